import { describe, it, expect } from 'vitest';
import { dipoleArrayPorts, evaluateReceivingArray, skyAndGroundEnvironment, samplePatterns, type ArrayPorts } from '../../src/reception/index.js';
import { sphereQuadrature } from '../../src/geometry/index.js';
import { pick, subtract, multiply, solve, maxAbsDifference, frobeniusNorm } from '../../src/linalg/index.js';
import type { WireDipole } from '../../src/element/index.js';
import { DomainError } from '../../src/errors.js';
import { failedArrayPorts, randomFailures } from '../../src/imperfect/index.js';

const F = 1.42e9, LAM = 299792458 / F;
function line(n: number): WireDipole[] {
  return Array.from({ length: n }, (_, i) => ({ centerM: [(i - (n - 1) / 2) * 0.5 * LAM, 0, 0] as const, axis: [0, 1, 0] as const, lengthM: 0.47 * LAM, radiusM: LAM / 300 }));
}
const ports = dipoleArrayPorts(line(6), F);
const th = Float64Array.of(0.1, 0.7, 1.2, 2.0), ph = Float64Array.of(0, 0.5, 2.0, 4.0);

describe('failedArrayPorts', () => {
  it('open failed port: Z of the others = Z with that row and column removed, patterns unchanged (identity)', () => {
    const r = failedArrayPorts(ports, [2, 4], { kind: 'open' });
    const keep = [0, 1, 3, 5];
    const z0 = pick(ports.impedanceOhm, keep, keep);
    expect(maxAbsDifference(r.impedanceOhm, z0)).toBeLessThan(1e-9 * frobeniusNorm(z0));
    const a = samplePatterns(r.patterns as never, th, ph), b = samplePatterns(ports.patterns, th, ph);
    expect(maxAbsDifference(a.thetaComponentV, pick(b.thetaComponentV, keep))).toBe(0);
  });
  it('loaded failed port: Z\' is the Schur complement Z_KK − Z_KF(Z_FF + Z_L)⁻¹Z_FK (network theory, Pozar 2012 Sect. 4.2)', () => {
    const zl = { re: 30, im: -12 };
    const r = failedArrayPorts(ports, [1], { kind: 'amplifierInput', impedanceOhm: zl });
    const K = [0, 2, 3, 4, 5], Fp = [1];
    const zff = pick(ports.impedanceOhm, Fp, Fp);
    zff.data[0] += zl.re; zff.data[1] += zl.im;
    const schur = subtract(pick(ports.impedanceOhm, K, K), multiply(pick(ports.impedanceOhm, K, Fp), solve(zff, pick(ports.impedanceOhm, Fp, K))));
    expect(maxAbsDifference(r.impedanceOhm, schur)).toBeLessThan(1e-9 * frobeniusNorm(schur));
  });
  it('reactively loaded failures keep the array lossless: the brightness integral of the new patterns meets Twiss for the new Z (energy identity)', () => {
    const r = failedArrayPorts(ports, [0, 3], { kind: 'amplifierInput', impedanceOhm: { re: 0, im: 40 } });
    const res = evaluateReceivingArray({
      ports: r, quadrature: sphereQuadrature(48, 96), bandwidthHz: 1e6, loss: 'lossless',
      environment: skyAndGroundEnvironment({ skyK: 290, groundK: 290 }),
      beams: { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(0) },
    });
    const twiss = res.checks.find((c) => c.name === 'twissResidual');
    expect(twiss?.passed).toBe(true);
  });
  it('a matched load absorbs power: the remaining array is less efficient (η_rad < 1), an open one is not', () => {
    const ev = (p: ArrayPorts) => evaluateReceivingArray({
      ports: p, quadrature: sphereQuadrature(48, 96), bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 5, groundK: 290 }),
      beams: { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(0) },
    });
    const m = ev(failedArrayPorts(ports, [2], { kind: 'matched' }));
    const o = ev(failedArrayPorts(ports, [2], { kind: 'open' }));
    expect(m.beams[0].radiationEfficiency).toBeLessThan(0.999);
    expect(Math.abs(o.beams[0].radiationEfficiency - 1)).toBeLessThan(2e-3);
  });
});

describe('randomFailures', () => {
  it('round(fraction·N) distinct seeded indices', () => {
    const a = randomFailures(1000, 0.03, 5), b = randomFailures(1000, 0.03, 5);
    expect(a.length).toBe(30);
    expect(new Set(a).size).toBe(30);
    expect(Array.from(a)).toEqual(Array.from(b));
    expect(() => randomFailures(10, 1.5, 1)).toThrow(DomainError);
    expect(() => failedArrayPorts(ports, [9], { kind: 'open' })).toThrow(DomainError);
    expect(() => failedArrayPorts(ports, [0, 1, 2, 3, 4, 5], { kind: 'open' })).toThrow(DomainError);
  });
});
