import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  zeros, identity, fromRows, fromParts, columnVector, diagonal, entry, setEntry, matrixToJSON, matrixFromJSON,
  formatMatrix, toRows, matrixView,
} from '../../src/linalg/cmatrix.js';
import {
  add, subtract, scale, multiply, multiplyInto, adjoint, transpose, conjugate, trace, frobeniusNorm, norm1, normInf,
  isHermitian, hermitianPart, block, pick, setBlock, innerProduct, quadraticForm, concatColumns, concatRows, hadamard,
} from '../../src/linalg/ops.js';
import { DimensionError, DomainError, ParseError } from '../../src/errors.js';
import { expectCMatrixClose, randomMatrix } from '../helpers/matchers.js';

/** Reference product by the textbook triple loop (independent of the unrolled kernel). */
function naiveProduct(a: ReturnType<typeof zeros>, b: ReturnType<typeof zeros>) {
  const out = zeros(a.rows, b.cols);
  for (let i = 0; i < a.rows; i++) for (let j = 0; j < b.cols; j++) {
    let re = 0, im = 0;
    for (let k = 0; k < a.cols; k++) {
      const ar = a.data[2 * (i * a.cols + k)], ai = a.data[2 * (i * a.cols + k) + 1];
      const br = b.data[2 * (k * b.cols + j)], bi = b.data[2 * (k * b.cols + j) + 1];
      re += ar * br - ai * bi; im += ar * bi + ai * br;
    }
    out.data[2 * (i * b.cols + j)] = re; out.data[2 * (i * b.cols + j) + 1] = im;
  }
  return out;
}

describe('factories and access', () => {
  it('fromRows accepts numbers, {re, im} and reads back', () => {
    const m = fromRows([[1, { re: 2, im: -3 }], [0, 4]]);
    expect(entry(m, 0, 1).re).toBe(2);
    expect(entry(m, 0, 1).im).toBe(-3);
    setEntry(m, 1, 0, { re: 5, im: 6 });
    expect(toRows(m)[1][0].im).toBe(6);
  });
  it('identity, diagonal, fromParts, columnVector shapes', () => {
    expect(trace(identity(5)).re).toBe(5);
    expect(trace(diagonal([1, { re: 0, im: 2 }])).im).toBe(2);
    const v = fromParts([1, 2], [3, 4], 2);
    expect([v.rows, v.cols]).toEqual([2, 1]);
    expect(columnVector([1, 2, 3]).rows).toBe(3);
  });
  it('JSON round trip and parse errors', () => {
    const a = randomMatrix(3, 4, 7);
    expectCMatrixClose(matrixFromJSON(JSON.parse(JSON.stringify(matrixToJSON(a)))), a, { rtol: 0 });
    expect(() => matrixFromJSON({ rows: 2, cols: 2, re: [1, 2, 3], im: [0, 0, 0, 0] })).toThrow(ParseError);
  });
  it('formatMatrix is readable', () => {
    const t = formatMatrix(fromRows([[1, { re: 0, im: -1 }]]), 3);
    expect(t).toContain('CMatrix 1×2');
    expect(t).toContain('[ 1+0j  0−1j ]');
  });
  it('bad input: ragged rows, NaN entries, bad view length', () => {
    expect(() => fromRows([[1, 2], [3]])).toThrow(DimensionError);
    expect(() => fromRows([[NaN]])).toThrow(DomainError);
    expect(() => fromRows([[Infinity]])).toThrow(DomainError);
    expect(() => matrixView(2, 2, new Float64Array(3))).toThrow(DimensionError);
    expect(() => zeros(-1, 2)).toThrow(DomainError);
  });
  it('empty matrices are allowed where meaningful', () => {
    const e = zeros(0, 3);
    expect(multiply(zeros(2, 0), e).data.every((x) => x === 0)).toBe(true);
    expect(frobeniusNorm(e)).toBe(0);
  });
});

describe('arithmetic', () => {
  it('multiply equals the naive triple loop for many shapes (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 9 }), fc.integer({ min: 1, max: 9 }), fc.integer(), (m, k, n, seed) => {
      const a = randomMatrix(m, k, seed), b = randomMatrix(k, n, seed + 1);
      // Each entry is a sum of k products of O(1) numbers: 8k ε relative to ‖AB‖ is ample.
      expectCMatrixClose(multiply(a, b), naiveProduct(a, b), { rtol: 1e-14, atol: 8 * k * 2.2e-16 * 4 });
    }), { seed: 42, numRuns: 200 });
  });
  it('multiplyInto rejects aliasing and bad shapes', () => {
    const a = randomMatrix(3, 3, 1);
    expect(() => multiplyInto(a, a, identity(3))).toThrow(DimensionError);
    expect(() => multiplyInto(zeros(3, 2), a, identity(3))).toThrow(DimensionError);
    expect(() => multiply(a, zeros(2, 2))).toThrow(DimensionError);
  });
  it('(AB)ᴴ = BᴴAᴴ, transpose/conjugate compose to adjoint', () => {
    const a = randomMatrix(4, 6, 3), b = randomMatrix(6, 5, 4);
    expectCMatrixClose(adjoint(multiply(a, b)), multiply(adjoint(b), adjoint(a)), { rtol: 1e-14 });
    expectCMatrixClose(transpose(conjugate(a)), adjoint(a), { rtol: 0 });
  });
  it('add, subtract, scale, hadamard', () => {
    const a = randomMatrix(3, 3, 9), b = randomMatrix(3, 3, 10);
    expectCMatrixClose(subtract(add(a, b), b), a, { rtol: 1e-15 });
    // j·j = −1
    expectCMatrixClose(scale(scale(a, { re: 0, im: 1 }), { re: 0, im: 1 }), scale(a, -1), { rtol: 0 });
    const h = hadamard(a, b);
    expect(entry(h, 1, 2).re).toBeCloseTo(entry(a, 1, 2).mul(entry(b, 1, 2)).re, 15);
  });
  it('norms against hand values', () => {
    const m = fromRows([[{ re: 3, im: 4 }, 0], [1, -2]]);
    expect(frobeniusNorm(m)).toBeCloseTo(Math.sqrt(30), 14);
    expect(norm1(m)).toBeCloseTo(6, 14);
    expect(normInf(m)).toBeCloseTo(5, 14);
    expect(frobeniusNorm(fromRows([[1e300, 1e300]]))).toBeCloseTo(Math.SQRT2 * 1e300, -286);
  });
  it('Hermitian checks', () => {
    const a = randomMatrix(5, 5, 11);
    const h = hermitianPart(a);
    expect(isHermitian(h)).toBe(true);
    expect(isHermitian(a)).toBe(false);
    const w = randomMatrix(5, 1, 12);
    // wᴴ H w is real for Hermitian H; compare with the explicit product
    const explicit = multiply(adjoint(w), multiply(h, w));
    expect(quadraticForm(w, h)).toBeCloseTo(explicit.data[0], 12);
    expect(Math.abs(explicit.data[1])).toBeLessThan(1e-13);
  });
  it('blocks, pick, concat', () => {
    const a = randomMatrix(4, 5, 13);
    const b = block(a, 1, 3, 2, 5);
    expect(entry(b, 0, 0).equals(entry(a, 1, 2))).toBe(true);
    const c = setBlock(zeros(4, 5), 1, 2, b);
    expect(entry(c, 2, 4).equals(entry(a, 2, 4))).toBe(true);
    expect(entry(pick(a, [3, 0], [4]), 0, 0).equals(entry(a, 3, 4))).toBe(true);
    expectCMatrixClose(concatColumns([block(a, 0, 4, 0, 2), block(a, 0, 4, 2, 5)]), a, { rtol: 0 });
    expectCMatrixClose(concatRows([block(a, 0, 1, 0, 5), block(a, 1, 4, 0, 5)]), a, { rtol: 0 });
    expect(() => block(a, 0, 5, 0, 1)).toThrow(DomainError);
  });
  it('innerProduct conjugates the first argument', () => {
    const a = columnVector([{ re: 0, im: 1 }]);
    expect(innerProduct(a, a).re).toBe(1);
    expect(innerProduct(a, columnVector([1])).im).toBe(-1);
  });
});
