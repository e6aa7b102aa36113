import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { projectionWeights, estimateInterferenceSubspace, maxSnrWeightsForCorrelation } from '../../src/beamform/projection.js';
import { maxSnrWeights } from '../../src/beamform/weights.js';
import { beamSnr, interferenceRejection } from '../../src/beamform/evaluate.js';
import { simulateSnapshots, sampleCorrelation } from '../../src/beamform/snapshots.js';
import { generalizedHermitianEigen } from '../../src/linalg/eigen.js';
import { pseudoInverse } from '../../src/linalg/svd.js';
import { adjoint, multiply, innerProduct, quadraticForm, subtract, add } from '../../src/linalg/ops.js';
import { identity } from '../../src/linalg/cmatrix.js';
import { DimensionError, SingularMatrixError, NotPositiveDefiniteError, DomainError } from '../../src/errors.js';
import { expectCMatrixClose, randomHpd, randomMatrix } from '../helpers/matchers.js';
import { lineSteering } from './scenario.js';

describe('projection beam', () => {
  it('nulls the interference subspace to 1e-12 and reports the signal loss', () => {
    fc.assert(fc.property(fc.integer({ min: 3, max: 12 }), fc.integer({ min: 1, max: 1e6 }), (n, seed) => {
      const j = 1 + (seed % (n - 1));
      const a = randomMatrix(n, 1, seed);
      const b = randomMatrix(n, j, seed + 1);
      const res = projectionWeights(a, b, { normalization: 'unitNorm' });
      const resp = multiply(adjoint(b), res.weights);
      for (let k = 0; k < j; k++) {
        const bn = Math.sqrt(innerProduct(subBlock(b, k), subBlock(b, k)).re);
        expect(Math.hypot(resp.data[2 * k], resp.data[2 * k + 1]) / bn).toBeLessThan(1e-12);
      }
      expect(res.residual).toBeLessThan(1e-12);
      // Independent: P⊥ = I − B B⁺ from the SVD pseudo-inverse; the loss for w₀ = a is −20 log₁₀(‖P⊥a‖²/‖a‖²).
      const pPerp = subtract(identity(n), multiply(b, pseudoInverse(b)));
      const pa = multiply(pPerp, a);
      const ratio = innerProduct(pa, pa).re / innerProduct(a, a).re;
      expect(Math.abs(res.signalLossDb - -20 * Math.log10(ratio))).toBeLessThan(1e-9);
      expect(Math.abs(res.whiteNoiseSnrLossDb - -10 * Math.log10(ratio))).toBeLessThan(1e-9);
    }), { seed: 5, numRuns: 60 });
  });

  it('on a line: deep nulls on interferers, look response kept; estimated subspace works too', () => {
    const n = 10;
    const a = lineSteering(n, [0]);
    const b = lineSteering(n, [0.5, -0.62]);
    const res = projectionWeights(a, b);
    expect(innerProduct(res.weights, a).re).toBeCloseTo(1, 12);
    const rej = interferenceRejection(res.weights, a, b);
    for (const d of rej.rejectionDb) expect(d).toBeGreaterThan(200);
    // Estimate the subspace from signal-free snapshots: strong interferers, weak noise.
    const sim = simulateSnapshots({ steering: b, sourcePowers: [100, 100], noisePower: 0.01, snapshotCount: 500, seed: 77 });
    const est = estimateInterferenceSubspace(sampleCorrelation(sim.snapshots), 2);
    expectCMatrixClose(multiply(adjoint(est), est), identity(2), { atol: 1e-12 });
    const res2 = projectionWeights(a, est);
    for (const d of interferenceRejection(res2.weights, a, b).rejectionDb) expect(d).toBeGreaterThan(40);
  });

  it('bad input: J ≥ N, dependent interference, look direction inside the subspace', () => {
    const a = randomMatrix(4, 1, 1);
    expect(() => projectionWeights(a, randomMatrix(4, 4, 2))).toThrow(DimensionError);
    const b = randomMatrix(4, 1, 3);
    const dep = { rows: 4, cols: 2, data: new Float64Array(16) };
    for (let i = 0; i < 4; i++) { dep.data.set(b.data.subarray(2 * i, 2 * i + 2), 4 * i); dep.data.set(b.data.subarray(2 * i, 2 * i + 2), 4 * i + 2); }
    expect(() => projectionWeights(a, dep)).toThrow(SingularMatrixError);
    expect(() => projectionWeights(a, a)).toThrow(SingularMatrixError);
    expect(() => projectionWeights(a, b, { normalization: 'unitNoise' })).toThrow(DomainError);
  });
});

function subBlock(b: ReturnType<typeof randomMatrix>, k: number) {
  const out = { rows: b.rows, cols: 1, data: new Float64Array(2 * b.rows) };
  for (let i = 0; i < b.rows; i++) { out.data[2 * i] = b.data[2 * (i * b.cols + k)]; out.data[2 * i + 1] = b.data[2 * (i * b.cols + k) + 1]; }
  return out;
}

describe('maximum-SNR beam for a signal of any rank', () => {
  it('its SNR is the largest generalised eigenvalue (independent solver) and beats random beams', () => {
    // Generalised Rayleigh quotient (Van Trees 2002, from memory): max wᴴR_s w / wᴴR_n w = λ_max(R_s, R_n).
    fc.assert(fc.property(fc.integer({ min: 2, max: 9 }), fc.integer({ min: 1, max: 1e6 }), (n, seed) => {
      const g = randomMatrix(n, 2, seed);
      const rs = multiply(g, adjoint(g)); // rank two
      const rn = randomHpd(n, seed + 1, 0.1);
      const { weights, snr } = maxSnrWeightsForCorrelation(rs, rn);
      const ref = generalizedHermitianEigen(rs, rn).values;
      expect(Math.abs(snr - ref[n - 1])).toBeLessThan(1e-10 * ref[n - 1]);
      expect(Math.abs(beamSnr(weights, rs, rn) - snr)).toBeLessThan(1e-10 * snr);
      expect(Math.abs(quadraticForm(weights, rn) - 1)).toBeLessThan(1e-12);
      expect(beamSnr(randomMatrix(n, 1, seed + 2), rs, rn)).toBeLessThanOrEqual(snr * (1 + 1e-12));
    }), { seed: 3, numRuns: 50 });
  });

  it('rank one reduces to R_n⁻¹a (up to scale)', () => {
    const a = randomMatrix(7, 1, 8);
    const rn = randomHpd(7, 9);
    const { weights } = maxSnrWeightsForCorrelation(multiply(a, adjoint(a)), rn, { normalization: 'unitNorm' });
    // Both have unit norm; equal up to a unit complex factor iff |⟨w₁, w₂⟩| = 1.
    const c = innerProduct(weights, maxSnrWeights(a, rn, { normalization: 'unitNorm' }));
    expect(Math.abs(Math.hypot(c.re, c.im) - 1)).toBeLessThan(1e-10);
  });

  it('singular noise without loading is a typed error; loading fixes it', () => {
    const a = randomMatrix(5, 1, 8);
    const rs = multiply(a, adjoint(a));
    expect(() => maxSnrWeightsForCorrelation(rs, rs)).toThrow(SingularMatrixError);
    expect(() => maxSnrWeightsForCorrelation(rs, subtract(rs, rs))).toThrow(NotPositiveDefiniteError);
    expect(maxSnrWeightsForCorrelation(rs, add(rs, identity(5)), {}).snr).toBeGreaterThan(0);
    expect(() => maxSnrWeightsForCorrelation(randomMatrix(5, 5, 1), identity(5))).toThrow(/"signal"/);
    expect(Number.isFinite(maxSnrWeightsForCorrelation(rs, rs, { diagonalLoading: 1e-2 }).snr)).toBe(true);
  });
});
