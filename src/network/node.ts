/**
 * Node-only helpers of the network module: reading and writing Touchstone
 * files on disk. Not re-exported from the browser-safe main entry; import
 * from the Node subpath.
 * @module
 */
import { writeFileSync } from 'node:fs';
import { basename } from 'node:path';
import { parseTextFile } from '../internal/node.js';
import type { Multiport } from './multiport.js';
import { type TouchstoneData, type TouchstoneFormatOptions, formatTouchstone, parseTouchstone } from './touchstone.js';

/**
 * Reads a Touchstone file from disk.
 *
 * @remarks
 * The port count of a version 1 file is taken from its `.sNp` extension (e.g. `.s4p` → 4);
 * version 2 files state it themselves. Parsing: parseTouchstone of the main entry.
 * @param path - File path.
 * @returns The parsed file.
 * @throws ParseError (from the main entry) on malformed content or an unreadable file.
 * @category Network
 */
export function readTouchstoneFile(path: string): TouchstoneData {
  const m = /\.[sS](\d+)[pP]$/.exec(basename(path));
  return parseTextFile(path, (text) => parseTouchstone(text, m ? { ports: Number(m[1]) } : {}), 'latin1');
}

/**
 * Writes a network to disk as a Touchstone file (formatTouchstone of the main entry).
 * @param path - File path; by convention `.sNp` with N the port count.
 * @param net - The network.
 * @param options - Format options.
 * @throws DomainError (from the main entry) as formatTouchstone does; Node file-system errors.
 * @category Network
 */
export function writeTouchstoneFile(path: string, net: Multiport, options: TouchstoneFormatOptions = {}): void {
  writeFileSync(path, formatTouchstone(net, options), 'latin1');
}
