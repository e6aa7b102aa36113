/**
 * The displacement path of the brightness integral: for identical elements
 * whose open-circuit patterns differ only by the phase of their positions,
 * fₙ(r̂) = g(r̂)·exp(+j k r̂·dₙ), the correlation depends only on dₘ − dₙ, so
 * an array needs one sum over directions per distinct displacement instead of
 * one rank-k update of all N² pairs.
 * @module
 */
import { gemmKernel } from '../internal/gemm.js';
import { mirrorTriangle } from '../internal/herk.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import type { PortPatternSource, QuadratureDirections } from './patterns.js';

/**
 * Ports whose patterns are one element pattern shifted by the phase of each
 * port's position: fₙ(r̂) = g(r̂)·exp(+j k r̂·dₙ) (conventions, "embedded pattern" and
 * "steering vector" conventions; docs/conventions.md).
 *
 * @remarks
 * Holds for identical, identically oriented elements whose open-circuit
 * embedded pattern equals their isolated pattern: the one-mode induced-EMF
 * dipoles of dipoleArrayPorts (an open thin dipole carries no current), with a
 * ground plane when every element has the same height (the image moves with
 * the element horizontally), and isolated-pattern element models. It does not
 * hold for method-of-moments or imported embedded patterns (each differs).
 * @category Reception
 */
export interface ShiftedElementPattern {
  /** The reference element's pattern g (a one-port source) [V]. */
  readonly element: PortPatternSource;
  /** Offset dₙ of each port from the reference element [m], 3N values (x, y, z per port). */
  readonly offsetsM: Float64Array;
}

/** @internal Distinct displacements of a set of offsets, split into x and (y, z) parts. */
export interface DisplacementStructure {
  readonly n: number;
  /** Index of each element's x coordinate among the distinct x values, and of its (y, z) pair. */
  readonly ix: Int32Array;
  readonly iyz: Int32Array;
  /** Distinct x values and (y, z) pairs. */
  readonly ux: number;
  readonly uyz: number;
  /** Distinct Δx values (rows) and (Δy, Δz) pairs (columns). */
  readonly dx: Float64Array;
  readonly dyz: Float64Array;
  /** Row of (x_a − x_b) for a, b distinct-x indices (ux×ux), column of the (y, z) differences (uyz×uyz). */
  readonly rowOf: Int32Array;
  readonly colOf: Int32Array;
}

/** Sorts values and merges those within tol; returns the distinct values (cluster minima) and each value's class. */
function cluster(values: Float64Array, tol: number): { unique: Float64Array; index: Int32Array } {
  const sorted = Float64Array.from(values).sort();
  const unique: number[] = [];
  for (let i = 0; i < sorted.length; i++) if (unique.length === 0 || sorted[i] - sorted[i - 1] > tol) unique.push(sorted[i]);
  const u = Float64Array.from(unique);
  const index = new Int32Array(values.length);
  for (let i = 0; i < values.length; i++) {
    // the class of v is the last cluster whose minimum is ≤ v
    const v = values[i];
    let lo = 0, hi = u.length - 1;
    while (lo < hi) { const mid = (lo + hi + 1) >> 1; if (u[mid] <= v) lo = mid; else hi = mid - 1; }
    index[i] = lo;
  }
  return { unique: u, index };
}

/**
 * @internal The displacement structure of N offsets, or null when it would not
 * pay (more than N²/4 distinct displacement cells).
 */
export function displacementStructure(offsetsM: Float64Array): DisplacementStructure | null {
  const n = offsetsM.length / 3;
  let ext = 0;
  for (let i = 0; i < 3 * n; i++) ext = Math.max(ext, Math.abs(offsetsM[i]));
  const tol = 1e-12 * Math.max(ext, 1e-30);
  const xs = new Float64Array(n), ys = new Float64Array(n), zs = new Float64Array(n);
  for (let i = 0; i < n; i++) { xs[i] = offsetsM[3 * i]; ys[i] = offsetsM[3 * i + 1]; zs[i] = offsetsM[3 * i + 2]; }
  const cx = cluster(xs, tol), cy = cluster(ys, tol), cz = cluster(zs, tol);
  const ux = cx.unique.length;
  // distinct (y, z) pairs
  const pairKey = new Map<number, number>();
  const iyz = new Int32Array(n);
  const yzList: number[] = [];
  for (let i = 0; i < n; i++) {
    const key = cy.index[i] * cz.unique.length + cz.index[i];
    let id = pairKey.get(key);
    if (id === undefined) { id = pairKey.size; pairKey.set(key, id); yzList.push(cy.unique[cy.index[i]], cz.unique[cz.index[i]]); }
    iyz[i] = id;
  }
  const uyz = pairKey.size;
  if (ux * ux > n * n || uyz * uyz > n * n) return null;
  // rows: distinct Δx over pairs of distinct x values
  const dxAll = new Float64Array(ux * ux);
  for (let a = 0; a < ux; a++) for (let b = 0; b < ux; b++) dxAll[a * ux + b] = cx.unique[a] - cx.unique[b];
  const rows = cluster(dxAll, 2 * tol);
  // columns: distinct (Δy, Δz) over pairs of distinct (y, z)
  const dyAll = new Float64Array(uyz * uyz), dzAll = new Float64Array(uyz * uyz);
  for (let a = 0; a < uyz; a++) for (let b = 0; b < uyz; b++) {
    dyAll[a * uyz + b] = yzList[2 * a] - yzList[2 * b];
    dzAll[a * uyz + b] = yzList[2 * a + 1] - yzList[2 * b + 1];
  }
  const cdy = cluster(dyAll, 2 * tol), cdz = cluster(dzAll, 2 * tol);
  const colKey = new Map<number, number>();
  const colOf = new Int32Array(uyz * uyz);
  const dyz: number[] = [];
  for (let p = 0; p < uyz * uyz; p++) {
    const key = cdy.index[p] * cdz.unique.length + cdz.index[p];
    let id = colKey.get(key);
    if (id === undefined) { id = colKey.size; colKey.set(key, id); dyz.push(cdy.unique[cdy.index[p]], cdz.unique[cdz.index[p]]); }
    colOf[p] = id;
  }
  const nRows = rows.unique.length, nCols = colKey.size;
  if (nRows * nCols > (n * n) / 4) return null;
  return {
    n, ix: cx.index, iyz, ux, uyz, dx: rows.unique, dyz: Float64Array.from(dyz), rowOf: rows.index, colOf,
  };
}

/** Directions per block of the displacement sums. */
const BLOCK = 1024;

/**
 * Writes exp(+j k·s·vₚ) for p = 0…count−1 into out (interleaved), using a
 * recurrence re-anchored every 32 terms when the values are an arithmetic
 * progression (a lattice), and direct cos/sin otherwise.
 */
function phases(out: Float64Array, o: number, stride: number, ks: number, v: Float64Array, step: number): void {
  const count = v.length;
  if (step !== 0) {
    let cr = 1, ci = 0;
    const sr = Math.cos(ks * step), si = Math.sin(ks * step);
    for (let p = 0; p < count; p++) {
      if ((p & 31) === 0) { const a = ks * v[p]; cr = Math.cos(a); ci = Math.sin(a); }
      out[o + p * stride] = cr; out[o + p * stride + 1] = ci;
      const t = cr * sr - ci * si; ci = cr * si + ci * sr; cr = t;
    }
    return;
  }
  for (let p = 0; p < count; p++) { const a = ks * v[p]; out[o + p * stride] = Math.cos(a); out[o + p * stride + 1] = Math.sin(a); }
}

/** Common step of an arithmetic progression (ascending values), or 0 when they are not one. */
function progressionStep(v: Float64Array): number {
  if (v.length < 3) return 0;
  const step = v[1] - v[0];
  const tol = 1e-12 * Math.max(Math.abs(v[0]), Math.abs(v[v.length - 1]));
  for (let p = 2; p < v.length; p++) if (Math.abs(v[p] - v[p - 1] - step) > tol) return 0;
  return step;
}

/**
 * @internal The displacement table of the brightness sums: H[t][(Δx row, (Δy, Δz) column)] =
 * Σₖ wₖ Tₜ,ₖ |g(r̂ₖ)|² exp(j k r̂ₖ·Δ) for every distinct displacement Δ of the structure and
 * every map t (interleaved, nt·rows·cols complex values, map-major), unscaled.
 */
export function displacementTable(
  shifted: ShiftedElementPattern, s: DisplacementStructure, wavenumberRadPerM: number,
  q: QuadratureDirections, maps: ReadonlyArray<Float64Array>,
): Float64Array {
  const { dx, dyz } = s;
  const nr = dx.length, nc = dyz.length / 2, nt = maps.length, m = q.thetaRad.length;
  const k = wavenumberRadPerM;
  const rowsA = nt * nr;
  const h = new Float64Array(2 * rowsA * nc);
  const gt = new Float64Array(2 * BLOCK), gp = new Float64Array(2 * BLOCK);
  const a = new Float64Array(2 * nr * BLOCK), b = new Float64Array(2 * BLOCK * nc), px = new Float64Array(2 * BLOCK * nr);
  const ph = new Float64Array(2 * nr);
  const used = new Int32Array(BLOCK), amp = new Float64Array(nt * BLOCK), sig = new Int32Array(BLOCK);
  const stepX = progressionStep(dx);
  const dyOnly = new Float64Array(nc), dzOnly = new Float64Array(nc);
  for (let c = 0; c < nc; c++) { dyOnly[c] = dyz[2 * c]; dzOnly[c] = dyz[2 * c + 1]; }
  // A line of elements along x (one column, Δy = Δz = 0): the phase depends on u alone, so the
  // amplitudes of directions sharing u (a product rule about the x axis has few u values) are
  // summed first and each distinct u costs one pass over the rows.
  const lineOnly = nc === 1 && dyz[0] === 0 && dyz[1] === 0;
  const uSum = lineOnly ? new Map<number, Float64Array>() : null;
  const groupMaps = nt <= 30;
  for (let start = 0; start < m; start += BLOCK) {
    const count = Math.min(BLOCK, m - start);
    let any = false;
    for (let t = 0; t < nt && !any; t++) for (let j = 0; j < count; j++) if (q.weightSr[start + j] * maps[t][start + j] > 0) { any = true; break; }
    if (!any) continue;
    shifted.element.fill(q.thetaRad, q.phiRad, start, count, gt, gp, BLOCK);
    // used directions, ordered by which maps they feed (their signature), so that each map's
    // directions form contiguous groups and no product is spent on zero amplitudes
    const tmpAmp = new Float64Array(nt * count), tmpSig = new Int32Array(count);
    let nu = 0;
    for (let j = 0; j < count; j++) {
      const g2 = gt[2 * j] ** 2 + gt[2 * j + 1] ** 2 + gp[2 * j] ** 2 + gp[2 * j + 1] ** 2;
      let bits = 0;
      for (let t = 0; t < nt; t++) {
        const v = q.weightSr[start + j] * maps[t][start + j] * g2;
        tmpAmp[t * count + j] = v;
        if (v > 0) bits |= groupMaps ? 1 << t : 1;
      }
      tmpSig[j] = bits;
      if (bits !== 0) used[nu++] = j;
    }
    if (nu === 0) continue;
    const order = Array.from(used.subarray(0, nu)).sort((x, y) => tmpSig[x] - tmpSig[y] || x - y);
    for (let e = 0; e < nu; e++) {
      used[e] = order[e]; sig[e] = tmpSig[order[e]];
      for (let t = 0; t < nt; t++) amp[t * BLOCK + e] = tmpAmp[t * count + order[e]];
    }
    if (uSum !== null) {
      for (let e = 0; e < nu; e++) {
        const j = start + used[e];
        const u = Math.sin(q.thetaRad[j]) * Math.cos(q.phiRad[j]);
        const key = Math.round(u * 1e13);
        let acc = uSum.get(key);
        if (acc === undefined) { acc = new Float64Array(nt + 1); acc[nt] = u; uSum.set(key, acc); }
        for (let t = 0; t < nt; t++) acc[t] += amp[t * BLOCK + e];
      }
      continue;
    }
    for (let e = 0; e < nu; e++) {
      const j = start + used[e];
      const st = Math.sin(q.thetaRad[j]);
      const u = st * Math.cos(q.phiRad[j]), v = st * Math.sin(q.phiRad[j]), w = Math.cos(q.thetaRad[j]);
      phases(px, 2 * e * nr, 2, k * u, dx, stepX);
      for (let c = 0; c < nc; c++) {
        const arg = k * (v * dyOnly[c] + w * dzOnly[c]);
        b[2 * (e * nc + c)] = Math.cos(arg); b[2 * (e * nc + c) + 1] = Math.sin(arg);
      }
    }
    // one product per (signature group, map of that group): H_t += A_t,g · B_g
    for (let g0 = 0; g0 < nu;) {
      let g1 = g0 + 1;
      while (g1 < nu && sig[g1] === sig[g0]) g1++;
      const width = g1 - g0;
      for (let t = 0; t < nt; t++) {
        if (groupMaps && (sig[g0] & (1 << t)) === 0) continue;
        for (let r = 0; r < nr; r++) {
          for (let e = 0; e < width; e++) {
            const av = amp[t * BLOCK + g0 + e], src = 2 * ((g0 + e) * nr + r), d = 2 * (r * width + e);
            a[d] = av * px[src]; a[d + 1] = av * px[src + 1];
          }
        }
        gemmKernel(nr, nc, width, a, 0, width, b, g0 * nc, nc, h, t * nr * nc, nc, true);
      }
      g0 = g1;
    }
  }
  if (uSum !== null) {
    for (const acc of uSum.values()) {
      phases(ph, 0, 2, k * acc[nt], dx, stepX);
      for (let t = 0; t < nt; t++) {
        const av = acc[t];
        if (av === 0) continue;
        const o = 2 * t * nr;
        for (let r = 0; r < nr; r++) { h[o + 2 * r] += av * ph[2 * r]; h[o + 2 * r + 1] += av * ph[2 * r + 1]; }
      }
    }
  }
  return h;
}

/**
 * @internal Brightness correlations on the displacement path:
 * R_t(m, n) = scale · Σₖ wₖ Tₜ,ₖ |g(r̂ₖ)|² exp(j k r̂ₖ·(dₘ − dₙ)), for every map t.
 *
 * @remarks
 * The phase splits as exp(j k u Δx)·exp(j k (v Δy + w Δz)), so for a block of
 * directions all distinct-displacement sums are one complex product
 * H += A·B with A[(t, Δx), k] = wₖ Tₜ,ₖ |g|² e^{jkuΔx} and B[k, (Δy, Δz)] =
 * e^{jk(vΔy + wΔz)} (SIMD kernel), then each matrix entry is read from H.
 * Cost O(M·(rows + cols)) phases + O(T·rows·cols·M) multiply–adds + O(T·N²)
 * for the fill, against O(N·M) pattern samples + O(T·N²·M) on the general path.
 */
export function shiftedBrightnessCorrelations(
  shifted: ShiftedElementPattern, s: DisplacementStructure, wavenumberRadPerM: number,
  q: QuadratureDirections, maps: ReadonlyArray<Float64Array>, scale: number,
): CMatrix[] {
  const h = displacementTable(shifted, s, wavenumberRadPerM, q, maps);
  const { n, dx, dyz } = s;
  const nr = dx.length, nc = dyz.length / 2, nt = maps.length;
  // fill every map: the lower triangle row by row from the displacement table (sequential
  // writes), then the upper triangle as its conjugate transpose in cache-sized tiles
  const outs = maps.map(() => new Float64Array(2 * n * n));
  const ix = s.ix, iyz = s.iyz, rowOf = s.rowOf, colOf = s.colOf, ux = s.ux, uyz = s.uyz;
  const cells = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const rx = ix[i] * ux, ry = iyz[i] * uyz;
    for (let j = 0; j <= i; j++) cells[j] = rowOf[rx + ix[j]] * nc + colOf[ry + iyz[j]];
    for (let t = 0; t < nt; t++) {
      const o = outs[t], base = t * nr * nc, row = 2 * i * n;
      for (let j = 0; j < i; j++) {
        const c = 2 * (base + cells[j]);
        o[row + 2 * j] = scale * h[c]; o[row + 2 * j + 1] = scale * h[c + 1];
      }
      o[row + 2 * i] = scale * h[2 * (base + cells[i])];
    }
  }
  for (const o of outs) mirrorTriangle(n, o, true, true);
  return outs.map((data) => ({ rows: n, cols: n, data }));
}


/**
 * @internal Quadratic forms of the brightness correlations on the displacement path without
 * forming the matrices: Re{wₖᴴ R_t wₖ} = scale · Σ_Δ Re{H_t(Δ) · A_k(Δ)} for every map t and
 * column k of W (N×K), with A_k(Δ) = Σ_{m,n: dₘ − dₙ = Δ} conj(w_mk) w_nk the weights'
 * autocorrelation over the distinct displacements. Cost: the table of
 * {@link displacementTable} plus O(N²K) for the autocorrelation, against O(T·N²) memory and
 * fill plus O(T·N²K) for the matrices and their forms. Returns one Float64Array (K values) per map.
 */
export function shiftedBrightnessForms(
  shifted: ShiftedElementPattern, s: DisplacementStructure, wavenumberRadPerM: number,
  q: QuadratureDirections, maps: ReadonlyArray<Float64Array>, scale: number, weights: CMatrix,
): Float64Array[] {
  const h = displacementTable(shifted, s, wavenumberRadPerM, q, maps);
  const { n, dx, dyz, ix, iyz, rowOf, colOf, ux, uyz } = s;
  const nr = dx.length, nc = dyz.length / 2, nt = maps.length, kb = weights.cols, w = weights.data;
  const cellsTotal = nr * nc;
  // autocorrelation of every column of W over the displacement cells, cell-major (K per cell)
  const acf = new Float64Array(2 * cellsTotal * kb);
  for (let i = 0; i < n; i++) {
    const rx = ix[i] * ux, ry = iyz[i] * uyz, wi = 2 * i * kb;
    for (let j = 0; j < n; j++) {
      const cell = rowOf[rx + ix[j]] * nc + colOf[ry + iyz[j]];
      const a = 2 * cell * kb, wj = 2 * j * kb;
      for (let c = 0; c < 2 * kb; c += 2) {
        // conj(w_ic) · w_jc
        const xr = w[wi + c], xi = w[wi + c + 1], yr = w[wj + c], yi = w[wj + c + 1];
        acf[a + c] += xr * yr + xi * yi;
        acf[a + c + 1] += xr * yi - xi * yr;
      }
    }
  }
  return maps.map((_, t) => {
    const out = new Float64Array(kb), base = 2 * t * cellsTotal;
    for (let cell = 0; cell < cellsTotal; cell++) {
      const hr = h[base + 2 * cell], hi = h[base + 2 * cell + 1], a = 2 * cell * kb;
      for (let c = 0; c < kb; c++) out[c] += hr * acf[a + 2 * c] - hi * acf[a + 2 * c + 1];
    }
    for (let c = 0; c < kb; c++) out[c] *= scale;
    return out;
  });
}
