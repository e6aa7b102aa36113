/**
 * Triangular solves with many right-hand sides on the WebAssembly SIMD
 * product kernel, with the right-hand sides kept as real/imaginary planes in
 * the module memory for the whole substitution (no per-update packing).
 * No checks.
 * @internal
 * @module
 */
import { ensureMemory } from './wasm-assembler.js';
import { loadZgemm, SIMD_UNROLL } from './zgemm-wasm.js';

/** Columns of X per pass (even), so the panel's two planes (n·W·16 bytes) stay in L2 for n ≲ 250. */
const SIMD_PANEL = 64;

/**
 * Solves T X = B in place (X holds B on entry, n×nrhs interleaved row-major)
 * for triangular T (n×n, leading dimension n), lower when `lower` is true,
 * else upper; `unitDiagonal` takes the diagonal as 1. Returns false (doing
 * nothing) when WebAssembly SIMD is unavailable.
 *
 * Row-oriented substitution with the diagonal folded into the data:
 * with D = diag(T), xᵢ = bᵢ/tᵢᵢ + Σₚ (−tᵢₚ/tᵢᵢ)·xₚ over the solved rows p,
 * so each row is one call of the SIMD product kernel (1 × W × #solved),
 * with the packed coefficients −tᵢₚ/tᵢᵢ as the left operand and the solved
 * rows of the plane panel as the right operand (Golub & Van Loan, *Matrix
 * Computations*, 4th ed., 2013, §3.1, from memory).
 */
export function simdSolveTriangular(lower: boolean, n: number, nrhs: number, t: Float64Array, x: Float64Array, unitDiagonal: boolean): boolean {
  const mod = loadZgemm();
  if (mod === null) return false;
  const U = SIMD_UNROLL;
  const w = Math.min(SIMD_PANEL, nrhs + (nrhs & 1));
  // layout (bytes): coefficient rows (n(n−1)/2 complex, row i at rowStart[i]) | Xre (n·w·8) | Xim
  const coefCount = (n * (n - 1)) / 2;
  const pxr = coefCount * 16, pxi = pxr + n * w * 8;
  const f = ensureMemory(mod.memory, pxi + n * w * 8);
  const rowStart = new Int32Array(n);
  const invR = new Float64Array(n), invI = new Float64Array(n);
  let o = 0;
  for (let i = 0; i < n; i++) {
    const dr = t[2 * (i * n + i)], di = t[2 * (i * n + i) + 1];
    let ir = 1, ii = 0;
    if (!unitDiagonal) {
      const den = dr * dr + di * di;
      ir = dr / den; ii = -di / den;
    }
    invR[i] = ir; invI[i] = ii;
    rowStart[i] = o;
    const p0 = lower ? 0 : i + 1, p1 = lower ? i : n;
    for (let p = p0; p < p1; p++, o++) {
      const tr = t[2 * (i * n + p)], ti = t[2 * (i * n + p) + 1];
      f[2 * o] = -(tr * ir - ti * ii);
      f[2 * o + 1] = -(tr * ii + ti * ir);
    }
  }
  const xr0 = pxr >> 3, xi0 = pxi >> 3;
  for (let c0 = 0; c0 < nrhs; c0 += w) {
    const pw = Math.min(w, nrhs - c0), wp = pw + (pw & 1), ld = wp * 8;
    // pack the panel, each row scaled by 1/tᵢᵢ
    for (let i = 0; i < n; i++) {
      const ir = invR[i], ii = invI[i], s = 2 * (i * nrhs + c0), d = i * wp;
      for (let j = 0; j < pw; j++) {
        const vr = x[s + 2 * j], vi = x[s + 2 * j + 1];
        f[xr0 + d + j] = vr * ir - vi * ii;
        f[xi0 + d + j] = vr * ii + vi * ir;
      }
      if (wp !== pw) { f[xr0 + d + pw] = 0; f[xi0 + d + pw] = 0; }
    }
    for (let step = 0; step < n; step++) {
      const i = lower ? step : n - 1 - step;
      const k = step, first = lower ? 0 : i + 1;
      if (k === 0) continue;
      const k3 = k - (k % U);
      const pa = rowStart[i] * 16, pcr = pxr + i * ld, pci = pxi + i * ld;
      const pbr = pxr + first * ld, pbi = pxi + first * ld;
      if (k3 > 0) mod.zgemm(1, wp, k3, pa, 0, pbr, pbi, ld, pcr, pci, ld);
      if (k3 < k) mod.zgemm1(1, wp, k - k3, pa + k3 * 16, 0, pbr + k3 * ld, pbi + k3 * ld, ld, pcr, pci, ld);
    }
    for (let i = 0; i < n; i++) {
      const s = 2 * (i * nrhs + c0), d = i * wp;
      for (let j = 0; j < pw; j++) { x[s + 2 * j] = f[xr0 + d + j]; x[s + 2 * j + 1] = f[xi0 + d + j]; }
    }
  }
  return true;
}
