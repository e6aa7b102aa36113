import { describe, expect, it } from 'vitest';
import { DimensionError, DomainError, SingularMatrixError } from '../../src/errors.js';
import { fromParts, type CMatrix } from '../../src/linalg/cmatrix.js';
import { concatColumns, innerProduct } from '../../src/linalg/ops.js';
import { C0_M_PER_S } from '../../src/units/constants.js';
import { nullsOnLayout, projectNulls, schelkunoffNulls } from '../../src/taper/nulls.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import { arrayFactorMagnitude } from '../../src/pattern/arrayFactor.js';
import { taylorTaper } from '../../src/taper/taylor.js';
import { seededRandom } from '../helpers/matchers.js';

const F_HZ = 1e9;
const K = (2 * Math.PI * F_HZ) / C0_M_PER_S;

/** Independent steering vector of the test: aₙ = exp(+j k (xₙ u + yₙ v)). */
function steering(x: ArrayLike<number>, y: ArrayLike<number>, u: number, v: number): CMatrix {
  const re = Array.from(x, (xi, i) => Math.cos(K * (xi * u + y[i] * v)));
  const im = Array.from(x, (xi, i) => Math.sin(K * (xi * u + y[i] * v)));
  return fromParts(re, im, x.length);
}

describe('schelkunoffNulls', () => {
  const n = 16;
  const d = C0_M_PER_S / F_HZ / 2;
  const x = Float64Array.from({ length: n }, (_, i) => i * d);
  const y = new Float64Array(n);
  const w0 = taylorTaper(n, 30, 5).weights;
  it('puts exact nulls at the requested directions and reports the main-beam change', () => {
    const r = schelkunoffNulls(w0, d, F_HZ, [0.3, -0.55]);
    const main = innerProduct(r.weights, steering(x, y, 0, 0)).abs();
    for (const u of [0.3, -0.55]) expect(innerProduct(r.weights, steering(x, y, u, 0)).abs() / main).toBeLessThan(1e-10);
    // Report against a direct evaluation of AF = wᴴa (conventions table) at u₀ = 0.
    const before = innerProduct(fromParts(w0, null, n), steering(x, y, 0, 0)).abs();
    expect(r.mainBeamChangeDb).toBeCloseTo(20 * Math.log10(main / before), 9);
    // Same ‖w‖₂ as the input.
    const p0 = w0.reduce((s, v) => s + v * v, 0);
    let p1 = 0;
    for (const v of r.weights.data) p1 += v * v;
    expect(p1 / p0).toBeCloseTo(1, 12);
    // A null in the sidelobe region barely moves the beam (< 0.5 dB).
    expect(Math.abs(r.mainBeamChangeDb)).toBeLessThan(0.5);
  });
  it('rejects bad input', () => {
    expect(() => schelkunoffNulls(w0, d, F_HZ, [1.5])).toThrow(DomainError);
    expect(() => schelkunoffNulls(w0, -d, F_HZ, [0.3])).toThrow(DomainError);
    expect(() => schelkunoffNulls(Float64Array.of(1), d, F_HZ, [])).toThrow(DimensionError);
    expect(() => schelkunoffNulls(Float64Array.of(1, 1), d, F_HZ, [0.2, 0.4])).toThrow(DimensionError);
    expect(() => schelkunoffNulls(Float64Array.of(1, 0), d, F_HZ, [0.2])).toThrow(DomainError);
  });
});

describe('projectNulls', () => {
  const rnd = seededRandom(7);
  const n = 40;
  const lam = C0_M_PER_S / F_HZ;
  const x = Float64Array.from({ length: n }, () => (rnd() - 0.5) * 4 * lam);
  const y = Float64Array.from({ length: n }, () => (rnd() - 0.5) * 4 * lam);
  const w = new Float64Array(n).fill(1);
  const nulls = [[0.4, 0.1], [-0.2, 0.5], [0.1, -0.7]];
  const a = concatColumns(nulls.map(([u, v]) => steering(x, y, u, v)));
  const a0 = steering(x, y, 0, 0);
  it('nulls are exact and the change is the least-squares one (w − w_new ∈ span A)', () => {
    const r = projectNulls(w, a, a0);
    for (const [u, v] of nulls) expect(innerProduct(r.weights, steering(x, y, u, v)).abs() / n).toBeLessThan(1e-12);
    // Projection identity: w_new ⊥ A and ‖w‖² = ‖w_new‖² + ‖w − w_new‖² (Pythagoras).
    let pNew = 0, pDiff = 0;
    for (let i = 0; i < n; i++) {
      const re = r.weights.data[2 * i], im = r.weights.data[2 * i + 1];
      pNew += re * re + im * im;
      pDiff += (1 - re) ** 2 + im * im;
    }
    expect((pNew + pDiff) / n).toBeCloseTo(1, 12);
    const main = innerProduct(r.weights, a0).abs();
    expect(r.mainBeamChangeDb).toBeCloseTo(20 * Math.log10(main / n), 10);
    expect(r.mainBeamGainChangeDb).toBeCloseTo(20 * Math.log10(main / n) - 10 * Math.log10(pNew / n), 10);
    expect(r.mainBeamChangeDb).toBeLessThan(0);
  });
  it('nullsOnLayout builds the steering vectors with the pattern module and nulls the AF there', () => {
    const layout = arrayLayout(Array.from({ length: n }, (_, i) => [x[i], y[i], 0] as [number, number, number]));
    const dirs = Float64Array.from(nulls.flatMap(([u, v]) => [u, v, Math.sqrt(1 - u * u - v * v)]));
    const r = nullsOnLayout(layout, w, dirs, [0, 0, 1], F_HZ);
    const af = arrayFactorMagnitude(layout, r.weights, dirs, F_HZ);
    for (const v of af) expect(v / n).toBeLessThan(1e-12);
    expect(r.mainBeamChangeDb).toBeCloseTo(projectNulls(w, a, a0).mainBeamChangeDb, 10);
  });
  it('repeated null is singular; shapes are checked', () => {
    expect(() => projectNulls(w, concatColumns([a0, a0]), a0)).toThrow(SingularMatrixError);
    expect(() => projectNulls(w.subarray(1), a, a0)).toThrow(DimensionError);
    expect(() => projectNulls(w, a, fromParts(new Float64Array(n), null, n))).toThrow(DomainError);
  });
});
