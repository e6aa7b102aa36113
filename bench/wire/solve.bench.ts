import { bench, describe } from 'vitest';
import { solveWires, placeWireElement, wireArrayPorts, type WireStructure } from '../../src/wire/index.js';
import { rectangularGridLayout } from '../../src/geometry/builders.js';
import { samplePatterns } from '../../src/reception/patterns.js';
import { luFactor } from '../../src/linalg/lu.js';
import { C0_M_PER_S } from '../../src/units/constants.js';

function sink(x: { data: Float64Array }): void {
  if (Number.isNaN(x.data[0])) throw new Error('NaN');
}

const F = C0_M_PER_S; // λ = 1 m

/**
 * A zig-zag wire of straight 0.5 λ pieces (10 segments of λ/20 each) with no translation
 * symmetry to reuse: every matrix block is filled. ≈ `unknowns` basis functions.
 */
function zigzag(unknowns: number): WireStructure {
  const pts: [number, number, number][] = [];
  for (let i = 0; i <= unknowns + 1; i += 10) pts.push([i * 0.05, (i / 10) % 2 === 0 ? 0 : 0.1, 0]);
  return { wires: [{ pointsM: pts, radiusM: 1e-3 }], ports: [{ wire: 0 }] };
}

for (const n of [1000, 3000]) {
  const s = zigzag(n);
  describe(`thin-wire MoM, general structure, ≈${n} unknowns (fill + LU + solve)`, () => {
    bench('solveWires', () => { sink(solveWires(s, F).impedanceOhm); }, { iterations: n > 2000 ? 1 : 3, warmupIterations: n > 2000 ? 0 : 1 });
  });
}

describe('complex LU alone (the factorisation inside solveWires)', () => {
  for (const n of [1000, 3000]) {
    const a = { rows: n, cols: n, data: new Float64Array(2 * n * n) };
    let seed = 7;
    for (let i = 0; i < a.data.length; i++) { seed = (seed * 16807) % 2147483647; a.data[i] = seed / 2147483647 - 0.5; }
    bench(`luFactor n=${n} (8n³/3 flops)`, () => { sink(luFactor(a).lu); }, { iterations: n > 2000 ? 1 : 3, warmupIterations: n > 2000 ? 0 : 1 });
  }
});

// 64 horizontal dipoles (8×8, λ/2 lattice) λ/4 over ground, 12 segments each = 11 unknowns per
// element (704 in all); port Z and the open-circuit embedded patterns of all 64 ports on 10 000
// directions, one frequency. Everything inside the timing.
const element: WireStructure = { wires: [{ pointsM: [[-0.235, 0, 0], [0.235, 0, 0]], radiusM: 2e-3, segments: 12 }], ports: [{ wire: 0 }] };
const layout = rectangularGridLayout({ countX: 8, countY: 8, spacingXM: 0.5, spacingYM: 0.5 });
const th = new Float64Array(10000), ph = new Float64Array(10000);
for (let a = 0; a < 100; a++) for (let b = 0; b < 100; b++) { th[a * 100 + b] = ((a + 0.5) * Math.PI) / 200; ph[a * 100 + b] = (b * 2 * Math.PI) / 100; }
describe('64-element wire-dipole array over ground: port Z + embedded patterns at 10 000 directions', () => {
  bench('wireArrayPorts + samplePatterns', () => {
    const ports = wireArrayPorts(placeWireElement(element, layout, { heightM: 0.25 }), F, { groundPlane: { zM: 0 } });
    sink(samplePatterns(ports.patterns, th, ph).thetaComponentV);
  }, { iterations: 3, warmupIterations: 1 });
});
