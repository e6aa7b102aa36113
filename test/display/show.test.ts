/**
 * Printed forms of results: the text names the quantities, carries their units and shapes, and
 * its numbers agree with independent hand computations; attaching the printed form leaves the
 * plain data (JSON, structural equality, structured clone) exactly as it was.
 */
import { describe, it, expect } from 'vitest';
import { inspect } from 'node:util';
import {
  fromRows, zeros, columnVector, multiply, show, resultKind, unitOfField, resultFromJSON, INSPECT_SYMBOL, taylorTaper,
  lineTaperFigures, createMultiport, noiseParametersFromFigure, cutFigures, yFactorReceiverTemperature, onOffSensitivity,
  reduceYFactorTable, physicalCheck, type CMatrix,
} from '../../src/index.js';

const z = fromRows([[1, { re: 0, im: -2 }], [3, 4]]);

describe('complex matrices', () => {
  it('header states shape and the Frobenius norm; entries read as a + bj', () => {
    const t = show(z).split('\n');
    // ‖A‖_F = √(1 + 4 + 9 + 16) = √30 = 5.4772… (hand computation)
    expect(t[0]).toBe('CMatrix 2×2 complex, ‖A‖_F = 5.477');
    expect(t[1]).toBe('  [ 1+0j  0−2j ]');
    expect(t[2]).toBe('  [ 3+0j  4+0j ]');
  });
  it('vectors state their length and 2-norm', () => {
    // ‖(3, 4j)‖₂ = 5
    expect(show(columnVector([3, { re: 0, im: 4 }]))).toMatch(/^complex vector, 2 entries, ‖v‖₂ = 5\n/);
  });
  it('large matrices keep their corners and elide the middle', () => {
    const a = zeros(20, 30);
    a.data[0] = 7;
    a.data[2 * (19 * 30 + 29) + 1] = -2.5;
    const lines = show(a).split('\n');
    expect(lines[0]).toContain('20×30');
    expect(lines[0]).toContain('‖A‖_F = 7.433'); // √(49 + 6.25)
    expect(lines).toHaveLength(1 + 9); // 4 + 4 rows and the ⋮ row
    expect(lines[1].trim().startsWith('[ 7+0j')).toBe(true);
    expect(lines[9]).toContain('0−2.5j ]');
    expect(lines[5]).toContain('⋱');
    expect(lines[1]).toContain('…');
  });
  it('empty matrices', () => {
    expect(show(zeros(0, 3))).toContain('0×3');
  });
  it("Node's inspect (REPL, console.log) prints the summary, also nested", () => {
    expect(inspect(z)).toBe(show(z));
    expect(inspect({ impedance: multiply(z, z) })).toContain('CMatrix 2×2 complex');
    expect(typeof (z as unknown as Record<symbol, unknown>)[INSPECT_SYMBOL]).toBe('function');
  });
  it('the data stay plain: own keys, JSON, structural equality, structured clone', () => {
    const literal: CMatrix = { rows: 2, cols: 2, data: Float64Array.of(1, 0, 0, -2, 3, 0, 4, 0) };
    expect(Object.keys(z)).toEqual(['rows', 'cols', 'data']);
    expect(JSON.stringify(z)).toBe(JSON.stringify(literal));
    expect(z).toEqual(literal);
    expect(z).toStrictEqual(literal);
    const cloned = structuredClone(z);
    expect(Object.getPrototypeOf(cloned)).toBe(Object.prototype);
    expect(show(cloned)).toBe(show(z)); // recognised by its fields
  });
  it('JSON round trip through resultFromJSON', () => {
    const back = resultFromJSON(JSON.stringify(z)) as CMatrix;
    expect(back).toEqual(z);
    expect(back.data).toBeInstanceOf(Float64Array);
    expect(inspect(back)).toBe(show(z));
  });
});

describe('units from field names', () => {
  it.each([
    ['systemTemperatureK', 'K'], ['sensitivityM2PerK', 'm²/K'], ['worstGainOverTemperatureDbPerK', 'dB/K'], ['sefdJy', 'Jy'],
    ['frequencyHz', 'Hz'], ['noiseResistanceOhm', 'Ω'], ['optimumSourceAdmittanceS', 'S'], ['peakSidelobeDb', 'dB'],
    ['thetaRad', 'rad'], ['positionsM', 'm'], ['effectiveAreaM2', 'm²'], ['sefdWPerM2Hz', 'W m⁻² Hz⁻¹'], ['varianceBudgetK2', 'K²'],
    ['sigma', ''], ['gain', ''], ['peakAt', ''], ['beams', ''],
  ])('%s → %s', (name, unit) => expect(unitOfField(name)).toBe(unit));
});

describe('result kinds print with names and units', () => {
  it('Taylor taper and its line figures', () => {
    const t = taylorTaper(16, 30, 5);
    const text = inspect(t);
    expect(text).toMatch(/^Taper design, 16 elements, no warnings/);
    expect(text).toMatch(/lineSourcePeakSidelobeDb\s+−30\.\d+ dB/);
    expect(text).toMatch(/weights\s+16 values/);
    // JSON drops the distribution function (documented); everything else comes back, typed arrays included
    const { distribution, ...data } = t;
    expect(typeof distribution).toBe('function');
    const back = resultFromJSON(JSON.stringify(t)) as typeof data;
    expect(back).toEqual(data);
    expect(back.weights).toBeInstanceOf(Float64Array);
    expect(inspect(back)).toBe(text);
    const lf = lineTaperFigures(t.weights, 0.1, 1.5e9);
    expect(resultFromJSON(JSON.stringify(lf))).toEqual(lf);
    const f = inspect(lf);
    expect(f).toMatch(/^Line-taper figures/);
    expect(f).toMatch(/peakSidelobeDb\s+−30\.\d+ dB/);
    expect(f).toMatch(/halfPowerWidthRad\s+[\d.]+ rad/);
  });
  it('multiport: ports, form with unit, band, references, first matrix', () => {
    const net = createMultiport('impedance', [1e9, 1.1e9], [fromRows([[50, 10], [10, 50]]), fromRows([[55, 12], [12, 55]])], { portNames: ['north', 'south'] });
    const text = inspect(net);
    expect(text.split('\n')[0]).toBe('Multiport: 2 ports, impedance form [Ω], 2 frequencies 1 GHz … 1.1 GHz');
    expect(text).toContain('north, south');
    expect(text).toContain('50 Ω (every port)');
    expect(text).toContain('[ 50+0j  10+0j ]');
    expect(resultFromJSON(JSON.stringify(net))).toEqual(net);
    expect(show(structuredClone(net))).toBe(text);
  });
  it('noise parameters: T_min with F_min, R_n, Y_opt', () => {
    // Γ_opt = 0 against 50 Ω → Y_opt = 20 mS; F_min = 0.5 dB → T_min = 290(10^0.05 − 1) = 35.39 K
    const p = noiseParametersFromFigure(0.5, 10, 0, 50);
    const text = inspect(p);
    expect(text).toContain('minimumNoiseTemperatureK  35.39 K  (F_min = 0.5 dB re 290 K)');
    expect(text).toContain('noiseResistanceOhm        10 Ω');
    expect(text).toContain('optimumSourceAdmittanceS  0.02+0j S');
    const back = resultFromJSON(JSON.stringify(p));
    expect(back).toEqual(p);
    expect(inspect(back)).toBe(text);
  });
  it('pattern-cut figures', () => {
    const c = cutFigures((x) => Math.abs(Math.cos(x)), -1.5, 1.5);
    const text = inspect(c);
    expect(inspect(resultFromJSON(JSON.stringify(c)))).toBe(text);
    expect(text).toMatch(/^Pattern-cut figures/);
    expect(text).toMatch(/halfPowerWidth\s+1\.571/); // |cos| = 1/√2 at ±π/4
  });
  it('measurement results', () => {
    // Y = 2, 290 K / 77 K: T_rec = (290 − 2·77)/(2 − 1) = 136 K
    const y = yFactorReceiverTemperature({ hotPower: 2, coldPower: 1, hotTemperatureK: 290, coldTemperatureK: 77 });
    expect(inspect(y)).toMatch(/receiverTemperatureK\s+136 K/);
    // A_e/T_sys = 2 k_B (P_on/P_off − 1)/S = 2·1.380649e-23·0.2/1e-24 = 5.523 m²/K; SEFD = S/0.2 = 500 Jy
    const o = inspect(onOffSensitivity({ onPower: 1.2, offPower: 1, fluxDensityWPerM2Hz: 1e-24 }));
    expect(o).toMatch(/aeOverTsysM2PerK\s+5\.523 m²\/K/);
    expect(o).toMatch(/sefdJy\s+500 Jy/);
    const rows = reduceYFactorTable([{ channel: 'X1', hot: 2, cold: 1 }], { hotTemperatureK: 290, coldTemperatureK: 77 });
    expect(inspect(rows[0])).toMatch(/channel\s+X1/);
    expect(resultFromJSON(JSON.stringify(rows))).toEqual(rows);
  });
  it('physical checks: a count, every failure named', () => {
    const ok = physicalCheck('radiationEfficiency', 0.98, 'atMost', 1.001, 'η_rad', ['radiationEfficiency']);
    const bad = physicalCheck('twissResidual', 0.2, 'atMost', 0.01, 'residual', []);
    expect(show({ checks: [ok, bad] })).toContain('2 physical checks, 1 FAILED: twissResidual (0.2 > 0.01)');
  });
  it('kinds are recognised from plain data', () => {
    expect(resultKind({ rows: 1, cols: 1, data: new Float64Array(2) })).toBe('CMatrix');
    expect(resultKind({ systemTemperatureK: 1, sensitivityM2PerK: 1 })).toBe('BeamFigures');
    expect(resultKind(42)).toBeUndefined();
  });
  it('digits option', () => {
    expect(show(z, { digits: 2 }).split('\n')[0]).toBe('CMatrix 2×2 complex, ‖A‖_F = 5.5');
  });
  it('resultFromJSON rejects text that is not JSON', () => {
    expect(() => resultFromJSON('{')).toThrow(/the result text is not valid JSON/);
  });
});
