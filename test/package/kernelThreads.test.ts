/**
 * The kernel threads from the built dist/ (ESM and CJS): a process that does a large product on
 * two threads gets the same bits as on one, its workers really took part, and it exits promptly
 * (the workers are unref()ed: they never keep a process alive). Needs dist/ (npm test builds first).
 */
import { describe, it, expect } from 'vitest';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { THREADS_SCRIPT, runTimed } from '../helpers/threadsScript.js';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

describe('kernel threads from dist/', () => {
  const cases = [
    ['ESM', ['--input-type=module', '-e', `import * as lib from ${JSON.stringify(join(root, 'dist', 'linalg.js'))}; import { createRequire } from 'node:module'; const require = createRequire(import.meta.url);\n${THREADS_SCRIPT}`]],
    ['CJS', ['-e', `const lib = require(${JSON.stringify(join(root, 'dist', 'linalg.cjs'))});\n${THREADS_SCRIPT}`]],
  ] as const;
  for (const [name, args] of cases) {
    it(`${name}: two threads give the same bits as one, and the process exits within seconds`, () => {
      const r = runTimed([...args], root);
      expect(r.err).toBe('');
      expect(r.status).toBe(0);
      const res = JSON.parse(r.out) as { same: boolean; threads: number; reason: string };
      expect(res).toMatchObject({ same: true, threads: 2 });
      expect(res.reason).toMatch(/1 of 1 ready/);
      // startup, two 300³ products per round and the wait for the worker: well under 10 s; a worker
      // keeping the event loop alive would hang until the 60 s timeout instead
      expect(r.ms).toBeLessThan(10_000);
    });
  }
});
