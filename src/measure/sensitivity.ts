/**
 * On/off-source sensitivity reduction: A_e/T_sys, SEFD and aperture efficiency.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertColumn, assertFinite, assertFiniteCMatrix, assertInRange, assertNonNegative, assertPositive, assertSquare } from '../internal/validate.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { quadraticForm } from '../linalg/ops.js';
import { JANSKY_W_PER_M2_HZ, K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { displayable } from '../display/attach.js';

/**
 * Plane-parallel atmospheric attenuation of a calibrator: S is multiplied by exp(−τ/sin el).
 * @category Measurement
 */
export interface AtmosphereCorrection {
  /** Zenith opacity τ [Np], ≥ 0. */
  zenithOpacityNp: number;
  /** Source elevation above the horizon [rad], in [0.001, π/2]. */
  elevationRad: number;
}

/**
 * Optional corrections to the calibrator's flux density. None is applied
 * unless given; every applied factor is reported in the result.
 * @category Measurement
 */
export interface FluxCorrections {
  /** Atmospheric attenuation: zenith opacity τ [Np] and source elevation [rad]; S is multiplied by exp(−τ/sin el) (plane-parallel atmosphere). */
  atmosphere?: AtmosphereCorrection;
  /** Source-size correction factor K ≥ 1 for a calibrator partly resolved by the beam; S is divided by K. */
  sourceSizeFactor?: number;
}

/**
 * Inputs of {@link onOffSensitivity}.
 * @category Measurement
 */
export interface OnOffInput {
  /** Beam output power on source [any linear unit]. */
  onPower: number;
  /** Beam output power off source, same unit. */
  offPower: number;
  /** Calibrator flux density S [W m⁻² Hz⁻¹] (use `janskyToSi`), total over both polarisations, unpolarised. */
  fluxDensityWPerM2Hz: number;
  /** Optional corrections (never applied silently). */
  corrections?: FluxCorrections;
  /** One-sigma relative uncertainty of the on-source power (e.g. 0.01 for 1 %). @defaultValue 0 */
  onPowerRelativeSigma?: number;
  /** One-sigma relative uncertainty of the off-source power. @defaultValue 0 */
  offPowerRelativeSigma?: number;
  /** One-sigma relative uncertainty of the calibrator flux density. @defaultValue 0 */
  fluxDensityRelativeSigma?: number;
}

/**
 * Result of {@link onOffSensitivity}.
 * @category Measurement
 */
export interface OnOffResult {
  /** Sensitivity A_e/T_sys [m²/K]. */
  aeOverTsysM2PerK: number;
  /** System-equivalent flux density SEFD = 2 k_B T_sys/A_e [W m⁻² Hz⁻¹]. */
  sefdWPerM2Hz: number;
  /** SEFD [Jy]. */
  sefdJy: number;
  /** On/off power ratio minus one, (P_on − P_off)/P_off (dimensionless). */
  sourceToSystemRatio: number;
  /** The flux density actually used after corrections [W m⁻² Hz⁻¹]. */
  effectiveFluxDensityWPerM2Hz: number;
  /** Multiplicative factors applied to S, by name (empty when none). */
  appliedCorrections: Record<string, number>;
  /** First-order one-sigma uncertainty of A_e/T_sys [m²/K] (uncorrelated inputs; 0 without input uncertainties). */
  aeOverTsysSigmaM2PerK: number;
  /** First-order one-sigma uncertainty of the SEFD [Jy] (same relative uncertainty as A_e/T_sys). */
  sefdSigmaJy: number;
}

function effectiveFlux(s: number, c: FluxCorrections | undefined): { s: number; applied: Record<string, number> } {
  assertPositive('fluxDensityWPerM2Hz', s, 'W m⁻² Hz⁻¹');
  const applied: Record<string, number> = {};
  let out = s;
  if (c?.atmosphere) {
    assertFinite('corrections.atmosphere.zenithOpacityNp', c.atmosphere.zenithOpacityNp);
    if (c.atmosphere.zenithOpacityNp < 0) throw new DomainError(`invalid argument "corrections.atmosphere.zenithOpacityNp": expected ≥ 0, received ${c.atmosphere.zenithOpacityNp}.`);
    assertInRange('corrections.atmosphere.elevationRad', c.atmosphere.elevationRad, 1e-3, Math.PI / 2, 'rad');
    const f = Math.exp(-c.atmosphere.zenithOpacityNp / Math.sin(c.atmosphere.elevationRad));
    applied.atmosphere = f;
    out *= f;
  }
  if (c?.sourceSizeFactor !== undefined) {
    assertFinite('corrections.sourceSizeFactor', c.sourceSizeFactor);
    if (c.sourceSizeFactor < 1) throw new DomainError(`invalid argument "corrections.sourceSizeFactor": expected K ≥ 1, received ${c.sourceSizeFactor}.`);
    applied.sourceSize = 1 / c.sourceSizeFactor;
    out /= c.sourceSizeFactor;
  }
  return { s: out, applied };
}

/**
 * Sensitivity A_e/T_sys of a beam from on-source and off-source powers on a
 * calibrator of known flux density.
 *
 * @remarks
 * A_e/T_sys = 2 k_B (P_on − P_off)/(S·P_off) for an unpolarised source of
 * total flux density S received in one polarisation channel of the beam
 * (half the flux), the receiving-array form used with IEEE Std 149-2021
 * practice and in Warnick et al., IEEE Trans. Antennas Propag. 58(6), 2010
 * (from memory); SEFD = 2 k_B T_sys/A_e. Conventions: docs/conventions.md
 * (sensitivity row). Uncertainty to first order for uncorrelated inputs (JCGM 100:2008, GUM
 * eq. 10): with r = P_on/P_off − 1, (σ/(A_e/T_sys))² = ((r + 1)/r)²(σ_on² + σ_off²) + σ_S²
 * (relative σ's); the SEFD has the same relative uncertainty. A weak source (r ≪ 1) magnifies
 * the power errors by (r + 1)/r.
 * @param input - Powers, flux density, optional corrections and uncertainties.
 * @returns A_e/T_sys [m²/K], SEFD [W m⁻² Hz⁻¹ and Jy], and the corrections used.
 * @throws {@link DomainError} for non-positive powers, P_on ≤ P_off, or invalid corrections.
 * @category Measurement
 */
export function onOffSensitivity(input: OnOffInput): OnOffResult {
  assertPositive('onPower', input.onPower);
  assertPositive('offPower', input.offPower);
  if (!(input.onPower > input.offPower)) {
    throw new DomainError(`invalid measurement: on-source power ${input.onPower} does not exceed off-source power ${input.offPower}; check pointing and the on/off order.`);
  }
  const { s, applied } = effectiveFlux(input.fluxDensityWPerM2Hz, input.corrections);
  const sOn = input.onPowerRelativeSigma ?? 0, sOff = input.offPowerRelativeSigma ?? 0, sS = input.fluxDensityRelativeSigma ?? 0;
  assertNonNegative('onPowerRelativeSigma', sOn);
  assertNonNegative('offPowerRelativeSigma', sOff);
  assertNonNegative('fluxDensityRelativeSigma', sS);
  const ratio = (input.onPower - input.offPower) / input.offPower;
  const aeOverT = (2 * K_BOLTZMANN_J_PER_K * ratio) / s;
  const sefd = (2 * K_BOLTZMANN_J_PER_K) / aeOverT;
  const rel = Math.sqrt(((ratio + 1) / ratio) ** 2 * (sOn * sOn + sOff * sOff) + sS * sS);
  return displayable<OnOffResult>({
    aeOverTsysM2PerK: aeOverT,
    sefdWPerM2Hz: sefd,
    sefdJy: sefd / JANSKY_W_PER_M2_HZ,
    sourceToSystemRatio: ratio,
    effectiveFluxDensityWPerM2Hz: s,
    appliedCorrections: applied,
    aeOverTsysSigmaM2PerK: rel * aeOverT,
    sefdSigmaJy: (rel * sefd) / JANSKY_W_PER_M2_HZ,
  }, 'OnOffResult');
}

/**
 * Inputs of {@link onOffSensitivityFromCorrelation}.
 * @category Measurement
 */
export interface OnOffCorrelationInput {
  /** On-source output correlation matrix of all channels, N×N Hermitian. */
  on: CMatrix;
  /** Off-source output correlation matrix, N×N Hermitian, same unit. */
  off: CMatrix;
  /** Beamformer weights w, N×1 (beam power P = wᴴRw). */
  weights: CMatrix;
  /** Calibrator flux density S [W m⁻² Hz⁻¹]. */
  fluxDensityWPerM2Hz: number;
  /** Optional corrections. */
  corrections?: FluxCorrections;
}

/**
 * Sensitivity of any beam from on/off correlation matrices: the beam powers
 * are wᴴR_on w and wᴴR_off w, then {@link onOffSensitivity}.
 * @param input - Correlation matrices, weights, flux density and corrections.
 * @returns As {@link onOffSensitivity}.
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} as {@link onOffSensitivity}.
 * @category Measurement
 */
export function onOffSensitivityFromCorrelation(input: OnOffCorrelationInput): OnOffResult {
  assertSquare('on', input.on);
  assertSquare('off', input.off);
  assertFiniteCMatrix('on', input.on);
  assertFiniteCMatrix('off', input.off);
  if (input.off.rows !== input.on.rows) {
    throw new DimensionError(`invalid argument "off": expected ${input.on.rows}×${input.on.rows} like "on", received ${input.off.rows}×${input.off.cols}.`);
  }
  assertColumn('weights', input.weights, input.on.rows, 'one weight per channel');
  return onOffSensitivity({
    onPower: quadraticForm(input.weights, input.on),
    offPower: quadraticForm(input.weights, input.off),
    fluxDensityWPerM2Hz: input.fluxDensityWPerM2Hz,
    corrections: input.corrections,
  });
}

/**
 * Aperture efficiency from a measured sensitivity and system temperature:
 * η_ap = (A_e/T_sys)·T_sys / A_phys.
 * @param aeOverTsysM2PerK - Sensitivity A_e/T_sys [m²/K], > 0.
 * @param systemTemperatureK - System noise temperature T_sys [K], > 0 (e.g. from a Y-factor measurement plus sky).
 * @param physicalAreaM2 - Physical aperture area [m²], > 0.
 * @returns Aperture efficiency (dimensionless).
 * @throws {@link DomainError} on non-positive inputs.
 * @category Measurement
 */
export function apertureEfficiencyFromSensitivity(aeOverTsysM2PerK: number, systemTemperatureK: number, physicalAreaM2: number): number {
  assertPositive('aeOverTsysM2PerK', aeOverTsysM2PerK, 'm²/K');
  assertPositive('systemTemperatureK', systemTemperatureK, 'K');
  assertPositive('physicalAreaM2', physicalAreaM2, 'm²');
  return (aeOverTsysM2PerK * systemTemperatureK) / physicalAreaM2;
}
