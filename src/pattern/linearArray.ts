/**
 * Convenience figures for a uniform-spacing linear array (taper design).
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertColumn, assertFiniteCMatrix, assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { cutFigures, type CutFigures, type CutFiguresOptions } from './cutFigures.js';

/**
 * Figures of a linear array pattern (see {@link linearArrayFigures}).
 * @category Pattern
 */
export interface LinearArrayFigures extends CutFigures {
  /** Exact directivity of the array of isotropic elements toward the peak (linear). */
  readonly directivity: number;
  /** 10·log10 of `directivity` [dBi]. */
  readonly directivityDb: number;
}

/**
 * |AF(θ)| of a linear array along x, positions xₙ = (n − (N−1)/2)d, as a
 * function of the angle θ from broadside in the xz-plane:
 * AF(θ) = Σₙ conj(wₙ) exp(j k xₙ sinθ) (docs/conventions.md).
 * @param weights - N×1 weights.
 * @param spacingM - Spacing d [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns A function θ [rad] → |AF(θ)|.
 * @throws {@link DimensionError} / {@link DomainError} for bad inputs.
 * @category Pattern
 */
export function linearArrayField(weights: CMatrix, spacingM: number, frequencyHz: number): (thetaFromBroadsideRad: number) => number {
  assertColumn('weights', weights);
  assertFiniteCMatrix('weights', weights);
  assertPositive('spacingM', spacingM, 'm');
  const kd = wavenumberRadPerM(frequencyHz) * spacingM;
  const n = weights.rows, w = Float64Array.from(weights.data), c = (n - 1) / 2;
  return (theta: number): number => {
    const psi = kd * Math.sin(theta);
    let re = 0, im = 0;
    for (let i = 0; i < n; i++) {
      const ph = (i - c) * psi, cs = Math.cos(ph), sn = Math.sin(ph);
      re += w[2 * i] * cs + w[2 * i + 1] * sn;
      im += w[2 * i] * sn - w[2 * i + 1] * cs;
    }
    return Math.hypot(re, im);
  };
}

/**
 * Peak, half-power and first-null beamwidths, peak sidelobe, integrated
 * sidelobe ratio and directivity of a linear array with isotropic elements,
 * over θ ∈ [−π/2, π/2] from broadside (the xz-plane cut of {@link linearArrayField}).
 *
 * @remarks
 * Cut figures by {@link cutFigures} (angles in radians from broadside; the
 * integrated sidelobe ratio is taken in θ). Directivity is exact:
 * D = |AF(θ_peak)|² / Σₘₙ Re{conj(wₘ) wₙ} sinc(k d (m − n)) (the closed form
 * for a line of isotropic elements; C. A. Balanis, *Antenna Theory*, 4th ed.,
 * Wiley, 2016, §6.4 — from memory).
 * @param weights - N×1 weights.
 * @param spacingM - Spacing d [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Sampling density of the cut. @defaultValue 4001 samples (raise it for N ≳ 500)
 * @returns The figures.
 * @throws {@link DimensionError} / {@link DomainError} for bad inputs.
 * @example
 * ```ts
 * // 16 uniform elements, d = λ/2, broadside
 * const f = linearArrayFigures(columnVector(Array(16).fill(1)), 0.05, 2.99792458e9);
 * f.halfPowerWidth; // 0.1110 rad (6.36°); f.firstNullAt[1] = asin(1/8) = 0.1253; f.peakSidelobeDb = −13.15; f.directivity = 16
 * ```
 * @category Pattern
 */
export function linearArrayFigures(weights: CMatrix, spacingM: number, frequencyHz: number, options: CutFiguresOptions = {}): LinearArrayFigures {
  const field = linearArrayField(weights, spacingM, frequencyHz);
  const figs = cutFigures(field, -Math.PI / 2, Math.PI / 2, options);
  const kd = wavenumberRadPerM(frequencyHz) * spacingM;
  const n = weights.rows, w = weights.data;
  let p = 0;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const x = kd * (i - j);
      p += (w[2 * i] * w[2 * j] + w[2 * i + 1] * w[2 * j + 1]) * (x === 0 ? 1 : Math.sin(x) / x);
    }
  }
  const d = (figs.peakValue * figs.peakValue) / p;
  return { ...figs, directivity: d, directivityDb: 10 * Math.log10(d) };
}
