/**
 * LU factorisation with partial pivoting and what it gives: solves, inverse,
 * determinant and a reciprocal condition estimate.
 * @module
 */
import { Complex } from 'complex.js';
import { DimensionError, SingularMatrixError } from '../errors.js';
import { adjointSquare, solveLowerThenUpperInPlace, solveVectorInPlace } from '../internal/triangular.js';
import { assertCMatrix, assertFiniteCMatrix, assertSquare } from '../internal/validate.js';
import { type CMatrix, identity, matrixView } from './cmatrix.js';
import { norm1 } from './ops.js';
import { gemmKernel } from '../internal/gemm.js';

/**
 * Result of {@link luFactor}: P·A = L·U.
 * @category Complex core
 */
export interface LuResult {
  /** Order n of the factored matrix. */
  readonly n: number;
  /** L (unit lower, strictly below the diagonal) and U (on and above) packed in one n×n matrix. */
  readonly lu: CMatrix;
  /** Row permutation: row i of P·A is row `pivots[i]` of A. */
  readonly pivots: Int32Array;
  /** +1 or −1: the sign of the permutation (for the determinant). */
  readonly permutationSign: number;
  /** True when a pivot was exactly zero, or the reciprocal condition number is below machine epsilon. */
  readonly singular: boolean;
  /** Estimate of 1/(‖A‖₁‖A⁻¹‖₁) (Hager–Higham 1-norm estimator); 0 when exactly singular. */
  readonly rcond: number;
}

/** Panel width of the blocked factorisation (columns factored together before one trailing product). */
const LU_BLOCK = 16;

/**
 * Blocked right-looking LU with partial pivoting in place on interleaved row-major
 * storage (n×n): each panel of LU_BLOCK columns is factored by row operations (pivot
 * rows swapped across the full width), the block row of U to its right is solved with
 * the panel's unit lower triangle, and the trailing matrix receives one product
 * A₂₂ −= L₂₁U₁₂ through the shared complex product kernel (its SIMD path for large
 * blocks). Golub & Van Loan, *Matrix Computations*, 4th ed., 2013, §3.4.4 (from memory).
 */
/** @internal Blocked LU in place (pivots in `piv`, initialised to the identity by the caller). */
export function factorInPlace(n: number, d: Float64Array, piv: Int32Array): { sign: number; exactlySingular: boolean } {
  let sign = 1;
  let exactlySingular = false;
  for (let k0 = 0; k0 < n; k0 += LU_BLOCK) {
    const kEnd = Math.min(n, k0 + LU_BLOCK);
    for (let k = k0; k < kEnd; k++) {
      let p = k;
      let best = -1;
      for (let i = k; i < n; i++) {
        const q = 2 * (i * n + k);
        const m = d[q] * d[q] + d[q + 1] * d[q + 1];
        if (m > best) { best = m; p = i; }
      }
      if (p !== k) {
        const rk = 2 * k * n, rp = 2 * p * n;
        for (let j = 0; j < 2 * n; j++) {
          const t = d[rk + j]; d[rk + j] = d[rp + j]; d[rp + j] = t;
        }
        const t = piv[k]; piv[k] = piv[p]; piv[p] = t;
        sign = -sign;
      }
      const kk = 2 * (k * n + k);
      const pr = d[kk], pi = d[kk + 1];
      const den = pr * pr + pi * pi;
      if (den === 0) { exactlySingular = true; continue; }
      const ir = pr / den, ii = -pi / den;
      const rk = 2 * k * n;
      for (let i = k + 1; i < n; i++) {
        const q = 2 * (i * n + k);
        const lr = d[q] * ir - d[q + 1] * ii;
        const li = d[q] * ii + d[q + 1] * ir;
        d[q] = lr; d[q + 1] = li;
        if (lr === 0 && li === 0) continue;
        const ri = 2 * i * n;
        // inside the panel only; columns right of it are updated blockwise below
        for (let j = 2 * (k + 1); j < 2 * kEnd; j += 2) {
          const ur = d[rk + j], ui = d[rk + j + 1];
          d[ri + j] -= lr * ur - li * ui;
          d[ri + j + 1] -= lr * ui + li * ur;
        }
      }
    }
    if (kEnd === n) break;
    // U₁₂: forward substitution with the panel's unit lower triangle, row by row
    for (let i = k0 + 1; i < kEnd; i++) {
      const ri = 2 * i * n;
      for (let r = k0; r < i; r++) {
        const lr = d[ri + 2 * r], li = d[ri + 2 * r + 1];
        if (lr === 0 && li === 0) continue;
        const rr = 2 * r * n;
        for (let j = 2 * kEnd; j < 2 * n; j += 2) {
          const ur = d[rr + j], ui = d[rr + j + 1];
          d[ri + j] -= lr * ur - li * ui;
          d[ri + j + 1] -= lr * ui + li * ur;
        }
      }
    }
    // A₂₂ −= L₂₁ · U₁₂
    const m = n - kEnd, kb = kEnd - k0;
    gemmKernel(m, m, kb, d, kEnd * n + k0, n, d, k0 * n + kEnd, n, d, kEnd * n + kEnd, n, true, -1);
  }
  return { sign, exactlySingular };
}

/**
 * LU factorisation with partial (row) pivoting, P·A = L·U.
 *
 * @remarks
 * Right-looking Doolittle elimination with row operations on contiguous rows;
 * the pivot is the entry of largest modulus in the column (Golub & Van Loan,
 * *Matrix Computations*, 4th ed., 2013, Alg. 3.4.1). The reciprocal condition
 * number is estimated with Hager's 1-norm estimator as refined by Higham
 * ("FORTRAN codes for estimating the one-norm of a real or complex matrix",
 * ACM TOMS 14(4), 1988, Alg. 4.1), costing a few extra solves. Poor
 * conditioning is reported as data: `rcond` small, `singular` true below
 * machine epsilon; solving then throws {@link SingularMatrixError}.
 * @param a - Square matrix, n×n, finite entries.
 * @returns The packed factors, the permutation, `singular` and `rcond`.
 * @throws {@link DimensionError} if `a` is not square or empty; {@link DomainError} on NaN/Infinity.
 * @example
 * ```ts
 * const f = luFactor(fromRows([[4, 3], [6, 3]]));
 * luSolve(f, columnVector([10, 12])); // [1, 2]ᵀ
 * ```
 * @category Complex core
 */
export function luFactor(a: CMatrix): LuResult {
  assertSquare('a', a);
  assertFiniteCMatrix('a', a);
  const n = a.rows;
  const d = a.data.slice();
  const piv = new Int32Array(n);
  for (let i = 0; i < n; i++) piv[i] = i;
  const { sign, exactlySingular } = factorInPlace(n, d, piv);
  const lu: CMatrix = { rows: n, cols: n, data: d };
  let rcond = 0;
  if (!exactlySingular) {
    const anorm = norm1(a);
    const inv = estimateInverseNorm1(n, d, piv);
    rcond = anorm === 0 || inv === 0 ? 0 : 1 / anorm / inv;
    if (!Number.isFinite(rcond)) rcond = 0;
  }
  return { n, lu, pivots: piv, permutationSign: sign, singular: exactlySingular || rcond < Number.EPSILON, rcond };
}

/** Solves A X = B given packed LU (no checks); B is n×k; returns X. @internal */
export function luSolveRaw(n: number, k: number, lu: Float64Array, piv: Int32Array, b: Float64Array): Float64Array {
  const x = new Float64Array(2 * n * k);
  for (let i = 0; i < n; i++) x.set(b.subarray(2 * piv[i] * k, 2 * (piv[i] + 1) * k), 2 * i * k);
  solveLowerThenUpperInPlace(n, k, lu, true, lu, false, x);
  return x;
}

/** Solves Aᴴ X = B given packed LU of A (no checks); B is n×k. */
function luSolveAdjointRaw(n: number, k: number, lu: Float64Array, piv: Int32Array, b: Float64Array): Float64Array {
  // Aᴴ = Uᴴ Lᴴ P: solve Uᴴ w = b (lower), Lᴴ v = w (unit upper), x = Pᵀ v.
  const w = b.slice();
  if (k === 1) {
    // one right-hand side: substitutions that read the rows of U and L (no adjoint copy)
    solveVectorInPlace(n, lu, w, false, false, true);
    solveVectorInPlace(n, lu, w, true, true, true);
  } else {
    const luH = adjointSquare(n, lu);
    solveLowerThenUpperInPlace(n, k, luH, false, luH, true, w);
  }
  const x = new Float64Array(2 * n * k);
  for (let i = 0; i < n; i++) x.set(w.subarray(2 * i * k, 2 * (i + 1) * k), 2 * piv[i] * k);
  return x;
}

/** Hager–Higham estimate of ‖A⁻¹‖₁ from the packed factors. */
function estimateInverseNorm1(n: number, lu: Float64Array, piv: Int32Array): number {
  let x = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) x[2 * i] = 1 / n;
  let est = 0;
  let lastJ = -1;
  for (let iter = 0; iter < 5; iter++) {
    const y = luSolveRaw(n, 1, lu, piv, x);
    let ynorm = 0;
    const xi = new Float64Array(2 * n);
    for (let i = 0; i < n; i++) {
      const m = Math.hypot(y[2 * i], y[2 * i + 1]);
      ynorm += m;
      if (m > 0) { xi[2 * i] = y[2 * i] / m; xi[2 * i + 1] = y[2 * i + 1] / m; } else { xi[2 * i] = 1; }
    }
    if (iter > 0 && ynorm <= est) { est = Math.max(est, ynorm); break; }
    est = ynorm;
    const z = luSolveAdjointRaw(n, 1, lu, piv, xi);
    let j = 0, zmax = -1, ztx = 0;
    for (let i = 0; i < n; i++) {
      const m = Math.hypot(z[2 * i], z[2 * i + 1]);
      if (m > zmax) { zmax = m; j = i; }
      ztx += z[2 * i] * x[2 * i] + z[2 * i + 1] * x[2 * i + 1];
    }
    if (iter > 0 && (zmax <= ztx || j === lastJ)) break;
    lastJ = j;
    x = new Float64Array(2 * n);
    x[2 * j] = 1;
  }
  // Higham's alternative lower bound guards against the estimator's rare failures.
  const alt = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) alt[2 * i] = (i % 2 === 0 ? 1 : -1) * (1 + i / Math.max(n - 1, 1));
  const y = luSolveRaw(n, 1, lu, piv, alt);
  let s = 0;
  for (let i = 0; i < n; i++) s += Math.hypot(y[2 * i], y[2 * i + 1]);
  return Math.max(est, (2 * s) / (3 * n));
}

function checkFactorAndRhs(f: LuResult, b: CMatrix): void {
  checkFactor(f);
  assertFiniteCMatrix('b', b);
  if (b.rows !== f.n) {
    throw new DimensionError(`invalid argument "b": expected ${f.n} rows (the order of the factored matrix), received ${b.rows}×${b.cols}.`);
  }
}

function checkFactor(f: LuResult): void {
  if (f === null || typeof f !== 'object' || !(f.pivots instanceof Int32Array) || f.lu === undefined) {
    throw new DimensionError('invalid argument "factor": expected the result of luFactor.');
  }
  if (f.singular) {
    throw new SingularMatrixError(
      `matrix is singular to working precision (reciprocal condition estimate ${f.rcond.toExponential(2)} < ε); ` +
      'regularise it (e.g. diagonal loading) or use pseudoInverse.',
    );
  }
}

/**
 * Solves A X = B from an LU factorisation.
 * @param factor - Result of {@link luFactor} for the n×n matrix A.
 * @param b - Right-hand sides, n×k (k ≥ 1), finite.
 * @returns X, n×k.
 * @throws {@link SingularMatrixError} if the factorisation flagged A singular; {@link DimensionError} on shape mismatch.
 * @category Complex core
 */
export function luSolve(factor: LuResult, b: CMatrix): CMatrix {
  checkFactorAndRhs(factor, b);
  return matrixView(b.rows, b.cols, luSolveRaw(factor.n, b.cols, factor.lu.data, factor.pivots, b.data));
}

/**
 * Solves Aᴴ X = B from an LU factorisation of A.
 * @param factor - Result of {@link luFactor} for A (n×n).
 * @param b - Right-hand sides, n×k.
 * @returns X, n×k.
 * @throws {@link SingularMatrixError} if A was flagged singular.
 * @category Complex core
 */
export function luSolveAdjoint(factor: LuResult, b: CMatrix): CMatrix {
  checkFactorAndRhs(factor, b);
  return matrixView(b.rows, b.cols, luSolveAdjointRaw(factor.n, b.cols, factor.lu.data, factor.pivots, b.data));
}

/**
 * Solves A X = B (LU with partial pivoting).
 * @param a - Square matrix, n×n.
 * @param b - Right-hand sides, n×k.
 * @returns X, n×k.
 * @throws {@link SingularMatrixError} if A is singular to working precision.
 * @category Complex core
 */
export function solve(a: CMatrix, b: CMatrix): CMatrix {
  assertCMatrix('b', b);
  return luSolve(luFactor(a), b);
}

/**
 * Matrix inverse A⁻¹ (LU with partial pivoting). Prefer {@link solve} when
 * the inverse is only applied to vectors.
 * @param a - Square matrix, n×n.
 * @returns A⁻¹.
 * @throws {@link SingularMatrixError} if A is singular to working precision.
 * @category Complex core
 */
export function inverse(a: CMatrix): CMatrix {
  const f = luFactor(a);
  return luSolve(f, identity(f.n));
}

/**
 * Determinant det A from the LU factors (product of U's diagonal and the
 * permutation sign). May overflow to ±Infinity for large matrices; use
 * {@link logDeterminant} then.
 * @param a - Square matrix, n×n.
 * @returns det A as a complex.js value (0 for an exactly singular matrix).
 * @category Complex core
 */
export function determinant(a: CMatrix): Complex {
  const f = luFactor(a);
  const { n } = f;
  const d = f.lu.data;
  let re = f.permutationSign, im = 0;
  for (let i = 0; i < n; i++) {
    const ur = d[2 * (i * n + i)], ui = d[2 * (i * n + i) + 1];
    const t = re * ur - im * ui;
    im = re * ui + im * ur;
    re = t;
  }
  return new Complex(re, im);
}

/**
 * Result of {@link logDeterminant}: det A = exp(logAbs)·exp(j·phaseRad).
 * @category Complex core
 */
export interface LogDeterminantResult {
  /** ln|det A|; −Infinity for an exactly singular matrix. */
  readonly logAbs: number;
  /** arg(det A) in (−π, π] [rad]. */
  readonly phaseRad: number;
}

/**
 * Natural logarithm of the determinant, robust against overflow:
 * ln|det A| and the phase arg(det A).
 * @param a - Square matrix, n×n.
 * @returns `{ logAbs, phaseRad }` with det A = exp(logAbs)·exp(j·phaseRad); logAbs = −Infinity when singular.
 * @category Complex core
 */
export function logDeterminant(a: CMatrix): LogDeterminantResult {
  const f = luFactor(a);
  const { n } = f;
  const d = f.lu.data;
  let logAbs = 0;
  let phase = f.permutationSign < 0 ? Math.PI : 0;
  for (let i = 0; i < n; i++) {
    const ur = d[2 * (i * n + i)], ui = d[2 * (i * n + i) + 1];
    logAbs += Math.log(Math.hypot(ur, ui));
    phase += Math.atan2(ui, ur);
  }
  phase = Math.atan2(Math.sin(phase), Math.cos(phase));
  return { logAbs, phaseRad: phase };
}
