import { describe, it, expect } from 'vitest';
import {
  wireDipoleRadiationResistance, hertzianRadiationResistance, wireDipoleRadiation, hertzianDipoleRadiation,
  isotropicRadiation, radiationResistanceMatrix, dipoleEmbeddedPatterns, dipoleArrayImpedanceMatrix,
  dipoleSelfImpedance, wireDipoleFarField, hertzianDipoleFarField, isotropicFarField,
} from '../../src/element/index.js';
import type { WireDipole } from '../../src/element/index.js';
import type { Vector3 } from '../../src/geometry/layout.js';
import { sphereQuadrature, sphereQuadratureOrder } from '../../src/geometry/quadrature.js';
import { add } from '../../src/linalg/ops.js';
import { DomainError } from '../../src/errors.js';
import { ETA0_OHM } from '../../src/units/constants.js';

const F = 299792458; // λ = 1 m
const K = 2 * Math.PI;
const dip = (centerM: Vector3, axis: Vector3 = [0, 0, 1], lengthM = 0.5, radiusM = 1e-6): WireDipole => ({ centerM, axis, lengthM, radiusM });
const rel = (a: number, b: number) => Math.abs(a - b) / Math.abs(b);

describe('radiation resistance and directivity', () => {
  it('Hertzian: R = 80π²(L/λ)² (η = 120π) and D = 1.5', () => {
    // Balanis, Antenna Theory, 4th ed., 2016, eq. (4-19) and (4-31) (from memory); with η0 the factor is (2π/3)η0.
    const L = 0.01;
    expect(rel(hertzianRadiationResistance(L, F), 80 * Math.PI ** 2 * L ** 2 * (ETA0_OHM / (120 * Math.PI)))).toBeLessThan(1e-14);
    const p = hertzianDipoleRadiation({ centerM: [0, 0, 0], axis: [0, 0, 1], lengthM: L }, F);
    expect(rel(p.directivity, 1.5)).toBeLessThan(1e-6); // L = 0.01λ point-limit vs exact uniform pattern peak: O((kL)²/24)
    expect(Math.abs(p.peakThetaRad - Math.PI / 2)).toBeLessThan(1e-6);
    // quadrature of the exact uniform-current field: differs from the point form by O((kL)²) ≈ 4e-3 · 1/10
    const q = hertzianDipoleRadiation({ centerM: [0, 0, 0], axis: [0, 0, 1], lengthM: L }, F, { method: 'quadrature' });
    expect(rel(q.radiationResistanceOhm, p.radiationResistanceOhm)).toBeLessThan((K * L) ** 2 / 10);
    expect(rel(q.effectiveAreaM2, (1.5 * 1) / (4 * Math.PI))).toBeLessThan(1e-3); // A_e = 3λ²/8π
  });
  it('half-wave dipole: R = 73.08 Ω, D = 1.64 (2.15 dBi), closed form = quadrature', () => {
    // Balanis, Antenna Theory, 4th ed., 2016, §4.6.3 (from memory): R_r = 73 Ω, D0 = 1.643 (η = 120π); with η0, D = η0/(π R) = 1.6409.
    const d = dip([0.3, -0.2, 0.1], [0.2, 0.5, 1]);
    const a = wireDipoleRadiation(d, F);
    const b = wireDipoleRadiation(d, F, { method: 'quadrature' });
    expect(Math.abs(a.radiationResistanceOhm - 73.08)).toBeLessThan(0.005);
    expect(rel(b.radiationResistanceOhm, a.radiationResistanceOhm)).toBeLessThan(1e-12);
    expect(Math.abs(a.directivity - 1.64)).toBeLessThan(0.002);
    expect(rel(a.directivity, ETA0_OHM / (Math.PI * a.radiationResistanceOhm))).toBeLessThan(1e-10);
    expect(Math.abs(a.directivityDbi - 2.15)).toBeLessThan(0.005);
  });
  it('closed form equals the induced-EMF self resistance (a → 0) and quadrature for several lengths', () => {
    for (const l of [0.1, 0.3, 0.75, 1.25, 1.5]) {
      const r = wireDipoleRadiationResistance(l, F);
      expect(rel(dipoleSelfImpedance(l, 1e-7, F).re, r)).toBeLessThan(1e-9);
      const q = wireDipoleRadiation(dip([0, 0, 0], [1, 0, 0], l), F, { method: 'quadrature' });
      expect(rel(q.radiationResistanceOhm, r)).toBeLessThan(1e-11);
    }
  });
  it('over a ground plane: closed form (image coupling) = quadrature; horizontal and vertical', () => {
    for (const [axis, h] of [[[1, 0, 0], 0.25], [[0, 1, 0], 0.6], [[0, 0, 1], 0.4], [[1, 0, 1], 0.7]] as [Vector3, number][]) {
      const d = dip([0.1, 0.2, h], axis);
      const a = wireDipoleRadiation(d, F, { groundPlane: { zM: 0 } });
      const b = wireDipoleRadiation(d, F, { groundPlane: { zM: 0 }, method: 'quadrature' });
      expect(rel(b.radiationResistanceOhm, a.radiationResistanceOhm)).toBeLessThan(1e-10);
      expect(a.peakThetaRad).toBeLessThanOrEqual(Math.PI / 2);
    }
    // horizontal λ/2 dipole λ/4 above ground: broadside gain ≈ 7.5 dBi? use the identity D = 4π|f|²/(ηR) at zenith with |f| = |2 sin(kh)|·η/2π
    const hz = wireDipoleRadiation(dip([0, 0, 0.25], [1, 0, 0]), F, { groundPlane: { zM: 0 } });
    const fz = 2 * ETA0_OHM / (2 * Math.PI);
    expect(rel(hz.directivity, (4 * Math.PI * fz * fz) / (ETA0_OHM * hz.radiationResistanceOhm))).toBeLessThan(1e-9);
    expect(Math.abs(hz.peakThetaRad)).toBeLessThan(1e-5);
    // Hertzian over ground: closed form (spherical Bessel) vs quadrature
    const e = { centerM: [0, 0, 0.3] as Vector3, axis: [1, 0, 0.5] as Vector3, lengthM: 0.002 };
    const c1 = hertzianDipoleRadiation(e, F, { groundPlane: { zM: 0 } });
    const c2 = hertzianDipoleRadiation(e, F, { groundPlane: { zM: 0 }, method: 'quadrature' });
    expect(rel(c2.radiationResistanceOhm, c1.radiationResistanceOhm)).toBeLessThan((K * 0.002) ** 2 / 5);
  });
  it('isotropic teaching radiator: D = 1, A_e = λ²/4π, |f|² = ηR/4π', () => {
    const p = isotropicRadiation({ centerM: [0, 0, 0], radiationResistanceOhm: 50 }, F);
    expect(p.directivity).toBeCloseTo(1, 14);
    expect(p.effectiveAreaM2).toBeCloseTo(1 / (4 * Math.PI), 14);
    const f = isotropicFarField({ centerM: [1, 0, 0], radiationResistanceOhm: 50 }, F, [0.3], [0.2]);
    expect(Math.hypot(f.thetaComponentV.data[0], f.thetaComponentV.data[1]) ** 2).toBeCloseTo((ETA0_OHM * 50) / (4 * Math.PI), 9);
    expect(() => isotropicFarField({ centerM: [0, 0, 0], radiationResistanceOhm: 50 }, F, [0], [0], { groundPlane: { zM: 0 } })).toThrow(DomainError);
  });
  it('far-field sign: z-dipole gives f_θ = +jη/2π at broadside for 1 A (e^{+jωt})', () => {
    // Balanis (4-62a) (from memory) with I_m = I₀: E_θ = jη I₀ e^{−jkr}/(2πr) · [cos(π/2 cosθ)]/sinθ
    const f = wireDipoleFarField(dip([0, 0, 0]), F, [Math.PI / 2], [0.7]);
    expect(f.thetaComponentV.data[0]).toBeCloseTo(0, 12);
    expect(f.thetaComponentV.data[1]).toBeCloseTo(ETA0_OHM / (2 * Math.PI), 10);
    const h = hertzianDipoleFarField({ centerM: [0, 0, 0], axis: [0, 0, 1], lengthM: 1e-4 }, F, [Math.PI / 2], [0]);
    expect(rel(h.thetaComponentV.data[1], (ETA0_OHM * K * 1e-4) / (4 * Math.PI))).toBeLessThan(1e-8);
    expect(() => wireDipoleFarField(dip([0, 0, 0], [0, 0, 1], 0), F, [0], [0])).toThrow(/zero-length/);
    expect(() => wireDipoleFarField(dip([0, 0, 0]), F, [0, 1], [0])).toThrow(DomainError);
    expect(() => wireDipoleFarField(dip([0, 0, 0]), F, [NaN], [0])).toThrow(DomainError);
  });
});

describe('Twiss identity: Re Z (induced EMF) = (1/(η|I₀|²))∮ fₘ·fₙ* dΩ (sphere quadrature)', () => {
  // DESIGN thermal-noise and brightness rows: in an isotropic bath the brightness integral
  // 4k_B B T/(η|I₀|²)∮ fₘ·fₙ* dΩ must equal 2k_B T B (Z + Zᴴ) = 4 k_B T B Re Z (Twiss 1955).
  const rule = (extentM: number, lengthM: number) => {
    const o = sphereQuadratureOrder(K * extentM, { tolerance: 1e-14, extraDegree: Math.ceil(2 * K * lengthM) + 8 });
    return sphereQuadrature(o.thetaCount, o.phiCount);
  };
  const maxRel = (a: Float64Array, b: Float64Array, n: number) => {
    let peak = 0, err = 0;
    for (let i = 0; i < n * n; i++) { peak = Math.max(peak, Math.abs(b[2 * i])); err = Math.max(err, Math.abs(a[2 * i] - b[2 * i]), Math.abs(a[2 * i + 1])); }
    return err / peak;
  };
  it('free space: mixed lengths and orientations', () => {
    const ds = [dip([0, 0, 0]), dip([0.5, 0, 0]), dip([0, 0.45, 0.1], [1, 0, 0], 0.4), dip([0.7, 0.6, -0.2], [1, 1, 1], 0.6), dip([-0.4, 0.2, 0.3], [0, 1, 0.2], 0.3)];
    const z = dipoleArrayImpedanceMatrix(ds, F);
    const q = rule(2.5, 0.6);
    const set = dipoleEmbeddedPatterns(ds, F, q.thetaRad, q.phiRad, { driveCurrentA: 2 });
    const r = radiationResistanceMatrix(set, q.weights);
    expect(maxRel(r.data, z.data, ds.length)).toBeLessThan(1e-9);
  });
  it('over a ground plane: the upper-hemisphere integral as ½ the dipole-plus-image integral', () => {
    const ds = [dip([0, 0, 0.25], [1, 0, 0]), dip([0, 0.5, 0.25], [1, 0, 0]), dip([0.6, 0, 0.3], [0, 1, 0]), dip([0.4, 0.4, 0.5], [0, 0, 1], 0.45)];
    const z = dipoleArrayImpedanceMatrix(ds, F, { groundPlane: { zM: 0 } });
    const images = ds.map((d) => dip([d.centerM[0], d.centerM[1], -d.centerM[2]], [-d.axis[0], -d.axis[1], d.axis[2]], d.lengthM));
    const q = rule(2.5, 0.5);
    const a = dipoleEmbeddedPatterns(ds, F, q.thetaRad, q.phiRad);
    const b = dipoleEmbeddedPatterns(images, F, q.thetaRad, q.phiRad);
    const both = { ...a, thetaComponentV: add(a.thetaComponentV, b.thetaComponentV), phiComponentV: add(a.phiComponentV, b.phiComponentV) };
    const r = radiationResistanceMatrix(both, q.weights);
    const half = Float64Array.from(r.data, (v) => v / 2);
    expect(maxRel(half, z.data, ds.length)).toBeLessThan(1e-9);
  });
  it('over a ground plane, directly from the zeroed patterns with an even θ count (no node on the horizon)', () => {
    const ds = [dip([0, 0, 0.25], [1, 0, 0]), dip([0.6, 0, 0.3], [0, 1, 0]), dip([0.4, 0.4, 0.5], [0, 0, 1], 0.45)];
    const z = dipoleArrayImpedanceMatrix(ds, F, { groundPlane: { zM: 0 } });
    const o = sphereQuadratureOrder(K * 2.5, { tolerance: 1e-14, extraDegree: 12 });
    const q = sphereQuadrature(o.thetaCount + (o.thetaCount % 2), o.phiCount);
    const set = dipoleEmbeddedPatterns(ds, F, q.thetaRad, q.phiRad, { groundPlane: { zM: 0 } });
    expect(maxRel(radiationResistanceMatrix(set, q.weights).data, z.data, ds.length)).toBeLessThan(1e-9);
  });
});
