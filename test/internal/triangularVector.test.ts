import { describe, expect, it } from 'vitest';
import { solveVectorInPlace } from '../../src/internal/triangular.js';
import { randomMatrix } from '../helpers/matchers.js';

const EPS = Number.EPSILON;

describe('one-right-hand-side substitution (solveVectorInPlace)', () => {
  it('T x = b and Tᴴ x = b for lower/upper, unit/non-unit T: residual within the substitution backward-error bound', () => {
    for (const n of [1, 2, 7, 40]) for (const lower of [true, false]) for (const unit of [true, false]) for (const adjoint of [false, true]) {
      // diagonally dominant triangular T with a complex diagonal
      const t = randomMatrix(n, n, 3 * n + (lower ? 1 : 0)).data;
      for (let i = 0; i < n; i++) for (let p = 0; p < n; p++) {
        if (lower ? p > i : p < i) { t[2 * (i * n + p)] = 0; t[2 * (i * n + p) + 1] = 0; }
        if (p === i) { t[2 * (i * n + i)] += n; t[2 * (i * n + i) + 1] -= 0.5 * n; }
      }
      const b = randomMatrix(n, 1, 5 * n).data;
      const x = b.slice();
      solveVectorInPlace(n, t, x, lower, unit, adjoint);
      // op(T)[i, p] = T[i, p] or conj(T[p, i]); the unit diagonal replaces T's diagonal by 1
      const entry = (i: number, p: number): [number, number] => {
        if (unit && i === p) return [1, 0];
        return adjoint ? [t[2 * (p * n + i)], -t[2 * (p * n + i) + 1]] : [t[2 * (i * n + p)], t[2 * (i * n + p) + 1]];
      };
      for (let i = 0; i < n; i++) {
        let re = -b[2 * i], im = -b[2 * i + 1], bound = 0;
        for (let p = 0; p < n; p++) {
          const [tr, ti] = entry(i, p), xr = x[2 * p], xi = x[2 * p + 1];
          re += tr * xr - ti * xi; im += tr * xi + ti * xr;
          bound += Math.hypot(tr, ti) * Math.hypot(xr, xi);
        }
        // |op(T) x − b| ≤ c·n·ε·|op(T)||x| (Higham, Accuracy and Stability of Numerical Algorithms, 2nd ed., 2002, Thm 8.5, from memory), c = 4 for complex
        expect(Math.hypot(re, im)).toBeLessThanOrEqual(4 * (n + 1) * EPS * bound + 1e-300);
      }
    }
  });
});
