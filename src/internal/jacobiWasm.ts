/**
 * One-sided Jacobi sweeps of the SVD on the WebAssembly SIMD kernel
 * (wasm/jacobi.wat): the columns of the work matrix and the rows of Vᵀ are
 * copied into the module memory once, swept there until no pair rotates, and
 * copied back (the sweeps keep the squared column norms behind them). No checks.
 * @internal
 * @module
 */
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Exports of wasm/jacobi.wat (byte addresses into its memory); arguments as documented there. */
interface JacobiFunctions {
  sweep: (pg: number, m: number, pv: number, n: number, tol: number, pnorm: number) => number;
}

const load = kernelModule<JacobiFunctions>('jacobi');

/**
 * Runs sweeps over `g` (n columns of length m, each contiguous, interleaved)
 * and `vt` (n×n, rows = columns of V) in place until a sweep rotates no pair
 * or `maxSweeps` is reached. Returns the number of sweeps used (the last one
 * rotating nothing), `maxSweeps + 1` when it did not converge, or 0 on the
 * scalar path (nothing done).
 */
export function simdJacobiSweeps(g: Float64Array, vt: Float64Array, m: number, n: number, tol: number, maxSweeps: number): number {
  const mod = load();
  if (mod === null) return 0;
  const gLen = 2 * m * n, vLen = 2 * n * n;
  // g, then Vᵀ, then the n squared column norms the sweep keeps
  const f = ensureMemory(mod.memory, 8 * (gLen + vLen + n));
  f.set(g.subarray(0, gLen), 0);
  f.set(vt.subarray(0, vLen), gLen);
  let sweeps = maxSweeps + 1;
  for (let sweep = 1; sweep <= maxSweeps; sweep++) {
    if (mod.sweep(0, m, 8 * gLen, n, tol, 8 * (gLen + vLen)) === 0) { sweeps = sweep; break; }
  }
  g.set(f.subarray(0, gLen));
  vt.set(f.subarray(gLen, gLen + vLen));
  return sweeps;
}
