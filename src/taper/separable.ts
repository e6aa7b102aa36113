/**
 * Separable planar tapers.
 * @module
 */
import { DimensionError } from '../errors.js';
import { assertFiniteArray } from '../internal/validate.js';
import { normalizeTaper, type TaperOptions } from './normalize.js';

/**
 * Separable planar taper w(ix, iy) = wx(ix)·wy(iy) for a rectangular grid.
 *
 * @remarks
 * Element (ix, iy) has index n = iy·Nx + ix (x fastest), the order of the geometry module's
 * rectangular grids. The pattern of a separable taper on a rectangular grid is the product of
 * the two line patterns in (u, v), so each principal cut keeps its line design.
 *
 * References:
 * - R. J. Mailloux, *Phased Array Antenna Handbook*, 2nd ed., Artech House, 2005, §3.2 (from memory).
 *
 * @param weightsX - Line taper along x, Nx real weights [dimensionless].
 * @param weightsY - Line taper along y, Ny real weights [dimensionless].
 * @param options - Normalisation of the product (default peak = 1).
 * @returns Nx·Ny real weights, x fastest [dimensionless].
 * @throws {@link DimensionError} if either taper is empty.
 * @throws {@link DomainError} if a weight is not finite or all products are zero.
 * @example
 * ```ts
 * separableTaper(taylorTaper(16, 30, 5).weights, dolphChebyshevTaper(8, 25)).length; // 128
 * ```
 * @category Tapers
 */
export function separableTaper(weightsX: Float64Array, weightsY: Float64Array, options: TaperOptions = {}): Float64Array {
  assertFiniteArray('weightsX', weightsX);
  assertFiniteArray('weightsY', weightsY);
  if (weightsX.length < 1 || weightsY.length < 1) {
    throw new DimensionError(`invalid arguments "weightsX", "weightsY": expected two non-empty line tapers, received lengths ${weightsX.length} and ${weightsY.length}.`);
  }
  const nx = weightsX.length;
  const w = new Float64Array(nx * weightsY.length);
  for (let iy = 0; iy < weightsY.length; iy++) {
    for (let ix = 0; ix < nx; ix++) w[iy * nx + ix] = weightsX[ix] * weightsY[iy];
  }
  return normalizeTaper(w, options.normalization);
}
