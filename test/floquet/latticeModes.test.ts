import { describe, expect, it } from 'vitest';
import { DomainError } from '../../src/errors.js';
import {
  planarLattice, rectangularLattice, triangularLattice, scaleLattice,
} from '../../src/geometry/lattice.js';
import {
  axialWavenumber, floquetModes, propagatingFloquetModes, teModeImpedance, tmModeImpedance,
} from '../../src/floquet/modes.js';
import {
  gratingLobeCircles, gratingLobeFreeScanConeRad, latticeScaleForScanCone, spacingForScanCone,
} from '../../src/geometry/gratingLobes.js';
import { gratingLobes as latticeGratingLobes } from '../../src/geometry/gratingLobes.js';
import type { PlanarLattice } from '../../src/geometry/lattice.js';

/** Grating lobes at a scan (θ, φ), strictly inside visible space. */
function gratingLobes(l: PlanarLattice, f: number, scan: { thetaRad: number; phiRad: number }) {
  const s = Math.sin(scan.thetaRad);
  return latticeGratingLobes(l, f, s * Math.cos(scan.phiRad), s * Math.sin(scan.phiRad)).filter((g) => g.u * g.u + g.v * g.v < 1 - 1e-12);
}
import { C0_M_PER_S, ETA0_OHM } from '../../src/units/constants.js';

const F = 10e9;
const LAMBDA = C0_M_PER_S / F;
const K = (2 * Math.PI) / LAMBDA;

describe('planarLattice', () => {
  it('reciprocal vectors satisfy aᵢ·bⱼ = 2π δᵢⱼ for a skewed lattice (definition of the reciprocal lattice)', () => {
    const l = planarLattice([0.013, 0.002], [-0.004, 0.011]);
    const a = [[l.a1xM, l.a1yM], [l.a2xM, l.a2yM]];
    const b = [[l.b1xRadPerM, l.b1yRadPerM], [l.b2xRadPerM, l.b2yRadPerM]];
    for (let i = 0; i < 2; i++) {
      for (let j = 0; j < 2; j++) {
        const dot = a[i][0] * b[j][0] + a[i][1] * b[j][1];
        expect(Math.abs(dot - (i === j ? 2 * Math.PI : 0))).toBeLessThan(1e-12);
      }
    }
    expect(l.cellAreaM2).toBeCloseTo(0.013 * 0.011 + 0.002 * 0.004, 15);
  });
  it('equilateral triangular cell area is (√3/2) d²; rectangular dx·dy', () => {
    expect(triangularLattice(0.02).cellAreaM2 / ((Math.sqrt(3) / 2) * 0.0004) - 1).toBeLessThan(1e-14);
    expect(rectangularLattice(0.02, 0.03).cellAreaM2).toBeCloseTo(6e-4, 16);
    expect(scaleLattice(rectangularLattice(1, 2), 0.5).cellAreaM2).toBeCloseTo(0.5, 15);
  });
  it('throws DomainError for collinear or zero primitive vectors', () => {
    expect(() => planarLattice([0.01, 0.01], [0.02, 0.02])).toThrow(DomainError);
    expect(() => planarLattice([0, 0], [0.02, 0.01])).toThrow(DomainError);
    expect(() => planarLattice([Number.NaN, 0], [0.02, 0.01])).toThrow(DomainError);
    expect(() => rectangularLattice(0, 0.01)).toThrow(DomainError);
  });
});

describe('Floquet modes', () => {
  it('k_z branch: real for k_t < k, −j|k_z| for k_t > k (e^{+jωt} decay away from the array)', () => {
    expect(axialWavenumber(3, 5).re).toBeCloseTo(4, 14);
    const ev = axialWavenumber(5, 3);
    expect(ev.re).toBe(0);
    expect(ev.im).toBeCloseTo(-4, 14);
  });
  it('evanescent TE modes are inductive and TM modes capacitive; propagating ones resistive', () => {
    const ev = axialWavenumber(2 * K, K);
    expect(teModeImpedance(ev, K).im).toBeGreaterThan(0);
    expect(tmModeImpedance(ev, K).im).toBeLessThan(0);
    const pr = axialWavenumber(0.5 * K, K);
    // Z_TE Z_TM = η² for every mode (Harrington 1961, from memory).
    const prod = teModeImpedance(pr, K).mul(tmModeImpedance(pr, K));
    expect(prod.re / (ETA0_OHM * ETA0_OHM) - 1).toBeLessThan(1e-14);
    expect(Math.abs(prod.im)).toBeLessThan(1e-9);
  });
  it('transverse wavenumbers follow k(u₀, v₀) + m b₁ + n b₂ and the (0,0) mode is the main beam', () => {
    const l = triangularLattice(0.6 * LAMBDA);
    const scan = { thetaRad: 0.4, phiRad: 0.7 };
    const modes = floquetModes(l, F, scan, { maxOrder: 2 });
    expect(modes).toHaveLength(25);
    const m00 = modes.find((m) => m.m === 0 && m.n === 0)!;
    expect(m00.kxRadPerM / K).toBeCloseTo(Math.sin(0.4) * Math.cos(0.7), 12);
    expect(m00.kzRadPerM.re / K).toBeCloseTo(Math.cos(0.4), 12);
    const m1 = modes.find((m) => m.m === 1 && m.n === -1)!;
    expect(m1.kyRadPerM - m00.kyRadPerM).toBeCloseTo(l.b1yRadPerM - l.b2yRadPerM, 8);
  });
  it('a half-wavelength square lattice has only the main beam at any scan; a 1λ lattice has grating lobes at broadside', () => {
    expect(propagatingFloquetModes(rectangularLattice(LAMBDA / 2, LAMBDA / 2), F, { thetaRad: 1.5, phiRad: 0.3 })).toHaveLength(1);
    // d = λ: the (±1, 0), (0, ±1) lobes are exactly at the horizon at broadside (k_t = k), not yet propagating;
    // at d = 1.01 λ they propagate.
    expect(propagatingFloquetModes(rectangularLattice(1.01 * LAMBDA, 1.01 * LAMBDA), F, { thetaRad: 0, phiRad: 0 })).toHaveLength(5);
  });
  it('scan directions outside visible space throw DomainError', () => {
    const l = rectangularLattice(0.01, 0.01);
    expect(() => floquetModes(l, F, { thetaRad: 1.6, phiRad: 0 })).toThrow(DomainError);
    expect(() => floquetModes(l, F, { thetaRad: -0.1, phiRad: 0 })).toThrow(DomainError);
    expect(() => floquetModes(l, F, { thetaRad: 0.1, phiRad: 0 }, { relativePermittivity: 0.5 })).toThrow(DomainError);
  });
});

describe('grating lobes', () => {
  it('linear/square lattice onset d/λ = 1/(1 + |sin θ₀|) (Hansen, Phased Array Antennas, 2nd ed. 2009, ch. 2, from memory)', () => {
    for (const deg of [0, 15, 30, 45, 60, 75]) {
      const s = Math.sin((deg * Math.PI) / 180);
      const d = LAMBDA / (1 + s);
      expect(gratingLobeFreeScanConeRad(rectangularLattice(d, d), F)).toBeCloseTo(Math.asin(s), 10);
      // Just beyond the cone along the x axis a grating lobe appears; just inside, none.
      const inside = gratingLobes(rectangularLattice(d, d), F, { thetaRad: Math.asin(s) * 0.999, phiRad: 0 });
      expect(inside).toHaveLength(0);
      if (deg > 0) {
        const outside = gratingLobes(rectangularLattice(d, d), F, { thetaRad: Math.min(Math.PI / 2, Math.asin(s) * 1.01), phiRad: 0 });
        expect(outside.length).toBeGreaterThan(0);
        expect(outside[0].orderP).toBe(-1);
      }
    }
  });
  it('equilateral triangular lattice condition d/λ = 2/(√3 (1 + sin θ₀)) (Hansen 2009, from memory)', () => {
    for (const deg of [0, 20, 45, 60]) {
      const s = Math.sin((deg * Math.PI) / 180);
      const d = (2 * LAMBDA) / (Math.sqrt(3) * (1 + s));
      expect(gratingLobeFreeScanConeRad(triangularLattice(d), F)).toBeCloseTo(Math.asin(s), 10);
      // The cone is isotropic: no lobe for a scan just inside it at any azimuth.
      for (const phi of [0, 0.3, 1.0, 2.2]) {
        expect(gratingLobes(triangularLattice(d), F, { thetaRad: Math.asin(s) * 0.995, phiRad: phi })).toHaveLength(0);
      }
    }
  });
  it('triangular lattice saves 1 − √3/2 ≈ 13.4 % of the elements (Sharp 1961, from memory)', () => {
    const r = spacingForScanCone(Math.PI / 3, F);
    expect(r.squareSpacingM / LAMBDA).toBeCloseTo(1 / (1 + Math.sin(Math.PI / 3)), 12);
    expect(r.triangularSideM / LAMBDA).toBeCloseTo(2 / (Math.sqrt(3) * (1 + Math.sin(Math.PI / 3))), 12);
    expect(r.elementCountRatio).toBeCloseTo(Math.sqrt(3) / 2, 12);
    expect(r.elementSaving).toBeCloseTo(0.1340, 4);
    expect(() => spacingForScanCone(2, F)).toThrow(DomainError);
  });
  it('a badly chosen skewed basis gives the same cone as the reduced one (Lagrange–Gauss reduction)', () => {
    const d = 0.55 * LAMBDA;
    const good = triangularLattice(d);
    const skewed = planarLattice([d, 0], [d / 2 + 5 * d, (d * Math.sqrt(3)) / 2]); // a2 + 5 a1: same lattice
    expect(gratingLobeFreeScanConeRad(skewed, F)).toBeCloseTo(gratingLobeFreeScanConeRad(good, F), 12);
    expect(latticeScaleForScanCone(skewed, 0.5, F)).toBeCloseTo(latticeScaleForScanCone(good, 0.5, F), 12);
  });
  it('grating-lobe circles are centred on the reciprocal lattice over k', () => {
    const c = gratingLobeCircles(rectangularLattice(0.7 * LAMBDA, 0.7 * LAMBDA), F, 1);
    expect(c).toHaveLength(9);
    expect(c[0]).toMatchObject({ m: 0, n: 0, centerU: 0, centerV: 0, radius: 1 });
    expect(Math.hypot(c[1].centerU, c[1].centerV)).toBeCloseTo(1 / 0.7, 12);
  });
});
