/**
 * Descriptions of the analytic elements (dipoles, isotropic radiator) and of
 * the optional infinite ground plane, with their boundary validation.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertPositive, describeValue } from '../internal/validate.js';

import type { Vector3 } from '../geometry/layout.js';

/**
 * A thin straight wire dipole, centre-fed, carrying the sinusoidal current
 * I(t) = I₀ sin(k(l/2 − |t|)) / sin(k l/2) along its axis (t from the feed),
 * where I₀ is the terminal (port) current.
 *
 * @remarks
 * The sinusoidal current is the classic single-mode assumption of the
 * induced-EMF method (exact for an infinitely thin wire only in the limit; good
 * for thin dipoles up to about one wavelength). The terminal current vanishes
 * when l is a whole number of wavelengths, so such lengths are rejected.
 * @category Elements
 */
export interface WireDipole {
  /** Centre (feed point) [m]. */
  readonly centerM: Vector3;
  /** Axis direction (any non-zero length; normalised internally), dimensionless. */
  readonly axis: Vector3;
  /** Total length l tip to tip [m], > 0. */
  readonly lengthM: number;
  /** Wire radius a [m], > 0 and ≪ l; used only for the self impedance. */
  readonly radiusM: number;
}

/**
 * An infinitesimal (Hertzian) current element of length L carrying a uniform
 * current I₀.
 * @category Elements
 */
export interface HertzianDipole {
  /** Position [m]. */
  readonly centerM: Vector3;
  /** Current direction (normalised internally), dimensionless. */
  readonly axis: Vector3;
  /** Length L [m], > 0 and ≪ λ. */
  readonly lengthM: number;
}

/**
 * An isotropic "radiator" for teaching: |f| is the same in every direction and
 * the field is θ̂-polarised.
 *
 * @remarks
 * Caveat: no physical antenna radiates a tangential vector field of constant,
 * non-zero magnitude over the whole sphere (a continuous tangent field on a
 * sphere must vanish somewhere — the "hairy ball" theorem); the θ̂ field used
 * here jumps in direction at the poles. Use it for array-factor intuition and
 * for directivity/effective-area bookkeeping (D = 1, A_e = λ²/4π), never for
 * polarisation, coupling or noise studies.
 * @category Elements
 */
export interface IsotropicRadiator {
  /** Position [m]. */
  readonly centerM: Vector3;
  /** Radiation resistance R it is credited with [Ω], > 0 (sets |f|² = η R |I₀|² / 4π). */
  readonly radiationResistanceOhm: number;
}

/**
 * An infinite perfectly conducting ground plane z = zM (normal +z); elements
 * must lie wholly above it and fields are zero below it (image theory).
 * @category Elements
 */
export interface GroundPlane {
  /** Height of the plane above the coordinate origin [m]. */
  readonly zM: number;
}

/** @internal A validated, normalised dipole in flat form. */
export interface DipoleGeometry {
  cx: number; cy: number; cz: number;
  ax: number; ay: number; az: number;
  halfLengthM: number;
  radiusM: number;
}

/** @internal Validates a 3-vector. */
export function assertVector3(name: string, v: Vector3): void {
  if (!Array.isArray(v) && !(ArrayBuffer.isView(v))) {
    throw new DomainError(`invalid argument "${name}": expected [x, y, z], received ${describeValue(v)}.`);
  }
  if ((v as ArrayLike<number>).length !== 3) {
    throw new DomainError(`invalid argument "${name}": expected 3 components [x, y, z], received ${describeValue(v)}.`);
  }
  for (let i = 0; i < 3; i++) assertFinite(`${name}[${i}]`, v[i]);
}

/** @internal Unit vector of a non-zero axis. */
export function unitAxis(name: string, v: Vector3): [number, number, number] {
  assertVector3(name, v);
  const n = Math.hypot(v[0], v[1], v[2]);
  if (!(n > 0)) {
    throw new DomainError(`invalid argument "${name}": expected a non-zero direction, received [${v.join(', ')}]; give the wire axis, e.g. [0, 0, 1].`);
  }
  return [v[0] / n, v[1] / n, v[2] / n];
}

/** @internal Validates a wire dipole (and its length against the wavenumber when given). */
export function dipoleGeometry(name: string, d: WireDipole, wavenumberRadPerM?: number): DipoleGeometry {
  if (d === null || typeof d !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected a WireDipole {centerM, axis, lengthM, radiusM}, received ${describeValue(d)}.`);
  }
  assertVector3(`${name}.centerM`, d.centerM);
  const a = unitAxis(`${name}.axis`, d.axis);
  if (typeof d.lengthM !== 'number' || !(d.lengthM > 0) || !Number.isFinite(d.lengthM)) {
    throw new DomainError(`invalid argument "${name}.lengthM": expected a finite dipole length > 0 [m], received ${describeValue(d.lengthM)}; a zero-length dipole radiates nothing.`);
  }
  assertPositive(`${name}.radiusM`, d.radiusM, 'm');
  if (d.radiusM >= d.lengthM / 2) {
    throw new DomainError(`invalid argument "${name}.radiusM": expected a thin wire (radius ≪ length/2 = ${d.lengthM / 2} m), received ${d.radiusM} m.`);
  }
  if (wavenumberRadPerM !== undefined) {
    const s = Math.sin((wavenumberRadPerM * d.lengthM) / 2);
    if (Math.abs(s) < 1e-6) {
      throw new DomainError(`invalid argument "${name}.lengthM": ${d.lengthM} m is (within 1e-6) a whole number of wavelengths, where the sinusoidal current vanishes at the feed and the port current is undefined; choose another length or frequency.`);
    }
  }
  return { cx: d.centerM[0], cy: d.centerM[1], cz: d.centerM[2], ax: a[0], ay: a[1], az: a[2], halfLengthM: d.lengthM / 2, radiusM: d.radiusM };
}

/** @internal Validates a ground plane and that a dipole lies wholly above it. */
export function assertAboveGround(name: string, g: DipoleGeometry, plane: GroundPlane): void {
  const lowest = g.cz - g.halfLengthM * Math.abs(g.az) - plane.zM;
  if (!(lowest > 0)) {
    throw new DomainError(`invalid argument "${name}": the dipole reaches z = ${(lowest + plane.zM).toPrecision(6)} m, at or below the ground plane z = ${plane.zM} m; raise it above the plane.`);
  }
}

/** @internal Validates the ground-plane option. */
export function assertGroundPlane(name: string, plane: GroundPlane | undefined): void {
  if (plane === undefined) return;
  if (plane === null || typeof plane !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected {zM: number} or undefined, received ${describeValue(plane)}.`);
  }
  assertFinite(`${name}.zM`, plane.zM);
}

/**
 * @internal The ground-plane image of a dipole: position mirrored in z = zM and
 * current direction 2(â·ẑ)ẑ − â (horizontal currents reverse, vertical ones keep
 * their sense), so that the image plus the original meet the PEC condition.
 */
export function imageGeometry(g: DipoleGeometry, plane: GroundPlane): DipoleGeometry {
  return { cx: g.cx, cy: g.cy, cz: 2 * plane.zM - g.cz, ax: -g.ax, ay: -g.ay, az: g.az, halfLengthM: g.halfLengthM, radiusM: g.radiusM };
}
