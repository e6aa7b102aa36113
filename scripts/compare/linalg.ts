/** bench:compare entries of the complex linear-algebra core. */
import { multiplyInto, zeros, hermitianEigen, choleskyFactor, choleskySolve, solve, svd } from '../../src/index.js';
import { seededHermitian, seededHpd, seededMatrix } from '../../bench/linalg/sink.js';
import type { CompareKernel } from './types.js';

const crand = (r: number, c: number): string => `(rng.uniform(-1, 1, (${r}, ${c})) + 1j * rng.uniform(-1, 1, (${r}, ${c})))`;

function product(n: number, targetMs: number): CompareKernel<{ a: ReturnType<typeof seededMatrix>; b: ReturnType<typeof seededMatrix>; out: ReturnType<typeof zeros> }> {
  return {
    name: `complex product ${n}×${n}`,
    targetMs,
    setup: () => ({ a: seededMatrix(n, n, 1), b: seededMatrix(n, n, 2), out: zeros(n, n) }),
    run: (s) => multiplyInto(s.out, s.a, s.b),
    numpySnippet: { setup: `a = ${crand(n, n)}; b = ${crand(n, n)}; out = np.empty((${n}, ${n}), complex)`, run: 'np.matmul(a, b, out=out)' },
  };
}

export const kernels: CompareKernel<any>[] = [
  product(128, 1.0),
  product(256, 8.0),
  {
    name: 'Hermitian eigen 128 (values + vectors)',
    targetMs: 6.0,
    setup: () => seededHermitian(128, 3),
    run: (a) => hermitianEigen(a).vectors,
    numpySnippet: { setup: `a = ${crand(128, 128)}; a = a + a.conj().T`, run: 'np.linalg.eigh(a)' },
  },
  {
    name: 'Cholesky + 1000 right-hand sides, N = 128',
    targetMs: 12.0,
    setup: () => ({ a: seededHpd(128, 6), b: seededMatrix(128, 1000, 7) }),
    run: (s) => choleskySolve(choleskyFactor(s.a), s.b),
    numpySnippet: {
      setup: `import scipy.linalg as sla; g = ${crand(128, 128)}; a = g @ g.conj().T + 128 * np.eye(128); b = ${crand(128, 1000)}`,
      run: 'sla.cho_solve(sla.cho_factor(a, lower=True), b)',
    },
  },
  {
    name: 'LU solve 128, 1 right-hand side',
    setup: () => ({ a: seededMatrix(128, 128, 8), b: seededMatrix(128, 1, 9) }),
    run: (s) => solve(s.a, s.b),
    numpySnippet: { setup: `a = ${crand(128, 128)}; b = ${crand(128, 1)}`, run: 'np.linalg.solve(a, b)' },
  },
  {
    name: 'SVD 64×64 (values + vectors)',
    setup: () => seededMatrix(64, 64, 10),
    run: (a) => svd(a).u,
    numpySnippet: { setup: `a = ${crand(64, 64)}`, run: 'np.linalg.svd(a, full_matrices=False)' },
  },
];
