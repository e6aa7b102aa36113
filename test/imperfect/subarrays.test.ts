import { describe, it, expect } from 'vitest';
import { uniformLineLayout, rectangularGridLayout } from '../../src/geometry/index.js';
import { C0_M_PER_S } from '../../src/units/index.js';
import { DomainError } from '../../src/errors.js';
import { gridSubarrays, beamSquint, bandSteeringWeights } from '../../src/imperfect/index.js';

const F0 = 3e9, LAM = C0_M_PER_S / F0;
const S0 = 0.5, DIR = [S0, 0, Math.sqrt(1 - S0 * S0)] as const;

describe('beam squint across the band', () => {
  const layout = uniformLineLayout(32, LAM / 2);
  const freqs = [2.6e9, 2.8e9, 3e9, 3.2e9, 3.4e9];
  it('phase steering: sin θ(f) = (f₀/f) sin θ₀ (identity of the fixed progressive phase)', () => {
    for (const p of beamSquint(layout, DIR, F0, freqs, 'phase')) expect(p.peakU).toBeCloseTo((S0 * F0) / p.frequencyHz, 7);
  });
  it('element time delay removes the squint and the gain loss', () => {
    for (const p of beamSquint(layout, DIR, F0, freqs, 'elementDelay')) {
      expect(p.peakU).toBeCloseTo(S0, 7);
      expect(p.gainLossDb).toBeLessThan(1e-9);
    }
  });
  it('subarray time delay keeps the pointing far closer than phase steering', () => {
    const sub = gridSubarrays({ countX: 32, countY: 1, spacingXM: LAM / 2, spacingYM: LAM / 2 }, 4);
    const ph = beamSquint(layout, DIR, F0, [2.6e9], 'phase')[0];
    const sd = beamSquint(layout, DIR, F0, [2.6e9], 'subarrayDelay', sub)[0];
    expect(Math.abs(sd.pointingErrorRad)).toBeLessThan(0.2 * Math.abs(ph.pointingErrorRad));
    expect(sd.gainLossDb).toBeLessThan(ph.gainLossDb);
  });
});

describe('gridSubarrays', () => {
  it('partition and centres equal the mean element position (identity)', () => {
    const grid = { countX: 8, countY: 6, spacingXM: 0.05, spacingYM: 0.04 };
    const sub = gridSubarrays(grid, 4, 3), lay = rectangularGridLayout(grid);
    expect(sub.count).toBe(4);
    for (let s = 0; s < sub.count; s++) {
      let x = 0, y = 0, c = 0;
      for (let n = 0; n < lay.count; n++) if (sub.index[n] === s) { x += lay.positionsM[3 * n]; y += lay.positionsM[3 * n + 1]; c++; }
      expect(c).toBe(12);
      expect(sub.centresM[3 * s]).toBeCloseTo(x / c, 12);
      expect(sub.centresM[3 * s + 1]).toBeCloseTo(y / c, 12);
    }
    expect(() => gridSubarrays(grid, 3)).toThrow(DomainError);
    expect(() => bandSteeringWeights(lay, DIR, F0, F0, 'subarrayDelay')).toThrow(DomainError);
  });
});
