import { bench, describe } from 'vitest';
import { latticeLayout } from '../../src/geometry/builders.js';
import { dolphChebyshevTaper } from '../../src/taper/chebyshev.js';
import { circularTaylorTaper } from '../../src/taper/circularTaylor.js';
import { taylorTaper } from '../../src/taper/taylor.js';
import { baylissTaper } from '../../src/taper/bayliss.js';

function sink(w: Float64Array): void {
  for (let i = 0; i < w.length; i += 97) if (Number.isNaN(w[i])) throw new Error('NaN weight');
}

for (const n of [64, 500, 2000]) {
  describe(`line tapers N=${n}`, () => {
    bench('dolphChebyshevTaper 60 dB', () => { sink(dolphChebyshevTaper(n, 60)); });
    bench('dolphChebyshevTaper 120 dB', () => { sink(dolphChebyshevTaper(n, 120)); });
    bench('taylorTaper 40 dB, n̄ = 8', () => { sink(taylorTaper(n, 40, 8).weights); });
    bench('baylissTaper 35 dB, n̄ = 6', () => { sink(baylissTaper(n, 35, 6).weights); });
  });
}

describe('circularTaylorTaper, 4000-element square grid clipped to a circle', () => {
  // Square grid of 1 m spacing clipped to radius 35.7 m: 4001 elements (built untimed).
  const r = 35.7;
  const layout = latticeLayout([1, 0], [0, 1], { kind: 'circle', radiusM: r });
  bench(`${layout.count} elements, 35 dB, n̄ = 6`, () => { sink(circularTaylorTaper(layout, r + 0.5, 35, 6).weights); });
});
