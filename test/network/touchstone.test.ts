import { describe, it, expect } from 'vitest';
import { parseTouchstone, formatTouchstone } from '../../src/network/touchstone.js';
import { createMultiport, multiportMatrix } from '../../src/network/multiport.js';
import { convertMultiport } from '../../src/network/convert.js';
import { fromRows, transpose, add, scale } from '../../src/linalg/index.js';
import { ParseError, DomainError } from '../../src/errors.js';
import { expectCMatrixClose, randomMatrix, seededRandom } from '../helpers/matchers.js';
import { randomPassiveImpedance } from './helpers.js';
import type { Multiport } from '../../src/network/multiport.js';

function expectNetClose(a: Multiport, b: Multiport, rtol: number): void {
  expect(a.ports).toBe(b.ports);
  expect(a.frequencyHz.length).toBe(b.frequencyHz.length);
  for (let k = 0; k < a.frequencyHz.length; k++) {
    expect(Math.abs(a.frequencyHz[k] - b.frequencyHz[k])).toBeLessThanOrEqual(1e-15 * b.frequencyHz[k]);
    expectCMatrixClose(multiportMatrix(convertMultiport(a, 'scattering'), k), multiportMatrix(convertMultiport(b, 'scattering'), k), { rtol });
  }
}

function sampleNet(n: number, nf: number, seed: number, refs?: number[]): Multiport {
  const f = Array.from({ length: nf }, (_, k) => 1e9 + 2.5e7 * k);
  const mats = f.map((_, k) => scale(randomMatrix(n, n, seed + k), 0.4));
  return createMultiport('scattering', f, mats, refs ? { referenceOhm: refs } : {});
}

describe('hand-written files (layout from the Touchstone 2.0 specification, from memory)', () => {
  it('version 1 two-port with comments, MA, 11 21 12 22 order and a noise block', () => {
    const text = [
      '! a small amplifier of our own',
      '# GHz S MA R 50',
      '1.0 0.5 -30 4.0 120 0.05 60 0.4 -20 ! end-of-line comment',
      '2.0 0.45 -50 3.5 100 0.06 50 0.38 -35',
      '! noise parameters',
      '1.0 0.6 0.3 40 0.2',
      '2.0 0.8 0.25 70 0.18',
    ].join('\n');
    const d = parseTouchstone(text);
    expect(d.version).toBe(1);
    expect(d.comments).toEqual([' a small amplifier of our own', ' end-of-line comment', ' noise parameters']);
    const s = multiportMatrix(d.network, 0);
    const pol = (m: number, deg: number) => ({ re: m * Math.cos((deg * Math.PI) / 180), im: m * Math.sin((deg * Math.PI) / 180) });
    expectCMatrixClose(s, fromRows([[pol(0.5, -30), pol(0.05, 60)], [pol(4, 120), pol(0.4, -20)]]), { rtol: 1e-15 });
    expect(d.noise!.frequencyHz[1]).toBe(2e9);
    expect(d.noise!.noiseResistanceOhm[0]).toBeCloseTo(10, 12);
    expect(d.noise!.minimumNoiseFigureDb[1]).toBe(0.8);
  });
  it('version 1 Z data are normalised to R; three-port rows wrap', () => {
    const text = '# MHz Z RI R 25\n100 1 0 0.5 0.1 0 0\n 0.5 0.1 2 -1 0 0\n 0 0 0 0 4 0\n';
    const d = parseTouchstone(text, { ports: 3 });
    expect(d.network.form).toBe('impedance');
    expectCMatrixClose(multiportMatrix(d.network, 0), fromRows([[25, { re: 12.5, im: 2.5 }, 0], [{ re: 12.5, im: 2.5 }, { re: 50, im: -25 }, 0], [0, 0, 100]]), { rtol: 1e-15 });
    expect(d.network.frequencyHz[0]).toBe(1e8);
  });
  it('version 2 with [Reference] over two lines, Lower matrix, information block, noise', () => {
    const text = [
      '[Version] 2.0',
      '# Hz Y RI R 50',
      '[Number of Ports] 3',
      '[Number of Frequencies] 1',
      '[Reference] 50 75',
      '100',
      '[Matrix Format] Lower',
      '[Begin Information]',
      'anything goes here',
      '[End Information]',
      '[Network Data]',
      '5e8 0.02 0.001',
      ' -0.01 0 0.03 0',
      ' 0 0 0.001 0.002 0.04 -0.01',
      '[End]',
    ].join('\n');
    const d = parseTouchstone(text);
    expect(Array.from(d.network.referenceOhm)).toEqual([50, 0, 75, 0, 100, 0]);
    const y = multiportMatrix(d.network, 0);
    expectCMatrixClose(y, transpose(y), { rtol: 0 });
    expect(y.data[2 * 7]).toBeCloseTo(0.001, 15); // entry (2, 1), not normalised in version 2
  });
  it('H-parameters of a two-port become Z (H11 = ΔZ/Z22, … ; Pozar 2012 Table 4.2 analogue, from memory)', () => {
    const z = fromRows([[{ re: 40, im: 3 }, { re: 10, im: -2 }], [{ re: 15, im: 1 }, { re: 60, im: 5 }]]);
    const zr = (i: number, j: number) => ({ re: z.data[2 * (i * 2 + j)], im: z.data[2 * (i * 2 + j) + 1] });
    // H from Z: H11 = det Z / Z22, H12 = Z12/Z22, H21 = −Z21/Z22, H22 = 1/Z22 (Pozar 2012, Table 4.2 style, from memory)
    const C = (x: { re: number; im: number }) => x;
    const mul = (a: { re: number; im: number }, b: { re: number; im: number }) => ({ re: a.re * b.re - a.im * b.im, im: a.re * b.im + a.im * b.re });
    const div = (a: { re: number; im: number }, b: { re: number; im: number }) => { const m = b.re ** 2 + b.im ** 2; return { re: (a.re * b.re + a.im * b.im) / m, im: (a.im * b.re - a.re * b.im) / m }; };
    const det = { re: mul(zr(0, 0), zr(1, 1)).re - mul(zr(0, 1), zr(1, 0)).re, im: mul(zr(0, 0), zr(1, 1)).im - mul(zr(0, 1), zr(1, 0)).im };
    const h11 = div(det, zr(1, 1)), h12 = div(zr(0, 1), zr(1, 1)), h21 = div({ re: -zr(1, 0).re, im: -zr(1, 0).im }, zr(1, 1)), h22 = div({ re: 1, im: 0 }, zr(1, 1));
    const r = 50;
    const line = [1, h11.re / r, h11.im / r, C(h21).re, h21.im, h12.re, h12.im, h22.re * r, h22.im * r].join(' ');
    const d = parseTouchstone(`# GHz H RI R 50\n${line}\n`);
    expectCMatrixClose(multiportMatrix(d.network, 0), z, { rtol: 1e-14 });
  });
});

describe('round trips', () => {
  for (const version of [1, 2] as const) {
    for (const n of [1, 2, 3, 5]) {
      for (const format of ['RI', 'MA', 'DB'] as const) {
        it(`version ${version}, ${n} ports, ${format}`, () => {
          const refs = version === 2 ? Array.from({ length: n }, (_, i) => 50 + 10 * i) : undefined;
          const net = sampleNet(n, 4, 10 * n, refs);
          const text = formatTouchstone(net, { version, format, frequencyUnit: 'MHz', comments: ['round trip'] });
          const back = parseTouchstone(text, { ports: n });
          expect(back.version).toBe(version);
          expectNetClose(back.network, net, format === 'RI' ? 0 : 1e-14);
          if (version === 1 && n >= 3) {
            // at most four pairs per line, each row starts a new line
            const lines = text.split('\n').filter((l) => l && !l.startsWith('!') && !l.startsWith('#'));
            expect(lines.every((l) => l.trim().split(/\s+/).length <= 9)).toBe(true);
            expect(lines.length).toBe(4 * n * Math.ceil(n / 4));
          }
        });
      }
    }
  }
  it('Z and Y data, Upper format, noise blocks in both versions', () => {
    const z = randomPassiveImpedance(2, 77);
    const net = createMultiport('impedance', [1e9, 2e9], [z, add(z, fromRows([[1, 0], [0, 1]]))]);
    const noise = {
      frequencyHz: Float64Array.of(1e9, 1.5e9), minimumNoiseFigureDb: Float64Array.of(0.5, 0.7),
      optimumReflection: Float64Array.of(0.3, 0.1, 0.25, 0.12), noiseResistanceOhm: Float64Array.of(9, 11), referenceOhm: 50,
    };
    for (const version of [1, 2] as const) {
      for (const parameter of ['Z', 'Y'] as const) {
        const text = formatTouchstone(net, { version, parameter, noise, matrixFormat: version === 2 ? 'upper' : 'full' });
        const d = parseTouchstone(text);
        expectNetClose(d.network, net, 1e-13);
        expect(Array.from(d.noise!.noiseResistanceOhm)).toEqual([9, 11]);
        expect(d.noise!.optimumReflection[3]).toBeCloseTo(0.12, 15);
      }
    }
  });
  it('writer refusals are DomainErrors', () => {
    const c = createMultiport('scattering', [1e9], [fromRows([[0.1]])], { referenceOhm: { re: 50, im: 5 } });
    expect(() => formatTouchstone(c)).toThrow(DomainError);
    const u = sampleNet(2, 1, 3, [50, 75]);
    expect(() => formatTouchstone(u, { version: 1 })).toThrow(DomainError);
    expect(() => formatTouchstone(sampleNet(3, 1, 4), { matrixFormat: 'lower' })).toThrow(DomainError);
  });
});

describe('malformed input gives ParseError with the line number', () => {
  const cases: Array<[string, string, number, object?]> = [
    ['bad option', '# GHz S XX R 50\n1 0 0\n', 1],
    ['missing R value', '# GHz S MA R\n1 0 0\n', 1],
    ['text in data', '# GHz S RI\n1 0 0\n2 0 abc\n', 3],
    ['decreasing frequency (one-port)', '# GHz S RI\n1 0 0\n0.5 0 0\n', 3],
    ['truncated block', '# GHz S RI\n1 0 0 0 0 0 0 0 0\n2 0 0 0\n', 3],
    ['unknown port count', '# GHz S RI\n1 0 0 0 0\n', 2],
    ['v2 missing [End]', '[Version] 2.0\n# GHz S RI\n[Number of Ports] 1\n[Number of Frequencies] 1\n[Network Data]\n1 0 0\n', 6],
    ['v2 count mismatch', '[Version] 2.0\n# GHz S RI\n[Number of Ports] 1\n[Number of Frequencies] 2\n[Network Data]\n1 0 0\n[End]\n', 7],
    ['v2 two-port without data order', '[Version] 2.0\n# GHz S RI\n[Number of Ports] 2\n[Number of Frequencies] 1\n[Network Data]\n1 0 0 0 0 0 0 0 0\n[End]\n', 5],
    ['v2 mixed mode', '[Version] 2.0\n# GHz S RI\n[Number of Ports] 4\n[Mixed-Mode Order] D2,3 D1,4\n', 4],
    ['v2 bad reference', '[Version] 2.0\n# GHz S RI\n[Number of Ports] 2\n[Reference] 50 -3\n', 4],
    ['infinite number', '# GHz S RI\n1 1e999 0\n', 2],
  ];
  for (const [name, text, line] of cases) {
    it(name, () => {
      let err: unknown;
      try { parseTouchstone(text); } catch (e) { err = e; }
      expect(err).toBeInstanceOf(ParseError);
      expect((err as ParseError).line).toBe(line);
    });
  }
});

describe('fuzz: seeded mutations of valid files', () => {
  it('every failure is a ParseError (5000 mutations)', () => {
    const seeds = [
      formatTouchstone(sampleNet(2, 3, 1), { version: 1, format: 'MA' }) + '1000 0.5 0.3 40 0.2\n1500 0.6 0.3 41 0.2\n',
      formatTouchstone(sampleNet(3, 2, 2), { version: 1, format: 'DB' }),
      formatTouchstone(sampleNet(2, 2, 3, [50, 60]), { version: 2, noise: { frequencyHz: Float64Array.of(1e9), minimumNoiseFigureDb: Float64Array.of(1), optimumReflection: Float64Array.of(0.1, 0.2), noiseResistanceOhm: Float64Array.of(5), referenceOhm: 50 } }),
      formatTouchstone(sampleNet(4, 2, 4), { version: 2, format: 'RI' }),
    ];
    const rnd = seededRandom(20261201);
    const alphabet = '0123456789.-+eE !#[]\n\tRIMADBSZYGHz_abc';
    const pickInt = (n: number) => Math.floor(rnd() * n);
    let parsed = 0, failed = 0;
    for (let t = 0; t < 5000; t++) {
      let s = seeds[t % seeds.length];
      const edits = 1 + pickInt(3);
      for (let e = 0; e < edits; e++) {
        const op = pickInt(6);
        const p = pickInt(s.length + 1);
        if (op === 0) s = s.slice(0, p) + alphabet[pickInt(alphabet.length)] + s.slice(p);
        else if (op === 1) s = s.slice(0, p) + s.slice(p + 1);
        else if (op === 2) s = s.slice(0, p) + alphabet[pickInt(alphabet.length)] + s.slice(p + 1);
        else if (op === 3) s = s.slice(0, p);
        else if (op === 4) { const lines = s.split('\n'); const i = pickInt(lines.length); lines.splice(i, 1); s = lines.join('\n'); }
        else { const lines = s.split('\n'); const i = pickInt(lines.length); lines.splice(i, 0, lines[pickInt(lines.length)]); s = lines.join('\n'); }
      }
      try {
        const d = parseTouchstone(s, t % 3 === 0 ? {} : { ports: [2, 3, 2, 4][t % 4] });
        expect(d.network.data.every(Number.isFinite)).toBe(true);
        parsed++;
      } catch (e) {
        if (!(e instanceof ParseError)) throw new Error(`mutation ${t} threw ${(e as Error).name}: ${(e as Error).message}\n---\n${s}`);
        failed++;
      }
    }
    expect(parsed).toBeGreaterThan(100);
    expect(failed).toBeGreaterThan(100);
  });
});

describe('Touchstone port-count hint', () => {
  it('2-port data in a file read as 4-port names the likely cause', () => {
    const text = '# GHz S RI R 50\n1.0 0.1 0 0.2 0 0.2 0 0.1 0\n1.1 0.1 0 0.2 0 0.2 0 0.1 0\n1.2 0.1 0 0.2 0 0.2 0 0.1 0\n';
    expect(() => parseTouchstone(text, { ports: 4 })).toThrow('every data line holds 8 numbers after its frequency, as 2-port data does, but the file is read as 4-port');
    // A genuine 4-port file (8 numbers per line, continuation lines without a frequency) parses.
    const row = '0.1 0 0.2 0 0.2 0 0.1 0';
    const four = `# GHz S RI R 50\n1.0 ${row}\n${row}\n${row}\n${row}\n`;
    expect(parseTouchstone(four, { ports: 4 }).network.ports).toBe(4);
  });
});
