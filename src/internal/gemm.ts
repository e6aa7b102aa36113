/**
 * Complex matrix-product kernels on interleaved row-major storage. No checks.
 * @internal
 * @module
 */

import { simdGemm } from './ztileWasm.js';

/** Complex multiply–adds from which the SIMD kernel pays for its packing (measured: break-even near 8³). */
export const SIMD_MIN_WORK = 4096;

/**
 * C[m×n] (+)= alpha·A[m×k]·B[k×n] (alpha real), all interleaved row-major with
 * the given leading dimensions (in complex elements) and offsets (in complex
 * elements). With `accumulate` false, C is overwritten (alpha still applies).
 * The k-loop is unrolled by four so each row of C is loaded and stored once
 * per four rank-one updates; the inner loop walks a row of B contiguously.
 * C must not alias A or B (disjoint regions of one buffer are fine).
 *
 * Products of at least {@link SIMD_MIN_WORK} complex multiply–adds (and at
 * least two rows and columns) go to the WebAssembly SIMD kernel
 * (`simdGemm`, f64x2 on split real/imaginary planes) when the runtime has
 * WebAssembly SIMD; this scalar loop is the fallback and serves small products.
 */
export function gemmKernel(
  m: number, n: number, k: number,
  a: Float64Array, offA: number, lda: number,
  b: Float64Array, offB: number, ldb: number,
  c: Float64Array, offC: number, ldc: number,
  accumulate: boolean,
  alpha = 1,
): void {
  if (m >= 2 && n >= 2 && m * n * k >= SIMD_MIN_WORK &&
    simdGemm(m, n, k, a, offA, lda, b, offB, ldb, c, offC, ldc, accumulate, alpha)) return;
  gemmScalarKernel(m, n, k, a, offA, lda, b, offB, ldb, c, offC, ldc, accumulate, alpha);
}

/** The scalar loop of {@link gemmKernel} (same contract), used below the SIMD threshold and as fallback. */
export function gemmScalarKernel(
  m: number, n: number, k: number,
  a: Float64Array, offA: number, lda: number,
  b: Float64Array, offB: number, ldb: number,
  c: Float64Array, offC: number, ldc: number,
  accumulate: boolean,
  alpha: number,
): void {
  if (!accumulate) {
    for (let i = 0; i < m; i++) c.fill(0, 2 * (offC + i * ldc), 2 * (offC + i * ldc + n));
  }
  const n2 = 2 * n;
  for (let i = 0; i < m; i++) {
    const ci = 2 * (offC + i * ldc);
    const ai = 2 * (offA + i * lda);
    let p = 0;
    for (; p + 3 < k; p += 4) {
      const ap = ai + 2 * p;
      const a0r = alpha * a[ap], a0i = alpha * a[ap + 1], a1r = alpha * a[ap + 2], a1i = alpha * a[ap + 3];
      const a2r = alpha * a[ap + 4], a2i = alpha * a[ap + 5], a3r = alpha * a[ap + 6], a3i = alpha * a[ap + 7];
      const b0 = 2 * (offB + p * ldb);
      const b1 = b0 + 2 * ldb;
      const b2 = b1 + 2 * ldb;
      const b3 = b2 + 2 * ldb;
      for (let j = 0; j < n2; j += 2) {
        const x0r = b[b0 + j], x0i = b[b0 + j + 1];
        const x1r = b[b1 + j], x1i = b[b1 + j + 1];
        const x2r = b[b2 + j], x2i = b[b2 + j + 1];
        const x3r = b[b3 + j], x3i = b[b3 + j + 1];
        c[ci + j] += a0r * x0r - a0i * x0i + a1r * x1r - a1i * x1i + a2r * x2r - a2i * x2i + a3r * x3r - a3i * x3i;
        c[ci + j + 1] += a0r * x0i + a0i * x0r + a1r * x1i + a1i * x1r + a2r * x2i + a2i * x2r + a3r * x3i + a3i * x3r;
      }
    }
    for (; p < k; p++) {
      const ap = ai + 2 * p;
      const ar = alpha * a[ap], aim = alpha * a[ap + 1];
      const b0 = 2 * (offB + p * ldb);
      for (let j = 0; j < n2; j += 2) {
        const xr = b[b0 + j], xi = b[b0 + j + 1];
        c[ci + j] += ar * xr - aim * xi;
        c[ci + j + 1] += ar * xi + aim * xr;
      }
    }
  }
}
