/**
 * Far-field (embedded-pattern) vectors of the analytic elements in the
 * phasewise convention.
 *
 * @remarks
 * Convention (conventions, "embedded pattern"): with port current I₀ (RMS) the
 * radiated field is E(r) = f(r̂) e^{−jkr}/r, time dependence e^{+jωt}, the
 * phase referred to the coordinate origin. For a current density J(r′) of
 * terminal current I₀ the radiation vector is N(r̂) = ∫ J(r′) e^{+jk r̂·r′} dV′
 * and
 *
 *   f(r̂) = −j (η k / 4π) [N − (N·r̂) r̂],
 *
 * the transverse part of the vector potential (Balanis, Antenna Theory, 4th ed.,
 * 2016, §3.6 and eq. (4-26a), from memory). For a z-directed Hertzian element
 * this gives f_θ = +j η k I₀ L sinθ / 4π, the classic result. The sign agrees
 * with the conventions' reception row: two far-apart elements give
 * −j(4π/(ηkI₀)) f₂·E_inc = Z₂₁ I₁ (tested against the induced-EMF mutual
 * impedance).
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteArray, assertPositive, describeValue } from '../internal/validate.js';
import { C0_M_PER_S, ETA0_OHM } from '../units/constants.js';
import {
  assertAboveGround, assertGroundPlane, assertVector3, dipoleGeometry, imageGeometry, unitAxis,
  type DipoleGeometry, type GroundPlane, type HertzianDipole, type IsotropicRadiator, type WireDipole,
} from './types.js';

/**
 * Options of the analytic far-field functions.
 * @category Elements
 */
export interface FarFieldOptions {
  /** Port (terminal) current I₀ the pattern is referred to [A, RMS]. @defaultValue 1 */
  driveCurrentA?: number;
  /** Infinite PEC ground plane; adds the image and zeroes the field below the plane. @defaultValue none (free space) */
  groundPlane?: GroundPlane;
}

/**
 * θ̂ and φ̂ components of a far-field pattern f(r̂) at M directions.
 * @category Elements
 */
export interface FarFieldResult {
  /** f·θ̂ [V], 1×M: one row (the element's port), one column per direction — the N×M shape of the reception module's sampled patterns, so elements stack as rows. */
  readonly thetaComponentV: CMatrix;
  /** f·φ̂ [V], 1×M. */
  readonly phiComponentV: CMatrix;
}

/** @internal Current model of one straight element: 0 sinusoidal, 1 uniform. */
export type CurrentModel = 0 | 1;
/** @internal Sinusoidal current model tag. */
export const SINUSOIDAL_CURRENT: CurrentModel = 0;
/** @internal Uniform current model tag. */
export const UNIFORM_CURRENT: CurrentModel = 1;

/** @internal sin(x)/x, exact at 0. */
export function sinc(x: number): number {
  return Math.abs(x) < 1e-4 ? 1 - (x * x) / 6 : Math.sin(x) / x;
}

/**
 * @internal Scalar radiation integral ∫ I(t) e^{jk t cosψ} dt / I₀ of a straight
 * element with terminal current 1 A, along its own axis, for cosψ = r̂·â.
 * Sinusoidal: (k h² / sin kh) · sinc(kh(1−x)/2) · sinc(kh(1+x)/2), the stable
 * form of 2[cos(kh x) − cos kh]/(k sin kh (1 − x²)).
 */
export function radiationIntegral(model: CurrentModel, k: number, halfLengthM: number, cosPsi: number): number {
  if (model === UNIFORM_CURRENT) return 2 * halfLengthM * sinc(k * halfLengthM * cosPsi);
  const kh = k * halfLengthM;
  return ((k * halfLengthM * halfLengthM) / Math.sin(kh)) * sinc((kh * (1 - cosPsi)) / 2) * sinc((kh * (1 + cosPsi)) / 2);
}

/**
 * @internal Adds the far field of one straight element (and its ground image) at
 * M directions into interleaved θ/φ buffers at `offset` (complex index) with unit
 * stride. `scale` multiplies the terminal current (A).
 */
export function accumulateElementFarField(
  outTheta: Float64Array, outPhi: Float64Array, offset: number,
  g: DipoleGeometry, model: CurrentModel, k: number, scale: number,
  thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>, plane: GroundPlane | undefined,
): void {
  const c = (ETA0_OHM * k * scale) / (4 * Math.PI);
  const img = plane ? imageGeometry(g, plane) : undefined;
  const m = thetaRad.length;
  for (let i = 0; i < m; i++) {
    const th = thetaRad[i], ph = phiRad[i];
    const st = Math.sin(th), ct = Math.cos(th), sp = Math.sin(ph), cp = Math.cos(ph);
    if (plane && ct < 0) continue;
    const rx = st * cp, ry = st * sp, rz = ct;
    let fr = 0, fi = 0, gr = 0, gi = 0;
    for (let pass = 0; pass < (img ? 2 : 1); pass++) {
      const e = pass === 0 ? g : (img as DipoleGeometry);
      const cosPsi = rx * e.ax + ry * e.ay + rz * e.az;
      const s = c * radiationIntegral(model, k, e.halfLengthM, cosPsi);
      const p = k * (rx * e.cx + ry * e.cy + rz * e.cz);
      // −j e^{jp} = sin p − j cos p
      const wr = s * Math.sin(p), wi = -s * Math.cos(p);
      const at = ct * cp * e.ax + ct * sp * e.ay - st * e.az;
      const ap = -sp * e.ax + cp * e.ay;
      fr += wr * at; fi += wi * at;
      gr += wr * ap; gi += wi * ap;
    }
    const o = 2 * (offset + i);
    outTheta[o] += fr; outTheta[o + 1] += fi;
    outPhi[o] += gr; outPhi[o + 1] += gi;
  }
}

/** @internal Shared argument checks of the far-field functions; returns k. */
export function checkDirections(frequencyHz: number, thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>): number {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  assertFiniteArray('thetaRad', thetaRad);
  assertFiniteArray('phiRad', phiRad);
  if (thetaRad.length !== phiRad.length) {
    throw new DomainError(`invalid arguments "thetaRad"/"phiRad": expected equal lengths (one θ and one φ per direction), received ${thetaRad.length} and ${phiRad.length}.`);
  }
  return (2 * Math.PI * frequencyHz) / C0_M_PER_S;
}

/** @internal Validates FarFieldOptions; returns the drive current. */
export function checkFarFieldOptions(options: FarFieldOptions): number {
  if (options === null || typeof options !== 'object') {
    throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(options)}.`);
  }
  const i0 = options.driveCurrentA ?? 1;
  assertPositive('options.driveCurrentA', i0, 'A');
  assertGroundPlane('options.groundPlane', options.groundPlane);
  return i0;
}

function result(m: number, th: Float64Array, ph: Float64Array): FarFieldResult {
  return { thetaComponentV: { rows: 1, cols: m, data: th }, phiComponentV: { rows: 1, cols: m, data: ph } };
}

/**
 * Far-field pattern of a thin centre-fed wire dipole with sinusoidal current,
 * any length, orientation and position, optionally over a PEC ground plane.
 *
 * @remarks
 * With I(t) = I₀ sin(k(h − |t|))/sin(kh), h = l/2, along axis â and centre c:
 * f(r̂) = −j(ηk/4π) S(ψ) e^{+jk r̂·c} [â − (â·r̂) r̂], with
 * S(ψ) = 2 I₀ [cos(kh cosψ) − cos kh] / (k sin kh sin²ψ), cosψ = r̂·â.
 * For â = ẑ at the origin this is f_θ = j η I₀ [cos(kh cosθ) − cos kh] / (2π sin kh sinθ)
 * (Balanis, Antenna Theory, 4th ed., 2016, eq. (4-62a), from memory, there
 * referred to the current maximum I_m = I₀/sin kh). With a ground plane the
 * image (mirrored position, current 2(â·ẑ)ẑ − â) is added above the plane and
 * the field is zero for θ > π/2 (plane at z = zM, normal +z).
 * Conventions: e^{+jωt}, RMS, phase referred to the origin; docs/conventions.md.
 *
 * @param dipole - The wire dipole (lengths [m]).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param thetaRad - Polar angles from +z [rad], length M.
 * @param phiRad - Azimuths from +x toward +y [rad], length M.
 * @param options - Drive current and ground plane.
 * @returns f·θ̂ and f·φ̂ [V] at each direction.
 * @throws {@link DomainError} for a zero/negative length, a length that is a whole number of wavelengths, NaN angles, unequal angle arrays, or a dipole at or below the ground plane.
 * @example
 * ```ts
 * const d = { centerM: [0, 0, 0], axis: [0, 0, 1], lengthM: 0.5, radiusM: 1e-4 } as const;
 * wireDipoleFarField(d, 299792458, [Math.PI / 2], [0]).thetaComponentV; // ≈ [59.96j] V (= jη/2π)
 * ```
 * @category Elements
 */
export function wireDipoleFarField(
  dipole: WireDipole, frequencyHz: number, thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>, options: FarFieldOptions = {},
): FarFieldResult {
  const k = checkDirections(frequencyHz, thetaRad, phiRad);
  const i0 = checkFarFieldOptions(options);
  const g = dipoleGeometry('dipole', dipole, k);
  if (options.groundPlane) assertAboveGround('dipole', g, options.groundPlane);
  const m = thetaRad.length;
  const th = new Float64Array(2 * m), ph = new Float64Array(2 * m);
  accumulateElementFarField(th, ph, 0, g, SINUSOIDAL_CURRENT, k, i0, thetaRad, phiRad, options.groundPlane);
  return result(m, th, ph);
}

/**
 * Far-field pattern of an infinitesimal (Hertzian) dipole of length L with
 * uniform current I₀, any orientation and position, optionally over a ground plane.
 *
 * @remarks
 * f(r̂) = −j(ηk/4π) I₀ L e^{+jk r̂·c} [â − (â·r̂) r̂]; for â = ẑ at the origin
 * f_θ = j η k I₀ L sinθ / 4π (Balanis, Antenna Theory, 4th ed., 2016, eq.
 * (4-26a), from memory). The radiation integral is evaluated exactly for a
 * uniform current of length L (a factor sinc(kL cosψ/2) that is 1 to O((kL)²)),
 * so the model stays a short uniform-current element rather than a point.
 *
 * @param dipole - The element (lengths [m]).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param thetaRad - Polar angles [rad], length M.
 * @param phiRad - Azimuths [rad], length M.
 * @param options - Drive current and ground plane.
 * @returns f·θ̂ and f·φ̂ [V].
 * @throws {@link DomainError} for a zero length, bad angles or an element below the ground plane.
 * @category Elements
 */
export function hertzianDipoleFarField(
  dipole: HertzianDipole, frequencyHz: number, thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>, options: FarFieldOptions = {},
): FarFieldResult {
  const k = checkDirections(frequencyHz, thetaRad, phiRad);
  const i0 = checkFarFieldOptions(options);
  const g = hertzianGeometry('dipole', dipole);
  if (options.groundPlane) assertAboveGround('dipole', g, options.groundPlane);
  const m = thetaRad.length;
  const th = new Float64Array(2 * m), ph = new Float64Array(2 * m);
  accumulateElementFarField(th, ph, 0, g, UNIFORM_CURRENT, k, i0, thetaRad, phiRad, options.groundPlane);
  return result(m, th, ph);
}

/** @internal Validates a Hertzian element. */
export function hertzianGeometry(name: string, d: HertzianDipole): DipoleGeometry {
  if (d === null || typeof d !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected a HertzianDipole {centerM, axis, lengthM}, received ${describeValue(d)}.`);
  }
  assertVector3(`${name}.centerM`, d.centerM);
  const a = unitAxis(`${name}.axis`, d.axis);
  if (typeof d.lengthM !== 'number' || !(d.lengthM > 0) || !Number.isFinite(d.lengthM)) {
    throw new DomainError(`invalid argument "${name}.lengthM": expected a finite length > 0 [m], received ${describeValue(d.lengthM)}; a zero-length dipole radiates nothing.`);
  }
  return { cx: d.centerM[0], cy: d.centerM[1], cz: d.centerM[2], ax: a[0], ay: a[1], az: a[2], halfLengthM: d.lengthM / 2, radiusM: 0 };
}

/**
 * Far-field pattern of the teaching isotropic radiator: f = √(η R/4π) I₀ e^{+jk r̂·c} θ̂.
 *
 * @remarks
 * |f|² = η R |I₀|²/4π in every direction, so the radiated power is R|I₀|² and the
 * directivity 1. Caveat (see {@link IsotropicRadiator}): not a physical vector
 * field — its θ̂ polarisation is discontinuous at the poles; use it for
 * bookkeeping, not for polarisation, coupling or noise. No ground plane option.
 *
 * @param radiator - Position [m] and radiation resistance [Ω].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param thetaRad - Polar angles [rad], length M.
 * @param phiRad - Azimuths [rad], length M.
 * @param options - Drive current (a ground plane is rejected).
 * @returns f·θ̂ and f·φ̂ (zero) [V].
 * @throws {@link DomainError} for bad arguments or a ground plane.
 * @category Elements
 */
export function isotropicFarField(
  radiator: IsotropicRadiator, frequencyHz: number, thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>, options: FarFieldOptions = {},
): FarFieldResult {
  const k = checkDirections(frequencyHz, thetaRad, phiRad);
  const i0 = checkFarFieldOptions(options);
  if (options.groundPlane) {
    throw new DomainError('invalid argument "options.groundPlane": the isotropic teaching radiator has no ground-plane model (its field is not a physical vector field); remove the option.');
  }
  if (radiator === null || typeof radiator !== 'object') {
    throw new DomainError(`invalid argument "radiator": expected {centerM, radiationResistanceOhm}, received ${describeValue(radiator)}.`);
  }
  assertVector3('radiator.centerM', radiator.centerM);
  assertPositive('radiator.radiationResistanceOhm', radiator.radiationResistanceOhm, 'Ω');
  const amp = Math.sqrt((ETA0_OHM * radiator.radiationResistanceOhm) / (4 * Math.PI)) * i0;
  const [cx, cy, cz] = radiator.centerM;
  const m = thetaRad.length;
  const th = new Float64Array(2 * m), ph = new Float64Array(2 * m);
  for (let i = 0; i < m; i++) {
    const st = Math.sin(thetaRad[i]);
    const p = k * (st * Math.cos(phiRad[i]) * cx + st * Math.sin(phiRad[i]) * cy + Math.cos(thetaRad[i]) * cz);
    th[2 * i] = amp * Math.cos(p);
    th[2 * i + 1] = amp * Math.sin(p);
  }
  return result(m, th, ph);
}
