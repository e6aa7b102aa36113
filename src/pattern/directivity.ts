/**
 * Directivity by sphere quadrature, the exact isotropic-element directivity,
 * beam solid angle and scan loss.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { assertUnitVector } from '../geometry/directions.js';
import { sphereQuadratureForLayout, type SphereQuadrature } from '../geometry/quadrature.js';
import { patternEvaluator } from './evaluator.js';
import { assertElementFactor, elementFactorAt, type ElementFactor } from './element.js';
import { assertWeights } from './validate.js';
import { steeringVector } from './steering.js';

/**
 * Result of {@link directivity}.
 * @category Pattern
 */
export interface DirectivityResult {
  /** Directivity D(r̂₀) = 4π|F(r̂₀)|² / ∮|F|² dΩ (linear, dimensionless). */
  readonly directivity: number;
  /** 10·log10 D [dBi, power ratio]. */
  readonly directivityDb: number;
  /** ∮ |F|² dΩ [sr] (F dimensionless). */
  readonly patternIntegral: number;
  /** Beam solid angle Ω_A = ∮|F|² dΩ / |F(r̂₀)|² = 4π/D [sr]. */
  readonly beamSolidAngleSr: number;
  /** Bound on the quadrature error of `patternIntegral` (absolute [sr]; from the rule's plane-wave bound times (Σ|wₙ|·max f)²), or NaN when a caller-supplied rule was used. */
  readonly errorBound: number;
}

/**
 * Options of {@link directivity}.
 * @category Pattern
 */
export interface DirectivityOptions {
  /** Element factor (pattern multiplication). @defaultValue isotropic */
  element?: ElementFactor;
  /** Sphere rule to use; by default one sized from the layout ({@link sphereQuadratureForLayout}), split at the horizon for cosine elements. */
  quadrature?: SphereQuadrature;
  /** Target plane-wave error of the default rule. @defaultValue 1e-12 */
  tolerance?: number;
}

/**
 * Directivity of an array toward r̂₀ by sphere quadrature of |F|², F = f·wᴴa.
 *
 * @remarks
 * D(r̂₀) = 4π |F(r̂₀)|² / ∮ |F(r̂)|² dΩ (IEEE Std 145-2013, "directivity").
 * The integral uses Gauss–Legendre in cosθ × trapezoid in φ; the default rule
 * is sized from the electrical diameter (see {@link sphereQuadratureOrder} for
 * the error bound). For a cos^q element the rule adds 2q to the degree and is
 * split at the horizon, where the element factor has a kink.
 * @param layout - Element positions.
 * @param weights - N×1 weights.
 * @param direction - r̂₀ [unit vector].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Element factor, rule, tolerance.
 * @returns Directivity, its dB value, the pattern integral, beam solid angle and error bound.
 * @throws {@link DimensionError} / {@link DomainError} for bad inputs.
 * @example
 * ```ts
 * const layout = uniformLineLayout(10, 0.05); // λ/2 at 2.998 GHz
 * const w = steeringVector(layout, [0, 0, 1], 2.99792458e9);
 * directivity(layout, w, [0, 0, 1], 2.99792458e9).directivity; // 10.000000000 (= N for λ/2 broadside)
 * ```
 * @category Pattern
 */
export function directivity(layout: ArrayLayout, weights: CMatrix, direction: Vector3, frequencyHz: number, options: DirectivityOptions = {}): DirectivityResult {
  assertLayout('layout', layout);
  assertWeights(weights, layout);
  assertUnitVector('direction', direction);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const element = options.element ?? { kind: 'isotropic' };
  assertElementFactor(element);
  let q = options.quadrature;
  let planeWaveBound = NaN;
  if (q === undefined) {
    const extra = element.kind === 'cosine' ? Math.ceil(2 * element.exponent) : 0;
    const rule = sphereQuadratureForLayout(layout, frequencyHz, {
      tolerance: options.tolerance ?? 1e-12, extraDegree: extra, splitAtHorizon: element.kind === 'cosine',
    });
    q = rule;
    planeWaveBound = rule.errorEstimate;
  }
  const ev = patternEvaluator(layout, weights, frequencyHz, element);
  const vals = ev.evaluateSphereInto(new Float64Array(2 * q.count), q);
  let integral = 0, fmax = 0;
  for (let k = 0; k < q.count; k++) {
    integral += q.weights[k] * (vals[2 * k] * vals[2 * k] + vals[2 * k + 1] * vals[2 * k + 1]);
  }
  let wsum = 0;
  for (let n = 0; n < layout.count; n++) if (!layout.enabled || layout.enabled[n]) wsum += Math.hypot(weights.data[2 * n], weights.data[2 * n + 1]);
  for (let k = 0; k < q.count; k++) {
    fmax = Math.max(fmax, Math.abs(elementFactorAt(element, q.directions[3 * k], q.directions[3 * k + 1], q.directions[3 * k + 2])));
  }
  const f0 = ev.magnitudeAt(direction[0], direction[1], direction[2]);
  const d = (4 * Math.PI * f0 * f0) / integral;
  return {
    directivity: d,
    directivityDb: 10 * Math.log10(d),
    patternIntegral: integral,
    beamSolidAngleSr: integral / (f0 * f0),
    errorBound: planeWaveBound * wsum * wsum * fmax * fmax,
  };
}

/**
 * Exact directivity of an array of isotropic elements, from the closed-form
 * pattern integral ∮|wᴴa|² dΩ = 4π Σₘₙ conj(wₘ) wₙ sinc(k|rₘ − rₙ|), sinc x = sin x / x.
 *
 * @remarks
 * Follows from ∮ exp(j k r̂·d) dΩ = 4π sin(kd)/(kd). Cost O(N²), no quadrature;
 * a reference for {@link directivity} (R. C. Hansen, *Phased Array Antennas*,
 * 2nd ed., Wiley, 2009, ch. 2 — from memory).
 * @param layout - Element positions.
 * @param weights - N×1 weights.
 * @param direction - r̂₀ [unit vector].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns D(r̂₀) (linear).
 * @throws {@link DimensionError} / {@link DomainError} for bad inputs.
 * @category Pattern
 */
export function isotropicDirectivity(layout: ArrayLayout, weights: CMatrix, direction: Vector3, frequencyHz: number): number {
  assertLayout('layout', layout);
  assertWeights(weights, layout);
  assertUnitVector('direction', direction);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const k = wavenumberRadPerM(frequencyHz);
  const p = layout.positionsM, w = weights.data, n = layout.count;
  const on = (i: number): number => (layout.enabled && !layout.enabled[i] ? 0 : 1);
  let sum = 0;
  for (let i = 0; i < n; i++) {
    const ai = on(i);
    if (!ai) continue;
    sum += w[2 * i] * w[2 * i] + w[2 * i + 1] * w[2 * i + 1];
    for (let j = i + 1; j < n; j++) {
      if (!on(j)) continue;
      const x = k * Math.hypot(p[3 * i] - p[3 * j], p[3 * i + 1] - p[3 * j + 1], p[3 * i + 2] - p[3 * j + 2]);
      const re = w[2 * i] * w[2 * j] + w[2 * i + 1] * w[2 * j + 1]; // Re{conj(wᵢ) wⱼ}
      sum += 2 * re * (x === 0 ? 1 : Math.sin(x) / x);
    }
  }
  const ev = patternEvaluator(layout, weights, frequencyHz);
  const f0 = ev.magnitudeAt(direction[0], direction[1], direction[2]);
  return (f0 * f0) / sum;
}

/**
 * Scan loss: the directivity when the beam is steered to r̂ (w = a(r̂)) relative
 * to the directivity at broadside (+z), in dB (≤ 0 means a loss).
 *
 * @remarks
 * A large planar array loses directivity as cosθ, its projected aperture
 * (R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, ch. 2 — from
 * memory), whatever the element factor: in directivity the element factor at
 * the beam peak cancels against the pattern integral. Gain scan loss from
 * mismatch (active reflection) is outside the pattern-multiplication model.
 * Computed with {@link directivity} for both beams.
 * @param layout - Element positions.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param scanDirection - Scan direction r̂ [unit vector].
 * @param element - Element factor. @defaultValue isotropic
 * @returns 10·log10(D(r̂)/D(+z)) [dB, power ratio].
 * @throws {@link DomainError} for bad inputs.
 * @category Pattern
 */
export function scanLossDb(layout: ArrayLayout, frequencyHz: number, scanDirection: Vector3, element: ElementFactor = { kind: 'isotropic' }): number {
  assertLayout('layout', layout);
  assertUnitVector('scanDirection', scanDirection);
  const broadside: Vector3 = [0, 0, 1];
  const d0 = directivity(layout, steeringVector(layout, broadside, frequencyHz), broadside, frequencyHz, { element }).directivity;
  const ds = directivity(layout, steeringVector(layout, scanDirection, frequencyHz), scanDirection, frequencyHz, { element }).directivity;
  return 10 * Math.log10(ds / d0);
}
