import { bench, describe } from 'vitest';
import { sphereQuadratureForLayout } from '../../src/geometry/quadrature.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import type { WireDipole } from '../../src/element/types.js';
import { wavelengthM } from '../../src/units/convert.js';
import {
  dipoleArrayPorts, evaluateReceivingArray, quadratureDirections, skyAndGroundEnvironment,
} from '../../src/reception/index.js';

// 64 half-wave dipoles (8×8, λ/2 spacing) λ/4 over a PEC ground, 100 scan directions (10 θ × 10 φ
// within 45° of zenith), sky 10 K / ground 290 K, one amplifier type. Everything inside the timing:
// impedance matrix, patterns on the quadrature grid, noise budget, max-SNR beams, all figures.
const f = 1.4e9, lambda = wavelengthM(f);
const dipoles: WireDipole[] = [];
const pos: [number, number, number][] = [];
for (let i = 0; i < 8; i++) for (let j = 0; j < 8; j++) {
  const c: [number, number, number] = [(i - 3.5) * lambda / 2, (j - 3.5) * lambda / 2, lambda / 4];
  pos.push(c);
  dipoles.push({ centerM: c, axis: [1, 0, 0], lengthM: 0.48 * lambda, radiusM: lambda / 400 });
}
const th = new Float64Array(100), ph = new Float64Array(100);
for (let a = 0; a < 10; a++) for (let b = 0; b < 10; b++) { th[a * 10 + b] = (a * Math.PI) / 40; ph[a * 10 + b] = (b * 2 * Math.PI) / 10; }
const quad = quadratureDirections(sphereQuadratureForLayout(arrayLayout(pos), f, { tolerance: 1e-6 }));
let last: ReturnType<typeof evaluateReceivingArray> | undefined;

describe(`full evaluation, 64 dipoles over ground, ${quad.thetaRad.length} quadrature directions, 100 beams`, () => {
  bench('evaluateReceivingArray (incl. Z and patterns)', () => {
    const ports = dipoleArrayPorts(dipoles, f, { groundPlane: { zM: 0 } });
    last = evaluateReceivingArray({
      ports, quadrature: quad, bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 10, groundK: 290 }),
      amplifiers: { minimumNoiseTemperatureK: 25, noiseResistanceOhm: 4, optimumSourceAdmittanceS: { re: 0.014, im: -0.002 } },
      beams: { thetaRad: th, phiRad: ph }, physicalAreaM2: 64 * lambda * lambda / 4,
    });
    if (!(last.beams[0].systemTemperatureK > 0)) throw new Error('bad result');
  }, { iterations: 5, warmupIterations: 1, teardown: () => { if (last) process.stdout.write(`breakdown ms ${JSON.stringify(last.timingsMs)}\n`); } });
  bench('impedance matrix only', () => { dipoleArrayPorts(dipoles, f, { groundPlane: { zM: 0 } }); }, { iterations: 5, warmupIterations: 1 });
});
