/**
 * Node-only readers for measurement tables (uses `fs`).
 * @module
 */
import { parseTextFile } from '../internal/node.js';
import { parseJsonText } from '../internal/json.js';
import { matrixFromJSON, type CMatrix, type CMatrixJSON } from '../linalg/cmatrix.js';
import { type OnOffRow, type YFactorRow, parseOnOffCsv, parseYFactorCsv } from './table.js';

/**
 * Reads a Y-factor CSV file (layout of `parseYFactorCsv`).
 * @param path - File path.
 * @returns Rows in file order.
 * @throws `ParseError` if the file cannot be read or is malformed (with line numbers).
 * @category Measurement
 */
export function readYFactorCsv(path: string): YFactorRow[] {
  return parseTextFile(path, parseYFactorCsv);
}

/**
 * Reads an on/off CSV file (layout of `parseOnOffCsv`).
 * @param path - File path.
 * @returns Rows in file order.
 * @throws `ParseError` if the file cannot be read or is malformed (with line numbers).
 * @category Measurement
 */
export function readOnOffCsv(path: string): OnOffRow[] {
  return parseTextFile(path, parseOnOffCsv);
}

/**
 * Reads a correlation matrix (or any complex matrix, e.g. beam weights one column per beam)
 * from a JSON file in the library's serialised matrix form `{"rows", "cols", "re", "im"}`
 * (row-major real and imaginary parts; `matrixToJSON` writes it).
 * @param path - File path.
 * @returns The matrix.
 * @throws `ParseError` naming the file (and line:column for malformed JSON) if it cannot be read or is malformed.
 * @category Measurement
 */
export function readCorrelationMatrixFile(path: string): CMatrix {
  return parseTextFile(path, (text) => matrixFromJSON(parseJsonText(text, 'the matrix file') as CMatrixJSON));
}
