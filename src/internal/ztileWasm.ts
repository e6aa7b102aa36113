/**
 * The one complex matrix-product kernel on WebAssembly SIMD: the
 * register-tiled `ztile` of `wasm/ztile.wat` (a 1-row × 4-column tile of C in
 * registers while the inner dimension runs; B packed in four-column panels).
 * Used by the general product (`simdGemm` below, behind `gemmKernel`), the
 * Hermitian rank-k updates (`herk.ts`) and the triangular solves
 * (`triangularWasm.ts`). No checks.
 * @internal
 * @module
 */
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Raw exports of the tiled product module (byte addresses into `memory`); arguments as in wasm/ztile.wat. */
export interface ZtileFunctions {
  ztile: (m: number, n: number, k: number, pa: number, lda: number, pb: number, ldbq: number, pcr: number, pci: number, ldc: number, ldcq: number) => void;
}

/** The tiled product module, or null on the scalar path. */
export const loadZtile = kernelModule<ZtileFunctions>('ztile');

/** Whether the SIMD product kernel runs in this runtime (false also when switched off for tests). */
export function simdGemmAvailable(): boolean {
  return loadZtile() !== null;
}

/** Columns of C per block of {@link ztileBlocked} (a multiple of four). */
const BLOCK_COLUMNS = 128;
/** Inner-dimension steps per block of {@link ztileBlocked}: with {@link BLOCK_COLUMNS} the packed B block is 128·128·16 B = 256 KiB (L2). */
const BLOCK_DEPTH = 128;

/**
 * C (+)= A·B on the tiled kernel in blocks of {@link BLOCK_COLUMNS} columns ×
 * {@link BLOCK_DEPTH} inner steps (Goto & van de Geijn 2008, from memory: the
 * packed B block stays in L2 while every row of A streams past it, and each
 * entry of C is read and written once per depth block). Without the column
 * blocking the depth that fits L2 shrinks as 1/n and C is re-streamed k/kb
 * times: at n = 3169 that was a depth of 5 and ~200 GB of C traffic.
 * Addresses in bytes, layout of wasm/ztile.wat (B in four-column panels of
 * stride `ldbq`, C planes with row stride `ldc` and panel stride 32).
 * `firstRow(j0)` gives the first row of C needed for the column block starting
 * at column j0 (0 for a full product; j0 for a lower triangle). C is accumulated.
 */
export function ztileBlocked(
  mod: ZtileFunctions, m: number, n4: number, k: number,
  pa: number, lda: number, pb: number, ldbq: number, pcr: number, pci: number, ldc: number,
  firstRow: (j0: number) => number = () => 0,
): void {
  for (let j0 = 0; j0 < n4; j0 += BLOCK_COLUMNS) {
    const nb = Math.min(BLOCK_COLUMNS, n4 - j0), i0 = firstRow(j0);
    if (i0 >= m) continue;
    for (let p0 = 0; p0 < k; p0 += BLOCK_DEPTH) {
      const kb = Math.min(BLOCK_DEPTH, k - p0);
      mod.ztile(m - i0, nb, kb, pa + i0 * lda + p0 * 16, lda, pb + (j0 >> 2) * ldbq + p0 * 64, ldbq,
        pcr + i0 * ldc + j0 * 8, pci + i0 * ldc + j0 * 8, ldc, 32);
    }
  }
}

/**
 * C[m×n] (+)= alpha·A[m×k]·B[k×n] (alpha real) on interleaved row-major
 * storage with leading dimensions and offsets in complex elements (the
 * signature of the scalar `gemmKernel`), computed by the tiled kernel.
 * Returns false (doing nothing) on the scalar path.
 * A and B are copied into the module memory before C is written, so C may
 * share a buffer with A or B as long as the regions do not overlap.
 */
export function simdGemm(
  m: number, n: number, k: number,
  a: Float64Array, offA: number, lda: number,
  b: Float64Array, offB: number, ldb: number,
  c: Float64Array, offC: number, ldc: number,
  accumulate: boolean, alpha: number,
): boolean {
  const mod = loadZtile();
  if (mod === null) return false;
  const n4 = (n + 3) & ~3;
  // layout (bytes): A (m·k·16, interleaved) | B panels (n4/4 panels of k·64) | Cre (m·n4·8) | Cim
  const aBytes = m * k * 16, bBytes = n4 * k * 16, cBytes = m * n4 * 8;
  const f = ensureMemory(mod.memory, aBytes + bBytes + 2 * cBytes);
  const pa = 0, pb = aBytes, pcr = pb + bBytes, pci = pcr + cBytes;
  for (let i = 0; i < m; i++) {
    const s = 2 * (offA + i * lda);
    f.set(a.subarray(s, s + 2 * k), 2 * i * k);
  }
  // B: column j in panel j>>2, lane j&3; for step p the real parts at +8p, imaginary at +8p+4 (doubles)
  const b0 = pb >> 3;
  for (let p = 0; p < k; p++) {
    const s = 2 * (offB + p * ldb);
    for (let j = 0; j < n; j++) {
      const d = b0 + (j >> 2) * k * 8 + 8 * p + (j & 3);
      f[d] = b[s + 2 * j]; f[d + 4] = b[s + 2 * j + 1];
    }
    for (let j = n; j < n4; j++) {
      const d = b0 + (j >> 2) * k * 8 + 8 * p + (j & 3);
      f[d] = 0; f[d + 4] = 0;
    }
  }
  const cr = pcr >> 3, ci = pci >> 3;
  f.fill(0, cr, ci + m * n4);
  ztileBlocked(mod, m, n4, k, pa, k * 16, pb, k * 64, pcr, pci, n4 * 8);
  for (let i = 0; i < m; i++) {
    const s = i * n4, d = 2 * (offC + i * ldc);
    if (accumulate) {
      for (let j = 0; j < n; j++) { c[d + 2 * j] += alpha * f[cr + s + j]; c[d + 2 * j + 1] += alpha * f[ci + s + j]; }
    } else if (alpha === 1) {
      for (let j = 0; j < n; j++) { c[d + 2 * j] = f[cr + s + j]; c[d + 2 * j + 1] = f[ci + s + j]; }
    } else {
      for (let j = 0; j < n; j++) { c[d + 2 * j] = alpha * f[cr + s + j]; c[d + 2 * j + 1] = alpha * f[ci + s + j]; }
    }
  }
  return true;
}
