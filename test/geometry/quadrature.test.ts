import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { gaussLegendre, sphereQuadrature, sphereQuadratureOrder, sphereQuadratureForLayout, rectangularGridLayout } from '../../src/geometry/index.js';
import { DomainError } from '../../src/errors.js';

const fixture = JSON.parse(readFileSync(new URL('./fixtures/gauss_legendre.json', import.meta.url), 'utf8')) as {
  numpy: string; mpmath: string; rules: Record<string, { nodes: number[]; weights: number[] }>;
};

describe('gaussLegendre', () => {
  it('A&S Table 25.4 closed forms: n = 2 (±1/√3, 1), n = 3 (0, ±√(3/5); 8/9, 5/9)', () => {
    const r2 = gaussLegendre(2);
    expect(r2.nodes[1]).toBeCloseTo(1 / Math.sqrt(3), 15);
    expect(r2.weights[0]).toBeCloseTo(1, 15);
    const r3 = gaussLegendre(3);
    expect(r3.nodes[1]).toBe(0);
    expect(r3.nodes[2]).toBeCloseTo(Math.sqrt(0.6), 15);
    expect(r3.weights[1]).toBeCloseTo(8 / 9, 15);
    expect(r3.weights[0]).toBeCloseTo(5 / 9, 15);
  });
  it('matches 40-digit mpmath rules (fixture): nodes to 1e-15, weights to the node-rounding limit', () => {
    for (const [n, ref] of Object.entries(fixture.rules)) {
      const r = gaussLegendre(Number(n));
      for (let i = 0; i < ref.nodes.length; i++) {
        expect(Math.abs(r.nodes[i] - ref.nodes[i])).toBeLessThan(1e-15);
        // A node rounded by δx ≈ ε moves the weight by a relative 2|x|δx/(1 − x²) (from the
        // Legendre equation at a root), so the attainable relative accuracy is ~ε/(1 − |x|).
        const tol = 1e-14 + (4 * 2.2e-16) / (1 - Math.abs(ref.nodes[i]));
        expect(Math.abs(r.weights[i] - ref.weights[i])).toBeLessThan(tol * ref.weights[i]);
      }
    }
  });
  it('exact for x^(2n−2) (degree ≤ 2n−1): ∫ x^k = 2/(k+1)', () => {
    const n = 10, r = gaussLegendre(n);
    let s = 0;
    for (let i = 0; i < n; i++) s += r.weights[i] * r.nodes[i] ** 18;
    expect(s).toBeCloseTo(2 / 19, 14);
    expect(() => gaussLegendre(0)).toThrow(DomainError);
  });
});

describe('sphere quadrature', () => {
  it('weights sum to 4π; unit vectors', () => {
    const q = sphereQuadrature(12, 24);
    expect(q.weights.reduce((a, b) => a + b, 0)).toBeCloseTo(4 * Math.PI, 13);
    for (let k = 0; k < q.count; k++) expect(Math.hypot(q.directions[3 * k], q.directions[3 * k + 1], q.directions[3 * k + 2])).toBeCloseTo(1, 14);
  });
  it('chosen order integrates plane waves: ∮ exp(j k d·r̂) dΩ = 4π sin(kd)/(kd) within the stated bound', () => {
    // Plane-wave identity (Rayleigh expansion, l = 0 term); check three orientations of d.
    for (const kd of [5, 40, 150]) {
      const o = sphereQuadratureOrder(kd);
      const q = sphereQuadrature(o.thetaCount, o.phiCount);
      for (const dir of [[0, 0, 1], [1, 0, 0], [0.48, 0.6, 0.64]]) {
        let re = 0, im = 0;
        for (let k = 0; k < q.count; k++) {
          const ph = kd * (dir[0] * q.directions[3 * k] + dir[1] * q.directions[3 * k + 1] + dir[2] * q.directions[3 * k + 2]);
          re += q.weights[k] * Math.cos(ph);
          im += q.weights[k] * Math.sin(ph);
        }
        const exact = (4 * Math.PI * Math.sin(kd)) / kd;
        // rounding of the sum adds ~count·ε·4π on top of the truncation bound
        expect(Math.hypot(re - exact, im)).toBeLessThan(o.errorEstimate + 4 * Math.PI * q.count * 2e-16);
      }
    }
  });
  it('under-resolved rule is visibly wrong (the bound is not vacuous)', () => {
    const q = sphereQuadrature(10, 20), kd = 60;
    let re = 0;
    for (let k = 0; k < q.count; k++) re += q.weights[k] * Math.cos(kd * q.directions[3 * k + 2]);
    expect(Math.abs(re - (4 * Math.PI * Math.sin(kd)) / kd)).toBeGreaterThan(1e-3);
  });
  it('sized from a layout; bad inputs', () => {
    const q = sphereQuadratureForLayout(rectangularGridLayout({ countX: 4, countY: 4, spacingXM: 0.05, spacingYM: 0.05 }), 3e9);
    expect(q.thetaCount).toBeGreaterThan(5);
    expect(q.errorEstimate).toBeLessThan(1e-12);
    expect(() => sphereQuadratureOrder(-1)).toThrow(DomainError);
    expect(() => sphereQuadratureOrder(10, { tolerance: 0 })).toThrow(DomainError);
    expect(() => sphereQuadrature(0, 4)).toThrow(DomainError);
  });
});

describe('sphereQuadrature split at given polar angles', () => {
  it('integrates a step at θ = 0.7 rad exactly: ∫_{θ<0.7} dΩ = 2π(1 − cos 0.7)', () => {
    const q = sphereQuadrature(6, 4, { splitAtThetaRad: [0.7], splitAtHorizon: true });
    expect(q.thetaCount).toBe(18);
    let cap = 0;
    for (let k = 0; k < q.count; k++) if (q.directions[3 * k + 2] > Math.cos(0.7)) cap += q.weights[k];
    expect(cap / (2 * Math.PI * (1 - Math.cos(0.7))) - 1).toBeCloseTo(0, 14);
    // The horizon given twice (as an angle and as the flag) is one breakpoint.
    expect(sphereQuadrature(6, 4, { splitAtThetaRad: [Math.PI / 2], splitAtHorizon: true }).thetaCount).toBe(12);
    expect(() => sphereQuadrature(6, 4, { splitAtThetaRad: [4] })).toThrow(DomainError);
  });
});
