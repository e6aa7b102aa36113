import { describe, it, expect } from 'vitest';
import {
  beamResponse, beamPowerPattern, beamPowerPatternInto, beamOutputPower, beamSnr, whiteNoiseGain, arrayGain, interferenceRejection,
} from '../../src/beamform/evaluate.js';
import { conjugateFieldWeights, constrainedMinimumVarianceWeights, maxDirectivityWeights, maxSnrWeights } from '../../src/beamform/weights.js';
import { findSpectrumPeaks } from '../../src/beamform/peaks.js';
import { arrayFactor } from '../../src/pattern/arrayFactor.js';
import { add, adjoint, multiply, scale, innerProduct, concatColumns, quadraticForm } from '../../src/linalg/ops.js';
import { fromRows, identity, zeros } from '../../src/linalg/cmatrix.js';
import { DimensionError, DomainError } from '../../src/errors.js';
import { randomHpd, randomMatrix } from '../helpers/matchers.js';
import { grid, K_RAD_PER_M, LAMBDA_M, line, lineSteering, lineSteeringDerivative } from './scenario.js';

describe('beam evaluation', () => {
  const n = 8;
  const a = lineSteering(n, [0.2]);
  it('conjugate match of a unit-modulus steering vector: WNG = N, array gain in white noise = N', () => {
    // Cauchy–Schwarz; Van Trees 2002 (from memory): the uniform beam's array gain in white noise is N.
    const w = conjugateFieldWeights(a);
    expect(whiteNoiseGain(w, a)).toBeCloseTo(n, 12);
    expect(arrayGain(w, a, scale(identity(n), 3))).toBeCloseTo(n, 12);
    expect(beamResponse(w, a).data[0]).toBeCloseTo(1, 14);
  });
  it('power pattern: |AF|² matches the pattern module; components add', () => {
    const w = maxSnrWeights(a, randomHpd(n, 4));
    const scan = lineSteering(n, grid(-1, 1, 25));
    const p = beamPowerPattern(w, scan);
    const resp = beamResponse(w, scan);
    for (let k = 0; k < 25; k++) expect(p[k]).toBeCloseTo(resp.data[2 * k] ** 2 + resp.data[2 * k + 1] ** 2, 12);
    const two = beamPowerPattern(w, [scan, scale(scan, 2)]);
    for (let k = 0; k < 25; k++) expect(two[k]).toBeCloseTo(5 * p[k], 10);
    expect(() => beamPowerPattern(w, [])).toThrow(DimensionError);
    const out = new Float64Array(25).fill(7);
    expect(beamPowerPatternInto(out, w, scan)).toBe(out); // returns out, overwrites stale contents
    for (let k = 0; k < 25; k++) expect(out[k]).toBe(p[k]);
    expect(() => beamPowerPatternInto(new Float64Array(24), w, scan)).toThrow(DimensionError);
    expect(() => beamPowerPattern(w, [scan, zeros(n, 3)])).toThrow(DimensionError);
  });
  it('array factor agrees with the pattern module (wᴴa convention shared)', () => {
    const w = randomMatrix(n, 1, 5);
    const dirs = new Float64Array([0, 0, 1, Math.sin(0.3), 0, Math.cos(0.3)]);
    const af = arrayFactor(line(n), w, dirs, 1.5e9);
    const mine = beamResponse(w, lineSteering(n, [0, Math.sin(0.3)]));
    for (let k = 0; k < 2; k++) {
      expect(Math.abs(af.data[2 * k] - mine.data[2 * k]) + Math.abs(af.data[2 * k + 1] - mine.data[2 * k + 1])).toBeLessThan(1e-12);
    }
  });
  it('SNR with a response vector equals SNR with the rank-one correlation; output power is wᴴRw', () => {
    const rn = randomHpd(n, 6);
    const w = randomMatrix(n, 1, 7);
    expect(beamSnr(w, a, rn)).toBeCloseTo(beamSnr(w, multiply(a, adjoint(a)), rn), 12);
    expect(beamOutputPower(w, rn)).toBeCloseTo(innerProduct(w, multiply(rn, w)).re, 12);
    expect(beamSnr(zeros(n, 1), a, rn)).toBe(0);
  });
  it('interference rejection: LCMV nulls give > 250 dB, a conjugate beam gives its sidelobe level', () => {
    const b = lineSteering(n, [-0.5, 0.7]);
    const w = constrainedMinimumVarianceWeights(concatColumns([a, b]), identity(n), fromRows([[1], [0], [0]]));
    for (const d of interferenceRejection(w, a, b).rejectionDb) expect(d).toBeGreaterThan(250);
    // Uniform 8-element beam, interferer at a sidelobe: |AF|² = (sin(Nψ/2)/(N sin(ψ/2)))², ψ = kd·Δu.
    const wc = conjugateFieldWeights(a);
    const du = -0.5 - 0.2, psi = K_RAD_PER_M * (LAMBDA_M / 2) * du;
    const af = Math.sin(n * psi / 2) / (n * Math.sin(psi / 2));
    expect(interferenceRejection(wc, a, b).relativeResponse[0]).toBeCloseTo(af * af, 12);
  });
  it('bad input', () => {
    expect(() => whiteNoiseGain(zeros(n, 1), a)).toThrow(DimensionError);
    expect(() => whiteNoiseGain(randomMatrix(n + 1, 1, 1), a)).toThrow(DimensionError);
    expect(() => arrayGain(a, a, identity(n), n)).toThrow(DomainError);
    expect(() => interferenceRejection(zeros(n, 1), a, a)).toThrow(DimensionError);
    const bad = randomMatrix(n, 1, 1); bad.data[3] = Infinity;
    expect(() => beamResponse(bad, a)).toThrow(DomainError);
  });
});

describe('LCMV derivative constraint on a line', () => {
  it('a zero-derivative constraint flattens the main beam (central difference of wᴴa(u) ≈ 0)', () => {
    // Constraint wᴴ ∂a/∂u = 0 makes d(wᴴa)/du vanish at u₀ (Van Trees 2002, from memory); the central
    // difference then has an O(h²) truncation error only, against O(1) for the same beam without it.
    const n = 10, u0 = 0.23, h = 1e-4; // interferer off the conjugate beam's nulls, so MVDR ≠ conjugate match
    const r = add(identity(n), scale(multiply(lineSteering(n, [-0.05]), adjoint(lineSteering(n, [-0.05]))), 100));
    const c = concatColumns([lineSteering(n, [u0]), lineSteeringDerivative(n, [u0])]);
    const flat = constrainedMinimumVarianceWeights(c, r, fromRows([[1], [0]]));
    const plain = constrainedMinimumVarianceWeights(lineSteering(n, [u0]), r, fromRows([[1]]));
    const slope = (w: ReturnType<typeof zeros>) => {
      const resp = beamResponse(w, lineSteering(n, [u0 - h, u0 + h]));
      return Math.hypot(resp.data[2] - resp.data[0], resp.data[3] - resp.data[1]) / (2 * h);
    };
    expect(slope(flat)).toBeLessThan(1e-6);
    expect(slope(plain)).toBeGreaterThan(0.05); // measured 0.093
  });
  it('conjugate match with unit-noise normalisation', () => {
    const rn = randomHpd(10, 3);
    const a = lineSteering(10, [0.1]);
    const w = conjugateFieldWeights(a, { normalization: 'unitNoise', noise: rn });
    expect(quadraticForm(w, rn)).toBeCloseTo(1, 13);
    expect(() => conjugateFieldWeights(a, { normalization: 'unitNoise' })).toThrow(DimensionError);
  });
});

describe('maximum directivity of isotropic point elements', () => {
  /** R_iso,mn = sin(k dₘₙ)/(k dₘₙ) for isotropic point elements on a line. */
  function isotropicCorrelation(n: number, spacingM: number) {
    const r = zeros(n, n);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const x = K_RAD_PER_M * spacingM * Math.abs(i - j);
      r.data[2 * (i * n + j)] = x === 0 ? 1 : Math.sin(x) / x;
    }
    return r;
  }
  it('half-wave broadside: R_iso = I and the maximum directivity is N', () => {
    // sin(mπ)/(mπ) = 0: uniform weights are optimal, D = N (Balanis, Antenna Theory, 4th ed., from memory).
    const n = 6;
    const a = lineSteering(n, [0]);
    const riso = isotropicCorrelation(n, LAMBDA_M / 2);
    const w = maxDirectivityWeights(a, riso);
    expect(beamSnr(w, a, riso)).toBeCloseTo(n, 10);
  });
  it('closely spaced endfire: approaches Uzkov’s N² (superdirectivity)', () => {
    // A. I. Uzkov, Dokl. Akad. Nauk SSSR 53, 1946 (from memory): the maximum endfire directivity of N
    // isotropic elements tends to N² as the spacing tends to zero. At d = 0.05λ, N = 4 it is within 5 %.
    const n = 4, d = 0.05 * LAMBDA_M;
    const a = lineSteering(n, [1], d);
    const riso = isotropicCorrelation(n, d);
    const dMax = beamSnr(maxDirectivityWeights(a, riso), a, riso);
    expect(dMax).toBeLessThan(n * n);
    expect(dMax).toBeGreaterThan(0.95 * n * n);
    // The superdirective beam is fragile: its white-noise gain is tiny (Cox, Zeskind & Owen 1987).
    expect(whiteNoiseGain(maxDirectivityWeights(a, riso), a)).toBeLessThan(0.01);
  });
});

describe('findSpectrumPeaks', () => {
  it('recovers the vertex of sampled parabolas exactly (uniform and non-uniform grids)', () => {
    const xs = [grid(-1, 1, 21), Float64Array.from([-1, -0.7, -0.35, -0.1, 0.05, 0.3, 0.6, 1])];
    for (const x of xs) {
      const y = Float64Array.from(x, (v) => 5 - 3 * (v - 0.123) ** 2);
      const [p] = findSpectrumPeaks(y, x);
      expect(p.position).toBeCloseTo(0.123, 12);
      expect(p.value).toBeCloseTo(5, 12);
      // 'reciprocal' is exact for 1/(quadratic), 'log' for a Gaussian.
      const r = Float64Array.from(x, (v) => 1 / (0.01 + 2 * (v + 0.2) ** 2));
      const [q] = findSpectrumPeaks(r, x, { refineOn: 'reciprocal' });
      expect(q.position).toBeCloseTo(-0.2, 12);
      expect(q.value).toBeCloseTo(100, 9);
      const gss = Float64Array.from(x, (v) => Math.exp(-((v - 0.31) ** 2) / 0.5));
      expect(findSpectrumPeaks(gss, x, { refineOn: 'log' })[0].position).toBeCloseTo(0.31, 12);
    }
  });
  it('sorts by value, honours maxPeaks, skips the ends and plateaus once', () => {
    const x = grid(0, 9, 10);
    const y = Float64Array.from([9, 1, 3, 1, 5, 5, 1, 2, 1, 9]);
    const peaks = findSpectrumPeaks(y, x);
    expect(peaks.map((p) => p.index)).toEqual([4, 2, 7]);
    expect(findSpectrumPeaks(y, x, { maxPeaks: 1 }).length).toBe(1);
  });
  it('bad input', () => {
    expect(() => findSpectrumPeaks([1, 2], [0, 1])).toThrow(DimensionError);
    expect(() => findSpectrumPeaks([1, 2, 1], [0, 1, 1])).toThrow(DomainError);
    expect(() => findSpectrumPeaks([1, NaN, 1], [0, 1, 2])).toThrow(DomainError);
    expect(() => findSpectrumPeaks([1, 0, 1], [0, 1, 2], { refineOn: 'log' })).toThrow(DomainError);
    expect(() => findSpectrumPeaks([1, 2, 1], [0, 1, 2], { refineOn: 'cubic' as never })).toThrow(DomainError);
  });
});
