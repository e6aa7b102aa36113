/**
 * Hermitian eigendecomposition (standard and generalised Hermitian-definite).
 * @module
 */
import { DomainError } from '../errors.js';
import { backTransform, reduceHermitianToTridiagonal, tridiagonalQl } from '../internal/tridiagonal.js';
import { assertFiniteCMatrix, assertNonNegative, assertSquare } from '../internal/validate.js';
import type { CMatrix } from './cmatrix.js';
import { hermitianDeviation } from './ops.js';

/**
 * Options of {@link hermitianEigen} and {@link generalizedHermitianEigen}.
 * @category Complex core
 */
export interface HermitianEigenOptions {
  /**
   * Largest accepted relative deviation from Hermitian symmetry,
   * max |aᵢⱼ − conj(aⱼᵢ)| / max |aᵢⱼ| (see {@link hermitianDeviation}).
   * Within it the Hermitian part (A + Aᴴ)/2 is decomposed.
   * @defaultValue 1e-10
   */
  hermitianTolerance?: number;
  /**
   * When true only the eigenvalues are computed (`vectors` is then `null`),
   * which is about three times faster.
   * @defaultValue false
   */
  valuesOnly?: boolean;
}

/**
 * Result of {@link hermitianEigen}.
 * @category Complex core
 */
export interface HermitianEigenResult {
  /** Eigenvalues in ascending order (real), length n. */
  readonly values: Float64Array;
  /**
   * Orthonormal eigenvectors as the COLUMNS of an n×n matrix (column j belongs
   * to `values[j]`), or `null` with `valuesOnly`. Each column is determined up
   * to a unit complex factor (and up to a rotation within a repeated eigenvalue).
   */
  readonly vectors: CMatrix | null;
}

/** Validates a Hermitian input and returns its name-free order. @internal */
export function assertHermitian(name: string, a: CMatrix, tol: number): number {
  assertSquare(name, a);
  assertFiniteCMatrix(name, a);
  assertNonNegative('hermitianTolerance', tol);
  const dev = hermitianDeviation(a);
  if (dev > tol) {
    throw new DomainError(`invalid argument "${name}": expected a Hermitian matrix (aᵢⱼ = conj(aⱼᵢ)), received one whose relative deviation max|aᵢⱼ − conj(aⱼᵢ)|/max|aᵢⱼ| is ${dev.toExponential(3)} > hermitianTolerance ${tol}; pass (A + Aᴴ)/2 or raise the tolerance.`);
  }
  return a.rows;
}

/**
 * Eigen-decomposes an n×n Hermitian matrix without validation. The Hermitian
 * part of `a` is used. @internal
 */
export function hermitianEigenKernel(a: CMatrix, valuesOnly: boolean): HermitianEigenResult {
  const n = a.rows, src = a.data;
  // Scale to max |aᵢⱼ| = 1 so squares in the kernels can neither overflow nor underflow.
  let mag = 0;
  for (let k = 0; k < src.length; k++) mag = Math.max(mag, Math.abs(src[k]));
  const sc = mag === 0 ? 1 : 1 / mag;
  const w = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const p = 2 * (i * n + j), q = 2 * (j * n + i);
      w[p] = 0.5 * sc * (src[p] + src[q]);
      w[p + 1] = 0.5 * sc * (src[p + 1] - src[q + 1]);
    }
  }
  const red = reduceHermitianToTridiagonal(w, n);
  const d = red.d;
  let z: Float64Array | null = null;
  if (!valuesOnly) {
    z = new Float64Array(n * n);
    for (let i = 0; i < n; i++) z[i * n + i] = 1;
  }
  tridiagonalQl(d, red.e.slice(), n, z);
  const order = Array.from({ length: n }, (_, i) => i).sort((x, y) => d[x] - d[y]);
  const values = new Float64Array(n);
  for (let j = 0; j < n; j++) values[j] = d[order[j]] * mag;
  if (z === null) return { values, vectors: null };
  // Sort the columns of Z, then back-transform.
  const zs = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    const row = i * n;
    for (let j = 0; j < n; j++) zs[row + j] = z[row + order[j]];
  }
  const v = new Float64Array(2 * n * n);
  backTransform(red, zs, n, v);
  return { values, vectors: { rows: n, cols: n, data: v } };
}

/**
 * All eigenvalues (ascending) and orthonormal eigenvectors of a complex
 * Hermitian matrix, A V = V Λ, Vᴴ V = I.
 *
 * @remarks
 * Method: Householder reduction of A to real symmetric tridiagonal form (complex
 * reflectors followed by a diagonal phase similarity that makes the
 * off-diagonal real), implicit QL iteration with shifts on the tridiagonal
 * accumulating real plane rotations, then back-transformation of the real
 * eigenvectors by the phases and reflectors. The input is scaled by its
 * largest entry first. Backward stable: the computed pair satisfies
 * ‖A V − V Λ‖ ≈ O(n ε ‖A‖) and ‖Vᴴ V − I‖ ≈ O(n ε); eigenvalues are accurate
 * to O(ε ‖A‖) absolutely (so small eigenvalues of an ill-conditioned A have
 * large relative error, and eigenvectors of close eigenvalues are
 * individually ill-determined while their span is not).
 *
 * References:
 * - G. H. Golub & C. F. Van Loan, *Matrix Computations*, 4th ed., Johns Hopkins, 2013, §8.3 (from memory).
 * - J. H. Wilkinson & C. Reinsch, *Handbook for Automatic Computation, Vol. II: Linear Algebra*,
 *   Springer, 1971, contributions II/2 (tridiagonalisation of Hermitian matrices) and II/3 (QL), from memory.
 *
 * @param a - Hermitian n×n matrix (n ≥ 1), any unit; only its Hermitian part is used.
 * @param options - Tolerance of the Hermitian check and the values-only switch.
 * @returns Eigenvalues [unit of `a`] ascending and eigenvectors (dimensionless, unit 2-norm columns).
 * @throws {@link DimensionError} if `a` is not square or is empty.
 * @throws {@link DomainError} if an entry is NaN/±Infinity or `a` is not Hermitian within the tolerance.
 * @throws {@link ConvergenceError} if the QL iteration fails (not observed for finite inputs).
 * @example
 * ```ts
 * const { values, vectors } = hermitianEigen(fromRows([[2, { re: 0, im: 1 }], [{ re: 0, im: -1 }, 2]]));
 * // values: Float64Array [1, 3]
 * ```
 * @category Complex core
 */
export function hermitianEigen(a: CMatrix, options: HermitianEigenOptions = {}): HermitianEigenResult {
  const { hermitianTolerance = 1e-10, valuesOnly = false } = options;
  assertHermitian('a', a, hermitianTolerance);
  return hermitianEigenKernel(a, valuesOnly);
}
