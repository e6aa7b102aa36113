/**
 * Allocation-free dense complex solves over a stack of small matrices
 * (one per frequency, per beam, …). No argument checks.
 *
 * Storage: interleaved re/im, row-major; matrix k of a stack of n×n matrices
 * starts at complex offset k·n·n. Offsets below are counted in complex
 * elements and doubled inside.
 *
 * Method: Gaussian elimination with partial (row) pivoting, the same
 * algorithm as `luFactor` in src/linalg/lu.ts (Golub & Van Loan, *Matrix
 * Computations*, 4th ed., 2013, Alg. 3.4.1) but done in place, without the
 * condition estimate, and with a cheap singularity test: a pivot of modulus
 * ≤ n·ε·max|aᵢⱼ| is treated as zero.
 * @internal
 * @module
 */

/**
 * Solves A X = B in place for one n×n matrix A (destroyed: overwritten by its
 * LU factors) and an n×m right-hand side B (overwritten by X).
 * @returns −1 on success, otherwise the elimination step at which A was found
 * singular (X is then unspecified).
 */
export function solveSmallInPlace(
  n: number, m: number,
  a: Float64Array, offA: number,
  b: Float64Array, offB: number,
): number {
  const a0 = 2 * offA;
  const b0 = 2 * offB;
  const n2 = 2 * n;
  const m2 = 2 * m;
  let amax = 0;
  for (let q = a0; q < a0 + 2 * n * n; q += 2) {
    const v = Math.abs(a[q]) + Math.abs(a[q + 1]);
    if (v > amax) amax = v;
  }
  const tiny = n * Number.EPSILON * amax;
  for (let k = 0; k < n; k++) {
    // pivot search in column k
    let p = k;
    let best = -1;
    for (let i = k; i < n; i++) {
      const q = a0 + i * n2 + 2 * k;
      const v = Math.abs(a[q]) + Math.abs(a[q + 1]);
      if (v > best) { best = v; p = i; }
    }
    if (!(best > tiny)) return k;
    if (p !== k) {
      const rk = a0 + k * n2, rp = a0 + p * n2;
      for (let j = 0; j < n2; j++) { const t = a[rk + j]; a[rk + j] = a[rp + j]; a[rp + j] = t; }
      const sk = b0 + k * m2, sp = b0 + p * m2;
      for (let j = 0; j < m2; j++) { const t = b[sk + j]; b[sk + j] = b[sp + j]; b[sp + j] = t; }
    }
    const kk = a0 + k * n2 + 2 * k;
    const pr = a[kk], pi = a[kk + 1];
    const den = pr * pr + pi * pi;
    const ir = pr / den, ii = -pi / den;
    const rk = a0 + k * n2;
    const bk = b0 + k * m2;
    for (let i = k + 1; i < n; i++) {
      const q = a0 + i * n2 + 2 * k;
      const lr = a[q] * ir - a[q + 1] * ii;
      const li = a[q] * ii + a[q + 1] * ir;
      if (lr === 0 && li === 0) continue;
      const ri = a0 + i * n2;
      for (let j = 2 * (k + 1); j < n2; j += 2) {
        const ur = a[rk + j], ui = a[rk + j + 1];
        a[ri + j] -= lr * ur - li * ui;
        a[ri + j + 1] -= lr * ui + li * ur;
      }
      const bi = b0 + i * m2;
      for (let j = 0; j < m2; j += 2) {
        const ur = b[bk + j], ui = b[bk + j + 1];
        b[bi + j] -= lr * ur - li * ui;
        b[bi + j + 1] -= lr * ui + li * ur;
      }
    }
  }
  // back substitution with U
  for (let k = n - 1; k >= 0; k--) {
    const kk = a0 + k * n2 + 2 * k;
    const pr = a[kk], pi = a[kk + 1];
    const den = pr * pr + pi * pi;
    const ir = pr / den, ii = -pi / den;
    const bk = b0 + k * m2;
    for (let j = 0; j < m2; j += 2) {
      let sr = b[bk + j], si = b[bk + j + 1];
      for (let l = k + 1; l < n; l++) {
        const q = a0 + k * n2 + 2 * l;
        const ur = a[q], ui = a[q + 1];
        const xr = b[b0 + l * m2 + j], xi = b[b0 + l * m2 + j + 1];
        sr -= ur * xr - ui * xi;
        si -= ur * xi + ui * xr;
      }
      b[bk + j] = sr * ir - si * ii;
      b[bk + j + 1] = sr * ii + si * ir;
    }
  }
  return -1;
}

/**
 * For each k < count solves A_k X_k = B_k in place (A_k n×n destroyed, B_k
 * n×m overwritten by X_k), the matrices stacked contiguously in `a` and `b`.
 * @returns −1 on success, otherwise the first stack index k whose A_k is singular.
 */
export function batchedSolveInPlace(n: number, m: number, count: number, a: Float64Array, b: Float64Array): number {
  for (let k = 0; k < count; k++) {
    if (solveSmallInPlace(n, m, a, k * n * n, b, k * n * m) >= 0) return k;
  }
  return -1;
}

/**
 * Transposes (no conjugation) every n×n matrix of a stack in place.
 */
export function batchedTransposeInPlace(n: number, count: number, a: Float64Array): void {
  for (let k = 0; k < count; k++) {
    const o = 2 * k * n * n;
    for (let i = 0; i < n; i++) {
      for (let j = i + 1; j < n; j++) {
        const p = o + 2 * (i * n + j), q = o + 2 * (j * n + i);
        let t = a[p]; a[p] = a[q]; a[q] = t;
        t = a[p + 1]; a[p + 1] = a[q + 1]; a[q + 1] = t;
      }
    }
  }
}
