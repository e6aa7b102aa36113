import { describe, it, expect } from 'vitest';
import { DimensionError, DomainError } from '../../src/errors.js';
import { fromRows } from '../../src/linalg/cmatrix.js';
import { K_BOLTZMANN_J_PER_K, T0_K } from '../../src/units/constants.js';
import { receiverNoiseCorrelation } from '../../src/reception/amplifier.js';
import { noiseTemperatureK as amplifierNoiseTemperature, type NoiseParametersInput as AmplifierNoise } from '../../src/network/noise.js';
import { isHermitian } from '../../src/linalg/ops.js';
import { seededRandom, randomMatrix } from '../helpers/matchers.js';

/** Random physical noise parameters: T_min ≤ 4 T0 R_n Re Y_opt by construction. */
function randomAmplifier(rnd: () => number): AmplifierNoise {
  const rn = 1 + 30 * rnd();
  const yr = 0.002 + 0.05 * rnd(), yi = 0.04 * (rnd() - 0.5);
  const tMin = 4 * T0_K * rn * yr * rnd();
  return { minimumNoiseTemperatureK: tMin, noiseResistanceOhm: rn, optimumSourceAdmittanceS: { re: yr, im: yi } };
}

describe('receiverNoiseCorrelation', () => {
  it('N = 1 reduces to the one-amplifier formula at 500 random points', () => {
    // DESIGN "noise of one amplifier": every multi-port model must reduce to it.
    const rnd = seededRandom(8);
    const b = 1e6;
    for (let t = 0; t < 500; t++) {
      const amp = randomAmplifier(rnd);
      const zr = 1 + 200 * rnd(), zi = 300 * (rnd() - 0.5);
      const r = receiverNoiseCorrelation(fromRows([[{ re: zr, im: zi }]]), amp, b);
      const tEq = r.data[0] / (4 * K_BOLTZMANN_J_PER_K * b * zr);
      const d = zr * zr + zi * zi;
      const expected = amplifierNoiseTemperature(amp, { re: zr / d, im: -zi / d });
      expect(Math.abs(tEq - expected)).toBeLessThanOrEqual(1e-10 * expected + 1e-9);
      expect(r.data[1]).toBe(0);
    }
  });
  it('is Hermitian positive semidefinite for random coupled arrays and independent of the loads', () => {
    const rnd = seededRandom(3);
    const n = 6;
    const z = randomMatrix(n, n, 11);
    for (let i = 0; i < n; i++) z.data[2 * (i * n + i)] += 100;
    const amps = Array.from({ length: n }, () => randomAmplifier(rnd));
    const r = receiverNoiseCorrelation(z, amps, 1);
    expect(isHermitian(r, 1e-12)).toBe(true);
    // PSD: wᴴRw ≥ 0 for random w (R = E[(e + Zi)(e + Zi)ᴴ] of a PSD source covariance)
    for (let t = 0; t < 50; t++) {
      const w = randomMatrix(n, 1, 100 + t);
      let acc = 0;
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        const wr = w.data[2 * i], wi = -w.data[2 * i + 1], vr = w.data[2 * j], vi = w.data[2 * j + 1];
        const rr = r.data[2 * (i * n + j)], ri = r.data[2 * (i * n + j) + 1];
        const pr = wr * rr - wi * ri, pi = wr * ri + wi * rr;
        acc += pr * vr - pi * vi;
      }
      expect(acc).toBeGreaterThanOrEqual(-1e-12 * Math.abs(r.data[0]));
    }
  });
  it('uncoupled array: diagonal entries are the one-amplifier temperatures of each port', () => {
    const amp: AmplifierNoise = { minimumNoiseTemperatureK: 15, noiseResistanceOhm: 8, optimumSourceAdmittanceS: { re: 0.015, im: -0.004 } };
    const z = fromRows([[{ re: 73, im: 42 }, 0], [0, { re: 50, im: -10 }]]);
    const r = receiverNoiseCorrelation(z, [amp, amp], 1);
    expect(r.data[2]).toBe(0);
    const t0 = r.data[0] / (4 * K_BOLTZMANN_J_PER_K * 73);
    expect(t0).toBeCloseTo(amplifierNoiseTemperature(amp, { re: 73 / (73 * 73 + 42 * 42), im: -42 / (73 * 73 + 42 * 42) }), 9);
  });
  it('typed errors: wrong amplifier count, non-square Z, non-physical parameters', () => {
    const amp: AmplifierNoise = { minimumNoiseTemperatureK: 15, noiseResistanceOhm: 8, optimumSourceAdmittanceS: 0.02 };
    const z = fromRows([[50, 1], [1, 50]]);
    expect(() => receiverNoiseCorrelation(z, [amp], 1)).toThrow(DimensionError);
    expect(() => receiverNoiseCorrelation(fromRows([[50, 1]]), amp, 1)).toThrow(DimensionError);
    expect(() => receiverNoiseCorrelation(z, { ...amp, minimumNoiseTemperatureK: 1000 }, 1)).toThrow(DomainError);
    expect(() => receiverNoiseCorrelation(z, amp, 0)).toThrow(DomainError);
    // physical realizability T_min ≤ 4 T0 R_n Re Y_opt (PSD noise correlation)
    const edge = { minimumNoiseTemperatureK: 4 * T0_K * 8 * 0.02, noiseResistanceOhm: 8, optimumSourceAdmittanceS: 0.02 };
    expect(() => receiverNoiseCorrelation(z, edge, 1)).not.toThrow();
    expect(() => receiverNoiseCorrelation(z, { ...edge, minimumNoiseTemperatureK: edge.minimumNoiseTemperatureK * 1.001 }, 1)).toThrow(DomainError);
    expect(() => receiverNoiseCorrelation(z, { ...edge, minimumNoiseTemperatureK: -1 }, 1)).toThrow(DomainError);
    expect(() => receiverNoiseCorrelation(z, { ...edge, optimumSourceAdmittanceS: -0.02 }, 1)).toThrow(DomainError);
  });
});
