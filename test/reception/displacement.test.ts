import { describe, it, expect } from 'vitest';
import { triangularLatticeLayout } from '../../src/geometry/builders.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import type { WireDipole } from '../../src/element/types.js';
import { wavelengthM } from '../../src/units/convert.js';
import { arrayNoiseBudget, brightnessCorrelations, dipoleArrayPorts, hertzianDipolePorts, quadratureDirections, skyAndGroundBrightness, skyAndGroundEnvironment } from '../../src/reception/index.js';
import { displacementStructure } from '../../src/reception/displacement.js';
import { brightnessQuadraticForms, brightnessValues } from '../../src/reception/brightness.js';
import { columnQuadraticForms } from '../../src/reception/figures.js';
import { asPatternSource } from '../../src/reception/patterns.js';
import { randomMatrix } from '../helpers/matchers.js';

const f = 1.42e9, lambda = wavelengthM(f), d = lambda / 2;

function squareGrid(count: number): [number, number][] {
  const out: [number, number][] = [];
  for (let i = 0; i < count; i++) for (let j = 0; j < count; j++) out.push([(i - (count - 1) / 2) * d, (j - (count - 1) / 2) * d]);
  return out;
}
function hexagon(rings: number): [number, number][] {
  const lay = triangularLatticeLayout(d, { kind: 'hexagon', circumradiusM: rings * d * (1 + 1e-9) });
  const out: [number, number][] = [];
  for (let i = 0; i < lay.count; i++) out.push([lay.positionsM[3 * i], lay.positionsM[3 * i + 1]]);
  return out;
}

describe('displacement path of the brightness integral', () => {
  const q = quadratureDirections(sphereQuadrature(30, 60, { splitAtHorizon: true }));
  const maps = [skyAndGroundBrightness({ skyK: 10, groundK: 290, tiltRad: 0.35, tiltAzimuthRad: 0.4 }), () => 1];
  /** The displacement path equals the general path to 1e-10 of the largest entry, for every map. */
  function expectPathsAgree(patterns: Parameters<typeof brightnessCorrelations>[0]): void {
    const fast = brightnessCorrelations(patterns, q, maps, 1e6);
    const slow = brightnessCorrelations(patterns, q, maps, 1e6, { path: 'general' });
    for (let t = 0; t < maps.length; t++) {
      let big = 0, diff = 0;
      for (let k = 0; k < slow[t].data.length; k++) { big = Math.max(big, Math.abs(slow[t].data[k])); diff = Math.max(diff, Math.abs(fast[t].data[k] - slow[t].data[k])); }
      expect(diff).toBeLessThan(1e-10 * big);
    }
  }
  const cases: Array<[string, [number, number][], boolean]> = [
    ['16 (4×4 square), free space', squareGrid(4), false],
    ['16 (4×4 square), over ground', squareGrid(4), true],
    ['61 (triangular, hexagon of 4 rings), free space', hexagon(4), false],
    ['61 (triangular, hexagon of 4 rings), over ground', hexagon(4), true],
    ['256 (16×16 square), over ground', squareGrid(16), true],
    ['256 (16×16 square), free space', squareGrid(16), false],
    ['16 (line along x), over ground', Array.from({ length: 16 }, (_, i): [number, number] => [(i - 7.5) * d, 0]), true],
  ];
  for (const [label, xy, ground] of cases) {
    it(`equals the general path to 1e-10: ${label}`, () => {
      const dip = xy.map(([x, y]): WireDipole => ({ centerM: [x, y, ground ? lambda / 4 : 0.3 * y], axis: [1, 0, 0], lengthM: 0.47 * lambda, radiusM: lambda / 300 }));
      const ports = dipoleArrayPorts(dip, f, ground ? { groundPlane: { zM: 0 } } : {});
      expect(ports.patterns.shifted).toBeDefined();
      expect(displacementStructure(ports.patterns.shifted!.offsetsM)).not.toBeNull();
      expectPathsAgree(ports.patterns);
    });
  }
  it('point (Hertzian) elements, isolated patterns: equals the general path to 1e-10 (61 triangular over ground, 16 square in free space)', () => {
    for (const [xy, ground] of [[hexagon(4), true], [squareGrid(4), false]] as const) {
      const ports = hertzianDipolePorts(xy.map(([x, y]) => ({ centerM: [x, y, lambda / 4] as [number, number, number], axis: [1, 0.2, 0] as [number, number, number], lengthM: lambda / 20 })), f, ground ? { groundPlane: { zM: 0 } } : {});
      expect(ports.patterns.shifted).toBeDefined();
      expectPathsAgree(ports.patterns);
    }
  });
  it('is not taken for differing elements or heights over ground; random layouts fall back to the general path', () => {
    const xy = squareGrid(3);
    const dip = xy.map(([x, y], i): WireDipole => ({ centerM: [x, y, lambda / 4 + (i === 0 ? 0.01 : 0)], axis: [1, 0, 0], lengthM: 0.47 * lambda, radiusM: lambda / 300 }));
    expect(dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } }).patterns.shifted).toBeUndefined();
    const dip2 = xy.map(([x, y], i): WireDipole => ({ centerM: [x, y, 0], axis: [1, 0, 0], lengthM: (0.47 + (i === 3 ? 0.01 : 0)) * lambda, radiusM: lambda / 300 }));
    expect(dipoleArrayPorts(dip2, f).patterns.shifted).toBeUndefined();
    const rnd = Float64Array.from({ length: 3 * 40 }, (_, i) => Math.sin(i * 12.9898) * 43758.5453 % 1);
    expect(displacementStructure(rnd)).toBeNull();
  });
  it('quadratic forms without the matrices (the refinement path): wₖᴴ R_t wₖ by the weights\' autocorrelation equals the forms of the general-path matrices to 1e-10 (61 triangular over ground, 16 line, 256 square)', () => {
    for (const [xy, ground] of [[hexagon(4), true], [Array.from({ length: 16 }, (_, i): [number, number] => [(i - 7.5) * d, 0]), true], [squareGrid(16), false]] as const) {
      const dip = xy.map(([x, y]): WireDipole => ({ centerM: [x, y, ground ? lambda / 4 : 0], axis: [1, 0, 0], lengthM: 0.47 * lambda, radiusM: lambda / 300 }));
      const ports = dipoleArrayPorts(dip, f, ground ? { groundPlane: { zM: 0 } } : {});
      const src = asPatternSource('p', ports.patterns);
      const w = randomMatrix(xy.length, 5, 11);
      const values = maps.map((b, i) => brightnessValues(`m${i}`, b, q));
      let called = false;
      const fast = brightnessQuadraticForms(src, q, values, 1e6, w, () => { called = true; return []; });
      expect(called).toBe(false); // the displacement path, no matrices
      const slow = columnQuadraticForms(w, brightnessCorrelations(ports.patterns, q, maps, 1e6, { path: 'general' }));
      for (let t = 0; t < maps.length; t++) {
        for (let k = 0; k < 5; k++) expect(Math.abs(fast[t][k] - slow[t][k])).toBeLessThan(1e-10 * Math.abs(slow[t][k]));
      }
    }
  });
  it('a brightness constant per region: the budget takes the T-weighted integrals as multiples of the 1 K ones, equal to integrating the T maps (linearity), 61 triangular in free space (both regions seen)', () => {
    const dip = hexagon(4).map(([x, y]): WireDipole => ({ centerM: [x, y, 0], axis: [1, 0, 0], lengthM: 0.47 * lambda, radiusM: lambda / 300 }));
    const ports = dipoleArrayPorts(dip, f);
    const env = skyAndGroundEnvironment({ skyK: 7, groundK: 290 });
    const budget = arrayNoiseBudget({ patterns: ports.patterns, quadrature: q, impedanceOhm: ports.impedanceOhm, environment: env, bandwidthHz: 1e6, loss: 'lossless' });
    const skyMap = (th: number, ph: number) => (env.isSky!(th, ph) ? 7 : 0), groundMap = (th: number, ph: number) => (env.isSky!(th, ph) ? 0 : 290);
    const [sky, ground] = brightnessCorrelations(ports.patterns, q, [skyMap, groundMap], 1e6);
    for (const [a, b] of [[budget.sky, sky], [budget.ground, ground]] as const) {
      let big = 0, diff = 0;
      for (let k = 0; k < a.data.length; k++) { big = Math.max(big, Math.abs(b.data[k])); diff = Math.max(diff, Math.abs(a.data[k] - b.data[k])); }
      expect(big).toBeGreaterThan(0);
      expect(diff).toBeLessThan(1e-12 * big);
    }
  });
});
