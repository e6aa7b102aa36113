import { describe, it, expect } from 'vitest';
import { currentSheetScanResistance, infiniteDipoleArray, infiniteArrayActiveImpedance, rectangularLattice, triangularLattice } from '../../src/floquet/index.js';
import type { ArrayBacking } from '../../src/floquet/index.js';
import { ETA0_OHM } from '../../src/units/constants.js';
import { DomainError } from '../../src/errors.js';

const F = 2.99792458e9, LAMBDA = 0.1, K = 2 * Math.PI / LAMBDA;
const lattice = rectangularLattice(0.5 * LAMBDA, 0.5 * LAMBDA);
const A = lattice.cellAreaM2;
const sheet = (backing: ArrayBacking, l = 1) => ({ lattice, backing, frequencyHz: F, effectiveLengthM: l });

describe('currentSheetScanResistance: Wheeler current sheet (IEEE Trans. Antennas Propag. 13(4), 1965, from memory)', () => {
  it('free space: R = ηL²/(2A) at broadside; ∝ cos θ in the E-plane and sec θ in the H-plane, to rounding', () => {
    const r0 = currentSheetScanResistance(sheet({ kind: 'freeSpace' }), { thetaRad: 0, phiRad: 0 }).resistanceOhm;
    expect(Math.abs(r0 / (ETA0_OHM / (2 * A)) - 1)).toBeLessThan(4e-16);
    for (const deg of [10, 30, 45, 60, 75, 85]) {
      const th = (deg * Math.PI) / 180;
      const rE = currentSheetScanResistance(sheet({ kind: 'freeSpace' }), { thetaRad: th, phiRad: 0 }).resistanceOhm;
      const rH = currentSheetScanResistance(sheet({ kind: 'freeSpace' }), { thetaRad: th, phiRad: Math.PI / 2 }).resistanceOhm;
      const rD = currentSheetScanResistance(sheet({ kind: 'freeSpace' }), { thetaRad: th, phiRad: Math.PI / 4 }).resistanceOhm;
      expect(Math.abs(rE / r0 / Math.cos(th) - 1)).toBeLessThan(1e-14);
      expect(Math.abs((rH / r0) * Math.cos(th) - 1)).toBeLessThan(1e-14);
      expect(Math.abs(rD / r0 / ((Math.cos(th) + 1 / Math.cos(th)) / 2) - 1)).toBeLessThan(1e-14);
    }
  });
  it('over a ground plane at h: R = (ηL²/A)·cos θ·sin²(kh cos θ) (E) and ·sin²(kh cos θ)/cos θ (H) by image theory', () => {
    const h = 0.2 * LAMBDA;
    for (const deg of [0, 25, 50, 70]) {
      const th = (deg * Math.PI) / 180, c = Math.cos(th), s2 = Math.sin(K * h * c) ** 2;
      const rE = currentSheetScanResistance(sheet({ kind: 'groundPlane', heightM: h }), { thetaRad: th, phiRad: 0 }).resistanceOhm;
      const rH = currentSheetScanResistance(sheet({ kind: 'groundPlane', heightM: h }), { thetaRad: th, phiRad: Math.PI / 2 }).resistanceOhm;
      expect(Math.abs(rE / ((ETA0_OHM / A) * c * s2) - 1)).toBeLessThan(1e-13);
      expect(Math.abs(rH / ((ETA0_OHM / A) * s2 / c) - 1)).toBeLessThan(1e-13);
    }
  });
  it('is the limit of the strip-dipole array: a 0.002λ × 0.0001λ strip agrees to (kL)²-order terms', () => {
    const L = 0.002 * LAMBDA, w = 0.0001 * LAMBDA, h = L / 2;
    const leff = (2 * (1 - Math.cos(K * h))) / (K * Math.sin(K * h)); // ∫ sin k(h − |x|)/sin kh dx, closed form
    const strip = infiniteDipoleArray({ lattice, element: { lengthM: L, widthM: w }, backing: { kind: 'freeSpace' }, frequencyHz: F, relativeTolerance: 1e-3 });
    for (const [th, ph] of [[0, 0], [0.6, 0], [0.6, Math.PI / 2]]) {
      const rs = infiniteArrayActiveImpedance(strip, { thetaRad: th, phiRad: ph }).impedanceOhm.re;
      const rc = currentSheetScanResistance(sheet({ kind: 'freeSpace' }, leff), { thetaRad: th, phiRad: ph }).resistanceOhm;
      expect(Math.abs(rs / rc - 1)).toBeLessThan(1e-5);
    }
  });
  it('grating lobes add their modes: a 1.2λ triangular lattice at broadside radiates the main beam and six lobes (first reciprocal ring 0.962k < k)', () => {
    const big = { lattice: triangularLattice(1.2 * LAMBDA), backing: { kind: 'freeSpace' } as const, frequencyHz: F };
    const r = currentSheetScanResistance(big, { thetaRad: 0, phiRad: 0 });
    expect(r.modeResistanceOhm.length).toBe(7);
    expect(r.resistanceOhm).toBeCloseTo(r.modeResistanceOhm.reduce((a, b) => a + b, 0), 12);
    expect(() => currentSheetScanResistance(big, { thetaRad: Math.PI / 2, phiRad: 0 })).toThrow(DomainError);
    expect(() => currentSheetScanResistance({ ...big, effectiveLengthM: 0 }, { thetaRad: 0, phiRad: 0 })).toThrow(DomainError);
  });
});
