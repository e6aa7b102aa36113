/**
 * Achieved-pattern checks of the tapers, evaluated with the pattern module's array factor
 * (AF = wᴴa, docs/conventions.md) and cut-figure routine.
 */
import { describe, expect, it } from 'vitest';
import { DimensionError, DomainError } from '../../src/errors.js';
import { latticeLayout, rectangularGridLayout } from '../../src/geometry/builders.js';
import { fromParts } from '../../src/linalg/cmatrix.js';
import { linearArrayField } from '../../src/pattern/linearArray.js';
import { baylissTaper } from '../../src/taper/bayliss.js';
import { binomialTaper } from '../../src/taper/binomial.js';
import { dolphChebyshevTaper } from '../../src/taper/chebyshev.js';
import { circularTaylorTaper } from '../../src/taper/circularTaylor.js';
import { taperEfficiency } from '../../src/taper/efficiency.js';
import { lineTaperFigures, planarTaperFigures } from '../../src/taper/figures.js';
import { separableTaper } from '../../src/taper/separable.js';
import { taylorTaper } from '../../src/taper/taylor.js';
import { uniformTaper } from '../../src/taper/uniform.js';
import { C0_M_PER_S } from '../../src/units/constants.js';

const F_HZ = 1e9;
const LAMBDA = C0_M_PER_S / F_HZ;
const HALF = LAMBDA / 2;

/** Refined local maxima of f on [a, b] (grid + golden section), as values. */
function localMaxima(f: (t: number) => number, a: number, b: number, samples: number): { at: number; value: number }[] {
  const h = (b - a) / (samples - 1);
  const y = Float64Array.from({ length: samples }, (_, i) => f(a + i * h));
  const out: { at: number; value: number }[] = [];
  const g = (Math.sqrt(5) - 1) / 2;
  for (let i = 0; i < samples; i++) {
    const left = i === 0 ? -Infinity : y[i - 1];
    const right = i === samples - 1 ? -Infinity : y[i + 1];
    if (!(y[i] >= left && y[i] > right)) continue;
    let lo = a + Math.max(0, i - 1) * h, hi = a + Math.min(samples - 1, i + 1) * h;
    let x1 = hi - g * (hi - lo), x2 = lo + g * (hi - lo), f1 = f(x1), f2 = f(x2);
    for (let k = 0; k < 80; k++) {
      if (f1 < f2) { lo = x1; x1 = x2; f1 = f2; x2 = lo + g * (hi - lo); f2 = f(x2); } else { hi = x2; x2 = x1; f2 = f1; x1 = hi - g * (hi - lo); f1 = f(x1); }
    }
    const best = Math.max(f1, f2, y[i]);
    out.push({ at: best === y[i] ? a + i * h : f1 > f2 ? x1 : x2, value: best });
  }
  return out;
}

/** Sidelobe peaks (dB re main beam) of a broadside line pattern over u = sinθ ∈ [0, 1], beyond the first null. */
function sidelobesDb(w: Float64Array, lobesPerUnit = 24): number[] {
  const field = linearArrayField(fromParts(w, null, w.length), HALF, F_HZ);
  const fu = (u: number) => field(Math.asin(Math.min(1, u)));
  const peak = fu(0);
  const maxima = localMaxima(fu, 0, 1, lobesPerUnit * w.length + 1);
  return maxima.filter((m) => m.at > 1e-9).map((m) => 20 * Math.log10(m.value / peak));
}

describe('Dolph–Chebyshev achieved pattern', () => {
  it.each([[8, 20], [8, 40], [21, 30], [64, 50], [64, 80], [128, 60], [200, 30], [200, 120]])('N = %i, %i dB: every sidelobe at the level ±0.05 dB (Dolph 1946)', (n, sll) => {
    // Dolph (1946): the Chebyshev array is equiripple; at d = λ/2 every sidelobe peak equals −sll.
    const side = sidelobesDb(dolphChebyshevTaper(n, sll));
    expect(side.length).toBeGreaterThanOrEqual(Math.floor((n - 2) / 2));
    for (const s of side) expect(Math.abs(s + sll)).toBeLessThan(0.05);
  });
  it('lineTaperFigures reports the achieved level and the exact λ/2 directivity loss', () => {
    const w = dolphChebyshevTaper(32, 35);
    const f = lineTaperFigures(w, HALF, F_HZ);
    expect(Math.abs((f.peakSidelobeDb ?? 0) + 35)).toBeLessThan(0.05);
    // At d = λ/2 the steering vectors of a line are orthogonal over the sphere, so the
    // directivity ratio equals the taper efficiency exactly (Hansen 2009, ch. 3, from memory).
    expect(f.directivityLossDb).toBeCloseTo(-10 * Math.log10(taperEfficiency(w)), 9);
    expect(f.beamBroadening).toBeGreaterThan(1);
  });
});

describe('Taylor achieved pattern', () => {
  it.each([[64, 25, 4], [64, 30, 5], [100, 35, 6], [200, 40, 8]])('N = %i, %i dB, n̄ = %i: first sidelobe within ±0.5 dB, the first n̄−1 within +0.5/−2.5 dB (Taylor 1955)', (n, sll, nbar) => {
    // Taylor (1955): the first n̄−1 sidelobes are held near the design level; they droop slowly
    // towards n̄ (scipy.signal.windows.taylor, which these weights match to 1e-12, gives the same
    // patterns: e.g. N = 64, 25 dB, n̄ = 4: −25.37, −25.89, −26.88 dB). So only the first sidelobe
    // is within ±0.5 dB; the others lie between design − 2.5 dB and design + 0.5 dB
    // (N = 200, 40 dB, n̄ = 8: the 7th is −42.23 dB).
    const side = sidelobesDb(taylorTaper(n, sll, nbar).weights);
    expect(Math.abs(side[0] + sll)).toBeLessThan(0.5);
    for (let k = 0; k < nbar - 1; k++) {
      expect(side[k]).toBeLessThan(-sll + 0.5);
      expect(side[k]).toBeGreaterThan(-sll - 2.5);
    }
    // Beyond n̄ the sidelobes decay.
    expect(side[nbar + 2]).toBeLessThan(-sll);
  });
});

describe('Bayliss achieved difference pattern', () => {
  it.each([[64, 25, 4], [64, 30, 5], [100, 35, 6], [200, 40, 7]])('N = %i, %i dB, n̄ = %i: peak sidelobe within 1 dB, null at broadside (Bayliss 1968)', (n, sll, nbar) => {
    const w = baylissTaper(n, sll, nbar).weights;
    const f = lineTaperFigures(w, HALF, F_HZ, { kind: 'difference' });
    expect(Math.abs((f.peakSidelobeDb ?? 0) + sll)).toBeLessThan(1);
    const field = linearArrayField(fromParts(w, null, n), HALF, F_HZ);
    expect(field(0) / field(f.peakThetaRad)).toBeLessThan(1e-12);
    expect(f.firstNullsRad[0]).toBe(0);
    expect(f.firstNullsRad[1]).toBeGreaterThan(f.peakThetaRad);
  });
});

describe('figure argument checks', () => {
  it('typed errors for bad weights, spacing, frequency, kind and layout mismatch', () => {
    const w = uniformTaper(8);
    expect(() => lineTaperFigures(uniformTaper(1), HALF, F_HZ)).toThrow(DomainError);
    expect(() => lineTaperFigures(w, 0, F_HZ)).toThrow(DomainError);
    expect(() => lineTaperFigures(w, HALF, Number.NaN)).toThrow(DomainError);
    expect(() => lineTaperFigures(w, HALF, F_HZ, { kind: 'delta' as never })).toThrow(DomainError);
    expect(() => lineTaperFigures(Float64Array.of(1, Number.NaN), HALF, F_HZ)).toThrow(DomainError);
    const layout = rectangularGridLayout({ countX: 2, countY: 2, spacingXM: HALF, spacingYM: HALF });
    expect(() => planarTaperFigures(layout, w, F_HZ)).toThrow(DimensionError);
    expect(() => planarTaperFigures(layout, uniformTaper(4), -1)).toThrow(DomainError);
  });
});

describe('uniform and binomial figures', () => {
  it('uniform: −13.26 dB sidelobe for a long line, broadening 1, loss 0', () => {
    // Uniform line source: first sidelobe 20·log10(0.2172) = −13.26 dB (classical; e.g. Balanis 2016 §6.3, from memory);
    // a 200-element λ/2 array is within 0.02 dB of it.
    const f = lineTaperFigures(uniformTaper(200), HALF, F_HZ);
    expect(Math.abs((f.peakSidelobeDb ?? 0) + 13.26)).toBeLessThan(0.02);
    expect(f.beamBroadening).toBeCloseTo(1, 12);
    expect(f.directivityLossDb).toBeCloseTo(0, 12);
    // First null of the uniform N = 200 λ/2 line: sinθ = λ/(N d) = 0.01.
    expect(Math.sin(f.firstNullsRad[1] ?? 0)).toBeCloseTo(0.01, 8);
  });
  it('binomial at λ/2 has no sidelobes (all zeros at u = ±1) and efficiency 4^{N−1}/(N·C(2N−2, N−1))', () => {
    // Stone's binomial array (Balanis 2016 §6.8.2, from memory): nothing above rounding noise outside the main lobe.
    const f = lineTaperFigures(binomialTaper(12), HALF, F_HZ);
    expect(f.peakSidelobeDb ?? -Infinity).toBeLessThan(-200);
    // C(22, 11) = 705432.
    expect(f.directivityLossDb).toBeCloseTo(-10 * Math.log10(Math.pow(4, 11) / (12 * 705432)), 9);
  });
});

describe('planar tapers: achieved patterns', () => {
  it('filled circular array of radius 10λ, 35 dB, n̄ = 6: peak sidelobe within 1 dB (Taylor 1960)', () => {
    // Square λ/2 lattice clipped to 10λ (1264 elements). Aperture radius: the area-equivalent
    // radius √(N·d²/π) = 10.03λ (N cells of area d²; common practice).
    const layout = latticeLayout([HALF, 0], [0, HALF], { kind: 'circle', radiusM: 10 * LAMBDA }, { offsetM: [HALF / 2, HALF / 2] });
    const t = circularTaylorTaper(layout, Math.sqrt((layout.count * HALF * HALF) / Math.PI), 35, 6);
    const f = planarTaperFigures(layout, t.weights, F_HZ, { cutsPhiRad: [0, Math.PI / 8, Math.PI / 4], samples: 3001 });
    expect(Math.abs((f.peakSidelobeDb ?? 0) + 35)).toBeLessThan(1);
    for (const b of f.beamBroadening) expect(b).toBeGreaterThan(1);
    expect(f.directivityLossDb).toBeGreaterThan(0);
  });
  it('separable Dolph–Chebyshev on a λ/2 grid keeps each line design in its principal cut', () => {
    // Pattern multiplication on a rectangular grid: AF(u, 0) = AF_x(u)·AF_y(0), so the φ = 0 cut
    // is the x-line pattern (−30 dB equiripple) and φ = π/2 the y-line pattern (−25 dB).
    const layout = rectangularGridLayout({ countX: 16, countY: 12, spacingXM: HALF, spacingYM: HALF });
    const w = separableTaper(dolphChebyshevTaper(16, 30), dolphChebyshevTaper(12, 25));
    const f = planarTaperFigures(layout, w, F_HZ, { cutsPhiRad: [0, Math.PI / 2] });
    expect(Math.abs((f.cutPeakSidelobeDb[0] ?? 0) + 30)).toBeLessThan(0.05);
    expect(Math.abs((f.cutPeakSidelobeDb[1] ?? 0) + 25)).toBeLessThan(0.05);
    // On a planar λ/2 grid the steering vectors are NOT orthogonal over the sphere
    // (sinc(k·d·√2) ≠ 0 for diagonal pairs), so −10·log₁₀η only approximates the exact
    // directivity loss: 0.93 dB vs 1.05 dB here.
    expect(Math.abs(f.directivityLossDb + 10 * Math.log10(f.efficiency))).toBeLessThan(0.2);
    expect(f.efficiency).toBeCloseTo(taperEfficiency(dolphChebyshevTaper(16, 30)) * taperEfficiency(dolphChebyshevTaper(12, 25)), 12);
  });
});
