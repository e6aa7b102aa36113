import { describe, it, expect } from 'vitest';
import { Complex } from 'complex.js';
import {
  noiseTemperatureK, noiseFigureDb, noiseParametersFromFigure, chainNoiseCorrelation, noiseParametersFromChainCorrelation,
  convertNoiseCorrelation, cascadeNoiseTemperatureK, thermalImpedanceNoise, thermalNoiseWaves, withImpedanceNoise,
  impedanceNoiseOf, withThermalNoise, withTwoPortNoise, twoPortNoiseOf,
} from '../../src/network/noise.js';
import { createMultiport, multiportMatrix } from '../../src/network/multiport.js';
import { convertMultiport, renormalizeMultiport } from '../../src/network/convert.js';
import { cascadeTwoPorts, joinPorts, terminatePorts } from '../../src/network/connect.js';
import { fromRows, multiply, inverse, entry } from '../../src/linalg/index.js';
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { K_BOLTZMANN_J_PER_K, T0_K } from '../../src/units/constants.js';
import { DomainError, DimensionError } from '../../src/errors.js';
import { expectCMatrixClose } from '../helpers/matchers.js';
import { randomPassiveImpedance } from './helpers.js';

const params = { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 8, optimumSourceAdmittanceS: new Complex(0.012, -0.006) };

describe('noise temperature and figure', () => {
  it('textbook reflection-coefficient form F = Fmin + 4 rn |Γs − Γopt|²/((1 − |Γs|²)|1 + Γopt|²) (Pozar, Microwave Engineering, 4th ed., 2012, ch. 12, from memory)', () => {
    const z0 = 50;
    const gs = new Complex(0.3, -0.4), gopt = new Complex(1).sub(params.optimumSourceAdmittanceS.mul(z0)).div(params.optimumSourceAdmittanceS.mul(z0).add(1));
    const ys = new Complex(1).sub(gs).div(gs.add(1).mul(z0));
    const fmin = 1 + params.minimumNoiseTemperatureK / T0_K;
    const f = fmin + (4 * (params.noiseResistanceOhm / z0) * gs.sub(gopt).abs() ** 2) / ((1 - gs.abs() ** 2) * gopt.add(1).abs() ** 2);
    expect(noiseFigureDb(params, ys)).toBeCloseTo(10 * Math.log10(f), 12);
    expect(noiseTemperatureK(params, params.optimumSourceAdmittanceS)).toBeCloseTo(35, 12);
  });
  it('data-sheet form round trip and a direct circuit evaluation from C_A', () => {
    const p = noiseParametersFromFigure(0.5, 10, { re: 0.2, im: 0.3 }, 50);
    expect(p.minimumNoiseTemperatureK).toBeCloseTo(T0_K * (10 ** 0.05 - 1), 12);
    const ca = chainNoiseCorrelation(p, 1e6);
    const back = noiseParametersFromChainCorrelation(ca, 1e6);
    expect(back.minimumNoiseTemperatureK).toBeCloseTo(p.minimumNoiseTemperatureK, 9);
    expect(back.noiseResistanceOhm).toBeCloseTo(10, 12);
    expect(back.optimumSourceAdmittanceS.sub(p.optimumSourceAdmittanceS).abs()).toBeLessThan(1e-15);
    // a source Y_s with Norton current i_s: equivalent input noise current i + Y_s u (module notes)
    const ys = new Complex(0.03, 0.01);
    const cuu = entry(ca, 0, 0), cui = entry(ca, 0, 1), ciu = entry(ca, 1, 0), cii = entry(ca, 1, 1);
    const total = cii.add(ys.mul(cui)).add(ys.conjugate().mul(ciu)).add(cuu.mul(ys.abs() ** 2)).re;
    const t = total / (4 * K_BOLTZMANN_J_PER_K * 1e6 * ys.re);
    expect(t).toBeCloseTo(noiseTemperatureK(p, ys), 9);
  });
  it('bad input', () => {
    expect(() => noiseTemperatureK(params, { re: 0, im: 0.01 })).toThrow(DomainError);
    expect(() => noiseTemperatureK({ ...params, noiseResistanceOhm: -1 }, 0.02)).toThrow(DomainError);
    expect(() => noiseParametersFromFigure(1, 10, 1.2, 50)).toThrow(DomainError);
    expect(() => cascadeNoiseTemperatureK([])).toThrow(DimensionError);
    expect(() => cascadeNoiseTemperatureK([{ noiseTemperatureK: 10, availableGain: 0 }])).toThrow(DomainError);
  });
});

describe('Twiss (1955) vs. the scattering form', () => {
  it('2kTB(Z + Zᴴ) mapped to waves equals kTB(I − SSᴴ) on random passive networks, complex references', () => {
    for (let seed = 1; seed <= 5; seed++) {
      const n = 2 + (seed % 4);
      const z = randomPassiveImpedance(n, seed);
      const refs = Array.from({ length: n }, (_, i) => ({ re: 20 + 15 * i, im: 10 * (i - 1) }));
      const net = createMultiport('impedance', [1e9], [z], { referenceOhm: refs });
      const twiss = withImpedanceNoise(net, [thermalImpedanceNoise(z, 300, 1)]);
      const s = multiportMatrix(convertMultiport(net, 'scattering'), 0);
      const cs = thermalNoiseWaves(s, 300, 1);
      expectCMatrixClose({ rows: n, cols: n, data: twiss.noiseWaves!.slice() }, cs, { rtol: 1e-12 });
      expectCMatrixClose(impedanceNoiseOf(withThermalNoise(net, 300))[0], thermalImpedanceNoise(z, 300, 1), { rtol: 1e-12 });
    }
  });
  it('Bosma (1967): thermal networks at one T stay thermal after joining and renormalisation', () => {
    const f = [1e9, 1.5e9];
    const a = withThermalNoise(createMultiport('impedance', f, [randomPassiveImpedance(3, 31), randomPassiveImpedance(3, 32)], { referenceOhm: [50, { re: 30, im: 12 }, 70] }), 290);
    const b = withThermalNoise(createMultiport('impedance', f, [randomPassiveImpedance(2, 33), randomPassiveImpedance(2, 34)]), 290);
    const j = renormalizeMultiport(joinPorts(a, 1, b, 0), [{ re: 40, im: -5 }, 60, 45]);
    const expected = withThermalNoise(j, 290);
    for (let k = 0; k < 2; k++) {
      expectCMatrixClose({ rows: 3, cols: 3, data: j.noiseWaves!.subarray(18 * k, 18 * (k + 1)) as Float64Array },
        { rows: 3, cols: 3, data: expected.noiseWaves!.subarray(18 * k, 18 * (k + 1)) as Float64Array }, { rtol: 1e-11 });
    }
  });
});

describe('terminations at a temperature (Bosma 1967)', () => {
  it('a lossless network closed by loads at T is thermal at T; a thermal network closed by warm loads too', () => {
    const x = randomPassiveImpedance(4, 81);
    for (let q = 0; q < x.data.length; q += 2) x.data[q] = 0; // Z = jX: lossless
    const f = [1e9];
    const lossless = createMultiport('impedance', f, [x], { referenceOhm: [50, { re: 30, im: 20 }, 50, 75] });
    const t = terminatePorts(lossless, [1, 3], [{ re: 40, im: 10 }, 120], { loadTemperatureK: 250 });
    const expected = withThermalNoise(t, 250);
    expectCMatrixClose({ rows: 2, cols: 2, data: t.noiseWaves! }, { rows: 2, cols: 2, data: expected.noiseWaves! }, { rtol: 1e-12 });
    const warm = withThermalNoise(createMultiport('impedance', f, [randomPassiveImpedance(3, 82)]), 400);
    const t2 = terminatePorts(warm, [0], [{ re: 10, im: -30 }], { loadTemperatureK: [400] });
    expectCMatrixClose({ rows: 2, cols: 2, data: t2.noiseWaves! }, { rows: 2, cols: 2, data: withThermalNoise(t2, 400).noiseWaves! }, { rtol: 1e-12 });
    expect(() => terminatePorts(warm, [0], [50], { loadTemperatureK: [1, 2] })).toThrow(DimensionError);
    expect(() => terminatePorts(warm, [0], [50], { loadTemperatureK: -1 })).toThrow(DomainError);
  });
});

describe('correlation-matrix forms (Hillbrand & Russer 1976)', () => {
  it('Z ↔ Y ↔ chain transformations agree with thermal noise of the same two-port', () => {
    const z = randomPassiveImpedance(2, 41);
    const y = inverse(z);
    const zn = createMultiport('impedance', [1e9], [z]);
    const abcd = multiportMatrix(convertMultiport(zn, 'chain'), 0);
    const cz = thermalImpedanceNoise(z, 400, 1);
    const cy = multiply(multiply(y, cz), fromRows([[entry(y, 0, 0).conjugate(), entry(y, 1, 0).conjugate()], [entry(y, 0, 1).conjugate(), entry(y, 1, 1).conjugate()]]));
    // C_Y of a thermal network is 2kT(Y + Yᴴ) (Twiss, dual form)
    const twissY = thermalImpedanceNoise(y, 400, 1);
    expectCMatrixClose(cy, twissY, { rtol: 1e-12 });
    expectCMatrixClose(convertNoiseCorrelation(cz, 'impedance', 'admittance', abcd), twissY, { rtol: 1e-12 });
    const ca = convertNoiseCorrelation(cz, 'impedance', 'chain', abcd);
    expectCMatrixClose(convertNoiseCorrelation(twissY, 'admittance', 'chain', abcd), ca, { rtol: 1e-12 });
    expectCMatrixClose(convertNoiseCorrelation(ca, 'chain', 'impedance', abcd), cz, { rtol: 1e-12 });
  });
  it('a matched attenuator of loss L at temperature T has noise temperature (L − 1)T', () => {
    // resistive T-pad, Z0 = 50 Ω, K = √L: series arms Z0 (K−1)/(K+1), shunt 2 Z0 K/(K² − 1)
    // (Pozar 2012 problem set / common practice, from memory); verified below by S11 = 0, |S21|² = 1/L.
    const L = 10 ** (3 / 10), K = Math.sqrt(L), z0 = 50;
    const r1 = (z0 * (K - 1)) / (K + 1), r2 = (2 * z0 * K) / (K * K - 1);
    const z = fromRows([[r1 + r2, r2], [r2, r1 + r2]]);
    const T = 310;
    const att = withThermalNoise(createMultiport('impedance', [1e9], [z]), T);
    const s = multiportMatrix(convertMultiport(att, 'scattering'), 0);
    expect(entry(s, 0, 0).abs()).toBeLessThan(1e-14);
    expect(entry(s, 1, 0).abs() ** 2).toBeCloseTo(1 / L, 14);
    const p = twoPortNoiseOf(att)[0];
    expect(noiseTemperatureK(p, 1 / z0)).toBeCloseTo((L - 1) * T, 9);
    // the same from the Twiss C_Z through the chain form
    const ca = convertNoiseCorrelation(thermalImpedanceNoise(z, T, 1), 'impedance', 'chain', multiportMatrix(convertMultiport(att, 'chain'), 0));
    expect(noiseTemperatureK(noiseParametersFromChainCorrelation(ca, 1), 1 / z0)).toBeCloseTo((L - 1) * T, 9);
  });
});

describe('Friis (1944) cascade vs. noise of connected networks', () => {
  it('two noisy amplifier two-ports in cascade', () => {
    const f = [2e9];
    // stage chain matrices (our own example amplifiers), noise parameters of each
    const a1 = fromRows([[{ re: 0.05, im: 0.02 }, { re: 4, im: 1 }], [{ re: 0.0008, im: 0.0003 }, { re: 0.06, im: -0.01 }]]);
    const a2 = fromRows([[{ re: 0.1, im: -0.03 }, { re: 6, im: 2 }], [{ re: 0.001, im: 0 }, { re: 0.08, im: 0.02 }]]);
    const p1 = { minimumNoiseTemperatureK: 40, noiseResistanceOhm: 6, optimumSourceAdmittanceS: new Complex(0.015, -0.004) };
    const p2 = { minimumNoiseTemperatureK: 90, noiseResistanceOhm: 15, optimumSourceAdmittanceS: new Complex(0.01, 0.005) };
    const n1 = withTwoPortNoise(createMultiport('chain', f, [a1]), [p1]);
    const n2 = withTwoPortNoise(createMultiport('chain', f, [a2]), [p2]);
    // round trip of the parameters through the noise waves
    const back = twoPortNoiseOf(n1)[0];
    expect(back.minimumNoiseTemperatureK).toBeCloseTo(40, 9);
    expect(back.optimumSourceAdmittanceS.sub(p1.optimumSourceAdmittanceS).abs()).toBeLessThan(1e-14);
    const cas = twoPortNoiseOf(cascadeTwoPorts(n1, n2))[0];
    const zs = new Complex(35, 15), ys = new Complex(1).div(zs);
    const A = new Complex(a1.data[0], a1.data[1]), B = new Complex(a1.data[2], a1.data[3]);
    const C = new Complex(a1.data[4], a1.data[5]), D = new Complex(a1.data[6], a1.data[7]);
    // output impedance of stage 1 driven from Z_s: (D Z_s + B)/(C Z_s + A); available gain
    // G = R_s / (|A + C Z_s|² Re Z_out) (Thevenin at both ends).
    const zout = D.mul(zs).add(B).div(C.mul(zs).add(A));
    const g1 = zs.re / (A.add(C.mul(zs)).abs() ** 2 * zout.re);
    const t1 = noiseTemperatureK(p1, ys), t2 = noiseTemperatureK(p2, new Complex(1).div(zout));
    expect(noiseTemperatureK(cas, ys)).toBeCloseTo(cascadeNoiseTemperatureK([{ noiseTemperatureK: t1, availableGain: g1 }, { noiseTemperatureK: t2, availableGain: 1 }]), 8);
  });
});
