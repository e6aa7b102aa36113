import { describe, it, expect } from 'vitest';
import { uniformLineLayout, unitVectorFromAngles } from '../../src/geometry/index.js';
import { schelkunoffZeros, weightsFromSchelkunoffZeros, nullSteeringWeights, schelkunoffVisibleArc, arrayFactorMagnitude } from '../../src/pattern/index.js';
import { columnVector, fromParts } from '../../src/linalg/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';
import { randomMatrix } from '../helpers/matchers.js';

const F = 3e9;
const L = C0_M_PER_S / F;
const binomial = (n: number) => { const c = [1]; for (let k = 1; k < n; k++) c.push((c[k - 1] * (n - k)) / k); return c; };

describe('Schelkunoff zeros', () => {
  it('uniform N-element array: zeros at exp(j2πm/N), m = 1…N−1 (Balanis 2016, §6.10 — from memory)', () => {
    for (const n of [2, 5, 8, 16]) {
      const z = schelkunoffZeros(columnVector(Array(n).fill(1)));
      expect(z.rows).toBe(n - 1);
      const got = Array.from({ length: n - 1 }, (_, i) => Math.atan2(z.data[2 * i + 1], z.data[2 * i])).map((a) => (a <= 0 ? a + 2 * Math.PI : a)).sort((a, b) => a - b);
      got.forEach((a, i) => expect(a).toBeCloseTo((2 * Math.PI * (i + 1)) / n, 12));
      for (let i = 0; i < n - 1; i++) expect(Math.hypot(z.data[2 * i], z.data[2 * i + 1])).toBeCloseTo(1, 12);
    }
  });
  it('binomial array: all N−1 zeros at −1 (Balanis 2016, §6.8.2 — from memory)', () => {
    for (const n of [3, 5, 7]) {
      const z = schelkunoffZeros(columnVector(binomial(n)));
      // a root of multiplicity m is only determined to ~ε^{1/m} (perturbation theory of multiple roots)
      const tol = 10 * 2.2e-16 ** (1 / (n - 1));
      for (let i = 0; i < n - 1; i++) {
        expect(Math.hypot(z.data[2 * i] + 1, z.data[2 * i + 1])).toBeLessThan(tol);
      }

    }
  });
  it('weights → zeros → weights round trip (monic normalisation), with progressive phase', () => {
    const w = randomMatrix(7, 1, 44);
    for (const beta of [0, 0.8]) {
      const back = weightsFromSchelkunoffZeros(schelkunoffZeros(w, beta), beta);
      // the rebuilt polynomial is monic, so the weights agree up to one complex scale: compare wᵢ/w₆
      const lr = w.data[12], li = w.data[13];
      for (let i = 0; i < 7; i++) {
        const br = back.data[2 * i], bi = back.data[2 * i + 1];
        const b6r = back.data[12], b6i = back.data[13];
        const den = b6r * b6r + b6i * b6i, wden = lr * lr + li * li;
        const rr = (br * b6r + bi * b6i) / den, ri = (bi * b6r - br * b6i) / den;
        const wr = (w.data[2 * i] * lr + w.data[2 * i + 1] * li) / wden, wi = (w.data[2 * i + 1] * lr - w.data[2 * i] * li) / wden;
        expect(Math.hypot(rr - wr, ri - wi)).toBeLessThan(1e-11);
      }
    }
  });
  it('null placement: Balanis 2016 Example 6.10 (from memory): d = λ/4, nulls at 0, π/2, π → AF = ζ³ − ζ² + ζ − 1', () => {
    const w = nullSteeringWeights([0, Math.PI / 2, Math.PI], L / 4, F);
    expect(Array.from(w.data).map((x) => Math.round(x * 1e12) / 1e12 + 0)).toEqual([-1, 0, 1, 0, -1, 0, 1, 0]);
  });
  it('null placement with scan: the array factor vanishes at every requested angle', () => {
    const nulls = [0.4, 1.1, 1.9, 2.6];
    const d = 0.45 * L, beta = -2 * Math.PI * 0.45 * Math.cos(1.4); // main beam near γ = 1.4
    const w = nullSteeringWeights(nulls, d, F, beta);
    const layout = uniformLineLayout(nulls.length + 1, d, { axis: 'z' });
    const dirs = new Float64Array(nulls.flatMap((g) => [...unitVectorFromAngles(g, 0)]));
    const mag = arrayFactorMagnitude(layout, w, dirs, F);
    let wsum = 0;
    for (let i = 0; i < w.rows; i++) wsum += Math.hypot(w.data[2 * i], w.data[2 * i + 1]);
    for (const m of mag) expect(m).toBeLessThan(1e-13 * wsum);
    expect(arrayFactorMagnitude(layout, w, Float64Array.from(unitVectorFromAngles(1.4, 0)), F)[0]).toBeGreaterThan(0.5 * wsum);
  });
  it('visible arc: [β − kd, β + kd], overlapping only when d > λ/2 (2kd > 2π)', () => {
    const a = schelkunoffVisibleArc(L / 4, F, 0.3, 5);
    expect(a.psiStartRad).toBeCloseTo(0.3 - Math.PI / 2, 14);
    expect(a.psiEndRad).toBeCloseTo(0.3 + Math.PI / 2, 14);
    expect(a.overlaps).toBe(false);
    expect(Math.atan2(a.points[1], a.points[0])).toBeCloseTo(0.3 - Math.PI / 2, 14);
    expect(schelkunoffVisibleArc(L, F).overlaps).toBe(true);
    expect(schelkunoffVisibleArc(L / 2, F).overlaps).toBe(false);
  });
  it('typed errors', () => {
    expect(() => schelkunoffZeros(columnVector([1]))).toThrow(DimensionError);
    expect(() => schelkunoffZeros(fromParts([1, 0], null, 2))).toThrow(DomainError);
    expect(() => nullSteeringWeights([], L / 2, F)).toThrow(DomainError);
    expect(() => nullSteeringWeights([4], L / 2, F)).toThrow(DomainError);
    expect(() => schelkunoffVisibleArc(-1, F)).toThrow(DomainError);
  });
});
