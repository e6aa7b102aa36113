import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import {
  conjugateFieldWeights, maxSnrWeights, maxSnrWeightsForDirections, minimumVarianceWeights,
  constrainedMinimumVarianceWeights, maxGainWeights, maxDirectivityWeights,
} from '../../src/beamform/weights.js';
import { diagonalLoading } from '../../src/beamform/conditioning.js';
import { beamSnr, beamResponse, beamOutputPower } from '../../src/beamform/evaluate.js';
import { solve } from '../../src/linalg/lu.js';
import { column, innerProduct, multiply, adjoint, add, scale, quadraticForm } from '../../src/linalg/ops.js';
import { fromRows, identity, zeros } from '../../src/linalg/cmatrix.js';
import { DimensionError, DomainError, NotPositiveDefiniteError, SingularMatrixError } from '../../src/errors.js';
import { expectCMatrixClose, randomHpd, randomMatrix } from '../helpers/matchers.js';

const arbCase = fc.record({ n: fc.integer({ min: 2, max: 9 }), seed: fc.integer({ min: 1, max: 1e6 }) });

describe('maximum-SNR beam', () => {
  it('its SNR is ≥ that of every other beamformer on random HPD noise (theorem)', () => {
    // Generalised Rayleigh quotient: max_w |wᴴa|²/wᴴR_n w = aᴴR_n⁻¹a, attained only by w ∝ R_n⁻¹a
    // (Van Trees, Optimum Array Processing, 2002, from memory).
    fc.assert(fc.property(arbCase, ({ n, seed }) => {
      const rn = randomHpd(n, seed, 0.05);
      const a = randomMatrix(n, 1, seed + 1);
      const best = beamSnr(maxSnrWeights(a, rn), a, rn);
      // The maximum equals aᴴR_n⁻¹a, computed here by LU (an independent path).
      const bound = innerProduct(a, solve(rn, a)).re;
      expect(Math.abs(best - bound)).toBeLessThanOrEqual(1e-10 * bound);
      const rTotal = add(rn, multiply(a, adjoint(a)));
      const others = [
        conjugateFieldWeights(a),
        minimumVarianceWeights(a, rTotal, { diagonalLoading: 0.3 }),
        maxSnrWeights(a, rn, { diagonalLoading: 0.5 }),
        constrainedMinimumVarianceWeights(randomMatrix(n, 1, seed + 2), rTotal, fromRows([[1]])),
        randomMatrix(n, 1, seed + 3),
      ];
      for (const w of others) expect(beamSnr(w, a, rn)).toBeLessThanOrEqual(best * (1 + 1e-12));
    }), { seed: 42, numRuns: 60 });
  });

  it('MVDR on R = σ²aaᴴ + R_n equals the maximum-SNR beam up to scale', () => {
    // Matrix inversion lemma: R⁻¹a = R_n⁻¹a / (1 + σ² aᴴR_n⁻¹a) (Van Trees 2002, from memory);
    // with the same distortionless normalisation both beams coincide.
    fc.assert(fc.property(arbCase, fc.double({ min: 0.01, max: 100, noNaN: true }), ({ n, seed }, power) => {
      const rn = randomHpd(n, seed, 0.05);
      const a = randomMatrix(n, 1, seed + 7);
      const r = add(rn, scale(multiply(a, adjoint(a)), power));
      expectCMatrixClose(minimumVarianceWeights(a, r), maxSnrWeights(a, rn), { rtol: 1e-9 });
    }), { seed: 7, numRuns: 60 });
  });

  it('many directions at once equal one direction at a time', () => {
    const rn = randomHpd(12, 3);
    const steer = randomMatrix(12, 5, 4);
    const many = maxSnrWeightsForDirections(steer, rn, { normalization: 'unitNoise' });
    for (let k = 0; k < 5; k++) {
      expectCMatrixClose(column(many, k), maxSnrWeights(column(steer, k), rn, { normalization: 'unitNoise' }), { rtol: 1e-13 });
    }
  });

  it('normalisations: distortionless, unit norm, unit noise', () => {
    const rn = randomHpd(6, 11);
    const a = randomMatrix(6, 1, 12);
    const d = maxSnrWeights(a, rn);
    const c = innerProduct(d, a);
    expect(Math.abs(c.re - 1) + Math.abs(c.im)).toBeLessThan(1e-13);
    const u = maxSnrWeights(a, rn, { normalization: 'unitNorm' });
    expect(Math.abs(innerProduct(u, u).re - 1)).toBeLessThan(1e-13);
    expect(Math.abs(innerProduct(u, a).im)).toBeLessThan(1e-13);
    expect(innerProduct(u, a).re).toBeGreaterThan(0);
    const q = maxSnrWeights(a, rn, { normalization: 'unitNoise' });
    expect(Math.abs(quadraticForm(q, rn) - 1)).toBeLessThan(1e-13);
    // Raw: exactly R_n⁻¹a.
    expectCMatrixClose(maxSnrWeights(a, rn, { normalization: 'none' }), solve(rn, a), { rtol: 1e-12 });
    expect(() => maxSnrWeights(a, rn, { normalization: 'peak' as never })).toThrow(DomainError);
  });
});

describe('LCMV', () => {
  it('meets every constraint to 1e-12 (nulls, several looks, derivative-like columns)', () => {
    fc.assert(fc.property(arbCase, fc.integer({ min: 1, max: 8 }), ({ n, seed }, mRaw) => {
      const m = Math.min(mRaw, n);
      const r = randomHpd(n, seed, 0.1);
      const c = randomMatrix(n, m, seed + 5);
      const g = randomMatrix(m, 1, seed + 6);
      if (m > 1) { g.data[2] = 0; g.data[3] = 0; } // one null constraint
      const w = constrainedMinimumVarianceWeights(c, r, g);
      const resp = multiply(adjoint(w), c); // 1×M: wᴴcₘ
      let scaleRef = 0;
      for (let k = 0; k < m; k++) scaleRef = Math.max(scaleRef, Math.hypot(g.data[2 * k], g.data[2 * k + 1]), 1);
      for (let k = 0; k < m; k++) {
        expect(Math.hypot(resp.data[2 * k] - g.data[2 * k], resp.data[2 * k + 1] - g.data[2 * k + 1])).toBeLessThan(1e-12 * scaleRef);
      }
    }), { seed: 9, numRuns: 80 });
  });

  it('with one unit constraint it is MVDR; more constraints never lower the output power', () => {
    // Frost 1972: adding constraints shrinks the feasible set, so min wᴴRw cannot decrease.
    const r = randomHpd(8, 21);
    const a = randomMatrix(8, 1, 22);
    const one = constrainedMinimumVarianceWeights(a, r, fromRows([[1]]));
    expectCMatrixClose(one, minimumVarianceWeights(a, r), { rtol: 1e-12 });
    const two = constrainedMinimumVarianceWeights(concat(a, randomMatrix(8, 1, 24)), r, fromRows([[1], [0]]));
    expect(beamOutputPower(two, r)).toBeGreaterThanOrEqual(beamOutputPower(one, r) * (1 - 1e-12));
  });

  it('throws for more constraints than elements and for dependent constraints', () => {
    const r = randomHpd(4, 1);
    expect(() => constrainedMinimumVarianceWeights(randomMatrix(4, 5, 2), r, randomMatrix(5, 1, 3))).toThrow(DimensionError);
    const a = randomMatrix(4, 1, 4);
    expect(() => constrainedMinimumVarianceWeights(concat(a, scale(a, 2)), r, fromRows([[1], [0]]))).toThrow(SingularMatrixError);
    expect(() => constrainedMinimumVarianceWeights(a, r, fromRows([[1], [0]]))).toThrow(DimensionError);
  });
});

function concat(a: ReturnType<typeof zeros>, b: ReturnType<typeof zeros>) {
  const out = zeros(a.rows, 2);
  for (let i = 0; i < a.rows; i++) {
    out.data[4 * i] = a.data[2 * i]; out.data[4 * i + 1] = a.data[2 * i + 1];
    out.data[4 * i + 2] = b.data[2 * i]; out.data[4 * i + 3] = b.data[2 * i + 1];
  }
  return out;
}

describe('conditioning policy and bad input', () => {
  const a = randomMatrix(5, 1, 31);
  const rankOne = multiply(a, adjoint(a));
  it('steering vector of the wrong length: DimensionError', () => {
    expect(() => maxSnrWeights(randomMatrix(4, 1, 1), randomHpd(5, 2))).toThrow(DimensionError);
    expect(() => minimumVarianceWeights(randomMatrix(6, 1, 1), randomHpd(5, 2))).toThrow(DimensionError);
    expect(() => conjugateFieldWeights(randomMatrix(5, 2, 1))).toThrow(DimensionError);
  });
  it('singular correlation without loading: typed error; with loading: a finite beam', () => {
    expect(() => minimumVarianceWeights(a, rankOne)).toThrow(SingularMatrixError);
    expect(() => minimumVarianceWeights(a, zeros(5, 5))).toThrow(NotPositiveDefiniteError);
    // Exactly singular in exact arithmetic but with positive rounding pivots: caught by the pivot-ratio test.
    const w = minimumVarianceWeights(a, rankOne, { diagonalLoading: 1e-3 });
    expect(Math.abs(innerProduct(w, a).re - 1)).toBeLessThan(1e-12);
  });
  it('non-Hermitian or non-finite correlation: DomainError', () => {
    const bad = randomMatrix(5, 5, 9);
    expect(() => maxSnrWeights(a, bad)).toThrow(DomainError);
    expect(() => maxSnrWeights(a, bad)).toThrow(/"noise"/); // the message names the caller's argument
    expect(() => minimumVarianceWeights(a, bad)).toThrow(/"correlation"/);
    expect(() => maxDirectivityWeights(a, zeros(5, 5))).toThrow(/"isotropicCorrelation"/);
    const nan = randomHpd(5, 3); nan.data[4] = NaN;
    expect(() => maxSnrWeights(a, nan)).toThrow(DomainError);
    expect(() => maxSnrWeights(a, randomHpd(5, 3), { diagonalLoading: -1 })).toThrow(DomainError);
  });
  it('diagonalLoading adds loading·tr(R)/N to the diagonal', () => {
    const r = randomHpd(3, 5);
    const tr = r.data[0] + r.data[8] + r.data[16];
    expectCMatrixClose(diagonalLoading(r, 0.2), add(r, scale(identity(3), 0.2 * tr / 3)), { rtol: 1e-15 });
  });
});

describe('maximum gain', () => {
  it('with zero loss equals maximum directivity; losses lower the achievable quotient', () => {
    const riso = randomHpd(6, 41, 0.02);
    const a = randomMatrix(6, 1, 42);
    const loss = scale(identity(6), 0.1);
    expectCMatrixClose(maxGainWeights(a, riso, zeros(6, 6)), maxDirectivityWeights(a, riso), { rtol: 1e-13 });
    const wg = maxGainWeights(a, riso, loss);
    const total = add(riso, loss);
    // The max-gain beam maximises |wᴴa|²/wᴴ(R_iso+R_loss)w: the directivity beam cannot beat it there.
    expect(beamSnr(maxDirectivityWeights(a, riso), a, total)).toBeLessThanOrEqual(beamSnr(wg, a, total) * (1 + 1e-12));
    expect(beamResponse(wg, a).data[0]).toBeCloseTo(1, 12);
  });
});
