import { describe, it, expect } from 'vitest';
import { rectangularGridLayout, evenlySpaced, uvGrid, visibleDirections, type RectangularGridSpec } from '../../src/geometry/index.js';
import { arrayFactor, separableGridArrayFactor, fftGridArrayFactor, steeringVector } from '../../src/pattern/index.js';
import { C0_M_PER_S, wavenumberRadPerM } from '../../src/units/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';
import { randomMatrix } from '../helpers/matchers.js';
import { referenceArrayFactor, relativeMaxError } from './helpers.js';

const F = 3e9;
const L = C0_M_PER_S / F;

describe('fast grid paths equal the direct sum (identity, 1e-10 relative)', () => {
  const cases: RectangularGridSpec[] = [
    { countX: 32, countY: 32, spacingXM: L / 2, spacingYM: L / 2 },
    { countX: 7, countY: 12, spacingXM: 0.45 * L, spacingYM: 0.62 * L },
    { countX: 1, countY: 5, spacingXM: 0.5 * L, spacingYM: 0.5 * L },
  ];
  for (const g of cases) {
    it(`separable, ${g.countX}×${g.countY}, arbitrary (u, v) including invisible points`, () => {
      const layout = rectangularGridLayout(g);
      const w = randomMatrix(layout.count, 1, 31);
      const u = evenlySpaced(-1.3, 1.1, 23), v = evenlySpaced(-0.9, 1.4, 17);
      const sep = separableGridArrayFactor(g, w, u, v, F);
      // the reference sum only needs (u, v): the grid lies in z = 0
      const dirs = new Float64Array(3 * u.length * v.length);
      for (let j = 0; j < v.length; j++) for (let i = 0; i < u.length; i++) dirs.set([u[i], v[j], 0], 3 * (j * u.length + i));
      expect(relativeMaxError(sep.data, referenceArrayFactor(layout, w, dirs, wavenumberRadPerM(F)))).toBeLessThan(1e-10);
    });
    it(`FFT, ${g.countX}×${g.countY}: equals separable everywhere and the direct sum on visible points`, () => {
      const layout = rectangularGridLayout(g);
      const w = randomMatrix(layout.count, 1, 37);
      const r = fftGridArrayFactor(g, w, F, 64, 32);
      const sep = separableGridArrayFactor(g, w, r.uValues, r.vValues, F);
      expect(relativeMaxError(r.values.data, sep.data)).toBeLessThan(1e-10);
      const grid = uvGrid(r.uValues, r.vValues);
      const { directions, indices } = visibleDirections(grid);
      const direct = arrayFactor(layout, w, directions, F);
      const picked = new Float64Array(2 * indices.length);
      indices.forEach((k, m) => { picked[2 * m] = r.values.data[2 * k]; picked[2 * m + 1] = r.values.data[2 * k + 1]; });
      expect(relativeMaxError(picked, direct.data)).toBeLessThan(1e-10);
    });
  }
  it('FFT grid: λ/2 spacing covers u, v ∈ [−1, 1); the steered peak lands on its bin', () => {
    const g = { countX: 16, countY: 16, spacingXM: L / 2, spacingYM: L / 2 };
    const layout = rectangularGridLayout(g);
    // scan to (u, v) = (0.25, −0.5), both on the 128-point grid (step 2/128)
    const w = steeringVector(layout, [0.25, -0.5, Math.sqrt(1 - 0.3125)], F);
    const r = fftGridArrayFactor(g, w, F, 128);
    expect(r.uValues[0]).toBeCloseTo(-1, 14);
    const p = 64 + 16, q = 64 - 32;
    expect(r.values.data[2 * (q * 128 + p)]).toBeCloseTo(256, 9);
  });
  it('typed errors', () => {
    const g = { countX: 4, countY: 4, spacingXM: L / 2, spacingYM: L / 2 };
    const w = randomMatrix(16, 1, 1);
    expect(() => fftGridArrayFactor(g, w, F, 48)).toThrow(DomainError);
    expect(() => fftGridArrayFactor(g, w, F, 2)).toThrow(DomainError);
    expect(() => fftGridArrayFactor(g, randomMatrix(15, 1, 1), F, 64)).toThrow(DimensionError);
    expect(() => separableGridArrayFactor(g, w, [NaN], [0], F)).toThrow(DomainError);
    expect(() => separableGridArrayFactor(g, w, [], [0], F)).toThrow(DomainError);
  });
});
