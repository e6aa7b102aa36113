import { bench, describe } from 'vitest';
import { paraboloidReflector, cosinePowerFeed, secondaryPatternsPhysicalOptics, analyticFeedSource, type FeedPattern } from '../../src/reflector/index.js';
import { C0_M_PER_S } from '../../src/units/constants.js';

function sink(x: { thetaComponentV: { data: Float64Array } }): void {
  if (Number.isNaN(x.thetaComponentV.data[0])) throw new Error('NaN in benchmark output');
}

// 100 λ dish (λ = 1 m at c0 Hz), f/D = 0.4; 10 000 directions filling a cone of 5 beamwidths (θ ≤ 0.06 rad).
const dish = paraboloidReflector({ diameterM: 100, focalLengthM: 40 });
const m = 10_000;
const th = new Float64Array(m), ph = new Float64Array(m);
for (let i = 0; i < m; i++) { th[i] = 0.06 * Math.sqrt((i + 0.5) / m); ph[i] = i * 2.399963; }
const k = 2 * Math.PI;
const feeds: FeedPattern[] = Array.from({ length: 64 }, (_, n) => {
  const base = cosinePowerFeed(1.2);
  const dx = ((n % 8) - 3.5) * 0.6, dy = (Math.floor(n / 8) - 3.5) * 0.6;
  return (t, p) => {
    const v = base(t, p);
    const a = k * Math.sin(t) * (Math.cos(p) * dx + Math.sin(p) * dy);
    return { thetaRe: v.thetaRe * Math.cos(a), thetaIm: v.thetaRe * Math.sin(a), phiRe: v.phiRe * Math.cos(a), phiIm: v.phiRe * Math.sin(a) };
  };
});
const one = analyticFeedSource([feeds[0]], C0_M_PER_S);
const all = analyticFeedSource(feeds, C0_M_PER_S);

describe('reflector secondary patterns, 100 λ dish, 10 000 directions', () => {
  bench('one element, physical optics', () => { sink(secondaryPatternsPhysicalOptics(dish, one, th, ph)); }, { iterations: 3, warmupIterations: 1 });
  bench('64 elements, physical optics', () => { sink(secondaryPatternsPhysicalOptics(dish, all, th, ph)); }, { iterations: 1, warmupIterations: 0 });
});
