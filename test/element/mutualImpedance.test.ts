import { describe, it, expect } from 'vitest';
import sici from '@stdlib/math-base-special-sici';
import fixture from './fixtures/induced_emf.json';
import {
  dipoleSelfImpedance, sideBySideMutualImpedance, collinearMutualImpedance, echelonMutualImpedance,
  dipoleMutualImpedance, dipoleArrayImpedanceMatrix, CoincidentElementsError,
} from '../../src/element/index.js';
import type { WireDipole } from '../../src/element/index.js';
import type { Vector3 } from '../../src/geometry/layout.js';
import { DomainError } from '../../src/errors.js';
import { ETA0_OHM } from '../../src/units/constants.js';
import { entry } from '../../src/linalg/cmatrix.js';

const F = 299792458; // λ = 1 m
const dip = (centerM: Vector3, axis: Vector3 = [0, 0, 1], lengthM = 0.5, radiusM = 1e-5): WireDipole => ({ centerM, axis, lengthM, radiusM });
const close = (re: number, im: number, eRe: number, eIm: number, rtol: number) => {
  const scale = Math.hypot(eRe, eIm);
  expect(Math.hypot(re - eRe, im - eIm)).toBeLessThanOrEqual(rtol * scale + 1e-12);
};

describe('dipoleSelfImpedance', () => {
  it('half-wave dipole reactance carries −η·a/λ: mpmath values of the filament closed form', () => {
    // mpmath 1.3.0, mp.dps = 30, η = 1.25663706212e-6·299792458, k = 2π, l = 0.5 (λ = 1 m):
    //   X = −(η/4π)[2 Si(ka) − Si(k(√(a²+l²)+l)) − Si(k(√(a²+l²)−l))], R likewise with Ci.
    // Issue 23: the doc's "42.52, independent of a" was wrong; the a → 0 value is (η/4π) Si(2π) = 42.51511.
    const ref = [
      [1e-6, 73.0790102848572163, 42.5147379755563770],
      [1e-4, 73.0790043677831808, 42.4774435587928135],
      [1e-3, 73.0784185201253818, 42.1385735833385323],
    ] as const;
    // The resistance is the filament's radiation resistance at every radius (the a → 0 limit of the
    // R column above): R = (η/4π)(γ + ln 2π − Ci 2π) = 73.0790102854489829 (mpmath 1.3.0, same η).
    const rFilament = 73.0790102854489829;
    for (const [a, r, x] of ref) {
      const z = dipoleSelfImpedance(0.5, a, F);
      expect(Math.abs(z.re - rFilament)).toBeLessThan(1e-12 * rFilament);
      // the surface evaluation (the R column) differs by O((ka)²): about (η/4π)·(ka)²·0.6 here
      expect(Math.abs(z.re - r)).toBeLessThan(2 * (ETA0_OHM / (4 * Math.PI)) * (2 * Math.PI * a) ** 2 + 1e-9);
      expect(Math.abs(z.im - x)).toBeLessThan(1e-9 * x);
      // Leading radius term: X ≈ (η/4π) Si(2π) − η·a/λ; the rest is (η/4π)·Si(k(√(l²+a²) − l)) ≈ (η/4π)·2πa²/λ
      // plus O((ka)³), so the bound is twice that quadratic term.
      expect(Math.abs(z.im - (42.5151147056816779 - ETA0_OHM * a))).toBeLessThan(2 * (ETA0_OHM / (4 * Math.PI)) * 2 * Math.PI * a * a + 1e-12);
    }
  });
  it('thin half-wave dipole: 73.08 + j42.51 Ω', () => {
    // Balanis, Antenna Theory, 4th ed., 2016, eq. (8-60a,b)/(4-93) (from memory): 73.1 + j42.5 Ω with η = 120π.
    // With η0 = 376.7303 Ω the induced-EMF values are R = (η/4π)(γ + ln 2π − Ci 2π) = 73.079,
    // X = (η/4π) Si(2π) = 42.515 (closed forms evaluated in the next test from the same source).
    const z = dipoleSelfImpedance(0.5, 1e-6, F);
    expect(Math.abs(z.re - 73.08)).toBeLessThan(0.005);
    expect(Math.abs(z.im - 42.51)).toBeLessThan(0.005);
  });
  it('matches the Balanis closed form R, X for l = λ/2 (a → 0)', () => {
    // Balanis (4-93) (from memory): R = (η/4π)[γ + ln(2π) − Ci(2π)], X = (η/4π) Si(2π), referred to I_max = I_in.
    const [si2pi, ci2pi] = sici(2 * Math.PI);
    const r = (ETA0_OHM / (4 * Math.PI)) * (0.5772156649015329 + Math.log(2 * Math.PI) - ci2pi);
    const x = (ETA0_OHM / (4 * Math.PI)) * si2pi;
    // The book's X drops terms of order ka (the exact filament form has −(η/4π)·2Si(ka) ≈ −(η/4π)·2ka),
    // so the tolerance on X is 1.5·(η/4π)·2ka; on R the difference is O((ka)²).
    const a = 1e-7, ka = 2 * Math.PI * a;
    const z = dipoleSelfImpedance(0.5, a, F);
    expect(Math.abs(z.re - r) / r).toBeLessThan(1e-9);
    expect(Math.abs(z.im - x)).toBeLessThan(1.5 * (ETA0_OHM / (4 * Math.PI)) * 2 * ka);
    expect(Math.abs(z.im - x)).toBeGreaterThan(0.5 * (ETA0_OHM / (4 * Math.PI)) * 2 * ka);
  });
  it('general length: resistance equals Balanis (4-79) radiation resistance over sin²(kl/2)', () => {
    // Balanis (4-79) (from memory), current-maximum referred:
    // R_m = η/(2π){γ + ln(kl) − Ci(kl) + ½ sin(kl)[Si(2kl) − 2Si(kl)] + ½ cos(kl)[γ + ln(kl/2) + Ci(2kl) − 2Ci(kl)]}
    const g = 0.5772156649015329;
    for (const l of [0.1, 0.3, 0.75, 1.25]) {
      const kl = 2 * Math.PI * l;
      const [s1, c1] = sici(kl);
      const [s2, c2] = sici(2 * kl);
      const rm = (ETA0_OHM / (2 * Math.PI)) * (g + Math.log(kl) - c1 + 0.5 * Math.sin(kl) * (s2 - 2 * s1) + 0.5 * Math.cos(kl) * (g + Math.log(kl / 2) + c2 - 2 * c1));
      const rin = rm / Math.sin(kl / 2) ** 2;
      const z = dipoleSelfImpedance(l, 1e-7, F);
      expect(Math.abs(z.re - rin) / rin).toBeLessThan(1e-8);
    }
  });
  it('rejects zero length, whole-wavelength length and radius ≥ l/2', () => {
    expect(() => dipoleSelfImpedance(0, 1e-3, F)).toThrow(DomainError);
    expect(() => dipoleSelfImpedance(1, 1e-3, F)).toThrow(/whole number of wavelengths/);
    expect(() => dipoleSelfImpedance(0.5, 0.3, F)).toThrow(DomainError);
    expect(() => dipoleSelfImpedance(0.5, 1e-3, NaN)).toThrow(DomainError);
  });
});

describe('mutual impedance: closed forms vs independent scipy integration', () => {
  // Fixture: test/element/fixtures/generate_induced_emf.py (scipy.integrate.quad of the induced-EMF integral).
  for (const c of fixture.parallel) {
    it(`${c.kind} l=${c.lengthM} d=${c.separationM} h=${c.axialOffsetM}`, () => {
      const z = c.kind === 'side-by-side' ? sideBySideMutualImpedance(c.lengthM, c.separationM, F)
        : c.kind === 'collinear' ? collinearMutualImpedance(c.lengthM, c.axialOffsetM, F)
          : echelonMutualImpedance(c.lengthM, c.separationM, c.axialOffsetM, F);
      close(z.re, z.im, c.re, c.im, 1e-9); // quad epsrel 1e-12; 1e-9 leaves room for its error estimate
    });
  }
  for (const [i, c] of fixture.general.entries()) {
    it(`arbitrary orientation case ${i}: numerical Gauss–Legendre vs scipy`, () => {
      const z = dipoleMutualImpedance(dip(c.centerA as unknown as Vector3, c.axisA as unknown as Vector3, c.lengthA), dip(c.centerB as unknown as Vector3, c.axisB as unknown as Vector3, c.lengthB), F);
      close(z.re, z.im, c.re, c.im, 1e-9);
    });
  }
});

describe('mutual impedance: published values', () => {
  it('half-wave side by side equals Balanis (8-68) at 0.1–3 λ', () => {
    // Balanis, Antenna Theory, 4th ed., 2016, eq. (8-68) (Carter 1932) (from memory), l = λ/2:
    // R = (η/4π)[2Ci(u0) − Ci(u1) − Ci(u2)], X = −(η/4π)[2Si(u0) − Si(u1) − Si(u2)].
    for (let d = 0.1; d <= 3.0001; d += 0.05) {
      const k = 2 * Math.PI, l = 0.5;
      const u0 = k * d, u1 = k * (Math.hypot(d, l) + l), u2 = k * (Math.hypot(d, l) - l);
      const [s0, c0] = sici(u0), [s1, c1] = sici(u1), [s2, c2] = sici(u2);
      const r = (ETA0_OHM / (4 * Math.PI)) * (2 * c0 - c1 - c2);
      const x = -(ETA0_OHM / (4 * Math.PI)) * (2 * s0 - s1 - s2);
      const z = sideBySideMutualImpedance(0.5, d, F);
      close(z.re, z.im, r, x, 1e-11);
    }
  });
  it('textbook curve values (Balanis Fig. 8.19, from memory)', () => {
    // d = 0.5λ: −12.5 − j29.9 Ω; d = λ: 4.0 + j17.7 Ω (read off the curves, ±0.3 Ω).
    const a = sideBySideMutualImpedance(0.5, 0.5, F);
    expect(Math.abs(a.re + 12.5)).toBeLessThan(0.3);
    expect(Math.abs(a.im + 29.9)).toBeLessThan(0.3);
    const b = sideBySideMutualImpedance(0.5, 1, F);
    expect(Math.abs(b.re - 4.0)).toBeLessThan(0.3);
    expect(Math.abs(b.im - 17.7)).toBeLessThan(0.3);
  });
  it('collinear is the d → 0 limit of echelon', () => {
    const c = collinearMutualImpedance(0.5, 1.2, F);
    const e = echelonMutualImpedance(0.5, 1e-7, 1.2, F);
    close(e.re, e.im, c.re, c.im, 1e-9);
  });
});

describe('dipoleMutualImpedance and the array matrix', () => {
  it('reciprocity Z12 = Z21 for skewed pairs (tests E_z and E_ρ of the filament field)', () => {
    const a = dip([0, 0, 0], [0.2, 0.1, 1], 0.45);
    const b = dip([0.7, 0.2, -0.1], [1, 0.3, 0.4], 0.6);
    const ab = dipoleMutualImpedance(a, b, F), ba = dipoleMutualImpedance(b, a, F);
    close(ab.re, ab.im, ba.re, ba.im, 1e-11);
  });
  it('near-parallel pair: numerical path is continuous with the closed form', () => {
    const p = dipoleMutualImpedance(dip([0, 0, 0]), dip([0.4, 0, 0.1]), F);
    const q = dipoleMutualImpedance(dip([0, 0, 0]), dip([0.4, 0, 0.1], [1e-7, 0, 1]), F);
    close(q.re, q.im, p.re, p.im, 1e-6);
  });
  it('antiparallel axis flips the sign', () => {
    const p = dipoleMutualImpedance(dip([0, 0, 0]), dip([0.4, 0, 0.1]), F);
    const q = dipoleMutualImpedance(dip([0, 0, 0]), dip([0.4, 0, 0.1], [0, 0, -1]), F);
    close(q.re, q.im, -p.re, -p.im, 1e-14);
  });
  it('ground plane: horizontal dipole over PEC = Z_self − Z_sbs(2h) (image theory)', () => {
    const h = 0.3;
    const zm = dipoleArrayImpedanceMatrix([dip([0, 0, h], [1, 0, 0], 0.5, 1e-5)], F, { groundPlane: { zM: 0 } });
    const self = dipoleSelfImpedance(0.5, 1e-5, F), m = sideBySideMutualImpedance(0.5, 2 * h, F);
    const z = entry(zm, 0, 0);
    close(z.re, z.im, self.re - m.re, self.im - m.im, 1e-12);
  });
  it('matrix is symmetric and matches the pair function', () => {
    const ds = [dip([0, 0, 0]), dip([0.5, 0, 0]), dip([0, 0.6, 0.1], [1, 0, 0]), dip([0.8, 0.5, 0.3], [1, 1, 1], 0.4)];
    const z = dipoleArrayImpedanceMatrix(ds, F);
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) {
      const a = entry(z, i, j), b = entry(z, j, i);
      expect(a.re).toBe(b.re);
      if (i !== j) {
        const p = dipoleMutualImpedance(ds[i], ds[j], F);
        close(a.re, a.im, p.re, p.im, 1e-10);
      }
    }
  });
  it('regular lattice over ground: reuse of repeated pair geometries gives the pair-by-pair values', () => {
    const ds: WireDipole[] = [];
    for (let ix = 0; ix < 4; ix++) for (let iy = 0; iy < 3; iy++) ds.push(dip([(ix - 1.5) * 0.37, (iy - 1) * 0.41, 0.2], [1, 0, 0], 0.3));
    ds.push(dip([0.1, 0.9, 0.35], [0.3, 1, 0.2], 0.4));
    const plane = { zM: 0 };
    const z = dipoleArrayImpedanceMatrix(ds, F, { groundPlane: plane });
    for (let i = 0; i < ds.length; i++) for (let j = i + 1; j < ds.length; j++) {
      const p = dipoleMutualImpedance(ds[i], ds[j], F, { groundPlane: plane });
      const a = entry(z, i, j);
      close(a.re, a.im, p.re, p.im, 1e-9);
    }
  });
  it('coincident elements: typed error naming the pair', () => {
    const ds = [dip([0, 0, 0]), dip([0.5, 0, 0]), dip([0.5, 0, 0.1])];
    let caught: unknown;
    try { dipoleArrayImpedanceMatrix(ds, F); } catch (e) { caught = e; }
    expect(caught).toBeInstanceOf(CoincidentElementsError);
    expect((caught as CoincidentElementsError).pair).toEqual([1, 2]);
    expect((caught as Error).message).toMatch(/elements 1 and 2/);
    expect(() => collinearMutualImpedance(0.5, 0.5, F)).toThrow(CoincidentElementsError);
    expect(() => sideBySideMutualImpedance(0.5, 0, F)).toThrow(CoincidentElementsError);
    // crossing wires (non-parallel)
    expect(() => dipoleMutualImpedance(dip([0, 0, 0]), dip([0, 0, 0.1], [1, 0, 0]), F)).toThrow(CoincidentElementsError);
  });
  it('bad input: zero-length dipole, empty list, dipole below the ground plane', () => {
    expect(() => dipoleArrayImpedanceMatrix([dip([0, 0, 0], [0, 0, 1], 0)], F)).toThrow(/zero-length/);
    expect(() => dipoleArrayImpedanceMatrix([], F)).toThrow(DomainError);
    expect(() => dipoleArrayImpedanceMatrix([dip([0, 0, 0.1])], F, { groundPlane: { zM: 0 } })).toThrow(/ground plane/);
    expect(() => dipoleArrayImpedanceMatrix([dip([0, 0, 0], [0, 0, 0])], F)).toThrow(/non-zero direction/);
  });
});

describe('reciprocity (property)', () => {
  it('Z(a, b) = Z(b, a) for random pairs with centres ≥ 1.2 λ apart (wires ≥ 0.5 λ)', async () => {
    const fc = (await import('fast-check')).default;
    const coord = fc.double({ min: -1, max: 1, noNaN: true });
    const axis = fc.tuple(coord, coord, coord).filter(([x, y, z]) => Math.hypot(x, y, z) > 0.2);
    fc.assert(fc.property(axis, axis, fc.tuple(coord, coord, coord), fc.double({ min: 0.2, max: 0.7, noNaN: true }), fc.double({ min: 0.2, max: 0.7, noNaN: true }),
      (a1, a2, c, l1, l2) => {
        const a = dip([0, 0, 0], a1 as unknown as Vector3, l1);
        const b = dip([Math.abs(2 * c[0]) + 1.2, c[1], c[2]], a2 as unknown as Vector3, l2);
        const ab = dipoleMutualImpedance(a, b, F), ba = dipoleMutualImpedance(b, a, F);
        return Math.hypot(ab.re - ba.re, ab.im - ba.im) <= 1e-9 * Math.hypot(ab.re, ab.im) + 1e-9;
      }), { seed: 42, numRuns: 40 });
  });
});
