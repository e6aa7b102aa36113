/**
 * Reading files named inside a design file, relative to its folder
 * (Touchstone files as latin1, everything else as UTF-8).
 * @internal
 * @module
 */
import { readFileSync } from 'node:fs';
import { dirname, resolve } from 'node:path';
import type { DesignFileReader } from '../design/index.js';

/** A reader resolving names from the design file's folder. @internal */
export function designReader(designFile: string): DesignFileReader {
  const base = dirname(resolve(designFile));
  return (name) => readFileSync(resolve(base, name), /\.[sS]\d+[pP]$/.test(name) ? 'latin1' : 'utf8');
}
