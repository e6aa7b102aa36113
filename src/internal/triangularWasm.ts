/**
 * Triangular solves with many right-hand sides on the register-tiled
 * WebAssembly SIMD product kernel (ztile), with the right-hand sides kept in
 * its four-column panel layout in the module memory for the whole
 * substitution (no per-update packing).
 * No checks.
 * @internal
 * @module
 */
import { ensureMemory } from './wasm/runtime.js';
import { JOB_KIND, runJob } from './wasm/threads.js';
import { loadZtile } from './ztileWasm.js';

/** Columns of X per chunk of the substitution (a multiple of 4), so the chunk (n·W·16 bytes) stays in L2 for n ≲ 250. */
const SIMD_PANEL = 64;

/** One triangular factor of a chain of solves. */
export interface TriangularStage {
  /** n×n, interleaved row-major, leading dimension n. */
  t: Float64Array;
  /** Lower (else upper) triangular. */
  lower: boolean;
  /** Take the diagonal as 1. */
  unitDiagonal: boolean;
}

/**
 * Solves T_s ⋯ T₂ T₁ X = B in place for the given triangular stages, applied
 * in order (X ← T₁⁻¹X, then T₂⁻¹X, …), with X n×nrhs interleaved row-major
 * holding B on entry, or B read from `src` (same shape; then X's entry
 * values are ignored and `src` is not written). X is packed once, swept by every stage
 * (each stage cut into chunks of contiguous four-column groups, run on the kernel
 * threads when large enough: columns are independent, so the result does not depend
 * on the thread count), and unpacked once. Returns false (doing nothing)
 * when WebAssembly SIMD is unavailable.
 *
 * Row-oriented substitution with the diagonal folded into the data:
 * with D = diag(T), xᵢ = bᵢ/tᵢᵢ + Σₚ (−tᵢₚ/tᵢᵢ)·xₚ over the solved rows p,
 * so each row is one call of the tiled product kernel (1 × W × #solved),
 * with the packed coefficients −tᵢₚ/tᵢᵢ as the left operand, the solved
 * rows of the panel as the right operand and row i of the same panel as the
 * result (Golub & Van Loan, *Matrix Computations*, 4th ed., 2013, §3.1,
 * from memory).
 */
export function simdSolveTriangular(n: number, nrhs: number, stages: readonly TriangularStage[], x: Float64Array, src: Float64Array = x): boolean {
  const mod = loadZtile();
  if (mod === null) return false;
  const groups = (nrhs + 3) >> 2, w4 = 4 * groups;
  // layout (bytes): per stage, coefficient rows (n(n−1)/2 complex, row i at rowStart(i)) | X:
  // groups of four columns, group q at px + q·n·64, row i of it the 64 bytes [re ×4 | im ×4]
  const coefCount = (n * (n - 1)) / 2;
  const px = stages.length * coefCount * 16, groupBytes = n * 64;
  const f = ensureMemory(mod.memory, px + groups * groupBytes);
  const invR = stages.map(() => new Float64Array(n)), invI = stages.map(() => new Float64Array(n));
  let o = 0;
  stages.forEach(({ t, lower, unitDiagonal }, st) => {
    for (let i = 0; i < n; i++) {
      const dr = t[2 * (i * n + i)], di = t[2 * (i * n + i) + 1];
      let ir = 1, ii = 0;
      if (!unitDiagonal) {
        const den = dr * dr + di * di;
        ir = dr / den; ii = -di / den;
      }
      invR[st][i] = ir; invI[st][i] = ii;
      // row i's coefficients at o: lower rows hold i entries, upper rows n − 1 − i (the kernel threads' rowStart)
      const p0 = lower ? 0 : i + 1, p1 = lower ? i : n;
      for (let p = p0; p < p1; p++, o++) {
        const tr = t[2 * (i * n + p)], ti = t[2 * (i * n + p) + 1];
        f[2 * o] = -(tr * ir - ti * ii);
        f[2 * o + 1] = -(tr * ii + ti * ir);
      }
    }
  });
  const x0 = px >> 3, g8 = groupBytes >> 3;
  // pack X, each row scaled by 1/tᵢᵢ of the first stage; zero columns up to a multiple of four
  for (let i = 0; i < n; i++) {
    const ir = invR[0][i], ii = invI[0][i], s = 2 * i * nrhs;
    for (let j = 0; j < w4; j++) {
      const d = x0 + (j >> 2) * g8 + 8 * i + (j & 3);
      if (j < nrhs) {
        const vr = src[s + 2 * j], vi = src[s + 2 * j + 1];
        f[d] = vr * ir - vi * ii;
        f[d + 4] = vr * ii + vi * ir;
      } else {
        f[d] = 0; f[d + 4] = 0;
      }
    }
  }
  // column groups per chunk: up to SIMD_PANEL columns, at least eight chunks where there are enough groups
  const per = Math.min(SIMD_PANEL >> 2, Math.ceil(groups / 8));
  stages.forEach(({ lower, unitDiagonal }, st) => {
    if (st > 0 && !unitDiagonal) {
      // later stages: scale the rows by their 1/tᵢᵢ in place
      for (let i = 0; i < n; i++) {
        const ir = invR[st][i], ii = invI[st][i];
        for (let j = 0; j < w4; j++) {
          const d = x0 + (j >> 2) * g8 + 8 * i + (j & 3);
          const vr = f[d], vi = f[d + 4];
          f[d] = vr * ir - vi * ii;
          f[d + 4] = vr * ii + vi * ir;
        }
      }
    }
    // every column group is substituted independently: a job of the kernel threads
    runJob(mod, JOB_KIND.SWEEP, [n, lower ? 1 : 0, st * coefCount * 16, px, groupBytes, groups, per], Math.ceil(groups / per), coefCount * w4);
  });
  for (let i = 0; i < n; i++) {
    const s = 2 * i * nrhs;
    for (let j = 0; j < nrhs; j++) {
      const d = x0 + (j >> 2) * g8 + 8 * i + (j & 3);
      x[s + 2 * j] = f[d]; x[s + 2 * j + 1] = f[d + 4];
    }
  }
  return true;
}
