/** bench:compare entries of the geometry and pattern modules. */
import { arrayFactorInto, fftGridArrayFactorInto, rectangularGridLayout, steeringVector, directivity, arrayLayout, sphereQuadratureForLayout } from '../../src/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';
import { randomMatrix, randomUnitVectors, seededRandom } from '../../test/helpers/matchers.js';
import type { CompareKernel } from './types.js';

const F = 3e9, L = C0_M_PER_S / F;
const grid = { countX: 32, countY: 32, spacingXM: L / 2, spacingYM: L / 2 };


/** numpy: positions of the centred 32×32 λ/2 grid in wavelengths, weights steered to θ = 0.3 rad in the xz-plane. */
const NP_GRID = `n = 32; c = (np.arange(n) - (n - 1) / 2) * 0.5; X, Y = np.meshgrid(c, c); x = X.ravel(); y = Y.ravel(); k = 2 * np.pi
w = np.exp(1j * k * x * np.sin(0.3))`;

export const kernels: CompareKernel<any>[] = [
  {
    name: '32×32 λ/2 grid → 256×256 u-v grid, FFT path',
    targetMs: 0.9,
    setup: () => ({ w: steeringVector(rectangularGridLayout(grid), [Math.sin(0.3), 0, Math.cos(0.3)], F), out: { rows: 256, cols: 256, data: new Float64Array(2 * 256 * 256) } }),
    run: (s) => fftGridArrayFactorInto(s.out, grid, s.w, 256, 256),
    numpySnippet: {
      setup: `${NP_GRID}
g = (w.reshape(32, 32) * ((-1.0) ** np.add.outer(np.arange(32), np.arange(32))))
pu = np.exp(-2j * np.pi * 15.5 * (np.arange(256) - 128) / 256)`,
      run: 'af = np.conj(np.fft.fft2(g, s=(256, 256))) * np.outer(pu, pu)',
    },
  },
  {
    name: '32×32 λ/2 grid, direct sum over 65 536 arbitrary directions',
    targetMs: 40,
    targetRatio: 1.5,
    setup: () => {
      const layout = rectangularGridLayout(grid);
      return { layout, w: steeringVector(layout, [Math.sin(0.3), 0, Math.cos(0.3)], F), d: randomUnitVectors(65536, 0x5eed), out: { rows: 65536, cols: 1, data: new Float64Array(2 * 65536) } };
    },
    run: (s) => arrayFactorInto(s.out, s.layout, s.w, s.d, F),
    numpySnippet: {
      setup: `${NP_GRID}
z = rng.uniform(-1, 1, 65536); ph = rng.uniform(0, 2 * np.pi, 65536); r = np.sqrt(1 - z * z); u = r * np.cos(ph); v = r * np.sin(ph)
W = np.conj(w).reshape(32, 32)  # rows iy, columns ix
def rec(s): return np.concatenate([np.exp(1j * k * c[0] * s)[:, None], np.broadcast_to(np.exp(0.5j * k * s)[:, None], (s.size, 31))], 1).cumprod(1)`,
      // the lattice-factored sum in BLAS: AF_m = Σ_iy Ey[m, iy] · (Ex @ Wᵀ)[m, iy]
      run: 'af = ((np.exp(1j * k * np.outer(u, c)) @ W.T) * np.exp(1j * k * np.outer(v, c))).sum(1)',
      alternatives: [
        { label: 'einsum row-wise dot', run: 'af = np.einsum("ij,ij->i", np.exp(1j * k * np.outer(u, c)) @ W.T, np.exp(1j * k * np.outer(v, c)))' },
        // the phase tables by the recurrence e^{jk(c0 + iΔ)s} = e^{jk c0 s}·(e^{jkΔs})^i (cumprod), as phasewise builds them
        { label: 'recurrence phases (cumprod) + einsum', run: 'af = np.einsum("ij,ij->i", rec(u) @ W.T, rec(v))' },
      ],
    },
  },
  {
    name: 'directivity, 1024-element random layout, sphere quadrature',
    setup: () => {
      const rnd = seededRandom(0x5eed);
      const pts: Array<[number, number, number]> = [];
      for (let i = 0; i < 1024; i++) pts.push([16 * L * (rnd() - 0.5), 16 * L * (rnd() - 0.5), 0]);
      const layout = arrayLayout(pts);
      return { layout, w: randomMatrix(1024, 1, 3), rule: sphereQuadratureForLayout(layout, F) };
    },
    run: (s) => Float64Array.of(directivity(s.layout, s.w, [0, 0, 1], F, { quadrature: s.rule }).directivity),
  },
];
