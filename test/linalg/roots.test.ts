import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { type CMatrix, type CMatrixJSON, columnVector, matrixFromJSON, zeros } from '../../src/linalg/cmatrix.js';
import { polynomialRoots, polynomialFromRoots } from '../../src/linalg/roots.js';
import { ConvergenceError, DimensionError, DomainError } from '../../src/errors.js';
import { expectCMatrixClose, randomMatrix, seededRandom } from '../helpers/matchers.js';

const EPS = Number.EPSILON;
const fixtures = JSON.parse(readFileSync(new URL('./fixtures/linalg.json', import.meta.url), 'utf8')) as {
  cases: Record<string, Array<Record<string, unknown>>>;
};
const m = (x: unknown): CMatrix => matrixFromJSON(x as CMatrixJSON);

/** p(z), p′(z) and Σ|cₖ||z|^{d−k} for coefficients highest power first. */
function evaluate(c: CMatrix, zr: number, zi: number): { pr: number; pi: number; dr: number; di: number; mag: number } {
  let pr = 0, pi = 0, dr = 0, di = 0, mag = 0;
  const az = Math.hypot(zr, zi);
  for (let k = 0; k < c.rows; k++) {
    const ndr = dr * zr - di * zi + pr, ndi = dr * zi + di * zr + pi;
    dr = ndr; di = ndi;
    const npr = pr * zr - pi * zi + c.data[2 * k], npi = pr * zi + pi * zr + c.data[2 * k + 1];
    pr = npr; pi = npi;
    mag = mag * az + Math.hypot(c.data[2 * k], c.data[2 * k + 1]);
  }
  return { pr, pi, dr, di, mag };
}

/** Greedy nearest matching; returns per reference root the matched computed root. */
function match(ref: CMatrix, got: CMatrix): Array<[number, number, number, number]> {
  const used = new Set<number>();
  const out: Array<[number, number, number, number]> = [];
  for (let i = 0; i < ref.rows; i++) {
    let best = -1, bd = Infinity;
    for (let j = 0; j < got.rows; j++) {
      if (used.has(j)) continue;
      const d = Math.hypot(ref.data[2 * i] - got.data[2 * j], ref.data[2 * i + 1] - got.data[2 * j + 1]);
      if (d < bd) { bd = d; best = j; }
    }
    used.add(best);
    out.push([ref.data[2 * i], ref.data[2 * i + 1], got.data[2 * best], got.data[2 * best + 1]]);
  }
  return out;
}

describe('polynomialRoots', () => {
  it('zᴺ − 1: the N-th roots of unity, sorted by argument', () => {
    // Exact: z = exp(2πik/N) (de Moivre).
    const n = 16;
    const c = zeros(n + 1, 1); c.data[0] = 1; c.data[2 * n] = -1;
    const z = polynomialRoots(c);
    expect(z.rows).toBe(n);
    let prev = -Infinity;
    for (let i = 0; i < n; i++) {
      const ang = Math.atan2(z.data[2 * i + 1], z.data[2 * i]);
      expect(ang).toBeGreaterThan(prev);
      prev = ang;
      const k = Math.round((ang * n) / (2 * Math.PI));
      expect(Math.hypot(z.data[2 * i] - Math.cos((2 * Math.PI * k) / n), z.data[2 * i + 1] - Math.sin((2 * Math.PI * k) / n))).toBeLessThan(8 * EPS);
    }
  });

  for (const fx of fixtures.cases.polynomialRoots) {
    it(`mpmath polyroots fixture: ${String(fx.name)}`, () => {
      const c = m(fx.coefficients), ref = m(fx.roots);
      const got = polynomialRoots(c);
      expect(got.rows).toBe(ref.rows);
      const mult = Number(fx.multiplicity);
      for (const [rr, ri, gr, gi] of match(ref, got)) {
        const err = Math.hypot(rr - gr, ri - gi);
        const { dr, di, mag } = evaluate(c, rr, ri);
        // Simple root: first-order condition |Δz| ≈ ε Σ|cₖ||z|^{d−k} / |p′(z)| (Wilkinson, Rounding Errors in
        // Algebraic Processes, 1963, ch. 2, from memory). m-fold root: |Δz| ~ (ε·…)^{1/m}.
        const tol = mult === 1 ? 100 * EPS * mag / Math.max(Math.hypot(dr, di), 1e-300) + 4 * EPS * Math.hypot(rr, ri)
          : 10 * Math.pow(EPS, 1 / mult) * (1 + Math.hypot(rr, ri));
        expect(err).toBeLessThanOrEqual(tol);
      }
    });
  }

  it('backward stable: roots reproduce the coefficients (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 14 }), fc.integer(), (d, seed) => {
      const c = randomMatrix(d + 1, 1, seed);
      const z = polynomialRoots(c);
      expect(z.rows).toBe(d);
      // every root is an exact root of a nearby polynomial: |p(z)| ≤ k·d·ε·Σ|cₖ||z|^{d−k}
      for (let i = 0; i < d; i++) {
        const { pr, pi, mag } = evaluate(c, z.data[2 * i], z.data[2 * i + 1]);
        expect(Math.hypot(pr, pi)).toBeLessThanOrEqual(8 * d * EPS * mag);
      }
    }), { seed: 3, numRuns: 60 });
  });

  it('roots → coefficients → roots round trip for well-separated roots (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 12 }), fc.integer(), (d, seed) => {
      const rnd = seededRandom(seed);
      // well separated: jittered points on a circle of radius 0.5 … 2
      const roots = zeros(d, 1);
      for (let k = 0; k < d; k++) {
        const r = 0.5 + 1.5 * rnd(), t = (2 * Math.PI * (k + 0.3 * rnd())) / d;
        roots.data[2 * k] = r * Math.cos(t); roots.data[2 * k + 1] = r * Math.sin(t);
      }
      const c = polynomialFromRoots(roots);
      const back = polynomialFromRoots(polynomialRoots(c));
      expectCMatrixClose(back, c, { rtol: 1e3 * d * EPS });
    }), { seed: 9, numRuns: 50 });
  });

  it('leading zeros are stripped, trailing zeros give exact zero roots, degree 0 and 1', () => {
    const z = polynomialRoots(columnVector([0, 0, 2, 4, 0]));
    expect(z.rows).toBe(2);
    expect(Array.from(z.data)).toContain(-2);
    expect(z.data.filter((x) => x === 0).length).toBeGreaterThanOrEqual(3);
    expect(polynomialRoots(columnVector([{ re: 0, im: 3 }])).rows).toBe(0);
    const one = polynomialRoots(columnVector([{ re: 0, im: 2 }, { re: 4, im: 0 }])); // 2j z + 4 = 0 → z = 2j
    expect(one.data[0]).toBeCloseTo(0, 15);
    expect(one.data[1]).toBeCloseTo(2, 15);
  });

  it('bad input: row vector, empty, NaN, Infinity, all-zero, bad budget; ConvergenceError on an exhausted budget', () => {
    expect(() => polynomialRoots(zeros(1, 3))).toThrow(DimensionError);
    expect(() => polynomialRoots(zeros(0, 1))).toThrow(DimensionError);
    const nan = zeros(2, 1); nan.data[0] = 1; nan.data[3] = NaN;
    expect(() => polynomialRoots(nan)).toThrow(DomainError);
    const inf = zeros(3, 1); inf.data[2] = Infinity;
    expect(() => polynomialRoots(inf)).toThrow(DomainError);
    expect(() => polynomialRoots(zeros(4, 1))).toThrow(DomainError);
    expect(() => polynomialRoots(columnVector([1, 2, 3]), { maxIterations: 0 })).toThrow(DomainError);
    expect(() => polynomialRoots(randomMatrix(12, 1, 1), { maxIterations: 1 })).toThrow(ConvergenceError);
  });
});

describe('polynomialFromRoots', () => {
  it('(z − 1)(z + 1) = z² − 1; no roots gives the constant 1', () => {
    expectCMatrixClose(polynomialFromRoots(columnVector([1, -1])), columnVector([1, 0, -1]), { atol: 0 });
    expectCMatrixClose(polynomialFromRoots(zeros(0, 1)), columnVector([1]), { atol: 0 });
  });
  it('Vieta: c₁ = −Σ rₖ and cₙ = (−1)ⁿ Π rₖ', () => {
    const r = randomMatrix(7, 1, 12);
    const c = polynomialFromRoots(r);
    let sr = 0, si = 0, pr = 1, pi = 0;
    for (let k = 0; k < 7; k++) {
      sr += r.data[2 * k]; si += r.data[2 * k + 1];
      const t = pr * r.data[2 * k] - pi * r.data[2 * k + 1];
      pi = pr * r.data[2 * k + 1] + pi * r.data[2 * k]; pr = t;
    }
    expect(Math.hypot(c.data[2] + sr, c.data[3] + si)).toBeLessThan(1e-14);
    expect(Math.hypot(c.data[14] + pr, c.data[15] + pi)).toBeLessThan(1e-14);
  });
  it('zeros spread on the unit circle expand accurately (Leja order): z⁴⁰ + 1', () => {
    const n = 40;
    const r = zeros(n, 1);
    for (let k = 0; k < n; k++) { r.data[2 * k] = Math.cos((Math.PI * (2 * k + 1)) / n); r.data[2 * k + 1] = Math.sin((Math.PI * (2 * k + 1)) / n); }
    const c = polynomialFromRoots(r);
    const expected = zeros(n + 1, 1); expected.data[0] = 1; expected.data[2 * n] = 1;
    expectCMatrixClose(c, expected, { atol: 1e-13 });
  });
  it('bad input: a matrix with two columns, NaN', () => {
    expect(() => polynomialFromRoots(zeros(2, 2))).toThrow(DimensionError);
    const inf = zeros(2, 1); inf.data[2] = Infinity;
    expect(() => polynomialFromRoots(inf)).toThrow(DomainError);
  });
});
