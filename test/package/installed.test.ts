/**
 * What users run: the packed tarball installed into a fresh project. The bin runs under the
 * npm bin symlink and npx (not only as `node dist/cli.js`), `--version` answers, a band design
 * evaluates on the worker pool with the same result as one worker, and the package imports
 * by name. Needs dist/ (npm test builds first) and the npm registry or its cache.
 */
import { describe, it, expect, beforeAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { THREADS_SCRIPT, runTimed } from '../helpers/threadsScript.js';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { version: string };
let project: string;

const sh = (cmd: string, args: string[], cwd = project) => execFileSync(cmd, args, { cwd, encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], timeout: 300_000 });

beforeAll(() => {
  const tmp = mkdtempSync(join(tmpdir(), 'pw-installed-'));
  sh('npm', ['pack', '--silent', '--pack-destination', tmp], root);
  const tarball = readdirSync(tmp).find((f) => f.endsWith('.tgz')) as string;
  project = join(tmp, 'user-project');
  execFileSync('mkdir', ['-p', project]);
  writeFileSync(join(project, 'package.json'), JSON.stringify({ name: 'user-project', private: true, type: 'module' }));
  sh('npm', ['install', '--no-audit', '--no-fund', '--prefer-offline', join(tmp, tarball)]);
  const L = 299792458 / 1.4e9;
  writeFileSync(join(project, 'band.json'), JSON.stringify({
    title: 'installed-package band check',
    frequencyHz: { fromHz: 1.3e9, toHz: 1.5e9, count: 4 }, bandwidthHz: 1e6,
    layout: { kind: 'line', count: 4, spacingM: 0.5 * L },
    elements: { kind: 'dipole', lengthM: 0.47 * L, radiusM: L / 300, axis: [0, 1, 0], groundPlaneHeightM: L / 4 },
    amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.02 },
    environment: { skyK: 8, groundK: 290 },
    beams: { pointings: [{ thetaDeg: 0, phiDeg: 0 }, { thetaDeg: 20, phiDeg: 0 }] },
    quadrature: { thetaCount: 16, phiCount: 32 },
  }));
}, 300_000);

describe('the packed and installed package', () => {
  it('npx phasewise --version and the bin symlink print the version', () => {
    expect(sh('npx', ['--no-install', 'phasewise', '--version']).trim()).toBe(pkg.version);
    expect(sh(join(project, 'node_modules', '.bin', 'phasewise'), ['--help'])).toContain('Examples:');
  });

  it('npx phasewise evaluate writes the report; two workers give the same figures as one', () => {
    const a = sh('npx', ['--no-install', 'phasewise', 'evaluate', 'band.json', '--out', 'rep1', '--workers', '1']);
    expect(a).toContain('report written to');
    sh('npx', ['--no-install', 'phasewise', 'evaluate', 'band.json', '--out', 'rep2', '--workers', '2']);
    const j1 = readFileSync(join(project, 'rep1', 'figures.json'), 'utf8');
    expect(JSON.parse(j1).frequenciesHz).toHaveLength(4);
    expect(readFileSync(join(project, 'rep2', 'figures.json'), 'utf8')).toBe(j1);
  });

  it('npx phasewise onoff reduces a table; a module subpath imports by name', () => {
    // 1500 Jy calibrator, P_on/P_off − 1 = 0.05: A_e/T_sys = 2 k_B·0.05/(1500·1e-26) = 9.2043 m²/K (conventions, sensitivity row).
    writeFileSync(join(project, 'scan.csv'), 'beam,on,off\nzenith,1.05,1\n');
    const r = JSON.parse(sh('npx', ['--no-install', 'phasewise', 'onoff', 'scan.csv', '--flux-jy', '1500', '--json']));
    expect(r[0].aeOverTsysM2PerK).toBeCloseTo((2 * 1.380649e-23 * 0.05) / 1500e-26, 9);
    const sub = sh('node', ['--input-type=module', '-e', "import { trace } from 'phasewise/linalg'; import { trace as t2 } from 'phasewise'; console.log(trace === t2);"]);
    expect(sub.trim()).toBe('true');
  });

  it('the installed package runs large products on two kernel threads (ESM and CJS): same bits as one thread, prompt exit', () => {
    for (const args of [
      ['--input-type=module', '-e', `import * as lib from 'phasewise/linalg'; import { createRequire } from 'node:module'; const require = createRequire(import.meta.url);\n${THREADS_SCRIPT}`],
      ['-e', `const lib = require('phasewise/linalg');\n${THREADS_SCRIPT}`],
    ]) {
      const r = runTimed(args, project);
      expect(r.status).toBe(0);
      expect(JSON.parse(r.out)).toMatchObject({ same: true, threads: 2 });
      expect(r.ms).toBeLessThan(10_000);
    }
  });

  it('imports by package name (ESM and CJS) and runs the band job', () => {
    const esm = sh('node', ['--input-type=module', '-e', "import { evaluateDesign, validateDesign, VERSION } from 'phasewise'; import { readFileSync } from 'node:fs'; const ev = evaluateDesign(validateDesign(JSON.parse(readFileSync('band.json', 'utf8')), 'band.json')); console.log(VERSION, ev.frequencies.length, ev.bandSummary.length);"]);
    expect(esm.trim()).toBe(`${pkg.version} 4 2`);
    const cjs = sh('node', ['-e', "const p = require('phasewise'); console.log(typeof p.evaluateDesign, typeof p.gainOverTemperatureDbPerK);"]);
    expect(cjs.trim()).toBe('function function');
  });
});
