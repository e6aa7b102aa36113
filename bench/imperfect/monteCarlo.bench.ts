import { bench, describe } from 'vitest';
import { rectangularGridLayout } from '../../src/geometry/index.js';
import { steeringVector } from '../../src/pattern/index.js';
import { monteCarloErrorPatterns } from '../../src/imperfect/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';

const F = 3e9, L = C0_M_PER_S / F;

function sink(x: Float64Array): void {
  if (Number.isNaN(x[0])) throw new Error('NaN in benchmark output');
}

describe('Monte Carlo, 1000 trials, 32×32 half-wave grid (1024 elements), 256×256 = 65 536 u-v points by FFT', () => {
  const grid = { countX: 32, countY: 32, spacingXM: L / 2, spacingYM: L / 2 };
  const steer = [Math.sin(0.2), 0, Math.cos(0.2)] as const;
  const w = steeringVector(rectangularGridLayout(grid), steer, F);
  const model = { amplitude: { distribution: 'gaussian', rms: 0.1 }, phaseRad: { distribution: 'gaussian', rms: 0.1 } } as const;
  bench('monteCarloErrorPatterns (fftGrid path)', () => {
    sink(monteCarloErrorPatterns({ kind: 'fftGrid', grid, sizeU: 256 }, w, steer, F, model, { trials: 1000, seed: 1 }).meanPower);
  }, { iterations: 1, warmupIterations: 0, time: 0 });
});
