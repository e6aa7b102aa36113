/**
 * Failed elements in the design file (imperfections.failures): carried through the coupled
 * network at every band frequency. Physical identity: a one-mode induced-EMF dipole left open
 * carries no current, so the array with element k failed open equals the same design with
 * element k removed from the layout, figure by figure. A matched termination scatters (the
 * figures differ) and stays passive; the failure cost equals the intact design's figures.
 */
import { describe, it, expect } from 'vitest';
import { evaluateDesign, prepareDesign, designPortsAt, designLivePorts, validateDesign, type DesignEvaluation } from '../../src/design/index.js';
import { randomFailures } from '../../src/imperfect/index.js';
import { choleskyFactor } from '../../src/linalg/index.js';
import { DesignError } from '../../src/errors.js';
import { reportFigureList } from '../../src/cli/report/figures.js';

const C0 = 299792458;
const F0 = 1.42e9, L0 = C0 / F0;

// A student hydrogen-line array: five dipoles a half wavelength apart, λ/4 over ground.
function design(extra: Record<string, unknown> = {}): any {
  return {
    title: 'five-dipole hydrogen-line line array',
    frequencyHz: [0.95 * F0, F0],
    bandwidthHz: 1e6,
    layout: { kind: 'line', count: 5, spacingM: 0.5 * L0 },
    elements: { kind: 'dipole', lengthM: 0.47 * L0, radiusM: L0 / 300, axis: [0, 1, 0], groundPlaneHeightM: L0 / 4 },
    amplifiers: { minimumNoiseTemperatureK: 35, noiseResistanceOhm: 6, optimumSourceAdmittanceS: { re: 0.016, im: -0.003 } },
    environment: { skyK: 6, groundK: 290 },
    beams: { thetaDeg: [0, 25] },
    report: { frequenciesHz: [F0] },
    ...extra,
  };
}
const failed = (termination: Record<string, unknown>, elements = [1]) => design({ imperfections: { failures: { elements, ...termination } } });

/** Every number of a beam figure row, with its key. */
function numbers(o: object): Array<[string, number]> {
  return Object.entries(o).filter(([, v]) => typeof v === 'number') as Array<[string, number]>;
}
function close(a: number, b: number, rel: number, what: string): void {
  expect(Math.abs(a - b), what).toBeLessThanOrEqual(rel * Math.max(Math.abs(a), Math.abs(b), 1e-300));
}

describe('design failures: open element ≡ element removed (one-mode dipoles, identity)', () => {
  const withFailure = evaluateDesign(validateDesign(failed({ termination: 'open' }), 'open.json'));
  const positions = prepareDesign(validateDesign(design(), 'd.json')).layout.positionsM;
  const keptPositions = [0, 2, 3, 4].map((i) => Array.from(positions.subarray(3 * i, 3 * i + 3)));
  const removed = evaluateDesign(validateDesign(design({ layout: { kind: 'positions', positionsM: keptPositions } }), 'removed.json'));

  it('every beam figure, T_rec,min, embedded efficiencies, integration errors and checks agree to 1e-10', () => {
    expect(withFailure.failures).toEqual({ failedElements: [1], workingElementCount: 4, termination: 'open' });
    withFailure.frequencies.forEach((r, i) => {
      const s = removed.frequencies[i];
      expect(r.quadrature).toEqual(s.quadrature);
      r.beams.forEach((b, k) => { for (const [key, v] of numbers(b)) close(v, (s.beams[k] as any)[key], 1e-10, `${key}, beam ${k}, f ${r.frequencyHz}`); });
      // integration errors are differences of nearly equal figures: compare them on the scale of T_sys
      r.integrationErrors.forEach((e, k) => { for (const [key, v] of numbers(e)) expect(Math.abs(v - (s.integrationErrors[k] as any)[key]), key).toBeLessThan(1e-10 * r.beams[k].systemTemperatureK); });
      close(r.minimumReceiverTemperatureK as number, s.minimumReceiverTemperatureK as number, 1e-10, 'T_rec,min');
      r.embeddedElementEfficiency.forEach((x, j) => close(x, s.embeddedElementEfficiency[j], 1e-10, 'embedded efficiency'));
      const own = r.checks.filter((c) => !c.name.startsWith('intactArray.'));
      expect(own.map((c) => c.name)).toEqual(s.checks.map((c) => c.name));
      expect(own.every((c) => c.passed)).toBe(true);
    });
    expect(withFailure.failedChecks).toEqual([]);
  });
  it('pattern cuts and active reflection agree (elements named by their layout index)', () => {
    const r = withFailure.frequencies[1], s = removed.frequencies[1];
    r.patternCuts!.forEach((c, j) => c.valueDb.forEach((v, i) => expect(Math.abs(v - s.patternCuts![j].valueDb[i])).toBeLessThan(1e-8)));
    const names = { 0: 0, 1: 2, 2: 3, 3: 4 } as Record<number, number>;
    r.activeReflection!.forEach((t, j) => {
      expect(t.element).toBe(names[s.activeReflection![j].element]);
      t.re.forEach((x, i) => close(x, s.activeReflection![j].re[i], 1e-10, 'Re Γ'));
      t.im.forEach((x, i) => close(x, s.activeReflection![j].im[i], 1e-10, 'Im Γ'));
    });
  });
  it('failure cost = the intact design\'s figures against the remaining array\'s', () => {
    const intact = evaluateDesign(validateDesign(design(), 'intact.json'));
    withFailure.frequencies.forEach((r, i) => r.failureCost!.forEach((c, k) => {
      const a = intact.frequencies[i].beams[k], b = r.beams[k];
      close(c.intactSensitivityM2PerK, a.sensitivityM2PerK, 1e-12, 'intact A_e/T_sys');
      close(c.intactGainOverTemperatureDbPerK, a.gainOverTemperatureDbPerK, 1e-12, 'intact G/T');
      close(c.sensitivityLossDb, 10 * Math.log10(a.sensitivityM2PerK / b.sensitivityM2PerK), 1e-10, 'loss');
      // ΔG/T in dB equals the A_e/T_sys loss (same λ): identity of the G/T definition
      close(c.sensitivityLossDb, a.gainOverTemperatureDbPerK - b.gainOverTemperatureDbPerK, 1e-9, 'ΔG/T');
      close(c.systemTemperatureChangeK, b.systemTemperatureK - a.systemTemperatureK, 1e-10, 'ΔT_sys');
    }));
    const worst = Math.max(...withFailure.frequencies.map((r) => r.failureCost![0].sensitivityLossDb));
    expect(withFailure.bandSummary[0].worstFailureLossDb).toBe(worst);
  });
});

describe('design failures: matched and amplifier terminations', () => {
  const open = evaluateDesign(validateDesign(failed({ termination: 'open' }), 'open.json'));
  const matched = evaluateDesign(validateDesign(failed({ termination: 'matched', referenceOhm: 50 }), 'matched.json'));
  it('a matched load scatters: figures differ from the open case; no check fails', () => {
    const a = open.frequencies[1].beams[0], b = matched.frequencies[1].beams[0];
    expect(Math.abs(a.sensitivityM2PerK - b.sensitivityM2PerK) / a.sensitivityM2PerK).toBeGreaterThan(1e-3);
    expect(matched.failedChecks).toEqual([]);
    // the load dissipates: loss noise appears and η_rad < 1
    expect(b.lossTemperatureK).toBeGreaterThan(0);
    expect(b.radiationEfficiency).toBeLessThan(1);
  });
  it('the working ports\' Z stays passive (Cholesky of (Z + Zᴴ)/2), reciprocal, and keeps every position for the sphere rule', () => {
    const p = prepareDesign(validateDesign(failed({ termination: 'matched' }), 'm.json'));
    const all = designPortsAt(p, F0);
    const live = designLivePorts(p, all);
    const z = live.impedanceOhm, n = z.rows;
    expect(n).toBe(4);
    const h = { rows: n, cols: n, data: new Float64Array(2 * n * n) };
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      const a = 2 * (i * n + j), b = 2 * (j * n + i);
      h.data[a] = 0.5 * (z.data[a] + z.data[b]); h.data[a + 1] = 0.5 * (z.data[a + 1] - z.data[b + 1]);
      close(z.data[a], z.data[b], 1e-12, 'reciprocity Re'); close(z.data[a + 1], z.data[b + 1], 1e-12, 'reciprocity Im');
    }
    expect(choleskyFactor(h).positiveDefinite).toBe(true);
    expect(live.geometry!.positionsM.length).toBe(15);
  });
  it('amplifier input impedance: a reactive load keeps the array lossless (Twiss check passes), a resistive one does not', () => {
    const reactive = evaluateDesign(validateDesign(failed({ termination: 'amplifier', amplifierInputOhm: { re: 0, im: -40 } }), 'x.json'));
    expect(reactive.failedChecks).toEqual([]);
    expect(reactive.frequencies[1].beams[0].lossTemperatureK / reactive.frequencies[1].beams[0].systemTemperatureK).toBeLessThan(1e-3);
    const lossy = evaluateDesign(validateDesign(failed({ termination: 'amplifier', amplifierInputOhm: { re: 15, im: -40 } }), 'y.json'));
    expect(lossy.failedChecks).toEqual([]);
    expect(lossy.frequencies[1].beams[0].lossTemperatureK).toBeGreaterThan(0.01);
  });
});

describe('design failures: random fraction, report and errors', () => {
  it('a seeded fraction picks randomFailures(N, fraction, seed)', () => {
    const d = validateDesign(design({ layout: { kind: 'line', count: 12, spacingM: 0.5 * L0 }, imperfections: { failures: { fraction: 0.25, seed: 9, termination: 'open' } } }), 'f.json');
    expect(Array.from(prepareDesign(d).failedElements!)).toEqual(Array.from(randomFailures(12, 0.25, 9)));
  });
  it('the report draws the failure cost', () => {
    const ev: DesignEvaluation = evaluateDesign(validateDesign(failed({ termination: 'open' }), 'open.json'));
    const fig = reportFigureList(ev).find((f) => f.file === 'failure-cost.svg');
    expect(fig).toBeDefined();
    expect(fig!.svg).toContain('dB');
  });
  it('bad fields are named', () => {
    const msg = (x: unknown) => { try { validateDesign(x, 'bad.json'); return ''; } catch (e) { expect(e).toBeInstanceOf(DesignError); return (e as Error).message; } };
    expect(msg(design({ imperfections: { failures: { termination: 'open' } } }))).toContain('imperfections.failures.elements');
    expect(msg(design({ imperfections: { failures: { elements: [1, 1], termination: 'open' } } }))).toContain('imperfections.failures.elements[1]');
    expect(msg(design({ imperfections: { failures: { elements: [1], termination: 'amplifier' } } }))).toContain('imperfections.failures.amplifierInputOhm');
    expect(msg(design({ imperfections: { failures: { elements: [1], termination: 'amplifier', amplifierInputOhm: -5 } } }))).toContain('passive');
    expect(msg(design({ imperfections: { failures: { elements: [1], termination: 'shorted' } } }))).toContain('imperfections.failures.termination');
    expect(() => prepareDesign(validateDesign(failed({ termination: 'open' }, [7]), 'x.json'))).toThrow(/imperfections\.failures\.elements\[0\].*below 5/);
    expect(() => prepareDesign(validateDesign(failed({ termination: 'open' }, [0, 1, 2, 3, 4]), 'x.json'))).toThrow(/at least one working element/);
  });
});
