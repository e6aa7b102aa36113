/**
 * Y-factor (hot/cold) reduction of one receiver channel.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertNonNegative, assertPositive } from '../internal/validate.js';
import { T0_K } from '../units/constants.js';
import { displayable } from '../display/attach.js';

/**
 * Inputs of {@link yFactorReceiverTemperature}.
 * @category Measurement
 */
export interface YFactorInput {
  /** Output power with the hot load [W, or any linear unit; dB when `powerScale` is 'dB']. */
  hotPower: number;
  /** Output power with the cold load, same unit as `hotPower`. */
  coldPower: number;
  /** Noise temperature of the hot load at the receiver input [K]. */
  hotTemperatureK: number;
  /** Noise temperature of the cold load at the receiver input [K]. */
  coldTemperatureK: number;
  /**
   * Whether the powers are linear or in dB (any common reference).
   * @defaultValue 'linear'
   */
  powerScale?: 'linear' | 'dB';
  /** One-sigma uncertainty of the hot power, relative (e.g. 0.01 for 1 %); dimensionless. @defaultValue 0 */
  hotPowerRelativeSigma?: number;
  /** One-sigma uncertainty of the cold power, relative. @defaultValue 0 */
  coldPowerRelativeSigma?: number;
  /** One-sigma uncertainty of the hot-load temperature [K]. @defaultValue 0 */
  hotTemperatureSigmaK?: number;
  /** One-sigma uncertainty of the cold-load temperature [K]. @defaultValue 0 */
  coldTemperatureSigmaK?: number;
}

/**
 * Contributions to the variance of a Y-factor receiver temperature [K²].
 * @category Measurement
 */
export interface YFactorVarianceBudget {
  /** From the hot-power uncertainty [K²]. */
  hotPower: number;
  /** From the cold-power uncertainty [K²]. */
  coldPower: number;
  /** From the hot-load temperature uncertainty [K²]. */
  hotTemperature: number;
  /** From the cold-load temperature uncertainty [K²]. */
  coldTemperature: number;
}

/**
 * Result of {@link yFactorReceiverTemperature}.
 * @category Measurement
 */
export interface YFactorResult {
  /** Y = P_hot / P_cold (linear, > 1). */
  yFactor: number;
  /** Receiver noise temperature referred to its input [K]. */
  receiverTemperatureK: number;
  /** First-order one-sigma uncertainty of the receiver temperature [K] (uncorrelated inputs). */
  receiverTemperatureSigmaK: number;
  /** Contributions to the variance of the receiver temperature [K²]. */
  varianceBudgetK2: YFactorVarianceBudget;
  /** Noise figure 10·log10(1 + T_rec/T0) [dB] (T0 = 290 K). */
  noiseFigureDb: number;
}

function toLinear(name: string, p: number, scale: 'linear' | 'dB'): number {
  assertFinite(name, p);
  if (scale === 'dB') return 10 ** (p / 10);
  if (!(p > 0)) throw new DomainError(`invalid argument "${name}": expected a power > 0 (linear), received ${p}; pass powerScale: 'dB' for decibel readings.`);
  return p;
}

/**
 * Receiver noise temperature from hot and cold load powers (Y-factor method).
 *
 * @remarks
 * Y = P_hot/P_cold and T_rec = (T_hot − Y·T_cold)/(Y − 1), the standard Y-factor
 * relation for a linear receiver whose output power is proportional to
 * T_load + T_rec (D. M. Pozar, *Microwave Engineering*, 4th ed., 2012, §10.1,
 * from memory; IEEE Std 149-2021 practice for noise-based measurement).
 * The uncertainty is propagated to first order with the partial derivatives
 * ∂T/∂T_hot = 1/(Y−1), ∂T/∂T_cold = −Y/(Y−1), ∂T/∂Y = (T_cold − T_hot)/(Y−1)²,
 * and σ_Y/Y = sqrt(σ_hot² + σ_cold²) for relative power errors, treating the
 * inputs as uncorrelated (JCGM 100:2008, GUM eq. 10).
 * @param input - Powers, load temperatures and optional uncertainties.
 * @returns Y, T_rec [K], its one-sigma uncertainty [K], the variance budget and the noise figure.
 * @throws {@link DomainError} for non-positive linear powers, negative temperatures, T_hot ≤ T_cold or Y ≤ 1.
 * @example
 * ```ts
 * // 290 K / 77 K loads, Y = 2.0 → T_rec = (290 − 2·77)/(2 − 1) = 136 K
 * yFactorReceiverTemperature({ hotPower: 2, coldPower: 1, hotTemperatureK: 290, coldTemperatureK: 77 }).receiverTemperatureK; // 136.000
 * ```
 * @category Measurement
 */
export function yFactorReceiverTemperature(input: YFactorInput): YFactorResult {
  const scale = input.powerScale ?? 'linear';
  if (scale !== 'linear' && scale !== 'dB') throw new DomainError(`invalid argument "powerScale": expected 'linear' or 'dB', received ${String(scale)}.`);
  const ph = toLinear('hotPower', input.hotPower, scale);
  const pc = toLinear('coldPower', input.coldPower, scale);
  const th = input.hotTemperatureK, tc = input.coldTemperatureK;
  assertNonNegative('hotTemperatureK', th, 'K');
  assertNonNegative('coldTemperatureK', tc, 'K');
  if (!(th > tc)) throw new DomainError(`invalid argument "hotTemperatureK": expected a hot load warmer than the cold load (${tc} K), received ${th} K.`);
  const sh = input.hotPowerRelativeSigma ?? 0, sc = input.coldPowerRelativeSigma ?? 0;
  const sth = input.hotTemperatureSigmaK ?? 0, stc = input.coldTemperatureSigmaK ?? 0;
  assertNonNegative('hotPowerRelativeSigma', sh);
  assertNonNegative('coldPowerRelativeSigma', sc);
  assertNonNegative('hotTemperatureSigmaK', sth, 'K');
  assertNonNegative('coldTemperatureSigmaK', stc, 'K');
  const y = ph / pc;
  if (!(y > 1)) throw new DomainError(`invalid measurement: Y = P_hot/P_cold = ${y.toPrecision(6)} ≤ 1; the hot reading must exceed the cold one (check the load order or the receiver's linearity).`);
  const tRec = (th - y * tc) / (y - 1);
  const dY = (tc - th) / ((y - 1) * (y - 1));
  const budget = {
    hotPower: (dY * y * sh) ** 2,
    coldPower: (dY * y * sc) ** 2,
    hotTemperature: (sth / (y - 1)) ** 2,
    coldTemperature: ((y * stc) / (y - 1)) ** 2,
  };
  const variance = budget.hotPower + budget.coldPower + budget.hotTemperature + budget.coldTemperature;
  return displayable<YFactorResult>({
    yFactor: y,
    receiverTemperatureK: tRec,
    receiverTemperatureSigmaK: Math.sqrt(variance),
    varianceBudgetK2: budget,
    noiseFigureDb: 10 * Math.log10(1 + tRec / T0_K),
  }, 'YFactorResult');
}

/**
 * Inputs of {@link noiseSourceReceiverTemperature}.
 * @category Measurement
 */
export interface NoiseSourceInput {
  /** Excess noise ratio of the calibrated source [dB], ENR = 10·log10((T_on − T0)/T0). */
  enrDb: number;
  /** Output power with the source on (linear, or dB with `powerScale`). */
  onPower: number;
  /** Output power with the source off, same unit. */
  offPower: number;
  /**
   * Reference temperature T0 of the ENR calibration [K], > 0 (the IEEE definition uses 290 K;
   * pass the calibration's own value if it differs).
   * @defaultValue 290
   */
  enrReferenceTemperatureK?: number;
  /**
   * Physical temperature of the source when off [K], ≥ 0 (the same rule as the cold load of
   * {@link yFactorReceiverTemperature}); the classic F = ENR/(Y − 1) assumes T_off = T0.
   * @defaultValue `enrReferenceTemperatureK`
   */
  offTemperatureK?: number;
  /**
   * Whether the powers are linear or in dB.
   * @defaultValue 'linear'
   */
  powerScale?: 'linear' | 'dB';
}

/**
 * Result of {@link noiseSourceReceiverTemperature}: the Y-factor result and the temperatures used.
 * @category Measurement
 */
export interface NoiseSourceResult extends YFactorResult {
  /** On temperature the reduction used, T_on = T0·(1 + ENR) [K]. */
  onTemperatureK: number;
  /** Off temperature the reduction used [K]. */
  offTemperatureK: number;
  /** ENR reference temperature T0 the reduction used [K]. */
  enrReferenceTemperatureK: number;
}

/**
 * Noise temperature of a calibrated noise source when on: T_on = T0·(1 + ENR).
 *
 * @remarks
 * ENR = (T_on − T0)/T0 with T0 = 290 K by definition (IEEE Std 149-2021 practice; Keysight
 * application note 57-1, "Fundamentals of RF and microwave noise figure measurements", from
 * memory); a calibration stated for another reference passes its own T0.
 * @param enrDb - Excess noise ratio [dB], finite.
 * @param enrReferenceTemperatureK - Reference temperature T0 [K], > 0. @defaultValue 290
 * @returns T_on [K].
 * @throws {@link DomainError} for a non-finite ENR or T0 ≤ 0.
 * @example
 * ```ts
 * noiseSourceOnTemperature(15); // ≈ 9460.6 K (= 290·(1 + 10^1.5))
 * ```
 * @category Measurement
 */
export function noiseSourceOnTemperature(enrDb: number, enrReferenceTemperatureK: number = T0_K): number {
  assertFinite('enrDb', enrDb);
  assertPositive('enrReferenceTemperatureK', enrReferenceTemperatureK, 'K');
  return enrReferenceTemperatureK * (1 + 10 ** (enrDb / 10));
}

/**
 * Receiver noise temperature and noise figure from a calibrated noise source
 * (noise-diode form of the Y-factor method).
 *
 * @remarks
 * The source's on temperature is T_on = T0·(1 + ENR) ({@link noiseSourceOnTemperature};
 * T0 = 290 K by the IEEE definition of excess noise ratio, settable); with the source off
 * at T_off ≥ 0 K the Y-factor relation gives T_rec = (T_on − Y·T_off)/(Y − 1). The result
 * states T_on, T_off and T0 it used. The noise figure keeps T0 = 290 K of its definition.
 * For T_off = T0 this is the
 * textbook F = ENR/(Y − 1) (noise factor, linear) (Agilent/Keysight
 * application note 57-1, "Fundamentals of RF and microwave noise figure
 * measurements", from memory; Pozar, *Microwave Engineering*, 4th ed., 2012, §10.1).
 * @param input - ENR, on/off powers, the ENR reference and the off temperature.
 * @returns The fields of {@link yFactorReceiverTemperature} (no uncertainties) and T_on, T_off, T0 used [K].
 * @throws {@link DomainError} for non-positive linear powers, Y ≤ 1, T0 ≤ 0 or T_off < 0.
 * @example
 * ```ts
 * // ENR 15 dB, Y = 10 dB, off at 290 K: F = ENR/(Y − 1) = 31.62/9 → NF 5.458 dB
 * const r = noiseSourceReceiverTemperature({ enrDb: 15, onPower: 10, offPower: 1 });
 * // r.onTemperatureK: 9460.6, r.noiseFigureDb: 5.458
 * ```
 * @category Measurement
 */
export function noiseSourceReceiverTemperature(input: NoiseSourceInput): NoiseSourceResult {
  const t0 = input.enrReferenceTemperatureK ?? T0_K;
  const tOn = noiseSourceOnTemperature(input.enrDb, t0);
  const tOff = input.offTemperatureK ?? t0;
  assertNonNegative('offTemperatureK', tOff, 'K');
  const r = yFactorReceiverTemperature({
    hotPower: input.onPower,
    coldPower: input.offPower,
    hotTemperatureK: tOn,
    coldTemperatureK: tOff,
    powerScale: input.powerScale,
  });
  return displayable({ ...r, onTemperatureK: tOn, offTemperatureK: tOff, enrReferenceTemperatureK: t0 }, 'YFactorResult');
}
