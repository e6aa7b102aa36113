import { describe, it } from 'vitest';
import { brightnessCorrelations } from '../../src/reception/brightness.js';
import { wasmSettings } from '../../src/internal/wasm/runtime.js';
import type { QuadratureDirections, SampledPortPatterns } from '../../src/reception/patterns.js';
import { expectCMatrixClose, randomMatrix, seededRandom } from '../helpers/matchers.js';

describe('brightness integral: WebAssembly SIMD path and scalar fallback agree', () => {
  it('N = 13 ports, 301 directions, maps with zero-temperature directions, odd block size', () => {
    const n = 13, m = 301, rnd = seededRandom(41);
    const th = new Float64Array(m).map(() => Math.acos(2 * rnd() - 1)), ph = new Float64Array(m).map(() => 2 * Math.PI * rnd());
    const patterns: SampledPortPatterns = {
      thetaRad: th, phiRad: ph, driveCurrentA: 1, frequencyHz: 1e9,
      thetaComponentV: randomMatrix(n, m, 42), phiComponentV: randomMatrix(n, m, 43),
    };
    const quad: QuadratureDirections = { thetaRad: th, phiRad: ph, weightSr: new Float64Array(m).fill((4 * Math.PI) / m) };
    const maps = [new Float64Array(m).map((_, k) => (k % 4 === 0 ? 0 : 3 + 280 * rnd())), (t: number) => (t < 1 ? 10 : 290)];
    const simd = brightnessCorrelations(patterns, quad, maps, 1e6, { blockSize: 37 });
    wasmSettings.enabled = false;
    try {
      const scalar = brightnessCorrelations(patterns, quad, maps, 1e6, { blockSize: 37 });
      // same sums, weights applied as w·T on one side instead of √(w·T) on both: rounding only
      for (let t = 0; t < maps.length; t++) expectCMatrixClose(simd[t], scalar[t], { rtol: 1e-13 });
    } finally {
      wasmSettings.enabled = true;
    }
  });
});
