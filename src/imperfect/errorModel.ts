/**
 * Random excitation and position errors of an array: the error model, its
 * moments, and the expected (ensemble-average) power pattern in closed form.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteCMatrix, assertPositive, describeValue } from '../internal/validate.js';
import type { RandomStream } from '../internal/random.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { assertDirections, assertUnitVector } from '../geometry/directions.js';

/**
 * Shape of a zero-mean random error: `'gaussian'` (normal) or `'uniform'`
 * (flat on [−√3·rms, √3·rms], so that its standard deviation is `rms`).
 * @category Imperfect
 */
export type ErrorDistribution = 'gaussian' | 'uniform';

/**
 * One zero-mean random error: its distribution and standard deviation.
 * @category Imperfect
 */
export interface RandomDeviation {
  /** Distribution of the error. */
  readonly distribution: ErrorDistribution;
  /** Standard deviation (unit set by the field that holds it), ≥ 0. */
  readonly rms: number;
}

/**
 * Errors shared by every element of one subarray (fully correlated inside a
 * subarray, independent between subarrays), e.g. one amplifier or one phase
 * shifter per subarray.
 * @category Imperfect
 */
export interface SubarrayErrors {
  /** Subarray index of each element, length N, integers 0…S−1. */
  readonly index: ArrayLike<number>;
  /** Relative amplitude error δ (dimensionless; gain factor 1 + δ). @defaultValue none */
  readonly amplitude?: RandomDeviation;
  /** Phase error [rad]. @defaultValue none */
  readonly phaseRad?: RandomDeviation;
}

/**
 * Random element-position errors, independent per axis and element.
 * @category Imperfect
 */
export interface PositionErrors {
  /** Distribution of each coordinate's error. */
  readonly distribution: ErrorDistribution;
  /** Standard deviation per axis [σx, σy, σz] [m], each ≥ 0. */
  readonly rms: Vector3;
}

/**
 * Random errors of an array's channels and element positions. Every error is
 * zero-mean and independent of every other; a channel's complex gain is
 * g = (1 + δ)·e^{jφ} times, for position errors Δr, the extra path phase
 * e^{j k r̂·Δr} in direction r̂ (docs/conventions.md: steering e^{+jk r̂·r}).
 * @category Imperfect
 */
export interface RandomErrorModel {
  /** Element-level relative amplitude error δ (dimensionless). @defaultValue none */
  readonly amplitude?: RandomDeviation;
  /** Element-level phase error φ [rad]. @defaultValue none */
  readonly phaseRad?: RandomDeviation;
  /** Element position error, one standard deviation per axis x, y, z [m]. @defaultValue none */
  readonly positionM?: PositionErrors;
  /** Errors correlated within subarrays. @defaultValue none */
  readonly subarray?: SubarrayErrors;
}

/**
 * First and second moments of one channel's complex error factor g, as they
 * enter the expected pattern (see {@link expectedErrorPattern}).
 * @category Imperfect
 */
export interface ErrorMoments {
  /** |E g_element|² in the given direction (dimensionless, ≤ 1). */
  readonly elementCoherent: number;
  /** E|g_element|² = 1 + σ_δ² (dimensionless). */
  readonly elementPower: number;
  /** |E g_subarray|² (dimensionless, 1 without subarray errors). */
  readonly subarrayCoherent: number;
  /** E|g_subarray|² (dimensionless, 1 without subarray errors). */
  readonly subarrayPower: number;
}

function assertDeviation(name: string, d: RandomDeviation | undefined, unit: string): void {
  if (d === undefined) return;
  if (d === null || typeof d !== 'object' || (d.distribution !== 'gaussian' && d.distribution !== 'uniform')) {
    throw new DomainError(`invalid argument "${name}": expected { distribution: 'gaussian' | 'uniform', rms }, received ${describeValue(d)}.`);
  }
  if (!Number.isFinite(d.rms) || d.rms < 0) {
    throw new DomainError(`invalid argument "${name}.rms": expected a finite standard deviation ≥ 0${unit}, received ${describeValue(d.rms)}.`);
  }
}

/**
 * Validates a {@link RandomErrorModel} against an array of `count` elements and
 * returns the number of subarrays (0 without subarray errors).
 * @internal
 */
export function assertErrorModel(name: string, model: RandomErrorModel, count: number): number {
  if (model === null || typeof model !== 'object') {
    throw new DomainError(`invalid argument "${name}": expected an error model object, received ${describeValue(model)}.`);
  }
  assertDeviation(`${name}.amplitude`, model.amplitude, '');
  assertDeviation(`${name}.phaseRad`, model.phaseRad, ' rad');
  if (model.positionM !== undefined) {
    const p = model.positionM;
    assertDeviation(`${name}.positionM`, { distribution: p?.distribution, rms: 0 }, ' m');
    if (!Array.isArray(p.rms) || p.rms.length !== 3 || p.rms.some((s) => !Number.isFinite(s) || s < 0)) {
      throw new DomainError(`invalid argument "${name}.positionM.rms": expected [σx, σy, σz] finite and ≥ 0 [m], received ${describeValue(p.rms)}.`);
    }
  }
  const s = model.subarray;
  if (s === undefined) return 0;
  assertDeviation(`${name}.subarray.amplitude`, s.amplitude, '');
  assertDeviation(`${name}.subarray.phaseRad`, s.phaseRad, ' rad');
  if (!s.index || s.index.length !== count) {
    throw new DimensionError(`invalid argument "${name}.subarray.index": expected ${count} subarray indices (one per element), received ${describeValue(s.index)}.`);
  }
  let max = -1;
  for (let n = 0; n < count; n++) {
    const v = s.index[n];
    if (!Number.isInteger(v) || v < 0) {
      throw new DomainError(`invalid argument "${name}.subarray.index": entry ${n} must be an integer ≥ 0, received ${describeValue(v)}.`);
    }
    if (v > max) max = v;
  }
  return max + 1;
}

/** E[e^{jx}] of a zero-mean error with standard deviation σ (real: the distributions are symmetric). */
function characteristic(d: ErrorDistribution, sigma: number): number {
  if (sigma === 0) return 1;
  if (d === 'gaussian') return Math.exp(-0.5 * sigma * sigma);
  const a = Math.sqrt(3) * sigma;
  return Math.sin(a) / a;
}

/**
 * Moments of the error factors of {@link RandomErrorModel} in direction r̂.
 *
 * @remarks
 * Phase: E e^{jφ} = e^{−σ²/2} (Gaussian) or sin(√3σ)/(√3σ) (uniform, half-width √3σ).
 * Position: the phase k r̂·Δr, one such factor per axis with σ = k σ_axis |r̂_axis|.
 * Amplitude: E(1 + δ) = 1, E(1 + δ)² = 1 + σ_δ². These are the moments of
 * J. Ruze, "Antenna tolerance theory — a review", Proc. IEEE 54(4), 1966,
 * Sect. II (from memory).
 * @param model - The error model.
 * @param direction - Unit vector r̂ (position errors only).
 * @param wavenumberRadPerM - k [rad/m] (position errors only).
 * @returns The moments.
 * @internal
 */
export function errorMoments(model: RandomErrorModel, direction: Vector3, wavenumberRadPerM: number): ErrorMoments {
  let ce = 1;
  if (model.phaseRad) ce *= characteristic(model.phaseRad.distribution, model.phaseRad.rms);
  if (model.positionM) {
    for (let a = 0; a < 3; a++) ce *= characteristic(model.positionM.distribution, wavenumberRadPerM * model.positionM.rms[a] * Math.abs(direction[a]));
  }
  const ae = model.amplitude?.rms ?? 0;
  const s = model.subarray;
  const cs = s?.phaseRad ? characteristic(s.phaseRad.distribution, s.phaseRad.rms) : 1;
  const as = s?.amplitude?.rms ?? 0;
  return { elementCoherent: ce * ce, elementPower: 1 + ae * ae, subarrayCoherent: cs * cs, subarrayPower: 1 + as * as };
}

/**
 * Draws one realisation of the element error factors g_n (complex, N×1 into
 * `out`, interleaved) for the excitation errors of `model` (not positions).
 * @internal
 */
export function drawChannelErrors(out: Float64Array, model: RandomErrorModel, count: number, subarrays: number, rng: RandomStream, work: Float64Array): void {
  const draw = (d: RandomDeviation | undefined): number => {
    if (!d || d.rms === 0) return 0;
    return d.distribution === 'gaussian' ? d.rms * rng.nextNormal() : d.rms * Math.sqrt(3) * (2 * rng.nextFloat64() - 1);
  };
  if (subarrays > 0) {
    const s = model.subarray as SubarrayErrors;
    for (let k = 0; k < subarrays; k++) {
      const amp = 1 + draw(s.amplitude), ph = draw(s.phaseRad);
      work[2 * k] = amp * Math.cos(ph);
      work[2 * k + 1] = amp * Math.sin(ph);
    }
  }
  for (let n = 0; n < count; n++) {
    const amp = 1 + draw(model.amplitude), ph = draw(model.phaseRad);
    let re = amp * Math.cos(ph), im = amp * Math.sin(ph);
    if (subarrays > 0) {
      const k = (model.subarray as SubarrayErrors).index[n];
      const sr = work[2 * k], si = work[2 * k + 1];
      const r2 = re * sr - im * si;
      im = re * si + im * sr;
      re = r2;
    }
    out[2 * n] = re;
    out[2 * n + 1] = im;
  }
}

/**
 * Draws one realisation of the element positions with position errors (length 3N).
 * @internal
 */
export function drawPositions(out: Float64Array, nominal: Float64Array, model: RandomErrorModel, rng: RandomStream): void {
  const p = model.positionM;
  for (let i = 0; i < nominal.length; i++) {
    let e = 0;
    if (p) {
      const s = p.rms[i % 3];
      if (s > 0) e = p.distribution === 'gaussian' ? s * rng.nextNormal() : s * Math.sqrt(3) * (2 * rng.nextFloat64() - 1);
    }
    out[i] = nominal[i] + e;
  }
}

/**
 * Expected power pattern E|AF(r̂)|² of an array with random errors, in closed form.
 *
 * @remarks
 * With the realised array factor AF(r̂) = Σₙ conj(wₙ) gₙ(r̂) e^{jk r̂·rₙ}
 * (docs/conventions.md) and gₙ = g^e_n · g^s_{s(n)} (element and subarray factors,
 * independent, zero-mean errors), the ensemble average is
 *
 * E|AF|² = |c_e c_s|² |AF₀|² + |c_e|² (m_s − |c_s|²) Σ_s |AF_s|² + (m_e − |c_e|²) m_s Σₙ |wₙ|²,
 *
 * c = E g, m = E|g|², AF₀ the error-free pattern and AF_s the pattern of
 * subarray s alone. Without subarray errors this is the classical result
 * E|AF|² = |c|²|AF₀|² + (m − |c|²)Σ|wₙ|²: the error-free pattern scaled by
 * e^{−σ²} plus a direction-independent incoherent floor (J. Ruze, "Antenna
 * tolerance theory — a review", Proc. IEEE 54(4), 1966, eq. for the average
 * pattern; R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, Sect. 7.x
 * "random errors" (from memory)). The subarray term is the correlated-error
 * result discussed by R. J. Mailloux, *Phased Array Antenna Handbook*, 3rd ed.,
 * Artech House, 2017, ch. on array errors (from memory).
 * @param layout - Nominal element positions [m].
 * @param weights - Beamformer weights w, N×1 (dimensionless).
 * @param directions - M unit vectors r̂, xyz-interleaved.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param model - The random errors.
 * @returns E|AF(r̂ₘ)|², length M (dimensionless, the normalisation of {@link arrayFactor}, squared).
 * @throws {@link DimensionError} for mismatched weights or subarray indices; {@link DomainError} for bad values.
 * @example
 * ```ts
 * // 16 elements, uniform weights, 0.1 rad rms phase error: floor at 16·(1 − e^{−0.01})
 * const layout = uniformLineLayout(16, 0.05);
 * const w = columnVector(new Array(16).fill(1));
 * expectedErrorPattern(layout, w, Float64Array.of(0, 0, 1), 3e9, { phaseRad: { distribution: 'gaussian', rms: 0.1 } })[0]; // ≈ 253.6
 * ```
 * @category Imperfect
 */
export function expectedErrorPattern(layout: ArrayLayout, weights: CMatrix, directions: Float64Array, frequencyHz: number, model: RandomErrorModel): Float64Array {
  assertLayout('layout', layout);
  assertWeights(weights, layout.count);
  assertDirections('directions', directions);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const subarrays = assertErrorModel('model', model, layout.count);
  const k = wavenumberRadPerM(frequencyHz);
  const n = layout.count, p = layout.positionsM, w = weights.data;
  const m = directions.length / 3;
  const out = new Float64Array(m);
  let sumW2 = 0;
  for (let i = 0; i < n; i++) sumW2 += w[2 * i] ** 2 + w[2 * i + 1] ** 2;
  const subRe = new Float64Array(Math.max(subarrays, 1)), subIm = new Float64Array(Math.max(subarrays, 1));
  for (let j = 0; j < m; j++) {
    const r: Vector3 = [directions[3 * j], directions[3 * j + 1], directions[3 * j + 2]];
    const mo = errorMoments(model, r, k);
    let re = 0, im = 0;
    subRe.fill(0); subIm.fill(0);
    for (let i = 0; i < n; i++) {
      const ph = k * (r[0] * p[3 * i] + r[1] * p[3 * i + 1] + r[2] * p[3 * i + 2]);
      const c = Math.cos(ph), s = Math.sin(ph), wr = w[2 * i], wi = -w[2 * i + 1];
      const tr = wr * c - wi * s, ti = wr * s + wi * c;
      re += tr; im += ti;
      if (subarrays > 0) {
        const q = (model.subarray as SubarrayErrors).index[i];
        subRe[q] += tr; subIm[q] += ti;
      }
    }
    let sumSub = 0;
    if (subarrays > 0) for (let q = 0; q < subarrays; q++) sumSub += subRe[q] ** 2 + subIm[q] ** 2;
    out[j] = mo.elementCoherent * mo.subarrayCoherent * (re * re + im * im)
      + mo.elementCoherent * (mo.subarrayPower - mo.subarrayCoherent) * sumSub
      + (mo.elementPower - mo.elementCoherent) * mo.subarrayPower * sumW2;
  }
  return out;
}

/**
 * Closed-form figures of an array with random errors (see {@link randomErrorFigures}).
 * @category Imperfect
 */
export interface RandomErrorFigures {
  /** Expected peak power over error-free peak power, E|AF(r̂₀)|²/|AF₀(r̂₀)|² (dimensionless). */
  readonly peakPowerRatio: number;
  /** Expected directivity over error-free directivity (dimensionless, ≤ 1 for small errors): peakPowerRatio / (m_e m_s). */
  readonly directivityRatio: number;
  /** −10·log10(directivityRatio) [dB] (positive = loss). */
  readonly directivityLossDb: number;
  /** Element-level incoherent sidelobe floor relative to the error-free peak power (dimensionless): (m_e − |c_e|²) m_s Σ|w|² / |AF₀(r̂₀)|². */
  readonly sidelobeFloor: number;
  /** 10·log10(sidelobeFloor) [dB]. */
  readonly sidelobeFloorDb: number;
  /** Taper efficiency η_T = |Σ wₙ|² / (N Σ|wₙ|²) (dimensionless) of the weights' magnitudes. */
  readonly taperEfficiency: number;
}

/** @internal */
export function assertWeights(weights: CMatrix, count: number): void {
  if (!weights || weights.rows !== count || weights.cols !== 1) {
    throw new DimensionError(`invalid argument "weights": expected ${count}×1 (one weight per element), received ${weights ? `${weights.rows}×${weights.cols}` : describeValue(weights)}.`);
  }
  assertFiniteCMatrix('weights', weights);
}

/**
 * Expected directivity loss and mean sidelobe floor of an array with random
 * errors, from {@link expectedErrorPattern} at the beam direction.
 *
 * @remarks
 * Directivity is taken as |AF(r̂₀)|² / Σₙ|wₙ gₙ|² (elements mutually orthogonal in
 * radiated power, the assumption of Ruze's tolerance theory: e.g. a λ/2 lattice
 * of isotropic radiators along a line); its expectation ratio is
 * D/D₀ = E|AF(r̂₀)|² / (|AF₀(r̂₀)|² · E|g|²) = e^{−σ_φ²}/(1 + σ_δ²) + O(1/N) for
 * uncorrelated Gaussian errors ≈ 1/(1 + σ_δ² + σ_φ²) for small errors
 * (J. Ruze, Proc. IEEE 54(4), 1966; R. C. Hansen, *Phased Array Antennas*,
 * 2nd ed., Wiley, 2009, ch. 7 (from memory)). The mean sidelobe floor relative
 * to the peak, for uncorrelated errors, is (1 + σ_δ² − |c|²)Σ|wₙ|²/|Σwₙ|² ≈
 * σ²/(η_T N) with σ² = σ_δ² + σ_φ² (the same sources; R. J. Mailloux,
 * *Phased Array Antenna Handbook*, 3rd ed., 2017, "average sidelobe level"
 * (from memory)). Subarray-correlated errors add a floor shaped like the sum of
 * the subarray patterns; evaluate it with {@link expectedErrorPattern}.
 * @param layout - Nominal element positions [m].
 * @param weights - Weights w, N×1, pointing the beam at `steering`.
 * @param steering - Beam direction r̂₀ (unit vector).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param model - The random errors.
 * @returns The figures.
 * @throws {@link DomainError} if the error-free pattern vanishes at r̂₀; as {@link expectedErrorPattern} otherwise.
 * @example
 * ```ts
 * const layout = uniformLineLayout(100, 0.05);
 * const w = columnVector(new Array(100).fill(1));
 * const f = randomErrorFigures(layout, w, [0, 0, 1], 3e9, { amplitude: { distribution: 'gaussian', rms: 0.1 }, phaseRad: { distribution: 'gaussian', rms: 0.1 } });
 * // f.sidelobeFloorDb = −37.001, f.directivityLossDb = 0.08577
 * ```
 * @category Imperfect
 */
export function randomErrorFigures(layout: ArrayLayout, weights: CMatrix, steering: Vector3, frequencyHz: number, model: RandomErrorModel): RandomErrorFigures {
  assertUnitVector('steering', steering);
  const dir = Float64Array.from(steering);
  const expected = expectedErrorPattern(layout, weights, dir, frequencyHz, model)[0];
  const ideal = expectedErrorPattern(layout, weights, dir, frequencyHz, {})[0];
  if (!(ideal > 0)) {
    throw new DomainError(`invalid argument "weights": the error-free pattern vanishes at the steering direction (|AF₀(r̂₀)|² = ${ideal}); point the weights at "steering".`);
  }
  const mo = errorMoments(model, steering, wavenumberRadPerM(frequencyHz));
  const w = weights.data, n = layout.count;
  let sumW2 = 0, sumAbs = 0;
  for (let i = 0; i < n; i++) {
    const a2 = w[2 * i] ** 2 + w[2 * i + 1] ** 2;
    sumW2 += a2;
    sumAbs += Math.sqrt(a2);
  }
  const peakPowerRatio = expected / ideal;
  const directivityRatio = peakPowerRatio / (mo.elementPower * mo.subarrayPower);
  const sidelobeFloor = ((mo.elementPower - mo.elementCoherent) * mo.subarrayPower * sumW2) / ideal;
  return {
    peakPowerRatio, directivityRatio, directivityLossDb: -10 * Math.log10(directivityRatio),
    sidelobeFloor, sidelobeFloorDb: 10 * Math.log10(sidelobeFloor), taperEfficiency: (sumAbs * sumAbs) / (n * sumW2),
  };
}
