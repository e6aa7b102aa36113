/**
 * Node-only text-file reading shared by the modules' `node.ts` entries: one wording for an
 * unreadable file, and parse errors that name the file (`file:line:column: what`).
 * @internal
 * @module
 */
import { readFileSync } from 'node:fs';
import { ParseError } from '../errors.js';

/**
 * Reads a text file and parses it; a {@link ParseError} from `parse` is re-thrown naming the file.
 * @param path - File path as the user gave it.
 * @param parse - Parser of the text.
 * @param encoding - Text encoding. @defaultValue 'utf8'
 * @returns What `parse` returns.
 * @throws ParseError for an unreadable file (with the system's reason) or malformed content.
 * @internal
 */
export function parseTextFile<T>(path: string, parse: (text: string) => T, encoding: 'utf8' | 'latin1' = 'utf8'): T {
  let text: string;
  try {
    text = readFileSync(path, encoding);
  } catch (e) {
    throw new ParseError(`cannot read the file: ${(e as Error).message}`, 0, 0, path);
  }
  try {
    return parse(text);
  } catch (e) {
    throw e instanceof ParseError && e.file === undefined ? e.inFile(path) : e;
  }
}
