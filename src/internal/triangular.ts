/**
 * Triangular solves with many right-hand sides, in place, on interleaved
 * row-major storage. No checks. The right-hand sides are processed in column
 * panels so that the working set stays in cache; each row update is one call
 * of the shared product kernel.
 * @internal
 * @module
 */
import { gemmKernel } from './gemm.js';

/** Column-panel width (complex entries) for the many-right-hand-side solves. */
const PANEL = 64;

function scaleRow(x: Float64Array, off: number, len: number, dr: number, di: number): void {
  // x[off .. off+len) /= (dr + j di)
  const den = dr * dr + di * di;
  const ir = dr / den, ii = -di / den;
  for (let j = 2 * off, end = 2 * (off + len); j < end; j += 2) {
    const xr = x[j], xi = x[j + 1];
    x[j] = xr * ir - xi * ii;
    x[j + 1] = xr * ii + xi * ir;
  }
}

/**
 * Solves T X = B in place (X holds B on entry) for lower-triangular T (n×n,
 * leading dimension n), X n×nrhs. `unitDiagonal` skips the division.
 */
export function solveLowerInPlace(n: number, nrhs: number, t: Float64Array, x: Float64Array, unitDiagonal: boolean): void {
  for (let c0 = 0; c0 < nrhs; c0 += PANEL) {
    const pw = Math.min(PANEL, nrhs - c0);
    for (let i = 0; i < n; i++) {
      if (i > 0) gemmKernel(1, pw, i, t, i * n, n, x, c0, nrhs, x, i * nrhs + c0, nrhs, true, -1);
      if (!unitDiagonal) scaleRow(x, i * nrhs + c0, pw, t[2 * (i * n + i)], t[2 * (i * n + i) + 1]);
    }
  }
}

/**
 * Solves T X = B in place (X holds B on entry) for upper-triangular T (n×n,
 * leading dimension n), X n×nrhs. `unitDiagonal` skips the division.
 */
export function solveUpperInPlace(n: number, nrhs: number, t: Float64Array, x: Float64Array, unitDiagonal: boolean): void {
  for (let c0 = 0; c0 < nrhs; c0 += PANEL) {
    const pw = Math.min(PANEL, nrhs - c0);
    for (let i = n - 1; i >= 0; i--) {
      const m = n - i - 1;
      if (m > 0) gemmKernel(1, pw, m, t, i * n + i + 1, n, x, (i + 1) * nrhs + c0, nrhs, x, i * nrhs + c0, nrhs, true, -1);
      if (!unitDiagonal) scaleRow(x, i * nrhs + c0, pw, t[2 * (i * n + i)], t[2 * (i * n + i) + 1]);
    }
  }
}

/** Conjugate transpose of an n×n interleaved matrix into a new buffer. */
export function adjointSquare(n: number, a: Float64Array): Float64Array {
  const out = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const s = 2 * (i * n + j), d = 2 * (j * n + i);
      out[d] = a[s];
      out[d + 1] = -a[s + 1];
    }
  }
  return out;
}
