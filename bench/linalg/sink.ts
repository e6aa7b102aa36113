/**
 * Bench helpers for the linalg kernels: seeded inputs built outside timing and
 * a sink that consumes results and fails on NaN.
 */
import type { CMatrix } from '../../src/linalg/cmatrix.js';

let acc = 0;

/** Consumes a result so the JIT cannot drop the work; throws on NaN. */
export function sink(x: CMatrix | Float64Array | number): void {
  const v = typeof x === 'number' ? x : x instanceof Float64Array ? x[0] : x.data[0];
  if (Number.isNaN(v)) throw new Error('bench produced NaN');
  acc += v;
}

/** Seeded uniform [−1, 1] + j[−1, 1] entries (mulberry32). */
export function seededMatrix(rows: number, cols: number, seed: number): CMatrix {
  let a = seed >>> 0;
  const data = new Float64Array(2 * rows * cols);
  for (let k = 0; k < data.length; k++) {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    data[k] = (2 * (((t ^ (t >>> 14)) >>> 0) / 4294967296)) - 1;
  }
  return { rows, cols, data };
}

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
  const g = seededMatrix(n, n, seed);
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
      out[2 * (i * n + j)] = re + (i === j ? n : 0);
      out[2 * (i * n + j) + 1] = i === j ? 0 : im;
    }
  }
  return { rows: n, cols: n, data: out };
}

/** Accumulated sink value (keeps `acc` observable). */
export function sinkValue(): number {
  return acc;
}
