import { describe, it, expect } from 'vitest';
import { DimensionError } from '../../src/errors.js';
import { diagonal } from '../../src/linalg/cmatrix.js';
import { multiply, quadraticForm } from '../../src/linalg/ops.js';
import {
  loadedVoltageTransfer, referCorrelationToLoads, referCorrelationToOpenCircuit, referWeightsToLoads, referWeightsToOpenCircuit,
} from '../../src/reception/referral.js';
import { expectCMatrixClose, randomHpd, randomMatrix } from '../helpers/matchers.js';

const n = 5;
const za = randomMatrix(n, n, 21);
for (let i = 0; i < n; i++) za.data[2 * (i * n + i)] += 60;
const zl = diagonal([{ re: 50, im: 5 }, 45, { re: 60, im: -20 }, 50, { re: 30, im: 10 }]);

describe('referral between open-circuit terminals and loads', () => {
  it('Q = Z_L (Z_A + Z_L)⁻¹ satisfies the circuit equations V = Z_A I + v_oc, V = −Z_L I', () => {
    // Thevenin equivalent of a multiport (circuit identity).
    const q = loadedVoltageTransfer(za, zl);
    const voc = randomMatrix(n, 1, 5);
    const v = multiply(q, voc);
    // I = −Z_L⁻¹ V; check Z_A I + v_oc = V
    const i = new Float64Array(2 * n);
    for (let k = 0; k < n; k++) {
      const zr = zl.data[2 * (k * n + k)], zi = zl.data[2 * (k * n + k) + 1], d = zr * zr + zi * zi;
      const vr = v.data[2 * k], vi = v.data[2 * k + 1];
      i[2 * k] = -(vr * zr + vi * zi) / d; i[2 * k + 1] = -(vi * zr - vr * zi) / d;
    }
    const back = multiply(za, { rows: n, cols: 1, data: i });
    for (let k = 0; k < 2 * n; k++) back.data[k] += voc.data[k];
    expectCMatrixClose(back, v, { rtol: 1e-12 });
  });
  it('SNR is the same at the open-circuit terminals and at the loads (round trip exact)', () => {
    const rs = randomHpd(n, 7), rn = randomHpd(n, 8);
    const rsL = referCorrelationToLoads(rs, za, zl), rnL = referCorrelationToLoads(rn, za, zl);
    expectCMatrixClose(referCorrelationToOpenCircuit(rsL, za, zl), rs, { rtol: 1e-11 });
    for (let t = 0; t < 10; t++) {
      const wL = randomMatrix(n, 1, 40 + t);
      const wOc = referWeightsToOpenCircuit(wL, za, zl);
      const snrL = quadraticForm(wL, rsL) / quadraticForm(wL, rnL);
      const snrOc = quadraticForm(wOc, rs) / quadraticForm(wOc, rn);
      expect(Math.abs(snrL - snrOc)).toBeLessThan(1e-11 * snrOc);
      expectCMatrixClose(referWeightsToLoads(wOc, za, zl), wL, { rtol: 1e-11 });
    }
  });
  it('rejects mismatched port counts', () => {
    expect(() => loadedVoltageTransfer(za, diagonal([50, 50]))).toThrow(DimensionError);
    expect(() => referCorrelationToLoads(randomHpd(3, 1), za, zl)).toThrow(DimensionError);
    expect(() => referWeightsToOpenCircuit(randomMatrix(3, 1, 1), za, zl)).toThrow(DimensionError);
  });
});
