/**
 * Uniform taper.
 * @module
 */
import { assertElementCount, normalizeTaper, type TaperOptions } from './normalize.js';

/**
 * Uniform (untapered) weights: every element equal.
 *
 * @remarks
 * The reference of every taper figure: efficiency 1, narrowest beam, first sidelobe
 * −13.26 dB for a long line. Weights are real; as array weights they enter AF = wᴴa
 * (docs/conventions.md).
 *
 * @param elementCount - Number of elements N, integer ≥ 1.
 * @param options - Normalisation (default peak = 1).
 * @returns N real weights [dimensionless].
 * @throws {@link DomainError} if N is not an integer ≥ 1.
 * @example
 * ```ts
 * uniformTaper(4); // Float64Array [1, 1, 1, 1]
 * ```
 * @category Tapers
 */
export function uniformTaper(elementCount: number, options: TaperOptions = {}): Float64Array {
  assertElementCount('elementCount', elementCount);
  return normalizeTaper(new Float64Array(elementCount).fill(1), options.normalization);
}
