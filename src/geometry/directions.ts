/**
 * Direction conversions: spherical angles (θ, φ) ↔ unit vector r̂ ↔ direction
 * cosines (u, v) ↔ azimuth/elevation.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertFinite, describeValue } from '../internal/validate.js';
import { degToRad } from '../units/convert.js';
import type { Vector3 } from './layout.js';

/** Tolerance on | |r̂| − 1 | accepted for a unit direction vector. */
export const UNIT_VECTOR_TOLERANCE = 1e-9;

/**
 * Polar and azimuth angles of a direction (docs/conventions.md).
 * @category Geometry
 */
export interface SphericalAngles {
  /** Polar angle θ from +z [rad], in [0, π]. */
  readonly thetaRad: number;
  /** Azimuth φ from +x toward +y [rad], in (−π, π]. */
  readonly phiRad: number;
}

/**
 * Direction cosines (u, v) of a direction.
 * @category Geometry
 */
export interface DirectionCosines {
  /** u = sinθ cosφ. */
  readonly u: number;
  /** v = sinθ sinφ. */
  readonly v: number;
}

/**
 * Azimuth and elevation of a direction for an array in the xy-plane (broadside +z).
 * @category Geometry
 */
export interface AzimuthElevation {
  /** Azimuth [rad]: rotation in the xz-plane from +z toward +x, in (−π, π]. */
  readonly azimuthRad: number;
  /** Elevation [rad]: angle out of the xz-plane toward +y, in [−π/2, π/2]. */
  readonly elevationRad: number;
}

/**
 * Unit vector of a direction: r̂ = (sinθ cosφ, sinθ sinφ, cosθ).
 * @param thetaRad - Polar angle from +z [rad].
 * @param phiRad - Azimuth from +x toward +y [rad].
 * @returns r̂ (dimensionless).
 * @throws {@link DomainError} for non-finite angles.
 * @example
 * ```ts
 * unitVectorFromAngles(Math.PI / 2, 0); // [1, 0, 6.1e-17]
 * ```
 * @category Geometry
 */
export function unitVectorFromAngles(thetaRad: number, phiRad: number): Vector3 {
  assertFinite('thetaRad', thetaRad);
  assertFinite('phiRad', phiRad);
  const s = Math.sin(thetaRad);
  return [s * Math.cos(phiRad), s * Math.sin(phiRad), Math.cos(thetaRad)];
}

/**
 * Unit vector from angles given in degrees (edge helper).
 * @param thetaDeg - Polar angle from +z [deg].
 * @param phiDeg - Azimuth from +x toward +y [deg].
 * @returns r̂ (dimensionless).
 * @throws {@link DomainError} for non-finite angles.
 * @category Geometry
 */
export function unitVectorFromDegrees(thetaDeg: number, phiDeg: number): Vector3 {
  return unitVectorFromAngles(degToRad(thetaDeg), degToRad(phiDeg));
}

/** @internal Throws unless r is a finite unit 3-vector. */
export function assertUnitVector(name: string, r: Vector3 | ArrayLike<number>): void {
  if (r === null || typeof r !== 'object' || r.length !== 3) {
    throw new DimensionError(`invalid argument "${name}": expected a unit vector [x, y, z], received ${describeValue(r)}.`);
  }
  const len = Math.hypot(r[0], r[1], r[2]);
  if (!(Math.abs(len - 1) <= UNIT_VECTOR_TOLERANCE)) {
    throw new DomainError(`invalid argument "${name}": expected a unit vector (| |r̂| − 1 | ≤ ${UNIT_VECTOR_TOLERANCE}), received length ${describeValue(len)}; normalise it or build it with unitVectorFromAngles.`);
  }
}

/** @internal Throws unless `dirs` is a Float64Array of 3M finite unit vectors (M ≥ 1). */
export function assertDirections(name: string, dirs: Float64Array): void {
  if (!(dirs instanceof Float64Array) || dirs.length === 0 || dirs.length % 3 !== 0) {
    throw new DimensionError(`invalid argument "${name}": expected a Float64Array of 3M direction cosines (xyz-interleaved, M ≥ 1), received ${describeValue(dirs)}; build it with unitVectorsFromAngles or a grid.`);
  }
  for (let m = 0; m < dirs.length; m += 3) {
    const len = Math.hypot(dirs[m], dirs[m + 1], dirs[m + 2]);
    if (!(Math.abs(len - 1) <= UNIT_VECTOR_TOLERANCE)) {
      throw new DomainError(`invalid argument "${name}": direction ${m / 3} has length ${describeValue(len)}; every direction must be a unit vector (| |r̂| − 1 | ≤ ${UNIT_VECTOR_TOLERANCE}).`);
    }
  }
}

/**
 * Spherical angles of a unit vector.
 * @param r - Unit vector r̂.
 * @returns θ ∈ [0, π], φ ∈ (−π, π] (φ = 0 on the z-axis).
 * @throws {@link DomainError} if |r̂| ≠ 1 (tolerance 1e-9).
 * @category Geometry
 */
export function anglesFromUnitVector(r: Vector3): SphericalAngles {
  assertUnitVector('r', r);
  return { thetaRad: Math.atan2(Math.hypot(r[0], r[1]), r[2]), phiRad: Math.atan2(r[1], r[0]) };
}

/**
 * Direction cosines u = sinθ cosφ, v = sinθ sinφ.
 * @param thetaRad - Polar angle [rad].
 * @param phiRad - Azimuth [rad].
 * @returns (u, v), dimensionless.
 * @throws {@link DomainError} for non-finite angles.
 * @category Geometry
 */
export function uvFromAngles(thetaRad: number, phiRad: number): DirectionCosines {
  const r = unitVectorFromAngles(thetaRad, phiRad);
  return { u: r[0], v: r[1] };
}

/**
 * Unit vector of a visible direction given by its direction cosines:
 * r̂ = (u, v, ±√(1 − u² − v²)).
 * @param u - Direction cosine along x.
 * @param v - Direction cosine along y.
 * @param hemisphere - `'front'` (z ≥ 0, default) or `'back'` (z ≤ 0).
 * @returns r̂.
 * @throws {@link DomainError} if u² + v² > 1 (outside the visible region, tolerance 1e-12) or not finite.
 * @category Geometry
 */
export function unitVectorFromUv(u: number, v: number, hemisphere: 'front' | 'back' = 'front'): Vector3 {
  assertFinite('u', u);
  assertFinite('v', v);
  const s = u * u + v * v;
  if (s > 1 + 1e-12) {
    throw new DomainError(`invalid arguments "u", "v": u² + v² = ${s} > 1 lies outside the visible region; only u² + v² ≤ 1 maps to a real direction.`);
  }
  const w = Math.sqrt(Math.max(0, 1 - s));
  return [u, v, hemisphere === 'back' ? -w : w];
}

/**
 * Spherical angles of a visible (u, v) point in the front hemisphere.
 * @param u - Direction cosine along x.
 * @param v - Direction cosine along y.
 * @returns θ ∈ [0, π/2], φ ∈ (−π, π].
 * @throws {@link DomainError} if u² + v² > 1.
 * @category Geometry
 */
export function anglesFromUv(u: number, v: number): SphericalAngles {
  return anglesFromUnitVector(unitVectorFromUv(u, v));
}

/**
 * Unit vector from azimuth and elevation, with the definition used for an
 * array in the xy-plane that faces +z:
 * r̂ = (cos el · sin az, sin el, cos el · cos az).
 *
 * @remarks
 * Azimuth turns the beam in the xz-plane (about the y-axis) from broadside
 * toward +x; elevation then tilts it out of that plane toward +y. Hence
 * u = cos el · sin az, v = sin el, and (az, el) = (0, 0) is broadside. This is
 * the azimuth-over-elevation convention common for planar phased arrays
 * (R. J. Mailloux, *Phased Array Antenna Handbook*, 2nd ed., Artech House,
 * 2005, ch. 1 — from memory).
 * @param azimuthRad - Azimuth [rad].
 * @param elevationRad - Elevation [rad].
 * @returns r̂.
 * @throws {@link DomainError} for non-finite angles.
 * @category Geometry
 */
export function unitVectorFromAzEl(azimuthRad: number, elevationRad: number): Vector3 {
  assertFinite('azimuthRad', azimuthRad);
  assertFinite('elevationRad', elevationRad);
  const ce = Math.cos(elevationRad);
  return [ce * Math.sin(azimuthRad), Math.sin(elevationRad), ce * Math.cos(azimuthRad)];
}

/**
 * Azimuth and elevation of a unit vector (inverse of {@link unitVectorFromAzEl}).
 * @param r - Unit vector r̂.
 * @returns az ∈ (−π, π], el ∈ [−π/2, π/2].
 * @throws {@link DomainError} if |r̂| ≠ 1.
 * @category Geometry
 */
export function azElFromUnitVector(r: Vector3): AzimuthElevation {
  assertUnitVector('r', r);
  return { azimuthRad: Math.atan2(r[0], r[2]), elevationRad: Math.asin(Math.max(-1, Math.min(1, r[1]))) };
}

/**
 * Many unit vectors from paired angle lists: direction m from (θₘ, φₘ).
 * @param thetaRad - Polar angles [rad].
 * @param phiRad - Azimuths [rad], same length.
 * @returns Directions, Float64Array of length 3M, xyz-interleaved.
 * @throws {@link DimensionError} if lengths differ or are zero; {@link DomainError} for non-finite angles.
 * @category Geometry
 */
export function unitVectorsFromAngles(thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>): Float64Array {
  if (!thetaRad || !phiRad || thetaRad.length !== phiRad.length || thetaRad.length === 0) {
    throw new DimensionError(`invalid arguments "thetaRad", "phiRad": expected two non-empty lists of equal length, received ${describeValue(thetaRad)} and ${describeValue(phiRad)}.`);
  }
  const out = new Float64Array(3 * thetaRad.length);
  for (let m = 0; m < thetaRad.length; m++) {
    const t = thetaRad[m], p = phiRad[m];
    if (!Number.isFinite(t) || !Number.isFinite(p)) {
      throw new DomainError(`invalid arguments "thetaRad", "phiRad": entry ${m} is (${describeValue(t)}, ${describeValue(p)}); angles must be finite.`);
    }
    const s = Math.sin(t);
    out[3 * m] = s * Math.cos(p);
    out[3 * m + 1] = s * Math.sin(p);
    out[3 * m + 2] = Math.cos(t);
  }
  return out;
}

/**
 * A set of directions, one entry per direction: the one direction vocabulary of the library.
 *
 * @remarks
 * `thetaRad[k]`, `phiRad[k]` are the angles of direction k (θ from +z, φ from +x toward +y;
 * docs/conventions.md), both of length M. Sampled port patterns, secondary patterns and
 * weighted quadrature directions extend this shape. Grid types — a product rule
 * (`SphereQuadrature`), a θ-φ grid, an embedded-pattern set — hold axes instead (`thetaRad` of
 * length nθ); {@link weightedDirections} expands a product rule into per-direction form.
 * @category Geometry
 */
export interface Directions {
  /** Polar angle of each direction [rad], length M. */
  readonly thetaRad: Float64Array;
  /** Azimuth of each direction [rad], length M. */
  readonly phiRad: Float64Array;
}

/**
 * Directions with solid-angle quadrature weights: ∮ g dΩ ≈ Σₖ weightSr[k]·g(θₖ, φₖ).
 * @category Geometry
 */
export interface WeightedDirections extends Directions {
  /** Solid-angle weight of each direction [sr], ≥ 0, length M (summing to 4π for a full-sphere rule). */
  readonly weightSr: Float64Array;
}

/**
 * The product-rule shape {@link weightedDirections} expands (a `SphereQuadrature` has it): θ and
 * φ axes and one weight per node.
 * @category Geometry
 */
export interface ProductRule {
  /** θ axis [rad], length thetaCount. */
  readonly thetaRad: Float64Array;
  /** φ axis [rad], length phiCount. */
  readonly phiRad: Float64Array;
  /** Weight of node k = j·thetaCount + i [sr], length count. */
  readonly weights: Float64Array;
  /** Number of θ nodes. */
  readonly thetaCount: number;
  /** Number of φ nodes. */
  readonly phiCount: number;
  /** thetaCount·phiCount. */
  readonly count: number;
}

/**
 * Per-direction form of a sphere rule: a product rule (θ and φ axes and a weight per node) is
 * expanded into one (θ, φ, weight) triple per direction, in the rule's own order (direction
 * k = j·thetaCount + i, θ fastest); weighted directions are returned as they are. The one place
 * that tells the two forms apart.
 * @param rule - A product rule (`sphereQuadrature`, `sphereQuadratureForLayout`) or weighted directions.
 * @returns Per-direction angles [rad] and weights [sr].
 * @throws {@link DimensionError} if the rule's arrays are inconsistent.
 * @example
 * ```ts
 * const q = weightedDirections(sphereQuadrature(8, 16));
 * q.weightSr.length, q.weightSr.reduce((a, b) => a + b); // 128, 12.566371 (4π)
 * ```
 * @category Geometry
 */
export function weightedDirections(rule: ProductRule | WeightedDirections): WeightedDirections {
  if (rule === null || typeof rule !== 'object') throw new DomainError(`invalid argument "rule": expected a sphere rule or weighted directions, received ${describeValue(rule)}.`);
  if ('weightSr' in rule) return rule;
  const { thetaCount, phiCount, count } = rule;
  if (rule.thetaRad.length !== thetaCount || rule.phiRad.length !== phiCount || rule.weights.length !== count || count !== thetaCount * phiCount) {
    throw new DimensionError(`invalid argument "quadrature": expected thetaRad of length thetaCount, phiRad of length phiCount and count = thetaCount·phiCount weights, received ${rule.thetaRad.length}, ${rule.phiRad.length}, ${rule.weights.length}.`);
  }
  const thetaRad = new Float64Array(count), phiRad = new Float64Array(count);
  for (let j = 0; j < phiCount; j++) {
    for (let i = 0; i < thetaCount; i++) {
      thetaRad[j * thetaCount + i] = rule.thetaRad[i];
      phiRad[j * thetaCount + i] = rule.phiRad[j];
    }
  }
  return { thetaRad, phiRad, weightSr: rule.weights };
}
