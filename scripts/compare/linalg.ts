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

function eigen(n: number, targetMs?: number): CompareKernel<ReturnType<typeof seededHermitian>> {
  return {
    name: `Hermitian eigen ${n} (values + vectors)`,
    targetRatio: 2,
    ...(targetMs === undefined ? {} : { targetMs }),
    setup: () => seededHermitian(n, 3),
    run: (a) => hermitianEigen(a).vectors,
    numpySnippet: {
      setup: `import scipy.linalg as sla; a = ${crand(n, n)}; a = a + a.conj().T`,
      run: 'np.linalg.eigh(a)',
      alternatives: [
        { label: "scipy.linalg.eigh(driver='evr', check_finite=False)", run: "sla.eigh(a, driver='evr', check_finite=False)" },
        { label: "scipy.linalg.eigh(driver='evd', check_finite=False)", run: "sla.eigh(a, driver='evd', check_finite=False)" },
      ],
    },
  };
}

function cholesky(n: number, targetMs?: number): CompareKernel<{ a: ReturnType<typeof seededHpd>; b: ReturnType<typeof seededMatrix> }> {
  return {
    name: `Cholesky + 1000 right-hand sides, N = ${n}`,
    ...(n >= 512 ? { targetRatio: 2 } : {}),
    ...(targetMs === undefined ? {} : { targetMs }),
    setup: () => ({ a: seededHpd(n, 6), b: seededMatrix(n, 1000, 7) }),
    run: (s) => choleskySolve(choleskyFactor(s.a), s.b),
    numpySnippet: {
      setup: `import scipy.linalg as sla; g = ${crand(n, n)}; a = g @ g.conj().T + ${n} * np.eye(${n}); b = ${crand(n, 1000)}`,
      run: 'sla.cho_solve(sla.cho_factor(a, lower=True), b)',
      alternatives: [{ label: 'scipy cho_factor/cho_solve(check_finite=False)', run: 'sla.cho_solve(sla.cho_factor(a, lower=True, check_finite=False), b, check_finite=False)' }],
    },
  };
}

export const kernels: CompareKernel<any>[] = [
  product(128, 1.0),
  product(256, 8.0),
  eigen(128, 6.0),
  eigen(512),
  cholesky(128, 12.0),
  cholesky(512),
  {
    name: 'LU solve 128, 1 right-hand side',
    targetRatio: 3,
    setup: () => ({ a: seededMatrix(128, 128, 8), b: seededMatrix(128, 1, 9) }),
    run: (s) => solve(s.a, s.b),
    numpySnippet: {
      setup: `import scipy.linalg as sla; a = ${crand(128, 128)}; b = ${crand(128, 1)}`,
      run: 'np.linalg.solve(a, b)',
      alternatives: [{ label: 'scipy.linalg.solve(check_finite=False)', run: 'sla.solve(a, b, check_finite=False)' }],
    },
  },
  {
    name: 'SVD 64×64 (values + vectors)',
    targetRatio: 5,
    setup: () => seededMatrix(64, 64, 10),
    run: (a) => svd(a).u,
    numpySnippet: {
      setup: `import scipy.linalg as sla; a = ${crand(64, 64)}`,
      run: 'np.linalg.svd(a, full_matrices=False)',
      alternatives: [{ label: "scipy.linalg.svd(gesdd, check_finite=False)", run: 'sla.svd(a, full_matrices=False, check_finite=False)' }],
    },
  },
];
