/**
 * Builders of the reception inputs from the element module: analytic wire
 * dipoles (patterns filled block by block + induced-EMF impedance matrix) and
 * imported embedded-pattern sets (interpolated at any direction).
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertPositive, describeValue } from '../internal/validate.js';
import { C0_M_PER_S } from '../units/constants.js';
import { accumulateElementFarField, SINUSOIDAL_CURRENT } from '../element/farField.js';
import { dipoleArrayImpedanceMatrix, type InducedEmfOptions } from '../element/mutualImpedance.js';
import { convertPatternExcitation, embeddedPatternSet, type EmbeddedPatternSet } from '../element/patternSet.js';
import { patternInterpolator } from '../element/patternInterpolation.js';
import { assertAboveGround, dipoleGeometry, type DipoleGeometry, type GroundPlane, type WireDipole } from '../element/types.js';
import type { ShiftedElementPattern } from './displacement.js';
import type { PortPatternSource } from './patterns.js';
import { physicalCheck, type PhysicalCheck } from '../checks.js';

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
  /** Phase centre of every port [m], 3N values (x, y, z per port). */
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
 * (nothing is stored per direction), in the DESIGN "embedded pattern"
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
