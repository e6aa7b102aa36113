import { solveWires, placeWireElement, rectangularGridLayout, wireArrayPorts, samplePatterns } from './src/index.ts';
const f = 299792458;
// general structure: a zig-zag wire (no translation reuse), n unknowns
function zigzag(n: number) {
  const pts: [number, number, number][] = [];
  const segs = n + 1;
  for (let i = 0; i <= segs; i += 10) pts.push([i * 0.05, (i / 10) % 2 === 0 ? 0 : 0.1, 0]);
  return { wires: [{ pointsM: pts, radiusM: 1e-3 }], ports: [{ wire: 0, atFraction: 0.5 }] };
}
for (const n of [1000, 3000]) {
  const t = performance.now();
  const s = solveWires(zigzag(n), f);
  console.log(n, s.unknowns, s.timings, ((performance.now() - t) / 1000).toFixed(2), 's');
}
