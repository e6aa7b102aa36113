/**
 * Subarrays and time delay in the design file (imperfections.subarrays, steering): beam pointing,
 * gain loss and subarray-lattice lobes per beam across the band, against closed forms for a
 * uniform line of S subarrays of P elements. With element weights w_n = exp(j[k₀u₀(x_n − c_s) +
 * k u₀ c_s]) the array factor factors (geometric series) into
 * |AF(u)| = |D_S(k(u − u₀)Pd)|·|D_P((ku − k₀u₀)d)|, D_M(z) = sin(Mz/2)/sin(z/2);
 * phase steering is P = N, S = 1 (sin θ(f) = (f₀/f)·sin θ₀), element delay P = 1 (no squint).
 */
import { describe, it, expect } from 'vitest';
import { evaluateDesign, validateDesign, prepareDesign } from '../../src/design/index.js';
import { DesignError } from '../../src/errors.js';
import { reportFigureList } from '../../src/cli/report/figures.js';

const C0 = 299792458, F0 = 3e9, L0 = C0 / F0, N = 32, P = 4, S = N / P, D = L0 / 2;
const BAND = [0.8 * F0, 0.9 * F0, F0, 1.1 * F0, 1.2 * F0];
const SCAN = [0, 20, 40];

// An S-band line of 32 elements for a wideband tracking receiver, subarrays of 4.
function design(imperfections: Record<string, unknown>, layout: Record<string, unknown> = { kind: 'line', count: N, spacingM: D }): any {
  return {
    frequencyHz: BAND, bandwidthHz: 1e6, layout,
    elements: { kind: 'dipole', lengthM: 0.45 * L0 * 0.8, radiusM: L0 / 400, axis: [0, 1, 0], groundPlaneHeightM: L0 / 4 },
    amplifiers: { minimumNoiseTemperatureK: 40, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.02 },
    environment: { skyK: 10, groundK: 290 },
    beams: { thetaDeg: SCAN }, quadrature: { thetaCount: 24, phiCount: 48 },
    report: { frequenciesHz: [F0] },
    imperfections,
  };
}

const dirichlet = (m: number, z: number) => (Math.abs(Math.sin(z / 2)) < 1e-14 ? m : Math.sin((m * z) / 2) / Math.sin(z / 2));
/** |AF(u)|² of the factored line (P elements per subarray, S subarrays) at f. */
function power(u: number, u0: number, f: number, p: number, s: number): number {
  const k = (2 * Math.PI * f) / C0, k0 = (2 * Math.PI * F0) / C0;
  return (dirichlet(s, k * (u - u0) * p * D) * dirichlet(p, (k * u - k0 * u0) * D)) ** 2;
}
/** Peak of |AF|² near u0 by a fine scan and golden refinement (independent of the library's search). */
function peak(u0: number, f: number, p: number, s: number): { u: number; power: number } {
  let best = u0, bp = -1;
  for (let i = -4000; i <= 4000; i++) {
    const u = u0 + (i * 0.2) / 4000;
    if (Math.abs(u) <= 1 && power(u, u0, f, p, s) > bp) { bp = power(u, u0, f, p, s); best = u; }
  }
  let lo = best - 1e-4, hi = best + 1e-4;
  for (let it = 0; it < 100; it++) {
    const a = lo + (hi - lo) / 3, b = hi - (hi - lo) / 3;
    if (power(a, u0, f, p, s) > power(b, u0, f, p, s)) hi = b; else lo = a;
  }
  const u = (lo + hi) / 2;
  return { u, power: power(u, u0, f, p, s) };
}

describe('design subarrays and time delay: closed forms of the factored line', () => {
  const phase = evaluateDesign(validateDesign(design({ steering: 'phase' }), 'phase.json')).imperfections!;
  const element = evaluateDesign(validateDesign(design({ steering: 'elementDelay' }), 'td.json')).imperfections!;
  const sub = evaluateDesign(validateDesign(design({ steering: 'subarrayDelay', subarrays: { perX: P } }), 'sub.json')).imperfections!;

  it('phase steering: pointing sin θ(f) = (f₀/f) sin θ₀; gain loss = −10 log10(D_N(x)²/N²), x = (k − k₀)u₀d', () => {
    SCAN.forEach((deg, j) => {
      const u0 = Math.sin((deg * Math.PI) / 180);
      BAND.forEach((f, i) => {
        expect(phase.beams[j].pointingErrorDeg[i]).toBeCloseTo(((Math.asin((u0 * F0) / f) - Math.asin(u0)) * 180) / Math.PI, 10);
        const k = (2 * Math.PI * f) / C0, k0 = (2 * Math.PI * F0) / C0;
        expect(phase.beams[j].gainLossDb![i]).toBeCloseTo(-10 * Math.log10(dirichlet(N, (k - k0) * u0 * D) ** 2 / (N * N)), 9);
      });
    });
  });
  it('element delay: no squint and no gain loss at any frequency (identity)', () => {
    for (const b of element.beams) {
      expect(b.pointingErrorDeg.every((v) => v === 0)).toBe(true);
      b.gainLossDb!.forEach((g) => expect(Math.abs(g)).toBeLessThan(1e-9));
    }
  });
  it('subarray delay: pointing and gain loss of the factored form; squint between element delay and phase', () => {
    SCAN.forEach((deg, j) => {
      const u0 = Math.sin((deg * Math.PI) / 180);
      BAND.forEach((f, i) => {
        const pk = peak(u0, f, P, S);
        expect(Math.abs(sub.beams[j].pointingErrorDeg[i]! - ((Math.asin(pk.u) - Math.asin(u0)) * 180) / Math.PI)).toBeLessThan(1e-5);
        expect(sub.beams[j].gainLossDb![i]).toBeCloseTo(-10 * Math.log10(power(u0, u0, f, P, S) / (N * N)), 8);
        if (deg > 0 && f !== F0) {
          expect(Math.abs(sub.beams[j].pointingErrorDeg[i]!)).toBeLessThan(Math.abs(phase.beams[j].pointingErrorDeg[i]!));
          expect(sub.beams[j].gainLossDb![i]).toBeLessThan(phase.beams[j].gainLossDb![i]);
        }
      });
    });
  });
  it('subarray lobes: S²·D_P(x_m)² at u_m = u₀ + mλ/(Pd) relative to the peak; nulls at f₀', () => {
    expect(sub.subarrays).toMatchObject({ count: S, perX: P, perY: 1, periodM: [P * D, null] });
    SCAN.forEach((deg, j) => {
      const u0 = Math.sin((deg * Math.PI) / 180);
      BAND.forEach((f, i) => {
        const lam = C0 / f, pk = peak(u0, f, P, S);
        let best = -Infinity;
        for (let m = -20; m <= 20; m++) {
          const u = u0 + (m * lam) / (P * D);
          if (m !== 0 && Math.abs(u) < 1) best = Math.max(best, power(u, u0, f, P, S));
        }
        const level = sub.beams[j].subarrayLobeDb![i]!;
        // at f₀, and at broadside for any f, the weights are those of an equal-amplitude line: exact nulls
        if (f === F0 || deg === 0) expect(level).toBeLessThan(-100);
        else expect(level).toBeCloseTo(10 * Math.log10(best / pk.power), 6);
      });
    });
  });
  it('the report draws pointing, gain loss and subarray lobes versus frequency', () => {
    const ev = evaluateDesign(validateDesign(design({ steering: 'subarrayDelay', subarrays: { perX: P } }), 'sub.json'));
    const files = reportFigureList(ev).map((f) => f.file);
    for (const f of ['beam-squint.svg', 'steering-gain-loss.svg', 'subarray-lobes.svg']) expect(files).toContain(f);
  });
});

describe('design subarrays: rectangular layouts and errors', () => {
  it('a rectangular layout is cut into perX × perY blocks (gridSubarrays order)', () => {
    const p = prepareDesign(validateDesign(design({ subarrays: { perX: 2, perY: 2 } }, { kind: 'rectangular', countX: 4, countY: 4, spacingXM: D, spacingYM: D }), 'r.json'));
    expect(p.subarrays!.count).toBe(4);
    expect(Array.from(p.subarrays!.index.slice(0, 8))).toEqual([0, 0, 1, 1, 0, 0, 1, 1]);
  });
  it('bad fields are named', () => {
    const fails = (imp: Record<string, unknown>, layout?: Record<string, unknown>, field = 'imperfections.subarrays') => {
      expect(() => prepareDesign(validateDesign(design(imp, layout), 'bad.json'))).toThrow(DesignError);
      try { prepareDesign(validateDesign(design(imp, layout), 'bad.json')); } catch (e) { expect((e as Error).message).toContain(field); }
    };
    fails({ steering: 'subarrayDelay' });
    fails({ subarrays: { perX: 5 } });
    fails({ subarrays: { perX: 4, perY: 2 } }, undefined, 'imperfections.subarrays.perY');
    fails({ subarrays: { perX: 2 } }, { kind: 'triangular', spacingM: D, boundary: { kind: 'circle', radiusM: 2 * D } });
    fails({ steering: 'trueDelay' }, undefined, 'imperfections.steering');
  });
});
