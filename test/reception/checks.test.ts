import { describe, it, expect } from 'vitest';
import { DomainError } from '../../src/errors.js';
import { physicalCheck, failedChecks } from '../../src/checks.js';
import { fromRows } from '../../src/linalg/cmatrix.js';
import { hermitianEigen, generalizedHermitianEigen } from '../../src/linalg/eigen.js';
import { multiply, adjoint, hermitianPart } from '../../src/linalg/ops.js';
import { lanczosExtremes } from '../../src/internal/lanczos.js';
import { gemmKernel } from '../../src/internal/gemm.js';
import { impedancePassivity } from '../../src/network/checks.js';
import { sphereQuadrature, sphereQuadratureForLayout } from '../../src/geometry/quadrature.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import { wavelengthM } from '../../src/units/convert.js';
import { K_BOLTZMANN_J_PER_K, T0_K } from '../../src/units/constants.js';
import type { WireDipole } from '../../src/element/types.js';
import {
  arrayNoiseBudget, dipoleArrayPorts, dipoleModelChecks, evaluateReceivingArray, minimumReceiverTemperature,
  quadratureDirections, receiverNoiseCorrelation, receivingArrayChecks, skyAndGroundEnvironment, twissResidual,
} from '../../src/reception/index.js';
import { randomMatrix } from '../helpers/matchers.js';

const amp = { minimumNoiseTemperatureK: 25, noiseResistanceOhm: 4, optimumSourceAdmittanceS: { re: 0.018, im: -0.001 } };

function randomHermitian(n: number, seed: number, shift: number) {
  const a = randomMatrix(n, n, seed);
  const h = hermitianPart(multiply(a, adjoint(a)));
  for (let i = 0; i < n; i++) h.data[2 * (i * n + i)] += shift;
  return h;
}

describe('lanczosExtremes', () => {
  it('agrees with the dense Hermitian eigenvalues (numpy-checked in test/linalg) at both ends', () => {
    for (const [n, seed] of [[40, 1], [120, 2], [7, 3]] as const) {
      const h = randomHermitian(n, seed, -3);
      const v = hermitianEigen(h, { valuesOnly: true }).values;
      const e = lanczosExtremes(n, (x, y) => gemmKernel(n, 1, n, h.data, 0, n, x, 0, 1, y, 0, 1, false), 'both', 1e-13);
      expect(e.converged).toBe(true);
      const scale = Math.max(Math.abs(v[0]), Math.abs(v[n - 1]));
      expect(Math.abs(e.min - v[0])).toBeLessThan(1e-9 * scale);
      expect(Math.abs(e.max - v[n - 1])).toBeLessThan(1e-9 * scale);
    }
  });
});

describe('physical check records', () => {
  it('decide passed from the comparison; NaN fails', () => {
    expect(physicalCheck('a', 1, 'atMost', 1, 'm', []).passed).toBe(true);
    expect(physicalCheck('a', 1.1, 'atMost', 1, 'm', []).passed).toBe(false);
    expect(physicalCheck('a', -1, 'atLeast', 0, 'm', []).passed).toBe(false);
    expect(physicalCheck('a', NaN, 'atLeast', 0, 'm', []).passed).toBe(false);
    expect(failedChecks([physicalCheck('a', 2, 'atMost', 1, 'm', []), physicalCheck('b', 0, 'atMost', 1, 'm', [])]).map((c) => c.name)).toEqual(['a']);
  });
  it('impedancePassivity: eigenvalues of Re Z (2×2 by hand: 50 ± 10 Ω) and a non-passive matrix', () => {
    const p = impedancePassivity(fromRows([[{ re: 50, im: 3 }, { re: 10, im: -7 }], [{ re: 10, im: -7 }, { re: 50, im: 1 }]]));
    expect(p.positiveDefinite).toBe(true);
    expect(p.smallestEigenvalueOhm).toBeCloseTo(40, 12);
    expect(p.largestEigenvalueOhm).toBeCloseTo(60, 12);
    const q = impedancePassivity(fromRows([[1, 2], [2, 1]]));
    expect(q.positiveDefinite).toBe(false);
    expect(q.smallestEigenvalueOhm).toBeCloseTo(-1, 12);
  });
});

describe('receiverNoiseCorrelation on the rank-N kernel', () => {
  it('equals Σ_ee + Z C + C* Zᴴ + Z Σ_ii Zᴴ formed by explicit products (N = 40, per-port amplifiers)', () => {
    const n = 40;
    const z = randomMatrix(n, n, 5);
    for (let i = 0; i < n; i++) z.data[2 * (i * n + i)] += 80;
    const amps = Array.from({ length: n }, (_, k) => ({ minimumNoiseTemperatureK: 10 + k / 4, noiseResistanceOhm: 2 + k / 10, optimumSourceAdmittanceS: { re: 0.02 + k / 4000, im: -0.003 } }));
    const r = receiverNoiseCorrelation(z, amps, 1);
    const s = 4 * K_BOLTZMANN_J_PER_K;
    const sig = new Float64Array(2 * n * n), c = new Float64Array(2 * n * n), dee = new Float64Array(2 * n * n);
    amps.forEach((a, k) => {
      const yr = a.optimumSourceAdmittanceS.re, yi = a.optimumSourceAdmittanceS.im, rn = a.noiseResistanceOhm;
      sig[2 * (k * n + k)] = T0_K * rn * (yr * yr + yi * yi);
      c[2 * (k * n + k)] = a.minimumNoiseTemperatureK / 2 - T0_K * rn * yr; c[2 * (k * n + k) + 1] = -T0_K * rn * yi;
      dee[2 * (k * n + k)] = T0_K * rn;
    });
    const m = (a: typeof z, b: typeof z) => multiply(a, b);
    const cm = { rows: n, cols: n, data: c }, sm = { rows: n, cols: n, data: sig };
    const zc = m(z, cm), czh = adjoint(zc), zsz = m(m(z, sm), adjoint(z));
    let worst = 0, big = 0;
    for (let k = 0; k < 2 * n * n; k++) {
      const e = s * (dee[k] + zc.data[k] + czh.data[k] + zsz.data[k]);
      worst = Math.max(worst, Math.abs(r.data[k] - e)); big = Math.max(big, Math.abs(e));
    }
    expect(worst).toBeLessThan(1e-12 * big);
  });
});

/** Half-wave dipoles of the shipped L-band example over ground on a square grid. */
function grid(count: number, spacingM: number): WireDipole[] {
  const out: WireDipole[] = [];
  for (let i = 0; i < count; i++) for (let j = 0; j < count; j++) {
    out.push({ centerM: [(i - (count - 1) / 2) * spacingM, (j - (count - 1) / 2) * spacingM, 0.0528], axis: [1, 0, 0], lengthM: 0.0985, radiusM: 0.0008 });
  }
  return out;
}

describe('evaluateReceivingArray checks', () => {
  it('16×16 dipoles at 0.12 m: Re Z is positive semidefinite once the self resistance is the filament value (a Gram matrix of the patterns)', () => {
    // Issue 17 measured −0.006 Ω here (numpy, same formulas): the self resistance was evaluated on the
    // wire surface, O((ka)²) below the filament's radiation resistance the patterns integrate to.
    const f = 1.42e9, dip = grid(16, 0.12);
    const ports = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
    const p = impedancePassivity(ports.impedanceOhm);
    expect(p.positiveDefinite).toBe(true);
    expect(p.smallestEigenvalueOhm).toBeGreaterThan(-1e-9 * p.largestEigenvalueOhm);
  });
  it('a non-passive imported Z (the 16×16 grid with 0.01 Ω taken off every self resistance): T_rec,min fails as a check, the rest is finished', () => {
    const f = 1.42e9, dip = grid(16, 0.12);
    const ports0 = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
    const n = ports0.impedanceOhm.rows, z = ports0.impedanceOhm.data.slice();
    for (let i = 0; i < n; i++) z[2 * (i * n + i)] -= 0.01;
    const ports = { ...ports0, impedanceOhm: { rows: n, cols: n, data: z } };
    const res = evaluateReceivingArray({
      ports, quadrature: sphereQuadrature(40, 80, { splitAtHorizon: true }), bandwidthHz: 2e6, loss: 'lossless',
      environment: skyAndGroundEnvironment({ skyK: 5, groundK: 290 }), amplifiers: amp,
      beams: { thetaRad: Float64Array.of(0, 0.3), phiRad: Float64Array.of(0, 0) },
    });
    const byName = Object.fromEntries(res.checks.map((c) => [c.name, c]));
    expect(byName.impedancePassivity.passed).toBe(false);
    expect(byName.impedancePassivity.value).toBeLessThan(0);
    expect(byName.impedancePassivity.value).toBeGreaterThan(-0.011);
    expect(byName.minimumReceiverTemperature.passed).toBe(false);
    expect(Number.isNaN(res.minimumReceiverTemperatureK)).toBe(true);
    expect(res.beams[0].noiseMatchingEfficiency).toBeUndefined();
    for (const b of res.beams) expect(b.systemTemperatureK).toBeGreaterThan(25);
    expect(byName['elementModel.electricalLength'].passed).toBe(true);
  });
  it('dipole model validity: a 25 λ dipole and any dipole at 1e30 Hz fail the electrical-length check; the L-band dipole passes', () => {
    const f = 1.42e9, lambda = wavelengthM(f);
    const long: WireDipole = { centerM: [0, 0, 1], axis: [1, 0, 0], lengthM: 25.3 * lambda, radiusM: 0.0008 };
    const c25 = dipoleModelChecks([long], f);
    expect(c25[0].name).toBe('elementModel.electricalLength');
    expect(c25[0].passed).toBe(false);
    expect(c25[0].value).toBeCloseTo(25.3, 9);
    expect(dipoleModelChecks(grid(1, 0), 1e30)[0].passed).toBe(false);
    expect(dipoleModelChecks(grid(1, 0), f).every((c) => c.passed)).toBe(true);
    expect(() => dipoleModelChecks([], f)).toThrow(DomainError);
    // the ports carry the checks into every evaluation
    expect(dipoleArrayPorts([long], f).checks?.[0].passed).toBe(false);
  });
  it('Twiss residual: fails for a 14 × 28 rule on a 40-element λ/2 line, passes with the rule sized for the layout', () => {
    const f = 1.4e9, lambda = wavelengthM(f), n = 40;
    const pos: [number, number, number][] = [];
    for (let i = 0; i < n; i++) pos.push([(i - (n - 1) / 2) * lambda / 2, 0, 0]);
    const dip = pos.map((c): WireDipole => ({ centerM: [c[0], 0, lambda / 4], axis: [0, 1, 0], lengthM: 0.48 * lambda, radiusM: lambda / 400 }));
    const ports = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
    const env = skyAndGroundEnvironment({ skyK: 10, groundK: 290 });
    const budgetOf = (q: ReturnType<typeof sphereQuadrature>) => arrayNoiseBudget({
      patterns: ports.patterns, quadrature: quadratureDirections(q), impedanceOhm: ports.impedanceOhm, environment: env, bandwidthHz: 1, loss: 'lossless',
    });
    expect(twissResidual(budgetOf(sphereQuadrature(14, 28)))).toBeGreaterThan(0.1);
    expect(twissResidual(budgetOf(sphereQuadratureForLayout(arrayLayout(pos), f, { tolerance: 1e-6, splitAtHorizon: true })))).toBeLessThan(1e-4);
  });
  it('receivingArrayChecks flags η_rad > 1 and efficiencies outside [0, 1]; aperture efficiency is not bounded', () => {
    const f = 1.42e9, dip = grid(2, 0.12);
    const ports = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
    const res = evaluateReceivingArray({
      ports, quadrature: sphereQuadrature(24, 48, { splitAtHorizon: true }), bandwidthHz: 2e6, loss: 'lossless',
      environment: skyAndGroundEnvironment({ skyK: 5, groundK: 290 }), amplifiers: amp,
      beams: { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(0) }, physicalAreaM2: 1e-4,
    });
    expect(failedChecks(res.checks)).toEqual([]);
    expect(res.beams[0].apertureEfficiency as number).toBeGreaterThan(1); // tiny stated area: unbounded by definition
    const bad = receivingArrayChecks({
      budget: res.budget, beams: [{ ...res.beams[0], radiationEfficiency: 1.2, spilloverEfficiency: -0.1 }], lossless: true,
      passivity: impedancePassivity(ports.impedanceOhm), embeddedElementEfficiency: Float64Array.of(0.5, 1.3),
    });
    const failed = failedChecks(bad).map((c) => c.name);
    expect(failed).toEqual(['radiationEfficiency', 'spilloverEfficiency', 'embeddedElementEfficiency']);
    expect(() => receivingArrayChecks(null as never)).toThrow(DomainError);
  });
  it('minimumReceiverTemperature (Lanczos on the reciprocal pencil) equals the dense generalized eigenvalue', () => {
    const f = 1.42e9, dip = grid(6, 0.12);
    const ports = dipoleArrayPorts(dip, f, { groundPlane: { zM: 0 } });
    const budget = arrayNoiseBudget({
      patterns: ports.patterns, quadrature: quadratureDirections(sphereQuadrature(24, 48, { splitAtHorizon: true })), impedanceOhm: ports.impedanceOhm,
      environment: skyAndGroundEnvironment({ skyK: 5 }), bandwidthHz: 1, loss: 'lossless', amplifiers: amp,
    });
    const dense = generalizedHermitianEigen(budget.receiver, budget.isotropicPerK, { valuesOnly: true }).values[0];
    expect(Math.abs(minimumReceiverTemperature(budget) - dense)).toBeLessThan(1e-9 * dense);
  });
});
