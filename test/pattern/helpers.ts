/** Reference (textbook, unoptimised) array factor used by the pattern tests. */
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import type { ArrayLayout } from '../../src/geometry/layout.js';

/** AF(r̂) = Σ conj(wₙ) exp(j k r̂·rₙ), one cos/sin pair per term, no masking tricks. */
export function referenceArrayFactor(layout: ArrayLayout, w: CMatrix, dirs: Float64Array, k: number): Float64Array {
  const m = dirs.length / 3, out = new Float64Array(2 * m), p = layout.positionsM;
  for (let j = 0; j < m; j++) {
    let re = 0, im = 0;
    for (let n = 0; n < layout.count; n++) {
      if (layout.enabled && !layout.enabled[n]) continue;
      const ph = k * (dirs[3 * j] * p[3 * n] + dirs[3 * j + 1] * p[3 * n + 1] + dirs[3 * j + 2] * p[3 * n + 2]);
      const wr = w.data[2 * n], wi = -w.data[2 * n + 1];
      re += wr * Math.cos(ph) - wi * Math.sin(ph);
      im += wr * Math.sin(ph) + wi * Math.cos(ph);
    }
    out[2 * j] = re;
    out[2 * j + 1] = im;
  }
  return out;
}

/** max |a − b| / max |b| over interleaved complex arrays. */
export function relativeMaxError(a: Float64Array, b: Float64Array): number {
  let e = 0, s = 0;
  for (let i = 0; i < a.length; i += 2) {
    e = Math.max(e, Math.hypot(a[i] - b[i], a[i + 1] - b[i + 1]));
    s = Math.max(s, Math.hypot(b[i], b[i + 1]));
  }
  return e / s;
}
