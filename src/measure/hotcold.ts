/**
 * Matrix Y-factor: receiver noise correlation of all channels from hot and
 * cold correlation matrices.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertColumn, assertFiniteCMatrix, assertNonNegative, assertSquare } from '../internal/validate.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { hermitianDeviation, quadraticForm } from '../linalg/ops.js';

/**
 * Inputs of {@link receiverNoiseFromHotCold}.
 * @category Measurement
 */
export interface HotColdCorrelationInput {
  /** Output correlation matrix of all channels with the hot environment, N×N Hermitian [W or any consistent unit]. */
  hot: CMatrix;
  /** Output correlation matrix with the cold environment, N×N Hermitian, same unit. */
  cold: CMatrix;
  /** Brightness temperature of the hot environment [K]. */
  hotTemperatureK: number;
  /** Brightness temperature of the cold environment [K]. */
  coldTemperatureK: number;
  /**
   * Relative tolerance on the Hermitian deviation of the inputs.
   * @defaultValue 1e-8
   */
  hermitianTolerance?: number;
}

/**
 * Result of {@link receiverNoiseFromHotCold}.
 * @category Measurement
 */
export interface HotColdCorrelationResult {
  /** Output correlation per kelvin of environment brightness, (R_hot − R_cold)/(T_hot − T_cold), N×N [unit/K]. */
  perKelvin: CMatrix;
  /** Output-referred receiver noise correlation R_cold − T_cold·perKelvin, N×N [unit]. */
  receiver: CMatrix;
}

/**
 * Receiver noise correlation matrix of an array from hot and cold
 * measurements (matrix Y-factor).
 *
 * @remarks
 * Assumptions (stated, not checked): the receiver chain is linear and
 * unchanged between the two measurements, and the hot and cold environments
 * have the same angular shape (typically both fill the whole pattern:
 * absorber enclosing the array, and a uniform cold sky), so that the output
 * correlation is R(T) = T·R_K + R_rec with one per-kelvin matrix R_K. Then
 * R_K = (R_hot − R_cold)/(T_hot − T_cold) and R_rec = R_cold − T_cold·R_K,
 * the matrix form of the Y-factor relation (K. F. Warnick, B. D. Jeffs et al.,
 * "Phased array antenna design and characterization for next-generation
 * radio telescopes", and the isotropic-noise figure-of-merit framework of
 * Warnick, Ivashina, Maaskant, Woestenburg, IEEE Trans. Antennas Propag.
 * 58(6), 2010, from memory). A non-uniform cold sky violates the model; model
 * its difference and subtract it before calling.
 * @param input - Hot/cold correlation matrices and temperatures.
 * @returns The per-kelvin and receiver correlation matrices (Hermitian).
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-Hermitian input, negative temperatures or T_hot ≤ T_cold.
 * @category Measurement
 */
export function receiverNoiseFromHotCold(input: HotColdCorrelationInput): HotColdCorrelationResult {
  const { hot, cold, hotTemperatureK: th, coldTemperatureK: tc } = input;
  assertSquare('hot', hot);
  assertSquare('cold', cold);
  assertFiniteCMatrix('hot', hot);
  assertFiniteCMatrix('cold', cold);
  if (hot.rows !== cold.rows) throw new DimensionError(`invalid argument "cold": expected ${hot.rows}×${hot.rows} like "hot", received ${cold.rows}×${cold.cols}.`);
  assertNonNegative('hotTemperatureK', th, 'K');
  assertNonNegative('coldTemperatureK', tc, 'K');
  if (!(th > tc)) throw new DomainError(`invalid argument "hotTemperatureK": expected a hot environment warmer than the cold one (${tc} K), received ${th} K.`);
  const tol = input.hermitianTolerance ?? 1e-8;
  for (const [name, m] of [['hot', hot], ['cold', cold]] as const) {
    const dev = hermitianDeviation(m);
    if (dev > tol) throw new DomainError(`invalid argument "${name}": expected a Hermitian correlation matrix, deviation ${dev.toExponential(2)} exceeds ${tol}.`);
  }
  const n = hot.rows;
  const perK = new Float64Array(2 * n * n);
  const rec = new Float64Array(2 * n * n);
  const s = 1 / (th - tc);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const p = 2 * (i * n + j), q = 2 * (j * n + i);
      // Hermitian parts of the inputs, so the outputs are exactly Hermitian.
      const hr = 0.5 * (hot.data[p] + hot.data[q]), hi = 0.5 * (hot.data[p + 1] - hot.data[q + 1]);
      const cr = 0.5 * (cold.data[p] + cold.data[q]), ci = 0.5 * (cold.data[p + 1] - cold.data[q + 1]);
      perK[p] = (hr - cr) * s;
      perK[p + 1] = (hi - ci) * s;
      rec[p] = cr - tc * perK[p];
      rec[p + 1] = ci - tc * perK[p + 1];
    }
  }
  for (let i = 0; i < n; i++) {
    if (!(perK[2 * (i * n + i)] > 0)) {
      throw new DomainError(`invalid measurement: channel ${i} shows no increase from cold to hot (diagonal of R_hot − R_cold is ${(perK[2 * (i * n + i)] * (th - tc)).toPrecision(4)}); Y ≤ 1 on that channel.`);
    }
  }
  return { perKelvin: { rows: n, cols: n, data: perK }, receiver: { rows: n, cols: n, data: rec } };
}

/**
 * Beam-equivalent receiver temperature of a beam formed with weights w from a
 * matrix Y-factor result: T_rec(w) = wᴴR_rec w / wᴴR_K w [K].
 *
 * @remarks
 * With R_K the response to the hot/cold environment per kelvin, this is the
 * temperature of that environment that would give the same beam output power
 * as the receiver noise; for isotropic hot and cold environments it is the
 * isotropic-noise-referred receiver temperature of the beam (Warnick et al.,
 * IEEE Trans. Antennas Propag. 58(6), 2010, from memory). For w = eₙ it is
 * the single-channel Y-factor result of channel n.
 * @param result - Output of {@link receiverNoiseFromHotCold}.
 * @param weights - Beamformer weights w, N×1 (y = wᴴx).
 * @returns T_rec(w) [K].
 * @throws {@link DimensionError} on a wrong weight length; {@link DomainError} if the beam sees no environment power.
 * @category Measurement
 */
export function beamReceiverTemperature(result: HotColdCorrelationResult, weights: CMatrix): number {
  const n = result.perKelvin.rows;
  assertColumn('weights', weights, n, 'one weight per channel');
  assertFiniteCMatrix('weights', weights);
  const den = quadraticForm(weights, result.perKelvin);
  if (!(den > 0)) throw new DomainError(`invalid argument "weights": the beam has no response to the hot/cold environment (wᴴR_K w = ${den}); check the weights.`);
  return quadraticForm(weights, result.receiver) / den;
}
