/**
 * The figures receiving-system engineers quote first, from the sensitivity
 * A_e/T_sys: the gain-to-noise-temperature ratio G/T and the system
 * equivalent flux density SEFD.
 * @module
 */
import { assertPositive } from '../internal/validate.js';
import { JANSKY_W_PER_M2_HZ, K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { wavelengthM } from '../units/convert.js';

/**
 * Gain-to-noise-temperature ratio G/T of a beam, in dB/K.
 *
 * @remarks
 * G/T = (4π/λ²)·A_e/T_sys (IEEE Std 145-2013, "gain-to-noise-temperature ratio", from
 * memory): G = 4πA_e/λ² is the receiving array's gain for the beam (radiation efficiency
 * included) and T_sys its system noise temperature, both referred to the beamformer output
 * with the beam's isotropic noise response as the reference (K. F. Warnick et al., IEEE
 * Trans. Antennas Propag. 58(6), 2010, from memory). The ratio, unlike G and T_sys
 * separately, does not depend on where along the receive chain the reference plane is put.
 * Quoted as 10·log10 of the ratio in 1/K.
 * @param sensitivityM2PerK - A_e/T_sys [m²/K], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns G/T [dB/K].
 * @throws {@link DomainError} for non-positive arguments.
 * @example
 * ```ts
 * gainOverTemperatureDbPerK(1, 299792458); // ≈ 10.99 dB/K (4π at λ = 1 m)
 * ```
 * @category Reception
 */
export function gainOverTemperatureDbPerK(sensitivityM2PerK: number, frequencyHz: number): number {
  assertPositive('sensitivityM2PerK', sensitivityM2PerK, 'm²/K');
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const lambda = wavelengthM(frequencyHz);
  return 10 * Math.log10(((4 * Math.PI) / (lambda * lambda)) * sensitivityM2PerK);
}

/**
 * System equivalent flux density of a beam, in jansky.
 *
 * @remarks
 * SEFD = 2 k_B T_sys / A_e: the flux density of an unpolarized source that doubles the
 * beam's output noise power (A. R. Thompson, J. M. Moran, G. W. Swenson, *Interferometry and
 * Synthesis in Radio Astronomy*, 3rd ed., Springer, 2017, §6.2, from memory). With A_e for
 * an unpolarized source this is the sensitivity row of docs/conventions.md inverted:
 * SNR = S / SEFD. 1 Jy = 10⁻²⁶ W m⁻² Hz⁻¹.
 * @param sensitivityM2PerK - A_e/T_sys [m²/K], > 0.
 * @returns SEFD [Jy].
 * @throws {@link DomainError} for a non-positive sensitivity.
 * @example
 * ```ts
 * systemEquivalentFluxDensityJy(1); // ≈ 2761.3 Jy
 * ```
 * @category Reception
 */
export function systemEquivalentFluxDensityJy(sensitivityM2PerK: number): number {
  assertPositive('sensitivityM2PerK', sensitivityM2PerK, 'm²/K');
  return (2 * K_BOLTZMANN_J_PER_K) / sensitivityM2PerK / JANSKY_W_PER_M2_HZ;
}
