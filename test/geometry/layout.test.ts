import { describe, it, expect } from 'vitest';
import {
  arrayLayout, withEnabledMask, activeLayout, activeCount, metresFromWavelengths, wavelengthsFromMetres,
  layoutCentroid, layoutDiameterM, uniformLineLayout, rectangularGridLayout, latticeLayout, triangularLatticeLayout, ringLayout, rectangularLattice,
} from '../../src/geometry/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';

function pairDistances(p: Float64Array): number[] {
  const d: number[] = [];
  for (let i = 0; i < p.length; i += 3) for (let j = i + 3; j < p.length; j += 3) d.push(Math.hypot(p[i] - p[j], p[i + 1] - p[j + 1], p[i + 2] - p[j + 2]));
  return d;
}

describe('arrayLayout', () => {
  it('copies positions given as triples or interleaved', () => {
    const a = arrayLayout([[0, 0, 0], [1, 2, 3]]);
    expect(Array.from(a.positionsM)).toEqual([0, 0, 0, 1, 2, 3]);
    const src = Float64Array.of(1, 2, 3);
    const b = arrayLayout(src);
    src[0] = 9;
    expect(b.positionsM[0]).toBe(1);
  });
  it('rejects empty layouts, NaN positions, bad lengths, non-unit orientations, bad masks', () => {
    expect(() => arrayLayout([])).toThrow(DimensionError);
    expect(() => arrayLayout(new Float64Array(0))).toThrow(DimensionError);
    expect(() => arrayLayout(Float64Array.of(1, 2))).toThrow(DimensionError);
    expect(() => arrayLayout([[0, NaN, 0]])).toThrow(DomainError);
    expect(() => arrayLayout([[0, Infinity, 0]])).toThrow(DomainError);
    expect(() => arrayLayout([[0, 0, 0]], { orientations: [[1, 1, 0]] })).toThrow(DomainError);
    expect(() => arrayLayout([[0, 0, 0]], { orientations: [[1, 0, 0], [0, 1, 0]] })).toThrow(DimensionError);
    expect(() => arrayLayout([[0, 0, 0]], { enabled: [1, 0] })).toThrow(DimensionError);
    expect(() => arrayLayout([[0, 0, 0]], { enabled: [2] })).toThrow(DomainError);
  });
  it('thinning mask: activeCount, activeLayout, centroid', () => {
    const line = uniformLineLayout(4, 1);
    const thin = withEnabledMask(line, [true, false, true, true]);
    expect(activeCount(thin)).toBe(3);
    const act = activeLayout(thin);
    expect(Array.from(act.positionsM)).toEqual([-1.5, 0, 0, 0.5, 0, 0, 1.5, 0, 0]);
    expect(layoutCentroid(thin)[0]).toBeCloseTo(1 / 6, 15);
    expect(() => activeLayout(withEnabledMask(line, [0, 0, 0, 0]))).toThrow(DimensionError);
  });
  it('wavelength conversions: λ = c0/f (c0 = 299 792 458 m/s exactly, SI definition)', () => {
    expect(metresFromWavelengths(0.5, 1.5e9)).toBeCloseTo(299792458 / 1.5e9 / 2, 15);
    expect(wavelengthsFromMetres(metresFromWavelengths(0.7, 3e9), 3e9)).toBeCloseTo(0.7, 14);
    expect(() => metresFromWavelengths(NaN, 1e9)).toThrow(DomainError);
    expect(() => metresFromWavelengths(0.5, 0)).toThrow(DomainError);
  });
});

describe('builders', () => {
  it('uniform line along any axis, centred', () => {
    const l = uniformLineLayout(3, 0.1, { axis: 'z' });
    expect(Array.from(l.positionsM)).toEqual([0, 0, -0.1, 0, 0, 0, 0, 0, 0.1]);
    const s = Math.SQRT1_2;
    const d = uniformLineLayout(5, 0.2, { axis: [s, s, 0], centred: false });
    expect(d.positionsM[12]).toBeCloseTo(0.8 * s, 15);
    expect(layoutDiameterM(uniformLineLayout(11, 0.3))).toBeCloseTo(3, 14);
    expect(() => uniformLineLayout(0, 0.1)).toThrow(DomainError);
    expect(() => uniformLineLayout(3, -0.1)).toThrow(DomainError);
    expect(() => uniformLineLayout(3, 0.1, { axis: [1, 1, 0] })).toThrow(DomainError);
  });
  it('rectangular grid: order x fastest, centred', () => {
    const g = rectangularGridLayout({ countX: 3, countY: 2, spacingXM: 1, spacingYM: 2 });
    expect(g.count).toBe(6);
    expect(Array.from(g.positionsM.slice(0, 6))).toEqual([-1, -1, 0, 0, -1, 0]);
    expect(Array.from(g.positionsM.slice(9, 12))).toEqual([-1, 1, 0]);
    expect(() => rectangularGridLayout({ countX: 2, countY: 0, spacingXM: 1, spacingYM: 1 })).toThrow(DomainError);
  });
  it('equilateral lattice: hexagon of circumradius d holds 7 points, nearest-neighbour distance d', () => {
    const h = triangularLatticeLayout(0.1, { kind: 'hexagon', circumradiusM: 0.1 });
    expect(h.count).toBe(7);
    expect(Math.min(...pairDistances(h.positionsM))).toBeCloseTo(0.1, 14);
    // hexagonal number 3k(k+1)+1 for a hexagon of k rings (geometry identity): k = 3 → 37
    expect(triangularLatticeLayout(1, { kind: 'hexagon', circumradiusM: 3 }).count).toBe(37);
  });
  it('lattice clipped to circle and rectangle: counts from the lattice-point definitions', () => {
    // Gauss circle problem: integer points with x²+y² ≤ 25 number 81 (direct count, well known).
    expect(latticeLayout([1, 0], [0, 1], { kind: 'circle', radiusM: 5 }).count).toBe(81);
    const r = latticeLayout([1, 0], [0, 1], { kind: 'rectangle', widthM: 4, heightM: 2 }, { offsetM: [0.5, 0] });
    expect(r.count).toBe(12); // x ∈ {±0.5, ±1.5}, y ∈ {−1, 0, 1}
    expect(() => latticeLayout([1, 0], [2, 0], { kind: 'circle', radiusM: 5 })).toThrow(DomainError);
    expect(() => latticeLayout([1, 0], [0, 1], { kind: 'circle', radiusM: 0.1 }, { offsetM: [0.5, 0.5] })).toThrow(DomainError);
  });
  it('rings', () => {
    const r = ringLayout([{ count: 6, radiusM: 0.1 }, { count: 12, radiusM: 0.2, startAngleRad: 0.1 }], true);
    expect(r.count).toBe(19);
    for (let n = 1; n < 7; n++) expect(Math.hypot(r.positionsM[3 * n], r.positionsM[3 * n + 1])).toBeCloseTo(0.1, 15);
    expect(() => ringLayout([])).toThrow(DomainError);
  });
});

describe('lattice layouts carry their lattice (issue 20)', () => {
  it('every position is the offset plus an integer combination of the primitive vectors', () => {
    const layouts = [
      rectangularGridLayout({ countX: 5, countY: 3, spacingXM: 0.1, spacingYM: 0.12 }),
      triangularLatticeLayout(0.1, { kind: 'circle', radiusM: 0.35 }),
      latticeLayout([0.1, 0.02], [0.03, 0.09], { kind: 'circle', radiusM: 0.3 }, { offsetM: [0.01, -0.02] }),
    ];
    for (const layout of layouts) {
      const l = layout.lattice!;
      expect(l).toBeDefined();
      // Solve r − r₀ = m a₁ + n a₂ for each element; m and n must be integers (Cramer's rule).
      const det = l.a1xM * l.a2yM - l.a1yM * l.a2xM;
      const x0 = layout.positionsM[0], y0 = layout.positionsM[1];
      for (let i = 0; i < layout.count; i++) {
        const dx = layout.positionsM[3 * i] - x0, dy = layout.positionsM[3 * i + 1] - y0;
        const m = (dx * l.a2yM - dy * l.a2xM) / det, n = (l.a1xM * dy - l.a1yM * dx) / det;
        expect(Math.abs(m - Math.round(m)) + Math.abs(n - Math.round(n))).toBeLessThan(1e-9);
      }
      // Reciprocal vectors: aᵢ·bⱼ = 2π δᵢⱼ.
      expect(l.a1xM * l.b1xRadPerM + l.a1yM * l.b1yRadPerM).toBeCloseTo(2 * Math.PI, 12);
      expect(l.a1xM * l.b2xRadPerM + l.a1yM * l.b2yRadPerM).toBeCloseTo(0, 12);
    }
    expect(uniformLineLayout(4, 0.1).lattice).toBeUndefined();
    expect(arrayLayout([[0, 0, 0], [0.1, 0, 0]], { lattice: rectangularLattice(0.1, 0.1) }).lattice?.cellAreaM2).toBeCloseTo(0.01, 15);
    expect(() => arrayLayout([[0, 0, 0]], { lattice: { a1xM: 1 } as never })).toThrow(/PlanarLattice/);
  });
});
