/**
 * Printed forms of the reception and design results, and their plain data across JSON, structured
 * clone (the worker-thread transfer of src/cli/parallel.ts) and structural equality.
 */
import { F0, D, LEN, A, H, fourDipoleLine } from '../helpers/designs.js';
import { describe, it, expect } from 'vitest';
import { inspect } from 'node:util';
import {
  evaluateDesign, validateDesign, evaluateReceivingArray, dipoleArrayPorts, skyAndGroundEnvironment, sphereQuadrature,
  show, resultFromJSON, restoreDisplay, prepareDesign, evaluateDesignFrequency, assembleDesignEvaluation, type DesignEvaluation,
} from '../../src/index.js';

const design = validateDesign(fourDipoleLine({ title: 'four dipoles over ground' }), 'line.json');

describe('design evaluation', () => {
  const ev = evaluateDesign(design, { fileName: 'line.json' });
  it('prints title, size, band, a per-beam summary table with units, and the checks', () => {
    const text = inspect(ev);
    const lines = text.split('\n');
    expect(lines[0]).toBe('Design evaluation "four dipoles over ground" (line.json)');
    expect(lines[1]).toBe('  4 elements, max-snr beams, bandwidth 1 MHz');
    expect(lines[2]).toBe('  band 3 frequencies: 1.26 GHz … 1.54 GHz');
    expect(text).toContain('worst A_e/T_sys [m²/K]');
    expect(text).toContain('worst G/T [dB/K]');
    expect(text).toContain('worst SEFD [Jy]');
    expect(text).toContain('0: scan −30°');
    // the worst sensitivity of the broadside beam, as the table prints it
    const w = ev.bandSummary[1].worstSensitivityM2PerK;
    expect(text).toContain(w.toExponential(3));
    expect(text).toContain('checks: every figure passed its physical checks');
  });
  it('each frequency prints its beams as a table', () => {
    const text = inspect(ev.frequencies[1]);
    expect(text).toMatch(/^Frequency evaluation at 1\.4 GHz: sky 8 K, T_rec,min [\d.]+ K/);
    expect(text).toContain('T_sys [K]');
    expect(text).toMatch(/10 physical checks, all passed|\d+ physical checks, all passed/);
  });
  it('the data are plain: JSON round trip, structured clone (worker transfer) and equality', () => {
    const back = resultFromJSON(JSON.stringify(ev)) as DesignEvaluation;
    expect(back).toEqual(ev);
    expect(inspect(back)).toBe(inspect(ev));
    // a report's figures.json, written as src/cli/commands/evaluate.ts writes it, reads back the same way
    const report = resultFromJSON(JSON.stringify({ format: 'phasewise-report', version: '0', ...ev }, null, 1)) as DesignEvaluation;
    expect(inspect(report)).toBe(inspect(ev));
    expect(report.frequencies).toEqual(ev.frequencies);
    const cloned = structuredClone(ev);
    expect(cloned).toEqual(ev);
    expect(show(cloned)).toBe(show(ev));
    expect(JSON.stringify(cloned)).toBe(JSON.stringify(ev));
  });
});

describe('results that crossed a worker thread', () => {
  it('assembleDesignEvaluation gives structured-cloned frequencies their printed form again', () => {
    const prepared = prepareDesign(design, { fileName: 'line.json' });
    const direct = prepared.frequenciesHz.length;
    const local = Array.from({ length: direct }, (_, i) => evaluateDesignFrequency(prepared, i));
    const transferred = local.map((r) => structuredClone(r)); // what workerpool's postMessage does
    expect(inspect(transferred[0].beams[0])).not.toMatch(/^Beam figures/);
    const ev = assembleDesignEvaluation(prepared, transferred);
    expect(ev).toEqual(assembleDesignEvaluation(prepared, local));
    expect(inspect(ev.frequencies[0])).toBe(inspect(local[0]));
    expect(inspect(ev.frequencies[0].beams[0])).toMatch(/^Beam figures/);
  });
  it('restoreDisplay leaves the data unchanged and prints them again', () => {
    const ev = evaluateDesign(design, { fileName: 'line.json' });
    const back = restoreDisplay(structuredClone(ev));
    expect(back).toEqual(ev);
    expect(inspect(back.frequencies[1].beams[2])).toBe(inspect(ev.frequencies[1].beams[2]));
  });
});

describe('receiving-array evaluation', () => {
  const dipoles = Array.from({ length: 4 }, (_, i) => ({ centerM: [(i - 1.5) * D, 0, H] as const, axis: [0, 1, 0] as const, lengthM: LEN, radiusM: A }));
  const r = evaluateReceivingArray({
    ports: dipoleArrayPorts(dipoles, F0, { groundPlane: { zM: 0 } }),
    quadrature: sphereQuadrature(20, 40),
    bandwidthHz: 1e6,
    environment: skyAndGroundEnvironment({ skyK: 8, groundK: 290 }),
    amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.02 },
    beams: { thetaRad: Float64Array.of(0, 0.5), phiRad: Float64Array.of(0, Math.PI / 2) },
  });
  it('prints ports, beams, T_rec,min, the beam table and checks', () => {
    const text = inspect(r);
    expect(text.split('\n')[0]).toMatch(/^Receiving-array evaluation: 4 ports, 2 beams, T_rec,min [\d.]+ K$/);
    expect(text).toContain('A_e/T_sys [m²/K]');
    expect(text).toContain('embeddedElementEfficiency  [');
    expect(text).toContain('800 directions');
    expect(text).toMatch(/physical checks, all passed/);
    // JSON writes −0 as 0 (the budget's zero imaginary parts), so compare the JSON text and the types
    const back = resultFromJSON(JSON.stringify(r)) as typeof r;
    expect(JSON.stringify(back)).toBe(JSON.stringify(r));
    expect(back.weights.data).toBeInstanceOf(Float64Array);
    expect(back.budget.total.data).toBeInstanceOf(Float64Array);
    expect(back.quadrature.weightSr).toBeInstanceOf(Float64Array);
    expect(inspect(back)).toBe(text);
    const b = inspect(r.beams[0]);
    expect(b).toMatch(/systemTemperatureK\s+[\d.]+ K/);
    expect(b).toMatch(/effectiveAreaM2\s+[\d.e−-]+ m²/);
  });
});
