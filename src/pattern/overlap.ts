/**
 * The isotropic-noise (pattern-overlap) matrix of a layout and the maximum directivity it
 * bounds.
 * @module
 */
import { NotPositiveDefiniteError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { zeros } from '../linalg/cmatrix.js';
import { choleskyFactor, choleskySolve } from '../linalg/cholesky.js';
import { assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { assertUnitVector } from '../geometry/directions.js';
import { sphereQuadratureForLayout, type SphereQuadrature } from '../geometry/quadrature.js';
import { assertElementFactor, elementFactorAt, type ElementFactor } from './element.js';
import { steeringVector } from './steering.js';

/**
 * Options of {@link isotropicNoiseMatrix} and {@link maximumDirectivity}.
 * @category Pattern
 */
export interface IsotropicNoiseOptions {
  /** Element factor f (pattern multiplication). @defaultValue isotropic (closed form, no quadrature) */
  element?: ElementFactor;
  /** Sphere rule for a non-isotropic element; by default one sized from the layout, split at the horizon for cosine elements. */
  quadrature?: SphereQuadrature;
  /** Target plane-wave error of the default rule. @defaultValue 1e-12 */
  tolerance?: number;
}

/**
 * Isotropic-noise (pattern-overlap) matrix of a layout: R_mn = (1/4π) ∮ |f(r̂)|² aₘ(r̂) aₙ*(r̂) dΩ.
 *
 * @remarks
 * With the steering vector a(r̂)ₙ = exp(+j k r̂·rₙ) (docs/conventions.md) the radiated power
 * of weights w is ∮|f wᴴa|² dΩ = 4π wᴴ R w, so D(r̂₀) = |f(r̂₀)|²|wᴴa(r̂₀)|² / (wᴴ R w); R is
 * also the correlation of the element outputs in an isotropic noise field of unit power per
 * steradian over 4π. For isotropic elements it is exact in closed form,
 * R_mn = sin(k dₘₙ)/(k dₘₙ), dₘₙ = |rₘ − rₙ| (from ∮ exp(j k r̂·d) dΩ = 4π sin(kd)/(kd);
 * R. F. Harrington, "Antenna excitation for maximum gain", IEEE Trans. AP 13(6), 1965, from
 * memory); for other element factors it is integrated by sphere quadrature. Disabled
 * elements get zero rows and columns.
 * @param layout - Element positions [m].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Element factor and quadrature.
 * @returns R, N×N Hermitian positive semidefinite, dimensionless (|f|² units), R_nn = (1/4π)∮|f|²dΩ (1 for isotropic elements).
 * @throws {@link DimensionError} / {@link DomainError} for a bad layout, frequency or element factor.
 * @example
 * ```ts
 * // two isotropic elements λ/2 apart: sin(π)/π = 0
 * isotropicNoiseMatrix(uniformLineLayout(2, 0.05), 2.99792458e9); // ≈ [1, 0.000000, 0.000000, 1]
 * ```
 * @category Pattern
 */
export function isotropicNoiseMatrix(layout: ArrayLayout, frequencyHz: number, options: IsotropicNoiseOptions = {}): CMatrix {
  assertLayout('layout', layout);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const element = options.element ?? { kind: 'isotropic' };
  assertElementFactor(element);
  const n = layout.count, p = layout.positionsM;
  const on = (i: number): boolean => !layout.enabled || layout.enabled[i] !== 0;
  const k = wavenumberRadPerM(frequencyHz);
  const r = zeros(n, n);
  if (element.kind === 'isotropic' && options.quadrature === undefined) {
    for (let i = 0; i < n; i++) {
      if (!on(i)) continue;
      r.data[2 * (i * n + i)] = 1;
      for (let j = i + 1; j < n; j++) {
        if (!on(j)) continue;
        const x = k * Math.hypot(p[3 * i] - p[3 * j], p[3 * i + 1] - p[3 * j + 1], p[3 * i + 2] - p[3 * j + 2]);
        const s = x === 0 ? 1 : Math.sin(x) / x;
        r.data[2 * (i * n + j)] = s;
        r.data[2 * (j * n + i)] = s;
      }
    }
    return r;
  }
  const q = options.quadrature ?? sphereQuadratureForLayout(layout, frequencyHz, {
    tolerance: options.tolerance ?? 1e-12,
    extraDegree: element.kind === 'cosine' ? Math.ceil(2 * element.exponent) : 0,
    splitAtHorizon: element.kind === 'cosine',
  });
  // R = Σ_k (w_k/4π)|f_k|² a_k a_kᴴ, accumulated over the upper triangle.
  const dirs = q.directions;
  const phase = new Float64Array(n);
  for (let d = 0; d < q.count; d++) {
    const x = dirs[3 * d], y = dirs[3 * d + 1], z = dirs[3 * d + 2];
    const f = elementFactorAt(element, x, y, z);
    const c = (q.weights[d] / (4 * Math.PI)) * f * f;
    if (c === 0) continue;
    for (let i = 0; i < n; i++) phase[i] = k * (x * p[3 * i] + y * p[3 * i + 1] + z * p[3 * i + 2]);
    for (let i = 0; i < n; i++) {
      if (!on(i)) continue;
      for (let j = i; j < n; j++) {
        if (!on(j)) continue;
        const t = phase[i] - phase[j];
        r.data[2 * (i * n + j)] += c * Math.cos(t);
        r.data[2 * (i * n + j) + 1] += c * Math.sin(t);
      }
    }
  }
  for (let i = 0; i < n; i++) {
    r.data[2 * (i * n + i) + 1] = 0;
    for (let j = i + 1; j < n; j++) {
      r.data[2 * (j * n + i)] = r.data[2 * (i * n + j)];
      r.data[2 * (j * n + i) + 1] = -r.data[2 * (i * n + j) + 1];
    }
  }
  return r;
}

/**
 * Result of {@link maximumDirectivity}.
 * @category Pattern
 */
export interface MaximumDirectivityResult {
  /** D_max(r̂₀) = |f(r̂₀)|² a₀ᴴ R⁻¹ a₀ (linear, dimensionless). */
  readonly directivity: number;
  /** 10·log10 D_max [dBi, power ratio]. */
  readonly directivityDb: number;
  /** The weights reaching it, w = R⁻¹ a₀, N×1 (scaled so that wᴴa₀ = 1). */
  readonly weights: CMatrix;
  /** The isotropic-noise matrix R used ({@link isotropicNoiseMatrix}). */
  readonly isotropicNoise: CMatrix;
}

/**
 * Maximum directivity of a layout toward r̂₀ over all complex weights, and the weights.
 *
 * @remarks
 * D(w) = |f₀|²|wᴴa₀|²/(wᴴRw) is a Rayleigh quotient; its maximum over w is |f₀|² a₀ᴴR⁻¹a₀ at
 * w ∝ R⁻¹a₀ (Harrington 1965, from memory; the weights are those of `maxDirectivityWeights`
 * in the beamform module). For N isotropic elements on a line with spacing → 0 the endfire
 * maximum tends to N² (A. I. Uzkov, "An approach to the problem of optimum directive antenna
 * design", C. R. (Doklady) Acad. Sci. URSS 53(1), 1946, pp. 35–38 — from memory), while
 * λ/2-spaced broadside lines give N. Close spacings make R ill-conditioned (superdirectivity):
 * the weights grow like (kd)^{−(N−1)} and the result is only as good as R's condition allows.
 * @param layout - Element positions [m].
 * @param direction - r̂₀ [unit vector].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Element factor and quadrature, as for {@link isotropicNoiseMatrix}.
 * @returns D_max, in dBi, the weights and R.
 * @throws {@link NotPositiveDefiniteError} if R is singular (e.g. coincident elements, or disabled ones);
 *   {@link DimensionError} / {@link DomainError} for bad inputs.
 * @example
 * ```ts
 * // 4 isotropic elements 0.1λ apart on x, endfire toward +x: below Uzkov's N² = 16
 * maximumDirectivity(uniformLineLayout(4, 0.01), [1, 0, 0], 2.99792458e9).directivity; // ≈ 15.50 (mpmath: 15.4961)
 * ```
 * @category Pattern
 */
export function maximumDirectivity(layout: ArrayLayout, direction: Vector3, frequencyHz: number, options: IsotropicNoiseOptions = {}): MaximumDirectivityResult {
  assertUnitVector('direction', direction);
  const r = isotropicNoiseMatrix(layout, frequencyHz, options);
  const element = options.element ?? { kind: 'isotropic' };
  const f0 = elementFactorAt(element, direction[0], direction[1], direction[2]);
  const a = steeringVector(layout, direction, frequencyHz);
  const chol = choleskyFactor(r);
  if (!chol.positiveDefinite) {
    throw new NotPositiveDefiniteError(`invalid argument "layout": its isotropic-noise matrix is singular (pivot ${chol.failedPivot}): coincident or disabled elements leave no unique maximum-directivity weights; remove them.`, chol.failedPivot);
  }
  const w = choleskySolve(chol, a);
  let q = 0;
  for (let i = 0; i < layout.count; i++) q += a.data[2 * i] * w.data[2 * i] + a.data[2 * i + 1] * w.data[2 * i + 1];
  for (let i = 0; i < w.data.length; i++) w.data[i] /= q;
  const d = f0 * f0 * q;
  return { directivity: d, directivityDb: 10 * Math.log10(d), weights: w, isotropicNoise: r };
}
