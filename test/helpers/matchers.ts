/**
 * Shared test helpers: the one CMatrix closeness check and seeded random inputs.
 */
import { expect } from 'vitest';
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import { adjoint, frobeniusNorm, multiply } from '../../src/linalg/ops.js';

/** Options of {@link expectCMatrixClose}. */
export interface CloseOptions {
  /** Relative tolerance against ‖expected‖_F. */
  rtol?: number;
  /** Absolute tolerance. */
  atol?: number;
}

/** Asserts ‖actual − expected‖_F ≤ atol + rtol·‖expected‖_F and equal shapes. */
export function expectCMatrixClose(actual: CMatrix, expected: CMatrix, opts: CloseOptions = {}): void {
  const { rtol = 1e-12, atol = 0 } = opts;
  expect([actual.rows, actual.cols]).toEqual([expected.rows, expected.cols]);
  let diff = 0;
  for (let k = 0; k < actual.data.length; k++) {
    const d = actual.data[k] - expected.data[k];
    diff += d * d;
  }
  diff = Math.sqrt(diff);
  const bound = atol + rtol * frobeniusNorm(expected);
  if (!(diff <= bound)) {
    throw new Error(`CMatrix mismatch: ‖actual − expected‖_F = ${diff.toExponential(3)} > ${bound.toExponential(3)} (rtol ${rtol}, atol ${atol})`);
  }
}

export { seededRandom, randomMatrix, randomHpd } from './random.js';
import { seededRandom } from './random.js';

/**
 * Largest distance ‖P − P_ref‖_F between the projectors X_c X_cᴴ built from
 * matching column clusters of `actual` and `reference` eigen/singular vector
 * matrices, each distance divided by the bound `slack·ε·scale / gap_c`
 * (Davis–Kahan sin θ theorem: a perturbation of size ε‖A‖ moves an invariant
 * subspace by O(ε‖A‖/gap), gap = distance of the cluster to the rest of the
 * spectrum). `values` are sorted (ascending or descending); columns whose
 * values differ by less than `clusterTol` form one cluster; clusters whose
 * values are all ≤ `skipBelow` (e.g. zero singular values) are not compared.
 * Returns the worst ratio; ≤ 1 passes. Phase- and sign-invariant by design.
 */
export function subspaceMismatch(
  actual: CMatrix, reference: CMatrix, values: ArrayLike<number>,
  opts: { clusterTol: number; scale: number; slack?: number; skipBelow?: number },
): number {
  const { clusterTol, scale, slack = 100, skipBelow = -Infinity } = opts;
  const k = values.length, m = actual.rows;
  let worst = 0;
  let start = 0;
  while (start < k) {
    let end = start + 1;
    while (end < k && Math.abs(values[end] - values[end - 1]) < clusterTol) end++;
    let gap = Infinity;
    if (start > 0) gap = Math.min(gap, Math.abs(values[start] - values[start - 1]));
    if (end < k) gap = Math.min(gap, Math.abs(values[end] - values[end - 1]));
    let allSmall = true;
    for (let c = start; c < end; c++) if (Math.abs(values[c]) > skipBelow) allSmall = false;
    if (!allSmall && gap !== Infinity) {
      let diff = 0;
      for (let i = 0; i < m; i++) {
        for (let j = 0; j < m; j++) {
          let re = 0, im = 0;
          for (let c = start; c < end; c++) {
            const ar = actual.data[2 * (i * actual.cols + c)], ai = actual.data[2 * (i * actual.cols + c) + 1];
            const br = actual.data[2 * (j * actual.cols + c)], bi = actual.data[2 * (j * actual.cols + c) + 1];
            const cr = reference.data[2 * (i * reference.cols + c)], ci = reference.data[2 * (i * reference.cols + c) + 1];
            const dr = reference.data[2 * (j * reference.cols + c)], di = reference.data[2 * (j * reference.cols + c) + 1];
            re += ar * br + ai * bi - (cr * dr + ci * di);
            im += ai * br - ar * bi - (ci * dr - cr * di);
          }
          diff += re * re + im * im;
        }
      }
      const bound = (slack * Number.EPSILON * scale) / gap;
      worst = Math.max(worst, Math.sqrt(diff) / Math.max(bound, 1e-300));
    }
    start = end;
  }
  return worst;
}

/** Residual ‖A V − V diag(λ)‖_F for eigenpairs stored as columns (λ real). */
export function eigenResidual(a: CMatrix, v: CMatrix, values: ArrayLike<number>): number {
  const av = multiply(a, v);
  const k = v.cols;
  let s = 0;
  for (let i = 0; i < v.rows; i++) {
    for (let j = 0; j < k; j++) {
      const p = 2 * (i * k + j);
      const re = av.data[p] - values[j] * v.data[p];
      const im = av.data[p + 1] - values[j] * v.data[p + 1];
      s += re * re + im * im;
    }
  }
  return Math.sqrt(s);
}

/** ‖Xᴴ M X − I‖_F (M = identity when omitted): orthonormality of the columns of X in the M inner product. */
export function orthonormalityError(x: CMatrix, m?: CMatrix): number {
  const g = multiply(adjoint(x), m ? multiply(m, x) : x);
  const k = g.rows;
  let s = 0;
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      const p = 2 * (i * k + j);
      const re = g.data[p] - (i === j ? 1 : 0), im = g.data[p + 1];
      s += re * re + im * im;
    }
  }
  return Math.sqrt(s);
}

/** M unit vectors uniform over the sphere (z uniform in [−1, 1], φ uniform), xyz-interleaved. */
export function randomUnitVectors(m: number, seed: number): Float64Array {
  const rnd = seededRandom(seed), d = new Float64Array(3 * m);
  for (let i = 0; i < m; i++) {
    const z = 2 * rnd() - 1, p = 2 * Math.PI * rnd(), s = Math.sqrt(1 - z * z);
    d[3 * i] = s * Math.cos(p);
    d[3 * i + 1] = s * Math.sin(p);
    d[3 * i + 2] = z;
  }
  return d;
}
