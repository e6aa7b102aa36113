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
import { simdLuFactor } from '../internal/luWasm.js';

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

/** Panel width at which the recursion stops and columns are eliminated one by one. */
const LU_LEAF = 4;

/** Largest order factored whole in the WebAssembly module (16·n² bytes, within cache); larger ones recurse on the product kernel. */
const LU_SIMD_MAX_ORDER = 160;

/**
 * LU with partial pivoting in place on interleaved row-major storage (n×n),
 * by recursion on the columns (Toledo, "Locality of reference in LU
 * decomposition with partial pivoting", SIAM J. Matrix Anal. Appl. 18(4),
 * 1997): the left half of a panel is factored, the block of U to its right is
 * solved with the half's unit lower triangle, the rest of the panel receives
 * one product A₂₂ −= L₂₁U₁₂ through the shared complex product kernel, and
 * the right half is factored the same way. Pivot rows are swapped across the
 * full width, so P·A = L·U exactly as in the right-looking elimination
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., 2013, Alg. 3.4.1); most
 * of the work runs in the product kernel (its SIMD path). Panels of at most
 * LU_LEAF columns are eliminated column by column. With WebAssembly SIMD, orders
 * up to LU_SIMD_MAX_ORDER are instead eliminated whole in the module memory of
 * `wasm/lu.wat` (same pivots and operation order as the column-by-column code),
 * which spares the per-block product calls that dominate at such sizes.
 * `src`, when given, holds A and `d` receives the factors.
 * @internal Pivots in `piv` (initialised to the identity by the caller);
 * `minPivot` is the smallest pivot modulus (0 when a pivot is exactly zero).
 */
export function factorInPlace(n: number, d: Float64Array, piv: Int32Array, src: Float64Array = d): { sign: number; exactlySingular: boolean; minPivot: number } {
  if (n <= LU_SIMD_MAX_ORDER) {
    const r = simdLuFactor(n, src, piv, d);
    if (r !== null) return { sign: r.swaps % 2 === 0 ? 1 : -1, exactlySingular: r.minPivotSq === 0, minPivot: Math.sqrt(r.minPivotSq) };
  }
  if (src !== d) d.set(src);
  const state = { sign: 1, minPivotSq: Infinity };
  factorPanel(n, d, piv, 0, n, state);
  return { sign: state.sign, exactlySingular: state.minPivotSq === 0, minPivot: Math.sqrt(state.minPivotSq) };
}

/** Factors columns k … k+w−1 of rows k … n−1 (everything left of column k already factored and applied). */
function factorPanel(n: number, d: Float64Array, piv: Int32Array, k: number, w: number, state: { sign: number; minPivotSq: number }): void {
  if (w <= LU_LEAF) {
    eliminatePanel(n, d, piv, k, w, state);
    return;
  }
  const w1 = w >> 1, w2 = w - w1;
  factorPanel(n, d, piv, k, w1, state);
  // U₁₂ = L₁₁⁻¹ A₁₂, then A₂₂ −= L₂₁ U₁₂
  solveUnitLowerBlock(n, d, k, w1, k + w1, w2);
  gemmKernel(n - k - w1, w2, w1, d, (k + w1) * n + k, n, d, k * n + k + w1, n, d, (k + w1) * n + k + w1, n, true, -1);
  factorPanel(n, d, piv, k + w1, w2, state);
}

/** Column-by-column elimination of the panel of columns k … k+w−1, rows k … n−1. */
function eliminatePanel(n: number, d: Float64Array, piv: Int32Array, k0: number, w: number, state: { sign: number; minPivotSq: number }): void {
  const kEnd = k0 + w;
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
      state.sign = -state.sign;
    }
    const kk = 2 * (k * n + k);
    const pr = d[kk], pi = d[kk + 1];
    const den = pr * pr + pi * pi;
    if (den < state.minPivotSq) state.minPivotSq = den;
    if (den === 0) continue;
    const ir = pr / den, ii = -pi / den;
    const rk = 2 * k * n;
    for (let i = k + 1; i < n; i++) {
      const q = 2 * (i * n + k);
      const lr = d[q] * ir - d[q + 1] * ii;
      const li = d[q] * ii + d[q + 1] * ir;
      d[q] = lr; d[q + 1] = li;
      if (lr === 0 && li === 0) continue;
      const ri = 2 * i * n;
      // inside the panel only; columns right of it are updated by the caller's product
      for (let j = 2 * (k + 1); j < 2 * kEnd; j += 2) {
        const ur = d[rk + j], ui = d[rk + j + 1];
        d[ri + j] -= lr * ur - li * ui;
        d[ri + j + 1] -= lr * ui + li * ur;
      }
    }
  }
}

/**
 * B := L⁻¹ B in place, L the unit lower triangle of the w×w diagonal block at
 * (k, k) and B the w×cols block at (k, c); recursive halving, so that the
 * off-diagonal work is one product per level, with forward substitution below LU_LEAF rows.
 */
function solveUnitLowerBlock(n: number, d: Float64Array, k: number, w: number, c: number, cols: number): void {
  if (w <= LU_LEAF) {
    for (let i = k + 1; i < k + w; i++) {
      const ri = 2 * i * n;
      for (let r = k; r < i; r++) {
        const lr = d[ri + 2 * r], li = d[ri + 2 * r + 1];
        if (lr === 0 && li === 0) continue;
        const rr = 2 * r * n;
        for (let j = 2 * c; j < 2 * (c + cols); j += 2) {
          const ur = d[rr + j], ui = d[rr + j + 1];
          d[ri + j] -= lr * ur - li * ui;
          d[ri + j + 1] -= lr * ui + li * ur;
        }
      }
    }
    return;
  }
  const h = w >> 1;
  solveUnitLowerBlock(n, d, k, h, c, cols);
  gemmKernel(w - h, cols, h, d, (k + h) * n + k, n, d, k * n + c, n, d, (k + h) * n + c, n, true, -1);
  solveUnitLowerBlock(n, d, k + h, w - h, c, cols);
}

/**
 * LU factorisation with partial (row) pivoting, P·A = L·U.
 *
 * @remarks
 * Doolittle elimination with row operations on contiguous rows; the pivot is
 * the entry of largest modulus in the column (Golub & Van Loan, *Matrix
 * Computations*, 4th ed., 2013, Alg. 3.4.1): up to order 160 whole on a
 * WebAssembly SIMD kernel, above it by recursion on the columns so that most
 * work runs in the complex product kernel (Toledo, SIAM J. Matrix Anal. Appl.
 * 18(4), 1997). The reciprocal condition
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
  return factorValidated(a, 'always');
}

/** Smallest pivot modulus, relative to the largest entry modulus of A, that {@link solve} accepts without a condition estimate (√ε). */
const PIVOT_SUSPECT = Math.sqrt(Number.EPSILON);

/**
 * Validates and factors `a`. The condition estimate runs `'always'`, `'never'`
 * (rcond NaN, singular only for an exactly zero pivot), or `'suspect'`: only
 * when the smallest pivot is below PIVOT_SUSPECT·max|aᵢⱼ|, else rcond is NaN.
 * `transient`: the factors may be a view of the LU module's memory, valid only
 * until its next use (for a caller that solves with them at once).
 */
function factorValidated(a: CMatrix, estimate: 'always' | 'suspect' | 'never', transient = false): LuResult {
  assertSquare('a', a);
  const n = a.rows;
  // one pass: finiteness (x·0 is NaN only for ±Infinity and NaN) and the largest modulus
  const src = a.data;
  let bad = 0, maxSq = 0;
  for (let i = 0; i < src.length; i += 2) {
    const re = src[i], im = src[i + 1];
    bad += re * 0 + im * 0;
    const s = re * re + im * im;
    if (s > maxSq) maxSq = s;
  }
  if (bad !== 0) assertFiniteCMatrix('a', a);
  const piv = new Int32Array(n);
  for (let i = 0; i < n; i++) piv[i] = i;
  const inModule = transient && n <= LU_SIMD_MAX_ORDER ? simdLuFactor(n, src, piv) : null;
  let d: Float64Array, sign: number, exactlySingular: boolean, minPivot: number;
  if (inModule !== null) {
    d = inModule.lu;
    sign = inModule.swaps % 2 === 0 ? 1 : -1;
    exactlySingular = inModule.minPivotSq === 0;
    minPivot = Math.sqrt(inModule.minPivotSq);
  } else {
    d = new Float64Array(2 * n * n);
    ({ sign, exactlySingular, minPivot } = factorInPlace(n, d, piv, src));
  }
  const lu: CMatrix = { rows: n, cols: n, data: d };
  let rcond = exactlySingular ? 0 : NaN;
  if (!exactlySingular && (estimate === 'always' || (estimate === 'suspect' && minPivot <= PIVOT_SUSPECT * Math.sqrt(maxSq)))) {
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
 *
 * @remarks
 * Like LAPACK's `zgesv` (Anderson et al., *LAPACK Users' Guide*, 3rd ed.,
 * SIAM, 1999, §2.3.1, from memory), `solve` skips the 1-norm condition estimate of
 * {@link luFactor} — unless elimination meets a pivot of modulus below
 * √ε·max|aᵢⱼ|: a matrix within a small relative distance of a singular one
 * (|lᵢⱼ| ≤ 1, so zeroing such a pivot changes A by at most √n times it). Then
 * the estimate runs and a reciprocal condition below ε throws, exactly as
 * `luSolve(luFactor(a), b)` would. An exactly zero pivot always throws. Use
 * {@link luFactor} to read `rcond` itself.
 * @param a - Square matrix, n×n.
 * @param b - Right-hand sides, n×k.
 * @returns X, n×k.
 * @throws {@link SingularMatrixError} if A is exactly singular, or has a pivot below √ε·max|aᵢⱼ| and an estimated reciprocal condition below ε.
 * @throws {@link DimensionError} if `a` is not square or `b` has the wrong number of rows; {@link DomainError} on NaN/Infinity.
 * @category Complex core
 */
export function solve(a: CMatrix, b: CMatrix): CMatrix {
  assertCMatrix('b', b);
  // the factors stay in the LU module's memory: they are used at once and dropped
  return luSolve(factorValidated(a, 'suspect', true), b);
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
  const f = factorValidated(a, 'never');
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
  const f = factorValidated(a, 'never');
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
