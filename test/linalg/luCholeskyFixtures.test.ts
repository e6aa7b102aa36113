import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { type CMatrix, type CMatrixJSON, matrixFromJSON } from '../../src/linalg/cmatrix.js';
import { solve, inverse, determinant, luFactor } from '../../src/linalg/lu.js';
import { choleskyFactor, choleskySolve } from '../../src/linalg/cholesky.js';
import { NotPositiveDefiniteError } from '../../src/errors.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

// Reference values from numpy.linalg / scipy.linalg.cho_solve (generate_linalg.py; versions inside the JSON).
const EPS = Number.EPSILON;
const fixtures = JSON.parse(readFileSync(new URL('./fixtures/linalg.json', import.meta.url), 'utf8')) as {
  versions: Record<string, string>;
  cases: Record<string, Array<Record<string, unknown>>>;
};
const m = (x: unknown): CMatrix => matrixFromJSON(x as CMatrixJSON);

describe('LU and Cholesky against numpy/scipy fixtures', () => {
  it('fixture file records the generator versions', () => {
    expect(Object.keys(fixtures.versions)).toEqual(expect.arrayContaining(['numpy', 'scipy', 'mpmath']));
  });
  // Forward error of a backward-stable solve: ‖x − x̂‖/‖x‖ ≲ c·n·ε·κ(A) (Higham, Accuracy and Stability
  // of Numerical Algorithms, 2nd ed., 2002, Thm 7.2); both sides carry such an error, hence 2c.
  for (const fx of fixtures.cases.solve) {
    it(`solve: ${String(fx.name)}`, () => {
      const a = m(fx.a);
      expectCMatrixClose(solve(a, m(fx.b)), m(fx.x), { rtol: 40 * a.rows * EPS * Number(fx.cond) });
    });
  }
  for (const fx of fixtures.cases.inverse) {
    it(`inverse: ${String(fx.name)}`, () => {
      const a = m(fx.a);
      expectCMatrixClose(inverse(a), m(fx.inverse), { rtol: 40 * a.rows * EPS * Number(fx.cond) });
      // rcond is an estimate of 1/κ₁; κ₁ and κ₂ agree within a factor n (norm equivalence).
      const rcond = luFactor(a).rcond;
      expect(rcond * Number(fx.cond)).toBeGreaterThan(1 / (10 * a.rows));
      expect(rcond * Number(fx.cond)).toBeLessThan(10 * a.rows);
    });
  }
  for (const fx of fixtures.cases.determinant) {
    it(`determinant: ${String(fx.name)}`, () => {
      const a = m(fx.a);
      const d = determinant(a);
      const ref = Math.hypot(Number(fx.re), Number(fx.im));
      // det error relative O(n ε κ) for the product of pivots; these matrices have κ < 1e3.
      expect(Math.hypot(d.re - Number(fx.re), d.im - Number(fx.im))).toBeLessThanOrEqual(1e3 * a.rows * EPS * ref);
    });
  }
  for (const fx of fixtures.cases.cholesky) {
    it(`Cholesky solve: ${String(fx.name)}`, () => {
      const f = choleskyFactor(m(fx.a));
      if (fx.positiveDefinite === false) {
        expect(f.positiveDefinite).toBe(false);
        expect(() => choleskySolve(f, m({ rows: f.n, cols: 1, re: new Array(f.n).fill(1), im: new Array(f.n).fill(0) }))).toThrow(NotPositiveDefiniteError);
        return;
      }
      expect(f.positiveDefinite).toBe(true);
      expectCMatrixClose(choleskySolve(f, m(fx.b)), m(fx.x), { rtol: 40 * f.n * EPS * Number(fx.cond) });
    });
  }
});
