/**
 * Bench helpers for the linalg kernels: seeded inputs built outside timing and
 * a sink that consumes results and fails on NaN.
 */
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { randomHpd, randomMatrix } from '../../test/helpers/random.js';

let acc = 0;

/** Consumes a result so the JIT cannot drop the work; throws on NaN. */
export function sink(x: CMatrix | Float64Array | number): void {
  const v = typeof x === 'number' ? x : x instanceof Float64Array ? x[0] : x.data[0];
  if (Number.isNaN(v)) throw new Error('bench produced NaN');
  acc += v;
}

/** Seeded uniform [−1, 1] + j[−1, 1] entries (mulberry32; the shared test generator). */
export const seededMatrix = randomMatrix;

/** A + Aᴴ of a seeded matrix (Hermitian). */
export function seededHermitian(n: number, seed: number): CMatrix {
  const a = seededMatrix(n, n, seed);
  const d = a.data;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j <= i; j++) {
      const p = 2 * (i * n + j), q = 2 * (j * n + i);
      const re = d[p] + d[q], im = d[p + 1] - d[q + 1];
      d[p] = re; d[p + 1] = im; d[q] = re; d[q + 1] = -im;
    }
  }
  return a;
}

/** G Gᴴ + n·I of a seeded matrix (Hermitian positive definite). */
export function seededHpd(n: number, seed: number): CMatrix {
  return randomHpd(n, seed, 1);
}

/** Accumulated sink value (keeps `acc` observable). */
export function sinkValue(): number {
  return acc;
}
