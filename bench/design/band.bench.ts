/**
 * The band job on the 64-dipole array over ground: 51 frequencies × 25 beams on a cone.
 * In-process on one thread (evaluateDesign), and the built command line on a worker pool of
 * two (needs dist/: `npm run build`). Stage split per frequency: `npx tsx scripts/bench-band.ts`.
 */
import { bench, describe } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { evaluateDesign, parseDesign } from '../../src/design/index.js';
import { sink } from '../linalg/sink.js';

const file = join(__dirname, 'band-64.json');
const design = parseDesign(readFileSync(file, 'utf8'), 'band-64.json');
const out = mkdtempSync(join(tmpdir(), 'pw-bench-band-'));

describe('band job: 64 dipoles over ground, 51 frequencies × 25 beams', () => {
  bench('evaluateDesign, one thread', () => {
    const ev = evaluateDesign(design);
    sink(Float64Array.from(ev.bandSummary, (s) => s.bandAverageSensitivityM2PerK));
  }, { iterations: 2, warmupIterations: 0 });
  bench('phasewise evaluate --workers 2 (process, report written)', () => {
    execFileSync('node', [join(__dirname, '../../dist/cli.js'), 'evaluate', file, '--out', out, '--workers', '2', '--no-progress']);
  }, { iterations: 2, warmupIterations: 0 });
});
