/**
 * Example: sensitivity A_e/T_sys of a small dipole array versus scan angle, in the E- and
 * H-planes, with coupled uncooled amplifiers and a cold sky over warm ground.
 *
 * Scenario of our own: a 3×3 grid of x-directed 0.47 λ dipoles, 0.55 λ apart, λ/4 over a
 * ground plane, at 1.7 GHz (a weather-satellite downlink), 2 MHz bandwidth, sky 5 K,
 * ground 290 K, amplifiers T_min = 40 K, R_n = 8 Ω, Y_opt = 20 mS; maximum-SNR beams.
 * Run: npx tsx examples/sensitivity-vs-scan.ts
 */
import {
  dipoleArrayPorts, evaluateReceivingArray, skyAndGroundEnvironment, sphereQuadrature, rectangularGridLayout,
  wavelengthM, degToRad, type WireDipole,
} from 'phasewise';
import { linePlotSvg } from 'phasewise/plot';
import { mkdirSync, writeFileSync } from 'node:fs';

const f = 1.7e9, lambda = wavelengthM(f), d = 0.55 * lambda;
const layout = rectangularGridLayout({ countX: 3, countY: 3, spacingXM: d, spacingYM: d });
const dipoles: WireDipole[] = [];
for (let i = 0; i < layout.count; i++) {
  dipoles.push({ centerM: [layout.positionsM[3 * i], layout.positionsM[3 * i + 1], lambda / 4], axis: [1, 0, 0], lengthM: 0.47 * lambda, radiusM: lambda / 250 });
}
const ports = dipoleArrayPorts(dipoles, f, { groundPlane: { zM: 0 } });

const scanDeg = [0, 10, 20, 30, 40, 50, 60];
const thetaRad = Float64Array.from([...scanDeg, ...scanDeg], degToRad);
const phiRad = Float64Array.from([...scanDeg.map(() => 0), ...scanDeg.map(() => Math.PI / 2)]);
const result = evaluateReceivingArray({
  ports,
  quadrature: sphereQuadrature(16, 32),
  bandwidthHz: 2e6,
  environment: skyAndGroundEnvironment({ skyK: 5, groundK: 290 }),
  amplifiers: { minimumNoiseTemperatureK: 40, noiseResistanceOhm: 8, optimumSourceAdmittanceS: 0.02 },
  loss: 'lossless', // thin-wire filament patterns and induced-EMF Z (see docs/reception.md)
  beams: { thetaRad, phiRad },
  physicalAreaM2: 9 * d * d,
});

console.log('scan [deg]  E-plane T_sys [K]  A_e/T_sys [m²/K]   H-plane T_sys [K]  A_e/T_sys [m²/K]');
const n = scanDeg.length;
for (let i = 0; i < n; i++) {
  const e = result.beams[i], h = result.beams[n + i];
  console.log(`${String(scanDeg[i]).padStart(10)}  ${e.systemTemperatureK.toFixed(2).padStart(17)}  ${e.sensitivityM2PerK.toExponential(3).padStart(16)}   ${h.systemTemperatureK.toFixed(2).padStart(17)}  ${h.sensitivityM2PerK.toExponential(3).padStart(16)}`);
}
console.log(`T_rec,min = ${result.minimumReceiverTemperatureK.toFixed(2)} K`);

// The same numbers as a figure (an SVG string; write it to a file to view it).
const svg = linePlotSvg({
  title: 'A_e/T_sys versus scan', xLabel: 'scan angle θ [deg]', yLabel: 'A_e/T_sys [m²/K]',
  traces: [
    { label: 'E-plane', x: scanDeg, y: result.beams.slice(0, n).map((b) => b.sensitivityM2PerK) },
    { label: 'H-plane', x: scanDeg, y: result.beams.slice(n).map((b) => b.sensitivityM2PerK) },
  ],
});
mkdirSync('examples-output', { recursive: true });
writeFileSync('examples-output/sensitivity-vs-scan.svg', svg);
console.log('figure written to examples-output/sensitivity-vs-scan.svg');
