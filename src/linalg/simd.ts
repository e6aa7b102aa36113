/**
 * Which arithmetic path the complex core runs on: WebAssembly SIMD kernels or
 * the scalar TypeScript fallback.
 * @module
 */
import { kernelPath } from '../internal/wasm/runtime.js';

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
 * @returns The path and its reason.
 * @throws Never.
 * @example
 * ```ts
 * simdStatus().path; // 'wasm-simd'
 * ```
 * @category Complex core
 */
export function simdStatus(): SimdStatus {
  const { path, reason } = kernelPath();
  return { path, reason };
}
