/** Test-only builders for network tests (seeded). */
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { seededRandom } from '../helpers/matchers.js';

/**
 * A random reciprocal, strictly passive impedance matrix Z = R + jX [Ω] with
 * R = A Aᵀ + shift·I (real symmetric positive definite) and X real symmetric.
 */
export function randomPassiveImpedance(n: number, seed: number, scaleOhm = 50): CMatrix {
  const rnd = seededRandom(seed);
  const a = Array.from({ length: n * n }, () => 2 * rnd() - 1);
  const b = Array.from({ length: n * n }, () => 2 * rnd() - 1);
  const data = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      let r = 0;
      for (let k = 0; k < n; k++) r += a[i * n + k] * a[j * n + k];
      if (i === j) r += 0.2 * n;
      data[2 * (i * n + j)] = scaleOhm * r / n;
      data[2 * (i * n + j) + 1] = scaleOhm * (b[i * n + j] + b[j * n + i]) / 2;
    }
  }
  return { rows: n, cols: n, data };
}

/** Indices 0..n−1 without those listed. */
export function complement(n: number, drop: number[]): number[] {
  return Array.from({ length: n }, (_, i) => i).filter((i) => !drop.includes(i));
}
