/**
 * The kernel threads (src/internal/wasm/threads.ts): products, Hermitian rank-k updates and
 * triangular solves give bit-identical results on 1, 2 and 3 threads (every output entry is
 * formed by one thread in the same order), agree with the definition of the product and with
 * the numpy/scipy fixtures when the threaded path is forced, fall back to one thread with the
 * same results when workers or shared memory are missing, and `setKernelThreads` validates
 * its argument.
 */
import { readFileSync } from 'node:fs';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import { herkLowerScalarKernel, simdHerkLower } from '../../src/internal/herk.js';
import { simdSolveTriangular } from '../../src/internal/triangularWasm.js';
import { gemmScalarKernel } from '../../src/internal/gemm.js';
import { DEFAULT_THREAD_CAP, PARALLEL_MIN_WORK, defaultThreadCount, threadSettings, workerCounts } from '../../src/internal/wasm/threads.js';
import { availableParallelism } from 'node:os';
import { type CMatrix, type CMatrixJSON, matrixFromJSON } from '../../src/linalg/cmatrix.js';
import { choleskyFactor, choleskySolve } from '../../src/linalg/cholesky.js';
import { luFactor, solve } from '../../src/linalg/lu.js';
import { multiply } from '../../src/linalg/ops.js';
import { setKernelThreads, simdStatus } from '../../src/linalg/simd.js';
import { DomainError } from '../../src/errors.js';
import { expectCMatrixClose, randomHpd, randomMatrix } from '../helpers/matchers.js';

const EPS = Number.EPSILON;

/** Runs `f` with `n` kernel threads. */
function withThreads<T>(n: number, f: () => T): T {
  setKernelThreads(n);
  try {
    return f();
  } finally {
    setKernelThreads('auto');
  }
}

/** Bit equality of two arrays (Object.is per entry, so −0 ≠ +0 too). */
function expectBitIdentical(a: Float64Array, b: Float64Array): void {
  expect(a.length).toBe(b.length);
  let differ = 0;
  for (let i = 0; i < a.length; i++) if (!Object.is(a[i], b[i])) differ++;
  expect(differ).toBe(0);
}

/** Waits until every started worker is ready (they start at the first large product). */
async function workersReady(): Promise<void> {
  for (let t = 0; t < 500; t++) {
    const { ready } = workerCounts();
    if (ready.length > 0 && ready.every(Boolean)) return;
    await new Promise((r) => setTimeout(r, 10));
  }
  throw new Error('the kernel worker threads did not become ready within 5 s');
}

describe('kernel threads: the same bits on any thread count', () => {
  beforeAll(async () => {
    // start the workers (two, for three threads) and wait for them, so the runs below really split
    withThreads(3, () => multiply(randomMatrix(80, 80, 1), randomMatrix(80, 80, 2)));
    await workersReady();
  });

  it('Node reports worker threads on one shared memory', () => {
    const s = withThreads(2, () => simdStatus());
    expect(s.threads).toBe(2);
    expect(s.threadsReason).toMatch(/worker thread.*shared WebAssembly memory/);
  });

  it('product (odd shapes, above the split threshold): 1, 2, 3 threads bit-identical, equal to the definition to rounding, and the workers took part', () => {
    const a = randomMatrix(97, 75, 3), b = randomMatrix(75, 83, 4);
    const ran = (): number => workerCounts().ran.reduce((s, x) => s + x, 0);
    const before = ran();
    const [c1, c2, c3] = [1, 2, 3].map((n) => withThreads(n, () => multiply(a, b)));
    // a worker wakes within microseconds to milliseconds (machine load): larger products until one took a chunk
    const big = randomMatrix(200, 200, 15);
    for (let t = 0; t < 20 && ran() === before; t++) withThreads(2, () => multiply(big, big));
    expect(ran()).toBeGreaterThan(before);
    expectBitIdentical(c1.data, c2.data);
    expectBitIdentical(c1.data, c3.data);
    const ref = new Float64Array(2 * 97 * 83);
    gemmScalarKernel(97, 83, 75, a.data, 0, 75, b.data, 0, 83, ref, 0, 83, false, 1);
    // 75 terms of products of entries ≤ √2 (both sides rounded)
    expect(Math.max(...c1.data.map((x, i) => Math.abs(x - ref[i])))).toBeLessThan(200 * 75 * EPS);
  });

  it('Hermitian rank-k update (lower triangle): 1 and 2 threads bit-identical and equal to the scalar loop to rounding', () => {
    const n = 131, k = 70, g = randomMatrix(n, k, 5).data;
    const [c1, c2] = [1, 2].map((t) => withThreads(t, () => {
      const c = new Float64Array(2 * n * n);
      expect(simdHerkLower(n, k, g, k, c)).toBe(true);
      return c;
    }));
    expectBitIdentical(c1, c2);
    const ref = new Float64Array(2 * n * n);
    herkLowerScalarKernel(n, k, g, k, ref);
    for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) {
      expect(Math.abs(c1[2 * (i * n + j)] - ref[2 * (i * n + j)])).toBeLessThan(400 * k * EPS);
      expect(Math.abs(c1[2 * (i * n + j) + 1] - ref[2 * (i * n + j) + 1])).toBeLessThan(400 * k * EPS);
    }
  });

  it('triangular solves with many right-hand sides (split by columns): 1 and 2 threads bit-identical, residual at rounding', () => {
    const n = 70, nrhs = 301;
    const l = randomHpd(n, 6).data, b = randomMatrix(n, nrhs, 7).data;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) { l[2 * (i * n + j)] = 0; l[2 * (i * n + j) + 1] = 0; }
    for (let i = 0; i < n; i++) l[2 * (i * n + i)] += n; // well conditioned
    const [x1, x2] = [1, 2].map((t) => withThreads(t, () => {
      const x = b.slice();
      expect(simdSolveTriangular(n, nrhs, [{ t: l, lower: true, unitDiagonal: false }], x)).toBe(true);
      return x;
    }));
    expectBitIdentical(x1, x2);
    // identity: L·X = B
    const r = new Float64Array(2 * n * nrhs);
    gemmScalarKernel(n, nrhs, n, l, 0, n, x1, 0, nrhs, r, 0, nrhs, false, 1);
    expect(Math.max(...r.map((v, i) => Math.abs(v - b[i])))).toBeLessThan(1e-12);
  });

  it('LU solve and Cholesky solve at N = 300 (blocked factorisations): 1 and 2 threads bit-identical, small backward error', () => {
    const a = randomHpd(300, 8), b = randomMatrix(300, 40, 9);
    const [lu1, lu2] = [1, 2].map((t) => withThreads(t, () => solve(a, b)));
    const [ch1, ch2] = [1, 2].map((t) => withThreads(t, () => choleskySolve(choleskyFactor(a), b)));
    expectBitIdentical(lu1.data, lu2.data);
    expectBitIdentical(ch1.data, ch2.data);
    // identity: A·X = B to the backward error of a stable solve (Higham, Accuracy and Stability of
    // Numerical Algorithms, 2nd ed., 2002, Thm 9.4 and 10.4)
    for (const x of [lu1, ch1]) {
      const r = multiply(a, x);
      let num = 0, den = 0;
      for (let i = 0; i < r.data.length; i++) { num = Math.max(num, Math.abs(r.data[i] - b.data[i])); den = Math.max(den, Math.abs(b.data[i])); }
      expect(num / den).toBeLessThan(1e3 * 300 * EPS);
    }
  });
});

describe('kernel threads forced on small problems: the numpy/scipy fixtures', () => {
  // Reference values from numpy.linalg / scipy.linalg.cho_solve (test/linalg/fixtures/generate_linalg.py).
  const fixtures = JSON.parse(readFileSync(new URL('../linalg/fixtures/linalg.json', import.meta.url), 'utf8')) as {
    cases: Record<string, Array<Record<string, unknown>>>;
  };
  const m = (x: unknown): CMatrix => matrixFromJSON(x as CMatrixJSON);
  beforeAll(async () => {
    threadSettings.minWork = 0; // split every job the kernels run, however small
    withThreads(2, () => multiply(randomMatrix(40, 40, 1), randomMatrix(40, 40, 2)));
    await workersReady();
  });
  afterAll(() => { threadSettings.minWork = PARALLEL_MIN_WORK; });

  for (const fx of fixtures.cases.solve) {
    it(`LU solve on 2 threads: ${String(fx.name)}`, () => {
      const a = m(fx.a);
      const x = withThreads(2, () => solve(a, m(fx.b)));
      expectCMatrixClose(x, m(fx.x), { rtol: 40 * a.rows * EPS * Number(fx.cond) });
      expectBitIdentical(x.data, withThreads(1, () => solve(a, m(fx.b))).data);
    });
  }
  for (const fx of fixtures.cases.cholesky.filter((c) => c.x !== undefined)) {
    it(`Cholesky solve on 2 threads: ${String(fx.name)}`, () => {
      const a = m(fx.a);
      const x = withThreads(2, () => choleskySolve(choleskyFactor(a), m(fx.b)));
      expectCMatrixClose(x, m(fx.x), { rtol: 40 * a.rows * EPS * Number(fx.cond) });
    });
  }
  it('the forced split reached the workers', () => {
    expect(workerCounts().ran.reduce((s, x) => s + x, 0)).toBeGreaterThan(0);
  });
});

describe('setKernelThreads', () => {
  it('the documented numbers: split from 80³ complex multiply–adds; default = available cores, at most 8', () => {
    expect(PARALLEL_MIN_WORK).toBe(80 ** 3);
    expect(DEFAULT_THREAD_CAP).toBe(8);
    expect(defaultThreadCount()).toBe(Math.min(8, availableParallelism()));
    setKernelThreads('auto');
    expect(simdStatus().threads).toBe(Math.min(8, availableParallelism()));
  });
  it('returns the count in use and simdStatus reports it', () => {
    expect(setKernelThreads(1)).toBe(1);
    expect(simdStatus()).toMatchObject({ threads: 1, threadsReason: 'one thread (setKernelThreads(1))' });
    expect(setKernelThreads(2)).toBe(2);
    setKernelThreads('auto');
  });
  it.each([0, 65, 1.5, Number.NaN, -1, '2', null])('rejects %s with a DomainError naming n and the range', (bad) => {
    expect(() => setKernelThreads(bad as unknown as number)).toThrow(DomainError);
    expect(() => setKernelThreads(bad as unknown as number)).toThrow(/setKernelThreads: n must be 'auto' or an integer in 1 … 64, got/);
  });
});

describe('fallback to one thread (fresh module state)', () => {
  afterEach(() => {
    vi.unstubAllGlobals();
    vi.resetModules();
  });

  it('no SharedArrayBuffer: one thread, the reason says so, same bits as the threaded run', async () => {
    const a = randomMatrix(90, 90, 10), b = randomMatrix(90, 90, 11);
    const threaded = withThreads(2, () => multiply(a, b));
    vi.resetModules();
    vi.stubGlobal('SharedArrayBuffer', undefined);
    const simd = await import('../../src/linalg/simd.js');
    const ops = await import('../../src/linalg/ops.js');
    simd.setKernelThreads(2);
    const single = ops.multiply(a, b);
    expect(simd.simdStatus()).toMatchObject({ path: 'wasm-simd', threads: 1, threadsReason: 'this runtime has no SharedArrayBuffer' });
    expectBitIdentical(single.data, threaded.data);
  });

  it('a worker that fails to start: the caller does every chunk (same bits), then the status reports the failure', async () => {
    const a = randomMatrix(90, 90, 12), b = randomMatrix(90, 90, 13);
    const reference = withThreads(1, () => multiply(a, b));
    vi.resetModules();
    const threads = await import('../../src/internal/wasm/threads.js');
    const simd = await import('../../src/linalg/simd.js');
    const ops = await import('../../src/linalg/ops.js');
    threads.threadSettings.workerSource = 'throw new Error("no worker here")';
    simd.setKernelThreads(2);
    expectBitIdentical(ops.multiply(a, b).data, reference.data);
    for (let t = 0; t < 500 && simd.simdStatus().threads !== 1; t++) await new Promise((r) => setTimeout(r, 10));
    expect(simd.simdStatus()).toMatchObject({ threads: 1, threadsReason: expect.stringMatching(/kernel threads stopped: worker 0 failed: no worker here/) });
    expectBitIdentical(ops.multiply(a, b).data, reference.data);
  });
});

describe('LU factor with threads', () => {
  it('luFactor on 1 and 2 threads gives the same packed factors and pivots', () => {
    const a = randomMatrix(290, 290, 14);
    const [f1, f2] = [1, 2].map((t) => withThreads(t, () => luFactor(a)));
    expectBitIdentical(f1.lu.data, f2.lu.data);
    expect(Array.from(f1.pivots)).toEqual(Array.from(f2.pivots));
  });
});
