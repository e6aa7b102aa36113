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
  rotate: (pz: number, rowBytes: number, lo: number, m: number, pc: number, ps: number) => void;
}

const load = kernelModule<RotationFunctions>('rotate');

/** Workspace of one QL run in the module memory. */
export interface RotationWorkspace {
  /** Row stride of Zt in doubles (n rounded up to a multiple of 8). */
  readonly stride: number;
  /** View of the memory: Zt at 0 (n rows of `stride`), then c and s (n each). */
  readonly view: Float64Array;
  /** Offsets (in doubles) of the cosine and sine arrays. */
  readonly cOffset: number;
  readonly sOffset: number;
  /** Applies rotations t = m−1 … lo recorded at view[cOffset + t], view[sOffset + t]. */
  apply(lo: number, m: number): void;
}

/** A workspace for an n×n rotation accumulation initialised to Zt = I, or null without WebAssembly SIMD. */
export function rotationWorkspace(n: number): RotationWorkspace | null {
  const mod = load();
  if (mod === null) return null;
  const stride = Math.ceil(n / 8) * 8;
  const bytes = 8 * (n * stride + 2 * n);
  const view = ensureMemory(mod.memory, bytes);
  view.fill(0, 0, n * stride);
  for (let i = 0; i < n; i++) view[i * stride + i] = 1;
  const cOffset = n * stride, sOffset = cOffset + n;
  return {
    stride, view, cOffset, sOffset,
    apply(lo: number, m: number): void { mod.rotate(0, stride * 8, lo, m, cOffset * 8, sOffset * 8); },
  };
}
