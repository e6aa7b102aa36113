/**
 * Noise (or extended-source signal) correlation from a brightness-temperature
 * distribution by sphere quadrature, in blocks of directions.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { herkLowerKernel, herkLowerWeighted, mirrorLowerToUpper } from '../internal/herk.js';
import { assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import { C0_M_PER_S, ETA0_OHM, K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { displacementStructure, shiftedBrightnessCorrelations, shiftedBrightnessForms } from './displacement.js';
import {
  assertQuadrature, asPatternSource, isPatternSource,
  type PortPatternSource, type QuadratureDirections, type SampledPortPatterns,
} from './patterns.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * Brightness temperature as a function of direction [K] (θ from +z, φ from +x, radians).
 * @category Reception
 */
export type BrightnessFunction = (thetaRad: number, phiRad: number) => number;

/**
 * A brightness temperature [K] per quadrature direction (a map on exactly the
 * quadrature's directions), or a function of direction.
 * @category Reception
 */
export type Brightness = Float64Array | BrightnessFunction;

/**
 * Options of {@link brightnessCorrelation}.
 * @category Reception
 */
export interface BrightnessOptions {
  /**
   * Directions per block; memory for the pattern buffers is 64·N·blockSize bytes.
   * @defaultValue 128
   */
  blockSize?: number;
  /**
   * Which algorithm: `'auto'` takes the displacement path when the source
   * carries a {@link ShiftedElementPattern} and the array has few distinct
   * displacements, `'general'` always sums the N² pattern products.
   * @defaultValue 'auto'
   */
  path?: 'auto' | 'general';
}

/** @internal Resolves the brightness of every direction into a Float64Array, validated. */
export function brightnessValues(name: string, b: Brightness, q: QuadratureDirections): Float64Array {
  const m = q.thetaRad.length;
  let t: Float64Array;
  if (b instanceof Float64Array) {
    if (b.length !== m) {
      throw new DimensionError(`invalid argument "${name}": the brightness map has ${b.length} values but the quadrature has ${m} directions; sample the map on the quadrature's own directions.`);
    }
    t = b;
  } else if (typeof b === 'function') {
    t = new Float64Array(m);
    for (let k = 0; k < m; k++) t[k] = b(q.thetaRad[k], q.phiRad[k]);
  } else {
    throw new DomainError(`invalid argument "${name}": expected a Float64Array map or a function (thetaRad, phiRad) → K, received ${describeValue(b)}.`);
  }
  for (let k = 0; k < m; k++) {
    const v = t[k];
    if (!Number.isFinite(v) || v < 0) {
      throw new DomainError(`invalid argument "${name}": brightness temperature at direction ${k} (θ = ${q.thetaRad[k]} rad, φ = ${q.phiRad[k]} rad) is ${describeValue(v)}; temperatures must be finite and ≥ 0 [K].`);
    }
  }
  return t;
}


/**
 * Correlation matrices E[v vᴴ] at the open-circuit terminals for several
 * brightness distributions, sharing one pass over the pattern blocks.
 *
 * @remarks
 * conventions, "brightness noise": R_mn = (4 k_B B / (η |I₀|²)) ∮ T(r̂) fₘ(r̂)·fₙ*(r̂) dΩ,
 * evaluated as Σₖ wₖ Tₖ (f_θ f_θᴴ + f_φ f_φᴴ)ₖ. Each block of directions is
 * packed, with the columns scaled by √(wₖTₖ) and directions of zero weight
 * skipped, into G = [F_θ F_φ] (N × 2·block) and accumulated as the Hermitian
 * rank-2·block update R += G Gᴴ (lower triangle only, mirrored at the end).
 * Memory: O(N² + N·blockSize) whatever M is.
 * Displacement path: when the source carries a {@link ShiftedElementPattern}
 * (identical elements whose patterns differ only by the phase of their
 * positions) the correlation depends only on dₘ − dₙ; the sums over directions
 * are then formed once per distinct displacement (a product of the x phases and
 * the (y, z) phases of each block of directions) and the N×N matrices are read
 * from that table: O(M·D) instead of O(M·N²) for D distinct displacements
 * (D = O(N) on a lattice). It equals the general path to rounding (tested to
 * 1e-10 on 16-, 61- and 256-element arrays).
 * The same integral with a source's brightness gives the signal correlation of
 * an extended source. Rayleigh–Jeans brightness (unpolarized):
 * J. D. Kraus, *Radio Astronomy*, 2nd ed., Cygnus-Quasar, 1986, §3-11 (from
 * memory); array form: K. F. Warnick, M. A. Jensen, "Optimal noise matching for
 * mutually coupled arrays", IEEE Trans. Antennas Propag. 55(6), 2007 (from memory).
 *
 * @param patterns - Pattern source (or samples on exactly the quadrature's directions).
 * @param quadrature - Directions and solid-angle weights [rad, sr].
 * @param brightnessK - One or more brightness distributions [K] (maps on the quadrature or functions).
 * @param bandwidthHz - Bandwidth B [Hz], > 0.
 * @param options - Block size.
 * @returns One N×N Hermitian matrix [V²] per brightness distribution.
 * @throws {@link DimensionError} for a map of the wrong length or patterns on another grid;
 *   {@link DomainError} for negative or non-finite temperatures or weights.
 * @category Reception
 */
export function brightnessCorrelations(
  patterns: PortPatternSource | SampledPortPatterns,
  quadrature: QuadratureDirections,
  brightnessK: ReadonlyArray<Brightness>,
  bandwidthHz: number,
  options: BrightnessOptions = {},
): CMatrix[] {
  const src = asPatternSource('patterns', patterns);
  const m = assertQuadrature('quadrature', quadrature);
  assertPositive('bandwidthHz', bandwidthHz, 'Hz');
  if (!Array.isArray(brightnessK) || brightnessK.length === 0) {
    throw new DomainError(`invalid argument "brightnessK": expected a non-empty array of brightness maps or functions, received ${describeValue(brightnessK)}.`);
  }
  const block = options.blockSize ?? 128;
  assertInteger('options.blockSize', block, 1, 1 << 20);
  if (!isPatternSource(patterns)) {
    const sp = patterns as SampledPortPatterns;
    if (sp.thetaRad.length !== m) {
      throw new DimensionError(`invalid argument "patterns": sampled at ${sp.thetaRad.length} directions but the quadrature has ${m}; sample the patterns on the quadrature's directions.`);
    }
  }
  const n = src.portCount;
  const maps = brightnessK.map((b, i) => brightnessValues(`brightnessK[${i}]`, b, quadrature));
  const w = quadrature.weightSr;
  const scale = (4 * K_BOLTZMANN_J_PER_K * bandwidthHz) / (ETA0_OHM * src.driveCurrentA * src.driveCurrentA);
  const path = options.path ?? 'auto';
  if (path !== 'auto' && path !== 'general') {
    throw new DomainError(`invalid argument "options.path": expected 'auto' or 'general', received ${describeValue(path)}.`);
  }
  if (path === 'auto' && src.shifted !== undefined) {
    const structure = displacementStructure(src.shifted.offsetsM);
    if (structure !== null) {
      return shiftedBrightnessCorrelations(src.shifted, structure, (2 * Math.PI * src.frequencyHz) / C0_M_PER_S, quadrature, maps, scale);
    }
  }
  const acc = maps.map(() => new Float64Array(2 * n * n));
  const ft = new Float64Array(2 * n * block), fp = new Float64Array(2 * n * block);
  const g = new Float64Array(2 * n * 2 * block);
  const sq = new Float64Array(block), wt = new Float64Array(block);
  const cols = new Int32Array(block);
  for (let start = 0; start < m; start += block) {
    const count = Math.min(block, m - start);
    // skip the pattern evaluation when no map needs this block
    let any = false;
    for (let t = 0; t < maps.length && !any; t++) {
      for (let k = 0; k < count; k++) if (w[start + k] * maps[t][start + k] > 0) { any = true; break; }
    }
    if (!any) continue;
    src.fill(quadrature.thetaRad, quadrature.phiRad, start, count, ft, fp, block);
    for (let t = 0; t < maps.length; t++) {
      const tm = maps[t];
      // SIMD path: weights wₖTₖ applied to one side, F_θ and F_φ read in place
      for (let k = 0; k < count; k++) wt[k] = w[start + k] * tm[start + k];
      if (herkLowerWeighted(n, count, [ft, fp], block, wt, acc[t])) continue;
      let used = 0;
      for (let k = 0; k < count; k++) {
        const v = w[start + k] * tm[start + k];
        if (v > 0) { cols[used] = k; sq[used] = Math.sqrt(v); used++; }
      }
      if (used === 0) continue;
      const ldg = 2 * used;
      for (let i = 0; i < n; i++) {
        const row = 2 * i * ldg, src0 = 2 * i * block;
        for (let u = 0; u < used; u++) {
          const s = sq[u], q = src0 + 2 * cols[u];
          g[row + 2 * u] = s * ft[q]; g[row + 2 * u + 1] = s * ft[q + 1];
          g[row + 2 * (used + u)] = s * fp[q]; g[row + 2 * (used + u) + 1] = s * fp[q + 1];
        }
      }
      herkLowerKernel(n, ldg, g, ldg, acc[t]);
    }
  }
  return acc.map((c) => {
    mirrorLowerToUpper(n, c);
    for (let k = 0; k < c.length; k++) c[k] *= scale;
    return matrixView(n, n, c);
  });
}

/**
 * @internal Re{wₖᴴ R_t wₖ} of the brightness correlations R_t of {@link brightnessCorrelations}
 * for every map t and column k of `weights` (N×K), one Float64Array of K values per map. On
 * the displacement path the matrices are never formed (weights' autocorrelation over the
 * distinct displacements); otherwise the matrices are formed and `forms` evaluates them.
 * No argument checks beyond those of the matrix path.
 */
export function brightnessQuadraticForms(
  src: PortPatternSource, quadrature: QuadratureDirections, maps: ReadonlyArray<Float64Array>, bandwidthHz: number,
  weights: CMatrix, forms: (w: CMatrix, matrices: CMatrix[]) => Float64Array[],
): Float64Array[] {
  if (src.shifted !== undefined) {
    const structure = displacementStructure(src.shifted.offsetsM);
    if (structure !== null) {
      const scale = (4 * K_BOLTZMANN_J_PER_K * bandwidthHz) / (ETA0_OHM * src.driveCurrentA * src.driveCurrentA);
      return shiftedBrightnessForms(src.shifted, structure, (2 * Math.PI * src.frequencyHz) / C0_M_PER_S, quadrature, maps, scale, weights);
    }
  }
  return forms(weights, brightnessCorrelations(src, quadrature, maps, bandwidthHz));
}

/**
 * Correlation matrix E[v vᴴ] at the open-circuit terminals for one brightness
 * distribution (external noise, or the signal of an extended source).
 *
 * @remarks
 * See {@link brightnessCorrelations} for the formula, the blocked algorithm and sources.
 * For a lossless array in an isotropic bath at T the result equals the Twiss
 * matrix 2 k_B T B (Z + Zᴴ) (tested to 1e-9).
 * @param patterns - Pattern source (or samples on exactly the quadrature's directions).
 * @param quadrature - Directions and solid-angle weights [rad, sr].
 * @param brightnessK - Brightness temperature [K]: a map on the quadrature or a function.
 * @param bandwidthHz - Bandwidth B [Hz], > 0.
 * @param options - Block size.
 * @returns N×N Hermitian matrix [V²].
 * @throws {@link DimensionError} / {@link DomainError} as {@link brightnessCorrelations}.
 * @example
 * ```ts fragment
 * const rSky = brightnessCorrelation(source, quad, skyAndGroundBrightness({ skyK: 10, groundK: 290 }), 1e6);
 * ```
 * @category Reception
 */
export function brightnessCorrelation(
  patterns: PortPatternSource | SampledPortPatterns,
  quadrature: QuadratureDirections,
  brightnessK: Brightness,
  bandwidthHz: number,
  options: BrightnessOptions = {},
): CMatrix {
  return brightnessCorrelations(patterns, quadrature, [brightnessK], bandwidthHz, options)[0];
}

/**
 * Uniform brightness T everywhere.
 * @param temperatureK - Brightness temperature [K], ≥ 0.
 * @returns The brightness function.
 * @throws {@link DomainError} for a negative or non-finite temperature.
 * @category Reception
 */
export function isotropicBrightness(temperatureK: number): BrightnessFunction {
  checkTemperature('temperatureK', temperatureK);
  return () => temperatureK;
}

/**
 * Orientation of the local horizon relative to the array's own axes.
 * @category Reception
 */
export interface HorizonOrientation {
  /**
   * Angle between the array's +z axis and the local zenith [rad], in [0, π].
   * @defaultValue 0 (array facing the zenith)
   */
  tiltRad?: number;
  /**
   * Array-frame azimuth toward which the array's +z axis is tipped [rad]; the
   * zenith in array coordinates is (−sinτ cosα, −sinτ sinα, cosτ).
   * @defaultValue 0
   */
  tiltAzimuthRad?: number;
}

/** @internal Returns the zenith unit vector in array coordinates. */
export function zenithInArrayFrame(h: HorizonOrientation = {}): [number, number, number] {
  const tau = h.tiltRad ?? 0, alpha = h.tiltAzimuthRad ?? 0;
  if (!Number.isFinite(tau) || tau < 0 || tau > Math.PI) {
    throw new DomainError(`invalid argument "tiltRad": expected an angle in [0, π] [rad], received ${describeValue(tau)}.`);
  }
  if (!Number.isFinite(alpha)) {
    throw new DomainError(`invalid argument "tiltAzimuthRad": expected a finite angle [rad], received ${describeValue(alpha)}.`);
  }
  return [-Math.sin(tau) * Math.cos(alpha), -Math.sin(tau) * Math.sin(alpha), Math.cos(tau)];
}

/**
 * True for directions above the local horizon (elevation ≥ 0) of a tilted array.
 * @param orientation - Tilt of the array relative to the horizon.
 * @returns The predicate (θ, φ in array coordinates [rad]).
 * @throws {@link DomainError} for a bad tilt.
 * @category Reception
 */
export function aboveHorizon(orientation: HorizonOrientation = {}): (thetaRad: number, phiRad: number) => boolean {
  const [zx, zy, zz] = zenithInArrayFrame(orientation);
  return (th, ph) => {
    const s = Math.sin(th);
    return s * Math.cos(ph) * zx + s * Math.sin(ph) * zy + Math.cos(th) * zz >= 0;
  };
}

/**
 * Options of {@link skyAndGroundBrightness}.
 * @category Reception
 */
export interface SkyGroundOptions extends HorizonOrientation {
  /** Uniform sky brightness above the horizon [K], ≥ 0. */
  skyK: number;
  /** Uniform ground brightness below the horizon [K], ≥ 0 (e.g. 290 K warm ground). */
  groundK: number;
}

/**
 * Uniform sky above the local horizon and uniform warm ground below it, for an
 * array tilted by any angle.
 * @param options - Sky and ground temperatures [K] and the array tilt [rad].
 * @returns The brightness function (array coordinates).
 * @throws {@link DomainError} for negative temperatures or a bad tilt.
 * @category Reception
 */
export function skyAndGroundBrightness(options: SkyGroundOptions): BrightnessFunction {
  checkTemperature('options.skyK', options.skyK);
  checkTemperature('options.groundK', options.groundK);
  const up = aboveHorizon(options);
  return (th, ph) => (up(th, ph) ? options.skyK : options.groundK);
}

/** @internal Throws DomainError unless T is finite and ≥ 0. */
export function checkTemperature(name: string, t: number): void {
  if (typeof t !== 'number' || !Number.isFinite(t) || t < 0) {
    throw new DomainError(`invalid argument "${name}": expected a temperature ≥ 0 [K], received ${describeValue(t)}; temperatures are absolute (kelvin).`);
  }
}
