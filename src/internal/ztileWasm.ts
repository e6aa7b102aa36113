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
import { JOB_KIND, loadZtile, runJob } from './wasm/threads.js';

export { loadZtile };

/** Parts a job is cut into (contiguous rows or column groups), so that any thread count up to 8 is balanced. */
export const JOB_CHUNKS = 32;

/** Whether the SIMD product kernel runs in this runtime (false also when switched off for tests). */
export function simdGemmAvailable(): boolean {
  return loadZtile() !== null;
}

/** Inner-dimension steps per pass, so that the packed B block (n4·kb·16 bytes) stays within ~256 KiB of L2. */
function panelDepth(n4: number): number {
  return Math.max(4, Math.floor((256 * 1024) / (16 * n4)));
}

/**
 * C[m×n] (+)= alpha·A[m×k]·B[k×n] (alpha real) on interleaved row-major
 * storage with leading dimensions and offsets in complex elements (the
 * signature of the scalar `gemmKernel`), computed by the tiled kernel.
 * Returns false (doing nothing) on the scalar path. Rows of C are cut into
 * contiguous blocks run on the kernel threads (`wasm/threads.ts`) when the
 * product is large enough; each row's sums are the same for any thread count.
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
  const per = Math.ceil(m / JOB_CHUNKS);
  runJob(mod, JOB_KIND.ROWS, [m, n4, k, pa, k * 16, pb, k * 64, pcr, pci, n4 * 8, 32, panelDepth(n4), per], Math.ceil(m / per), m * n4 * k);
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
