/**
 * Cosine and cosine-squared tapers on a pedestal.
 * @module
 */
import { assertInRange } from '../internal/validate.js';
import { sampleUniformLine, type LineDistribution } from './aperture.js';
import { type TaperOptions } from './normalize.js';

/**
 * Cosine-on-a-pedestal line distribution g(p) = q + (1 − q)·cos(πp), p ∈ [−½, ½].
 *
 * @remarks
 * q is the edge amplitude (the pedestal): q = 0 is the pure cosine, q = 1 uniform.
 *
 * References:
 * - R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, §3.1 (from memory).
 *
 * @param pedestal - Edge amplitude q ∈ [0, 1] [dimensionless, field ratio].
 * @returns The distribution g(p) [dimensionless].
 * @throws {@link DomainError} if q is outside [0, 1].
 * @category Tapers
 */
export function cosineDistribution(pedestal = 0): LineDistribution {
  assertInRange('pedestal', pedestal, 0, 1);
  return (p) => pedestal + (1 - pedestal) * Math.cos(Math.PI * p);
}

/**
 * Cosine-squared-on-a-pedestal line distribution g(p) = q + (1 − q)·cos²(πp), p ∈ [−½, ½].
 *
 * @remarks
 * References: R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, §3.1 (from memory).
 *
 * @param pedestal - Edge amplitude q ∈ [0, 1] [dimensionless, field ratio].
 * @returns The distribution g(p) [dimensionless].
 * @throws {@link DomainError} if q is outside [0, 1].
 * @category Tapers
 */
export function cosineSquaredDistribution(pedestal = 0): LineDistribution {
  assertInRange('pedestal', pedestal, 0, 1);
  return (p) => {
    const c = Math.cos(Math.PI * p);
    return pedestal + (1 - pedestal) * c * c;
  };
}

/**
 * Cosine-on-a-pedestal taper of an N-element uniform line, sampled at the cell centres
 * pₙ = (n − (N−1)/2)/N of an aperture of length N·d.
 *
 * @remarks
 * See {@link cosineDistribution}. Weights are real; as array weights they enter AF = wᴴa.
 *
 * @param elementCount - Number of elements N, integer ≥ 1.
 * @param pedestal - Edge amplitude q ∈ [0, 1] of the continuous distribution [dimensionless].
 * @param options - Normalisation (default peak = 1).
 * @returns N real weights [dimensionless].
 * @throws {@link DomainError} if N is not an integer ≥ 1 or q is outside [0, 1].
 * @example
 * ```ts
 * cosineTaper(4, 0.2); // ≈ [0.5390, 1, 1, 0.5390] (0.2 + 0.8 cos πp at p = ±1/8, ±3/8, peak-normalised)
 * ```
 * @category Tapers
 */
export function cosineTaper(elementCount: number, pedestal = 0, options: TaperOptions = {}): Float64Array {
  return sampleUniformLine(cosineDistribution(pedestal), elementCount, options);
}

/**
 * Cosine-squared-on-a-pedestal taper of an N-element uniform line, sampled at the cell
 * centres pₙ = (n − (N−1)/2)/N.
 *
 * @remarks
 * See {@link cosineSquaredDistribution}.
 *
 * @param elementCount - Number of elements N, integer ≥ 1.
 * @param pedestal - Edge amplitude q ∈ [0, 1] of the continuous distribution [dimensionless].
 * @param options - Normalisation (default peak = 1).
 * @returns N real weights [dimensionless].
 * @throws {@link DomainError} if N is not an integer ≥ 1 or q is outside [0, 1].
 * @category Tapers
 */
export function cosineSquaredTaper(elementCount: number, pedestal = 0, options: TaperOptions = {}): Float64Array {
  return sampleUniformLine(cosineSquaredDistribution(pedestal), elementCount, options);
}
