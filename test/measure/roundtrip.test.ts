/**
 * Round trip between the reception module (which generates hot/cold and on/off correlation
 * matrices of a coupled array with known amplifiers) and the measurement reduction here.
 */
import { describe, it, expect } from 'vitest';
import { dipoleArrayPorts } from '../../src/reception/ports.js';
import { arrayNoiseBudget, isotropicEnvironment } from '../../src/reception/budget.js';
import { quadratureDirections, samplePatterns } from '../../src/reception/patterns.js';
import { pointSourceCorrelation } from '../../src/reception/signal.js';
import { beamFigures, maxSnrWeightsUnpolarized } from '../../src/reception/figures.js';
import { simulateSnapshots, sampleCorrelation } from '../../src/beamform/snapshots.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { add, quadraticForm } from '../../src/linalg/ops.js';
import { zeros } from '../../src/linalg/cmatrix.js';
import { C0_M_PER_S } from '../../src/units/constants.js';
import { janskyToSi } from '../../src/units/convert.js';
import {
  receiverNoiseFromHotCold, beamReceiverTemperature, onOffSensitivityFromCorrelation, yFactorReceiverTemperature,
} from '../../src/measure/index.js';

// Four coupled half-wave dipoles (λ = 1 m) a quarter wave over ground, 0.6 λ apart, with one amplifier model.
const F = C0_M_PER_S;
const dipoles = [0, 1, 2, 3].map((i) => ({ centerM: [(i - 1.5) * 0.6, 0, 0] as [number, number, number], axis: [1, 0, 0] as [number, number, number], lengthM: 0.5, radiusM: 1e-4 }));
const ports = dipoleArrayPorts(dipoles, F, { groundPlane: { zM: -0.25 } });
const quad = quadratureDirections(sphereQuadrature(24, 32, { splitAtHorizon: true }));
const amps = { minimumNoiseTemperatureK: 40, noiseResistanceOhm: 6, optimumSourceAdmittanceS: { re: 0.015, im: -0.004 } };
const B = 1e6;
const budgetAt = (t: number) => arrayNoiseBudget({
  patterns: ports.patterns, quadrature: quad, impedanceOhm: ports.impedanceOhm, environment: isotropicEnvironment(t),
  amplifiers: amps, bandwidthHz: B, loss: 'lossless',
});
const hot = budgetAt(295), cold = budgetAt(20);

describe('matrix Y-factor on reception-module data', () => {
  it('recovers the coupled receiver noise matrix to 1e-9 and every beam temperature exactly', () => {
    const r = receiverNoiseFromHotCold({ hot: hot.total, cold: cold.total, hotTemperatureK: 295, coldTemperatureK: 20 });
    let num = 0, den = 0;
    for (let k = 0; k < r.receiver.data.length; k++) { num += (r.receiver.data[k] - cold.receiver.data[k]) ** 2; den += cold.receiver.data[k] ** 2; }
    expect(Math.sqrt(num / den)).toBeLessThan(1e-9);
    // The beam temperature is referred to the radiated isotropic response (the hot/cold environment itself).
    const w = zeros(4, 1); w.data[0] = 1; w.data[2] = 0.5; w.data[5] = -0.3; w.data[6] = 0.8;
    const tRec = beamReceiverTemperature(r, w);
    expect(Math.abs(tRec / (quadraticForm(w, cold.receiver) / quadraticForm(w, cold.radiationPerK)) - 1)).toBeLessThan(1e-9);
    // Reception refers T_rec to 2k_B B(Z + Zᴴ); for these lossless analytic dipoles the two references differ only by the
    // wire-radius term of the induced-EMF self resistance (~1e-5 relative), hence 1e-4 here.
    const beams = samplePatterns(ports.patterns, Float64Array.of(0), Float64Array.of(0));
    const fig = beamFigures(cold, w, beams)[0];
    expect(Math.abs(tRec / fig.receiverTemperatureK - 1)).toBeLessThan(1e-4);
  });
  it('on/off reduction of a point source returns the reception module\'s A_e/T_sys to 1e-9', () => {
    const beams = samplePatterns(ports.patterns, Float64Array.of(0.2), Float64Array.of(0.4));
    const s = janskyToSi(5e4);
    const rs = pointSourceCorrelation(beams, 0, { fluxDensityWPerM2Hz: s, bandwidthHz: B });
    const w = maxSnrWeightsUnpolarized(beams, cold.total);
    const red = onOffSensitivityFromCorrelation({ on: add(cold.total, rs), off: cold.total, weights: w, fluxDensityWPerM2Hz: s });
    const fig = beamFigures(cold, w, beams)[0];
    expect(Math.abs(red.aeOverTsysM2PerK / fig.sensitivityM2PerK - 1)).toBeLessThan(1e-9);
  });
  it('with simulated snapshots the beam T_rec scatters as the first-order Y-factor uncertainty predicts', () => {
    // Beam = port 0. Sample powers from T snapshots have relative σ = 1/√T (complex Gaussian, exponential |y|²).
    const T = 4000, trials = 40;
    const e0 = zeros(4, 1); e0.data[0] = 1;
    const pHot = quadraticForm(e0, hot.total), pCold = quadraticForm(e0, cold.total);
    const truth = yFactorReceiverTemperature({ hotPower: pHot, coldPower: pCold, hotTemperatureK: 295, coldTemperatureK: 20 });
    const predicted = yFactorReceiverTemperature({
      hotPower: pHot, coldPower: pCold, hotTemperatureK: 295, coldTemperatureK: 20,
      hotPowerRelativeSigma: 1 / Math.sqrt(T), coldPowerRelativeSigma: 1 / Math.sqrt(T),
    }).receiverTemperatureSigmaK;
    let sq = 0;
    for (let k = 0; k < trials; k++) {
      const sim = (r: typeof hot, seed: number) => sampleCorrelation(simulateSnapshots({ steering: zeros(4, 0), sourcePowers: [], noiseCorrelation: r.total, snapshotCount: T, seed }).snapshots);
      const red = receiverNoiseFromHotCold({ hot: sim(hot, 1000 + k), cold: sim(cold, 5000 + k), hotTemperatureK: 295, coldTemperatureK: 20, hermitianTolerance: 1e-6 });
      sq += (beamReceiverTemperature(red, e0) - truth.receiverTemperatureK) ** 2;
    }
    const rms = Math.sqrt(sq / trials);
    // 40 trials estimate an RMS to about ±11 % (1σ); accept 0.65–1.4 of the prediction.
    expect(rms / predicted).toBeGreaterThan(0.65);
    expect(rms / predicted).toBeLessThan(1.4);
  });
});
