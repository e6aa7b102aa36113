/**
 * Receiver noise of N amplifiers coupled through the array impedance matrix
 * (noise parameters as in the network module; the one-amplifier formula is
 * network's noiseTemperatureK).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { complexParts, type CMatrix, matrixView } from '../linalg/cmatrix.js';
import { parseNoiseParameters, type NoiseParametersInput } from '../network/noise.js';
import { assertFiniteCMatrix, assertPositive, assertSquare, describeValue } from '../internal/validate.js';
import { K_BOLTZMANN_J_PER_K, T0_K } from '../units/constants.js';
import { herkLowerKernel, herkLowerWeighted } from '../internal/herk.js';

/** @internal Parsed noise parameters. */
export interface ParsedAmplifier { tMin: number; rn: number; yr: number; yi: number }

/** @internal Noise parameters validated by the network module's one rule ({@link parseNoiseParameters}). */
export function parseAmplifier(name: string, a: NoiseParametersInput): ParsedAmplifier {
  const p = parseNoiseParameters(name, a);
  return { tMin: p.tMin, rn: p.rn, yr: p.gOpt, yi: p.bOpt };
}

/**
 * Receiver-noise correlation of N amplifiers coupled through the array, at the
 * array's open-circuit terminals.
 *
 * @remarks
 * conventions, "coupled amplifiers": amplifier n has a series EMF eₙ and a shunt
 * current iₙ driven into its array port with E|e|² = 4k_B B T0 R_n,
 * E|i|² = 4k_B B T0 R_n |Y_opt|², E[i e*] = 4k_B B (T_min/2 − T0 R_n Y_opt);
 * amplifiers are mutually uncorrelated. Referred to the open-circuit terminals,
 * v_rec = e + Z_A i, so
 * R_rec = Σ_ee + Z_A C + C* Z_Aᴴ + Z_A Σ_ii Z_Aᴴ with C = diag(E[iₙ eₙ*]).
 * It does not depend on the amplifiers' input impedances. For N = 1 the
 * equivalent temperature E|v_rec|² / (4 k_B B Re Z_A) is exactly
 * T_min + T0 R_n |Y_s − Y_opt|² / Re Y_s with Y_s = 1/Z_A (tested at random
 * points). References: K. F. Warnick, B. Woestenburg, L. Belostotski,
 * P. Russer, IEEE Trans. Antennas Propag. 57(7), 2009; K. F. Warnick et al.,
 * IEEE Trans. Antennas Propag. 58(6), 2010 (from memory).
 * @param impedanceOhm - Array impedance matrix Z_A [Ω], N×N.
 * @param amplifiers - One set of noise parameters per port, or one set shared by all ports.
 * @param bandwidthHz - Bandwidth B [Hz], > 0.
 * @returns R_rec [V²], N×N Hermitian.
 * @throws {@link DimensionError} when the number of amplifiers differs from the number of ports;
 *   {@link DomainError} for non-physical parameters.
 * @category Reception
 */
export function receiverNoiseCorrelation(
  impedanceOhm: CMatrix, amplifiers: NoiseParametersInput | ReadonlyArray<NoiseParametersInput>, bandwidthHz: number,
): CMatrix {
  assertSquare('impedanceOhm', impedanceOhm);
  assertFiniteCMatrix('impedanceOhm', impedanceOhm);
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  const n = impedanceOhm.rows;
  const amps = parseAmplifiers(amplifiers, n);
  const s = 4 * K_BOLTZMANN_J_PER_K * bandwidthHz;
  const z = impedanceOhm.data;
  const out = new Float64Array(2 * n * n);
  // c_k = E[i e*]/s, σi_k = E|i|²/s, σe_k = E|e|²/s
  const cr = new Float64Array(n), ci = new Float64Array(n), si = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const a = amps[k];
    cr[k] = a.tMin / 2 - T0_K * a.rn * a.yr;
    ci[k] = -T0_K * a.rn * a.yi;
    si[k] = T0_K * a.rn * (a.yr * a.yr + a.yi * a.yi);
  }
  // lower triangle of Z Σ_ii Zᴴ by one Hermitian rank-N update (SIMD kernel; scalar fallback on Z√Σ)
  const zsz = new Float64Array(2 * n * n);
  if (!herkLowerWeighted(n, n, [z], n, si, zsz)) {
    const g = new Float64Array(2 * n * n);
    for (let i = 0; i < n; i++) for (let k = 0; k < n; k++) {
      const r = Math.sqrt(si[k]), q = 2 * (i * n + k);
      g[q] = r * z[q]; g[q + 1] = r * z[q + 1];
    }
    herkLowerKernel(n, n, g, n, zsz);
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      let re = zsz[2 * (i * n + j)], im = zsz[2 * (i * n + j) + 1];
      // (Z C)_ij = Z_ij c_j ; (C* Zᴴ)_ij = conj(c_i) conj(Z_ji)
      const zr = z[2 * (i * n + j)], zi = z[2 * (i * n + j) + 1];
      re += zr * cr[j] - zi * ci[j];
      im += zr * ci[j] + zi * cr[j];
      const yr = z[2 * (j * n + i)], yi = z[2 * (j * n + i) + 1];
      re += cr[i] * yr - ci[i] * yi;
      im += -(cr[i] * yi + ci[i] * yr);
      if (i === j) { re += T0_K * amps[i].rn; im = 0; }
      out[2 * (i * n + j)] = s * re; out[2 * (i * n + j) + 1] = s * im;
      out[2 * (j * n + i)] = s * re; out[2 * (j * n + i) + 1] = im === 0 ? 0 : -s * im;
    }
  }
  return matrixView(n, n, out);
}

/** @internal Validates one shared or N per-port amplifier descriptions. */
export function parseAmplifiers(amplifiers: NoiseParametersInput | ReadonlyArray<NoiseParametersInput>, n: number): ParsedAmplifier[] {
  if (Array.isArray(amplifiers)) {
    if (amplifiers.length !== n) {
      throw new DimensionError(`invalid argument "amplifiers": expected ${n} noise-parameter sets (one per port of the impedance matrix) or a single shared set, received ${amplifiers.length}.`);
    }
    return amplifiers.map((a, k) => parseAmplifier(`amplifiers[${k}]`, a));
  }
  const p = parseAmplifier('amplifiers', amplifiers as NoiseParametersInput);
  return Array.from({ length: n }, () => p);
}
