/**
 * Beamformer weights from steering vectors and correlation matrices:
 * conjugate-field match, maximum SNR, MVDR, LCMV, maximum directivity and
 * maximum gain. Conventions: beam output y = wᴴx, so the beam's response to a
 * steering or signal-response vector a is wᴴa (docs/conventions.md).
 * @module
 */
import { DimensionError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { choleskySolve, solveLowerTriangular } from '../linalg/cholesky.js';
import { add } from '../linalg/ops.js';
import { assertColumn, assertFiniteCMatrix, assertShape } from '../internal/validate.js';
import { factorCorrelation, factorGram } from './conditioning.js';
import { type BeamNormalization, assertNormalization, normalizeColumn } from './normalize.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * Options shared by the weight functions.
 * @category Beamforming
 */
export interface BeamWeightOptions {
  /**
   * Scaling of the weights (see {@link BeamNormalization}).
   * @defaultValue `'distortionless'` (wᴴa = 1)
   */
  normalization?: BeamNormalization;
  /**
   * Diagonal loading relative to the mean eigenvalue, δ = loading·tr(R)/N, added before inversion (see {@link diagonalLoading}).
   * @defaultValue 0 (no loading: a singular matrix throws)
   */
  diagonalLoading?: number;
}

function lookVector(a: CMatrix): number {
  assertFiniteCMatrix('a', a);
  assertColumn('a', a);
  return a.rows;
}

function finish(w: CMatrix, a: CMatrix | null, mode: BeamNormalization, noise: CMatrix | null): CMatrix {
  for (let j = 0; j < w.cols; j++) normalizeColumn(w, j, mode, a, noise);
  return w;
}

/**
 * Conjugate-field (phase-steering) match: w ∝ a, the beam that adds the
 * element signals of a plane wave (or of any signal response a) in phase.
 *
 * @remarks
 * It maximises the SNR in spatially white, uncorrelated noise (Cauchy–Schwarz).
 * Pointing at r̂₀ with the steering vector a(r̂₀)ₙ = exp(+j k r̂₀·rₙ) gives AF = wᴴa = 1
 * with the default normalisation.
 * @param a - Look-direction steering or signal-response vector, N×1 [dimensionless or V].
 * @param options - `normalization` (default `'distortionless'`); `noise` (N×N) is needed only for `'unitNoise'`.
 * @returns Weights, N×1.
 * @throws {@link DimensionError} if `a` is not a column or is zero; {@link DomainError} on non-finite entries or an unknown normalisation.
 * @category Beamforming
 */
export function conjugateFieldWeights(a: CMatrix, options: { normalization?: BeamNormalization; noise?: CMatrix } = {}): CMatrix {
  const n = lookVector(a);
  const mode = options.normalization ?? 'distortionless';
  assertNormalization(mode);
  if (options.noise) {
    assertFiniteCMatrix('noise', options.noise);
    assertShape('noise', options.noise, n, n, 'one row and column per element');
  }
  return finish({ rows: n, cols: 1, data: a.data.slice() }, a, mode, options.noise ?? null);
}

/**
 * Maximum-SNR weights w ∝ R_n⁻¹a for a rank-one signal with response a in
 * noise of correlation R_n.
 *
 * @remarks
 * Maximises |wᴴa|² / wᴴR_n w (a generalised Rayleigh quotient; the maximum is
 * aᴴR_n⁻¹a). H. L. Van Trees, *Optimum Array Processing*, Wiley, 2002
 * (from memory). Computed with one Cholesky factorisation R_n = L Lᴴ and two
 * triangular solves; see the module's conditioning policy ({@link diagonalLoading}).
 * @param a - Signal response (steering) vector, N×1.
 * @param noise - Noise correlation matrix R_n, N×N Hermitian positive definite [any power unit].
 * @param options - See {@link BeamWeightOptions}; `'unitNoise'` gives wᴴR_n w = 1.
 * @returns Weights, N×1.
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite or non-Hermitian input;
 *   {@link NotPositiveDefiniteError} / {@link SingularMatrixError} for a singular R_n without loading.
 * @category Beamforming
 */
export function maxSnrWeights(a: CMatrix, noise: CMatrix, options: BeamWeightOptions = {}): CMatrix {
  lookVector(a);
  return solveBeams('a', a, 'noise', noise, options);
}

/**
 * Maximum-SNR weights R_n⁻¹aₖ for many look directions at once (one
 * factorisation, one solve with K right-hand sides).
 *
 * @remarks
 * Column k of the result is the maximum-SNR beam for column k of `steering`,
 * normalised per column. This is the fast path for beam tables and scans.
 * Method as {@link maxSnrWeights}.
 * @param steering - Steering or response vectors as columns, N×K.
 * @param noise - Noise correlation matrix R_n, N×N Hermitian positive definite.
 * @param options - See {@link BeamWeightOptions}.
 * @returns Weights, N×K (one beam per column).
 * @throws As {@link maxSnrWeights}.
 * @category Beamforming
 */
export function maxSnrWeightsForDirections(steering: CMatrix, noise: CMatrix, options: BeamWeightOptions = {}): CMatrix {
  return solveBeams('steering', steering, 'noise', noise, options);
}

/** R⁻¹aₖ for every column under the conditioning policy; argument names for messages. */
function solveBeams(steeringName: string, steering: CMatrix, matrixName: string, matrix: CMatrix, options: BeamWeightOptions): CMatrix {
  assertFiniteCMatrix(steeringName, steering);
  if (steering.rows < 1 || steering.cols < 1) {
    throw new DimensionError(`invalid argument "${steeringName}": expected N×K with N, K ≥ 1, received ${steering.rows}×${steering.cols}.`);
  }
  const mode = options.normalization ?? 'distortionless';
  assertNormalization(mode);
  const f = factorCorrelation(matrixName, matrix, steering.rows, options.diagonalLoading ?? 0);
  const w = choleskySolve(f, steering);
  return finish(w, steering, mode, matrix);
}

/**
 * Minimum-variance distortionless-response (MVDR) weights
 * w = R⁻¹a / (aᴴR⁻¹a) on a total (signal + interference + noise) correlation R.
 *
 * @remarks
 * Minimises the output power wᴴRw subject to wᴴa = 1 (J. Capon,
 * "High-resolution frequency-wavenumber spectrum analysis", Proc. IEEE 57(8),
 * 1969). When R = σ_s² a aᴴ + R_n the result equals the maximum-SNR beam up to
 * scale (matrix inversion lemma). Diagonal loading is the usual remedy for
 * sample correlation matrices and steering errors.
 * @param a - Look-direction steering vector, N×1.
 * @param correlation - Total correlation matrix R, N×N Hermitian positive definite.
 * @param options - See {@link BeamWeightOptions}; default and natural normalisation `'distortionless'`; `'unitNoise'` gives wᴴRw = 1.
 * @returns Weights, N×1.
 * @throws As {@link maxSnrWeights}.
 * @category Beamforming
 */
export function minimumVarianceWeights(a: CMatrix, correlation: CMatrix, options: BeamWeightOptions = {}): CMatrix {
  const n = lookVector(a);
  const mode = options.normalization ?? 'distortionless';
  assertNormalization(mode);
  const f = factorCorrelation('correlation', correlation, n, options.diagonalLoading ?? 0);
  return finish(choleskySolve(f, a), a, mode, correlation);
}

/**
 * Linearly constrained minimum-variance (LCMV) weights: minimise wᴴRw subject to
 * wᴴcₘ = gₘ for every constraint column cₘ.
 *
 * @remarks
 * w = R⁻¹C (CᴴR⁻¹C)⁻¹ g* (O. L. Frost III, "An algorithm for linearly
 * constrained adaptive array processing", Proc. IEEE 60(8), 1972; Van Trees
 * 2002, from memory). Constraints may be look directions (g = 1), nulls
 * (g = 0), derivative constraints (columns ∂a/∂θ with g = 0 flatten the
 * response), or any mix. With y = wᴴx, gₘ is the beam's complex response to cₘ.
 * The weights are not rescaled: the constraints fix them.
 * Argument order (constraints, correlation, responses): the constraint or steering matrix
 * first and the correlation second, as in every weight function of this module (changed in
 * the Unreleased version; it was (correlation, constraints, responses)).
 * @param constraints - Constraint vectors C as columns, N×M, M ≤ N, linearly independent.
 * @param correlation - Correlation matrix R, N×N Hermitian positive definite.
 * @param responses - Required responses g, M×1 (wᴴcₘ = gₘ).
 * @param options - `diagonalLoading` (see {@link BeamWeightOptions}).
 * @returns Weights, N×1.
 * @throws {@link DimensionError} if M > N or shapes disagree; {@link SingularMatrixError} if the constraints are linearly dependent;
 *   errors of the conditioning policy for R.
 * @category Beamforming
 */
export function constrainedMinimumVarianceWeights(
  constraints: CMatrix, correlation: CMatrix, responses: CMatrix, options: { diagonalLoading?: number } = {},
): CMatrix {
  assertFiniteCMatrix('constraints', constraints);
  const n = constraints.rows, m = constraints.cols;
  if (n < 1 || m < 1) throw new DimensionError(`invalid argument "constraints": expected N×M with N, M ≥ 1, received ${n}×${m}.`);
  if (m > n) {
    throw new DimensionError(`invalid argument "constraints": ${m} constraints cannot all be met by ${n} weights; use at most ${n} constraint columns (one per degree of freedom).`);
  }
  assertFiniteCMatrix('responses', responses);
  assertColumn('responses', responses, m, 'one required response per constraint column');
  const f = factorCorrelation('correlation', correlation, n, options.diagonalLoading ?? 0);
  // G = CᴴR⁻¹C = (L⁻¹C)ᴴ(L⁻¹C), Hermitian positive definite iff C has full column rank.
  const y = solveLowerTriangular(f.l, constraints);
  const g = gramian(y);
  const fg = factorGram(g, `invalid argument "constraints": the ${m} constraint columns are linearly dependent (or nearly so); remove redundant constraints.`);
  const gConj = { rows: m, cols: 1, data: responses.data.slice() };
  for (let k = 1; k < gConj.data.length; k += 2) gConj.data[k] = -gConj.data[k];
  const h = choleskySolve(fg, gConj);
  // w = R⁻¹ C h
  const ch = { rows: n, cols: 1, data: new Float64Array(2 * n) };
  const c = constraints.data;
  for (let i = 0; i < n; i++) {
    let re = 0, im = 0;
    for (let j = 0; j < m; j++) {
      const p = 2 * (i * m + j);
      re += c[p] * h.data[2 * j] - c[p + 1] * h.data[2 * j + 1];
      im += c[p] * h.data[2 * j + 1] + c[p + 1] * h.data[2 * j];
    }
    ch.data[2 * i] = re;
    ch.data[2 * i + 1] = im;
  }
  return choleskySolve(f, ch);
}

/** YᴴY for an n×m matrix Y, exactly Hermitian. */
function gramian(y: CMatrix): CMatrix {
  const n = y.rows, m = y.cols, d = y.data;
  const out = new Float64Array(2 * m * m);
  for (let a = 0; a < m; a++) {
    for (let b = a; b < m; b++) {
      let re = 0, im = 0;
      for (let i = 0; i < n; i++) {
        const p = 2 * (i * m + a), q = 2 * (i * m + b);
        re += d[p] * d[q] + d[p + 1] * d[q + 1];
        im += d[p] * d[q + 1] - d[p + 1] * d[q];
      }
      out[2 * (a * m + b)] = re;
      out[2 * (a * m + b) + 1] = im;
      out[2 * (b * m + a)] = re;
      out[2 * (b * m + a) + 1] = -im;
    }
  }
  return matrixView(m, m, out);
}

/**
 * Maximum-directivity weights w ∝ R_iso⁻¹a.
 *
 * @remarks
 * Directivity of a beam is D(w) = |wᴴa|² / (wᴴR_iso w) with
 * R_iso = (1/4π)∮ f(r̂) f(r̂)ᴴ dΩ the correlation of the element responses in an
 * isotropic field (for isotropic point elements R_iso,mn = sin(k dₘₙ)/(k dₘₙ)),
 * so the maximiser is the maximum-SNR beam with R_n = R_iso (C. T. Tai,
 * "The optimum directivity of uniform arrays of dipoles", IEEE Trans. AP
 * 12(4), 1964; Van Trees 2002, from memory). Very close spacing makes
 * R_iso ill conditioned (superdirectivity): load it if needed.
 * @param a - Look-direction response, N×1.
 * @param isotropicCorrelation - R_iso, N×N Hermitian positive definite [units of |a|²].
 * @param options - See {@link BeamWeightOptions}; the maximum directivity is then aᴴR_iso⁻¹a.
 * @returns Weights, N×1.
 * @throws As {@link maxSnrWeights}.
 * @category Beamforming
 */
export function maxDirectivityWeights(a: CMatrix, isotropicCorrelation: CMatrix, options: BeamWeightOptions = {}): CMatrix {
  lookVector(a);
  return solveBeams('a', a, 'isotropicCorrelation', isotropicCorrelation, options);
}

/**
 * Maximum-gain weights w ∝ (R_iso + R_loss)⁻¹a for an array with ohmic losses.
 *
 * @remarks
 * Gain counts the power lost in the array as well as the power radiated: with
 * R_iso the isotropic radiation correlation (see {@link maxDirectivityWeights})
 * and R_loss the loss correlation in the same units (for the port-current
 * picture, R_loss ∝ Re Z_loss), G(w) = |wᴴa|² / wᴴ(R_iso + R_loss)w, maximised
 * by the maximum-SNR beam with R_n = R_iso + R_loss (R. F. Harrington, "Antenna
 * excitation for maximum gain", IEEE Trans. AP 13(6), 1965, from memory).
 * Losses regularise superdirective solutions.
 * @param a - Look-direction response, N×1.
 * @param isotropicCorrelation - R_iso, N×N Hermitian positive semidefinite.
 * @param lossCorrelation - R_loss, N×N Hermitian positive semidefinite, same units.
 * @param options - See {@link BeamWeightOptions}.
 * @returns Weights, N×1.
 * @throws As {@link maxSnrWeights} (the sum must be positive definite).
 * @category Beamforming
 */
export function maxGainWeights(a: CMatrix, isotropicCorrelation: CMatrix, lossCorrelation: CMatrix, options: BeamWeightOptions = {}): CMatrix {
  const n = lookVector(a);
  assertFiniteCMatrix('isotropicCorrelation', isotropicCorrelation);
  assertShape('isotropicCorrelation', isotropicCorrelation, n, n, 'one row and column per element');
  assertFiniteCMatrix('lossCorrelation', lossCorrelation);
  assertShape('lossCorrelation', lossCorrelation, n, n, 'one row and column per element');
  return solveBeams('a', a, 'isotropicCorrelation + lossCorrelation', add(isotropicCorrelation, lossCorrelation), options);
}
