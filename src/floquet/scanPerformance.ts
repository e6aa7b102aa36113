/**
 * Active reflection coefficient and embedded element gain of an infinite dipole array.
 * @module
 */
import { Complex } from 'complex.js';
import { wavelengthM } from '../units/convert.js';
import { currentSpectrum, widthSpectrum } from './dipoleSpectrum.js';
import { type InfiniteDipoleArray, infiniteArrayActiveImpedance } from './infiniteDipoleArray.js';
import { type ScanDirection, assertScan } from './modes.js';
import { reflectionFromImpedance, toReferenceImpedance } from './finiteArray.js';
import { layeredImpedancesInto } from './spectralGreen.js';

/**
 * Scan performance of one element of the infinite array.
 * @category Floquet
 */
export interface ScanPerformance {
  /** Active impedance Z_a [Ω]. */
  readonly impedanceOhm: Complex;
  /** Active reflection coefficient Γ_a = (Z_a − Z₀*)/(Z_a + Z₀) (power waves, Kurokawa 1965). */
  readonly reflection: Complex;
  /** |Γ_a| (dimensionless). */
  readonly reflectionMagnitude: number;
  /** Fraction of the delivered power radiated into the main-beam Floquet mode toward r̂₀ (dimensionless). */
  readonly mainBeamFraction: number;
  /** Embedded element gain toward r̂₀, linear, referred to the generator's available power. */
  readonly embeddedGain: number;
  /** Ideal element gain 4πA cosθ/λ² of a lossless matched array radiating into one half-space (linear). */
  readonly idealGain: number;
  /** Floquet terms used. */
  readonly modesUsed: number;
  /** Estimated relative error of Z_a. */
  readonly estimatedRelativeError: number;
}

/**
 * Active impedance, active reflection coefficient and embedded element gain of the infinite array at a scan.
 *
 * @remarks
 * Each element is driven by a generator of internal impedance Z₀ (the reference impedance). The
 * embedded element gain is G(θ₀, φ₀) = (4π A/λ²) cosθ₀ · P₀₀/P_avail, where P₀₀ is the power per cell
 * carried upward by the (0, 0) Floquet mode (the power into the free-space line above the array in the
 * TE/TM transmission-line model) and P_avail = |V_g|²/(4 Re Z₀). For a lossless array over a ground plane
 * or slab with no grating lobe, P₀₀/P_avail = 1 − |Γ_a|², so G = (4π A/λ²) cosθ (1 − |Γ_a|²).
 * References: P. W. Hannan, "The element-gain paradox for a phased-array antenna", IEEE Trans. Antennas
 * Propag. 12(4), 1964 (from memory); K. Kurokawa, "Power waves and the scattering matrix", IEEE Trans.
 * Microw. Theory Tech. 13(2), 1965.
 * @param array - Prepared array ({@link infiniteDipoleArray}).
 * @param scan - Scan direction, θ ∈ [0, π/2).
 * @param referenceImpedanceOhm - Generator (reference) impedance Z₀ [Ω], Re Z₀ > 0; number or complex; default 50.
 * @returns Impedance, reflection, gains and convergence figures.
 * @throws {@link DomainError} for a scan outside visible space or Re Z₀ ≤ 0.
 * @category Floquet
 */
export function infiniteArrayScanPerformance(array: InfiniteDipoleArray, scan: ScanDirection, referenceImpedanceOhm: number | Complex = 50): ScanPerformance {
  assertScan(scan, Math.PI / 2 - 1e-9);
  const z0 = toReferenceImpedance(referenceImpedanceOhm);
  const res = infiniteArrayActiveImpedance(array, scan);
  const za = res.impedanceOhm;
  const gamma = reflectionFromImpedance(za, z0);
  const st = array.state;
  const s = Math.sin(scan.thetaRad);
  const kx = st.k0 * s * Math.cos(scan.phiRad);
  const ky = st.k0 * s * Math.sin(scan.phiRad);
  const beta = Math.hypot(kx, ky);
  const buf = new Float64Array(10);
  layeredImpedancesInto(buf, st.med, beta);
  const cx = beta === 0 ? 1 : (kx * kx) / (beta * beta);
  const cy = 1 - cx;
  const ztm = new Complex(buf[0], buf[1]), zte = new Complex(buf[2], buf[3]);
  const yTmUp = new Complex(buf[4], buf[5]).inverse().re;
  const yTeUp = new Complex(buf[6], buf[7]).inverse().re;
  const f = currentSpectrum(st.sp, kx) * widthSpectrum(st.sp, ky);
  // Upward power per cell for unit feed current.
  const pUp = ((f * f) / st.area) * (cx * ztm.abs() ** 2 * yTmUp + cy * zte.abs() ** 2 * yTeUp);
  const pDelivered = za.re;
  const idealGain = (4 * Math.PI * st.area * Math.cos(scan.thetaRad)) / wavelengthM(array.frequencyHz) ** 2;
  const pAvailPerI2 = za.add(z0).abs() ** 2 / (4 * z0.re);
  return {
    impedanceOhm: za,
    reflection: gamma,
    reflectionMagnitude: gamma.abs(),
    mainBeamFraction: pDelivered > 0 ? pUp / pDelivered : 0,
    embeddedGain: (idealGain * pUp) / pAvailPerI2,
    idealGain,
    modesUsed: res.modesUsed,
    estimatedRelativeError: res.estimatedRelativeError,
  };
}
