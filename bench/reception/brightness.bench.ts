import { bench, describe } from 'vitest';
import { brightnessCorrelation } from '../../src/reception/brightness.js';
import { brightnessInputs } from './inputs.js';

function sink(x: { data: Float64Array }): void {
  if (Number.isNaN(x.data[0])) throw new Error('NaN');
}

const n = 100, m = 20000;
const { patterns, quad, t } = brightnessInputs(n, m);

describe(`brightness integral N=${n}, M=${m} (θ̂ and φ̂ components)`, () => {
  for (const blockSize of [64, 128, 256]) {
    bench(`block ${blockSize}`, () => { sink(brightnessCorrelation(patterns, quad, t, 1e6, { blockSize })); }, { iterations: 5, warmupIterations: 1 });
  }
});
