/**
 * Interference suppression by orthogonal projection, and the maximum-SNR beam
 * for a signal of any rank.
 * @module
 */
import { DimensionError, SingularMatrixError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { type CholeskyResult, choleskySolve, solveLowerAdjoint, solveLowerTriangular } from '../linalg/cholesky.js';
import { assertHermitian, hermitianEigen } from '../linalg/eigen.js';
import { adjoint, multiply } from '../linalg/ops.js';
import { assertColumn, assertFiniteCMatrix, assertInteger, assertShape } from '../internal/validate.js';
import { HERMITIAN_TOLERANCE, factorCorrelation, factorGram } from './conditioning.js';
import { type BeamNormalization, assertNormalization, normalizeColumn } from './normalize.js';
import { responsePowersInto } from './evaluate.js';
import { splitSubspaces } from './spectra.js';

/**
 * Result of {@link projectionWeights}.
 * @category Beamforming
 */
export interface ProjectionBeamResult {
  /** Projected weights P⊥w₀, normalised as requested, N×1. */
  readonly weights: CMatrix;
  /**
   * Loss of look-direction response power caused by the projection,
   * −10·log₁₀(|(P⊥w₀)ᴴa|² / |w₀ᴴa|²), power ratio [dB], ≥ 0 for w₀ = a.
   */
  readonly signalLossDb: number;
  /**
   * Loss of SNR in spatially white noise (white-noise gain of P⊥w₀ relative to w₀), power ratio [dB];
   * for w₀ = a it equals −10·log₁₀(‖P⊥a‖²/‖a‖²).
   */
  readonly whiteNoiseSnrLossDb: number;
  /** Largest residual response to the interference subspace, max‖Bᴴw‖/(‖B‖·‖w‖) over columns (≈ 0) [dimensionless]. */
  readonly residual: number;
}

/**
 * Interference suppression by orthogonal projection: w = P⊥w₀ with
 * P⊥ = I − B(BᴴB)⁻¹Bᴴ, which nulls every vector in the span of the interference
 * columns B.
 *
 * @remarks
 * The beam response to any b in span(B) is wᴴb = w₀ᴴP⊥b = 0. The price is the
 * part of the look direction that lies in that span: the signal loss is
 * reported (large when an interferer is close to the look direction). Use the
 * steering vectors of known interferers, or an estimated subspace from
 * {@link estimateInterferenceSubspace} (A. M. Haimovich and Y. Bar-Ness, "An
 * eigenanalysis interference canceler", IEEE Trans. SP 39(1), 1991, from memory).
 * @param a - Look-direction steering vector, N×1.
 * @param interference - Interference steering vectors or subspace basis as columns, N×J, J < N, independent.
 * @param options - `baseWeights` w₀ (default: conjugate match w₀ = a); `normalization` of the result (default `'distortionless'`).
 * @returns Weights, losses and the residual.
 * @throws {@link DimensionError} on shape mismatch or J ≥ N; {@link SingularMatrixError} if the interference columns are dependent
 *   or the projected beam has no look-direction response.
 * @category Beamforming
 */
export function projectionWeights(
  a: CMatrix, interference: CMatrix, options: { baseWeights?: CMatrix; normalization?: BeamNormalization } = {},
): ProjectionBeamResult {
  assertFiniteCMatrix('a', a);
  assertColumn('a', a);
  const n = a.rows;
  assertFiniteCMatrix('interference', interference);
  if (interference.rows !== n || interference.cols < 1 || interference.cols >= n) {
    throw new DimensionError(`invalid argument "interference": expected ${n}×J with 1 ≤ J < ${n} (one column per interferer), received ${interference.rows}×${interference.cols}.`);
  }
  const w0 = options.baseWeights ?? a;
  assertFiniteCMatrix('baseWeights', w0);
  assertShape('baseWeights', w0, n, 1, 'one weight per element');
  const mode = options.normalization ?? 'distortionless';
  assertNormalization(mode, ['distortionless', 'unitNorm', 'none']);
  const bh = adjoint(interference);
  const gram = multiply(bh, interference);
  const f = factorGram(gram, 'invalid argument "interference": the interference columns are linearly dependent; pass an independent set (or an orthonormal basis).');
  // w = w0 − B (BᴴB)⁻¹ Bᴴ w0, then one refinement sweep to reach the 1e-12 null depth in rounding.
  let w = subtractProjection(w0, interference, bh, f);
  w = subtractProjection(w, interference, bh, f);
  const before = responsePowersInto(new Float64Array(1), w0, a)[0];
  const after = responsePowersInto(new Float64Array(1), w, a)[0];
  if (!(after > 0)) throw new SingularMatrixError('the projected beam has no response in the look direction: "a" lies in the interference subspace.');
  const norm2 = (v: CMatrix) => v.data.reduce((s, x) => s + x * x, 0);
  const signalLossDb = -10 * Math.log10(after / before);
  const whiteNoiseSnrLossDb = -10 * Math.log10((after / norm2(w)) / (before / norm2(w0)));
  const residualRaw = multiply(bh, w);
  let residual = 0;
  const bNorm = Math.sqrt(norm2(interference)), wNorm = Math.sqrt(norm2(w));
  for (let j = 0; j < residualRaw.rows; j++) residual = Math.max(residual, Math.hypot(residualRaw.data[2 * j], residualRaw.data[2 * j + 1]) / (bNorm * wNorm));
  normalizeColumn(w, 0, mode, a, null);
  return { weights: w, signalLossDb, whiteNoiseSnrLossDb, residual };
}

function subtractProjection(w: CMatrix, b: CMatrix, bh: CMatrix, f: CholeskyResult): CMatrix {
  const c = choleskySolve(f, multiply(bh, w));
  const bc = multiply(b, c);
  const out = { rows: w.rows, cols: 1, data: w.data.slice() };
  for (let q = 0; q < out.data.length; q++) out.data[q] -= bc.data[q];
  return out;
}

/**
 * Orthonormal basis of an estimated interference subspace: the eigenvectors of
 * the `count` largest eigenvalues of an interference-plus-noise correlation
 * matrix (eigenvalue order, largest first).
 *
 * @remarks
 * Estimate it from data that holds no desired signal (signal-free snapshots or
 * a model); otherwise the projection also removes the signal. Pair with
 * {@link projectionWeights}; choose `count` with {@link estimateSourceCount}.
 * @param correlation - Interference-plus-noise correlation, N×N Hermitian.
 * @param count - Dimension of the subspace J, integer in [1, N−1].
 * @returns N×J matrix with orthonormal columns.
 * @throws {@link DimensionError} if not square; {@link DomainError} if not Hermitian or on a bad count.
 * @category Beamforming
 */
export function estimateInterferenceSubspace(correlation: CMatrix, count: number): CMatrix {
  assertFiniteCMatrix('correlation', correlation);
  assertShape('correlation', correlation, correlation.rows, correlation.rows, 'a square matrix');
  assertInteger('count', count, 1, correlation.rows - 1);
  return splitSubspaces('correlation', correlation, count).signal;
}

/**
 * Result of {@link maxSnrWeightsForCorrelation}.
 * @category Beamforming
 */
export interface CorrelationBeamResult {
  /** Weights w, N×1, normalised as requested. */
  readonly weights: CMatrix;
  /** The maximum SNR λ_max = wᴴR_s w / wᴴR_n w, linear [dimensionless]. */
  readonly snr: number;
}

/**
 * Maximum-SNR weights for a signal of any rank: the principal generalised
 * eigenvector of the pencil (R_s, R_n), R_s w = λ_max R_n w.
 *
 * @remarks
 * Maximises wᴴR_s w / wᴴR_n w (generalised Rayleigh quotient; the maximum SNR
 * is λ_max). Used for partially coherent or extended sources and for a
 * polarised/unpolarised source received by dual-polarised elements (Van Trees
 * 2002, from memory). Computed by whitening with R_n = L Lᴴ (under the
 * module's conditioning policy, see {@link diagonalLoading}): the principal
 * eigenvector v of L⁻¹R_s L⁻ᴴ gives w = L⁻ᴴv. For rank-one R_s = a aᴴ it
 * reduces to {@link maxSnrWeights}.
 * @param signal - Signal correlation R_s, N×N Hermitian positive semidefinite.
 * @param noise - Noise correlation R_n, N×N Hermitian positive definite.
 * @param options - `normalization`: `'unitNoise'` (default, wᴴR_n w = 1), or `'unitNorm'` (either with the phase making the largest-modulus weight real positive);
 *   `diagonalLoading` for R_n.
 * @returns Weights w (N×1) and the maximum SNR (λ_max) [dimensionless].
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-Hermitian input;
 *   {@link NotPositiveDefiniteError} / {@link SingularMatrixError} for a singular R_n without loading.
 * @category Beamforming
 */
export function maxSnrWeightsForCorrelation(
  signal: CMatrix, noise: CMatrix, options: { normalization?: 'unitNoise' | 'unitNorm'; diagonalLoading?: number } = {},
): CorrelationBeamResult {
  assertFiniteCMatrix('signal', signal);
  const n = signal.rows;
  assertShape('signal', signal, n, n, 'a square matrix');
  assertHermitian('signal', signal, HERMITIAN_TOLERANCE);
  const mode = options.normalization ?? 'unitNoise';
  assertNormalization(mode, ['unitNoise', 'unitNorm']);
  const f = factorCorrelation('noise', noise, n, options.diagonalLoading ?? 0);
  // C = L⁻¹ R_s L⁻ᴴ = L⁻¹ (L⁻¹ R_s)ᴴ, R_s Hermitian.
  const y = solveLowerTriangular(f.l, signal);
  const c = solveLowerTriangular(f.l, adjoint(y));
  const sym = adjoint(c);
  for (let q = 0; q < c.data.length; q++) c.data[q] = 0.5 * (c.data[q] + sym.data[q]);
  const { values, vectors } = hermitianEigen(c);
  const v = { rows: n, cols: 1, data: new Float64Array(2 * n) };
  for (let i = 0; i < n; i++) {
    v.data[2 * i] = vectors!.data[2 * (i * n + n - 1)];
    v.data[2 * i + 1] = vectors!.data[2 * (i * n + n - 1) + 1];
  }
  const w = solveLowerAdjoint(f.l, v); // wᴴR_n w = vᴴv = 1
  // Phase: largest-modulus weight real and positive (deterministic output).
  let big = 0, br = 1, bi = 0;
  for (let i = 0; i < n; i++) {
    const m = Math.hypot(w.data[2 * i], w.data[2 * i + 1]);
    if (m > big) { big = m; br = w.data[2 * i] / m; bi = w.data[2 * i + 1] / m; }
  }
  for (let i = 0; i < n; i++) {
    const xr = w.data[2 * i], xi = w.data[2 * i + 1];
    w.data[2 * i] = xr * br + xi * bi;
    w.data[2 * i + 1] = xi * br - xr * bi;
  }
  if (mode === 'unitNorm') normalizeColumn(w, 0, 'unitNorm', null, null);
  return { weights: w, snr: values[n - 1] };
}
