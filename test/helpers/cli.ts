/**
 * Runs the command line in-process and captures its output. A run that exits 0 and wrote a
 * report must have no failed physical check in it (exit 0 means trustworthy).
 */
import { expect } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';

/** Exit code and captured stdout/stderr of one command line. */
export async function runCapture(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '', err = '';
  const code = await runCli(args, { out: (s) => { out += s; }, err: (s) => { err += s; } });
  const o = args.indexOf('--out');
  if (code === 0 && o >= 0 && !args.includes('--accept-failed-checks') && existsSync(join(args[o + 1], 'figures.json'))) {
    expect(JSON.parse(readFileSync(join(args[o + 1], 'figures.json'), 'utf8')).failedChecks, `exit 0 with failed checks: ${args.join(' ')}`).toEqual([]);
  }
  return { code, out, err };
}
