/**
 * Layout builders: uniform lines, rectangular grids, triangular and skewed
 * lattices clipped to a boundary, concentric rings.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertInteger, assertPositive, assertFinite, describeValue } from '../internal/validate.js';
import type { ArrayLayout, Vector3 } from './layout.js';
import { planarLattice, rectangularLattice } from './lattice.js';

/**
 * The axis of a line array: a coordinate axis name or any unit vector.
 * @category Geometry
 */
export type LineAxis = 'x' | 'y' | 'z' | Vector3;

/**
 * Options of {@link uniformLineLayout}.
 * @category Geometry
 */
export interface UniformLineOptions {
  /** Direction of the line. @defaultValue 'x' */
  axis?: LineAxis;
  /** Centre the line on the origin; otherwise element 0 sits at the origin. @defaultValue true */
  centred?: boolean;
}

function axisVector(axis: LineAxis): Vector3 {
  if (axis === 'x') return [1, 0, 0];
  if (axis === 'y') return [0, 1, 0];
  if (axis === 'z') return [0, 0, 1];
  if (!Array.isArray(axis) || axis.length !== 3 || !axis.every((c) => Number.isFinite(c)) ||
    Math.abs(Math.hypot(axis[0], axis[1], axis[2]) - 1) > 1e-9) {
    throw new DomainError(`invalid argument "axis": expected 'x', 'y', 'z' or a finite unit vector [x, y, z], received ${describeValue(axis)}; normalise the vector.`);
  }
  return axis;
}

/**
 * A uniform line of N elements with spacing d: rₙ = (n − c)·d·â, n = 0…N−1,
 * c = (N−1)/2 when centred (default) or 0.
 *
 * @param count - Number of elements N, integer ≥ 1.
 * @param spacingM - Element spacing d [m], > 0 (use {@link metresFromWavelengths} for d in wavelengths).
 * @param options - Axis and centring.
 * @returns The layout, element order along +â.
 * @throws {@link DomainError} for a bad count, spacing or axis.
 * @example
 * ```ts
 * uniformLineLayout(3, 0.1).positionsM; // [-0.1,0,0, 0,0,0, 0.1,0,0]
 * ```
 * @category Geometry
 */
export function uniformLineLayout(count: number, spacingM: number, options: UniformLineOptions = {}): ArrayLayout {
  assertInteger('count', count, 1);
  assertPositive('spacingM', spacingM, 'm');
  const a = axisVector(options.axis ?? 'x');
  const c = options.centred === false ? 0 : (count - 1) / 2;
  const pos = new Float64Array(3 * count);
  for (let n = 0; n < count; n++) {
    const s = (n - c) * spacingM;
    pos[3 * n] = s * a[0] + 0; // + 0 turns −0 into +0
    pos[3 * n + 1] = s * a[1] + 0;
    pos[3 * n + 2] = s * a[2] + 0;
  }
  return { count, positionsM: pos };
}

/**
 * A uniform rectangular grid in the xy-plane, as used by the fast pattern paths.
 *
 * @remarks
 * Element (ix, iy) has index n = iy·countX + ix (x fastest) and sits at
 * x = (ix − (countX−1)/2)·spacingXM, y = (iy − (countY−1)/2)·spacingYM, z = 0.
 * @category Geometry
 */
export interface RectangularGridSpec {
  /** Number of columns (along x), integer ≥ 1. */
  readonly countX: number;
  /** Number of rows (along y), integer ≥ 1. */
  readonly countY: number;
  /** Column spacing [m], > 0. */
  readonly spacingXM: number;
  /** Row spacing [m], > 0. */
  readonly spacingYM: number;
}

/** @internal Validates a grid spec. */
export function assertGridSpec(name: string, g: RectangularGridSpec): void {
  if (g === null || typeof g !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected {countX, countY, spacingXM, spacingYM}, received ${describeValue(g)}.`);
  }
  assertInteger(`${name}.countX`, g.countX, 1);
  assertInteger(`${name}.countY`, g.countY, 1);
  assertPositive(`${name}.spacingXM`, g.spacingXM, 'm');
  assertPositive(`${name}.spacingYM`, g.spacingYM, 'm');
}

/**
 * A centred uniform rectangular grid in the xy-plane (see {@link RectangularGridSpec} for order).
 * @param grid - Counts and spacings.
 * @returns The layout, N = countX·countY.
 * @throws {@link DomainError} for bad counts or spacings.
 * @example
 * ```ts
 * rectangularGridLayout({ countX: 4, countY: 2, spacingXM: 0.1, spacingYM: 0.1 }).count; // 8
 * ```
 * @category Geometry
 */
export function rectangularGridLayout(grid: RectangularGridSpec): ArrayLayout {
  assertGridSpec('grid', grid);
  const { countX, countY, spacingXM, spacingYM } = grid;
  const count = countX * countY;
  const pos = new Float64Array(3 * count);
  const cx = (countX - 1) / 2, cy = (countY - 1) / 2;
  for (let iy = 0; iy < countY; iy++) {
    for (let ix = 0; ix < countX; ix++) {
      const n = iy * countX + ix;
      pos[3 * n] = (ix - cx) * spacingXM;
      pos[3 * n + 1] = (iy - cy) * spacingYM;
    }
  }
  return { count, positionsM: pos, lattice: rectangularLattice(spacingXM, spacingYM) };
}

/**
 * A planar boundary (centred on the origin, in the xy-plane) that clips a lattice.
 *
 * @remarks
 * - `rectangle`: |x| ≤ widthM/2 and |y| ≤ heightM/2.
 * - `circle`: x² + y² ≤ radiusM².
 * - `hexagon`: regular hexagon of circumradius `circumradiusM`, a vertex on the
 *   +x axis rotated by `rotationRad` (counter-clockwise).
 *
 * Points on the boundary (to 1e-9 relative) are kept.
 * @category Geometry
 */
export type LatticeBoundary = RectangleBoundary | CircleBoundary | HexagonBoundary;

/**
 * A centred rectangle |x| ≤ widthM/2, |y| ≤ heightM/2.
 * @category Geometry
 */
export interface RectangleBoundary {
  /** Discriminant. */
  readonly kind: 'rectangle';
  /** Full width along x [m], > 0. */
  readonly widthM: number;
  /** Full height along y [m], > 0. */
  readonly heightM: number;
}

/**
 * A centred circle x² + y² ≤ radiusM².
 * @category Geometry
 */
export interface CircleBoundary {
  /** Discriminant. */
  readonly kind: 'circle';
  /** Radius [m], > 0. */
  readonly radiusM: number;
}

/**
 * A centred regular hexagon.
 * @category Geometry
 */
export interface HexagonBoundary {
  /** Discriminant. */
  readonly kind: 'hexagon';
  /** Centre-to-vertex distance [m], > 0. */
  readonly circumradiusM: number;
  /** Rotation of the first vertex from +x toward +y [rad]. @defaultValue 0 */
  readonly rotationRad?: number;
}

function boundaryTest(b: LatticeBoundary): { radius: number; inside: (x: number, y: number) => boolean } {
  if (b === null || typeof b !== 'object') {
    throw new DomainError(`invalid argument "boundary": expected {kind: 'rectangle' | 'circle' | 'hexagon', …}, received ${describeValue(b)}.`);
  }
  if (b.kind === 'rectangle') {
    assertPositive('boundary.widthM', b.widthM, 'm');
    assertPositive('boundary.heightM', b.heightM, 'm');
    const hx = (b.widthM / 2) * (1 + 1e-9), hy = (b.heightM / 2) * (1 + 1e-9);
    return { radius: Math.hypot(hx, hy), inside: (x, y) => Math.abs(x) <= hx && Math.abs(y) <= hy };
  }
  if (b.kind === 'circle') {
    assertPositive('boundary.radiusM', b.radiusM, 'm');
    const r = b.radiusM * (1 + 1e-9);
    return { radius: r, inside: (x, y) => x * x + y * y <= r * r };
  }
  if (b.kind === 'hexagon') {
    assertPositive('boundary.circumradiusM', b.circumradiusM, 'm');
    const rot = b.rotationRad ?? 0;
    assertFinite('boundary.rotationRad', rot);
    const apothem = ((b.circumradiusM * Math.sqrt(3)) / 2) * (1 + 1e-9);
    // Edge normals of a hexagon with a vertex at angle rot point at rot + 30° + 60°·i.
    const nx: number[] = [], ny: number[] = [];
    for (let i = 0; i < 6; i++) {
      const a = rot + Math.PI / 6 + (i * Math.PI) / 3;
      nx.push(Math.cos(a)); ny.push(Math.sin(a));
    }
    return {
      radius: b.circumradiusM * (1 + 1e-9),
      inside: (x, y) => {
        for (let i = 0; i < 6; i++) if (x * nx[i] + y * ny[i] > apothem) return false;
        return true;
      },
    };
  }
  throw new DomainError(`invalid argument "boundary.kind": expected 'rectangle', 'circle' or 'hexagon', received ${describeValue((b as { kind: unknown }).kind)}.`);
}

/**
 * Options of {@link latticeLayout} and {@link triangularLatticeLayout}.
 * @category Geometry
 */
export interface LatticeOptions {
  /** Shift of the lattice relative to the origin [m], e.g. half a cell to centre an even grid. @defaultValue [0, 0] */
  offsetM?: readonly [number, number];
}

/**
 * A general (skewed) planar lattice rₘₙ = offset + m·a₁ + n·a₂ in the xy-plane,
 * clipped to a boundary.
 *
 * @remarks
 * Any 2-D lattice is described by two basis vectors: a rectangular grid by
 * a₁ = (dx, 0), a₂ = (0, dy); a triangular grid with row spacing dy and
 * alternate rows offset by dx/2 by a₁ = (dx, 0), a₂ = (dx/2, dy). Elements are
 * ordered by rows (increasing y, then increasing x).
 * @param basis1M - First lattice vector a₁ [m], (x, y).
 * @param basis2M - Second lattice vector a₂ [m], (x, y), not parallel to a₁.
 * @param boundary - The clipping boundary.
 * @param options - Lattice offset.
 * @returns The clipped layout.
 * @throws {@link DomainError} for parallel or non-finite basis vectors, a bad boundary, or a boundary that holds no lattice point.
 * @category Geometry
 */
export function latticeLayout(
  basis1M: readonly [number, number],
  basis2M: readonly [number, number],
  boundary: LatticeBoundary,
  options: LatticeOptions = {},
): ArrayLayout {
  for (const [name, v] of [['basis1M', basis1M], ['basis2M', basis2M], ['offsetM', options.offsetM ?? [0, 0]]] as const) {
    if (!Array.isArray(v) || v.length !== 2 || !Number.isFinite(v[0]) || !Number.isFinite(v[1])) {
      throw new DomainError(`invalid argument "${name}": expected a finite [x, y] pair in metres, received ${describeValue(v)}.`);
    }
  }
  const [ax, ay] = basis1M, [bx, by] = basis2M;
  const [ox, oy] = options.offsetM ?? [0, 0];
  const det = ax * by - ay * bx;
  if (!(Math.abs(det) > 1e-12 * Math.hypot(ax, ay) * Math.hypot(bx, by))) {
    throw new DomainError(`invalid arguments "basis1M", "basis2M": the lattice vectors are parallel (cross product ${det}); give two independent vectors.`);
  }
  const { radius, inside } = boundaryTest(boundary);
  const r = radius + Math.hypot(ox, oy);
  const mMax = Math.ceil((r * Math.hypot(bx, by)) / Math.abs(det)) + 1;
  const nMax = Math.ceil((r * Math.hypot(ax, ay)) / Math.abs(det)) + 1;
  const pts: Array<[number, number]> = [];
  for (let n = -nMax; n <= nMax; n++) {
    for (let m = -mMax; m <= mMax; m++) {
      const x = ox + m * ax + n * bx, y = oy + m * ay + n * by;
      if (inside(x, y)) pts.push([x, y]);
    }
  }
  if (pts.length === 0) {
    throw new DomainError('invalid argument "boundary": no lattice point falls inside it; enlarge the boundary or shrink the lattice.');
  }
  const tol = 1e-9 * Math.max(Math.abs(det), 1e-300) ** 0.5;
  pts.sort((p, q) => (Math.abs(p[1] - q[1]) > tol ? p[1] - q[1] : p[0] - q[0]));
  const pos = new Float64Array(3 * pts.length);
  pts.forEach(([x, y], i) => { pos[3 * i] = x; pos[3 * i + 1] = y; });
  return { count: pts.length, positionsM: pos, lattice: planarLattice(basis1M, basis2M) };
}

/**
 * A triangular lattice clipped to a boundary: rows along x with column spacing
 * dx, row spacing dy, alternate rows offset by dx/2 (a₁ = (dx, 0), a₂ = (dx/2, dy)).
 * With the default dy = dx·√3/2 the lattice is equilateral (six neighbours at distance dx).
 * @param spacingXM - Column spacing dx [m], > 0.
 * @param boundary - The clipping boundary.
 * @param spacingYM - Row spacing dy [m], > 0. @defaultValue dx·√3/2 (equilateral)
 * @param options - Lattice offset.
 * @returns The clipped layout, ordered by rows.
 * @throws {@link DomainError} for bad spacings or boundary.
 * @example
 * ```ts
 * triangularLatticeLayout(0.1, { kind: 'hexagon', circumradiusM: 0.1 }).count; // 7 (centre and six neighbours)
 * ```
 * @category Geometry
 */
export function triangularLatticeLayout(spacingXM: number, boundary: LatticeBoundary, spacingYM?: number, options: LatticeOptions = {}): ArrayLayout {
  assertPositive('spacingXM', spacingXM, 'm');
  const dy = spacingYM ?? (spacingXM * Math.sqrt(3)) / 2;
  assertPositive('spacingYM', dy, 'm');
  return latticeLayout([spacingXM, 0], [spacingXM / 2, dy], boundary, options);
}

/**
 * One ring of a concentric-ring layout.
 * @category Geometry
 */
export interface RingSpec {
  /** Number of elements on the ring, integer ≥ 1. */
  readonly count: number;
  /** Ring radius [m], > 0. */
  readonly radiusM: number;
  /** Angle of the first element from +x toward +y [rad]. @defaultValue 0 */
  readonly startAngleRad?: number;
}

/**
 * Concentric rings in the xy-plane centred on the origin; element k of a ring
 * of M elements sits at angle start + 2πk/M. Rings follow each other in the
 * given order, after an optional centre element.
 * @param rings - The rings, at least one.
 * @param centreElement - Put one element at the origin first. @defaultValue false
 * @returns The layout.
 * @throws {@link DomainError} for an empty ring list or a bad ring.
 * @example
 * ```ts
 * ringLayout([{ count: 6, radiusM: 0.1 }, { count: 12, radiusM: 0.2 }], true).count; // 19
 * ```
 * @category Geometry
 */
export function ringLayout(rings: ReadonlyArray<RingSpec>, centreElement = false): ArrayLayout {
  if (!Array.isArray(rings) || rings.length === 0) {
    throw new DomainError(`invalid argument "rings": expected at least one {count, radiusM}, received ${describeValue(rings)}.`);
  }
  let count = centreElement ? 1 : 0;
  rings.forEach((r, i) => {
    assertInteger(`rings[${i}].count`, r.count, 1);
    assertPositive(`rings[${i}].radiusM`, r.radiusM, 'm');
    assertFinite(`rings[${i}].startAngleRad`, r.startAngleRad ?? 0);
    count += r.count;
  });
  const pos = new Float64Array(3 * count);
  let n = centreElement ? 1 : 0;
  for (const r of rings) {
    const a0 = r.startAngleRad ?? 0;
    for (let k = 0; k < r.count; k++, n++) {
      const a = a0 + (2 * Math.PI * k) / r.count;
      pos[3 * n] = r.radiusM * Math.cos(a);
      pos[3 * n + 1] = r.radiusM * Math.sin(a);
    }
  }
  return { count, positionsM: pos };
}
