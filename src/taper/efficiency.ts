/**
 * Weight-only figures of a taper: taper efficiency and directivity loss.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFiniteArray, assertFiniteCMatrix, assertColumn } from '../internal/validate.js';
import type { CMatrix } from '../linalg/cmatrix.js';

/**
 * Real taper weights or a complex N×1 weight vector.
 * @category Tapers
 */
export type TaperWeights = Float64Array | CMatrix;

/** Sums (Σ re, Σ im, Σ|w|², N) of real or complex weights after validation. @internal */
export function weightSums(name: string, w: TaperWeights): { re: number; im: number; power: number; count: number } {
  let re = 0, im = 0, power = 0, count: number;
  if (w instanceof Float64Array) {
    assertFiniteArray(name, w);
    count = w.length;
    for (let i = 0; i < count; i++) { re += w[i]; power += w[i] * w[i]; }
  } else {
    assertFiniteCMatrix(name, w);
    assertColumn(name, w);
    count = w.rows;
    const d = w.data;
    for (let i = 0; i < count; i++) {
      re += d[2 * i]; im += d[2 * i + 1];
      power += d[2 * i] * d[2 * i] + d[2 * i + 1] * d[2 * i + 1];
    }
  }
  if (count < 1) throw new DomainError(`invalid argument "${name}": expected at least one weight, received none.`);
  if (!(power > 0)) throw new DomainError(`invalid argument "${name}": every weight is zero; a taper needs at least one non-zero weight.`);
  return { re, im, power, count };
}

/**
 * Taper (aperture) efficiency η = |Σwₙ|² / (N Σ|wₙ|²).
 *
 * @remarks
 * The ratio of the broadside directivity of the tapered array to that of the uniform one
 * when the element pairs are uncorrelated over the sphere (isotropic elements on a
 * half-wave-spaced line: exact); for planar lattices it is an approximation (a 16×12 λ/2 grid
 * with separable Dolph–Chebyshev weights: −10·log₁₀η = 0.93 dB against an exact 1.05 dB).
 * 1 for the uniform taper and < 1 otherwise (Cauchy–Schwarz). For a phase-steered taper pass the weights without the
 * steering phase. 0 for antisymmetric (difference) tapers.
 *
 * References:
 * - R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, §3.1 (taper efficiency) (from memory).
 *
 * @param w - Real weights or an N×1 complex vector [dimensionless].
 * @returns η ∈ [0, 1] [dimensionless].
 * @throws {@link DomainError} if a weight is not finite or all are zero.
 * @throws {@link DimensionError} if a complex `w` is not a column vector.
 * @example
 * ```ts
 * taperEfficiency(Float64Array.of(1, 2, 1)); // 0.888… (= 16/18)
 * ```
 * @category Tapers
 */
export function taperEfficiency(w: TaperWeights): number {
  const s = weightSums('w', w);
  return (s.re * s.re + s.im * s.im) / (s.count * s.power);
}

/**
 * Directivity loss of a taper relative to uniform weighting, −10·log₁₀ η.
 *
 * @remarks
 * Positive number of dB lost; exact under the same assumption as {@link taperEfficiency}
 * (half-wave line of isotropic elements), common practice elsewhere; the exact values for any
 * layout come from {@link lineTaperFigures} and {@link planarTaperFigures}. Infinite for η = 0.
 *
 * @param w - Real weights or an N×1 complex vector [dimensionless].
 * @returns Loss ≥ 0 [dB, power ratio].
 * @throws {@link DomainError} if a weight is not finite or all are zero.
 * @throws {@link DimensionError} if a complex `w` is not a column vector.
 * @category Tapers
 */
export function directivityLossDb(w: TaperWeights): number {
  return -10 * Math.log10(taperEfficiency(w));
}
