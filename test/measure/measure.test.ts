import { describe, it, expect } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  yFactorReceiverTemperature, noiseSourceReceiverTemperature, noiseSourceOnTemperature, receiverNoiseFromHotCold, beamReceiverTemperature,
  onOffSensitivity, onOffSensitivityFromCorrelation, apertureEfficiencyFromSensitivity, parseYFactorCsv, parseOnOffCsv,
  reduceYFactorTable, reduceOnOffTable, reduceYFactorCsv, reduceOnOffCsv,
} from '../../src/measure/index.js';
import { readCorrelationMatrixFile, readYFactorCsv } from '../../src/measure/node.js';
import { matrixToJSON } from '../../src/linalg/cmatrix.js';
import { zeros, columnVector, fromRows } from '../../src/linalg/cmatrix.js';
import { add, scale, multiply, adjoint } from '../../src/linalg/ops.js';
import { K_BOLTZMANN_J_PER_K, T0_K } from '../../src/units/constants.js';
import { janskyToSi } from '../../src/units/convert.js';
import { DimensionError, DomainError, ParseError } from '../../src/errors.js';
import { randomHpd, randomMatrix } from '../helpers/matchers.js';

describe('single-channel Y-factor', () => {
  it('textbook relation T_rec = (T_hot − Y T_cold)/(Y − 1)', () => {
    // Pozar, Microwave Engineering 4th ed. §10.1 (from memory): 290 K / 77 K loads, Y = 2 → 136 K.
    const r = yFactorReceiverTemperature({ hotPower: 2, coldPower: 1, hotTemperatureK: 290, coldTemperatureK: 77 });
    expect(r.receiverTemperatureK).toBeCloseTo(136, 12);
    expect(r.yFactor).toBe(2);
    // Same in dB: Y = 3.0103 dB.
    const d = yFactorReceiverTemperature({ hotPower: -57 + 10 * Math.log10(2), coldPower: -57, hotTemperatureK: 290, coldTemperatureK: 77, powerScale: 'dB' });
    expect(d.receiverTemperatureK).toBeCloseTo(136, 9);
  });
  it('round trip: powers generated from a known T_rec are reduced back to it', () => {
    for (const tRec of [5, 35, 136, 900]) {
      const g = 3.7e-9; // arbitrary gain·k_B·B
      const r = yFactorReceiverTemperature({ hotPower: g * (295 + tRec), coldPower: g * (20 + tRec), hotTemperatureK: 295, coldTemperatureK: 20 });
      expect(Math.abs(r.receiverTemperatureK - tRec)).toBeLessThan(1e-9 * tRec);
    }
  });
  it('first-order uncertainty matches a finite-difference propagation', () => {
    const base = { hotPower: 3.1, coldPower: 1.3, hotTemperatureK: 300, coldTemperatureK: 80 };
    const r = yFactorReceiverTemperature({ ...base, hotPowerRelativeSigma: 0.01, coldTemperatureSigmaK: 2 });
    const h = 1e-6;
    const dPh = (yFactorReceiverTemperature({ ...base, hotPower: base.hotPower * (1 + h) }).receiverTemperatureK - yFactorReceiverTemperature(base).receiverTemperatureK) / h; // per relative change
    const dTc = (yFactorReceiverTemperature({ ...base, coldTemperatureK: 80 + h }).receiverTemperatureK - yFactorReceiverTemperature(base).receiverTemperatureK) / h;
    const expected = Math.hypot(dPh * 0.01, dTc * 2);
    expect(Math.abs(r.receiverTemperatureSigmaK / expected - 1)).toBeLessThan(1e-4);
  });
  it('noise-source form: F = ENR/(Y − 1) when the source is off at T0', () => {
    // Keysight AN 57-1 (from memory): NF_dB = ENR_dB − 10 log10(Y − 1).
    const enrDb = 15.2, y = 7.3;
    const r = noiseSourceReceiverTemperature({ enrDb, onPower: y, offPower: 1 });
    expect(r.noiseFigureDb).toBeCloseTo(enrDb - 10 * Math.log10(y - 1), 10);
    expect(r.receiverTemperatureK).toBeCloseTo(T0_K * (10 ** (enrDb / 10) / (y - 1) - 1), 8);
    // The result states the temperatures it used: T_on = T0(1 + ENR), T_off = T0 = 290 K.
    expect(r.onTemperatureK).toBeCloseTo(290 * (1 + 10 ** 1.52), 9);
    expect(r.offTemperatureK).toBe(290);
    expect(r.enrReferenceTemperatureK).toBe(290);
  });
  it('noise-source form with a settable T0 and a cold off state: the Y-factor identity holds', () => {
    // Synthetic linear receiver: P ∝ T_source + T_rec. T0 = 296 K, ENR 6 dB, off at 0 K (≥ 0 K accepted, as by the Y-factor).
    const t0 = 296, tRec = 75, enrDb = 6;
    const tOn = t0 * (1 + 10 ** (enrDb / 10));
    expect(noiseSourceOnTemperature(enrDb, t0)).toBeCloseTo(tOn, 10);
    const r = noiseSourceReceiverTemperature({ enrDb, enrReferenceTemperatureK: t0, offTemperatureK: 0, onPower: tOn + tRec, offPower: tRec });
    expect(r.receiverTemperatureK).toBeCloseTo(tRec, 9);
    expect(r.onTemperatureK).toBeCloseTo(tOn, 10);
    expect(r.offTemperatureK).toBe(0);
    expect(() => noiseSourceReceiverTemperature({ enrDb, offTemperatureK: -1, onPower: 2, offPower: 1 })).toThrow(DomainError);
    expect(() => noiseSourceOnTemperature(15, 0)).toThrow(DomainError);
  });
  it('bad input: Y ≤ 1, non-positive powers, inverted loads', () => {
    expect(() => yFactorReceiverTemperature({ hotPower: 1, coldPower: 1, hotTemperatureK: 290, coldTemperatureK: 77 })).toThrow(/Y = .* ≤ 1/);
    expect(() => yFactorReceiverTemperature({ hotPower: 0, coldPower: 1, hotTemperatureK: 290, coldTemperatureK: 77 })).toThrow(DomainError);
    expect(() => yFactorReceiverTemperature({ hotPower: 2, coldPower: 1, hotTemperatureK: 70, coldTemperatureK: 77 })).toThrow(DomainError);
    expect(() => yFactorReceiverTemperature({ hotPower: 2, coldPower: NaN, hotTemperatureK: 290, coldTemperatureK: 77 })).toThrow(DomainError);
  });
});

describe('matrix Y-factor', () => {
  // Synthetic array: output correlation R(T) = T·R_K + R_rec with known R_K, R_rec (both HPD).
  const n = 6;
  const rK = scale(randomHpd(n, 101), 1e-3);
  const rRec = scale(randomHpd(n, 202), 5e-2);
  const at = (t: number) => add(scale(rK, t), rRec);

  it('recovers the receiver correlation exactly (model identity) and the per-channel Y-factor', () => {
    const res = receiverNoiseFromHotCold({ hot: at(295), cold: at(15), hotTemperatureK: 295, coldTemperatureK: 15 });
    for (let k = 0; k < rRec.data.length; k++) expect(Math.abs(res.receiver.data[k] - rRec.data[k])).toBeLessThan(1e-12);
    // Channel 2 alone: the matrix result equals the scalar Y-factor on that channel's powers.
    const e = zeros(n, 1); e.data[4] = 1;
    const scalar = yFactorReceiverTemperature({ hotPower: at(295).data[2 * (2 * n + 2)], coldPower: at(15).data[2 * (2 * n + 2)], hotTemperatureK: 295, coldTemperatureK: 15 });
    expect(beamReceiverTemperature(res, e)).toBeCloseTo(scalar.receiverTemperatureK, 9);
    // Any beam: wᴴR_rec w / wᴴR_K w.
    const w = randomMatrix(n, 1, 303);
    const num = multiply(adjoint(w), multiply(rRec, w)).data[0];
    const den = multiply(adjoint(w), multiply(rK, w)).data[0];
    expect(beamReceiverTemperature(res, w)).toBeCloseTo(num / den, 9);
  });
  it('bad input', () => {
    expect(() => receiverNoiseFromHotCold({ hot: at(295), cold: zeros(3, 3), hotTemperatureK: 295, coldTemperatureK: 15 })).toThrow(DimensionError);
    expect(() => receiverNoiseFromHotCold({ hot: at(15), cold: at(295), hotTemperatureK: 295, coldTemperatureK: 15 })).toThrow(/no increase/);
    expect(() => receiverNoiseFromHotCold({ hot: randomMatrix(n, n, 1), cold: at(15), hotTemperatureK: 295, coldTemperatureK: 15 })).toThrow(DomainError);
    const res = receiverNoiseFromHotCold({ hot: at(295), cold: at(15), hotTemperatureK: 295, coldTemperatureK: 15 });
    expect(() => beamReceiverTemperature(res, zeros(n + 1, 1))).toThrow(DimensionError);
  });
});

describe('on/off sensitivity', () => {
  it('round trip: powers from a known A_e and T_sys give back A_e/T_sys and SEFD = 2k_B T_sys/A_e', () => {
    // Unpolarised source of flux S adds an antenna temperature T_A = A_e S/(2 k_B) (conventions: sensitivity row).
    const ae = 12.5, tsys = 48, s = janskyToSi(30);
    const ta = (ae * s) / (2 * K_BOLTZMANN_J_PER_K);
    const g = 2.2e-7;
    const r = onOffSensitivity({ onPower: g * (tsys + ta), offPower: g * tsys, fluxDensityWPerM2Hz: s });
    expect(Math.abs(r.aeOverTsysM2PerK / (ae / tsys) - 1)).toBeLessThan(1e-12);
    expect(Math.abs(r.sefdJy / ((2 * K_BOLTZMANN_J_PER_K * tsys) / ae / 1e-26) - 1)).toBeLessThan(1e-12);
    expect(r.appliedCorrections).toEqual({});
    expect(apertureEfficiencyFromSensitivity(r.aeOverTsysM2PerK, tsys, 25)).toBeCloseTo(0.5, 12);
  });
  it('corrections are applied only when given, and reported', () => {
    const base = { onPower: 1.2, offPower: 1, fluxDensityWPerM2Hz: janskyToSi(10) };
    const plain = onOffSensitivity(base);
    const corr = onOffSensitivity({ ...base, corrections: { atmosphere: { zenithOpacityNp: 0.05, elevationRad: Math.PI / 6 }, sourceSizeFactor: 1.1 } });
    const factor = Math.exp(-0.05 / 0.5) / 1.1;
    expect(corr.aeOverTsysM2PerK / plain.aeOverTsysM2PerK).toBeCloseTo(1 / factor, 12);
    expect(Object.keys(corr.appliedCorrections).sort()).toEqual(['atmosphere', 'sourceSize']);
  });
  it('from correlation matrices equals the scalar reduction of the beam powers', () => {
    const n = 4;
    const off = randomHpd(n, 5), src = scale(randomHpd(n, 6), 0.1);
    const on = add(off, src);
    const w = columnVector([1, { re: 0, im: 1 }, -1, 0.5]);
    const r = onOffSensitivityFromCorrelation({ on, off, weights: w, fluxDensityWPerM2Hz: 1e-25 });
    const pOn = multiply(adjoint(w), multiply(on, w)).data[0], pOff = multiply(adjoint(w), multiply(off, w)).data[0];
    expect(r.aeOverTsysM2PerK).toBeCloseTo((2 * K_BOLTZMANN_J_PER_K * (pOn - pOff)) / (1e-25 * pOff), 30);
    expect(() => onOffSensitivityFromCorrelation({ on, off: zeros(3, 3), weights: w, fluxDensityWPerM2Hz: 1e-25 })).toThrow(DimensionError);
  });
  it('first-order uncertainty matches a finite-difference propagation (GUM eq. 10)', () => {
    const base = { onPower: 1.08, offPower: 1, fluxDensityWPerM2Hz: janskyToSi(200) };
    const sOn = 0.003, sOff = 0.002, sS = 0.04;
    const r = onOffSensitivity({ ...base, onPowerRelativeSigma: sOn, offPowerRelativeSigma: sOff, fluxDensityRelativeSigma: sS });
    // Numerical partial derivatives of A_e/T_sys with respect to each input, scaled by its σ.
    const f = (p: typeof base) => onOffSensitivity(p).aeOverTsysM2PerK;
    const h = 1e-7;
    const d = (key: keyof typeof base, rel: number) => ((f({ ...base, [key]: base[key] * (1 + h) }) - f({ ...base, [key]: base[key] * (1 - h) })) / (2 * h)) * rel;
    const sigma = Math.hypot(d('onPower', sOn), d('offPower', sOff), d('fluxDensityWPerM2Hz', sS));
    expect(r.aeOverTsysSigmaM2PerK / sigma).toBeCloseTo(1, 6);
    expect(r.sefdSigmaJy / r.sefdJy).toBeCloseTo(r.aeOverTsysSigmaM2PerK / r.aeOverTsysM2PerK, 12);
    expect(onOffSensitivity(base).aeOverTsysSigmaM2PerK).toBe(0);
  });
  it('bad input', () => {
    expect(() => onOffSensitivity({ onPower: 1.1, offPower: 1, fluxDensityWPerM2Hz: 1e-26, onPowerRelativeSigma: -0.1 })).toThrow(/onPowerRelativeSigma/);
    expect(() => onOffSensitivity({ onPower: 1, offPower: 1.1, fluxDensityWPerM2Hz: 1e-26 })).toThrow(DomainError);
    expect(() => onOffSensitivity({ onPower: 1.1, offPower: 1, fluxDensityWPerM2Hz: -1 })).toThrow(DomainError);
    expect(() => onOffSensitivity({ onPower: 1.1, offPower: 1, fluxDensityWPerM2Hz: 1e-26, corrections: { sourceSizeFactor: 0.5 } })).toThrow(DomainError);
  });
});

describe('measurement tables', () => {
  const csv = '# bench test, loads at 295 K and 77 K\nChannel,Hot,Cold,notes\nA,2.0,1.0,first\n\nB,3.0,1.2,\n';
  it('parses CSV with comments, blank lines and extra columns', () => {
    const rows = parseYFactorCsv(csv);
    expect(rows).toEqual([{ channel: 'A', hot: 2, cold: 1, line: 3 }, { channel: 'B', hot: 3, cold: 1.2, line: 5 }]);
    const red = reduceYFactorTable(rows, { hotTemperatureK: 295, coldTemperatureK: 77 });
    expect(red[0].receiverTemperatureK).toBeCloseTo(295 - 2 * 77, 12);
    expect(parseOnOffCsv('beam,on,off\nb0,1.5,1\n')[0]).toEqual({ beam: 'b0', on: 1.5, off: 1, line: 2 });
    expect(reduceOnOffTable([{ beam: 'b0', on: 1.5, off: 1 }], 1e-26)[0].beam).toBe('b0');
  });
  it('errors name the missing column or the line', () => {
    expect(() => parseYFactorCsv('channel,hot\nA,1\n')).toThrow(/missing column "cold"/);
    try { parseYFactorCsv('channel,hot,cold\nA,1,1\n# c\nB,x,1\n'); expect.unreachable(); } catch (e) {
      expect(e).toBeInstanceOf(ParseError);
      expect((e as ParseError).line).toBe(4);
    }
    expect(() => reduceYFactorTable([{ channel: 'Q', hot: 1, cold: 2 }], { hotTemperatureK: 295, coldTemperatureK: 77 })).toThrow(/channel "Q"/);
    // Rows are counted from 1, like lines (issue 21: no "row 0").
    expect(() => reduceYFactorTable([{ channel: 'P', hot: 2, cold: 1 }, { channel: 'Q', hot: 1, cold: 2 }], { hotTemperatureK: 295, coldTemperatureK: 77 })).toThrow(/^data row 2 \(channel "Q"\)/);
    expect(() => reduceOnOffTable([{ beam: 'b', on: -1, off: 1 }], janskyToSi(100))).toThrow(/^data row 1 \(beam "b"\)/);
    // An empty file (or only comments) says so, on line 1, instead of the CSV parser's delimiter message.
    for (const text of ['', '\n\n', '# only a comment\n']) {
      try { parseYFactorCsv(text); expect.unreachable(); } catch (e) {
        expect(e).toBeInstanceOf(ParseError);
        expect((e as ParseError).message).toMatch(/the CSV is empty: expected a header line with the columns channel, hot, cold/);
        expect((e as ParseError).message).not.toMatch(/delimit/);
        expect((e as ParseError).line).toBe(1);
      }
    }
    expect(() => reduceYFactorTable([{ channel: 'Q', hot: -1, cold: 2 }], { hotTemperatureK: 295, coldTemperatureK: 77 })).toThrow(DomainError);
  });
  it('reads files in the Node entry; errors name the file and line', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-'));
    writeFileSync(join(dir, 't.csv'), csv);
    expect(readYFactorCsv(join(dir, 't.csv')).length).toBe(2);
    expect(() => readYFactorCsv(join(dir, 'missing.csv'))).toThrow(ParseError);
    writeFileSync(join(dir, 'b.csv'), 'channel,hot,cold\nA,1,1\n# c\nB,x,1\n');
    expect(() => readYFactorCsv(join(dir, 'b.csv'))).toThrow(`${join(dir, 'b.csv')}:4: column "hot": expected a finite number, found "x"`);
    const m = fromRows([[2, { re: 0.1, im: 0.2 }], [{ re: 0.1, im: -0.2 }, 3]]);
    writeFileSync(join(dir, 'm.json'), JSON.stringify(matrixToJSON(m)));
    expect(readCorrelationMatrixFile(join(dir, 'm.json')).data).toEqual(m.data);
    writeFileSync(join(dir, 'n.json'), '{"rows": 2,\n  "cols": NaN}');
    expect(() => readCorrelationMatrixFile(join(dir, 'n.json'))).toThrow(`${join(dir, 'n.json')}:2:11: the matrix file is not valid JSON: NaN is not a JSON value`);
  });
  it('row-by-row reduction: bad rows are rejected with their line and reason, good rows reduced', () => {
    const text = '# loads 295 K / 77 K\nchannel,hot,cold\nA,2,1\nB,x,1\n\nC,1,2\nD,3,1\n';
    const r = reduceYFactorCsv(text, { hotTemperatureK: 295, coldTemperatureK: 77 });
    expect(r.results.map((x) => x.channel)).toEqual(['A', 'D']);
    expect(r.results[1].receiverTemperatureK).toBeCloseTo((295 - 3 * 77) / 2, 12);
    expect(r.rejected.map((x) => [x.name, x.row, x.line])).toEqual([['B', 2, 4], ['C', 3, 6]]);
    expect(r.rejected[0].reason).toBe('column "hot": expected a finite number, found "x"');
    expect(r.rejected[1].reason).toMatch(/Y = P_hot\/P_cold = 0.500000 ≤ 1/);
    // The strict form names the first bad row by its CSV line.
    expect(() => reduceYFactorTable(parseYFactorCsv('channel,hot,cold\n# c\nA,1,2\n'), { hotTemperatureK: 295, coldTemperatureK: 77 })).toThrow(/^line 3 \(channel "A"\)/);
    const o = reduceOnOffCsv('beam,on,off\nb1,1.2,1\nb2,0.9,1\n', { fluxDensityWPerM2Hz: janskyToSi(100) });
    expect([o.results.length, o.rejected[0].name, o.rejected[0].line]).toEqual([1, 'b2', 3]);
    expect(() => reduceYFactorCsv('', { hotTemperatureK: 295, coldTemperatureK: 77 })).toThrow(ParseError);
  });
  it('table uncertainties propagate per channel as the single-channel reduction does', () => {
    const opts = { hotTemperatureK: 295, coldTemperatureK: 77, powerRelativeSigma: 0.01, hotTemperatureSigmaK: 0.5, coldTemperatureSigmaK: 1 };
    const [row] = reduceYFactorTable([{ channel: 'A', hot: 2.5, cold: 1 }], opts);
    const one = yFactorReceiverTemperature({ hotPower: 2.5, coldPower: 1, hotTemperatureK: 295, coldTemperatureK: 77, hotPowerRelativeSigma: 0.01, coldPowerRelativeSigma: 0.01, hotTemperatureSigmaK: 0.5, coldTemperatureSigmaK: 1 });
    expect(row.receiverTemperatureSigmaK).toBe(one.receiverTemperatureSigmaK);
    expect(row.receiverTemperatureSigmaK).toBeGreaterThan(0);
  });
});
