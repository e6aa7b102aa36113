/**
 * Regenerates the stored outputs of the example notebooks (examples/notebooks/*.ipynb) by
 * running them with the notebook executor of scripts/notebooks/kernel.ts against the built
 * package. Run: `npm run notebooks:update` (builds first). A notebook whose run fails is left
 * unchanged and the script exits with status 1.
 */
import { readdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { NOTEBOOK_DIR, executeNotebook, readNotebook, withOutputs } from './notebooks/kernel.js';

let failed = false;
const only = process.argv.slice(2);
for (const name of readdirSync(NOTEBOOK_DIR).filter((f) => f.endsWith('.ipynb')).sort()) {
  if (only.length > 0 && !only.some((o) => name.includes(o))) continue;
  const path = join(NOTEBOOK_DIR, name);
  const t = performance.now();
  const run = executeNotebook(path);
  if (run.error) {
    failed = true;
    process.stderr.write(`${name}: cell ${run.error.cell} failed: ${run.error.ename}: ${run.error.evalue}\n${run.error.traceback.slice(0, 6).join('\n')}\n`);
    continue;
  }
  writeFileSync(path, JSON.stringify(withOutputs(readNotebook(path), run), null, 1) + '\n');
  process.stdout.write(`${name}: outputs stored (${((performance.now() - t) / 1000).toFixed(1)} s)\n`);
}
process.exitCode = failed ? 1 : 0;
