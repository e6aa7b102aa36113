/**
 * Diagonal loading and the conditioning policy shared by every beamformer
 * and spectrum that inverts a correlation matrix.
 *
 * Policy (documented in docs/beamform.md):
 * 1. The matrix must be finite, square, N×N and Hermitian to a relative
 *    deviation of 1e-10 (else {@link DomainError}; pass `hermitianPart(R)` if
 *    the asymmetry is rounding).
 * 2. Optional diagonal loading adds δ·I with δ = loading · tr(R)/N (loading
 *    relative to the mean eigenvalue; common practice: 1e-3 to 1e-1 for sample
 *    matrices, B. D. Carlson, IEEE Trans. AES 24(4), 1988, from memory).
 * 3. The (loaded) matrix is factored by Cholesky. A failed pivot throws
 *    {@link NotPositiveDefiniteError}. Otherwise, if (min ℓᵢᵢ / max ℓᵢᵢ)² <
 *    N·16ε the matrix is rejected with {@link SingularMatrixError}: since
 *    λ_min ≤ min ℓᵢᵢ² and max ℓᵢᵢ² ≤ λ_max, that ratio is an upper bound on
 *    1/κ₂(R), so a rejected matrix is certainly singular to working precision.
 * Nothing is loaded silently: without a `diagonalLoading` option the matrix is used as given.
 * @module
 */
import { NotPositiveDefiniteError, SingularMatrixError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { type CholeskyResult, choleskyFactor } from '../linalg/cholesky.js';
import { assertHermitian } from '../linalg/eigen.js';
import { assertFiniteCMatrix, assertNonNegative, assertShape, assertSquare } from '../internal/validate.js';

/** Relative Hermitian deviation accepted for correlation matrices (policy rule 1). */
export const HERMITIAN_TOLERANCE = 1e-10;

/**
 * R + δ·I with δ = relativeLoading · Re tr(R) / N: diagonal loading relative to
 * the mean eigenvalue of R.
 *
 * @remarks
 * Loading trades a little optimality for robustness to steering errors and to
 * the estimation noise of a sample correlation matrix (common practice; B. D.
 * Carlson, "Covariance matrix estimation errors and diagonal loading in
 * adaptive arrays", IEEE Trans. AES 24(4), 1988, from memory).
 * @param r - Hermitian matrix, N×N [any power unit].
 * @param relativeLoading - Loading relative to tr(R)/N, ≥ 0 [dimensionless].
 * @returns A new loaded matrix [units of `r`].
 * @throws {@link DimensionError} if not square; {@link DomainError} on non-finite entries or negative loading.
 * @category Beamforming
 */
export function diagonalLoading(r: CMatrix, relativeLoading: number): CMatrix {
  assertSquare('r', r);
  assertFiniteCMatrix('r', r);
  assertNonNegative('relativeLoading', relativeLoading);
  return loaded(r, relativeLoading);
}

function loaded(r: CMatrix, relativeLoading: number): CMatrix {
  const n = r.rows;
  const out = { rows: n, cols: n, data: r.data.slice() };
  if (relativeLoading === 0) return out;
  let tr = 0;
  for (let i = 0; i < n; i++) tr += r.data[2 * (i * n + i)];
  const delta = (relativeLoading * tr) / n;
  for (let i = 0; i < n; i++) out.data[2 * (i * n + i)] += delta;
  return out;
}

/**
 * Applies the conditioning policy of this module to a correlation matrix and
 * returns its Cholesky factor. `name` is the argument name for messages,
 * `n` the expected order.
 */
export function factorCorrelation(name: string, r: CMatrix, n: number, relativeLoading = 0): CholeskyResult {
  assertFiniteCMatrix(name, r);
  assertShape(name, r, n, n, 'one row and column per array element');
  assertNonNegative('diagonalLoading', relativeLoading);
  assertHermitian(name, r, HERMITIAN_TOLERANCE);
  const f = choleskyFactor(relativeLoading > 0 ? loaded(r, relativeLoading) : r);
  if (!f.positiveDefinite) {
    throw new NotPositiveDefiniteError(
      `invalid argument "${name}": the ${n}×${n} correlation matrix is not positive definite (Cholesky pivot ${f.failedPivot} is not positive); `
      + 'it is singular or indefinite. Pass a positive diagonalLoading option (e.g. 1e-3) or add receiver noise.',
      f.failedPivot,
    );
  }
  const bound = pivotConditionBound(f);
  if (bound < 16 * n * Number.EPSILON) {
    throw new SingularMatrixError(
      `invalid argument "${name}": the correlation matrix is singular to working precision (1/condition number ≤ ${bound.toExponential(2)}). `
      + 'Pass a positive diagonalLoading option (e.g. 1e-3) or use more snapshots than elements.',
      f.failedPivot,
    );
  }
  return f;
}

/**
 * (min ℓᵢᵢ / max ℓᵢᵢ)² of a successful Cholesky factor: an upper bound on
 * 1/κ₂ of the factored matrix (0 when the factorisation failed).
 */
export function pivotConditionBound(f: CholeskyResult): number {
  if (!f.positiveDefinite) return 0;
  const n = f.n;
  let lo = Infinity, hi = 0;
  for (let i = 0; i < n; i++) {
    const d = f.l.data[2 * (i * n + i)];
    if (d < lo) lo = d;
    if (d > hi) hi = d;
  }
  return (lo / hi) ** 2;
}

/**
 * Cholesky factor of a Gram matrix (of constraint, interference or steering
 * columns) under the same policy; `message` describes dependent columns.
 */
export function factorGram(gram: CMatrix, message: string): CholeskyResult {
  const f = choleskyFactor(gram);
  if (pivotConditionBound(f) < 16 * gram.rows * Number.EPSILON) throw new SingularMatrixError(message, f.failedPivot);
  return f;
}
