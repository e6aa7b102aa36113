/**
 * The frequency-indexed N-port of phasewise and its construction.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { type CMatrix, type ComplexLike, complexParts, matrixView } from '../linalg/cmatrix.js';
import { assertCMatrix, assertInteger, describeValue } from '../internal/validate.js';
import { displayable } from '../display/attach.js';

/**
 * Representation in which a {@link Multiport} stores its matrices.
 *
 * - `'impedance'`: V = Z I [Ω], currents into the ports.
 * - `'admittance'`: I = Y V [S].
 * - `'scattering'`: b = S a, waves per {@link WaveDefinition} with the per-port reference impedances.
 * - `'chain'` (two-ports only): [V₁; I₁] = [A B; C D]·[V₂; −I₂] (A, D dimensionless, B [Ω], C [S]).
 * - `'transfer'` (two-ports only): [a₁; b₁] = T·[b₂; a₂] (waves as for `'scattering'`), so that
 *   cascading two-ports whose joined ports share one real reference multiplies T matrices.
 * @category Network
 */
export type MultiportForm = 'impedance' | 'admittance' | 'scattering' | 'chain' | 'transfer';

/**
 * Definition of the incident/reflected waves at a port with reference impedance Z_r = R_r + jX_r.
 *
 * - `'power'` (default; Kurokawa 1965): a = (V + Z_r I)/(2√R_r), b = (V − Z_r* I)/(2√R_r).
 *   |a|² − |b|² is the power delivered to the port for any Z_r with R_r > 0.
 * - `'pseudo'` (Marks & Williams 1992): a = √R_r (V + Z_r I)/(2|Z_r|), b = √R_r (V − Z_r I)/(2|Z_r|).
 *   Equal to power waves for real Z_r; for complex Z_r the cross power is not |a|² − |b|².
 *
 * Sources: K. Kurokawa, "Power waves and the scattering matrix", IEEE Trans. MTT 13(2), 1965,
 * eq. (1) (from memory); R. B. Marks and D. F. Williams, "A general waveguide circuit theory",
 * J. Res. NIST 97(5), 1992 (from memory).
 * @category Network
 */
export type WaveDefinition = 'power' | 'pseudo';

/**
 * A linear N-port sampled at one or more frequencies.
 *
 * @remarks
 * Stored in the form it was made from ({@link MultiportForm}); convert on demand with
 * {@link convertMultiport} or {@link renormalizeMultiport}. Treat as immutable: every
 * function returns a new value.
 *
 * Layout of `data`: matrix k (frequency `frequencyHz[k]`) is N×N, row-major, interleaved
 * re/im, starting at index 2·k·N·N. Conventions: RMS phasors, e^{+jωt}, V = Z I with
 * currents into the ports, power waves (Kurokawa 1965) with per-port reference
 * impedances (default 50 Ω). The references are kept whatever the form, so converting
 * Z → S → Z is exact in intent.
 *
 * `noiseWaves`, when present, holds the noise-wave correlation E[c cᴴ] per hertz
 * [W/Hz] of b = S a + c (power waves, the same references), same layout as `data`;
 * it is carried through renormalisation, port operations and connections.
 * @category Network
 */
export interface Multiport {
  /** Number of ports N ≥ 1. */
  readonly ports: number;
  /** Frequencies [Hz], finite, ≥ 0, strictly increasing. */
  readonly frequencyHz: Float64Array;
  /** The stored representation. */
  readonly form: MultiportForm;
  /** Stacked N×N matrices, length 2·F·N·N (see remarks). Units per form. */
  readonly data: Float64Array;
  /** Per-port reference impedances [Ω], interleaved re/im, length 2N; real parts > 0. */
  readonly referenceOhm: Float64Array;
  /** Wave definition used by the scattering and transfer forms. */
  readonly waves: WaveDefinition;
  /** Port names, length N. */
  readonly portNames: readonly string[];
  /** Optional noise-wave correlation stack E[c cᴴ] per hertz [W/Hz] (power waves), length 2·F·N·N. */
  readonly noiseWaves?: Float64Array;
}

/**
 * Options of {@link createMultiport}.
 * @category Network
 */
export interface MultiportOptions {
  /**
   * Reference impedance [Ω]: one value for every port or one per port; real part > 0.
   * @defaultValue 50
   */
  referenceOhm?: ComplexLike | ReadonlyArray<ComplexLike>;
  /**
   * Wave definition of the scattering and transfer forms.
   * @defaultValue 'power'
   */
  waves?: WaveDefinition;
  /**
   * Port names, one per port.
   * @defaultValue ['1', '2', …]
   */
  portNames?: ReadonlyArray<string>;
}

const FORMS: readonly MultiportForm[] = ['impedance', 'admittance', 'scattering', 'chain', 'transfer'];

/** Validates and packs reference impedances into an interleaved array of length 2n. @internal */
export function packReferences(name: string, ref: ComplexLike | ReadonlyArray<ComplexLike> | undefined, n: number): Float64Array {
  const out = new Float64Array(2 * n);
  if (ref === undefined) {
    for (let i = 0; i < n; i++) out[2 * i] = 50;
    return out;
  }
  const list = Array.isArray(ref) ? ref : null;
  if (list && list.length !== n) {
    throw new DimensionError(`invalid argument "${name}": expected one reference impedance or ${n} (one per port), received ${list.length}.`);
  }
  for (let i = 0; i < n; i++) {
    const [re, im] = complexParts(list ? `${name}[${i}]` : name, list ? list[i] : (ref as ComplexLike));
    if (!(re > 0)) {
      throw new DomainError(`invalid argument "${name}": the reference impedance of port ${i} must have a real part > 0 [Ω], received ${re} + ${im}j; power waves need R_r > 0.`);
    }
    out[2 * i] = re;
    out[2 * i + 1] = im;
  }
  return out;
}

/** Validates a frequency array: finite, ≥ 0, strictly increasing, non-empty. @internal */
export function checkFrequencies(name: string, f: ArrayLike<number>): Float64Array {
  if (f === null || typeof f !== 'object' || typeof f.length !== 'number' || f.length < 1) {
    throw new DimensionError(`invalid argument "${name}": expected a non-empty array of frequencies [Hz], received ${describeValue(f)}.`);
  }
  const out = Float64Array.from(f);
  for (let k = 0; k < out.length; k++) {
    if (!Number.isFinite(out[k]) || out[k] < 0) {
      throw new DomainError(`invalid argument "${name}": frequency ${k} is ${describeValue(out[k])}; expected a finite number ≥ 0 [Hz].`);
    }
    if (k > 0 && !(out[k] > out[k - 1])) {
      throw new DomainError(`invalid argument "${name}": frequencies must be strictly increasing, but entry ${k} (${out[k]} Hz) ≤ entry ${k - 1} (${out[k - 1]} Hz); sort them and remove duplicates.`);
    }
  }
  return out;
}

/**
 * Builds a {@link Multiport} from one matrix per frequency.
 *
 * @param form - The representation of `matrices` ({@link MultiportForm}).
 * @param frequencyHz - Frequencies [Hz], finite, ≥ 0, strictly increasing.
 * @param matrices - One N×N CMatrix per frequency, or a stacked interleaved Float64Array of
 *   length 2·F·N·N (copied). Units: Z [Ω], Y [S], S and T dimensionless, chain per {@link MultiportForm}.
 * @param options - References, wave definition, port names.
 * @returns A new network.
 * @throws {@link DimensionError} on inconsistent sizes (or a non-2-port chain/transfer form);
 *   {@link DomainError} on non-finite entries, bad frequencies or references with real part ≤ 0.
 * @example
 * ```ts
 * const load = createMultiport('impedance', [1e9], [fromRows([[75]])]); // a 75 Ω one-port
 * ```
 * @category Network
 */
export function createMultiport(
  form: MultiportForm,
  frequencyHz: ArrayLike<number>,
  matrices: ReadonlyArray<CMatrix> | Float64Array,
  options: MultiportOptions = {},
): Multiport {
  if (!FORMS.includes(form)) {
    throw new DomainError(`invalid argument "form": expected one of ${FORMS.join(', ')}, received ${describeValue(form)}.`);
  }
  const f = checkFrequencies('frequencyHz', frequencyHz);
  const nf = f.length;
  let n: number;
  let data: Float64Array;
  if (matrices instanceof Float64Array) {
    const per = matrices.length / (2 * nf);
    n = Math.round(Math.sqrt(per));
    if (!Number.isInteger(per) || n * n !== per || n < 1) {
      throw new DimensionError(`invalid argument "matrices": a stacked Float64Array must have length 2·F·N·N with F = ${nf}, received length ${matrices.length}.`);
    }
    data = matrices.slice();
  } else {
    if (!Array.isArray(matrices) || matrices.length !== nf) {
      throw new DimensionError(`invalid argument "matrices": expected ${nf} matrices (one per frequency), received ${describeValue(matrices)}.`);
    }
    assertCMatrix('matrices[0]', matrices[0]);
    n = matrices[0].rows;
    if (n < 1) throw new DimensionError('invalid argument "matrices": expected N×N matrices with N ≥ 1, received 0×0.');
    data = new Float64Array(2 * nf * n * n);
    for (let k = 0; k < nf; k++) {
      const m = matrices[k];
      assertCMatrix(`matrices[${k}]`, m);
      if (m.rows !== n || m.cols !== n) {
        throw new DimensionError(`invalid argument "matrices[${k}]": expected ${n}×${n} like matrices[0], received ${m.rows}×${m.cols}.`);
      }
      data.set(m.data, 2 * k * n * n);
    }
  }
  for (let q = 0; q < data.length; q++) {
    if (!Number.isFinite(data[q])) {
      const e = q >> 1;
      const k = Math.floor(e / (n * n));
      const r = e - k * n * n;
      throw new DomainError(`invalid argument "matrices": entry (${Math.floor(r / n)}, ${r % n}) at frequency index ${k} is not finite (${data[q]}); every entry must be finite.`);
    }
  }
  if ((form === 'chain' || form === 'transfer') && n !== 2) {
    throw new DimensionError(`invalid argument "matrices": the ${form} form is defined for two-ports only, received ${n}×${n} matrices.`);
  }
  const waves = options.waves ?? 'power';
  if (waves !== 'power' && waves !== 'pseudo') {
    throw new DomainError(`invalid option "waves": expected 'power' or 'pseudo', received ${describeValue(waves)}.`);
  }
  return displayable<Multiport>({
    ports: n,
    frequencyHz: f,
    form,
    data,
    referenceOhm: packReferences('referenceOhm', options.referenceOhm, n),
    waves,
    portNames: checkPortNames(options.portNames, n),
  }, 'Multiport');
}

/** Validates port names or makes the default ones. @internal */
export function checkPortNames(names: ReadonlyArray<string> | undefined, n: number): string[] {
  if (names === undefined) return Array.from({ length: n }, (_, i) => String(i + 1));
  if (!Array.isArray(names) || names.length !== n) {
    throw new DimensionError(`invalid argument "portNames": expected ${n} names (one per port), received ${describeValue(names)}.`);
  }
  for (let i = 0; i < n; i++) {
    if (typeof names[i] !== 'string') {
      throw new DomainError(`invalid argument "portNames": entry ${i} must be a string, received ${describeValue(names[i])}.`);
    }
  }
  return names.slice();
}

/**
 * The matrix of a network at one frequency index, copied.
 * @param net - The network.
 * @param k - Frequency index, integer in [0, F − 1].
 * @returns N×N CMatrix in the network's stored form and units.
 * @throws {@link DomainError} if `k` is out of range.
 * @category Network
 */
export function multiportMatrix(net: Multiport, k: number): CMatrix {
  assertMultiport('net', net);
  assertInteger('k', k, 0, net.frequencyHz.length - 1);
  const nn = net.ports * net.ports;
  return matrixView(net.ports, net.ports, net.data.slice(2 * k * nn, 2 * (k + 1) * nn));
}

/** Structural check of a Multiport argument. @internal */
export function assertMultiport(name: string, net: Multiport): void {
  if (
    net === null || typeof net !== 'object' || !Number.isInteger(net.ports) || net.ports < 1 ||
    !(net.frequencyHz instanceof Float64Array) || !(net.data instanceof Float64Array) ||
    net.data.length !== 2 * net.frequencyHz.length * net.ports * net.ports ||
    !(net.referenceOhm instanceof Float64Array) || net.referenceOhm.length !== 2 * net.ports ||
    !FORMS.includes(net.form)
  ) {
    throw new DimensionError(`invalid argument "${name}": expected a Multiport (make one with createMultiport), received ${describeValue(net)}.`);
  }
}

/**
 * Per-port wave coefficients: a = f·(V + g·I), b = f·(V − h·I).
 * Returns interleaved arrays {f (real, length n), g, h (complex, length 2n)}. @internal
 */
export function waveCoefficients(ref: Float64Array, waves: WaveDefinition): { f: Float64Array; g: Float64Array; h: Float64Array } {
  const n = ref.length / 2;
  const f = new Float64Array(n);
  const g = ref.slice();
  const h = ref.slice();
  for (let i = 0; i < n; i++) {
    const r = ref[2 * i], x = ref[2 * i + 1];
    if (waves === 'power') {
      f[i] = 1 / (2 * Math.sqrt(r));
      h[2 * i + 1] = -x;
    } else {
      f[i] = Math.sqrt(r) / (2 * Math.hypot(r, x));
    }
  }
  return { f, g, h };
}

/**
 * Coefficients of V = d1·a + d2·b and I = d3·(a − b) per port (interleaved complex,
 * length 2n each), the inverse of {@link waveCoefficients}. @internal
 */
export function voltageCurrentCoefficients(ref: Float64Array, waves: WaveDefinition): { d1: Float64Array; d2: Float64Array; d3: Float64Array } {
  const { f, g, h } = waveCoefficients(ref, waves);
  const n = f.length;
  const d1 = new Float64Array(2 * n), d2 = new Float64Array(2 * n), d3 = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    // den = f (g + h)
    const sr = g[2 * i] + h[2 * i], si = g[2 * i + 1] + h[2 * i + 1];
    const dr = f[i] * sr, di = f[i] * si;
    const m = dr * dr + di * di;
    const ir = dr / m, ii = -di / m;
    d3[2 * i] = ir; d3[2 * i + 1] = ii;
    d1[2 * i] = h[2 * i] * ir - h[2 * i + 1] * ii; d1[2 * i + 1] = h[2 * i] * ii + h[2 * i + 1] * ir;
    d2[2 * i] = g[2 * i] * ir - g[2 * i + 1] * ii; d2[2 * i + 1] = g[2 * i] * ii + g[2 * i + 1] * ir;
  }
  return { d1, d2, d3 };
}

/** Copy of a network with some fields replaced. @internal */
export function withFields(net: Multiport, fields: Partial<Multiport>): Multiport {
  const out: Multiport = { ...net, ...fields };
  if (out.noiseWaves === undefined) delete (out as { noiseWaves?: Float64Array }).noiseWaves;
  return displayable(out, 'Multiport');
}
