/**
 * The deterministic Cramér–Rao bound on direction estimates.
 * @module
 */
import { DimensionError, SingularMatrixError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { choleskySolve } from '../linalg/cholesky.js';
import { factorGram } from './conditioning.js';
import { adjoint, multiply } from '../linalg/ops.js';
import { assertFiniteArray, assertFiniteCMatrix, assertInteger, assertPositive, assertShape } from '../internal/validate.js';

/**
 * Result of {@link deterministicCramerRaoBound}.
 * @category Beamforming
 */
export interface CramerRaoBoundResult {
  /** The bound on the covariance of the K direction parameters, K×K real, row-major [parameter unit²]. */
  readonly covariance: Float64Array;
  /** Square roots of its diagonal: the bound on each parameter's standard deviation [parameter unit]. */
  readonly standardDeviation: Float64Array;
}

/**
 * Deterministic (conditional) Cramér–Rao bound for the directions of K
 * uncorrelated narrowband sources in white noise.
 *
 * @remarks
 * CRB = (σ²/2T) {Re[(Dᴴ P_A⊥ D) ⊙ Pᵀ]}⁻¹ with P_A⊥ = I − A(AᴴA)⁻¹Aᴴ, D the
 * derivatives of the steering vectors with respect to each source's direction
 * parameter, P the source correlation (here diagonal: the source powers) and T
 * the number of snapshots (P. Stoica and A. Nehorai, "MUSIC, maximum
 * likelihood, and Cramér–Rao bound", IEEE Trans. ASSP 37(5), 1989,
 * from memory; P stands in for the sample source covariance, which it equals
 * for large T). With P diagonal, Re[H ⊙ Pᵀ] is diagonal, so the bound is diagonal:
 * σ²/(2T pᵢ Hᵢᵢ) for source i. The parameter is whatever D differentiates by: θ [rad] with
 * ∂aₙ/∂θ, or a direction cosine u with ∂aₙ/∂u = j k xₙ aₙ for a line array
 * along x.
 * @param steering - Steering vectors A of the sources, N×K, linearly independent.
 * @param derivatives - ∂aₖ/∂parameterₖ as columns, N×K [1/parameter unit].
 * @param sourcePowers - Source powers, length K, > 0 [unit of noisePower].
 * @param noisePower - White-noise power per element σ², > 0.
 * @param snapshotCount - Number of snapshots T, integer ≥ 1.
 * @returns Covariance bound and per-source standard deviations.
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-positive powers or counts;
 *   {@link SingularMatrixError} if the steering vectors are dependent or a direction is unidentifiable.
 * @category Beamforming
 */
export function deterministicCramerRaoBound(
  steering: CMatrix, derivatives: CMatrix, sourcePowers: ArrayLike<number>, noisePower: number, snapshotCount: number,
): CramerRaoBoundResult {
  assertFiniteCMatrix('steering', steering);
  const n = steering.rows, k = steering.cols;
  if (n < 1 || k < 1 || k >= n) throw new DimensionError(`invalid argument "steering": expected N×K with 1 ≤ K < N, received ${n}×${k}.`);
  assertFiniteCMatrix('derivatives', derivatives);
  assertShape('derivatives', derivatives, n, k, 'one derivative column per steering column');
  if (sourcePowers.length !== k) throw new DimensionError(`invalid argument "sourcePowers": expected ${k} powers, received ${sourcePowers.length}.`);
  assertFiniteArray('sourcePowers', sourcePowers);
  for (let i = 0; i < k; i++) assertPositive(`sourcePowers[${i}]`, sourcePowers[i]);
  assertPositive('noisePower', noisePower);
  assertInteger('snapshotCount', snapshotCount, 1);
  const ah = adjoint(steering);
  const gram = multiply(ah, steering);
  const fg = factorGram(gram, 'invalid argument "steering": the source steering vectors are linearly dependent (sources at the same direction); the bound does not exist.');
  // H = DᴴD − DᴴA (AᴴA)⁻¹ AᴴD
  const dh = adjoint(derivatives);
  const dd = multiply(dh, derivatives);
  const ad = multiply(ah, derivatives);
  const corr = multiply(adjoint(ad), choleskySolve(fg, ad));
  // Re[H ⊙ Pᵀ] with P diagonal keeps only the diagonal, H_ii·p_i, so the bound is diagonal.
  const c = noisePower / (2 * snapshotCount);
  const cov = new Float64Array(k * k);
  const sd = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    const p = 2 * (i * k + i);
    const h = dd.data[p] - corr.data[p];
    if (!(h > 1e-14 * dd.data[p])) {
      throw new SingularMatrixError(`the Fisher information of source ${i} vanishes: its direction is unidentifiable (zero derivative, or its derivative lies in the span of the steering vectors).`, i);
    }
    cov[i * k + i] = c / (h * sourcePowers[i]);
    sd[i] = Math.sqrt(cov[i * k + i]);
  }
  return { covariance: cov, standardDeviation: sd };
}
