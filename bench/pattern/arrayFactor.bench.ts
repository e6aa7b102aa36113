import { bench, describe } from 'vitest';
import { rectangularGridLayout, arrayLayout } from '../../src/geometry/index.js';
import { arrayFactorInto, steeringVector } from '../../src/pattern/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';
import { randomMatrix, randomUnitVectors, seededRandom } from '../../test/helpers/matchers.js';

const F = 3e9, LAMBDA = C0_M_PER_S / F;

function sink(x: Float64Array): void {
  if (Number.isNaN(x[0])) throw new Error('NaN in benchmark output');
}


describe('direct sum, 32×32 half-wave grid, 65 536 arbitrary directions', () => {
  const layout = rectangularGridLayout({ countX: 32, countY: 32, spacingXM: LAMBDA / 2, spacingYM: LAMBDA / 2 });
  const w = steeringVector(layout, [Math.sin(0.3), 0, Math.cos(0.3)], F);
  const dirs = randomUnitVectors(65536, 0x5eed);
  const out = { rows: 65536, cols: 1, data: new Float64Array(2 * 65536) };
  bench('arrayFactorInto (factored lattice path)', () => { sink(arrayFactorInto(out, layout, w, dirs, F).data); }, { iterations: 10 });
});

describe('direct sum, 1024-element random layout, 4096 directions', () => {
  const rnd = seededRandom(7);
  const pts: Array<[number, number, number]> = [];
  for (let i = 0; i < 1024; i++) pts.push([16 * LAMBDA * rnd(), 16 * LAMBDA * rnd(), 0]);
  const layout = arrayLayout(pts);
  const w = randomMatrix(1024, 1, 9);
  const dirs = randomUnitVectors(4096, 0x5eed);
  const out = { rows: 4096, cols: 1, data: new Float64Array(2 * 4096) };
  bench('arrayFactorInto (plain cos/sin path)', () => { sink(arrayFactorInto(out, layout, w, dirs, F).data); }, { iterations: 10 });
});
