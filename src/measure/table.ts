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
}

function parseCsv(text: string, required: readonly string[]): { rows: Record<string, string>[]; lines: number[] } {
  if (typeof text !== 'string') throw new ParseError(`expected CSV text, received ${typeof text}`);
  if (!text.split(/\r\n|\n|\r/).some((l) => l.trim() !== '' && !l.trim().startsWith('#'))) {
    throw new ParseError(`the CSV is empty: expected a header line with the columns ${required.join(', ')} and one data line per row`, 1);
  }
  const res = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: 'greedy', comments: '#', transformHeader: (h) => h.trim().toLowerCase() });
  if (res.errors.length > 0) {
    const e = res.errors[0];
    throw new ParseError(`malformed CSV: ${e.message}`, (e.row ?? 0) + 2);
  }
  const fields = res.meta.fields ?? [];
  for (const col of required) {
    if (!fields.includes(col)) throw new ParseError(`missing column "${col}" in the header (found: ${fields.join(', ') || 'none'}); required columns: ${required.join(', ')}`, 1);
  }
  // Line numbers: header is line 1; count the data lines as they appear (comments and blank lines skipped).
  const lines: number[] = [];
  const all = text.split(/\r\n|\n|\r/);
  let headerSeen = false;
  all.forEach((l, i) => {
    const t = l.trim();
    if (t === '' || t.startsWith('#')) return;
    if (!headerSeen) { headerSeen = true; return; }
    lines.push(i + 1);
  });
  return { rows: res.data, lines };
}

function numberField(row: Record<string, string>, col: string, line: number): number {
  const raw = (row[col] ?? '').trim();
  const v = Number(raw);
  if (raw === '' || !Number.isFinite(v)) throw new ParseError(`column "${col}": expected a finite number, found "${raw}"`, line);
  return v;
}

/**
 * Parses a Y-factor table from CSV text.
 *
 * @remarks
 * Layout (phasewise's own): a header row with the columns `channel`, `hot`,
 * `cold` (case-insensitive, any order, extra columns ignored), one row per
 * channel; lines starting with `#` are comments.
 * @param text - CSV text.
 * @returns Rows in file order.
 * @throws {@link ParseError} with the line number for a missing column or a non-numeric value.
 * @category Measurement
 */
export function parseYFactorCsv(text: string): YFactorRow[] {
  const { rows, lines } = parseCsv(text, ['channel', 'hot', 'cold']);
  return rows.map((r, i) => ({ channel: (r.channel ?? '').trim(), hot: numberField(r, 'hot', lines[i]), cold: numberField(r, 'cold', lines[i]) }));
}

/**
 * Parses an on/off table from CSV text: columns `beam`, `on`, `off` (see {@link parseYFactorCsv} for the rules).
 * @param text - CSV text.
 * @returns Rows in file order.
 * @throws {@link ParseError} with the line number for a missing column or a non-numeric value.
 * @category Measurement
 */
export function parseOnOffCsv(text: string): OnOffRow[] {
  const { rows, lines } = parseCsv(text, ['beam', 'on', 'off']);
  return rows.map((r, i) => ({ beam: (r.beam ?? '').trim(), on: numberField(r, 'on', lines[i]), off: numberField(r, 'off', lines[i]) }));
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
 * Options of {@link reduceYFactorTable}.
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
}

/**
 * Reduces every row of a Y-factor table with {@link yFactorReceiverTemperature}.
 * @param rows - Rows (from {@link parseYFactorCsv} or built in code).
 * @param options - Load temperatures and power scale.
 * @returns One result per row, with its channel name.
 * @throws {@link DomainError} naming the row for non-positive powers or Y ≤ 1.
 * @category Measurement
 */
export function reduceYFactorTable(rows: readonly YFactorRow[], options: YFactorTableOptions): YFactorTableResult[] {
  if (!Array.isArray(rows)) throw new DimensionError('invalid argument "rows": expected an array of {channel, hot, cold}.');
  return rows.map((r, i) => {
    try {
      return displayable({ channel: r.channel, ...yFactorReceiverTemperature({ hotPower: r.hot, coldPower: r.cold, hotTemperatureK: options.hotTemperatureK, coldTemperatureK: options.coldTemperatureK, powerScale: options.powerScale }) }, 'YFactorResult');
    } catch (e) {
      if (e instanceof DomainError) throw new DomainError(`data row ${i + 1} (channel "${r.channel}"): ${e.message}`);
      throw e;
    }
  });
}

/**
 * Reduces every row of an on/off table with {@link onOffSensitivity}.
 * @param rows - Rows (from {@link parseOnOffCsv} or built in code).
 * @param fluxDensityWPerM2Hz - Calibrator flux density [W m⁻² Hz⁻¹].
 * @param corrections - Optional flux corrections (applied to every row, reported in each result).
 * @returns One result per row, with its beam name.
 * @throws {@link DomainError} naming the row for invalid powers.
 * @category Measurement
 */
export function reduceOnOffTable(rows: readonly OnOffRow[], fluxDensityWPerM2Hz: number, corrections?: FluxCorrections): OnOffTableResult[] {
  if (!Array.isArray(rows)) throw new DimensionError('invalid argument "rows": expected an array of {beam, on, off}.');
  return rows.map((r, i) => {
    try {
      return displayable({ beam: r.beam, ...onOffSensitivity({ onPower: r.on, offPower: r.off, fluxDensityWPerM2Hz, corrections }) }, 'OnOffResult');
    } catch (e) {
      if (e instanceof DomainError) throw new DomainError(`data row ${i + 1} (beam "${r.beam}"): ${e.message}`);
      throw e;
    }
  });
}
