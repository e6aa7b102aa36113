import { describe, it } from 'vitest';
import fixture from './fixtures/network.json';
import { createMultiport, multiportMatrix } from '../../src/network/multiport.js';
import { convertMultiport, renormalizeMultiport } from '../../src/network/convert.js';
import { terminatePorts } from '../../src/network/connect.js';
import { fromParts } from '../../src/linalg/index.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

type Enc = { re: number[]; im: number[] };
const mat = (e: Enc, n: number) => fromParts(e.re, e.im, n, n);
const refs = (e: Enc) => e.re.map((re, i) => ({ re, im: e.im[i] }));

describe(`N-port conversions vs. independent numpy ${fixture.numpy} code (fixtures/generate_network.py)`, () => {
  for (const c of fixture.cases) {
    const n = c.ports;
    const z = mat(c.z, n);
    // conditioning of (Z + G) is modest; 1e-12 relative allows a few hundred ulps of LU error
    it(`${n}-port: Z → S (power and pseudo waves), Z → Y, S → Z`, () => {
      const net = createMultiport('impedance', [1e9], [z], { referenceOhm: refs(c.referenceOhm) });
      expectCMatrixClose(multiportMatrix(convertMultiport(net, 'scattering'), 0), mat(c.sPower, n), { rtol: 1e-12 });
      expectCMatrixClose(multiportMatrix(convertMultiport(net, 'admittance'), 0), mat(c.y, n), { rtol: 1e-12 });
      const pseudo = createMultiport('impedance', [1e9], [z], { referenceOhm: refs(c.referenceOhm), waves: 'pseudo' });
      expectCMatrixClose(multiportMatrix(convertMultiport(pseudo, 'scattering'), 0), mat(c.sPseudo, n), { rtol: 1e-12 });
      const sNet = createMultiport('scattering', [1e9], [mat(c.sPower, n)], { referenceOhm: refs(c.referenceOhm) });
      expectCMatrixClose(multiportMatrix(convertMultiport(sNet, 'impedance'), 0), z, { rtol: 1e-12 });
      // from 50 Ω S, renormalised to the fixture's references
      const s50 = convertMultiport(createMultiport('impedance', [1e9], [z]), 'scattering');
      expectCMatrixClose(multiportMatrix(renormalizeMultiport(s50, refs(c.referenceOhm)), 0), mat(c.sPower, n), { rtol: 1e-12 });
    });
    it(`${n}-port: termination of two ports in loads`, () => {
      const net = createMultiport('impedance', [1e9], [z], { referenceOhm: refs(c.referenceOhm) });
      const t = terminatePorts(net, c.terminated.ports, refs(c.terminated.loadOhm));
      expectCMatrixClose(multiportMatrix(convertMultiport(t, 'impedance'), 0), mat(c.terminated.z, n - 2), { rtol: 1e-12 });
    });
  }
});
