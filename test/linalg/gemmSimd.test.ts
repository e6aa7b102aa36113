import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { gemmKernel, gemmScalarKernel, SIMD_MIN_WORK } from '../../src/internal/gemm.js';
import { simdGemm, simdGemmAvailable } from '../../src/internal/ztileWasm.js';
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
    const { wasmSettings } = await import('../../src/internal/wasm/runtime.js');
    const { hermitianEigen } = await import('../../src/linalg/eigen.js');
    const { choleskyFactor, choleskySolve } = await import('../../src/linalg/cholesky.js');
    const { hermitianPart } = await import('../../src/linalg/ops.js');
    const { randomHpd } = await import('../helpers/matchers.js');
    const a = randomMatrix(40, 37, 1), b = randomMatrix(37, 45, 2);
    const h = hermitianPart(randomMatrix(104, 104, 3)); // ≥ 100: divide and conquer
    const spd = randomHpd(33, 4), rhs = randomMatrix(33, 70, 5);
    const run = () => ({ p: multiply(a, b), e: hermitianEigen(h), x: choleskySolve(choleskyFactor(spd), rhs) });
    const withSimd = run();
    wasmSettings.enabled = false;
    try {
      expect(simdGemmAvailable()).toBe(false);
      const scalar = run();
      expectCMatrixClose(scalar.p, withSimd.p, { rtol: 100 * EPS });
      expectCMatrixClose(scalar.x, withSimd.x, { rtol: 1e-12 });
      for (let i = 0; i < 104; i++) expect(Math.abs(scalar.e.values[i] - withSimd.e.values[i])).toBeLessThan(1e-13);
      expect(subspaceMismatch(scalar.e.vectors!, withSimd.e.vectors!, withSimd.e.values, { clusterTol: 1e-9, scale: 104 * 10 })).toBeLessThanOrEqual(1);
    } finally {
      wasmSettings.enabled = true;
    }
  });
});

describe('SIMD triangular substitution', () => {
  it('solves lower/upper, unit/non-unit systems with complex diagonals: T·X reproduces B, and equals the scalar path (property)', async () => {
    const { simdSolveTriangular } = await import('../../src/internal/triangularWasm.js');
    const { solveLowerInPlace, solveUpperInPlace } = await import('../../src/internal/triangular.js');
    const { wasmSettings } = await import('../../src/internal/wasm/runtime.js');
    fc.assert(fc.property(
      fc.integer({ min: 1, max: 40 }), fc.integer({ min: 1, max: 150 }), fc.boolean(), fc.boolean(), fc.integer(),
      (n, nrhs, lower, unit, seed) => {
        // diagonally dominant triangular T (well conditioned), complex diagonal; with a unit
        // diagonal the off-diagonal entries are scaled by 1/n so that it stays dominant
        const t = randomMatrix(n, n, seed).data;
        for (let i = 0; i < n; i++) {
          for (let p = 0; p < n; p++) {
            if (lower ? p > i : p < i) { t[2 * (i * n + p)] = 0; t[2 * (i * n + p) + 1] = 0; }
            else if (unit && p !== i) { t[2 * (i * n + p)] /= n; t[2 * (i * n + p) + 1] /= n; }
          }
          t[2 * (i * n + i)] += lower ? 0.5 * n : -0.5 * n; t[2 * (i * n + i) + 1] += 0.3 * n;
        }
        const b = randomMatrix(n, nrhs, seed + 1).data;
        const x = b.slice();
        expect(simdSolveTriangular(n, nrhs, [{ t, lower, unitDiagonal: unit }], x)).toBe(true);
        // residual T·X − B (unit diagonal taken as 1) against the componentwise backward-error
        // bound of substitution, |T X − B| ≤ c·n·ε·|T||X| (Higham, Accuracy and Stability of
        // Numerical Algorithms, 2nd ed., 2002, Thm 8.5, from memory), with c = 4 for complex arithmetic
        for (let i = 0; i < n; i++) for (let j = 0; j < nrhs; j++) {
          let re = -b[2 * (i * nrhs + j)], im = -b[2 * (i * nrhs + j) + 1], bound = 0;
          for (let p = 0; p < n; p++) {
            const tr = unit && p === i ? 1 : t[2 * (i * n + p)], ti = unit && p === i ? 0 : t[2 * (i * n + p) + 1];
            const xr = x[2 * (p * nrhs + j)], xi = x[2 * (p * nrhs + j) + 1];
            re += tr * xr - ti * xi; im += tr * xi + ti * xr;
            bound += Math.hypot(tr, ti) * Math.hypot(xr, xi);
          }
          expect(Math.hypot(re, im)).toBeLessThanOrEqual(4 * (n + 1) * EPS * bound);
        }
        const y = b.slice();
        wasmSettings.enabled = false;
        try {
          (lower ? solveLowerInPlace : solveUpperInPlace)(n, nrhs, t, y, unit);
        } finally {
          wasmSettings.enabled = true;
        }
        for (let q = 0; q < y.length; q++) expect(Math.abs(x[q] - y[q])).toBeLessThan(1e-12 * (1 + Math.abs(y[q])));
      }), { seed: 23, numRuns: 40 });
  });
});

describe('SIMD Hermitian rank-k update', () => {
  it('lower triangle of C + G·Gᴴ equals the definition for odd/even n and k, upper triangle untouched (property)', async () => {
    const { simdHerkLower, herkLowerScalarKernel } = await import('../../src/internal/herk.js');
    fc.assert(fc.property(fc.integer({ min: 1, max: 23 }), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 0, max: 3 }), fc.integer(), (n, k, pad, seed) => {
      const ldg = k + pad;
      const g = randomMatrix(n, ldg, seed).data;
      const c0 = randomMatrix(n, n, seed + 1).data;
      const c = c0.slice(), cs = c0.slice();
      expect(simdHerkLower(n, k, g, ldg, c)).toBe(true);
      herkLowerScalarKernel(n, k, g, ldg, cs);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        let re = 0, im = 0;
        for (let p = 0; p < k; p++) {
          const ar = g[2 * (i * ldg + p)], ai = g[2 * (i * ldg + p) + 1], br = g[2 * (j * ldg + p)], bi = g[2 * (j * ldg + p) + 1];
          re += ar * br + ai * bi; im += ai * br - ar * bi;
        }
        const q = 2 * (i * n + j);
        if (j > i) { expect(c[q]).toBe(c0[q]); expect(c[q + 1]).toBe(c0[q + 1]); continue; }
        // k products of entries ≤ √2 in modulus: rounding ≤ 4kε·(2k + 1)
        expect(Math.abs(c[q] - (c0[q] + re))).toBeLessThanOrEqual(4 * k * EPS * (2 * k + 1));
        expect(Math.abs(c[q + 1] - (c0[q + 1] + (j === i ? 0 : im)))).toBeLessThanOrEqual(4 * k * EPS * (2 * k + 1));
        expect(Math.abs(c[q] - cs[q])).toBeLessThanOrEqual(4 * k * EPS * (2 * k + 1));
      }
    }), { seed: 29, numRuns: 60 });
  });
});

describe('fused lower-then-upper substitution', () => {
  it('equals the two scalar substitutions in sequence (unit and non-unit, complex diagonals, odd widths)', async () => {
    const { solveLowerThenUpperInPlace, solveLowerInPlace, solveUpperInPlace } = await import('../../src/internal/triangular.js');
    const { wasmSettings } = await import('../../src/internal/wasm/runtime.js');
    for (const [n, nrhs, lUnit, uUnit] of [[37, 131, true, false], [20, 5, false, true], [64, 70, false, false]] as const) {
      const l = randomMatrix(n, n, n).data, u = randomMatrix(n, n, n + 1).data;
      for (let i = 0; i < n; i++) {
        for (let p = 0; p < n; p++) {
          if (p > i) { l[2 * (i * n + p)] = 0; l[2 * (i * n + p) + 1] = 0; }
          if (p < i) { u[2 * (i * n + p)] = 0; u[2 * (i * n + p) + 1] = 0; }
        }
        l[2 * (i * n + i)] += n; u[2 * (i * n + i) + 1] -= n;
      }
      const b = randomMatrix(n, nrhs, 7).data;
      const x = b.slice();
      solveLowerThenUpperInPlace(n, nrhs, l, lUnit, u, uUnit, x);
      const y = b.slice();
      wasmSettings.enabled = false;
      try {
        solveLowerInPlace(n, nrhs, l, y, lUnit);
        solveUpperInPlace(n, nrhs, u, y, uUnit);
      } finally {
        wasmSettings.enabled = true;
      }
      const scale = y.reduce((m, v) => Math.max(m, Math.abs(v)), 0);
      for (let q = 0; q < y.length; q++) expect(Math.abs(x[q] - y[q])).toBeLessThan(1e-12 * scale);
    }
  });
});

describe('SIMD weighted Hermitian rank-k update', () => {
  it('lower triangle of C + Σₛ Gₛ diag(d) Gₛᴴ equals the definition, zero weights skipped (property)', async () => {
    const { herkLowerWeighted } = await import('../../src/internal/herk.js');
    fc.assert(fc.property(fc.integer({ min: 8, max: 23 }), fc.integer({ min: 1, max: 30 }), fc.integer({ min: 1, max: 2 }), fc.integer(), (n, k, parts, seed) => {
      const ldg = k + 2;
      const gs = Array.from({ length: parts }, (_, s) => randomMatrix(n, ldg, seed + s).data);
      const d = randomMatrix(1, k, seed + 7).data.subarray(0, k).map((v, p) => (p % 3 === 1 ? 0 : Math.abs(v)));
      const c0 = randomMatrix(n, n, seed + 9).data;
      const c = c0.slice();
      expect(herkLowerWeighted(n, k, gs, ldg, d, c)).toBe(true);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        let re = 0, im = 0;
        for (const g of gs) for (let p = 0; p < k; p++) {
          const ar = g[2 * (i * ldg + p)], ai = g[2 * (i * ldg + p) + 1], br = g[2 * (j * ldg + p)], bi = g[2 * (j * ldg + p) + 1];
          re += d[p] * (ar * br + ai * bi); im += d[p] * (ai * br - ar * bi);
        }
        const q = 2 * (i * n + j);
        if (j > i) { expect(c[q]).toBe(c0[q]); continue; }
        // 2k weighted products of entries ≤ √2 (weights ≤ √2): rounding ≤ 8kε·(4k + 1)
        expect(Math.abs(c[q] - (c0[q] + re))).toBeLessThanOrEqual(8 * k * EPS * (4 * k + 1));
        expect(Math.abs(c[q + 1] - (c0[q + 1] + (j === i ? 0 : im)))).toBeLessThanOrEqual(8 * k * EPS * (4 * k + 1));
      }
    }), { seed: 31, numRuns: 40 });
    // below the SIMD order the caller keeps its scalar path
    expect(herkLowerWeighted(5, 4, [new Float64Array(40)], 4, new Float64Array(4).fill(1), new Float64Array(50))).toBe(false);
  });
});
