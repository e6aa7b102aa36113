import { bench, describe } from 'vitest';
import { arrayLayout, gaussLegendre, sphereQuadratureForLayout } from '../../src/geometry/index.js';
import { directivity } from '../../src/pattern/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';
import { randomMatrix, seededRandom } from '../../test/helpers/matchers.js';

const F = 3e9, L = C0_M_PER_S / F;

function sink(x: number): void {
  if (Number.isNaN(x)) throw new Error('NaN in benchmark output');
}

describe('Gauss–Legendre nodes', () => {
  for (const n of [64, 256, 1024]) bench(`gaussLegendre(${n})`, () => { sink(gaussLegendre(n).nodes[0]); });
});

describe('directivity of a 1024-element arbitrary layout by sphere quadrature', () => {
  // random positions in a 16λ × 16λ square (no lattice: the plain cos/sin path)
  const rnd = seededRandom(0x5eed);
  const pts: Array<[number, number, number]> = [];
  for (let i = 0; i < 1024; i++) pts.push([16 * L * (rnd() - 0.5), 16 * L * (rnd() - 0.5), 0]);
  const layout = arrayLayout(pts);
  const w = randomMatrix(1024, 1, 3);
  const rule = sphereQuadratureForLayout(layout, F);
  bench(`directivity, rule ${rule.thetaCount}×${rule.phiCount} given`, () => { sink(directivity(layout, w, [0, 0, 1], F, { quadrature: rule }).directivity); }, { iterations: 3 });
  bench('sphereQuadratureForLayout (rule construction only)', () => { sink(sphereQuadratureForLayout(layout, F).weights[0]); });
});
