import { bench, describe } from 'vitest';
import { dipoleEmbeddedPatterns, dipolesFromLayout, patternInterpolator } from '../../src/element/index.js';
import { rectangularGridLayout } from '../../src/geometry/index.js';
import { seededRandom } from '../../test/helpers/matchers.js';

const F = 299792458;
function sink(x: { data: Float64Array }): void {
  if (Number.isNaN(x.data[0])) throw new Error('NaN');
}

describe('interpolate 64-port patterns (2.5° grid) to 10 000 directions', () => {
  const layout = rectangularGridLayout({ countX: 8, countY: 8, spacingXM: 0.5, spacingYM: 0.5 });
  const ds = dipolesFromLayout(layout, { lengthM: 0.45, radiusM: 1e-3 });
  const th = Float64Array.from({ length: 73 }, (_, i) => (i * Math.PI) / 72);
  const ph = Float64Array.from({ length: 144 }, (_, i) => (i * Math.PI) / 72);
  const set = dipoleEmbeddedPatterns(ds, F, th, ph);
  const rnd = seededRandom(0x5eed);
  const m = 10_000;
  const tq = Float64Array.from({ length: m }, () => Math.acos(1 - 2 * rnd()));
  const pq = Float64Array.from({ length: m }, () => 2 * Math.PI * rnd());
  const interp = patternInterpolator(set);
  const outT = { rows: 64, cols: m, data: new Float64Array(2 * 64 * m) };
  const outP = { rows: 64, cols: m, data: new Float64Array(2 * 64 * m) };
  bench('prepare + evaluate (allocating)', () => { sink(patternInterpolator(set).evaluate(tq, pq).thetaComponentV); });
  bench('evaluateInto (prepared)', () => { sink(interp.evaluateInto(outT, outP, tq, pq).thetaComponentV); });
});
