/**
 * Cholesky factorisation of Hermitian positive-definite matrices and the
 * triangular solves built on it.
 * @module
 */
import { DimensionError, DomainError, NotPositiveDefiniteError } from '../errors.js';
import { adjointSquare, solveLowerInPlace, solveLowerThenUpperInPlace, solveUpperInPlace } from '../internal/triangular.js';
import { herkLowerKernel } from '../internal/herk.js';
import { assertCMatrix, assertFiniteCMatrix, assertSquare } from '../internal/validate.js';
import type { CMatrix } from './cmatrix.js';
import { hermitianDeviation } from './ops.js';
import { matrixView } from './cmatrix.js';

/**
 * Result of {@link choleskyFactor}: A = L·Lᴴ with L lower triangular and a
 * real positive diagonal.
 * @category Complex core
 */
export interface CholeskyResult {
  /** Order n. */
  readonly n: number;
  /** The lower-triangular factor L (entries above the diagonal are zero). Valid rows 0…failedPivot−1 only when not positive definite. */
  readonly l: CMatrix;
  /** Lᴴ, stored once so that solves with it walk rows contiguously. */
  readonly lAdjoint: CMatrix;
  /** False when a pivot was not positive (A is not positive definite to working precision). */
  readonly positiveDefinite: boolean;
  /** Zero-based index of the first non-positive pivot, or −1. */
  readonly failedPivot: number;
}

/**
 * Options of {@link choleskyFactor}.
 * @category Complex core
 */
export interface CholeskyOptions {
  /**
   * Relative tolerance on the Hermitian deviation of the input (see `hermitianDeviation`); larger deviations throw.
   * @defaultValue 1e-10
   */
  hermitianTolerance?: number;
}

/**
 * Cholesky factorisation A = L Lᴴ of a Hermitian positive-definite matrix.
 *
 * @remarks
 * Row-oriented (Cholesky–Banachiewicz) ordering, so that each entry is an
 * inner product of two contiguous rows of L (Golub & Van Loan, *Matrix
 * Computations*, 4th ed., 2013, §4.2); from order 129 on, right-looking and
 * blocked (64 columns, §4.2.9): the panel below each diagonal block is one
 * triangular solve with many right-hand sides and the trailing update one
 * Hermitian rank-64 product, both on the SIMD product kernel, which does
 * nearly all the work. Only the lower triangle of `a` is read
 * after the Hermitian check. A non-positive (or non-finite) pivot is an
 * expected outcome and is returned as data (`positiveDefinite: false`,
 * `failedPivot`); {@link choleskySolve} then throws
 * {@link NotPositiveDefiniteError}.
 * @param a - Hermitian matrix, n×n, finite.
 * @param options - See {@link CholeskyOptions}.
 * @returns The factor, its adjoint and the positive-definiteness verdict.
 * @throws {@link DimensionError} if not square; {@link DomainError} if not Hermitian or not finite.
 * @category Complex core
 */
export function choleskyFactor(a: CMatrix, options: CholeskyOptions = {}): CholeskyResult {
  assertSquare('a', a);
  assertFiniteCMatrix('a', a);
  const tol = options.hermitianTolerance ?? 1e-10;
  const dev = hermitianDeviation(a);
  if (dev > tol) {
    throw new DomainError(`invalid argument "a": expected a Hermitian matrix, but max|aᵢⱼ − conj(aⱼᵢ)| is ${dev.toExponential(2)} of the largest entry (tolerance ${tol}); pass hermitianPart(a) if the asymmetry is rounding.`);
  }
  const n = a.rows;
  const { l, failed } = n >= BLOCKED_MIN_ORDER ? blockedCholesky(n, a.data) : unblockedCholesky(n, a.data);
  return {
    n,
    l: { rows: n, cols: n, data: l },
    lAdjoint: { rows: n, cols: n, data: adjointSquare(n, l) },
    positiveDefinite: failed < 0,
    failedPivot: failed,
  };
}

/** Order from which the blocked factorisation is used. */
const BLOCKED_MIN_ORDER = 129;
/** Block width of the blocked factorisation. */
const NB = 64;

/** Row-oriented (Banachiewicz) factorisation of the lower triangle of src (n×n); -1 or the failed pivot. */
function unblockedCholesky(n: number, src: Float64Array): { l: Float64Array; failed: number } {
  const l = new Float64Array(2 * n * n);
  let failed = -1;
  outer: for (let i = 0; i < n; i++) {
    const ri = 2 * i * n;
    for (let j = 0; j <= i; j++) {
      const rj = 2 * j * n;
      let sr = src[ri + 2 * j], si = src[ri + 2 * j + 1];
      // s −= Σ_k L[i,k]·conj(L[j,k])
      for (let k = 0; k < 2 * j; k += 2) {
        const ar = l[ri + k], ai = l[ri + k + 1];
        const br = l[rj + k], bi = l[rj + k + 1];
        sr -= ar * br + ai * bi;
        si -= ai * br - ar * bi;
      }
      if (j === i) {
        if (!(sr > 0) || !Number.isFinite(sr)) { failed = i; break outer; }
        l[ri + 2 * i] = Math.sqrt(sr);
      } else {
        const djj = l[rj + 2 * j];
        l[ri + 2 * j] = sr / djj;
        l[ri + 2 * j + 1] = si / djj;
      }
    }
  }
  return { l, failed };
}

/**
 * Right-looking blocked factorisation (Golub & Van Loan 2013, §4.2.9, from memory): for each
 * block column of width NB, factor the diagonal block (scalar, row-oriented), solve the panel
 * below it against the block's adjoint (as one triangular solve with many right-hand sides on
 * the SIMD product kernel), and subtract the panel's Hermitian rank-NB product from the trailing
 * lower triangle on the SIMD rank-k kernel, where nearly all the work is.
 */
function blockedCholesky(n: number, src: Float64Array): { l: Float64Array; failed: number } {
  const a = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) a.set(src.subarray(2 * i * n, 2 * (i * n + i + 1)), 2 * i * n);
  const tmp = new Float64Array(2 * n * n);
  const diag = new Float64Array(2 * NB * NB), panel = new Float64Array(2 * NB * n);
  for (let k0 = 0; k0 < n; k0 += NB) {
    const k1 = Math.min(n, k0 + NB);
    // diagonal block, in place (its entries already hold all earlier updates)
    for (let i = k0; i < k1; i++) {
      const ri = 2 * i * n;
      for (let j = k0; j <= i; j++) {
        const rj = 2 * j * n;
        let sr = a[ri + 2 * j], si = a[ri + 2 * j + 1];
        for (let k = 2 * k0; k < 2 * j; k += 2) {
          const ar = a[ri + k], ai = a[ri + k + 1], br = a[rj + k], bi = a[rj + k + 1];
          sr -= ar * br + ai * bi; si -= ai * br - ar * bi;
        }
        if (j === i) {
          if (!(sr > 0) || !Number.isFinite(sr)) return { l: clearUpper(n, a, i), failed: i };
          a[ri + 2 * i] = Math.sqrt(sr); a[ri + 2 * i + 1] = 0;
        } else {
          const d = a[rj + 2 * j];
          a[ri + 2 * j] = sr / d; a[ri + 2 * j + 1] = si / d;
        }
      }
    }
    if (k1 === n) break;
    // panel rows k1…n−1: X·L11ᴴ = A21 ⇔ L11·Xᴴ = A21ᴴ, solved for the m = n − k1 columns of
    // A21ᴴ at once (the SIMD substitution with many right-hand sides)
    const m = n - k1, w = k1 - k0;
    const l11 = diag.subarray(0, 2 * w * w), y = panel.subarray(0, 2 * w * m);
    for (let i = 0; i < w; i++) l11.set(a.subarray(2 * ((k0 + i) * n + k0), 2 * ((k0 + i) * n + k1)), 2 * i * w);
    for (let i = 0; i < m; i++) {
      const s0 = 2 * ((k1 + i) * n + k0);
      for (let j = 0; j < w; j++) { y[2 * (j * m + i)] = a[s0 + 2 * j]; y[2 * (j * m + i) + 1] = -a[s0 + 2 * j + 1]; }
    }
    solveLowerInPlace(w, m, l11, y, false);
    for (let i = 0; i < m; i++) {
      const d0 = 2 * ((k1 + i) * n + k0);
      for (let j = 0; j < w; j++) { a[d0 + 2 * j] = y[2 * (j * m + i)]; a[d0 + 2 * j + 1] = -y[2 * (j * m + i) + 1]; }
    }
    // trailing lower triangle −= P Pᴴ, P the panel (rows k1…n−1, columns k0…k1−1)
    const c = tmp.subarray(0, 2 * m * m);
    c.fill(0);
    herkLowerKernel(m, w, a.subarray(2 * (k1 * n + k0)), n, c);
    for (let i = 0; i < m; i++) {
      const dst = 2 * ((k1 + i) * n + k1), s0 = 2 * i * m;
      for (let j = 0; j <= 2 * i + 1; j++) a[dst + j] -= c[s0 + j];
    }
  }
  return { l: clearUpper(n, a, n), failed: -1 };
}

/** Zeroes everything above the diagonal (and every row from `rows` on) of an n×n interleaved matrix. */
function clearUpper(n: number, a: Float64Array, rows: number): Float64Array {
  for (let i = 0; i < n; i++) {
    if (i >= rows) { a.fill(0, 2 * i * n, 2 * (i + 1) * n); continue; }
    a.fill(0, 2 * (i * n + i + 1), 2 * (i + 1) * n);
  }
  return a;
}

function checkCholesky(f: CholeskyResult, b: CMatrix): void {
  if (f === null || typeof f !== 'object' || f.l === undefined || f.lAdjoint === undefined) {
    throw new DimensionError('invalid argument "factor": expected the result of choleskyFactor.');
  }
  if (!f.positiveDefinite) {
    throw new NotPositiveDefiniteError(
      `matrix is not positive definite: pivot ${f.failedPivot} is not positive; add diagonal loading or check that the matrix is a valid correlation/impedance real part.`,
      f.failedPivot,
    );
  }
  assertFiniteCMatrix('b', b);
  if (b.rows !== f.n) {
    throw new DimensionError(`invalid argument "b": expected ${f.n} rows (the order of the factored matrix), received ${b.rows}×${b.cols}.`);
  }
}

/**
 * Solves A X = B with A = L Lᴴ from {@link choleskyFactor}.
 *
 * @remarks
 * Forward substitution with L, then back substitution with Lᴴ, on all
 * right-hand sides at once in cache-sized column panels, so one factorisation
 * serves many solves (for example many beam directions).
 * @param factor - Result of {@link choleskyFactor} for the n×n matrix A.
 * @param b - Right-hand sides, n×k.
 * @returns X, n×k.
 * @throws {@link NotPositiveDefiniteError} if the factorisation failed; {@link DimensionError} on shape mismatch.
 * @category Complex core
 */
export function choleskySolve(factor: CholeskyResult, b: CMatrix): CMatrix {
  checkCholesky(factor, b);
  const x = new Float64Array(b.data.length);
  solveLowerThenUpperInPlace(factor.n, b.cols, factor.l.data, false, factor.lAdjoint.data, false, x, b.data);
  return matrixView(b.rows, b.cols, x);
}

function checkTriangular(name: string, t: CMatrix, b: CMatrix): void {
  assertSquare(name, t);
  assertCMatrix('b', b);
  if (b.rows !== t.rows) {
    throw new DimensionError(`invalid argument "b": expected ${t.rows} rows (the order of "${name}"), received ${b.rows}×${b.cols}.`);
  }
  const n = t.rows;
  for (let i = 0; i < n; i++) {
    const k = 2 * (i * n + i);
    if (t.data[k] === 0 && t.data[k + 1] === 0) {
      throw new DomainError(`invalid argument "${name}": diagonal entry ${i} is zero; the triangular system is singular.`);
    }
  }
}

/**
 * Solves L X = B for lower-triangular L (entries above the diagonal are ignored).
 * @param l - Lower-triangular matrix, n×n, non-zero diagonal (e.g. `choleskyFactor(a).l`).
 * @param b - Right-hand sides, n×k.
 * @returns X, n×k.
 * @throws {@link DomainError} on a zero diagonal entry; {@link DimensionError} on shape mismatch.
 * @category Complex core
 */
export function solveLowerTriangular(l: CMatrix, b: CMatrix): CMatrix {
  checkTriangular('l', l, b);
  assertFiniteCMatrix('b', b);
  const x = b.data.slice();
  solveLowerInPlace(l.rows, b.cols, l.data, x, false);
  return matrixView(b.rows, b.cols, x);
}

/**
 * Solves Lᴴ X = B for lower-triangular L (i.e. an upper-triangular system with Lᴴ).
 * @param l - Lower-triangular matrix, n×n, non-zero diagonal.
 * @param b - Right-hand sides, n×k.
 * @returns X, n×k.
 * @throws {@link DomainError} on a zero diagonal entry; {@link DimensionError} on shape mismatch.
 * @category Complex core
 */
export function solveLowerAdjoint(l: CMatrix, b: CMatrix): CMatrix {
  checkTriangular('l', l, b);
  assertFiniteCMatrix('b', b);
  const x = b.data.slice();
  solveUpperInPlace(l.rows, b.cols, adjointSquare(l.rows, l.data), x, false);
  return matrixView(b.rows, b.cols, x);
}
