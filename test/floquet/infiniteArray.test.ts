import { describe, expect, it } from 'vitest';
import fixture from './fixtures/floquet_brute.json';
import { DomainError } from '../../src/errors.js';
import { planarLattice, rectangularLattice, triangularLattice } from '../../src/geometry/lattice.js';
import {
  type InfiniteDipoleArray, infiniteArrayActiveImpedance, infiniteArrayActiveImpedanceInto, infiniteDipoleArray,
} from '../../src/floquet/infiniteDipoleArray.js';
import type { ArrayBacking } from '../../src/floquet/spectralGreen.js';
import { infiniteArrayScanPerformance } from '../../src/floquet/scanPerformance.js';
import { C0_M_PER_S, ETA0_OHM } from '../../src/units/constants.js';

const F = 1e9;
const LAMBDA = C0_M_PER_S / F;
const K = (2 * Math.PI) / LAMBDA;

describe('infinite dipole array: accelerated Floquet sum', () => {
  // Reference: independent numpy direct double sum |m|,|n| ≤ 1600 with Richardson extrapolation
  // (test/floquet/fixtures/generate_floquet_brute.py; spread between extrapolations ≤ 5e-7 Ω).
  for (const c of fixture.cases) {
    const skew = (c as { skewM?: number }).skewM ?? 0;
    it(`matches the numpy brute-force sum to 1e-6: ${c.backing.kind}, w = ${(c.widthM / LAMBDA).toFixed(2)}λ${skew ? ', triangular lattice' : ''}`, () => {
      const arr = infiniteDipoleArray({
        lattice: planarLattice([c.dxM, 0], [skew, c.dyM]),
        element: { lengthM: c.lengthM, widthM: c.widthM, effectiveWavenumberRadPerM: c.keRadPerM },
        backing: c.backing as ArrayBacking,
        frequencyHz: c.frequencyHz,
        relativeTolerance: 1e-6,
      });
      const r = infiniteArrayActiveImpedance(arr, { thetaRad: c.thetaRad, phiRad: c.phiRad });
      const ref = Math.hypot(c.impedanceRe, c.impedanceIm);
      const err = Math.hypot(r.impedanceOhm.re - c.impedanceRe, r.impedanceOhm.im - c.impedanceIm) / ref;
      expect(err).toBeLessThan(1e-6);
      expect(r.estimatedRelativeError).toBeLessThan(1e-5);
      expect(r.modesUsed).toBeGreaterThan(10);
    });
  }

  const lattice = rectangularLattice(0.5 * LAMBDA, 0.5 * LAMBDA);
  const make = (backing: ArrayBacking, lengthM = 0.45 * LAMBDA, widthM = 0.01 * LAMBDA, tol = 1e-6): InfiniteDipoleArray =>
    infiniteDipoleArray({ lattice, element: { lengthM, widthM }, backing, frequencyHz: F, relativeTolerance: tol });

  it('tolerance 1e-4 and 1e-8 agree to 1e-4 (convergence control)', () => {
    const a = make({ kind: 'groundedSlab', relativePermittivity: 4, thicknessM: 0.05 * LAMBDA }, 0.3 * LAMBDA, 0.01 * LAMBDA, 1e-4);
    const b = make({ kind: 'groundedSlab', relativePermittivity: 4, thicknessM: 0.05 * LAMBDA }, 0.3 * LAMBDA, 0.01 * LAMBDA, 1e-8);
    const scan = { thetaRad: 0.6, phiRad: 0.9 };
    const za = infiniteArrayActiveImpedance(a, scan).impedanceOhm;
    const zb = infiniteArrayActiveImpedance(b, scan).impedanceOhm;
    expect(za.sub(zb).abs() / zb.abs()).toBeLessThan(1e-4);
  });

  it('cosine current = piecewise-sinusoidal current with k_e = π/L; slab default k_e = k₀√((εr + 1)/2)', () => {
    const L = 0.4 * LAMBDA;
    const slab: ArrayBacking = { kind: 'groundedSlab', relativePermittivity: 3, thicknessM: 0.05 * LAMBDA };
    const scan = { thetaRad: 0.4, phiRad: 0.2 };
    const z = (element: { lengthM: number; widthM: number; current?: 'cosine' | 'piecewiseSinusoidal'; effectiveWavenumberRadPerM?: number }) =>
      infiniteArrayActiveImpedance(infiniteDipoleArray({ lattice, element, backing: slab, frequencyHz: F, relativeTolerance: 1e-5 }), scan).impedanceOhm;
    const cos = z({ lengthM: L, widthM: 0.01 * LAMBDA, current: 'cosine' });
    const pws = z({ lengthM: L, widthM: 0.01 * LAMBDA, effectiveWavenumberRadPerM: Math.PI / L });
    expect(cos.sub(pws).abs() / cos.abs()).toBeLessThan(1e-12);
    const dflt = z({ lengthM: L, widthM: 0.01 * LAMBDA });
    const expl = z({ lengthM: L, widthM: 0.01 * LAMBDA, effectiveWavenumberRadPerM: K * Math.sqrt(2) });
    expect(dflt.sub(expl).abs() / dflt.abs()).toBeLessThan(1e-12);
  });

  it('mirror symmetry: Z(θ, φ) = Z(θ, −φ) = Z(θ, π − φ) (rectangular), Z(θ, φ) = Z(θ, −φ) (triangular)', () => {
    const arr = make({ kind: 'groundPlane', heightM: 0.2 * LAMBDA });
    const z = (phi: number) => infiniteArrayActiveImpedance(arr, { thetaRad: 0.7, phiRad: phi }).impedanceOhm;
    expect(z(0.4).sub(z(-0.4)).abs() / z(0.4).abs()).toBeLessThan(1e-8);
    expect(z(0.4).sub(z(Math.PI - 0.4)).abs() / z(0.4).abs()).toBeLessThan(1e-6);
    const tri = infiniteDipoleArray({ lattice: triangularLattice(0.55 * LAMBDA), element: { lengthM: 0.45 * LAMBDA, widthM: 0.01 * LAMBDA }, backing: { kind: 'freeSpace' }, frequencyHz: F });
    const zt = (phi: number) => infiniteArrayActiveImpedance(tri, { thetaRad: 0.5, phiRad: phi }).impedanceOhm;
    expect(zt(1.1).sub(zt(-1.1)).abs() / zt(1.1).abs()).toBeLessThan(1e-6);
  });

  it('Into kernel equals the allocating call and rejects θ ≥ π/2', () => {
    const arr = make({ kind: 'freeSpace' });
    const th = Float64Array.of(0, 0.3, 1.2);
    const ph = Float64Array.of(0, 1, 2);
    const out = infiniteArrayActiveImpedanceInto(new Float64Array(6), arr, th, ph);
    for (let i = 0; i < 3; i++) {
      const z = infiniteArrayActiveImpedance(arr, { thetaRad: th[i], phiRad: ph[i] }).impedanceOhm;
      expect(out[2 * i]).toBe(z.re);
      expect(out[2 * i + 1]).toBe(z.im);
    }
    expect(() => infiniteArrayActiveImpedanceInto(new Float64Array(2), arr, Float64Array.of(Math.PI / 2), Float64Array.of(0))).toThrow(DomainError);
    expect(() => infiniteArrayActiveImpedance(arr, { thetaRad: 2, phiRad: 0 })).toThrow(DomainError);
  });

  it('bad input: non-positive thickness/height, εr < 1, a1 not along x, strip too wide, dipole too long', () => {
    const el = { lengthM: 0.45 * LAMBDA, widthM: 0.01 * LAMBDA };
    const base = { lattice, element: el, frequencyHz: F };
    expect(() => infiniteDipoleArray({ ...base, backing: { kind: 'groundedSlab', relativePermittivity: 2, thicknessM: 0 } })).toThrow(DomainError);
    expect(() => infiniteDipoleArray({ ...base, backing: { kind: 'groundedSlab', relativePermittivity: 2, thicknessM: -1e-3 } })).toThrow(DomainError);
    expect(() => infiniteDipoleArray({ ...base, backing: { kind: 'groundedSlab', relativePermittivity: 0.9, thicknessM: 1e-3 } })).toThrow(DomainError);
    expect(() => infiniteDipoleArray({ ...base, backing: { kind: 'groundPlane', heightM: 0 } })).toThrow(DomainError);
    expect(() => infiniteDipoleArray({ ...base, lattice: planarLattice([0.1, 0.05], [0, 0.15]), backing: { kind: 'freeSpace' } })).toThrow(DomainError);
    expect(() => infiniteDipoleArray({ ...base, element: { lengthM: 0.4 * LAMBDA, widthM: 0.49 * LAMBDA }, backing: { kind: 'freeSpace' } })).toThrow(DomainError);
    expect(() => infiniteDipoleArray({ ...base, element: { lengthM: 1.0 * LAMBDA, widthM: 0.01 * LAMBDA }, backing: { kind: 'freeSpace' } })).toThrow(DomainError);
    expect(() => infiniteDipoleArray({ ...base, backing: { kind: 'freeSpace' }, relativeTolerance: 0 })).toThrow(DomainError);
  });
});

describe('Wheeler current sheet (H. A. Wheeler, "Simple relations derived from a phased-array antenna made of an infinite current sheet", IEEE Trans. Antennas Propag. 13(4), 1965, from memory)', () => {
  // Very short dipoles: the array approximates a uniform current sheet; with d = λ/2 only the
  // (0,0) mode propagates, so the resistance is the sheet's.
  const L = 0.01 * LAMBDA;
  const lattice = rectangularLattice(0.5 * LAMBDA, 0.5 * LAMBDA);
  const A = lattice.cellAreaM2;
  // Effective length ∫ I(x)/I₀ dx of the piecewise-sinusoidal current, by Simpson's rule (independent of the code's closed form).
  const h = L / 2;
  let leff = 0;
  const n = 2000;
  for (let i = 0; i <= n; i++) {
    const x = -h + (2 * h * i) / n;
    const f = Math.sin(K * (h - Math.abs(x))) / Math.sin(K * h);
    leff += (i === 0 || i === n ? 1 : i % 2 ? 4 : 2) * f;
  }
  leff *= (2 * h) / n / 3;
  // The resistance comes from the propagating (0,0) mode alone, so a loose sum tolerance suffices here.
  const sheet = (backing: ArrayBacking) =>
    infiniteDipoleArray({ lattice, element: { lengthM: L, widthM: 0.001 * LAMBDA }, backing, frequencyHz: F, relativeTolerance: 1e-3 });
  const freeSheet = sheet({ kind: 'freeSpace' });

  it('free-standing sheet broadside resistance η L_eff²/(2A) from the power balance (half the power each way)', () => {
    const r = infiniteArrayActiveImpedance(freeSheet, { thetaRad: 0, phiRad: 0 }).impedanceOhm.re;
    expect(r / ((ETA0_OHM * leff * leff) / (2 * A)) - 1).toBeLessThan(1e-6);
  });
  it('sheet λ/4 above a ground plane: broadside resistance η L_eff²/A (all power up, in-phase image)', () => {
    const arr = sheet({ kind: 'groundPlane', heightM: LAMBDA / 4 });
    const r = infiniteArrayActiveImpedance(arr, { thetaRad: 0, phiRad: 0 }).impedanceOhm.re;
    expect(Math.abs(r / ((ETA0_OHM * leff * leff) / A) - 1)).toBeLessThan(1e-6);
  });
  it('scan resistance ∝ cos θ in the E-plane and 1/cos θ in the H-plane', () => {
    const arr = freeSheet;
    const r0 = infiniteArrayActiveImpedance(arr, { thetaRad: 0, phiRad: 0 }).impedanceOhm.re;
    for (const deg of [20, 40, 60, 75]) {
      const th = (deg * Math.PI) / 180;
      const rE = infiniteArrayActiveImpedance(arr, { thetaRad: th, phiRad: 0 }).impedanceOhm.re;
      const rH = infiniteArrayActiveImpedance(arr, { thetaRad: th, phiRad: Math.PI / 2 }).impedanceOhm.re;
      // Residual from the finite dipole length: F(k sinθ)/F(0) − 1 = O((kL)²/24·…) ≈ 2e-4 at 0.01λ.
      expect(Math.abs(rE / r0 / Math.cos(th) - 1)).toBeLessThan(3e-4);
      // H-plane: exactly 1/cosθ times the strip's transverse factor sinc²(k sinθ w/2) (≈ 1 − 3e-6 here).
      const x = (K * Math.sin(th) * 0.001 * LAMBDA) / 2;
      expect(Math.abs((rH / r0) * Math.cos(th) - (Math.sin(x) / x) ** 2)).toBeLessThan(1e-9);
    }
  });
});

describe('energy conservation and embedded element gain', () => {
  const lattice = rectangularLattice(0.5 * LAMBDA, 0.5 * LAMBDA);
  const ideal = (th: number) => (4 * Math.PI * lattice.cellAreaM2 * Math.cos(th)) / (LAMBDA * LAMBDA);
  for (const backing of [
    { kind: 'groundPlane', heightM: 0.25 * LAMBDA },
    { kind: 'groundedSlab', relativePermittivity: 2.2, thicknessM: 0.08 * LAMBDA },
  ] as ArrayBacking[]) {
    it(`lossless matched array: embedded gain = 4πA cosθ/λ² (Hannan 1964, from memory) — ${backing.kind}`, () => {
      const arr = infiniteDipoleArray({ lattice, element: { lengthM: 0.4 * LAMBDA, widthM: 0.01 * LAMBDA }, backing, frequencyHz: F });
      for (const [th, ph] of [[0, 0], [0.5, 0], [0.7, Math.PI / 2], [0.9, 0.8]]) {
        const za = infiniteArrayActiveImpedance(arr, { thetaRad: th, phiRad: ph }).impedanceOhm;
        // Conjugate-matched generator: Γ = 0; all delivered power must leave in the main-beam mode.
        const matched = infiniteArrayScanPerformance(arr, { thetaRad: th, phiRad: ph }, za.conjugate());
        expect(matched.reflectionMagnitude).toBeLessThan(1e-12);
        expect(Math.abs(matched.embeddedGain / ideal(th) - 1)).toBeLessThan(1e-9);
        expect(Math.abs(matched.mainBeamFraction - 1)).toBeLessThan(1e-9);
        // 50 Ω generator: G = (4πA/λ²) cosθ (1 − |Γ|²).
        const p50 = infiniteArrayScanPerformance(arr, { thetaRad: th, phiRad: ph }, 50);
        expect(Math.abs(p50.embeddedGain / (ideal(th) * (1 - p50.reflectionMagnitude ** 2)) - 1)).toBeLessThan(1e-9);
      }
    });
  }
  it('free-standing array sends exactly half the delivered power upward (symmetry)', () => {
    const arr = infiniteDipoleArray({ lattice, element: { lengthM: 0.45 * LAMBDA, widthM: 0.01 * LAMBDA }, backing: { kind: 'freeSpace' }, frequencyHz: F });
    const p = infiniteArrayScanPerformance(arr, { thetaRad: 0.6, phiRad: 0.3 });
    expect(Math.abs(p.mainBeamFraction - 0.5)).toBeLessThan(1e-9);
    expect(p.impedanceOhm.re).toBeGreaterThan(0);
    expect(() => infiniteArrayScanPerformance(arr, { thetaRad: 0.6, phiRad: 0.3 }, -50)).toThrow(DomainError);
  });
});

describe('layered-medium impedances at a grating-lobe onset', () => {
  it('β = k₀ exactly gives a large finite TE impedance, not NaN (Wood anomaly of a free-standing array)', async () => {
    const { layeredImpedancesInto, spectralMedium } = await import('../../src/floquet/spectralGreen.js');
    const out = new Float64Array(8);
    for (const backing of [{ kind: 'freeSpace' }, { kind: 'groundPlane', heightM: 0.1 }, { kind: 'groundedSlab', relativePermittivity: 3, thicknessM: 0.01 }] as ArrayBacking[]) {
      layeredImpedancesInto(out, spectralMedium(backing, K), K);
      for (let i = 0; i < 4; i++) expect(Number.isFinite(out[i])).toBe(true);
    }
    layeredImpedancesInto(out, spectralMedium({ kind: 'freeSpace' }, K), K);
    expect(Math.hypot(out[2], out[3])).toBeGreaterThan(1e9);
  });
});
