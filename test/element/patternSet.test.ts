import { describe, it, expect } from 'vitest';
import {
  wireDipoleFarField, dipoleMutualImpedance, dipoleArrayImpedanceMatrix, dipoleEmbeddedPatterns,
  convertPatternExcitation, ludwig3Components, translatePhaseReference, patternInterpolator, rotatePatternSet,
  embeddedPatternSet, dipoleArrayFarFields,
} from '../../src/element/index.js';
import type { WireDipole } from '../../src/element/index.js';
import type { Vector3 } from '../../src/geometry/layout.js';
import { DimensionError, DomainError } from '../../src/errors.js';
import { ETA0_OHM } from '../../src/units/constants.js';
import { fromRows } from '../../src/linalg/cmatrix.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const F = 299792458; // λ = 1 m
const K = 2 * Math.PI;
const dip = (centerM: Vector3, axis: Vector3 = [0, 0, 1], lengthM = 0.5): WireDipole => ({ centerM, axis, lengthM, radiusM: 1e-5 });
const deg = (d: number) => (d * Math.PI) / 180;
const grid = (stepDeg: number) => {
  const th = Float64Array.from({ length: Math.round(180 / stepDeg) + 1 }, (_, i) => deg(i * stepDeg));
  const ph = Float64Array.from({ length: Math.round(360 / stepDeg) }, (_, i) => deg(i * stepDeg));
  return { th, ph };
};

/** Cartesian complex vector [xr, xi, yr, yi, zr, zi] of a θ/φ pair at (θ, φ). */
function cart(tr: number, ti: number, pr: number, pi: number, th: number, ph: number): number[] {
  const ct = Math.cos(th), st = Math.sin(th), cp = Math.cos(ph), sp = Math.sin(ph);
  return [tr * ct * cp - pr * sp, ti * ct * cp - pi * sp, tr * ct * sp + pr * cp, ti * ct * sp + pi * cp, -tr * st, -ti * st];
}

describe('reception row of DESIGN: far-zone pair gives v₂ = Z₂₁ I₁', () => {
  // Identity: reciprocity between the induced-EMF Z₂₁ and the reception formula
  // vₙ = −j(4π/(ηkI₀)) fₙ(r̂)·E_inc with E_inc referred to the origin.
  const cases: { rx: (R: number) => WireDipole; dir: Vector3 }[] = [
    { rx: (R) => dip([R, 0, 0]), dir: [1, 0, 0] },
    { rx: (R) => dip([R * 0.6, R * 0.48, R * 0.64], [0.3, -0.2, 1], 0.4), dir: [0.6, 0.48, 0.64] },
  ];
  for (const [ci, c] of cases.entries()) {
    it(`case ${ci}: error falls like 1/(kR) and is below 5/(kR)`, () => {
      const errs: number[] = [];
      for (const R of [50, 400]) {
        const tx = dip([0, 0, 0], [0.1, 0.2, 1], 0.5);
        const rx = c.rx(R);
        const [ux, uy, uz] = c.dir;
        const th = Math.acos(uz), ph = Math.atan2(uy, ux);
        const i1 = 0.7;
        const e = wireDipoleFarField(tx, F, [th], [ph], { driveCurrentA: i1 });
        const E = cart(e.thetaComponentV.data[0], e.thetaComponentV.data[1], e.phiComponentV.data[0], e.phiComponentV.data[1], th, ph);
        // field at the receiver, then referred to the origin along the arrival direction −r̂₀: × e^{−jkR}/R × e^{+jkR}
        const eOrigin = E.map((v) => v / R);
        const f2 = wireDipoleFarField(rx, F, [Math.PI - th], [ph + Math.PI]);
        const fv = cart(f2.thetaComponentV.data[0], f2.thetaComponentV.data[1], f2.phiComponentV.data[0], f2.phiComponentV.data[1], Math.PI - th, ph + Math.PI);
        let dr = 0, di = 0;
        for (let a = 0; a < 6; a += 2) { dr += fv[a] * eOrigin[a] - fv[a + 1] * eOrigin[a + 1]; di += fv[a] * eOrigin[a + 1] + fv[a + 1] * eOrigin[a]; }
        const s = (4 * Math.PI) / (ETA0_OHM * K * 1); // I₀ = 1 A for f₂
        const vr = s * di, vi = -s * dr; // −j s (dr + j di)
        const z = dipoleMutualImpedance(tx, rx, F);
        const err = Math.hypot(vr - z.re * i1, vi - z.im * i1) / (Math.hypot(z.re, z.im) * i1);
        expect(err).toBeLessThan(5 / (K * R)); // near-zone terms: relative size O(1/(kR))
        errs.push(err);
      }
      expect(errs[1]).toBeLessThan(errs[0] / 7); // 8× farther → ~8× smaller (near-field terms ∝ 1/(kR))
    });
  }
});

describe('dipoleEmbeddedPatterns and interpolation', () => {
  const ds = [dip([0, 0, 0]), dip([0.6, 0, 0]), dip([0, 0.7, 0.2], [1, 0, 0]), dip([-0.5, 0.3, 0], [1, 1, 0], 0.45)];
  it('single-mode constructor equals the isolated patterns with position phase', () => {
    const { th, ph } = grid(15);
    const set = dipoleEmbeddedPatterns(ds, F, th, ph);
    const nt = th.length;
    const t = Array.from(ph).flatMap((p) => Array.from(th).map((x) => [x, p]));
    for (let n = 0; n < ds.length; n++) {
      const f = wireDipoleFarField(ds[n], F, t.map((v) => v[0]), t.map((v) => v[1]));
      for (let c = 0; c < t.length; c++) {
        expect(set.thetaComponentV.data[2 * (n * t.length + c)]).toBeCloseTo(f.thetaComponentV.data[2 * c], 12);
        expect(set.phiComponentV.data[2 * (n * t.length + c) + 1]).toBeCloseTo(f.phiComponentV.data[2 * c + 1], 12);
      }
    }
    expect(nt).toBe(13);
    // the direction-list form gives the same numbers
    const direct = dipoleArrayFarFields(ds, F, t.map((v) => v[0]), t.map((v) => v[1]));
    expectCMatrixClose(direct.thetaComponentV, set.thetaComponentV, { rtol: 1e-15 });
    expectCMatrixClose(direct.phiComponentV, set.phiComponentV, { rtol: 1e-15 });
  });
  for (const [stepDeg, bound] of [[5, 3e-5], [2.5, 2e-6]] as const) {
    it(`cubic interpolation on a ${stepDeg}° grid: max error ≤ ${bound} of the peak (measured)`, () => {
      const { th, ph } = grid(stepDeg);
      const set = dipoleEmbeddedPatterns(ds, F, th, ph);
      const interp = patternInterpolator(set);
      const m = 2000;
      const rnd = (i: number) => ((Math.sin(i * 12.9898) * 43758.5453) % 1 + 1) % 1;
      const tq = Float64Array.from({ length: m }, (_, i) => Math.acos(1 - 2 * rnd(i)));
      const pq = Float64Array.from({ length: m }, (_, i) => 2 * Math.PI * rnd(i + 7777));
      const got = interp.evaluate(tq, pq);
      let maxErr = 0, peak = 0;
      for (let n = 0; n < ds.length; n++) {
        const f = wireDipoleFarField(ds[n], F, tq, pq);
        for (let c = 0; c < m; c++) {
          const o = 2 * (n * m + c);
          peak = Math.max(peak, Math.hypot(f.thetaComponentV.data[2 * c], f.thetaComponentV.data[2 * c + 1], f.phiComponentV.data[2 * c], f.phiComponentV.data[2 * c + 1]));
          maxErr = Math.max(maxErr, Math.hypot(got.thetaComponentV.data[o] - f.thetaComponentV.data[2 * c], got.thetaComponentV.data[o + 1] - f.thetaComponentV.data[2 * c + 1],
            got.phiComponentV.data[o] - f.phiComponentV.data[2 * c], got.phiComponentV.data[o + 1] - f.phiComponentV.data[2 * c + 1]));
        }
      }
      expect(maxErr / peak).toBeLessThan(bound);
    });
  }
  it('interpolation reproduces grid samples exactly and rejects θ outside the grid', () => {
    const th = Float64Array.from([0, 0.5, 1, 1.5]);
    const { ph } = grid(30);
    const set = dipoleEmbeddedPatterns(ds, F, th, ph);
    const it2 = patternInterpolator(set);
    const g = it2.evaluate([1, 1], [ph[3], ph[5]]);
    const m = th.length * ph.length;
    expect(g.thetaComponentV.data[0]).toBeCloseTo(set.thetaComponentV.data[2 * (3 * th.length + 2)], 12);
    expect(g.phiComponentV.data[2 * (2 * 2 + 1) + 1]).toBeCloseTo(set.phiComponentV.data[2 * (2 * m + 5 * th.length + 2) + 1], 12);
    expect(() => it2.evaluate([2], [0])).toThrow(DomainError);
  });
  it('rotation by 90° about y turns a z-dipole pattern into an x-dipole pattern', () => {
    const { th, ph } = grid(2.5);
    const set = dipoleEmbeddedPatterns([dip([0, 0, 0.3])], F, th, ph);
    // Q = rotation about +y by +90°: z → x, x → −z
    const rot = rotatePatternSet(set, [0, 0, 1, 0, 1, 0, -1, 0, 0]);
    const ref = dipoleEmbeddedPatterns([dip([0.3, 0, 0], [1, 0, 0])], F, th, ph);
    expectCMatrixClose(rot.thetaComponentV, ref.thetaComponentV, { rtol: 1e-5 });
    expectCMatrixClose(rot.phiComponentV, ref.phiComponentV, { rtol: 1e-5, atol: 1e-5 * 60 });
    expect(() => rotatePatternSet(set, [1, 0, 0, 0, 1, 0, 0, 0, -1])).toThrow(/determinant/);
  });
});

describe('excitation conventions, Ludwig-3, translation', () => {
  const ds = [dip([0, 0, 0]), dip([0.3, 0, 0]), dip([0.6, 0.1, 0])];
  const { th, ph } = grid(30);
  const oc = dipoleEmbeddedPatterns(ds, F, th, ph);
  const z = dipoleArrayImpedanceMatrix(ds, F);
  it('open → short → loaded → open round trip', () => {
    const sc = convertPatternExcitation(oc, z, { kind: 'short-circuit-voltage', driveVoltageV: 2 });
    const loads = fromRows([[50], [{ re: 73, im: -42 }], [100]]);
    const ld = convertPatternExcitation(sc, z, { kind: 'loaded-voltage', driveVoltageV: 1, loadOhm: loads });
    const back = convertPatternExcitation(ld, z, { kind: 'open-circuit-current', driveCurrentA: 1 });
    expectCMatrixClose(back.thetaComponentV, oc.thetaComponentV, { rtol: 1e-12 });
    expectCMatrixClose(back.phiComponentV, oc.phiComponentV, { rtol: 1e-12, atol: 1e-12 });
  });
  it('a single port: short-circuit pattern = (V₀/Z₁₁) × open-circuit pattern (Ohm\'s law)', () => {
    const one = dipoleEmbeddedPatterns([ds[0]], F, th, ph);
    const z1 = dipoleArrayImpedanceMatrix([ds[0]], F);
    const sc = convertPatternExcitation(one, z1, { kind: 'short-circuit-voltage', driveVoltageV: 1 });
    const zr = z1.data[0], zi = z1.data[1], d = zr * zr + zi * zi;
    const c = 5; // some column away from the poles
    const fr = one.thetaComponentV.data[2 * c], fi = one.thetaComponentV.data[2 * c + 1];
    expect(sc.thetaComponentV.data[2 * c]).toBeCloseTo((fr * zr + fi * zi) / d, 10);
    expect(sc.thetaComponentV.data[2 * c + 1]).toBeCloseTo((fi * zr - fr * zi) / d, 10);
  });
  it('conversion rejects a wrong-size impedance matrix or load vector', () => {
    expect(() => convertPatternExcitation(oc, fromRows([[1, 0], [0, 1]]), { kind: 'short-circuit-voltage', driveVoltageV: 1 })).toThrow(DimensionError);
    expect(() => convertPatternExcitation(oc, z, { kind: 'loaded-voltage', driveVoltageV: 1, loadOhm: fromRows([[50]]) })).toThrow(DimensionError);
  });
  it('Ludwig-3 at broadside gives the x and y components; x/y references swap', () => {
    const t = fromRows([[{ re: 1, im: 2 }, 3]]), p = fromRows([[{ re: -1, im: 0.5 }, 4]]);
    const phi = [0.3, 1.2];
    const x = ludwig3Components(t, p, phi, 'x'), y = ludwig3Components(t, p, phi, 'y');
    // θ = 0: θ̂ = (cosφ, sinφ, 0), φ̂ = (−sinφ, cosφ, 0); E_x = f_θ cosφ − f_φ sinφ (Ludwig 1973, def. 3)
    expect(x.co.data[0]).toBeCloseTo(Math.cos(0.3) + Math.sin(0.3), 14);
    expect(x.cross.data[2]).toBeCloseTo(3 * Math.sin(1.2) + 4 * Math.cos(1.2), 14);
    expectCMatrixClose(x.co, y.cross);
    expectCMatrixClose(x.cross, y.co);
    // power is preserved
    const pw = (a: number[]) => a.reduce((s, v) => s + v * v, 0);
    expect(pw([...x.co.data, ...x.cross.data])).toBeCloseTo(pw([...t.data, ...p.data]), 12);
  });
  it('translating the phase reference to an element centre removes its position phase', () => {
    const moved = translatePhaseReference(oc, [0.6, 0.1, 0]);
    const alone = dipoleEmbeddedPatterns([dip([0, 0, 0])], F, th, ph);
    const m = th.length * ph.length;
    for (let c = 0; c < m; c++) {
      expect(moved.thetaComponentV.data[2 * (2 * m + c)]).toBeCloseTo(alone.thetaComponentV.data[2 * c], 10);
      expect(moved.thetaComponentV.data[2 * (2 * m + c) + 1]).toBeCloseTo(alone.thetaComponentV.data[2 * c + 1], 10);
    }
    expect(Array.from(moved.phaseCentersM ?? [])).toEqual([-0.6, -0.1, 0, -0.3, -0.1, 0, 0, 0, 0].map((v, i) => (i === 8 || i === 5 || i === 2 ? 0 : v)));
  });
  it('embeddedPatternSet rejects a non-uniform φ grid and a descending θ grid', () => {
    expect(() => embeddedPatternSet({ ...oc, phiRad: Float64Array.from(ph, (v, i) => (i === 3 ? v + 0.01 : v)) })).toThrow(/uniform/);
    expect(() => embeddedPatternSet({ ...oc, thetaRad: Float64Array.from(th).reverse() })).toThrow(/ascending/);
    expect(() => embeddedPatternSet({ ...oc, excitation: { kind: 'open-circuit-current', driveCurrentA: 0 } })).toThrow(DomainError);
  });
});
