import { describe, it, expect } from 'vitest';
import { evenlySpaced, thetaPhiGrid, uvGrid, visibleDirections, planeCut } from '../../src/geometry/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';

describe('grids', () => {
  it('evenlySpaced hits both ends', () => {
    expect(Array.from(evenlySpaced(-1, 1, 5))).toEqual([-1, -0.5, 0, 0.5, 1]);
    expect(() => evenlySpaced(0, 1, 0)).toThrow(DomainError);
  });
  it('θ-φ grid: θ fastest; all unit vectors', () => {
    const g = thetaPhiGrid([0, Math.PI / 2], [0, Math.PI / 2, Math.PI]);
    expect(g.count).toBe(6);
    // k = iPhi·thetaCount + iTheta: k = 3 is θ = π/2, φ = π/2 → +y
    expect(g.directions[9]).toBeCloseTo(0, 15);
    expect(g.directions[10]).toBeCloseTo(1, 15);
    expect(() => thetaPhiGrid([], [0])).toThrow(DimensionError);
  });
  it('u-v grid visible mask and visible directions (unit length, front hemisphere)', () => {
    const g = uvGrid(evenlySpaced(-1, 1, 21), evenlySpaced(-1, 1, 21));
    let direct = 0;
    for (const v of g.vValues) for (const u of g.uValues) if (u * u + v * v <= 1) direct++;
    expect(g.visibleCount).toBe(direct);
    const { directions, indices } = visibleDirections(g);
    expect(indices.length).toBe(direct);
    for (let m = 0; m < indices.length; m++) {
      expect(Math.hypot(directions[3 * m], directions[3 * m + 1], directions[3 * m + 2])).toBeCloseTo(1, 14);
      expect(directions[3 * m + 2]).toBeGreaterThanOrEqual(0);
    }
    expect(() => visibleDirections(uvGrid([2], [2]))).toThrow(DimensionError);
  });
  it('plane cut: negative angles mirror to φ₀ + π; diagonal cut has u = v', () => {
    const c = planeCut(Math.PI / 4, [-0.5, 0.5]);
    expect(c.directions[0]).toBeCloseTo(-Math.sin(0.5) * Math.SQRT1_2, 15);
    expect(c.directions[3]).toBeCloseTo(c.directions[4], 15);
    expect(() => planeCut(0, [4])).toThrow(DomainError);
  });
});
