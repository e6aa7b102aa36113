import { describe, expect, it } from 'vitest';
import { DimensionError, DomainError } from '../../src/errors.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import { sampleLineDistribution, samplePlanarDistribution, sampleRadialDistribution } from '../../src/taper/aperture.js';
import { baylissLineSource, baylissTaper } from '../../src/taper/bayliss.js';
import { besselJ1Zeros } from '../../src/taper/besselZeros.js';
import { circularTaylorAperture, circularTaylorTaper } from '../../src/taper/circularTaylor.js';
import { separableTaper } from '../../src/taper/separable.js';
import besselj0 from '@stdlib/math-base-special-besselj0';
import ref from './fixtures/taper_reference.json';

/** Local maxima of |f| on a uniform grid, in dB relative to `ref`. */
function lobePeaksDb(values: Float64Array, refValue: number): number[] {
  const out: number[] = [];
  for (let i = 1; i < values.length - 1; i++) {
    const a = Math.abs(values[i]);
    if (a >= Math.abs(values[i - 1]) && a >= Math.abs(values[i + 1])) out.push(20 * Math.log10(a / refValue));
  }
  return out;
}

/** Odd line-source pattern by Simpson quadrature: D(u) = ∫_{−½}^{½} g(p) sin(2πup) dp. */
function oddPattern(g: (p: number) => number, u: number, steps = 600): number {
  let s = 0;
  for (let i = 0; i <= steps; i++) {
    const p = -0.5 + i / steps;
    const wgt = i === 0 || i === steps ? 1 : i % 2 ? 4 : 2;
    s += wgt * g(p) * Math.sin(2 * Math.PI * u * p);
  }
  return s / (3 * steps);
}

describe('besselJ1Zeros', () => {
  it('matches scipy.special.jn_zeros(1, 200) to 4 ulp-scale relative error', () => {
    const z = besselJ1Zeros(200);
    ref.besselJ1Zeros.forEach((v, i) => expect(Math.abs(z[i] / v - 1)).toBeLessThan(1e-14));
  });
  it('A&S Table 9.5: j₁,₁ = 3.8317059702', () => {
    // M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions, 1964, Table 9.5.
    expect(besselJ1Zeros(1)[0]).toBeCloseTo(3.8317059702, 10);
    expect(besselJ1Zeros(0).length).toBe(0);
    expect(() => besselJ1Zeros(-1)).toThrow(DomainError);
  });
});

describe('baylissLineSource', () => {
  it.each([[25, 4], [30, 5], [35, 6], [40, 7]])('%i dB, n̄ = %i: quadrature pattern has n̄−1 sidelobes at the level (Bayliss 1968)', (sll, nbar) => {
    // Independent check: pattern by Simpson quadrature of the returned distribution.
    const d = baylissLineSource(sll, nbar);
    // Simpson with 600 panels: relative error < 1e-5 for u ≤ 11; grid step 0.02 misses a lobe peak by < 0.005 dB.
    const du = 1 / 50;
    const u = Array.from({ length: Math.round((nbar + 4) / du) }, (_, i) => i * du);
    const vals = Float64Array.from(u, (x) => oddPattern(d.distribution, x));
    const peaks = lobePeaksDb(vals, 1);
    const main = peaks[0];
    const side = peaks.slice(1).map((p) => p - main);
    // Grid peak within 0.01 dB of the true peak (du = 0.01 near a lobe of width ≈ 1).
    for (let k = 0; k < nbar - 1; k++) expect(Math.abs(side[k] + sll)).toBeLessThan(0.02);
    for (const s of side) expect(s).toBeLessThan(-sll + 0.02);
    expect(Math.abs(oddPattern(d.distribution, 0))).toBeLessThan(1e-15);
    expect(d.warnings).toEqual([]);
  });
  it('sampled taper is antisymmetric with a null at broadside (Σwₙ = 0)', () => {
    for (const n of [2, 9, 16, 33]) {
      const w = baylissTaper(n, 30, 4).weights;
      for (let i = 0; i < n; i++) expect(w[i] + w[n - 1 - i]).toBe(0);
      expect(Math.max(...w)).toBe(1);
    }
  });
  it('samples the distribution at the cell centres', () => {
    const t = baylissTaper(8, 30, 4);
    const g = t.distribution;
    expect(t.weights[7] / t.weights[6]).toBeCloseTo(g(3.5 / 8) / g(2.5 / 8), 12);
  });
  it('rejects bad input', () => {
    expect(() => baylissTaper(1, 30, 4)).toThrow(DomainError);
    expect(() => baylissTaper(16, Number.NaN, 4)).toThrow(DomainError);
    expect(() => baylissTaper(16, -30, 4)).toThrow(DomainError);
    expect(() => baylissTaper(16, 30, 0)).toThrow(DomainError);
  });
});

describe('circularTaylorAperture', () => {
  it.each([[25, 4], [30, 5], [35, 6], [40, 6]])('%i dB, n̄ = %i: Hankel-transform pattern has zeros uₙ and sidelobes ≤ design + 0.6 dB (Taylor 1960)', (sll, nbar) => {
    const d = circularTaylorAperture(sll, nbar);
    // F(u) = 2∫₀¹ g(ρ) J₀(πuρ) ρ dρ by Simpson quadrature (independent of the closed form).
    const steps = 600; // Simpson error < 1e-7 relative for u ≤ 9
    const f = (u: number): number => {
      let s = 0;
      for (let i = 0; i <= steps; i++) {
        const rho = i / steps;
        const wgt = i === 0 || i === steps ? 1 : i % 2 ? 4 : 2;
        s += wgt * d.distribution(rho) * besselj0(Math.PI * u * rho) * rho;
      }
      return (2 * s) / (3 * steps);
    };
    const f0 = f(0);
    for (const z of d.zeros) expect(Math.abs(f(z) / f0)).toBeLessThan(1e-6);
    // Grid of 0.05 in u: a sidelobe (width ≈ 1) peak is missed by < 0.03 dB.
    const du = 0.05;
    const vals = Float64Array.from({ length: Math.round((nbar + 2) / du) }, (_, i) => f(i * du));
    const side = lobePeaksDb(vals, f0); // u = 0 is not a grid interior point: every local maximum is a sidelobe
    // Taylor (1960): the first n̄−1 rings approximately at the design level.
    expect(Math.max(...side)).toBeLessThan(-sll + 0.6);
    expect(Math.max(...side)).toBeGreaterThan(-sll - 1);
  });
  it('samples g(ρ) at arbitrary positions inside the circle', () => {
    const t = circularTaylorTaper(arrayLayout([[0, 0, 0], [0.5, 0, 0], [0, 1, 0]]), 1, 30, 5);
    expect(t.weights[0]).toBe(1);
    expect(t.weights[1]).toBeCloseTo(t.distribution(0.5) / t.distribution(0), 14);
    expect(t.weights[2]).toBeCloseTo(t.distribution(1) / t.distribution(0), 14);
    expect(() => circularTaylorTaper(arrayLayout([[0, 0, 0], [1.1, 0, 0]]), 1, 30, 5)).toThrow(DomainError);
    expect(() => circularTaylorTaper({ count: 2, positionsM: new Float64Array(3) }, 1, 30, 5)).toThrow(DimensionError);
    expect(() => circularTaylorTaper(arrayLayout([[0, 0, 0]]), 1, -30, 5)).toThrow(DomainError);
    expect(() => circularTaylorTaper(arrayLayout([[0, 0, 0]]), 1, 30, 0)).toThrow(DomainError);
    // Disabled elements get weight 0.
    const m = circularTaylorTaper(arrayLayout([[0, 0, 0], [0.5, 0, 0]], { enabled: [1, 0] }), 1, 30, 5);
    expect(Array.from(m.weights)).toEqual([1, 0]);
  });
});

describe('aperture sampling and separable tapers', () => {
  it('sampleLineDistribution evaluates g((x − x_c)/L)', () => {
    const w = sampleLineDistribution((p) => 1 - p * p, Float64Array.of(1, 2, 3), 4, { centreM: 2 });
    expect(Array.from(w)).toEqual([(1 - 1 / 16), 1, (1 - 1 / 16)]);
    expect(() => sampleLineDistribution((p) => p, Float64Array.of(3), 4)).toThrow(DomainError);
    expect(() => sampleLineDistribution(() => Number.NaN, Float64Array.of(0), 4)).toThrow(DomainError);
    expect(() => sampleLineDistribution((p) => p, new Float64Array(0), 4)).toThrow(DimensionError);
    expect(() => sampleLineDistribution((p) => p, Float64Array.of(0), 0)).toThrow(DomainError);
  });
  it('sampleRadialDistribution with an offset centre and power normalisation', () => {
    const w = sampleRadialDistribution((r) => 1 - r, arrayLayout([[1, 1, 0], [2, 1, 0]]), 2, { centreXM: 1, centreYM: 1, normalization: 'power' });
    expect(w[0] / w[1]).toBeCloseTo(2, 14);
    expect(w[0] ** 2 + w[1] ** 2).toBeCloseTo(1, 14);
    const g = samplePlanarDistribution((x, y) => x + 2 * y, arrayLayout([[1, 1, 0], [2, 0, 0]]), { normalization: 'sum' });
    expect(Array.from(g)).toEqual([1.2, 0.8]);
    expect(() => samplePlanarDistribution(() => Infinity, arrayLayout([[1, 1, 0]]))).toThrow(DomainError);
  });
  it('separableTaper is the outer product, x fastest', () => {
    const w = separableTaper(Float64Array.of(1, 2, 1), Float64Array.of(1, 0.5), { normalization: 'peak' });
    expect(Array.from(w)).toEqual([0.5, 1, 0.5, 0.25, 0.5, 0.25]);
    expect(() => separableTaper(new Float64Array(0), Float64Array.of(1))).toThrow(DimensionError);
  });
});
