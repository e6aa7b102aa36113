import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { triangularLatticeLayout } from '../../src/geometry/builders.js';
import { sphereQuadratureForLayout } from '../../src/geometry/quadrature.js';
import { splitSphereRule } from '../../src/geometry/splitRule.js';
import { DomainError } from '../../src/errors.js';
import {
  adaptiveSphereRule, brightnessCorrelations, dipoleArrayPorts, evaluateReceivingArray, skyAndGroundEnvironment,
} from '../../src/reception/index.js';

const fixture = JSON.parse(readFileSync(new URL('./fixtures/lband_brightness.json', import.meta.url), 'utf8'));

/** The shipped L-band example (examples/designs/l-band-feed.json). */
function lband() {
  const f = 1.42e9;
  const lay = triangularLatticeLayout(0.12, { kind: 'hexagon', circumradiusM: 0.24 });
  const dip = Array.from({ length: lay.count }, (_, i) => ({
    centerM: [lay.positionsM[3 * i], lay.positionsM[3 * i + 1], 0.0528] as [number, number, number], axis: [1, 0, 0] as [number, number, number], lengthM: 0.0985, radiusM: 0.0008,
  }));
  const ports = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
  const env = skyAndGroundEnvironment({ skyK: 5, groundK: 290, tiltRad: (20 * Math.PI) / 180, tiltAzimuthRad: 0 });
  return { f, lay, ports, env };
}

describe('splitSphereRule', () => {
  it('integrates polynomials of the direction about any axis, with and without splits (∮ x² dΩ = 4π/3, ∮ x⁴ = 4π/5)', () => {
    for (const polarAxis of [[0, 0, 1], [1, 0.3, -0.2], [0, 1, 0]] as const) {
      const r = splitSphereRule({ polarAxis, thetaCount: 12, phiCount: 16, phiSplitsRad: [0.3, 2], thetaSplits: [0.1] });
      const plain = splitSphereRule({ polarAxis, thetaCount: 6, phiCount: 8 });
      let p2 = 0;
      for (let k = 0; k < plain.weightSr.length; k++) p2 += plain.weightSr[k] * (Math.sin(plain.thetaRad[k]) * Math.cos(plain.phiRad[k])) ** 2;
      expect(p2).toBeCloseTo((4 * Math.PI) / 3, 12); // unsplit product rule: exact for this degree
      let s0 = 0, s2 = 0, s4 = 0;
      for (let k = 0; k < r.weightSr.length; k++) {
        const x = Math.sin(r.thetaRad[k]) * Math.cos(r.phiRad[k]);
        s0 += r.weightSr[k]; s2 += r.weightSr[k] * x * x; s4 += r.weightSr[k] * x ** 4;
      }
      // split rules are spectrally accurate rather than exact for trigonometric polynomials
      expect(Math.abs(s0 - 4 * Math.PI)).toBeLessThan(1e-12);
      expect(Math.abs(s2 - (4 * Math.PI) / 3)).toBeLessThan(1e-10);
      expect(Math.abs(s4 - (4 * Math.PI) / 5)).toBeLessThan(1e-10);
    }
    expect(() => splitSphereRule({ polarAxis: [0, 0, 0], thetaCount: 4, phiCount: 4 })).toThrow(DomainError);
    expect(() => splitSphereRule({ polarAxis: [0, 0, 1], referenceAxis: [0, 0, 2], thetaCount: 4, phiCount: 4 })).toThrow(DomainError);
  });
});

describe('adaptive sphere rule', () => {
  it('L-band example: sky- and ground-region integrals equal the numpy reference (lband_brightness.py) to 1e-9', () => {
    const { f, ports, env } = lband();
    const q = adaptiveSphereRule(ports.geometry!, f, { edgeNormals: env.edgeNormals });
    expect(q.kind).toBe('edges');
    const [sky, ground] = brightnessCorrelations(ports.patterns, q, [(t, p) => (env.isSky!(t, p) ? 1 : 0), (t, p) => (env.isSky!(t, p) ? 0 : 1)], 1);
    // the fixture's positions are the builder's (same order is not assumed: match by position)
    const n = 19, pos = ports.geometry!.positionsM;
    const idx = fixture.positionsM.map((p: number[]) => {
      for (let i = 0; i < n; i++) if (Math.hypot(pos[3 * i] - p[0], pos[3 * i + 1] - p[1], pos[3 * i + 2] - p[2]) < 1e-9) return i;
      throw new Error('position not found');
    });
    for (const [ours, ref] of [[sky, fixture.skyRegionPerK], [ground, fixture.groundRegionPerK]] as const) {
      let big = 0, diff = 0;
      for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) {
        const o = 2 * (idx[a] * n + idx[b]), r = a * n + b;
        big = Math.max(big, Math.hypot(ref.re[r], ref.im[r]));
        diff = Math.max(diff, Math.hypot(ours.data[o] - ref.re[r], ours.data[o + 1] - ref.im[r]));
      }
      expect(diff).toBeLessThan(1e-9 * big);
    }
  });
  it('L-band example at broadside: spillover 0.533 K (issue 17, numpy re-implementation) where the plain layout rule gave 0.657 K; the refinement check fails for the plain rule', () => {
    const { f, lay, ports, env } = lband();
    const common = {
      ports, bandwidthHz: 2e6, environment: env, loss: 'lossless' as const, physicalAreaM2: 0.23694,
      amplifiers: { minimumNoiseTemperatureK: 25, noiseResistanceOhm: 4, optimumSourceAdmittanceS: { re: 0.018, im: -0.001 } },
      beams: { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(Math.PI / 2) },
    };
    const adaptive = evaluateReceivingArray({ ...common, quadrature: 'adaptive' });
    expect(adaptive.beams[0].spilloverTemperatureK).toBeCloseTo(0.533, 3);
    expect(adaptive.checks.find((c) => c.name === 'integrationRefinement')?.passed).toBe(true);
    expect(adaptive.integrationErrors[0].spilloverTemperatureK as number).toBeLessThan(1e-4);
    const plain = evaluateReceivingArray({ ...common, quadrature: sphereQuadratureForLayout(lay, f, { tolerance: 1e-6 }) });
    expect(Math.abs(plain.beams[0].spilloverTemperatureK - 0.657)).toBeLessThan(1e-3);
    const check = plain.checks.find((c) => c.name === 'integrationRefinement');
    expect(check?.passed).toBe(false);
    // the Twiss residual cannot see the jump at the horizon: it passes for the plain rule
    expect(plain.checks.find((c) => c.name === 'twissResidual')?.passed).toBe(true);
  });
  it('a λ/2 line over ground takes the line-aligned rule; bad input is a DomainError', () => {
    const f = 1.4e9, lambda = 299792458 / f;
    const positionsM = Float64Array.from({ length: 30 }, (_, i) => (i % 3 === 0 ? (i / 3) * lambda / 2 : i % 3 === 2 ? lambda / 4 : 0));
    const r = adaptiveSphereRule({ positionsM, elementSizeM: 0.48 * lambda, groundPlaneZM: 0 }, f, { edgeNormals: [[0, 0, 1]] });
    expect(r.kind).toBe('line');
    expect(r.polarAxis[0]).toBeCloseTo(1, 12);
    expect(() => adaptiveSphereRule({ positionsM: new Float64Array(0), elementSizeM: 0 }, f)).toThrow(DomainError);
    expect(() => adaptiveSphereRule({ positionsM, elementSizeM: 0 }, -1)).toThrow(DomainError);
  });
});
