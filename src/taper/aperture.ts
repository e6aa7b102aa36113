/**
 * Continuous aperture distributions and their sampling at element positions.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertFinite, assertFiniteArray, assertPositive, describeValue } from '../internal/validate.js';
import { assertLayout, type ArrayLayout } from '../geometry/layout.js';
import { assertElementCount, cellCentre, normalizeTaper, type TaperOptions } from './normalize.js';

/**
 * A continuous line-source distribution g(p) over the normalised coordinate
 * p = x / L ∈ [−½, ½] (L the aperture length). Real-valued, dimensionless.
 * @category Tapers
 */
export type LineDistribution = (p: number) => number;

/**
 * A continuous circularly symmetric aperture distribution g(ρ) over the
 * normalised radius ρ = r / a ∈ [0, 1] (a the aperture radius). Real-valued, dimensionless.
 * @category Tapers
 */
export type RadialDistribution = (rho: number) => number;

/**
 * Options of {@link sampleLineDistribution}.
 * @category Tapers
 */
export interface LineSampleOptions extends TaperOptions {
  /**
   * Position of the aperture centre along the line [m].
   * @defaultValue 0
   */
  centreM?: number;
}

/**
 * Options of {@link sampleRadialDistribution}.
 * @category Tapers
 */
export interface RadialSampleOptions extends TaperOptions {
  /**
   * x of the aperture centre [m].
   * @defaultValue 0
   */
  centreXM?: number;
  /**
   * y of the aperture centre [m].
   * @defaultValue 0
   */
  centreYM?: number;
}

/** Relative slack for elements placed exactly on the aperture rim. */
const RIM_SLACK = 1e-9;

function checkSample(name: string, value: number, index: number): number {
  if (!Number.isFinite(value)) {
    throw new DomainError(`invalid argument "${name}": the distribution returned ${describeValue(value)} at element ${index}; it must return a finite number for every position inside the aperture.`);
  }
  return value;
}

/**
 * Samples a continuous line-source distribution at arbitrary element positions.
 *
 * @remarks
 * wₙ = g((xₙ − x_c) / L). Elements must lie inside the aperture, |xₙ − x_c| ≤ L/2.
 * For N equally spaced elements at spacing d the usual choice is L = N·d, so that
 * each element sits at the centre of its own cell (the element tapers of this
 * module use exactly that sampling).
 *
 * @param distribution - g(p), p ∈ [−½, ½] [dimensionless].
 * @param positionsM - Element positions along the line [m].
 * @param apertureLengthM - Aperture length L [m], > 0.
 * @param options - Aperture centre and normalisation.
 * @returns Real weights, one per element, normalised as requested [dimensionless].
 * @throws {@link DomainError} if a position is outside the aperture or not finite, L ≤ 0,
 *   or the distribution returns a non-finite value.
 * @throws {@link DimensionError} if `positionsM` is empty.
 * @example
 * ```ts
 * sampleLineDistribution((p) => Math.cos(Math.PI * p), Float64Array.of(-0.25, 0, 0.25), 1); // [0.707…, 1, 0.707…]
 * ```
 * @category Tapers
 */
export function sampleLineDistribution(
  distribution: LineDistribution,
  positionsM: ArrayLike<number>,
  apertureLengthM: number,
  options: LineSampleOptions = {},
): Float64Array {
  if (typeof distribution !== 'function') {
    throw new DomainError(`invalid argument "distribution": expected a function of the normalised position p ∈ [−½, ½], received ${describeValue(distribution)}.`);
  }
  assertFiniteArray('positionsM', positionsM);
  if (positionsM.length < 1) throw new DimensionError(`invalid argument "positionsM": expected at least one element position, received an empty array.`);
  assertPositive('apertureLengthM', apertureLengthM, 'm');
  const centre = options.centreM ?? 0;
  assertFinite('options.centreM', centre);
  const w = new Float64Array(positionsM.length);
  for (let i = 0; i < w.length; i++) {
    const p = (positionsM[i] - centre) / apertureLengthM;
    if (Math.abs(p) > 0.5 * (1 + RIM_SLACK)) {
      throw new DomainError(`invalid argument "positionsM": element ${i} at ${positionsM[i]} m lies outside the aperture of length ${apertureLengthM} m centred at ${centre} m; enlarge "apertureLengthM" or move the centre.`);
    }
    w[i] = checkSample('distribution', distribution(Math.max(-0.5, Math.min(0.5, p))), i);
  }
  return normalizeTaper(w, options.normalization);
}

/**
 * A continuous planar aperture distribution g(x, y) of positions in the aperture plane [m].
 * Real-valued, dimensionless.
 * @category Tapers
 */
export type PlanarDistribution = (xM: number, yM: number) => number;

/**
 * Samples a continuous circularly symmetric distribution at the elements of any planar layout.
 *
 * @remarks
 * wₙ = g(√((xₙ − x_c)² + (yₙ − y_c)²) / a), using the element positions projected onto the
 * xy-plane (the aperture plane of planar arrays, docs/conventions.md). Every element must lie
 * inside the circle of radius a. For a filled lattice take the area-equivalent radius
 * a = √(N·A_cell/π) (N cells of area A_cell; common practice): it matches the physical
 * extent of the array, whereas a larger a leaves the edge under-tapered (a 10λ circular
 * Taylor array designed for −35 dB reaches −33 dB with a = outermost radius + λ/4).
 * Disabled elements (layout mask) get weight 0.
 *
 * @param distribution - g(ρ), ρ ∈ [0, 1] [dimensionless].
 * @param layout - Element positions (geometry module).
 * @param radiusM - Aperture radius a [m], > 0.
 * @param options - Aperture centre and normalisation.
 * @returns Real weights, one per element [dimensionless].
 * @throws {@link DimensionError} if `layout` is malformed.
 * @throws {@link DomainError} if an element lies outside the circle, a ≤ 0, or a value is not finite.
 * @category Tapers
 */
export function sampleRadialDistribution(
  distribution: RadialDistribution,
  layout: ArrayLayout,
  radiusM: number,
  options: RadialSampleOptions = {},
): Float64Array {
  if (typeof distribution !== 'function') {
    throw new DomainError(`invalid argument "distribution": expected a function of the normalised radius ρ ∈ [0, 1], received ${describeValue(distribution)}.`);
  }
  assertLayout('layout', layout);
  assertPositive('radiusM', radiusM, 'm');
  const cx = options.centreXM ?? 0;
  const cy = options.centreYM ?? 0;
  assertFinite('options.centreXM', cx);
  assertFinite('options.centreYM', cy);
  const p = layout.positionsM;
  const w = new Float64Array(layout.count);
  for (let i = 0; i < w.length; i++) {
    const rho = Math.hypot(p[3 * i] - cx, p[3 * i + 1] - cy) / radiusM;
    if (rho > 1 + RIM_SLACK) {
      throw new DomainError(`invalid argument "layout": element ${i} at (${p[3 * i]}, ${p[3 * i + 1]}) m lies ${rho.toFixed(4)} radii from the centre, outside the aperture of radius ${radiusM} m; enlarge "radiusM".`);
    }
    w[i] = layout.enabled && !layout.enabled[i] ? 0 : checkSample('distribution', distribution(Math.min(1, rho)), i);
  }
  return normalizeTaper(w, options.normalization);
}

/**
 * Samples any continuous planar distribution g(x, y) at the elements of a layout.
 *
 * @remarks
 * wₙ = g(xₙ, yₙ) with the positions projected onto the xy-plane. Disabled elements get 0.
 *
 * @param distribution - g(x, y), x and y in [m] [dimensionless].
 * @param layout - Element positions (geometry module).
 * @param options - Normalisation (default peak = 1).
 * @returns Real weights, one per element [dimensionless].
 * @throws {@link DimensionError} if `layout` is malformed.
 * @throws {@link DomainError} if the distribution returns a non-finite value or only zeros.
 * @example
 * ```ts
 * const layout = rectangularGridLayout({ countX: 2, countY: 1, spacingXM: 0.2, spacingYM: 0.2 }); // x = ±0.1 m
 * samplePlanarDistribution((x, y) => Math.exp(-(x * x + y * y) / 0.1), layout); // Float64Array [1, 1] (peak-normalised)
 * ```
 * @category Tapers
 */
export function samplePlanarDistribution(distribution: PlanarDistribution, layout: ArrayLayout, options: TaperOptions = {}): Float64Array {
  if (typeof distribution !== 'function') {
    throw new DomainError(`invalid argument "distribution": expected a function of (xM, yM), received ${describeValue(distribution)}.`);
  }
  assertLayout('layout', layout);
  const p = layout.positionsM;
  const w = new Float64Array(layout.count);
  for (let i = 0; i < w.length; i++) {
    w[i] = layout.enabled && !layout.enabled[i] ? 0 : checkSample('distribution', distribution(p[3 * i], p[3 * i + 1]), i);
  }
  return normalizeTaper(w, options.normalization);
}

/**
 * Samples a line distribution at the cell centres of an N-element uniform line. @internal
 */
export function sampleUniformLine(distribution: LineDistribution, count: number, options: TaperOptions = {}): Float64Array {
  assertElementCount('elementCount', count);
  const w = new Float64Array(count);
  for (let n = 0; n < count; n++) w[n] = distribution(cellCentre(n, count));
  return normalizeTaper(w, options.normalization);
}
