import { describe, it, expect } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import {
  dipoleEmbeddedPatterns, parsePatternJson, formatPatternJson, parsePatternCsv, formatPatternCsv,
} from '../../src/element/index.js';
import { readPatternFile, writePatternFile } from '../../src/element/node.js';
import { ParseError } from '../../src/errors.js';
import { fromRows } from '../../src/linalg/cmatrix.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const F = 1.4e9;
const lam = 299792458 / F;
const th = Float64Array.from({ length: 7 }, (_, i) => (i * Math.PI) / 6);
const ph = Float64Array.from({ length: 8 }, (_, i) => (i * Math.PI) / 4);
const set = dipoleEmbeddedPatterns(
  [{ centerM: [0, 0, 0], axis: [1, 0, 0], lengthM: lam / 2, radiusM: 1e-4 }, { centerM: [0, lam / 2, 0], axis: [0, 1, 0], lengthM: lam / 2, radiusM: 1e-4 }],
  F, th, ph,
);
const labelled = { ...set, portLabels: ['x-pol', 'y-pol'] };
const loaded = { ...set, excitation: { kind: 'loaded-voltage' as const, driveVoltageV: 2, loadOhm: fromRows([[50], [{ re: 73.1, im: -42.5 }]]) } };

function parseErr(fn: () => unknown): ParseError {
  try { fn(); } catch (e) { if (e instanceof ParseError) return e; throw e; }
  throw new Error('expected a ParseError');
}

describe('JSON layout', () => {
  it('round trip is exact (labels, phase centres, loads)', () => {
    for (const s of [set, labelled, loaded]) {
      const back = parsePatternJson(formatPatternJson(s));
      expectCMatrixClose(back.thetaComponentV, s.thetaComponentV, { rtol: 0 });
      expectCMatrixClose(back.phiComponentV, s.phiComponentV, { rtol: 0 });
      back.thetaRad.forEach((v, i) => expect(Math.abs(v - s.thetaRad[i])).toBeLessThan(1e-15)); // degrees in the file
      expect(back.excitation.kind).toBe(s.excitation.kind);
      expect(Array.from(back.phaseCentersM ?? [])).toEqual(Array.from(s.phaseCentersM ?? []));
    }
    expect(parsePatternJson(formatPatternJson(labelled)).portLabels).toEqual(['x-pol', 'y-pol']);
  });
  it('syntax error: line number', () => {
    const text = formatPatternJson(set).replace('"version": 1', '"version": 1,,');
    const e = parseErr(() => parsePatternJson(text));
    expect(e.line).toBe(3);
    // The second comma: column 15 of ' "version": 1,,' (one-space indent; counted by hand).
    expect(e.message).toMatch(/^line 3, column 15: the pattern file is not valid JSON: expected a property name in double quotes/);
  });
  it('schema errors name the field path and its line', () => {
    const obj = JSON.parse(formatPatternJson(set));
    obj.ports[1].thetaRe[5] = 'oops';
    const text = JSON.stringify(obj, null, 1);
    const e = parseErr(() => parsePatternJson(text));
    expect(e.message).toMatch(/ports\[1\]\.thetaRe\[5\]/);
    expect(text.split('\n')[e.line - 1]).toMatch(/"oops"/);
    const obj2 = JSON.parse(formatPatternJson(set));
    obj2.ports[0].phiIm.pop();
    const e2 = parseErr(() => parsePatternJson(JSON.stringify(obj2, null, 1)));
    expect(e2.message).toMatch(/ports\[0\]\.phiIm.*expected 56 values/);
    expect(e2.line).toBeGreaterThan(1);
    const obj3 = JSON.parse(formatPatternJson(set));
    obj3.excitation = { kind: 'open-circuit-current', driveCurrent: 1 };
    expect(parseErr(() => parsePatternJson(JSON.stringify(obj3))).message).toMatch(/excitation/);
    const obj4 = JSON.parse(formatPatternJson(set));
    obj4.phiDeg[3] += 1;
    expect(parseErr(() => parsePatternJson(JSON.stringify(obj4))).message).toMatch(/uniform/);
  });
});

describe('CSV layout', () => {
  it('round trip is exact and row order does not matter', () => {
    for (const s of [set, labelled, loaded]) {
      const back = parsePatternCsv(formatPatternCsv(s));
      expectCMatrixClose(back.thetaComponentV, s.thetaComponentV, { rtol: 0 });
      expectCMatrixClose(back.phiComponentV, s.phiComponentV, { rtol: 0 });
    }
    const lines = formatPatternCsv(set).trimEnd().split('\n');
    const head = lines.filter((l) => l.startsWith('#') || l.startsWith('port'));
    const data = lines.filter((l) => !l.startsWith('#') && !l.startsWith('port')).reverse();
    const back = parsePatternCsv([...head, ...data].join('\n'));
    expectCMatrixClose(back.thetaComponentV, set.thetaComponentV, { rtol: 0 });
  });
  it('malformed files: line and column named', () => {
    const lines = formatPatternCsv(set).split('\n');
    const hdr = lines.findIndex((l) => l.startsWith('port,'));
    const bad = [...lines];
    bad[hdr + 3] = bad[hdr + 3].replace(/,([^,]*)$/, ',abc');
    let e = parseErr(() => parsePatternCsv(bad.join('\n')));
    expect(e.line).toBe(hdr + 4);
    expect(e.message).toMatch(/field 7 \("phiImV"\)/);
    const short = [...lines];
    short[hdr + 2] = '0,30,0,1,2';
    e = parseErr(() => parsePatternCsv(short.join('\n')));
    expect(e.line).toBe(hdr + 3);
    expect(e.message).toMatch(/expected 7 comma-separated fields/);
    const dup = [...lines];
    dup[hdr + 2] = dup[hdr + 1];
    e = parseErr(() => parsePatternCsv(dup.join('\n')));
    expect(e.message).toMatch(/duplicate row.*first given on line/);
    expect(e.line).toBe(hdr + 3);
    const noMeta = lines.filter((l) => !l.startsWith('# frequencyHz'));
    expect(parseErr(() => parsePatternCsv(noMeta.join('\n'))).message).toMatch(/frequencyHz/);
    const badHeader = [...lines];
    badHeader[hdr] = 'port,theta,phi,a,b,c,d';
    expect(parseErr(() => parsePatternCsv(badHeader.join('\n'))).line).toBe(hdr + 1);
    const missing = lines.filter((_, i) => i !== hdr + 5);
    expect(parseErr(() => parsePatternCsv(missing.join('\n'))).message).toMatch(/missing row for port 0/);
  });
});

describe('Node file reading', () => {
  it('writes and reads both layouts by extension; rejects unknown extensions', () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-el-'));
    for (const ext of ['json', 'csv']) {
      const p = join(dir, `set.${ext}`);
      writePatternFile(p, labelled);
      const back = readPatternFile(p);
      expectCMatrixClose(back.thetaComponentV, set.thetaComponentV, { rtol: 0 });
    }
    writeFileSync(join(dir, 'x.txt'), 'x');
    expect(() => readPatternFile(join(dir, 'x.txt'))).toThrow(ParseError);
    expect(() => readPatternFile(join(dir, 'nope.json'))).toThrow(/cannot read/);
  });
});
