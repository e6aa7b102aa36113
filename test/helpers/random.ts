/**
 * Seeded random test and bench inputs (no test-framework imports, so benches and scripts can use them).
 */
import type { CMatrix } from '../../src/linalg/cmatrix.js';

/** Small, fast, seeded PRNG (mulberry32) for test inputs. */
export function seededRandom(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** A rows×cols matrix with entries uniform in [−1, 1] + j[−1, 1]. */
export function randomMatrix(rows: number, cols: number, seed: number): CMatrix {
  const rnd = seededRandom(seed);
  const data = new Float64Array(2 * rows * cols);
  for (let k = 0; k < data.length; k++) data[k] = 2 * rnd() - 1;
  return { rows, cols, data };
}

/** A random Hermitian positive-definite n×n matrix G Gᴴ + shift·I. */
export function randomHpd(n: number, seed: number, shift = 1e-1): CMatrix {
  const g = randomMatrix(n, n, seed);
  const out = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let re = 0, im = 0;
      for (let k = 0; k < n; k++) {
        const ar = g.data[2 * (i * n + k)], ai = g.data[2 * (i * n + k) + 1];
        const br = g.data[2 * (j * n + k)], bi = -g.data[2 * (j * n + k) + 1];
        re += ar * br - ai * bi;
        im += ar * bi + ai * br;
      }
      out[2 * (i * n + j)] = re + (i === j ? shift * n : 0);
      out[2 * (i * n + j) + 1] = i === j ? 0 : im;
    }
  }
  return { rows: n, cols: n, data: out };
}
