import { describe, it, expect } from 'vitest';
import { batchedSolveInPlace, batchedTransposeInPlace, solveSmallInPlace } from '../../src/internal/batched.js';
import { solve, transpose, fromRows } from '../../src/linalg/index.js';
import { expectCMatrixClose, randomMatrix } from '../helpers/matchers.js';

describe('batched small complex solve (src/internal/batched.ts)', () => {
  it('agrees with the core LU solve on a stack of random systems (residual-level tolerance)', () => {
    const n = 5, m = 3, count = 7;
    const a = new Float64Array(2 * n * n * count), b = new Float64Array(2 * n * m * count);
    const as = [], bs = [];
    for (let k = 0; k < count; k++) {
      const ak = randomMatrix(n, n, 100 + k), bk = randomMatrix(n, m, 200 + k);
      as.push(ak); bs.push(bk);
      a.set(ak.data, 2 * n * n * k); b.set(bk.data, 2 * n * m * k);
    }
    expect(batchedSolveInPlace(n, m, count, a, b)).toBe(-1);
    for (let k = 0; k < count; k++) {
      expectCMatrixClose({ rows: n, cols: m, data: b.slice(2 * n * m * k, 2 * n * m * (k + 1)) }, solve(as[k], bs[k]), { rtol: 1e-12 });
    }
  });
  it('reports the first singular matrix of the stack', () => {
    const good = fromRows([[2, 1], [1, 3]]), bad = fromRows([[1, 2], [2, 4]]);
    const a = new Float64Array([...good.data, ...bad.data, ...good.data]);
    const b = new Float64Array(12).fill(1);
    expect(batchedSolveInPlace(2, 1, 3, a, b)).toBe(1);
    expect(solveSmallInPlace(2, 1, fromRows([[0, 0], [0, 0]]).data, 0, new Float64Array(4), 0)).toBe(0);
  });
  it('transposes every matrix of a stack', () => {
    const x = randomMatrix(3, 3, 9);
    const stack = new Float64Array([...x.data, ...x.data]);
    batchedTransposeInPlace(3, 2, stack);
    expectCMatrixClose({ rows: 3, cols: 3, data: stack.slice(18) }, transpose(x), { rtol: 0 });
  });
});
