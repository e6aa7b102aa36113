import { afterEach, describe, expect, it } from 'vitest';
import { arrayLayout, rectangularGridLayout, withEnabledMask, type ArrayLayout } from '../../src/geometry/index.js';
import { arrayFactor } from '../../src/pattern/index.js';
import { planArrayFactor } from '../../src/pattern/kernel.js';
import { wasmSettings } from '../../src/internal/wasm/runtime.js';
import { wavenumberRadPerM, C0_M_PER_S } from '../../src/units/index.js';
import { randomMatrix, randomUnitVectors, seededRandom } from '../helpers/matchers.js';
import { referenceArrayFactor, relativeMaxError } from './helpers.js';

const F = 3e9;
const K = wavenumberRadPerM(F);
const L = C0_M_PER_S / F;

/** A full nx × ny grid with spacings dx, dy, its first element at `origin`, in the plane spanned by axes a (columns) and b (rows). */
function grid(nx: number, ny: number, dx: number, dy: number, origin: [number, number, number], a = 0, b = 1): ArrayLayout {
  const pts: Array<[number, number, number]> = [];
  for (let j = 0; j < ny; j++) {
    for (let i = 0; i < nx; i++) {
      const p: [number, number, number] = [...origin];
      p[a] += i * dx;
      p[b] += j * dy;
      pts.push(p);
    }
  }
  return arrayLayout(pts);
}

describe('array factor of a full grid on the SIMD grid sum (mirror-paired bilinear form)', () => {
  afterEach(() => { wasmSettings.enabled = true; });

  const rnd = seededRandom(5);
  const cases: Array<[string, ArrayLayout]> = [
    ['32×32 centred λ/2 grid (the benchmark case)', rectangularGridLayout({ countX: 32, countY: 32, spacingXM: L / 2, spacingYM: L / 2 })],
    ['9×5 odd counts, unequal spacings', rectangularGridLayout({ countX: 9, countY: 5, spacingXM: 0.7 * L, spacingYM: 0.45 * L })],
    ['40×3: columns past one re-seed period (20 pairs)', grid(40, 3, 0.5 * L, 0.8 * L, [0, 0, 0])],
    ['70×2 off-centre: three re-seeds and a centre phase', grid(70, 2, 0.31 * L, 0.6 * L, [1.3 * L, -0.4 * L, 0])],
    ['single row of 11', grid(11, 1, 0.5 * L, 0.5 * L, [0, 0, 0])],
    ['6×7 grid in the plane y = 0.9λ (columns on z, rows on x)', grid(6, 7, 0.55 * L, 0.5 * L, [0.2 * L, 0.9 * L, -0.3 * L], 2, 0)],
    ['16×12 thinned by a mask', withEnabledMask(rectangularGridLayout({ countX: 16, countY: 12, spacingXM: 0.5 * L, spacingYM: 0.6 * L }), Array.from({ length: 192 }, () => (rnd() < 0.7 ? 1 : 0)))],
  ];

  for (const [label, layout] of cases) {
    it(`${label}: equals the element-by-element sum to 1e-13 of max |AF|, and the scalar path to 1e-13`, () => {
      // the layout must take the grid-sum path for this test to mean anything
      expect(planArrayFactor(layout.positionsM).gridShape).not.toBeNull();
      const dirs = randomUnitVectors(257, 31); // odd count: the last pair repeats its direction in the spare lane
      const w = randomMatrix(layout.count, 1, 41);
      const af = arrayFactor(layout, w, dirs, F);
      // independent reference: one cos/sin pair per element and direction
      expect(relativeMaxError(af.data, referenceArrayFactor(layout, w, dirs, K))).toBeLessThan(1e-13);
      wasmSettings.enabled = false;
      const scalar = arrayFactor(layout, w, dirs, F);
      expect(relativeMaxError(af.data, scalar.data)).toBeLessThan(1e-13);
    });
  }

  it('a steered uniform grid peaks at N in the steering direction and is Hermitian-symmetric: AF(−r̂) = conj AF(r̂) for real weights', () => {
    // physical identities: wᴴa(r̂₀) = Σ|aₙ|² = N for w = a(r̂₀); for real w, a(−r̂) = conj a(r̂)
    const layout = rectangularGridLayout({ countX: 12, countY: 10, spacingXM: 0.5 * L, spacingYM: 0.5 * L });
    const d0: [number, number, number] = [Math.sin(0.4) * Math.cos(1.1), Math.sin(0.4) * Math.sin(1.1), Math.cos(0.4)];
    const w = randomMatrix(layout.count, 1, 3);
    const dirs = randomUnitVectors(64, 9);
    const both = new Float64Array(6 * 64);
    both.set(dirs);
    for (let i = 0; i < 3 * 64; i++) both[3 * 64 + i] = -dirs[i];
    const real = { rows: layout.count, cols: 1, data: w.data.map((v, i) => (i % 2 ? 0 : v)) };
    const af = arrayFactor(layout, real, both, F);
    for (let m = 0; m < 64; m++) {
      expect(Math.abs(af.data[2 * m] - af.data[2 * (64 + m)])).toBeLessThan(1e-12 * layout.count);
      expect(Math.abs(af.data[2 * m + 1] + af.data[2 * (64 + m) + 1])).toBeLessThan(1e-12 * layout.count);
    }
    const steer = new Float64Array(3 * 40);
    for (let m = 0; m < 40; m++) steer.set(d0, 3 * m);
    const pointed = arrayFactor(layout, { rows: layout.count, cols: 1, data: referenceSteering(layout, d0) }, steer, F);
    for (let m = 0; m < 40; m++) {
      expect(Math.abs(pointed.data[2 * m] - layout.count)).toBeLessThan(1e-12 * layout.count);
      expect(Math.abs(pointed.data[2 * m + 1])).toBeLessThan(1e-12 * layout.count);
    }
  });
});

/** aₙ = exp(+j k r̂·rₙ), written out here so the test does not depend on the library's steering vector. */
function referenceSteering(layout: ArrayLayout, d: [number, number, number]): Float64Array {
  const out = new Float64Array(2 * layout.count), p = layout.positionsM;
  for (let n = 0; n < layout.count; n++) {
    const ph = K * (d[0] * p[3 * n] + d[1] * p[3 * n + 1] + d[2] * p[3 * n + 2]);
    out[2 * n] = Math.cos(ph);
    out[2 * n + 1] = Math.sin(ph);
  }
  return out;
}
