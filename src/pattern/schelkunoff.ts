/**
 * Schelkunoff (polynomial) representation of a uniformly spaced linear array.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { polynomialFromRoots, polynomialRoots } from '../linalg/roots.js';
import { assertColumn, assertFinite, assertFiniteArray, assertFiniteCMatrix, assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * The array polynomial's coefficients cₙ = conj(wₙ)·e^{−jnβ}, n = 0…N−1,
 * returned highest power first for the root finder.
 */
function coefficientsFromWeights(weights: CMatrix, beta: number): CMatrix {
  const n = weights.rows, data = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const wr = weights.data[2 * i], wi = -weights.data[2 * i + 1];
    const c = Math.cos(-i * beta), s = Math.sin(-i * beta);
    const o = 2 * (n - 1 - i);
    data[o] = wr * c - wi * s;
    data[o + 1] = wr * s + wi * c;
  }
  return matrixView(n, 1, data);
}

/**
 * Zeros of the Schelkunoff polynomial of a linear array.
 *
 * @remarks
 * Elements at xₙ = n·d (n = 0…N−1) along the array axis, γ the angle from that
 * axis. With steering aₙ = exp(+j k n d cosγ) and AF = wᴴa (docs/conventions.md),
 * AF(γ) = Σₙ cₙ ζⁿ with ζ = exp(jψ), ψ = k d cosγ + β and cₙ = conj(wₙ)·e^{−jnβ}
 * (S. A. Schelkunoff, "A mathematical theory of linear arrays", Bell Syst.
 * Tech. J. 22, 1943; C. A. Balanis, *Antenna Theory*, 4th ed., Wiley, 2016,
 * §6.10 — from memory). β is the progressive phase you want to factor out of the
 * weights (β = 0: the weights' own polynomial). A centred array differs only by
 * the constant factor ζ^{−(N−1)/2}, which does not move zeros. Zeros on the
 * unit circle inside the visible arc ({@link schelkunoffVisibleArc}) are pattern nulls.
 * @param weights - N×1 weights, N ≥ 2, leading coefficient conj(w_{N−1}) ≠ 0.
 * @param progressivePhaseRad - β [rad]. @defaultValue 0
 * @returns N−1 zeros ζₘ as an (N−1)×1 column (sorted by argument; from {@link polynomialRoots}).
 * @throws {@link DimensionError} for fewer than two weights; {@link DomainError} for non-finite input or w_{N−1} = 0.
 * @example
 * ```ts
 * schelkunoffZeros(columnVector([1, 1, 1, 1])); // ≈ [−1.000000j, 1.000000j, −1.000000] (4th roots of unity but 1)
 * ```
 * @category Pattern
 */
export function schelkunoffZeros(weights: CMatrix, progressivePhaseRad = 0): CMatrix {
  assertColumn('weights', weights);
  assertFiniteCMatrix('weights', weights);
  assertFinite('progressivePhaseRad', progressivePhaseRad);
  const n = weights.rows;
  if (n < 2) throw new DimensionError(`invalid argument "weights": expected at least 2 elements for an array polynomial, received ${n}.`);
  if (weights.data[2 * (n - 1)] === 0 && weights.data[2 * (n - 1) + 1] === 0) {
    throw new DomainError(`invalid argument "weights": the last weight is zero, so the polynomial has degree < ${n - 1}; remove trailing zero weights.`);
  }
  return polynomialRoots(coefficientsFromWeights(weights, progressivePhaseRad));
}

/**
 * Weights whose Schelkunoff polynomial has the given zeros (the inverse of {@link schelkunoffZeros}).
 *
 * @remarks
 * Builds Π(ζ − ζₘ) = Σ cₙ ζⁿ (monic: c_{N−1} = 1) and returns
 * wₙ = conj(cₙ·e^{jnβ}), so that AF(γ) = Σ cₙ ζⁿ with ζ = exp(j(k d cosγ + β)).
 * @param zeros - (N−1)×1 zeros ζₘ (N − 1 ≥ 1).
 * @param progressivePhaseRad - β [rad]. @defaultValue 0
 * @returns N×1 weights, element n at xₙ = n·d (or centred; see {@link schelkunoffZeros}).
 * @throws {@link DimensionError} for an empty list; {@link DomainError} for non-finite zeros.
 * @category Pattern
 */
export function weightsFromSchelkunoffZeros(zeros: CMatrix, progressivePhaseRad = 0): CMatrix {
  assertColumn('zeros', zeros);
  assertFiniteCMatrix('zeros', zeros);
  assertFinite('progressivePhaseRad', progressivePhaseRad);
  const c = polynomialFromRoots(zeros); // highest power first
  const n = c.rows, data = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const o = 2 * (n - 1 - i);
    const cr = c.data[o], ci = c.data[o + 1];
    const p = i * progressivePhaseRad, cs = Math.cos(p), sn = Math.sin(p);
    // w = conj(c·e^{jnβ})
    data[2 * i] = cr * cs - ci * sn;
    data[2 * i + 1] = -(cr * sn + ci * cs);
  }
  return matrixView(n, 1, data);
}

/**
 * Weights of an N = M + 1 element line array with nulls at M given angles
 * (Schelkunoff zero placement): ζₘ = exp(j(k d cosγₘ + β)).
 * @param nullAnglesRad - Angles γₘ from the array axis [rad], each in [0, π], at least one.
 * @param spacingM - Element spacing d [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param progressivePhaseRad - β [rad]. @defaultValue 0
 * @returns N×1 weights (monic polynomial: |w_{N−1}| = 1).
 * @throws {@link DomainError} for angles outside [0, π], an empty list, or bad spacing/frequency.
 * @example
 * ```ts
 * // d = λ/4, nulls at γ = 0, π/2, π → AF = ζ³ − ζ² + ζ − 1 (Balanis 2016, Example 6.10 — from memory)
 * nullSteeringWeights([0, Math.PI / 2, Math.PI], 0.025, 2.99792458e9); // [−1, 1, −1, 1] (w₀ … w₃)
 * ```
 * @category Pattern
 */
export function nullSteeringWeights(nullAnglesRad: ArrayLike<number>, spacingM: number, frequencyHz: number, progressivePhaseRad = 0): CMatrix {
  if (!nullAnglesRad || typeof nullAnglesRad !== 'object' || nullAnglesRad.length < 1) {
    throw new DomainError(`invalid argument "nullAnglesRad": expected at least one angle, received ${describeValue(nullAnglesRad)}.`);
  }
  assertFiniteArray('nullAnglesRad', nullAnglesRad);
  assertPositive('spacingM', spacingM, 'm');
  assertFinite('progressivePhaseRad', progressivePhaseRad);
  const kd = wavenumberRadPerM(frequencyHz) * spacingM;
  const m = nullAnglesRad.length, z = new Float64Array(2 * m);
  for (let i = 0; i < m; i++) {
    const g = nullAnglesRad[i];
    if (g < 0 || g > Math.PI) throw new DomainError(`invalid argument "nullAnglesRad": entry ${i} is ${g}; angles from the array axis lie in [0, π].`);
    const psi = kd * Math.cos(g) + progressivePhaseRad;
    z[2 * i] = Math.cos(psi);
    z[2 * i + 1] = Math.sin(psi);
  }
  return weightsFromSchelkunoffZeros({ rows: m, cols: 1, data: z }, progressivePhaseRad);
}

/**
 * The visible arc of the unit circle |ζ| = 1 for a spacing and progressive phase.
 * @category Pattern
 */
export interface SchelkunoffArc {
  /** ψ at γ = π (endfire toward −axis): β − kd [rad]. */
  readonly psiStartRad: number;
  /** ψ at γ = 0: β + kd [rad]. */
  readonly psiEndRad: number;
  /** True when the arc spans more than 2π (d > λ/2): parts of the circle are visited twice, so one zero can null two directions and a beam can repeat (grating lobes). */
  readonly overlaps: boolean;
  /** Points ζ = e^{jψ} along the arc, interleaved [re, im], from ψ start to end. */
  readonly points: Float64Array;
}

/**
 * The visible arc ψ ∈ [β − kd, β + kd] of ζ = e^{jψ}, traced as γ goes from π to 0
 * (data for a zero plot: zeros on this arc are pattern nulls; the rest of the
 * circle is invisible).
 * @param spacingM - Spacing d [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param progressivePhaseRad - β [rad]. @defaultValue 0
 * @param pointCount - Number of arc samples, ≥ 2. @defaultValue 181
 * @returns The arc.
 * @throws {@link DomainError} for bad inputs.
 * @category Pattern
 */
export function schelkunoffVisibleArc(spacingM: number, frequencyHz: number, progressivePhaseRad = 0, pointCount = 181): SchelkunoffArc {
  assertPositive('spacingM', spacingM, 'm');
  assertFinite('progressivePhaseRad', progressivePhaseRad);
  assertInteger('pointCount', pointCount, 2, 1e7);
  const kd = wavenumberRadPerM(frequencyHz) * spacingM;
  const a = progressivePhaseRad - kd, b = progressivePhaseRad + kd;
  const points = new Float64Array(2 * pointCount);
  for (let i = 0; i < pointCount; i++) {
    // uniform in γ from π to 0, so the sampling follows the pattern angle
    const g = Math.PI * (1 - i / (pointCount - 1));
    const psi = kd * Math.cos(g) + progressivePhaseRad;
    points[2 * i] = Math.cos(psi);
    points[2 * i + 1] = Math.sin(psi);
  }
  return { psiStartRad: a, psiEndRad: b, overlaps: kd > Math.PI * (1 + 1e-12), points };
}
