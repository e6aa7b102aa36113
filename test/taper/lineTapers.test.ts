import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/errors.js';
import { fromParts } from '../../src/linalg/cmatrix.js';
import { binomialTaper } from '../../src/taper/binomial.js';
import { dolphChebyshevTaper } from '../../src/taper/chebyshev.js';
import { cosineSquaredTaper, cosineTaper } from '../../src/taper/cosine.js';
import { directivityLossDb, taperEfficiency } from '../../src/taper/efficiency.js';
import { normalizeTaper } from '../../src/taper/normalize.js';
import { taylorLineSource, taylorTaper } from '../../src/taper/taylor.js';
import { uniformTaper } from '../../src/taper/uniform.js';
import ref from './fixtures/taper_reference.json';

function maxAbsDiff(a: ArrayLike<number>, b: ArrayLike<number>): number {
  expect(a.length).toBe(b.length);
  let m = 0;
  for (let i = 0; i < a.length; i++) m = Math.max(m, Math.abs(a[i] - b[i]));
  return m;
}

describe('dolphChebyshevTaper', () => {
  it.each(ref.chebwin.map((c) => [c.n, c.sllDb, c.weights] as const))('N = %i, %i dB matches scipy.signal.windows.chebwin', (n, sll, expected) => {
    // Reference: scipy.signal.windows.chebwin (scipy version in the fixture), max-normalised.
    // Tolerance: both are O(N·ε·R) accurate; 1e-9 absolute on peak-1 weights.
    expect(maxAbsDiff(dolphChebyshevTaper(n, sll), expected)).toBeLessThan(1e-9);
  });
  it('efficiency against Parseval closed form R²/Σ T²_{N−1}(x₀cos(πk/N)) (mpmath fixture)', () => {
    for (const c of ref.chebyshevEfficiency) {
      expect(Math.abs(taperEfficiency(dolphChebyshevTaper(c.n, c.sllDb)) / c.efficiency - 1)).toBeLessThan(1e-10);
    }
  });
  it('N = 2000 at 120 dB is finite, symmetric and peak-normalised', () => {
    const w = dolphChebyshevTaper(2000, 120);
    let peak = 0;
    for (let i = 0; i < w.length; i++) {
      expect(Number.isFinite(w[i])).toBe(true);
      expect(w[i]).toBe(w[1999 - i]);
      peak = Math.max(peak, Math.abs(w[i]));
    }
    expect(peak).toBe(1);
  });
  it('rejects N < 2, NaN/negative/zero levels', () => {
    expect(() => dolphChebyshevTaper(1, 30)).toThrow(DomainError);
    expect(() => dolphChebyshevTaper(0, 30)).toThrow(DomainError);
    expect(() => dolphChebyshevTaper(8.5, 30)).toThrow(DomainError);
    expect(() => dolphChebyshevTaper(8, Number.NaN)).toThrow(DomainError);
    expect(() => dolphChebyshevTaper(8, -30)).toThrow(DomainError);
    expect(() => dolphChebyshevTaper(8, 0)).toThrow(DomainError);
    expect(() => dolphChebyshevTaper(8, Infinity)).toThrow(DomainError);
  });
});

describe('taylorTaper', () => {
  it.each(ref.taylor.map((c) => [c.n, c.nbar, c.sllDb, c.weights] as const))('N = %i, n̄ = %i, %i dB matches scipy.signal.windows.taylor', (n, nbar, sll, expected) => {
    // Reference: scipy.signal.windows.taylor(M, nbar, sll, norm=False) / max (fixture).
    expect(maxAbsDiff(taylorTaper(n, sll, nbar).weights, expected)).toBeLessThan(1e-12);
  });
  it('distribution is in Taylor\'s normalisation: mean 1, g(0) = 1 + 2ΣFₘ (issue 23), equal to scipy\'s unnormalised window', () => {
    // scipy 1.17.1: scipy.signal.windows.taylor(16, 5, 30, norm=False)[:8] (cell centres p = (n − 7.5)/16).
    const scipyRaw = [0.40116504, 0.50441108, 0.69015859, 0.91770428, 1.14136499, 1.33036802, 1.46948935, 1.54533866];
    const d = taylorLineSource(30, 5);
    scipyRaw.forEach((v, n) => expect(Math.abs(d.distribution((n - 7.5) / 16) - v)).toBeLessThan(1e-8));
    const sumF = d.coefficients.reduce((a, b) => a + b, 0);
    expect(d.distribution(0)).toBeCloseTo(1 + 2 * sumF, 14);
    expect(Math.abs(d.distribution(0) - 1)).toBeGreaterThan(0.5);
    // ∫_{−½}^{½} g dp = 1: the cosines integrate to zero (Simpson, 2000 panels; exact for this trigonometric sum to rounding).
    let mean = 0;
    const m = 2000;
    for (let i = 0; i <= m; i++) mean += (i === 0 || i === m ? 1 : i % 2 ? 4 : 2) * d.distribution(-0.5 + i / m);
    expect(Math.abs(mean / (3 * m) - 1)).toBeLessThan(1e-12);
  });
  it('warns (as data) when n̄ is too large for a monotonic distribution', () => {
    // R. C. Hansen, Phased Array Antennas, 2nd ed., 2009, §3.4 (from memory): at 30 dB the
    // largest n̄ with a monotonic Taylor distribution is 7 (scipy check: n̄ = 8 rises at the edge).
    expect(taylorLineSource(30, 7).warnings).toEqual([]);
    const w = taylorLineSource(30, 8).warnings;
    expect(w.map((x) => x.code)).toEqual(['non-monotonic']);
    expect(taylorLineSource(30, 8).monotonic).toBe(false);
  });
  it('warns when n̄ is too small to reach the design level', () => {
    // Continuous Taylor pattern, 40 dB, n̄ = 4: peak sidelobe ≈ −38.9 dB (numpy FFT of
    // scipy's taylor(512, 4, 40): −38.91 dB); n̄ = 6 reaches −40.2 dB.
    const d = taylorLineSource(40, 4);
    expect(d.warnings.map((x) => x.code)).toEqual(['sidelobes-above-design']);
    expect(d.lineSourcePeakSidelobeDb).toBeGreaterThan(-39.2);
    expect(d.lineSourcePeakSidelobeDb).toBeLessThan(-38.6);
    expect(taylorLineSource(40, 6).warnings).toEqual([]);
  });
  it('the distribution radiates Taylor (1955) zeros uₙ = σ√(A² + (n−½)²) and integer zeros beyond n̄', () => {
    // Pattern of g(p) over [−½, ½] by direct trapezoidal quadrature (independent of the
    // closed-form coefficients): F(u) = ∫ g(p) cos(2πup) dp. 30 dB, n̄ = 5: A = arccosh(31.62)/π = 1.3200.
    const d = taylorLineSource(30, 5);
    expect(d.a).toBeCloseTo(Math.acosh(Math.pow(10, 1.5)) / Math.PI, 14);
    const steps = 20000;
    const f = (u: number): number => {
      let s = 0;
      for (let i = 0; i <= steps; i++) {
        const p = -0.5 + i / steps;
        s += (i === 0 || i === steps ? 0.5 : 1) * d.distribution(p) * Math.cos(2 * Math.PI * u * p);
      }
      return s / steps;
    };
    const f0 = f(0);
    for (const u of [...d.zeros, 5, 6, 7]) expect(Math.abs(f(u) / f0)).toBeLessThan(1e-7);
  });
  it('n̄ = 1 is uniform', () => {
    expect(Array.from(taylorTaper(6, 30, 1).weights)).toEqual([1, 1, 1, 1, 1, 1]);
  });
  it('rejects bad input with DomainError', () => {
    expect(() => taylorTaper(0, 30, 4)).toThrow(DomainError);
    expect(() => taylorTaper(16, Number.NaN, 4)).toThrow(DomainError);
    expect(() => taylorTaper(16, -30, 4)).toThrow(DomainError);
    expect(() => taylorTaper(16, 30, 0)).toThrow(DomainError);
    expect(() => taylorTaper(16, 30, 2.5)).toThrow(DomainError);
  });
});

describe('simple tapers and efficiency', () => {
  it('uniform efficiency is exactly 1 and loss 0 dB', () => {
    for (const n of [1, 2, 7, 64]) {
      expect(taperEfficiency(uniformTaper(n))).toBe(1);
      expect(directivityLossDb(uniformTaper(n))).toBe(-0);
    }
  });
  it('binomial coefficients and efficiency 4^{N−1}/(N·C(2N−2, N−1)) (Vandermonde identity)', () => {
    expect(Array.from(binomialTaper(5, { normalization: 'peak' })).map((x) => x * 6)).toEqual([1, 4, 6, 4, 1]);
    for (const n of [2, 3, 10, 40]) {
      // Σ C(n−1,k) = 2^{n−1}, Σ C(n−1,k)² = C(2n−2, n−1).
      let c = 1; // C(2m, m) with m = n−1 by recurrence
      for (let k = 1; k <= n - 1; k++) c = (c * (n - 1 + k)) / k;
      const expected = Math.pow(4, n - 1) / (n * c);
      expect(Math.abs(taperEfficiency(binomialTaper(n)) / expected - 1)).toBeLessThan(1e-12);
    }
    const big = binomialTaper(3000);
    expect(big.every((x) => Number.isFinite(x))).toBe(true);
    expect(Math.max(...big)).toBe(1);
  });
  it('cosine tapers: samples of q + (1−q)cos(πp) at the cell centres', () => {
    const w = cosineTaper(4, 0.3);
    // Cell centres p = ±1/8, ±3/8; peak normalisation divides by the centre pair.
    const g = (p: number) => 0.3 + 0.7 * Math.cos(Math.PI * p);
    expect(w[0]).toBeCloseTo(g(3 / 8) / g(1 / 8), 14);
    const w2 = cosineSquaredTaper(5, 0);
    expect(w2[0]).toBeCloseTo(Math.cos((Math.PI * 2) / 5) ** 2, 14);
    expect(() => cosineTaper(4, -0.1)).toThrow(DomainError);
    expect(() => cosineSquaredTaper(4, 1.5)).toThrow(DomainError);
  });
  it('normalisations: peak, sum = N, unit power', () => {
    const w = Float64Array.of(1, 2, 1);
    expect(Array.from(normalizeTaper(Float64Array.from(w), 'sum'))).toEqual([0.75, 1.5, 0.75]);
    const p = normalizeTaper(Float64Array.from(w), 'power');
    expect(p.reduce((s, x) => s + x * x, 0)).toBeCloseTo(1, 15);
    expect(() => normalizeTaper(new Float64Array(3), 'peak')).toThrow(DomainError);
    expect(() => normalizeTaper(Float64Array.of(1, Number.NaN), 'peak')).toThrow(DomainError);
    expect(() => normalizeTaper(Float64Array.of(1), 'max' as never)).toThrow(DomainError);
  });
  it('efficiency of complex weights equals that of real ones with a common phase', () => {
    const re = Float64Array.of(0.5, 1, 0.5);
    const c = fromParts(re.map((x) => x * Math.cos(0.3)), re.map((x) => x * Math.sin(0.3)), 3);
    expect(taperEfficiency(c)).toBeCloseTo(taperEfficiency(re), 15);
  });
  it('rejects N < 1', () => {
    expect(() => uniformTaper(0)).toThrow(DomainError);
    expect(() => binomialTaper(-3)).toThrow(DomainError);
    expect(() => cosineTaper(0)).toThrow(DomainError);
  });
});
