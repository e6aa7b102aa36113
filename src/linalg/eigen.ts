/**
 * Hermitian eigendecomposition (standard and generalised Hermitian-definite).
 * @module
 */
import { DimensionError, DomainError, NotPositiveDefiniteError } from '../errors.js';
import { adjointSquare, solveLowerInPlace, solveUpperInPlace } from '../internal/triangular.js';
import { backTransform, reduceHermitianToTridiagonal, tridiagonalQl } from '../internal/tridiagonal.js';
import { tridiagonalDivideConquer } from '../internal/divideConquer.js';
import { assertFiniteCMatrix, assertNonNegative, assertSquare } from '../internal/validate.js';
import { choleskyFactor } from './cholesky.js';
import type { CMatrix } from './cmatrix.js';
import { hermitianDeviation, hermitianPart } from './ops.js';

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
   * which is two to three times faster.
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

/** Order from which the eigenvectors of the tridiagonal matrix come from divide and conquer instead of QL (measured: QL is faster up to about 96, divide and conquer 15 % faster at 128). */
const DC_MIN_ORDER = 100;

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
  // the lower triangle of (A + Aᴴ)/2 in 32×32 tiles, so the transposed reads stay in cache
  for (let i0 = 0; i0 < n; i0 += 32) {
    const i1 = Math.min(n, i0 + 32);
    for (let j0 = 0; j0 <= i0; j0 += 32) {
      for (let i = i0; i < i1; i++) {
        const j1 = Math.min(i + 1, j0 + 32);
        for (let j = j0; j < j1; j++) {
          const p = 2 * (i * n + j), q = 2 * (j * n + i);
          w[p] = 0.5 * sc * (src[p] + src[q]);
          w[p + 1] = 0.5 * sc * (src[p + 1] - src[q + 1]);
        }
      }
    }
  }
  const red = reduceHermitianToTridiagonal(w, n);
  const d = red.d;
  // Divide and conquer from order DC_MIN_ORDER on (it returns Zᵀ, values sorted), else QL on Z = I.
  let z: Float64Array | null = null;
  const dc = !valuesOnly && n >= DC_MIN_ORDER;
  if (dc) {
    z = tridiagonalDivideConquer(d, red.e, n);
  } else {
    if (!valuesOnly) {
      z = new Float64Array(n * n);
      for (let i = 0; i < n; i++) z[i * n + i] = 1;
    }
    tridiagonalQl(d, red.e.slice(), n, z);
  }
  const order = Array.from({ length: n }, (_, i) => i).sort((x, y) => d[x] - d[y]);
  const values = new Float64Array(n);
  for (let j = 0; j < n; j++) values[j] = d[order[j]] * mag;
  if (z === null) return { values, vectors: null };
  // Back-transform the columns of Z in ascending order of their eigenvalues.
  const v = new Float64Array(2 * n * n);
  backTransform(red, z, order, v, dc);
  return { values, vectors: { rows: n, cols: n, data: v } };
}

/**
 * All eigenvalues (ascending) and orthonormal eigenvectors of a complex
 * Hermitian matrix, A V = V Λ, Vᴴ V = I.
 *
 * @remarks
 * Method: Householder reduction of A to real symmetric tridiagonal form (complex
 * reflectors followed by a diagonal phase similarity that makes the
 * off-diagonal real); eigenvectors of the tridiagonal by Cuppen's divide and
 * conquer with Gu–Eisenstat vectors from n = 100 on (below, and for values
 * only, implicit QL iteration with shifts accumulating real plane rotations);
 * then back-transformation of the real eigenvectors by the phases and
 * reflectors (blocked, compact WY). The input is scaled by its
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
 * - J. J. M. Cuppen, "A divide and conquer method for the symmetric tridiagonal eigenproblem",
 *   Numer. Math. 36, 1981; M. Gu & S. C. Eisenstat, "A divide-and-conquer algorithm for the symmetric
 *   tridiagonal eigenproblem", SIAM J. Matrix Anal. Appl. 16(1), 1995 (both from memory).
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

/**
 * Result of {@link generalizedHermitianEigen}.
 * @category Complex core
 */
export interface GeneralizedEigenResult {
  /** Eigenvalues λ of A x = λ B x in ascending order, length n [unit of a / unit of b]. */
  readonly values: Float64Array;
  /**
   * Eigenvectors as the COLUMNS of an n×n matrix, normalised to xᴴ B x = 1
   * (B-orthonormal: Xᴴ B X = I, Xᴴ A X = Λ), or `null` with `valuesOnly`.
   */
  readonly vectors: CMatrix | null;
  /**
   * (max lᵢᵢ / min lᵢᵢ)² over the Cholesky factor of B: a cheap LOWER bound on
   * the 2-norm condition number of B. When it approaches 1/ε ≈ 4.5e15 the
   * reduction L⁻¹ A L⁻ᴴ loses all accuracy and the eigenvalues should not be
   * trusted; regularise B (diagonal loading) first.
   */
  readonly bConditionLowerBound: number;
}

/**
 * Generalised Hermitian-definite eigenproblem A x = λ B x, with A Hermitian and
 * B Hermitian positive definite (e.g. signal and noise correlation matrices in
 * the maximum-SNR beamformer: the largest λ is the best achievable SNR).
 *
 * @remarks
 * Cholesky reduction: B = L Lᴴ, C = L⁻¹ A L⁻ᴴ (Hermitian), C Y = Y Λ by
 * {@link hermitianEigen}, X = L⁻ᴴ Y, so that Xᴴ B X = I and Xᴴ A X = Λ
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., 2013, §8.7.2, from memory;
 * R. S. Martin & J. H. Wilkinson, "Reduction of the symmetric eigenproblem
 * Ax = λBx and related problems to standard form", Numer. Math. 11, 1968,
 * from memory). Accuracy degrades with the conditioning of B: the errors in λ
 * are of order ε ‖A‖ ‖B⁻¹‖, so `bConditionLowerBound` is reported.
 * @param a - Hermitian n×n matrix, any unit.
 * @param b - Hermitian positive-definite n×n matrix, any unit.
 * @param options - Tolerance of the Hermitian checks (applied to both) and values-only switch.
 * @returns Ascending eigenvalues, B-orthonormal eigenvectors and a conditioning indicator of B.
 * @throws {@link DimensionError} if `a` or `b` is not square, empty, or their orders differ.
 * @throws {@link DomainError} if an entry is NaN/±Infinity or a matrix is not Hermitian within the tolerance.
 * @throws {@link NotPositiveDefiniteError} if B is not positive definite (its `index` is the failing Cholesky pivot).
 * @example
 * ```ts
 * const r = generalizedHermitianEigen(fromRows([[2, 0], [0, 3]]), fromRows([[1, 0], [0, 2]]));
 * // r.values: Float64Array [1.5, 2]
 * ```
 * @category Complex core
 */
export function generalizedHermitianEigen(a: CMatrix, b: CMatrix, options: HermitianEigenOptions = {}): GeneralizedEigenResult {
  const { hermitianTolerance = 1e-10, valuesOnly = false } = options;
  const n = assertHermitian('a', a, hermitianTolerance);
  assertHermitian('b', b, hermitianTolerance);
  if (b.rows !== n) {
    throw new DimensionError(`invalid argument "b": expected ${n}×${n} (the order of "a"), received ${b.rows}×${b.cols}.`);
  }
  const f = choleskyFactor(hermitianPart(b), { hermitianTolerance: Infinity });
  if (!f.positiveDefinite) {
    throw new NotPositiveDefiniteError(`invalid argument "b": expected a Hermitian positive-definite matrix, but its Cholesky pivot ${f.failedPivot} is not positive; B must be a valid (noise) correlation or metric matrix — add diagonal loading if it is only semidefinite.`, f.failedPivot);
  }
  const l = f.l.data;
  let dmin = Infinity, dmax = 0;
  for (let i = 0; i < n; i++) {
    const v = l[2 * (i * n + i)];
    if (v < dmin) dmin = v;
    if (v > dmax) dmax = v;
  }
  // C = L⁻¹ (L⁻¹ A)ᴴ = L⁻¹ A L⁻ᴴ for Hermitian A.
  const x = hermitianPart(a).data;
  solveLowerInPlace(n, n, l, x, false);
  const c = adjointSquare(n, x);
  solveLowerInPlace(n, n, l, c, false);
  const eig = hermitianEigenKernel({ rows: n, cols: n, data: c }, valuesOnly);
  const bConditionLowerBound = (dmax / dmin) ** 2;
  if (eig.vectors === null) return { values: eig.values, vectors: null, bConditionLowerBound };
  const y = eig.vectors.data;
  solveUpperInPlace(n, n, f.lAdjoint.data, y, false);
  return { values: eig.values, vectors: { rows: n, cols: n, data: y }, bConditionLowerBound };
}
