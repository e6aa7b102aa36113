/** bench:compare entries of the beamforming module. */
import { maxSnrWeightsForDirections, musicSpectrum } from '../../src/index.js';
import { maxSnrInputs, musicInputs } from '../../bench/beamform/inputs.js';
import type { CompareKernel } from './types.js';

const lineScanPy = (n: number, count: number): string =>
  `np.exp(1j * np.pi * np.outer(np.arange(${n}) - (${n} - 1) / 2, np.linspace(-0.99, 0.99, ${count})))`;

export const kernels: CompareKernel<any>[] = [
  {
    name: '1000 max-SNR beams, N = 128 (factor, solve, distortionless)',
    targetMs: 10.0,
    setup: maxSnrInputs,
    run: (s) => maxSnrWeightsForDirections(s.steering, s.noise),
    numpySnippet: {
      setup: `import scipy.linalg as sla; g = rng.uniform(-1, 1, (128, 128)) + 1j * rng.uniform(-1, 1, (128, 128)); rn = g @ g.conj().T + 128 * np.eye(128); a = ${lineScanPy(128, 1000)}`,
      run: 'w = sla.cho_solve(sla.cho_factor(rn, lower=True), a); w = w / np.conj(np.sum(np.conj(w) * a, axis=0))',
      alternatives: [{
        label: 'scipy cho_factor/cho_solve(check_finite=False)',
        run: 'w = sla.cho_solve(sla.cho_factor(rn, lower=True, check_finite=False), a, check_finite=False); w = w / np.conj(np.sum(np.conj(w) * a, axis=0))',
      }],
    },
  },
  {
    name: 'MUSIC spectrum N = 64, 10 000 directions, K = 3',
    setup: musicInputs,
    run: (s) => musicSpectrum(s.correlation, s.scan, 3),
    numpySnippet: {
      setup: `a3 = ${lineScanPy(64, 3)}; r = a3 @ a3.conj().T + 0.1 * np.eye(64); s = ${lineScanPy(64, 10000)}`,
      run: 'w, v = np.linalg.eigh(r); es = v[:, -3:]; p = np.sum(np.abs(s) ** 2, axis=0); q = np.sum(np.abs(es.conj().T @ s) ** 2, axis=0); out = p / (p - q)',
    },
  },
];
