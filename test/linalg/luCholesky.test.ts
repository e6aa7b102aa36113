import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { fromRows, identity, zeros, columnVector } from '../../src/linalg/cmatrix.js';
import { multiply, adjoint, frobeniusNorm, subtract, norm1 } from '../../src/linalg/ops.js';
import { luFactor, luSolve, luSolveAdjoint, solve, inverse, determinant, logDeterminant } from '../../src/linalg/lu.js';
import { choleskyFactor, choleskySolve, solveLowerTriangular, solveLowerAdjoint } from '../../src/linalg/cholesky.js';
import { DimensionError, DomainError, NotPositiveDefiniteError, SingularMatrixError } from '../../src/errors.js';
import { expectCMatrixClose, randomMatrix, randomHpd } from '../helpers/matchers.js';

const EPS = Number.EPSILON;

/** Normwise backward error ‖A X − B‖ / (‖A‖‖X‖ + ‖B‖) (Higham, Accuracy and Stability, 2002, eq. 7.23). */
function backwardError(a: ReturnType<typeof zeros>, x: ReturnType<typeof zeros>, b: ReturnType<typeof zeros>): number {
  return frobeniusNorm(subtract(multiply(a, x), b)) / (frobeniusNorm(a) * frobeniusNorm(x) + frobeniusNorm(b));
}

describe('LU', () => {
  it('2×2 worked example: [[4,3],[6,3]] x = [10,12] → x = [1,2], det = −6', () => {
    // Hand computation: 4·1 + 3·2 = 10, 6·1 + 3·2 = 12; det = 4·3 − 3·6 = −6.
    const a = fromRows([[4, 3], [6, 3]]);
    expectCMatrixClose(solve(a, columnVector([10, 12])), columnVector([1, 2]), { rtol: 4 * EPS });
    expect(determinant(a).re).toBeCloseTo(-6, 13);
  });
  it('complex determinant equals ad − bc (2×2 identity)', () => {
    const a = fromRows([[{ re: 1, im: 2 }, { re: 3, im: -1 }], [{ re: 0, im: 1 }, { re: 2, im: 2 }]]);
    // (1+2j)(2+2j) − (3−j)(j) = (−2+6j) − (1+3j) = −3 + 3j
    const d = determinant(a);
    expect(d.re).toBeCloseTo(-3, 13);
    expect(d.im).toBeCloseTo(3, 13);
    const ld = logDeterminant(a);
    expect(ld.logAbs).toBeCloseTo(Math.log(Math.hypot(3, 3)), 13);
    expect(ld.phaseRad).toBeCloseTo(Math.atan2(3, -3), 13);
  });
  it('backward error ≤ 100 ε for random systems up to N = 256, many right-hand sides (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 70 }), fc.integer(), (n, k, seed) => {
      const a = randomMatrix(n, n, seed), b = randomMatrix(n, k, seed ^ 0x55);
      const x = solve(a, b);
      expect(backwardError(a, x, b)).toBeLessThan(100 * EPS);
    }), { seed: 7, numRuns: 60 });
    const a = randomMatrix(256, 256, 3), b = randomMatrix(256, 3, 4);
    expect(backwardError(a, solve(a, b), b)).toBeLessThan(100 * EPS);
  });
  it('A·A⁻¹ = I and Aᴴ solves', () => {
    const a = randomMatrix(17, 17, 21);
    const ai = inverse(a);
    const f = luFactor(a);
    // ‖A A⁻¹ − I‖ ≲ n ε κ(A); κ of a random 17×17 is O(10²)
    expectCMatrixClose(multiply(a, ai), identity(17), { atol: 1e-11 });
    const b = randomMatrix(17, 2, 22);
    expect(backwardError(adjoint(a), luSolveAdjoint(f, b), b)).toBeLessThan(100 * EPS);
  });
  it('rcond estimate brackets the exact 1-norm reciprocal condition (Higham 1988: lower bound on ‖A⁻¹‖₁, rarely off by > 3)', () => {
    for (const seed of [1, 2, 3, 4, 5]) {
      const a = randomMatrix(12, 12, seed * 31);
      const exact = 1 / (norm1(a) * norm1(inverse(a)));
      const est = luFactor(a).rcond;
      expect(est).toBeGreaterThanOrEqual(exact * (1 - 1e-12));
      expect(est).toBeLessThanOrEqual(3 * exact);
    }
  });
  it('singular and nearly singular matrices are reported as data, and solving throws', () => {
    const s = fromRows([[1, 2], [2, 4]]);
    const f = luFactor(s);
    expect(f.singular).toBe(true);
    expect(() => luSolve(f, columnVector([1, 1]))).toThrow(SingularMatrixError);
    expect(determinant(s).abs()).toBe(0);
    const near = fromRows([[1, 1], [1, 1 + 1e-9]]);
    const g = luFactor(near);
    expect(g.singular).toBe(false);
    expect(g.rcond).toBeLessThan(1e-9);
    expect(g.rcond).toBeGreaterThan(1e-11);
  });
  it('blocked factorisation: a zero column past the first panel is found exactly; det matches the column-scaled product', () => {
    // Column 100 of a 130×130 random matrix set to zero: rank-deficient, found as an exactly zero pivot
    // after the trailing products of two panels. Scaling column j by cⱼ scales det by cⱼ (multilinearity).
    const a = randomMatrix(130, 130, 77);
    const z = { rows: 130, cols: 130, data: a.data.slice() };
    for (let i = 0; i < 130; i++) { z.data[2 * (i * 130 + 100)] = 0; z.data[2 * (i * 130 + 100) + 1] = 0; }
    expect(luFactor(z).singular).toBe(true);
    const scaled = { rows: 130, cols: 130, data: a.data.slice() };
    for (let i = 0; i < 130; i++) { scaled.data[2 * (i * 130 + 90)] *= 2; scaled.data[2 * (i * 130 + 90) + 1] *= 2; }
    const l0 = logDeterminant(a), l1 = logDeterminant(scaled);
    expect(Math.abs(l1.logAbs - l0.logAbs - Math.log(2))).toBeLessThan(1e-10);
  });
  it('bad input: non-square, empty, NaN, wrong right-hand side', () => {
    expect(() => luFactor(zeros(2, 3))).toThrow(DimensionError);
    expect(() => luFactor(zeros(0, 0))).toThrow(DimensionError);
    expect(() => luFactor({ rows: 1, cols: 1, data: Float64Array.of(NaN, 0) })).toThrow(DomainError);
    expect(() => solve(identity(2), zeros(3, 1))).toThrow(DimensionError);
    expect(() => solve(identity(2), { rows: 2, cols: 1, data: Float64Array.of(1, 0, Infinity, 0) })).toThrow(DomainError);
  });
});

describe('Cholesky', () => {
  it('L Lᴴ = A with a real positive diagonal (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 30 }), fc.integer(), (n, seed) => {
      const a = randomHpd(n, seed);
      const f = choleskyFactor(a);
      expect(f.positiveDefinite).toBe(true);
      expectCMatrixClose(multiply(f.l, adjoint(f.l)), a, { rtol: 20 * n * EPS });
      for (let i = 0; i < n; i++) {
        expect(f.l.data[2 * (i * n + i)]).toBeGreaterThan(0);
        expect(f.l.data[2 * (i * n + i) + 1]).toBe(0);
      }
    }), { seed: 11, numRuns: 50 });
  });
  it('solve agrees with LU and has small backward error, N = 128 and 1000 right-hand sides', () => {
    const a = randomHpd(128, 5);
    const b = randomMatrix(128, 1000, 6);
    const x = choleskySolve(choleskyFactor(a), b);
    expect(backwardError(a, x, b)).toBeLessThan(100 * EPS);
    expectCMatrixClose(x, solve(a, b), { rtol: 1e-10 });
  });
  it('triangular solves', () => {
    const f = choleskyFactor(randomHpd(9, 8));
    const b = randomMatrix(9, 3, 9);
    expect(backwardError(f.l, solveLowerTriangular(f.l, b), b)).toBeLessThan(100 * EPS);
    expect(backwardError(adjoint(f.l), solveLowerAdjoint(f.l, b), b)).toBeLessThan(100 * EPS);
    expect(() => solveLowerTriangular(zeros(2, 2), zeros(2, 1))).toThrow(DomainError);
  });
  it('indefinite matrix: reported at the failing pivot, solve throws NotPositiveDefiniteError', () => {
    // Leading 2×2 minor of [[2,1,0],[1,0.4,0],[0,0,1]] is 0.8 − 1 < 0: fails at pivot 1.
    const a = fromRows([[2, 1, 0], [1, 0.4, 0], [0, 0, 1]]);
    const f = choleskyFactor(a);
    expect(f.positiveDefinite).toBe(false);
    expect(f.failedPivot).toBe(1);
    expect(() => choleskySolve(f, columnVector([1, 1, 1]))).toThrow(NotPositiveDefiniteError);
    try { choleskySolve(f, columnVector([1, 1, 1])); } catch (e) { expect((e as NotPositiveDefiniteError).index).toBe(1); }
  });
  it('bad input: non-Hermitian, NaN, non-square', () => {
    expect(() => choleskyFactor(fromRows([[2, 1], [0, 2]]))).toThrow(DomainError);
    expect(() => choleskyFactor({ rows: 1, cols: 1, data: Float64Array.of(NaN, 0) })).toThrow(DomainError);
    expect(() => choleskyFactor(zeros(2, 1))).toThrow(DimensionError);
  });
});

describe('blocked Cholesky (order ≥ 257)', () => {
  it('reproduces A = L Lᴴ to 1e-13 at N = 600 and 257 and flags the same failed pivot as the unblocked order would', async () => {
    const { choleskyFactor } = await import('../../src/linalg/cholesky.js');
    const { multiply, adjoint, hermitianPart } = await import('../../src/linalg/ops.js');
    const { randomMatrix } = await import('../helpers/matchers.js');
    for (const n of [600, 257]) {
      const g = randomMatrix(n, n, n);
      const a = hermitianPart(multiply(g, adjoint(g)));
      for (let i = 0; i < n; i++) a.data[2 * (i * n + i)] += 1;
      const f = choleskyFactor(a);
      expect(f.positiveDefinite).toBe(true);
      const r = multiply(f.l, adjoint(f.l));
      let worst = 0, big = 0;
      for (let k = 0; k < a.data.length; k++) { worst = Math.max(worst, Math.abs(r.data[k] - a.data[k])); big = Math.max(big, Math.abs(a.data[k])); }
      expect(worst).toBeLessThan(1e-13 * big);
      for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) expect(f.l.data[2 * (i * n + j)]).toBe(0);
      // indefinite: the leading 200×200 block is positive definite, entry 200 breaks it
      const b = { rows: n, cols: n, data: a.data.slice() };
      b.data[2 * (200 * n + 200)] = -1e6;
      const fb = choleskyFactor(b);
      expect(fb.positiveDefinite).toBe(false);
      expect(fb.failedPivot).toBe(200);
    }
  });
});
