import { describe, it, expect } from 'vitest';
import { DimensionError, DomainError } from '../../src/errors.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { K_BOLTZMANN_J_PER_K } from '../../src/units/constants.js';
import { wavelengthM } from '../../src/units/convert.js';
import { evaluateReceivingArray, skyAndGroundEnvironment } from '../../src/reception/index.js';
import { show } from '../../src/display/index.js';
import { hertzianResistance, hertzianSource } from './hertzian.js';

const f = 1.4e9, lambda = wavelengthM(f), L = lambda / 40;
const xy: [number, number][] = [[0, 0], [0.5 * lambda, 0], [0, 0.5 * lambda]];
const r = hertzianResistance(xy, L, f);
for (let i = 0; i < 3; i++) r[2 * (i * 3 + i) + 1] = -1500;
const z = { rows: 3, cols: 3, data: r };

describe('evaluateReceivingArray', () => {
  const calls: number[] = [];
  const res = evaluateReceivingArray({
    ports: { patterns: hertzianSource(xy, L, f), impedanceOhm: z },
    quadrature: sphereQuadrature(24, 48),
    bandwidthHz: 1e6,
    environment: skyAndGroundEnvironment({ skyK: 6, groundK: 280 }),
    amplifiers: { minimumNoiseTemperatureK: 20, noiseResistanceOhm: 2, optimumSourceAdmittanceS: 0.05 },
    loss: 'lossless',
    beams: { thetaRad: Float64Array.of(0.6, 1.0, 1.4), phiRad: Float64Array.of(0, 0, 1.2) },
    physicalAreaM2: 0.1,
    fluxDensityWPerM2Hz: 1e-25,
    onProgress: (stage, done) => { if (stage === 'beams') calls.push(done); },
  });
  it("arrayFigures false: the same beam figures without T_rec,min and the efficiencies, said by arrayFiguresComputed and by show(); the default ('auto') computes them for 3 ports", () => {
    expect(res.arrayFiguresComputed).toBe(true);
    const off = evaluateReceivingArray({
      ports: { patterns: hertzianSource(xy, L, f), impedanceOhm: z }, quadrature: sphereQuadrature(24, 48), bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 6, groundK: 280 }),
      amplifiers: { minimumNoiseTemperatureK: 20, noiseResistanceOhm: 2, optimumSourceAdmittanceS: 0.05 }, loss: 'lossless',
      beams: { thetaRad: Float64Array.of(0.6, 1.0, 1.4), phiRad: Float64Array.of(0, 0, 1.2) }, arrayFigures: false,
    });
    expect(off.arrayFiguresComputed).toBe(false);
    expect(Number.isNaN(off.minimumReceiverTemperatureK)).toBe(true);
    expect(off.embeddedElementEfficiency).toHaveLength(0);
    expect(off.checks.map((c) => c.name)).not.toContain('minimumReceiverTemperature');
    expect(off.checks.every((c) => c.passed)).toBe(true);
    for (let k = 0; k < 3; k++) expect(off.beams[k].systemTemperatureK).toBeCloseTo(res.beams[k].systemTemperatureK, 10);
    expect(show(off)).toContain('array figures not computed');
    expect(show(res)).not.toContain('array figures not computed');
  });
  it('returns every figure per beam with units, consistent with the sensitivity identity', () => {
    expect(res.beams).toHaveLength(3);
    expect(calls).toEqual([1, 2, 3]);
    expect(res.units.sensitivityM2PerK).toBe('m²/K');
    for (const b of res.beams) {
      // DESIGN sensitivity row: A_e/T_sys = 2 k_B SNR / S
      expect(Math.abs(b.sensitivityM2PerK / ((2 * K_BOLTZMANN_J_PER_K * (b.snr as number)) / 1e-25) - 1)).toBeLessThan(1e-12);
      expect(b.apertureEfficiency).toBeCloseTo(b.effectiveAreaM2 / 0.1, 14);
      expect(b.noiseMatchingEfficiency as number).toBeLessThanOrEqual(1 + 1e-12);
      expect(Math.abs(b.radiationEfficiency - 1)).toBeLessThan(1e-9); // lossless, quadrature exact to ~1e-12
    }
    expect(res.embeddedElementEfficiency).toHaveLength(3);
    expect(res.weights.rows).toBe(3);
  });
  it('typed errors for a bad description', () => {
    expect(() => evaluateReceivingArray(null as never)).toThrow(DomainError);
    expect(() => evaluateReceivingArray({
      ports: { patterns: hertzianSource(xy, L, f), impedanceOhm: { rows: 2, cols: 2, data: new Float64Array(8) } },
      quadrature: sphereQuadrature(8, 16), bandwidthHz: 1, environment: skyAndGroundEnvironment({ skyK: 5 }),
      beams: { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(0) },
    })).toThrow(DimensionError);
    expect(() => evaluateReceivingArray({
      ports: { patterns: hertzianSource(xy, L, f), impedanceOhm: z },
      quadrature: sphereQuadrature(8, 16), bandwidthHz: 1, environment: skyAndGroundEnvironment({ skyK: 5 }),
      beams: { thetaRad: Float64Array.of(1), phiRad: Float64Array.of(0) }, terminationOhm: [50, 50],
    })).toThrow(DimensionError);
  });
});
