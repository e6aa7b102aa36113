/**
 * The command line on band designs: shards merge into exactly the single run's report, bad
 * shard options and mixed parts exit 2, output-folder faults exit 2 without partial output.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync, readdirSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCapture } from '../helpers/cli.js';

const run = runCapture;

const F0 = 1.4e9, L0 = 299792458 / F0;
function bandDesign(title = 'band line'): Record<string, unknown> {
  return {
    title,
    frequencyHz: { fromHz: 0.9 * F0, toHz: 1.1 * F0, count: 5 },
    bandwidthHz: 1e6,
    layout: { kind: 'rectangular', countX: 3, countY: 2, spacingXM: 0.5 * L0, spacingYM: 0.5 * L0 },
    elements: { kind: 'dipole', lengthM: 0.47 * L0, radiusM: L0 / 300, axis: [1, 0, 0], groundPlaneHeightM: L0 / 4 },
    amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.02, gainDb: 30, secondStageTemperatureK: 400 },
    environment: { skyK: { referenceK: 4, referenceHz: F0 }, groundK: 290 },
    beams: { cone: { maxThetaDeg: 25, stepUV: 0.2 } },
    physicalAreaM2: 6 * (0.5 * L0) ** 2,
    quadrature: { thetaCount: 16, phiCount: 32 },
  };
}

let dir: string;
beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'pw-band-')); });

describe('phasewise evaluate on a band design', () => {
  it('writes figures versus frequency, a sensitivity map per report frequency and G/T, SEFD in figures.json', async () => {
    const file = join(dir, 'band.json');
    writeFileSync(file, JSON.stringify(bandDesign()));
    const r = await run(['evaluate', file, '--out', join(dir, 'single'), '--workers', '1']);
    expect(r.code, r.err).toBe(0);
    const files = readdirSync(join(dir, 'single'));
    for (const f of ['sensitivity-vs-frequency.svg', 'gt-vs-frequency.svg', 'system-temperature-vs-frequency.svg', 'sensitivity-map-1260MHz.svg', 'sensitivity-map-1400MHz.svg', 'sensitivity-map-1540MHz.svg', 'pattern-cut-1400MHz.svg', 'grating-lobes.svg']) {
      expect(files, f).toContain(f);
    }
    const j = JSON.parse(readFileSync(join(dir, 'single', 'figures.json'), 'utf8'));
    expect(j.frequenciesHz).toHaveLength(5);
    expect(j.frequencies[2].beams[0].gainOverTemperatureDbPerK).toBeTypeOf('number');
    expect(j.bandSummary[0].worstSefdJy).toBeGreaterThan(0);
    expect(r.out).toMatch(/worst beam .*A_e\/T_sys/);
    const html = readFileSync(join(dir, 'single', 'report.html'), 'utf8');
    expect(html).toContain('G/T [dB/K]');
    expect(html).toContain('SEFD [Jy]');
  });

  it('shards 1/3, 2/3, 3/3 merge into exactly the single run (figures.json byte for byte)', async () => {
    const file = join(dir, 'band.json');
    for (const s of ['1/3', '2/3', '3/3']) {
      const r = await run(['evaluate', file, '--out', join(dir, 'parts'), '--shard', s]);
      expect(r.code, r.err).toBe(0);
      expect(r.out).toContain(`shard ${s}`);
    }
    const parts = readdirSync(join(dir, 'parts')).sort().map((p) => join(dir, 'parts', p));
    expect(parts).toHaveLength(3);
    const m = await run(['merge', ...parts.reverse(), '--out', join(dir, 'merged')]);
    expect(m.code, m.err).toBe(0);
    expect(readFileSync(join(dir, 'merged', 'figures.json'), 'utf8')).toBe(readFileSync(join(dir, 'single', 'figures.json'), 'utf8'));
    expect(readdirSync(join(dir, 'merged')).sort()).toEqual(readdirSync(join(dir, 'single')).sort());
  });

  it('bad shards and mixed or incomplete parts exit 2 with a message', async () => {
    const file = join(dir, 'band.json');
    for (const s of ['0/3', '4/3', '2', 'a/b', '1/0']) {
      const r = await run(['evaluate', file, '--out', join(dir, 'x'), '--shard', s]);
      expect(r.code, s).toBe(2);
      expect(r.err, s).toContain('--shard');
    }
    const tooMany = await run(['evaluate', file, '--out', join(dir, 'x'), '--shard', '1/6']);
    expect(tooMany.code).toBe(2);
    expect(tooMany.err).toContain('at most 5 shards');
    const other = join(dir, 'other.json');
    writeFileSync(other, JSON.stringify(bandDesign('another design')));
    expect((await run(['evaluate', other, '--out', join(dir, 'parts-other'), '--shard', '2/3'])).code).toBe(0);
    const mixed = await run(['merge', join(dir, 'parts', 'part-1-of-3.json'), join(dir, 'parts-other', 'part-2-of-3.json'), join(dir, 'parts', 'part-3-of-3.json'), '--out', join(dir, 'm2')]);
    expect(mixed.code).toBe(2);
    expect(mixed.err).toContain('different design');
    const missing = await run(['merge', join(dir, 'parts', 'part-1-of-3.json'), '--out', join(dir, 'm3')]);
    expect(missing.code).toBe(2);
    expect(missing.err).toContain('shards 2/3, 3/3 are missing');
    const twice = await run(['merge', join(dir, 'parts', 'part-1-of-3.json'), join(dir, 'parts', 'part-1-of-3.json'), '--out', join(dir, 'm4')]);
    expect(twice.err).toContain('given twice');
    writeFileSync(join(dir, 'not-a-part.json'), '{"a": 1}');
    const notPart = await run(['merge', join(dir, 'not-a-part.json'), '--out', join(dir, 'm5')]);
    expect(notPart.code).toBe(2);
    expect(notPart.err).toContain('expected a shard part');
  });

  it('output folder faults exit 2 naming the path and the reason, with nothing written', async () => {
    const file = join(dir, 'band.json');
    const aFile = join(dir, 'a-file');
    writeFileSync(aFile, 'x');
    const cases: Array<[string, string]> = [
      [aFile, 'a file of that name exists'],
      [join(aFile, 'sub'), 'a part of the path is a file'],
      ['/proc/phasewise-report', 'special file system'],
    ];
    for (const [out, why] of cases) {
      const r = await run(['evaluate', file, '--out', out, '--workers', '1']);
      expect(r.code, out).toBe(2);
      expect(r.err, out).toContain(out);
      expect(r.err, out).toContain(why);
      expect(r.err).not.toMatch(/internal error|\n\s+at /);
    }
    expect(readFileSync(aFile, 'utf8')).toBe('x');
    // An unwritable folder (skipped as root, who may write anywhere): permission denied.
    if (process.getuid?.() !== 0) {
      const ro = join(dir, 'ro');
      mkdirSync(ro, { mode: 0o500 });
      const r = await run(['evaluate', file, '--out', join(ro, 'rep'), '--workers', '1']);
      expect(r.code).toBe(2);
      expect(r.err).toContain('permission denied');
    }
    expect(existsSync('/proc/phasewise-report')).toBe(false);
  });

  it('results that fail a physical check exit 3 with the report written and marked; --accept-failed-checks exits 0', async () => {
    // 600 λ/2-spaced dipoles over ground with a 14 × 28 sphere rule: far too coarse (η_rad ≈ 24).
    const d = { ...bandDesign('too coarse a rule'), frequencyHz: F0, layout: { kind: 'line', count: 600, spacingM: 0.5 * L0 }, beams: { thetaDeg: [0] }, quadrature: { thetaCount: 14, phiCount: 28 } } as Record<string, unknown>;
    delete d.physicalAreaM2;
    const file = join(dir, 'coarse.json');
    writeFileSync(file, JSON.stringify(d));
    const r = await run(['evaluate', file, '--out', join(dir, 'coarse'), '--workers', '1']);
    expect(r.code, r.err).toBe(3);
    expect(r.err).toContain('phasewise: failed checks:');
    expect(r.err).toContain('radiationEfficiency');
    expect(r.err).toContain('twissResidual');
    const j = JSON.parse(readFileSync(join(dir, 'coarse', 'figures.json'), 'utf8'));
    expect(j.failedChecks.map((c: any) => c.name)).toEqual(expect.arrayContaining(['radiationEfficiency', 'twissResidual']));
    expect(readFileSync(join(dir, 'coarse', 'report.html'), 'utf8')).toContain('id="failed-checks"');
    const a = await run(['evaluate', file, '--out', join(dir, 'coarse-accepted'), '--workers', '1', '--accept-failed-checks']);
    expect(a.code).toBe(0);
    expect(a.err).toContain('warning');
    // A shard of a failing design exits 3 too, and so does merging it.
    const s = await run(['evaluate', file, '--out', join(dir, 'coarse-parts'), '--shard', '1/1']);
    expect(s.code).toBe(3);
    const m = await run(['merge', join(dir, 'coarse-parts', 'part-1-of-1.json'), '--out', join(dir, 'coarse-merged')]);
    expect(m.code).toBe(3);
  }, 120_000);

  it('element-model validity and sizes beyond memory exit 2 before any integral, naming the check or the estimate', async () => {
    const cases: Array<[string, (d: any) => void, string]> = [
      ['25.3 λ dipole', (d) => { d.frequencyHz = F0; d.elements.lengthM = 25.3 * L0; }, 'elementModel.electricalLength'],
      ['10³⁰ Hz', (d) => { d.frequencyHz = 1e30; }, 'elementModel.electricalLength'],
      ['1000 × 1000 grid', (d) => { d.frequencyHz = F0; d.layout = { kind: 'rectangular', countX: 1000, countY: 1000, spacingXM: 0.5 * L0, spacingYM: 0.5 * L0 }; }, 'GB of memory'],
    ];
    for (const [label, mutate, text] of cases) {
      const d = bandDesign(label) as any;
      delete d.quadrature;
      mutate(d);
      const file = join(dir, `invalid-${label.replace(/\W+/g, '-')}.json`);
      writeFileSync(file, JSON.stringify(d));
      const t0 = performance.now();
      const r = await run(['evaluate', file, '--out', join(dir, 'never'), '--workers', '1']);
      expect(r.code, `${label}: ${r.err}`).toBe(2);
      expect(r.err, label).toContain(text);
      expect(performance.now() - t0, label).toBeLessThan(20_000);
    }
    expect(existsSync(join(dir, 'never'))).toBe(false);
  });

  it('--dry-run prints the time and memory estimate and writes nothing', async () => {
    const r = await run(['evaluate', join(dir, 'band.json'), '--out', join(dir, 'dry'), '--dry-run']);
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/^estimate for a design of 6 elements, 13 beams and 5 frequencies: about .* s on one core, .*peak memory about \d+ MB/);
    expect(existsSync(join(dir, 'dry'))).toBe(false);
  });

  it('every error, commander ones included, has one style: "phasewise: error: …"', async () => {
    for (const args of [['evaluate', 'x.json'], ['evaluate', join(dir, 'band.json'), '--out', join(dir, 'y'), '--bogus'], ['nonsense'], ['evaluate', join(dir, 'missing.json'), '--out', join(dir, 'y')]]) {
      const r = await run(args);
      expect(r.code, args.join(' ')).toBe(2);
      expect(r.err, args.join(' ')).toMatch(/^phasewise: error: /);
    }
  });
});
