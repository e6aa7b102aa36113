/** bench:compare entries of the reception module. */
import { brightnessCorrelation } from '../../src/index.js';
import { brightnessInputs } from '../../bench/reception/inputs.js';
import type { CompareKernel } from './types.js';

const N = 100, M = 20000;

export const kernels: CompareKernel<any>[] = [
  {
    name: `brightness integral, N = ${N} ports, ${M} directions`,
    targetMs: 60,
    setup: () => brightnessInputs(N, M),
    run: (s) => brightnessCorrelation(s.patterns, s.quad, s.t, 1e6),
    numpySnippet: {
      setup: `from scipy.linalg.blas import zherk; ft = rng.uniform(-1, 1, (${N}, ${M})) + 1j * rng.uniform(-1, 1, (${N}, ${M})); fp = rng.uniform(-1, 1, (${N}, ${M})) + 1j * rng.uniform(-1, 1, (${N}, ${M})); wt = (4 * np.pi / ${M}) * rng.uniform(3, 283, ${M})`,
      run: 'r = (ft * wt) @ ft.conj().T + (fp * wt) @ fp.conj().T',
      alternatives: [
        // the Hermitian rank-k product: half the multiply-adds, one triangle (as phasewise computes it)
        { label: 'BLAS zherk on √w-scaled patterns', run: 's = np.sqrt(wt); r = zherk(1.0, ft * s); r = zherk(1.0, fp * s, beta=1.0, c=r, overwrite_c=1)' },
      ],
    },
  },
];
