import { describe, it, expect } from 'vitest';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import type { WireDipole } from '../../src/element/types.js';
import { ETA0_OHM } from '../../src/units/constants.js';
import { adjoint, add, scale } from '../../src/linalg/ops.js';
import { isotropicNoiseMatrix } from '../../src/pattern/overlap.js';
import { dipoleArrayPorts, patternOverlapMatrix, quadratureDirections } from '../../src/reception/index.js';
import { hertzianSource } from './hertzian.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const f = 1e9, lambda = 299792458 / f;

describe('patternOverlapMatrix', () => {
  it('lossless dipoles: Ω = η|I₀|²(Z + Zᴴ)/(8π) (Twiss, J. Appl. Phys. 26(5), 1955, from memory)', () => {
    const d = (x: number, y: number): WireDipole => ({ centerM: [x * lambda, y * lambda, 0], axis: [0, 0, 1], lengthM: lambda / 2, radiusM: 1e-7 * lambda });
    const ports = dipoleArrayPorts([d(0, 0), d(0.4, 0), d(0.1, 0.55)], f, { driveCurrentA: 2 });
    const omega = patternOverlapMatrix(ports.patterns, quadratureDirections(sphereQuadrature(48, 96)));
    const z = ports.impedanceOhm;
    expectCMatrixClose(omega, scale(add(z, adjoint(z)), (ETA0_OHM * 4) / (8 * Math.PI)), { rtol: 1e-9 });
  });
  it('one pattern at several positions: the layout builder with that element factor, times the pattern scale', () => {
    // Hertzian dipoles along z: f = j(ηkI₀L/4π) sinθ·aₙ (Balanis 2016 eq. (4-26a), from memory).
    const xy: [number, number][] = [[0, 0], [0.07, 0], [0.02, 0.11]];
    const len = 0.01, k = (2 * Math.PI * f) / 299792458, amp = (ETA0_OHM * k * len) / (4 * Math.PI);
    const q = sphereQuadrature(40, 80);
    const omega = patternOverlapMatrix(hertzianSource(xy, len, f), quadratureDirections(q));
    const layout = arrayLayout(xy.map(([x, y]) => [x, y, 0]));
    const ref = isotropicNoiseMatrix(layout, f, { element: { kind: 'custom', amplitude: (_x, _y, z) => Math.sqrt(1 - z * z) }, quadrature: q });
    expectCMatrixClose(omega, scale(ref, amp * amp), { rtol: 1e-11 });
    // diagonal: (1/4π)∮ amp² sin²θ dΩ = (2/3) amp²
    expect(omega.data[0] / (amp * amp)).toBeCloseTo(2 / 3, 12);
  });
});
