/**
 * LU with partial pivoting of a matrix that fits in cache, whole in the
 * module memory of `wasm/lu.wat` (right-looking elimination, SIMD rank-one
 * updates): one copy in and one copy out instead of a product-kernel call per
 * block. No checks.
 * @internal
 * @module
 */
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Raw exports of the LU module (byte addresses into `memory`); arguments as in wasm/lu.wat. */
export interface LuFunctions {
  lu: (n: number, pa: number, pu: number, pp: number, pm: number) => number;
}

/** The LU module, or null on the scalar path. */
export const loadLu = kernelModule<LuFunctions>('lu');

/**
 * Factors the n×n interleaved matrix `src` (P·A = L·U packed), applying the
 * row interchanges to `piv`. The factors are copied to `out` when given, else
 * `lu` is a view of the module memory, valid until the next call (for a caller
 * that solves with them at once: no n² allocation). Returns null (doing
 * nothing) on the scalar path.
 */
export function simdLuFactor(n: number, src: Float64Array, piv: Int32Array, out?: Float64Array): { lu: Float64Array; swaps: number; minPivotSq: number } | null {
  const mod = loadLu();
  if (mod === null) return null;
  // layout (bytes): A (16·n²) | u, u' (32·n) | pivots (4·n, padded to 8) | min pivot (8)
  const pa = 0, pu = 16 * n * n, pp = pu + 32 * n, pm = pp + 8 * Math.ceil(n / 2);
  const f = ensureMemory(mod.memory, pm + 8);
  f.set(src, 0);
  const p = new Int32Array(mod.memory.buffer, pp, n);
  p.set(piv);
  const swaps = mod.lu(n, pa, pu, pp, pm);
  piv.set(p);
  const view = f.subarray(0, 2 * n * n);
  if (out !== undefined) out.set(view);
  return { lu: out ?? view, swaps, minPivotSq: f[pm >> 3] };
}
