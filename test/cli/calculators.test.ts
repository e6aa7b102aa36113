import { describe, it, expect } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { dolphChebyshevTaper, taperEfficiency } from '../../src/taper/index.js';
import { spacingForScanCone } from '../../src/floquet/gratingLobes.js';

async function run(args: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '', err = '';
  const code = await runCli(args, { out: (s) => { out += s; }, err: (s) => { err += s; } });
  return { code, out, err };
}

describe('phasewise taper', () => {
  it('JSON output equals the library result', async () => {
    const r = await run(['taper', '--kind', 'dolph-chebyshev', '--elements', '16', '--sidelobe-db', '30', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.weights).toEqual(Array.from(dolphChebyshevTaper(16, 30)));
    expect(j.taperEfficiency).toBe(taperEfficiency(dolphChebyshevTaper(16, 30)));
    // Dolph–Chebyshev is equiripple at the design level (Dolph 1946): achieved −30 dB.
    expect(j.achievedPeakSidelobeDb).toBeCloseTo(-30, 2);
  });
  it('tables for people, help with an example', async () => {
    const r = await run(['taper', '--kind', 'taylor', '--elements', '24', '--sidelobe-db', '35']);
    expect(r.code).toBe(0);
    expect(r.out).toContain('taper efficiency');
    const h = await run(['taper', '--help']);
    expect(h.code).toBe(0);
    expect(h.out).toContain('Example:');
  });
  it('bad input exits with 2 and names the option', async () => {
    for (const args of [
      ['taper', '--kind', 'hamming', '--elements', '8'],
      ['taper', '--kind', 'uniform', '--elements', '0'],
      ['taper', '--kind', 'uniform', '--elements', 'many'],
      ['taper', '--kind', 'dolph-chebyshev', '--elements', '8'],
      ['taper', '--elements', '8'],
      ['no-such-command'],
    ]) {
      const r = await run(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.err.length, args.join(' ')).toBeGreaterThan(0);
    }
    expect((await run(['taper', '--kind', 'dolph-chebyshev', '--elements', '8'])).err).toContain('--sidelobe-db');
  });
});

describe('phasewise spacing', () => {
  it('matches the grating-lobe condition d/λ = 1/(1 + sin θ) (Hansen, from memory)', async () => {
    const r = await run(['spacing', '--scan-deg', '40', '--frequency-hz', '2.25e9', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.squareSpacingWavelengths).toBeCloseTo(1 / (1 + Math.sin((40 * Math.PI) / 180)), 12);
    expect(j.triangularSideM).toBe(spacingForScanCone((40 * Math.PI) / 180, 2.25e9).triangularSideM);
    expect((await run(['spacing', '--scan-deg', '95', '--frequency-hz', '1e9'])).code).toBe(2);
  });
});

describe('phasewise yfactor', () => {
  it('reduces a CSV table; bad tables exit with 2 and a line number', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-cli-'));
    writeFileSync(join(dir, 'ok.csv'), 'channel,hot,cold\nA,2,1\n');
    const r = await run(['yfactor', join(dir, 'ok.csv'), '--hot-k', '290', '--cold-k', '77', '--json']);
    expect(r.code).toBe(0);
    expect(JSON.parse(r.out)[0].receiverTemperatureK).toBeCloseTo(136, 10); // (290 − 2·77)/(2 − 1)
    writeFileSync(join(dir, 'bad.csv'), 'channel,hot,cold\nA,2,1\nB,abc,1\n');
    const b = await run(['yfactor', join(dir, 'bad.csv'), '--hot-k', '290', '--cold-k', '77']);
    expect(b.code).toBe(2);
    expect(b.err).toContain('line 3');
    const y = await run(['yfactor', join(dir, 'ok.csv'), '--hot-k', '77', '--cold-k', '290']);
    expect(y.code).toBe(2);
    // An empty file: a plain message on line 1, not the CSV parser's delimiter guess (issue 21).
    writeFileSync(join(dir, 'empty.csv'), '');
    const e = await run(['yfactor', join(dir, 'empty.csv'), '--hot-k', '290', '--cold-k', '77']);
    expect(e.code).toBe(2);
    expect(e.err).toMatch(/^phasewise: error: line 1: the CSV is empty/);
    expect(e.err).not.toMatch(/delimit/i);
    // Non-positive linear powers point a CLI user to --db, not to the library option.
    writeFileSync(join(dir, 'neg.csv'), 'channel,hot,cold\nA,-2,-5\n');
    const n = await run(['yfactor', join(dir, 'neg.csv'), '--hot-k', '290', '--cold-k', '77']);
    expect(n.code).toBe(2);
    expect(n.err).toContain('pass --db for decibel readings');
    expect(n.err).not.toContain('powerScale');
  });
  it('noise-source form prints the on temperature T0(1 + ENR) it used', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-cli-'));
    writeFileSync(join(dir, 'diode.csv'), 'channel,hot,cold\nA,10,1\n');
    const r = await run(['yfactor', join(dir, 'diode.csv'), '--enr-db', '15', '--cold-k', '290']);
    expect(r.code).toBe(0);
    // T_on = 290·(1 + 10^1.5) = 9460.6 K; F = ENR/(Y − 1) (Keysight AN 57-1, from memory) → NF = 10 log10(31.62/9) = 5.4576 dB.
    expect(r.out).toContain('T_on = T0·(1 + ENR) = 9460.61 K (T0 = 290 K)');
    const j = await run(['yfactor', join(dir, 'diode.csv'), '--enr-db', '15', '--t0-k', '296', '--cold-k', '296', '--json']);
    const row = JSON.parse(j.out)[0];
    expect(row.onTemperatureK).toBeCloseTo(296 * (1 + 10 ** 1.5), 9);
    expect(row.noiseFigureDb).toBeCloseTo(10 * Math.log10(1 + ((296 * 10 ** 1.5) / 9 - 296) / 290), 9);
    const both = await run(['yfactor', join(dir, 'diode.csv'), '--enr-db', '15', '--hot-k', '300', '--cold-k', '290']);
    expect(both.code).toBe(2);
    const none = await run(['yfactor', join(dir, 'diode.csv'), '--cold-k', '290']);
    expect(none.code).toBe(2);
  });
});
