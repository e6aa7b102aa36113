/**
 * Singular value decomposition by one-sided Jacobi rotations, and the
 * condition number, pseudo-inverse and numerical rank built on it.
 * @module
 */
import { ConvergenceError, DimensionError } from '../errors.js';
import { assertFiniteCMatrix, assertNonNegative } from '../internal/validate.js';
import { simdJacobiSweeps } from '../internal/jacobiWasm.js';
import type { CMatrix } from './cmatrix.js';
import { matrixView } from './cmatrix.js';

const EPS = 2.220446049250313e-16;

/**
 * Result of {@link svd}: A = U diag(s) Vᴴ (thin form).
 * @category Complex core
 */
export interface SvdResult {
  /** Left singular vectors, m×k orthonormal columns, k = min(m, n). */
  readonly u: CMatrix;
  /** Singular values in descending order, length k, ≥ 0 [unit of a]. */
  readonly s: Float64Array;
  /** Right singular vectors, n×k orthonormal columns. */
  readonly v: CMatrix;
  /** Number of Jacobi sweeps used (diagnostic). */
  readonly sweeps: number;
}

function assertNonEmpty(name: string, a: CMatrix): void {
  assertFiniteCMatrix(name, a);
  if (a.rows === 0 || a.cols === 0) {
    throw new DimensionError(`invalid argument "${name}": expected a non-empty matrix, received ${a.rows}×${a.cols}.`);
  }
}

/**
 * One-sided Jacobi on the columns of an m×n matrix (m ≥ n). `g` holds the
 * columns as ROWS (n rows of length m, interleaved), `vt` the columns of V as
 * rows (n×n, initialised to I). On return the rows of `g` are mutually
 * orthogonal (relative tolerance `tol`) and g = (A V)ᵀ. The squared column
 * norms are summed at the start of each sweep and then updated per rotation
 * (Drmač & Veselić 2008), so each pair costs one inner product, not three;
 * each row p of a sweep starts with de Rijk's pivot (1989): the remaining
 * column of largest norm is swapped into place p.
 */
function jacobiColumns(g: Float64Array, vt: Float64Array, m: number, n: number): number {
  const tol = Math.max(EPS * Math.sqrt(m), EPS);
  const m2 = 2 * m, n2 = 2 * n;
  const maxSweeps = 80;
  // the same sweeps on the WebAssembly SIMD kernel where it runs (wasm/jacobi.wat)
  const simd = n > 1 ? simdJacobiSweeps(g, vt, m, n, tol, maxSweeps) : 0;
  if (simd > maxSweeps) throw nonConvergence(maxSweeps);
  if (simd > 0) return simd;
  const norm2 = (off: number): number => {
    let s2 = 0;
    for (let k = 0; k < m2; k++) s2 += g[off + k] * g[off + k];
    return s2;
  };
  const nu = new Float64Array(n); // squared column norms, summed afresh each sweep and updated per rotation
  for (let sweep = 1; sweep <= maxSweeps; sweep++) {
    let rotated = false;
    for (let p = 0; p < n; p++) nu[p] = norm2(p * m2);
    for (let p = 0; p < n - 1; p++) {
      const gp = p * m2, vp = p * n2;
      // de Rijk's pivot: the remaining column of largest norm moves to position p
      let best = p;
      for (let q = p + 1; q < n; q++) if (nu[q] > nu[best]) best = q;
      if (best !== p) {
        swapRanges(g, gp, best * m2, m2);
        swapRanges(vt, vp, best * n2, n2);
        const t = nu[p]; nu[p] = nu[best]; nu[best] = t;
      }
      for (let q = p + 1; q < n; q++) {
        const gq = q * m2, vq = q * n2;
        const alpha = nu[p], beta = nu[q];
        let gr = 0, gi = 0;
        for (let k = 0; k < m2; k += 2) {
          const ar = g[gp + k], ai = g[gp + k + 1];
          const br = g[gq + k], bi = g[gq + k + 1];
          gr += ar * br + ai * bi;
          gi += ar * bi - ai * br;
        }
        const gabs = Math.sqrt(gr * gr + gi * gi);
        if (gabs === 0 || gabs <= tol * Math.sqrt(alpha) * Math.sqrt(beta)) continue;
        rotated = true;
        const zeta = (beta - alpha) / (2 * gabs);
        const t = (zeta >= 0 ? 1 : -1) / (Math.abs(zeta) + Math.sqrt(1 + zeta * zeta));
        const c = 1 / Math.sqrt(1 + t * t);
        const s = c * t;
        // e^{−jφ} = conj(γ)/|γ|; g_p ← c g_p − s e^{−jφ} g_q; g_q ← s g_p + c e^{−jφ} g_q
        const er = gr / gabs, ei = -gi / gabs;
        for (let k = 0; k < m2; k += 2) {
          const ar = g[gp + k], ai = g[gp + k + 1];
          const br = g[gq + k], bi = g[gq + k + 1];
          const hr = er * br - ei * bi, hi = er * bi + ei * br;
          g[gp + k] = c * ar - s * hr;
          g[gp + k + 1] = c * ai - s * hi;
          g[gq + k] = s * ar + c * hr;
          g[gq + k + 1] = s * ai + c * hi;
        }
        for (let k = 0; k < n2; k += 2) {
          const ar = vt[vp + k], ai = vt[vp + k + 1];
          const br = vt[vq + k], bi = vt[vq + k + 1];
          const hr = er * br - ei * bi, hi = er * bi + ei * br;
          vt[vp + k] = c * ar - s * hr;
          vt[vp + k + 1] = c * ai - s * hi;
          vt[vq + k] = s * ar + c * hr;
          vt[vq + k + 1] = s * ai + c * hi;
        }
        // the exact squared norms after the rotation, α − t|γ| and β + t|γ|; summed again
        // where the update cancels (loses more than four digits)
        const a2 = alpha - t * gabs, b2 = beta + t * gabs;
        nu[p] = a2 < 1e-4 * alpha ? norm2(gp) : a2;
        nu[q] = b2 < 1e-4 * beta ? norm2(gq) : b2;
      }
    }
    if (!rotated) return sweep;
  }
  throw nonConvergence(maxSweeps);
}

/** Swaps x[a … a + len − 1] and x[b … b + len − 1]. */
function swapRanges(x: Float64Array, a: number, b: number, len: number): void {
  for (let k = 0; k < len; k++) {
    const t = x[a + k];
    x[a + k] = x[b + k];
    x[b + k] = t;
  }
}

function nonConvergence(maxSweeps: number): ConvergenceError {
  return new ConvergenceError(`svd: one-sided Jacobi did not converge within ${maxSweeps} sweeps; the input may contain values near overflow or underflow.`);
}

/**
 * Completes the orthonormal set of rows of `u` (k rows of length m) where
 * `missing[j]` is true, by Gram–Schmidt (twice) on unit vectors e_i.
 */
function completeOrthonormal(u: Float64Array, m: number, k: number, missing: boolean[]): void {
  const m2 = 2 * m;
  let cand = 0;
  for (let j = 0; j < k; j++) {
    if (!missing[j]) continue;
    for (; cand < m; cand++) {
      const row = j * m2;
      u.fill(0, row, row + m2);
      u[row + 2 * cand] = 1;
      for (let pass = 0; pass < 2; pass++) {
        for (let o = 0; o < k; o++) {
          if (o === j || (missing[o] && o > j)) continue;
          const ro = o * m2;
          let dr = 0, di = 0;
          for (let t = 0; t < m2; t += 2) {
            dr += u[ro + t] * u[row + t] + u[ro + t + 1] * u[row + t + 1];
            di += u[ro + t] * u[row + t + 1] - u[ro + t + 1] * u[row + t];
          }
          for (let t = 0; t < m2; t += 2) {
            u[row + t] -= dr * u[ro + t] - di * u[ro + t + 1];
            u[row + t + 1] -= dr * u[ro + t + 1] + di * u[ro + t];
          }
        }
      }
      let nn = 0;
      for (let t = 0; t < m2; t++) nn += u[row + t] * u[row + t];
      if (nn > 0.25) {
        const inv = 1 / Math.sqrt(nn);
        for (let t = 0; t < m2; t++) u[row + t] *= inv;
        cand++;
        break;
      }
    }
  }
}

/** SVD of a validated m×n matrix with m ≥ n, returned with U m×n, V n×n. */
function svdTall(a: CMatrix, conjugateTranspose: boolean): { u: Float64Array; s: Float64Array; v: Float64Array; sweeps: number } {
  // Work matrix: the columns of A (or of Aᴴ) as rows.
  const m = conjugateTranspose ? a.cols : a.rows;
  const n = conjugateTranspose ? a.rows : a.cols;
  const src = a.data;
  let mag = 0;
  for (let k = 0; k < src.length; k++) mag = Math.max(mag, Math.abs(src[k]));
  const sc = mag === 0 ? 1 : 1 / mag;
  const g = new Float64Array(2 * m * n);
  if (conjugateTranspose) {
    // columns of Aᴴ are conjugated rows of A: g row j = conj(A row j)
    for (let k = 0; k < src.length; k += 2) { g[k] = src[k] * sc; g[k + 1] = -src[k + 1] * sc; }
  } else {
    const cols = a.cols;
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < n; j++) {
        g[2 * (j * m + i)] = src[2 * (i * cols + j)] * sc;
        g[2 * (j * m + i) + 1] = src[2 * (i * cols + j) + 1] * sc;
      }
    }
  }
  const vt = new Float64Array(2 * n * n);
  for (let j = 0; j < n; j++) vt[2 * (j * n + j)] = 1;
  const sweeps = jacobiColumns(g, vt, m, n);
  const norms = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    let s2 = 0;
    for (let t = 2 * j * m; t < 2 * (j + 1) * m; t++) s2 += g[t] * g[t];
    norms[j] = Math.sqrt(s2);
  }
  const order = Array.from({ length: n }, (_, j) => j).sort((x, y) => norms[y] - norms[x]);
  const s = new Float64Array(n);
  const ut = new Float64Array(2 * m * n); // U columns as rows
  const missing: boolean[] = [];
  for (let r = 0; r < n; r++) {
    const j = order[r];
    s[r] = norms[j] * mag;
    missing.push(norms[j] === 0);
    if (norms[j] > 0) {
      const inv = 1 / norms[j];
      for (let t = 0; t < 2 * m; t++) ut[2 * r * m + t] = g[2 * j * m + t] * inv;
    }
  }
  if (missing.some((x) => x)) completeOrthonormal(ut, m, n, missing);
  // Transpose to row-major m×n (U) and n×n (V), columns in sorted order.
  const u = new Float64Array(2 * m * n);
  const v = new Float64Array(2 * n * n);
  for (let r = 0; r < n; r++) {
    for (let i = 0; i < m; i++) {
      u[2 * (i * n + r)] = ut[2 * (r * m + i)];
      u[2 * (i * n + r) + 1] = ut[2 * (r * m + i) + 1];
    }
    const j = order[r];
    for (let i = 0; i < n; i++) {
      v[2 * (i * n + r)] = vt[2 * (j * n + i)];
      v[2 * (i * n + r) + 1] = vt[2 * (j * n + i) + 1];
    }
  }
  return { u, s, v, sweeps };
}

/**
 * Thin singular value decomposition A = U diag(s) Vᴴ of any complex m×n matrix.
 *
 * @remarks
 * One-sided Jacobi (Hestenes) rotations orthogonalise the columns of A (of Aᴴ
 * when m < n) until every pair satisfies |g_pᴴ g_q| ≤ √m·ε ‖g_p‖‖g_q‖; the
 * singular values are the column norms. Each row of a sweep starts by moving
 * the remaining column of largest norm into place (de Rijk's pivoting), and
 * the squared column norms are updated per rotation rather than summed again
 * (Drmač & Veselić), so a pair costs one inner product. This method computes even the small
 * singular values to high relative accuracy when A is a well-scaled column
 * scaling of a well-conditioned matrix (Demmel & Veselić 1992). Singular
 * vectors of an exactly zero singular value are completed to an orthonormal
 * set. Cost O(sweeps·m·n²) with typically 6–10 sweeps: fine for the array
 * sizes of this library (n ≲ 200); not a replacement for a bidiagonal SVD on
 * very large matrices.
 *
 * References:
 * - M. R. Hestenes, "Inversion of matrices by biorthogonalization and related results",
 *   J. SIAM 6(1), 1958 (from memory).
 * - J. Demmel & K. Veselić, "Jacobi's method is more accurate than QR", SIAM J. Matrix
 *   Anal. Appl. 13(4), 1992 (from memory).
 * - P. P. M. de Rijk, "A one-sided Jacobi algorithm for computing the singular value
 *   decomposition on a vector computer", SIAM J. Sci. Stat. Comput. 10(2), 1989 (from memory).
 * - Z. Drmač & K. Veselić, "New fast and accurate Jacobi SVD algorithm I", SIAM J. Matrix
 *   Anal. Appl. 29(4), 2008 (from memory).
 * - G. H. Golub & C. F. Van Loan, *Matrix Computations*, 4th ed., 2013, §8.6.4 (from memory).
 * @param a - Matrix, m×n, m, n ≥ 1, finite, any unit.
 * @returns U (m×k), s (descending, length k) [unit of a], V (n×k), k = min(m, n).
 * @throws {@link DimensionError} if `a` is empty or not a CMatrix.
 * @throws {@link DomainError} if an entry is NaN or ±Infinity.
 * @throws {@link ConvergenceError} if the sweeps do not converge (not observed for finite inputs).
 * @example
 * ```ts
 * svd(fromRows([[3, 0], [0, { re: 0, im: -4 }]])).s; // Float64Array [4, 3]
 * ```
 * @category Complex core
 */
export function svd(a: CMatrix): SvdResult {
  assertNonEmpty('a', a);
  const m = a.rows, n = a.cols;
  if (m >= n) {
    const r = svdTall(a, false);
    return { u: { rows: m, cols: n, data: r.u }, s: r.s, v: { rows: n, cols: n, data: r.v }, sweeps: r.sweeps };
  }
  // A = (Aᴴ)ᴴ = (U′ Σ V′ᴴ)ᴴ = V′ Σ U′ᴴ
  const r = svdTall(a, true);
  return { u: { rows: m, cols: m, data: r.v }, s: r.s, v: { rows: n, cols: m, data: r.u }, sweeps: r.sweeps };
}

/**
 * 2-norm condition number κ₂(A) = σ_max / σ_min of an m×n matrix, σ_min the
 * smallest of its min(m, n) singular values.
 *
 * @remarks
 * Computed from {@link svd}. Returns `Infinity` when σ_min is exactly zero;
 * values above about 1/ε ≈ 4.5e15 mean A is singular to working precision.
 * @param a - Matrix, m×n, non-empty, finite.
 * @returns κ₂ ≥ 1 (dimensionless), or `Infinity` when σ_min = 0 (including the zero matrix).
 * @throws {@link DimensionError} if `a` is empty; {@link DomainError} on NaN/±Infinity.
 * @category Complex core
 */
export function conditionNumber(a: CMatrix): number {
  const { s } = svd(a);
  const smin = s[s.length - 1];
  return smin === 0 ? Infinity : s[0] / smin;
}

/**
 * Options of {@link pseudoInverse} and {@link matrixRank}.
 * @category Complex core
 */
export interface RankOptions {
  /**
   * Relative cut-off: singular values σ ≤ rcond·σ_max are treated as zero.
   * @defaultValue max(m, n)·ε, ε = 2.22e-16 (the choice of Press et al., *Numerical
   * Recipes*, 3rd ed., 2007, §2.6, from memory, and of numpy's `matrix_rank`)
   */
  rcond?: number;
}

function cutoff(a: CMatrix, s: Float64Array, options: RankOptions): number {
  const rcond = options.rcond ?? Math.max(a.rows, a.cols) * EPS;
  assertNonNegative('rcond', rcond);
  return rcond * s[0];
}

/**
 * Moore–Penrose pseudo-inverse A⁺ = V diag(1/σ) Uᴴ, singular values at or
 * below the cut-off rcond·σ_max dropped.
 *
 * @remarks
 * The cut-off makes the result stable for rank-deficient or ill-conditioned A
 * (it is the minimum-norm least-squares solver x = A⁺ b); with a too small
 * `rcond`, noise-level singular values are inverted and A⁺ becomes huge. Use
 * {@link matrixRank} with the same `rcond` to see how many were kept.
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., 2013, §5.5.2, from memory.)
 * @param a - Matrix, m×n, non-empty, finite [any unit].
 * @param options - Relative cut-off `rcond`.
 * @returns A⁺, n×m [1/unit of a].
 * @throws {@link DimensionError} if `a` is empty; {@link DomainError} on NaN/±Infinity or a negative `rcond`.
 * @category Complex core
 */
export function pseudoInverse(a: CMatrix, options: RankOptions = {}): CMatrix {
  const { u, s, v } = svd(a);
  const tol = cutoff(a, s, options);
  const m = a.rows, n = a.cols, k = s.length;
  const out = new Float64Array(2 * n * m);
  const ud = u.data, vd = v.data;
  for (let r = 0; r < k; r++) {
    if (!(s[r] > tol)) break;
    const inv = 1 / s[r];
    for (let i = 0; i < n; i++) {
      const vr = vd[2 * (i * k + r)] * inv, vi = vd[2 * (i * k + r) + 1] * inv;
      const row = 2 * i * m;
      for (let j = 0; j < m; j++) {
        // (V Σ⁻¹)_{ir} · conj(U_{jr})
        const ur = ud[2 * (j * k + r)], ui = -ud[2 * (j * k + r) + 1];
        out[row + 2 * j] += vr * ur - vi * ui;
        out[row + 2 * j + 1] += vr * ui + vi * ur;
      }
    }
  }
  return matrixView(n, m, out);
}

/**
 * Numerical rank: the number of singular values above rcond·σ_max.
 *
 * @remarks
 * The rank of a matrix with noisy entries depends on the cut-off; choose
 * `rcond` near the relative noise level of the entries when it is known.
 * The zero matrix has rank 0.
 * @param a - Matrix, m×n, non-empty, finite.
 * @param options - Relative cut-off `rcond`.
 * @returns Rank, integer in [0, min(m, n)].
 * @throws {@link DimensionError} if `a` is empty; {@link DomainError} on NaN/±Infinity or a negative `rcond`.
 * @category Complex core
 */
export function matrixRank(a: CMatrix, options: RankOptions = {}): number {
  const { s } = svd(a);
  const tol = cutoff(a, s, options);
  let r = 0;
  while (r < s.length && s[r] > tol) r++;
  return r;
}
