/**
 * Fast array-factor paths for uniform rectangular grids in the xy-plane:
 * separable evaluation on any (u, v) product grid, and a 2-D FFT onto the
 * natural u-v grid of the lattice.
 * @module
 */
import FFT from 'fft.js';
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { multiplyInto } from '../linalg/ops.js';
import { assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import { wavelengthM, wavenumberRadPerM } from '../units/convert.js';
import { assertGridSpec, type RectangularGridSpec } from '../geometry/builders.js';
import { assertColumn, assertFiniteCMatrix, assertFiniteArray } from '../internal/validate.js';

function assertGridWeights(grid: RectangularGridSpec, weights: CMatrix): void {
  assertGridSpec('grid', grid);
  assertColumn('weights', weights, grid.countX * grid.countY, 'one weight per grid element, index iy·countX + ix');
  assertFiniteCMatrix('weights', weights);
}

function finiteValues(name: string, x: ArrayLike<number>): void {
  if (!x || typeof x !== 'object' || x.length < 1) {
    throw new DomainError(`invalid argument "${name}": expected a non-empty list of direction cosines, received ${describeValue(x)}.`);
  }
  assertFiniteArray(name, x);
}

/**
 * Array factor of a uniform rectangular grid on the product of arbitrary u and
 * v values, by separable (two-stage) summation.
 *
 * @remarks
 * For the centred grid of {@link rectangularGridLayout} (z = 0),
 * AF(u, v) = Σ_iy e^{jk y_iy v} Σ_ix conj(w_iy,ix) e^{jk x_ix u}: two complex
 * matrix products costing Ny·Nx·Nu + Nv·Ny·Nu instead of Nx·Ny·Nu·Nv. Equal to
 * the direct sum {@link arrayFactor} to rounding. Since the grid is planar,
 * AF depends on (u, v) only, so points outside the visible region
 * (u² + v² > 1) are allowed (they describe the invisible, reactive spectrum).
 * @param grid - Counts and spacings of the grid.
 * @param weights - N×1 weights, N = countX·countY, index iy·countX + ix.
 * @param uValues - u values (dimensionless).
 * @param vValues - v values (dimensionless).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns AF as a vCount×uCount CMatrix (entry (iv, iu); the index order of {@link uvGrid}).
 * @throws {@link DimensionError} for weights of the wrong length; {@link DomainError} for non-finite values or a bad grid/frequency.
 * @category Pattern
 */
export function separableGridArrayFactor(
  grid: RectangularGridSpec, weights: CMatrix, uValues: ArrayLike<number>, vValues: ArrayLike<number>, frequencyHz: number,
): CMatrix {
  assertGridWeights(grid, weights);
  finiteValues('uValues', uValues);
  finiteValues('vValues', vValues);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const k = wavenumberRadPerM(frequencyHz);
  const { countX: nx, countY: ny, spacingXM: dx, spacingYM: dy } = grid;
  const nu = uValues.length, nv = vValues.length;
  // Ex: nx×nu, Ey: nv×ny, Wc: ny×nx (conjugated weights)
  const ex = { rows: nx, cols: nu, data: new Float64Array(2 * nx * nu) };
  for (let ix = 0; ix < nx; ix++) {
    const x = (ix - (nx - 1) / 2) * dx;
    for (let iu = 0; iu < nu; iu++) {
      const ph = k * x * uValues[iu];
      ex.data[2 * (ix * nu + iu)] = Math.cos(ph);
      ex.data[2 * (ix * nu + iu) + 1] = Math.sin(ph);
    }
  }
  const ey = { rows: nv, cols: ny, data: new Float64Array(2 * nv * ny) };
  for (let iv = 0; iv < nv; iv++) {
    for (let iy = 0; iy < ny; iy++) {
      const ph = k * (iy - (ny - 1) / 2) * dy * vValues[iv];
      ey.data[2 * (iv * ny + iy)] = Math.cos(ph);
      ey.data[2 * (iv * ny + iy) + 1] = Math.sin(ph);
    }
  }
  const wc = { rows: ny, cols: nx, data: new Float64Array(2 * nx * ny) };
  for (let n = 0; n < nx * ny; n++) {
    wc.data[2 * n] = weights.data[2 * n];
    wc.data[2 * n + 1] = -weights.data[2 * n + 1];
  }
  const t = multiplyInto({ rows: ny, cols: nu, data: new Float64Array(2 * ny * nu) }, wc, ex);
  return multiplyInto({ rows: nv, cols: nu, data: new Float64Array(2 * nv * nu) }, ey, t);
}

/**
 * Result of {@link fftGridArrayFactor}.
 * @category Pattern
 */
export interface FftGridArrayFactor {
  /** u values u_p = (p − P/2)·λ/(P·dx), p = 0…P−1 (ascending, covering [−λ/(2dx), λ/(2dx))). */
  readonly uValues: Float64Array;
  /** v values v_q = (q − Q/2)·λ/(Q·dy), q = 0…Q−1. */
  readonly vValues: Float64Array;
  /** AF as a Q×P CMatrix: entry (q, p) at (u_p, v_q) (the index order of {@link uvGrid}). */
  readonly values: CMatrix;
}

/** Cached fft.js plans by size. */
const plans = new Map<number, FFT>();
function plan(size: number): FFT {
  let p = plans.get(size);
  if (!p) { p = new FFT(size); plans.set(size, p); }
  return p;
}

/**
 * Array factor of a uniform rectangular grid on its natural u-v grid by a
 * zero-padded 2-D FFT (fft.js).
 *
 * @remarks
 * With x_ix = (ix − (Nx−1)/2)dx and u_p = (p − P/2)λ/(P dx), the phase
 * k x_ix u_p = 2π(ix − cx)(p − P/2)/P, so
 * AF(u_p, v_q) = e^{−j2π cx (p−P/2)/P} e^{−j2π cy (q−Q/2)/Q} · conj(G_qp),
 * G = 2-D DFT (forward, e^{−j}) of w_iy,ix·(−1)^{ix+iy} zero-padded to Q×P.
 * The (−1) factors centre the spectrum, the leading phases re-reference the
 * grid to its centre. The grid covers |u| < λ/(2dx): all of visible space for
 * dx ≤ λ/2; for wider spacings visible space wraps (grating lobes alias).
 * Equal to the direct sum to rounding (tested to 1e-10 relative). Cost
 * O(PQ log PQ). Column transforms are only taken for the Nx non-zero columns;
 * output rows are written contiguously.
 * @param grid - Counts and spacings of the grid.
 * @param weights - N×1 weights, index iy·countX + ix.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param sizeU - FFT length P along u, a power of two ≥ max(2, countX).
 * @param sizeV - FFT length Q along v, a power of two ≥ max(2, countY). @defaultValue sizeU
 * @returns The u and v values and AF on their product grid.
 * @throws {@link DomainError} for sizes that are not powers of two or are smaller than the grid; as {@link separableGridArrayFactor} otherwise.
 * @example
 * ```ts
 * // 32×32 grid at λ/2 onto a 256×256 grid covering u, v ∈ [−1, 1)
 * const w = columnVector(new Array(1024).fill(1)); // uniform weights
 * const r = fftGridArrayFactor({ countX: 32, countY: 32, spacingXM: 0.05, spacingYM: 0.05 }, w, 2.99792458e9, 256);
 * r.uValues.length; // 256
 * ```
 * @category Pattern
 */
export function fftGridArrayFactor(grid: RectangularGridSpec, weights: CMatrix, frequencyHz: number, sizeU: number, sizeV: number = sizeU): FftGridArrayFactor {
  assertGridWeights(grid, weights);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const { countX: nx, countY: ny, spacingXM: dx, spacingYM: dy } = grid;
  for (const [name, size, count] of [['sizeU', sizeU, nx], ['sizeV', sizeV, ny]] as const) {
    assertInteger(name, size, 2, 1 << 24);
    if ((size & (size - 1)) !== 0 || size < count) {
      throw new DomainError(`invalid argument "${name}": expected a power of two ≥ ${Math.max(2, count)} (the grid count along that axis), received ${size}.`);
    }
  }
  const lam = wavelengthM(frequencyHz);
  const P = sizeU, Q = sizeV;
  const uValues = new Float64Array(P), vValues = new Float64Array(Q);
  for (let p = 0; p < P; p++) uValues[p] = ((p - P / 2) * lam) / (P * dx);
  for (let q = 0; q < Q; q++) vValues[q] = ((q - Q / 2) * lam) / (Q * dy);
  const values = { rows: Q, cols: P, data: new Float64Array(2 * P * Q) };
  fftGridArrayFactorInto(values, grid, weights, P, Q);
  return { uValues, vValues, values };
}

/**
 * Allocation-light kernel of {@link fftGridArrayFactor}: writes the Q×P result
 * into `out` (work buffers are cached per size). Checks shapes only.
 * @param out - Destination, Q×P CMatrix (must not alias `weights`).
 * @param grid - Counts and spacings of the grid (only the counts are used: the u-v values scale with spacing and λ).
 * @param weights - N×1 weights, index iy·countX + ix.
 * @param sizeU - P, power of two ≥ countX.
 * @param sizeV - Q, power of two ≥ countY.
 * @returns `out`.
 * @throws {@link DimensionError} if `out` is not Q×P.
 * @category Pattern
 */
export function fftGridArrayFactorInto<T extends CMatrix>(out: T, grid: RectangularGridSpec, weights: CMatrix, sizeU: number, sizeV: number): T {
  const P = sizeU, Q = sizeV, nx = grid.countX, ny = grid.countY;
  if (out.rows !== Q || out.cols !== P || out.data.length !== 2 * P * Q) {
    throw new DimensionError(`invalid argument "out": expected ${Q}×${P}, received ${out.rows}×${out.cols}.`);
  }
  const fu = plan(P), fv = plan(Q);
  const w = workFor(P, Q, nx);
  const { rowIn, rowOut, rows: cols, colIn, colOut, phaseU, phaseV } = w;
  const cx = (nx - 1) / 2, cy = (ny - 1) / 2;
  // phase factors e^{−j2π c (p − P/2)/P}
  for (let p = 0; p < P; p++) { const a = (-2 * Math.PI * cx * (p - P / 2)) / P; phaseU[2 * p] = Math.cos(a); phaseU[2 * p + 1] = Math.sin(a); }
  for (let q = 0; q < Q; q++) { const a = (-2 * Math.PI * cy * (q - Q / 2)) / Q; phaseV[2 * q] = Math.cos(a); phaseV[2 * q + 1] = Math.sin(a); }
  // column transforms along y (the nx non-zero columns only)
  colIn.fill(0);
  for (let ix = 0; ix < nx; ix++) {
    for (let iy = 0; iy < ny; iy++) {
      const s = (ix + iy) & 1 ? -1 : 1, n = iy * nx + ix;
      colIn[2 * iy] = s * weights.data[2 * n];
      colIn[2 * iy + 1] = s * weights.data[2 * n + 1];
    }
    fv.transform(colOut, colIn);
    cols.set(colOut, 2 * Q * ix);
  }
  // row transforms along x, one output row at a time (contiguous writes):
  // conj(G)·φv·φu = conj(G·conj(φv))·φu, and G·conj(φv) is the transform of the row times conj(φv)
  rowIn.fill(0);
  const d = out.data;
  for (let q = 0; q < Q; q++) {
    const vr = phaseV[2 * q], vi = -phaseV[2 * q + 1];
    for (let ix = 0; ix < nx; ix++) {
      const xr = cols[2 * (Q * ix + q)], xi = cols[2 * (Q * ix + q) + 1];
      rowIn[2 * ix] = xr * vr - xi * vi;
      rowIn[2 * ix + 1] = xr * vi + xi * vr;
    }
    fu.transform(rowOut, rowIn);
    for (let p = 0, o = 2 * q * P; p < P; p++, o += 2) {
      const gr = rowOut[2 * p], gi = -rowOut[2 * p + 1], ur = phaseU[2 * p], ui = phaseU[2 * p + 1];
      d[o] = gr * ur - gi * ui;
      d[o + 1] = gr * ui + gi * ur;
    }
  }
  return out;
}

interface FftWork {
  rowIn: Float64Array; rowOut: Float64Array; rows: Float64Array; colIn: Float64Array; colOut: Float64Array;
  phaseU: Float64Array; phaseV: Float64Array;
}
let cachedWork: { key: string; work: FftWork } | undefined;
function workFor(P: number, Q: number, nx: number): FftWork {
  const key = `${P}x${Q}x${nx}`;
  if (cachedWork?.key !== key) {
    cachedWork = {
      key,
      work: {
        rowIn: new Float64Array(2 * P), rowOut: new Float64Array(2 * P), rows: new Float64Array(2 * Q * nx),
        colIn: new Float64Array(2 * Q), colOut: new Float64Array(2 * Q), phaseU: new Float64Array(2 * P), phaseV: new Float64Array(2 * Q),
      },
    };
  }
  return cachedWork.work;
}
