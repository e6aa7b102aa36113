import { describe, it, expect } from 'vitest';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { concatRows } from '../../src/linalg/ops.js';
import { fromRows } from '../../src/linalg/cmatrix.js';
import { hertzianDipoleFarField, wireDipoleFarField } from '../../src/element/farField.js';
import { thermalImpedanceNoise } from '../../src/network/noise.js';
import { brightnessCorrelation, dipoleArrayPorts, hertzianDipolePorts, isotropicBrightness, quadratureDirections, samplePatterns } from '../../src/reception/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';
import { expectCMatrixClose } from '../helpers/matchers.js';
import { hertzianResistance } from './hertzian.js';

const F = 299792458; // λ = 1 m
const elems = [
  { centerM: [0, 0, 0.3], axis: [0, 0, 1], lengthM: 0.05 },
  { centerM: [0.4, 0.1, 0.3], axis: [1, 0, 0], lengthM: 0.05 },
  { centerM: [-0.2, 0.5, 0.2], axis: [1, 1, 0], lengthM: 0.03 },
] as const;

describe('hertzianDipolePorts', () => {
  for (const groundPlane of [undefined, { zM: 0 }]) {
    it(`Twiss: the brightness integral equals 2k_B T B (Z + Zᴴ) to the rule's accuracy (${groundPlane ? 'over ground' : 'free space'})`, () => {
      // Closed-form point-limit R (spherical Bessel functions) against a numerical sphere integral of the patterns.
      const ports = hertzianDipolePorts(elems.map((e) => ({ ...e, centerM: [...e.centerM] as [number, number, number], axis: [...e.axis] as [number, number, number] })), F, { groundPlane });
      const q = quadratureDirections(sphereQuadrature(40, 80, { splitAtHorizon: true }));
      const r = brightnessCorrelation(ports.patterns, q, isotropicBrightness(50), 1e6);
      expectCMatrixClose(r, thermalImpedanceNoise(ports.impedanceOhm, 50, 1e6), { rtol: 1e-12 });
    });
  }
  it('z-directed elements in a plane: R equals the independent fixture (Balanis eq. (4-19) self term)', () => {
    const xy: [number, number][] = [[0, 0], [0.3, 0.1], [0.05, 0.6]];
    const ports = hertzianDipolePorts(xy.map(([x, y]) => ({ centerM: [x, y, 0], axis: [0, 0, 1], lengthM: 0.02 })), F);
    const ref = hertzianResistance(xy, 0.02, F);
    for (let i = 0; i < 9; i++) expect(Math.abs(ports.impedanceOhm.data[2 * i] - ref[2 * i])).toBeLessThan(1e-12 * Math.abs(ref[0]));
  });
  it('patterns are the L → 0 limit of the element module\'s uniform-current far field', () => {
    const e = { centerM: [0.1, -0.2, 0.05] as [number, number, number], axis: [0.3, 0.4, 0.8] as [number, number, number], lengthM: 1e-6 };
    const th = Float64Array.of(0.3, 1.2, 2.5), ph = Float64Array.of(0.1, 2, -1);
    const s = samplePatterns(hertzianDipolePorts([e], F).patterns, th, ph);
    const ff = hertzianDipoleFarField(e, F, th, ph);
    expectCMatrixClose(s.thetaComponentV, ff.thetaComponentV, { rtol: 1e-10 });
    expectCMatrixClose(s.phiComponentV, ff.phiComponentV, { rtol: 1e-10 });
  });
  it('reactance option and bad input', () => {
    const x = fromRows([[10]]);
    expect(hertzianDipolePorts([elems[0] as never], F, { reactanceOhm: x }).impedanceOhm.data[1]).toBe(10);
    expect(() => hertzianDipolePorts([elems[0] as never], F, { reactanceOhm: fromRows([[1, 0], [0, 1]]) })).toThrow(DimensionError);
    expect(() => hertzianDipolePorts([{ centerM: [0, 0, -1], axis: [0, 0, 1], lengthM: 0.1 }], F, { groundPlane: { zM: 0 } })).toThrow(DomainError);
    expect(() => hertzianDipolePorts([], F)).toThrow(DomainError);
  });
});

describe('far-field functions share the sampled-pattern shape (one row per port, one column per direction)', () => {
  it('stacking wireDipoleFarField rows gives samplePatterns of dipoleArrayPorts', () => {
    const ds = [0, 0.6].map((x) => ({ centerM: [x, 0, 0] as [number, number, number], axis: [0, 0, 1] as [number, number, number], lengthM: 0.5, radiusM: 1e-4 }));
    const th = Float64Array.of(0.4, 1.1, 1.5, 2.0), ph = Float64Array.of(0, 0.5, 1, 3);
    const rows = ds.map((d) => wireDipoleFarField(d, F, th, ph));
    expect([rows[0].thetaComponentV.rows, rows[0].thetaComponentV.cols]).toEqual([1, 4]);
    const s = samplePatterns(dipoleArrayPorts(ds, F).patterns, th, ph);
    expectCMatrixClose(concatRows(rows.map((r) => r.thetaComponentV)), s.thetaComponentV, { rtol: 1e-14 });
  });
});
