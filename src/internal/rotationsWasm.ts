/**
 * WebAssembly SIMD kernel applying the plane rotations of one implicit QL
 * sweep to the accumulated eigenvector matrix, two matrix rows per f64x2
 * lane pair and eight rows per pass (four independent running values hide
 * the latency of the recurrence). The kernel is wasm/rotate.wat;
 * callers fall back to their scalar loop on the scalar path. No checks.
 * @internal
 * @module
 */
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Exports of wasm/rotate.wat (byte addresses into its memory); arguments as documented there. */
interface RotationFunctions {
  rotate: (pz: number, panelBytes: number, panels: number, lo: number, m: number, pc: number, ps: number) => void;
}

const load = kernelModule<RotationFunctions>('rotate');

/** Workspace of one QL run in the module memory. */
export interface RotationWorkspace {
  /** View of the memory: Zt in panels of eight columns (see wasm/rotate.wat), then c and s (n each). */
  readonly view: Float64Array;
  /** Offsets (in doubles) of the cosine and sine arrays. */
  readonly cOffset: number;
  readonly sOffset: number;
  /** Applies rotations t = m−1 … lo recorded at view[cOffset + t], view[sOffset + t]. */
  apply(lo: number, m: number): void;
  /** Writes the accumulated Z (n×n, row-major, Z[k][t] = Zt[t][k]) to `z`. */
  readInto(z: Float64Array): void;
}

/**
 * A workspace for an n×n rotation accumulation initialised to Zt = I, or null
 * on the scalar path. Zt is stored in panels of eight columns so that a sweep
 * walks memory contiguously (see wasm/rotate.wat).
 */
export function rotationWorkspace(n: number): RotationWorkspace | null {
  const mod = load();
  if (mod === null) return null;
  const panels = Math.ceil(n / 8), panel = 8 * n; // doubles per panel
  const bytes = 8 * (panels * panel + 2 * n);
  const view = ensureMemory(mod.memory, bytes);
  view.fill(0, 0, panels * panel);
  // Zt[t][k] at (k >> 3)·panel + 8t + (k & 7)
  for (let i = 0; i < n; i++) view[(i >> 3) * panel + 8 * i + (i & 7)] = 1;
  const cOffset = panels * panel, sOffset = cOffset + n;
  return {
    view, cOffset, sOffset,
    apply(lo: number, m: number): void { mod.rotate(0, panel * 8, panels, lo, m, cOffset * 8, sOffset * 8); },
    readInto(z: Float64Array): void {
      for (let k = 0; k < n; k++) {
        const base = (k >> 3) * panel + (k & 7), row = k * n;
        for (let t = 0; t < n; t++) z[row + t] = view[base + 8 * t];
      }
    },
  };
}
