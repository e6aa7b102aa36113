/**
 * Triangular solves with many right-hand sides, in place, on interleaved
 * row-major storage. No checks. The right-hand sides are processed in column
 * panels so that the working set stays in cache; each row update is one call
 * of the shared product kernel.
 * @internal
 * @module
 */
import { gemmKernel } from './gemm.js';
import { simdSolveTriangular } from './triangularWasm.js';

/** Right-hand sides and order from which the SIMD substitution is used (below it the blocked scalar code). */
const SIMD_MIN_RHS = 4, SIMD_MIN_ORDER = 4;

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

/** Diagonal block size of the blocked substitutions. */
const BLOCK = 16;

/**
 * Solves T x = b (or Tᴴ x = b with `adjoint`) in place for one right-hand side
 * x (n complex entries holding b on entry), T lower or upper triangular (n×n,
 * leading dimension n), `unitDiagonal` taking its diagonal as 1. Plain
 * substitution: row-oriented dot products for T, column-oriented updates
 * (rows of T, so no transpose is formed) for Tᴴ (Golub & Van Loan, *Matrix
 * Computations*, 4th ed., 2013, §3.1.1–3.1.2, from memory).
 */
export function solveVectorInPlace(n: number, t: Float64Array, x: Float64Array, lower: boolean, unitDiagonal: boolean, adjoint: boolean): void {
  if (!adjoint) {
    for (let step = 0; step < n; step++) {
      const i = lower ? step : n - 1 - step;
      const p0 = lower ? 0 : i + 1, p1 = lower ? i : n, row = 2 * i * n;
      let sr = x[2 * i], si = x[2 * i + 1];
      for (let p = p0; p < p1; p++) {
        const tr = t[row + 2 * p], ti = t[row + 2 * p + 1], xr = x[2 * p], xi = x[2 * p + 1];
        sr -= tr * xr - ti * xi;
        si -= tr * xi + ti * xr;
      }
      if (!unitDiagonal) {
        const dr = t[row + 2 * i], di = t[row + 2 * i + 1], den = dr * dr + di * di;
        const qr = (sr * dr + si * di) / den, qi = (si * dr - sr * di) / den;
        sr = qr; si = qi;
      }
      x[2 * i] = sr; x[2 * i + 1] = si;
    }
    return;
  }
  // Tᴴ is upper when T is lower: solve backwards, each solved x_i updating x_p −= conj(t_ip)·x_i
  for (let step = 0; step < n; step++) {
    const i = lower ? n - 1 - step : step;
    const row = 2 * i * n;
    let xr = x[2 * i], xi = x[2 * i + 1];
    if (!unitDiagonal) {
      // x_i / conj(t_ii)
      const dr = t[row + 2 * i], di = -t[row + 2 * i + 1], den = dr * dr + di * di;
      const qr = (xr * dr + xi * di) / den, qi = (xi * dr - xr * di) / den;
      xr = qr; xi = qi;
      x[2 * i] = xr; x[2 * i + 1] = xi;
    }
    const p0 = lower ? 0 : i + 1, p1 = lower ? i : n;
    for (let p = p0; p < p1; p++) {
      const tr = t[row + 2 * p], ti = -t[row + 2 * p + 1];
      x[2 * p] -= tr * xr - ti * xi;
      x[2 * p + 1] -= tr * xi + ti * xr;
    }
  }
}

/**
 * Solves T X = B in place (X holds B on entry) for lower-triangular T (n×n,
 * leading dimension n), X n×nrhs. `unitDiagonal` skips the division.
 * Blocked: each block of BLOCK rows first receives the update from all solved
 * rows as one matrix product (the SIMD kernel for many right-hand sides),
 * then is solved row by row within the block (Golub & Van Loan, *Matrix
 * Computations*, 4th ed., 2013, §3.1.6, from memory).
 */
export function solveLowerInPlace(n: number, nrhs: number, t: Float64Array, x: Float64Array, unitDiagonal: boolean): void {
  if (nrhs === 1) { solveVectorInPlace(n, t, x, true, unitDiagonal, false); return; }
  if (nrhs >= SIMD_MIN_RHS && n >= SIMD_MIN_ORDER && simdSolveTriangular(n, nrhs, [{ t, lower: true, unitDiagonal }], x)) return;
  for (let b0 = 0; b0 < n; b0 += BLOCK) {
    const nb = Math.min(BLOCK, n - b0);
    // X[b0:b0+nb] −= T[b0:b0+nb, 0:b0] · X[0:b0]
    if (b0 > 0) gemmKernel(nb, nrhs, b0, t, b0 * n, n, x, 0, nrhs, x, b0 * nrhs, nrhs, true, -1);
    for (let c0 = 0; c0 < nrhs; c0 += PANEL) {
      const pw = Math.min(PANEL, nrhs - c0);
      for (let i = b0; i < b0 + nb; i++) {
        if (i > b0) gemmKernel(1, pw, i - b0, t, i * n + b0, n, x, b0 * nrhs + c0, nrhs, x, i * nrhs + c0, nrhs, true, -1);
        if (!unitDiagonal) scaleRow(x, i * nrhs + c0, pw, t[2 * (i * n + i)], t[2 * (i * n + i) + 1]);
      }
    }
  }
}

/**
 * Solves T X = B in place (X holds B on entry) for upper-triangular T (n×n,
 * leading dimension n), X n×nrhs. `unitDiagonal` skips the division.
 * Blocked from the bottom up like {@link solveLowerInPlace}.
 */
export function solveUpperInPlace(n: number, nrhs: number, t: Float64Array, x: Float64Array, unitDiagonal: boolean): void {
  if (nrhs === 1) { solveVectorInPlace(n, t, x, false, unitDiagonal, false); return; }
  if (nrhs >= SIMD_MIN_RHS && n >= SIMD_MIN_ORDER && simdSolveTriangular(n, nrhs, [{ t, lower: false, unitDiagonal }], x)) return;
  for (let e0 = n; e0 > 0; e0 -= BLOCK) {
    const b0 = Math.max(0, e0 - BLOCK), nb = e0 - b0;
    // X[b0:e0] −= T[b0:e0, e0:n] · X[e0:n]
    if (e0 < n) gemmKernel(nb, nrhs, n - e0, t, b0 * n + e0, n, x, e0 * nrhs, nrhs, x, b0 * nrhs, nrhs, true, -1);
    for (let c0 = 0; c0 < nrhs; c0 += PANEL) {
      const pw = Math.min(PANEL, nrhs - c0);
      for (let i = e0 - 1; i >= b0; i--) {
        const m = e0 - i - 1;
        if (m > 0) gemmKernel(1, pw, m, t, i * n + i + 1, n, x, (i + 1) * nrhs + c0, nrhs, x, i * nrhs + c0, nrhs, true, -1);
        if (!unitDiagonal) scaleRow(x, i * nrhs + c0, pw, t[2 * (i * n + i)], t[2 * (i * n + i) + 1]);
      }
    }
  }
}

/**
 * Solves U L X = B in place, i.e. X ← U⁻¹(L⁻¹B), for lower-triangular L and
 * upper-triangular U (n×n, leading dimension n), X n×nrhs: the pair of
 * substitutions of a Cholesky or LU solve. With WebAssembly SIMD both sweeps
 * run on each column panel while it stays in cache; otherwise
 * {@link solveLowerInPlace} then {@link solveUpperInPlace}. B is read from
 * `src` when given (then X's entry values are ignored and `src` is not
 * written), which spares the caller a copy.
 */
export function solveLowerThenUpperInPlace(
  n: number, nrhs: number, l: Float64Array, lUnitDiagonal: boolean, u: Float64Array, uUnitDiagonal: boolean, x: Float64Array,
  src: Float64Array = x,
): void {
  if (nrhs >= SIMD_MIN_RHS && n >= SIMD_MIN_ORDER &&
    simdSolveTriangular(n, nrhs, [{ t: l, lower: true, unitDiagonal: lUnitDiagonal }, { t: u, lower: false, unitDiagonal: uUnitDiagonal }], x, src)) return;
  if (src !== x) x.set(src);
  solveLowerInPlace(n, nrhs, l, x, lUnitDiagonal);
  solveUpperInPlace(n, nrhs, u, x, uUnitDiagonal);
}

/** Conjugate transpose of an n×n interleaved matrix into a new buffer (in 16×16 tiles, so both sides stay in cache). */
export function adjointSquare(n: number, a: Float64Array): Float64Array {
  const out = new Float64Array(2 * n * n);
  for (let i0 = 0; i0 < n; i0 += 16) {
    const i1 = Math.min(n, i0 + 16);
    for (let j0 = 0; j0 < n; j0 += 16) {
      const j1 = Math.min(n, j0 + 16);
      for (let i = i0; i < i1; i++) {
        for (let j = j0; j < j1; j++) {
          const s = 2 * (i * n + j), d = 2 * (j * n + i);
          out[d] = a[s];
          out[d + 1] = -a[s + 1];
        }
      }
    }
  }
  return out;
}
