/**
 * Sky brightness across a band: a power law for the galactic synchrotron
 * background plus the cosmic microwave background.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertNonNegative, assertPositive, describeValue } from '../internal/validate.js';

/** Cosmic microwave background temperature [K] (D. J. Fixsen, "The temperature of the cosmic microwave background", ApJ 707, 2009: 2.72548 K; from memory). */
export const CMB_TEMPERATURE_K = 2.725;

/**
 * Default spectral index β of the galactic synchrotron brightness, T ∝ ν^(−β) (dimensionless).
 * Measured values lie near 2.5–2.6 between about 50 MHz and a few GHz (e.g. A. E. Guzmán et al.,
 * A&A 525, 2011, β ≈ 2.5; from memory); 2.55 is a common choice. Change it for your sky.
 */
export const SYNCHROTRON_SPECTRAL_INDEX = 2.55;

/**
 * A sky brightness law T_sky(ν) = T_ref·(ν/ν_ref)^(−β) + T_bg.
 * @category Reception
 */
export interface SkyPowerLaw {
  /** Galactic brightness T_ref at the reference frequency [K], ≥ 0 (excluding the background). */
  readonly referenceK: number;
  /** Reference frequency ν_ref [Hz], > 0. */
  readonly referenceHz: number;
  /** Spectral index β (dimensionless). @defaultValue {@link SYNCHROTRON_SPECTRAL_INDEX} (2.55) */
  readonly spectralIndex?: number;
  /** Isotropic background added at every frequency [K], ≥ 0. @defaultValue {@link CMB_TEMPERATURE_K} (2.725 K) */
  readonly backgroundK?: number;
}

/**
 * Sky brightness temperature at a frequency from a power law plus the background.
 *
 * @remarks
 * T_sky(ν) = T_ref·(ν/ν_ref)^(−β) + T_bg: the synchrotron background of the Galaxy falls
 * with frequency with β ≈ 2.55 (common practice; see {@link SYNCHROTRON_SPECTRAL_INDEX}), and
 * the cosmic microwave background (2.725 K) is flat in Rayleigh–Jeans temperature at radio
 * frequencies. A number instead of a law is a frequency-independent sky.
 * @param sky - A law or a constant temperature [K].
 * @param frequencyHz - Frequency ν [Hz], > 0.
 * @returns Brightness temperature [K].
 * @throws {@link DomainError} for negative temperatures or non-positive frequencies.
 * @example
 * ```ts
 * skyTemperatureAt({ referenceK: 20, referenceHz: 408e6 }, 816e6); // ≈ 6.14 K (20·2^(−2.55) + 2.725)
 * ```
 * @category Reception
 */
export function skyTemperatureAt(sky: number | SkyPowerLaw, frequencyHz: number): number {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (typeof sky === 'number') {
    assertNonNegative('sky', sky, 'K');
    return sky;
  }
  if (sky === null || typeof sky !== 'object') {
    throw new DomainError(`invalid argument "sky": expected a temperature [K] or {referenceK, referenceHz, spectralIndex?, backgroundK?}, received ${describeValue(sky)}.`);
  }
  assertNonNegative('sky.referenceK', sky.referenceK, 'K');
  assertPositive('sky.referenceHz', sky.referenceHz, 'Hz');
  const beta = sky.spectralIndex ?? SYNCHROTRON_SPECTRAL_INDEX;
  assertFinite('sky.spectralIndex', beta);
  const bg = sky.backgroundK ?? CMB_TEMPERATURE_K;
  assertNonNegative('sky.backgroundK', bg, 'K');
  return sky.referenceK * (frequencyHz / sky.referenceHz) ** -beta + bg;
}
