/**
 * Referral of correlation matrices and beamformer weights between the array's
 * open-circuit (Thevenin) terminals and the loaded amplifier inputs.
 * @module
 */
import { DimensionError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { inverse } from '../linalg/lu.js';
import { add, adjoint, multiply } from '../linalg/ops.js';
import { assertFiniteCMatrix, assertSquare } from '../internal/validate.js';

/**
 * Transfer matrix from open-circuit voltages to loaded port voltages.
 *
 * @remarks
 * With V = Z_A I + v_oc at the array ports and loads V = −Z_L I (currents into
 * the ports, conventions "multiport"), the load voltages are
 * V_L = Q v_oc, Q = Z_L (Z_A + Z_L)⁻¹. Amplifier noise sources referred as in
 * receiverNoiseCorrelation ride on v_oc and transfer the same way.
 * @param arrayImpedanceOhm - Z_A [Ω], N×N.
 * @param loadImpedanceOhm - Z_L [Ω], N×N (diagonal for independent amplifiers).
 * @returns Q, N×N, dimensionless.
 * @throws {@link DimensionError} for mismatched sizes; {@link SingularMatrixError} if Z_A + Z_L is singular.
 * @category Reception
 */
export function loadedVoltageTransfer(arrayImpedanceOhm: CMatrix, loadImpedanceOhm: CMatrix): CMatrix {
  assertSquare('arrayImpedanceOhm', arrayImpedanceOhm);
  assertSquare('loadImpedanceOhm', loadImpedanceOhm);
  assertFiniteCMatrix('arrayImpedanceOhm', arrayImpedanceOhm);
  assertFiniteCMatrix('loadImpedanceOhm', loadImpedanceOhm);
  if (loadImpedanceOhm.rows !== arrayImpedanceOhm.rows) {
    throw new DimensionError(`invalid argument "loadImpedanceOhm": expected ${arrayImpedanceOhm.rows}×${arrayImpedanceOhm.rows} (one load per array port), received ${loadImpedanceOhm.rows}×${loadImpedanceOhm.cols}.`);
  }
  return multiply(loadImpedanceOhm, inverse(add(arrayImpedanceOhm, loadImpedanceOhm)));
}

/**
 * Refers a correlation matrix from the open-circuit terminals to the loads: R_L = Q R Qᴴ.
 * @param correlation - R at the open-circuit terminals [V²], N×N.
 * @param arrayImpedanceOhm - Z_A [Ω], N×N.
 * @param loadImpedanceOhm - Z_L [Ω], N×N.
 * @returns R_L [V²], N×N.
 * @throws {@link DimensionError} for mismatched sizes; {@link SingularMatrixError} for a singular Z_A + Z_L.
 * @category Reception
 */
export function referCorrelationToLoads(correlation: CMatrix, arrayImpedanceOhm: CMatrix, loadImpedanceOhm: CMatrix): CMatrix {
  const q = loadedVoltageTransfer(arrayImpedanceOhm, loadImpedanceOhm);
  checkSize('correlation', correlation, q.rows);
  return multiply(multiply(q, correlation), adjoint(q));
}

/**
 * Refers a correlation matrix from the loads back to the open-circuit
 * terminals: R = Q⁻¹ R_L Q⁻ᴴ, Q⁻¹ = (Z_A + Z_L) Z_L⁻¹.
 * @param correlation - R_L at the loads [V²], N×N.
 * @param arrayImpedanceOhm - Z_A [Ω], N×N.
 * @param loadImpedanceOhm - Z_L [Ω], N×N, non-singular.
 * @returns R at the open-circuit terminals [V²], N×N.
 * @throws {@link DimensionError} for mismatched sizes; {@link SingularMatrixError} for a singular Z_L.
 * @category Reception
 */
export function referCorrelationToOpenCircuit(correlation: CMatrix, arrayImpedanceOhm: CMatrix, loadImpedanceOhm: CMatrix): CMatrix {
  const qInv = inverse(loadedVoltageTransfer(arrayImpedanceOhm, loadImpedanceOhm));
  checkSize('correlation', correlation, qInv.rows);
  return multiply(multiply(qInv, correlation), adjoint(qInv));
}

/**
 * Converts beamformer weights applied at the loads into the equivalent
 * open-circuit weights, w_oc = Qᴴ w_L, so that y = w_Lᴴ V_L = w_ocᴴ v_oc and every
 * SNR is the same in both places.
 * @param weightsAtLoads - w_L, N×K (K beams), dimensionless.
 * @param arrayImpedanceOhm - Z_A [Ω], N×N.
 * @param loadImpedanceOhm - Z_L [Ω], N×N.
 * @returns w_oc, N×K.
 * @throws {@link DimensionError} for mismatched sizes.
 * @category Reception
 */
export function referWeightsToOpenCircuit(weightsAtLoads: CMatrix, arrayImpedanceOhm: CMatrix, loadImpedanceOhm: CMatrix): CMatrix {
  const q = loadedVoltageTransfer(arrayImpedanceOhm, loadImpedanceOhm);
  checkRows('weightsAtLoads', weightsAtLoads, q.rows);
  return multiply(adjoint(q), weightsAtLoads);
}

/**
 * Converts open-circuit weights into the weights to apply at the loads,
 * w_L = Q⁻ᴴ w_oc (inverse of {@link referWeightsToOpenCircuit}).
 * @param weightsAtOpenCircuit - w_oc, N×K, dimensionless.
 * @param arrayImpedanceOhm - Z_A [Ω], N×N.
 * @param loadImpedanceOhm - Z_L [Ω], N×N, non-singular.
 * @returns w_L, N×K.
 * @throws {@link DimensionError} for mismatched sizes; {@link SingularMatrixError} for a singular Z_L.
 * @category Reception
 */
export function referWeightsToLoads(weightsAtOpenCircuit: CMatrix, arrayImpedanceOhm: CMatrix, loadImpedanceOhm: CMatrix): CMatrix {
  const qInv = inverse(loadedVoltageTransfer(arrayImpedanceOhm, loadImpedanceOhm));
  checkRows('weightsAtOpenCircuit', weightsAtOpenCircuit, qInv.rows);
  return multiply(adjoint(qInv), weightsAtOpenCircuit);
}

function checkSize(name: string, r: CMatrix, n: number): void {
  assertSquare(name, r);
  if (r.rows !== n) throw new DimensionError(`invalid argument "${name}": expected ${n}×${n} (one row per array port), received ${r.rows}×${r.cols}.`);
}

function checkRows(name: string, w: CMatrix, n: number): void {
  assertFiniteCMatrix(name, w);
  if (w.rows !== n || w.cols < 1) throw new DimensionError(`invalid argument "${name}": expected ${n}×K (one row per array port), received ${w.rows}×${w.cols}.`);
}
