/**
 * Array factor AF(r̂) = wᴴ a(r̂) over arbitrary direction sets (general 3-D layouts).
 * @module
 */
import { DimensionError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout } from '../geometry/layout.js';
import { assertDirections } from '../geometry/directions.js';
import { assertOutColumn, assertWeights } from './validate.js';
import { evaluateArrayFactor, kernelWork, loadWeights, planArrayFactor } from './kernel.js';

/**
 * Complex array factor AF(r̂ₘ) = wᴴ a(r̂ₘ) = Σₙ conj(wₙ) exp(j k r̂ₘ·rₙ) for each direction.
 *
 * @remarks
 * Conventions (docs/conventions.md): steering aₙ = exp(+j k r̂·rₙ), beam output
 * y = wᴴx, so weights w = a(r̂₀) point the beam at r̂₀ with AF(r̂₀) = N.
 * Elements disabled by the layout's mask count as weight 0. Not normalised.
 * Lattice-like layouts are summed in factored form (exact, see the kernel
 * notes in docs/pattern.md); others with one cos/sin pair per element and
 * direction.
 * @param layout - Element positions.
 * @param weights - Complex weights w, N×1.
 * @param directions - M unit vectors r̂ₘ, xyz-interleaved (length 3M).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns AF, M×1 complex (dimensionless).
 * @throws {@link DimensionError} if `weights` is not N×1 or `directions` is empty/ragged.
 * @throws {@link DomainError} for non-finite weights, |r̂ₘ| ≠ 1 or a bad frequency.
 * @example
 * ```ts
 * const layout = uniformLineLayout(8, 0.05);
 * const w = steeringVector(layout, [0, 0, 1], 3e9);
 * arrayFactor(layout, w, Float64Array.of(0, 0, 1), 3e9); // [8 + 0j]
 * ```
 * @category Pattern
 */
export function arrayFactor(layout: ArrayLayout, weights: CMatrix, directions: Float64Array, frequencyHz: number): CMatrix {
  assertLayout('layout', layout);
  assertWeights(weights, layout);
  assertDirections('directions', directions);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const m = directions.length / 3;
  return arrayFactorInto({ rows: m, cols: 1, data: new Float64Array(2 * m) }, layout, weights, directions, frequencyHz);
}

/**
 * Allocation-light {@link arrayFactor} into `out` (M×1); checks shapes only.
 * `out` must not alias `directions` or `weights`.
 * @param out - Destination, M×1.
 * @param layout - Element positions.
 * @param weights - N×1 weights.
 * @param directions - M unit vectors, xyz-interleaved.
 * @param frequencyHz - Frequency [Hz].
 * @returns `out`.
 * @throws {@link DimensionError} on shape mismatch.
 * @category Pattern
 */
export function arrayFactorInto<T extends CMatrix>(out: T, layout: ArrayLayout, weights: CMatrix, directions: Float64Array, frequencyHz: number): T {
  if (weights.rows !== layout.count || weights.cols !== 1) {
    throw new DimensionError(`invalid argument "weights": expected ${layout.count}×1 (one weight per element of "layout"), received ${weights.rows}×${weights.cols}.`);
  }
  const m = directions.length / 3;
  assertOutColumn('out', out, m);
  const plan = planArrayFactor(layout.positionsM);
  const work = kernelWork(plan);
  loadWeights(plan, work, weights.data, layout.enabled);
  evaluateArrayFactor(plan, work, directions, wavenumberRadPerM(frequencyHz), out.data, 0, m);
  return out;
}

/**
 * Magnitude |AF(r̂ₘ)| = |wᴴ a(r̂ₘ)| per direction (see {@link arrayFactor}).
 * @param layout - Element positions.
 * @param weights - N×1 weights.
 * @param directions - M unit vectors, xyz-interleaved.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns |AF|, length M (dimensionless, not normalised).
 * @throws {@link DimensionError} / {@link DomainError} as {@link arrayFactor}.
 * @category Pattern
 */
export function arrayFactorMagnitude(layout: ArrayLayout, weights: CMatrix, directions: Float64Array, frequencyHz: number): Float64Array {
  const af = arrayFactor(layout, weights, directions, frequencyHz);
  return magnitudesInto(new Float64Array(af.rows), af);
}

/**
 * |zₘ| of an M×1 complex column into `out` (length M). `out` may not alias `z.data`.
 * @param out - Destination, length M.
 * @param z - Complex column M×1.
 * @returns `out`.
 * @throws {@link DimensionError} if lengths differ.
 * @category Pattern
 */
export function magnitudesInto<T extends Float64Array>(out: T, z: CMatrix): T {
  if (out.length !== z.rows * z.cols) throw new DimensionError(`invalid argument "out": expected length ${z.rows * z.cols}, received ${out.length}.`);
  const d = z.data;
  for (let i = 0; i < out.length; i++) out[i] = Math.hypot(d[2 * i], d[2 * i + 1]);
  return out;
}
