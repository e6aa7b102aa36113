import { bench, describe } from 'vitest';
import { evaluateDesign, validateDesign } from '../../src/design/index.js';

// The 64-element array of bench/wire/solve.bench.ts (8×8 horizontal dipoles, 12 segments = 11
// unknowns each, λ/4 over ground at 1 GHz) through the design job: 51 frequencies over
// 0.9–1.1 GHz, the wire array re-solved at every frequency, max-SNR beams at 3 pointings,
// sphere rule sized by the job for the layout at each frequency.
const lambda = 299792458 / 1e9;
const design = validateDesign({
  title: 'bench: 64 wire dipoles, 51 frequencies',
  frequencyHz: { fromHz: 0.9e9, toHz: 1.1e9, count: 51 },
  bandwidthHz: 1e6,
  layout: { kind: 'rectangular', countX: 8, countY: 8, spacingXM: lambda / 2, spacingYM: lambda / 2 },
  elements: {
    kind: 'wire', wires: [{ pointsM: [[-0.235 * lambda, 0, 0], [0.235 * lambda, 0, 0]], radiusM: 0.002 * lambda, segments: 12 }],
    port: { wire: 0 }, groundPlaneHeightM: lambda / 4,
  },
  amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: { re: 0.02, im: 0 } },
  environment: { skyK: 10, groundK: 290 },
  beams: { pointings: [{ thetaDeg: 0, phiDeg: 0 }, { thetaDeg: 20, phiDeg: 0 }, { thetaDeg: 20, phiDeg: 90 }] },
}, 'bench');

describe('design job, 64 wire dipoles over ground, 51 frequencies', () => {
  bench('evaluateDesign', () => {
    const ev = evaluateDesign(design, { fileName: 'bench' });
    if (!Number.isFinite(ev.frequencies[50].beams[0].sensitivityM2PerK)) throw new Error('NaN');
  }, { iterations: 1, warmupIterations: 0 });
});
