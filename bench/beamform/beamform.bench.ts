import { bench, describe } from 'vitest';
import { maxSnrWeightsForDirections } from '../../src/beamform/weights.js';
import { musicSpectrum } from '../../src/beamform/spectra.js';
import { choleskyFactor, choleskySolve } from '../../src/linalg/cholesky.js';
import { uniformLineLayout } from '../../src/geometry/builders.js';
import { unitVectorFromUv } from '../../src/geometry/directions.js';
import { steeringMatrix } from '../../src/pattern/steering.js';
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { randomHpd } from '../../test/helpers/matchers.js';

const F_HZ = 1.5e9;
const LAMBDA_M = 299792458 / F_HZ;

function lineScan(n: number, count: number): CMatrix {
  const dirs = new Float64Array(3 * count);
  for (let i = 0; i < count; i++) dirs.set(unitVectorFromUv(-0.99 + (1.98 * i) / (count - 1), 0), 3 * i);
  return steeringMatrix(uniformLineLayout(n, LAMBDA_M / 2, { axis: 'x' }), dirs, F_HZ);
}

function sink(m: CMatrix | Float64Array): void {
  const d = 'data' in m ? m.data : m;
  if (!Number.isFinite(d[0]) || !Number.isFinite(d[d.length - 1])) throw new Error('non-finite benchmark output');
}

describe('1000 max-SNR beams, N = 128 (one factorisation, many solves)', () => {
  const rn = randomHpd(128, 0x5eed, 0.5);
  const steer = lineScan(128, 1000);
  bench('maxSnrWeightsForDirections (validate, factor, solve, normalise)', () => { sink(maxSnrWeightsForDirections(steer, rn)); });
  bench('raw choleskyFactor + choleskySolve, no normalisation', () => { sink(choleskySolve(choleskyFactor(rn), steer)); });
});

describe('MUSIC spectrum, N = 64, 10 000 directions', () => {
  const n = 64;
  const a = lineScan(n, 3);
  // Three sources plus white noise: exact model correlation A Aᴴ + 0.1 I.
  const r = randomHpd(n, 1, 0.1);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    let re = 0, im = 0;
    for (let k = 0; k < 3; k++) {
      const p = 2 * (i * 3 + k), q = 2 * (j * 3 + k);
      re += a.data[p] * a.data[q] + a.data[p + 1] * a.data[q + 1];
      im += a.data[p + 1] * a.data[q] - a.data[p] * a.data[q + 1];
    }
    r.data[2 * (i * n + j)] = re + (i === j ? 0.1 : 0);
    r.data[2 * (i * n + j) + 1] = im;
  }
  const scan = lineScan(n, 10000);
  bench('musicSpectrum, K = 3 (signal-subspace branch)', () => { sink(musicSpectrum(r, scan, 3)); });
  bench('musicSpectrum, K = 40 (noise-subspace branch)', () => { sink(musicSpectrum(r, scan, 40)); });
});
