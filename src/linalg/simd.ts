/**
 * Which arithmetic path the complex core runs on (WebAssembly SIMD kernels or
 * the scalar TypeScript fallback) and on how many threads.
 * @module
 */
import { DomainError } from '../errors.js';
import { kernelPath } from '../internal/wasm/runtime.js';
import { MAX_THREADS, threadSettings, threadStatus } from '../internal/wasm/threads.js';

/**
 * The arithmetic path of the complex core, as reported by {@link simdStatus}.
 * @category Complex core
 */
export interface SimdStatus {
  /**
   * `'wasm-simd'`: the matrix product, Hermitian rank-k update, triangular
   * solves with many right-hand sides, tridiagonal reduction, QL rotations and
   * the Jacobi sweeps of the SVD
   * run on WebAssembly 128-bit SIMD (f64x2) kernels; `'scalar'`: every
   * operation runs on the TypeScript loops (same results to rounding, large
   * operations several times slower).
   */
  readonly path: 'wasm-simd' | 'scalar';
  /** Why this path was taken, in words (for `'scalar'`: what the runtime lacks or what failed). */
  readonly reason: string;
  /**
   * Threads the product kernel runs on for large products (the calling thread
   * included): the {@link setKernelThreads} setting where kernel threads can
   * run, else 1.
   */
  readonly threads: number;
  /** Why that many, in words (for 1: what the runtime lacks, the setting, or what failed). */
  readonly threadsReason: string;
}

/**
 * Reports whether the complex core runs on its WebAssembly SIMD kernels or on
 * the scalar fallback, and why.
 *
 * @remarks
 * The decision is made once per process (or page), at the first large matrix
 * operation or at the first call of this function: WebAssembly must be present
 * and accept every kernel module, which uses the 128-bit SIMD instructions
 * (f64x2; WebAssembly SIMD proposal, standardised in WebAssembly 2.0, W3C,
 * 2022, from memory). Node ≥ 20 and current browsers take `'wasm-simd'`.
 * When the fallback is taken, one warning is emitted through
 * `process.emitWarning` (type `PhasewiseWarning`, code
 * `PHASEWISE_SIMD_FALLBACK`) where the runtime has it; a browser page has no
 * such channel and should call this function. The path changes only speed,
 * never the arithmetic convention (docs/conventions.md) nor the results
 * beyond rounding.
 * The thread count is decided at the same time: Node (≥ 20.16, with
 * `worker_threads` and shared WebAssembly memory) runs large products on
 * {@link setKernelThreads} threads; browsers run them on one thread (a page's
 * main thread may not block in `Atomics.wait`), and so does any runtime where
 * the workers cannot start — same results either way.
 * @returns The path, the thread count and their reasons.
 * @throws Never.
 * @example
 * ```ts
 * simdStatus().path; // 'wasm-simd'
 * ```
 * @category Complex core
 */
export function simdStatus(): SimdStatus {
  const { path, reason } = kernelPath();
  const { threads, reason: threadsReason } = threadStatus();
  return { path, reason, threads, threadsReason };
}

/**
 * Chooses how many threads the dense kernels use: complex matrix products,
 * Hermitian rank-k updates and triangular solves with many right-hand sides,
 * and through them the LU and Cholesky factorisations and solves.
 *
 * @remarks
 * A product of at least 80³ complex multiply–adds is cut into contiguous
 * blocks of output rows (or, for triangular solves, of right-hand-side
 * columns); the calling thread and `n − 1` worker threads, which share one
 * WebAssembly memory, each take blocks and run the same SIMD kernel on them
 * (row-block parallelism over a shared packed panel: K. Goto and R. van de
 * Geijn, "Anatomy of high-performance matrix multiplication", ACM TOMS 34(3),
 * 2008, from memory). Every output entry is formed by one thread in the same
 * order, so results are bit-identical for every thread count. Workers start
 * at the first such product, never keep a process alive and are reused; the
 * calling thread waits for them (`Atomics.wait`). Node only (≥ 20.16): in
 * browsers, or where shared memory or `worker_threads` is missing, the
 * kernels run on one thread and {@link simdStatus} says why. The setting is
 * per process (or worker), like `OPENBLAS_NUM_THREADS` for OpenBLAS.
 * @param n - Threads including the calling one: an integer in 1 … 64, or
 *   `'auto'` for the default, the runtime's available cores
 *   (`os.availableParallelism()`) capped at 8.
 * @returns The thread count now in use (1 where threads cannot run).
 * @throws DomainError when `n` is neither `'auto'` nor an integer in 1 … 64.
 * @example
 * ```ts
 * setKernelThreads(1); // → 1
 * simdStatus().threads; // 1
 * setKernelThreads('auto');
 * ```
 * @category Complex core
 */
export function setKernelThreads(n: number | 'auto'): number {
  if (n !== 'auto' && !(typeof n === 'number' && Number.isInteger(n) && n >= 1 && n <= MAX_THREADS)) {
    throw new DomainError(`setKernelThreads: n must be 'auto' or an integer in 1 … ${MAX_THREADS}, got ${typeof n === 'number' ? String(n) : typeof n === 'string' ? `'${n}'` : typeof n}`);
  }
  threadSettings.requested = n === 'auto' ? undefined : n;
  return threadStatus().threads;
}

