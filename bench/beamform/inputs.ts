/** Seeded inputs shared by the beamforming bench and the bench:compare entries (built outside timing). */
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { uniformLineLayout } from '../../src/geometry/builders.js';
import { unitVectorFromUv } from '../../src/geometry/directions.js';
import { steeringMatrix } from '../../src/pattern/steering.js';
import { seededHpd } from '../linalg/sink.js';

/** Frequency of the scenarios [Hz]; half-wave spacing at it. */
export const BENCH_FREQUENCY_HZ = 1.5e9;
const SPACING_M = 299792458 / BENCH_FREQUENCY_HZ / 2;

/** Steering matrix of an N-element half-wave line along x for `count` directions, u from −0.99 to 0.99. */
export function lineScan(n: number, count: number): CMatrix {
  const dirs = new Float64Array(3 * count);
  for (let i = 0; i < count; i++) dirs.set(unitVectorFromUv(-0.99 + (1.98 * i) / (count - 1), 0), 3 * i);
  return steeringMatrix(uniformLineLayout(n, SPACING_M, { axis: 'x' }), dirs, BENCH_FREQUENCY_HZ);
}

/** Noise correlation for the max-SNR kernel: seeded G Gᴴ + N·I, N = 128. */
export function maxSnrInputs(): { noise: CMatrix; steering: CMatrix } {
  return { noise: seededHpd(128, 0x5eed), steering: lineScan(128, 1000) };
}

/** Model correlation A Aᴴ + 0.1·I of three unit sources on a 64-element line, and 10 000 scan directions. */
export function musicInputs(): { correlation: CMatrix; scan: CMatrix } {
  const n = 64;
  const a = lineScan(n, 3);
  const data = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let re = 0, im = 0;
    for (let k = 0; k < 3; k++) {
      const p = 2 * (i * 3 + k), q = 2 * (j * 3 + k);
      re += a.data[p] * a.data[q] + a.data[p + 1] * a.data[q + 1];
      im += a.data[p + 1] * a.data[q] - a.data[p] * a.data[q + 1];
    }
    data[2 * (i * n + j)] = re + (i === j ? 0.1 : 0);
    data[2 * (i * n + j) + 1] = i === j ? 0 : im;
  }
  return { correlation: { rows: n, cols: n, data }, scan: lineScan(n, 10000) };
}
