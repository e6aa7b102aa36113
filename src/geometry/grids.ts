/**
 * Direction grids: θ-φ grids, u-v grids with the visible-region mask, and
 * plane cuts (principal planes, diagonals).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertFinite, assertInteger, describeValue } from '../internal/validate.js';

/**
 * `count` evenly spaced values from `start` to `end` inclusive.
 * @param start - First value.
 * @param end - Last value.
 * @param count - Number of values, integer ≥ 1 (1 gives `[start]`).
 * @returns The values.
 * @throws {@link DomainError} for non-finite ends or a bad count.
 * @example
 * ```ts
 * evenlySpaced(-1, 1, 5); // [-1, -0.5, 0, 0.5, 1]
 * ```
 * @category Geometry
 */
export function evenlySpaced(start: number, end: number, count: number): Float64Array {
  assertFinite('start', start);
  assertFinite('end', end);
  assertInteger('count', count, 1);
  const out = new Float64Array(count);
  if (count === 1) { out[0] = start; return out; }
  const h = (end - start) / (count - 1);
  for (let i = 0; i < count; i++) out[i] = start + i * h;
  out[count - 1] = end;
  return out;
}

function finiteList(name: string, x: ArrayLike<number>): Float64Array {
  if (!x || typeof x !== 'object' || x.length === 0) {
    throw new DimensionError(`invalid argument "${name}": expected a non-empty list of numbers, received ${describeValue(x)}.`);
  }
  const out = Float64Array.from(x);
  for (let i = 0; i < out.length; i++) {
    if (!Number.isFinite(out[i])) throw new DomainError(`invalid argument "${name}": entry ${i} is ${describeValue(out[i])}; every entry must be finite.`);
  }
  return out;
}

/**
 * A product grid of polar and azimuth angles.
 * @remarks Direction k = iPhi·thetaCount + iTheta (θ fastest), so each fixed-φ cut is contiguous.
 * @category Geometry
 */
export interface ThetaPhiGrid {
  /** Number of θ values. */
  readonly thetaCount: number;
  /** Number of φ values. */
  readonly phiCount: number;
  /** Number of directions, thetaCount·phiCount. */
  readonly count: number;
  /** The θ values [rad]. */
  readonly thetaRad: Float64Array;
  /** The φ values [rad]. */
  readonly phiRad: Float64Array;
  /** Unit vectors, length 3·count, xyz-interleaved. */
  readonly directions: Float64Array;
}

/**
 * The product grid of θ and φ values with its unit vectors.
 * @param thetaRad - Polar angles [rad].
 * @param phiRad - Azimuths [rad].
 * @returns The grid (θ fastest).
 * @throws {@link DimensionError} for empty lists; {@link DomainError} for non-finite angles.
 * @example
 * ```ts
 * thetaPhiGrid(evenlySpaced(0, Math.PI, 181), evenlySpaced(0, 2 * Math.PI, 361)).count; // 65341
 * ```
 * @category Geometry
 */
export function thetaPhiGrid(thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>): ThetaPhiGrid {
  const t = finiteList('thetaRad', thetaRad), p = finiteList('phiRad', phiRad);
  const nt = t.length, np = p.length;
  const dirs = new Float64Array(3 * nt * np);
  const st = t.map(Math.sin), ct = t.map(Math.cos);
  for (let j = 0; j < np; j++) {
    const cp = Math.cos(p[j]), sp = Math.sin(p[j]);
    for (let i = 0; i < nt; i++) {
      const k = 3 * (j * nt + i);
      dirs[k] = st[i] * cp;
      dirs[k + 1] = st[i] * sp;
      dirs[k + 2] = ct[i];
    }
  }
  return { thetaCount: nt, phiCount: np, count: nt * np, thetaRad: t, phiRad: p, directions: dirs };
}

/**
 * A product grid of direction cosines (u, v) with its visible-region mask.
 * @remarks Point k = iv·uCount + iu (u fastest). A point is visible when u² + v² ≤ 1.
 * @category Geometry
 */
export interface UvGrid {
  /** Number of u values. */
  readonly uCount: number;
  /** Number of v values. */
  readonly vCount: number;
  /** Number of points uCount·vCount. */
  readonly count: number;
  /** The u values (dimensionless). */
  readonly uValues: Float64Array;
  /** The v values (dimensionless). */
  readonly vValues: Float64Array;
  /** 1 where u² + v² ≤ 1 (a real direction in the front hemisphere), else 0; length count. */
  readonly visible: Uint8Array;
  /** Number of visible points. */
  readonly visibleCount: number;
}

/**
 * The product grid of given u and v values, with the visible mask.
 * @param uValues - Direction cosines along x.
 * @param vValues - Direction cosines along y.
 * @returns The grid (u fastest).
 * @throws {@link DimensionError} for empty lists; {@link DomainError} for non-finite values.
 * @example
 * ```ts
 * uvGrid(evenlySpaced(-1, 1, 101), evenlySpaced(-1, 1, 101)).visibleCount; // 7841
 * ```
 * @category Geometry
 */
export function uvGrid(uValues: ArrayLike<number>, vValues: ArrayLike<number>): UvGrid {
  const u = finiteList('uValues', uValues), v = finiteList('vValues', vValues);
  const visible = new Uint8Array(u.length * v.length);
  let visibleCount = 0;
  for (let j = 0; j < v.length; j++) {
    for (let i = 0; i < u.length; i++) {
      if (u[i] * u[i] + v[j] * v[j] <= 1) { visible[j * u.length + i] = 1; visibleCount++; }
    }
  }
  return { uCount: u.length, vCount: v.length, count: u.length * v.length, uValues: u, vValues: v, visible, visibleCount };
}

/**
 * The visible points of a u-v grid as unit vectors.
 * @category Geometry
 */
export interface VisibleDirections {
  /** Unit vectors (u, v, √(1 − u² − v²)), 3·visibleCount, xyz-interleaved. */
  readonly directions: Float64Array;
  /** Grid index of each direction. */
  readonly indices: Uint32Array;
}

/**
 * Front-hemisphere unit vectors of the visible points of a u-v grid.
 * @param grid - The u-v grid.
 * @returns `directions` (3·visibleCount, xyz-interleaved) and `indices` (grid index of each).
 * @throws {@link DimensionError} if no point of the grid is visible.
 * @category Geometry
 */
export function visibleDirections(grid: UvGrid): VisibleDirections {
  if (!grid || grid.visibleCount < 1) {
    throw new DimensionError('invalid argument "grid": no point lies in the visible region u² + v² ≤ 1; widen the grid.');
  }
  const dirs = new Float64Array(3 * grid.visibleCount);
  const idx = new Uint32Array(grid.visibleCount);
  let m = 0;
  for (let j = 0; j < grid.vCount; j++) {
    for (let i = 0; i < grid.uCount; i++) {
      const k = j * grid.uCount + i;
      if (!grid.visible[k]) continue;
      const u = grid.uValues[i], v = grid.vValues[j];
      dirs[3 * m] = u;
      dirs[3 * m + 1] = v;
      dirs[3 * m + 2] = Math.sqrt(Math.max(0, 1 - u * u - v * v));
      idx[m++] = k;
    }
  }
  return { directions: dirs, indices: idx };
}

/**
 * A planar cut through the z-axis at azimuth φ₀, parametrised by a signed
 * angle: direction = (sin t cos φ₀, sin t sin φ₀, cos t) for t ∈ [−π, π]
 * (negative t lies at azimuth φ₀ + π).
 *
 * @remarks
 * Principal planes of a planar array: φ₀ = 0 (xz-plane), φ₀ = π/2 (yz-plane);
 * diagonal planes φ₀ = π/4 and 3π/4.
 * @category Geometry
 */
export interface PlaneCut {
  /** Azimuth of the cut plane φ₀ [rad]. */
  readonly phiRad: number;
  /** Signed angles from +z within the plane [rad]. */
  readonly angleRad: Float64Array;
  /** Unit vectors, 3·count, xyz-interleaved. */
  readonly directions: Float64Array;
}

/**
 * A plane cut at azimuth φ₀ through the given signed angles.
 * @param phiRad - Azimuth of the cut plane [rad] (0: xz-plane, π/2: yz-plane, π/4: diagonal).
 * @param angleRad - Signed angles from +z in the plane [rad], each in [−π, π].
 * @returns The cut.
 * @throws {@link DimensionError} for an empty list; {@link DomainError} for angles outside [−π, π].
 * @example
 * ```ts
 * planeCut(0, evenlySpaced(-Math.PI / 2, Math.PI / 2, 181)).directions.length; // 543
 * ```
 * @category Geometry
 */
export function planeCut(phiRad: number, angleRad: ArrayLike<number>): PlaneCut {
  assertFinite('phiRad', phiRad);
  const t = finiteList('angleRad', angleRad);
  const cp = Math.cos(phiRad), sp = Math.sin(phiRad);
  const dirs = new Float64Array(3 * t.length);
  for (let i = 0; i < t.length; i++) {
    if (Math.abs(t[i]) > Math.PI * (1 + 1e-15)) {
      throw new DomainError(`invalid argument "angleRad": entry ${i} is ${t[i]}; signed cut angles lie in [−π, π].`);
    }
    const s = Math.sin(t[i]);
    dirs[3 * i] = s * cp;
    dirs[3 * i + 1] = s * sp;
    dirs[3 * i + 2] = Math.cos(t[i]);
  }
  return { phiRad, angleRad: t, directions: dirs };
}
