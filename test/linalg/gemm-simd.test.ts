import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { gemmKernel, gemmScalarKernel, SIMD_MIN_WORK } from '../../src/internal/gemm.js';
import { simdGemm, simdGemmAvailable } from '../../src/internal/zgemm-wasm.js';
import { multiply, multiplyInto } from '../../src/linalg/ops.js';
import { zeros } from '../../src/linalg/cmatrix.js';
import { DimensionError } from '../../src/errors.js';
import { expectCMatrixClose, randomMatrix, subspaceMismatch } from '../helpers/matchers.js';

const EPS = Number.EPSILON;

/** Definition of the product, one entry at a time (the reference). */
function naive(m: number, n: number, k: number, a: Float64Array, offA: number, lda: number, b: Float64Array, offB: number, ldb: number): Float64Array {
  const c = new Float64Array(2 * m * n);
  for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) {
    let re = 0, im = 0;
    for (let p = 0; p < k; p++) {
      const ar = a[2 * (offA + i * lda + p)], ai = a[2 * (offA + i * lda + p) + 1];
      const br = b[2 * (offB + p * ldb + j)], bi = b[2 * (offB + p * ldb + j) + 1];
      re += ar * br - ai * bi;
      im += ar * bi + ai * br;
    }
    c[2 * (i * n + j)] = re; c[2 * (i * n + j) + 1] = im;
  }
  return c;
}

describe('complex product kernels (SIMD and scalar)', () => {
  it('WebAssembly SIMD is available on Node ≥ 20 (else the scalar path is used)', () => {
    expect(simdGemmAvailable()).toBe(true);
  });

  it('SIMD and scalar kernels equal the definition on odd/even shapes, offsets, strides, accumulate and alpha (property)', () => {
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 19 }), fc.integer({ min: 1, max: 19 }), fc.integer({ min: 1, max: 19 }),
      fc.integer({ min: 0, max: 3 }), fc.boolean(), fc.constantFrom(1, -1, 0.5), fc.integer(),
      (m, n, k, pad, accumulate, alpha, seed) => {
        const lda = k + pad, ldb = n + pad, ldc = n + pad, offA = pad, offB = 2 * pad, offC = pad;
        const a = randomMatrix(1, offA + m * lda, seed).data, b = randomMatrix(1, offB + k * ldb, seed + 1).data;
        const c0 = randomMatrix(1, offC + m * ldc, seed + 2).data;
        const ref = naive(m, n, k, a, offA, lda, b, offB, ldb);
        for (const which of ['simd', 'scalar'] as const) {
          const c = c0.slice();
          if (which === 'simd') expect(simdGemm(m, n, k, a, offA, lda, b, offB, ldb, c, offC, ldc, accumulate, alpha)).toBe(true);
          else gemmScalarKernel(m, n, k, a, offA, lda, b, offB, ldb, c, offC, ldc, accumulate, alpha);
          for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) for (let h = 0; h < 2; h++) {
            const got = c[2 * (offC + i * ldc + j) + h];
            const want = (accumulate ? c0[2 * (offC + i * ldc + j) + h] : 0) + alpha * ref[2 * (i * n + j) + h];
            // k-term sums of products of entries ≤ √2 in modulus: rounding ≤ 2kε·(2k + 1)
            expect(Math.abs(got - want)).toBeLessThanOrEqual(4 * k * EPS * (2 * k + 1));
          }
          // entries outside the C block are untouched
          for (let t = 0; t < 2 * offC; t++) expect(c[t]).toBe(c0[t]);
        }
      }), { seed: 17, numRuns: 60 });
  });

  it('multiplyInto above the SIMD threshold equals the definition (65×33 · 33×47)', () => {
    expect(65 * 47 * 33).toBeGreaterThan(SIMD_MIN_WORK);
    const a = randomMatrix(65, 33, 1), b = randomMatrix(33, 47, 2);
    const ref = { rows: 65, cols: 47, data: naive(65, 47, 33, a.data, 0, 33, b.data, 0, 47) };
    expectCMatrixClose(multiply(a, b), ref, { rtol: 100 * EPS });
    const out = randomMatrix(65, 47, 3);
    expectCMatrixClose(multiplyInto(out, a, b), ref, { rtol: 100 * EPS });
  });

  it('disjoint regions of one buffer (as in the blocked triangular solves) are safe', () => {
    // rows 0..9 of x are B, rows 10..19 are C: C −= A·B
    const x = randomMatrix(20, 30, 5).data;
    const a = randomMatrix(10, 10, 6).data;
    const before = x.slice();
    const ref = naive(10, 30, 10, a, 0, 10, before, 0, 30);
    gemmKernel(10, 30, 10, a, 0, 10, x, 0, 30, x, 300, 30, true, -1);
    for (let t = 0; t < 600; t++) expect(x[t]).toBe(before[t]);
    for (let t = 0; t < 600; t++) expect(Math.abs(x[600 + t] - (before[600 + t] - ref[t]))).toBeLessThan(1e-13);
  });

  it('multiplyInto still rejects an out that shares storage with an operand', () => {
    const a = zeros(40, 40);
    expect(() => multiplyInto(a, a, zeros(40, 40))).toThrow(DimensionError);
  });
});

describe('scalar fallbacks (WebAssembly SIMD switched off) agree with the SIMD paths', () => {
  it('product, Cholesky solve with many right-hand sides, Hermitian eigen', async () => {
    const { wasmSettings } = await import('../../src/internal/wasm-assembler.js');
    const { hermitianEigen } = await import('../../src/linalg/eigen.js');
    const { choleskyFactor, choleskySolve } = await import('../../src/linalg/cholesky.js');
    const { hermitianPart } = await import('../../src/linalg/ops.js');
    const { randomHpd } = await import('../helpers/matchers.js');
    const a = randomMatrix(40, 37, 1), b = randomMatrix(37, 45, 2);
    const h = hermitianPart(randomMatrix(48, 48, 3));
    const spd = randomHpd(33, 4), rhs = randomMatrix(33, 70, 5);
    const run = () => ({ p: multiply(a, b), e: hermitianEigen(h), x: choleskySolve(choleskyFactor(spd), rhs) });
    const withSimd = run();
    wasmSettings.enabled = false;
    try {
      expect(simdGemmAvailable()).toBe(false);
      const scalar = run();
      expectCMatrixClose(scalar.p, withSimd.p, { rtol: 100 * EPS });
      expectCMatrixClose(scalar.x, withSimd.x, { rtol: 1e-12 });
      for (let i = 0; i < 48; i++) expect(Math.abs(scalar.e.values[i] - withSimd.e.values[i])).toBeLessThan(1e-13);
      expect(subspaceMismatch(scalar.e.vectors!, withSimd.e.vectors!, withSimd.e.values, { clusterTol: 1e-9, scale: 48 * 10 })).toBeLessThanOrEqual(1);
    } finally {
      wasmSettings.enabled = true;
    }
  });
});
