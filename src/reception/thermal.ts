/**
 * Thermal noise of passive networks (Twiss), radiation resistance matrices and
 * ohmic-loss noise.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteArray, assertFiniteCMatrix, assertPositive, assertSquare } from '../internal/validate.js';
import { K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { checkTemperature } from './brightness.js';

/**
 * Open-circuit noise correlation of a passive network at uniform temperature T.
 *
 * @remarks
 * DESIGN, "thermal noise": E[v vᴴ] = 2 k_B T B (Z + Zᴴ) (R. Q. Twiss, "Nyquist's
 * and Thevenin's theorems generalized for nonreciprocal linear networks",
 * J. Appl. Phys. 26(5), 1955, from memory).
 * @param impedanceOhm - Impedance matrix Z [Ω], N×N.
 * @param temperatureK - Physical temperature T [K], ≥ 0.
 * @param bandwidthHz - Bandwidth B [Hz], > 0.
 * @returns 2 k_B T B (Z + Zᴴ) [V²], N×N Hermitian.
 * @throws {@link DimensionError} for a non-square Z; {@link DomainError} for a negative temperature or non-finite entries.
 * @example
 * ```ts
 * thermalNoiseCorrelation(fromRows([[50]]), 290, 1); // 4 k_B·290·50 ≈ 8.0e-19 V²
 * ```
 * @category Reception
 */
export function thermalNoiseCorrelation(impedanceOhm: CMatrix, temperatureK: number, bandwidthHz: number): CMatrix {
  assertSquare('impedanceOhm', impedanceOhm);
  assertFiniteCMatrix('impedanceOhm', impedanceOhm);
  checkTemperature('temperatureK', temperatureK);
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  return twissInto(new Float64Array(2 * impedanceOhm.rows * impedanceOhm.rows), impedanceOhm, 2 * K_BOLTZMANN_J_PER_K * temperatureK * bandwidthHz);
}

/** @internal out = s·(Z + Zᴴ) as a CMatrix. No checks. */
export function twissInto(out: Float64Array, z: CMatrix, s: number): CMatrix {
  const n = z.rows, d = z.data;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const a = 2 * (i * n + j), b = 2 * (j * n + i);
      out[a] = s * (d[a] + d[b]);
      out[a + 1] = s * (d[a + 1] - d[b + 1]);
    }
  }
  return { rows: n, cols: n, data: out };
}

/**
 * Options of {@link ohmicLossNoiseCorrelation}: give exactly one description of the radiation.
 * @category Reception
 */
export interface OhmicLossOptions {
  /**
   * Open-circuit correlation of the array in an isotropic bath at 1 K
   * [V²/K], i.e. the brightness integral with T ≡ 1 K (from
   * brightnessCorrelation(patterns, quadrature, isotropicBrightness(1), B)).
   */
  isotropicRadiationPerK?: CMatrix;
  /**
   * Radiation efficiency of each port's own element, in (0, 1]; the loss is
   * then taken as local to each element: R_loss,nn = (1 − eₙ)·Re Zₙₙ, no mutual
   * loss resistance (common practice for thin-wire elements).
   */
  radiationEfficiency?: Float64Array;
}

/**
 * Noise of the ohmic losses of an array at physical temperature T_phys, at the
 * open-circuit terminals.
 *
 * @remarks
 * The part of the Twiss matrix not accounted for by radiation:
 * R_loss = 2 k_B T_phys B (Z + Zᴴ) − T_phys·R_iso,1K, where R_iso,1K is the
 * isotropic brightness integral at 1 K (DESIGN, "brightness noise"); a
 * lossless array gives zero. With per-element radiation efficiencies eₙ
 * instead: R_loss = 4 k_B T_phys B diag((1 − eₙ) Re Zₙₙ). References: K. F.
 * Warnick, B. Woestenburg, L. Belostotski, P. Russer, "Minimizing the noise
 * penalty due to mutual coupling in array antennas", IEEE Trans. Antennas
 * Propag. 57(7), 2009 (from memory).
 * @param impedanceOhm - Impedance matrix Z [Ω], N×N.
 * @param physicalTemperatureK - Physical temperature of the lossy structure [K], ≥ 0.
 * @param bandwidthHz - Bandwidth B [Hz], > 0.
 * @param options - The radiation description (exactly one of the two fields).
 * @returns R_loss [V²], N×N Hermitian.
 * @throws {@link DimensionError} for mismatched sizes or when both/neither options are given;
 *   {@link DomainError} for a negative temperature or efficiencies outside (0, 1].
 * @category Reception
 */
export function ohmicLossNoiseCorrelation(
  impedanceOhm: CMatrix, physicalTemperatureK: number, bandwidthHz: number, options: OhmicLossOptions,
): CMatrix {
  assertSquare('impedanceOhm', impedanceOhm);
  assertFiniteCMatrix('impedanceOhm', impedanceOhm);
  checkTemperature('physicalTemperatureK', physicalTemperatureK);
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  const n = impedanceOhm.rows;
  const hasIso = options?.isotropicRadiationPerK !== undefined, hasEff = options?.radiationEfficiency !== undefined;
  if (hasIso === hasEff) {
    throw new DimensionError('invalid argument "options": give exactly one of isotropicRadiationPerK (an N×N matrix) or radiationEfficiency (N values).');
  }
  const s = 2 * K_BOLTZMANN_J_PER_K * physicalTemperatureK * bandwidthHz;
  const out = twissInto(new Float64Array(2 * n * n), impedanceOhm, s);
  if (hasIso) {
    const r = options.isotropicRadiationPerK as CMatrix;
    assertSquare('options.isotropicRadiationPerK', r);
    assertFiniteCMatrix('options.isotropicRadiationPerK', r);
    if (r.rows !== n) {
      throw new DimensionError(`invalid argument "options.isotropicRadiationPerK": expected ${n}×${n} (the size of "impedanceOhm"), received ${r.rows}×${r.cols}; patterns and impedance matrix must describe the same ports.`);
    }
    for (let k = 0; k < out.data.length; k++) out.data[k] -= physicalTemperatureK * r.data[k];
    return out;
  }
  const e = options.radiationEfficiency as Float64Array;
  assertFiniteArray('options.radiationEfficiency', e);
  if (e.length !== n) {
    throw new DimensionError(`invalid argument "options.radiationEfficiency": expected ${n} values (one per port of "impedanceOhm"), received ${e.length}.`);
  }
  out.data.fill(0);
  for (let i = 0; i < n; i++) {
    if (!(e[i] > 0 && e[i] <= 1)) {
      throw new DomainError(`invalid argument "options.radiationEfficiency": entry ${i} is ${e[i]}; efficiencies must lie in (0, 1].`);
    }
    out.data[2 * (i * n + i)] = 2 * s * (1 - e[i]) * impedanceOhm.data[2 * (i * n + i)];
  }
  return out;
}
