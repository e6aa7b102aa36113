/**
 * The array-factor summation kernel shared by the pattern functions.
 *
 * AF(r̂) = Σₙ conj(wₙ) exp(j k r̂·rₙ) is evaluated either
 * - plainly: one cos/sin pair per element and direction; or
 * - factored: when the positions take few distinct values along one axis
 *   ("columns") and few distinct values across the other two ("rows"), as on
 *   any lattice, exp(j k r̂·rₙ) = E_col(n)·E_row(n) exactly; per direction the
 *   column and row tables cost one cos/sin pair per distinct value — or one
 *   complex multiplication per value when the values form an arithmetic
 *   progression (a recurrence re-seeded with a direct cos/sin every 16 steps,
 *   so its rounding stays below ~20 ulp) — and the sum costs one complex
 *   multiply-add per element.
 * The cheaper of the two is chosen from a simple cost model.
 * A full grid (every row holds every column, both on progressions) pairs each
 * column with its mirror and each row with its mirror; on WebAssembly SIMD the
 * sum is then the bilinear form xᵀ B y of real cos/sin tables (`gridsumWasm.ts`),
 * and `evaluateFullGrid` below is the scalar path.
 * @internal
 * @module
 */

import { PHASE_RESEED as RESEED, pairedColumns, pairedHalf, simdGridSum, type GridSumShape } from '../internal/gridsumWasm.js';

/** Directions from which the SIMD grid sum pays for copying its weight matrix. */
const GRID_SUM_MIN_DIRECTIONS = 32;


/** Precomputed summation plan of one layout. */
export interface ArrayFactorPlan {
  readonly count: number;
  readonly factored: boolean;
  /** Grouped position g → element index. */
  readonly order: Int32Array;
  /** Plain path: positions in grouped order (xyz-interleaved). */
  readonly positions: Float64Array;
  /** Axis permutation: inner (column) axis a, row axes b and c. */
  readonly axisA: number;
  readonly axisB: number;
  readonly axisC: number;
  /** Distinct a-values (ascending), progression step or NaN. */
  readonly colValues: Float64Array;
  readonly colStep: number;
  /** Column index of each grouped element. */
  readonly colIndex: Int32Array;
  /** Row starts (length rows + 1) in grouped order. */
  readonly rowStart: Int32Array;
  /** b and c coordinate of each row. */
  readonly rowB: Float64Array;
  readonly rowC: Float64Array;
  /** All rows share one c value (then rows are sorted by b). */
  readonly planar: boolean;
  /** Progression step of rowB when planar, else NaN. */
  readonly rowStep: number;
  /**
   * Every row holds every column and the columns form a progression: the sum
   * then pairs columns c and D−1−c, symmetric about the mid value x̄, so that
   * wₐ e^{jδ} + w_b e^{−jδ} = (wₐ + w_b) cos δ + j (wₐ − w_b) sin δ
   * halves the multiplications (exact).
   */
  readonly fullGrid: boolean;
  /**
   * A full grid whose rows also form a progression in one plane: the SIMD
   * grid sum applies (both axes mirror-paired); its shape, else null.
   */
  readonly gridShape: GridSumShape | null;
}

function progressionStep(v: Float64Array): number {
  const d = v.length;
  if (d === 1) return 0;
  const step = (v[d - 1] - v[0]) / (d - 1);
  const tol = 1e-13 * Math.max(Math.abs(v[0]), Math.abs(v[d - 1]), Math.abs(step));
  for (let i = 1; i < d - 1; i++) if (Math.abs(v[i] - (v[0] + i * step)) > tol) return NaN;
  return step;
}

function distinct(values: Float64Array): Float64Array {
  return Float64Array.from(new Set(values)).sort();
}

/** Builds the plan of a layout (positions xyz-interleaved, N ≥ 1). */
export function planArrayFactor(positionsM: Float64Array): ArrayFactorPlan {
  const n = positionsM.length / 3;
  const coord = [0, 1, 2].map((a) => {
    const c = new Float64Array(n);
    for (let i = 0; i < n; i++) c[i] = positionsM[3 * i + a];
    return c;
  });
  const counts = coord.map((c) => new Set(c).size);
  const axisA = counts.indexOf(Math.max(...counts));
  const rest = [0, 1, 2].filter((a) => a !== axisA);
  const [axisC, axisB] = counts[rest[0]] <= counts[rest[1]] ? [rest[0], rest[1]] : [rest[1], rest[0]];
  const ca = coord[axisA], cb = coord[axisB], cc = coord[axisC];
  const colValues = distinct(ca);
  const colStep = progressionStep(colValues);
  const colOf = new Map<number, number>();
  colValues.forEach((v, i) => colOf.set(v, i));
  const planar = counts[axisC] === 1;
  // rows keyed by (b, c)
  const rowKey = new Map<string, number>();
  const rowsB: number[] = [], rowsC: number[] = [];
  const rowOfElem = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const key = `${cb[i]}|${cc[i]}`;
    let r = rowKey.get(key);
    if (r === undefined) { r = rowsB.length; rowKey.set(key, r); rowsB.push(cb[i]); rowsC.push(cc[i]); }
    rowOfElem[i] = r;
  }
  const rowCount = rowsB.length;
  // sort rows by (c, b)
  const rowPerm = Array.from({ length: rowCount }, (_, r) => r).sort((p, q) => rowsC[p] - rowsC[q] || rowsB[p] - rowsB[q]);
  const rowRank = new Int32Array(rowCount);
  rowPerm.forEach((r, i) => { rowRank[r] = i; });
  const rowB = Float64Array.from(rowPerm.map((r) => rowsB[r]));
  const rowC = Float64Array.from(rowPerm.map((r) => rowsC[r]));
  const rowStep = planar ? progressionStep(rowB) : NaN;
  const elems = Array.from({ length: n }, (_, i) => i).sort((p, q) => rowRank[rowOfElem[p]] - rowRank[rowOfElem[q]] || ca[p] - ca[q]);
  const order = Int32Array.from(elems);
  const colIndex = new Int32Array(n);
  const rowStart = new Int32Array(rowCount + 1);
  const positions = new Float64Array(3 * n);
  for (let g = 0; g < n; g++) {
    const i = order[g];
    colIndex[g] = colOf.get(ca[i])!;
    rowStart[rowRank[rowOfElem[i]] + 1]++;
    positions[3 * g] = positionsM[3 * i];
    positions[3 * g + 1] = positionsM[3 * i + 1];
    positions[3 * g + 2] = positionsM[3 * i + 2];
  }
  for (let r = 0; r < rowCount; r++) rowStart[r + 1] += rowStart[r];
  const colCost = Number.isNaN(colStep) ? 8 * colValues.length : colValues.length;
  const rowCost = Number.isNaN(rowStep) ? 8 * rowCount : rowCount;
  const factored = colCost + rowCost + 1.5 * n < 8 * n;
  let fullGrid = factored && !Number.isNaN(colStep) && colValues.length >= 2 && rowCount * colValues.length === n;
  for (let g = 0; fullGrid && g < n; g++) fullGrid = colIndex[g] === g % colValues.length;
  const gridShape: GridSumShape | null = fullGrid && planar && !Number.isNaN(rowStep) ? {
    cols: colValues.length, colStep, rows: rowCount, rowStep, axisA, axisB, axisC,
    midA: 0.5 * (colValues[0] + colValues[colValues.length - 1]), midB: 0.5 * (rowB[0] + rowB[rowCount - 1]), planeC: rowC[0],
  } : null;
  return { count: n, factored, order, positions, axisA, axisB, axisC, colValues, colStep, colIndex, rowStart, rowB, rowC, planar, rowStep, fullGrid, gridShape };
}

/** Fills re/im with exp(j(s·values[i] + offset)), by recurrence when `step` is a number. */
function fillPhases(re: Float64Array, im: Float64Array, values: Float64Array, s: number, offset: number, step: number, at = 0): void {
  const d = values.length;
  if (Number.isNaN(step)) {
    for (let i = 0; i < d; i++) {
      const ph = s * values[i] + offset;
      re[at + i] = Math.cos(ph);
      im[at + i] = Math.sin(ph);
    }
    return;
  }
  const cs = Math.cos(s * step), sn = Math.sin(s * step);
  let zr = 0, zi = 0;
  for (let i = 0; i < d; i++) {
    if (i % RESEED === 0) {
      const ph = s * values[i] + offset;
      zr = Math.cos(ph);
      zi = Math.sin(ph);
    } else {
      const t = zr * cs - zi * sn;
      zi = zr * sn + zi * cs;
      zr = t;
    }
    re[at + i] = zr;
    im[at + i] = zi;
  }
}

/** Work buffers of the factored kernel. */
export interface KernelWork {
  colRe: Float64Array;
  colIm: Float64Array;
  rowRe: Float64Array;
  rowIm: Float64Array;
  cwRe: Float64Array;
  cwIm: Float64Array;
  /** Full-grid path: pair sums P = wₐ + w_b and differences Q = wₐ − w_b, interleaved [Pr, Pi, Qr, Qi] per (row, pair). */
  pairs: Float64Array;
  /** Full-grid path: half-table of cos δ, sin δ for four directions. */
  half: Float64Array;
  /** Grid-sum path: the paired weight matrix B, nx rows of pairedColumns(ny) entries [re, im]. */
  gridB: Float64Array;
}

/** Allocates the work buffers of a plan. */
export function kernelWork(plan: ArrayFactorPlan): KernelWork {
  const nc = plan.colValues.length, nr = plan.rowB.length;
  return {
    colRe: new Float64Array(nc), colIm: new Float64Array(nc),
    rowRe: new Float64Array(plan.fullGrid ? 4 * nr : nr), rowIm: new Float64Array(plan.fullGrid ? 4 * nr : nr),
    cwRe: new Float64Array(plan.count), cwIm: new Float64Array(plan.count),
    pairs: new Float64Array(plan.fullGrid ? 4 * nr * Math.floor(nc / 2) : 0),
    half: new Float64Array(plan.fullGrid ? 8 * Math.floor(nc / 2) : 0),
    gridB: new Float64Array(plan.gridShape === null ? 0 : 2 * nc * pairedColumns(nr)),
  };
}

/**
 * Table slots of value c of an axis with `count` values in the mirror-paired
 * table [cos φ_0 … cos φ_{h−1}, (1 if odd), sin φ_0 … sin φ_{h−1}], φ_i the
 * i-th phase outward from the middle: e^{jφ(c)} = cos-slot term + j·sign·sin-slot term
 * (sin slot −1 for the middle value of an odd count).
 */
function pairedSlots(count: number, c: number): { cosSlot: number; sinSlot: number; sign: number } {
  const { h, odd } = pairedHalf(count);
  if (odd && c === h) return { cosSlot: h, sinSlot: -1, sign: 0 };
  const upper = c >= h + odd;
  const i = upper ? c - h - odd : h - 1 - c;
  return { cosSlot: i, sinSlot: h + odd + i, sign: upper ? 1 : -1 };
}

/**
 * The paired weight matrix B of the grid sum: AF = m · Σ_ab x_a B[a, b] y_b,
 * each weight W[r, c] adding W·(x-coefficient)·(y-coefficient) to the (at most)
 * four entries its column and row slots name; j·W and −W are exact.
 */
function loadGridMatrix(plan: ArrayFactorPlan, work: KernelWork): void {
  const shape = plan.gridShape!;
  const d = shape.cols, rows = shape.rows, nyp = pairedColumns(2 * (rows >> 1) + (rows & 1));
  const b = work.gridB;
  b.fill(0);
  const add = (a: number, col: number, re: number, im: number): void => {
    b[2 * (a * nyp + col)] += re;
    b[2 * (a * nyp + col) + 1] += im;
  };
  for (let r = 0; r < rows; r++) {
    const y = pairedSlots(rows, r);
    for (let c = 0; c < d; c++) {
      const x = pairedSlots(d, c);
      const wr = work.cwRe[r * d + c], wi = work.cwIm[r * d + c];
      add(x.cosSlot, y.cosSlot, wr, wi);
      if (x.sinSlot >= 0) add(x.sinSlot, y.cosSlot, -x.sign * wi, x.sign * wr);
      if (y.sinSlot >= 0) add(x.cosSlot, y.sinSlot, -y.sign * wi, y.sign * wr);
      if (x.sinSlot >= 0 && y.sinSlot >= 0) add(x.sinSlot, y.sinSlot, -x.sign * y.sign * wr, -x.sign * y.sign * wi);
    }
  }
}

/**
 * Loads conj(w)·mask in grouped order into work.cwRe/cwIm.
 * `w` is interleaved re/im of length 2N in element order.
 */
export function loadWeights(plan: ArrayFactorPlan, work: KernelWork, w: Float64Array, enabled?: Uint8Array): void {
  for (let g = 0; g < plan.count; g++) {
    const i = plan.order[g];
    const on = enabled === undefined || enabled[i] ? 1 : 0;
    work.cwRe[g] = on * w[2 * i];
    work.cwIm[g] = -on * w[2 * i + 1];
  }
  if (plan.fullGrid) {
    const d = plan.colValues.length, h = d >> 1, rows = plan.rowB.length;
    for (let r = 0; r < rows; r++) {
      for (let c = 0; c < h; c++) {
        const a = r * d + c, b = r * d + d - 1 - c, o = 4 * (r * h + c);
        work.pairs[o] = work.cwRe[a] + work.cwRe[b];
        work.pairs[o + 1] = work.cwIm[a] + work.cwIm[b];
        work.pairs[o + 2] = work.cwRe[a] - work.cwRe[b];
        work.pairs[o + 3] = work.cwIm[a] - work.cwIm[b];
      }
    }
  }
  if (plan.gridShape !== null) loadGridMatrix(plan, work);
}

/**
 * AF for directions[3m…] (m in [m0, m1)) written to out[2m], out[2m+1].
 * `k` is the wavenumber [rad/m]; weights must be loaded first.
 */
export function evaluateArrayFactor(
  plan: ArrayFactorPlan, work: KernelWork, directions: Float64Array, k: number, out: Float64Array, m0: number, m1: number,
): void {
  const { cwRe, cwIm } = work;
  const n = plan.count;
  if (!plan.factored) {
    const p = plan.positions;
    for (let m = m0; m < m1; m++) {
      const ux = k * directions[3 * m], uy = k * directions[3 * m + 1], uz = k * directions[3 * m + 2];
      let ar = 0, ai = 0;
      for (let g = 0; g < n; g++) {
        const ph = ux * p[3 * g] + uy * p[3 * g + 1] + uz * p[3 * g + 2];
        const c = Math.cos(ph), s = Math.sin(ph);
        const wr = cwRe[g], wi = cwIm[g];
        ar += wr * c - wi * s;
        ai += wr * s + wi * c;
      }
      out[2 * m] = ar;
      out[2 * m + 1] = ai;
    }
    return;
  }
  if (plan.gridShape !== null && m1 - m0 >= GRID_SUM_MIN_DIRECTIONS && simdGridSum(plan.gridShape, work.gridB, directions, k, out, m0, m1)) return;
  if (plan.fullGrid) {
    evaluateFullGrid(plan, work, directions, k, out, m0, m1);
    return;
  }
  const { colRe, colIm, rowRe, rowIm } = work;
  const { colIndex, rowStart, rowB, rowC, colValues, colStep, rowStep, planar, axisA, axisB, axisC } = plan;
  const rows = rowB.length;
  const c0 = rowC[0];
  for (let m = m0; m < m1; m++) {
    const sa = k * directions[3 * m + axisA], sb = k * directions[3 * m + axisB], sc = k * directions[3 * m + axisC];
    fillPhases(colRe, colIm, colValues, sa, 0, colStep);
    if (planar) {
      fillPhases(rowRe, rowIm, rowB, sb, sc * c0, rowStep);
    } else {
      for (let r = 0; r < rows; r++) {
        const ph = sb * rowB[r] + sc * rowC[r];
        rowRe[r] = Math.cos(ph);
        rowIm[r] = Math.sin(ph);
      }
    }
    let accR = 0, accI = 0;
    for (let r = 0; r < rows; r++) {
      let ar = 0, ai = 0;
      const end = rowStart[r + 1];
      for (let g = rowStart[r]; g < end; g++) {
        const ci = colIndex[g];
        const er = colRe[ci], ei = colIm[ci];
        const wr = cwRe[g], wi = cwIm[g];
        ar += wr * er - wi * ei;
        ai += wr * ei + wi * er;
      }
      const rr = rowRe[r], ri = rowIm[r];
      accR += ar * rr - ai * ri;
      accI += ar * ri + ai * rr;
    }
    out[2 * m] = accR;
    out[2 * m + 1] = accI;
  }
}

/** Row factors exp(j k (b·r̂_b + c·r̂_c)) of one direction into re/im. */
function fillRows(plan: ArrayFactorPlan, re: Float64Array, im: Float64Array, at: number, sb: number, sc: number): void {
  if (plan.planar) {
    fillPhases(re, im, plan.rowB, sb, sc * plan.rowC[0], plan.rowStep, at);
    return;
  }
  for (let r = 0; r < plan.rowB.length; r++) {
    const ph = sb * plan.rowB[r] + sc * plan.rowC[r];
    re[at + r] = Math.cos(ph);
    im[at + r] = Math.sin(ph);
  }
}

/** Half-table cos δ_c, sin δ_c (δ_c = s·(c − (D−1)/2)·step, c < D/2) at half[8c + 2t], t = direction slot 0…3. */
function fillHalf(half: Float64Array, h: number, d: number, s: number, step: number, slot: number): void {
  const cs = Math.cos(s * step), sn = Math.sin(s * step);
  let zr = 0, zi = 0;
  for (let c = 0; c < h; c++) {
    if (c % RESEED === 0) {
      const ph = s * step * (c - (d - 1) / 2);
      zr = Math.cos(ph);
      zi = Math.sin(ph);
    } else {
      const t = zr * cs - zi * sn;
      zi = zr * sn + zi * cs;
      zr = t;
    }
    half[8 * c + 2 * slot] = zr;
    half[8 * c + 2 * slot + 1] = zi;
  }
}

/** Full-grid path, four directions per pass (shares the weight loads, keeps four independent sums in flight). */
function evaluateFullGrid(plan: ArrayFactorPlan, work: KernelWork, directions: Float64Array, k: number, out: Float64Array, m0: number, m1: number): void {
  const { pairs, half, rowRe, rowIm, cwRe, cwIm } = work;
  const { colValues, colStep, axisA, axisB, axisC } = plan;
  const d = colValues.length, h = d >> 1, odd = d & 1, rows = plan.rowB.length;
  const mid = 0.5 * (colValues[0] + colValues[d - 1]);
  const acc = new Float64Array(8);
  for (let m = m0; m < m1; m += 4) {
    // slots beyond the end repeat the last direction and are not written back
    for (let t = 0; t < 4; t++) {
      const mt = Math.min(m + t, m1 - 1);
      fillHalf(half, h, d, k * directions[3 * mt + axisA], colStep, t);
      fillRows(plan, rowRe, rowIm, t * rows, k * directions[3 * mt + axisB], k * directions[3 * mt + axisC]);
    }
    let aR0 = 0, aI0 = 0, aR1 = 0, aI1 = 0, aR2 = 0, aI2 = 0, aR3 = 0, aI3 = 0;
    for (let r = 0; r < rows; r++) {
      let r0 = 0, i0 = 0, r1 = 0, i1 = 0, r2 = 0, i2 = 0, r3 = 0, i3 = 0;
      let o = 4 * r * h;
      for (let c = 0, e = 0; c < h; c++, o += 4, e += 8) {
        const pr = pairs[o], pi = pairs[o + 1], qr = pairs[o + 2], qi = pairs[o + 3];
        let cs = half[e], sn = half[e + 1];
        r0 += pr * cs - qi * sn; i0 += pi * cs + qr * sn;
        cs = half[e + 2]; sn = half[e + 3];
        r1 += pr * cs - qi * sn; i1 += pi * cs + qr * sn;
        cs = half[e + 4]; sn = half[e + 5];
        r2 += pr * cs - qi * sn; i2 += pi * cs + qr * sn;
        cs = half[e + 6]; sn = half[e + 7];
        r3 += pr * cs - qi * sn; i3 += pi * cs + qr * sn;
      }
      if (odd) {
        const g = r * d + h, wr = cwRe[g], wi = cwIm[g];
        r0 += wr; i0 += wi; r1 += wr; i1 += wi; r2 += wr; i2 += wi; r3 += wr; i3 += wi;
      }
      let fr = rowRe[r], fi = rowIm[r];
      aR0 += r0 * fr - i0 * fi; aI0 += r0 * fi + i0 * fr;
      fr = rowRe[rows + r]; fi = rowIm[rows + r];
      aR1 += r1 * fr - i1 * fi; aI1 += r1 * fi + i1 * fr;
      fr = rowRe[2 * rows + r]; fi = rowIm[2 * rows + r];
      aR2 += r2 * fr - i2 * fi; aI2 += r2 * fi + i2 * fr;
      fr = rowRe[3 * rows + r]; fi = rowIm[3 * rows + r];
      aR3 += r3 * fr - i3 * fi; aI3 += r3 * fi + i3 * fr;
    }
    acc[0] = aR0; acc[1] = aI0; acc[2] = aR1; acc[3] = aI1; acc[4] = aR2; acc[5] = aI2; acc[6] = aR3; acc[7] = aI3;
    for (let t = 0; t < 4 && m + t < m1; t++) {
      // column mid-point phase exp(j k r̂_a x̄)
      const ph = k * directions[3 * (m + t) + axisA] * mid, er = Math.cos(ph), ei = Math.sin(ph);
      out[2 * (m + t)] = acc[2 * t] * er - acc[2 * t + 1] * ei;
      out[2 * (m + t) + 1] = acc[2 * t] * ei + acc[2 * t + 1] * er;
    }
  }
}

/**
 * Plain path for a direction r̂ₘ and its antipode −r̂ₘ at once: exp(−j k r̂·rₙ) is the
 * conjugate of exp(j k r̂·rₙ), so one cos/sin pair per element serves both sums.
 * Writes AF(r̂ₘ) to out[2m…] and AF(−r̂ₘ) to out[2mAnti…].
 */
export function evaluatePlainWithAntipode(
  plan: ArrayFactorPlan, work: KernelWork, directions: Float64Array, k: number, out: Float64Array, m: number, mAnti: number,
): void {
  const { cwRe, cwIm } = work;
  const p = plan.positions, n = plan.count;
  const ux = k * directions[3 * m], uy = k * directions[3 * m + 1], uz = k * directions[3 * m + 2];
  let ar = 0, ai = 0, br = 0, bi = 0;
  for (let g = 0; g < n; g++) {
    const ph = ux * p[3 * g] + uy * p[3 * g + 1] + uz * p[3 * g + 2];
    const c = Math.cos(ph), s = Math.sin(ph);
    const wr = cwRe[g], wi = cwIm[g];
    const wrc = wr * c, wis = wi * s, wrs = wr * s, wic = wi * c;
    ar += wrc - wis;
    ai += wrs + wic;
    br += wrc + wis;
    bi += wic - wrs;
  }
  out[2 * m] = ar;
  out[2 * m + 1] = ai;
  out[2 * mAnti] = br;
  out[2 * mAnti + 1] = bi;
}
