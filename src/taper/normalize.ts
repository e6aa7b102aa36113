/**
 * Taper normalisation and the shared argument checks of the taper module.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFiniteArray, assertInteger, describeValue } from '../internal/validate.js';

/**
 * How a taper is scaled.
 *
 * @remarks
 * - `'peak'`: the largest |wₙ| equals 1 (default everywhere in this module).
 * - `'sum'`: Σ|wₙ| = N, so a uniform taper is all ones and the coherent gain of a
 *   real positive taper is N. (Σ|wₙ| rather than Σwₙ so that antisymmetric
 *   difference tapers, whose Σwₙ is 0, can be scaled too.)
 * - `'power'`: Σ|wₙ|² = 1 (unit-norm weight vector).
 * @category Tapers
 */
export type TaperNormalization = 'peak' | 'sum' | 'power';

/**
 * Options shared by every taper function.
 * @category Tapers
 */
export interface TaperOptions {
  /**
   * Scaling of the returned weights.
   * @defaultValue `'peak'`
   */
  normalization?: TaperNormalization;
}

/**
 * Scales real taper weights in place to the requested normalisation.
 *
 * @param w - Real weights, dimensionless; overwritten and returned.
 * @param normalization - `'peak'` (max |wₙ| = 1), `'sum'` (Σ|wₙ| = N) or `'power'` (Σ|wₙ|² = 1).
 * @returns `w`, scaled [dimensionless].
 * @throws {@link DomainError} if an entry is not finite, all entries are zero, or the mode is unknown.
 * @example
 * ```ts
 * normalizeTaper(Float64Array.of(1, 2, 1), 'sum'); // Float64Array [0.75, 1.5, 0.75]
 * ```
 * @category Tapers
 */
export function normalizeTaper<T extends Float64Array>(w: T, normalization: TaperNormalization = 'peak'): T {
  assertFiniteArray('w', w);
  let peak = 0;
  let sumAbs = 0;
  let sumSq = 0;
  for (let i = 0; i < w.length; i++) {
    const a = Math.abs(w[i]);
    if (a > peak) peak = a;
    sumAbs += a;
    sumSq += a * a;
  }
  if (!(peak > 0)) {
    throw new DomainError(`invalid argument "w": every weight is zero, so it cannot be normalised; pass at least one non-zero weight.`);
  }
  // Divide (rather than multiply by a reciprocal) so the peak entry becomes exactly 1.
  let d: number;
  if (normalization === 'peak') d = peak;
  else if (normalization === 'sum') d = sumAbs / w.length;
  else if (normalization === 'power') d = Math.sqrt(sumSq);
  else {
    throw new DomainError(`invalid option "normalization": expected 'peak', 'sum' or 'power', received ${describeValue(normalization)}.`);
  }
  for (let i = 0; i < w.length; i++) w[i] /= d;
  return w;
}

/** Validates an element count (integer ≥ min) with a taper-specific remedy. @internal */
export function assertElementCount(name: string, n: number, min = 1): void {
  assertInteger(name, n, min);
}

/**
 * Validates a sidelobe level given as a positive number of dB below the main-beam peak.
 * @internal
 */
export function assertSidelobeLevel(name: string, sllDb: number, max = 200): void {
  if (typeof sllDb !== 'number' || !Number.isFinite(sllDb) || sllDb <= 0 || sllDb > max) {
    throw new DomainError(`invalid argument "${name}": expected the sidelobe level as a positive number of dB below the peak, in (0, ${max}] (e.g. 30 for −30 dB sidelobes), received ${describeValue(sllDb)}.`);
  }
}

/**
 * Normalised position of the centre of cell n of an N-element uniform line,
 * pₙ = (n − (N−1)/2)/N ∈ (−½, ½): the element positions sampled from a continuous
 * line-source distribution of length N·d. @internal
 */
export function cellCentre(n: number, count: number): number {
  return (n - (count - 1) / 2) / count;
}
