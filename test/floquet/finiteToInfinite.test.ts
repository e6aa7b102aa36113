import { describe, expect, it } from 'vitest';
import { Complex } from 'complex.js';
import { dipoleArrayImpedanceMatrix, dipoleMutualImpedance, dipoleSelfImpedance } from '../../src/element/mutualImpedance.js';
import type { WireDipole } from '../../src/element/types.js';
import { zeros } from '../../src/linalg/cmatrix.js';
import { rectangularLattice } from '../../src/geometry/lattice.js';
import { infiniteArrayActiveImpedance, infiniteDipoleArray } from '../../src/floquet/infiniteDipoleArray.js';
import { finiteArrayActiveImpedances } from '../../src/floquet/finiteArray.js';
import { C0_M_PER_S } from '../../src/units/constants.js';

// Identity between two modules: the centre element of growing finite arrays of thin-wire dipoles
// (element module, induced-EMF mutual impedances, sinusoidal current) tends to the Floquet result
// for the same lattice (strip width w = a·e^{3/2} ≡ wire radius a). The excitation is the scanned
// current Iₙ = exp(−j k r̂₀·rₙ) with a separable cos² taper, which removes the slowly decaying
// edge ripple of a uniformly excited truncated array so that the convergence is visible at N ≤ 41.
const F = 1e9;
const LAMBDA = C0_M_PER_S / F;
const K = (2 * Math.PI) / LAMBDA;
const L = 0.45 * LAMBDA, RADIUS = 0.001 * LAMBDA, DX = 0.6 * LAMBDA, DY = 0.5 * LAMBDA;

const dipoleAt = (x: number, y: number): WireDipole => ({ centerM: [x, y, 0], axis: [1, 0, 0], lengthM: L, radiusM: RADIUS });

function excitation(m: number, n: number, h: number, u: number, v: number): Complex {
  const w = Math.cos((Math.PI * m) / (2 * (h + 1))) ** 2 * Math.cos((Math.PI * n) / (2 * (h + 1))) ** 2;
  const p = -K * (u * m * DX + v * n * DY);
  return new Complex(w * Math.cos(p), w * Math.sin(p));
}

describe('finite-to-infinite convergence of dipole arrays', () => {
  for (const [th, ph] of [[0, 0], [0.5, 0.7]]) {
    it(`centre element → infinite array, scan θ = ${th}, φ = ${ph}`, () => {
      const inf = infiniteArrayActiveImpedance(
        infiniteDipoleArray({ lattice: rectangularLattice(DX, DY), element: { lengthM: L, widthM: RADIUS * Math.exp(1.5) }, backing: { kind: 'freeSpace' }, frequencyHz: F }),
        { thetaRad: th, phiRad: ph },
      ).impedanceOhm;
      const u = Math.sin(th) * Math.cos(ph), v = Math.sin(th) * Math.sin(ph);
      const errors: number[] = [];
      // Small arrays: the full N×N impedance matrix and the finite-array function.
      for (const N of [5, 11]) {
        const h = (N - 1) / 2;
        const dipoles: WireDipole[] = [];
        const I = zeros(N * N, 1);
        for (let m = -h; m <= h; m++) {
          for (let n = -h; n <= h; n++) {
            const i = dipoles.length;
            dipoles.push(dipoleAt(m * DX, n * DY));
            const c = excitation(m, n, h, u, v);
            I.data[2 * i] = c.re;
            I.data[2 * i + 1] = c.im;
          }
        }
        const za = finiteArrayActiveImpedances(dipoleArrayImpedanceMatrix(dipoles, F), I);
        const centre = (N * N - 1) / 2;
        errors.push(new Complex(za.data[2 * centre], za.data[2 * centre + 1]).sub(inf).abs());
      }
      // Larger arrays: only the centre row of Z is needed for the centre element.
      const cache = new Map<string, Complex>();
      for (const N of [21, 41]) {
        const h = (N - 1) / 2;
        let z = dipoleSelfImpedance(L, RADIUS, F);
        for (let m = -h; m <= h; m++) {
          for (let n = -h; n <= h; n++) {
            if (m === 0 && n === 0) continue;
            const key = `${Math.abs(m)},${Math.abs(n)}`;
            let zmn = cache.get(key);
            if (!zmn) {
              zmn = dipoleMutualImpedance(dipoleAt(0, 0), dipoleAt(Math.abs(m) * DX, Math.abs(n) * DY), F);
              cache.set(key, zmn);
            }
            z = z.add(zmn.mul(excitation(m, n, h, u, v)));
          }
        }
        errors.push(z.sub(inf).abs());
      }
      for (let i = 1; i < errors.length; i++) expect(errors[i]).toBeLessThan(errors[i - 1]);
      // At N = 41 the two models agree to 0.5 % (the residual is the wire/strip equivalence in the reactance).
      expect(errors[errors.length - 1] / inf.abs()).toBeLessThan(5e-3);
    });
  }
});
