/**
 * The array layout type: element positions, optional orientations and an
 * optional enable mask (thinning).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { describeValue } from '../internal/validate.js';
import { wavelengthM } from '../units/convert.js';
import { assertLattice, type PlanarLattice } from './lattice.js';

/**
 * A point or direction in 3-D Cartesian coordinates `[x, y, z]`.
 * @category Geometry
 */
export type Vector3 = readonly [number, number, number];

/**
 * Element positions of an array, with optional orientations and enable mask.
 *
 * @remarks
 * Storage is xyz-interleaved: element n sits at
 * `(positionsM[3n], positionsM[3n + 1], positionsM[3n + 2])` in metres, in the
 * right-handed frame of docs/conventions.md (planar arrays in the xy-plane,
 * broadside +z). Positions are measured from the phase reference (the origin);
 * builders centre their lattices on the origin.
 *
 * `orientations`, when present, holds one unit vector per element, interleaved
 * the same way (for example the axis of a dipole); layouts themselves do not
 * use it, element models do. `enabled`, when present, holds 1 for an active
 * element and 0 for a removed one (thinning): array-factor routines treat a
 * disabled element as having weight 0, and {@link activeLayout} drops them.
 *
 * Build layouts with {@link arrayLayout} or the builders
 * ({@link uniformLineLayout}, {@link rectangularGridLayout},
 * {@link latticeLayout}, {@link triangularLatticeLayout}, {@link ringLayout});
 * they validate once so that kernels need not.
 * @category Geometry
 */
export interface ArrayLayout {
  /** Number of elements N, ≥ 1. */
  readonly count: number;
  /** Positions [m], length 3N, xyz-interleaved. */
  readonly positionsM: Float64Array;
  /** Optional unit orientation vectors (dimensionless), length 3N, xyz-interleaved. */
  readonly orientations?: Float64Array;
  /** Optional enable mask, length N: 1 = active, 0 = removed (thinned). */
  readonly enabled?: Uint8Array;
  /**
   * The planar lattice the positions lie on (every position is one lattice point plus a common
   * offset, in the plane z = 0), when the layout was built on one: {@link latticeLayout},
   * {@link triangularLatticeLayout} and {@link rectangularGridLayout} set it. Grating lobes,
   * scan-cone spacing and Floquet analysis take it directly (`gratingLobes(layout.lattice, …)`).
   */
  readonly lattice?: PlanarLattice;
}

/**
 * Options of {@link arrayLayout}.
 * @category Geometry
 */
export interface ArrayLayoutOptions {
  /** Unit orientation vectors, one per element (3N interleaved or N triples). @defaultValue none */
  orientations?: Float64Array | ReadonlyArray<Vector3>;
  /** Enable mask, one entry per element (true/1 active). @defaultValue all active */
  enabled?: ArrayLike<number | boolean>;
  /** The lattice the positions lie on (stated by the caller; see {@link ArrayLayout.lattice}). @defaultValue none */
  lattice?: PlanarLattice;
}

function flatten(name: string, v: Float64Array | ReadonlyArray<Vector3>): Float64Array {
  if (v instanceof Float64Array) return Float64Array.from(v);
  if (!Array.isArray(v)) {
    throw new DimensionError(`invalid argument "${name}": expected a Float64Array (xyz-interleaved) or an array of [x, y, z] triples, received ${describeValue(v)}.`);
  }
  const out = new Float64Array(3 * v.length);
  for (let n = 0; n < v.length; n++) {
    const p = v[n];
    if (!Array.isArray(p) || p.length !== 3) {
      throw new DimensionError(`invalid argument "${name}": entry ${n} must be an [x, y, z] triple, received ${describeValue(p)}.`);
    }
    out[3 * n] = p[0];
    out[3 * n + 1] = p[1];
    out[3 * n + 2] = p[2];
  }
  return out;
}

function checkCoordinates(name: string, v: Float64Array): void {
  for (let k = 0; k < v.length; k++) {
    if (!Number.isFinite(v[k])) {
      throw new DomainError(`invalid argument "${name}": coordinate ${'xyz'[k % 3]} of element ${Math.floor(k / 3)} is ${describeValue(v[k])}; every coordinate must be finite.`);
    }
  }
}

/**
 * Builds a validated layout from arbitrary element positions.
 *
 * @param positionsM - Positions [m]: a Float64Array of length 3N (xyz-interleaved) or N `[x, y, z]` triples. Copied.
 * @param options - Optional orientations and enable mask.
 * @returns A new layout owning copies of its data.
 * @throws {@link DimensionError} if there are no elements, the length is not a multiple of 3, or an option has the wrong length.
 * @throws {@link DomainError} if a coordinate is NaN/infinite or an orientation is not a unit vector (|v| − 1 > 1e-9).
 * @example
 * ```ts
 * arrayLayout([[0, 0, 0], [0.05, 0, 0]]).count; // 2
 * ```
 * @category Geometry
 */
export function arrayLayout(positionsM: Float64Array | ReadonlyArray<Vector3>, options: ArrayLayoutOptions = {}): ArrayLayout {
  const pos = flatten('positionsM', positionsM);
  if (pos.length === 0 || pos.length % 3 !== 0) {
    throw new DimensionError(`invalid argument "positionsM": expected 3N coordinates with N ≥ 1, received ${pos.length} coordinates; pass at least one [x, y, z] position.`);
  }
  checkCoordinates('positionsM', pos);
  const count = pos.length / 3;
  const layout: { count: number; positionsM: Float64Array; orientations?: Float64Array; enabled?: Uint8Array; lattice?: PlanarLattice } = { count, positionsM: pos };
  if (options.lattice !== undefined) layout.lattice = assertLattice('lattice', options.lattice);
  if (options.orientations !== undefined) {
    const o = flatten('orientations', options.orientations);
    if (o.length !== pos.length) {
      throw new DimensionError(`invalid argument "orientations": expected ${count} unit vectors (one per element), received ${o.length / 3}.`);
    }
    checkCoordinates('orientations', o);
    for (let n = 0; n < count; n++) {
      const len = Math.hypot(o[3 * n], o[3 * n + 1], o[3 * n + 2]);
      if (Math.abs(len - 1) > 1e-9) {
        throw new DomainError(`invalid argument "orientations": vector ${n} has length ${len}; orientations must be unit vectors (normalise them first).`);
      }
    }
    layout.orientations = o;
  }
  if (options.enabled !== undefined) layout.enabled = maskFrom(options.enabled, count);
  return layout;
}

function maskFrom(enabled: ArrayLike<number | boolean>, count: number): Uint8Array {
  if (enabled === null || typeof enabled !== 'object' || enabled.length !== count) {
    throw new DimensionError(`invalid argument "enabled": expected ${count} entries (one per element), received ${describeValue(enabled)}.`);
  }
  const m = new Uint8Array(count);
  for (let n = 0; n < count; n++) {
    const e = enabled[n];
    if (e === true || e === 1) m[n] = 1;
    else if (e === false || e === 0) m[n] = 0;
    else throw new DomainError(`invalid argument "enabled": entry ${n} is ${describeValue(e)}; use true/1 (active) or false/0 (removed).`);
  }
  return m;
}

/**
 * Returns a copy of a layout with a new enable mask (thinning).
 * @param layout - Source layout.
 * @param enabled - One entry per element: true/1 active, false/0 removed.
 * @returns A new layout sharing nothing with the source.
 * @throws {@link DimensionError} if the mask length differs from `layout.count`.
 * @category Geometry
 */
export function withEnabledMask(layout: ArrayLayout, enabled: ArrayLike<number | boolean>): ArrayLayout {
  assertLayout('layout', layout);
  return {
    count: layout.count,
    positionsM: Float64Array.from(layout.positionsM),
    ...(layout.orientations ? { orientations: Float64Array.from(layout.orientations) } : {}),
    enabled: maskFrom(enabled, layout.count),
  };
}

/**
 * The layout of the active elements only (drops elements whose mask is 0).
 * @param layout - Source layout.
 * @returns A new layout without an enable mask.
 * @throws {@link DimensionError} if every element is disabled.
 * @category Geometry
 */
export function activeLayout(layout: ArrayLayout): ArrayLayout {
  assertLayout('layout', layout);
  const keep: number[] = [];
  for (let n = 0; n < layout.count; n++) if (!layout.enabled || layout.enabled[n]) keep.push(n);
  if (keep.length === 0) throw new DimensionError('invalid argument "layout": every element is disabled; enable at least one element.');
  const pos = new Float64Array(3 * keep.length);
  const ori = layout.orientations ? new Float64Array(3 * keep.length) : undefined;
  keep.forEach((n, i) => {
    for (let c = 0; c < 3; c++) {
      pos[3 * i + c] = layout.positionsM[3 * n + c];
      if (ori) ori[3 * i + c] = layout.orientations![3 * n + c];
    }
  });
  return ori ? { count: keep.length, positionsM: pos, orientations: ori } : { count: keep.length, positionsM: pos };
}

/**
 * Number of active elements (those not removed by the enable mask).
 * @param layout - The layout.
 * @returns Count of active elements.
 * @category Geometry
 */
export function activeCount(layout: ArrayLayout): number {
  if (!layout.enabled) return layout.count;
  let c = 0;
  for (let n = 0; n < layout.count; n++) c += layout.enabled[n] ? 1 : 0;
  return c;
}

/**
 * Converts a length given in wavelengths at a stated frequency to metres,
 * ℓ = ℓ_λ · c0 / f. Use it to give builder spacings in wavelengths.
 * @param lengthWavelengths - Length in free-space wavelengths (dimensionless), finite.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns Length [m].
 * @throws {@link DomainError} for a non-finite length or non-positive frequency.
 * @example
 * ```ts
 * metresFromWavelengths(0.5, 1.5e9); // 0.0999308193 (half a wavelength at 1.5 GHz)
 * ```
 * @category Geometry
 */
export function metresFromWavelengths(lengthWavelengths: number, frequencyHz: number): number {
  if (typeof lengthWavelengths !== 'number' || !Number.isFinite(lengthWavelengths)) {
    throw new DomainError(`invalid argument "lengthWavelengths": expected a finite number, received ${describeValue(lengthWavelengths)}.`);
  }
  return lengthWavelengths * wavelengthM(frequencyHz);
}

/**
 * Converts a length in metres to free-space wavelengths at a stated frequency.
 * @param lengthM - Length [m], finite.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns Length in wavelengths (dimensionless).
 * @throws {@link DomainError} for a non-finite length or non-positive frequency.
 * @category Geometry
 */
export function wavelengthsFromMetres(lengthM: number, frequencyHz: number): number {
  if (typeof lengthM !== 'number' || !Number.isFinite(lengthM)) {
    throw new DomainError(`invalid argument "lengthM": expected a finite number, received ${describeValue(lengthM)}.`);
  }
  return lengthM / wavelengthM(frequencyHz);
}

/**
 * Centroid of the active element positions.
 * @param layout - The layout.
 * @returns Centroid [m].
 * @category Geometry
 */
export function layoutCentroid(layout: ArrayLayout): Vector3 {
  assertLayout('layout', layout);
  let x = 0, y = 0, z = 0, c = 0;
  const p = layout.positionsM;
  for (let n = 0; n < layout.count; n++) {
    if (layout.enabled && !layout.enabled[n]) continue;
    x += p[3 * n]; y += p[3 * n + 1]; z += p[3 * n + 2]; c++;
  }
  return c === 0 ? [0, 0, 0] : [x / c, y / c, z / c];
}

/**
 * An upper bound on the largest distance between two active elements:
 * twice the largest distance from their centroid (exact for symmetric layouts).
 * Used to size sphere quadratures ({@link sphereQuadratureOrder}).
 * @param layout - The layout.
 * @returns Diameter bound D [m], ≥ 0.
 * @category Geometry
 */
export function layoutDiameterM(layout: ArrayLayout): number {
  const [cx, cy, cz] = layoutCentroid(layout);
  const p = layout.positionsM;
  let r = 0;
  for (let n = 0; n < layout.count; n++) {
    if (layout.enabled && !layout.enabled[n]) continue;
    r = Math.max(r, Math.hypot(p[3 * n] - cx, p[3 * n + 1] - cy, p[3 * n + 2] - cz));
  }
  return 2 * r;
}

/**
 * Throws unless `layout` is a structurally valid {@link ArrayLayout}
 * (N ≥ 1, storage lengths consistent, finite positions).
 * @internal
 */
export function assertLayout(name: string, layout: ArrayLayout): void {
  if (
    layout === null || typeof layout !== 'object' || !(layout.positionsM instanceof Float64Array) ||
    !Number.isInteger(layout.count) || layout.count < 1 || layout.positionsM.length !== 3 * layout.count
  ) {
    throw new DimensionError(`invalid argument "${name}": expected an ArrayLayout with count ≥ 1 and positionsM of length 3·count, received ${describeValue(layout)}; build one with arrayLayout or a layout builder.`);
  }
  if (layout.enabled !== undefined && (!(layout.enabled instanceof Uint8Array) || layout.enabled.length !== layout.count)) {
    throw new DimensionError(`invalid argument "${name}": enabled mask must be a Uint8Array of length ${layout.count}, received ${describeValue(layout.enabled)}.`);
  }
  checkCoordinates(`${name}.positionsM`, layout.positionsM);
}
