/**
 * Radiation resistance, directivity and effective area of the analytic
 * elements, from closed forms and from their fields by sphere quadrature; and
 * the radiation-resistance matrix of any open-circuit pattern set.
 * @module
 */
import sici from '@stdlib/math-base-special-sici';
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteArray, assertPositive, describeValue } from '../internal/validate.js';
import { C0_M_PER_S, ETA0_OHM } from '../units/constants.js';
import { sphereQuadrature, sphereQuadratureOrder } from '../geometry/quadrature.js';
import {
  accumulateElementFarField, checkFarFieldOptions, hertzianGeometry, SINUSOIDAL_CURRENT, UNIFORM_CURRENT, type CurrentModel,
} from './farField.js';
import { generalMutualImpedanceInto, parallelMutualImpedanceInto } from './inducedEmf.js';
import { embeddedPatternSet, type EmbeddedPatternSet } from './patternSet.js';
import {
  assertAboveGround, assertGroundPlane, assertVector3, dipoleGeometry, imageGeometry,
  type DipoleGeometry, type GroundPlane, type HertzianDipole, type IsotropicRadiator, type WireDipole,
} from './types.js';
import { matrixView } from '../linalg/cmatrix.js';

const EULER_GAMMA = 0.5772156649015329;

/**
 * How {@link wireDipoleRadiation} and {@link hertzianDipoleRadiation} obtain the radiated power.
 * - `'closed-form'`: Si/Ci or spherical-Bessel closed forms (the ground image by the induced-EMF coupling term);
 * - `'quadrature'`: |f|² integrated over the sphere with the geometry module's Gauss–Legendre × trapezoid rule.
 * @category Elements
 */
export type RadiationMethod = 'closed-form' | 'quadrature';

/**
 * Options of the element radiation functions.
 * @category Elements
 */
export interface RadiationOptions {
  /** Infinite PEC ground plane z = zM. @defaultValue none (free space) */
  groundPlane?: GroundPlane;
  /** Closed form or sphere quadrature. @defaultValue 'closed-form' */
  method?: RadiationMethod;
}

/**
 * Radiation figures of one element (lossless, terminal-referred).
 * @category Elements
 */
export interface RadiationProperties {
  /** Radiation resistance R = P_rad/|I₀|² at the terminals [Ω]. */
  readonly radiationResistanceOhm: number;
  /** Maximum directivity D = 4π max|f|² / (η R |I₀|²), linear. */
  readonly directivity: number;
  /** 10·log10(D) [dBi]. */
  readonly directivityDbi: number;
  /** Maximum effective area λ² D / 4π [m²] (lossless, conjugate-matched, polarisation-matched). */
  readonly effectiveAreaM2: number;
  /** Direction of the maximum, θ [rad]. */
  readonly peakThetaRad: number;
  /** Direction of the maximum, φ [rad]. */
  readonly peakPhiRad: number;
  /** Method used for R. */
  readonly method: RadiationMethod;
}

function readMethod(o: RadiationOptions): RadiationMethod {
  if (o === null || typeof o !== 'object') throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(o)}.`);
  assertGroundPlane('options.groundPlane', o.groundPlane);
  const m = o.method ?? 'closed-form';
  if (m !== 'closed-form' && m !== 'quadrature') {
    throw new DomainError(`invalid argument "options.method": expected 'closed-form' or 'quadrature', received ${describeValue(m)}.`);
  }
  return m;
}

/** |f|² [V²] at one direction for 1 A. */
function powerPattern(g: DipoleGeometry, model: CurrentModel, k: number, plane: GroundPlane | undefined, th: number, ph: number, buf: Float64Array): number {
  buf.fill(0);
  accumulateElementFarField(buf.subarray(0, 2), buf.subarray(2, 4), 0, g, model, k, 1, [th], [ph], plane);
  return buf[0] * buf[0] + buf[1] * buf[1] + buf[2] * buf[2] + buf[3] * buf[3];
}

/** Maximum of |f|² over the sphere (or upper hemisphere): dense search, then golden refinement. */
function patternMaximum(g: DipoleGeometry, model: CurrentModel, k: number, plane: GroundPlane | undefined): { value: number; th: number; ph: number } {
  const buf = new Float64Array(4);
  const f = (th: number, ph: number) => powerPattern(g, model, k, plane, th, ph, buf);
  const thMax = plane ? Math.PI / 2 : Math.PI;
  let best = { value: -1, th: 0, ph: 0 };
  const nt = 90, np = 180;
  for (let i = 0; i <= nt; i++) {
    for (let j = 0; j < np; j++) {
      const th = (thMax * i) / nt, ph = (2 * Math.PI * j) / np;
      const v = f(th, ph);
      if (v > best.value) best = { value: v, th, ph };
    }
  }
  // alternate golden-section searches in θ and φ around the best sample
  let dth = thMax / nt, dph = (2 * Math.PI) / np;
  for (let round = 0; round < 6; round++) {
    best.th = golden((t) => f(t, best.ph), Math.max(0, best.th - dth), Math.min(thMax, best.th + dth));
    best.ph = golden((p) => f(best.th, p), best.ph - dph, best.ph + dph);
    dth /= 4; dph /= 4;
  }
  best.value = f(best.th, best.ph);
  best.ph = ((best.ph % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
  return best;
}

function golden(fn: (x: number) => number, a: number, b: number): number {
  const r = (Math.sqrt(5) - 1) / 2;
  let c = b - r * (b - a), d = a + r * (b - a);
  let fc = fn(c), fd = fn(d);
  for (let it = 0; it < 80 && b - a > 1e-12; it++) {
    if (fc > fd) { b = d; d = c; fd = fc; c = b - r * (b - a); fc = fn(c); } else { a = c; c = d; fc = fd; d = a + r * (b - a); fd = fn(d); }
  }
  return (a + b) / 2;
}

/** (1/η)∮|f|² dΩ for 1 A by the geometry sphere rule; over ground via the image identity. */
function quadratureResistance(g: DipoleGeometry, model: CurrentModel, k: number, plane: GroundPlane | undefined): number {
  // Over a PEC plane the field above is that of the element plus its image in free space, and
  // that free-space pattern has |F(mirror r̂)| = |F(r̂)|, so ∫_upper |F|² = ½ ∮ |F|².
  const parts = plane ? [g, imageGeometry(g, plane)] : [g];
  let extent = 2 * g.halfLengthM;
  if (plane) extent += 2 * Math.abs(g.cz - plane.zM);
  const order = sphereQuadratureOrder(k * extent, { extraDegree: Math.ceil(2 * k * g.halfLengthM) + 8 });
  const q = sphereQuadrature(order.thetaCount, order.phiCount);
  const th = new Float64Array(q.count), ph = new Float64Array(q.count);
  for (let j = 0; j < q.phiCount; j++) for (let i = 0; i < q.thetaCount; i++) { th[j * q.thetaCount + i] = q.thetaRad[i]; ph[j * q.thetaCount + i] = q.phiRad[j]; }
  const ft = new Float64Array(2 * q.count), fp = new Float64Array(2 * q.count);
  for (const e of parts) accumulateElementFarField(ft, fp, 0, e, model, k, 1, th, ph, undefined);
  let s = 0;
  for (let c = 0; c < q.count; c++) s += q.weights[c] * (ft[2 * c] ** 2 + ft[2 * c + 1] ** 2 + fp[2 * c] ** 2 + fp[2 * c + 1] ** 2);
  return (plane ? 0.5 : 1) * s / ETA0_OHM;
}

function finish(r: number, maxF2: number, th: number, ph: number, k: number, method: RadiationMethod): RadiationProperties {
  const d = (4 * Math.PI * maxF2) / (ETA0_OHM * r);
  const lambda = (2 * Math.PI) / k;
  return {
    radiationResistanceOhm: r, directivity: d, directivityDbi: 10 * Math.log10(d), effectiveAreaM2: (lambda * lambda * d) / (4 * Math.PI),
    peakThetaRad: th, peakPhiRad: ph, method,
  };
}

/**
 * Radiation resistance of an isolated thin sinusoidal dipole referred to its
 * terminals, closed form in Si/Ci.
 *
 * @remarks
 * R_in = R_m / sin²(kl/2) with the current-maximum value
 * R_m = η/(2π){γ + ln(kl) − Ci(kl) + ½ sin(kl)[Si(2kl) − 2Si(kl)]
 * + ½ cos(kl)[γ + ln(kl/2) + Ci(2kl) − 2Ci(kl)]}
 * (Balanis, Antenna Theory, 4th ed., 2016, eqs. (4-70), (4-79), from memory).
 * Half-wave: 73.08 Ω with η0.
 * @param lengthM - Length l [m], > 0, not a whole number of wavelengths.
 * @param frequencyHz - Frequency [Hz].
 * @returns R_in [Ω].
 * @throws {@link DomainError} for bad arguments.
 * @category Elements
 */
export function wireDipoleRadiationResistance(lengthM: number, frequencyHz: number): number {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  dipoleGeometry('dipole', { centerM: [0, 0, 0], axis: [0, 0, 1], lengthM, radiusM: lengthM * 1e-9 }, k);
  return closedFormDipoleResistance(k, lengthM);
}

function closedFormDipoleResistance(k: number, lengthM: number): number {
  const kl = k * lengthM;
  const [s1, c1] = sici(kl);
  const [s2, c2] = sici(2 * kl);
  const rm = (ETA0_OHM / (2 * Math.PI)) * (EULER_GAMMA + Math.log(kl) - c1 + 0.5 * Math.sin(kl) * (s2 - 2 * s1)
    + 0.5 * Math.cos(kl) * (EULER_GAMMA + Math.log(kl / 2) + c2 - 2 * c1));
  return rm / Math.sin(kl / 2) ** 2;
}

/**
 * Radiation resistance of a Hertzian (uniform-current) element of length L:
 * R = (2π/3) η (L/λ)², i.e. 80π²(L/λ)² with η = 120π Ω (Balanis, Antenna
 * Theory, 4th ed., 2016, eq. (4-19), from memory).
 * @param lengthM - Length L [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns R [Ω].
 * @throws {@link DomainError} for bad arguments.
 * @category Elements
 */
export function hertzianRadiationResistance(lengthM: number, frequencyHz: number): number {
  assertPositive('lengthM', lengthM, 'm');
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const lambda = C0_M_PER_S / frequencyHz;
  return ((2 * Math.PI) / 3) * ETA0_OHM * (lengthM / lambda) ** 2;
}

/** j0, j1, j2 spherical Bessel functions (series for small x). */
function sphericalBessel(x: number): [number, number, number] {
  if (x < 1e-2) {
    const x2 = x * x;
    return [1 - x2 / 6 + (x2 * x2) / 120, (x / 3) * (1 - x2 / 10), (x2 / 15) * (1 - x2 / 14)];
  }
  const s = Math.sin(x), c = Math.cos(x);
  const j0 = s / x, j1 = s / (x * x) - c / x;
  return [j0, j1, (3 / (x * x) - 1) * j0 - (3 * c) / (x * x)];
}

/** Mutual radiation resistance of two short uniform elements (point limit) [Ω]. @internal */
export function hertzianMutualResistance(k: number, a: DipoleGeometry, b: DipoleGeometry): number {
  const dx = b.cx - a.cx, dy = b.cy - a.cy, dz = b.cz - a.cz;
  const d = Math.hypot(dx, dy, dz);
  const x = k * d;
  const [j0, j1, j2] = sphericalBessel(x);
  const ab = a.ax * b.ax + a.ay * b.ay + a.az * b.az;
  let ad = 0, bd = 0;
  if (d > 0) { ad = (a.ax * dx + a.ay * dy + a.az * dz) / d; bd = (b.ax * dx + b.ay * dy + b.az * dz) / d; }
  const j1x = x < 1e-2 ? (1 - (x * x) / 10) / 3 : j1 / x;
  // (1/η)(ηk/4π)² L_a L_b · 4π[(a·b)(j0 − j1/x) + (a·d̂)(b·d̂) j2]
  return ((ETA0_OHM * k * k * 4 * a.halfLengthM * b.halfLengthM) / (4 * Math.PI)) * (ab * (j0 - j1x) + ad * bd * j2);
}

/**
 * Radiation resistance, directivity and effective area of a thin sinusoidal
 * wire dipole, in free space or over a PEC ground plane.
 *
 * @remarks
 * Closed form: the isolated R_in of {@link wireDipoleRadiationResistance}, plus
 * over ground the real part of the induced-EMF coupling to the image (Si/Ci
 * when the dipole is parallel or perpendicular to the plane, Gauss–Legendre
 * otherwise). Quadrature: (1/η)∮|f|²dΩ with the geometry module's rule, its
 * order from the element's electrical size (over ground, ½ of the free-space
 * dipole-plus-image integral, which equals the upper-hemisphere integral by
 * mirror symmetry). The directivity uses the pattern maximum found by a dense
 * search refined by golden sections. Half-wave in free space: R = 73.08 Ω,
 * D = 1.641 (2.15 dBi) (Balanis, Antenna Theory, 4th ed., 2016, §4.6, from memory).
 *
 * @param dipole - The dipole (its radius is not used: thin-wire limit).
 * @param frequencyHz - Frequency [Hz].
 * @param options - Ground plane and method.
 * @returns The radiation figures.
 * @throws {@link DomainError} for bad arguments or a dipole at or below the ground plane.
 * @category Elements
 */
export function wireDipoleRadiation(dipole: WireDipole, frequencyHz: number, options: RadiationOptions = {}): RadiationProperties {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const method = readMethod(options);
  const g = dipoleGeometry('dipole', dipole, k);
  const plane = options.groundPlane;
  if (plane) assertAboveGround('dipole', g, plane);
  let r: number;
  if (method === 'quadrature') r = quadratureResistance(g, SINUSOIDAL_CURRENT, k, plane);
  else {
    r = closedFormDipoleResistance(k, 2 * g.halfLengthM);
    if (plane) {
      const img = imageGeometry(g, plane);
      const out = new Float64Array(2);
      const dot = g.ax * img.ax + g.ay * img.ay + g.az * img.az;
      if (1 - Math.abs(dot) < 1e-12) {
        const dz = img.cz - g.cz;
        const along = dz * g.az;
        const perp = Math.sqrt(Math.max(0, dz * dz - along * along));
        parallelMutualImpedanceInto(out, k, g.halfLengthM, g.halfLengthM, perp < 1e-13 * Math.abs(along) ? 0 : perp, along);
        if (dot < 0) out[0] = -out[0];
      } else {
        generalMutualImpedanceInto(out, g, img, k, 2 * (g.cz - plane.zM) - 2 * g.halfLengthM * Math.abs(g.az), { nodesPerSegment: 16, maxSegmentWavelengths: 0.25 });
      }
      r += out[0];
    }
  }
  const peak = patternMaximum(g, SINUSOIDAL_CURRENT, k, plane);
  return finish(r, peak.value, peak.th, peak.ph, k, method);
}

/**
 * Radiation resistance, directivity (1.5 in free space) and effective area of a
 * Hertzian element, in free space or over a PEC ground plane.
 *
 * @remarks
 * Closed form: (2π/3)η(L/λ)² (Balanis eq. (4-19), from memory) plus, over
 * ground, the mutual radiation resistance to the image,
 * (ηk²L²/4π)[(â·b̂)(j₀ − j₁/x) + (â·d̂)(b̂·d̂) j₂], x = k d, d = 2h (our
 * derivation from ∮ r̂ᵢr̂ⱼ e^{jk r̂·d} dΩ = 4π[δᵢⱼ j₁(x)/x − d̂ᵢd̂ⱼ j₂(x)]);
 * quadrature as in {@link wireDipoleRadiation}. The closed form treats the
 * element as a point (L ≪ λ); the quadrature integrates the exact uniform
 * current of length L, so the two differ by O((kL)²).
 *
 * @param dipole - The element.
 * @param frequencyHz - Frequency [Hz].
 * @param options - Ground plane and method.
 * @returns The radiation figures.
 * @throws {@link DomainError} for bad arguments.
 * @category Elements
 */
export function hertzianDipoleRadiation(dipole: HertzianDipole, frequencyHz: number, options: RadiationOptions = {}): RadiationProperties {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const method = readMethod(options);
  const g = hertzianGeometry('dipole', dipole);
  const plane = options.groundPlane;
  if (plane) assertAboveGround('dipole', g, plane);
  let r: number;
  if (method === 'quadrature') r = quadratureResistance(g, UNIFORM_CURRENT, k, plane);
  else {
    r = hertzianMutualResistance(k, g, g);
    if (plane) r += hertzianMutualResistance(k, g, imageGeometry(g, plane));
  }
  const peak = patternMaximum(g, UNIFORM_CURRENT, k, plane);
  return finish(r, peak.value, peak.th, peak.ph, k, method);
}

/**
 * Radiation figures of the teaching isotropic radiator: R as given, D = 1,
 * A_e = λ²/4π (see the caveat on {@link IsotropicRadiator}).
 * @param radiator - Position [m] and radiation resistance [Ω].
 * @param frequencyHz - Frequency [Hz].
 * @returns The radiation figures (peak direction reported as θ = 0, φ = 0).
 * @throws {@link DomainError} for bad arguments.
 * @category Elements
 */
export function isotropicRadiation(radiator: IsotropicRadiator, frequencyHz: number): RadiationProperties {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (radiator === null || typeof radiator !== 'object') throw new DomainError(`invalid argument "radiator": expected {centerM, radiationResistanceOhm}, received ${describeValue(radiator)}.`);
  assertVector3('radiator.centerM', radiator.centerM);
  assertPositive('radiator.radiationResistanceOhm', radiator.radiationResistanceOhm, 'Ω');
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  checkFarFieldOptions({});
  const r = radiator.radiationResistanceOhm;
  return finish(r, (ETA0_OHM * r) / (4 * Math.PI), 0, 0, k, 'closed-form');
}

/**
 * Radiation-resistance matrix of an array from its open-circuit embedded
 * patterns by sphere quadrature: R_mn = (1/(η|I₀|²)) ∮ fₘ·fₙ* dΩ.
 *
 * @remarks
 * With RMS phasors the radiated power of port currents I is
 * P = (1/η)∮|Σ Iₙfₙ/I₀|² dΩ = Iᴴ R I, and for a lossless reciprocal array
 * Re Z = R (the Twiss / brightness-integral identity of the conventions: isotropic
 * brightness T gives 4k_B T B R = 2k_B T B (Z + Zᴴ)). `weightsSr` are the
 * solid-angle weights of the set's grid columns — e.g. build the set on
 * `sphereQuadrature(...).thetaRad/phiRad` and pass its `weights` (same column
 * order, θ fastest). Patterns over a PEC ground plane vanish below the
 * horizon; with an EVEN number of Gauss–Legendre θ nodes the symmetric rule
 * has no node on the horizon and sums exactly half of the mirror-symmetric
 * dipole-plus-image pattern, so it keeps its spectral accuracy (tested to
 * 1e-9). With an odd count the node at θ = π/2 is counted in full and the
 * error is O(1/n) for elements with a field at the horizon (vertical dipoles:
 * 28 % at n = 15, 6.6 % at n = 65, measured).
 *
 * @param set - Open-circuit embedded patterns (excitation `open-circuit-current`).
 * @param weightsSr - Quadrature weight of each grid column [sr], length nθ·nφ.
 * @returns R [Ω], N×N Hermitian (real symmetric for reciprocal arrays).
 * @throws {@link DomainError} if the set is not open-circuit or weights are not finite; {@link DimensionError} for a wrong weight count.
 * @category Elements
 */
export function radiationResistanceMatrix(set: EmbeddedPatternSet, weightsSr: ArrayLike<number>): CMatrix {
  embeddedPatternSet(set);
  if (set.excitation.kind !== 'open-circuit-current') {
    throw new DomainError(`invalid argument "set": expected open-circuit patterns, received "${set.excitation.kind}"; convert with convertPatternExcitation first.`);
  }
  const m = set.thetaRad.length * set.phiRad.length, n = set.portCount;
  if (weightsSr.length !== m) {
    throw new DimensionError(`invalid argument "weightsSr": expected ${m} weights (one per grid column), received ${weightsSr.length}.`);
  }
  assertFiniteArray('weightsSr', weightsSr);
  const t = set.thetaComponentV.data, p = set.phiComponentV.data;
  const out = new Float64Array(2 * n * n);
  const s = 1 / (ETA0_OHM * set.excitation.driveCurrentA ** 2);
  for (let a = 0; a < n; a++) {
    for (let b = a; b < n; b++) {
      let re = 0, im = 0;
      const oa = 2 * a * m, ob = 2 * b * m;
      for (let c = 0; c < m; c++) {
        const w = weightsSr[c];
        const i = 2 * c;
        // fa · conj(fb)
        re += w * (t[oa + i] * t[ob + i] + t[oa + i + 1] * t[ob + i + 1] + p[oa + i] * p[ob + i] + p[oa + i + 1] * p[ob + i + 1]);
        im += w * (t[oa + i + 1] * t[ob + i] - t[oa + i] * t[ob + i + 1] + p[oa + i + 1] * p[ob + i] - p[oa + i] * p[ob + i + 1]);
      }
      out[2 * (a * n + b)] = s * re; out[2 * (a * n + b) + 1] = s * im;
      out[2 * (b * n + a)] = s * re; out[2 * (b * n + a) + 1] = -s * im;
    }
  }
  return matrixView(n, n, out);
}
