import { describe, it, expect } from 'vitest';
import { uniformLineLayout, unitVectorsFromAngles, evenlySpaced } from '../../src/geometry/index.js';
import { arrayFactor, steeringVector } from '../../src/pattern/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';
import { DomainError } from '../../src/errors.js';
import { quantizeWeights, phaseQuantizationLobes, digitalWeightFigures, roundDigitalWeights } from '../../src/imperfect/index.js';

const F = 3e9, LAM = C0_M_PER_S / F;

function powerAtU(layout: ReturnType<typeof uniformLineLayout>, w: Parameters<typeof arrayFactor>[1], us: Float64Array): Float64Array {
  const dirs = new Float64Array(3 * us.length);
  us.forEach((u, i) => { dirs[3 * i] = u; dirs[3 * i + 2] = Math.sqrt(1 - u * u); });
  const af = arrayFactor(layout, w, dirs, F).data;
  return Float64Array.from(us, (_, i) => af[2 * i] ** 2 + af[2 * i + 1] ** 2);
}
const maxNear = (layout: ReturnType<typeof uniformLineLayout>, w: Parameters<typeof arrayFactor>[1], u: number, half: number): number =>
  Math.max(...powerAtU(layout, w, evenlySpaced(u - half, u + half, 401)));

describe('phase quantisation lobes (Miller 1964, from memory; Fourier series of the staircase phase)', () => {
  // u₀ = 0.1031: the sampled staircase has no short period, so the lobes of different harmonics
  // do not alias onto one another (for u₀ = 0.1 and 3 bits, harmonics −1 and 4 coincide)
  const n = 1024, layout = uniformLineLayout(n, LAM / 2), u0 = 0.1031;
  const w = steeringVector(layout, [u0, 0, Math.sqrt(1 - u0 * u0)], F);
  for (const bits of [3, 4]) {
    it(`${bits}-bit nearest rounding: largest lobe at u = (1 − 2^k)u₀ with power 1/(2^k − 1)²`, () => {
      const lobe = phaseQuantizationLobes(bits, u0, 2, 0.5)[0];
      expect(lobe.harmonic).toBe(-1);
      expect(lobe.relativeDb).toBeCloseTo(-20 * Math.log10(2 ** bits - 1), 10);
      const q = quantizeWeights(w, { phaseBits: bits });
      const main = maxNear(layout, q, u0, 0.002);
      const measured = 10 * Math.log10(maxNear(layout, q, lobe.u, 0.002) / main);
      expect(Math.abs(measured - lobe.relativeDb)).toBeLessThan(0.3);
    });
  }
  it('randomized rounding removes the lobe (drops it below the random floor, > 10 dB lower)', () => {
    const lobe = phaseQuantizationLobes(3, u0, 1, 0.5)[0];
    const q = quantizeWeights(w, { phaseBits: 3, rounding: 'randomized', seed: 4 });
    const main = maxNear(layout, q, u0, 0.002);
    expect(10 * Math.log10(maxNear(layout, q, lobe.u, 0.002) / main)).toBeLessThan(lobe.relativeDb - 10);
  });
  it('attenuator states and bad input', () => {
    const q = quantizeWeights({ rows: 2, cols: 1, data: Float64Array.of(1, 0, 0.6, 0) }, { attenuatorBits: 3, attenuatorStepDb: 1 });
    // 20·log10(0.6) = −4.437 dB → −4 dB
    expect(q.data[2]).toBeCloseTo(10 ** (-4 / 20), 12);
    expect(() => quantizeWeights(w, { phaseBits: 0 })).toThrow(DomainError);
    expect(() => phaseQuantizationLobes(3, 2)).toThrow(DomainError);
  });
});

describe('digital weight word length (additive uniform-noise model, Widrow & Kollár 2008, from memory)', () => {
  it('error variance and sidelobe floor agree with rounding actual weights', () => {
    const n = 512, layout = uniformLineLayout(n, LAM / 2), u0 = 0.3137;
    const w = steeringVector(layout, [u0, 0, Math.sqrt(1 - u0 * u0)], F);
    const bits = 6, fig = digitalWeightFigures(w, n, bits), q = roundDigitalWeights(w, bits);
    let e2 = 0;
    for (let i = 0; i < 2 * n; i++) e2 += (q.data[i] - w.data[i]) ** 2;
    expect(Math.abs(e2 / (2 * n) / fig.componentVariance - 1)).toBeLessThan(0.1);
    // floor: mean |AF(w̃) − AF(w)|² over a sidelobe cut, relative to the peak n²
    const dirs = unitVectorsFromAngles(evenlySpaced(-1.4, 1.4, 801), new Float64Array(801));
    const a = arrayFactor(layout, q, dirs, F).data, b = arrayFactor(layout, w, dirs, F).data;
    let s = 0;
    for (let i = 0; i < 801; i++) s += (a[2 * i] - b[2 * i]) ** 2 + (a[2 * i + 1] - b[2 * i + 1]) ** 2;
    expect(Math.abs(s / 801 / (n * n) / fig.sidelobeFloor - 1)).toBeLessThan(0.15);
    expect(fig.snrLossDb).toBeGreaterThan(0);
    expect(fig.snrLossDb).toBeLessThan(0.01);
  });
});
