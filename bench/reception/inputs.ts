/** Seeded inputs of the brightness-integral bench (shared with scripts/compare/reception.ts). */
import type { QuadratureDirections, SampledPortPatterns } from '../../src/reception/patterns.js';
import { seededRandom } from '../../test/helpers/random.js';

/** N ports sampled at M random directions (uniform on the sphere), equal weights, random brightness 3…283 K. */
export function brightnessInputs(n: number, m: number): { patterns: SampledPortPatterns; quad: QuadratureDirections; t: Float64Array } {
  const rnd = seededRandom(0x5eed);
  const th = new Float64Array(m), ph = new Float64Array(m), w = new Float64Array(m), t = new Float64Array(m);
  for (let k = 0; k < m; k++) { th[k] = Math.acos(2 * rnd() - 1); ph[k] = 2 * Math.PI * rnd(); w[k] = (4 * Math.PI) / m; t[k] = 3 + 280 * rnd(); }
  const mk = (): Float64Array => { const d = new Float64Array(2 * n * m); for (let k = 0; k < d.length; k++) d[k] = 2 * rnd() - 1; return d; };
  const patterns: SampledPortPatterns = {
    thetaRad: th, phiRad: ph, driveCurrentA: 1, frequencyHz: 1e9,
    thetaComponentV: { rows: n, cols: m, data: mk() }, phiComponentV: { rows: n, cols: m, data: mk() },
  };
  return { patterns, quad: { thetaRad: th, phiRad: ph, weightSr: w }, t };
}
