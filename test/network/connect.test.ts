import { describe, it, expect } from 'vitest';
import { createMultiport, multiportMatrix } from '../../src/network/multiport.js';
import { convertMultiport, renormalizeMultiport } from '../../src/network/convert.js';
import {
  terminatePorts, joinPorts, joinOwnPorts, cascadeTwoPorts, keepPorts, addSeriesImpedance, addShuntAdmittance, joinPortPairs,
} from '../../src/network/connect.js';
import { reorderPorts, renamePorts, combineMultiports } from '../../src/network/ports.js';
import { fromRows, pick, solve, multiply, subtract, add, diagonal, inverse, zeros, setBlock } from '../../src/linalg/index.js';
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { DimensionError, DomainError, SingularMatrixError } from '../../src/errors.js';
import { expectCMatrixClose } from '../helpers/matchers.js';
import { randomPassiveImpedance, complement } from './helpers.js';

const zOf = (net: ReturnType<typeof createMultiport>, k = 0): CMatrix => multiportMatrix(convertMultiport(net, 'impedance'), k);

/** Independent Z-domain termination: Z_ee − Z_ei (Z_ii + Z_L)⁻¹ Z_ie. */
function zTerminate(z: CMatrix, drop: number[], zl: CMatrix): CMatrix {
  const keep = complement(z.rows, drop);
  const x = solve(add(pick(z, drop, drop), zl), pick(z, drop, keep));
  return subtract(pick(z, keep, keep), multiply(pick(z, keep, drop), x));
}

describe('terminatePorts', () => {
  it('matches the Z-domain reduction (complex references on the kept ports)', () => {
    const z = randomPassiveImpedance(5, 3);
    const net = createMultiport('impedance', [1e9], [z], { referenceOhm: [{ re: 30, im: 10 }, 50, 75, { re: 20, im: -15 }, 50] });
    const loads = [{ re: 10, im: 40 }, 100];
    const red = terminatePorts(net, [1, 3], loads);
    expect(red.ports).toBe(3);
    expect(red.portNames).toEqual(['1', '3', '5']);
    expectCMatrixClose(zOf(red), zTerminate(z, [1, 3], diagonal(loads)), { rtol: 1e-12 });
  });
  it('open and short loads, and frequency-dependent loads', () => {
    const z1 = randomPassiveImpedance(3, 4), z2 = randomPassiveImpedance(3, 5);
    const net = createMultiport('impedance', [1e9, 2e9], [z1, z2]);
    const open = terminatePorts(net, [0], ['open']);
    expectCMatrixClose(zOf(open, 1), pick(z2, [1, 2], [1, 2]), { rtol: 1e-12 });
    const short = terminatePorts(net, [0], ['short']);
    expectCMatrixClose(zOf(short, 0), zTerminate(z1, [0], zeros(1)), { rtol: 1e-12 });
    const fd = terminatePorts(net, [2], [[20, { re: 5, im: 5 }]]);
    expectCMatrixClose(zOf(fd, 1), zTerminate(z2, [2], fromRows([[{ re: 5, im: 5 }]])), { rtol: 1e-12 });
  });
  it('mismatched counts and bad ports are typed errors', () => {
    const net = createMultiport('impedance', [1e9], [randomPassiveImpedance(3, 1)]);
    expect(() => terminatePorts(net, [0, 1], [50])).toThrow(DimensionError);
    expect(() => terminatePorts(net, [3], [50])).toThrow(DomainError);
    expect(() => terminatePorts(net, [0, 0], [50, 50])).toThrow(DomainError);
    expect(() => terminatePorts(net, [0, 1, 2], [50, 50, 50])).toThrow(DimensionError);
    expect(() => terminatePorts(net, [0], [[1, 2]])).toThrow(DimensionError);
  });
});

describe('joining ports', () => {
  it('joinPorts of two networks matches the Z-domain constraint V_p = V_q, I_p = −I_q', () => {
    const za = randomPassiveImpedance(3, 7), zb = randomPassiveImpedance(2, 8);
    const a = createMultiport('impedance', [1e9], [za], { referenceOhm: [{ re: 40, im: 5 }, 50, 60] });
    const b = createMultiport('scattering', [1e9], convertMultiport(createMultiport('impedance', [1e9], [zb], { referenceOhm: [25, { re: 80, im: -30 }] }), 'scattering').data, { referenceOhm: [25, { re: 80, im: -30 }] });
    const j = joinPorts(a, 2, b, 0);
    // independent: block Z, join ports 2 and 3 (a's port 2, b's port 0)
    const zblk = setBlock(setBlock(zeros(5), 0, 0, za), 3, 3, zb);
    const e = [0, 1, 4], p = 2, q = 3;
    const d = subtract(pick(zblk, [p], e), pick(zblk, [q], e));
    const s = subtract(add(pick(zblk, [p], [p]), pick(zblk, [q], [q])), add(pick(zblk, [p], [q]), pick(zblk, [q], [p])));
    const jcur = solve(s, d); // J = −s⁻¹ d I_e  (sign applied below)
    const zred = subtract(pick(zblk, e, e), multiply(subtract(pick(zblk, e, [p]), pick(zblk, e, [q])), jcur));
    expect(j.portNames).toEqual(['1', '2', '2']);
    expectCMatrixClose(zOf(j), zred, { rtol: 1e-12 });
    // the outer references are kept
    expect(Array.from(j.referenceOhm)).toEqual([40, 5, 50, 0, 80, -30]);
  });
  it('joinOwnPorts equals joining through combineMultiports', () => {
    const za = randomPassiveImpedance(4, 9);
    const a = createMultiport('impedance', [1e9], [za]);
    const viaOwn = joinOwnPorts(combineMultiports([a, a]), 1, 6);
    const viaJoin = joinPorts(a, 1, a, 2);
    expectCMatrixClose(multiportMatrix(viaOwn, 0), multiportMatrix(viaJoin, 0), { rtol: 1e-13 });
  });
  it('cascade equals the chain-matrix product (Pozar 2012, §4.4, from memory)', () => {
    const f = [1e9, 2e9];
    const a1 = [fromRows([[1.2, { re: 10, im: 5 }], [{ re: 0.001, im: 0.002 }, 0.9]]), fromRows([[1.1, 3], [0.01, 1]])];
    const a2 = [fromRows([[0.8, { re: 2, im: -7 }], [{ re: 0.003, im: 0 }, { re: 1.3, im: 0.1 }]]), fromRows([[1, 20], [0, 1]])];
    const n1 = createMultiport('chain', f, a1), n2 = createMultiport('chain', f, a2);
    const c = convertMultiport(cascadeTwoPorts(n1, n2), 'chain');
    for (let k = 0; k < 2; k++) expectCMatrixClose(multiportMatrix(c, k), multiply(a1[k], a2[k]), { rtol: 1e-12 });
    // with unequal complex references on the joined ports (the engine renormalises)
    const n1c = renormalizeMultiport(n1, [50, { re: 20, im: 30 }]);
    const c2 = convertMultiport(cascadeTwoPorts(n1c, n2, n2), 'chain');
    expectCMatrixClose(multiportMatrix(c2, 0), multiply(multiply(a1[0], a2[0]), a2[0]), { rtol: 1e-12 });
  });
  it('series and shunt elements', () => {
    const z = randomPassiveImpedance(2, 12);
    const net = createMultiport('impedance', [1e9], [z]);
    const zs = { re: 3, im: 17 };
    const s = addSeriesImpedance(net, 1, zs);
    expectCMatrixClose(zOf(s), add(z, fromRows([[0, 0], [0, zs]])), { rtol: 1e-12 });
    const ys = { re: 0.01, im: -0.02 };
    const p = addShuntAdmittance(net, 0, ys);
    expectCMatrixClose(multiportMatrix(convertMultiport(p, 'admittance'), 0), add(inverse(z), fromRows([[ys, 0], [0, 0]])), { rtol: 1e-12 });
  });
  it('mismatched port counts and frequency grids are typed errors', () => {
    const two = createMultiport('impedance', [1e9], [randomPassiveImpedance(2, 1)]);
    const three = createMultiport('impedance', [1e9], [randomPassiveImpedance(3, 1)]);
    const other = createMultiport('impedance', [2e9], [randomPassiveImpedance(2, 1)]);
    expect(() => cascadeTwoPorts(two, three)).toThrow(DimensionError);
    expect(() => cascadeTwoPorts(two, other)).toThrow(DimensionError);
    expect(() => joinPorts(two, 2, three, 0)).toThrow(DomainError);
    expect(() => joinPortPairs(two, [[0, 1]])).toThrow(DimensionError);
    expect(() => joinPortPairs(three, [[0, 0]])).toThrow(DomainError);
  });
  it('two ideal opens joined (lossless, undefined) give SingularMatrixError with the frequency index', () => {
    // refl: ports 0, 1 ideal opens at 1 GHz (S = I), |S| = 0.5 at 2 GHz; thru: ideal line; open1: ideal open.
    const open1 = createMultiport('scattering', [1e9, 2e9], [fromRows([[1]]), fromRows([[1]])]);
    const thru = createMultiport('scattering', [1e9, 2e9], [fromRows([[0, 1], [1, 0]]), fromRows([[0, 1], [1, 0]])]);
    const refl = createMultiport('scattering', [1e9, 2e9], [fromRows([[1, 0], [0, 1]]), fromRows([[0.5, 0], [0, 0.5]])]);
    let err: unknown;
    // joining every port is a DimensionError
    try { joinPortPairs(combineMultiports([refl, thru]), [[1, 2], [3, 0]]); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(DimensionError);
    // open — line — open is an undamped loop at 1 GHz
    const three = combineMultiports([refl, thru, open1]);
    err = undefined;
    try { joinPortPairs(three, [[1, 2], [3, 4]]); } catch (e) { err = e; }
    expect(err).toBeInstanceOf(SingularMatrixError);
    expect((err as SingularMatrixError).index).toBe(0);
  });
});

describe('port operations', () => {
  it('keepPorts: open → block of Z, short → block of Y, matched → block of S', () => {
    const z = randomPassiveImpedance(4, 21);
    const net = createMultiport('impedance', [1e9], [z], { referenceOhm: [50, { re: 30, im: 20 }, 75, 50] });
    const keep = [3, 1];
    expectCMatrixClose(zOf(keepPorts(net, keep, 'open')), pick(z, keep, keep), { rtol: 1e-12 });
    const y = inverse(z);
    expectCMatrixClose(multiportMatrix(convertMultiport(keepPorts(net, keep, 'short'), 'admittance'), 0), pick(y, keep, keep), { rtol: 1e-12 });
    const s = multiportMatrix(convertMultiport(net, 'scattering'), 0);
    expectCMatrixClose(multiportMatrix(keepPorts(net, keep, 'matched'), 0), pick(s, keep, keep), { rtol: 1e-12 });
    expect(keepPorts(net, keep, 'matched').portNames).toEqual(['4', '2']);
  });
  it('reorderPorts permutes Z and S consistently; renamePorts', () => {
    const z = randomPassiveImpedance(3, 22);
    const net = createMultiport('impedance', [1e9], [z], { referenceOhm: [50, 60, 70] });
    const r = reorderPorts(net, [2, 0, 1]);
    expectCMatrixClose(multiportMatrix(r, 0), pick(z, [2, 0, 1], [2, 0, 1]), { rtol: 0 });
    expect(Array.from(r.referenceOhm)).toEqual([70, 0, 50, 0, 60, 0]);
    expect(() => reorderPorts(net, [0, 1])).toThrow(DimensionError);
    expect(renamePorts(net, ['a', 'b', 'c']).portNames).toEqual(['a', 'b', 'c']);
    expect(() => renamePorts(net, ['a'])).toThrow(DimensionError);
  });
});
