/**
 * Fixed (noise-blind) beams of a receiving array for an unpolarized source:
 * the principal-polarization conjugate-field match, optionally with an
 * amplitude taper, and the beam power pattern of any weights.
 * @module
 */
import { DimensionError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { adjoint, multiply } from '../linalg/ops.js';
import { assertFiniteCMatrix, describeValue } from '../internal/validate.js';
import { assertSampledPatterns, type SampledPortPatterns } from './patterns.js';
import { matchedFieldWeightsUnpolarizedSource } from '../beamform/unpolarized.js';

/**
 * Conjugate-field (matched-field) open-circuit weights of each beam for an
 * unpolarized source, with an optional real amplitude taper.
 *
 * @remarks
 * With P = [f_θ f_φ] (N×2) the port patterns at the beam direction, the beam
 * matches the principal polarization of the array response: c is the principal
 * eigenvector of the 2×2 Gram matrix PᴴP (closed form) and w = diag(g)·P c,
 * normalised to unit 2-norm, g the taper (all ones by default). This is the
 * maximum-SNR beam of {@link maxSnrWeightsUnpolarized} for spatially white noise
 * (R_n ∝ I) — the conjugate-field match of the principal polarization — and
 * weighting the match by a taper gives the tapered beam. Convention: y = wᴴx,
 * docs/conventions.md. Source: generalized Rayleigh quotient (H. L. Van Trees,
 * *Optimum Array Processing*, Wiley, 2002, §6.2, from memory). The beamformer itself is the
 * beamform module's {@link matchedFieldWeightsUnpolarizedSource}.
 * @param beamPatterns - Patterns at the K beam directions [V], N×K.
 * @param amplitude - Real taper gₙ ≥ 0 per port (dimensionless), length N. @defaultValue all ones
 * @returns Weights, N×K, each column of unit 2-norm (a zero column where the beam pattern vanishes).
 * @throws {@link DimensionError} if `amplitude` does not have one value per port.
 * @category Reception
 */
export function matchedFieldWeightsUnpolarized(beamPatterns: SampledPortPatterns, amplitude?: ArrayLike<number>): CMatrix {
  const n = assertSampledPatterns('beamPatterns', beamPatterns);
  if (amplitude !== undefined && (amplitude === null || typeof amplitude.length !== 'number' || amplitude.length !== n)) {
    throw new DimensionError(`invalid argument "amplitude": expected ${n} real values (one per port of "beamPatterns"), received ${describeValue(amplitude)}.`);
  }
  return matchedFieldWeightsUnpolarizedSource(beamPatterns.thetaComponentV, beamPatterns.phiComponentV, amplitude);
}

/**
 * Beam power patterns |wᴴf_θ|² + |wᴴf_φ|² of each weight column at sampled directions.
 *
 * @remarks
 * The output power of beam k for a unit-flux unpolarized plane wave from each direction,
 * up to the constant 2SBλ²/(η|I₀|²) of the point-source row of docs/conventions.md
 * (y = wᴴx). Two complex products (W ᴴF_θ and WᴴF_φ).
 * @param weights - Open-circuit weights, N×K.
 * @param patterns - Port patterns at M directions [V], N×M.
 * @returns K rows of M powers [V²] (row k is beam k).
 * @throws {@link DimensionError} if the port counts differ.
 * @category Reception
 */
export function beamPowerPatterns(weights: CMatrix, patterns: SampledPortPatterns): Float64Array[] {
  const n = assertSampledPatterns('patterns', patterns);
  assertFiniteCMatrix('weights', weights);
  if (weights.rows !== n) {
    throw new DimensionError(`invalid argument "weights": expected ${n} rows (one per port of "patterns"), received ${weights.rows}×${weights.cols}.`);
  }
  const wh = adjoint(weights);
  const t = multiply(wh, patterns.thetaComponentV).data, f = multiply(wh, patterns.phiComponentV).data;
  const m = patterns.thetaRad.length;
  const out: Float64Array[] = [];
  for (let k = 0; k < weights.cols; k++) {
    const row = new Float64Array(m);
    for (let j = 0; j < m; j++) {
      const o = 2 * (k * m + j);
      row[j] = t[o] ** 2 + t[o + 1] ** 2 + f[o] ** 2 + f[o + 1] ** 2;
    }
    out.push(row);
  }
  return out;
}
