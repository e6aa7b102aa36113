/**
 * Null synthesis on top of a taper: Schelkunoff zero placement (uniform lines) and
 * least-squares projection (any layout).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertColumn, assertFiniteArray, assertFiniteCMatrix, assertPositive, describeValue } from '../internal/validate.js';
import { fromParts, type CMatrix } from '../linalg/cmatrix.js';
import { solve } from '../linalg/lu.js';
import { adjoint, innerProduct, multiply, subtract, vectorNorm } from '../linalg/ops.js';
import { wavenumberRadPerM } from '../units/convert.js';
import type { TaperWeights } from './efficiency.js';
import type { ArrayLayout, Vector3 } from '../geometry/layout.js';
import { linearArrayField } from '../pattern/linearArray.js';
import { schelkunoffZeros, weightsFromSchelkunoffZeros } from '../pattern/schelkunoff.js';
import { steeringMatrix, steeringVector } from '../pattern/steering.js';
import { displayable } from '../display/attach.js';

/**
 * Result of a null synthesis.
 * @category Tapers
 */
export interface NullSynthesisResult {
  /** New complex weights, N×1 [dimensionless]. */
  readonly weights: CMatrix;
  /**
   * 20·log₁₀(|AF_new(r̂₀)| / |AF_old(r̂₀)|) at the main-beam direction r̂₀, with the weights as
   * returned; negative when the beam drops [dB, power ratio].
   */
  readonly mainBeamChangeDb: number;
  /**
   * Change of the main-beam array gain |wᴴa₀|²/‖w‖², new over old: independent of the
   * weights' scale [dB, power ratio].
   */
  readonly mainBeamGainChangeDb: number;
}

/** Real or complex weights as an N×1 CMatrix (copied). */
function asColumn(name: string, w: TaperWeights): CMatrix {
  if (w instanceof Float64Array) {
    assertFiniteArray(name, w);
    if (w.length < 1) throw new DimensionError(`invalid argument "${name}": expected at least one weight, received none.`);
    return fromParts(w, null, w.length);
  }
  assertFiniteCMatrix(name, w);
  assertColumn(name, w);
  return fromParts(Array.from({ length: w.rows }, (_, i) => w.data[2 * i]), Array.from({ length: w.rows }, (_, i) => w.data[2 * i + 1]), w.rows);
}

function assertDirectionCosines(name: string, u: ArrayLike<number>): void {
  assertFiniteArray(name, u);
  for (let i = 0; i < u.length; i++) {
    if (Math.abs(u[i]) > 1) throw new DomainError(`invalid argument "${name}": entry ${i} is ${u[i]}; a direction cosine along the array axis lies in [−1, 1].`);
  }
}

/**
 * Places pattern nulls on a uniform line array by moving zeros of its Schelkunoff polynomial.
 *
 * @remarks
 * For elements at xₙ = x₀ + n·d along the array axis and AF = wᴴa with aₙ = exp(+j k xₙ u)
 * (docs/conventions.md; u = r̂·â = cos γ the direction cosine along the axis â, γ the angle
 * from it), the array factor is, up to the phase of x₀, the polynomial P(ζ) = Σ conj(wₙ) ζⁿ on
 * the unit circle ζ = exp(j k d u). Its N−1 zeros come from the pattern module's
 * {@link schelkunoffZeros}; for each requested null uₖ the nearest zero not yet moved is
 * replaced by exp(j k d uₖ), and the weights are rebuilt by {@link weightsFromSchelkunoffZeros}
 * and rescaled to the original ‖w‖₂ (so `mainBeamChangeDb` equals `mainBeamGainChangeDb`;
 * the rebuilt weights carry the monic polynomial's global phase). The main-beam change is
 * evaluated with the pattern module's line-array field at sinθ₀ = u₀.
 * The number of elements is unchanged, so at most N−1 nulls can be placed; the other
 * zeros, and hence the rest of the pattern, are kept as far as the moves allow.
 *
 * References:
 * - S. A. Schelkunoff, "A mathematical theory of linear arrays", Bell Syst. Tech. J. 22(1),
 *   1943, pp. 80–107.
 *
 * @param weights - Taper or weights of the N-element line, N ≥ 2, with w_{N−1} ≠ 0 [dimensionless].
 * @param spacingM - Element spacing d [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param nullDirectionCosines - Null directions as u = r̂·(array axis) ∈ [−1, 1], at most N−1 of them.
 * @param mainBeamDirectionCosine - Main-beam direction u₀ ∈ [−1, 1] for the report (default 0, broadside).
 * @returns New weights and the main-beam change.
 * @throws {@link DomainError} on non-finite or out-of-range arguments, a zero last weight, or
 *   zero response at the main-beam direction.
 * @throws {@link DimensionError} if there are more than N−1 nulls or the weights are not a column.
 * @throws {@link ConvergenceError} if the polynomial roots do not converge.
 * @example
 * ```ts
 * // 16-element half-wave line at 1 GHz, Taylor taper, null at u = 0.3:
 * const r = schelkunoffNulls(taylorTaper(16, 30, 5).weights, 0.15, 1e9, [0.3]);
 * ```
 * @category Tapers
 */
export function schelkunoffNulls(
  weights: TaperWeights,
  spacingM: number,
  frequencyHz: number,
  nullDirectionCosines: ArrayLike<number>,
  mainBeamDirectionCosine = 0,
): NullSynthesisResult {
  const w = asColumn('weights', weights);
  const n = w.rows;
  assertPositive('spacingM', spacingM, 'm');
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  assertDirectionCosines('nullDirectionCosines', nullDirectionCosines);
  assertDirectionCosines('mainBeamDirectionCosine', [mainBeamDirectionCosine]);
  if (n < 2) throw new DimensionError(`invalid argument "weights": a line needs N ≥ 2 elements to have a pattern zero, received N = ${n}.`);
  if (nullDirectionCosines.length > n - 1) {
    throw new DimensionError(`invalid argument "nullDirectionCosines": an N = ${n} line has ${n - 1} pattern zeros, so at most ${n - 1} nulls can be placed; received ${nullDirectionCosines.length}.`);
  }
  const zeros = schelkunoffZeros(w);
  const r = zeros.data;
  const kd = wavenumberRadPerM(frequencyHz) * spacingM;
  const moved = new Uint8Array(n - 1);
  for (let k = 0; k < nullDirectionCosines.length; k++) {
    const zr = Math.cos(kd * nullDirectionCosines[k]), zi = Math.sin(kd * nullDirectionCosines[k]);
    let best = -1, bestDist = Infinity;
    for (let i = 0; i < n - 1; i++) {
      if (moved[i]) continue;
      const dist = Math.hypot(r[2 * i] - zr, r[2 * i + 1] - zi);
      if (dist < bestDist) { bestDist = dist; best = i; }
    }
    r[2 * best] = zr;
    r[2 * best + 1] = zi;
    moved[best] = 1;
  }
  const result = weightsFromSchelkunoffZeros(zeros);
  const scale = vectorNorm(w) / vectorNorm(result);
  for (let k = 0; k < result.data.length; k++) result.data[k] *= scale;
  // Main-beam change from the pattern module's line-array field (θ from broadside, sinθ₀ = u₀).
  const theta0 = Math.asin(mainBeamDirectionCosine);
  const before = linearArrayField(w, spacingM, frequencyHz)(theta0);
  const after = linearArrayField(result, spacingM, frequencyHz)(theta0);
  if (!(before > 0)) {
    throw new DomainError(`invalid argument "mainBeamDirectionCosine": the weights have zero response at u₀ = ${mainBeamDirectionCosine}; pass the direction of the main beam.`);
  }
  const changeDb = 20 * Math.log10(after / before);
  return displayable<NullSynthesisResult>({ weights: result, mainBeamChangeDb: changeDb, mainBeamGainChangeDb: changeDb }, 'NullSynthesisResult');
}

/**
 * Places nulls on any layout by least-squares projection of the weights off the null
 * steering vectors.
 *
 * @remarks
 * w_new = w − A(AᴴA)⁻¹Aᴴw, A = [a(r̂₁) … a(r̂_K)] the steering vectors of the null directions
 * (aₙ = exp(+j k r̂·rₙ), docs/conventions.md). Then AF_new(r̂ₖ) = w_newᴴ a(r̂ₖ) = 0 exactly, and
 * w_new is the closest weight vector to w (in ‖·‖₂) with those nulls. The pattern change at
 * the main beam is reported both as returned (|w_newᴴa₀|/|wᴴa₀|) and as an array-gain change.
 *
 * References:
 * - H. Steyskal, "Synthesis of antenna patterns with prescribed nulls", IEEE Trans. Antennas
 *   Propag. AP-30(2), 1982, pp. 273–279 (from memory).
 *
 * @param weights - Weights w, N real or N×1 complex [dimensionless].
 * @param nullSteering - Steering vectors of the null directions, N×K, K ≥ 1, linearly independent.
 * @param mainBeamSteering - Steering vector of the main-beam direction, N×1.
 * @returns New weights and the main-beam change.
 * @throws {@link DimensionError} on inconsistent shapes.
 * @throws {@link DomainError} on non-finite entries, or if the main beam has zero response (wᴴa₀ = 0).
 * @throws {@link SingularMatrixError} if the null steering vectors are linearly dependent (e.g. a repeated null).
 * @category Tapers
 */
export function projectNulls(weights: TaperWeights, nullSteering: CMatrix, mainBeamSteering: CMatrix): NullSynthesisResult {
  const w = asColumn('weights', weights);
  assertFiniteCMatrix('nullSteering', nullSteering);
  if (nullSteering.rows !== w.rows || nullSteering.cols < 1) {
    throw new DimensionError(`invalid argument "nullSteering": expected ${w.rows}×K with K ≥ 1 (one column per null, one row per weight), received ${nullSteering.rows}×${nullSteering.cols}.`);
  }
  assertFiniteCMatrix('mainBeamSteering', mainBeamSteering);
  assertColumn('mainBeamSteering', mainBeamSteering, w.rows, 'one entry per weight');
  const ah = adjoint(nullSteering);
  const coeff = solve(multiply(ah, nullSteering), multiply(ah, w));
  const wNew = subtract(w, multiply(nullSteering, coeff));
  const before = innerProduct(w, mainBeamSteering).abs();
  if (!(before > 0)) {
    throw new DomainError(`invalid argument "mainBeamSteering": the weights have zero response there (|wᴴa₀| = ${describeValue(before)}); pass the direction of the main beam.`);
  }
  const after = innerProduct(wNew, mainBeamSteering).abs();
  const mainBeamChangeDb = 20 * Math.log10(after / before);
  const mainBeamGainChangeDb = mainBeamChangeDb - 20 * Math.log10(vectorNorm(wNew) / vectorNorm(w));
  return displayable<NullSynthesisResult>({ weights: wNew, mainBeamChangeDb, mainBeamGainChangeDb }, 'NullSynthesisResult');
}

/**
 * Places nulls at given directions on any layout by least-squares projection
 * (see {@link projectNulls}), building the steering vectors with the pattern module.
 *
 * @remarks
 * Steering vectors aₙ(r̂) = exp(+j k r̂·rₙ) (docs/conventions.md). The result's main-beam
 * figures refer to `mainBeamDirection`.
 *
 * @param layout - Element positions (geometry module).
 * @param weights - Taper or weights, N real or N×1 complex [dimensionless].
 * @param nullDirections - K unit vectors r̂ₖ, xyz-interleaved (length 3K) [dimensionless].
 * @param mainBeamDirection - Unit vector of the main beam [dimensionless].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns New weights and the main-beam change.
 * @throws {@link DimensionError} / {@link DomainError} on bad layouts, weights or directions.
 * @throws {@link SingularMatrixError} if the null directions give linearly dependent steering vectors.
 * @example
 * ```ts
 * const layout = uniformLineLayout(16, 0.15);
 * nullsOnLayout(layout, taylorTaper(16, 30, 5).weights, Float64Array.of(0.3, 0, Math.sqrt(0.91)), [0, 0, 1], 1e9);
 * ```
 * @category Tapers
 */
export function nullsOnLayout(
  layout: ArrayLayout,
  weights: TaperWeights,
  nullDirections: Float64Array,
  mainBeamDirection: Vector3,
  frequencyHz: number,
): NullSynthesisResult {
  return projectNulls(weights, steeringMatrix(layout, nullDirections, frequencyHz), steeringVector(layout, mainBeamDirection, frequencyHz));
}
