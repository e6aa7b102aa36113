import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import slab from './fixtures/slab_modes.json';
import { DimensionError, DomainError } from '../../src/errors.js';
import { fromRows } from '../../src/linalg/cmatrix.js';
import { rectangularLattice } from '../../src/geometry/lattice.js';
import { infiniteDipoleArray } from '../../src/floquet/infiniteDipoleArray.js';
import { findScanBlindness } from '../../src/floquet/scanBlindness.js';
import { groundedSlabSurfaceWaves, phaseMatchedScanAngles } from '../../src/floquet/surfaceWaves.js';
import { finiteArrayActiveImpedances, finiteArrayActiveReflections } from '../../src/floquet/finiteArray.js';
import { C0_M_PER_S } from '../../src/units/constants.js';

const F = 1e9;
const LAMBDA = C0_M_PER_S / F;
const K = (2 * Math.PI) / LAMBDA;

describe('grounded-slab surface waves', () => {
  // Reference: scipy brentq on the same dispersion equations solved for β (fixtures/generate_slab_modes.py).
  for (const c of slab.cases) {
    it(`εr = ${c.relativePermittivity}, t = ${c.thicknessOverLambda}λ matches scipy to 1e-12`, () => {
      const sw = groundedSlabSurfaceWaves(c.relativePermittivity, c.thicknessOverLambda * LAMBDA, F);
      const tm = sw.filter((s) => s.kind === 'TM').map((s) => s.betaRadPerM / K);
      const te = sw.filter((s) => s.kind === 'TE').map((s) => s.betaRadPerM / K);
      expect(tm).toHaveLength(c.betaOverK0.TM.length);
      expect(te).toHaveLength(c.betaOverK0.TE.length);
      tm.forEach((b, i) => expect(Math.abs(b - c.betaOverK0.TM[i])).toBeLessThan(1e-12));
      te.forEach((b, i) => expect(Math.abs(b - c.betaOverK0.TE[i])).toBeLessThan(1e-12));
      expect(sw[0].name).toBe('TM0');
    });
  }
  it('TE1 cut-off at t = λ/(4√(εr − 1)) (Pozar, Microwave Engineering, 4th ed. 2012, §3.6, from memory)', () => {
    const tc = LAMBDA / (4 * Math.sqrt(4 - 1));
    expect(groundedSlabSurfaceWaves(4, tc * 0.999, F).some((s) => s.name === 'TE1')).toBe(false);
    expect(groundedSlabSurfaceWaves(4, tc * 1.01, F).some((s) => s.name === 'TE1')).toBe(true);
  });
  it('bad input: εr < 1, non-positive thickness', () => {
    expect(() => groundedSlabSurfaceWaves(0.5, 1e-3, F)).toThrow(DomainError);
    expect(() => groundedSlabSurfaceWaves(2, 0, F)).toThrow(DomainError);
    expect(() => groundedSlabSurfaceWaves(2, -1, F)).toThrow(DomainError);
  });
});

/** Blindness search for 0.3λ × 0.01λ dipoles in λ/2 cells on a grounded slab (εr, t/λ), 1° grid. */
function printedBlindness(er: number, tOverLambda: number, phiRad: number) {
  const arr = infiniteDipoleArray({
    lattice: rectangularLattice(0.5 * LAMBDA, 0.5 * LAMBDA),
    element: { lengthM: 0.3 * LAMBDA, widthM: 0.01 * LAMBDA },
    backing: { kind: 'groundedSlab', relativePermittivity: er, thicknessM: tOverLambda * LAMBDA },
    frequencyHz: F,
    relativeTolerance: 1e-4,
  });
  return findScanBlindness(arr, phiRad, { stepRad: (1 * Math.PI) / 180, thetaMaxRad: (85 * Math.PI) / 180 });
}

describe('scan blindness of printed dipoles (Pozar & Schaubert, IEEE Trans. Antennas Propag. 32(6), 1984, for the phenomenon)', () => {
  it('E-plane blindness (εr = 12.8, t = 0.06λ, a = b = λ/2) at the TM0 phase-matching angle within 1°', () => {
    const r = printedBlindness(12.8, 0.06, 0);
    expect(r.blindAngles).toHaveLength(1);
    const pred = r.predictions.find((p) => p.surfaceWave === 'TM0' && p.n === 0)!;
    expect(Math.abs(r.blindAngles[0].thetaRad - pred.thetaRad)).toBeLessThan(Math.PI / 180);
    expect(r.blindAngles[0].reflectionMagnitude).toBeGreaterThan(0.999);
    // Embedded element gain collapses (ideal 4πA cosθ/λ² ≈ 2.2 at this angle).
    expect(r.blindAngles[0].embeddedGain).toBeLessThan(1e-3);
  });
  it('H-plane blindness from TE1 (εr = 4, t = 0.2λ) at its phase-matching angle; TM0 (0, ±1) does not couple to x-dipoles', () => {
    const r = printedBlindness(4, 0.2, Math.PI / 2);
    expect(r.blindAngles).toHaveLength(1);
    const te1 = r.predictions.find((p) => p.surfaceWave === 'TE1')!;
    expect(Math.abs(r.blindAngles[0].thetaRad - te1.thetaRad)).toBeLessThan(Math.PI / 180);
  });
  it('phase matching in the E-plane: sinθ = λ/a − β/k₀ for the (−1, 0) mode', () => {
    const sw = groundedSlabSurfaceWaves(2.55, 0.1 * LAMBDA, F);
    const p = phaseMatchedScanAngles(rectangularLattice(0.5 * LAMBDA, 0.5 * LAMBDA), F, 0, sw);
    const e = p.find((x) => x.m === -1 && x.n === 0)!;
    expect(Math.sin(e.thetaRad)).toBeCloseTo(2 - sw[0].betaRadPerM / K, 12);
  });
});

describe('finite arrays: active impedance and reflection', () => {
  const z = fromRows([
    [new Complex(73, 42), new Complex(-12, -29), new Complex(4, 18)],
    [new Complex(-12, -29), new Complex(73, 42), new Complex(-12, -29)],
    [new Complex(4, 18), new Complex(-12, -29), new Complex(73, 42)],
  ]);
  it('uniform excitation of a symmetric 3-element array: centre Z11 + 2 Z12, edges Z11 + Z12 + Z13 (V = Z I)', () => {
    const za = finiteArrayActiveImpedances(z, fromRows([[1], [1], [1]]));
    expect(za.data[2]).toBeCloseTo(73 - 24, 12);
    expect(za.data[3]).toBeCloseTo(42 - 58, 12);
    expect(za.data[0]).toBeCloseTo(73 - 12 + 4, 12);
    expect(za.data[1]).toBeCloseTo(42 - 29 + 18, 12);
  });
  it('Γ = (Z_a − Z₀*)/(Z_a + Z₀) and passivity |Γ| < 1 for Re Z_a > 0 (Kurokawa 1965)', () => {
    const I = fromRows([[new Complex(1, 0)], [new Complex(0, 1)], [new Complex(-1, 0)]]);
    const za = finiteArrayActiveImpedances(z, I);
    const g = finiteArrayActiveReflections(z, I, new Complex(50, 10));
    for (let n = 0; n < 3; n++) {
      const zn = new Complex(za.data[2 * n], za.data[2 * n + 1]);
      const expected = zn.sub(new Complex(50, -10)).div(zn.add(new Complex(50, 10)));
      expect(Math.abs(g.data[2 * n] - expected.re)).toBeLessThan(1e-14);
      expect(Math.abs(g.data[2 * n + 1] - expected.im)).toBeLessThan(1e-14);
      if (zn.re > 0) expect(expected.abs()).toBeLessThan(1);
    }
  });
  it('bad input: shape mismatch, zero current, non-positive reference resistance', () => {
    expect(() => finiteArrayActiveImpedances(z, fromRows([[1], [1]]))).toThrow(DimensionError);
    expect(() => finiteArrayActiveImpedances(z, fromRows([[1], [0], [1]]))).toThrow(DomainError);
    expect(() => finiteArrayActiveReflections(z, fromRows([[1], [1], [1]]), 0)).toThrow(DomainError);
  });
});
