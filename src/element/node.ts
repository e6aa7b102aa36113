/**
 * Node-only reading and writing of embedded-pattern files (uses `fs`); part of
 * the `phasewise/node` entry, never imported by the browser-safe core.
 * @module
 */
import { writeFileSync } from 'node:fs';
import { ParseError } from '../errors.js';
import { parseTextFile } from '../internal/node.js';
import type { EmbeddedPatternSet } from './patternSet.js';
import { formatPatternCsv, formatPatternJson, parsePatternCsv, parsePatternJson } from './patternFormats.js';

function formatOf(path: string, format: 'json' | 'csv' | undefined): 'json' | 'csv' {
  if (format) return format;
  const lower = path.toLowerCase();
  if (lower.endsWith('.json')) return 'json';
  if (lower.endsWith('.csv')) return 'csv';
  throw new ParseError(`cannot tell the layout of "${path}" from its extension; name it *.json or *.csv, or pass the format.`);
}

/**
 * Reads an embedded-pattern file in phasewise's JSON or CSV layout.
 * @param path - File path (*.json or *.csv unless `format` is given).
 * @param format - Layout, overriding the extension.
 * @returns The validated set.
 * @throws `ParseError` if the file cannot be read or is malformed (line and field named).
 * @category Elements
 */
export function readPatternFile(path: string, format?: 'json' | 'csv'): EmbeddedPatternSet {
  const f = formatOf(path, format);
  return parseTextFile(path, f === 'json' ? parsePatternJson : parsePatternCsv);
}

/**
 * Writes an embedded-pattern set in phasewise's JSON or CSV layout.
 * @param path - File path (*.json or *.csv unless `format` is given).
 * @param set - The set.
 * @param format - Layout, overriding the extension.
 * @throws `ParseError` for an unknown extension; `DomainError` for an invalid set.
 * @category Elements
 */
export function writePatternFile(path: string, set: EmbeddedPatternSet, format?: 'json' | 'csv'): void {
  const f = formatOf(path, format);
  writeFileSync(path, f === 'json' ? formatPatternJson(set) : formatPatternCsv(set), 'utf8');
}
