/**
 * Two polarisations in the design file (elements "crossedDipole"): two orthogonal one-mode
 * dipoles per position, both ports in the coupled network; the X/Y beam pair's Jones matrix,
 * IXR (Carozzi & Woan 2011) and Ludwig-3 cross-polar level per beam.
 */
import { describe, it, expect } from 'vitest';
import { evaluateDesign, prepareDesign, designPortsAt, validateDesign } from '../../src/design/index.js';
import { intrinsicCrossPolarizationRatio } from '../../src/imperfect/index.js';
import { reportFigureList } from '../../src/cli/report/figures.js';

const C0 = 299792458, F0 = 1.575e9, L0 = C0 / F0;

// A dual-polarised GNSS-band monitoring array of crossed half-wave dipoles λ/4 over ground.
function design(extra: Record<string, unknown> = {}): any {
  return {
    frequencyHz: F0, bandwidthHz: 2e6,
    layout: { kind: 'positions', positionsM: [[0, 0, 0]] },
    elements: { kind: 'crossedDipole', lengthM: 0.46 * L0, radiusM: L0 / 300, groundPlaneHeightM: L0 / 4 },
    amplifiers: { minimumNoiseTemperatureK: 50, noiseResistanceOhm: 6, optimumSourceAdmittanceS: 0.015 },
    environment: { skyK: 5, groundK: 290 },
    beams: { pointings: [0, 15, 30, 45, 60].map((t) => ({ thetaDeg: t, phiDeg: 45 })) },
    ...extra,
  };
}
const db = (x: number) => 10 * Math.log10(x);

describe('crossed-dipole designs: IXR and cross-polar level', () => {
  const one = evaluateDesign(validateDesign(design(), 'one.json'));
  const pol = one.frequencies[0].polarization!;
  it('one crossed pair: IXR infinite at broadside, ((1 + cos θ)/(1 − cos θ))² off axis in φ = 45° (geometric projection)', () => {
    // at φ = 45° both dipoles see the same angle to r̂, so J = g·[x̂ₜ; ŷₜ] (transverse projections, singular values 1 and cos θ)
    expect(pol.ixrDb[0]).toBe(300);
    [15, 30, 45, 60].forEach((t, i) => {
      const c = Math.cos((t * Math.PI) / 180);
      expect(pol.ixrDb[i + 1]).toBeCloseTo(db(((1 + c) / (1 - c)) ** 2), 8);
    });
    expect(one.failedChecks).toEqual([]);
  });
  it('the crossed pair is uncoupled (Z_XY = 0 by symmetry) and its ports are interleaved X, Y', () => {
    const z = designPortsAt(prepareDesign(validateDesign(design(), 'one.json')), F0).impedanceOhm;
    expect(z.rows).toBe(2);
    expect(Math.hypot(z.data[2], z.data[3])).toBe(0);
    expect(Math.abs(z.data[0] - z.data[6]) / z.data[0]).toBeLessThan(1e-12);
  });
  it('principal planes: no Ludwig-3 cross-polar component of a single pair (symmetry)', () => {
    const ev = evaluateDesign(validateDesign(design({ beams: { pointings: [{ thetaDeg: 40, phiDeg: 0 }, { thetaDeg: 40, phiDeg: 90 }] } }), 'pp.json'));
    const p = ev.frequencies[0].polarization!;
    p.crossPolarXDb.forEach((x) => expect(x).toBeLessThan(-200));
    p.crossPolarYDb.forEach((x) => expect(x).toBeLessThan(-200));
  });
  it('IXR invariance: raw IXR unchanged by U·J (U unitary), changed by a general C; IXR relative to a reference unchanged by C', () => {
    const j = Float64Array.from(pol.jones.flat());
    const apply = (m: number[], jj: Float64Array): Float64Array => {
      const out = new Float64Array(jj.length);
      for (let d = 0; d < jj.length / 8; d++) {
        for (let r = 0; r < 2; r++) for (let c = 0; c < 2; c++) {
          let re = 0, im = 0;
          for (let t = 0; t < 2; t++) {
            const ar = m[4 * r + 2 * t], ai = m[4 * r + 2 * t + 1], br = jj[8 * d + 4 * t + 2 * c], bi = jj[8 * d + 4 * t + 2 * c + 1];
            re += ar * br - ai * bi; im += ar * bi + ai * br;
          }
          out[8 * d + 4 * r + 2 * c] = re; out[8 * d + 4 * r + 2 * c + 1] = im;
        }
      }
      return out;
    };
    const a = 0.4, u = [Math.cos(a), 0, 0, -Math.sin(a), 0, -Math.sin(a), Math.cos(a), 0]; // unitary
    const cal = [1.3, 0.2, 0.4, -0.1, -0.2, 0.3, 0.8, 0]; // invertible, not unitary
    const raw = intrinsicCrossPolarizationRatio(j), rawU = intrinsicCrossPolarizationRatio(apply(u, j)), rawC = intrinsicCrossPolarizationRatio(apply(cal, j));
    for (let i = 1; i < raw.length; i++) {
      expect(Math.abs(rawU[i] - raw[i]) / raw[i]).toBeLessThan(1e-9);
      expect(Math.abs(rawC[i] - raw[i]) / raw[i]).toBeGreaterThan(1e-3);
    }
    const ref = intrinsicCrossPolarizationRatio(j, 2), refC = intrinsicCrossPolarizationRatio(apply(cal, j), 2);
    for (let i = 0; i < ref.length; i++) if (i !== 2) expect(Math.abs(refC[i] - ref[i]) / ref[i]).toBeLessThan(1e-9);
  });
});

describe('crossed-dipole arrays', () => {
  const arr = validateDesign(design({
    frequencyHz: [0.97 * F0, F0], layout: { kind: 'rectangular', countX: 3, countY: 3, spacingXM: 0.5 * L0, spacingYM: 0.5 * L0 },
    beams: { thetaDeg: [-40, 0, 20, 40], planePhiDeg: 45 },
    imperfections: { failures: { elements: [4], termination: 'matched' } },
  }), 'arr.json');
  const ev = evaluateDesign(arr);
  it('18 ports in the coupled network; a failed element fails both its ports; no check fails', () => {
    expect(ev.failures!.workingElementCount).toBe(8);
    expect(ev.frequencies[0].embeddedElementEfficiency.length).toBe(16);
    expect(ev.failedChecks).toEqual([]);
  });
  it('IXR per beam is that of the stored Jones matrices; the band summary holds the worst; the report draws it', () => {
    ev.frequencies.forEach((r) => r.polarization!.ixrDb.forEach((x, k) => {
      // 300 dB stands for an infinite IXR (the numerical limit)
      expect(x).toBeCloseTo(Math.min(300, db(intrinsicCrossPolarizationRatio(Float64Array.from(r.polarization!.jones[k]))[0])), 9);
    }));
    expect(ev.bandSummary[3].worstIxrDb).toBe(Math.min(...ev.frequencies.map((r) => r.polarization!.ixrDb[3])));
    // coupling and the array's asymmetry lower the IXR off broadside below the lone pair's projection
    expect(ev.frequencies[1].polarization!.ixrDb[3]).toBeGreaterThan(0);
    const files = reportFigureList(ev).map((f) => f.file);
    expect(files).toContain('ixr.svg');
    expect(files).toContain('cross-polar.svg');
    expect(files).toContain('polarization-sensitivity.svg');
  });
});

describe('crossed-dipole designs: sensitivity of each polarisation', () => {
  it('the X beam of a line of crossed dipoles equals the same line of x-dipoles alone (the Y ports are uncoupled and unweighted)', () => {
    // Along a line on x, X(i) and Y(j) are uncoupled by symmetry (the x-dipole's field has an odd
    // y-component about the line) and an open one-mode Y port carries no current, so the X beam
    // sees exactly the single-polarisation array: the identity below is exact, not a model fit.
    const line = { kind: 'line', count: 4, spacingM: 0.5 * L0, axis: 'x' };
    const beams = { planePhiDeg: 0, thetaDeg: [-30, 0, 20], beamformer: 'conjugate-field' };
    const crossed = evaluateDesign(validateDesign(design({ layout: line, beams }), 'crossed.json'));
    const single = evaluateDesign(validateDesign(design({
      layout: line, beams,
      elements: { kind: 'dipole', lengthM: 0.46 * L0, radiusM: L0 / 300, axis: [1, 0, 0], groundPlaneHeightM: L0 / 4 },
    }), 'single.json'));
    const pol = crossed.frequencies[0].polarization!;
    single.frequencies[0].beams.forEach((b, k) => {
      expect(Math.abs(pol.sensitivityXM2PerK[k] / b.sensitivityM2PerK - 1)).toBeLessThan(1e-9);
      expect(Math.abs(pol.sefdXJy[k] / b.sefdJy - 1)).toBeLessThan(1e-9);
    });
    // Optimality: the max-SNR beam over all 2N ports is at least as sensitive as either polarisation's beam.
    const best = evaluateDesign(validateDesign(design({ layout: line, beams: { planePhiDeg: 0, thetaDeg: [-30, 0, 20] } }), 'best.json'));
    best.frequencies[0].beams.forEach((b, k) => {
      expect(b.sensitivityM2PerK).toBeGreaterThanOrEqual(pol.sensitivityXM2PerK[k] * (1 - 1e-12));
      expect(b.sensitivityM2PerK).toBeGreaterThanOrEqual(pol.sensitivityYM2PerK[k] * (1 - 1e-12));
    });
    expect(crossed.failedChecks).toEqual([]);
  });
});
