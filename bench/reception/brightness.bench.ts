import { bench, describe } from 'vitest';
import { brightnessCorrelation } from '../../src/reception/brightness.js';
import type { QuadratureDirections, SampledPortPatterns } from '../../src/reception/patterns.js';
import { seededRandom } from '../../test/helpers/matchers.js';

function sink(x: { data: Float64Array }): void {
  if (Number.isNaN(x.data[0])) throw new Error('NaN');
}

const n = 100, m = 20000;
const rnd = seededRandom(0x5eed);
const th = new Float64Array(m), ph = new Float64Array(m), w = new Float64Array(m), t = new Float64Array(m);
for (let k = 0; k < m; k++) { th[k] = Math.acos(2 * rnd() - 1); ph[k] = 2 * Math.PI * rnd(); w[k] = (4 * Math.PI) / m; t[k] = 3 + 280 * rnd(); }
const mk = (): Float64Array => { const d = new Float64Array(2 * n * m); for (let k = 0; k < d.length; k++) d[k] = 2 * rnd() - 1; return d; };
const patterns: SampledPortPatterns = {
  thetaRad: th, phiRad: ph, driveCurrentA: 1, frequencyHz: 1e9,
  thetaComponentV: { rows: n, cols: m, data: mk() }, phiComponentV: { rows: n, cols: m, data: mk() },
};
const quad: QuadratureDirections = { thetaRad: th, phiRad: ph, weightSr: w };

describe(`brightness integral N=${n}, M=${m} (θ̂ and φ̂ components)`, () => {
  for (const blockSize of [64, 128, 256]) {
    bench(`block ${blockSize}`, () => { sink(brightnessCorrelation(patterns, quad, t, 1e6, { blockSize })); }, { iterations: 5, warmupIterations: 1 });
  }
});
