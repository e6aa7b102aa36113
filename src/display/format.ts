/**
 * Text summaries of phasewise results for people at a prompt: complex matrices with shape,
 * norm and elided corners; multiports; noise parameters; tapers; pattern, beam, reception,
 * measurement and design figures, each field with the unit its name carries. Browser-safe:
 * no Node module is imported; Node's REPL reaches these summaries through the
 * `Symbol.for('nodejs.util.inspect.custom')` hook of {@link ./attach.ts}.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';

/**
 * The kinds of result {@link show} recognises. A result made by a phasewise function carries
 * its kind (see docs/display.md); plain data (parsed JSON, a result that crossed a worker
 * thread) is recognised by its fields.
 * @category Display
 */
export type ResultKind =
  | 'CMatrix' | 'Multiport' | 'TwoPortNoiseParameters' | 'Taper' | 'LineTaperFigures' | 'PlanarTaperFigures' | 'NullSynthesisResult'
  | 'CutFigures' | 'BeamFigures' | 'ScanSweepResult' | 'ReceivingArrayEvaluation' | 'FrequencyEvaluation' | 'DesignEvaluation'
  | 'YFactorResult' | 'OnOffResult' | 'PhysicalCheck' | 'Figure';

/**
 * Options of {@link show}.
 * @category Display
 */
export interface ShowOptions {
  /**
   * Significant digits of every number.
   * @defaultValue 4
   */
  digits?: number;
  /**
   * Rows of a matrix shown before eliding the middle ones (first and last rows are kept).
   * @defaultValue 8
   */
  maxRows?: number;
  /**
   * Columns of a matrix shown before eliding the middle ones.
   * @defaultValue 6
   */
  maxCols?: number;
}

/** Resolved options. */
interface Opts { digits: number; maxRows: number; maxCols: number }

/** Symbol under which a displayable prototype stores its result kind (never serialised). @internal */
export const RESULT_KIND: unique symbol = Symbol('phasewise.resultKind');

/**
 * Units written at the end of field names (STYLE.md §3), longest first: the suffix must follow
 * a lower-case letter or a digit (camelCase boundary).
 */
const UNIT_SUFFIXES: ReadonlyArray<readonly [string, string]> = [
  ['WPerM2Hz', 'W m⁻² Hz⁻¹'], ['M2PerK', 'm²/K'], ['DbPerK', 'dB/K'], ['K2', 'K²'], ['M2', 'm²'], ['Ohm', 'Ω'], ['Hz', 'Hz'],
  ['Jy', 'Jy'], ['Db', 'dB'], ['Deg', 'deg'], ['Rad', 'rad'], ['Ms', 'ms'], ['Np', 'Np'], ['K', 'K'], ['M', 'm'], ['S', 'S'],
];

/**
 * The unit a field name carries at its end (`systemTemperatureK` → `'K'`), or `''`.
 * @param name - A field name in phasewise's camelCase-with-unit style.
 * @returns The unit symbol, empty when the name carries none.
 * @example
 * ```ts
 * unitOfField('sensitivityM2PerK'); // 'm²/K'
 * ```
 * @category Display
 */
export function unitOfField(name: string): string {
  for (const [suffix, unit] of UNIT_SUFFIXES) {
    if (name.length > suffix.length && name.endsWith(suffix) && /[a-z0-9]/.test(name[name.length - suffix.length - 1])) return unit;
  }
  return '';
}

const PREFIXES: ReadonlyArray<readonly [number, string]> = [[1e12, 'T'], [1e9, 'G'], [1e6, 'M'], [1e3, 'k']];

/** A number to `digits` significant digits, without trailing zeros; exponent form outside [1e-3, 1e6). */
export function formatNumber(x: number, digits: number): string {
  if (Number.isNaN(x)) return 'NaN';
  if (!Number.isFinite(x)) return x > 0 ? '∞' : '−∞';
  if (x === 0) return '0';
  const a = Math.abs(x);
  let s: string;
  if (a >= 1e-3 && a < 1e6) {
    s = x.toPrecision(digits);
    if (s.includes('e')) s = Number(s).toString();
    else if (s.includes('.')) s = s.replace(/\.?0+$/, '');
  } else {
    s = x.toExponential(digits - 1).replace(/\.?0+e/, 'e').replace('e+', 'e');
  }
  return s.replace(/^-/, '−');
}

/** A number with its unit; hertz get an SI prefix. */
function withUnit(x: number, unit: string, o: Opts): string {
  if (unit === 'Hz' && Number.isFinite(x)) {
    for (const [f, p] of PREFIXES) if (Math.abs(x) >= f) return `${formatNumber(x / f, o.digits + 2)} ${p}Hz`;
  }
  const n = formatNumber(x, o.digits);
  return unit ? `${n} ${unit}` : n;
}

/** a + bj with the sign of b. */
function complexText(re: number, im: number, o: Opts): string {
  const r = formatNumber(re, o.digits);
  const i = formatNumber(Math.abs(im), o.digits);
  return `${r}${im < 0 || Object.is(im, -0) ? '−' : '+'}${i}j`;
}

function isRecord(x: unknown): x is Record<string, unknown> {
  return x !== null && typeof x === 'object' && !Array.isArray(x) && !ArrayBuffer.isView(x);
}

function has(x: Record<string, unknown>, ...keys: string[]): boolean {
  return keys.every((k) => k in x);
}

function isCMatrix(x: unknown): x is CMatrix {
  return isRecord(x) && typeof x.rows === 'number' && typeof x.cols === 'number' && x.data instanceof Float64Array
    && x.data.length === 2 * x.rows * x.cols && !('ports' in x);
}

function isComplex(x: unknown): x is { re: number; im: number } {
  return isRecord(x) && typeof x.re === 'number' && typeof x.im === 'number' && Object.keys(x).length <= 2;
}

/**
 * The kind of a result: the one it carries, else the one its fields show, else `undefined`.
 * @param value - Any value.
 * @returns Its {@link ResultKind}, or `undefined` for data phasewise does not summarise specially.
 * @example
 * ```ts
 * resultKind(fromRows([[1, 2]])); // 'CMatrix'
 * ```
 * @category Display
 */
export function resultKind(value: unknown): ResultKind | undefined {
  if (!isRecord(value)) return undefined;
  const carried = (value as { [RESULT_KIND]?: ResultKind })[RESULT_KIND];
  if (carried !== undefined) return carried;
  const v = value;
  if (isCMatrix(v)) return 'CMatrix';
  if (has(v, 'ports', 'form', 'frequencyHz', 'referenceOhm', 'data')) return 'Multiport';
  if (has(v, 'minimumNoiseTemperatureK', 'noiseResistanceOhm', 'optimumSourceAdmittanceS')) return 'TwoPortNoiseParameters';
  if (has(v, 'bandSummary', 'frequencies', 'elementCount')) return 'DesignEvaluation';
  if (has(v, 'frequencyHz', 'beams', 'checks', 'quadrature')) return 'FrequencyEvaluation';
  if (has(v, 'budget', 'beams', 'weights')) return 'ReceivingArrayEvaluation';
  if (has(v, 'weights', 'beams') && Object.keys(v).length === 2) return 'ScanSweepResult';
  if (has(v, 'systemTemperatureK', 'sensitivityM2PerK')) return 'BeamFigures';
  if (has(v, 'peakAt', 'peakValue', 'halfPowerAt')) return 'CutFigures';
  if (has(v, 'efficiency', 'directivityLossDb', 'peakThetaRad')) return 'LineTaperFigures';
  if (has(v, 'efficiency', 'directivity') && 'peakSidelobeDb' in v) return 'PlanarTaperFigures';
  if (has(v, 'weights', 'warnings')) return 'Taper';
  if (has(v, 'yFactor', 'receiverTemperatureK')) return 'YFactorResult';
  if (has(v, 'aeOverTsysM2PerK', 'sefdJy')) return 'OnOffResult';
  if (has(v, 'name', 'value', 'limit', 'comparison', 'passed')) return 'PhysicalCheck';
  if (typeof v.svg === 'string' && typeof v.widthPx === 'number') return 'Figure';
  return undefined;
}

// ---------------------------------------------------------------------------------------------
// Complex matrices

/** Indices shown along one axis: all when ≤ max, else the first ⌈max/2⌉ and the last ⌊max/2⌋ with a gap (−1). */
function shownIndices(n: number, max: number): number[] {
  if (n <= max) return Array.from({ length: n }, (_, i) => i);
  const head = Math.ceil(max / 2), tail = Math.floor(max / 2);
  return [...Array.from({ length: head }, (_, i) => i), -1, ...Array.from({ length: tail }, (_, i) => n - tail + i)];
}

/** Frobenius norm of an interleaved block. */
function frobenius(data: Float64Array, offset: number, count: number): number {
  let s = 0;
  for (let k = 0; k < 2 * count; k++) s += data[offset + k] * data[offset + k];
  return Math.sqrt(s);
}

/** The grid of entries of an r×c block (elided corners), one text line per shown row. */
function gridLines(rows: number, cols: number, data: Float64Array, offset: number, o: Opts, unit = ''): string[] {
  const ri = shownIndices(rows, o.maxRows), ci = shownIndices(cols, o.maxCols);
  const cells = ri.map((i) => ci.map((j) => (i < 0 ? (j < 0 ? '⋱' : '⋮') : j < 0 ? '…' : complexText(data[offset + 2 * (i * cols + j)], data[offset + 2 * (i * cols + j) + 1], o))));
  const widths = ci.map((_, k) => Math.max(...cells.map((r) => r[k].length)));
  return cells.map((r) => '  [ ' + r.map((t, k) => t.padStart(widths[k])).join('  ') + ' ]' + (unit ? ` ${unit}` : ''));
}

function matrixHeader(a: CMatrix, o: Opts): string {
  const norm = formatNumber(frobenius(a.data, 0, a.rows * a.cols), o.digits);
  if (a.cols === 1) return `complex vector, ${a.rows} entries, ‖v‖₂ = ${norm}`;
  return `CMatrix ${a.rows}×${a.cols} complex, ‖A‖_F = ${norm}`;
}

/**
 * A complex matrix as text: shape, Frobenius norm and the entries, the middle rows and columns
 * elided (first and last kept) when the matrix is large.
 * @internal
 */
export function matrixText(a: CMatrix, o: Opts): string {
  const head = matrixHeader(a, o);
  if (a.rows === 0 || a.cols === 0) return `${head} (empty)`;
  return [head, ...gridLines(a.rows, a.cols, a.data, 0, o)].join('\n');
}

/** One-line summary of a matrix inside another result. */
function matrixLine(a: CMatrix, o: Opts): string {
  if (a.rows * a.cols <= 3) return `${a.rows}×${a.cols} [${Array.from({ length: a.rows * a.cols }, (_, k) => complexText(a.data[2 * k], a.data[2 * k + 1], o)).join(', ')}]`;
  return `${a.rows}×${a.cols} complex, ‖·‖_F = ${formatNumber(frobenius(a.data, 0, a.rows * a.cols), o.digits)}`;
}

// ---------------------------------------------------------------------------------------------
// Fields

/** A numeric series in one line: all values when few, else count, first…last and range. */
function seriesText(x: ArrayLike<number>, unit: string, o: Opts): string {
  const u = unit ? ` ${unit}` : '';
  if (x.length === 0) return '(none)';
  if (x.length <= 6) return '[' + Array.from(x, (v) => formatNumber(v, o.digits)).join(', ') + ']' + u;
  let lo = Infinity, hi = -Infinity;
  for (let i = 0; i < x.length; i++) { if (x[i] < lo) lo = x[i]; if (x[i] > hi) hi = x[i]; }
  return `${x.length} values [${formatNumber(x[0], o.digits)}, ${formatNumber(x[1], o.digits)}, …, ${formatNumber(x[x.length - 1], o.digits)}]${u}, range ${formatNumber(lo, o.digits)} … ${formatNumber(hi, o.digits)}${u}`;
}

function checksText(checks: readonly Record<string, unknown>[], o: Opts): string {
  const failed = checks.filter((c) => c.passed === false);
  if (failed.length === 0) return `${checks.length} physical checks, all passed`;
  return `${checks.length} physical checks, ${failed.length} FAILED: ` + failed.map((c) => `${String(c.name)} (${formatNumber(Number(c.value), o.digits)} ${c.comparison === 'atMost' ? '>' : '<'} ${formatNumber(Number(c.limit), o.digits)})`).join('; ');
}

/** The value of one field as one line of text. */
function fieldText(name: string, v: unknown, o: Opts, depth = 0): string {
  const unit = unitOfField(name);
  if (v === undefined || v === null) return '—';
  if (typeof v === 'number') return withUnit(v, unit, o);
  if (typeof v === 'boolean') return v ? 'yes' : 'no';
  if (typeof v === 'string') return v;
  if (typeof v === 'function') return '(function)';
  if (v instanceof Float64Array || v instanceof Float32Array || v instanceof Int32Array || v instanceof Uint8Array) return seriesText(v as ArrayLike<number>, unit, o);
  if (isCMatrix(v)) return matrixLine(v, o);
  if (isComplex(v)) return complexText(v.re, v.im, o) + (unit ? ` ${unit}` : '');
  if (Array.isArray(v)) {
    if (v.length === 0) return '(none)';
    if (v.every((x) => typeof x === 'number')) return seriesText(v as number[], unit, o);
    // Pairs such as [left, right] with a side not found (undefined; null after JSON).
    if (v.length <= 6 && v.every((x) => typeof x === 'number' || x === undefined || x === null)) {
      return '[' + v.map((x) => (typeof x === 'number' ? formatNumber(x, o.digits) : '—')).join(', ') + ']' + (unit ? ` ${unit}` : '');
    }
    if (v.every((x) => typeof x === 'string')) return v.length <= 8 ? v.join(', ') : `${v.slice(0, 6).join(', ')}, … (${v.length})`;
    if (v.every((x) => isRecord(x) && resultKind(x) === 'PhysicalCheck')) return checksText(v as Record<string, unknown>[], o);
    if (v.every((x) => isRecord(x) && 'code' in x && 'message' in x)) return v.map((x) => String((x as { code: unknown }).code)).join(', ');
    return `${v.length} × ${depth < 1 && isRecord(v[0]) ? inlineRecord(v[0] as Record<string, unknown>, o, depth + 1) : typeof v[0]}${v.length > 1 ? ', …' : ''}`;
  }
  if (isRecord(v)) {
    const k = resultKind(v);
    if (k === 'PhysicalCheck') return `${v.passed ? 'passed' : 'FAILED'} ${formatNumber(Number(v.value), o.digits)} ${v.comparison === 'atMost' ? '≤' : '≥'} ${formatNumber(Number(v.limit), o.digits)}`;
    return depth < 1 ? inlineRecord(v, o, depth + 1) : '{…}';
  }
  return String(v);
}

function inlineRecord(r: Record<string, unknown>, o: Opts, depth: number): string {
  const keys = Object.keys(r);
  if (keys.length === 0) return '(none)';
  const parts = keys.slice(0, 6).map((k) => `${k}: ${fieldText(k, r[k], o, depth)}`);
  return `{ ${parts.join(', ')}${keys.length > 6 ? ', …' : ''} }`;
}

/** A title line and one `name  value unit` line per field. */
function fieldsBlock(title: string, r: Record<string, unknown>, o: Opts, skip: readonly string[] = []): string {
  const keys = Object.keys(r).filter((k) => !skip.includes(k) && r[k] !== undefined);
  const w = Math.max(0, ...keys.map((k) => k.length));
  return [title, ...keys.map((k) => `  ${k.padEnd(w)}  ${fieldText(k, r[k], o)}`)].join('\n');
}

// ---------------------------------------------------------------------------------------------
// Tables of beams

const BEAM_COLUMNS: ReadonlyArray<readonly [string, string]> = [
  ['systemTemperatureK', 'T_sys [K]'], ['receiverTemperatureK', 'T_rec [K]'], ['effectiveAreaM2', 'A_e [m²]'],
  ['sensitivityM2PerK', 'A_e/T_sys [m²/K]'], ['radiationEfficiency', 'η_rad'], ['spilloverEfficiency', 'η_sp'],
  ['apertureEfficiency', 'η_ap'], ['gainOverTemperatureDbPerK', 'G/T [dB/K]'], ['sefdJy', 'SEFD [Jy]'],
];

/** A table with a header row; long tables keep their first and last rows. */
function table(header: readonly string[], rows: readonly string[][], o: Opts): string[] {
  const shown = shownIndices(rows.length, Math.max(o.maxRows, 4));
  const body = shown.map((i) => (i < 0 ? header.map(() => '⋮') : rows[i]));
  const widths = header.map((h, k) => Math.max(h.length, ...body.map((r) => r[k].length)));
  return [header.map((h, k) => h.padStart(widths[k])).join('  '), ...body.map((r) => r.map((t, k) => t.padStart(widths[k])).join('  '))].map((l) => '  ' + l);
}

/** Figures of many beams as a table (columns present in the first beam). */
function beamTable(beams: readonly Record<string, unknown>[], o: Opts, labels?: readonly string[]): string[] {
  if (beams.length === 0) return ['  (no beams)'];
  const cols = BEAM_COLUMNS.filter(([k]) => typeof beams[0][k] === 'number');
  const rows = beams.map((b, i) => [labels?.[i] ?? String(i), ...cols.map(([k]) => formatNumber(b[k] as number, o.digits))]);
  return table(['beam', ...cols.map(([, h]) => h)], rows, o);
}

// ---------------------------------------------------------------------------------------------
// Kinds

function multiportText(m: Record<string, unknown>, o: Opts): string {
  const n = m.ports as number;
  const f = m.frequencyHz as Float64Array;
  const form = String(m.form);
  const ref = m.referenceOhm as Float64Array;
  const unit = form === 'impedance' ? 'Ω' : form === 'admittance' ? 'S' : '';
  const band = f.length === 0 ? 'no frequencies' : f.length === 1 ? `at ${withUnit(f[0], 'Hz', o)}` : `${f.length} frequencies ${withUnit(f[0], 'Hz', o)} … ${withUnit(f[f.length - 1], 'Hz', o)}`;
  const refs: string[] = [];
  for (let k = 0; k < ref.length; k += 2) refs.push(ref[k + 1] === 0 ? formatNumber(ref[k], o.digits) : complexText(ref[k], ref[k + 1], o));
  const sameRef = refs.every((r) => r === refs[0]);
  const lines = [
    `Multiport: ${n} port${n === 1 ? '' : 's'}, ${form} form${unit ? ` [${unit}]` : ''}, ${band}`,
    `  ports       ${fieldText('portNames', m.portNames, o)}`,
    `  references  ${sameRef ? `${refs[0]} Ω (every port)` : refs.join(', ') + ' Ω'}, ${String(m.waves)} waves`,
    `  noise       ${m.noiseWaves ? 'noise-wave correlation carried' : 'none (noiseless)'}`,
  ];
  if (f.length > 0) {
    const data = m.data as Float64Array;
    lines.push(`  at ${withUnit(f[0], 'Hz', o)}:`, ...gridLines(n, n, data, 0, o).map((l) => '  ' + l));
    if (f.length > 1) lines.push(`  (${f.length - 1} more frequenc${f.length === 2 ? 'y' : 'ies'}; multiportMatrix(net, k) gives matrix k)`);
  }
  return lines.join('\n');
}

function noiseParametersText(p: Record<string, unknown>, o: Opts): string {
  const y = p.optimumSourceAdmittanceS as { re: number; im: number };
  const tmin = p.minimumNoiseTemperatureK as number;
  const fmin = 10 * Math.log10(1 + tmin / 290);
  return [
    'Two-port noise parameters',
    `  minimumNoiseTemperatureK  ${withUnit(tmin, 'K', o)}  (F_min = ${formatNumber(fmin, o.digits)} dB re 290 K)`,
    `  noiseResistanceOhm        ${withUnit(p.noiseResistanceOhm as number, 'Ω', o)}`,
    `  optimumSourceAdmittanceS  ${complexText(y.re, y.im, o)} S`,
  ].join('\n');
}

function taperText(t: Record<string, unknown>, o: Opts): string {
  const w = t.weights as ArrayLike<number> | CMatrix;
  const n = isCMatrix(w) ? w.rows : w.length;
  const warnings = (t.warnings as readonly { code: string; message: string }[]) ?? [];
  const head = `Taper design, ${n} elements${warnings.length ? `, ${warnings.length} warning${warnings.length === 1 ? '' : 's'}: ${warnings.map((x) => x.code).join(', ')}` : ', no warnings'}`;
  return fieldsBlock(head, t, o, ['warnings', 'distribution']);
}

function designText(d: Record<string, unknown>, o: Opts): string {
  const f = d.frequenciesHz as number[];
  const beams = d.beams as { thetaDeg?: number[]; phiDeg?: number[]; scanAngleDeg?: number[] } | undefined;
  const summary = (d.bandSummary as Record<string, unknown>[]) ?? [];
  const failed = (d.failedChecks as Record<string, unknown>[]) ?? [];
  const lines = [
    `Design evaluation "${String(d.title)}" (${String(d.fileName)})`,
    `  ${String(d.elementCount)} elements, ${String(d.beamformer)} beams, bandwidth ${withUnit(d.bandwidthHz as number, 'Hz', o)}`,
    `  band ${f.length} frequenc${f.length === 1 ? 'y' : 'ies'}: ${f.length ? `${withUnit(f[0], 'Hz', o)} … ${withUnit(f[f.length - 1], 'Hz', o)}` : '—'}`,
    '  band summary per beam (A_e/T_sys referred to the beamformer output):',
  ];
  const labels = summary.map((_, i) => (beams?.scanAngleDeg?.[i] !== undefined ? `${i}: scan ${formatNumber(beams.scanAngleDeg[i], 3)}°`
    : beams?.thetaDeg?.[i] !== undefined ? `${i}: θ/φ ${formatNumber(beams.thetaDeg[i], 3)}°/${formatNumber(beams.phiDeg?.[i] ?? 0, 3)}°` : String(i)));
  lines.push(...table(['beam', 'worst A_e/T_sys [m²/K]', 'at', 'band avg [m²/K]', 'worst G/T [dB/K]', 'worst SEFD [Jy]'], summary.map((s, i) => [
    labels[i], formatNumber(s.worstSensitivityM2PerK as number, o.digits), withUnit(s.worstFrequencyHz as number, 'Hz', o),
    formatNumber(s.bandAverageSensitivityM2PerK as number, o.digits), formatNumber(s.worstGainOverTemperatureDbPerK as number, o.digits),
    formatNumber(s.worstSefdJy as number, o.digits),
  ]), o));
  lines.push(failed.length === 0 ? '  checks: every figure passed its physical checks' : `  checks: ${failed.length} FAILED — ` + failed.map((c) => `${String(c.name)} at ${withUnit(c.frequencyHz as number, 'Hz', o)}`).join('; '));
  return lines.join('\n');
}

function frequencyText(e: Record<string, unknown>, o: Opts): string {
  const beams = e.beams as Record<string, unknown>[];
  return [
    `Frequency evaluation at ${withUnit(e.frequencyHz as number, 'Hz', o)}: sky ${withUnit(e.skyK as number, 'K', o)}, T_rec,min ${e.minimumReceiverTemperatureK !== null ? withUnit(e.minimumReceiverTemperatureK as number, 'K', o) : e.arrayFiguresComputed === false ? '— (array figures not computed)' : '— (check failed)'}`,
    ...beamTable(beams, o),
    `  ${checksText(e.checks as Record<string, unknown>[], o)}`,
  ].join('\n');
}

function receivingText(e: Record<string, unknown>, o: Opts): string {
  const w = e.weights as CMatrix;
  const eee = e.embeddedElementEfficiency as Float64Array;
  const q = e.quadrature as { weightSr?: ArrayLike<number> } | undefined;
  return [
    `Receiving-array evaluation: ${w.rows} ports, ${w.cols} beam${w.cols === 1 ? '' : 's'}, T_rec,min ${e.arrayFiguresComputed === false ? '— (array figures not computed)' : withUnit(e.minimumReceiverTemperatureK as number, 'K', o)}`,
    ...beamTable(e.beams as Record<string, unknown>[], o),
    `  embeddedElementEfficiency  ${seriesText(eee, '', o)}`,
    `  weights                    ${matrixLine(w, o)}`,
    `  quadrature                 ${q?.weightSr ? `${q.weightSr.length} directions` : '—'}`,
    `  ${checksText(e.checks as Record<string, unknown>[], o)}`,
  ].join('\n');
}

function sweepText(s: Record<string, unknown>, o: Opts): string {
  const w = s.weights as CMatrix;
  return [`Scan sweep: ${w.rows} ports, ${w.cols} beams; weights ${matrixLine(w, o)}`, ...beamTable(s.beams as Record<string, unknown>[], o)].join('\n');
}

const TITLES: Partial<Record<ResultKind, string>> = {
  BeamFigures: 'Beam figures (T_sys and A_e referred to the beamformer output)',
  CutFigures: 'Pattern-cut figures (positions in the cut variable)',
  LineTaperFigures: 'Line-taper figures',
  PlanarTaperFigures: 'Planar-taper figures',
  NullSynthesisResult: 'Null synthesis',
  YFactorResult: 'Y-factor reduction',
  OnOffResult: 'On/off-source sensitivity',
  PhysicalCheck: 'Physical check',
};

function resolve(options: ShowOptions | undefined): Opts {
  const digits = options?.digits ?? 4;
  const maxRows = options?.maxRows ?? 8;
  const maxCols = options?.maxCols ?? 6;
  return {
    digits: Number.isInteger(digits) && digits >= 1 && digits <= 17 ? digits : 4,
    maxRows: Number.isInteger(maxRows) && maxRows >= 2 ? maxRows : 8,
    maxCols: Number.isInteger(maxCols) && maxCols >= 2 ? maxCols : 6,
  };
}

/**
 * A compact, readable text summary of a phasewise result, with names and units: the same text
 * Node's REPL and a notebook kernel print for the result (through the inspect hook), usable in
 * the browser or anywhere a string is wanted.
 *
 * @remarks
 * Complex matrices show their shape, Frobenius norm and entries (a + bj), eliding the middle rows
 * and columns of large ones so that the corners stay visible; vectors show their 2-norm.
 * Multiports show form, band, references and the first frequency's matrix; tapers, pattern,
 * beam, reception, measurement and design results show each field with the unit its name
 * carries (`systemTemperatureK` → K, `sensitivityM2PerK` → m²/K, hertz with an SI prefix), many
 * beams as a table, and physical checks as a count with every failure named. Plain data without
 * a carried kind (parsed JSON, a result that crossed a worker thread) is recognised by its
 * fields; anything else is shown field by field. Numbers keep `digits` significant digits.
 * Conventions: docs/conventions.md; the display guide: docs/display.md.
 * @param value - A phasewise result (or any value).
 * @param options - Digits and elision limits.
 * @returns Multi-line text (no trailing newline).
 * @example
 * ```ts
 * show(fromRows([[1, { re: 0, im: -2 }], [3, 4]])).split('\n')[0]; // 'CMatrix 2×2 complex, ‖A‖_F = 5.477'
 * ```
 * @category Display
 */
export function show(value: unknown, options?: ShowOptions): string {
  const o = resolve(options);
  const kind = resultKind(value);
  if (kind === undefined) {
    if (value instanceof Float64Array) return seriesText(value, '', o);
    if (Array.isArray(value) && value.length > 0 && value.every((x) => resultKind(x) === 'BeamFigures')) return ['Beam figures per beam', ...beamTable(value, o)].join('\n');
    if (isRecord(value)) return fieldsBlock('Result', value, o);
    return fieldText('', value, o);
  }
  const r = value as Record<string, unknown>;
  switch (kind) {
    case 'CMatrix': return matrixText(value as CMatrix, o);
    case 'Multiport': return multiportText(r, o);
    case 'TwoPortNoiseParameters': return noiseParametersText(r, o);
    case 'Taper': return taperText(r, o);
    case 'DesignEvaluation': return designText(r, o);
    case 'FrequencyEvaluation': return frequencyText(r, o);
    case 'ReceivingArrayEvaluation': return receivingText(r, o);
    case 'ScanSweepResult': return sweepText(r, o);
    case 'Figure': return `Figure ${String(r.widthPx)}×${String(r.heightPx)} px "${String(r.title)}" (SVG, ${String(r.svg).length} characters)`;
    default: return fieldsBlock(TITLES[kind] ?? kind, r, o);
  }
}
