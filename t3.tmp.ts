import { solveWires } from './src/index.ts';
const f = 299792458;
const pts: [number, number, number][] = [];
for (let i = 0; i <= 1001; i += 10) pts.push([i * 0.05, (i / 10) % 2 === 0 ? 0 : 0.1, 0]);
const s = solveWires({ wires: [{ pointsM: pts, radiusM: 1e-3 }], ports: [{ wire: 0, atFraction: 0.5 }] }, f);
console.log(s.unknowns, s.timings);
