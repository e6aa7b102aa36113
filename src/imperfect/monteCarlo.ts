/**
 * Seeded Monte Carlo of an array's pattern under random errors, with
 * percentile bands of its sidelobe level and directivity.
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import { RandomStream } from '../internal/random.js';
import { wavelengthM } from '../units/convert.js';
import { assertLayout, layoutDiameterM, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { assertDirections, assertUnitVector } from '../geometry/directions.js';
import { assertGridSpec, rectangularGridLayout, type RectangularGridSpec } from '../geometry/builders.js';
import { arrayFactorInto } from '../pattern/arrayFactor.js';
import { fftGridArrayFactorInto } from '../pattern/gridPaths.js';
import {
  assertErrorModel, assertWeights, drawChannelErrors, drawPositions, type RandomErrorModel,
} from './errorModel.js';

/**
 * Where {@link monteCarloErrorPatterns} evaluates the pattern: an arbitrary
 * direction set (any layout, direct sum), or the natural u-v grid of a uniform
 * rectangular grid by 2-D FFT ({@link fftGridArrayFactor}; only the visible
 * points u² + v² ≤ 1 are used, front hemisphere).
 * @category Imperfect
 */
export type MonteCarloPatternPath = DirectionSetPath | FftGridPath;

/**
 * Pattern on an arbitrary direction set, any layout (direct sum, {@link arrayFactor}).
 * @category Imperfect
 */
export interface DirectionSetPath {
  /** Tag. */
  readonly kind: 'directions';
  /** Nominal element positions [m]. */
  readonly layout: ArrayLayout;
  /** M unit vectors, xyz-interleaved. */
  readonly directions: Float64Array;
}

/**
 * Pattern of a uniform rectangular grid on its natural u-v grid by FFT ({@link fftGridArrayFactor}).
 * @category Imperfect
 */
export interface FftGridPath {
  /** Tag. */
  readonly kind: 'fftGrid';
  /** Counts and spacings of the grid (element index iy·countX + ix). */
  readonly grid: RectangularGridSpec;
  /** FFT length P along u, a power of two ≥ countX. */
  readonly sizeU: number;
  /** FFT length Q along v, a power of two ≥ countY. @defaultValue sizeU */
  readonly sizeV?: number;
}

/**
 * Per-direction 5/50/95 % bands of the relative power.
 * @category Imperfect
 */
export interface PercentileBands {
  /** 5th percentile per direction. */
  readonly p5: Float64Array;
  /** Median per direction. */
  readonly p50: Float64Array;
  /** 95th percentile per direction. */
  readonly p95: Float64Array;
}

/**
 * Options of {@link monteCarloErrorPatterns}.
 * @category Imperfect
 */
export interface MonteCarloOptions {
  /** Number of trials, ≥ 2. @defaultValue 1000 */
  readonly trials?: number;
  /** Seed of the xoshiro128** stream (integer ≥ 0). @defaultValue 1 */
  readonly seed?: number;
  /**
   * Main-lobe radius in direction cosines: directions with √((u − u₀)² + (v − v₀)²) below it
   * are excluded from the sidelobe statistics. @defaultValue 2λ/D (D = layout diameter; common practice, about twice the first-null radius of a uniform aperture)
   */
  readonly mainLobeRadius?: number;
  /** Keep the 5/50/95 % band of the relative power per direction (needs trials·M ≤ 2²⁴ stored values). @defaultValue false */
  readonly bands?: boolean;
}

/**
 * 5th, 50th and 95th percentiles of a per-trial figure, with its mean and the
 * standard error of the mean.
 * @category Imperfect
 */
export interface TrialPercentiles {
  /** 5th percentile. */
  readonly p5: number;
  /** Median. */
  readonly p50: number;
  /** 95th percentile. */
  readonly p95: number;
  /** Sample mean. */
  readonly mean: number;
  /** Standard error of the mean, s/√trials. */
  readonly standardError: number;
}

/**
 * Result of {@link monteCarloErrorPatterns}. Powers are relative to the
 * error-free peak |AF₀(r̂₀)|² (dimensionless); "dB" fields are 10·log10 of them.
 * @category Imperfect
 */
export interface MonteCarloErrorResult {
  /** Number of trials. */
  readonly trials: number;
  /** Directions used, xyz-interleaved (the visible u-v grid points on the FFT path). */
  readonly directions: Float64Array;
  /** 1 where a direction counts as sidelobe region. */
  readonly sidelobeMask: Uint8Array;
  /** Mean over trials of |AF(r̂)|²/|AF₀(r̂₀)|², per direction. */
  readonly meanPower: Float64Array;
  /** Per-trial peak sidelobe power, relative (linear). */
  readonly peakSidelobe: TrialPercentiles;
  /** Per-trial mean sidelobe power over the sidelobe region, relative (linear). */
  readonly meanSidelobe: TrialPercentiles;
  /** Per-trial directivity ratio D/D₀ with D ∝ |AF(r̂₀)|²/Σ|wₙgₙ|² (see {@link randomErrorFigures}). */
  readonly directivityRatio: TrialPercentiles;
  /** Per-direction percentile bands of the relative power (present when `bands` was requested). */
  readonly bands?: PercentileBands;
}

/** Percentile by linear interpolation between order statistics (numpy's default rule). */
function percentile(sorted: Float64Array | Float32Array, q: number): number {
  const pos = q * (sorted.length - 1), lo = Math.floor(pos), hi = Math.ceil(pos);
  return sorted[lo] + (sorted[hi] - sorted[lo]) * (pos - lo);
}

/** @internal Percentiles, mean and standard error of per-trial values (sorts a copy). */
export function trialPercentiles(values: Float64Array): TrialPercentiles {
  const s = Float64Array.from(values).sort();
  let mean = 0;
  for (const v of values) mean += v;
  mean /= values.length;
  let v2 = 0;
  for (const v of values) v2 += (v - mean) ** 2;
  const sd = Math.sqrt(v2 / (values.length - 1));
  return { p5: percentile(s, 0.05), p50: percentile(s, 0.5), p95: percentile(s, 0.95), mean, standardError: sd / Math.sqrt(values.length) };
}

/**
 * Seeded Monte Carlo of the realised pattern of an array with random errors.
 *
 * @remarks
 * Each trial draws the errors of `model` (xoshiro128** stream, see
 * docs/imperfect.md), forms AF(r̂) = Σₙ conj(wₙ) gₙ e^{jk r̂·(rₙ + Δrₙ)}
 * (docs/conventions.md) on the chosen path and records the relative power per
 * direction, the peak and mean sidelobe power and the directivity ratio.
 * Percentiles are by linear interpolation between order statistics. The mean
 * power converges to {@link expectedErrorPattern}/|AF₀(r̂₀)|² (Ruze's average
 * pattern), the directivity ratio to {@link randomErrorFigures}; the
 * `standardError` fields state the Monte Carlo error of each mean. The FFT path
 * needs the weights in grid order (index iy·countX + ix) and supports
 * excitation errors only (position errors break the lattice).
 * @param path - Where to evaluate the pattern.
 * @param weights - Weights w, N×1 (dimensionless).
 * @param steering - Beam direction r̂₀ (unit vector; the reference peak and main-lobe centre).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param model - The random errors.
 * @param options - Trials, seed, main-lobe radius, bands.
 * @returns Means, percentiles and (optionally) per-direction bands.
 * @throws {@link DomainError} for position errors on the FFT path, too many stored band values, an empty sidelobe region or bad values; {@link DimensionError} for mismatched shapes.
 * @example
 * ```ts
 * const layout = uniformLineLayout(32, 0.05);
 * const w = columnVector(new Array(32).fill(1));
 * const cut = unitVectorsFromAngles(evenlySpaced(-1.5, 1.5, 301), new Float64Array(301));
 * const mc = monteCarloErrorPatterns({ kind: 'directions', layout, directions: cut }, w, [0, 0, 1], 3e9,
 *   { phaseRad: { distribution: 'uniform', rms: 0.2 } }, { trials: 200, seed: 7 });
 * mc.trials; // 200
 * ```
 * @category Imperfect
 */
export function monteCarloErrorPatterns(
  path: MonteCarloPatternPath, weights: CMatrix, steering: Vector3, frequencyHz: number, model: RandomErrorModel, options: MonteCarloOptions = {},
): MonteCarloErrorResult {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  assertUnitVector('steering', steering);
  const trials = options.trials ?? 1000, seed = options.seed ?? 1;
  assertInteger('options.trials', trials, 2, 1e7);
  assertInteger('options.seed', seed, 0, Number.MAX_SAFE_INTEGER);
  const lam = wavelengthM(frequencyHz);
  let layout: ArrayLayout, directions: Float64Array, visibleIndex: Int32Array | undefined;
  let P = 0, Q = 0;
  if (path?.kind === 'directions') {
    layout = path.layout;
    assertLayout('path.layout', layout);
    assertDirections('path.directions', path.directions);
    directions = path.directions;
  } else if (path?.kind === 'fftGrid') {
    assertGridSpec('path.grid', path.grid);
    layout = rectangularGridLayout(path.grid);
    P = path.sizeU; Q = path.sizeV ?? path.sizeU;
    for (const [name, size, count] of [['path.sizeU', P, path.grid.countX], ['path.sizeV', Q, path.grid.countY]] as const) {
      assertInteger(name, size, 2, 1 << 24);
      if ((size & (size - 1)) !== 0 || size < count) {
        throw new DomainError(`invalid argument "${name}": expected a power of two ≥ ${Math.max(2, count)}, received ${size}.`);
      }
    }
    if (model?.positionM && model.positionM.rms.some((s) => s > 0)) {
      throw new DomainError('invalid argument "model.positionM": position errors break the lattice the FFT path needs; use the path { kind: \'directions\' }.');
    }
    const dirs: number[] = [], idx: number[] = [];
    const { spacingXM: dx, spacingYM: dy } = path.grid;
    for (let q = 0; q < Q; q++) {
      const v = ((q - Q / 2) * lam) / (Q * dy);
      for (let p = 0; p < P; p++) {
        const u = ((p - P / 2) * lam) / (P * dx), r2 = u * u + v * v;
        if (r2 <= 1) { dirs.push(u, v, Math.sqrt(1 - r2)); idx.push(q * P + p); }
      }
    }
    directions = Float64Array.from(dirs);
    visibleIndex = Int32Array.from(idx);
  } else {
    throw new DomainError(`invalid argument "path": expected { kind: 'directions', layout, directions } or { kind: 'fftGrid', grid, sizeU }, received ${describeValue(path)}.`);
  }
  const n = layout.count;
  assertWeights(weights, n);
  const subarrays = assertErrorModel('model', model, n);
  const m = directions.length / 3;
  const radius = options.mainLobeRadius ?? (2 * lam) / Math.max(layoutDiameterM(layout), lam);
  assertPositive('options.mainLobeRadius', radius);
  const mask = new Uint8Array(m);
  let sideCount = 0;
  for (let j = 0; j < m; j++) {
    const du = directions[3 * j] - steering[0], dv = directions[3 * j + 1] - steering[1];
    if (du * du + dv * dv >= radius * radius) { mask[j] = 1; sideCount++; }
  }
  if (sideCount === 0) {
    throw new DomainError(`invalid argument "options.mainLobeRadius": every direction lies inside the main lobe (radius ${radius}); give more directions or a smaller radius.`);
  }
  if (options.bands && trials * m > 1 << 24) {
    throw new DomainError(`invalid argument "options.bands": trials·directions = ${trials * m} exceeds 2^24 stored values; use fewer trials or a cut of directions.`);
  }
  const store = options.bands ? new Float32Array(trials * m) : undefined;

  const steerDir = Float64Array.from(steering);
  const peak1 = { rows: 1, cols: 1, data: new Float64Array(2) };
  arrayFactorInto(peak1, layout, weights, steerDir, frequencyHz);
  const ideal = peak1.data[0] ** 2 + peak1.data[1] ** 2;
  if (!(ideal > 0)) {
    throw new DomainError('invalid argument "weights": the error-free pattern vanishes at the steering direction; point the weights at "steering".');
  }
  let sumW2 = 0;
  for (let i = 0; i < n; i++) sumW2 += weights.data[2 * i] ** 2 + weights.data[2 * i + 1] ** 2;

  const rng = RandomStream.fromSeed(seed);
  const g = new Float64Array(2 * n), work = new Float64Array(2 * Math.max(subarrays, 1));
  const wt = { rows: n, cols: 1, data: new Float64Array(2 * n) };
  const positions = new Float64Array(3 * n);
  const trialLayout: ArrayLayout = { count: n, positionsM: positions, ...(layout.enabled ? { enabled: layout.enabled } : {}) };
  const hasPosition = !!model.positionM && model.positionM.rms.some((s) => s > 0);
  const af = path.kind === 'fftGrid' ? { rows: Q, cols: P, data: new Float64Array(2 * P * Q) } : { rows: m, cols: 1, data: new Float64Array(2 * m) };
  const meanPower = new Float64Array(m);
  const peakSide = new Float64Array(trials), meanSide = new Float64Array(trials), dirRatio = new Float64Array(trials);
  const d0 = ideal / sumW2;
  for (let t = 0; t < trials; t++) {
    drawChannelErrors(g, model, n, subarrays, rng, work);
    // realised weights w̃ = w ⊙ conj(g), so that conj(w̃ₙ) = conj(wₙ) gₙ
    let sumG2 = 0;
    for (let i = 0; i < n; i++) {
      const wr = weights.data[2 * i], wi = weights.data[2 * i + 1], gr = g[2 * i], gi = -g[2 * i + 1];
      const r = wr * gr - wi * gi, im = wr * gi + wi * gr;
      wt.data[2 * i] = r; wt.data[2 * i + 1] = im;
      sumG2 += r * r + im * im;
    }
    const lay = hasPosition ? (drawPositions(positions, layout.positionsM, model, rng), trialLayout) : layout;
    arrayFactorInto(peak1, lay, wt, steerDir, frequencyHz);
    dirRatio[t] = (peak1.data[0] ** 2 + peak1.data[1] ** 2) / sumG2 / d0;
    let d: Float64Array;
    if (path.kind === 'fftGrid') {
      fftGridArrayFactorInto(af, path.grid, wt, P, Q);
      d = af.data;
    } else {
      arrayFactorInto(af, lay, wt, directions, frequencyHz);
      d = af.data;
    }
    let pk = 0, sum = 0;
    for (let j = 0; j < m; j++) {
      const o = visibleIndex ? 2 * visibleIndex[j] : 2 * j;
      const pw = (d[o] * d[o] + d[o + 1] * d[o + 1]) / ideal;
      meanPower[j] += pw;
      if (store) store[j * trials + t] = pw;
      if (mask[j]) { sum += pw; if (pw > pk) pk = pw; }
    }
    peakSide[t] = pk;
    meanSide[t] = sum / sideCount;
  }
  for (let j = 0; j < m; j++) meanPower[j] /= trials;
  let bands: PercentileBands | undefined;
  if (store) {
    const p5 = new Float64Array(m), p50 = new Float64Array(m), p95 = new Float64Array(m);
    for (let j = 0; j < m; j++) {
      const s = store.subarray(j * trials, (j + 1) * trials).sort();
      p5[j] = percentile(s, 0.05); p50[j] = percentile(s, 0.5); p95[j] = percentile(s, 0.95);
    }
    bands = { p5, p50, p95 };
  }
  return {
    trials, directions, sidelobeMask: mask, meanPower,
    peakSidelobe: trialPercentiles(peakSide), meanSidelobe: trialPercentiles(meanSide), directivityRatio: trialPercentiles(dirRatio),
    ...(bands ? { bands } : {}),
  };
}
