import { describe, it, expect } from 'vitest';
import { uniformLineLayout, unitVectorsFromAngles, evenlySpaced, rectangularGridLayout } from '../../src/geometry/index.js';
import { columnVector, fromParts } from '../../src/linalg/index.js';
import { taylorTaper } from '../../src/taper/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';
import { expectedErrorPattern, randomErrorFigures, monteCarloErrorPatterns, type RandomErrorModel } from '../../src/imperfect/index.js';

const F = 3e9;
const LAM = C0_M_PER_S / F;
const ones = (n: number) => columnVector(new Array(n).fill(1));
const cut = unitVectorsFromAngles(evenlySpaced(-1.5, 1.5, 241), new Float64Array(241));

/** Mean over the sidelobe mask of the closed-form expected power relative to the error-free peak. */
function closedMeanSidelobe(expected: Float64Array, mask: Uint8Array, ideal: number): number {
  let s = 0, c = 0;
  for (let j = 0; j < mask.length; j++) if (mask[j]) { s += expected[j] / ideal; c++; }
  return s / c;
}

describe('closed forms against a 1000-trial Monte Carlo (Ruze 1966 average pattern; agreement within 4 standard errors)', () => {
  const cases: Array<[string, RandomErrorModel]> = [
    ['Gaussian amplitude and phase, uncorrelated', { amplitude: { distribution: 'gaussian', rms: 0.15 }, phaseRad: { distribution: 'gaussian', rms: 0.2 } }],
    ['uniform amplitude and phase', { amplitude: { distribution: 'uniform', rms: 0.1 }, phaseRad: { distribution: 'uniform', rms: 0.3 } }],
    ['position errors, Gaussian, all three axes', { positionM: { distribution: 'gaussian', rms: [0.02 * LAM, 0.02 * LAM, 0.03 * LAM] } }],
    ['errors correlated within 8 subarrays of 8 plus element errors', {
      phaseRad: { distribution: 'gaussian', rms: 0.05 },
      subarray: { index: Array.from({ length: 64 }, (_, n) => Math.floor(n / 8)), amplitude: { distribution: 'gaussian', rms: 0.1 }, phaseRad: { distribution: 'uniform', rms: 0.15 } },
    }],
  ];
  for (const [name, model] of cases) {
    it(name, () => {
      const layout = uniformLineLayout(64, LAM / 2);
      const w = fromParts(taylorTaper(64, 30, 5).weights, null, 64);
      const mc = monteCarloErrorPatterns({ kind: 'directions', layout, directions: cut }, w, [0, 0, 1], F, model, { trials: 1000, seed: 11 });
      const ideal = expectedErrorPattern(layout, w, Float64Array.of(0, 0, 1), F, {})[0];
      const expected = expectedErrorPattern(layout, w, cut, F, model);
      const closed = closedMeanSidelobe(expected, mc.sidelobeMask, ideal);
      expect(Math.abs(mc.meanSidelobe.mean - closed)).toBeLessThan(4 * mc.meanSidelobe.standardError);
      const fig = randomErrorFigures(layout, w, [0, 0, 1], F, model);
      // ratio of expectations vs expectation of the ratio differ by O(σ²/N) ≪ the 4σ band here
      expect(Math.abs(mc.directivityRatio.mean - fig.directivityRatio)).toBeLessThan(4 * mc.directivityRatio.standardError + 2e-4);
      expect(mc.peakSidelobe.p5).toBeLessThan(mc.peakSidelobe.p50);
      expect(mc.peakSidelobe.p50).toBeLessThan(mc.peakSidelobe.p95);
    });
  }
});

describe('small-error closed forms of Hansen / Mailloux (from memory)', () => {
  it('sidelobe floor ≈ σ²/(η_T N) and D/D₀ ≈ 1/(1 + σ_δ² + σ_φ²) to O(σ⁴)', () => {
    const n = 256, layout = uniformLineLayout(n, LAM / 2), w = fromParts(taylorTaper(n, 35, 6).weights, null, n);
    const sa = 0.03, sp = 0.04;
    const f = randomErrorFigures(layout, w, [0, 0, 1], F, { amplitude: { distribution: 'gaussian', rms: sa }, phaseRad: { distribution: 'gaussian', rms: sp } });
    const s2 = sa * sa + sp * sp;
    expect(Math.abs(f.sidelobeFloor / (s2 / (f.taperEfficiency * n)) - 1)).toBeLessThan(2 * s2);
    expect(Math.abs(f.directivityRatio * (1 + s2) - 1)).toBeLessThan(2 * s2 * s2 + 2 / n * s2);
  });
});

describe('percentile bands', () => {
  it('far from the main lobe |AF|² is exponential (complex Gaussian sum, central limit): median = ln 2 × mean, 95 % = ln 20 × mean', () => {
    // A. Papoulis, Probability, Random Variables and Stochastic Processes, 3rd ed., 1991: |complex normal|² is exponential.
    const layout = uniformLineLayout(64, LAM / 2);
    const model: RandomErrorModel = { amplitude: { distribution: 'gaussian', rms: 0.3 }, phaseRad: { distribution: 'gaussian', rms: 0.3 } };
    // nulls of the uniform 64-element array: u = m/32, m = 8…31
    const u = Float64Array.from({ length: 24 }, (_, i) => (i + 8) / 32);
    const dirs = new Float64Array(72);
    u.forEach((x, i) => { dirs[3 * i] = x; dirs[3 * i + 2] = Math.sqrt(1 - x * x); });
    const mc = monteCarloErrorPatterns({ kind: 'directions', layout, directions: dirs }, ones(64), [0, 0, 1], F, model, { trials: 1000, seed: 5, bands: true });
    let r50 = 0, r95 = 0;
    for (let j = 0; j < 24; j++) { r50 += mc.bands!.p50[j] / mc.meanPower[j]; r95 += mc.bands!.p95[j] / mc.meanPower[j]; }
    expect(Math.abs(r50 / 24 / Math.LN2 - 1)).toBeLessThan(0.04);
    expect(Math.abs(r95 / 24 / Math.log(20) - 1)).toBeLessThan(0.04);
  });
});

describe('FFT path', () => {
  it('equals the direct path on the same visible u-v points, same seed (identity)', () => {
    const grid = { countX: 8, countY: 4, spacingXM: LAM / 2, spacingYM: 0.6 * LAM };
    const layout = rectangularGridLayout(grid);
    const model: RandomErrorModel = { amplitude: { distribution: 'uniform', rms: 0.2 }, phaseRad: { distribution: 'gaussian', rms: 0.3 } };
    const a = monteCarloErrorPatterns({ kind: 'fftGrid', grid, sizeU: 32, sizeV: 16 }, ones(32), [0, 0, 1], F, model, { trials: 5, seed: 9 });
    const b = monteCarloErrorPatterns({ kind: 'directions', layout, directions: a.directions }, ones(32), [0, 0, 1], F, model, { trials: 5, seed: 9 });
    for (let j = 0; j < a.meanPower.length; j++) expect(Math.abs(a.meanPower[j] - b.meanPower[j])).toBeLessThan(1e-11);
    expect(a.directivityRatio.mean).toBeCloseTo(b.directivityRatio.mean, 12);
  });
  it('rejects position errors', () => {
    const grid = { countX: 4, countY: 4, spacingXM: LAM / 2, spacingYM: LAM / 2 };
    expect(() => monteCarloErrorPatterns({ kind: 'fftGrid', grid, sizeU: 16 }, ones(16), [0, 0, 1], F, { positionM: { distribution: 'gaussian', rms: [1e-3, 0, 0] } })).toThrow(DomainError);
  });
});

describe('bad input', () => {
  const layout = uniformLineLayout(8, LAM / 2);
  it('typed errors', () => {
    expect(() => expectedErrorPattern(layout, ones(7), cut, F, {})).toThrow(DimensionError);
    expect(() => expectedErrorPattern(layout, ones(8), cut, F, { phaseRad: { distribution: 'gaussian', rms: -1 } })).toThrow(DomainError);
    expect(() => expectedErrorPattern(layout, ones(8), cut, F, { subarray: { index: [0, 1] } })).toThrow(DimensionError);
    expect(() => randomErrorFigures(layout, columnVector([1, -1, 1, -1, 1, -1, 1, -1]), [0, 0, 1], F, {})).toThrow(DomainError);
    expect(() => monteCarloErrorPatterns({ kind: 'directions', layout, directions: cut }, ones(8), [0, 0, 1], F, {}, { trials: 1 })).toThrow(DomainError);
    expect(() => monteCarloErrorPatterns({ kind: 'directions', layout, directions: cut }, ones(8), [0, 0, 1], F, {}, { trials: 2e6, bands: true })).toThrow(DomainError);
  });
});
