/**
 * Dipole descriptions from a geometry-module array layout.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertPositive, describeValue } from '../internal/validate.js';
import type { ArrayLayout, Vector3 } from '../geometry/layout.js';
import { unitAxis, type WireDipole } from './types.js';

/**
 * Options of {@link dipolesFromLayout}.
 * @category Elements
 */
export interface DipolesFromLayoutOptions {
  /** Dipole length l [m], > 0. */
  lengthM: number;
  /** Wire radius a [m], > 0. */
  radiusM: number;
  /** Axis used when the layout has no orientations. @defaultValue [1, 0, 0] (horizontal, for planar arrays in the xy-plane) */
  axis?: Vector3;
  /** Height added to every z coordinate [m] (e.g. above a ground plane at z = 0). @defaultValue 0 */
  heightM?: number;
}

/**
 * One thin-wire dipole per element of a layout: centre at the element
 * position (plus `heightM` in z), axis from the layout's orientations when
 * present, else `options.axis`.
 *
 * @remarks
 * Every element is converted, including disabled (thinned) ones, so that port
 * n is element n; pass `activeLayout(layout)` to drop them first.
 *
 * @param layout - The array layout (positions [m]).
 * @param options - Length, radius, default axis and height.
 * @returns The dipoles, in layout order.
 * @throws {@link DomainError} for a bad length, radius, axis or height.
 * @category Elements
 */
export function dipolesFromLayout(layout: ArrayLayout, options: DipolesFromLayoutOptions): WireDipole[] {
  if (layout === null || typeof layout !== 'object' || !(layout.positionsM instanceof Float64Array) || layout.positionsM.length !== 3 * layout.count) {
    throw new DomainError(`invalid argument "layout": expected an ArrayLayout {count, positionsM}, received ${describeValue(layout)}; build one with arrayLayout or a layout builder.`);
  }
  if (options === null || typeof options !== 'object') {
    throw new DomainError(`invalid argument "options": expected {lengthM, radiusM, axis?, heightM?}, received ${describeValue(options)}.`);
  }
  assertPositive('options.lengthM', options.lengthM, 'm');
  assertPositive('options.radiusM', options.radiusM, 'm');
  const axis = unitAxis('options.axis', options.axis ?? [1, 0, 0]);
  const h = options.heightM ?? 0;
  if (!Number.isFinite(h)) throw new DomainError(`invalid argument "options.heightM": expected a finite number [m], received ${describeValue(h)}.`);
  const p = layout.positionsM, o = layout.orientations;
  const out: WireDipole[] = [];
  for (let n = 0; n < layout.count; n++) {
    const a: Vector3 = o ? [o[3 * n], o[3 * n + 1], o[3 * n + 2]] : axis;
    out.push({ centerM: [p[3 * n], p[3 * n + 1], p[3 * n + 2] + h], axis: a, lengthM: options.lengthM, radiusM: options.radiusM });
  }
  return out;
}
