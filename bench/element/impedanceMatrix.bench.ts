import { bench, describe } from 'vitest';
import { dipoleArrayImpedanceMatrix, dipolesFromLayout } from '../../src/element/index.js';
import { rectangularGridLayout } from '../../src/geometry/index.js';

const F = 299792458; // λ = 1 m
function sink(x: { data: Float64Array }): void {
  if (Number.isNaN(x.data[1])) throw new Error('NaN');
}

for (const side of [8, 16]) {
  const n = side * side;
  describe(`impedance matrix, ${n} dipoles 0.45λ long, 0.5λ grid`, () => {
    const layout = rectangularGridLayout({ countX: side, countY: side, spacingXM: 0.5, spacingYM: 0.5 });
    const ds = dipolesFromLayout(layout, { lengthM: 0.45, radiusM: 1e-3, axis: [1, 0, 0], heightM: 0.25 });
    const tilted = ds.map((d, i) => ({ ...d, axis: [1, 0.02 * (i % 3), 0] as const }));
    bench('free space (parallel: Si/Ci closed form)', () => { sink(dipoleArrayImpedanceMatrix(ds, F)); });
    bench('over ground plane (closed form + images)', () => { sink(dipoleArrayImpedanceMatrix(ds, F, { groundPlane: { zM: 0 } })); });
    if (n <= 64) bench('non-parallel (Gauss–Legendre path)', () => { sink(dipoleArrayImpedanceMatrix(tilted, F)); });
  });
}
