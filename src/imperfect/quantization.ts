/**
 * Quantised phase shifters and attenuators, randomised rounding, and
 * digital-weight word lengths.
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteCMatrix, assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import { RandomStream } from '../internal/random.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * How a phase or amplitude setting is rounded to its quantised states:
 * `'nearest'` (deterministic; periodic errors for a linear phase progression)
 * or `'randomized'` (round up with probability equal to the fractional part,
 * seeded: unbiased and uncorrelated from element to element).
 * @category Imperfect
 */
export type RoundingRule = 'nearest' | 'randomized';

/**
 * Options of {@link quantizeWeights}.
 * @category Imperfect
 */
export interface QuantizeWeightsOptions {
  /** Phase-shifter bits k (2ᵏ states, step 2π/2ᵏ), 1…24. @defaultValue phases not quantised */
  readonly phaseBits?: number;
  /** Attenuator bits (2ᵇ states below full scale), 1…24. @defaultValue amplitudes not quantised */
  readonly attenuatorBits?: number;
  /** Attenuator step [dB], > 0 (states 0, −step, …, −(2ᵇ − 1)·step dB re the largest |w|; smaller amplitudes take the last state). @defaultValue 0.5 */
  readonly attenuatorStepDb?: number;
  /** Rounding rule. @defaultValue 'nearest' */
  readonly rounding?: RoundingRule;
  /** Seed of the randomized rounding (integer ≥ 0). @defaultValue 1 */
  readonly seed?: number;
}

function roundWith(x: number, rule: RoundingRule, rng: RandomStream | undefined): number {
  if (rule === 'nearest' || !rng) return Math.round(x);
  const lo = Math.floor(x);
  return rng.nextFloat64() < x - lo ? lo + 1 : lo;
}

/**
 * Weights as set by quantised phase shifters and attenuators.
 *
 * @remarks
 * Phase: arg wₙ rounded to a multiple of 2π/2ᵏ. Amplitude: 20·log10(|wₙ|/max|w|)
 * rounded to a multiple of the attenuator step within the 2ᵇ states. With
 * `'nearest'` rounding a linear phase progression leaves a periodic sawtooth
 * error and hence quantisation lobes ({@link phaseQuantizationLobes});
 * `'randomized'` rounding (round up with probability equal to the fractional
 * part) makes the error unbiased and independent between elements, turning
 * the lobes into a random floor (the remedy discussed by C. J. Miller,
 * "Minimizing the effects of phase quantization errors in an electronically
 * scanned array", Proc. Symp. Electronically Scanned Array Techniques and
 * Applications, RADC-TDR-64-225, 1964 (from memory), and R. J. Mailloux,
 * *Phased Array Antenna Handbook*, 3rd ed., 2017, ch. on quantisation (from memory)).
 * @param weights - Ideal weights w, N×1 (dimensionless).
 * @param options - Bits, step, rounding, seed.
 * @returns Quantised weights, N×1.
 * @throws {@link DomainError} for bad bit counts, step or seed, or non-finite weights.
 * @example
 * ```ts
 * const w = columnVector([{ re: Math.cos(0.3), im: Math.sin(0.3) }]);
 * quantizeWeights(w, { phaseBits: 2 }).data[1]; // = 0 (0.3 rad rounds to the 0 state of 4)
 * ```
 * @category Imperfect
 */
export function quantizeWeights(weights: CMatrix, options: QuantizeWeightsOptions = {}): CMatrix {
  assertFiniteCMatrix('weights', weights);
  const { phaseBits, attenuatorBits, attenuatorStepDb = 0.5, rounding = 'nearest', seed = 1 } = options;
  if (phaseBits !== undefined) assertInteger('options.phaseBits', phaseBits, 1, 24);
  if (attenuatorBits !== undefined) assertInteger('options.attenuatorBits', attenuatorBits, 1, 24);
  assertPositive('options.attenuatorStepDb', attenuatorStepDb, 'dB');
  assertInteger('options.seed', seed, 0, Number.MAX_SAFE_INTEGER);
  if (rounding !== 'nearest' && rounding !== 'randomized') {
    throw new DomainError(`invalid argument "options.rounding": expected 'nearest' or 'randomized', received ${describeValue(rounding)}.`);
  }
  const rng = rounding === 'randomized' ? RandomStream.fromSeed(seed) : undefined;
  const n = weights.rows * weights.cols, d = weights.data;
  let maxAbs = 0;
  for (let i = 0; i < n; i++) maxAbs = Math.max(maxAbs, Math.hypot(d[2 * i], d[2 * i + 1]));
  const out = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    let a = Math.hypot(d[2 * i], d[2 * i + 1]), ph = Math.atan2(d[2 * i + 1], d[2 * i]);
    if (phaseBits !== undefined) {
      const step = (2 * Math.PI) / 2 ** phaseBits;
      ph = step * roundWith(ph / step, rounding, rng);
    }
    if (attenuatorBits !== undefined && a > 0) {
      const states = 2 ** attenuatorBits;
      const db = Math.min(states - 1, Math.max(0, roundWith(-20 * Math.log10(a / maxAbs) / attenuatorStepDb, rounding, rng)));
      a = maxAbs * 10 ** (-(db * attenuatorStepDb) / 20);
    }
    out[2 * i] = a * Math.cos(ph);
    out[2 * i + 1] = a * Math.sin(ph);
  }
  return matrixView(weights.rows, weights.cols, out);
}

/**
 * One quantisation lobe of {@link phaseQuantizationLobes}.
 * @category Imperfect
 */
export interface QuantizationLobe {
  /** Harmonic index p (lobe from the phase slope (1 + p·2ᵏ)·ψ), p ≠ 0. */
  readonly harmonic: number;
  /** Direction cosine of the lobe along the array axis (folded into [−λ/(2d), λ/(2d)) when a spacing is given, else unfolded). */
  readonly u: number;
  /** Lobe power relative to the quantised main beam, 1/(1 + p·2ᵏ)² (linear). */
  readonly relativePower: number;
  /** The same in dB. */
  readonly relativeDb: number;
}

/**
 * Quantisation lobes of a linearly phased line array with k-bit phase shifters
 * and nearest rounding (periodic sawtooth phase error).
 *
 * @remarks
 * The realised phase Φ(t) = Δ·round(t/Δ), Δ = 2π/M, M = 2ᵏ, of the ideal phase
 * t = ψn has the Fourier series e^{jΦ(t)} = Σ_p c_{1+pM} e^{j(1+pM)t} with
 * c_q = sin(qπ/M)/(qπ/M) (derived in docs/imperfect.md), so lobe p appears
 * where the array phase slope is (1 + pM)ψ, i.e. at u_p = (1 + pM)·u₀ (folded by
 * the grating period λ/d), with power 1/(1 + pM)² relative to the main beam;
 * the largest, p = −1, is 1/(2ᵏ − 1)² ≈ −6.02·k dB. This is the periodic
 * phase-quantisation result of C. J. Miller (1964, from memory; see
 * {@link quantizeWeights}); it holds when the phase ramp spans many steps
 * (|ψ| < Δ, no element sampling coincidences).
 * @param bits - Phase-shifter bits k, 1…24.
 * @param u0 - Direction cosine of the beam along the array axis (dimensionless), |u0| ≤ 1.
 * @param harmonics - Lobes p = ±1…±harmonics to list, ≥ 1. @defaultValue 2
 * @param spacingWavelengths - Element spacing d/λ, > 0, to fold u into the first Brillouin zone. @defaultValue no folding
 * @returns The lobes, strongest first.
 * @throws {@link DomainError} for bad arguments.
 * @example
 * ```ts
 * phaseQuantizationLobes(3, 0.1)[0].relativeDb; // ≈ −16.90 (1/7²)
 * ```
 * @category Imperfect
 */
export function phaseQuantizationLobes(bits: number, u0: number, harmonics = 2, spacingWavelengths?: number): QuantizationLobe[] {
  assertInteger('bits', bits, 1, 24);
  if (!Number.isFinite(u0) || Math.abs(u0) > 1) throw new DomainError(`invalid argument "u0": expected a direction cosine in [−1, 1], received ${describeValue(u0)}.`);
  assertInteger('harmonics', harmonics, 1, 1000);
  if (spacingWavelengths !== undefined) assertPositive('spacingWavelengths', spacingWavelengths);
  const M = 2 ** bits, lobes: QuantizationLobe[] = [];
  for (let a = 1; a <= harmonics; a++) {
    for (const p of [-a, a]) {
      const q = 1 + p * M;
      let u = q * u0;
      if (spacingWavelengths !== undefined) {
        const period = 1 / spacingWavelengths;
        u = u - period * Math.floor(u / period + 0.5);
      }
      const relativePower = 1 / (q * q);
      lobes.push({ harmonic: p, u, relativePower, relativeDb: 10 * Math.log10(relativePower) });
    }
  }
  return lobes.sort((x, y) => y.relativePower - x.relativePower);
}

/**
 * Figures of {@link digitalWeightFigures}.
 * @category Imperfect
 */
export interface DigitalWeightFigures {
  /** Quantisation step of each real component, 2·fullScale/2ᵇ (weight units). */
  readonly lsb: number;
  /** Error variance per real component, lsb²/12 (weight units²). */
  readonly componentVariance: number;
  /** Mean sidelobe floor relative to the beam peak, 2σ²N/|wᴴa(r̂₀)|² (linear). */
  readonly sidelobeFloor: number;
  /** The same in dB. */
  readonly sidelobeFloorDb: number;
  /** Expected SNR loss in white, uncorrelated noise, −10·log10 of E|w̃ᴴa|²/|wᴴa|² · ‖w‖²/E‖w̃‖² [dB]. */
  readonly snrLossDb: number;
}

/**
 * Sidelobe floor and SNR cost of rounding digital beamformer weights to b-bit
 * fixed point (real and imaginary parts each, full scale = the largest |Re|, |Im|).
 *
 * @remarks
 * Model: the rounding error of each real component is uniform on ±lsb/2,
 * variance lsb²/12, independent of the weights and of the other components —
 * the additive-noise model of quantisation, valid when the step is small
 * against the spread of the values (B. Widrow and I. Kollár, *Quantization
 * Noise*, Cambridge University Press, 2008, ch. 4–5, from memory). With
 * E|ε|² = 2σ² per weight: E|w̃ᴴa|² = |wᴴa|² + 2σ²N, E‖w̃‖² = ‖w‖² + 2σ²N.
 * @param weights - Ideal weights w, N×1.
 * @param steeringGain - |wᴴa(r̂₀)| of the ideal weights at the beam direction (dimensionless), > 0.
 * @param bits - Word length b per real component, 2…53.
 * @returns The figures.
 * @throws {@link DomainError} for bad arguments or all-zero weights.
 * @example
 * ```ts
 * const w = columnVector(new Array(64).fill(1));
 * digitalWeightFigures(w, 64, 8).sidelobeFloorDb; // ≈ −67.99
 * ```
 * @category Imperfect
 */
export function digitalWeightFigures(weights: CMatrix, steeringGain: number, bits: number): DigitalWeightFigures {
  assertFiniteCMatrix('weights', weights);
  assertPositive('steeringGain', steeringGain);
  assertInteger('bits', bits, 2, 53);
  const n = weights.rows * weights.cols, d = weights.data;
  let fs = 0, w2 = 0;
  for (let i = 0; i < 2 * n; i++) { fs = Math.max(fs, Math.abs(d[i])); w2 += d[i] * d[i]; }
  if (fs === 0) throw new DomainError('invalid argument "weights": all weights are zero; nothing to quantise.');
  const lsb = (2 * fs) / 2 ** bits, v = (lsb * lsb) / 12, e = 2 * v * n, g2 = steeringGain * steeringGain;
  const floor = e / g2;
  return { lsb, componentVariance: v, sidelobeFloor: floor, sidelobeFloorDb: 10 * Math.log10(floor), snrLossDb: -10 * Math.log10(((g2 + e) / g2) * (w2 / (w2 + e))) };
}

/**
 * Rounds weights to b-bit fixed point per real component, full scale = the largest |Re|, |Im|
 * (see {@link digitalWeightFigures}).
 * @param weights - Weights, N×1.
 * @param bits - Word length b, 2…53.
 * @returns Rounded weights, N×1.
 * @throws {@link DomainError} for bad arguments.
 * @category Imperfect
 */
export function roundDigitalWeights(weights: CMatrix, bits: number): CMatrix {
  assertFiniteCMatrix('weights', weights);
  assertInteger('bits', bits, 2, 53);
  const d = weights.data;
  let fs = 0;
  for (let i = 0; i < d.length; i++) fs = Math.max(fs, Math.abs(d[i]));
  const lsb = fs > 0 ? (2 * fs) / 2 ** bits : 1;
  const out = new Float64Array(d.length);
  for (let i = 0; i < d.length; i++) out[i] = lsb * Math.round(d[i] / lsb);
  return matrixView(weights.rows, weights.cols, out);
}
