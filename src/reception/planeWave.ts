/**
 * Open-circuit port voltages for incident plane waves of any polarization, by
 * reciprocity from the embedded patterns.
 * @module
 */
import { DomainError } from '../errors.js';
import { complexParts, type CMatrix, type ComplexLike, matrixView } from '../linalg/cmatrix.js';
import { describeValue } from '../internal/validate.js';
import { C0_M_PER_S, ETA0_OHM } from '../units/constants.js';
import { assertSampledPatterns, type SampledPortPatterns } from './patterns.js';

/**
 * Polarization and amplitude of an incident plane wave, stated at the
 * coordinate origin (RMS phasors [V/m], e^{+jωt}).
 *
 * @remarks
 * - `thetaPhi`: E = E_θ θ̂ + E_φ φ̂ directly.
 * - `ludwig3`: Ludwig's third definition with reference polarization along x
 *   (default) or y. For reference x, co = cosφ θ̂ − sinφ φ̂ and
 *   cross = sinφ θ̂ + cosφ φ̂; for reference y, co = sinφ θ̂ + cosφ φ̂ and
 *   cross = cosφ θ̂ − sinφ φ̂ (A. C. Ludwig, "The definition of cross
 *   polarization", IEEE Trans. Antennas Propag. 21(1), 1973, from memory).
 * - `circular`: handedness with respect to the propagation direction −r̂ of a
 *   wave arriving from r̂ (IEEE Std 145 sense): right-hand E = a(θ̂ + jφ̂)/√2,
 *   left-hand E = a(θ̂ − jφ̂)/√2, so |E| = |a|. An element that transmits
 *   right-hand circular polarization, f ∝ θ̂ − jφ̂, receives the right-hand
 *   wave fully and the left-hand wave not at all.
 * @category Reception
 */
export type IncidentPolarization = ThetaPhiPolarization | Ludwig3Polarization | CircularPolarization;

/**
 * Incident field given by its θ̂ and φ̂ components at the origin.
 * @category Reception
 */
export interface ThetaPhiPolarization {
  /** Discriminant. */
  readonly kind: 'thetaPhi';
  /** E·θ̂ at the origin [V/m, RMS]. */
  readonly thetaComponentVPerM: ComplexLike;
  /** E·φ̂ at the origin [V/m, RMS]. */
  readonly phiComponentVPerM: ComplexLike;
}

/**
 * Incident field given by Ludwig-3 co- and cross-polar components.
 * @category Reception
 */
export interface Ludwig3Polarization {
  /** Discriminant. */
  readonly kind: 'ludwig3';
  /** Co-polar component [V/m, RMS]. */
  readonly coVPerM: ComplexLike;
  /** Cross-polar component [V/m, RMS]. */
  readonly crossVPerM: ComplexLike;
  /** Reference polarization direction. @defaultValue 'x' */
  readonly reference?: 'x' | 'y';
}

/**
 * Circularly polarized incident field.
 * @category Reception
 */
export interface CircularPolarization {
  /** Discriminant. */
  readonly kind: 'circular';
  /** Handedness with respect to the propagation direction. */
  readonly hand: 'right' | 'left';
  /** Amplitude a, |E| = |a| [V/m, RMS]. */
  readonly amplitudeVPerM: ComplexLike;
}

/** @internal Parsed polarization: a function of φ giving [Eθre, Eθim, Eφre, Eφim]. */
export type FieldAt = (phiRad: number, out: Float64Array) => void;

/** @internal Validates a polarization and returns its θ̂/φ̂ components as a function of φ. */
export function parsePolarization(name: string, pol: IncidentPolarization): FieldAt {
  if (pol === null || typeof pol !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected an IncidentPolarization {kind: 'thetaPhi' | 'ludwig3' | 'circular', …}, received ${describeValue(pol)}.`);
  }
  switch (pol.kind) {
    case 'thetaPhi': {
      const [tr, ti] = complexParts(`${name}.thetaComponentVPerM`, pol.thetaComponentVPerM);
      const [pr, pi] = complexParts(`${name}.phiComponentVPerM`, pol.phiComponentVPerM);
      return (_phi, out) => { out[0] = tr; out[1] = ti; out[2] = pr; out[3] = pi; };
    }
    case 'ludwig3': {
      const [cr, ci] = complexParts(`${name}.coVPerM`, pol.coVPerM);
      const [xr, xi] = complexParts(`${name}.crossVPerM`, pol.crossVPerM);
      const ref = pol.reference ?? 'x';
      if (ref !== 'x' && ref !== 'y') {
        throw new DomainError(`invalid argument "${name}.reference": expected 'x' or 'y', received ${describeValue(ref)}.`);
      }
      return (phi, out) => {
        const c = Math.cos(phi), s = Math.sin(phi);
        // unit vectors of co and cross in (θ̂, φ̂)
        const coT = ref === 'x' ? c : s, coP = ref === 'x' ? -s : c;
        const xT = ref === 'x' ? s : c, xP = ref === 'x' ? c : -s;
        out[0] = cr * coT + xr * xT; out[1] = ci * coT + xi * xT;
        out[2] = cr * coP + xr * xP; out[3] = ci * coP + xi * xP;
      };
    }
    case 'circular': {
      const [ar, ai] = complexParts(`${name}.amplitudeVPerM`, pol.amplitudeVPerM);
      if (pol.hand !== 'right' && pol.hand !== 'left') {
        throw new DomainError(`invalid argument "${name}.hand": expected 'right' or 'left', received ${describeValue(pol.hand)}.`);
      }
      const sgn = pol.hand === 'right' ? 1 : -1;
      const r = Math.SQRT1_2;
      // E_θ = a/√2, E_φ = ±j a/√2
      return (_phi, out) => { out[0] = ar * r; out[1] = ai * r; out[2] = -sgn * ai * r; out[3] = sgn * ar * r; };
    }
    default:
      throw new DomainError(`invalid argument "${name}.kind": expected 'thetaPhi', 'ludwig3' or 'circular', received ${describeValue((pol as { kind: unknown }).kind)}.`);
  }
}

/**
 * Reciprocity factor −j·4π/(η k I₀) of the conventions' reception row, returned as
 * the positive real 4π/(η k I₀) (the −j is applied by the caller).
 * @internal
 */
export function receptionScale(frequencyHz: number, driveCurrentA: number): number {
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  return (4 * Math.PI) / (ETA0_OHM * k * driveCurrentA);
}

/**
 * Open-circuit voltages of every port for a plane wave arriving from each
 * sampled direction.
 *
 * @remarks
 * Reciprocity (conventions, "reception"): vₙ = −j (4π/(η k I₀)) fₙ(r̂)·E_inc, with
 * E_inc the incident field at the origin, r̂ the direction the wave arrives
 * from, and no conjugation in the dot product. With this sign a far-zone pair
 * of elements gives v₂ = Z₂₁ I₁ (tested). References: R. F. Harrington,
 * *Time-Harmonic Electromagnetic Fields*, McGraw-Hill, 1961, §3-8
 * (reciprocity); C. A. Balanis, *Antenna Theory*, 4th ed., Wiley, 2016, §4.2
 * (from memory).
 *
 * @param patterns - Embedded patterns at M directions (N ports).
 * @param polarization - Incident field at the origin [V/m, RMS]; for Ludwig-3 the
 *   co/cross axes follow each direction's φ.
 * @returns Open-circuit voltages [V, RMS], N×M: column k is the response to a
 *   wave from direction k.
 * @throws {@link DimensionError} / {@link DomainError} for malformed patterns or polarization.
 * @example
 * ```ts
 * // a half-wave dipole along x at λ = 1 m, a 1 mV/m wave from zenith polarised along x:
 * const { patterns: source } = dipoleArrayPorts([{ centerM: [0, 0, 0], axis: [1, 0, 0], lengthM: 0.5, radiusM: 1e-5 }], 299792458);
 * const patterns = samplePatterns(source, Float64Array.of(0), Float64Array.of(0));
 * const v = openCircuitVoltages(patterns, { kind: 'ludwig3', coVPerM: 1e-3, crossVPerM: 0 });
 * Math.hypot(v.data[0], v.data[1]); // ≈ 3.183e-4 V (|E|·λ/π, the half-wave dipole's effective length)
 * ```
 * @category Reception
 */
export function openCircuitVoltages(patterns: SampledPortPatterns, polarization: IncidentPolarization): CMatrix {
  const n = assertSampledPatterns('patterns', patterns);
  const field = parsePolarization('polarization', polarization);
  const m = patterns.thetaRad.length;
  const c = receptionScale(patterns.frequencyHz, patterns.driveCurrentA);
  const ft = patterns.thetaComponentV.data, fp = patterns.phiComponentV.data;
  const out = new Float64Array(2 * n * m);
  const e = new Float64Array(4);
  for (let k = 0; k < m; k++) {
    field(patterns.phiRad[k], e);
    for (let i = 0; i < n; i++) {
      const q = 2 * (i * m + k);
      const sr = ft[q] * e[0] - ft[q + 1] * e[1] + fp[q] * e[2] - fp[q + 1] * e[3];
      const si = ft[q] * e[1] + ft[q + 1] * e[0] + fp[q] * e[3] + fp[q + 1] * e[2];
      // −j·c·(sr + j si) = c·(si − j sr)
      out[q] = c * si;
      out[q + 1] = -c * sr;
    }
  }
  return matrixView(n, m, out);
}
