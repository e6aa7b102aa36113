/**
 * Wire elements in the design file (elements: {kind: "wire", …}): the example design across its
 * 2:1 band, identity with the direct reception API, the Twiss identity on its junction-rich
 * element over ground, and field-named errors.
 */
import { describe, it, expect } from 'vitest';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { designPortsAt, evaluateDesign, evaluateDesignFrequency, parseDesign, prepareDesign, validateDesign } from '../../src/design/index.js';
import { evaluateReceivingArray, skyAndGroundEnvironment, brightnessCorrelation, isotropicBrightness, quadratureDirections } from '../../src/reception/index.js';
import { placeWireElement, wireArrayPorts, type WireStructure } from '../../src/wire/index.js';
import { rectangularGridLayout, sphereQuadrature } from '../../src/geometry/index.js';
import { thermalImpedanceNoise } from '../../src/network/noise.js';
import { DesignError } from '../../src/errors.js';
import { expectCMatrixClose } from '../helpers/matchers.js';

const file = join(__dirname, '../../examples/designs/fan-dipole-tile.json');
const text = readFileSync(file, 'utf8');

describe('design file with wire elements: examples/designs/fan-dipole-tile.json', () => {
  const design = parseDesign(text, file);
  const e = design.elements as Extract<typeof design.elements, { kind: 'wire' }>;

  it('spans a 2:1 band and evaluates at every frequency; each point equals the direct reception API (to 1e-12)', () => {
    const ev = evaluateDesign(design, { fileName: file });
    expect(ev.frequenciesHz[ev.frequenciesHz.length - 1] / ev.frequenciesHz[0]).toBeCloseTo(2, 12);
    expect(ev.frequencies.length).toBe(8);
    expect(ev.failedChecks).toEqual([]);
    expect(ev.frequencies[0].checks.some((c) => c.name === 'wire.passivity')).toBe(true);
    for (const fr of ev.frequencies) for (const b of fr.beams) expect(Number.isFinite(b.gainOverTemperatureDbPerK)).toBe(true);
    // direct: the same element placed by the wire module, the same reception inputs
    const k = 3, f = ev.frequenciesHz[k];
    const template: WireStructure = { wires: e.wires, ports: [e.port] };
    const layout = rectangularGridLayout({ countX: 3, countY: 3, spacingXM: 0.11, spacingYM: 0.11 });
    const beams = { thetaRad: Float64Array.of(0, Math.PI / 6, Math.PI / 6), phiRad: Float64Array.of(0, 0, Math.PI / 2) };
    const direct = evaluateReceivingArray({
      ports: wireArrayPorts(placeWireElement(template, layout, { heightM: 0.06 }), f, { groundPlane: { zM: 0 } }),
      quadrature: sphereQuadrature(24, 48), bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 10, groundK: 290 }),
      amplifiers: { minimumNoiseTemperatureK: 30, noiseResistanceOhm: 6, optimumSourceAdmittanceS: { re: 0.012, im: -0.004 } },
      physicalTemperatureK: 290, loss: 'lossless', beams, physicalAreaM2: design.physicalAreaM2,
    });
    direct.beams.forEach((b, i) => {
      const got = ev.frequencies[k].beams[i];
      for (const [key, value] of Object.entries(b)) {
        if (typeof value !== 'number') continue;
        expect(Math.abs((got as unknown as Record<string, number>)[key] - value), key).toBeLessThanOrEqual(1e-12 * Math.abs(value));
      }
    });
  });

  it('Twiss identity for the fan-dipole tile over ground at the top of the band (junctions of six wires)', () => {
    // conventions "thermal noise" = "brightness noise" at uniform T for a lossless array (Twiss 1955, from memory)
    const prepared = prepareDesign(design, { fileName: file });
    const f = prepared.frequenciesHz[prepared.frequenciesHz.length - 1];
    const ports = designPortsAt(prepared, f);
    const q = quadratureDirections(sphereQuadrature(48, 96, { splitAtHorizon: true }));
    expectCMatrixClose(brightnessCorrelation(ports.patterns, q, isotropicBrightness(50), 1e6), thermalImpedanceNoise(ports.impedanceOhm, 50, 1e6), { rtol: 1e-7 });
  });
});

describe('design-file wire elements: errors name the field', () => {
  const base = JSON.parse(text);
  const bad = (mutate: (d: any) => void): DesignError => {
    const d = JSON.parse(JSON.stringify(base));
    mutate(d);
    try { evaluateDesignFrequency(prepareDesign(validateDesign(d, 'bad.json'), { fileName: 'bad.json' }), 0); } catch (err) { if (err instanceof DesignError) return err; throw err; }
    throw new Error('expected a DesignError');
  };
  it('a port on a wire that does not exist', () => {
    expect(bad((d) => { d.elements.port.wire = 40; }).message).toMatch(/elements\.port\.wire/);
  });
  it('elements that overlap their neighbours (spacing smaller than the element)', () => {
    const err = bad((d) => { d.layout.spacingXM = 0.05; });
    expect(err.message).toMatch(/field "elements"/);
    expect(err.message).toMatch(/elements \d+ and \d+/);
  });
  it('segments shorter than the radius at the top of the band', () => {
    expect(bad((d) => { d.elements.wires[0].radiusM = 0.004; }).message).toMatch(/shorter than the wire radius/);
  });
});
