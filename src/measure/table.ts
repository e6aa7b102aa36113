/**
 * Measurement tables: Y-factor and on/off readings from CSV text or arrays
 * (browser-safe; the Node entry reads files).
 * @module
 */
import Papa from 'papaparse';
import { DimensionError, DomainError, ParseError } from '../errors.js';
import { type YFactorResult, yFactorReceiverTemperature } from './yfactor.js';
import { type OnOffResult, onOffSensitivity, type FluxCorrections } from './sensitivity.js';
import { displayable } from '../display/attach.js';

/**
 * One row of a Y-factor table.
 * @category Measurement
 */
export interface YFactorRow {
  /** Channel or beam name. */
  channel: string;
  /** Hot-load power (linear, or dB with powerScale 'dB'). */
  hot: number;
  /** Cold-load power, same unit. */
  cold: number;
  /** 1-based line in the CSV text the row came from (set by the CSV parser). */
  line?: number;
}

/**
 * One row of an on/off table.
 * @category Measurement
 */
export interface OnOffRow {
  /** Beam name. */
  beam: string;
  /** On-source power (linear). */
  on: number;
  /** Off-source power (linear). */
  off: number;
  /** 1-based line in the CSV text the row came from (set by the CSV parser). */
  line?: number;
}

/** Data lines of CSV text: 1-based line numbers of the non-blank, non-comment lines after the header. */
function dataLines(text: string): number[] {
  const lines: number[] = [];
  let headerSeen = false;
  text.split(/\r\n|\n|\r/).forEach((l, i) => {
    const t = l.trim();
    if (t === '' || t.startsWith('#')) return;
    if (headerSeen) lines.push(i + 1);
    headerSeen = true;
  });
  return lines;
}

function parseCsv(text: string, required: readonly string[]): { rows: Record<string, string>[]; lines: number[] } {
  if (typeof text !== 'string') throw new ParseError(`expected CSV text, received ${typeof text}`);
  const lines = dataLines(text);
  if (!text.split(/\r\n|\n|\r/).some((l) => l.trim() !== '' && !l.trim().startsWith('#'))) {
    throw new ParseError(`the CSV is empty: expected a header line with the columns ${required.join(', ')} and one data line per row`, 1);
  }
  const res = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy', comments: '#', transformHeader: (h) => h.trim().toLowerCase() });
  if (res.errors.length > 0) {
    const e = res.errors[0];
    const row = e.row ?? -1;
    throw new ParseError(`malformed CSV: ${e.message}`, lines[row] ?? (row >= 0 ? row + 2 : 1));
  }
  const fields = res.meta.fields ?? [];
  for (const col of required) {
    if (!fields.includes(col)) throw new ParseError(`missing column "${col}" in the header (found: ${fields.join(', ') || 'none'}); required columns: ${required.join(', ')}`, 1);
  }
  return { rows: res.data, lines };
}

function numberField(row: Record<string, string>, col: string, line: number): number {
  const raw = (row[col] ?? '').trim();
  const v = Number(raw);
  if (raw === '' || !Number.isFinite(v)) throw new ParseError(`column "${col}": expected a finite number, found "${raw}"`, line);
  return v;
}

/** One data row read leniently: the parsed row, or the parse error of that row. */
type RowOutcome<R> = { ok: true; row: R } | { ok: false; error: ParseError; name: string; line: number };

function readRows<R>(text: string, nameCol: string, cols: readonly [string, string], build: (name: string, a: number, b: number, line: number) => R): RowOutcome<R>[] {
  const { rows, lines } = parseCsv(text, [nameCol, ...cols]);
  return rows.map((r, i) => {
    const name = (r[nameCol] ?? '').trim();
    try {
      return { ok: true as const, row: build(name, numberField(r, cols[0], lines[i]), numberField(r, cols[1], lines[i]), lines[i]) };
    } catch (e) {
      if (e instanceof ParseError) return { ok: false as const, error: e, name, line: lines[i] };
      throw e;
    }
  });
}

function strictRows<R>(outcomes: RowOutcome<R>[]): R[] {
  return outcomes.map((o) => {
    if (!o.ok) throw o.error;
    return o.row;
  });
}

const yRows = (text: string) => readRows(text, 'channel', ['hot', 'cold'], (channel, hot, cold, line): YFactorRow => ({ channel, hot, cold, line }));
const onOffRows = (text: string) => readRows(text, 'beam', ['on', 'off'], (beam, on, off, line): OnOffRow => ({ beam, on, off, line }));

/**
 * Parses a Y-factor table from CSV text.
 *
 * @remarks
 * Layout (phasewise's own): a header row with the columns `channel`, `hot`,
 * `cold` (case-insensitive, any order, extra columns ignored), one row per
 * channel; lines starting with `#` are comments. Each row keeps its 1-based line number.
 * @param text - CSV text.
 * @returns Rows in file order.
 * @throws {@link ParseError} with the line number for a missing column or a non-numeric value.
 * @category Measurement
 */
export function parseYFactorCsv(text: string): YFactorRow[] {
  return strictRows(yRows(text));
}

/**
 * Parses an on/off table from CSV text: columns `beam`, `on`, `off` (see {@link parseYFactorCsv} for the rules).
 * @param text - CSV text.
 * @returns Rows in file order.
 * @throws {@link ParseError} with the line number for a missing column or a non-numeric value.
 * @category Measurement
 */
export function parseOnOffCsv(text: string): OnOffRow[] {
  return strictRows(onOffRows(text));
}

/**
 * A reduced Y-factor table row: the channel name and its {@link YFactorResult}.
 * @category Measurement
 */
export interface YFactorTableResult extends YFactorResult {
  /** Channel name from the table. */
  channel: string;
}

/**
 * A reduced on/off table row: the beam name and its {@link OnOffResult}.
 * @category Measurement
 */
export interface OnOffTableResult extends OnOffResult {
  /** Beam name from the table. */
  beam: string;
}

/**
 * A table row that could not be reduced, and why.
 * @category Measurement
 */
export interface RejectedRow {
  /** Channel or beam name (may be empty when the row has none). */
  name: string;
  /** 1-based data row (the first row after the header is 1). */
  row: number;
  /** 1-based line in the CSV text, when the row came from CSV. */
  line?: number;
  /** What is wrong with the row (a non-numeric value, Y ≤ 1, P_on ≤ P_off, …). */
  reason: string;
}

/**
 * Result of reducing a table row by row: the rows that reduced, and the rows that did not.
 * @category Measurement
 */
export interface TableReduction<T> {
  /** Reduced rows, in table order. */
  results: T[];
  /** Rows that could not be reduced, in table order (empty when every row reduced). */
  rejected: RejectedRow[];
}

/**
 * Options of {@link reduceYFactorTable}: load temperatures, power scale and the
 * one-sigma uncertainties propagated to every channel (see {@link YFactorInput}).
 * @category Measurement
 */
export interface YFactorTableOptions {
  /** Hot-load temperature [K]. */
  hotTemperatureK: number;
  /** Cold-load temperature [K]. */
  coldTemperatureK: number;
  /**
   * Linear powers or dB readings.
   * @defaultValue 'linear'
   */
  powerScale?: 'linear' | 'dB';
  /** One-sigma relative uncertainty of every hot and cold power reading (e.g. 0.01 for 1 %). @defaultValue 0 */
  powerRelativeSigma?: number;
  /** One-sigma uncertainty of the hot-load (or noise-source on) temperature [K]. @defaultValue 0 */
  hotTemperatureSigmaK?: number;
  /** One-sigma uncertainty of the cold-load temperature [K]. @defaultValue 0 */
  coldTemperatureSigmaK?: number;
}

/**
 * Options of {@link reduceOnOffTable}.
 * @category Measurement
 */
export interface OnOffTableOptions {
  /** Calibrator flux density [W m⁻² Hz⁻¹] (use `janskyToSi`). */
  fluxDensityWPerM2Hz: number;
  /** Optional flux corrections (applied to every row, reported in each result). */
  corrections?: FluxCorrections;
  /** One-sigma relative uncertainty of every on and off power reading. @defaultValue 0 */
  powerRelativeSigma?: number;
  /** One-sigma relative uncertainty of the calibrator flux density. @defaultValue 0 */
  fluxDensityRelativeSigma?: number;
}

function reduceRows<R, T>(outcomes: ReadonlyArray<RowOutcome<R>>, nameOf: (r: R) => string, lineOf: (r: R) => number | undefined, reduce: (r: R) => T): TableReduction<T> {
  const results: T[] = [], rejected: RejectedRow[] = [];
  outcomes.forEach((o, i) => {
    if (!o.ok) {
      rejected.push({ name: o.name, row: i + 1, line: o.line, reason: o.error.detail });
      return;
    }
    try {
      results.push(reduce(o.row));
    } catch (e) {
      if (!(e instanceof DomainError)) throw e;
      const line = lineOf(o.row);
      rejected.push({ name: nameOf(o.row), row: i + 1, ...(line !== undefined ? { line } : {}), reason: e.message });
    }
  });
  return { results, rejected };
}

function throwFirst<T>(r: TableReduction<T>, what: string): T[] {
  const bad = r.rejected[0];
  if (bad) throw new DomainError(`${bad.line !== undefined ? `line ${bad.line}` : `data row ${bad.row}`} (${what} "${bad.name}"): ${bad.reason}`);
  return r.results;
}

const okRows = <R>(rows: readonly R[]): RowOutcome<R>[] => rows.map((row) => ({ ok: true as const, row }));

function yFactorOf(o: YFactorTableOptions): (r: YFactorRow) => YFactorTableResult {
  return (r) => displayable({
    channel: r.channel,
    ...yFactorReceiverTemperature({
      hotPower: r.hot, coldPower: r.cold, hotTemperatureK: o.hotTemperatureK, coldTemperatureK: o.coldTemperatureK, powerScale: o.powerScale,
      hotPowerRelativeSigma: o.powerRelativeSigma, coldPowerRelativeSigma: o.powerRelativeSigma,
      hotTemperatureSigmaK: o.hotTemperatureSigmaK, coldTemperatureSigmaK: o.coldTemperatureSigmaK,
    }),
  }, 'YFactorResult');
}

function onOffOf(o: OnOffTableOptions): (r: OnOffRow) => OnOffTableResult {
  return (r) => displayable({
    beam: r.beam,
    ...onOffSensitivity({
      onPower: r.on, offPower: r.off, fluxDensityWPerM2Hz: o.fluxDensityWPerM2Hz, corrections: o.corrections,
      onPowerRelativeSigma: o.powerRelativeSigma, offPowerRelativeSigma: o.powerRelativeSigma, fluxDensityRelativeSigma: o.fluxDensityRelativeSigma,
    }),
  }, 'OnOffResult');
}

/**
 * Reduces every row of a Y-factor table with {@link yFactorReceiverTemperature}.
 * @param rows - Rows (from {@link parseYFactorCsv} or built in code).
 * @param options - Load temperatures, power scale and uncertainties.
 * @returns One result per row, with its channel name.
 * @throws {@link DomainError} naming the first bad row (its CSV line when known) for non-positive powers or Y ≤ 1.
 * @category Measurement
 */
export function reduceYFactorTable(rows: readonly YFactorRow[], options: YFactorTableOptions): YFactorTableResult[] {
  if (!Array.isArray(rows)) throw new DimensionError('invalid argument "rows": expected an array of {channel, hot, cold}.');
  return throwFirst(reduceRows(okRows(rows), (r) => r.channel, (r) => r.line, yFactorOf(options)), 'channel');
}

/**
 * Reduces a Y-factor CSV table channel by channel: a row with a non-numeric value, a
 * non-positive power or Y ≤ 1 is rejected with its line and reason, and the other
 * channels are still reduced.
 * @param text - CSV text (layout of {@link parseYFactorCsv}).
 * @param options - Load temperatures, power scale and uncertainties.
 * @returns The reduced channels and the rejected rows.
 * @throws {@link ParseError} when the table as a whole is unreadable (empty, a missing column, malformed CSV).
 * @category Measurement
 */
export function reduceYFactorCsv(text: string, options: YFactorTableOptions): TableReduction<YFactorTableResult> {
  return reduceRows(yRows(text), (r) => r.channel, (r) => r.line, yFactorOf(options));
}

/**
 * Reduces every row of an on/off table with {@link onOffSensitivity}.
 * @param rows - Rows (from {@link parseOnOffCsv} or built in code).
 * @param options - Calibrator flux density, corrections and uncertainties. (Deprecated form, kept
 *   for one minor version: the flux density [W m⁻² Hz⁻¹] as a number, with `corrections` third.)
 * @param corrections - Only with the deprecated numeric form: flux corrections.
 * @returns One result per row, with its beam name.
 * @throws {@link DomainError} naming the first bad row for invalid powers.
 * @category Measurement
 */
export function reduceOnOffTable(rows: readonly OnOffRow[], options: OnOffTableOptions | number, corrections?: FluxCorrections): OnOffTableResult[] {
  if (!Array.isArray(rows)) throw new DimensionError('invalid argument "rows": expected an array of {beam, on, off}.');
  const o: OnOffTableOptions = typeof options === 'number' ? { fluxDensityWPerM2Hz: options, corrections } : options;
  return throwFirst(reduceRows(okRows(rows), (r) => r.beam, (r) => r.line, onOffOf(o)), 'beam');
}

/**
 * Reduces an on/off CSV table beam by beam (rejected rows reported, the others reduced;
 * see {@link reduceYFactorCsv}).
 * @param text - CSV text (layout of {@link parseOnOffCsv}).
 * @param options - Calibrator flux density, corrections and uncertainties.
 * @returns The reduced beams and the rejected rows.
 * @throws {@link ParseError} when the table as a whole is unreadable.
 * @category Measurement
 */
export function reduceOnOffCsv(text: string, options: OnOffTableOptions): TableReduction<OnOffTableResult> {
  return reduceRows(onOffRows(text), (r) => r.beam, (r) => r.line, onOffOf(options));
}
