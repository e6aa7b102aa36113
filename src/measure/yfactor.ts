/**
 * Y-factor (hot/cold) reduction of one receiver channel.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertNonNegative, assertPositive } from '../internal/validate.js';
import { T0_K } from '../units/constants.js';

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
 * yFactorReceiverTemperature({ hotPower: 2, coldPower: 1, hotTemperatureK: 290, coldTemperatureK: 77 });
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
  return {
    yFactor: y,
    receiverTemperatureK: tRec,
    receiverTemperatureSigmaK: Math.sqrt(variance),
    varianceBudgetK2: budget,
    noiseFigureDb: 10 * Math.log10(1 + tRec / T0_K),
  };
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
   * Physical temperature of the source when off [K]; the classic formula assumes T0 = 290 K.
   * @defaultValue 290
   */
  offTemperatureK?: number;
  /**
   * Whether the powers are linear or in dB.
   * @defaultValue 'linear'
   */
  powerScale?: 'linear' | 'dB';
}

/**
 * Receiver noise temperature and noise figure from a calibrated noise source
 * (noise-diode form of the Y-factor method).
 *
 * @remarks
 * The source's on temperature is T_on = T0·(1 + ENR) with T0 = 290 K (the IEEE
 * definition of excess noise ratio); with the source off at T_off the Y-factor
 * relation gives T_rec = (T_on − Y·T_off)/(Y − 1). For T_off = T0 this is the
 * textbook F = ENR/(Y − 1) (noise factor, linear) (Agilent/Keysight
 * application note 57-1, "Fundamentals of RF and microwave noise figure
 * measurements", from memory; Pozar, *Microwave Engineering*, 4th ed., 2012, §10.1).
 * @param input - ENR, on/off powers and the off temperature.
 * @returns The same fields as {@link yFactorReceiverTemperature} (no uncertainties).
 * @throws {@link DomainError} for non-positive linear powers or Y ≤ 1.
 * @category Measurement
 */
export function noiseSourceReceiverTemperature(input: NoiseSourceInput): YFactorResult {
  assertFinite('enrDb', input.enrDb);
  const tOff = input.offTemperatureK ?? T0_K;
  assertPositive('offTemperatureK', tOff, 'K');
  const tOn = T0_K * (1 + 10 ** (input.enrDb / 10));
  return yFactorReceiverTemperature({
    hotPower: input.onPower,
    coldPower: input.offPower,
    hotTemperatureK: tOn,
    coldTemperatureK: tOff,
    powerScale: input.powerScale,
  });
}
