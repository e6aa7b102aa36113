/** The stated-value grammar and comparison of the doc-test harness can fail, and fail right. */
import { describe, it, expect } from 'vitest';
import { Complex } from 'complex.js';
import { compareStated, parseAssertions, parseStated } from './stated.js';
import { instrument } from './doctest.js';

const one = (text: string) => {
  const s = parseStated(text);
  if (!s) throw new Error(`unparsed: ${text}`);
  return s[0];
};

describe('stated values', () => {
  it('a complex stated to two decimals: the issue-23 dipole reactance 42.5147 is not 42.52', () => {
    const s = one('≈ 73.08 + 42.52j Ω');
    expect(compareStated(new Complex(73.0797, 42.5147), s)).toMatch(/stated/);
    expect(compareStated(new Complex(73.0797, 42.5151), s)).toBeNull();
    expect(compareStated({ re: 73.0797, im: -42.52 }, one('73.08 − 42.52j'))).toBeNull();
  });
  it('half a unit of the last digit; a whole unit after …', () => {
    expect(compareStated(0.8889, one('0.889'))).toBeNull();
    expect(compareStated(0.8896, one('0.889'))).toMatch(/stated/);
    expect(compareStated(0.8896, one('0.889…'))).toBeNull();
    expect(compareStated(2.24e-13, one('2.2e-13'))).toBeNull();
    expect(compareStated(2.26e-13, one('2.2e-13'))).toMatch(/stated/);
  });
  it('typed arrays: constructor, length and entries', () => {
    expect(compareStated(Float64Array.of(1), one('Float64Array [1]'))).toBeNull();
    expect(compareStated([1], one('Float64Array [1]'))).toMatch(/Float64Array/);
    expect(compareStated(Float64Array.of(0.5176, 0.8326, 1), one('[0.5756, 0.7638, 1]'))).toMatch(/\[0\]/);
    expect(compareStated(Float64Array.of(1, 2, 3), one('[1, 2, …]'))).toBeNull();
    expect(compareStated(Float64Array.of(1, 2, 3), one('[1, 2]'))).toMatch(/entries/);
  });
  it('CMatrix entries and objects', () => {
    const m = { rows: 2, cols: 1, data: Float64Array.of(1, 0, 0, -2) };
    expect(compareStated(m, one('[1, −2j]ᵀ'))).toBeNull();
    expect(compareStated(m, one('[1, 2j]ᵀ'))).toMatch(/\[1\]/);
    expect(compareStated({ a: 1, b: 'x', c: [] }, one("{ a: 1, b: 'x', … }"))).toBeNull();
    expect(compareStated({ a: 1 }, one('{ b: 1 }'))).toMatch(/lacks/);
  });
  it('commentary after the value is not read; prose is not a value', () => {
    expect(parseStated('0.1110 rad (6.36°)')).not.toBeNull();
    expect(parseStated('symmetric, peak 1')).toBeNull();
    expect(parseAssertions('r.values: Float64Array [1.5, 2]; f.a = 3, then prose')).toHaveLength(2);
  });
});

describe('instrumentation', () => {
  it('a trailing comment after a call becomes a check; prose with digits on a call line is a problem', () => {
    const r = instrument('const x = 2;\nMath.sqrt(x); // ≈ 1.414\nconst y = [x]; // = [2]\n// y[0]: 2\nMath.abs(x); // the 3rd root\n', 't');
    expect(r.checks.map((c) => c.label)).toEqual(['Math.sqrt(x)', 'y', 'y[0]']);
    expect(r.problems).toHaveLength(1);
  });
});
