/** bench:compare entries of the reception module. */
import { brightnessCorrelation } from '../../src/index.js';
import type { QuadratureDirections, SampledPortPatterns } from '../../src/reception/patterns.js';
import { seededRandom } from '../../test/helpers/random.js';
import type { CompareKernel } from './types.js';

const N = 100, M = 20000;

function brightnessInputs(): { patterns: SampledPortPatterns; quad: QuadratureDirections; t: Float64Array } {
  const rnd = seededRandom(0x5eed);
  const th = new Float64Array(M), ph = new Float64Array(M), w = new Float64Array(M), t = new Float64Array(M);
  for (let k = 0; k < M; k++) { th[k] = Math.acos(2 * rnd() - 1); ph[k] = 2 * Math.PI * rnd(); w[k] = (4 * Math.PI) / M; t[k] = 3 + 280 * rnd(); }
  const mk = (): Float64Array => { const d = new Float64Array(2 * N * M); for (let k = 0; k < d.length; k++) d[k] = 2 * rnd() - 1; return d; };
  const patterns: SampledPortPatterns = {
    thetaRad: th, phiRad: ph, driveCurrentA: 1, frequencyHz: 1e9,
    thetaComponentV: { rows: N, cols: M, data: mk() }, phiComponentV: { rows: N, cols: M, data: mk() },
  };
  return { patterns, quad: { thetaRad: th, phiRad: ph, weightSr: w }, t };
}

export const kernels: CompareKernel<any>[] = [
  {
    name: `brightness integral, N = ${N} ports, ${M} directions`,
    targetMs: 60,
    setup: brightnessInputs,
    run: (s) => brightnessCorrelation(s.patterns, s.quad, s.t, 1e6),
    numpySnippet: {
      setup: `ft = rng.uniform(-1, 1, (${N}, ${M})) + 1j * rng.uniform(-1, 1, (${N}, ${M})); fp = rng.uniform(-1, 1, (${N}, ${M})) + 1j * rng.uniform(-1, 1, (${N}, ${M})); wt = (4 * np.pi / ${M}) * rng.uniform(3, 283, ${M})`,
      run: 'r = (ft * wt) @ ft.conj().T + (fp * wt) @ fp.conj().T',
    },
  },
];
