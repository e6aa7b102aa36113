import { describe, it, expect } from 'vitest';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCli } from '../../src/cli/main.js';
import { dolphChebyshevTaper, taperEfficiency } from '../../src/taper/index.js';
import { spacingForScanCone } from '../../src/geometry/gratingLobes.js';

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
    expect(b.err).toContain(`${join(dir, 'bad.csv')}:3: channel "B": column "hot": expected a finite number, found "abc"`);
    expect(b.out).toMatch(/^A\s+2\s+136\s/m); // the good channel still reduced and printed
    const y = await run(['yfactor', join(dir, 'ok.csv'), '--hot-k', '77', '--cold-k', '290']);
    expect(y.code).toBe(2);
    // An empty file: a plain message on line 1, not the CSV parser's delimiter guess (issue 21).
    writeFileSync(join(dir, 'empty.csv'), '');
    const e = await run(['yfactor', join(dir, 'empty.csv'), '--hot-k', '290', '--cold-k', '77']);
    expect(e.code).toBe(2);
    expect(e.err).toMatch(/^phasewise: error: .*empty\.csv:1: the CSV is empty/);
    expect(e.err).not.toMatch(/delimit/i);
    // Non-positive linear powers point a CLI user to --db, not to the library option.
    writeFileSync(join(dir, 'neg.csv'), 'channel,hot,cold\nA,-2,-5\n');
    const n = await run(['yfactor', join(dir, 'neg.csv'), '--hot-k', '290', '--cold-k', '77']);
    expect(n.code).toBe(2);
    expect(n.err).toContain('pass --db for decibel readings');
    expect(n.err).not.toContain('powerScale');
  });
  it('per-channel errors let the good channels through and exit 2 naming every bad row', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-cli-'));
    const f = join(dir, 'mixed.csv');
    writeFileSync(f, '# bench, 2026-11-30\nchannel,hot,cold\nX1,2,1\nX2,1,2\n\nX3,3,1\nX4,,1\n');
    const r = await run(['yfactor', f, '--hot-k', '290', '--cold-k', '77', '--json']);
    expect(r.code).toBe(2);
    const rows = JSON.parse(r.out);
    expect(rows.map((x: { channel: string }) => x.channel)).toEqual(['X1', 'X3']);
    expect(rows[1].receiverTemperatureK).toBeCloseTo((290 - 3 * 77) / 2, 10);
    expect(r.err).toContain('2 of 4 channels could not be reduced (the others are printed above)');
    expect(r.err).toContain(`${f}:4: channel "X2": invalid measurement: Y = P_hot/P_cold = 0.500000 ≤ 1`);
    expect(r.err).toContain(`${f}:7: channel "X4": column "hot": expected a finite number, found ""`);
    expect(r.err).not.toMatch(/row 0|internal error/);
  });
  it('uncertainties in: σ of T_rec per channel from the power, load and ENR uncertainties', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-cli-'));
    writeFileSync(join(dir, 'ok.csv'), 'channel,hot,cold\nA,2.5,1\n');
    const r = await run(['yfactor', join(dir, 'ok.csv'), '--hot-k', '295', '--cold-k', '77', '--power-sigma', '0.01', '--hot-sigma-k', '0.5', '--cold-sigma-k', '1', '--json']);
    expect(r.code, r.err).toBe(0);
    // GUM first order (JCGM 100:2008 eq. 10), written out here: ∂T/∂T_hot = 1/(Y−1), ∂T/∂T_cold = −Y/(Y−1), ∂T/∂Y·Y·σ_rel per power.
    const y = 2.5, dY = (77 - 295) / (y - 1) ** 2;
    const sigma = Math.sqrt(2 * (dY * y * 0.01) ** 2 + (0.5 / (y - 1)) ** 2 + ((y * 1) / (y - 1)) ** 2);
    expect(JSON.parse(r.out)[0].receiverTemperatureSigmaK).toBeCloseTo(sigma, 10);
    const t = await run(['yfactor', join(dir, 'ok.csv'), '--hot-k', '295', '--cold-k', '77', '--power-sigma', '0.01']);
    expect(t.out).toMatch(/T_rec \[K\] \(± 1σ\)/);
    expect(t.out).toMatch(/A\s+2\.5\s+\d+(\.\d+)? ± \d/);
    // ENR form: σ(T_on) = T0·ENR·ln10/10·σ_ENR.
    const e = await run(['yfactor', join(dir, 'ok.csv'), '--enr-db', '15', '--enr-sigma-db', '0.1', '--cold-k', '290', '--json']);
    const row = JSON.parse(e.out)[0];
    expect(row.onTemperatureSigmaK).toBeCloseTo(290 * 10 ** 1.5 * (Math.LN10 / 10) * 0.1, 9);
    expect(row.varianceBudgetK2.hotTemperature).toBeCloseTo((row.onTemperatureSigmaK / (2.5 - 1)) ** 2, 9);
    expect((await run(['yfactor', join(dir, 'ok.csv'), '--hot-k', '295', '--enr-sigma-db', '0.1', '--cold-k', '77'])).code).toBe(2);
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

describe('phasewise onoff and receiver-noise', () => {
  it('onoff: A_e/T_sys and SEFD per beam with corrections and uncertainties; a bad beam exits 2, the others print', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-cli-'));
    // Known beam: A_e = 40 m², T_sys = 60 K, 1500 Jy calibrator: T_A = A_e S/(2 k_B) (conventions, sensitivity row).
    const ae = 40, tsys = 60, s = 1500e-26, ta = (ae * s) / (2 * 1.380649e-23);
    writeFileSync(join(dir, 'oo.csv'), `beam,on,off\nnorth,${(tsys + ta) * 3e-7},${tsys * 3e-7}\nsouth,0.9,1\n`);
    const r = await run(['onoff', join(dir, 'oo.csv'), '--flux-jy', '1500', '--power-sigma', '0.002', '--flux-sigma', '0.05', '--json']);
    expect(r.code).toBe(2);
    const [north] = JSON.parse(r.out);
    expect(north.aeOverTsysM2PerK / (ae / tsys)).toBeCloseTo(1, 10);
    expect(north.sefdJy / ((2 * 1.380649e-23 * tsys) / ae / 1e-26)).toBeCloseTo(1, 10);
    const ratio = ta / tsys;
    expect(north.aeOverTsysSigmaM2PerK / north.aeOverTsysM2PerK).toBeCloseTo(Math.sqrt(((ratio + 1) / ratio) ** 2 * 2 * 0.002 ** 2 + 0.05 ** 2), 10);
    expect(r.err).toContain(`${join(dir, 'oo.csv')}:3: beam "south": invalid measurement: on-source power 0.9 does not exceed off-source power 1`);
    // Atmosphere: S × exp(−τ/sin el) makes A_e/T_sys larger by the inverse factor.
    const a = await run(['onoff', join(dir, 'oo.csv'), '--flux-jy', '1500', '--zenith-opacity-np', '0.02', '--elevation-deg', '30']);
    expect(a.out).toContain(`atmosphere ×${Number(Math.exp(-0.04).toPrecision(5))}`);
    expect((await run(['onoff', join(dir, 'oo.csv'), '--flux-jy', '1500', '--zenith-opacity-np', '0.02'])).code).toBe(2);
  });
  it('receiver-noise: matrix Y-factor from correlation-matrix files equals the model it was built from', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'pw-cli-'));
    // R(T) = T·R_K + R_rec with known Hermitian R_K and R_rec; the per-channel T_rec is R_rec[n,n]/R_K[n,n].
    const rk = { re: [0.004, 0.001, 0.001, 0.005], im: [0, 0.0005, -0.0005, 0] }, rr = { re: [0.3, 0.02, 0.02, 0.5], im: [0, -0.01, 0.01, 0] };
    const at = (t: number) => ({ rows: 2, cols: 2, re: rk.re.map((v, i) => t * v + rr.re[i]), im: rk.im.map((v, i) => t * v + rr.im[i]) });
    writeFileSync(join(dir, 'hot.json'), JSON.stringify(at(293)));
    writeFileSync(join(dir, 'cold.json'), JSON.stringify(at(12)));
    writeFileSync(join(dir, 'w.json'), JSON.stringify({ rows: 2, cols: 1, re: [1, 1], im: [0, 0] }));
    const r = await run(['receiver-noise', '--hot', join(dir, 'hot.json'), '--cold', join(dir, 'cold.json'), '--hot-k', '293', '--cold-k', '12', '--weights', join(dir, 'w.json'), '--json']);
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.channels[0].receiverTemperatureK).toBeCloseTo(0.3 / 0.004, 8);
    expect(j.channels[1].receiverTemperatureK).toBeCloseTo(0.5 / 0.005, 8);
    // Beam w = [1, 1]: wᴴ R w = sum of all entries' real parts (Hermitian).
    expect(j.beams[0].receiverTemperatureK).toBeCloseTo((0.3 + 0.5 + 0.04) / (0.004 + 0.005 + 0.002), 8);
    writeFileSync(join(dir, 'bad.json'), '{"rows": 2,\n "cols": 2, "re": [1, 2, 3], "im": [0, 0, 0, 0]}');
    const b = await run(['receiver-noise', '--hot', join(dir, 'bad.json'), '--cold', join(dir, 'cold.json'), '--hot-k', '293', '--cold-k', '12']);
    expect(b.code).toBe(2);
    expect(b.err).toContain(`${join(dir, 'bad.json')}: field "re" must be an array of 4 numbers`);
  });
});
