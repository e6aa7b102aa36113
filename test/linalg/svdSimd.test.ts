import { describe, expect, it } from 'vitest';
import { svd } from '../../src/linalg/svd.js';
import { multiply, adjoint } from '../../src/linalg/ops.js';
import { wasmSettings } from '../../src/internal/wasm/runtime.js';
import { expectCMatrixClose, randomMatrix } from '../helpers/matchers.js';

const EPS = Number.EPSILON;

describe('SVD: WebAssembly SIMD Jacobi sweeps and the scalar sweeps agree', () => {
  it('tall, wide, square and rank-deficient inputs: same singular values to rounding, both reconstruct A', () => {
    const rankOne = multiply(randomMatrix(12, 1, 3), randomMatrix(1, 9, 4));
    for (const a of [randomMatrix(40, 40, 1), randomMatrix(31, 17, 2), randomMatrix(9, 23, 5), rankOne]) {
      const fast = svd(a);
      wasmSettings.enabled = false;
      let slow;
      try { slow = svd(a); } finally { wasmSettings.enabled = true; }
      const scale = fast.s[0];
      for (let i = 0; i < fast.s.length; i++) expect(Math.abs(fast.s[i] - slow.s[i])).toBeLessThan(100 * EPS * scale);
      // A = U Σ Vᴴ (one-sided Jacobi is backward stable: residual O(ε‖A‖), Demmel & Veselić, SIAM J. Matrix Anal. Appl. 13(4), 1992, from memory)
      const k = fast.s.length;
      const us = { rows: fast.u.rows, cols: k, data: fast.u.data.slice() };
      for (let i = 0; i < us.rows; i++) for (let j = 0; j < k; j++) { us.data[2 * (i * k + j)] *= fast.s[j]; us.data[2 * (i * k + j) + 1] *= fast.s[j]; }
      expectCMatrixClose(multiply(us, adjoint(fast.v)), a, { atol: 1e3 * EPS * scale });
    }
  });
});
