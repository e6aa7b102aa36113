/**
 * Binomial taper.
 * @module
 */
import { assertElementCount, normalizeTaper, type TaperOptions } from './normalize.js';

/**
 * Binomial weights wₙ = C(N−1, n): the line array whose pattern has all N−1 zeros at
 * ψ = π, hence no sidelobes at half-wave spacing.
 *
 * @remarks
 * Computed in log space, ln C(N−1, n) − ln C(N−1, ⌊(N−1)/2⌋) by the multiplicative
 * recurrence, so N in the thousands does not overflow (the raw coefficients exceed
 * 1e308 from N ≈ 1030); tiny edge weights underflow gracefully to 0.
 *
 * References:
 * - J. S. Stone, US Patents 1,643,323 and 1,715,433 (1927–1929) (from memory).
 * - C. A. Balanis, *Antenna Theory: Analysis and Design*, 4th ed., Wiley, 2016, §6.8.2 (from memory).
 *
 * @param elementCount - Number of elements N, integer ≥ 1.
 * @param options - Normalisation (default peak = 1).
 * @returns N real weights [dimensionless].
 * @throws {@link DomainError} if N is not an integer ≥ 1.
 * @example
 * ```ts
 * binomialTaper(5, { normalization: 'sum' }); // Float64Array [0.3125, 1.25, 1.875, 1.25, 0.3125] (= [1, 4, 6, 4, 1]·5/16)
 * ```
 * @category Tapers
 */
export function binomialTaper(elementCount: number, options: TaperOptions = {}): Float64Array {
  assertElementCount('elementCount', elementCount);
  const order = elementCount - 1;
  const logC = new Float64Array(elementCount);
  let maxLog = 0;
  for (let k = 1; k <= order; k++) {
    logC[k] = logC[k - 1] + Math.log((order - k + 1) / k);
    if (logC[k] > maxLog) maxLog = logC[k];
  }
  const w = new Float64Array(elementCount);
  for (let k = 0; k < elementCount; k++) w[k] = Math.exp(logC[k] - maxLog);
  return normalizeTaper(w, options.normalization);
}
