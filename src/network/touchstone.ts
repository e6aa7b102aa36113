/**
 * Reading and writing Touchstone files (the open standard for network
 * parameter data), versions 1 and 2, from and to strings (browser-safe; the
 * file-system helpers live in the Node entry, src/network/node.ts).
 *
 * Specification followed (from memory): IBIS Open Forum, *Touchstone® File
 * Format Specification*, Version 2.0, 2009 (which also defines version 1
 * files), with the clarification that [End] is required in version 2 files
 * (IBIS Touchstone Issue Resolution Document 4.1, 2022).
 * @module
 */
import { hzText } from '../internal/text.js';
import { DomainError, ParseError } from '../errors.js';
import { describeValue } from '../internal/validate.js';
import { convertMultiport } from './convert.js';
import { type Multiport, assertMultiport } from './multiport.js';

/**
 * Parameter type letter of a Touchstone file: scattering, admittance, impedance, and the
 * two-port hybrid forms G and H (read only; converted to admittance and impedance form).
 * @category Network
 */
export type TouchstoneParameter = 'S' | 'Y' | 'Z' | 'G' | 'H';

/**
 * Number pair format: real/imaginary, magnitude/angle [deg], dB (20·log10 |x|)/angle [deg].
 * @category Network
 */
export type TouchstoneNumberFormat = 'RI' | 'MA' | 'DB';

/**
 * Frequency unit of a Touchstone file.
 * @category Network
 */
export type TouchstoneFrequencyUnit = 'Hz' | 'kHz' | 'MHz' | 'GHz';

/**
 * Two-port noise parameters as tabulated in a Touchstone noise block.
 * @category Network
 */
export interface TouchstoneNoiseTable {
  /** Frequencies [Hz], strictly increasing. */
  readonly frequencyHz: Float64Array;
  /** Minimum noise figure F_min [dB] per frequency. */
  readonly minimumNoiseFigureDb: Float64Array;
  /** Optimum source reflection Γ_opt per frequency, interleaved re/im, against `referenceOhm`. */
  readonly optimumReflection: Float64Array;
  /** Equivalent noise resistance R_n [Ω] per frequency (the file stores R_n/referenceOhm). */
  readonly noiseResistanceOhm: Float64Array;
  /** Real reference resistance of Γ_opt and of the normalised R_n [Ω]. */
  readonly referenceOhm: number;
}

/**
 * Result of {@link parseTouchstone}.
 * @category Network
 */
export interface TouchstoneData {
  /** File version: 1 or 2. */
  readonly version: 1 | 2;
  /** Parameter type declared in the file. */
  readonly parameter: TouchstoneParameter;
  /** The network: scattering form for S, admittance for Y and G, impedance for Z and H. */
  readonly network: Multiport;
  /** Noise parameters (two-ports only), when the file has them. */
  readonly noise?: TouchstoneNoiseTable;
  /** Comment texts (after '!') in file order, without the '!'. */
  readonly comments: string[];
}

/**
 * Options of {@link parseTouchstone}.
 * @category Network
 */
export interface TouchstoneParseOptions {
  /**
   * Number of ports of a version 1 file (its .sNp extension). When omitted, a version 1 file
   * is read as a one- or two-port according to its first data line (3 or 9 numbers).
   * Ignored for version 2 files, which state it.
   */
  ports?: number;
}

/** Largest port count accepted by the parser. */
const MAX_PORTS = 1024;
const UNIT_SCALE: Record<string, number> = { HZ: 1, KHZ: 1e3, MHZ: 1e6, GHZ: 1e9 };
const UNIT_NAME: Record<TouchstoneFrequencyUnit, string> = { Hz: 'Hz', kHz: 'kHz', MHz: 'MHz', GHz: 'GHz' };
const POW10 = [1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22];

/** Character scanner with line tracking. */
class Scanner {
  pos = 0;
  line = 1;
  constructor(readonly text: string) {}

  /** Skips blanks, line ends and '!' comments; stops at the next significant character. */
  skipSpace(comments: string[] | null): void {
    const t = this.text;
    const n = t.length;
    let p = this.pos;
    let line = this.line;
    while (p < n) {
      const c = t.charCodeAt(p);
      if (c === 32 || c === 9 || c === 13) { p++; } else if (c === 10) { line++; p++; } else if (c === 33) {
        let e = t.indexOf('\n', p);
        if (e < 0) e = n;
        if (comments) comments.push(t.slice(p + 1, e).replace(/\r$/, ''));
        p = e;
      } else break;
    }
    this.pos = p;
    this.line = line;
  }

  /** The rest of the current line (up to '!' or the line end), advancing past it but not past the newline. */
  restOfLine(comments: string[] | null): string {
    const t = this.text;
    let e = t.indexOf('\n', this.pos);
    if (e < 0) e = t.length;
    let body = t.slice(this.pos, e);
    const bang = body.indexOf('!');
    if (bang >= 0) {
      if (comments) comments.push(body.slice(bang + 1).replace(/\r$/, ''));
      body = body.slice(0, bang);
    }
    this.pos = e;
    return body.trim();
  }

  /** Line to report for an unexpected end of file: the last line with content. */
  eofLine(): number {
    return this.text.endsWith('\n') ? this.line - 1 : this.line;
  }

  atNumberStart(): boolean {
    const c = this.text.charCodeAt(this.pos);
    return (c >= 48 && c <= 57) || c === 43 || c === 45 || c === 46;
  }

  /** Reads one number token at `pos` (after skipSpace) or throws ParseError. */
  number(what: string): number {
    const t = this.text;
    const n = t.length;
    const start = this.pos;
    let p = start;
    let neg = false;
    let c = t.charCodeAt(p);
    if (c === 43 || c === 45) { neg = c === 45; p++; c = t.charCodeAt(p); }
    let mant = 0;
    let digits = 0;
    let sig = 0;
    let scale = 0;
    while (c >= 48 && c <= 57) {
      if (sig < 15) { mant = mant * 10 + (c - 48); if (mant > 0) sig++; } else scale++;
      digits++; p++; c = t.charCodeAt(p);
    }
    if (c === 46) {
      p++; c = t.charCodeAt(p);
      while (c >= 48 && c <= 57) {
        if (sig < 15) { mant = mant * 10 + (c - 48); scale--; if (mant > 0) sig++; }
        digits++; p++; c = t.charCodeAt(p);
      }
    }
    let exact = sig < 15;
    if (digits > 0 && (c === 101 || c === 69)) {
      let q = p + 1;
      let ec = t.charCodeAt(q);
      let eneg = false;
      if (ec === 43 || ec === 45) { eneg = ec === 45; q++; ec = t.charCodeAt(q); }
      let ex = 0, ed = 0;
      while (ec >= 48 && ec <= 57) { if (ex < 100000) ex = ex * 10 + (ec - 48); ed++; q++; ec = t.charCodeAt(q); }
      if (ed === 0) { p = q; exact = false; c = -2; } else { scale += eneg ? -ex : ex; p = q; c = ec; }
    }
    const endOk = p >= n || c === 32 || c === 9 || c === 10 || c === 13 || c === 33;
    if (digits === 0 || !endOk) {
      let e = p;
      while (e < n && !/\s/.test(t[e])) e++;
      const tok = t.slice(start, Math.max(e, start + 1)).slice(0, 40);
      throw new ParseError(`expected ${what} (a number), found "${tok}"`, this.line);
    }
    this.pos = p;
    let v: number;
    if (exact && scale >= -22 && scale <= 22) {
      v = scale >= 0 ? mant * POW10[scale] : mant / POW10[-scale];
      if (neg) v = -v;
    } else {
      v = Number(t.slice(start, p));
    }
    if (!Number.isFinite(v)) throw new ParseError(`expected ${what} (a finite number), found "${t.slice(start, p)}"`, this.line);
    return v;
  }
}

interface OptionLine { unit: number; parameter: TouchstoneParameter; format: TouchstoneNumberFormat; r: number }

function parseOptionLine(body: string, line: number): OptionLine {
  const out: OptionLine = { unit: 1e9, parameter: 'S', format: 'MA', r: 50 };
  const tok = body.slice(1).trim().split(/\s+/).filter((s) => s.length > 0);
  for (let i = 0; i < tok.length; i++) {
    const u = tok[i].toUpperCase();
    if (u in UNIT_SCALE) out.unit = UNIT_SCALE[u];
    else if (u === 'S' || u === 'Y' || u === 'Z' || u === 'G' || u === 'H') out.parameter = u;
    else if (u === 'DB' || u === 'MA' || u === 'RI') out.format = u;
    else if (u === 'R') {
      const v = Number(tok[i + 1]);
      if (tok[i + 1] === undefined || !Number.isFinite(v) || !(v > 0)) {
        throw new ParseError(`option line: expected a positive reference resistance after "R", found "${tok[i + 1] ?? 'end of line'}"`, line);
      }
      out.r = v;
      i++;
    } else {
      throw new ParseError(`option line: unexpected "${tok[i]}"; expected a frequency unit (Hz, kHz, MHz, GHz), a parameter (S, Y, Z, G, H), a format (DB, MA, RI) or "R <ohms>"`, line);
    }
  }
  return out;
}

/** Converts a pair in the file's format to re/im. */
function pairToComplex(a: number, b: number, format: TouchstoneNumberFormat, out: Float64Array, o: number): void {
  if (format === 'RI') { out[o] = a; out[o + 1] = b; return; }
  const mag = format === 'MA' ? a : 10 ** (a / 20); // may overflow to Infinity: checked by the caller
  const ang = (b * Math.PI) / 180;
  out[o] = mag * Math.cos(ang);
  out[o + 1] = mag * Math.sin(ang);
}

/** Grows a Float64Array to hold at least `need` entries. */
function ensure(buf: Float64Array, need: number): Float64Array {
  if (need <= buf.length) return buf;
  const next = new Float64Array(Math.max(need, Math.ceil(1.5 * buf.length)));
  next.set(buf);
  return next;
}

interface Layout { n: number; order: Int32Array; symmetric: 'full' | 'lower' | 'upper' }

/** Position (row-major index) of each value read, in file order. */
function makeLayout(n: number, twoPortOrder: '12_21' | '21_12', matrix: 'full' | 'lower' | 'upper'): Layout {
  const idx: number[] = [];
  if (n === 2 && matrix === 'full') {
    if (twoPortOrder === '21_12') idx.push(0, 2, 1, 3); else idx.push(0, 1, 2, 3);
  } else {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      if (matrix === 'full' || (matrix === 'lower' && j <= i) || (matrix === 'upper' && j >= i)) idx.push(i * n + j);
    }
  }
  return { n, order: Int32Array.from(idx), symmetric: matrix };
}

interface DataResult { freq: Float64Array; data: Float64Array; nf: number; noise?: Omit<TouchstoneNoiseTable, 'referenceOhm'> }

function readNoise(sc: Scanner, opt: OptionLine, firstFreq: number | null, expect: number | null, comments: string[]): Omit<TouchstoneNoiseTable, 'referenceOhm'> {
  const f: number[] = [], nfmin: number[] = [], g: number[] = [], rn: number[] = [];
  let pending = firstFreq;
  for (;;) {
    sc.skipSpace(comments);
    if (pending === null) {
      if (sc.pos >= sc.text.length || !sc.atNumberStart()) break;
      if (expect !== null && f.length === expect) break;
      pending = sc.number('a noise-data frequency') * opt.unit;
    }
    const fr = pending;
    pending = null;
    if (f.length > 0 && !(fr > f[f.length - 1])) throw new ParseError(`noise data: frequencies must increase strictly; ${hzText(fr)} follows ${hzText(f[f.length - 1])}`, sc.line);
    sc.skipSpace(comments);
    const a = sc.number('the minimum noise figure [dB]');
    sc.skipSpace(comments);
    const m = sc.number('the magnitude of the optimum reflection coefficient');
    sc.skipSpace(comments);
    const ang = sc.number('the angle of the optimum reflection coefficient [deg]');
    sc.skipSpace(comments);
    const r = sc.number('the normalised noise resistance');
    if (!(m >= 0 && m < 1) || !(r >= 0) || !(a >= 0)) {
      throw new ParseError(`noise data: expected F_min ≥ 0 dB, 0 ≤ |Γ_opt| < 1 and R_n ≥ 0, found ${a}, ${m}, ${r}`, sc.line);
    }
    f.push(fr); nfmin.push(a); g.push(m * Math.cos((ang * Math.PI) / 180), m * Math.sin((ang * Math.PI) / 180)); rn.push(r * opt.r);
  }
  if (expect !== null && f.length !== expect) throw new ParseError(`noise data: [Number of Noise Frequencies] is ${expect}, but ${f.length} rows were found`, sc.line);
  if (f.length === 0) throw new ParseError('noise data: expected at least one row of 5 numbers', sc.line);
  return { frequencyHz: Float64Array.from(f), minimumNoiseFigureDb: Float64Array.from(nfmin), optimumReflection: Float64Array.from(g), noiseResistanceOhm: Float64Array.from(rn) };
}

/** Reads network data blocks. v1: until end (or noise start for 2-ports); v2: exactly `count` blocks. */
/**
 * When every data line holds 1 + 2m² numbers — one frequency and m² complex values, the
 * one-line-per-frequency layout of m-port data — but the file is read as n-port, say so:
 * the usual cause is a file name whose .sNp extension disagrees with its data.
 */
function portCountHint(block: string, n: number): string {
  const counts = block.split(/\r\n|\n|\r/).map((l) => l.replace(/!.*$/, '').trim()).filter((l) => l !== '' && !l.startsWith('#') && !l.startsWith('[')).map((l) => l.split(/[\s,]+/).length);
  if (counts.length < 2 || counts.some((c) => c !== counts[0])) return '';
  const m = Math.round(Math.sqrt((counts[0] - 1) / 2));
  if (m === n || 1 + 2 * m * m !== counts[0]) return '';
  return `; every data line holds ${counts[0] - 1} numbers after its frequency, as ${m}-port data does, but the file is read as ${n}-port (from its .s${n}p name or the ports option); name ${m}-port data .s${m}p`;
}

function readNetworkData(sc: Scanner, layout: Layout, opt: OptionLine, count: number | null, allowNoise: boolean, comments: string[]): DataResult {
  const n = layout.n;
  const nn = n * n;
  const per = layout.order.length;
  // A block has at least 4 characters per value pair: that bounds the first allocation by the text
  // (a corrupted count cannot allocate more than the text could hold). Without a count (version 1)
  // the capacity is re-estimated from the length of the first block.
  const minCap = Math.floor((sc.text.length - sc.pos) / (4 * per + 2)) + 1;
  const cap = Math.max(1, Math.min(count ?? 1, minCap));
  let freq: Float64Array = new Float64Array(cap);
  let data: Float64Array = new Float64Array(2 * nn * cap);
  let nf = 0;
  let last = -Infinity;
  const blockStart = sc.pos;
  const pair = new Float64Array(2);
  const ri = opt.format === 'RI';
  const sym = layout.symmetric !== 'full';
  for (;;) {
    sc.skipSpace(comments);
    if (sc.pos >= sc.text.length || !sc.atNumberStart()) break;
    if (count !== null && nf === count) break;
    const fr = sc.number('a frequency') * opt.unit;
    if (!(fr > last)) {
      if (allowNoise && nf > 0) {
        return { freq, data, nf, noise: readNoise(sc, opt, fr, null, comments) };
      }
      throw new ParseError(`frequencies must increase strictly; ${hzText(fr)} follows ${hzText(last)}`, sc.line);
    }
    if (fr < 0) throw new ParseError(`expected a frequency ≥ 0, found ${fr}`, sc.line);
    last = fr;
    freq = ensure(freq, nf + 1);
    data = ensure(data, 2 * nn * (nf + 1));
    freq[nf] = fr;
    const base = 2 * nn * nf;
    for (let v = 0; v < per; v++) {
      sc.skipSpace(comments);
      if (sc.pos >= sc.text.length) throw new ParseError(`unexpected end of file inside the data of frequency ${hzText(fr)}: expected ${2 * per} numbers after the frequency, found ${2 * v}${portCountHint(sc.text.slice(blockStart), n)}`, sc.eofLine());
      const a = sc.number('a network-data value');
      sc.skipSpace(comments);
      if (sc.pos >= sc.text.length) throw new ParseError(`unexpected end of file inside the data of frequency ${hzText(fr)}`, sc.eofLine());
      const b = sc.number('a network-data value');
      if (ri) { pair[0] = a; pair[1] = b; } else pairToComplex(a, b, opt.format, pair, 0);
      const q = layout.order[v];
      data[base + 2 * q] = pair[0];
      data[base + 2 * q + 1] = pair[1];
      if (sym) {
        const i = Math.floor(q / n), j = q % n;
        data[base + 2 * (j * n + i)] = pair[0];
        data[base + 2 * (j * n + i) + 1] = pair[1];
      }
    }
    nf++;
    if (nf === 1 && count === null) {
      const used = Math.max(1, sc.pos - blockStart);
      const estimate = Math.min(minCap, Math.ceil(((sc.text.length - blockStart) / used) * 1.02) + 1);
      freq = ensure(freq, estimate);
      data = ensure(data, 2 * nn * estimate);
    }
  }
  if (nf === 0) throw new ParseError('expected network data (a frequency followed by its values), found none', sc.line);
  if (count !== null && nf !== count) throw new ParseError(`[Number of Frequencies] is ${count}, but ${nf} frequencies were found`, sc.pos >= sc.text.length ? sc.eofLine() : sc.line);
  return { freq, data, nf };
}

/** Scales normalised data to ohms/siemens and turns G/H into Y/Z (two-ports). */
function finishData(d: DataResult, n: number, parameter: TouchstoneParameter, refs: Float64Array, normalised: boolean, line: number): { form: 'scattering' | 'admittance' | 'impedance'; data: Float64Array } {
  const nn = n * n;
  const used = 2 * nn * d.nf;
  const data = d.data.length === used ? d.data : d.data.length <= 1.1 * used ? d.data.subarray(0, used) : d.data.slice(0, used);
  if (parameter === 'S') return { form: 'scattering', data };
  const r0 = refs[0];
  if (parameter === 'Z' || parameter === 'Y') {
    if (normalised) {
      const s = parameter === 'Z' ? r0 : 1 / r0;
      for (let q = 0; q < data.length; q++) data[q] *= s;
    }
    return { form: parameter === 'Z' ? 'impedance' : 'admittance', data };
  }
  if (n !== 2) throw new ParseError(`${parameter}-parameters are defined for two-ports only, but the file has ${n} ports`, line);
  // H: [V1; I2] = H [I1; V2] → Z; G: [I1; V2] = G [V1; I2] → Y (the dual). Normalised: H11/R, H22·R; G11·R, G22/R.
  const s11 = parameter === 'H' ? r0 : 1 / r0;
  for (let k = 0; k < d.nf; k++) {
    const o = 8 * k;
    if (normalised) {
      data[o] *= s11; data[o + 1] *= s11; data[o + 6] /= s11; data[o + 7] /= s11;
    }
    const [a, b, c, e, f, g, h, i] = data.subarray(o, o + 8);
    const m = h * h + i * i;
    if (!(m > 0)) throw new ParseError(`${parameter}22 = 0 at frequency ${hzText(d.freq[k])}: the network has no ${parameter === 'H' ? 'impedance' : 'admittance'} matrix`, line);
    const dr = a * h - b * i - (c * f - e * g), di = a * i + b * h - (c * g + e * f);
    const div = (xr: number, xi: number): [number, number] => [(xr * h + xi * i) / m, (xi * h - xr * i) / m];
    const [p11r, p11i] = div(dr, di);
    const [p12r, p12i] = div(c, e);
    const [p21r, p21i] = div(-f, -g);
    const [p22r, p22i] = div(1, 0);
    data.set([p11r, p11i, p12r, p12i, p21r, p21i, p22r, p22i], o);
  }
  return { form: parameter === 'H' ? 'impedance' : 'admittance', data };
}

function build(d: DataResult, n: number, parameter: TouchstoneParameter, refs: Float64Array, normalised: boolean, line: number): Multiport {
  const { form, data } = finishData(d, n, parameter, refs, normalised, line);
  for (let q = 0; q < data.length; q++) {
    if (!Number.isFinite(data[q])) {
      const k = Math.floor(q / (2 * n * n));
      throw new ParseError(`a value at frequency ${hzText(d.freq[k])} is not finite after conversion (e.g. a dB magnitude too large)`, line);
    }
  }
  const referenceOhm = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) referenceOhm[2 * i] = refs[i];
  const portNames = Array.from({ length: n }, (_, i) => String(i + 1));
  return { ports: n, frequencyHz: d.freq.slice(0, d.nf), form, data, referenceOhm, waves: 'power', portNames };
}

function noiseTable(d: DataResult, r: number): TouchstoneNoiseTable | undefined {
  return d.noise ? { ...d.noise, referenceOhm: r } : undefined;
}

function parseV1(sc: Scanner, options: TouchstoneParseOptions, comments: string[]): TouchstoneData {
  let opt: OptionLine | null = null;
  for (;;) {
    sc.skipSpace(comments);
    if (sc.pos >= sc.text.length) throw new ParseError('expected network data, found the end of the file', sc.line);
    const c = sc.text[sc.pos];
    if (c === '#') {
      const line = sc.line;
      const body = sc.restOfLine(comments);
      if (!opt) opt = parseOptionLine(body, line); // later option lines are ignored (version 1 rule)
    } else if (c === '[') {
      throw new ParseError(`unexpected keyword "${sc.restOfLine(null).slice(0, 40)}" in a version 1 file; a version 2 file must start with [Version] 2.0`, sc.line);
    } else break;
  }
  opt ??= { unit: 1e9, parameter: 'S', format: 'MA', r: 50 };
  let n = options.ports;
  if (n === undefined) {
    // count numbers on the first data line
    let e = sc.text.indexOf('\n', sc.pos);
    if (e < 0) e = sc.text.length;
    const body = sc.text.slice(sc.pos, e).split('!')[0].trim();
    const count = body.split(/\s+/).length;
    if (count === 3) n = 1; else if (count === 9) n = 2;
    else throw new ParseError(`cannot tell the number of ports from the first data line (${count} numbers; 3 means a one-port, 9 a two-port); pass options.ports (the N of the .sNp extension)`, sc.line);
  } else if (!Number.isInteger(n) || n < 1 || n > MAX_PORTS) {
    throw new DomainError(`invalid option "ports": expected an integer in [1, ${MAX_PORTS}], received ${describeValue(n)}.`);
  }
  const layout = makeLayout(n, '21_12', 'full');
  const startLine = sc.line;
  const d = readNetworkData(sc, layout, opt, null, n === 2, comments);
  sc.skipSpace(comments);
  if (sc.pos < sc.text.length) {
    throw new ParseError(`unexpected "${sc.restOfLine(null).slice(0, 40)}"; expected a number or the end of the file`, sc.line);
  }
  const refs = new Float64Array(n).fill(opt.r);
  const network = build(d, n, opt.parameter, refs, true, startLine);
  const noise = noiseTable(d, opt.r);
  return { version: 1, parameter: opt.parameter, network, comments, ...(noise ? { noise } : {}) };
}

function keyword(body: string, line: number): { name: string; value: string } {
  const close = body.indexOf(']');
  if (close < 0) throw new ParseError(`a keyword must be enclosed in brackets, found "${body.slice(0, 40)}"`, line);
  return { name: body.slice(1, close).trim().toLowerCase().replace(/\s+/g, ' '), value: body.slice(close + 1).trim() };
}

function parseIntValue(v: string, name: string, line: number, min: number): number {
  if (!/^\d+$/.test(v)) throw new ParseError(`[${name}]: expected an integer ≥ ${min}, found "${v.slice(0, 40)}"`, line);
  const x = Number(v);
  if (x < min || x > 1_000_000) throw new ParseError(`[${name}]: expected an integer in [${min}, 1000000], found ${x}`, line);
  return x;
}

function parseV2(sc: Scanner, comments: string[]): TouchstoneData {
  // [Version] already consumed
  let opt: OptionLine | null = null;
  let n: number | null = null;
  let order: '12_21' | '21_12' | null = null;
  let nf: number | null = null;
  let nnf: number | null = null;
  let refs: Float64Array | null = null;
  let matrix: 'full' | 'lower' | 'upper' = 'full';
  for (;;) {
    sc.skipSpace(comments);
    if (sc.pos >= sc.text.length) throw new ParseError('expected [Network Data] before the end of the file', sc.line);
    const line = sc.line;
    const c = sc.text[sc.pos];
    if (c === '#') {
      if (opt) throw new ParseError('a version 2 file may have only one option line', line);
      opt = parseOptionLine(sc.restOfLine(comments), line);
      continue;
    }
    if (c !== '[') throw new ParseError(`expected a keyword in brackets or the option line, found "${sc.restOfLine(null).slice(0, 40)}"`, line);
    const { name, value } = keyword(sc.restOfLine(comments), line);
    if (name === 'number of ports') {
      n = parseIntValue(value, 'Number of Ports', line, 1);
      if (n > MAX_PORTS) throw new ParseError(`[Number of Ports]: at most ${MAX_PORTS} ports are supported, found ${n}`, line);
    }
    else if (name === 'two-port data order') {
      const v = value.replace(/\s+/g, '');
      if (v !== '12_21' && v !== '21_12') throw new ParseError(`[Two-Port Data Order]: expected 12_21 or 21_12, found "${value.slice(0, 40)}"`, line);
      order = v;
    } else if (name === 'number of frequencies') nf = parseIntValue(value, 'Number of Frequencies', line, 1);
    else if (name === 'number of noise frequencies') nnf = parseIntValue(value, 'Number of Noise Frequencies', line, 1);
    else if (name === 'matrix format') {
      const v = value.toLowerCase();
      if (v !== 'full' && v !== 'lower' && v !== 'upper') throw new ParseError(`[Matrix Format]: expected Full, Lower or Upper, found "${value.slice(0, 40)}"`, line);
      matrix = v;
    } else if (name === 'reference') {
      if (n === null) throw new ParseError('[Reference] must follow [Number of Ports]', line);
      const vals: number[] = [];
      const sub = new Scanner(value + '\n');
      sub.line = line;
      for (;;) {
        sub.skipSpace(null);
        if (sub.pos >= sub.text.length) break;
        vals.push(sub.number('a reference resistance [Ω]'));
      }
      while (vals.length < n) {
        sc.skipSpace(comments);
        if (sc.pos >= sc.text.length || !sc.atNumberStart()) break;
        vals.push(sc.number('a reference resistance [Ω]'));
      }
      if (vals.length !== n || vals.some((v) => !(v > 0))) {
        throw new ParseError(`[Reference]: expected ${n} positive resistances (one per port), found ${vals.length}${vals.some((v) => !(v > 0)) ? ' including a non-positive one' : ''}`, line);
      }
      refs = Float64Array.from(vals);
    } else if (name === 'mixed-mode order') {
      throw new ParseError('[Mixed-Mode Order] (mixed-mode data) is not supported; convert the file to single-ended data', line);
    } else if (name === 'begin information') {
      for (;;) {
        sc.skipSpace(comments);
        if (sc.pos >= sc.text.length) throw new ParseError('[Begin Information] without [End Information]', line);
        const body = sc.restOfLine(comments);
        if (body.startsWith('[') && keyword(body, sc.line).name === 'end information') break;
      }
    } else if (name === 'network data') {
      break;
    } else if (name === 'version') {
      throw new ParseError('[Version] may appear only once, as the first keyword', line);
    } else {
      throw new ParseError(`unknown or misplaced keyword [${name}]`, line);
    }
  }
  const startLine = sc.line;
  if (!opt) throw new ParseError('a version 2 file needs an option line (#) before [Network Data]', startLine);
  if (n === null) throw new ParseError('[Number of Ports] is required before [Network Data]', startLine);
  if (nf === null) throw new ParseError('[Number of Frequencies] is required before [Network Data]', startLine);
  if (n === 2 && order === null) throw new ParseError('[Two-Port Data Order] is required for a two-port before [Network Data]', startLine);
  if (matrix !== 'full' && opt.parameter !== 'S' && opt.parameter !== 'Y' && opt.parameter !== 'Z') {
    throw new ParseError(`[Matrix Format] ${matrix} needs S, Y or Z data`, startLine);
  }
  const referenceOhm = refs ?? new Float64Array(n).fill(opt.r);
  const d = readNetworkData(sc, makeLayout(n, order ?? '12_21', matrix), opt, nf, false, comments);
  let noise: TouchstoneNoiseTable | undefined;
  let sawEnd = false;
  for (;;) {
    sc.skipSpace(comments);
    if (sc.pos >= sc.text.length) break;
    const line = sc.line;
    if (sc.text[sc.pos] !== '[') throw new ParseError(`expected [Noise Data] or [End] after ${nf} frequencies of network data, found "${sc.restOfLine(null).slice(0, 40)}"`, line);
    const { name } = keyword(sc.restOfLine(comments), line);
    if (name === 'noise data' && !noise) {
      if (n !== 2) throw new ParseError('[Noise Data] is allowed for two-ports only', line);
      if (nnf === null) throw new ParseError('[Noise Data] needs [Number of Noise Frequencies] in the header', line);
      noise = { ...readNoise(sc, opt, null, nnf, comments), referenceOhm: referenceOhm[0] };
    } else if (name === 'end') {
      sawEnd = true;
      sc.skipSpace(comments);
      if (sc.pos < sc.text.length) throw new ParseError(`nothing may follow [End], found "${sc.restOfLine(null).slice(0, 40)}"`, sc.line);
      break;
    } else {
      throw new ParseError(`unexpected keyword [${name}] after the network data; expected [Noise Data] or [End]`, line);
    }
  }
  if (!sawEnd) throw new ParseError('expected [End] at the end of a version 2 file', sc.eofLine());
  if (nnf !== null && !noise) throw new ParseError(`[Number of Noise Frequencies] is ${nnf} but there is no [Noise Data]`, sc.line);
  const network = build(d, n, opt.parameter, referenceOhm, false, startLine);
  return { version: 2, parameter: opt.parameter, network, comments, ...(noise ? { noise } : {}) };
}

/**
 * Parses a Touchstone file (version 1 or 2) from a string.
 *
 * @remarks
 * Version 1: option line `# <unit> <parameter> <format> R <ohms>` (defaults GHz S MA R 50;
 * only the first option line counts), one frequency block per frequency, two-ports in the
 * order 11 21 12 22, larger networks row by row (any line wrapping is accepted); Z, Y, G and H
 * data are normalised to R and are scaled back here; a two-port file may end with a noise
 * block, recognised by its first frequency not exceeding the last network frequency.
 * Version 2: [Version] 2.0, the option line, [Number of Ports], [Two-Port Data Order]
 * (two-ports), [Number of Frequencies], [Number of Noise Frequencies], [Reference] (one real
 * resistance per port, may span lines), [Matrix Format] Full/Lower/Upper, [Begin Information]
 * … [End Information] (skipped), [Network Data], [Noise Data], [End]; Z and Y data are in ohms
 * and siemens (not normalised). [Mixed-Mode Order] is rejected. Noise rows are
 * `f F_min[dB] |Γ_opt| ∠Γ_opt[deg] R_n/R_ref`, R_ref the reference of port 1.
 * Every malformed input throws {@link ParseError} with the line number; nothing is returned
 * partially.
 * @param text - The file contents.
 * @param options - Port count of version 1 files.
 * @returns The network, optional noise table and the comments.
 * @throws {@link ParseError} on malformed input; {@link DomainError} on a bad `options.ports`.
 * @example
 * ```ts
 * const { network } = parseTouchstone('# MHz S RI R 50\n100 0.2 0.1\n200 0.25 0.05\n');
 * ```
 * @category Network
 */
export function parseTouchstone(text: string, options: TouchstoneParseOptions = {}): TouchstoneData {
  if (typeof text !== 'string') throw new ParseError(`expected the file contents as a string, received ${describeValue(text)}`);
  const sc = new Scanner(text);
  const comments: string[] = [];
  sc.skipSpace(comments);
  if (sc.text[sc.pos] === '[') {
    const line = sc.line;
    const { name, value } = keyword(sc.restOfLine(comments), line);
    if (name !== 'version') throw new ParseError(`a file that starts with a keyword must start with [Version], found [${name}]`, line);
    if (value !== '2.0' && value !== '2.1') throw new ParseError(`[Version]: expected 2.0 or 2.1, found "${value.slice(0, 40)}"`, line);
    return parseV2(sc, comments);
  }
  sc.pos = 0; sc.line = 1;
  comments.length = 0;
  return parseV1(sc, options, comments);
}

/**
 * Options of {@link formatTouchstone}.
 * @category Network
 */
export interface TouchstoneFormatOptions {
  /** File version. @defaultValue 2 */
  version?: 1 | 2;
  /** Parameter written: S (with the network's references), Y or Z. @defaultValue 'S' */
  parameter?: 'S' | 'Y' | 'Z';
  /** Number pair format. @defaultValue 'RI' */
  format?: TouchstoneNumberFormat;
  /** Frequency unit. @defaultValue 'GHz' */
  frequencyUnit?: TouchstoneFrequencyUnit;
  /** Version 2 matrix format (Lower/Upper require symmetric data). @defaultValue 'full' */
  matrixFormat?: 'full' | 'lower' | 'upper';
  /** Significant digits per number; omit for the shortest exact representation. */
  significantDigits?: number;
  /** Comment lines written at the top (without '!'). */
  comments?: ReadonlyArray<string>;
  /** Noise parameters to append (two-ports only). */
  noise?: TouchstoneNoiseTable;
}

/**
 * Writes a network as a Touchstone file (version 1 or 2).
 *
 * @remarks
 * References must be real (Touchstone stores resistances); version 1 also needs one
 * reference for all ports. Version 1 files of three or more ports put each matrix row on
 * new lines with at most four pairs per line; version 2 files write each frequency block on
 * one line per matrix row. Two-ports are written 11 21 12 22 (version 2 states
 * [Two-Port Data Order] 21_12). Y and Z are normalised to R in version 1 only.
 * @param net - The network.
 * @param options - See {@link TouchstoneFormatOptions}.
 * @returns The file contents.
 * @throws {@link DomainError} on complex or (version 1) unequal references, non-symmetric
 *   data with a Lower/Upper format, or noise on a network that is not a two-port.
 * @category Network
 */
export function formatTouchstone(net: Multiport, options: TouchstoneFormatOptions = {}): string {
  assertMultiport('net', net);
  const version = options.version ?? 2;
  const parameter = options.parameter ?? 'S';
  const format = options.format ?? 'RI';
  const unit = options.frequencyUnit ?? 'GHz';
  const matrix = options.matrixFormat ?? 'full';
  if (version !== 1 && version !== 2) throw new DomainError(`invalid option "version": expected 1 or 2, received ${describeValue(version)}.`);
  if (parameter !== 'S' && parameter !== 'Y' && parameter !== 'Z') throw new DomainError(`invalid option "parameter": expected 'S', 'Y' or 'Z', received ${describeValue(parameter)}.`);
  if (format !== 'RI' && format !== 'MA' && format !== 'DB') throw new DomainError(`invalid option "format": expected 'RI', 'MA' or 'DB', received ${describeValue(format)}.`);
  if (!(unit in UNIT_NAME)) throw new DomainError(`invalid option "frequencyUnit": expected Hz, kHz, MHz or GHz, received ${describeValue(unit)}.`);
  if (matrix !== 'full' && matrix !== 'lower' && matrix !== 'upper') throw new DomainError(`invalid option "matrixFormat": expected 'full', 'lower' or 'upper', received ${describeValue(matrix)}.`);
  if (version === 1 && matrix !== 'full') throw new DomainError('invalid option "matrixFormat": version 1 files are always full; use version 2.');
  const digits = options.significantDigits;
  if (digits !== undefined && (!Number.isInteger(digits) || digits < 1 || digits > 17)) {
    throw new DomainError(`invalid option "significantDigits": expected an integer in [1, 17], received ${describeValue(digits)}.`);
  }
  const n = net.ports;
  const ref = net.referenceOhm;
  for (let i = 0; i < n; i++) {
    if (ref[2 * i + 1] !== 0) throw new DomainError(`invalid argument "net": port ${i} has a complex reference impedance (${ref[2 * i]} + ${ref[2 * i + 1]}j Ω); Touchstone stores real resistances; renormalise with renormalizeMultiport first.`);
    if (version === 1 && ref[2 * i] !== ref[0]) throw new DomainError(`invalid argument "net": version 1 files have one reference for all ports, but port ${i} has ${ref[2 * i]} Ω and port 0 ${ref[0]} Ω; write version 2.`);
  }
  if (options.noise && n !== 2) throw new DomainError(`invalid option "noise": noise data are defined for two-ports only, the network has ${n} ports.`);
  if (options.noise && options.noise.referenceOhm !== ref[0]) {
    throw new DomainError(`invalid option "noise": its reference (${options.noise.referenceOhm} Ω) must equal the reference of port 1 (${ref[0]} Ω), to which the file's Γ_opt and R_n are normalised.`);
  }
  const form = parameter === 'S' ? 'scattering' : parameter === 'Y' ? 'admittance' : 'impedance';
  const data = convertMultiport(net, form).data;
  const scale = version === 1 && parameter !== 'S' ? (parameter === 'Z' ? 1 / ref[0] : ref[0]) : 1;
  const fScale = 1 / UNIT_SCALE[unit.toUpperCase()];
  const num = digits === undefined ? (x: number): string => String(x) : (x: number): string => x.toPrecision(digits);
  const pairText = (re: number, im: number): string => {
    if (format === 'RI') return `${num(re * scale)} ${num(im * scale)}`;
    const mag = Math.hypot(re, im) * scale;
    const ang = (Math.atan2(im, re) * 180) / Math.PI;
    return `${num(format === 'MA' ? mag : 20 * Math.log10(mag))} ${num(ang)}`;
  };
  const nn = n * n;
  if (matrix !== 'full') {
    for (let k = 0; k < net.frequencyHz.length; k++) for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
      const p = 2 * (k * nn + i * n + j), q = 2 * (k * nn + j * n + i);
      const tol = 1e-12 * (Math.hypot(data[p], data[p + 1]) + Math.hypot(data[q], data[q + 1]));
      if (Math.hypot(data[p] - data[q], data[p + 1] - data[q + 1]) > tol) {
        throw new DomainError(`invalid option "matrixFormat": ${matrix} stores half of a symmetric matrix, but entry (${i}, ${j}) differs from (${j}, ${i}) at frequency index ${k}; use 'full'.`);
      }
    }
  }
  const out: string[] = [];
  for (const c of options.comments ?? []) out.push(`!${String(c).replace(/[\r\n]+/g, ' ')}`);
  const refText = String(ref[0]);
  if (version === 2) {
    out.push('[Version] 2.0');
    out.push(`# ${UNIT_NAME[unit]} ${parameter} ${format} R ${refText}`);
    out.push(`[Number of Ports] ${n}`);
    if (n === 2) out.push('[Two-Port Data Order] 21_12');
    out.push(`[Number of Frequencies] ${net.frequencyHz.length}`);
    if (options.noise) out.push(`[Number of Noise Frequencies] ${options.noise.frequencyHz.length}`);
    out.push(`[Reference] ${Array.from({ length: n }, (_, i) => String(ref[2 * i])).join(' ')}`);
    out.push(`[Matrix Format] ${matrix === 'full' ? 'Full' : matrix === 'lower' ? 'Lower' : 'Upper'}`);
    out.push('[Network Data]');
  } else {
    out.push(`# ${UNIT_NAME[unit]} ${parameter} ${format} R ${refText}`);
  }
  for (let k = 0; k < net.frequencyHz.length; k++) {
    const o = 2 * k * nn;
    const f = num(net.frequencyHz[k] * fScale);
    const at = (i: number, j: number): string => pairText(data[o + 2 * (i * n + j)], data[o + 2 * (i * n + j) + 1]);
    if (n <= 2 && matrix === 'full') {
      const cells = n === 1 ? [at(0, 0)] : [at(0, 0), at(1, 0), at(0, 1), at(1, 1)];
      out.push(`${f} ${cells.join(' ')}`);
      continue;
    }
    for (let i = 0; i < n; i++) {
      const j0 = matrix === 'upper' ? i : 0;
      const j1 = matrix === 'lower' ? i + 1 : n;
      const cells: string[] = [];
      for (let j = j0; j < j1; j++) cells.push(at(i, j));
      const perLine = version === 1 ? 4 : cells.length;
      for (let c = 0; c < cells.length; c += perLine) {
        const lead = i === 0 && c === 0 ? `${f} ` : '  ';
        out.push(lead + cells.slice(c, c + perLine).join(' '));
      }
    }
  }
  if (options.noise) {
    const t = options.noise;
    if (version === 2) out.push('[Noise Data]');
    for (let k = 0; k < t.frequencyHz.length; k++) {
      const gr = t.optimumReflection[2 * k], gi = t.optimumReflection[2 * k + 1];
      out.push(`${num(t.frequencyHz[k] * fScale)} ${num(t.minimumNoiseFigureDb[k])} ${num(Math.hypot(gr, gi))} ${num((Math.atan2(gi, gr) * 180) / Math.PI)} ${num(t.noiseResistanceOhm[k] / t.referenceOhm)}`);
    }
  }
  if (version === 2) out.push('[End]');
  return out.join('\n') + '\n';
}
