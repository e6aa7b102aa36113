import { describe, it, expect } from 'vitest';
import { DimensionError, DomainError } from '../../src/errors.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { inverse } from '../../src/linalg/lu.js';
import { K_BOLTZMANN_J_PER_K, T0_K } from '../../src/units/constants.js';
import { wavelengthM } from '../../src/units/convert.js';
import {
  arrayNoiseBudget, beamFigures, brightnessCorrelation, brightnessCorrelations, embeddedElementEfficiencies,
  isotropicBrightness, isotropicEnvironment, maxSnrWeightsUnpolarized, minimumReceiverTemperature, openCircuitVoltages,
  pointSourceCorrelation, quadratureDirections, samplePatterns, sampledPatternSource, scanSweep, skyAndGroundEnvironment, ohmicLossNoiseCorrelation,
} from '../../src/reception/index.js';
import {
  noiseTemperatureK as amplifierNoiseTemperature, thermalImpedanceNoise as thermalNoiseCorrelation, type NoiseParametersInput as AmplifierNoise,
} from '../../src/network/noise.js';
import { expectCMatrixClose } from '../helpers/matchers.js';
import { maxSnrWeightsForCorrelation } from '../../src/beamform/projection.js';
import { quadraticForm } from '../../src/linalg/ops.js';
import { hertzianResistance, hertzianSource } from './hertzian.js';

const f = 1e9, lambda = wavelengthM(f), L = lambda / 50;
const quad = quadratureDirections(sphereQuadrature(40, 80));

/** Z = R (closed form) − j·X with an arbitrary symmetric reactance (does not enter Twiss). */
function hertzianZ(xy: ReadonlyArray<[number, number]>): CMatrix {
  const r = hertzianResistance(xy, L, f);
  const n = xy.length;
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) r[2 * (i * n + j) + 1] = i === j ? -2000 : -50 / (1 + Math.abs(i - j));
  return { rows: n, cols: n, data: r };
}

describe('brightness integral', () => {
  it('Twiss: isotropic bath at T equals 2 k_B T B (Z + Zᴴ) for a lossless Hertzian array (1e-9)', () => {
    // Physical identity (DESIGN: reception, brightness and thermal rows linked);
    // R from the closed form (η k² L²/4π)[j₀(x) − j₁(x)/x] (Balanis 4-19 at x = 0).
    const xy: [number, number][] = [[0, 0], [0.3 * lambda, 0], [0.1 * lambda, 0.45 * lambda], [-0.5 * lambda, 0.2 * lambda]];
    const src = hertzianSource(xy, L, f);
    const r = brightnessCorrelation(src, quad, isotropicBrightness(150), 2e6);
    const twiss = thermalNoiseCorrelation(hertzianZ(xy), 150, 2e6);
    expectCMatrixClose(r, twiss, { rtol: 1e-9 });
  });
  it('blocked evaluation is independent of the block size and equals the direct sum', () => {
    const xy: [number, number][] = [[0, 0], [0.37 * lambda, 0.1 * lambda], [0.8 * lambda, -0.3 * lambda]];
    const src = hertzianSource(xy, L, f);
    const q = quadratureDirections(sphereQuadrature(9, 17));
    const t = (th: number, ph: number): number => 10 + 100 * Math.cos(th) ** 2 + 30 * Math.sin(ph) ** 2;
    const a = brightnessCorrelation(src, q, t, 1, { blockSize: 1 });
    const b = brightnessCorrelation(src, q, t, 1, { blockSize: 1000 });
    expectCMatrixClose(a, b, { rtol: 1e-13 });
    // direct Σ_k w_k T_k f fᴴ
    const p = samplePatterns(src, q.thetaRad, q.phiRad);
    const n = 3, m = q.thetaRad.length;
    const direct = new Float64Array(2 * n * n);
    const s = (4 * K_BOLTZMANN_J_PER_K) / (376.730313668 * 1);
    for (let k = 0; k < m; k++) {
      const wt = q.weightSr[k] * t(q.thetaRad[k], q.phiRad[k]) * s;
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
        const ar = p.thetaComponentV.data[2 * (i * m + k)], ai = p.thetaComponentV.data[2 * (i * m + k) + 1];
        const br = p.thetaComponentV.data[2 * (j * m + k)], bi = p.thetaComponentV.data[2 * (j * m + k) + 1];
        direct[2 * (i * n + j)] += wt * (ar * br + ai * bi);
        direct[2 * (i * n + j) + 1] += wt * (ai * br - ar * bi);
      }
    }
    expectCMatrixClose(a, { rows: n, cols: n, data: direct }, { rtol: 1e-7 }); // η0 rounded to 12 digits above
  });
  it('sampled patterns: exact lookup by direction (φ modulo 2π), never interpolated', () => {
    const src = hertzianSource([[0, 0], [0.3 * lambda, 0.1 * lambda]], L, f);
    const q = quadratureDirections(sphereQuadrature(6, 8));
    const samples = samplePatterns(src, q.thetaRad, q.phiRad);
    const wrapped = sampledPatternSource(samples);
    const th = Float64Array.of(q.thetaRad[9], q.thetaRad[3]), ph = Float64Array.of(q.phiRad[9] + 2 * Math.PI, q.phiRad[3] - 2 * Math.PI);
    const a = samplePatterns(wrapped, th, ph), b = samplePatterns(src, th, ph);
    expectCMatrixClose(a.thetaComponentV, b.thetaComponentV, { rtol: 1e-12 });
    expect(() => samplePatterns(wrapped, Float64Array.of(0.123), Float64Array.of(0))).toThrow(DomainError);
    // the same brightness integral through the samples and through the source
    expectCMatrixClose(brightnessCorrelation(samples, q, () => 20, 1), brightnessCorrelation(src, q, () => 20, 1), { rtol: 1e-14 });
  });
  it('typed errors: mismatched grids, negative temperatures, wrong map length', () => {
    const src = hertzianSource([[0, 0]], L, f);
    const q = quadratureDirections(sphereQuadrature(4, 8));
    expect(() => brightnessCorrelation(src, q, new Float64Array(5), 1)).toThrow(DimensionError);
    expect(() => brightnessCorrelation(src, q, () => -3, 1)).toThrow(DomainError);
    expect(() => brightnessCorrelation(src, q, () => Number.NaN, 1)).toThrow(DomainError);
    expect(() => isotropicBrightness(-1)).toThrow(DomainError);
    const samples = samplePatterns(src, q.thetaRad.subarray(0, 10), q.phiRad.subarray(0, 10));
    expect(() => brightnessCorrelation(samples, q, () => 1, 1)).toThrow(DimensionError);
    expect(() => brightnessCorrelations(src, q, [], 1)).toThrow(DomainError);
    expect(() => brightnessCorrelation(src, { ...q, weightSr: q.weightSr.subarray(1) }, () => 1, 1)).toThrow(DimensionError);
  });
});

describe('plane-wave reception', () => {
  it('far-zone pair: reception formula gives v₂ = Z₂₁ I₁ (sign and magnitude)', () => {
    // Exact field of a Hertzian dipole broadside (Balanis eq. (4-10a), from memory):
    // Z₂₁ = (jηkL²/4πd) e^{−jkd}[1 + 1/(jkd) − 1/(kd)²]; the reception formula keeps the 1/d term.
    const d = 1000 * lambda, k = (2 * Math.PI) / lambda, eta = 376.730313668;
    const src = hertzianSource([[0, 0], [d, 0]], L, f);
    // wave from element 1 arrives at element 2 from r̂ = −x̂ (θ = π/2, φ = π); plane wave E(r) = E0 e^{−jk x̂·r}
    // with E0 chosen so that at r₂ it equals the field of element 1: E0 = −ẑ·jηkI₁L/(4πd) ⇒ E_θ = +jηkI₁L/(4πd) (θ̂ = −ẑ).
    const i1 = 1;
    const eTheta = { re: 0, im: (eta * k * i1 * L) / (4 * Math.PI * d) };
    const p = samplePatterns(src, Float64Array.of(Math.PI / 2), Float64Array.of(Math.PI));
    const v = openCircuitVoltages(p, { kind: 'thetaPhi', thetaComponentVPerM: eTheta, phiComponentVPerM: 0 });
    const c = (eta * k * L * L) / (4 * Math.PI * d);
    const kd = k * d;
    // exact Z21 = j c e^{−jkd} (1 − 1/(kd)² − j/(kd))
    const gr = 1 - 1 / (kd * kd), gi = -1 / kd;
    const er = Math.cos(kd), ei = -Math.sin(kd);
    const pr = er * gr - ei * gi, pi = er * gi + ei * gr;
    const zr = -c * pi, zi = c * pr;
    const v2r = v.data[2], v2i = v.data[3];
    expect(Math.hypot(v2r - zr, v2i - zi)).toBeLessThan(2e-4 * Math.hypot(zr, zi));
  });
  it('Ludwig-3: an x-directed short dipole has no cross-polar response in the principal planes and full co-polar response at broadside', () => {
    // A. C. Ludwig, IEEE Trans. Antennas Propag. 21(1), 1973 (from memory): x-dipole f ∝ x̂ − (x̂·r̂)r̂.
    const th = Float64Array.of(0, 0.4, 0.7, 0.5), ph = Float64Array.of(0, 0, Math.PI / 2, Math.PI);
    const m = th.length;
    const ft = new Float64Array(2 * m), fp = new Float64Array(2 * m);
    for (let k = 0; k < m; k++) { ft[2 * k + 1] = Math.cos(th[k]) * Math.cos(ph[k]); fp[2 * k + 1] = -Math.sin(ph[k]); }
    const p = { thetaRad: th, phiRad: ph, thetaComponentV: { rows: 1, cols: m, data: ft }, phiComponentV: { rows: 1, cols: m, data: fp }, driveCurrentA: 1, frequencyHz: f };
    const cross = openCircuitVoltages(p, { kind: 'ludwig3', coVPerM: 0, crossVPerM: 1 });
    const co = openCircuitVoltages(p, { kind: 'ludwig3', coVPerM: 1, crossVPerM: 0 });
    const coY = openCircuitVoltages(p, { kind: 'ludwig3', coVPerM: 1, crossVPerM: 0, reference: 'y' });
    const scale = (4 * Math.PI) / (376.730313668 * (2 * Math.PI / lambda));
    for (let k = 0; k < m; k++) expect(Math.hypot(cross.data[2 * k], cross.data[2 * k + 1])).toBeLessThan(1e-15);
    expect(Math.abs(Math.hypot(co.data[0], co.data[1]) / scale - 1)).toBeLessThan(1e-6);
    expect(Math.hypot(coY.data[0], coY.data[1])).toBeLessThan(1e-15);
  });
  it('circular: a crossed pair fed for right-hand transmission receives the right-hand wave and rejects the left-hand one', () => {
    // f ∝ θ̂ − jφ̂ transmits RHCP toward +z; reciprocity: it receives incoming RHCP (θ̂ + jφ̂)/√2 fully (IEEE Std 145 handedness).
    const th = Float64Array.of(0.3), ph = Float64Array.of(1.1);
    const p = { thetaRad: th, phiRad: ph, thetaComponentV: { rows: 1, cols: 1, data: Float64Array.of(1, 0) }, phiComponentV: { rows: 1, cols: 1, data: Float64Array.of(0, -1) }, driveCurrentA: 1, frequencyHz: f };
    const right = openCircuitVoltages(p, { kind: 'circular', hand: 'right', amplitudeVPerM: 1 });
    const left = openCircuitVoltages(p, { kind: 'circular', hand: 'left', amplitudeVPerM: 1 });
    const scale = (4 * Math.PI) / (376.730313668 * (2 * Math.PI / lambda));
    expect(Math.abs(Math.hypot(right.data[0], right.data[1]) / scale - Math.SQRT2)).toBeLessThan(1e-9);
    expect(Math.hypot(left.data[0], left.data[1])).toBeLessThan(1e-15);
  });
});

describe('signal and sensitivity', () => {
  it('single conjugate-matched lossless short dipole: received power = S·A_e·B, A_e = 1.5 λ²/4π', () => {
    // Balanis, Antenna Theory, 4th ed., eq. (2-111) A_em = λ²D/4π with D = 1.5 for the Hertzian dipole (eq. (4-31)), from memory.
    const src = hertzianSource([[0, 0]], L, f);
    const p = samplePatterns(src, Float64Array.of(Math.PI / 2), Float64Array.of(0.3));
    const s = 1e-24, b = 1e6;
    const r = hertzianResistance([[0, 0]], L, f)[0];
    const rsPol = pointSourceCorrelation(p, 0, { fluxDensityWPerM2Hz: s, bandwidthHz: b, polarization: { kind: 'thetaPhi', thetaComponentVPerM: 1, phiComponentVPerM: 0 } });
    const ae = (1.5 * lambda * lambda) / (4 * Math.PI);
    expect(Math.abs(rsPol.data[0] / (4 * r) / (s * ae * b) - 1)).toBeLessThan(1e-12);
    // unpolarized: half the flux is received
    const rsUn = pointSourceCorrelation(p, 0, { fluxDensityWPerM2Hz: s, bandwidthHz: b });
    expect(Math.abs(rsUn.data[0] / (4 * r) / (0.5 * s * ae * b) - 1)).toBeLessThan(1e-12);
    // and the figures of merit report the same A_e, T_sys = T in an isotropic bath
    const z = hertzianZ([[0, 0]]);
    const budget = arrayNoiseBudget({ patterns: src, quadrature: quad, impedanceOhm: z, environment: isotropicEnvironment(100), bandwidthHz: b, loss: 'lossless' });
    const [fig] = beamFigures(budget, { rows: 1, cols: 1, data: Float64Array.of(1, 0) }, p, { fluxDensityWPerM2Hz: s });
    expect(Math.abs(fig.effectiveAreaM2 / ae - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fig.systemTemperatureK / 100 - 1)).toBeLessThan(1e-9);
    expect(Math.abs(fig.directivity - 1.5)).toBeLessThan(1e-9);
    // DESIGN sensitivity row: A_e/T_sys = 2 k_B SNR / S
    expect(Math.abs(fig.sensitivityM2PerK / ((2 * K_BOLTZMANN_J_PER_K * (fig.snr as number)) / s) - 1)).toBeLessThan(1e-12);
  });
  it('max-SNR sensitivity of two coupled short dipoles in an isotropic bath equals λ²D_max/(4πT)', () => {
    // Physical identity: with only isotropic thermal noise, max SNR ⇔ max directivity.
    // D_max from the closed-form radiation resistance: D_max = (η k² L²/4π)·aᴴR⁻¹a·4π/(η k² L²/4π·4π)…
    // i.e. D(w) = 4π U(w)/P(w) with U = (ηk²L²/16π²)|wᴴa|², P = wᴴRw ⇒ D_max = (ηk²L²/4π) aᴴR⁻¹a.
    const xy: [number, number][] = [[0, 0], [0.15 * lambda, 0]];
    const src = hertzianSource(xy, L, f);
    const t = 50;
    const z = hertzianZ(xy);
    const budget = arrayNoiseBudget({ patterns: src, quadrature: quad, impedanceOhm: z, environment: isotropicEnvironment(t), bandwidthHz: 1, loss: 'lossless' });
    const beam = samplePatterns(src, Float64Array.of(Math.PI / 2), Float64Array.of(0)); // endfire along +x
    const w = maxSnrWeightsUnpolarized(beam, budget.total);
    const [fig] = beamFigures(budget, w, beam);
    const k = (2 * Math.PI) / lambda;
    const rInv = inverse({ rows: 2, cols: 2, data: hertzianResistance(xy, L, f) });
    // a = steering at θ = π/2, φ = 0: e^{jk x}
    const a = [[1, 0], [Math.cos(k * xy[1][0]), Math.sin(k * xy[1][0])]];
    let q = 0;
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) {
      const rr = rInv.data[2 * (i * 2 + j)], ri = rInv.data[2 * (i * 2 + j) + 1];
      const pr = rr * a[j][0] - ri * a[j][1], pi = rr * a[j][1] + ri * a[j][0];
      q += a[i][0] * pr + a[i][1] * pi;
    }
    const dMax = ((376.730313668 * k * k * L * L) / (4 * Math.PI)) * q;
    expect(dMax).toBeGreaterThan(3); // superdirective endfire pair (> 2·1.5 is impossible for uncoupled; sanity)
    expect(Math.abs(fig.sensitivityM2PerK / ((lambda * lambda * dMax) / (4 * Math.PI * t)) - 1)).toBeLessThan(1e-8);
  });
});

describe('noise decomposition and efficiencies', () => {
  const xy: [number, number][] = [[0, 0], [0.5 * lambda, 0], [0, 0.5 * lambda], [0.5 * lambda, 0.5 * lambda]];
  const src = hertzianSource(xy, L, f);
  const z = hertzianZ(xy);
  const amp: AmplifierNoise = { minimumNoiseTemperatureK: 30, noiseResistanceOhm: 1, optimumSourceAdmittanceS: { re: 0.1, im: 0.001 } };
  const eff = Float64Array.of(0.9, 0.85, 0.95, 0.8);
  // a lossy array consistent with the efficiency model: Re Z' = R_rad + R_loss, R_loss,nn = (1 − eₙ) Re Z'ₙₙ
  const zLossy = { rows: 4, cols: 4, data: z.data.slice() };
  for (let i = 0; i < 4; i++) zLossy.data[2 * (i * 4 + i)] /= eff[i];
  const budget = arrayNoiseBudget({
    patterns: src, quadrature: quad, impedanceOhm: zLossy, bandwidthHz: 1,
    environment: skyAndGroundEnvironment({ skyK: 8, groundK: 300, tiltRad: 0.6, tiltAzimuthRad: 0.2 }),
    amplifiers: amp, physicalTemperatureK: 295, loss: { radiationEfficiency: eff },
  });
  const beams = samplePatterns(src, Float64Array.of(0.3, 1.0), Float64Array.of(0.1, 2.0));
  it('T_sys = sky + spillover + loss + receiver; the parts match η_rad, η_sp and T_phys', () => {
    const { beams: figs } = scanSweep(budget, beams);
    for (const g of figs) {
      expect(Math.abs(g.skyTemperatureK + g.spilloverTemperatureK + g.lossTemperatureK + g.receiverTemperatureK - g.systemTemperatureK)).toBeLessThan(1e-12 * g.systemTemperatureK);
      // Warnick et al. 2010 (from memory): T_sys = η_rad η_sp T_sky + η_rad (1 − η_sp) T_gnd + (1 − η_rad) T_p + T_rec
      expect(Math.abs(g.skyTemperatureK - g.radiationEfficiency * g.spilloverEfficiency * 8)).toBeLessThan(1e-9 * g.skyTemperatureK);
      expect(Math.abs(g.spilloverTemperatureK - g.radiationEfficiency * (1 - g.spilloverEfficiency) * 300)).toBeLessThan(1e-9 * g.spilloverTemperatureK);
      expect(Math.abs(g.lossTemperatureK - (1 - g.radiationEfficiency) * 295)).toBeLessThan(1e-6 * g.lossTemperatureK);
      // coupled beams need not stay between the element efficiencies, but a passive lossy array has 0 < η_rad < 1
      expect(g.radiationEfficiency).toBeGreaterThan(0.5);
      expect(g.radiationEfficiency).toBeLessThan(1);
    }
  });
  it('three loss descriptions agree: Twiss − pattern integral, element efficiencies, loss resistance matrix', () => {
    // Twiss for the lossy part alone; R_loss,nn = (1 − eₙ) Re Z'ₙₙ by construction of zLossy.
    const rl = { rows: 4, cols: 4, data: new Float64Array(32) };
    for (let i = 0; i < 4; i++) rl.data[2 * (i * 4 + i)] = (1 - eff[i]) * zLossy.data[2 * (i * 4 + i)];
    const q = quadratureDirections(sphereQuadrature(40, 80));
    const rad = brightnessCorrelation(src, q, isotropicBrightness(1), 1);
    const a = ohmicLossNoiseCorrelation(zLossy, 295, 1, { isotropicRadiationPerK: rad });
    const b = ohmicLossNoiseCorrelation(zLossy, 295, 1, { radiationEfficiency: eff });
    const c = ohmicLossNoiseCorrelation(zLossy, 295, 1, { lossResistanceOhm: rl });
    expectCMatrixClose(a, b, { rtol: 1e-9 });
    expectCMatrixClose(c, b, { rtol: 1e-14 });
    expect(() => ohmicLossNoiseCorrelation(zLossy, 295, 1, { radiationEfficiency: eff, lossResistanceOhm: rl })).toThrow(DimensionError);
    expect(() => ohmicLossNoiseCorrelation(zLossy, 295, 1, { radiationEfficiency: Float64Array.of(1.2, 1, 1, 1) })).toThrow(DomainError);
    expect(() => ohmicLossNoiseCorrelation(zLossy, -1, 1, { lossResistanceOhm: rl })).toThrow(DomainError);
  });
  it('batched rank-2 max-SNR weights reach the SNR of the generic generalized-eigenvector beamformer', () => {
    // Cross-check against the beamform module's any-rank max-SNR (principal generalized eigenvector).
    const w = maxSnrWeightsUnpolarized(beams, budget.total);
    for (let k = 0; k < 2; k++) {
      const rs = pointSourceCorrelation(beams, k, { fluxDensityWPerM2Hz: 1e-24, bandwidthHz: 1 });
      const ref = maxSnrWeightsForCorrelation(rs, budget.total);
      const wk = { rows: 4, cols: 1, data: Float64Array.from({ length: 8 }, (_, q) => w.data[2 * ((q >> 1) * 2 + k) + (q & 1)]) };
      const snr = quadraticForm(wk, rs) / quadraticForm(wk, budget.total);
      expect(Math.abs(snr / ref.snr - 1)).toBeLessThan(1e-9);
    }
  });
  it('T_rec,min ≤ T_rec of every beam; N = 1 gives the one-amplifier temperature', () => {
    const tMin = minimumReceiverTemperature(budget);
    const { beams: figs } = scanSweep(budget, beams, { minimumReceiverTemperatureK: tMin });
    for (const g of figs) {
      expect(g.receiverTemperatureK).toBeGreaterThanOrEqual(tMin * (1 - 1e-12));
      expect(g.noiseMatchingEfficiency as number).toBeLessThanOrEqual(1 + 1e-12);
    }
    const z1 = hertzianZ([[0, 0]]);
    const b1 = arrayNoiseBudget({ patterns: hertzianSource([[0, 0]], L, f), quadrature: quad, impedanceOhm: z1, environment: isotropicEnvironment(0), amplifiers: amp, bandwidthHz: 1, loss: 'lossless' });
    const zr = z1.data[0], zi = z1.data[1], d = zr * zr + zi * zi;
    expect(Math.abs(minimumReceiverTemperature(b1) / amplifierNoiseTemperature(amp, { re: zr / d, im: -zi / d }) - 1)).toBeLessThan(1e-10);
  });
  it('sensitivity increases monotonically as the amplifier T_min falls', () => {
    let prev = Infinity;
    for (const tMin of [100, 60, 30, 10, 3, 0]) {
      const b = arrayNoiseBudget({ patterns: src, quadrature: quad, impedanceOhm: z, bandwidthHz: 1, environment: isotropicEnvironment(10), amplifiers: { ...amp, minimumNoiseTemperatureK: tMin }, loss: 'lossless' });
      const [g] = scanSweep(b, beams).beams;
      if (prev !== Infinity) expect(g.sensitivityM2PerK).toBeGreaterThan(prev);
      prev = g.sensitivityM2PerK;
    }
  });
  it('tilting by π swaps sky and ground: η_sp(π) = 1 − η_sp(0); the z-dipole pattern gives 1/2', () => {
    const single = hertzianSource([[0, 0]], L, f);
    const z1 = hertzianZ([[0, 0]]);
    const p = samplePatterns(single, Float64Array.of(1), Float64Array.of(0));
    const sp = (tilt: number): number => {
      const b = arrayNoiseBudget({ patterns: single, quadrature: quad, impedanceOhm: z1, bandwidthHz: 1, environment: skyAndGroundEnvironment({ skyK: 5, tiltRad: tilt }), loss: 'lossless' });
      return beamFigures(b, { rows: 1, cols: 1, data: Float64Array.of(1, 0) }, p)[0].spilloverEfficiency;
    };
    expect(Math.abs(sp(0) - 0.5)).toBeLessThan(1e-12);
    expect(Math.abs(sp(1.1) - 0.5)).toBeLessThan(1e-3); // GL nodes are not symmetric about a tilted horizon
    // 4-element array, asymmetric beam
    const w = maxSnrWeightsUnpolarized(beams, budget.total);
    const e0 = arrayNoiseBudget({ patterns: src, quadrature: quad, impedanceOhm: z, bandwidthHz: 1, environment: skyAndGroundEnvironment({ skyK: 5, tiltRad: 0 }), loss: 'lossless' });
    const eP = arrayNoiseBudget({ patterns: src, quadrature: quad, impedanceOhm: z, bandwidthHz: 1, environment: skyAndGroundEnvironment({ skyK: 5, tiltRad: Math.PI }), loss: 'lossless' });
    const a = beamFigures(e0, w, beams), c = beamFigures(eP, w, beams);
    for (let k = 0; k < 2; k++) expect(Math.abs(a[k].spilloverEfficiency + c[k].spilloverEfficiency - 1)).toBeLessThan(1e-12);
  });
  it('embedded element efficiency: 1 for a lossless conjugate-matched single element; e·(1 − |Γ|²) with loss and mismatch', () => {
    const z1 = hertzianZ([[0, 0]]);
    const b1 = arrayNoiseBudget({ patterns: hertzianSource([[0, 0]], L, f), quadrature: quad, impedanceOhm: z1, environment: isotropicEnvironment(0), bandwidthHz: 1, loss: 'lossless' });
    const r = z1.data[0], x = z1.data[1];
    expect(Math.abs(embeddedElementEfficiencies(b1, [{ re: r, im: -x }])[0] - 1)).toBeLessThan(1e-9);
    // 50 Ω termination: mismatch 1 − |Γ|², Γ = (Z − Z_L*)/(Z + Z_L) (power-wave, Kurokawa 1965)
    const gr = r - 50, gi = x, hr = r + 50, hi = x;
    const gamma2 = (gr * gr + gi * gi) / (hr * hr + hi * hi);
    expect(Math.abs(embeddedElementEfficiencies(b1, [50])[0] / (1 - gamma2) - 1)).toBeLessThan(1e-9);
    expect(() => embeddedElementEfficiencies(b1, [50, 50])).toThrow(DimensionError);
    expect(() => embeddedElementEfficiencies(b1, [-5])).toThrow(DomainError);
  });
  it('typed errors: port-count mismatch, negative temperatures, non-physical amplifiers', () => {
    const base = { patterns: src, quadrature: quad, impedanceOhm: z, environment: isotropicEnvironment(10), bandwidthHz: 1 };
    expect(() => arrayNoiseBudget({ ...base, impedanceOhm: hertzianZ([[0, 0]]) })).toThrow(DimensionError);
    expect(() => arrayNoiseBudget({ ...base, physicalTemperatureK: -1 })).toThrow(DomainError);
    expect(() => skyAndGroundEnvironment({ skyK: -4 })).toThrow(DomainError);
    expect(() => arrayNoiseBudget({ ...base, amplifiers: { ...amp, minimumNoiseTemperatureK: 4 * T0_K * 1 * 0.1 * 1.1 } })).toThrow(DomainError);
    expect(() => beamFigures(budget, { rows: 3, cols: 2, data: new Float64Array(12) }, beams)).toThrow(DimensionError);
    expect(() => scanSweep(budget, samplePatterns(hertzianSource([[0, 0]], L, f), Float64Array.of(0), Float64Array.of(0)))).toThrow(DimensionError);
  });
});
