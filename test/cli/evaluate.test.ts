import { describe, it, expect, beforeAll, vi } from 'vitest';
import { mkdtempSync, readFileSync, writeFileSync, existsSync, readdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { XMLValidator } from 'fast-xml-parser';
import { runCapture } from '../helpers/cli.js';
import { parseDesign, validateDesign } from '../../src/design/schema.js';
import { designPortsAt, prepareDesign } from '../../src/design/build.js';
import { demoDesign } from '../../src/cli/commands/demo.js';
import {
  dipoleArrayPorts, evaluateReceivingArray, patternSetPorts, skyAndGroundEnvironment,
} from '../../src/reception/index.js';
import { sphereQuadrature, uniformLineLayout } from '../../src/geometry/index.js';
import { dipoleEmbeddedPatterns } from '../../src/element/patternSet.js';
import { writePatternFile } from '../../src/element/node.js';
import { writeTouchstoneFile } from '../../src/network/node.js';
import { createMultiport } from '../../src/network/multiport.js';
import { convertMultiport } from '../../src/network/convert.js';
import type { WireDipole } from '../../src/element/types.js';
import { identity } from '../../src/linalg/cmatrix.js';
import { add, scale, subtract } from '../../src/linalg/ops.js';
import { solve } from '../../src/linalg/lu.js';

const run = runCapture;

const F = 1.5e9, LAMBDA = 299792458 / F;
const D = 0.5 * LAMBDA, L = 0.47 * LAMBDA, A = LAMBDA / 300, H = LAMBDA / 4;

/** A small valid design: 4 dipoles on a line over ground, 3 beams, a coarse quadrature. */
function baseDesign(): Record<string, any> {
  return {
    title: 'four dipoles',
    frequencyHz: F,
    bandwidthHz: 1e6,
    layout: { kind: 'line', count: 4, spacingM: D, axis: 'x' },
    elements: { kind: 'dipole', lengthM: L, radiusM: A, axis: [0, 1, 0], groundPlaneHeightM: H },
    amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: { re: 0.02, im: 0 } },
    environment: { skyK: 8, groundK: 290, tiltDeg: 0, physicalTemperatureK: 290 },
    beams: { planePhiDeg: 0, thetaDeg: [-30, 0, 30], beamformer: 'max-snr' },
    physicalAreaM2: 4 * D * D,
    quadrature: { thetaCount: 14, phiCount: 28 },
  };
}

function dipoles(): WireDipole[] {
  const lay = uniformLineLayout(4, D);
  return Array.from({ length: 4 }, (_, i) => ({ centerM: [lay.positionsM[3 * i], 0, H] as const, axis: [0, 1, 0] as const, lengthM: L, radiusM: A }));
}

const directBeams = { thetaRad: Float64Array.of(Math.PI / 6, 0, Math.PI / 6), phiRad: Float64Array.of(Math.PI, 0, 0) };

let dir: string;
beforeAll(() => {
  dir = mkdtempSync(join(tmpdir(), 'pw-eval-'));
  // Imported data: the same dipoles' embedded patterns and Z written as a pattern file and a Touchstone file.
  const th = Float64Array.from({ length: 19 }, (_, i) => (i * Math.PI) / 18);
  const ph = Float64Array.from({ length: 24 }, (_, i) => (i * 2 * Math.PI) / 24);
  const set = dipoleEmbeddedPatterns(dipoles(), F, th, ph, { groundPlane: { zM: 0 } });
  writePatternFile(join(dir, 'patterns.json'), set);
  const z = dipoleArrayPorts(dipoles(), F, { groundPlane: { zM: 0 } }).impedanceOhm;
  const net = createMultiport('impedance', [F * 0.99, F * 1.01], [z, z]);
  writeTouchstoneFile(join(dir, 'array.s4p'), convertMultiport(net, 'scattering'));
  writeFileSync(join(dir, 'garbage.s4p'), 'this is not a touchstone file\n1 2 3\n');
  writeFileSync(join(dir, 'garbage.json'), '{"frequencyHz": "x"}');
  writeFileSync(join(dir, 'lna-no-noise.s2p'), '# GHz S RI R 50\n1.4 0.1 0 5 0 0.01 0 0.2 0\n1.6 0.1 0 5 0 0.01 0 0.2 0\n');
  const set3 = dipoleEmbeddedPatterns(dipoles().slice(0, 3), F, th, ph, { groundPlane: { zM: 0 } });
  writePatternFile(join(dir, 'patterns3.json'), set3);
  const set2 = dipoleEmbeddedPatterns(dipoles(), 2 * F, th, ph, { groundPlane: { zM: 0 } });
  const upper = Float64Array.from({ length: 10 }, (_, i) => (i * Math.PI) / 18); // 0 … 90° only
  writePatternFile(join(dir, 'patterns-upper.json'), dipoleEmbeddedPatterns(dipoles(), F, upper, ph, { groundPlane: { zM: 0 } }));
  writePatternFile(join(dir, 'patterns-2f.json'), set2);
});

function writeDesign(name: string, data: unknown): string {
  const p = join(dir, name);
  writeFileSync(p, typeof data === 'string' ? data : JSON.stringify(data));
  return p;
}

describe('phasewise evaluate: a valid design', () => {
  it('exits 0 and figures.json equals the library result for the same inputs', async () => {
    const out = join(dir, 'report-ok');
    const r = await run(['evaluate', writeDesign('ok.json', baseDesign()), '--out', out]);
    expect(r.err).toBe('');
    expect(r.code).toBe(0);
    expect(r.out).toContain(out);
    for (const f of ['report.html', 'figures.json', 'pattern-cut.svg', 'system-temperature.svg', 'sensitivity.svg', 'active-reflection.svg']) {
      expect(existsSync(join(out, f)), f).toBe(true);
    }
    // A line has no planar lattice: no grating-lobe diagram.
    expect(existsSync(join(out, 'grating-lobes.svg'))).toBe(false);
    const j = JSON.parse(readFileSync(join(out, 'figures.json'), 'utf8'));
    const direct = evaluateReceivingArray({
      ports: dipoleArrayPorts(dipoles(), F, { groundPlane: { zM: 0 } }),
      quadrature: sphereQuadrature(14, 28),
      bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 8, groundK: 290, tiltRad: 0 }),
      amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: { re: 0.02, im: 0 } },
      physicalTemperatureK: 290,
      loss: 'lossless',
      beams: directBeams,
      physicalAreaM2: 4 * D * D,
    });
    const fr = j.frequencies[0];
    expect(fr.beams).toHaveLength(3);
    expect(j.beams.scanAngleDeg).toEqual([-30, 0, 30]);
    for (let k = 0; k < 3; k++) {
      const { gainOverTemperatureDbPerK, sefdJy, ...figs } = fr.beams[k];
      expect(figs).toEqual({ ...direct.beams[k] });
      // G/T and SEFD from A_e/T_sys by their definitions (IEEE Std 145-2013; Thompson, Moran & Swenson 2017, from memory).
      expect(gainOverTemperatureDbPerK).toBeCloseTo(10 * Math.log10(direct.beams[k].gain / direct.beams[k].systemTemperatureK), 10);
      expect(sefdJy).toBeCloseTo((2 * 1.380649e-23 * direct.beams[k].systemTemperatureK) / direct.beams[k].effectiveAreaM2 / 1e-26, 6);
    }
    expect(fr.minimumReceiverTemperatureK).toBe(direct.minimumReceiverTemperatureK);
    expect(fr.embeddedElementEfficiency).toEqual(Array.from(direct.embeddedElementEfficiency));
    // Symmetric array: the ±30° beams agree (a physical check of the scan-plane directions).
    expect(fr.beams[0].systemTemperatureK).toBeCloseTo(fr.beams[2].systemTemperatureK, 9);
    // Broadside pattern cut peaks at 0° and is 0 dB at its own normalisation maximum.
    const mid = fr.patternCuts.find((t: any) => t.beam === 1);
    const iMax = mid.valueDb.indexOf(Math.max(...mid.valueDb));
    expect(fr.cutAngleDeg[iMax]).toBe(0);
    for (const f of readdirSync(out).filter((x) => x.endsWith('.svg'))) {
      expect(XMLValidator.validate(readFileSync(join(out, f), 'utf8')), f).toBe(true);
    }
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(html).toContain('<svg');
    expect(html).toContain('T_sys [K]');
    expect(html).not.toMatch(/<script|<link|src="http/);
  });

  it('progress bar on stderr only when stderr is a terminal, and --no-progress silences it', async () => {
    const pd = baseDesign();
    pd.frequencyHz = [0.98 * F, F, 1.01 * F];
    const file = writeDesign('progress.json', pd);
    const writes: string[] = [];
    const spy = vi.spyOn(process.stderr, 'write').mockImplementation((chunk: any) => { writes.push(String(chunk)); return true; });
    const tty = Object.getOwnPropertyDescriptor(process.stderr, 'isTTY');
    try {
      Object.defineProperty(process.stderr, 'isTTY', { value: false, configurable: true });
      expect((await run(['evaluate', file, '--out', join(dir, 'report-p1')])).code).toBe(0);
      expect(writes.join('')).not.toContain('frequencies');
      Object.defineProperty(process.stderr, 'isTTY', { value: true, configurable: true });
      expect((await run(['evaluate', file, '--out', join(dir, 'report-p2'), '--no-progress'])).code).toBe(0);
      expect(writes.join('')).not.toContain('frequencies');
      expect((await run(['evaluate', file, '--out', join(dir, 'report-p3')])).code).toBe(0);
      expect(writes.join('')).toContain('3/3 frequencies');
    } finally {
      spy.mockRestore();
      if (tty) Object.defineProperty(process.stderr, 'isTTY', tty); else delete (process.stderr as { isTTY?: boolean }).isTTY;
    }
  });

  it('active reflection coefficients equal (S c)ₙ/cₙ with S = (Z − 50)(Z + 50)⁻¹ (Pozar 1994, from memory)', async () => {
    const j = JSON.parse(readFileSync(join(dir, 'report-ok', 'figures.json'), 'utf8'));
    const z = dipoleArrayPorts(dipoles(), F, { groundPlane: { zM: 0 } }).impedanceOhm;
    const i4 = identity(4);
    const s = solve(add(z, scale(i4, 50)), subtract(z, scale(i4, 50))); // (Z+50)⁻¹(Z−50) = (Z−50)(Z+50)⁻¹ (they commute)
    const ar = { traces: j.frequencies[0].activeReflection };
    const x = uniformLineLayout(4, D).positionsM;
    for (const [k, ang] of (j.beams.scanAngleDeg as number[]).entries()) {
      const u = Math.sin((ang * Math.PI) / 180);
      const c = Array.from({ length: 4 }, (_, m) => ({ re: Math.cos(-2 * Math.PI / LAMBDA * u * x[3 * m]), im: Math.sin(-2 * Math.PI / LAMBDA * u * x[3 * m]) }));
      for (const t of ar.traces) {
        let gr = 0, gi = 0;
        for (let m = 0; m < 4; m++) {
          const o = 2 * (t.element * 4 + m), sr = s.data[o], si = s.data[o + 1];
          gr += sr * c[m].re - si * c[m].im; gi += sr * c[m].im + si * c[m].re;
        }
        const cn = c[t.element], den = cn.re ** 2 + cn.im ** 2;
        expect(t.re[k]).toBeCloseTo((gr * cn.re + gi * cn.im) / den, 10);
        expect(t.im[k]).toBeCloseTo((gi * cn.re - gr * cn.im) / den, 10);
      }
    }
  });

  it('every layout kind and the circular Taylor taper evaluate', async () => {
    const cases: Array<[Record<string, unknown>, number, boolean]> = [
      [{ kind: 'rectangular', countX: 2, countY: 2, spacingXM: D, spacingYM: D }, 4, true],
      [{ kind: 'triangular', spacingM: D, boundary: { kind: 'circle', radiusM: D } }, 7, true],
      [{ kind: 'triangular', spacingM: D, boundary: { kind: 'hexagon', circumradiusM: D } }, 7, true],
      [{ kind: 'positions', positionsM: [[0, 0, 0], [D, 0, 0], [0, D, 0]] }, 3, false],
    ];
    for (const [i, [layout, count, lattice]] of cases.entries()) {
      const d = baseDesign();
      d.layout = layout;
      d.physicalAreaM2 = count * D * D;
      d.beams = { thetaDeg: { fromDeg: 0, toDeg: 20, count: 2 }, beamformer: 'taper', taper: { kind: 'circular-taylor', sidelobeDb: 25, nbar: 3 } };
      const out = join(dir, `report-layout-${i}`);
      const r = await run(['evaluate', writeDesign(`layout-${i}.json`, d), '--out', out]);
      expect(r.code, r.err).toBe(0);
      const j = JSON.parse(readFileSync(join(out, 'figures.json'), 'utf8'));
      expect(j.elementCount).toBe(count);
      expect(existsSync(join(out, 'grating-lobes.svg'))).toBe(lattice);
      expect(j.beams.scanAngleDeg).toEqual([0, 20]);
    }
  });

  it('conjugate-field and taper beamformers give weights the figures reflect', async () => {
    const cf = baseDesign();
    cf.beams.beamformer = 'conjugate-field';
    const r1 = await run(['evaluate', writeDesign('cf.json', cf), '--out', join(dir, 'report-cf')]);
    expect(r1.code, r1.err).toBe(0);
    const tp = baseDesign();
    tp.beams.beamformer = 'taper';
    tp.beams.taper = { kind: 'cosine', pedestal: 0.3 };
    const r2 = await run(['evaluate', writeDesign('tp.json', tp), '--out', join(dir, 'report-tp')]);
    expect(r2.code, r2.err).toBe(0);
    const ms = JSON.parse(readFileSync(join(dir, 'report-ok', 'figures.json'), 'utf8'));
    const c = JSON.parse(readFileSync(join(dir, 'report-cf', 'figures.json'), 'utf8'));
    const t = JSON.parse(readFileSync(join(dir, 'report-tp', 'figures.json'), 'utf8'));
    // Max-SNR maximises A_e/T_sys among all weights (Rayleigh quotient): no other beamformer beats it.
    const [m0, c0, t0] = [ms, c, t].map((x) => x.frequencies[0].beams);
    for (let k = 0; k < 3; k++) {
      expect(m0[k].sensitivityM2PerK).toBeGreaterThanOrEqual(c0[k].sensitivityM2PerK * (1 - 1e-12));
      expect(m0[k].sensitivityM2PerK).toBeGreaterThanOrEqual(t0[k].sensitivityM2PerK * (1 - 1e-12));
    }
    // A taper lowers the aperture efficiency of a phase-steered beam at broadside (taper efficiency < 1).
    expect(t0[1].apertureEfficiency).toBeLessThan(c0[1].apertureEfficiency);
  });

  it('imported Touchstone + pattern files give the library result of patternSetPorts', async () => {
    const d = baseDesign();
    d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'patterns.json' };
    const out = join(dir, 'report-imp');
    const r = await run(['evaluate', writeDesign('imp.json', d), '--out', out]);
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(readFileSync(join(out, 'figures.json'), 'utf8'));
    const { readPatternFile } = await import('../../src/element/node.js');
    const { readTouchstoneFile } = await import('../../src/network/node.js');
    const { interpolateMultiport } = await import('../../src/network/interpolate.js');
    const { multiportMatrix } = await import('../../src/network/multiport.js');
    const z = multiportMatrix(convertMultiport(interpolateMultiport(readTouchstoneFile(join(dir, 'array.s4p')).network, [F]), 'impedance'), 0);
    const direct = evaluateReceivingArray({
      ports: patternSetPorts(readPatternFile(join(dir, 'patterns.json')), z),
      quadrature: sphereQuadrature(14, 28), bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 8, groundK: 290, tiltRad: 0 }),
      amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: { re: 0.02, im: 0 } },
      physicalTemperatureK: 290, loss: 'fromPatterns', beams: directBeams, physicalAreaM2: 4 * D * D,
    });
    for (let k = 0; k < 3; k++) {
      const { gainOverTemperatureDbPerK, sefdJy, ...figs } = j.frequencies[0].beams[k];
      expect(figs).toEqual({ ...direct.beams[k] });
    }
    // Interpolated imported data of the same dipoles agree with the analytic evaluation to a few per cent.
    const analytic = JSON.parse(readFileSync(join(dir, 'report-ok', 'figures.json'), 'utf8'));
    expect(Math.abs(j.frequencies[0].beams[1].systemTemperatureK / analytic.frequencies[0].beams[1].systemTemperatureK - 1)).toBeLessThan(0.05);
  });
});

type Mutation = [label: string, mutate: (d: Record<string, any>) => unknown, field: string];

const MALFORMED: Mutation[] = [
  ['missing frequency', (d) => { delete d.frequencyHz; }, 'frequencyHz'],
  ['frequency as a string', (d) => { d.frequencyHz = '2.25 GHz'; }, 'frequencyHz'],
  ['frequency in the wrong unit field', (d) => { delete d.frequencyHz; d.frequencyGHz = 1.5; }, 'frequencyGHz'],
  ['negative frequency', (d) => { d.frequencyHz = -1; }, 'frequencyHz'],
  ['zero bandwidth', (d) => { d.bandwidthHz = 0; }, 'bandwidthHz'],
  ['missing layout', (d) => { delete d.layout; }, 'layout'],
  ['unknown layout kind', (d) => { d.layout.kind = 'spiral'; }, 'layout.kind'],
  ['fractional element count', (d) => { d.layout.count = 3.5; }, 'layout.count'],
  ['zero element count', (d) => { d.layout.count = 0; }, 'layout.count'],
  ['spacing in millimetres field', (d) => { delete d.layout.spacingM; d.layout.spacingMm = 100; }, 'layout'],
  ['negative spacing', (d) => { d.layout.spacingM = -0.1; }, 'layout.spacingM'],
  ['bad axis name', (d) => { d.layout.axis = 'w'; }, 'layout.axis'],
  ['triangular without boundary', (d) => { d.layout = { kind: 'triangular', spacingM: D }; }, 'layout.boundary'],
  ['unknown boundary kind', (d) => { d.layout = { kind: 'triangular', spacingM: D, boundary: { kind: 'square', sideM: 1 } }; }, 'layout.boundary.kind'],
  ['empty position list', (d) => { d.layout = { kind: 'positions', positionsM: [] }; }, 'layout.positionsM'],
  ['position with two coordinates', (d) => { d.layout = { kind: 'positions', positionsM: [[0, 0, 0], [0.1, 0]] }; }, 'layout.positionsM[1]'],
  ['rectangular grid count as string', (d) => { d.layout = { kind: 'rectangular', countX: '2', countY: 2, spacingXM: D, spacingYM: D }; }, 'layout.countX'],
  ['missing elements', (d) => { delete d.elements; }, 'elements'],
  ['dipole without length', (d) => { delete d.elements.lengthM; }, 'elements.lengthM'],
  ['zero dipole radius', (d) => { d.elements.radiusM = 0; }, 'elements.radiusM'],
  ['zero axis vector', (d) => { d.elements.axis = [0, 0, 0]; }, 'elements.axis'],
  ['one-wavelength dipole (no feed-point solution)', (d) => { d.elements.lengthM = LAMBDA; }, 'elements'],
  ['ground-plane height negative', (d) => { d.elements.groundPlaneHeightM = -0.01; }, 'elements.groundPlaneHeightM'],
  ['dipole crossing the ground plane', (d) => { d.elements.groundPlaneHeightM = 0.1 * H; d.elements.axis = [0, 0, 1]; }, 'elements'],
  ['amplifier without noise resistance', (d) => { delete d.amplifiers.noiseResistanceOhm; }, 'amplifiers.noiseResistanceOhm'],
  ['negative T_min', (d) => { d.amplifiers.minimumNoiseTemperatureK = -5; }, 'amplifiers.minimumNoiseTemperatureK'],
  ['non-physical amplifier', (d) => { d.amplifiers.minimumNoiseTemperatureK = 500; d.amplifiers.noiseResistanceOhm = 1; }, 'amplifiers.minimumNoiseTemperatureK'],
  ['Y_opt with negative conductance', (d) => { d.amplifiers.optimumSourceAdmittanceS = { re: -0.02, im: 0 }; }, 'amplifiers.optimumSourceAdmittanceS'],
  ['Y_opt as text', (d) => { d.amplifiers.optimumSourceAdmittanceS = '20 mS'; }, 'amplifiers.optimumSourceAdmittanceS'],
  ['missing environment', (d) => { delete d.environment; }, 'environment'],
  ['negative sky temperature', (d) => { d.environment.skyK = -3; }, 'environment.skyK'],
  ['tilt beyond 180°', (d) => { d.environment.tiltDeg = 270; }, 'environment.tiltDeg'],
  ['sky temperature in Celsius field', (d) => { d.environment.skyC = 5; }, 'environment'],
  ['scan angle beyond 90°', (d) => { d.beams.thetaDeg = [0, 100]; }, 'beams.thetaDeg'],
  ['empty scan list', (d) => { d.beams.thetaDeg = []; }, 'beams.thetaDeg'],
  ['scan range with zero count', (d) => { d.beams.thetaDeg = { fromDeg: -10, toDeg: 10, count: 0 }; }, 'beams.thetaDeg'],
  ['unknown beamformer', (d) => { d.beams.beamformer = 'delay-and-sum'; }, 'beams.beamformer'],
  ['taper beamformer without taper', (d) => { d.beams.beamformer = 'taper'; }, 'beams.taper'],
  ['taper with a non-positive sidelobe level', (d) => { d.beams.beamformer = 'taper'; d.beams.taper = { kind: 'circular-taylor', sidelobeDb: -25 }; }, 'beams.taper.sidelobeDb'],
  ['negative physical area', (d) => { d.physicalAreaM2 = -1; }, 'physicalAreaM2'],
  ['quadrature with one node', (d) => { d.quadrature.thetaCount = 1; }, 'quadrature.thetaCount'],
  ['top level is an array', () => [1, 2, 3], '(top level)'],
  ['not JSON', () => '{"frequencyHz": 1e9,', 'not valid JSON'],
  ['missing Touchstone file', (d) => { d.elements = { kind: 'imported', touchstoneFile: 'nope.s4p', patternFile: 'patterns.json' }; }, 'elements.touchstoneFile'],
  ['malformed Touchstone file', (d) => { d.elements = { kind: 'imported', touchstoneFile: 'garbage.s4p', patternFile: 'patterns.json' }; }, 'elements.touchstoneFile'],
  ['malformed pattern file', (d) => { d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'garbage.json' }; }, 'elements.patternFile'],
  ['pattern file with 3 ports for a 4-port Touchstone file', (d) => { d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'patterns3.json' }; }, 'elements.patternFile'],
  ['layout count differing from the imported ports', (d) => { d.layout.count = 5; d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'patterns.json' }; }, 'layout'],
  ['pattern file at another frequency', (d) => { d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'patterns-2f.json' }; }, 'elements.patternFile'],
  ['frequency outside the Touchstone range', (d) => { d.frequencyHz = 2 * F; d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'patterns-2f.json' }; }, 'elements.touchstoneFile'],
  ['band reaching past the Touchstone data', (d) => { d.frequencyHz = { fromHz: F, toHz: 1.05 * F, count: 3 }; d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'patterns.json' }; }, 'elements.touchstoneFile'],
  ['band point without pattern data', (d) => { d.frequencyHz = [0.995 * F, F]; d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: ['patterns.json'] }; }, 'elements.patternFile'],
  ['frequency list not increasing', (d) => { d.frequencyHz = [F, 0.9 * F]; }, 'frequencyHz[1]'],
  ['frequency range with toHz below fromHz', (d) => { d.frequencyHz = { fromHz: F, toHz: 0.9 * F, count: 3 }; }, 'frequencyHz.toHz'],
  ['noise table with one row', (d) => { d.amplifiers = { table: { frequencyHz: [F], minimumNoiseTemperatureK: [35], noiseResistanceOhm: [5], optimumSourceAdmittanceS: [0.02] } }; }, 'amplifiers.table.frequencyHz'],
  ['noise table not covering the band', (d) => { d.amplifiers = { table: { frequencyHz: [1.1 * F, 1.2 * F], minimumNoiseTemperatureK: [35, 36], noiseResistanceOhm: [5, 5], optimumSourceAdmittanceS: [0.02, 0.02] } }; }, 'amplifiers.table.frequencyHz'],
  ['noise table columns of different lengths', (d) => { d.amplifiers = { table: { frequencyHz: [0.9 * F, 1.1 * F], minimumNoiseTemperatureK: [35], noiseResistanceOhm: [5, 5], optimumSourceAdmittanceS: [0.02, 0.02] } }; }, 'amplifiers.table.minimumNoiseTemperatureK'],
  ['two-port Touchstone without a noise block', (d) => { d.amplifiers = { touchstoneFile: 'lna-no-noise.s2p' }; }, 'amplifiers.touchstoneFile'],
  ['second stage without LNA gain', (d) => { d.amplifiers.secondStageTemperatureK = 300; }, 'amplifiers.gainDb'],
  ['beams given twice', (d) => { d.beams.cone = { maxThetaDeg: 30, stepUV: 0.2 }; }, 'beams.cone'],
  ['cone step of zero', (d) => { delete d.beams.thetaDeg; delete d.beams.planePhiDeg; d.beams.cone = { maxThetaDeg: 30, stepUV: 0 }; }, 'beams.cone.stepUV'],
  ['pointing beyond 90°', (d) => { delete d.beams.thetaDeg; delete d.beams.planePhiDeg; d.beams.pointings = [{ thetaDeg: 95, phiDeg: 0 }]; }, 'beams.pointings[0].thetaDeg'],
  ['negative sky reference temperature', (d) => { d.environment.skyK = { referenceK: -1, referenceHz: 1e9 }; }, 'environment.skyK'],
  ['pattern file not covering the sphere the noise integral needs', (d) => { d.elements = { kind: 'imported', touchstoneFile: 'array.s4p', patternFile: 'patterns-upper.json' }; }, 'elements.patternFile'],
];

describe('phasewise evaluate: malformed design files exit 2 naming the field', () => {
  it(`catalogue of ${MALFORMED.length} malformed designs`, async () => {
    expect(MALFORMED.length).toBeGreaterThanOrEqual(30);
    for (const [label, mutate, field] of MALFORMED) {
      const d = baseDesign();
      const replaced = mutate(d);
      const file = writeDesign(`bad-${label.replace(/[^a-z0-9]+/gi, '-')}.json`, replaced === undefined ? d : replaced);
      const out = join(dir, `out-bad`);
      const r = await run(['evaluate', file, '--out', out]);
      expect(r.code, `${label}: ${r.err}`).toBe(2);
      expect(r.err, label).toContain(field === 'not valid JSON' || field.startsWith('cannot') ? field : `field "${field}`);
      expect(r.err, label).not.toMatch(/internal error|\n\s+at /);
    }
  });

  it('errors say what was expected and what was found', async () => {
    const d = baseDesign();
    d.frequencyHz = '2.25 GHz';
    const r = await run(['evaluate', writeDesign('msg.json', d), '--out', join(dir, 'x')]);
    expect(r.err).toContain('field "frequencyHz": expected a frequency [Hz], a list of frequencies [Hz] or {"fromHz", "toHz", "count"}, received the string "2.25 GHz"');
    const e = await run(['evaluate', join(dir, 'does-not-exist.json'), '--out', join(dir, 'x')]);
    expect(e.code).toBe(2);
    expect(e.err).toContain('cannot read the design file');
    const u = await run(['evaluate', writeDesign('ok2.json', baseDesign())]);
    expect(u.code).toBe(2); // --out is required
  });

  it('never writes outside the output folder and never evaluates input as code', async () => {
    const d = baseDesign();
    d.title = '<script>alert(1)</script>';
    const out = join(dir, 'report-esc');
    const r = await run(['evaluate', writeDesign('esc.json', d), '--out', out]);
    expect(r.code, r.err).toBe(0);
    expect(readdirSync(out).sort()).toEqual(['active-reflection.svg', 'efficiencies.svg', 'figures.json', 'pattern-cut.svg', 'report.html', 'sensitivity.svg', 'system-temperature.svg']);
    expect(readFileSync(join(out, 'report.html'), 'utf8')).not.toContain('<script>');
  });
});

describe('phasewise demo', () => {
  it('writes report.html, figures.json and parseable SVGs into the folder it names', async () => {
    const out = join(dir, 'demo');
    const r = await run(['demo', '--out', out]);
    expect(r.code, r.err).toBe(0);
    expect(r.out).toContain(out);
    const files = readdirSync(out);
    for (const f of ['report.html', 'figures.json', 'pattern-cut.svg', 'grating-lobes.svg', 'active-reflection.svg']) expect(files).toContain(f);
    for (const f of files.filter((x) => x.endsWith('.svg'))) expect(XMLValidator.validate(readFileSync(join(out, f), 'utf8')), f).toBe(true);
    const j = JSON.parse(readFileSync(join(out, 'figures.json'), 'utf8'));
    expect(j.elementCount).toBe(61);
    expect(j.beams.scanAngleDeg[0]).toBe(-40);
    expect(j.beams.scanAngleDeg.at(-1)).toBe(40);
    // A symmetric hexagonal array scanned in a symmetry plane: T_sys(−θ) = T_sys(θ).
    const b = j.frequencies[0].beams;
    expect(b[0].systemTemperatureK).toBeCloseTo(b.at(-1).systemTemperatureK, 8);
    // Grating-lobe diagram: 0.6 λ triangular lattice, the nearest grating circle centre lies 1/(0.6·sin 60°) from the origin.
    const c = j.gratingLobes.circles[0];
    expect(Math.hypot(c.u, c.v)).toBeCloseTo(1 / (0.6 * Math.sin(Math.PI / 3)), 3);
    // The amplifiers are noise-matched to the broadside active admittance, so broadside has the best
    // noise match and the best A_e/T_sys (Warnick & Jensen 2007, from memory), and the report says why.
    const nm = b.map((x: { noiseMatchingEfficiency: number }) => x.noiseMatchingEfficiency);
    const s = b.map((x: { sensitivityM2PerK: number }) => x.sensitivityM2PerK);
    const mid = j.beams.scanAngleDeg.indexOf(0);
    expect(nm[mid]).toBe(Math.max(...nm));
    expect(nm[mid]).toBeGreaterThan(0.95);
    expect(s[mid]).toBe(Math.max(...s));
    const html = readFileSync(join(out, 'report.html'), 'utf8');
    expect(b[mid].apertureEfficiency).toBeGreaterThan(1);
    expect(html).toContain('Why η_ap exceeds 1');
    expect(html).toContain('noise-matching efficiency is highest at beam at 0°');
    // The README's figure is this run's pattern cut, byte for byte (regenerate with `npm run docs:figures`).
    expect(readFileSync(join(out, 'pattern-cut.svg'), 'utf8')).toBe(readFileSync(join(__dirname, '../../docs/figures/demo-pattern.svg'), 'utf8'));
  });

  it('the showcase designs take Y_opt from the broadside active admittance, mean of 1/Σ_j Z_ij (to the 2 digits given)', () => {
    const file = join(__dirname, '../../examples/designs/l-band-feed.json');
    const designs = [validateDesign(demoDesign(), 'demo-design.json'), parseDesign(readFileSync(file, 'utf8'), file)];
    for (const d of designs) {
      const p = prepareDesign(d);
      const z = designPortsAt(p, p.frequenciesHz[0]).impedanceOhm, n = z.rows;
      let g = 0, bb = 0;
      for (let i = 0; i < n; i++) {
        let re = 0, im = 0;
        for (let k = 0; k < n; k++) { re += z.data[2 * (i * n + k)]; im += z.data[2 * (i * n + k) + 1]; }
        g += re / (re * re + im * im) / n; bb += -im / (re * re + im * im) / n;
      }
      const y = (d.amplifiers as { optimumSourceAdmittanceS: { re: number; im: number } }).optimumSourceAdmittanceS;
      expect(Math.abs(y.re - g)).toBeLessThan(0.00006);
      expect(Math.abs(y.im - bb)).toBeLessThan(0.00006);
    }
  });

  it('the sample design file shipped in examples/designs is valid', () => {
    const file = join(__dirname, '../../examples/designs/l-band-feed.json');
    const d = parseDesign(readFileSync(file, 'utf8'), file);
    expect(d.layout.kind).toBe('triangular');
    // Its stated physical area is the 19 triangular cells √3/2·d² (to the 5 digits given).
    expect(d.physicalAreaM2).toBeCloseTo(19 * (Math.sqrt(3) / 2) * 0.12 ** 2, 5);
  });

  it('help of every report subcommand carries an example', async () => {
    expect((await run(['--help'])).out).toContain('Examples:');
    for (const c of ['evaluate', 'demo']) {
      const h = await run([c, '--help']);
      expect(h.code).toBe(0);
      expect(h.out).toContain('Example:');
    }
  });
});
