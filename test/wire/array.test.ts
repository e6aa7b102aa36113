import { describe, it, expect } from 'vitest';
import { placeWireElement, solveWires, wireArrayPorts, wireFarField, type WireStructure } from '../../src/wire/index.js';
import { sideBySideMutualImpedance } from '../../src/element/index.js';
import { rectangularGridLayout } from '../../src/geometry/builders.js';
import { arrayLayout } from '../../src/geometry/layout.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { brightnessCorrelation, isotropicBrightness, quadratureDirections, samplePatterns } from '../../src/reception/index.js';
import { thermalImpedanceNoise } from '../../src/network/noise.js';
import { ETA0_OHM, C0_M_PER_S } from '../../src/units/constants.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const F = C0_M_PER_S; // λ = 1 m
const xDipole = (l: number, a: number, segments?: number): WireStructure => ({ wires: [{ pointsM: [[-l / 2, 0, 0], [l / 2, 0, 0]], radiusM: a, segments }], ports: [{ wire: 0 }] });
const zDipole = (l: number, a: number, x: number): WireStructure['wires'][number] => ({ pointsM: [[x, 0, -l / 2], [x, 0, l / 2]], radiusM: a });

describe('arrays of wire elements', () => {
  it('mutual impedance of two half-wave dipoles at 1–3 λ agrees with the induced-EMF module within the one-mode error', () => {
    // The one-mode (sinusoidal-current) model is the Ω = 2 ln(2h/a) → ∞ limit; its mutual impedances
    // carry O(1/Ω) errors, about 10 % at Ω ≈ 20 (R. W. P. King, The Theory of Linear Antennas, 1956,
    // ch. III, from memory). Check: within 15 % at a = 1e-5 λ (Ω = 21.6), closer still at a = 1e-9 λ.
    for (const d of [1, 2, 3]) {
      const emf = sideBySideMutualImpedance(0.5, d, F);
      const err = (a: number): number => {
        const s = solveWires({ wires: [zDipole(0.5, a, 0), zDipole(0.5, a, d)], ports: [{ wire: 0 }, { wire: 1 }] }, F);
        return Math.hypot(s.impedanceOhm.data[2] - emf.re, s.impedanceOhm.data[3] - emf.im);
      };
      const thick = err(1e-5), thin = err(1e-9);
      expect(thick).toBeLessThan(0.15 * Math.hypot(emf.re, emf.im));
      expect(thin).toBeLessThan(thick);
    }
  });

  it('placed array equals the same wires given one by one; identical placement pairs are computed once', () => {
    const el = xDipole(0.48, 1e-3, 12);
    const layout = rectangularGridLayout({ countX: 3, countY: 3, spacingXM: 0.5, spacingYM: 0.55 });
    const arr = solveWires(placeWireElement(el, layout, { heightM: 0.25 }), F, { groundPlane: { zM: 0 } });
    const wires = Array.from({ length: 9 }, (_, i) => {
      const p = layout.positionsM;
      return { pointsM: [[p[3 * i] - 0.24, p[3 * i + 1], 0.25], [p[3 * i] + 0.24, p[3 * i + 1], 0.25]] as [number, number, number][], radiusM: 1e-3, segments: 12 };
    });
    const flat = solveWires({ wires, ports: wires.map((_, i) => ({ wire: i })) }, F, { groundPlane: { zM: 0 } });
    expectCMatrixClose(arr.impedanceOhm, flat.impedanceOhm, { rtol: 1e-8 }); // to rounding and quadrature (pairs on a rule threshold)
    expect(arr.blocks.used).toBe(45);
    expect(arr.blocks.computed).toBeLessThan(30);
  });

  it('rotated placement: a layout orientation along y turns an x dipole into a y dipole', () => {
    const el = xDipole(0.48, 1e-3, 12);
    const layout = arrayLayout([[0, 0, 0], [0.6, 0, 0]], { orientations: [[0, 1, 0], [0, 1, 0]] });
    const rot = solveWires(placeWireElement(el, layout), F);
    const direct = solveWires({
      wires: [{ pointsM: [[0, -0.24, 0], [0, 0.24, 0]], radiusM: 1e-3, segments: 12 }, { pointsM: [[0.6, -0.24, 0], [0.6, 0.24, 0]], radiusM: 1e-3, segments: 12 }],
      ports: [{ wire: 0 }, { wire: 1 }],
    }, F);
    expectCMatrixClose(rot.impedanceOhm, direct.impedanceOhm, { rtol: 1e-9 });
  });

  it('4 × 4 wire-dipole array over ground: open-circuit embedded patterns reproduce the Twiss identity', () => {
    // DESIGN/conventions "thermal noise" and "brightness noise" rows: for a lossless array in an isotropic
    // bath the brightness integral equals 2 k_B T B (Z + Zᴴ) (R. Q. Twiss, "Nyquist's and Thevenin's theorems
    // generalized for nonreciprocal linear networks", J. Appl. Phys. 26(5), 1955, from memory).
    // Below the ground plane the bath is hidden; the upper hemisphere carries all the power.
    const el = xDipole(0.47, 2e-3, 11);
    const layout = rectangularGridLayout({ countX: 4, countY: 4, spacingXM: 0.5, spacingYM: 0.5 });
    const ports = wireArrayPorts(placeWireElement(el, layout, { heightM: 0.25 }), F, { groundPlane: { zM: 0 } });
    const q = quadratureDirections(sphereQuadrature(64, 128, { splitAtHorizon: true }));
    const r = brightnessCorrelation(ports.patterns, q, isotropicBrightness(100), 1e6);
    expectCMatrixClose(r, thermalImpedanceNoise(ports.impedanceOhm, 100, 1e6), { rtol: 1e-8 }); // measured 6e-10: segment quadrature of Re Z
    expect(ports.solution.checks.every((c) => c.passed)).toBe(true);
  });

  it('reception reciprocity row: a far pair gives v₂ = −j(4π/(ηkI₀)) f₂·E₁ = Z₂₁ I₁', () => {
    // docs/conventions.md "reception" row. Two parallel half-wave dipoles 40 λ apart along x: the field of
    // port 1 (1 A, port 2 open) at element 2 is locally a plane wave E₀ = f₁(x̂)/D referred to the origin
    // (element 1 sits at the origin), arriving from −x̂. Near-field terms are O(1/(kD)) ≈ 0.4 %.
    const D = 40;
    const s = wireArrayPorts({ wires: [zDipole(0.5, 1e-3, 0), zDipole(0.5, 1e-3, D)], ports: [{ wire: 0 }, { wire: 1 }] }, F);
    const out = samplePatterns(s.patterns, Float64Array.of(Math.PI / 2, Math.PI / 2), Float64Array.of(0, Math.PI));
    const f1 = [out.thetaComponentV.data[0], out.thetaComponentV.data[1]]; // port 1 toward +x
    const f2 = [out.thetaComponentV.data[6], out.thetaComponentV.data[7]]; // port 2 toward −x
    // θ̂ at (π/2, 0) is −ẑ and at (π/2, π) also −ẑ: the θ components multiply directly.
    const e0 = [f1[0] / D, f1[1] / D];
    const dr = f2[0] * e0[0] - f2[1] * e0[1], di = f2[0] * e0[1] + f2[1] * e0[0];
    const c = (4 * Math.PI) / (ETA0_OHM * 2 * Math.PI);
    const v2 = [c * di, -c * dr];
    const z21 = [s.impedanceOhm.data[4], s.impedanceOhm.data[5]];
    expect(Math.hypot(v2[0] - z21[0], v2[1] - z21[1])).toBeLessThan(0.01 * Math.hypot(z21[0], z21[1]));
  });

  it('a load equals a terminated port: Z_in = Z₁₁ − Z₁₂²/(Z₂₂ + Z_L)', () => {
    // Network theory of a reciprocal 2-port closed by a load (e.g. D. M. Pozar, Microwave Engineering, 4th ed., 2012, §4.2).
    const zl = { resistanceOhm: 30, inductanceH: 20e-9, capacitanceF: 2e-12 };
    const wires = [zDipole(0.48, 1e-3, 0), zDipole(0.5, 1e-3, 0.2)];
    const two = solveWires({ wires, ports: [{ wire: 0 }, { wire: 1 }] }, F).impedanceOhm.data;
    const one = solveWires({ wires, ports: [{ wire: 0 }], loads: [{ wire: 1, ...zl }] }, F).impedanceOhm.data;
    const w = 2 * Math.PI * F;
    const lr = 30, li = w * 20e-9 - 1 / (w * 2e-12);
    const den = [two[6] + lr, two[7] + li];
    const num = [two[2] * two[2] - two[3] * two[3], 2 * two[2] * two[3]];
    const dd = den[0] ** 2 + den[1] ** 2;
    const q = [(num[0] * den[0] + num[1] * den[1]) / dd, (num[1] * den[0] - num[0] * den[1]) / dd];
    expect(Math.abs(one[0] - (two[0] - q[0]))).toBeLessThan(1e-8 * Math.hypot(two[0], two[1]));
    expect(Math.abs(one[1] - (two[1] - q[1]))).toBeLessThan(1e-8 * Math.hypot(two[0], two[1]));
  });

  it('wireFarField with all ports driven equals the sum of the embedded patterns', () => {
    const s = wireArrayPorts({ wires: [zDipole(0.5, 1e-3, 0), zDipole(0.45, 1e-3, 0.3)], ports: [{ wire: 0 }, { wire: 1 }] }, F);
    const th = Float64Array.of(0.3, 1.2, 2.0), ph = Float64Array.of(0.1, 2.5, -1);
    const p = samplePatterns(s.patterns, th, ph);
    const ff = wireFarField(s.solution, { rows: 2, cols: 1, data: Float64Array.of(1, 0, 0, 2) }, th, ph);
    for (let k = 0; k < 3; k++) {
      const a = p.thetaComponentV.data, b = ff.thetaComponentV.data;
      // f = f₁·1 + f₂·2j
      const er = a[2 * k] - 2 * a[2 * (3 + k) + 1], ei = a[2 * k + 1] + 2 * a[2 * (3 + k)];
      expect(Math.hypot(b[2 * k] - er, b[2 * k + 1] - ei)).toBeLessThan(1e-9 * Math.hypot(er, ei));
    }
  });
});
