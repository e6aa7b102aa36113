/**
 * The kernel threads: the same dense work on one thread and on two, in the same run, so vitest
 * prints the speedup ("2 threads … x faster than 1 thread"). Products at N = 256, 512, 1024;
 * Cholesky factor + solve with N right-hand sides and LU factor at N = 512, 1024. Run under the
 * heavy lock on a quiet machine and write the load average beside every figure:
 *   flock /tmp/phasewise-heavy.lock npx vitest bench --run bench/linalg/threads.bench.ts
 */
import { bench, describe } from 'vitest';
import { multiply } from '../../src/linalg/ops.js';
import { choleskyFactor, choleskySolve } from '../../src/linalg/cholesky.js';
import { luFactor } from '../../src/linalg/lu.js';
import { setKernelThreads } from '../../src/linalg/simd.js';
import { seededHpd, seededMatrix, sink } from './sink.js';

const options = (n: number) => ({ iterations: n >= 1024 ? 3 : 5, time: n >= 1024 ? 2000 : 1000, warmupIterations: 1 });

for (const n of [256, 512, 1024]) {
  describe(`complex product ${n}×${n}`, () => {
    const a = seededMatrix(n, n, 1), b = seededMatrix(n, n, 2);
    for (const t of [1, 2]) bench(`${t} thread${t > 1 ? 's' : ''}`, () => { setKernelThreads(t); sink(multiply(a, b)); }, options(n));
  });
}

for (const n of [512, 1024]) {
  describe(`Cholesky factor + solve (${n} right-hand sides), N = ${n}`, () => {
    const a = seededHpd(n, 3), b = seededMatrix(n, n, 4);
    for (const t of [1, 2]) bench(`${t} thread${t > 1 ? 's' : ''}`, () => { setKernelThreads(t); sink(choleskySolve(choleskyFactor(a), b)); }, options(n));
  });
  describe(`LU factor, N = ${n}`, () => {
    const a = seededMatrix(n, n, 5);
    for (const t of [1, 2]) bench(`${t} thread${t > 1 ? 's' : ''}`, () => { setKernelThreads(t); sink(luFactor(a).lu); }, options(n));
  });
}
