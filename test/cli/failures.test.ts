/**
 * The command line on imperfection studies: a design whose failed elements are terminated in
 * matched loads exits 0 (no false failed check: the loads' dissipation is modelled as loss) and
 * the report shows the failure cost; a crossed-dipole design with subarray delay exits 0 and
 * shows IXR, cross-polar level, squint, gain loss and subarray lobes.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { runCapture } from '../helpers/cli.js';

const F0 = 2.25e9, L0 = 299792458 / F0;
let dir: string;
beforeAll(() => { dir = mkdtempSync(join(tmpdir(), 'pw-fail-')); });

describe('phasewise evaluate with failed elements', () => {
  it('exits 0, draws failure-cost.svg and names the failed elements', async () => {
    const file = join(dir, 'tile.json');
    writeFileSync(file, JSON.stringify({
      title: 'S-band telemetry tile with two dead channels',
      frequencyHz: { fromHz: 2.2e9, toHz: 2.3e9, count: 3 }, bandwidthHz: 1e6,
      layout: { kind: 'rectangular', countX: 3, countY: 3, spacingXM: 0.5 * L0, spacingYM: 0.5 * L0 },
      elements: { kind: 'dipole', lengthM: 0.46 * L0, radiusM: L0 / 250, axis: [1, 0, 0], groundPlaneHeightM: L0 / 4 },
      amplifiers: { minimumNoiseTemperatureK: 40, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.018 },
      environment: { skyK: 12, groundK: 290 },
      beams: { thetaDeg: [-30, 0, 30] },
      imperfections: { failures: { elements: [4, 7], termination: 'matched' } },
    }));
    const r = await runCapture(['evaluate', file, '--out', join(dir, 'out'), '--workers', '1']);
    expect(r.code, r.err).toBe(0);
    expect(readdirSync(join(dir, 'out'))).toContain('failure-cost.svg');
    const html = readFileSync(join(dir, 'out', 'report.html'), 'utf8');
    expect(html).toContain('failed elements');
    expect(html).toContain('worst failure loss');
    const figures = JSON.parse(readFileSync(join(dir, 'out', 'figures.json'), 'utf8'));
    expect(figures.failedChecks).toEqual([]);
  });
  it('crossed dipoles with subarray delay: exits 0 and draws the polarisation and steering figures', async () => {
    const file = join(dir, 'dual.json');
    writeFileSync(file, JSON.stringify({
      title: 'Dual-polarised S-band tile, time delay between 2×2 subarrays',
      frequencyHz: { fromHz: 2.0e9, toHz: 2.5e9, count: 3 }, bandwidthHz: 1e6,
      layout: { kind: 'rectangular', countX: 4, countY: 2, spacingXM: 0.5 * L0, spacingYM: 0.5 * L0 },
      elements: { kind: 'crossedDipole', lengthM: 0.44 * L0, radiusM: L0 / 250, groundPlaneHeightM: L0 / 4 },
      amplifiers: { minimumNoiseTemperatureK: 40, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.018 },
      environment: { skyK: 12, groundK: 290 },
      beams: { thetaDeg: [-30, 0, 30] },
      quadrature: { thetaCount: 32, phiCount: 64 },
      imperfections: { subarrays: { perX: 2, perY: 2 }, steering: 'subarrayDelay' },
    }));
    const out = join(dir, 'dual-out');
    const r = await runCapture(['evaluate', file, '--out', out, '--workers', '1']);
    expect(r.code, r.err).toBe(0);
    const files = readdirSync(out);
    for (const f of ['ixr.svg', 'cross-polar.svg', 'beam-squint.svg', 'steering-gain-loss.svg', 'subarray-lobes.svg']) expect(files).toContain(f);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).toContain('worst IXR');
  });
});
