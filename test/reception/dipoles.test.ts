import { describe, it, expect } from 'vitest';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { wireDipoleFarField } from '../../src/element/farField.js';
import type { WireDipole } from '../../src/element/types.js';
import { thermalImpedanceNoise } from '../../src/network/noise.js';
import { inverse } from '../../src/linalg/lu.js';
import { ETA0_OHM } from '../../src/units/constants.js';
import { wavelengthM } from '../../src/units/convert.js';
import {
  arrayNoiseBudget, beamFigures, brightnessCorrelation, dipoleArrayPorts, evaluateReceivingArray, isotropicBrightness,
  isotropicEnvironment, maxSnrWeightsUnpolarized, pointSourceCorrelation, quadratureDirections, samplePatterns, scanSweep,
  skyAndGroundEnvironment,
} from '../../src/reception/index.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const f = 1e9, lambda = wavelengthM(f);
// Very thin wires: the induced-EMF self resistance carries an O((ka)²) radius term that the
// filament patterns do not (≈ 2e-6 relative at a = λ/2000, measured), so identities use a = 1e-7 λ.
const half = (c: [number, number, number], axis: [number, number, number] = [0, 0, 1]): WireDipole => ({ centerM: c, axis, lengthM: lambda / 2, radiusM: 1e-7 * lambda });

describe('analytic dipoles (element module) through the reception chain', () => {
  it('Twiss: isotropic brightness integral = 2 k_B T B (Z + Zᴴ) for a lossless dipole array, 1e-9 relative', () => {
    // Physical identity (DESIGN); Z by the induced-EMF method, patterns from the same sinusoidal current.
    const dip = [half([0, 0, 0]), half([0.4 * lambda, 0, 0]), half([0.1 * lambda, 0.55 * lambda, 0.2 * lambda]), half([-0.3 * lambda, 0.2 * lambda, 0], [0, 0, 1])];
    const ports = dipoleArrayPorts(dip, f);
    const q = quadratureDirections(sphereQuadrature(48, 96));
    const r = brightnessCorrelation(ports.patterns, q, isotropicBrightness(77), 3e5);
    expectCMatrixClose(r, thermalImpedanceNoise(ports.impedanceOhm, 77, 3e5), { rtol: 1e-9 });
  });
  it('single conjugate-matched lossless half-wave dipole: P = S·A_e·B, A_e = λ²D/4π, D = 1.64', () => {
    // C. A. Balanis, Antenna Theory, 4th ed., 2016, eq. (4-91): D0 ≈ 1.643 for the half-wave dipole (from memory).
    const ports = dipoleArrayPorts([half([0, 0, 0])], f);
    const q = quadratureDirections(sphereQuadrature(32, 8));
    const p = samplePatterns(ports.patterns, Float64Array.of(Math.PI / 2), Float64Array.of(0));
    const s = 2e-25, b = 1e6;
    const rs = pointSourceCorrelation(p, 0, { fluxDensityWPerM2Hz: s, bandwidthHz: b, polarization: { kind: 'thetaPhi', thetaComponentVPerM: 1, phiComponentVPerM: 0 } });
    const rA = ports.impedanceOhm.data[0];
    const received = rs.data[0] / (4 * rA); // available power, conjugate match
    const budget = arrayNoiseBudget({ patterns: ports.patterns, quadrature: q, impedanceOhm: ports.impedanceOhm, environment: isotropicEnvironment(50), bandwidthHz: b, loss: 'lossless' });
    const [fig] = beamFigures(budget, { rows: 1, cols: 1, data: Float64Array.of(1, 0) }, p);
    expect(Math.abs(received / (s * fig.effectiveAreaM2 * b) - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fig.effectiveAreaM2 / ((lambda * lambda * 1.64) / (4 * Math.PI)) - 1)).toBeLessThan(2e-3); // 1.6409 vs 1.64
    expect(Math.abs(fig.directivity - 1.6409)).toBeLessThan(1e-4); // 4/Cin(2π) = 1.64086
  });
  it('max-SNR sensitivity of two coupled half-wave dipoles (isotropic, T) = λ² D_max/(4πT)', () => {
    // Identity: with isotropic thermal noise only, max SNR ⇔ max directivity;
    // D_max = (4π/η|I₀|²) fᴴ (Re Z)⁻¹ f (R. F. Harrington, "Antenna excitation for maximum gain",
    // IEEE Trans. Antennas Propag. 13(6), 1965, from memory), from the induced-EMF Z and the far field.
    const dip = [half([0, 0, 0]), half([0.2 * lambda, 0, 0])];
    const ports = dipoleArrayPorts(dip, f);
    const q = quadratureDirections(sphereQuadrature(40, 40));
    const t = 120;
    const budget = arrayNoiseBudget({ patterns: ports.patterns, quadrature: q, impedanceOhm: ports.impedanceOhm, environment: isotropicEnvironment(t), bandwidthHz: 1, loss: 'lossless' });
    const beam = samplePatterns(ports.patterns, Float64Array.of(Math.PI / 2), Float64Array.of(0));
    const [fig] = scanSweep(budget, beam).beams;
    // independent: far field by element, Re Z by element
    const fth = dip.map((d) => wireDipoleFarField(d, f, [Math.PI / 2], [0]).thetaComponentV.data);
    const re = { rows: 2, cols: 2, data: ports.impedanceOhm.data.map((v, k) => (k % 2 === 0 ? v : 0)) };
    const ri = inverse(re).data;
    let qf = 0;
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) {
      const gr = ri[2 * (i * 2 + j)], gi = ri[2 * (i * 2 + j) + 1];
      const xr = fth[j][0], xi = fth[j][1];
      const yr = gr * xr - gi * xi, yi = gr * xi + gi * xr;
      qf += fth[i][0] * yr + fth[i][1] * yi;
    }
    const dMax = (4 * Math.PI * qf) / ETA0_OHM;
    expect(dMax).toBeGreaterThan(3.5); // closely spaced endfire pair is superdirective
    expect(Math.abs(fig.sensitivityM2PerK / ((lambda * lambda * dMax) / (4 * Math.PI * t)) - 1)).toBeLessThan(1e-8);
    // max-SNR weights beat every other weight (sensitivity of random weights is lower)
    const w = maxSnrWeightsUnpolarized(beam, budget.total);
    // The deprecated (noise, beamPatterns) order gives the same weights.
    expect(maxSnrWeightsUnpolarized(budget.total, beam).data).toEqual(w.data);
    for (const other of [[1, 0, 1, 0], [1, 0, -1, 0], [0.3, 0.2, 1, -0.4]]) {
      const g = beamFigures(budget, { rows: 2, cols: 1, data: Float64Array.from(other) }, beam)[0];
      expect(g.sensitivityM2PerK).toBeLessThan(fig.sensitivityM2PerK);
    }
    expect(w.cols).toBe(1);
  });
  it('aperture efficiency of half-wave-spaced dipole arrays over ground at broadside → 1 as the array grows', () => {
    // Large-array limit D → 4πA/λ² with A = N·d² (infinite-array theory, e.g. R. C. Hansen,
    // Phased Array Antennas, 2nd ed., Wiley, 2009, ch. 7, from memory; common practice).
    // Measured by this code: uniform weights 1.0622 (4×4), 1.0302 (8×8) — an edge/ground excess
    // ≈ 0.24/n_x, so the finite array over an INFINITE ground plane exceeds N·d² slightly.
    const eff: number[] = [];
    for (const nx of [4, 8]) {
      const dip: WireDipole[] = [];
      for (let i = 0; i < nx; i++) for (let j = 0; j < nx; j++) dip.push({ centerM: [(i - (nx - 1) / 2) * lambda / 2, (j - (nx - 1) / 2) * lambda / 2, lambda / 4], axis: [1, 0, 0], lengthM: 0.49 * lambda, radiusM: lambda / 1000 });
      const ports = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
      const nt = 2 * nx + 14;
      const q = quadratureDirections(sphereQuadrature(nt, 2 * nt));
      const b = arrayNoiseBudget({ patterns: ports.patterns, quadrature: q, impedanceOhm: ports.impedanceOhm, environment: isotropicEnvironment(100), bandwidthHz: 1, loss: 'lossless' });
      const bp = samplePatterns(ports.patterns, Float64Array.of(0), Float64Array.of(0));
      const n = nx * nx, w = { rows: n, cols: 1, data: new Float64Array(2 * n) };
      for (let i = 0; i < n; i++) w.data[2 * i] = 1;
      const g = beamFigures(b, w, bp, { physicalAreaM2: (n * lambda * lambda) / 4 })[0];
      expect(Math.abs(g.radiationEfficiency - 1)).toBeLessThan(2e-5); // lossless (induced-EMF vs quadrature)
      eff.push(g.apertureEfficiency as number);
    }
    expect(Math.abs(eff[1] - 1)).toBeLessThan(0.035); // tolerance: 8×8 within 3.5 %
    expect(Math.abs(eff[1] - 1)).toBeLessThan(0.6 * Math.abs(eff[0] - 1)); // converging (≈ 1/n_x)
  });
  it('evaluateReceivingArray on dipoles over ground tilted 30° under a cold sky: parts add up, efficiencies in range', () => {
    const nx = 3, dip: WireDipole[] = [];
    for (let i = 0; i < nx; i++) for (let j = 0; j < nx; j++) dip.push({ centerM: [i * lambda / 2, j * lambda / 2, lambda / 4], axis: [1, 0, 0], lengthM: 0.48 * lambda, radiusM: lambda / 500 });
    const ports = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
    const res = evaluateReceivingArray({
      ports, quadrature: sphereQuadrature(24, 48), bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 10, groundK: 290, tiltRad: Math.PI / 6 }),
      amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 6, optimumSourceAdmittanceS: { re: 0.012, im: -0.003 } },
      loss: 'lossless',
      beams: { thetaRad: Float64Array.of(0, 0.3), phiRad: Float64Array.of(0, Math.PI / 2) },
      physicalAreaM2: (9 * lambda * lambda) / 4,
    });
    for (const b of res.beams) {
      expect(b.spilloverEfficiency).toBeGreaterThan(0.5);
      expect(b.spilloverEfficiency).toBeLessThan(1);
      expect(b.receiverTemperatureK).toBeGreaterThanOrEqual(res.minimumReceiverTemperatureK);
      expect(Math.abs(b.skyTemperatureK + b.spilloverTemperatureK + b.lossTemperatureK + b.receiverTemperatureK - b.systemTemperatureK)).toBeLessThan(1e-12 * b.systemTemperatureK);
    }
    for (const e of res.embeddedElementEfficiency) { expect(e).toBeGreaterThan(0); expect(e).toBeLessThan(1 + 1e-6); }
  });
});
