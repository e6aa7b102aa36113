/**
 * Builders of the reception inputs from the element module: analytic wire
 * dipoles (patterns filled block by block + induced-EMF impedance matrix) and
 * imported embedded-pattern sets (interpolated at any direction).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteCMatrix, assertPositive, assertSquare, describeValue } from '../internal/validate.js';
import { C0_M_PER_S, ETA0_OHM } from '../units/constants.js';
import { accumulateElementFarField, hertzianGeometry, SINUSOIDAL_CURRENT } from '../element/farField.js';
import { dipoleArrayImpedanceMatrix, type InducedEmfOptions } from '../element/mutualImpedance.js';
import { convertPatternExcitation, embeddedPatternSet, type EmbeddedPatternSet } from '../element/patternSet.js';
import { patternInterpolator } from '../element/patternInterpolation.js';
import { assertAboveGround, dipoleGeometry, imageGeometry, type DipoleGeometry, type GroundPlane, type HertzianDipole, type WireDipole } from '../element/types.js';
import { hertzianMutualResistance } from '../element/radiation.js';
import type { ShiftedElementPattern } from './displacement.js';
import type { PortPatternSource } from './patterns.js';
import { physicalCheck, type PhysicalCheck } from '../checks.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * The ports of a receiving array with a pattern source that fills any block
 * of directions (bounded memory) and its impedance matrix.
 * @category Reception
 */
export interface ArrayPortSource {
  /** Embedded open-circuit patterns, filled on demand. */
  readonly patterns: PortPatternSource;
  /** Impedance matrix Z_A [Ω], N×N. */
  readonly impedanceOhm: CMatrix;
  /** Validity checks of the element model at this frequency (e.g. {@link dipoleModelChecks}); copied into every evaluation's checks. */
  readonly checks?: ReadonlyArray<PhysicalCheck>;
  /** Where the elements are (for the adaptive sphere rule). */
  readonly geometry?: PortGeometry;
}

/**
 * Where the elements of an array are: what the adaptive sphere rule needs to
 * size itself (electrical extent, element size, ground-plane images).
 * @category Reception
 */
export interface PortGeometry {
  /** Phase centre of every radiating element [m], 3 values (x, y, z) each: one per port, plus any terminated elements that still radiate (imperfect module's failedArrayPorts). */
  readonly positionsM: Float64Array;
  /** Largest dimension of one element [m] (its pattern varies on this scale), ≥ 0. */
  readonly elementSizeM: number;
  /** Height z of an infinite PEC ground plane [m]; the patterns vanish below it. @defaultValue no ground plane */
  readonly groundPlaneZM?: number;
}

/** Longest dipole of the one-mode induced-EMF model, in wavelengths (common practice). */
export const DIPOLE_MODEL_MAX_LENGTH_WAVELENGTHS = 1;
/** Thickest wire of the thin-wire model, radius in wavelengths (common practice). */
export const DIPOLE_MODEL_MAX_RADIUS_WAVELENGTHS = 0.01;

/**
 * Validity checks of the one-mode (sinusoidal-current) induced-EMF dipole model at a frequency.
 *
 * @remarks
 * Two limits, both common practice (C. A. Balanis, *Antenna Theory*, 4th ed.,
 * Wiley, 2016, §4.6 and §8.5–8.6, from memory: the sinusoidal current is a good
 * approximation of a thin centre-fed wire's current up to about one
 * wavelength; longer wires carry several current modes and the feed current,
 * hence Z, departs from the one-mode value; the thin-wire kernel needs a ≪ λ):
 * - `elementModel.electricalLength`: longest l/λ ≤ {@link DIPOLE_MODEL_MAX_LENGTH_WAVELENGTHS};
 * - `elementModel.wireRadius`: thickest a/λ ≤ {@link DIPOLE_MODEL_MAX_RADIUS_WAVELENGTHS}.
 * A 25 λ dipole, or any dipole at 10³⁰ Hz, fails the first.
 * @param dipoles - The dipoles [m].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns The two checks.
 * @throws {@link DomainError} for a bad frequency or an empty list.
 * @category Reception
 */
export function dipoleModelChecks(dipoles: ReadonlyArray<WireDipole>, frequencyHz: number): PhysicalCheck[] {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (!Array.isArray(dipoles) || dipoles.length === 0) {
    throw new DomainError(`invalid argument "dipoles": expected a non-empty array of WireDipole, received ${describeValue(dipoles)}.`);
  }
  const lambda = C0_M_PER_S / frequencyHz;
  let lMax = 0, aMax = 0;
  for (const d of dipoles) { lMax = Math.max(lMax, d.lengthM / lambda); aMax = Math.max(aMax, d.radiusM / lambda); }
  return [
    physicalCheck('elementModel.electricalLength', lMax, 'atMost', DIPOLE_MODEL_MAX_LENGTH_WAVELENGTHS,
      `longest dipole length in wavelengths l/λ (linear); the one-mode sinusoidal-current induced-EMF model holds up to about ${DIPOLE_MODEL_MAX_LENGTH_WAVELENGTHS} λ (common practice), beyond it Z, the patterns and every figure are not trustworthy`,
      ['*']),
    physicalCheck('elementModel.wireRadius', aMax, 'atMost', DIPOLE_MODEL_MAX_RADIUS_WAVELENGTHS,
      `thickest wire radius in wavelengths a/λ (linear); the thin-wire self impedance needs a ≤ ${DIPOLE_MODEL_MAX_RADIUS_WAVELENGTHS} λ (common practice)`,
      ['*']),
  ];
}

/**
 * Options of {@link dipoleArrayPorts}.
 * @category Reception
 */
export interface DipoleArrayPortsOptions extends InducedEmfOptions {
  /** RMS drive current the patterns are referred to [A]. @defaultValue 1 */
  driveCurrentA?: number;
}

/**
 * Ports of an array of thin wire dipoles (optionally over a PEC ground plane):
 * embedded open-circuit patterns with the sinusoidal-current model and the
 * induced-EMF impedance matrix, both from the element module.
 *
 * @remarks
 * The pattern source evaluates the element module's far field block by block
 * (nothing is stored per direction), in the conventions' "embedded pattern"
 * convention with every other port open. With the single-mode sinusoidal
 * current the open-port embedded pattern of each dipole is its isolated
 * pattern (an open thin dipole carries no current in this model), and Z and
 * the patterns come from the same current, so the Twiss identity holds to the
 * quadrature's accuracy (tested to 1e-9). Source: C. A. Balanis, *Antenna
 * Theory*, 4th ed., Wiley, 2016, §4.6 and §8.6 (from memory).
 * @param dipoles - The N dipoles [m].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Ground plane, induced-EMF integration controls, drive current.
 * @returns Pattern source, Z [Ω] and the model-validity checks of {@link dipoleModelChecks}.
 * @throws {@link DomainError} for invalid dipoles (zero length, whole-wavelength length, below the ground plane) or options.
 * @category Reception
 */
export function dipoleArrayPorts(dipoles: ReadonlyArray<WireDipole>, frequencyHz: number, options: DipoleArrayPortsOptions = {}): ArrayPortSource {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (!Array.isArray(dipoles) || dipoles.length === 0) {
    throw new DomainError(`invalid argument "dipoles": expected a non-empty array of WireDipole, received ${describeValue(dipoles)}.`);
  }
  if (options === null || typeof options !== 'object') {
    throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(options)}.`);
  }
  const i0 = options.driveCurrentA ?? 1;
  assertPositive('options.driveCurrentA', i0, 'A');
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const plane = options.groundPlane;
  const geo = dipoles.map((d, i) => {
    const g = dipoleGeometry(`dipoles[${i}]`, d, k);
    if (plane) assertAboveGround(`dipoles[${i}]`, g, plane);
    return g;
  });
  const impedanceOhm = dipoleArrayImpedanceMatrix(dipoles, frequencyHz, options);
  const n = geo.length;
  const shifted = shiftedDipoles(geo, plane, (g, th, ph, start, count, outTheta, outPhi) => {
    outTheta.fill(0, 0, 2 * count); outPhi.fill(0, 0, 2 * count);
    accumulateElementFarField(outTheta, outPhi, 0, g, SINUSOIDAL_CURRENT, k, i0, th.subarray(start, start + count), ph.subarray(start, start + count), plane);
  }, i0, frequencyHz);
  return {
    impedanceOhm,
    checks: dipoleModelChecks(dipoles, frequencyHz),
    geometry: {
      positionsM: Float64Array.from(geo.flatMap((g) => [g.cx, g.cy, g.cz])),
      elementSizeM: Math.max(...geo.map((g) => 2 * g.halfLengthM)),
      groundPlaneZM: plane?.zM,
    },
    patterns: {
      portCount: n, driveCurrentA: i0, frequencyHz, shifted,
      fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
        const th = thetaRad.subarray(start, start + count), ph = phiRad.subarray(start, start + count);
        for (let p = 0; p < n; p++) {
          outTheta.fill(0, 2 * p * ld, 2 * (p * ld + count));
          outPhi.fill(0, 2 * p * ld, 2 * (p * ld + count));
          accumulateElementFarField(outTheta, outPhi, p * ld, geo[p], SINUSOIDAL_CURRENT, k, i0, th, ph, plane);
        }
      },
    },
  };
}

/**
 * The displacement description of identical dipoles (same length, radius and
 * axis; with a ground plane also the same height), or undefined.
 */
function shiftedDipoles(
  geo: ReadonlyArray<DipoleGeometry>, plane: GroundPlane | undefined,
  fillOne: (g: DipoleGeometry, th: Float64Array, ph: Float64Array, start: number, count: number, outTheta: Float64Array, outPhi: Float64Array) => void,
  driveCurrentA: number, frequencyHz: number,
): ShiftedElementPattern | undefined {
  const g0 = geo[0];
  const same = (a: number, b: number): boolean => Math.abs(a - b) <= 1e-12 * Math.max(Math.abs(a), Math.abs(b), 1e-300);
  for (const g of geo) {
    if (!same(g.halfLengthM, g0.halfLengthM) || !same(g.radiusM, g0.radiusM)) return undefined;
    if (Math.abs(g.ax - g0.ax) > 1e-12 || Math.abs(g.ay - g0.ay) > 1e-12 || Math.abs(g.az - g0.az) > 1e-12) return undefined;
    if (plane && Math.abs(g.cz - g0.cz) > 1e-12 * Math.max(Math.abs(g0.cz), 1)) return undefined;
  }
  const ref: DipoleGeometry = { ...g0, cx: 0, cy: 0, cz: plane ? g0.cz : 0 };
  const offsetsM = new Float64Array(3 * geo.length);
  geo.forEach((g, i) => { offsetsM[3 * i] = g.cx; offsetsM[3 * i + 1] = g.cy; offsetsM[3 * i + 2] = plane ? 0 : g.cz; });
  return {
    offsetsM,
    element: {
      portCount: 1, driveCurrentA, frequencyHz,
      fill(thetaRad, phiRad, start, count, outTheta, outPhi) { fillOne(ref, thetaRad, phiRad, start, count, outTheta, outPhi); },
    },
  };
}

/**
 * Ports from imported data: an embedded-pattern set (any excitation record,
 * converted to the open-circuit convention with Z) and the impedance matrix;
 * the pattern source interpolates the set at any direction.
 *
 * @remarks
 * Conversion and interpolation are the element module's
 * (convertPatternExcitation, patternInterpolator). Directions outside the
 * set's θ range throw when requested.
 * @param set - Embedded patterns on a θ-φ grid.
 * @param impedanceOhm - Z_A [Ω], N×N, the same ports.
 * @returns Pattern source and Z.
 * @throws {@link DimensionError} / {@link DomainError} for an invalid set or a Z of another size.
 * @category Reception
 */
export function patternSetPorts(set: EmbeddedPatternSet, impedanceOhm: CMatrix): ArrayPortSource {
  embeddedPatternSet(set);
  const i0 = set.excitation.kind === 'open-circuit-current' ? set.excitation.driveCurrentA : 1;
  const oc = set.excitation.kind === 'open-circuit-current'
    ? set
    : convertPatternExcitation(set, impedanceOhm, { kind: 'open-circuit-current', driveCurrentA: i0 });
  const interp = patternInterpolator(oc);
  const n = set.portCount;
  return {
    impedanceOhm,
    patterns: {
      portCount: n, driveCurrentA: i0, frequencyHz: set.frequencyHz,
      fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
        const r = interp.evaluate(thetaRad.subarray(start, start + count), phiRad.subarray(start, start + count));
        for (let p = 0; p < n; p++) {
          outTheta.set(r.thetaComponentV.data.subarray(2 * p * count, 2 * (p + 1) * count), 2 * p * ld);
          outPhi.set(r.phiComponentV.data.subarray(2 * p * count, 2 * (p + 1) * count), 2 * p * ld);
        }
      },
    },
  };
}

/**
 * Options of {@link hertzianDipolePorts}.
 * @category Reception
 */
export interface HertzianDipolePortsOptions {
  /** PEC ground plane z = zM (elements above it). @defaultValue none (free space) */
  groundPlane?: GroundPlane;
  /** RMS drive current the patterns are referred to [A]. @defaultValue 1 */
  driveCurrentA?: number;
  /** Reactance matrix X [Ω], N×N real, added as jX to the radiation resistance. @defaultValue 0 (ideally tuned elements) */
  reactanceOhm?: CMatrix;
}

/**
 * Ports of an array of Hertzian (point current-moment) elements, optionally over a PEC ground
 * plane: embedded patterns in the reception module's N×M shape and Z = R_rad + jX.
 *
 * @remarks
 * Each element is the point limit of a uniform current I₀ over length L along â at cₙ:
 * fₙ(r̂) = j(η k I₀ L/4π)(r̂ × (r̂ × â))·e^{+j k r̂·cₙ}, i.e. f_θ = −j(ηkI₀L/4π)(â·θ̂)e^{jk r̂·cₙ}
 * (Balanis, *Antenna Theory*, 4th ed., 2016, eq. (4-26a), from memory), plus the image
 * (horizontal components reversed) over a ground plane, zero below it. The radiation
 * resistance matrix is the closed form R_mn = (ηk²LₘLₙ/4π)[(âₘ·âₙ)(j₀ − j₁/x) + (âₘ·d̂)(âₙ·d̂)j₂],
 * x = k|cₙ − cₘ| (the element module's point-limit mutual resistance), with the image terms
 * over ground; patterns and R describe the same currents, so the Twiss identity holds to the
 * sphere rule's accuracy (tested to 1e-12). The point element's reactance is not defined by
 * this model (it depends on the wire and its tuning): Z = R + jX with X from the options,
 * zero by default (elements tuned to resonance, mutual reactance neglected) — state it when
 * the amplifiers' noise matching matters. Unlike {@link hertzianDipoleFarField}, the finite
 * length's sinc factor (1 − O((kL)²)) is not applied.
 * @param dipoles - The N elements (position [m], axis, length L [m]).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Ground plane, drive current, reactance.
 * @returns Pattern source (with the displacement description when the elements are identical,
 *   and one height over ground), Z [Ω] and the element positions.
 * @throws {@link DomainError} for bad elements, an element at or below the ground plane or bad options;
 *   {@link DimensionError} for a reactance matrix of the wrong size.
 * @example
 * ```ts
 * // two z-directed elements 0.1 m long, λ/2 apart at λ = 1 m
 * const ports = hertzianDipolePorts([{ centerM: [0, 0, 0], axis: [0, 0, 1], lengthM: 0.1 }, { centerM: [0.5, 0, 0], axis: [0, 0, 1], lengthM: 0.1 }], 299792458);
 * ports.impedanceOhm.data[0]; // ≈ 7.8902 Ω (= (2π/3)η(L/λ)², Balanis eq. (4-19))
 * ```
 * @category Reception
 */
export function hertzianDipolePorts(dipoles: ReadonlyArray<HertzianDipole>, frequencyHz: number, options: HertzianDipolePortsOptions = {}): ArrayPortSource {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (!Array.isArray(dipoles) || dipoles.length === 0) {
    throw new DomainError(`invalid argument "dipoles": expected a non-empty array of HertzianDipole, received ${describeValue(dipoles)}.`);
  }
  if (options === null || typeof options !== 'object') throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(options)}.`);
  const i0 = options.driveCurrentA ?? 1;
  assertPositive('options.driveCurrentA', i0, 'A');
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const plane = options.groundPlane;
  const geo = dipoles.map((d, i) => {
    const g = hertzianGeometry(`dipoles[${i}]`, d);
    if (plane) assertAboveGround(`dipoles[${i}]`, g, plane);
    return g;
  });
  const n = geo.length;
  const z: CMatrix = matrixView(n, n, new Float64Array(2 * n * n));
  for (let a = 0; a < n; a++) {
    for (let b = 0; b < n; b++) {
      let r = hertzianMutualResistance(k, geo[a], geo[b]);
      if (plane) r += hertzianMutualResistance(k, geo[a], imageGeometry(geo[b], plane));
      z.data[2 * (a * n + b)] = r;
    }
  }
  if (options.reactanceOhm !== undefined) {
    const x = options.reactanceOhm;
    assertSquare('options.reactanceOhm', x);
    assertFiniteCMatrix('options.reactanceOhm', x);
    if (x.rows !== n) throw new DimensionError(`invalid argument "options.reactanceOhm": expected ${n}×${n} (one row per element), received ${x.rows}×${x.cols}.`);
    for (let q = 0; q < n * n; q++) {
      if (x.data[2 * q + 1] !== 0) throw new DomainError('invalid argument "options.reactanceOhm": expected a real matrix X (it is added as jX).');
      z.data[2 * q + 1] = x.data[2 * q];
    }
  }
  const fillFor = (list: ReadonlyArray<DipoleGeometry>): PortPatternSource['fill'] => hertzianFill(list.flatMap((g) => (plane ? [g, imageGeometry(g, plane)] : [g])), plane ? 2 : 1, plane !== undefined, k, i0);
  const shifted = shiftedDipoles(geo, plane, (g, th, ph, start, count, outTheta, outPhi) => fillFor([g])(th, ph, start, count, outTheta, outPhi, count), i0, frequencyHz);
  return {
    impedanceOhm: z,
    geometry: {
      positionsM: Float64Array.from(geo.flatMap((g) => [g.cx, g.cy, g.cz])),
      elementSizeM: Math.max(...geo.map((g) => 2 * g.halfLengthM)),
      groundPlaneZM: plane?.zM,
    },
    patterns: { portCount: n, driveCurrentA: i0, frequencyHz, shifted, fill: fillFor(geo) },
  };
}

/** The pattern fill of point elements (`per` sources per port: the element and, over ground, its image). */
function hertzianFill(sources: ReadonlyArray<DipoleGeometry>, per: number, ground: boolean, k: number, i0: number): PortPatternSource['fill'] {
  const n = sources.length / per;
  return (thetaRad, phiRad, start, count, outTheta, outPhi, ld) => {
    for (let c = 0; c < count; c++) {
      const t = thetaRad[start + c], p = phiRad[start + c];
      const st = Math.sin(t), ct = Math.cos(t), sp = Math.sin(p), cp = Math.cos(p);
      const ux = st * cp, uy = st * sp, uz = ct;
      const below = ground && uz < 0;
      for (let m = 0; m < n; m++) {
        let tr = 0, ti = 0, pr = 0, pi = 0;
        if (!below) {
          for (let q = 0; q < per; q++) {
            const g = sources[m * per + q];
            const amp = (ETA0_OHM * k * i0 * 2 * g.halfLengthM) / (4 * Math.PI);
            const at = g.ax * ct * cp + g.ay * ct * sp - g.az * st; // â·θ̂
            const ap = -g.ax * sp + g.ay * cp; // â·φ̂
            const psi = k * (ux * g.cx + uy * g.cy + uz * g.cz);
            const cr = Math.cos(psi), ci = Math.sin(psi);
            // −j·amp·(â·ê)·e^{jψ} = amp·(â·ê)·(sin ψ − j cos ψ)
            tr += amp * at * ci; ti -= amp * at * cr;
            pr += amp * ap * ci; pi -= amp * ap * cr;
          }
        }
        const o = 2 * (m * ld + c);
        outTheta[o] = tr; outTheta[o + 1] = ti;
        outPhi[o] = pr; outPhi[o + 1] = pi;
      }
    }
  };
}
