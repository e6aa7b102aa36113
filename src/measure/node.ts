/**
 * Node-only readers for measurement tables (uses `fs`).
 * @module
 */
import { readFileSync } from 'node:fs';
import { ParseError } from '../errors.js';
import { type OnOffRow, type YFactorRow, parseOnOffCsv, parseYFactorCsv } from './table.js';

function readText(path: string): string {
  try {
    return readFileSync(path, 'utf8');
  } catch (e) {
    throw new ParseError(`cannot read "${path}": ${(e as Error).message}`);
  }
}

/**
 * Reads a Y-factor CSV file (layout of `parseYFactorCsv`).
 * @param path - File path.
 * @returns Rows in file order.
 * @throws `ParseError` if the file cannot be read or is malformed (with line numbers).
 * @category Measurement
 */
export function readYFactorCsv(path: string): YFactorRow[] {
  return parseYFactorCsv(readText(path));
}

/**
 * Reads an on/off CSV file (layout of `parseOnOffCsv`).
 * @param path - File path.
 * @returns Rows in file order.
 * @throws `ParseError` if the file cannot be read or is malformed (with line numbers).
 * @category Measurement
 */
export function readOnOffCsv(path: string): OnOffRow[] {
  return parseOnOffCsv(readText(path));
}
