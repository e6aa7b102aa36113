/**
 * Hermitian rank-k update kernel on interleaved row-major storage. No checks.
 * @internal
 * @module
 */
import { ensureMemory } from './wasm/runtime.js';
import { loadZtile, ztileBlocked } from './ztileWasm.js';

/** Order and rank from which the SIMD path is used. */
const HERK_SIMD_MIN = 8;

/**
 * Lower triangle (j ≤ i, diagonal included) of C[n×n] += G[n×k]·G[n×k]ᴴ, i.e.
 * C_ij += Σ_p G_ip · conj(G_jp). G is interleaved row-major with leading
 * dimension `ldg` (complex elements); C is n×n interleaved row-major. The upper
 * triangle of C is not touched (see {@link mirrorLowerToUpper}).
 *
 * Rows of G are contiguous, so each entry is a complex dot product of two rows;
 * the kernel computes a 2×2 block of C per pass over p, so every loaded pair of
 * entries feeds two multiply–adds (register blocking).
 */
export function herkLowerKernel(n: number, k: number, g: Float64Array, ldg: number, c: Float64Array): void {
  if (n >= HERK_SIMD_MIN && k >= HERK_SIMD_MIN && simdHerkLower(n, k, g, ldg, c)) return;
  herkLowerScalarKernel(n, k, g, ldg, c);
}

/**
 * The same update on the register-tiled WebAssembly SIMD kernel (ztile): G
 * is copied as the left operand and Gᴴ packed in four-column panels as the
 * right operand; rows [i0, i0+4) of C are formed against columns [0, i0+4)
 * only, so just the lower triangle (in 4×4 granules) is computed, then the
 * lower triangle is added to `c` (real part only on the diagonal). Returns
 * false (doing nothing) when WebAssembly SIMD is unavailable.
 */
export function simdHerkLower(n: number, k: number, g: Float64Array, ldg: number, c: Float64Array): boolean {
  return packedHerk(n, k, c, (f, a0, b0) => {
    for (let i = 0; i < n; i++) {
      const s = 2 * i * ldg;
      f.set(g.subarray(s, s + 2 * k), a0 + 2 * i * k);
      const q = b0 + (i >> 2) * k * 8 + (i & 3);
      for (let p = 0; p < k; p++) { f[q + 8 * p] = g[s + 2 * p]; f[q + 8 * p + 4] = -g[s + 2 * p + 1]; }
    }
  });
}

/**
 * Lower triangle of C[n×n] += Σₛ Gₛ·diag(d)·Gₛᴴ for real weights d ≥ 0 on the
 * SIMD kernel: columns p with d[p] > 0 of every Gₛ (n×k, leading dimension
 * `ldg`) are packed once, scaled by d[p] on the left operand only; columns of
 * zero weight are skipped. Returns false (doing nothing) for small n or when
 * WebAssembly SIMD is unavailable; the caller then forms its own scaled G for
 * {@link herkLowerKernel}.
 */
export function herkLowerWeighted(n: number, k: number, gs: readonly Float64Array[], ldg: number, d: Float64Array, c: Float64Array): boolean {
  if (n < HERK_SIMD_MIN) return false;
  const idx = new Int32Array(k);
  let used = 0;
  for (let p = 0; p < k; p++) if (d[p] > 0) idx[used++] = p;
  const kk = used * gs.length;
  if (kk === 0) return loadZtile() !== null;
  return packedHerk(n, kk, c, (f, a0, b0) => {
    for (let i = 0; i < n; i++) {
      const q = b0 + (i >> 2) * kk * 8 + (i & 3), s = 2 * i * ldg;
      let a = a0 + 2 * i * kk, bq = q;
      for (const g of gs) {
        for (let u = 0; u < used; u++) {
          const p = idx[u], w = d[p], re = g[s + 2 * p], im = g[s + 2 * p + 1];
          f[a] = w * re; f[a + 1] = w * im; a += 2;
          f[bq] = re; f[bq + 4] = -im; bq += 8;
        }
      }
    }
  });
}

/**
 * Shared body of the SIMD rank-k updates: `pack(f, a0, b0)` writes rows
 * 0…n−1 of A (n×kk interleaved, at double index a0) and of the four-column
 * panels of B = Gᴴ (at double index b0; column i of B in panel i>>2, lane i&3);
 * padding, the kernel calls and the accumulation into `c` are done here.
 */
function packedHerk(n: number, kk: number, c: Float64Array, pack: (f: Float64Array, a0: number, b0: number) => void): boolean {
  const mod = loadZtile();
  if (mod === null) return false;
  const n4 = (n + 3) & ~3;
  // layout (bytes): A (n4·kk·16) | B panels (n4·kk·16) | Cre (n4·n4·8) | Cim
  const abytes = n4 * kk * 16, cBytes = n4 * n4 * 8;
  const f = ensureMemory(mod.memory, 2 * abytes + 2 * cBytes);
  const pb = abytes, pcr = 2 * abytes, pci = pcr + cBytes;
  const b0 = pb >> 3, cr = pcr >> 3, ci = pci >> 3;
  pack(f, 0, b0);
  if (n4 !== n) {
    f.fill(0, 2 * n * kk, 2 * n4 * kk);
    for (let i = n; i < n4; i++) {
      const q = b0 + (i >> 2) * kk * 8 + (i & 3);
      for (let p = 0; p < kk; p++) { f[q + 8 * p] = 0; f[q + 8 * p + 4] = 0; }
    }
  }
  f.fill(0, cr, ci + n4 * n4);
  // column blocks against the rows from their first column down: the lower triangle in
  // blocks (the diagonal blocks also form their upper part, which is not copied out)
  ztileBlocked(mod, n4, n4, kk, 0, kk * 16, pb, kk * 64, pcr, pci, n4 * 8, true);
  for (let i = 0; i < n; i++) {
    const dd = 2 * i * n, s = i * n4;
    for (let j = 0; j < i; j++) { c[dd + 2 * j] += f[cr + s + j]; c[dd + 2 * j + 1] += f[ci + s + j]; }
    c[dd + 2 * i] += f[cr + s + i];
  }
  return true;
}

/** The scalar loop of {@link herkLowerKernel} (same contract), used for small updates and as fallback. */
export function herkLowerScalarKernel(n: number, k: number, g: Float64Array, ldg: number, c: Float64Array): void {
  const k2 = 2 * k;
  let i = 0;
  for (; i + 1 < n; i += 2) {
    const gi0 = 2 * i * ldg, gi1 = gi0 + 2 * ldg;
    // 2×2 blocks strictly left of the diagonal block
    let j = 0;
    for (; j + 1 < i; j += 2) {
      const gj0 = 2 * j * ldg, gj1 = gj0 + 2 * ldg;
      let s00r = 0, s00i = 0, s01r = 0, s01i = 0, s10r = 0, s10i = 0, s11r = 0, s11i = 0;
      for (let p = 0; p < k2; p += 2) {
        const a0r = g[gi0 + p], a0i = g[gi0 + p + 1];
        const a1r = g[gi1 + p], a1i = g[gi1 + p + 1];
        const b0r = g[gj0 + p], b0i = g[gj0 + p + 1];
        const b1r = g[gj1 + p], b1i = g[gj1 + p + 1];
        s00r += a0r * b0r + a0i * b0i; s00i += a0i * b0r - a0r * b0i;
        s01r += a0r * b1r + a0i * b1i; s01i += a0i * b1r - a0r * b1i;
        s10r += a1r * b0r + a1i * b0i; s10i += a1i * b0r - a1r * b0i;
        s11r += a1r * b1r + a1i * b1i; s11i += a1i * b1r - a1r * b1i;
      }
      const c00 = 2 * (i * n + j), c10 = c00 + 2 * n;
      c[c00] += s00r; c[c00 + 1] += s00i; c[c00 + 2] += s01r; c[c00 + 3] += s01i;
      c[c10] += s10r; c[c10 + 1] += s10i; c[c10 + 2] += s11r; c[c10 + 3] += s11i;
    }
    // diagonal 2×2 block: (i,i), (i+1,i), (i+1,i+1)
    let d0 = 0, d1 = 0, s10r = 0, s10i = 0;
    for (let p = 0; p < k2; p += 2) {
      const a0r = g[gi0 + p], a0i = g[gi0 + p + 1];
      const a1r = g[gi1 + p], a1i = g[gi1 + p + 1];
      d0 += a0r * a0r + a0i * a0i;
      d1 += a1r * a1r + a1i * a1i;
      s10r += a1r * a0r + a1i * a0i; s10i += a1i * a0r - a1r * a0i;
    }
    const cd = 2 * (i * n + i);
    c[cd] += d0;
    c[cd + 2 * n] += s10r; c[cd + 2 * n + 1] += s10i;
    c[cd + 2 * n + 2] += d1;
  }
  if (i < n) {
    // last odd row against every column j ≤ i
    const gi = 2 * i * ldg;
    for (let j = 0; j <= i; j++) {
      const gj = 2 * j * ldg;
      let sr = 0, si = 0;
      for (let p = 0; p < k2; p += 2) {
        const ar = g[gi + p], ai = g[gi + p + 1], br = g[gj + p], bi = g[gj + p + 1];
        sr += ar * br + ai * bi; si += ai * br - ar * bi;
      }
      c[2 * (i * n + j)] += sr; c[2 * (i * n + j) + 1] += j === i ? 0 : si;
    }
  }
}

/** Copies the conjugate of the strict lower triangle of an n×n interleaved matrix into its upper triangle and zeroes the imaginary parts of the diagonal. */
export function mirrorLowerToUpper(n: number, c: Float64Array): void {
  for (let i = 0; i < n; i++) c[2 * (i * n + i) + 1] = 0;
  mirrorTriangle(n, c, true, true);
}

/**
 * Copies one strict triangle of an n×n interleaved matrix onto the other — from the lower
 * triangle when `fromLower`, else from the upper — conjugated (Hermitian) or not (symmetric).
 * Walks 32×32 tiles so that the strided side stays in cache (a plain column walk across a
 * large matrix misses the cache on every entry).
 */
export function mirrorTriangle(n: number, c: Float64Array, fromLower: boolean, conjugate: boolean): void {
  const T = 32, sign = conjugate ? -1 : 1;
  for (let i0 = 0; i0 < n; i0 += T) {
    const i1 = Math.min(n, i0 + T);
    for (let j0 = 0; j0 <= i0; j0 += T) {
      for (let i = i0; i < i1; i++) {
        const j1 = Math.min(i, j0 + T);
        for (let j = j0; j < j1; j++) {
          const lo = 2 * (i * n + j), up = 2 * (j * n + i);
          const src = fromLower ? lo : up, dst = fromLower ? up : lo;
          c[dst] = c[src]; c[dst + 1] = sign * c[src + 1];
        }
      }
    }
  }
}
