/**
 * Cholesky factorisation of Hermitian positive-definite matrices and the
 * triangular solves built on it.
 * @module
 */
import { DimensionError, DomainError, NotPositiveDefiniteError } from '../errors.js';
import { adjointSquare, solveLowerInPlace, solveLowerThenUpperInPlace, solveUpperInPlace } from '../internal/triangular.js';
import { assertCMatrix, assertFiniteCMatrix, assertSquare } from '../internal/validate.js';
import type { CMatrix } from './cmatrix.js';
import { hermitianDeviation } from './ops.js';

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
 * Computations*, 4th ed., 2013, §4.2). Only the lower triangle of `a` is read
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
  const src = a.data;
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
  return {
    n,
    l: { rows: n, cols: n, data: l },
    lAdjoint: { rows: n, cols: n, data: adjointSquare(n, l) },
    positiveDefinite: failed < 0,
    failedPivot: failed,
  };
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
  const x = b.data.slice();
  solveLowerThenUpperInPlace(factor.n, b.cols, factor.l.data, false, factor.lAdjoint.data, false, x);
  return { rows: b.rows, cols: b.cols, data: x };
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
  return { rows: b.rows, cols: b.cols, data: x };
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
  return { rows: b.rows, cols: b.cols, data: x };
}
