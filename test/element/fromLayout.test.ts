import { describe, it, expect } from 'vitest';
import { dipolesFromLayout } from '../../src/element/index.js';
import { arrayLayout, rectangularGridLayout } from '../../src/geometry/index.js';
import { DomainError } from '../../src/errors.js';

describe('dipolesFromLayout', () => {
  it('positions, height and default axis; orientations from the layout when present', () => {
    const ds = dipolesFromLayout(rectangularGridLayout({ countX: 2, countY: 1, spacingXM: 1, spacingYM: 1 }), { lengthM: 0.5, radiusM: 1e-3, heightM: 0.25 });
    expect(ds.map((d) => d.centerM)).toEqual([[-0.5, 0, 0.25], [0.5, 0, 0.25]]);
    expect(ds[0].axis).toEqual([1, 0, 0]);
    const withAxes = dipolesFromLayout(arrayLayout([[0, 0, 0], [1, 0, 0]], { orientations: [[0, 1, 0], [0, 0, 1]] }), { lengthM: 0.5, radiusM: 1e-3 });
    expect(withAxes.map((d) => d.axis)).toEqual([[0, 1, 0], [0, 0, 1]]);
  });
  it('rejects a zero length and a zero axis', () => {
    const l = rectangularGridLayout({ countX: 2, countY: 1, spacingXM: 1, spacingYM: 1 });
    expect(() => dipolesFromLayout(l, { lengthM: 0, radiusM: 1e-3 })).toThrow(DomainError);
    expect(() => dipolesFromLayout(l, { lengthM: 0.5, radiusM: 1e-3, axis: [0, 0, 0] })).toThrow(/non-zero/);
  });
});
