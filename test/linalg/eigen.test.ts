import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { type CMatrix, type CMatrixJSON, fromRows, matrixFromJSON, zeros, columnVector } from '../../src/linalg/cmatrix.js';
import { frobeniusNorm, hermitianPart, adjoint, multiply, innerProduct } from '../../src/linalg/ops.js';
import { solve } from '../../src/linalg/lu.js';
import { hermitianEigen, generalizedHermitianEigen } from '../../src/linalg/eigen.js';
import { DimensionError, DomainError, NotPositiveDefiniteError } from '../../src/errors.js';
import { eigenResidual, orthonormalityError, randomHpd, randomMatrix, subspaceMismatch } from '../helpers/matchers.js';

const EPS = Number.EPSILON;
const fixtures = JSON.parse(readFileSync(new URL('./fixtures/linalg.json', import.meta.url), 'utf8')) as {
  cases: Record<string, Array<Record<string, unknown>>>;
};
const m = (x: unknown): CMatrix => matrixFromJSON(x as CMatrixJSON);
const maxAbs = (v: ArrayLike<number>): number => { let s = 0; for (let i = 0; i < v.length; i++) s = Math.max(s, Math.abs(v[i])); return s; };

describe('hermitianEigen', () => {
  it('2×2 worked example [[2, j], [−j, 2]]: λ = 1, 3', () => {
    // Hand computation: det([[2−λ, j], [−j, 2−λ]]) = (2−λ)² − 1 = 0 → λ = 1, 3.
    const { values, vectors } = hermitianEigen(fromRows([[2, { re: 0, im: 1 }], [{ re: 0, im: -1 }, 2]]));
    expect(Math.abs(values[0] - 1)).toBeLessThan(4 * EPS);
    expect(Math.abs(values[1] - 3)).toBeLessThan(8 * EPS);
    expect(orthonormalityError(vectors!)).toBeLessThan(8 * EPS);
  });

  it('Hermitian circulant: eigenvalues are the DFT of its first row', () => {
    // R. M. Gray, "Toeplitz and circulant matrices: a review", Found. Trends Commun. Inf. Theory 2(3), 2006, §3.1:
    // C_{jk} = c_{(k−j) mod n} has eigenvalues ψ_m = Σ_k c_k e^{−2πi mk/n}; c_{n−k} = conj(c_k) makes C Hermitian.
    const n = 9;
    const cr = [2.5, 0.3, -0.7, 0.2, 0.05, 0.05, 0.2, -0.7, 0.3];
    const ci = [0, 0.4, 0.1, -0.2, 0.3, -0.3, 0.2, -0.1, -0.4];
    const c = zeros(n, n);
    for (let j = 0; j < n; j++) for (let k = 0; k < n; k++) {
      const t = (k - j + n) % n;
      c.data[2 * (j * n + k)] = cr[t];
      c.data[2 * (j * n + k) + 1] = ci[t];
    }
    const expected: number[] = [];
    for (let q = 0; q < n; q++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += cr[k] * Math.cos((2 * Math.PI * q * k) / n) + ci[k] * Math.sin((2 * Math.PI * q * k) / n);
      expected.push(s);
    }
    expected.sort((a, b) => a - b);
    const { values } = hermitianEigen(c);
    for (let q = 0; q < n; q++) expect(Math.abs(values[q] - expected[q])).toBeLessThan(20 * n * EPS * 4);
  });

  for (const fx of fixtures.cases.hermitianEigen) {
    it(`numpy eigh fixture: ${String(fx.name)}`, () => {
      const a = m(fx.a);
      const ref = fx.values as number[];
      const n = a.rows;
      const { values, vectors } = hermitianEigen(a);
      const scale = maxAbs(ref); // ‖A‖₂
      // Weyl: a backward-stable solver moves each eigenvalue by ≤ ‖E‖₂ = O(n ε ‖A‖₂); numpy's error is of the same order.
      for (let i = 0; i < n; i++) expect(Math.abs(values[i] - ref[i])).toBeLessThanOrEqual(10 * n * EPS * scale);
      // Vectors: invariant-subspace projectors per cluster (Davis–Kahan).
      expect(subspaceMismatch(vectors!, m(fx.vectors), ref, { clusterTol: 1e-6 * scale, scale: n * scale })).toBeLessThanOrEqual(1);
      expect(eigenResidual(a, vectors!, values)).toBeLessThanOrEqual(100 * EPS * frobeniusNorm(a));
      expect(orthonormalityError(vectors!)).toBeLessThanOrEqual(1e-12);
    });
  }

  it('A V = V Λ, Vᴴ V = I, ascending, trace = Σλ on random Hermitian matrices (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: 40 }), fc.integer(), (n, seed) => {
      const a = hermitianPart(randomMatrix(n, n, seed));
      const { values, vectors } = hermitianEigen(a);
      expect(eigenResidual(a, vectors!, values)).toBeLessThanOrEqual(100 * EPS * frobeniusNorm(a));
      expect(orthonormalityError(vectors!)).toBeLessThanOrEqual(1e-12);
      let tr = 0, sum = 0;
      for (let i = 0; i < n; i++) { tr += a.data[2 * (i * n + i)]; sum += values[i]; }
      expect(Math.abs(tr - sum)).toBeLessThanOrEqual(10 * n * EPS * frobeniusNorm(a));
      for (let i = 1; i < n; i++) expect(values[i]).toBeGreaterThanOrEqual(values[i - 1]);
    }), { seed: 11, numRuns: 40 });
  });

  it('N = 256: orthonormality ≤ 1e-12; N = 512: backward error ≤ 100 ε ‖A‖', () => {
    const a256 = hermitianPart(randomMatrix(256, 256, 256));
    const r256 = hermitianEigen(a256);
    expect(orthonormalityError(r256.vectors!)).toBeLessThanOrEqual(1e-12);
    const a = hermitianPart(randomMatrix(512, 512, 512));
    const { values, vectors } = hermitianEigen(a);
    expect(eigenResidual(a, vectors!, values)).toBeLessThanOrEqual(100 * EPS * frobeniusNorm(a));
    expect(orthonormalityError(vectors!)).toBeLessThanOrEqual(1e-12);
  });

  /** Q = H₁ ⋯ H₆, H_t = I − 2 w wᴴ/(wᴴw), w_j = cos(0.7 j t + 0.3) + i sin(1.3 j + 0.5 t): the unitary of generate_linalg.py. */
  function formulaUnitary(n: number): CMatrix {
    const q = zeros(n, n), d = q.data;
    for (let i = 0; i < n; i++) d[2 * (i * n + i)] = 1;
    const wr = new Float64Array(n), wi = new Float64Array(n);
    for (let t = 1; t <= 6; t++) {
      let ww = 0;
      for (let j = 0; j < n; j++) { wr[j] = Math.cos(0.7 * j * t + 0.3); wi[j] = Math.sin(1.3 * j + 0.5 * t); ww += wr[j] ** 2 + wi[j] ** 2; }
      for (let i = 0; i < n; i++) {
        // row i of Q ← row − (2/wᴴw) (row · w) wᴴ
        let sr = 0, si = 0;
        for (let j = 0; j < n; j++) { const p = 2 * (i * n + j); sr += d[p] * wr[j] - d[p + 1] * wi[j]; si += d[p] * wi[j] + d[p + 1] * wr[j]; }
        sr *= 2 / ww; si *= 2 / ww;
        for (let j = 0; j < n; j++) { const p = 2 * (i * n + j); d[p] -= sr * wr[j] + si * wi[j]; d[p + 1] -= si * wr[j] - sr * wi[j]; }
      }
    }
    return q;
  }

  for (const fx of fixtures.cases.hermitianEigenStructured) {
    it(`divide and conquer (n ≥ 100): Q diag(λ) Qᴴ with ${String(fx.name)} — exact spectrum, numpy eigh, exact invariant subspaces`, () => {
      const lam = fx.spectrum as number[], ref = fx.values as number[], n = lam.length;
      const q = formulaUnitary(n);
      const ql = zeros(n, n);
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        const p = 2 * (i * n + j);
        ql.data[p] = q.data[p] * lam[j]; ql.data[p + 1] = q.data[p + 1] * lam[j];
      }
      const a = hermitianPart(multiply(ql, adjoint(q)));
      const a01 = fx.a01 as number[];
      expect(Math.hypot(a.data[2] - a01[0], a.data[3] - a01[1])).toBeLessThan(1e-13); // the same A as the generator
      const scale = maxAbs(lam);
      const { values, vectors } = hermitianEigen(a);
      const exact = [...lam].sort((x, y) => x - y);
      for (let i = 0; i < n; i++) {
        expect(Math.abs(values[i] - exact[i])).toBeLessThanOrEqual(10 * n * EPS * scale);
        expect(Math.abs(values[i] - ref[i])).toBeLessThanOrEqual(10 * n * EPS * scale);
      }
      expect(eigenResidual(a, vectors!, values)).toBeLessThanOrEqual(100 * EPS * frobeniusNorm(a));
      expect(orthonormalityError(vectors!)).toBeLessThanOrEqual(1e-12);
      // Each cluster C (exact eigenvalues closer than 1e-6·scale) spans the exact invariant subspace:
      // ‖(I − Q_C Q_Cᴴ) V_C‖_F ≤ O(n ε ‖A‖ / gap) (Davis–Kahan), gap = distance to the rest of the spectrum.
      const cols = Array.from({ length: n }, (_, j) => j).sort((x, y) => lam[x] - lam[y]);
      const r = new Float64Array(2 * n);
      for (let c0 = 0; c0 < n;) {
        let c1 = c0 + 1;
        while (c1 < n && exact[c1] - exact[c1 - 1] <= 1e-6 * scale) c1++;
        const gap = Math.min(c0 > 0 ? exact[c0] - exact[c0 - 1] : Infinity, c1 < n ? exact[c1] - exact[c1 - 1] : Infinity);
        let res2 = 0;
        for (let y = c0; y < c1; y++) {
          for (let i = 0; i < n; i++) { r[2 * i] = vectors!.data[2 * (i * n + y)]; r[2 * i + 1] = vectors!.data[2 * (i * n + y) + 1]; }
          for (let x = c0; x < c1; x++) {
            let sr = 0, si = 0; // q_xᴴ v_y
            for (let i = 0; i < n; i++) {
              const p = 2 * (i * n + cols[x]), qr = q.data[p], qi = q.data[p + 1];
              const vr = vectors!.data[2 * (i * n + y)], vi = vectors!.data[2 * (i * n + y) + 1];
              sr += qr * vr + qi * vi; si += qr * vi - qi * vr;
            }
            for (let i = 0; i < n; i++) {
              const p = 2 * (i * n + cols[x]), qr = q.data[p], qi = q.data[p + 1];
              r[2 * i] -= qr * sr - qi * si; r[2 * i + 1] -= qr * si + qi * sr;
            }
          }
          for (let i = 0; i < 2 * n; i++) res2 += r[i] * r[i];
        }
        expect(Math.sqrt(res2)).toBeLessThanOrEqual(Math.max(1e-13, (10 * n * EPS * scale) / gap));
        c0 = c1;
      }
      // values-only (QL) agrees to rounding
      const vo = hermitianEigen(a, { valuesOnly: true }).values;
      for (let i = 0; i < n; i++) expect(Math.abs(vo[i] - values[i])).toBeLessThanOrEqual(10 * n * EPS * scale);
    });
  }

  it('valuesOnly returns the same eigenvalues and no vectors', () => {
    const a = hermitianPart(randomMatrix(30, 30, 5));
    const full = hermitianEigen(a);
    const vals = hermitianEigen(a, { valuesOnly: true });
    expect(vals.vectors).toBeNull();
    for (let i = 0; i < 30; i++) expect(vals.values[i]).toBe(full.values[i]);
  });

  it('zero matrix and 1×1', () => {
    expect(Array.from(hermitianEigen(zeros(3, 3)).values)).toEqual([0, 0, 0]);
    const r = hermitianEigen(fromRows([[-4.5]]));
    expect(r.values[0]).toBe(-4.5);
    expect(Math.hypot(r.vectors!.data[0], r.vectors!.data[1])).toBeCloseTo(1, 15);
  });

  it('bad input: non-square, empty, NaN, Infinity, non-Hermitian, not a matrix', () => {
    expect(() => hermitianEigen(zeros(2, 3))).toThrow(DimensionError);
    expect(() => hermitianEigen(zeros(0, 0))).toThrow(DimensionError);
    expect(() => hermitianEigen(fromRows([[1, 0], [0, 1]]).data as unknown as CMatrix)).toThrow(DimensionError);
    const nan = zeros(2, 2); nan.data[2] = NaN;
    expect(() => hermitianEigen(nan)).toThrow(DomainError);
    expect(() => hermitianEigen(nan)).toThrow(/NaN/);
    const inf = zeros(2, 2); inf.data[7] = -Infinity;
    expect(() => hermitianEigen(inf)).toThrow(DomainError);
    const skew = fromRows([[1, 2], [3, 1]]);
    expect(() => hermitianEigen(skew)).toThrow(/deviation .*3\.333e-1/);
    expect(() => hermitianEigen(skew)).toThrow(DomainError);
    // Within a user tolerance the Hermitian part is used: (A + Aᴴ)/2 = [[1, 2.5], [2.5, 1]] → −1.5, 3.5.
    const r = hermitianEigen(skew, { hermitianTolerance: 0.5 });
    expect(r.values[0]).toBeCloseTo(-1.5, 14);
    expect(r.values[1]).toBeCloseTo(3.5, 14);
    expect(() => hermitianEigen(skew, { hermitianTolerance: -1 })).toThrow(DomainError);
  });
});

describe('generalizedHermitianEigen', () => {
  for (const fx of fixtures.cases.generalizedEigen) {
    if (fx.positiveDefinite === false) {
      it(`scipy fixture: ${String(fx.name)} → NotPositiveDefiniteError`, () => {
        expect(() => generalizedHermitianEigen(m(fx.a), m(fx.b))).toThrow(NotPositiveDefiniteError);
      });
      continue;
    }
    it(`scipy eigh(a, b) fixture: ${String(fx.name)}`, () => {
      const a = m(fx.a), b = m(fx.b), ref = fx.values as number[];
      const n = a.rows;
      const { values, vectors, bConditionLowerBound } = generalizedHermitianEigen(a, b);
      const scale = maxAbs(ref);
      // Error of λ is O(n ε ‖A‖ ‖B⁻¹‖) (Golub & Van Loan 2013, §8.7.2); ‖B⁻¹‖ ≤ 1/(0.1 n) for these B = GGᴴ + 0.1 n I,
      // so a 1e3 n ε |λ|max bound has ample margin while still catching any real error.
      for (let i = 0; i < n; i++) expect(Math.abs(values[i] - ref[i])).toBeLessThanOrEqual(1e3 * n * EPS * scale);
      const x = vectors!;
      expect(orthonormalityError(x, b)).toBeLessThanOrEqual(1e-12 * n);
      // A X = B X Λ
      const ax = multiply(a, x), bx = multiply(b, x);
      let res = 0;
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        const p = 2 * (i * n + j);
        res = Math.max(res, Math.hypot(ax.data[p] - values[j] * bx.data[p], ax.data[p + 1] - values[j] * bx.data[p + 1]));
      }
      expect(res).toBeLessThanOrEqual(1e3 * n * EPS * (scale + 1) * frobeniusNorm(b));
      expect(subspaceMismatch(x, m(fx.vectors), ref, { clusterTol: 1e-6 * scale, scale: n * scale, slack: 1e4 })).toBeLessThanOrEqual(1);
      expect(bConditionLowerBound).toBeGreaterThanOrEqual(1);
    });
  }

  it('maximum SNR: largest λ of s sᴴ x = λ R x equals sᴴ R⁻¹ s', () => {
    // H. L. Van Trees, Optimum Array Processing, Wiley, 2002, §6.2 (from memory): max-SNR weight ∝ R⁻¹ s, SNR = sᴴ R⁻¹ s.
    const n = 12;
    const s = randomMatrix(n, 1, 91);
    const r = randomHpd(n, 92);
    const a = multiply(s, adjoint(s));
    const { values, vectors } = generalizedHermitianEigen(a, r);
    const snr = innerProduct(s, solve(r, s)).re;
    expect(Math.abs(values[n - 1] - snr)).toBeLessThanOrEqual(1e3 * n * EPS * snr);
    for (let i = 0; i < n - 1; i++) expect(Math.abs(values[i])).toBeLessThanOrEqual(1e3 * n * EPS * snr);
    // eigenvector ∝ R⁻¹ s: |xᴴ R w|/‖..‖ = 1 for w = R⁻¹s normalised in R
    const w = solve(r, s);
    const x = zeros(n, 1);
    for (let i = 0; i < n; i++) { x.data[2 * i] = vectors!.data[2 * (i * n + n - 1)]; x.data[2 * i + 1] = vectors!.data[2 * (i * n + n - 1) + 1]; }
    const c = innerProduct(x, multiply(r, w));
    const wn = Math.sqrt(innerProduct(w, multiply(r, w)).re);
    expect(Math.abs(Math.hypot(c.re, c.im) / wn - 1)).toBeLessThan(1e-12);
  });

  it('B = I reduces to hermitianEigen; valuesOnly', () => {
    const a = hermitianPart(randomMatrix(9, 9, 4));
    const eye = zeros(9, 9); for (let i = 0; i < 9; i++) eye.data[2 * (i * 9 + i)] = 1;
    const g = generalizedHermitianEigen(a, eye, { valuesOnly: true });
    const h = hermitianEigen(a, { valuesOnly: true });
    expect(g.vectors).toBeNull();
    for (let i = 0; i < 9; i++) expect(Math.abs(g.values[i] - h.values[i])).toBeLessThanOrEqual(100 * EPS * 9);
    expect(g.bConditionLowerBound).toBe(1);
  });

  it('bad input: order mismatch, non-Hermitian b, NaN, semidefinite b (failing pivot reported)', () => {
    const a = hermitianPart(randomMatrix(3, 3, 1));
    expect(() => generalizedHermitianEigen(a, randomHpd(4, 2))).toThrow(DimensionError);
    expect(() => generalizedHermitianEigen(a, fromRows([[1, 2, 0], [0, 1, 0], [0, 0, 1]]))).toThrow(DomainError);
    const nan = randomHpd(3, 3); nan.data[0] = NaN;
    expect(() => generalizedHermitianEigen(a, nan)).toThrow(DomainError);
    // [[1, 1], [1, 1]] is singular (semidefinite): the second pivot is 1 − 1 = 0.
    try {
      generalizedHermitianEigen(fromRows([[1, 0], [0, 2]]), fromRows([[1, 1], [1, 1]]));
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(NotPositiveDefiniteError);
      expect((e as NotPositiveDefiniteError).index).toBe(1);
    }
    expect(() => generalizedHermitianEigen(columnVector([1]), zeros(1, 1))).toThrow(NotPositiveDefiniteError);
  });
});
