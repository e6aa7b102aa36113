/**
 * Writing report files strictly inside the chosen output folder.
 * @internal
 * @module
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { isAbsolute, relative, resolve } from 'node:path';
import { UsageError } from './errors.js';

/** A writer confined to one folder. @internal */
export interface OutputFolder {
  /** Absolute path of the folder. */
  readonly path: string;
  /** Writes `name` (a plain file name, no separators) with the given content; returns its absolute path. */
  write(name: string, content: string | Uint8Array): string;
}

/** Creates (if needed) and returns a writer for `dir`. @internal */
export function outputFolder(dir: string): OutputFolder {
  if (typeof dir !== 'string' || dir.trim() === '') throw new UsageError('invalid option "--out": expected a folder path.');
  const path = resolve(dir);
  mkdirSync(path, { recursive: true });
  return {
    path,
    write(name: string, content: string | Uint8Array): string {
      if (!/^[A-Za-z0-9._-]+$/.test(name) || name === '.' || name === '..') {
        throw new UsageError(`refusing to write "${name}": report file names are plain names inside the output folder.`);
      }
      const target = resolve(path, name);
      const rel = relative(path, target);
      if (rel.startsWith('..') || isAbsolute(rel)) throw new UsageError(`refusing to write outside the output folder: ${target}`);
      writeFileSync(target, content);
      return target;
    },
  };
}
