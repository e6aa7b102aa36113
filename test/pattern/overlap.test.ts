import { describe, it, expect } from 'vitest';
import fixture from './fixtures/max_directivity.json';
import { isotropicNoiseMatrix, maximumDirectivity } from '../../src/pattern/overlap.js';
import { directivity } from '../../src/pattern/directivity.js';
import { uniformLineLayout } from '../../src/geometry/builders.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { NotPositiveDefiniteError, DomainError } from '../../src/errors.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const F = 2.99792458e9; // λ = 0.1 m

describe('maximumDirectivity (Harrington 1965) against mpmath', () => {
  it.each(fixture.cases.map((c) => [c.n, c.spacingWavelengths, c.kind, c.directivity, c.condition] as const))(
    'N = %i, d = %fλ, %s', (n, d, kind, expected, cond) => {
      // Fixture: mpmath at 50 digits (generate_max_directivity.py). Double precision loses about
      // log10(cond(R)) digits: tolerance 1e-15·cond, floored at 1e-13.
      const r = maximumDirectivity(uniformLineLayout(n, d * 0.1), kind === 'endfire' ? [1, 0, 0] : [0, 0, 1], F);
      expect(Math.abs(r.directivity / expected - 1)).toBeLessThan(Math.max(1e-13, 1e-15 * cond));
    });
  it('endfire limit N² for vanishing spacing (A. I. Uzkov 1946, from memory)', () => {
    for (const n of [2, 3, 4]) {
      const d = maximumDirectivity(uniformLineLayout(n, 0.001), [1, 0, 0], F).directivity; // 0.01λ
      expect(Math.abs(d / (n * n) - 1)).toBeLessThan(1e-3);
      expect(d).toBeLessThan(n * n);
    }
  });
  it('the returned weights reach the returned directivity (independent sphere quadrature)', () => {
    const layout = uniformLineLayout(4, 0.02);
    const r = maximumDirectivity(layout, [1, 0, 0], F);
    expect(directivity(layout, r.weights, [1, 0, 0], F).directivity / r.directivity).toBeCloseTo(1, 8);
  });
  it('cos element: a single element gives 2(2q + 1) (∮cos^{2q}θ dΩ over the upper half = 2π/(2q + 1))', () => {
    for (const q of [1, 2]) {
      const r = maximumDirectivity(arrayLayout([[0, 0, 0]]), [0, 0, 1], F, { element: { kind: 'cosine', exponent: q } });
      expect(r.directivity / (2 * (2 * q + 1))).toBeCloseTo(1, 11);
    }
  });
  it('coincident elements: NotPositiveDefiniteError', () => {
    expect(() => maximumDirectivity(arrayLayout([[0, 0, 0], [0, 0, 0]]), [0, 0, 1], F)).toThrow(NotPositiveDefiniteError);
    expect(() => maximumDirectivity(uniformLineLayout(2, 0.05), [0, 0, 2], F)).toThrow(DomainError);
  });
});

describe('isotropicNoiseMatrix', () => {
  it('isotropic closed form sinc(k d) equals the sphere quadrature of a aᴴ/4π', () => {
    const layout = arrayLayout([[0, 0, 0], [0.03, 0.01, 0], [0.01, -0.04, 0.02]]);
    const exact = isotropicNoiseMatrix(layout, F);
    const quad = isotropicNoiseMatrix(layout, F, { quadrature: sphereQuadrature(40, 80) });
    expectCMatrixClose(quad, exact, { rtol: 1e-12 });
    // sinc(k d) for the first pair, d = √(0.03² + 0.01²) m, k = 20π rad/m
    const x = 20 * Math.PI * Math.hypot(0.03, 0.01);
    expect(exact.data[2]).toBeCloseTo(Math.sin(x) / x, 15);
  });
  it('cosine element: Hermitian, diagonal (1/4π)∮cos²θ dΩ = 1/6 over the upper hemisphere', () => {
    const r = isotropicNoiseMatrix(uniformLineLayout(3, 0.05), F, { element: { kind: 'cosine', exponent: 1 } });
    for (let i = 0; i < 3; i++) expect(r.data[2 * (i * 3 + i)]).toBeCloseTo(1 / 6, 12);
    expect(r.data[2 * 1 + 1]).toBeCloseTo(-r.data[2 * 3 + 1], 15);
  });
});
