/**
 * Regenerates the figures the README and guides embed, from the demo's own
 * report (`npm run docs:figures`). test/cli/evaluate.test.ts checks that the
 * committed files equal a fresh run byte for byte.
 */
import { copyFileSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runDemo } from '../src/cli/commands/demo.js';

// Demo report file → committed documentation figure.
const DOC_FIGURES: ReadonlyArray<readonly [string, string]> = [
  ['pattern-cut.svg', 'docs/figures/demo-pattern.svg'],
];

const dir = mkdtempSync(join(tmpdir(), 'pw-docs-'));
try {
  await runDemo(dir, { progress: false, workers: 1 });
  for (const [from, to] of DOC_FIGURES) {
    copyFileSync(join(dir, from), to);
    console.log(`wrote ${to}`);
  }
} finally {
  rmSync(dir, { recursive: true, force: true });
}
