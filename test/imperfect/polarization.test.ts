import { describe, it, expect } from 'vitest';
import { hertzianDipolePorts } from '../../src/reception/index.js';
import { columnVector } from '../../src/linalg/index.js';
import { DomainError } from '../../src/errors.js';
import { beamJonesMatrices, intrinsicCrossPolarizationRatio, jonesCrossPolarRatios } from '../../src/imperfect/index.js';

const F = 1e9;
// ideal crossed pair: x- and y-directed point dipoles at the origin, one port each
const ports = hertzianDipolePorts([{ centerM: [0, 0, 0], axis: [1, 0, 0], lengthM: 0.01 }, { centerM: [0, 0, 0], axis: [0, 1, 0], lengthM: 0.01 }], F);
const th = Float64Array.of(0, 0.2, 0.5, 0.9, 1.2, 0.5, 0.9);
const ph = Float64Array.of(0, 0, 0.3, 1.1, 2.5, 4.0, 5.5);
const J = beamJonesMatrices(ports.patterns, columnVector([1, 0]), columnVector([0, 1]), th, ph);

/** 2×2 complex product A·B on 8-value interleaved matrices. */
function mul(a: ArrayLike<number>, b: ArrayLike<number>): Float64Array {
  const out = new Float64Array(8);
  for (let r = 0; r < 2; r++) for (let c = 0; c < 2; c++) for (let t = 0; t < 2; t++) {
    const xr = a[4 * r + 2 * t], xi = a[4 * r + 2 * t + 1], yr = b[4 * t + 2 * c], yi = b[4 * t + 2 * c + 1];
    out[4 * r + 2 * c] += xr * yr - xi * yi; out[4 * r + 2 * c + 1] += xr * yi + xi * yr;
  }
  return out;
}
const applyLeft = (c: ArrayLike<number>, jones: Float64Array): Float64Array => {
  const out = new Float64Array(jones.length);
  for (let k = 0; k < jones.length / 8; k++) out.set(mul(c, jones.subarray(8 * k, 8 * k + 8)), 8 * k);
  return out;
};

describe('intrinsic cross-polarisation ratio (Carozzi & Woan 2011, from memory)', () => {
  it('ideal crossed dipoles: infinite at broadside, ((1 + cos θ)/(1 − cos θ))² off axis (projection: singular values cos θ and 1)', () => {
    const ixr = intrinsicCrossPolarizationRatio(J.jones);
    expect(ixr[0]).toBe(Infinity);
    for (let k = 1; k < th.length; k++) {
      const c = Math.cos(th[k]);
      expect(ixr[k] / ((1 + c) / (1 - c)) ** 2 - 1).toBeLessThan(1e-9);
      expect(1 - ixr[k] / ((1 + c) / (1 - c)) ** 2).toBeLessThan(1e-9);
    }
  });
  it('unchanged by a scalar and unitary transforms (condition number); the calibrated IXR is unchanged by any invertible 2×2 on the output', () => {
    // a non-ideal pair: slightly rotated second dipole and unequal gains
    const p2 = hertzianDipolePorts([{ centerM: [0, 0, 0], axis: [1, 0, 0], lengthM: 0.01 }, { centerM: [0, 0, 0], axis: [0.15, 1, 0.05], lengthM: 0.012 }], F);
    const jn = beamJonesMatrices(p2.patterns, columnVector([1, 0]), columnVector([0.2, { re: 0.9, im: 0.3 }]), th, ph).jones;
    const raw = intrinsicCrossPolarizationRatio(jn);
    const a = 0.7, b = 0.4, ph1 = 0.9; // unitary U = e^{jφ}[[a, −b*],[b, a*]] with |a|² + |b|² = 1 after scaling
    const nrm = Math.hypot(a, b);
    const U = [Math.cos(ph1) * a / nrm, Math.sin(ph1) * a / nrm, -Math.cos(ph1) * b / nrm, -Math.sin(ph1) * b / nrm, Math.cos(ph1) * b / nrm, Math.sin(ph1) * b / nrm, Math.cos(ph1) * a / nrm, Math.sin(ph1) * a / nrm];
    const scaled = applyLeft(U, jn).map((v) => 3.5 * v);
    const u = intrinsicCrossPolarizationRatio(Float64Array.from(scaled));
    for (let k = 0; k < th.length; k++) expect(Math.abs(u[k] / raw[k] - 1)).toBeLessThan(1e-9);
    const C = [1.3, 0.2, -0.4, 0.1, 0.25, -0.6, 0.8, 0.35]; // a general invertible calibration
    const cal = intrinsicCrossPolarizationRatio(jn, 2), cal2 = intrinsicCrossPolarizationRatio(applyLeft(C, jn), 2);
    expect(cal[2]).toBe(Infinity);
    for (let k = 0; k < th.length; k++) if (k !== 2) expect(Math.abs(cal2[k] / cal[k] - 1)).toBeLessThan(1e-8);
    // the raw IXR is not invariant under a non-unitary C (so the calibrated form is the one to quote after calibration)
    const rawC = intrinsicCrossPolarizationRatio(applyLeft(C, jn));
    expect(Math.abs(rawC[3] / raw[3] - 1)).toBeGreaterThan(1e-3);
  });
  it('Ludwig-3 cross-polar ratio of the x dipole: ((1 − cos θ) sin φ cos φ)² / (cos θ cos²φ + sin²φ)² (projection of x̂ on the Ludwig-3 basis)', () => {
    const r = jonesCrossPolarRatios(J.jones);
    for (let k = 0; k < th.length; k++) {
      const c = Math.cos(th[k]), s = Math.sin(ph[k]), co = Math.cos(ph[k]);
      const expected = ((1 - c) * s * co) ** 2 / (c * co * co + s * s) ** 2;
      expect(Math.abs(r.x[k] - expected)).toBeLessThan(1e-12 + 1e-9 * expected);
    }
  });
  it('bad input', () => {
    expect(() => intrinsicCrossPolarizationRatio(new Float64Array(7))).toThrow();
    expect(() => intrinsicCrossPolarizationRatio(new Float64Array(8), 0)).toThrow(DomainError);
  });
});
