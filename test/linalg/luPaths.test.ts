import { afterEach, describe, expect, it } from 'vitest';
import { columnVector, fromRows } from '../../src/linalg/cmatrix.js';
import { frobeniusNorm, multiply, subtract } from '../../src/linalg/ops.js';
import { determinant, luFactor, solve } from '../../src/linalg/lu.js';
import { wasmSettings } from '../../src/internal/wasm/runtime.js';
import { DomainError, SingularMatrixError } from '../../src/errors.js';
import { randomMatrix } from '../helpers/matchers.js';
import type { CMatrix } from '../../src/linalg/cmatrix.js';

const EPS = Number.EPSILON;

/** ‖P·A − L·U‖_F / ‖A‖_F from the packed factors (the defining identity of the factorisation). */
function factorResidual(a: CMatrix): number {
  const f = luFactor(a), n = f.n, d = f.lu.data;
  const l = new Float64Array(2 * n * n), u = new Float64Array(2 * n * n), pa = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const q = 2 * (i * n + j);
      if (j < i) { l[q] = d[q]; l[q + 1] = d[q + 1]; } else { u[q] = d[q]; u[q + 1] = d[q + 1]; }
      if (i === j) l[q] = 1;
      pa[q] = a.data[2 * (f.pivots[i] * n + j)];
      pa[q + 1] = a.data[2 * (f.pivots[i] * n + j) + 1];
    }
  }
  const m = (x: Float64Array): CMatrix => ({ rows: n, cols: n, data: x });
  return frobeniusNorm(subtract(m(pa), multiply(m(l), m(u)))) / frobeniusNorm(a);
}

describe('LU factorisation paths (SIMD whole-matrix elimination, recursive panels on the product kernel, scalar)', () => {
  afterEach(() => { wasmSettings.enabled = true; });

  // 1–160: the SIMD elimination; 161 and 230: the recursion with SIMD products; every order again on the scalar path
  for (const n of [1, 2, 3, 7, 33, 128, 161, 230]) {
    it(`n = ${n}: ‖PA − LU‖ ≤ 4nε‖A‖ on both paths, and the two solutions agree to rounding`, () => {
      // Partial pivoting keeps |lᵢⱼ| ≤ 1; for random matrices the growth factor is small, so the residual
      // stays near nε (Golub & Van Loan, Matrix Computations, 4th ed., 2013, Thm. 3.4.4, from memory).
      const a = randomMatrix(n, n, 1000 + n), b = randomMatrix(n, 1, 2000 + n);
      expect(factorResidual(a)).toBeLessThan(4 * n * EPS);
      const x = solve(a, b);
      wasmSettings.enabled = false;
      expect(factorResidual(a)).toBeLessThan(4 * n * EPS);
      const xs = solve(a, b);
      // κ(A) of a random matrix is O(n): the two rounding paths differ by ≲ κ·nε relative
      expect(frobeniusNorm(subtract(x, xs)) / frobeniusNorm(xs)).toBeLessThan(1e-11);
    });
  }

  it('determinant sign follows the row interchanges on both paths: det of a permutation matrix is its sign', () => {
    // Cyclic shift of 5 rows: an even permutation (a 5-cycle), det = +1; of 4 rows: odd, det = −1.
    for (const [n, expected] of [[5, 1], [4, -1]] as const) {
      const rows = Array.from({ length: n }, (_, i) => Array.from({ length: n }, (_, j) => (j === (i + 1) % n ? 1 : 0)));
      expect(determinant(fromRows(rows)).re).toBe(expected);
      wasmSettings.enabled = false;
      expect(determinant(fromRows(rows)).re).toBe(expected);
      wasmSettings.enabled = true;
    }
  });
});

describe('solve without the condition estimate (as LAPACK zgesv) still reports singular matrices', () => {
  it('an exactly singular matrix (a zero column) throws SingularMatrixError', () => {
    const a = randomMatrix(40, 40, 5);
    for (let i = 0; i < 40; i++) { a.data[2 * (i * 40 + 17)] = 0; a.data[2 * (i * 40 + 17) + 1] = 0; }
    expect(() => solve(a, randomMatrix(40, 1, 6))).toThrow(SingularMatrixError);
  });
  it('a rank-one matrix u vᴴ (pivots at rounding level) throws SingularMatrixError, as luFactor flags it', () => {
    const u = randomMatrix(30, 1, 7), v = randomMatrix(30, 1, 8);
    const a: CMatrix = { rows: 30, cols: 30, data: new Float64Array(2 * 900) };
    for (let i = 0; i < 30; i++) {
      for (let j = 0; j < 30; j++) {
        const ur = u.data[2 * i], ui = u.data[2 * i + 1], vr = v.data[2 * j], vi = -v.data[2 * j + 1];
        a.data[2 * (i * 30 + j)] = ur * vr - ui * vi;
        a.data[2 * (i * 30 + j) + 1] = ur * vi + ui * vr;
      }
    }
    expect(luFactor(a).singular).toBe(true);
    expect(() => solve(a, randomMatrix(30, 1, 9))).toThrow(SingularMatrixError);
  });
  it('the 2×2 example [[1, 2], [2, 4]] throws; a nearly singular one (rcond ~ 1e-10) still solves', () => {
    expect(() => solve(fromRows([[1, 2], [2, 4]]), columnVector([1, 1]))).toThrow(SingularMatrixError);
    // [[1, 1], [1, 1 + δ]] x = [2, 2 + δ] has the exact solution x = [1, 1] for any δ ≠ 0
    const x = solve(fromRows([[1, 1], [1, 1 + 1e-9]]), columnVector([2, 2 + 1e-9]));
    expect(Math.abs(x.data[0] - 1)).toBeLessThan(1e-6);
    expect(Math.abs(x.data[2] - 1)).toBeLessThan(1e-6);
  });
  it('non-finite entries are a DomainError naming the entry', () => {
    const a = randomMatrix(5, 5, 3);
    a.data[2 * (2 * 5 + 3) + 1] = Infinity;
    expect(() => solve(a, randomMatrix(5, 1, 4))).toThrow(DomainError);
    expect(() => solve(a, randomMatrix(5, 1, 4))).toThrow(/entry \(2, 3\) has a imaginary part/);
    a.data[2 * (2 * 5 + 3) + 1] = NaN;
    expect(() => solve(a, randomMatrix(5, 1, 4))).toThrow(DomainError);
  });
});
