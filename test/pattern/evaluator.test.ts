import { describe, it, expect } from 'vitest';
import { arrayLayout, rectangularGridLayout, sphereQuadrature } from '../../src/geometry/index.js';
import { patternEvaluator } from '../../src/pattern/index.js';
import { C0_M_PER_S, wavenumberRadPerM } from '../../src/units/index.js';
import { randomMatrix, seededRandom } from '../helpers/matchers.js';
import { referenceArrayFactor, relativeMaxError } from './helpers.js';

const F = 3e9;
const L = C0_M_PER_S / F;

describe('patternEvaluator.evaluateSphereInto (antipodal and planar symmetry)', () => {
  const rnd = seededRandom(77);
  const cloud = (n: number, planar: boolean) => arrayLayout(Array.from({ length: n }, () => [3 * L * rnd(), 3 * L * rnd(), planar ? 0 : 2 * L * rnd()] as [number, number, number]));
  const cases = [
    ['3-D random layout (antipodal pairs)', cloud(40, false)],
    ['planar random layout (four-fold)', cloud(40, true)],
    ['lattice (factored path, no pairing)', rectangularGridLayout({ countX: 6, countY: 5, spacingXM: L / 2, spacingYM: 0.6 * L })],
  ] as const;
  for (const [name, layout] of cases) {
    it(`${name}: equals the textbook sum for even/odd θ and φ counts`, () => {
      const w = randomMatrix(layout.count, 1, 5);
      const ev = patternEvaluator(layout, w, F);
      for (const [nt, np] of [[12, 24], [13, 24], [9, 15]]) {
        const q = sphereQuadrature(nt, np);
        const got = ev.evaluateSphereInto(new Float64Array(2 * q.count), q);
        expect(relativeMaxError(got, referenceArrayFactor(layout, w, q.directions, wavenumberRadPerM(F)))).toBeLessThan(1e-12);
      }
    });
  }
  it('with a cosine element factor (split rule): zero behind the array', () => {
    const layout = cloud(20, true);
    const ev = patternEvaluator(layout, randomMatrix(20, 1, 9), F, { kind: 'cosine', exponent: 1.5 });
    const q = sphereQuadrature(6, 8, { splitAtHorizon: true });
    const out = ev.evaluateSphereInto(new Float64Array(2 * q.count), q);
    for (let k = 0; k < q.count; k++) if (q.directions[3 * k + 2] < 0) expect(Math.abs(out[2 * k]) + Math.abs(out[2 * k + 1])).toBe(0);
  });
});
