/**
 * Scoring a beam: its pattern, output power and SNR, white-noise gain, array
 * gain against one element, and rejection of given interferers.
 * Conventions: beam output y = wᴴx, array factor AF(r̂) = wᴴa(r̂) (docs/conventions.md).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { quadraticForm } from '../linalg/ops.js';
import { assertColumn, assertFiniteCMatrix, assertInteger, assertShape } from '../internal/validate.js';
import { matrixView } from '../linalg/cmatrix.js';

/** |wᴴ column j of b|² for every column, no checks. */
export function responsePowersInto(out: Float64Array, w: CMatrix, b: CMatrix): Float64Array {
  const n = w.rows, k = b.cols, x = w.data, d = b.data;
  for (let j = 0; j < k; j++) {
    let re = 0, im = 0;
    for (let i = 0; i < n; i++) {
      const p = 2 * (i * k + j);
      const wr = x[2 * i], wi = x[2 * i + 1], br = d[p], bi = d[p + 1];
      re += wr * br + wi * bi;
      im += wr * bi - wi * br;
    }
    out[j] += re * re + im * im;
  }
  return out;
}

/** Validates a weight vector against the element count of another argument. */
export function assertWeights(w: CMatrix, n: number, hint: string): void {
  assertFiniteCMatrix('w', w);
  assertColumn('w', w, n, hint);
}

/**
 * Complex beam response wᴴaₖ to each column aₖ of a steering or response matrix.
 *
 * @remarks
 * With steering vectors as columns this is the array factor AF(r̂ₖ) = wᴴa(r̂ₖ);
 * with embedded element responses (one polarisation component per matrix) it
 * is the beam's field pattern in that component. Convention: y = wᴴx.
 * @param w - Weights, N×1 [dimensionless].
 * @param responses - Steering or response vectors as columns, N×K [as given: dimensionless for steering vectors, V for embedded responses].
 * @returns K×1 complex responses [units of `responses`].
 * @throws {@link DimensionError} if `w` is not N×1 with N = `responses.rows`.
 * @throws {@link DomainError} on non-finite entries.
 * @category Beamforming
 */
export function beamResponse(w: CMatrix, responses: CMatrix): CMatrix {
  assertFiniteCMatrix('responses', responses);
  assertWeights(w, responses.rows, 'one weight per row of "responses"');
  const n = w.rows, k = responses.cols, x = w.data, d = responses.data;
  const out = new Float64Array(2 * k);
  for (let j = 0; j < k; j++) {
    let re = 0, im = 0;
    for (let i = 0; i < n; i++) {
      const p = 2 * (i * k + j);
      re += x[2 * i] * d[p] + x[2 * i + 1] * d[p + 1];
      im += x[2 * i] * d[p + 1] - x[2 * i + 1] * d[p];
    }
    out[2 * j] = re;
    out[2 * j + 1] = im;
  }
  return matrixView(k, 1, out);
}

/**
 * Beam power pattern Σ_c |wᴴ f_c(r̂ₖ)|² over one or more response components.
 *
 * @remarks
 * Pass one N×K steering matrix for an array-factor pattern |AF|², or the θ̂ and
 * φ̂ components of the embedded element patterns (each N×K, one column per
 * direction) for the full beam pattern |wᴴf_θ|² + |wᴴf_φ|² (the total power
 * pattern, independent of the polarisation basis). Convention: y = wᴴx.
 * @param w - Weights, N×1 [dimensionless].
 * @param components - One response matrix N×K, or a list of them with equal shapes [dimensionless or V].
 * @returns Power pattern per direction, length K [square of the response unit], not normalised.
 * @throws {@link DimensionError} on inconsistent shapes or an empty list.
 * @throws {@link DomainError} on non-finite entries.
 * @category Beamforming
 */
export function beamPowerPattern(w: CMatrix, components: CMatrix | ReadonlyArray<CMatrix>): Float64Array {
  const list = Array.isArray(components) ? components : [components as CMatrix];
  if (list.length === 0) {
    throw new DimensionError('invalid argument "components": expected at least one N×K response matrix, received an empty list.');
  }
  const first = list[0];
  assertFiniteCMatrix('components[0]', first);
  list.forEach((c, i) => {
    assertFiniteCMatrix(`components[${i}]`, c);
    assertShape(`components[${i}]`, c, first.rows, first.cols, 'the shape of components[0]');
  });
  assertWeights(w, first.rows, 'one weight per row of the responses');
  return beamPowerPatternInto(new Float64Array(first.cols), w, list);
}

/**
 * Allocation-free {@link beamPowerPattern}: writes Σ_c |wᴴ f_c(r̂ₖ)|² into `out`
 * (overwriting it) and returns it. Checks shapes only (validate once with the
 * allocating form or yourself); `out` must not share storage with `w` or the components.
 * @param out - Destination, length K.
 * @param w - Weights, N×1 [dimensionless].
 * @param components - One response matrix N×K, or a list of them [dimensionless or V].
 * @returns `out` [square of the response unit].
 * @throws {@link DimensionError} on inconsistent shapes.
 * @category Beamforming
 */
export function beamPowerPatternInto<T extends Float64Array>(out: T, w: CMatrix, components: CMatrix | ReadonlyArray<CMatrix>): T {
  const list = Array.isArray(components) ? components : [components as CMatrix];
  for (const c of list) {
    if (c.rows !== w.rows || c.cols !== out.length || w.cols !== 1) {
      throw new DimensionError(`invalid arguments to beamPowerPatternInto: weights ${w.rows}×${w.cols}, response ${c.rows}×${c.cols} and out of length ${out.length} do not match (expected N×1, N×K and K).`);
    }
  }
  out.fill(0);
  for (const c of list) responsePowersInto(out, w, c);
  return out;
}

function assertCorrelation(name: string, r: CMatrix, n: number): void {
  assertFiniteCMatrix(name, r);
  assertShape(name, r, n, n, 'one row and column per weight');
}

/**
 * Mean output power wᴴRw of a beam for an input correlation matrix R = E[x xᴴ].
 * @param w - Weights, N×1 [dimensionless].
 * @param correlation - Input correlation matrix, N×N Hermitian [V² or W, as the data].
 * @returns Output power [units of `correlation`].
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite entries.
 * @category Beamforming
 */
export function beamOutputPower(w: CMatrix, correlation: CMatrix): number {
  assertFiniteCMatrix('w', w);
  assertCorrelation('correlation', correlation, w.rows);
  return quadraticForm(w, correlation);
}

/**
 * Signal power at the beam output for a signal given either as a response
 * vector (rank one, unit power) or as a correlation matrix.
 */
function signalPower(w: CMatrix, signal: CMatrix): number {
  assertFiniteCMatrix('signal', signal);
  if (signal.cols === 1 && signal.rows === w.rows) {
    const p = new Float64Array(1);
    responsePowersInto(p, w, signal);
    return p[0];
  }
  assertCorrelation('signal', signal, w.rows);
  return quadraticForm(w, signal);
}

/**
 * Output signal-to-noise ratio wᴴR_s w / wᴴR_n w.
 *
 * @remarks
 * `signal` is either an N×1 response vector a (a unit-power point signal,
 * R_s = a aᴴ, so the numerator is |wᴴa|²) or an N×N signal correlation matrix.
 * The ratio is the one whose maximum defines the maximum-SNR beam and, for an
 * unpolarised point source, the sensitivity A_e/T_sys = 2k_B·SNR/S (IEEE Std 145-2013).
 * @param w - Weights, N×1 [dimensionless].
 * @param signal - Signal response N×1 or signal correlation N×N [same units as `noise`].
 * @param noise - Noise correlation matrix, N×N Hermitian positive semidefinite.
 * @returns The SNR, linear [dimensionless]; +Infinity if the beam output holds no noise.
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite entries.
 * @category Beamforming
 */
export function beamSnr(w: CMatrix, signal: CMatrix, noise: CMatrix): number {
  assertFiniteCMatrix('w', w);
  assertColumn('w', w);
  assertCorrelation('noise', noise, w.rows);
  const s = signalPower(w, signal);
  const q = quadraticForm(w, noise);
  return q > 0 ? s / q : (s > 0 ? Infinity : 0);
}

/**
 * White-noise gain |wᴴa|² / (wᴴw): the array gain against spatially white
 * noise, N for the conjugate match of a unit-modulus steering vector, a
 * measure of the beam's robustness (H. Cox, R. M. Zeskind and M. M. Owen,
 * "Robust adaptive beamforming", IEEE Trans. ASSP 35(10), 1987, from memory).
 * @param w - Weights, N×1 [dimensionless].
 * @param a - Look-direction steering vector, N×1 [dimensionless].
 * @returns White-noise gain, linear [dimensionless].
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite entries or zero weights.
 * @category Beamforming
 */
export function whiteNoiseGain(w: CMatrix, a: CMatrix): number {
  assertFiniteCMatrix('a', a);
  assertColumn('a', a);
  assertWeights(w, a.rows, 'one weight per entry of "a"');
  const p = new Float64Array(1);
  responsePowersInto(p, w, a);
  let ww = 0;
  for (let k = 0; k < w.data.length; k++) ww += w.data[k] * w.data[k];
  if (ww === 0) throw new DimensionError('invalid argument "w": all weights are zero; the white-noise gain is undefined.');
  return p[0] / ww;
}

/**
 * Array gain: output SNR of the beam divided by the input SNR at one
 * reference element, SNR_out / (|a_ref|² / R_n,ref,ref) (H. L. Van Trees,
 * *Optimum Array Processing*, Wiley, 2002, from memory).
 * @param w - Weights, N×1 [dimensionless].
 * @param a - Signal response vector, N×1 [same units as the noise correlation's square root].
 * @param noise - Noise correlation matrix, N×N.
 * @param referenceElement - Zero-based index of the reference element (default 0).
 * @returns Array gain, linear [dimensionless].
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite entries, a bad index, or a reference element without signal or noise.
 * @category Beamforming
 */
export function arrayGain(w: CMatrix, a: CMatrix, noise: CMatrix, referenceElement = 0): number {
  assertFiniteCMatrix('a', a);
  assertColumn('a', a);
  assertWeights(w, a.rows, 'one weight per entry of "a"');
  assertCorrelation('noise', noise, a.rows);
  assertInteger('referenceElement', referenceElement, 0, a.rows - 1);
  const i = referenceElement;
  const sIn = a.data[2 * i] ** 2 + a.data[2 * i + 1] ** 2;
  const nIn = noise.data[2 * (i * a.rows + i)];
  if (!(sIn > 0) || !(nIn > 0)) {
    throw new DomainError(`invalid argument "referenceElement": element ${i} has signal power ${sIn} and noise power ${nIn}; both must be > 0 to define its input SNR; choose another element.`);
  }
  return beamSnr(w, a, noise) / (sIn / nIn);
}

/** Result of {@link interferenceRejection}. */
export interface InterferenceRejectionResult {
  /** |wᴴbᵢ|² / |wᴴa|² per interferer, linear [dimensionless]. */
  readonly relativeResponse: Float64Array;
  /** Rejection −10·log₁₀(relativeResponse) per interferer, power ratio [dB]; +Infinity for an exact null. */
  readonly rejectionDb: Float64Array;
}

/**
 * Rejection of given interferers: the beam's power response to each
 * interferer's steering vector relative to its response in the look direction.
 * @param w - Weights, N×1 [dimensionless].
 * @param a - Look-direction steering vector, N×1.
 * @param interferers - Interferer steering vectors as columns, N×J.
 * @returns Relative responses and rejections in dB.
 * @throws {@link DimensionError} on shape mismatch or a beam with zero look-direction response; {@link DomainError} on non-finite entries.
 * @category Beamforming
 */
export function interferenceRejection(w: CMatrix, a: CMatrix, interferers: CMatrix): InterferenceRejectionResult {
  assertFiniteCMatrix('a', a);
  assertColumn('a', a);
  assertWeights(w, a.rows, 'one weight per entry of "a"');
  assertFiniteCMatrix('interferers', interferers);
  if (interferers.rows !== a.rows) {
    throw new DimensionError(`invalid argument "interferers": expected ${a.rows} rows (one per element), received ${interferers.rows}×${interferers.cols}.`);
  }
  const look = responsePowersInto(new Float64Array(1), w, a)[0];
  if (!(look > 0)) throw new DimensionError('invalid argument "w": the beam has zero response in the look direction "a"; rejection is undefined.');
  const rel = responsePowersInto(new Float64Array(interferers.cols), w, interferers);
  const db = new Float64Array(rel.length);
  for (let k = 0; k < rel.length; k++) {
    rel[k] /= look;
    db[k] = -10 * Math.log10(rel[k]);
  }
  return { relativeResponse: rel, rejectionDb: db };
}
