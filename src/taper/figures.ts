/**
 * Pattern figures of a line taper, computed from the achieved array pattern.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { layoutDiameterM, assertLayout, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { assertFiniteArray, assertPositive, describeValue } from '../internal/validate.js';
import { isotropicDirectivity } from '../pattern/directivity.js';
import { patternEvaluator } from '../pattern/evaluator.js';
import { fromParts, type CMatrix } from '../linalg/cmatrix.js';
import { cutFigures } from '../pattern/cutFigures.js';
import { linearArrayField, linearArrayFigures } from '../pattern/linearArray.js';
import { wavelengthM } from '../units/convert.js';
import { taperEfficiency, weightSums, type TaperWeights } from './efficiency.js';
import { displayable } from '../display/attach.js';

/**
 * Options of {@link lineTaperFigures}.
 * @category Tapers
 */
export interface LineTaperFiguresOptions {
  /**
   * `'sum'` for a beam with its peak on the main lobe, `'difference'` for an antisymmetric
   * (monopulse) taper with a broadside null: its figures are taken on θ ∈ [0, π/2], where the
   * difference lobe is the main lobe.
   * @defaultValue `'sum'`
   */
  kind?: 'sum' | 'difference';
  /**
   * Samples of the θ cut (each lobe needs several).
   * @defaultValue max(4001, ⌈12π N d/λ⌉)
   */
  samples?: number;
}

/**
 * Figures of a taper on a uniform line of isotropic elements.
 * @category Tapers
 */
export interface LineTaperFigures {
  /** Taper efficiency |Σw|²/(N Σ|w|²) from the weights alone [dimensionless]. */
  readonly efficiency: number;
  /** Directivity toward the peak, exact for isotropic elements [dimensionless, linear]. */
  readonly directivity: number;
  /** 10·log₁₀(D_uniform / D_taper), both toward broadside-scanned peaks, exact [dB, power ratio]. */
  readonly directivityLossDb: number;
  /** Half-power beamwidth in θ [rad], or undefined if not inside the cut. */
  readonly halfPowerWidthRad: number | undefined;
  /** Half-power width over that of the uniform taper of the same line (sum patterns) [dimensionless]. */
  readonly beamBroadening: number | undefined;
  /** Achieved peak sidelobe relative to the main-lobe peak, negative [dB, power ratio]. */
  readonly peakSidelobeDb: number | undefined;
  /** θ of the main-lobe peak [rad from broadside]. */
  readonly peakThetaRad: number;
  /** First nulls either side of the main lobe [rad from broadside]; for difference patterns [0 (the broadside null), outer null]. */
  readonly firstNullsRad: readonly [number | undefined, number | undefined];
}

/**
 * Achieved pattern figures of a line taper: directivity loss, beam broadening, peak sidelobe
 * and first nulls, computed from the array pattern (not assumed from the design).
 *
 * @remarks
 * The pattern is the xz-plane cut AF(θ) = wᴴa of the pattern module
 * (elements at xₙ = (n − (N−1)/2)d, θ from broadside; docs/conventions.md), analysed by its
 * cut-figure routine; directivities are the module's exact closed form for isotropic
 * elements. Beam broadening compares half-power widths with the uniform taper of the same N
 * and d. At d = λ/2 the directivity loss equals −10·log₁₀(efficiency) exactly.
 *
 * References:
 * - R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, ch. 3 (taper figures) (from memory).
 *
 * @param weights - N real weights or an N×1 complex vector, N ≥ 2 [dimensionless].
 * @param spacingM - Element spacing d [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Sum or difference pattern; cut sampling.
 * @returns The figures.
 * @throws {@link DomainError} / {@link DimensionError} for bad weights, spacing, frequency or options.
 * @example
 * ```ts
 * lineTaperFigures(taylorTaper(32, 30, 5).weights, 0.15, 1e9).peakSidelobeDb; // ≈ −30
 * ```
 * @category Tapers
 */
export function lineTaperFigures(weights: TaperWeights, spacingM: number, frequencyHz: number, options: LineTaperFiguresOptions = {}): LineTaperFigures {
  const sums = weightSums('weights', weights);
  if (sums.count < 2) throw new DomainError(`invalid argument "weights": a line needs N ≥ 2 elements for pattern figures, received N = ${sums.count}.`);
  const kind = options.kind ?? 'sum';
  if (kind !== 'sum' && kind !== 'difference') {
    throw new DomainError(`invalid option "kind": expected 'sum' or 'difference', received ${describeValue(kind)}.`);
  }
  assertPositive('spacingM', spacingM, 'm');
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const n = sums.count;
  const w: CMatrix = weights instanceof Float64Array ? fromParts(weights, null, n) : weights;
  const samples = options.samples ?? Math.max(4001, Math.ceil((12 * Math.PI * n * spacingM) / wavelengthM(frequencyHz)));
  const full = linearArrayFigures(w, spacingM, frequencyHz, { samples });
  const uniform = linearArrayFigures(fromParts(new Float64Array(n).fill(1), null, n), spacingM, frequencyHz, { samples });
  const figs = kind === 'sum' ? full : cutFigures(linearArrayField(w, spacingM, frequencyHz), 0, Math.PI / 2, { samples: Math.ceil(samples / 2) });
  const firstNullsRad: [number | undefined, number | undefined] = kind === 'sum' ? [figs.firstNullAt[0], figs.firstNullAt[1]] : [0, figs.firstNullAt[1]];
  return displayable<LineTaperFigures>({
    efficiency: taperEfficiency(weights),
    directivity: full.directivity,
    directivityLossDb: 10 * Math.log10(uniform.directivity / full.directivity),
    halfPowerWidthRad: kind === 'sum' ? figs.halfPowerWidth : undefined,
    beamBroadening: kind === 'sum' && figs.halfPowerWidth !== undefined && uniform.halfPowerWidth !== undefined ? figs.halfPowerWidth / uniform.halfPowerWidth : undefined,
    peakSidelobeDb: figs.peakSidelobeDb,
    peakThetaRad: figs.peakAt,
    firstNullsRad,
  }, 'LineTaperFigures');
}

/**
 * Options of {@link planarTaperFigures}.
 * @category Tapers
 */
export interface PlanarTaperFiguresOptions {
  /**
   * Azimuths φ of the pattern cuts [rad].
   * @defaultValue [0, π/4, π/2]
   */
  cutsPhiRad?: readonly number[];
  /**
   * Samples per cut over θ ∈ [−π/2, π/2].
   * @defaultValue max(4001, ⌈12π D/λ⌉), D the layout's largest extent
   */
  samples?: number;
}

/**
 * Figures of a taper on a planar layout, broadside beam.
 * @category Tapers
 */
export interface PlanarTaperFigures {
  /** Taper efficiency |Σw|²/(N Σ|w|²) from the weights alone [dimensionless]. */
  readonly efficiency: number;
  /** Exact isotropic-element directivity toward +z [dimensionless, linear]. */
  readonly directivity: number;
  /** 10·log₁₀(D_uniform / D_taper) toward +z, exact for isotropic elements [dB, power ratio]. */
  readonly directivityLossDb: number;
  /** Highest peak sidelobe over the cuts, negative [dB, power ratio], or undefined. */
  readonly peakSidelobeDb: number | undefined;
  /** Per cut (same order as the options): half-power width over that of uniform weights [dimensionless]. */
  readonly beamBroadening: readonly (number | undefined)[];
  /** Per cut: achieved peak sidelobe [dB, power ratio]. */
  readonly cutPeakSidelobeDb: readonly (number | undefined)[];
  /** Per cut: first nulls either side of the beam, θ signed along the cut [rad]. */
  readonly cutFirstNullsRad: readonly (readonly [number | undefined, number | undefined])[];
}

/**
 * Achieved pattern figures of a taper on any planar layout (broadside beam): directivity loss,
 * beam broadening, peak sidelobe and first nulls in a set of φ cuts.
 *
 * @remarks
 * Pattern by the pattern module's evaluator (AF = wᴴa, docs/conventions.md), cut figures by
 * its cut routine with θ signed along the cut (θ < 0 is the φ + π half-plane); directivities by
 * its exact isotropic-element closed form, for the taper and for uniform weights on the same
 * layout. Sidelobes between the cuts are not searched: for a full 2-D search use the pattern
 * module's u-v figures.
 *
 * @param layout - Element positions (geometry module).
 * @param weights - N real weights or an N×1 complex vector [dimensionless].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Cut azimuths and sampling.
 * @returns The figures.
 * @throws {@link DimensionError} / {@link DomainError} for bad layouts, weights, frequency or options.
 * @category Tapers
 */
export function planarTaperFigures(layout: ArrayLayout, weights: TaperWeights, frequencyHz: number, options: PlanarTaperFiguresOptions = {}): PlanarTaperFigures {
  assertLayout('layout', layout);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const sums = weightSums('weights', weights);
  if (sums.count !== layout.count) {
    throw new DimensionError(`invalid argument "weights": expected ${layout.count} weights (one per element of "layout"), received ${sums.count}.`);
  }
  const cuts = options.cutsPhiRad ?? [0, Math.PI / 4, Math.PI / 2];
  assertFiniteArray('options.cutsPhiRad', cuts);
  const w: CMatrix = weights instanceof Float64Array ? fromParts(weights, null, sums.count) : weights;
  const ones = fromParts(new Float64Array(layout.count).fill(1), null, layout.count);
  const samples = options.samples ?? Math.max(4001, Math.ceil((12 * Math.PI * layoutDiameterM(layout)) / wavelengthM(frequencyHz)));
  const zenith: Vector3 = [0, 0, 1];
  const dTaper = isotropicDirectivity(layout, w, zenith, frequencyHz);
  const dUniform = isotropicDirectivity(layout, ones, zenith, frequencyHz);
  const evTaper = patternEvaluator(layout, w, frequencyHz);
  const evUniform = patternEvaluator(layout, ones, frequencyHz);
  const beamBroadening: (number | undefined)[] = [];
  const cutPeakSidelobeDb: (number | undefined)[] = [];
  const cutFirstNullsRad: (readonly [number | undefined, number | undefined])[] = [];
  let peakSidelobeDb: number | undefined;
  for (const phi of cuts) {
    const c = Math.cos(phi), s = Math.sin(phi);
    const cutOf = (ev: typeof evTaper) => cutFigures((th) => ev.magnitudeAt(Math.sin(th) * c, Math.sin(th) * s, Math.cos(th)), -Math.PI / 2, Math.PI / 2, { samples });
    const ft = cutOf(evTaper);
    const fu = cutOf(evUniform);
    beamBroadening.push(ft.halfPowerWidth !== undefined && fu.halfPowerWidth !== undefined ? ft.halfPowerWidth / fu.halfPowerWidth : undefined);
    cutPeakSidelobeDb.push(ft.peakSidelobeDb);
    cutFirstNullsRad.push(ft.firstNullAt);
    if (ft.peakSidelobeDb !== undefined) peakSidelobeDb = Math.max(peakSidelobeDb ?? -Infinity, ft.peakSidelobeDb);
  }
  return displayable<PlanarTaperFigures>({
    efficiency: taperEfficiency(weights),
    directivity: dTaper,
    directivityLossDb: 10 * Math.log10(dUniform / dTaper),
    peakSidelobeDb,
    beamBroadening,
    cutPeakSidelobeDb,
    cutFirstNullsRad,
  }, 'PlanarTaperFigures');
}
