import { describe, it, expect } from 'vitest';
import {
  dipolePatternSource, patternSetSource, dipoleArrayImpedanceMatrix, dipoleEmbeddedPatterns, dipoleArrayFarFields,
  convertPatternExcitation,
} from '../../src/element/index.js';
import type { WireDipole } from '../../src/element/index.js';
import type { Vector3 } from '../../src/geometry/layout.js';
import { sphereQuadrature, sphereQuadratureOrder } from '../../src/geometry/quadrature.js';
import { brightnessCorrelation, isotropicBrightness } from '../../src/reception/brightness.js';
import { quadratureDirections, samplePatterns } from '../../src/reception/patterns.js';
import { thermalNoiseCorrelation } from '../../src/reception/thermal.js';
import { DomainError } from '../../src/errors.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const F = 299792458;
const dip = (centerM: Vector3, axis: Vector3 = [0, 0, 1], lengthM = 0.5): WireDipole => ({ centerM, axis, lengthM, radiusM: 1e-6 });

describe('pattern sources for the reception module', () => {
  const ds = [dip([0, 0, 0.25], [1, 0, 0]), dip([0, 0.5, 0.25], [1, 0, 0]), dip([0.5, 0.2, 0.3], [0, 1, 0.3], 0.4)];
  it('DESIGN brightness row in an isotropic bath equals the Twiss row 2k_B T B (Z + Zᴴ) (over ground, 1e-9)', () => {
    // Twiss 1955; DESIGN thermal-noise and brightness rows. Over the PEC plane the lower hemisphere
    // is empty, so use the dipole-plus-image free-space source and halve (mirror symmetry).
    const images = ds.map((d) => dip([d.centerM[0], d.centerM[1], -d.centerM[2]], [-d.axis[0], -d.axis[1], d.axis[2]], d.lengthM));
    const o = sphereQuadratureOrder(2 * Math.PI * 2, { tolerance: 1e-14, extraDegree: 16 });
    const q = quadratureDirections(sphereQuadrature(o.thetaCount, o.phiCount));
    const a = dipolePatternSource(ds, F), b = dipolePatternSource(images, F);
    const both = {
      portCount: 3, driveCurrentA: 1, frequencyHz: F,
      fill(t: Float64Array, p: Float64Array, s: number, c: number, ot: Float64Array, op: Float64Array, ld: number) {
        const t2 = new Float64Array(ot.length), p2 = new Float64Array(op.length);
        a.fill(t, p, s, c, ot, op, ld);
        b.fill(t, p, s, c, t2, p2, ld);
        for (let i = 0; i < ot.length; i++) { ot[i] += t2[i]; op[i] += p2[i]; }
      },
    };
    const r = brightnessCorrelation(both, q, isotropicBrightness(290), 1e6);
    const half = { ...r, data: r.data.map((v) => v / 2) };
    const twiss = thermalNoiseCorrelation(dipoleArrayImpedanceMatrix(ds, F, { groundPlane: { zM: 0 } }), 290, 1e6);
    expectCMatrixClose(half, twiss, { rtol: 1e-9 });
  });
  it('dipolePatternSource with a ground plane equals the direction-list patterns', () => {
    const th = Float64Array.of(0.1, 0.7, 1.5, 2.0), ph = Float64Array.of(0.3, 2.0, 4.0, 5.5);
    const s = samplePatterns(dipolePatternSource(ds, F, { groundPlane: { zM: 0 }, driveCurrentA: 2 }), th, ph);
    const d = dipoleArrayFarFields(ds, F, th, ph, { groundPlane: { zM: 0 }, driveCurrentA: 2 });
    expectCMatrixClose(s.thetaComponentV, d.thetaComponentV, { rtol: 1e-15 });
    expectCMatrixClose(s.phiComponentV, d.phiComponentV, { rtol: 1e-15 });
    expect(s.thetaComponentV.data[2 * 3]).toBe(0); // θ > π/2: below the plane
  });
  it('patternSetSource interpolates a set (2.5° grid) to within 1e-5 of the exact source', () => {
    const th = Float64Array.from({ length: 73 }, (_, i) => (i * Math.PI) / 72);
    const ph = Float64Array.from({ length: 144 }, (_, i) => (i * Math.PI) / 72);
    const set = dipoleEmbeddedPatterns(ds, F, th, ph);
    const tq = Float64Array.of(0.05, 1.1, 2.3, 3.1), pq = Float64Array.of(0.2, 1.9, 3.3, 6.1);
    const got = samplePatterns(patternSetSource(set), tq, pq);
    const ref = samplePatterns(dipolePatternSource(ds, F), tq, pq);
    expectCMatrixClose(got.thetaComponentV, ref.thetaComponentV, { rtol: 1e-5 });
    const z = dipoleArrayImpedanceMatrix(ds, F);
    expect(() => patternSetSource(convertPatternExcitation(set, z, { kind: 'short-circuit-voltage', driveVoltageV: 1 }))).toThrow(DomainError);
  });
});
