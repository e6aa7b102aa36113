import { describe, it, expect } from 'vitest';
import {
  arrayLayout, uniformLineLayout, rectangularGridLayout, triangularLatticeLayout, withEnabledMask, unitVectorFromAngles, ringLayout,
} from '../../src/geometry/index.js';
import { steeringVector, steeringMatrix, arrayFactor, arrayFactorMagnitude, totalPattern, elementFactorValues, steeringVectorInto } from '../../src/pattern/index.js';
import { planArrayFactor } from '../../src/pattern/kernel.js';
import { zeros, fromParts } from '../../src/linalg/index.js';
import { wavenumberRadPerM, C0_M_PER_S } from '../../src/units/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';
import { randomMatrix, randomUnitVectors, seededRandom } from '../helpers/matchers.js';
import { referenceArrayFactor, relativeMaxError } from './helpers.js';

const F = 3e9;
const K = wavenumberRadPerM(F);
const LAMBDA = C0_M_PER_S / F;

describe('steering vector and matrix', () => {
  it('two elements ±λ/4 on x, wave from +x: phases ∓π/2 (aₙ = exp(+j k r̂·rₙ))', () => {
    const a = steeringVector(uniformLineLayout(2, LAMBDA / 2), [1, 0, 0], F);
    expect(a.data[0]).toBeCloseTo(0, 14);
    expect(a.data[1]).toBeCloseTo(-1, 14);
    expect(a.data[3]).toBeCloseTo(1, 14);
  });
  it('steering matrix columns equal steering vectors; wᴴA equals arrayFactor', () => {
    const layout = triangularLatticeLayout(0.6 * LAMBDA, { kind: 'circle', radiusM: 2 * LAMBDA });
    const dirs = randomUnitVectors(7, 3);
    const a = steeringMatrix(layout, dirs, F);
    const w = randomMatrix(layout.count, 1, 5);
    const af = arrayFactor(layout, w, dirs, F);
    for (let j = 0; j < 7; j++) {
      const col = steeringVectorInto(zeros(layout.count, 1), layout, [dirs[3 * j], dirs[3 * j + 1], dirs[3 * j + 2]], F);
      let re = 0, im = 0;
      for (let n = 0; n < layout.count; n++) {
        expect(a.data[2 * (n * 7 + j)]).toBe(col.data[2 * n]);
        const wr = w.data[2 * n], wi = w.data[2 * n + 1], ar = col.data[2 * n], ai = col.data[2 * n + 1];
        re += wr * ar + wi * ai;
        im += wr * ai - wi * ar;
      }
      expect(Math.hypot(af.data[2 * j] - re, af.data[2 * j + 1] - im)).toBeLessThan(1e-12 * layout.count);
    }
  });
});

describe('arrayFactor', () => {
  it('uniform line, progressive phase: |AF| = |sin(Nψ/2)/sin(ψ/2)|, ψ = kd(cosθ − cosθ₀) (Balanis 2016, eq. 6-10)', () => {
    for (const [n, dWl, theta0] of [[8, 0.5, Math.PI / 2], [13, 0.7, Math.PI / 3], [20, 0.25, 0]] as const) {
      const layout = uniformLineLayout(n, dWl * LAMBDA, { axis: 'z' });
      const w = steeringVector(layout, unitVectorFromAngles(theta0, 0), F);
      const thetas = Array.from({ length: 91 }, (_, i) => 0.013 + (i * Math.PI) / 91);
      const dirs = new Float64Array(thetas.flatMap((t) => [...unitVectorFromAngles(t, 0.4)]));
      const mag = arrayFactorMagnitude(layout, w, dirs, F);
      thetas.forEach((t, i) => {
        const psi = K * dWl * LAMBDA * (Math.cos(t) - Math.cos(theta0));
        const ref = Math.abs(psi) < 1e-12 ? n : Math.abs(Math.sin((n * psi) / 2) / Math.sin(psi / 2));
        expect(Math.abs(mag[i] - ref)).toBeLessThan(1e-12 * n);
      });
    }
  });
  it('factored (lattice) summation equals the textbook sum to 1e-13 relative: planar grid, ring, 3-D lattice, thinned', () => {
    const rnd = seededRandom(11);
    const dirs = randomUnitVectors(201, 12); // odd count exercises the unpaired last direction
    const grid = rectangularGridLayout({ countX: 16, countY: 12, spacingXM: 0.5 * LAMBDA, spacingYM: 0.6 * LAMBDA });
    const pts: Array<[number, number, number]> = [];
    for (let i = 0; i < 6; i++) for (let j = 0; j < 7; j++) for (let l = 0; l < 5; l++) pts.push([0.4 * LAMBDA * i, 0.55 * LAMBDA * j, 0.3 * LAMBDA * l * l]);
    const cube = arrayLayout(pts);
    const thinned = withEnabledMask(grid, Array.from({ length: grid.count }, () => (rnd() < 0.7 ? 1 : 0)));
    const ring = ringLayout([{ count: 24, radiusM: 2 * LAMBDA }, { count: 12, radiusM: LAMBDA }], true);
    const line = uniformLineLayout(40, 0.5 * LAMBDA, { axis: 'y' });
    // the lattices must actually take the factored path for this test to mean anything
    for (const l of [grid, cube, line]) expect(planArrayFactor(l.positionsM).factored).toBe(true);
    expect(planArrayFactor(grid.positionsM).fullGrid).toBe(true);
    const oddGrid = rectangularGridLayout({ countX: 9, countY: 5, spacingXM: 0.7 * LAMBDA, spacingYM: 0.5 * LAMBDA });
    expect(planArrayFactor(oddGrid.positionsM).fullGrid).toBe(true);
    expect(planArrayFactor(thinned.positionsM).fullGrid).toBe(true);
    expect(planArrayFactor(ring.positionsM).factored).toBe(false);
    for (const layout of [grid, oddGrid, cube, thinned, ring, line]) {
      const w = randomMatrix(layout.count, 1, 17);
      const af = arrayFactor(layout, w, dirs, F);
      expect(relativeMaxError(af.data, referenceArrayFactor(layout, w, dirs, K))).toBeLessThan(1e-13);
    }
  });
  it('thinning: a disabled element contributes nothing', () => {
    const layout = uniformLineLayout(3, LAMBDA / 2);
    const thin = withEnabledMask(layout, [1, 0, 1]);
    const w = fromParts([1, 1, 1], null, 3);
    // broadside: two active elements in phase
    expect(arrayFactor(thin, w, Float64Array.of(0, 0, 1), F).data[0]).toBeCloseTo(2, 14);
  });
  it('pattern multiplication: cos^q element, custom element, values behind the array', () => {
    const layout = uniformLineLayout(4, LAMBDA / 2);
    const w = fromParts([1, 1, 1, 1], null, 4);
    const dirs = new Float64Array([...unitVectorFromAngles(Math.PI / 3, Math.PI / 2), ...unitVectorFromAngles(2, 0)]);
    const af = arrayFactor(layout, w, dirs, F);
    const tp = totalPattern(layout, w, dirs, F, { kind: 'cosine', exponent: 1 });
    expect(tp.data[0]).toBeCloseTo(0.5 * af.data[0], 14); // cos 60° = 1/2
    expect(Math.abs(tp.data[2])).toBe(0);
    expect(Array.from(elementFactorValues({ kind: 'custom', amplitude: (x, y, z) => 1 + z }, dirs))[0]).toBeCloseTo(1.5, 14);
    expect(() => elementFactorValues({ kind: 'custom', amplitude: () => NaN }, dirs)).toThrow(DomainError);
    expect(() => elementFactorValues({ kind: 'cosine', exponent: -1 }, dirs)).toThrow(DomainError);
  });
  it('typed errors: weights of wrong length, NaN weights, |r̂| ≠ 1, empty directions, bad frequency', () => {
    const layout = uniformLineLayout(4, LAMBDA / 2);
    const w = fromParts([1, 1, 1, 1], null, 4);
    expect(() => arrayFactor(layout, fromParts([1, 1, 1], null, 3), Float64Array.of(0, 0, 1), F)).toThrow(DimensionError);
    expect(() => arrayFactor(layout, fromParts([1, NaN, 1, 1], null, 4), Float64Array.of(0, 0, 1), F)).toThrow(DomainError);
    expect(() => arrayFactor(layout, w, Float64Array.of(0, 0, 1.1), F)).toThrow(DomainError);
    expect(() => arrayFactor(layout, w, new Float64Array(0), F)).toThrow(DimensionError);
    expect(() => arrayFactor(layout, w, Float64Array.of(0, 1), F)).toThrow(DimensionError);
    expect(() => arrayFactor(layout, w, Float64Array.of(0, 0, 1), 0)).toThrow(DomainError);
    expect(() => steeringVector(layout, [0, 0, 0.5], F)).toThrow(DomainError);
    expect(() => steeringMatrix(layout, Float64Array.of(NaN, 0, 1), F)).toThrow(DomainError);
  });
});
