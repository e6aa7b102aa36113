/**
 * Kernels of the Hermitian eigensolver: Householder reduction of a Hermitian
 * matrix to real symmetric tridiagonal form, implicit QL with shifts on the
 * tridiagonal, and the back-transformation. No argument checks.
 * @internal
 * @module
 */
import { ConvergenceError } from '../errors.js';
import { gemmKernel } from './gemm.js';
import { ensureMemory } from './wasm/runtime.js';
import { loadZtile } from './ztileWasm.js';
import { rotationWorkspace } from './rotationsWasm.js';
import { type TridiagWorkspace, tridiagWorkspace } from './tridiagonalWasm.js';

/** Result of {@link reduceHermitianToTridiagonal}. */
export interface TridiagonalReduction {
  /** Order n. */
  readonly n: number;
  /** Diagonal of the real tridiagonal T′, length n. */
  readonly d: Float64Array;
  /** Off-diagonal of T′ (entry i couples i and i+1), length n; e[n−1] = 0. */
  readonly e: Float64Array;
  /** Householder vectors: column k below the diagonal holds u_k (interleaved, n×n lower part). */
  readonly house: Float64Array;
  /** Householder scalars β_k with H_k = I − β_k u_k u_kᴴ (0: no reflection). */
  readonly beta: Float64Array;
  /** Diagonal phases δ_i (interleaved) with A = (Q D) T′ (Q D)ᴴ. */
  readonly phase: Float64Array;
}

/** Squared norm of column k below its first sub-diagonal entry (rows k + 2 … n − 1). */
function tailNorm2(w: Float64Array, n: number, k: number): number {
  let sigma = 0;
  for (let i = k + 2; i < n; i++) {
    const t = 2 * (i * n + k);
    sigma += w[t] * w[t] + w[t + 1] * w[t + 1];
  }
  return sigma;
}

/**
 * One Householder reflector of the tridiagonal reduction (both the scalar and the SIMD pass):
 * for the column head x = (xr, xi) and the squared norm σ of the rest, u₀ ← x + e^{j arg x}·α
 * with α = √(|x|² + σ), β = 1/(α(α + |x|)), and the new off-diagonal entry −e^{j arg x}·α
 * (Golub & Van Loan, *Matrix Computations*, 4th ed., 2013, §5.1.13, complex form, from memory).
 * @returns β.
 */
function householderStep(
  w: Float64Array, x0: number, xr: number, xi: number, sigma: number, k: number,
  beta: Float64Array, er: Float64Array, ei: Float64Array,
): number {
  const ax0 = Math.sqrt(xr * xr + xi * xi);
  const alpha = Math.sqrt(ax0 * ax0 + sigma);
  let phr = 1, phi = 0;
  if (ax0 > 0) { phr = xr / ax0; phi = xi / ax0; }
  w[x0] = xr + phr * alpha;
  w[x0 + 1] = xi + phi * alpha;
  const b = 1 / (alpha * (alpha + ax0));
  beta[k] = b;
  er[k] = -phr * alpha; ei[k] = -phi * alpha;
  return b;
}

/**
 * Reduces the Hermitian matrix held in the LOWER triangle of `w` (interleaved
 * row-major n×n; overwritten) to real symmetric tridiagonal form
 * A = (Q D) T′ (Q D)ᴴ, Q = H_0 H_1 ⋯ H_{n−2}, D = diag(δ) unitary.
 *
 * Reflector H_k = I − β u uᴴ with u = x + e^{jθ}‖x‖e₁ (θ = arg x₀) maps the
 * column below the diagonal to −e^{jθ}‖x‖e₁; the trailing block is updated by
 * the Hermitian rank-two form A ← A − u qᴴ − q uᴴ, p = βAu, q = p − (β/2)(uᴴp)u
 * (Golub & Van Loan, Matrix Computations, 4th ed., 2013, §8.3.1, from memory),
 * touching only the lower triangle. The complex off-diagonal is then made real
 * by the diagonal phase similarity D (Wilkinson & Reinsch, Handbook for
 * Automatic Computation II, 1971, contribution II/2 "htridi", from memory).
 */
export function reduceHermitianToTridiagonal(house: Float64Array, n: number): TridiagonalReduction {
  // With WebAssembly SIMD the matrix is worked on in the module memory by fused
  // passes (tridiagonalWasm.ts); otherwise by the scalar loops below.
  const ws = n > 8 ? tridiagWorkspace(n) : null;
  if (ws !== null) return reduceFused(house, n, ws);
  const w = house;
  const d = new Float64Array(n);
  const er = new Float64Array(n); // complex sub-diagonal before the phase fix
  const ei = new Float64Array(n);
  const beta = new Float64Array(n);
  const p = new Float64Array(2 * n);
  const n2 = 2 * n;
  for (let k = 0; k < n - 1; k++) {
    const k1 = k + 1;
    const x0 = 2 * (k1 * n + k);
    const sigma = tailNorm2(w, n, k);
    const xr = w[x0], xi = w[x0 + 1];
    if (sigma === 0) {
      er[k] = xr; ei[k] = xi;
      d[k] = w[2 * (k * n + k)];
      continue;
    }
    const b = householderStep(w, x0, xr, xi, sigma, k, beta, er, ei);
    d[k] = w[2 * (k * n + k)];
    // p = A u over the trailing block, lower triangle only (Hermitian matvec).
    p.fill(0, 2 * k1, n2);
    for (let i = k1; i < n; i++) {
      const ui = 2 * (i * n + k);
      const uir = w[ui], uii = w[ui + 1];
      const row = 2 * i * n;
      let sr = 0, si = 0;
      for (let j = k1; j < i; j++) {
        const a = row + 2 * j;
        const ar = w[a], ai = w[a + 1];
        const uj = 2 * (j * n + k);
        const ujr = w[uj], uji = w[uj + 1];
        sr += ar * ujr - ai * uji;
        si += ar * uji + ai * ujr;
        // conj(a_ij)·u_i contributes to p_j
        p[2 * j] += ar * uir + ai * uii;
        p[2 * j + 1] += ar * uii - ai * uir;
      }
      const dii = w[row + 2 * i];
      p[2 * i] += sr + dii * uir;
      p[2 * i + 1] += si + dii * uii;
    }
    // p ← β p; K = (β/2) Re(uᴴ p); q = p − K u (stored in p)
    let upr = 0;
    for (let i = k1; i < n; i++) {
      const ui = 2 * (i * n + k);
      p[2 * i] *= b; p[2 * i + 1] *= b;
      upr += w[ui] * p[2 * i] + w[ui + 1] * p[2 * i + 1];
    }
    const kk = 0.5 * b * upr;
    for (let i = k1; i < n; i++) {
      const ui = 2 * (i * n + k);
      p[2 * i] -= kk * w[ui];
      p[2 * i + 1] -= kk * w[ui + 1];
    }
    // A ← A − u qᴴ − q uᴴ on the lower triangle of the trailing block.
    for (let i = k1; i < n; i++) {
      const ui = 2 * (i * n + k);
      const uir = w[ui], uii = w[ui + 1];
      const qir = p[2 * i], qii = p[2 * i + 1];
      const row = 2 * i * n;
      for (let j = k1; j < i; j++) {
        const uj = 2 * (j * n + k);
        const ujr = w[uj], uji = w[uj + 1];
        const qjr = p[2 * j], qji = p[2 * j + 1];
        const a = row + 2 * j;
        // u_i conj(q_j) + q_i conj(u_j)
        w[a] -= uir * qjr + uii * qji + qir * ujr + qii * uji;
        w[a + 1] -= uii * qjr - uir * qji + qii * ujr - qir * uji;
      }
      const a = row + 2 * i;
      w[a] -= 2 * (uir * qir + uii * qii);
      w[a + 1] = 0;
    }
  }
  if (n > 0) d[n - 1] = w[2 * ((n - 1) * n + (n - 1))];
  return withRealOffDiagonal(n, d, er, ei, house, beta);
}

/**
 * The same reduction on the SIMD kernel: the rank-two update of step k is not
 * applied at once but kept pending; step k+1 first applies it to column k+1
 * and to the diagonal (O(n)), forms its reflector, and then one fused pass
 * applies the pending update to the rest of the trailing block while forming
 * p = A u for the new reflector, so the block is read once per step instead of
 * twice. The arithmetic is that of the scalar loops, in another order.
 */
function reduceFused(house: Float64Array, n: number, ws: TridiagWorkspace): TridiagonalReduction {
  const w = ws.view, { qc, qs, uc, us, u: pu, q: pq, vrr, vis, vpr, vii, p: pp } = ws;
  w.set(house.subarray(0, 2 * n * n), 0);
  const d = new Float64Array(n), er = new Float64Array(n), ei = new Float64Array(n), beta = new Float64Array(n);
  let pending = false;
  const clearPending = (from: number): void => {
    for (const off of [qc, qs, uc, us, pu, pq]) w.fill(0, off + 2 * from, off + 2 * n);
    pending = false;
  };
  for (let k = 0; k < n - 1; k++) {
    const k1 = k + 1;
    if (pending) {
      // the pending update on column k (rows > k) and on the diagonal from k on
      const ukr = w[pu + 2 * k], uki = w[pu + 2 * k + 1], qkr = w[pq + 2 * k], qki = w[pq + 2 * k + 1];
      for (let i = k1; i < n; i++) {
        const a = 2 * (i * n + k);
        const uir = w[pu + 2 * i], uii = w[pu + 2 * i + 1], qir = w[pq + 2 * i], qii = w[pq + 2 * i + 1];
        w[a] -= uir * qkr + uii * qki + qir * ukr + qii * uki;
        w[a + 1] -= uii * qkr - uir * qki + qii * ukr - qir * uki;
      }
      for (let i = k; i < n; i++) {
        const a = 2 * (i * n + i);
        w[a] -= 2 * (w[pu + 2 * i] * w[pq + 2 * i] + w[pu + 2 * i + 1] * w[pq + 2 * i + 1]);
        w[a + 1] = 0;
      }
    }
    const x0 = 2 * (k1 * n + k);
    const sigma = tailNorm2(w, n, k);
    const xr = w[x0], xi = w[x0 + 1];
    d[k] = w[2 * (k * n + k)];
    if (sigma === 0) {
      er[k] = xr; ei[k] = xi;
      if (pending) {
        // apply the pending update to the rest of the block; the product (v = 0) is unused
        for (const off of [vrr, vis, vpr, vii]) w.fill(0, off + 2 * k1, off + 2 * n);
        ws.pass(k1);
        clearPending(k1);
      }
      continue;
    }
    const b = householderStep(w, x0, xr, xi, sigma, k, beta, er, ei);
    // v = u (column k below the diagonal) in the kernel's four forms; p = 0
    for (let i = k1; i < n; i++) {
      const a = 2 * (i * n + k), vr = w[a], vi = w[a + 1], t = 2 * i;
      w[vrr + t] = vr; w[vrr + t + 1] = vr;
      w[vis + t] = -vi; w[vis + t + 1] = vi;
      w[vpr + t] = vr; w[vpr + t + 1] = -vr;
      w[vii + t] = vi; w[vii + t + 1] = vi;
    }
    w.fill(0, pp + 2 * k1, pp + 2 * n);
    // pending update (if any) on the strict lower triangle of the block, and p += (strict lower + its adjoint) u
    ws.pass(k1);
    // p += diag·u (the diagonal is real after the update); then p ← β p, K = (β/2) Re(uᴴ p), q = p − K u
    let upr = 0;
    for (let i = k1; i < n; i++) {
      const a = 2 * (i * n + k), dii = w[2 * (i * n + i)], t = pp + 2 * i;
      w[t] = b * (w[t] + dii * w[a]);
      w[t + 1] = b * (w[t + 1] + dii * w[a + 1]);
      upr += w[a] * w[t] + w[a + 1] * w[t + 1];
    }
    const kk = 0.5 * b * upr;
    // the new pending update: U = u, Q = q, and the kernel's forms QC, QS, UC, US
    for (let i = k1; i < n; i++) {
      const a = 2 * (i * n + k), t = 2 * i;
      const ur = w[a], uim = w[a + 1];
      const qr = w[pp + t] - kk * ur, qi = w[pp + t + 1] - kk * uim;
      w[qc + t] = qr; w[qc + t + 1] = -qi; w[qs + t] = qi; w[qs + t + 1] = qr;
      w[uc + t] = ur; w[uc + t + 1] = -uim; w[us + t] = uim; w[us + t + 1] = ur;
      w[pu + t] = ur; w[pu + t + 1] = uim; w[pq + t] = qr; w[pq + t + 1] = qi;
    }
    pending = true;
  }
  if (n > 0) {
    const last = 2 * ((n - 1) * n + (n - 1)), t = 2 * (n - 1);
    if (pending) { w[last] -= 2 * (w[pu + t] * w[pq + t] + w[pu + t + 1] * w[pq + t + 1]); w[last + 1] = 0; }
    d[n - 1] = w[last];
  }
  house.set(w.subarray(0, 2 * n * n), 0);
  return withRealOffDiagonal(n, d, er, ei, house, beta);
}

/** The diagonal phase fix-up shared by both reductions, and the result record. */
function withRealOffDiagonal(n: number, d: Float64Array, er: Float64Array, ei: Float64Array, house: Float64Array, beta: Float64Array): TridiagonalReduction {
  const e = new Float64Array(n);
  // Phase fix-up: δ_0 = 1, δ_{i+1} = δ_i e_i / |e_i| makes T′ = Dᴴ T D real.
  const phase = new Float64Array(2 * n);
  if (n > 0) phase[0] = 1;
  for (let i = 0; i < n - 1; i++) {
    const m = Math.sqrt(er[i] * er[i] + ei[i] * ei[i]);
    e[i] = m;
    const dr = phase[2 * i], di = phase[2 * i + 1];
    if (m > 0) {
      const cr = er[i] / m, ci = ei[i] / m;
      phase[2 * i + 2] = dr * cr - di * ci;
      phase[2 * i + 3] = dr * ci + di * cr;
    } else {
      phase[2 * i + 2] = dr;
      phase[2 * i + 3] = di;
    }
  }
  return { n, d, e, house, beta, phase };
}

/**
 * Eigenvalues (in `d`, unsorted) and, when `z` is given, eigenvectors of the
 * real symmetric tridiagonal matrix (d, e) by the implicit QL method with
 * Wilkinson-type shifts (Bowdler, Martin, Reinsch & Wilkinson, "The QR and QL
 * algorithms for symmetric matrices", Numer. Math. 11, 1968, and the Handbook
 * 1971 contribution II/3 "tql2", from memory; Golub & Van Loan 2013, §8.3.5).
 * `z` (n×n real, row-major, initialised to the identity) accumulates the
 * rotations: column i becomes eigenvector i. The rotations of one QL sweep are
 * recorded and then applied row by row, carrying one running value through the
 * sweep, so each entry of `z` is loaded and stored once per sweep.
 * Throws ConvergenceError after `maxIterPerValue` sweeps on one eigenvalue.
 */
export function tridiagonalQl(d: Float64Array, e: Float64Array, n: number, z: Float64Array | null, maxIterPerValue = 60): void {
  const eps = 2.220446049250313e-16;
  const tiny = 2.2250738585072014e-308;
  // With WebAssembly SIMD the rotations go to a transposed copy Zt in the
  // module memory (see rotationsWasm.ts); otherwise to z by the scalar loop.
  const ws = z !== null ? rotationWorkspace(n) : null;
  const cs = ws !== null ? ws.view : new Float64Array(n);
  const sn = ws !== null ? ws.view : new Float64Array(n);
  const cOff = ws !== null ? ws.cOffset : 0, sOff = ws !== null ? ws.sOffset : 0;
  e[n - 1] = 0;
  for (let l = 0; l < n; l++) {
    let iter = 0;
    for (;;) {
      let m = l;
      for (; m < n - 1; m++) {
        const dd = Math.abs(d[m]) + Math.abs(d[m + 1]);
        if (Math.abs(e[m]) <= eps * dd || Math.abs(e[m]) < tiny) break;
      }
      if (m === l) break;
      if (++iter > maxIterPerValue) {
        throw new ConvergenceError(`hermitianEigen: the implicit QL iteration did not converge for eigenvalue ${l} within ${maxIterPerValue} iterations (off-diagonal ${e[l].toExponential(3)}); the input may contain values near overflow.`);
      }
      // Shift from the leading 2×2 block, the eigenvalue closer to d[l].
      let g = (d[l + 1] - d[l]) / (2 * e[l]);
      let r = Math.sqrt(g * g + 1);
      g = d[m] - d[l] + e[l] / (g + (g >= 0 ? r : -r));
      let s = 1, c = 1, p = 0;
      let i = m - 1;
      let underflow = false;
      for (; i >= l; i--) {
        const f = s * e[i];
        const b = c * e[i];
        r = Math.sqrt(f * f + g * g);
        e[i + 1] = r;
        if (r === 0) {
          d[i + 1] -= p;
          e[m] = 0;
          underflow = true;
          break;
        }
        s = f / r;
        c = g / r;
        g = d[i + 1] - p;
        r = (d[i] - g) * s + 2 * c * b;
        p = s * r;
        d[i + 1] = g + p;
        g = c * r - b;
        cs[cOff + i] = c;
        sn[sOff + i] = s;
      }
      if (ws !== null) {
        ws.apply(i + 1, m);
      } else if (z !== null) {
        // Rotations i = m−1 … lo (lo = i+1 after an underflow break, else l).
        const lo = i + 1;
        // Four rows at a time: four independent carries keep the pipeline full.
        let k = 0;
        for (; k + 3 < n; k += 4) {
          const r0 = k * n, r1 = r0 + n, r2 = r1 + n, r3 = r2 + n;
          let c0 = z[r0 + m], c1 = z[r1 + m], c2 = z[r2 + m], c3 = z[r3 + m];
          for (let t = m - 1; t >= lo; t--) {
            const ct = cs[t], st = sn[t];
            const a0 = z[r0 + t], a1 = z[r1 + t], a2 = z[r2 + t], a3 = z[r3 + t];
            z[r0 + t + 1] = st * a0 + ct * c0;
            z[r1 + t + 1] = st * a1 + ct * c1;
            z[r2 + t + 1] = st * a2 + ct * c2;
            z[r3 + t + 1] = st * a3 + ct * c3;
            c0 = ct * a0 - st * c0;
            c1 = ct * a1 - st * c1;
            c2 = ct * a2 - st * c2;
            c3 = ct * a3 - st * c3;
          }
          z[r0 + lo] = c0; z[r1 + lo] = c1; z[r2 + lo] = c2; z[r3 + lo] = c3;
        }
        for (; k < n; k++) {
          const row = k * n;
          let carry = z[row + m];
          for (let t = m - 1; t >= lo; t--) {
            const zi = z[row + t];
            const ct = cs[t], st = sn[t];
            z[row + t + 1] = st * zi + ct * carry;
            carry = ct * zi - st * carry;
          }
          z[row + lo] = carry;
        }
      }
      if (underflow) continue;
      d[l] -= p;
      e[l] = g;
      e[m] = 0;
    }
  }
  if (ws !== null && z !== null) ws.readInto(z);
}

/** Reflectors per block of the back-transformation. */
const WY_BLOCK = 16;

/**
 * Back-transformation X = Q D Z of the real tridiagonal eigenvectors into
 * eigenvectors of the original Hermitian matrix: column j of X is built from
 * column `order[j]` of `z` (n×n, row-major, columns = eigenvectors), so the
 * columns come out sorted; with `zTransposed`, `z` holds Zᵀ instead (eigenvector
 * j contiguous at j·n). Written to `out` (interleaved complex, n×n
 * row-major, columns = eigenvectors).
 * Reflectors are applied in blocks in the compact WY form
 * H_{k0} ⋯ H_{k1−1} = I − V T Vᴴ, T upper triangular (Schreiber & Van Loan,
 * "A storage-efficient WY representation for products of Householder
 * transformations", SIAM J. Sci. Stat. Comput. 10(1), 1989, from memory), so
 * the work is matrix products. With WebAssembly SIMD, X stays in the product
 * kernel's memory in its packed panel layout for the whole run
 * ({@link backTransformSimd}); otherwise the products go through `gemmKernel`.
 */
export function backTransform(red: TridiagonalReduction, z: Float64Array, order: ArrayLike<number>, out: Float64Array, zTransposed = false): void {
  if (red.n > 8 && backTransformSimd(red, z, order, out, zTransposed)) return;
  const { n, house, beta, phase } = red;
  const cols = n;
  for (let i = 0; i < n; i++) {
    const pr = phase[2 * i], pi = phase[2 * i + 1];
    const xr = 2 * i * cols;
    for (let j = 0; j < cols; j++) {
      const v = zTransposed ? z[order[j] * n + i] : z[i * n + order[j]];
      out[xr + 2 * j] = pr * v;
      out[xr + 2 * j + 1] = pi * v;
    }
  }
  const nRefl = n - 2; // reflectors 0 … n−3 (H_{n−2} is always the identity)
  if (nRefl <= 0) return;
  const vb = new Float64Array(2 * n * WY_BLOCK);
  const vh = new Float64Array(2 * n * WY_BLOCK);
  const t = new Float64Array(2 * WY_BLOCK * WY_BLOCK);
  const s = new Float64Array(2 * WY_BLOCK * WY_BLOCK);
  const w = new Float64Array(2 * WY_BLOCK * cols);
  const w2 = new Float64Array(2 * WY_BLOCK * cols);
  const lastStart = Math.floor((nRefl - 1) / WY_BLOCK) * WY_BLOCK;
  for (let k0 = lastStart; k0 >= 0; k0 -= WY_BLOCK) {
    const nb = Math.min(WY_BLOCK, nRefl - k0);
    const r0 = k0 + 1, mm = n - r0;
    // V (mm×nb): column c = u_{k0+c}, zero above its first entry; Vᴴ (nb×mm)
    for (let r = 0; r < mm; r++) {
      const row = r0 + r;
      for (let c = 0; c < nb; c++) {
        const k = k0 + c;
        let vr = 0, vi = 0;
        if (row >= k + 1 && beta[k] !== 0) { vr = house[2 * (row * n + k)]; vi = house[2 * (row * n + k) + 1]; }
        vb[2 * (r * nb + c)] = vr; vb[2 * (r * nb + c) + 1] = vi;
        vh[2 * (c * mm + r)] = vr; vh[2 * (c * mm + r) + 1] = -vi;
      }
    }
    // S = Vᴴ V (its strict upper triangle is what T needs), then T from S
    gemmKernel(nb, nb, mm, vh, 0, mm, vb, 0, nb, s, 0, nb, false, 1);
    wyTriangle(nb, beta, k0, (q, c) => s[2 * (q * nb + c)], (q, c) => s[2 * (q * nb + c) + 1], t);
    // X[r0:n] −= V (T (Vᴴ X[r0:n]))
    gemmKernel(nb, cols, mm, vh, 0, mm, out, r0 * cols, cols, w, 0, cols, false, 1);
    gemmKernel(nb, cols, nb, t, 0, nb, w, 0, cols, w2, 0, cols, false, 1);
    gemmKernel(mm, cols, nb, vb, 0, nb, w2, 0, cols, out, r0 * cols, cols, true, -1);
  }
}

/**
 * The triangular factor T (nb×nb, interleaved, upper) of the compact WY form of
 * reflectors k0 … k0+nb−1 from S = Vᴴ V (entries (q, c), q < c, read through
 * `sRe`/`sIm`): T[c,c] = β_c, T[0:c, c] = −β_c T[0:c, 0:c] S[0:c, c].
 */
function wyTriangle(nb: number, beta: Float64Array, k0: number, sRe: (q: number, c: number) => number, sIm: (q: number, c: number) => number, t: Float64Array): void {
  t.fill(0, 0, 2 * nb * nb);
  for (let c = 0; c < nb; c++) {
    const b = beta[k0 + c];
    t[2 * (c * nb + c)] = b;
    if (b === 0) continue;
    for (let q = 0; q < c; q++) {
      let sr = 0, si = 0;
      for (let p = q; p < c; p++) {
        const ar = t[2 * (q * nb + p)], ai = t[2 * (q * nb + p) + 1];
        const xr = sRe(p, c), xi = sIm(p, c);
        sr += ar * xr - ai * xi;
        si += ar * xi + ai * xr;
      }
      t[2 * (q * nb + c)] = -b * sr; t[2 * (q * nb + c) + 1] = -b * si;
    }
  }
}

/** Reflectors per block of {@link backTransformSimd}. */
const WY_BLOCK_SIMD = 16;
/** Four-column panels of X per call of the product kernel in {@link backTransformSimd} (a block of X that stays in L2). */
const PANELS_PER_CALL = 8;

/**
 * {@link backTransform} on the SIMD product kernel (wasm/ztile.wat), called
 * directly on one thread: X lives in the kernel memory in the packed layout
 * of its B operand (four-column panels; panel q of row r at 64·(q·n + r)
 * bytes), which is also a valid layout of its C operand, so W = Vᴴ X reads X
 * in place and X −= V (T W) updates it in place: nothing is packed or copied
 * per block but the reflectors themselves. Returns false on the scalar path.
 */
function backTransformSimd(red: TridiagonalReduction, z: Float64Array, order: ArrayLike<number>, out: Float64Array, zTransposed: boolean): boolean {
  const mod = loadZtile();
  if (mod === null) return false;
  const { n, house, beta, phase } = red;
  const n4 = (n + 3) & ~3, panels = n4 >> 2;
  const bMax = WY_BLOCK_SIMD, b4 = (bMax + 3) & ~3;
  // layout (bytes): X panels | Vᴴ (nb×mm) | −V (mm×nb) | V panels | S planes | T | W panels | W2 panels
  const pX = 0;
  const pVh = pX + n * n4 * 16;
  const pVn = pVh + bMax * n * 16;
  const pVp = pVn + n * bMax * 16;
  const pS = pVp + n * b4 * 16;
  const pT = pS + 2 * bMax * b4 * 8;
  const pW = pT + bMax * bMax * 16;
  const pW2 = pW + bMax * n4 * 16;
  const f = ensureMemory(mod.memory, pW2 + bMax * n4 * 16);
  const x0 = pX >> 3, xPanel = 8 * n; // doubles per panel of X
  // X = D Z[:, order]
  f.fill(0, x0, x0 + n * n4 * 2);
  for (let j = 0; j < n; j++) {
    const c = order[j], base = x0 + (j >> 2) * xPanel + (j & 3);
    for (let i = 0; i < n; i++) {
      const v = zTransposed ? z[c * n + i] : z[i * n + c], d = base + 8 * i;
      f[d] = phase[2 * i] * v; f[d + 4] = phase[2 * i + 1] * v;
    }
  }
  const nRefl = n - 2;
  const t = new Float64Array(2 * bMax * bMax);
  const lastStart = nRefl > 0 ? Math.floor((nRefl - 1) / bMax) * bMax : -1;
  for (let k0 = lastStart; k0 >= 0; k0 -= bMax) {
    const nb = Math.min(bMax, nRefl - k0), nb4 = (nb + 3) & ~3;
    const r0 = k0 + 1, mm = n - r0;
    // V (mm×nb): column c = u_{k0+c} from row c on; as Vᴴ and −V (interleaved) and as panels
    const vh = pVh >> 3, vn = pVn >> 3, vp = pVp >> 3;
    f.fill(0, vp, vp + mm * nb4 * 2);
    for (let r = 0; r < mm; r++) {
      const a0 = 2 * ((r0 + r) * n + k0), g0 = vn + 2 * r * nb, e0 = vp + 8 * r;
      for (let c = 0; c < nb; c++) {
        let vr = 0, vi = 0;
        if (r >= c && beta[k0 + c] !== 0) { vr = house[a0 + 2 * c]; vi = house[a0 + 2 * c + 1]; }
        const h = vh + 2 * (c * mm + r), g = g0 + 2 * c, e = e0 + (c >> 2) * mm * 8 + (c & 3);
        f[h] = vr; f[h + 1] = -vi;
        f[g] = -vr; f[g + 1] = -vi;
        f[e] = vr; f[e + 4] = vi;
      }
    }
    // S = Vᴴ V (planes nb × nb4), then T (interleaved nb×nb)
    const sr = pS >> 3, si = sr + nb * nb4;
    f.fill(0, sr, sr + 2 * nb * nb4);
    mod.ztile(nb, nb4, mm, pVh, mm * 16, pVp, mm * 64, pS, pS + nb * nb4 * 8, nb4 * 8, 32);
    wyTriangle(nb, beta, k0, (q, c) => f[sr + q * nb4 + c], (q, c) => f[si + q * nb4 + c], t);
    f.set(t.subarray(0, 2 * nb * nb), pT >> 3);
    // per block of columns: W = Vᴴ X[r0:n], W2 = T W, X[r0:n] += (−V) W2
    const w = pW >> 3, w2 = pW2 >> 3;
    for (let q0 = 0; q0 < panels; q0 += PANELS_PER_CALL) {
      const cnt = Math.min(PANELS_PER_CALL, panels - q0);
      const pWq = pW + q0 * nb * 64, pW2q = pW2 + q0 * nb * 64, pXq = pX + q0 * n * 64 + r0 * 64;
      f.fill(0, w + q0 * nb * 8, w + (q0 + cnt) * nb * 8);
      f.fill(0, w2 + q0 * nb * 8, w2 + (q0 + cnt) * nb * 8);
      mod.ztile(nb, 4 * cnt, mm, pVh, mm * 16, pXq, n * 64, pWq, pWq + 32, 64, nb * 64);
      mod.ztile(nb, 4 * cnt, nb, pT, nb * 16, pWq, nb * 64, pW2q, pW2q + 32, 64, nb * 64);
      mod.ztile(mm, 4 * cnt, nb, pVn, nb * 16, pW2q, nb * 64, pXq, pXq + 32, 64, n * 64);
    }
  }
  for (let q = 0; q < panels; q++) {
    const j0 = 4 * q, w4 = Math.min(4, n - j0);
    for (let i = 0; i < n; i++) {
      const s = x0 + q * xPanel + 8 * i, d = 2 * (i * n + j0);
      for (let l = 0; l < w4; l++) { out[d + 2 * l] = f[s + l]; out[d + 2 * l + 1] = f[s + l + 4]; }
    }
  }
  return true;
}
