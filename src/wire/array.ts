/**
 * Arrays of wire elements: one element template placed at every position of
 * a geometry-module layout, rotated by the layout's orientations.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, describeValue } from '../internal/validate.js';
import { assertLayout, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { unitAxis } from '../element/types.js';
import type { WireStructure } from './types.js';

/**
 * One wire element template placed N times (the input of the solver for
 * arrays; identical placements share matrix blocks).
 *
 * @remarks
 * Element n is the template rotated by `rotations[9n … 9n+8]` (row-major 3×3,
 * proper rotation, acting on template coordinates) and then translated by
 * `positionsM[3n … 3n+2]`. Ports are numbered element by element: port
 * n·P + p is port p of element n (P ports per element).
 * @category Wire
 */
export interface WireElementArray {
  /** The element template in its own coordinates [m]. */
  readonly element: WireStructure;
  /** Number of elements N ≥ 1. */
  readonly count: number;
  /** Element positions [m], xyz-interleaved, length 3N. */
  readonly positionsM: Float64Array;
  /** Rotation of each element, row-major 3×3 per element, length 9N. */
  readonly rotations: Float64Array;
}

/**
 * Options of {@link placeWireElement}.
 * @category Wire
 */
export interface PlaceWireElementOptions {
  /** Template direction that the layout's orientation vectors point to. @defaultValue [1, 0, 0] */
  referenceAxis?: Vector3;
  /** Height added to every position's z [m] (e.g. above a ground plane at z = 0). @defaultValue 0 */
  heightM?: number;
}

/** Rotation (row-major) taking unit vector a onto unit vector b: Rodrigues' formula, the half-turn about z (or x) when b = −a. */
function rotationBetween(a: readonly number[], b: readonly number[]): Float64Array {
  const c = a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
  const vx = a[1] * b[2] - a[2] * b[1], vy = a[2] * b[0] - a[0] * b[2], vz = a[0] * b[1] - a[1] * b[0];
  if (c < -1 + 1e-12) {
    // half-turn about an axis perpendicular to a (z if possible)
    const ax = Math.abs(a[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
    const d = ax[0] * a[0] + ax[1] * a[1] + ax[2] * a[2];
    let nx = ax[0] - d * a[0], ny = ax[1] - d * a[1], nz = ax[2] - d * a[2];
    const l = Math.hypot(nx, ny, nz); nx /= l; ny /= l; nz /= l;
    return Float64Array.of(2 * nx * nx - 1, 2 * nx * ny, 2 * nx * nz, 2 * ny * nx, 2 * ny * ny - 1, 2 * ny * nz, 2 * nz * nx, 2 * nz * ny, 2 * nz * nz - 1);
  }
  const f = 1 / (1 + c);
  return Float64Array.of(
    c + f * vx * vx, f * vx * vy - vz, f * vx * vz + vy,
    f * vy * vx + vz, c + f * vy * vy, f * vy * vz - vx,
    f * vz * vx - vy, f * vz * vy + vx, c + f * vz * vz,
  );
}

/**
 * Places one wire element at every position of a layout.
 *
 * @remarks
 * Without layout orientations every element keeps the template's
 * orientation; with them, element n is turned by the smallest rotation that
 * takes `referenceAxis` onto orientation n (Rodrigues' rotation formula; a
 * half-turn when they are opposite). Disabled (thinned) elements are placed
 * too, so that element n is layout element n; pass `activeLayout(layout)` to
 * drop them. The template is validated when solved.
 * @param element - The element template [m].
 * @param layout - Positions [m] and optional orientations (geometry module).
 * @param options - Reference axis and height.
 * @returns The placed array.
 * @throws {@link DomainError} for an invalid layout, axis or height.
 * @example
 * ```ts
 * const dipole = { wires: [{ pointsM: [[-0.07, 0, 0], [0.07, 0, 0]], radiusM: 1e-3 }], ports: [{ wire: 0 }] };
 * placeWireElement(dipole, rectangularGridLayout({ countX: 4, countY: 4, spacingXM: 0.15, spacingYM: 0.15 })).count; // 16
 * ```
 * @category Wire
 */
export function placeWireElement(element: WireStructure, layout: ArrayLayout, options: PlaceWireElementOptions = {}): WireElementArray {
  assertLayout('layout', layout);
  if (element === null || typeof element !== 'object') {
    throw new DomainError(`invalid argument "element": expected a WireStructure {wires, ports, loads?}, received ${describeValue(element)}.`);
  }
  if (options === null || typeof options !== 'object') throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(options)}.`);
  const ref = unitAxis('options.referenceAxis', options.referenceAxis ?? [1, 0, 0]);
  const h = options.heightM ?? 0;
  assertFinite('options.heightM', h);
  const n = layout.count;
  const positionsM = Float64Array.from(layout.positionsM);
  for (let i = 0; i < n; i++) positionsM[3 * i + 2] += h;
  const rotations = new Float64Array(9 * n);
  for (let i = 0; i < n; i++) {
    const o = layout.orientations;
    rotations.set(o ? rotationBetween(ref, [o[3 * i], o[3 * i + 1], o[3 * i + 2]]) : Float64Array.of(1, 0, 0, 0, 1, 0, 0, 0, 1), 9 * i);
  }
  return { element, count: n, positionsM, rotations };
}
