import { describe, it, expect } from 'vitest';
import { validateDesign, evaluateDesign } from '../../src/design/index.js';
import { DesignError } from '../../src/errors.js';
import { reportFigureList } from '../../src/cli/report/figures.js';

const base = {
  frequencyHz: { fromHz: 1.3e9, toHz: 1.5e9, count: 3 }, bandwidthHz: 1e6,
  layout: { kind: 'line', count: 4, spacingM: 0.1 },
  elements: { kind: 'dipole', lengthM: 0.1, radiusM: 5e-4, axis: [0, 1, 0], groundPlaneHeightM: 0.05 },
  environment: { skyK: 10, groundK: 290 },
  beams: { thetaDeg: [0, 30] },
  quadrature: { thetaCount: 24, phiCount: 48 },
};

describe('design imperfections block', () => {
  const design = validateDesign({ ...base, imperfections: { errors: { amplitudeDb: 0.5, phaseDeg: 6 }, phaseBits: 4, weightBits: 8 } }, 'imp.json');
  const ev = evaluateDesign(design);
  const imp = ev.imperfections!;
  it('phase steering squint: sin θ(f) = (f₀/f) sin θ₀ (identity), f₀ the centre band point', () => {
    expect(imp.designFrequencyHz).toBe(1.4e9);
    ev.frequenciesHz.forEach((f, i) => {
      const expected = (Math.asin((Math.sin(Math.PI / 6) * 1.4e9) / f) - Math.PI / 6) * 180 / Math.PI;
      expect(imp.beams[1].pointingErrorDeg[i]).toBeCloseTo(expected, 10);
      expect(imp.beams[0].pointingErrorDeg[i]).toBe(0);
    });
  });
  it('random-error directivity loss and floor: Ruze\'s closed form for N equal weights, (c²N² + (m − c²)N)/(N² m) and (m − c²)/N', () => {
    const n = 4, d = 10 ** (0.5 / 20) - 1, c2 = Math.exp(-(((6 * Math.PI) / 180) ** 2)), m = 1 + d * d;
    for (const b of imp.beams) {
      expect(b.directivityLossDb).toBeCloseTo(-10 * Math.log10((c2 * n * n + (m - c2) * n) / (n * n * m)), 10);
      expect(b.sidelobeFloorDb).toBeCloseTo(10 * Math.log10((m - c2) / n), 10);
    }
    expect(imp.phaseQuantizationLobeDb).toBeCloseTo(-20 * Math.log10(15), 12);
    expect(imp.beams[0].weightSidelobeFloorDb).toBeLessThan(-40);
  });
  it('the report draws the squint and the floors', () => {
    const files = reportFigureList(ev).map((f) => f.file);
    expect(files).toContain('beam-squint.svg');
    expect(files).toContain('imperfection-floors.svg');
  });
  it('time delay: no squint; bad fields are rejected', () => {
    const td = evaluateDesign(validateDesign({ ...base, imperfections: { steering: 'elementDelay' } }, 'td.json'));
    expect(td.imperfections!.beams[1].pointingErrorDeg.every((v) => v === 0)).toBe(true);
    expect(reportFigureList(td).map((f) => f.file)).toContain('beam-squint.svg');
    expect(() => validateDesign({ ...base, imperfections: { phaseBits: 0 } }, 'bad.json')).toThrow(DesignError);
    expect(() => validateDesign({ ...base, imperfections: { bits: 3 } }, 'bad.json')).toThrow(DesignError);
  });
});
