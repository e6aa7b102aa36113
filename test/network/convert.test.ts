import { describe, it, expect } from 'vitest';
import { Complex } from 'complex.js';
import { createMultiport, multiportMatrix } from '../../src/network/multiport.js';
import { convertMultiport, renormalizeMultiport } from '../../src/network/convert.js';
import { fromRows, entry, transpose, identity, multiply, add, subtract, scale, solve } from '../../src/linalg/index.js';
import { randomPassiveImpedance } from './helpers.js';
import { DomainError, SingularMatrixError, DimensionError } from '../../src/errors.js';
import { expectCMatrixClose, randomMatrix } from '../helpers/matchers.js';
import { maxAbsDifference } from '../../src/linalg/ops.js';

const c = (re: number, im = 0): Complex => new Complex(re, im);
const z0 = 50;
// A lossy, non-reciprocal-free example two-port (values of our own choosing), Ω.
const zEx = [[c(40, 12), c(15, -7)], [c(22, 5), c(63, -20)]];

describe('two-port conversions vs. Pozar, Microwave Engineering, 4th ed., 2012, Table 4.2 (from memory)', () => {
  const zNet = createMultiport('impedance', [1e9], [fromRows(zEx)]);
  const [[z11, z12], [z21, z22]] = zEx;
  it('Z → S', () => {
    const dz = z11.add(z0).mul(z22.add(z0)).sub(z12.mul(z21));
    const s11 = z11.sub(z0).mul(z22.add(z0)).sub(z12.mul(z21)).div(dz);
    const s12 = z12.mul(2 * z0).div(dz);
    const s21 = z21.mul(2 * z0).div(dz);
    const s22 = z11.add(z0).mul(z22.sub(z0)).sub(z12.mul(z21)).div(dz);
    const s = multiportMatrix(convertMultiport(zNet, 'scattering'), 0);
    expectCMatrixClose(s, fromRows([[s11, s12], [s21, s22]]), { rtol: 1e-13 });
  });
  it('S → ABCD and S → Y', () => {
    const sNet = convertMultiport(zNet, 'scattering');
    const s = multiportMatrix(sNet, 0);
    const [s11, s12, s21, s22] = [entry(s, 0, 0), entry(s, 0, 1), entry(s, 1, 0), entry(s, 1, 1)];
    const one = c(1);
    const A = one.add(s11).mul(one.sub(s22)).add(s12.mul(s21)).div(s21.mul(2));
    const B = one.add(s11).mul(one.add(s22)).sub(s12.mul(s21)).mul(z0).div(s21.mul(2));
    const C = one.sub(s11).mul(one.sub(s22)).sub(s12.mul(s21)).div(s21.mul(2 * z0));
    const D = one.sub(s11).mul(one.add(s22)).add(s12.mul(s21)).div(s21.mul(2));
    expectCMatrixClose(multiportMatrix(convertMultiport(sNet, 'chain'), 0), fromRows([[A, B], [C, D]]), { rtol: 1e-13 });
    const dl = one.add(s11).mul(one.add(s22)).sub(s12.mul(s21));
    const y11 = one.sub(s11).mul(one.add(s22)).add(s12.mul(s21)).div(dl.mul(z0));
    const y12 = s12.mul(-2).div(dl.mul(z0));
    const y21 = s21.mul(-2).div(dl.mul(z0));
    const y22 = one.add(s11).mul(one.sub(s22)).add(s12.mul(s21)).div(dl.mul(z0));
    expectCMatrixClose(multiportMatrix(convertMultiport(sNet, 'admittance'), 0), fromRows([[y11, y12], [y21, y22]]), { rtol: 1e-13 });
  });
  it('Z → ABCD directly: A = Z11/Z21, B = ΔZ/Z21, C = 1/Z21, D = Z22/Z21', () => {
    const det = z11.mul(z22).sub(z12.mul(z21));
    const expected = fromRows([[z11.div(z21), det.div(z21)], [c(1).div(z21), z22.div(z21)]]);
    expectCMatrixClose(multiportMatrix(convertMultiport(zNet, 'chain'), 0), expected, { rtol: 1e-13 });
  });
  it('round trips through every form', () => {
    for (const form of ['admittance', 'scattering', 'chain', 'transfer'] as const) {
      const back = convertMultiport(convertMultiport(zNet, form), 'impedance');
      expectCMatrixClose(multiportMatrix(back, 0), fromRows(zEx), { rtol: 1e-13 });
    }
  });
  it('transfer form: cascading two-ports with equal real references multiplies T matrices', () => {
    const a = createMultiport('impedance', [1e9], [fromRows(zEx)]);
    const b = createMultiport('chain', [1e9], [fromRows([[1, c(10, 20)], [c(0.002, 0.001), 1.02]])]);
    const ta = multiportMatrix(convertMultiport(a, 'transfer'), 0), tb = multiportMatrix(convertMultiport(b, 'transfer'), 0);
    // chain-matrix product is the independent cascade (Pozar 2012, §4.4, from memory)
    const chain = createMultiport('chain', [1e9], [multiply(multiportMatrix(convertMultiport(a, 'chain'), 0), multiportMatrix(b, 0))]);
    expectCMatrixClose(multiportMatrix(convertMultiport(chain, 'transfer'), 0), multiply(ta, tb), { rtol: 1e-12 });
  });
  it('series impedance: chain [[1, Z], [0, 1]] has S11 = Z/(Z + 2Z0), S21 = 2Z0/(Z + 2Z0)', () => {
    // Pozar 2012, Table 4.1 (ABCD of a series impedance) (from memory)
    const zs = c(30, 40);
    const net = createMultiport('chain', [1e9], [fromRows([[1, zs], [0, 1]])]);
    const s = multiportMatrix(convertMultiport(net, 'scattering'), 0);
    const den = zs.add(2 * z0);
    expectCMatrixClose(s, fromRows([[zs.div(den), c(2 * z0).div(den)], [c(2 * z0).div(den), zs.div(den)]]), { rtol: 1e-13 });
    // it has no Z matrix
    expect(() => convertMultiport(net, 'impedance')).toThrow(SingularMatrixError);
  });
});

describe('complex references (power waves)', () => {
  it('conjugate match: a one-port Z with reference Z* has S = 0 (Kurokawa 1965)', () => {
    const zl = c(35, -22);
    const net = createMultiport('impedance', [1e9], [fromRows([[zl]])], { referenceOhm: zl.conjugate() });
    const s = multiportMatrix(convertMultiport(net, 'scattering'), 0);
    expect(s.data[0] ** 2 + s.data[1] ** 2).toBeLessThan(1e-30);
    // whereas reference = Z gives a non-zero power-wave reflection (X ≠ 0)
    const net2 = createMultiport('impedance', [1e9], [fromRows([[zl]])], { referenceOhm: zl });
    expect(entry(multiportMatrix(convertMultiport(net2, 'scattering'), 0), 0, 0).abs()).toBeGreaterThan(0.1);
  });
  it('conjugate match on a 3-port: reference_i = conj(Z_ii) zeroes the diagonal of S only when uncoupled', () => {
    const zd = [c(20, 5), c(70, -30), c(45, 60)];
    const z = fromRows([[zd[0], 0, 0], [0, zd[1], 0], [0, 0, zd[2]]]);
    const net = createMultiport('impedance', [1e9], [z], { referenceOhm: zd.map((v) => v.conjugate()) });
    const s = multiportMatrix(convertMultiport(net, 'scattering'), 0);
    expect(Math.max(...Array.from(s.data, Math.abs))).toBeLessThan(1e-15);
  });
  it('a reciprocal network stays symmetric after renormalisation to complex references (power waves)', () => {
    const g = randomMatrix(4, 4, 11);
    const zs = fromRows(Array.from({ length: 4 }, (_, i) => Array.from({ length: 4 }, (_, j) => {
      const a = entry(g, i, j), b = entry(g, j, i);
      return a.add(b).mul(20).add(i === j ? 80 : 0);
    })));
    const refs = [c(50, 10), c(25, -40), c(75, 0), c(10, 5)];
    const s = renormalizeMultiport(createMultiport('impedance', [2e9], [zs]), refs);
    const sm = multiportMatrix(convertMultiport(s, 'scattering'), 0);
    expect(maxAbsDifference(sm, transpose(sm))).toBeLessThan(1e-14);
    // pseudo-waves with the same references do not give a symmetric S (Marks & Williams 1992)
    const p = multiportMatrix(convertMultiport(renormalizeMultiport(s, refs, 'pseudo'), 'scattering'), 0);
    expect(maxAbsDifference(p, transpose(p))).toBeGreaterThan(1e-3);
    // and both describe the same Z
    expectCMatrixClose(multiportMatrix(convertMultiport(renormalizeMultiport(s, refs, 'pseudo'), 'impedance'), 0), zs, { rtol: 1e-12 });
  });
  it('renormalisation of S agrees with Z → S at the new references', () => {
    const z = randomMatrix(3, 3, 5);
    for (let i = 0; i < 3; i++) z.data[2 * (i * 3 + i)] += 3;
    const zNet = createMultiport('impedance', [1, 2], [z, z], { referenceOhm: 1 });
    const refs = [c(2, 1), c(0.5, -0.3), c(1, 0)];
    const direct = convertMultiport(createMultiport('impedance', [1, 2], [z, z], { referenceOhm: refs }), 'scattering');
    const viaS = renormalizeMultiport(convertMultiport(zNet, 'scattering'), refs);
    expectCMatrixClose(multiportMatrix(viaS, 1), multiportMatrix(direct, 1), { rtol: 1e-13 });
    const pseudo = renormalizeMultiport(convertMultiport(zNet, 'scattering'), refs, 'pseudo');
    const pseudoDirect = convertMultiport(createMultiport('impedance', [1, 2], [z, z], { referenceOhm: refs, waves: 'pseudo' }), 'scattering');
    expectCMatrixClose(multiportMatrix(pseudo, 0), multiportMatrix(pseudoDirect, 0), { rtol: 1e-13 });
  });
});

describe('typed errors', () => {
  it('singular Z → Y names the frequency index', () => {
    const ok = fromRows([[50, 0], [0, 50]]);
    const bad = fromRows([[50, 50], [50, 50]]);
    const net = createMultiport('impedance', [1e9, 2e9, 3e9], [ok, bad, ok]);
    let err: unknown;
    try { convertMultiport(net, 'admittance'); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(SingularMatrixError);
    expect((err as SingularMatrixError).index).toBe(1);
    expect((err as Error).message).toContain('frequency index 1');
  });
  it('non-positive real part of a reference impedance', () => {
    expect(() => createMultiport('impedance', [1], [identity(2)], { referenceOhm: [50, { re: 0, im: 10 }] })).toThrow(DomainError);
    expect(() => createMultiport('impedance', [1], [identity(2)], { referenceOhm: -50 })).toThrow(DomainError);
    const net = createMultiport('impedance', [1], [identity(2)]);
    expect(() => renormalizeMultiport(net, [50, -1])).toThrow(DomainError);
    expect(() => renormalizeMultiport(net, [50, 50, 50])).toThrow(DimensionError);
  });
  it('bad frequencies, non-finite data, chain form of a 3-port', () => {
    expect(() => createMultiport('impedance', [2, 1], [identity(1), identity(1)])).toThrow(DomainError);
    expect(() => createMultiport('impedance', [1], [fromRows([[NaN]])])).toThrow(DomainError);
    expect(() => createMultiport('impedance', [1, 2], [identity(1)])).toThrow(DimensionError);
    expect(() => convertMultiport(createMultiport('impedance', [1], [identity(3)]), 'chain')).toThrow(DimensionError);
  });
});

describe('large port counts', () => {
  it('Z → S for 60 ports (blocked LU path) equals (Z + Z₀)⁻¹(Z − Z₀) for real equal references', () => {
    // Power waves with a real Z₀: S = (Z + Z₀I)⁻¹(Z − Z₀I) (Kurokawa 1965; Pozar §4.3, from memory),
    // computed here with the general solver, not the conversion under test.
    const n = 60;
    const z = randomPassiveImpedance(n, 91);
    const z0 = 50;
    const s = multiportMatrix(convertMultiport(createMultiport('impedance', [1e9], [z]), 'scattering'), 0);
    const plus = add(z, scale(identity(n), z0)), minus = subtract(z, scale(identity(n), z0));
    expectCMatrixClose(s, solve(plus, minus), { rtol: 1e-11 });
    // and back again
    const back = multiportMatrix(convertMultiport(createMultiport('scattering', [1e9], [s]), 'impedance'), 0);
    expectCMatrixClose(back, z, { rtol: 1e-10 });
  });
});
