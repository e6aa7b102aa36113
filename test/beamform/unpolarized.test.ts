/**
 * Unpolarized-source beamformers of the beamform module (issue 20: beamformers live in beamform).
 * Reference: for R_s = P Pᴴ (P = [a_θ a_φ], rank two) the largest achievable SNR wᴴR_s w / wᴴR_n w
 * is the largest generalized eigenvalue of (P Pᴴ, R_n) — computed here with the library's
 * generalized Hermitian eigensolver, a route independent of the closed form under test.
 */
import { describe, it, expect } from 'vitest';
import { maxSnrWeightsUnpolarizedSource, matchedFieldWeightsUnpolarizedSource } from '../../src/beamform/unpolarized.js';
import { generalizedHermitianEigen } from '../../src/linalg/eigen.js';
import { identity, type CMatrix } from '../../src/linalg/cmatrix.js';
import { adjoint, add, column, multiply, scale } from '../../src/linalg/ops.js';
import { DimensionError, NotPositiveDefiniteError } from '../../src/errors.js';
import { randomHpd, randomMatrix } from '../helpers/matchers.js';

const quad = (w: CMatrix, r: CMatrix) => multiply(adjoint(w), multiply(r, w)).data[0];

describe('unpolarized-source beamformers', () => {
  it('max-SNR weights reach the largest generalized eigenvalue of (P Pᴴ, R_n) in every beam', () => {
    const n = 7, k = 4;
    const at = randomMatrix(n, k, 11), ap = randomMatrix(n, k, 12), rn = randomHpd(n, 13);
    const w = maxSnrWeightsUnpolarizedSource(at, ap, rn);
    for (let b = 0; b < k; b++) {
      const pt = column(at, b), pp = column(ap, b);
      const rs = add(multiply(pt, adjoint(pt)), multiply(pp, adjoint(pp)));
      const best = Math.max(...generalizedHermitianEigen(rs, rn).values);
      const wb = column(w, b);
      expect(quad(wb, rs) / quad(wb, rn) / best).toBeCloseTo(1, 10);
      expect(Math.hypot(...Array.from(wb.data))).toBeCloseTo(1, 12);
    }
  });
  it('in white noise the matched-field beam is the max-SNR beam (same SNR)', () => {
    const n = 6, k = 3;
    const at = randomMatrix(n, k, 21), ap = randomMatrix(n, k, 22);
    const white = scale(identity(n), 2.5);
    const mf = matchedFieldWeightsUnpolarizedSource(at, ap), ms = maxSnrWeightsUnpolarizedSource(at, ap, white);
    for (let b = 0; b < k; b++) {
      const pt = column(at, b), pp = column(ap, b);
      const rs = add(multiply(pt, adjoint(pt)), multiply(pp, adjoint(pp)));
      expect(quad(column(mf, b), rs) / quad(column(ms, b), rs)).toBeCloseTo(1, 10);
    }
  });
  it('typed errors', () => {
    const at = randomMatrix(3, 2, 31);
    expect(() => maxSnrWeightsUnpolarizedSource(at, randomMatrix(3, 1, 32), identity(3))).toThrow(DimensionError);
    expect(() => maxSnrWeightsUnpolarizedSource(at, at, scale(identity(3), -1))).toThrow(NotPositiveDefiniteError);
    expect(() => matchedFieldWeightsUnpolarizedSource(at, at, [1, 1])).toThrow(/amplitude/);
  });
});
