/**
 * Where the time of the band job goes, per frequency, for a design file (default: the bench's
 * 64-dipole array): preparation, ports (Z and pattern source), the sphere rule, the reception
 * module's stages (noise budget, beam patterns, weights and figures, array figures) and the
 * report extras (pattern cuts, active reflection) at the report frequencies.
 *   npx tsx scripts/bench-band.ts [design.json]
 */
import { readFileSync } from 'node:fs';
import { loadavg } from 'node:os';
import { basename } from 'node:path';
import { designEnvironmentAt, designPortsAt, evaluateDesignFrequency, parseDesign, prepareDesign } from '../src/design/index.js';
import { evaluateReceivingArray } from '../src/reception/index.js';
import { sphereQuadrature, sphereQuadratureForLayout } from '../src/geometry/index.js';

const file = process.argv[2] ?? 'bench/design/band-64.json';
const t0 = performance.now();
const prepared = prepareDesign(parseDesign(readFileSync(file, 'utf8'), basename(file)));
const tPrepare = performance.now() - t0;
const sum: Record<string, number> = { ports: 0, quadrature: 0, noiseBudget: 0, beamPatterns: 0, weightsAndFigures: 0, arrayFigures: 0 };
let tWhole = 0, tReport = 0;
const d = prepared.design;
for (let i = 0; i < prepared.frequenciesHz.length; i++) {
  const f = prepared.frequenciesHz[i];
  let t = performance.now();
  const ports = designPortsAt(prepared, f);
  sum.ports += performance.now() - t;
  t = performance.now();
  const quadrature = d.quadrature ? sphereQuadrature(d.quadrature.thetaCount, d.quadrature.phiCount) : sphereQuadratureForLayout(prepared.layout, f, { tolerance: 1e-6 });
  sum.quadrature += performance.now() - t;
  const ev = evaluateReceivingArray({
    ports, quadrature, bandwidthHz: d.bandwidthHz, environment: designEnvironmentAt(prepared, f).environment,
    amplifiers: prepared.amplifiersAt?.(f), loss: 'lossless', physicalTemperatureK: d.environment.physicalTemperatureK ?? 290,
    beams: { thetaRad: prepared.beams.thetaRad, phiRad: prepared.beams.phiRad }, physicalAreaM2: d.physicalAreaM2,
  });
  for (const [k, v] of Object.entries(ev.timingsMs)) sum[k] = (sum[k] ?? 0) + v;
  t = performance.now();
  evaluateDesignFrequency(prepared, i);
  const whole = performance.now() - t;
  tWhole += whole;
  if (prepared.reportFrequencyIndices.includes(i)) tReport += whole;
}
const n = prepared.frequenciesHz.length;
console.log(`${basename(file)}: ${prepared.layout.count} elements, ${prepared.beams.thetaRad.length} beams, ${n} frequencies; load average ${loadavg()[0].toFixed(2)}`);
console.log(`prepare ${tPrepare.toFixed(1)} ms; whole evaluateDesignFrequency ${tWhole.toFixed(0)} ms (${(tWhole / n).toFixed(1)} ms per frequency)`);
for (const [k, v] of Object.entries(sum)) console.log(`  ${k.padEnd(18)} ${(v / n).toFixed(2)} ms per frequency (${((100 * v) / tWhole).toFixed(1)} %)`);
console.log(`  report frequencies (${prepared.reportFrequencyIndices.length}, with cuts and active reflection): ${tReport.toFixed(0)} ms in all`);
