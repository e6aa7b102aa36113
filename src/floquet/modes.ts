/**
 * Floquet modes of an infinite planar array: transverse wavenumbers for a scan
 * direction, the axial wavenumber with the e^{+jωt} branch, and TE/TM mode
 * impedances.
 * @module
 */
import { Complex } from 'complex.js';
import { DomainError } from '../errors.js';
import { assertFinite, assertInRange, assertInteger, assertPositive } from '../internal/validate.js';
import { ETA0_OHM } from '../units/constants.js';
import { wavenumberRadPerM } from '../units/convert.js';
import type { PlanarLattice } from '../geometry/lattice.js';
import type { SphericalAngles } from '../geometry/directions.js';

/**
 * Scan direction of a planar array (main beam direction r̂₀): θ from +z in [0, π/2], φ from +x
 * toward +y (the geometry module's {@link SphericalAngles}; from direction cosines use
 * {@link anglesFromUv}).
 *
 * @remarks
 * The infinite array pointed at r̂₀ has receive weights wₙ = exp(+j k r̂₀·rₙ) (conventions: steering
 * convention) and the equivalent transmit excitation (port currents) Iₙ = conj(wₙ) =
 * exp(−j k r̂₀·rₙ); the (0,0) Floquet mode then has transverse wavenumber
 * k_t00 = k (sinθ₀cosφ₀, sinθ₀sinφ₀) and radiates toward r̂₀.
 * @category Floquet
 */
export type ScanDirection = SphericalAngles;

/** Validates a scan direction (θ in [0, maxTheta]). @internal */
export function assertScan(scan: ScanDirection, maxThetaRad = Math.PI / 2): void {
  if (scan === null || typeof scan !== 'object') {
    throw new DomainError(`invalid argument "scan": expected {thetaRad, phiRad}, received ${String(scan)}.`);
  }
  assertFinite('scan.phiRad', scan.phiRad);
  if (typeof scan.thetaRad !== 'number' || !Number.isFinite(scan.thetaRad) || scan.thetaRad < 0 || scan.thetaRad > maxThetaRad) {
    throw new DomainError(
      `invalid argument "scan.thetaRad": the scan direction must lie in the visible upper hemisphere, θ in [0, ${maxThetaRad}] rad, received ${String(scan.thetaRad)}; a planar array in the xy-plane scans over 0 ≤ θ ${maxThetaRad === Math.PI / 2 ? '≤' : '<'} π/2.`,
    );
  }
}

/**
 * One Floquet mode (m, n) of an infinite planar array.
 * @category Floquet
 */
export interface FloquetMode {
  /** Index along b₁. */
  readonly m: number;
  /** Index along b₂. */
  readonly n: number;
  /** Transverse wavenumber x component k_x = k u₀ + m b₁x + n b₂x [rad/m]. */
  readonly kxRadPerM: number;
  /** Transverse wavenumber y component k_y = k v₀ + m b₁y + n b₂y [rad/m]. */
  readonly kyRadPerM: number;
  /** Transverse wavenumber magnitude |k_t| [rad/m]. */
  readonly ktRadPerM: number;
  /** Axial wavenumber k_z = √(k² − k_t²), Re ≥ 0 and Im ≤ 0 (e^{+jωt}: evanescent k_z = −j|k_z|) [rad/m]. */
  readonly kzRadPerM: Complex;
  /** True when k_t < k (the mode carries power away from the array). */
  readonly propagating: boolean;
  /** TE mode impedance ωμ/k_z in the medium [Ω]. */
  readonly teImpedanceOhm: Complex;
  /** TM mode impedance k_z/(ωε) in the medium [Ω]. */
  readonly tmImpedanceOhm: Complex;
}

/**
 * Axial wavenumber k_z = √(k² − k_t²) on the e^{+jωt} branch.
 *
 * @remarks
 * For k_t ≤ k, k_z is real and ≥ 0 (an outgoing propagating wave e^{−j k_z z});
 * for k_t > k, k_z = −j √(k_t² − k²) so that e^{−j k_z z} decays away from the array.
 * @param ktRadPerM - Transverse wavenumber [rad/m], ≥ 0.
 * @param kRadPerM - Wavenumber of the medium [rad/m], > 0.
 * @returns k_z [rad/m].
 * @throws {@link DomainError} if an argument is not finite or k ≤ 0.
 * @category Floquet
 */
export function axialWavenumber(ktRadPerM: number, kRadPerM: number): Complex {
  assertFinite('ktRadPerM', ktRadPerM);
  assertPositive('kRadPerM', kRadPerM, 'rad/m');
  const d = kRadPerM * kRadPerM - ktRadPerM * ktRadPerM;
  return d >= 0 ? new Complex(Math.sqrt(d), 0) : new Complex(0, -Math.sqrt(-d));
}

/**
 * TE (transverse-electric to z) mode impedance Z_TE = ωμ/k_z = η k/k_z.
 * @remarks Reference: R. F. Harrington, *Time-Harmonic Electromagnetic Fields*, McGraw-Hill, 1961 (from memory).
 * Propagating modes are resistive, evanescent modes (k_z = −j|k_z|) inductive with e^{+jωt}.
 * @param kz - Axial wavenumber [rad/m] (from {@link axialWavenumber}).
 * @param kRadPerM - Wavenumber of the medium [rad/m].
 * @param etaOhm - Wave impedance of the medium [Ω]; default η0.
 * @returns Z_TE [Ω] (infinite at k_z = 0).
 * @category Floquet
 */
export function teModeImpedance(kz: Complex, kRadPerM: number, etaOhm: number = ETA0_OHM): Complex {
  return new Complex(etaOhm * kRadPerM, 0).div(kz);
}

/**
 * TM (transverse-magnetic to z) mode impedance Z_TM = k_z/(ωε) = η k_z/k.
 * @remarks Evanescent modes (k_z = −j|k_z|) are capacitive with e^{+jωt}.
 * Reference: R. F. Harrington, *Time-Harmonic Electromagnetic Fields*, McGraw-Hill, 1961 (from memory).
 * @param kz - Axial wavenumber [rad/m].
 * @param kRadPerM - Wavenumber of the medium [rad/m].
 * @param etaOhm - Wave impedance of the medium [Ω]; default η0.
 * @returns Z_TM [Ω].
 * @category Floquet
 */
export function tmModeImpedance(kz: Complex, kRadPerM: number, etaOhm: number = ETA0_OHM): Complex {
  return kz.mul(etaOhm / kRadPerM);
}

/**
 * Options of {@link floquetModes}.
 * @category Floquet
 */
export interface FloquetModesOptions {
  /** Largest |m| and |n| enumerated. @defaultValue 3 */
  maxOrder?: number;
  /** Relative permittivity of the medium the modes live in (εr ≥ 1, lossless). @defaultValue 1 */
  relativePermittivity?: number;
}

/**
 * Floquet modes (m, n), |m|, |n| ≤ maxOrder, of an infinite planar array scanned to r̂₀.
 *
 * @remarks
 * k_t,mn = k₀(u₀, v₀) + m b₁ + n b₂ with the scan wavenumber in free space (the array's
 * phase progression), and k_z = √(εr k₀² − k_t²) on the e^{+jωt} branch in the medium.
 * Modes are returned sorted by |k_t|. See {@link ScanDirection} for the excitation phase.
 * Reference: A. K. Bhattacharyya, *Phased Array Antennas: Floquet Analysis, Synthesis,
 * BFNs and Active Array Systems*, Wiley, 2006, ch. 2 (from memory).
 *
 * @param lattice - Array lattice.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param scan - Scan direction (θ ∈ [0, π/2]).
 * @param options - Enumeration order and medium.
 * @returns Modes sorted by transverse wavenumber.
 * @throws {@link DomainError} for a non-positive frequency, a scan outside visible space or εr < 1.
 * @category Floquet
 */
export function floquetModes(lattice: PlanarLattice, frequencyHz: number, scan: ScanDirection, options: FloquetModesOptions = {}): FloquetMode[] {
  const k0 = wavenumberRadPerM(frequencyHz);
  assertScan(scan);
  const maxOrder = options.maxOrder ?? 3;
  assertInteger('options.maxOrder', maxOrder, 0, 1000);
  const er = options.relativePermittivity ?? 1;
  assertInRange('options.relativePermittivity', er, 1, Number.MAX_VALUE);
  const k = k0 * Math.sqrt(er);
  const eta = ETA0_OHM / Math.sqrt(er);
  const st = Math.sin(scan.thetaRad);
  const kx0 = k0 * st * Math.cos(scan.phiRad);
  const ky0 = k0 * st * Math.sin(scan.phiRad);
  const modes: FloquetMode[] = [];
  for (let m = -maxOrder; m <= maxOrder; m++) {
    for (let n = -maxOrder; n <= maxOrder; n++) {
      const kx = kx0 + m * lattice.b1xRadPerM + n * lattice.b2xRadPerM;
      const ky = ky0 + m * lattice.b1yRadPerM + n * lattice.b2yRadPerM;
      const kt = Math.hypot(kx, ky);
      const kz = axialWavenumber(kt, k);
      modes.push({
        m, n, kxRadPerM: kx, kyRadPerM: ky, ktRadPerM: kt, kzRadPerM: kz, propagating: kt < k,
        teImpedanceOhm: teModeImpedance(kz, k, eta), tmImpedanceOhm: tmModeImpedance(kz, k, eta),
      });
    }
  }
  modes.sort((p, q) => p.ktRadPerM - q.ktRadPerM);
  return modes;
}

/**
 * The propagating Floquet modes (k_t < k) for a scan; each is a beam (the (0,0) main beam or a grating lobe).
 * @param lattice - Array lattice.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param scan - Scan direction.
 * @param relativePermittivity - Medium εr ≥ 1; default 1.
 * @returns Propagating modes, sorted by |k_t|.
 * @throws {@link DomainError} as {@link floquetModes}.
 * @category Floquet
 */
export function propagatingFloquetModes(lattice: PlanarLattice, frequencyHz: number, scan: ScanDirection, relativePermittivity = 1): FloquetMode[] {
  // Propagating modes have |k_t| < k; bound the order by k/|shortest b| + 1 per axis of the (possibly skewed) basis.
  const k = wavenumberRadPerM(frequencyHz) * Math.sqrt(Math.max(1, relativePermittivity));
  const a1 = Math.hypot(lattice.a1xM, lattice.a1yM);
  const a2 = Math.hypot(lattice.a2xM, lattice.a2yM);
  // |m| = |k_t·a1|/2π ≤ (2k)·|a1|/2π (|k_t| ≤ k, scan part ≤ k); same for n.
  const maxOrder = Math.min(1000, Math.ceil((2 * k * Math.max(a1, a2)) / (2 * Math.PI)) + 1);
  return floquetModes(lattice, frequencyHz, scan, { maxOrder, relativePermittivity }).filter((mode) => mode.propagating);
}
