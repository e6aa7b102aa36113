/**
 * Writing report files strictly inside the chosen output folder, checked
 * before any work starts and written all-or-nothing.
 * @internal
 * @module
 */
import { existsSync, mkdirSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { isAbsolute, relative, resolve, sep } from 'node:path';
import { UsageError } from './errors.js';

/** A writer confined to one folder. @internal */
export interface OutputFolder {
  /** Absolute path of the folder. */
  readonly path: string;
  /** Writes every file (plain names, no separators); on any failure removes what it wrote and throws UsageError. */
  writeAll(files: ReadonlyArray<readonly [string, string | Uint8Array]>): string[];
}

const SPECIAL = ['/proc', '/sys', '/dev'];

function reason(e: unknown): string {
  const code = (e as { code?: string }).code;
  switch (code) {
    case 'ENOTDIR': return 'a part of the path is a file, not a folder';
    case 'EEXIST': return 'a file of that name exists';
    case 'EACCES': case 'EPERM': return 'permission denied';
    case 'EROFS': return 'the file system is read-only';
    case 'ENOSPC': return 'no space left on the device';
    default: return (e as Error).message;
  }
}

/**
 * Checks and creates `dir` (option `option`), so that a bad place fails before any work.
 * @throws UsageError naming the path and the reason (exit 2).
 * @internal
 */
export function outputFolder(dir: string, option = '--out'): OutputFolder {
  if (typeof dir !== 'string' || dir.trim() === '') throw new UsageError(`option "${option}": expected a folder path.`);
  const path = resolve(dir);
  const fail = (why: string) => new UsageError(`option "${option}": cannot write the report to "${path}": ${why}.`);
  if (SPECIAL.some((s) => path === s || path.startsWith(s + sep))) throw fail('it lies on a special file system (/proc, /sys or /dev)');
  if (existsSync(path) && !statSync(path).isDirectory()) throw fail('a file of that name exists (choose a folder)');
  const created = !existsSync(path);
  try {
    mkdirSync(path, { recursive: true });
    const probe = resolve(path, `.phasewise-write-check-${process.pid}`);
    writeFileSync(probe, '');
    rmSync(probe);
  } catch (e) {
    if (created) {
      try { rmSync(path, { recursive: true, force: true }); } catch { /* nothing was created */ }
    }
    throw fail(reason(e));
  }
  return {
    path,
    writeAll(files) {
      const written: string[] = [];
      try {
        for (const [name, content] of files) {
          if (!/^[A-Za-z0-9._-]+$/.test(name) || name === '.' || name === '..') {
            throw new UsageError(`refusing to write "${name}": report file names are plain names inside the output folder.`);
          }
          const target = resolve(path, name);
          const rel = relative(path, target);
          if (rel.startsWith('..') || isAbsolute(rel)) throw new UsageError(`refusing to write outside the output folder: ${target}`);
          writeFileSync(target, content);
          written.push(target);
        }
      } catch (e) {
        for (const w of written) rmSync(w, { force: true });
        if (e instanceof UsageError) throw e;
        throw fail(reason(e));
      }
      return files.map(([n]) => n);
    },
  };
}
