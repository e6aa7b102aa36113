import { describe, it } from 'vitest';
import { herkLowerKernel, mirrorLowerToUpper } from '../../src/internal/herk.js';
import { adjoint, multiply, hermitianPart } from '../../src/linalg/ops.js';
import { expectCMatrixClose, randomMatrix } from '../helpers/matchers.js';

describe('herkLowerKernel', () => {
  it('equals G·Gᴴ (core multiply) for odd and even orders, with a leading dimension wider than k', () => {
    for (const [n, k] of [[1, 3], [2, 1], [5, 7], [8, 16], [9, 2]]) {
      const ld = k + 3;
      const g = randomMatrix(n, ld, 100 * n + k);
      const gk = { rows: n, cols: k, data: new Float64Array(2 * n * k) };
      for (let i = 0; i < n; i++) gk.data.set(g.data.subarray(2 * i * ld, 2 * i * ld + 2 * k), 2 * i * k);
      const c = new Float64Array(2 * n * n);
      herkLowerKernel(n, k, g.data, ld, c);
      herkLowerKernel(n, k, g.data, ld, c); // accumulates
      mirrorLowerToUpper(n, c);
      const ref = hermitianPart(multiply(gk, adjoint(gk)));
      for (let q = 0; q < ref.data.length; q++) ref.data[q] *= 2;
      expectCMatrixClose({ rows: n, cols: n, data: c }, ref, { rtol: 1e-14 });
    }
  });
});
