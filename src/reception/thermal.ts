/**
 * Ohmic-loss noise of an array: the part of the Twiss noise (network module,
 * thermalImpedanceNoise) not accounted for by radiation.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteArray, assertFiniteCMatrix, assertPositive, assertSquare } from '../internal/validate.js';
import { K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { checkTemperature } from './brightness.js';
import { thermalImpedanceNoise } from '../network/noise.js';
import { matrixView } from '../linalg/cmatrix.js';

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
  /**
   * Loss resistance matrix R_loss [Ω], N×N Hermitian positive semidefinite
   * (e.g. Re Z minus the radiation resistance matrix of a solver); the noise is
   * 4 k_B T_phys B R_loss.
   */
  lossResistanceOhm?: CMatrix;
}

/**
 * Noise of the ohmic losses of an array at physical temperature T_phys, at the
 * open-circuit terminals, from the pattern integral, from per-element radiation
 * efficiencies, or from a loss resistance matrix.
 *
 * @remarks
 * The part of the Twiss matrix not accounted for by radiation:
 * R_loss = 2 k_B T_phys B (Z + Zᴴ) − T_phys·R_iso,1K, where R_iso,1K is the
 * isotropic brightness integral at 1 K (conventions, "brightness noise"); a
 * lossless array gives zero. With per-element radiation efficiencies eₙ
 * instead: R_loss = 4 k_B T_phys B diag((1 − eₙ) Re Zₙₙ); with a loss resistance
 * matrix: 4 k_B T_phys B · herm(R_loss) (Twiss for the lossy part alone). References: K. F.
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
  const hasRes = options?.lossResistanceOhm !== undefined;
  if (Number(hasIso) + Number(hasEff) + Number(hasRes) !== 1) {
    throw new DimensionError('invalid argument "options": give exactly one of isotropicRadiationPerK (an N×N matrix), radiationEfficiency (N values) or lossResistanceOhm (an N×N matrix).');
  }
  if (hasRes) {
    const r = options.lossResistanceOhm as CMatrix;
    assertSquare('options.lossResistanceOhm', r);
    assertFiniteCMatrix('options.lossResistanceOhm', r);
    if (r.rows !== n) {
      throw new DimensionError(`invalid argument "options.lossResistanceOhm": expected ${n}×${n} (the size of "impedanceOhm"), received ${r.rows}×${r.cols}.`);
    }
    const c = 4 * K_BOLTZMANN_J_PER_K * physicalTemperatureK * bandwidthHz;
    const data = new Float64Array(2 * n * n);
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const a = 2 * (i * n + j), b = 2 * (j * n + i);
        data[a] = 0.5 * c * (r.data[a] + r.data[b]);
        data[a + 1] = 0.5 * c * (r.data[a + 1] - r.data[b + 1]);
      }
    }
    return matrixView(n, n, data);
  }
  const s = 2 * K_BOLTZMANN_J_PER_K * physicalTemperatureK * bandwidthHz;
  const out = thermalImpedanceNoise(impedanceOhm, physicalTemperatureK, bandwidthHz);
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
