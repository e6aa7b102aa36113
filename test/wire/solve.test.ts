import { describe, it, expect } from 'vitest';
import {
  placeWireElement, solveWires, wireArrayPorts, wireFarField, WireGeometryError, wireLoadImpedance, type WireStructure,
} from '../../src/wire/index.js';
import { addSegmentReaction } from '../../src/wire/kernel.js';
import { dipoleSelfImpedance, sideBySideMutualImpedance } from '../../src/element/index.js';
import { rectangularGridLayout } from '../../src/geometry/builders.js';
import { sphereQuadrature } from '../../src/geometry/quadrature.js';
import { brightnessCorrelation, isotropicBrightness, quadratureDirections } from '../../src/reception/index.js';
import { thermalImpedanceNoise } from '../../src/network/noise.js';
import { ETA0_OHM, C0_M_PER_S } from '../../src/units/constants.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

// λ = 1 m throughout, so lengths read directly in wavelengths.
const F = C0_M_PER_S;
type V3 = [number, number, number];
const dipole = (lengthM: number, radiusM: number, centre: V3 = [0, 0, 0], segments?: number): WireStructure => ({
  wires: [{ pointsM: [[centre[0], centre[1], centre[2] - lengthM / 2], [centre[0], centre[1], centre[2] + lengthM / 2]], radiusM, segments }],
  ports: [{ wire: 0 }],
});
const z = (s: { impedanceOhm: { data: Float64Array } }, i = 0): [number, number] => [s.impedanceOhm.data[2 * i], s.impedanceOhm.data[2 * i + 1]];

describe('Galerkin reaction kernel', () => {
  it('reciprocity: the reaction of half-modes on S due to T equals that on T due to S (each by its own quadrature), 1e-7', () => {
    // Reaction theorem (V. H. Rumsey, "Reaction concept in electromagnetic theory", Phys. Rev. 94(6), 1954, from memory):
    // <a, b> = <b, a>. The kernel integrates the inner integral along the source in closed form and the outer
    // one by Gauss rules, so the two orders are computed differently and agree only if both are accurate.
    const seg = (x: number, y: number, z0: number, u: V3, d: number, a: number): Float64Array => Float64Array.of(x, y, z0, ...u, d, a);
    const k = 2 * Math.PI, d = 0.0125, a = 1e-3;
    const s2 = Math.SQRT1_2;
    const pairs: [Float64Array, Float64Array][] = [
      [seg(0, 0, 0, [0, 0, 1], d, a), seg(0, 0, d, [0, 0, 1], d, a)], // collinear, touching
      [seg(0, 0, 0, [0, 0, 1], d, a), seg(0, 0, d, [s2, 0, s2], 1.3 * d, 2 * a)], // bent junction, unequal
      [seg(0, 0, 0, [0, 0, 1], d, a), seg(0.01, 0, 0.003, [0, 0, 1], d, a)], // parallel, offset
      [seg(0, 0, 0, [1, 0, 0], d, a), seg(0.004, 0.006, 0.002, [0, s2, s2], 0.8 * d, a)], // skew, near
      [seg(0, 0, 0, [1, 0, 0], d, a), seg(0.03, 0.02, 0.01, [0, 1, 0], d, a)], // mid range
    ];
    for (const [sA, sB] of pairs) {
      const ab = new Float64Array(8), ba = new Float64Array(8);
      addSegmentReaction(ab, k, sA, 0, sB, 0, 1);
      addSegmentReaction(ba, k, sB, 0, sA, 0, 1);
      const scale = Math.max(...ab.map(Math.abs));
      for (const [p, q] of [[0, 0], [1, 2], [2, 1], [3, 3]]) {
        expect(Math.abs(ab[2 * p] - ba[2 * q]) / scale).toBeLessThan(1e-7);
        expect(Math.abs(ab[2 * p + 1] - ba[2 * q + 1]) / scale).toBeLessThan(1e-7);
      }
    }
  });
});

describe('solveWires: single elements', () => {
  it('centre-fed half-wave dipole converges with segment count (successive changes shrink)', () => {
    // Convergence of the moment method under refinement (R. F. Harrington, Field Computation by Moment
    // Methods, 1968, ch. 1, from memory). Sequence (a = 1e-4 λ) in docs/wire.md.
    const seq = [10, 20, 40, 80].map((n) => z(solveWires(dipole(0.5, 1e-4, [0, 0, 0], n), F)));
    const steps = seq.slice(1).map((v, i) => Math.hypot(v[0] - seq[i][0], v[1] - seq[i][1]));
    expect(steps[1]).toBeLessThan(0.75 * steps[0]);
    expect(steps[2]).toBeLessThan(0.75 * steps[1]);
    expect(steps[2]).toBeLessThan(0.5);
  });

  it('thin half-wave dipole tends to the one-mode induced-EMF value 73.1 + j42.5 Ω as the radius shrinks', () => {
    // Induced-EMF self impedance of the half-wave dipole: 73.1 + j42.5 Ω (C. A. Balanis, Antenna Theory,
    // 4th ed., 2016, eq. (8-60), from memory; the element module reproduces it). The sinusoidal current is
    // the limit Ω = 2 ln(2h/a) → ∞ of the true current, with corrections O(1/Ω) (R. W. P. King,
    // The Theory of Linear Antennas, Harvard, 1956, ch. II, from memory): extrapolate in 1/Ω.
    const emf = dipoleSelfImpedance(0.5, 1e-9, F);
    const radii = [1e-6, 1e-8, 1e-10];
    const zs = radii.map((a) => z(solveWires(dipole(0.5, a, [0, 0, 0], 40), F)));
    const errs = zs.map((v) => Math.hypot(v[0] - emf.re, v[1] - emf.im));
    expect(errs[1]).toBeLessThan(errs[0]);
    expect(errs[2]).toBeLessThan(errs[1]);
    const om = radii.map((a) => 2 * Math.log(0.5 / a));
    const extra = (c: 0 | 1): number => zs[2][c] - (zs[1][c] - zs[2][c]) / (1 / om[1] - 1 / om[2]) / om[2];
    expect(Math.abs(extra(0) - emf.re)).toBeLessThan(1.0);
    expect(Math.abs(extra(1) - emf.im)).toBeLessThan(0.5);
  });

  it('resonant length of a thin dipole (a = 0.001 λ) lies between 0.47 λ and 0.48 λ', () => {
    // Common practice: a thin half-wave dipole resonates about 2–6 % short of λ/2.
    const x = (l: number): number => z(solveWires(dipole(l, 1e-3), F))[1];
    expect(x(0.47)).toBeLessThan(0);
    expect(x(0.48)).toBeGreaterThan(0);
  });

  it('quarter-wave monopole on a ground plane has half the impedance of the dipole (image theory)', () => {
    // Image theory (Balanis, Antenna Theory, 4th ed., 2016, §4.7.4, from memory): Z_mono = Z_dipole / 2.
    const mono: WireStructure = { wires: [{ pointsM: [[0, 0, 0], [0, 0, 0.25]], radiusM: 1e-4, segments: 10 }], ports: [{ wire: 0, atFraction: 0 }] };
    const zm = z(solveWires(mono, F, { groundPlane: { zM: 0 } }));
    const zd = z(solveWires(dipole(0.5, 1e-4, [0, 0, 0], 20), F));
    expect(Math.abs(zm[0] - zd[0] / 2)).toBeLessThan(1e-6 * zd[0]);
    expect(Math.abs(zm[1] - zd[1] / 2)).toBeLessThan(1e-6 * zd[0]);
  });

  it('folded half-wave dipole: input resistance ≈ 4 × the simple dipole', () => {
    // Common practice (equal conductors, close spacing): Z_folded ≈ 4 Z_dipole near resonance.
    const l = 0.48, a = 5e-4, sp = 0.005;
    const folded: WireStructure = {
      wires: [{ pointsM: [[0, 0, -l / 2], [0, 0, l / 2], [sp, 0, l / 2], [sp, 0, -l / 2], [0, 0, -l / 2]], radiusM: a }],
      ports: [{ wire: 0, atFraction: (l / 2) / (2 * l + 2 * sp) }],
    };
    const ratio = z(solveWires(folded, F))[0] / z(solveWires(dipole(l, a), F))[0];
    expect(ratio).toBeGreaterThan(3.7);
    expect(ratio).toBeLessThan(4.4);
  });

  it('power identity: Re(Iᴴ Z I) equals the power radiated through the far-field sphere (bent wires, 3-wire junction)', () => {
    // Poynting's theorem for a lossless structure; RMS phasors: P = Re{V I*} = ∮ |f|²/η dΩ (docs/conventions.md).
    const bent: WireStructure = {
      wires: [
        { pointsM: [[-0.2, 0, 0], [0, 0, 0.05]], radiusM: 2e-3 },
        { pointsM: [[0, 0, 0.05], [0.15, 0.1, 0.25]], radiusM: 2e-3 },
        { pointsM: [[0, 0, 0.05], [0, -0.2, 0.1]], radiusM: 1e-3 },
      ],
      ports: [{ wire: 0, atFraction: 0.3 }, { wire: 2, atFraction: 0.5 }],
    };
    const s = solveWires(bent, F);
    const q = quadratureDirections(sphereQuadrature(40, 80));
    const cur = { rows: 2, cols: 1, data: Float64Array.of(1, 0, 0.3, -0.7) };
    const ff = wireFarField(s, cur, q.thetaRad, q.phiRad);
    let p = 0;
    for (let i = 0; i < q.weightSr.length; i++) {
      const t = ff.thetaComponentV.data, ph = ff.phiComponentV.data;
      p += q.weightSr[i] * (t[2 * i] ** 2 + t[2 * i + 1] ** 2 + ph[2 * i] ** 2 + ph[2 * i + 1] ** 2) / ETA0_OHM;
    }
    // Re(Iᴴ Z I)
    const zd = s.impedanceOhm.data, i = cur.data;
    let re = 0;
    for (let r = 0; r < 2; r++) for (let c = 0; c < 2; c++) {
      const zr = zd[2 * (r * 2 + c)], zi = zd[2 * (r * 2 + c) + 1];
      const vr = zr * i[2 * c] - zi * i[2 * c + 1], vi = zr * i[2 * c + 1] + zi * i[2 * c];
      re += i[2 * r] * vr + i[2 * r + 1] * vi;
    }
    expect(Math.abs(p / re - 1)).toBeLessThan(1e-6);
    expect(s.checks.every((c) => c.passed)).toBe(true);
  });
});
