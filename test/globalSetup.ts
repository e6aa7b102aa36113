/**
 * Vitest global setup: the package, browser and figure tests run the built `dist/`. When `dist/`
 * is missing or older than a source file (a bare `npx vitest run` on a fresh clone or after an
 * edit), build it once first, so every test runs against the current source. `npm test` builds
 * before vitest, so this finds `dist/` fresh and does nothing.
 */
import { execFileSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '..');

function newestMtime(dir: string): number {
  let t = 0;
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = join(dir, e.name);
    t = Math.max(t, e.isDirectory() ? newestMtime(p) : statSync(p).mtimeMs);
  }
  return t;
}

export default function setup(): void {
  const marker = join(root, 'dist', 'cli.js');
  const sources = Math.max(newestMtime(join(root, 'src')), statSync(join(root, 'package.json')).mtimeMs, statSync(join(root, 'tsup.config.ts')).mtimeMs);
  if (existsSync(marker) && statSync(marker).mtimeMs >= sources) return;
  process.stderr.write('phasewise tests: dist/ is missing or older than src/; building it first (npm run build)\n');
  execFileSync('npm', ['run', 'build'], { cwd: root, stdio: ['ignore', 'ignore', 'inherit'] });
}
