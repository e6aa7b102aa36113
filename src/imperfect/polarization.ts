/**
 * Dual-polarised arrays: the 2×2 Jones matrix of a beam pair per direction,
 * the intrinsic cross-polarisation ratio and Ludwig-3 cross-polar ratios.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertInteger, describeValue } from '../internal/validate.js';
import { ludwig3Components } from '../element/patternSet.js';
import { samplePatterns, sampledPatternSource, type PortPatternSource, type SampledPortPatterns } from '../reception/patterns.js';
import { assertWeights } from './errorModel.js';

/**
 * Jones matrices of a beam pair per direction (see {@link beamJonesMatrices}).
 * @category Imperfect
 */
export interface BeamJones {
  /** Polar angles [rad], length M. */
  readonly thetaRad: Float64Array;
  /** Azimuths [rad], length M. */
  readonly phiRad: Float64Array;
  /**
   * Per direction m, the 2×2 complex matrix J (row = beam X, Y; column = Ludwig-3 co (x̂ reference), cross)
   * in volts per unit drive (the embedded-pattern scale), interleaved: entries J₀₀, J₀₁, J₁₀, J₁₁ at 8m…8m+7.
   */
  readonly jones: Float64Array;
}

/**
 * The Jones matrix of a pair of beams (two polarisations) of an array, per direction.
 *
 * @remarks
 * With beam output y = wᴴv and vₙ ∝ fₙ·E (docs/conventions.md), beam p responds to
 * the field as the pattern b_p(r̂) = Σₙ conj(w_p,ₙ) fₙ(r̂). Row p of J holds b_p's
 * components along Ludwig's third-definition co- and cross-polar unit vectors
 * with x̂ reference (A. C. Ludwig, IEEE Trans. Antennas Propag. 21(1), 1973,
 * from memory; {@link ludwig3Components}), so y = J·[E_co, E_cross]ᵀ up to the
 * common reception factor. For a dual-polarised array (crossed elements at one
 * position, two ports each) w_X and w_Y are the weights of the two beams over all ports.
 * @param patterns - Embedded patterns of all N ports (source or samples at exactly these directions).
 * @param weightsX - Weights of the first beam (nominally x-polarised), N×1.
 * @param weightsY - Weights of the second beam, N×1.
 * @param thetaRad - Polar angles [rad], length M.
 * @param phiRad - Azimuths [rad], length M.
 * @returns Directions and Jones matrices.
 * @throws {@link DimensionError} for mismatched weights; as {@link samplePatterns} otherwise.
 * @category Imperfect
 */
export function beamJonesMatrices(
  patterns: PortPatternSource | SampledPortPatterns, weightsX: CMatrix, weightsY: CMatrix, thetaRad: Float64Array, phiRad: Float64Array,
): BeamJones {
  const source = 'thetaComponentV' in patterns ? sampledPatternSource(patterns) : patterns;
  const n = source.portCount;
  assertWeights(weightsX, n);
  assertWeights(weightsY, n);
  const s = samplePatterns(source, thetaRad, phiRad);
  const m = thetaRad.length;
  const bt = { rows: 2, cols: m, data: new Float64Array(4 * m) }, bp = { rows: 2, cols: m, data: new Float64Array(4 * m) };
  [weightsX, weightsY].forEach((w, p) => {
    for (let i = 0; i < n; i++) {
      const wr = w.data[2 * i], wi = -w.data[2 * i + 1];
      if (wr === 0 && wi === 0) continue;
      for (let k = 0; k < m; k++) {
        const o = 2 * (i * m + k), d = 2 * (p * m + k);
        const tr = s.thetaComponentV.data[o], ti = s.thetaComponentV.data[o + 1], pr = s.phiComponentV.data[o], pi = s.phiComponentV.data[o + 1];
        bt.data[d] += wr * tr - wi * ti; bt.data[d + 1] += wr * ti + wi * tr;
        bp.data[d] += wr * pr - wi * pi; bp.data[d + 1] += wr * pi + wi * pr;
      }
    }
  });
  const l3 = ludwig3Components(bt, bp, phiRad, 'x');
  const jones = new Float64Array(8 * m);
  for (let k = 0; k < m; k++) {
    for (let p = 0; p < 2; p++) {
      const o = 2 * (p * m + k);
      jones[8 * k + 4 * p] = l3.co.data[o]; jones[8 * k + 4 * p + 1] = l3.co.data[o + 1];
      jones[8 * k + 4 * p + 2] = l3.cross.data[o]; jones[8 * k + 4 * p + 3] = l3.cross.data[o + 1];
    }
  }
  return { thetaRad: Float64Array.from(thetaRad), phiRad: Float64Array.from(phiRad), jones };
}

function assertJones(jones: Float64Array): number {
  if (!(jones instanceof Float64Array) || jones.length === 0 || jones.length % 8 !== 0) {
    throw new DimensionError(`invalid argument "jones": expected a Float64Array of 8 values per direction (2×2 complex), received ${describeValue(jones)}.`);
  }
  for (let i = 0; i < jones.length; i++) {
    if (!Number.isFinite(jones[i])) throw new DomainError(`invalid argument "jones": entry ${i} is ${jones[i]}; expected finite values.`);
  }
  return jones.length / 8;
}

/**
 * Intrinsic cross-polarisation ratio (IXR) of 2×2 Jones matrices.
 *
 * @remarks
 * IXR = ((σ₁ + σ₂)/(σ₁ − σ₂))², σ₁ ≥ σ₂ the singular values of J (T. D. Carozzi
 * and G. Woan, "A fundamental figure of merit for radio polarimeters", IEEE
 * Trans. Antennas Propag. 59(6), 2011, from memory). Computed without an SVD as
 * (‖J‖²_F + 2|det J|)/(‖J‖²_F − 2|det J|); Infinity when J is a multiple of a
 * unitary matrix (a perfect polarimeter). It depends on the condition number only, so it is
 * unchanged by J → a·U·J·V with a ≠ 0 and U, V unitary (a change of polarisation
 * basis or a rotation). With `reference` = r it is computed for J(r)⁻¹·J(r̂): the
 * residual after calibrating on direction r, which is unchanged by any invertible
 * 2×2 calibration C on the output (J → C·J); at r itself it is Infinity.
 * @param jones - 8 values per direction (see {@link BeamJones}).
 * @param reference - Direction index to calibrate on. @defaultValue none (the raw IXR)
 * @returns IXR per direction (linear, ≥ 1, Infinity allowed).
 * @throws {@link DimensionError} / {@link DomainError} for malformed input, a bad index or a singular reference matrix.
 * @example
 * ```ts
 * // a rotation by 10°: a perfect polarimeter
 * const c = Math.cos(0.1745), s = Math.sin(0.1745);
 * intrinsicCrossPolarizationRatio(Float64Array.of(c, 0, -s, 0, s, 0, c, 0))[0] > 1e12; // true
 * ```
 * @category Imperfect
 */
export function intrinsicCrossPolarizationRatio(jones: Float64Array, reference?: number): Float64Array {
  const m = assertJones(jones);
  let inv: Float64Array | undefined;
  if (reference !== undefined) {
    assertInteger('reference', reference, 0, m - 1);
    const o = 8 * reference;
    const [ar, ai, br, bi, cr, ci, dr, di] = jones.subarray(o, o + 8);
    const detR = ar * dr - ai * di - (br * cr - bi * ci), detI = ar * di + ai * dr - (br * ci + bi * cr);
    const d2 = detR * detR + detI * detI;
    const scale = ar * ar + ai * ai + br * br + bi * bi + cr * cr + ci * ci + dr * dr + di * di;
    if (!(d2 > 1e-28 * scale * scale)) throw new DomainError(`invalid argument "reference": the Jones matrix at direction ${reference} is singular; choose a direction both beams see.`);
    // inverse = [[d, −b], [−c, a]] / det
    const div = (xr: number, xi: number): [number, number] => [(xr * detR + xi * detI) / d2, (xi * detR - xr * detI) / d2];
    inv = Float64Array.from([...div(dr, di), ...div(-br, -bi), ...div(-cr, -ci), ...div(ar, ai)]);
  }
  const out = new Float64Array(m), j = new Float64Array(8);
  for (let k = 0; k < m; k++) {
    const src = jones.subarray(8 * k, 8 * k + 8);
    if (inv) {
      for (let r = 0; r < 2; r++) {
        for (let c = 0; c < 2; c++) {
          let re = 0, im = 0;
          for (let t = 0; t < 2; t++) {
            const xr = inv[4 * r + 2 * t], xi = inv[4 * r + 2 * t + 1], yr = src[4 * t + 2 * c], yi = src[4 * t + 2 * c + 1];
            re += xr * yr - xi * yi; im += xr * yi + xi * yr;
          }
          j[4 * r + 2 * c] = re; j[4 * r + 2 * c + 1] = im;
        }
      }
    } else j.set(src);
    let f = 0;
    for (let i = 0; i < 8; i++) f += j[i] * j[i];
    const detR = j[0] * j[6] - j[1] * j[7] - (j[2] * j[4] - j[3] * j[5]);
    const detI = j[0] * j[7] + j[1] * j[6] - (j[2] * j[5] + j[3] * j[4]);
    const d = 2 * Math.hypot(detR, detI), den = f - d;
    out[k] = den > 1e-15 * f ? (f + d) / den : Infinity;
  }
  return out;
}

/**
 * Cross- over co-polar power ratios of the two beams of a Jones field (linear), per direction.
 * @category Imperfect
 */
export interface CrossPolarRatios {
  /** Beam X: |J₀₁|²/|J₀₀|². */
  readonly x: Float64Array;
  /** Beam Y: |J₁₀|²/|J₁₁|². */
  readonly y: Float64Array;
}

/**
 * Ludwig-3 cross-polar ratio of each beam of a Jones field: |J₀₁|²/|J₀₀|² for beam X and
 * |J₁₀|²/|J₁₁|² for beam Y (cross over co power, linear; Ludwig 1973 definition 3, from memory).
 * @param jones - 8 values per direction (see {@link BeamJones}).
 * @returns Cross/co power ratio per direction for each beam (Infinity where co vanishes).
 * @throws {@link DimensionError} / {@link DomainError} for malformed input.
 * @category Imperfect
 */
export function jonesCrossPolarRatios(jones: Float64Array): CrossPolarRatios {
  const m = assertJones(jones), x = new Float64Array(m), y = new Float64Array(m);
  for (let k = 0; k < m; k++) {
    const o = 8 * k;
    x[k] = (jones[o + 2] ** 2 + jones[o + 3] ** 2) / (jones[o] ** 2 + jones[o + 1] ** 2);
    y[k] = (jones[o + 4] ** 2 + jones[o + 5] ** 2) / (jones[o + 6] ** 2 + jones[o + 7] ** 2);
  }
  return { x, y };
}
