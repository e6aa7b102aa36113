/**
 * Steering vectors and steering matrices.
 * @module
 */
import { DimensionError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { assertDirections, assertUnitVector } from '../geometry/directions.js';

/**
 * Steering vector aₙ(r̂) = exp(+j k r̂·rₙ), n = 0…N−1.
 *
 * @remarks
 * The phase at element n of a plane wave arriving from direction r̂, referenced
 * to the origin (docs/conventions.md); k = 2πf/c0. Pointing a beam at r̂₀ uses
 * w = a(r̂₀). Disabled elements (thinning mask) are included: the mask acts on
 * weights, not on geometry.
 * @param layout - Element positions.
 * @param direction - Unit vector r̂ toward the source.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns a, N×1 (dimensionless, |aₙ| = 1).
 * @throws {@link DomainError} if |r̂| ≠ 1 or the frequency is not positive.
 * @example
 * ```ts
 * steeringVector(uniformLineLayout(2, 0.05), [1, 0, 0], 2.99792458e9); // ≈ [−1.000000j, 1.000000j]ᵀ (exp(∓jπ/2))
 * ```
 * @category Pattern
 */
export function steeringVector(layout: ArrayLayout, direction: Vector3, frequencyHz: number): CMatrix {
  assertLayout('layout', layout);
  assertUnitVector('direction', direction);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  return steeringVectorInto({ rows: layout.count, cols: 1, data: new Float64Array(2 * layout.count) }, layout, direction, frequencyHz);
}

/**
 * Allocation-free {@link steeringVector}: writes a(r̂) into `out` (N×1) and returns it.
 * Checks shapes only (validate the layout and direction once yourself).
 * @param out - Destination, N×1.
 * @param layout - Element positions.
 * @param direction - Unit vector r̂.
 * @param frequencyHz - Frequency [Hz].
 * @returns `out`.
 * @throws {@link DimensionError} if `out` is not N×1.
 * @category Pattern
 */
export function steeringVectorInto<T extends CMatrix>(out: T, layout: ArrayLayout, direction: Vector3, frequencyHz: number): T {
  const n = layout.count;
  if (out.rows !== n || out.cols !== 1 || out.data.length !== 2 * n) {
    throw new DimensionError(`invalid argument "out": expected ${n}×1, received ${out.rows}×${out.cols}.`);
  }
  const k = wavenumberRadPerM(frequencyHz);
  const ux = k * direction[0], uy = k * direction[1], uz = k * direction[2];
  const p = layout.positionsM, d = out.data;
  for (let i = 0; i < n; i++) {
    const ph = ux * p[3 * i] + uy * p[3 * i + 1] + uz * p[3 * i + 2];
    d[2 * i] = Math.cos(ph);
    d[2 * i + 1] = Math.sin(ph);
  }
  return out;
}

/**
 * Steering matrix A (N×M): column m is the steering vector a(r̂ₘ) of direction m.
 * @param layout - Element positions.
 * @param directions - M unit vectors, xyz-interleaved (length 3M).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns A, N×M, Aₙₘ = exp(+j k r̂ₘ·rₙ).
 * @throws {@link DimensionError} for an empty or ragged direction list; {@link DomainError} if some |r̂ₘ| ≠ 1.
 * @category Pattern
 */
export function steeringMatrix(layout: ArrayLayout, directions: Float64Array, frequencyHz: number): CMatrix {
  assertLayout('layout', layout);
  assertDirections('directions', directions);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const m = directions.length / 3;
  return steeringMatrixInto({ rows: layout.count, cols: m, data: new Float64Array(2 * layout.count * m) }, layout, directions, frequencyHz);
}

/**
 * Allocation-free {@link steeringMatrix} into `out` (N×M). Checks shapes only.
 * `out` must not alias `directions`.
 * @param out - Destination, N×M.
 * @param layout - Element positions.
 * @param directions - M unit vectors, xyz-interleaved.
 * @param frequencyHz - Frequency [Hz].
 * @returns `out`.
 * @throws {@link DimensionError} if `out` is not N×M.
 * @category Pattern
 */
export function steeringMatrixInto<T extends CMatrix>(out: T, layout: ArrayLayout, directions: Float64Array, frequencyHz: number): T {
  const n = layout.count, m = directions.length / 3;
  if (out.rows !== n || out.cols !== m || out.data.length !== 2 * n * m) {
    throw new DimensionError(`invalid argument "out": expected ${n}×${m}, received ${out.rows}×${out.cols}.`);
  }
  const k = wavenumberRadPerM(frequencyHz);
  const p = layout.positionsM, d = out.data;
  for (let j = 0; j < m; j++) {
    const ux = k * directions[3 * j], uy = k * directions[3 * j + 1], uz = k * directions[3 * j + 2];
    for (let i = 0; i < n; i++) {
      const ph = ux * p[3 * i] + uy * p[3 * i + 1] + uz * p[3 * i + 2];
      const o = 2 * (i * m + j);
      d[o] = Math.cos(ph);
      d[o + 1] = Math.sin(ph);
    }
  }
  return out;
}
