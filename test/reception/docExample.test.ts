import { describe, it, expect } from 'vitest';
import {
  dipoleArrayPorts, evaluateReceivingArray, skyAndGroundEnvironment, sphereQuadrature, wavelengthM, janskyToSi,
  type WireDipole,
} from '../../src/index.js';

// The worked example of docs/reception.md, verbatim; the numbers quoted there are checked here.
describe('docs/reception.md worked example', () => {
  it('reproduces the quoted figures', () => {
    const f = 1.4e9, lambda = wavelengthM(f);
    const dipoles: WireDipole[] = [];
    for (let i = 0; i < 4; i++) for (let j = 0; j < 4; j++) {
      dipoles.push({ centerM: [(i - 1.5) * lambda / 2, (j - 1.5) * lambda / 2, lambda / 4], axis: [1, 0, 0], lengthM: 0.48 * lambda, radiusM: lambda / 400 });
    }
    const ports = dipoleArrayPorts(dipoles, f, { groundPlane: { zM: 0 } });
    const result = evaluateReceivingArray({
      ports,
      quadrature: sphereQuadrature(32, 64),
      bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 10, groundK: 290, tiltRad: 0 }),
      amplifiers: { minimumNoiseTemperatureK: 25, noiseResistanceOhm: 4, optimumSourceAdmittanceS: { re: 0.014, im: -0.002 } },
      loss: 'lossless',
      beams: { thetaRad: Float64Array.of(0, Math.PI / 6), phiRad: Float64Array.of(0, 0) },
      physicalAreaM2: 16 * (lambda / 2) ** 2,
      fluxDensityWPerM2Hz: janskyToSi(1000),
    });
    const [z, s] = result.beams;
    const near = (x: number, v: number, rel = 5e-4): void => { expect(Math.abs(x / v - 1)).toBeLessThan(rel); };
    near(ports.impedanceOhm.data[0], 75.96); near(ports.impedanceOhm.data[1], 37.27);
    near(z.systemTemperatureK, 41.18); near(z.receiverTemperatureK, 31.18); near(z.effectiveAreaM2, 0.1980);
    near(z.sensitivityM2PerK, 4.809e-3); near(z.apertureEfficiency as number, 1.080); near(z.noiseMatchingEfficiency as number, 0.8093);
    near(z.snr as number, 1.742e-3);
    near(s.systemTemperatureK, 37.48); near(s.effectiveAreaM2, 0.1815); near(s.sensitivityM2PerK, 4.842e-3);
    near(s.apertureEfficiency as number, 0.9894);
    near(result.minimumReceiverTemperatureK, 25.23);
    near(result.embeddedElementEfficiency[0], 0.7783); near(result.embeddedElementEfficiency[1], 0.7298);
  });
});
