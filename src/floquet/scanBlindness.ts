/**
 * Search for scan blindness of an infinite dipole array in a scan plane.
 * @module
 */
import type { Complex } from 'complex.js';
import { assertFinite, assertInRange } from '../internal/validate.js';
import { type InfiniteDipoleArray, infiniteArrayActiveImpedance } from './infiniteDipoleArray.js';
import { infiniteArrayScanPerformance } from './scanPerformance.js';
import { type PhaseMatchPrediction, groundedSlabSurfaceWaves, phaseMatchedScanAngles } from './surfaceWaves.js';

/**
 * Options of {@link findScanBlindness}.
 * @category Floquet
 */
export interface ScanBlindnessOptions {
  /** Reference (generator) impedance [Ω]; default: the complex conjugate of the broadside active impedance (matched at broadside). */
  referenceImpedanceOhm?: number | Complex;
  /** Grid step of the scan [rad]. @defaultValue 0.25° */
  stepRad?: number;
  /** Largest polar angle examined [rad], < π/2. @defaultValue 89° */
  thetaMaxRad?: number;
  /** Smallest |Γ_a| reported as a blindness. @defaultValue 0.95 */
  threshold?: number;
}

/**
 * One blind angle found in the scan.
 * @category Floquet
 */
export interface BlindAngle {
  /** Polar angle of the local maximum of |Γ_a| [rad]. */
  readonly thetaRad: number;
  /** |Γ_a| there (dimensionless). */
  readonly reflectionMagnitude: number;
  /** Embedded element gain there, linear. */
  readonly embeddedGain: number;
}

/**
 * Result of {@link findScanBlindness}.
 * @category Floquet
 */
export interface ScanBlindnessResult {
  /** Scan-plane azimuth [rad]. */
  readonly phiRad: number;
  /** Local maxima of |Γ_a| above the threshold, refined by golden-section search. */
  readonly blindAngles: BlindAngle[];
  /** Surface-wave phase-matching predictions (grounded slab only; empty otherwise). */
  readonly predictions: PhaseMatchPrediction[];
}

/**
 * Scans a plane φ (E-plane φ = 0, H-plane φ = π/2 for x-directed dipoles, diagonal φ = π/4, or any
 * other) and reports the angles where |Γ_a| approaches 1 (the embedded gain collapses), next to the
 * angles predicted by phase matching a Floquet mode to a surface wave of the slab, the latter from an
 * independent solve of the slab's dispersion equations ({@link groundedSlabSurfaceWaves}).
 *
 * @remarks
 * Reference: D. M. Pozar and D. H. Schaubert, "Scan blindness in infinite phased arrays of printed
 * dipoles", IEEE Trans. Antennas Propag. 32(6), 1984 (from memory).
 * @param array - Prepared array.
 * @param phiRad - Scan plane azimuth [rad].
 * @param options - Grid, threshold and reference impedance.
 * @returns Blind angles and predictions.
 * @throws {@link DomainError} for bad options.
 * @category Floquet
 */
export function findScanBlindness(array: InfiniteDipoleArray, phiRad: number, options: ScanBlindnessOptions = {}): ScanBlindnessResult {
  assertFinite('phiRad', phiRad);
  const step = options.stepRad ?? (0.25 * Math.PI) / 180;
  assertInRange('options.stepRad', step, 1e-6, 0.2, 'rad');
  const thetaMax = options.thetaMaxRad ?? (89 * Math.PI) / 180;
  assertInRange('options.thetaMaxRad', thetaMax, step, Math.PI / 2 - 1e-6, 'rad');
  const threshold = options.threshold ?? 0.95;
  assertInRange('options.threshold', threshold, 0, 1);
  const z0 = options.referenceImpedanceOhm ?? infiniteArrayActiveImpedance(array, { thetaRad: 0, phiRad }).impedanceOhm.conjugate();
  const mag = (theta: number): number => infiniteArrayScanPerformance(array, { thetaRad: theta, phiRad }, z0).reflectionMagnitude;
  const n = Math.floor(thetaMax / step);
  const grid = new Float64Array(n + 1);
  for (let i = 0; i <= n; i++) grid[i] = mag(i * step);
  const blind: BlindAngle[] = [];
  for (let i = 1; i < n; i++) {
    if (!(grid[i] >= grid[i - 1] && grid[i] >= grid[i + 1])) continue;
    // Golden-section maximisation of |Γ| on [θ_{i−1}, θ_{i+1}].
    let a = (i - 1) * step, b = (i + 1) * step;
    const g = (Math.sqrt(5) - 1) / 2;
    let c = b - g * (b - a), d = a + g * (b - a);
    let fc = mag(c), fd = mag(d);
    while (b - a > 1e-7) {
      if (fc > fd) { b = d; d = c; fd = fc; c = b - g * (b - a); fc = mag(c); }
      else { a = c; c = d; fc = fd; d = a + g * (b - a); fd = mag(d); }
    }
    const theta = 0.5 * (a + b);
    const perf = infiniteArrayScanPerformance(array, { thetaRad: theta, phiRad }, z0);
    if (perf.reflectionMagnitude >= threshold) {
      blind.push({ thetaRad: theta, reflectionMagnitude: perf.reflectionMagnitude, embeddedGain: perf.embeddedGain });
    }
  }
  const b = array.backing;
  const predictions = b.kind === 'groundedSlab'
    ? phaseMatchedScanAngles(array.lattice, array.frequencyHz, phiRad, groundedSlabSurfaceWaves(b.relativePermittivity, b.thicknessM, array.frequencyHz))
    : [];
  return { phiRad, blindAngles: blind, predictions };
}
