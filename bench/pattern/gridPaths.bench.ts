import { bench, describe } from 'vitest';
import { rectangularGridLayout, evenlySpaced } from '../../src/geometry/index.js';
import { fftGridArrayFactorInto, separableGridArrayFactor, steeringVector } from '../../src/pattern/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';

const F = 3e9, L = C0_M_PER_S / F;

function sink(x: Float64Array): void {
  if (Number.isNaN(x[0])) throw new Error('NaN in benchmark output');
}

describe('32×32 half-wave grid onto a 256×256 u-v grid', () => {
  const grid = { countX: 32, countY: 32, spacingXM: L / 2, spacingYM: L / 2 };
  const layout = rectangularGridLayout(grid);
  const w = steeringVector(layout, [Math.sin(0.3), 0, Math.cos(0.3)], F);
  const out = { rows: 256, cols: 256, data: new Float64Array(2 * 256 * 256) };
  const u = evenlySpaced(-1, 1 - 2 / 256, 256);
  bench('fftGridArrayFactorInto', () => { sink(fftGridArrayFactorInto(out, grid, w, 256, 256).data); });
  bench('separableGridArrayFactor', () => { sink(separableGridArrayFactor(grid, w, u, u, F).data); });
});
