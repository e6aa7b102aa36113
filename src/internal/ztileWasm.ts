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
import { ensureMemory } from './wasm/runtime.js';
import { JOB_KIND, loadZtile, runJob, type ZtileKernel } from './wasm/threads.js';

export { loadZtile };

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
 * With `lower`, the column block starting at column j0 needs only rows j0 and
 * below (a lower triangle, in blocks); else every row. C is accumulated.
 * The blocks are a job of the kernel threads (`wasm/threads.ts`): each column
 * block's rows are cut into parts so that there are at least
 * {@link MIN_CHUNKS} (column block, row part) chunks; a chunk runs every depth
 * block of its part, so each entry's sums are the same for any thread count.
 */
export function ztileBlocked(
  mod: ZtileKernel, m: number, n4: number, k: number,
  pa: number, lda: number, pb: number, ldbq: number, pcr: number, pci: number, ldc: number,
  lower = false,
): void {
  const blocks = Math.ceil(n4 / BLOCK_COLUMNS);
  const parts = Math.max(1, Math.min(m >> 2, Math.ceil(MIN_CHUNKS / blocks)));
  runJob(mod, JOB_KIND.BLOCKS, [m, n4, k, pa, lda, pb, ldbq, pcr, pci, ldc, lower ? 1 : 0, BLOCK_COLUMNS, BLOCK_DEPTH, parts], blocks * parts, lower ? (m * n4 * k) / 2 : m * n4 * k);
}

/** Chunks a blocked product is cut into at least (where it has that many rows), so that up to eight threads balance. */
const MIN_CHUNKS = 16;

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
