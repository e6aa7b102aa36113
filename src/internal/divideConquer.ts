/**
 * Cuppen's divide-and-conquer for the eigenvalues and eigenvectors of a real
 * symmetric tridiagonal matrix, with Gu–Eisenstat eigenvectors, so that the
 * vector accumulation is a few real matrix products instead of O(n²) plane
 * rotations. No argument checks.
 * @internal
 * @module
 */
import { tridiagonalQl } from './tridiagonal.js';
import { ensureMemory } from './wasm/runtime.js';
import { loadZtile, ztileBlocked } from './ztileWasm.js';

/** Subproblems of at most this order are solved by implicit QL (the rotations are cheap there). */
const LEAF = 32;
const EPS = 2.220446049250313e-16;

/**
 * Eigenvalues (returned in `d`, ascending) and eigenvectors (`z`, n×n row-major,
 * column j belongs to d[j], overwritten) of the real symmetric tridiagonal
 * matrix with diagonal `d` and off-diagonal `e` (e[i] couples i and i+1).
 *
 * Method (Cuppen, "A divide and conquer method for the symmetric tridiagonal
 * eigenproblem", Numer. Math. 36, 1981; Gu & Eisenstat, "A divide-and-conquer
 * algorithm for the symmetric tridiagonal eigenproblem", SIAM J. Matrix Anal.
 * Appl. 16(1), 1995, both from memory): T = diag(T̂₁, T̂₂) + ρ v vᵀ with
 * v = (e_last; ±e_first); the halves are solved recursively (QL below
 * {@link LEAF}), which leaves D + ρ z zᵀ, z = diag(Q₁, Q₂)ᵀ v. Entries with
 * ρ|zᵢ| below 8ε·max(|D|, |z|) and pairs of nearly equal dᵢ (rotated so that
 * one z entry vanishes) are deflated (as LAPACK's dlaed2 does); the rest are
 * the roots of the secular equation 1 + ρ Σ zⱼ²/(dⱼ − λ) = 0, one in each gap,
 * found by a safeguarded two-pole rational iteration in coordinates shifted
 * to the nearer pole (so every dⱼ − λ is accurate); z is then recomputed from
 * the roots by the Löwner formula (Gu–Eisenstat), which makes the vectors
 * (ẑⱼ/(dⱼ − λᵢ))ⱼ numerically orthogonal, and Q = diag(Q₁, Q₂) U is formed
 * as two real products over the rows of each half.
 * Backward stable: ‖T Z − Z Λ‖ and ‖ZᵀZ − I‖ are O(n ε ‖T‖).
 */
export function tridiagonalDivideConquer(d: Float64Array, e: Float64Array, n: number, z: Float64Array): void {
  const r = solve(d.slice(0, n), e.slice(0, Math.max(0, n - 1)));
  d.set(r.lam, 0);
  z.set(r.q, 0);
}

interface Eig {
  /** Eigenvalues ascending. */
  lam: Float64Array;
  /** Eigenvectors, s×s row-major, column j for lam[j]. */
  q: Float64Array;
}

/** The recursion on one subproblem (d, e are its own copies and are modified). */
function solve(d: Float64Array, e: Float64Array): Eig {
  const s = d.length;
  if (s <= LEAF) return leaf(d, e);
  const n1 = s >> 1, n2 = s - n1;
  const beta = e[n1 - 1];
  const rho = Math.abs(beta), sg = beta < 0 ? -1 : 1;
  d[n1 - 1] -= rho;
  d[n1] -= rho;
  const left = solve(d.subarray(0, n1).slice(), e.subarray(0, n1 - 1).slice());
  const right = solve(d.subarray(n1).slice(), e.subarray(n1).slice());
  return merge(left, right, n1, n2, rho, sg);
}

/** A leaf: implicit QL with the rotations accumulated, then sorted. */
function leaf(d: Float64Array, e: Float64Array): Eig {
  const s = d.length;
  const z = new Float64Array(s * s);
  for (let i = 0; i < s; i++) z[i * s + i] = 1;
  const ee = new Float64Array(s);
  ee.set(e.subarray(0, s - 1));
  tridiagonalQl(d, ee, s, z);
  const order = Array.from({ length: s }, (_, i) => i).sort((x, y) => d[x] - d[y]);
  const lam = new Float64Array(s), q = new Float64Array(s * s);
  for (let j = 0; j < s; j++) lam[j] = d[order[j]];
  for (let i = 0; i < s; i++) {
    for (let j = 0; j < s; j++) q[i * s + j] = z[i * s + order[j]];
  }
  return { lam, q };
}

/** Column kinds of diag(Q₁, Q₂) after deflation rotations: nonzero in the top rows only, in both, in the bottom rows only. */
const TOP = 0, MIXED = 1, BOTTOM = 2;

/** Merges two solved halves coupled by ρ v vᵀ, v = (e_{n1}; sg·e_1). */
function merge(left: Eig, right: Eig, n1: number, n2: number, rho0: number, sg: number): Eig {
  const s = n1 + n2;
  // D and z = diag(Q₁, Q₂)ᵀ v / √2 (unit norm), ρ = 2ρ₀
  const dAll = new Float64Array(s), zAll = new Float64Array(s);
  const inv = Math.SQRT1_2;
  for (let j = 0; j < n1; j++) { dAll[j] = left.lam[j]; zAll[j] = inv * left.q[(n1 - 1) * n1 + j]; }
  for (let j = 0; j < n2; j++) { dAll[n1 + j] = right.lam[j]; zAll[n1 + j] = sg * inv * right.q[j]; }
  const rho = 2 * rho0;
  // columns of diag(Q₁, Q₂), each kept as a full s-vector only when rotated (MIXED)
  const kind = new Uint8Array(s);
  for (let j = n1; j < s; j++) kind[j] = BOTTOM;
  const rotated = new Map<number, Float64Array>();
  /** Column j of diag(Q₁, Q₂), as an s-vector that deflation rotations may change. */
  const column = (j: number): Float64Array => {
    let c = rotated.get(j);
    if (c === undefined) {
      c = new Float64Array(s);
      if (j < n1) { for (let i = 0; i < n1; i++) c[i] = left.q[i * n1 + j]; }
      else { const jj = j - n1; for (let i = 0; i < n2; i++) c[n1 + i] = right.q[i * n2 + jj]; }
      rotated.set(j, c);
    }
    return c;
  };
  /** Copies rows r0 … r0+rows−1 of column j into dst[i·stride + off]. */
  const copyColumn = (j: number, r0: number, rows: number, dst: Float64Array, stride: number, off: number): void => {
    const c = rotated.get(j);
    if (c !== undefined) { for (let i = 0; i < rows; i++) dst[i * stride + off] = c[r0 + i]; return; }
    for (let i = 0; i < rows; i++) {
      const r = r0 + i;
      dst[i * stride + off] = j < n1 ? (r < n1 ? left.q[r * n1 + j] : 0) : (r >= n1 ? right.q[(r - n1) * n2 + (j - n1)] : 0);
    }
  };
  // ascending order of D (both halves are sorted: merge them)
  const perm = new Int32Array(s);
  for (let a = 0, b = n1, t = 0; t < s; t++) perm[t] = b >= s || (a < n1 && dAll[a] <= dAll[b]) ? a++ : b++;
  let dmax = 0, zmax = 0;
  for (let j = 0; j < s; j++) { dmax = Math.max(dmax, Math.abs(dAll[j])); zmax = Math.max(zmax, Math.abs(zAll[j])); }
  const tol = 8 * EPS * Math.max(dmax, zmax);
  // deflation (in ascending order of D): small ρ|z|, or a pair of close d rotated so one z vanishes
  const keep: number[] = [], deflated: number[] = [];
  let pj = -1;
  for (let t = 0; t < s; t++) {
    const nj = perm[t];
    if (rho * Math.abs(zAll[nj]) <= tol) { deflated.push(nj); continue; }
    if (pj < 0) { pj = nj; continue; }
    const zs = zAll[pj], zc = zAll[nj];
    const tau = Math.hypot(zc, zs);
    const c = zc / tau, sn = -zs / tau;
    if (Math.abs((dAll[nj] - dAll[pj]) * c * sn) <= tol) {
      // rotate columns pj, nj: z[pj] → 0, z[nj] → τ
      zAll[nj] = tau; zAll[pj] = 0;
      const x = column(pj), y = column(nj);
      for (let i = 0; i < s; i++) {
        const xi = x[i], yi = y[i];
        x[i] = c * xi + sn * yi;
        y[i] = c * yi - sn * xi;
      }
      const mk = kind[pj] === kind[nj] ? kind[pj] : MIXED;
      kind[pj] = mk; kind[nj] = mk;
      const dp = dAll[pj], dn = dAll[nj];
      dAll[pj] = dp * c * c + dn * sn * sn;
      dAll[nj] = dp * sn * sn + dn * c * c;
      deflated.push(pj);
    } else {
      keep.push(pj);
    }
    pj = nj;
  }
  if (pj >= 0) keep.push(pj);
  const k = keep.length;
  // secular equation on the kept entries (ascending d)
  const dk = new Float64Array(k), zk = new Float64Array(k);
  for (let i = 0; i < k; i++) { dk[i] = dAll[keep[i]]; zk[i] = zAll[keep[i]]; }
  const lam = new Float64Array(k);
  const delta = new Float64Array(k * k); // delta[i·k + j] = dk[j] − lam[i]
  for (let i = 0; i < k; i++) secularRoot(i, dk, zk, rho, lam, delta.subarray(i * k, (i + 1) * k));
  // Löwner: ρ ẑⱼ² = −Πᵢ (dⱼ − λᵢ) / Π_{i≠j} (dⱼ − dᵢ), sign of zⱼ
  const zh = new Float64Array(k);
  for (let j = 0; j < k; j++) zh[j] = delta[j * k + j];
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) if (j !== i) zh[j] *= delta[i * k + j] / (dk[j] - dk[i]);
  }
  for (let j = 0; j < k; j++) zh[j] = (zk[j] < 0 ? -1 : 1) * Math.sqrt(Math.max(0, -zh[j]));
  // U (k×k): column i ∝ (ẑⱼ / (dⱼ − λᵢ))ⱼ, unit norm; rows reordered by column kind below
  const byKind = Array.from({ length: k }, (_, i) => i).sort((a, b) => kind[keep[a]] - kind[keep[b]]);
  let nTop = 0, nBottom = 0;
  for (const i of byKind) { if (kind[keep[i]] === TOP) nTop++; else if (kind[keep[i]] === BOTTOM) nBottom++; }
  const nMixed = k - nTop - nBottom;
  const u = new Float64Array(k * k); // row r = kept entry byKind[r]
  for (let i = 0; i < k; i++) {
    const row = delta.subarray(i * k, (i + 1) * k);
    let nrm = 0;
    for (let j = 0; j < k; j++) { const v = zh[j] / row[j]; nrm += v * v; }
    const sc = 1 / Math.sqrt(nrm);
    for (let r = 0; r < k; r++) { const j = byKind[r]; u[r * k + i] = (sc * zh[j]) / row[j]; }
  }
  // Q_new[:, kept] = diag-structured Q[:, kept] · U, top and bottom rows separately
  const out = new Float64Array(s * s);
  const qk = new Float64Array(Math.max(n1, n2) * k); // the operand block of one half
  const res = new Float64Array(Math.max(n1, n2) * k);
  // the final order: all eigenvalues ascending (secular roots and deflated d)
  const all: { v: number; col: number; defl: number }[] = [];
  for (let i = 0; i < k; i++) all.push({ v: lam[i], col: i, defl: -1 });
  for (const j of deflated) all.push({ v: dAll[j], col: -1, defl: j });
  all.sort((a, b) => a.v - b.v);
  const dest = new Int32Array(k);
  all.forEach((x, t) => { if (x.col >= 0) dest[x.col] = t; });
  // top rows: columns TOP then MIXED (rows 0 … nTop+nMixed−1 of U)
  const halves: [number, number, number, number][] = [[0, n1, 0, nTop + nMixed], [n1, n2, nTop, nMixed + nBottom]];
  for (const [r0, rows, c0, cols] of halves) {
    if (cols === 0) continue;
    for (let c = 0; c < cols; c++) copyColumn(keep[byKind[c0 + c]], r0, rows, qk, cols, c);
    realProduct(rows, k, cols, qk, cols, u.subarray(c0 * k), k, res, k);
    for (let i = 0; i < rows; i++) {
      const orow = (r0 + i) * s, rrow = i * k;
      for (let c = 0; c < k; c++) out[orow + dest[c]] = res[rrow + c];
    }
  }
  const vals = new Float64Array(s);
  all.forEach((x, t) => {
    vals[t] = x.v;
    if (x.defl >= 0) copyColumn(x.defl, 0, s, out, s, t);
  });
  return { lam: vals, q: out };
}

/**
 * Root i of 1 + ρ Σⱼ zⱼ²/(dⱼ − λ) = 0 (d ascending, ρ > 0, z nonzero): λᵢ in
 * (dᵢ, dᵢ₊₁), or (d_{k−1}, d_{k−1} + ρ‖z‖²] for the last. Writes λᵢ to lam[i]
 * and dⱼ − λᵢ to delta[j], computed from the nearer pole so they are accurate.
 * Iteration: the two poles bracketing the root kept exactly and the rest of
 * each side's sum modelled by a constant matched in value and slope
 * (a "middle way" rational model, R.-C. Li, LAPACK Working Note 89, 1994, from
 * memory), safeguarded by bisection on a bracket that shrinks at every step.
 */
function secularRoot(i: number, d: Float64Array, z: Float64Array, rho: number, lam: Float64Array, delta: Float64Array): void {
  const k = d.length;
  const last = i === k - 1;
  let zz = 0;
  for (let j = 0; j < k; j++) zz += z[j] * z[j];
  // origin: the nearer pole; τ = λ − d[org]
  let org = i, lo: number, hi: number;
  if (last) {
    lo = 0; hi = rho * zz;
  } else {
    const gap = d[i + 1] - d[i], mid = 0.5 * gap;
    let f = 1;
    for (let j = 0; j < k; j++) f += (rho * z[j] * z[j]) / (d[j] - d[i] - mid);
    if (f >= 0) { lo = 0; hi = mid; }
    else { org = i + 1; lo = -mid; hi = 0; }
  }
  const base = d[org];
  for (let j = 0; j < k; j++) delta[j] = d[j] - base;
  let tau = 0.5 * (lo + hi);
  for (let iter = 0; iter < 200; iter++) {
    // f, split at the bracketing poles: ψ over j ≤ i, φ over j > i
    let psi = 0, dpsi = 0, phi = 0, dphi = 0;
    for (let j = 0; j <= i; j++) { const t = 1 / (delta[j] - tau), w = rho * z[j] * z[j] * t; psi += w; dpsi += w * t; }
    for (let j = i + 1; j < k; j++) { const t = 1 / (delta[j] - tau), w = rho * z[j] * z[j] * t; phi += w; dphi += w * t; }
    const f = 1 + psi + phi;
    if (f < 0) lo = tau; else hi = tau;
    const errBound = 4 * EPS * (1 + Math.abs(psi) + Math.abs(phi));
    if (Math.abs(f) <= errBound || hi - lo <= 2 * EPS * Math.max(Math.abs(lo), Math.abs(hi))) break;
    // model: c + b1/(δ_i − x) + b2/(δ_{i+1} − x), matched in value and slope at τ
    const p = delta[i] - tau;
    const b1 = dpsi * p * p;
    let next: number;
    if (last) {
      const c = 1 + psi - b1 / p; // 1 + ψ − b1/p + b1/(p − x) = 0, x relative to τ
      next = c > 0 ? tau + p + b1 / c : NaN;
    } else {
      const q = delta[i + 1] - tau, b2 = dphi * q * q;
      const c = 1 + psi + phi - b1 / p - b2 / q;
      // c (p − x)(q − x) + b1 (q − x) + b2 (p − x) = 0 for x in (p, q), x relative to τ
      const A = c, B = -(c * (p + q) + b1 + b2), C = c * p * q + b1 * q + b2 * p;
      let x = NaN;
      if (Math.abs(A) <= EPS * (Math.abs(B) + Math.abs(C))) x = -C / B;
      else {
        const disc = B * B - 4 * A * C;
        if (disc >= 0) {
          const sq = Math.sqrt(disc), r1 = B >= 0 ? (-B - sq) / (2 * A) : (-B + sq) / (2 * A);
          const r2 = r1 !== 0 ? C / (A * r1) : 0;
          x = r1 > p && r1 < q ? r1 : r2;
        }
      }
      next = tau + x;
    }
    tau = next > lo && next < hi ? next : 0.5 * (lo + hi);
  }
  lam[i] = base + tau;
  for (let j = 0; j < k; j++) delta[j] -= tau;
}

/**
 * C (m×n, row-major, leading dimension ldc) = A (m×k, lda) · B (k×n, ldb), all
 * real. With WebAssembly SIMD on the complex product kernel: the inner
 * dimension is split in halves paired as Re((A₁ + jA₂)(B₁ − jB₂)) = A₁B₁ + A₂B₂.
 */
function realProduct(m: number, n: number, k: number, a: Float64Array, lda: number, b: Float64Array, ldb: number, c: Float64Array, ldc: number): void {
  const mod = m >= 4 && n >= 4 && m * n * k >= 8192 ? loadZtile() : null;
  if (mod === null) {
    for (let i = 0; i < m; i++) {
      const ci = i * ldc;
      c.fill(0, ci, ci + n);
      for (let p = 0; p < k; p++) {
        const x = a[i * lda + p], bp = p * ldb;
        if (x === 0) continue;
        for (let j = 0; j < n; j++) c[ci + j] += x * b[bp + j];
      }
    }
    return;
  }
  const k2 = (k + 1) >> 1, n4 = (n + 3) & ~3;
  const aBytes = m * k2 * 16, bBytes = n4 * k2 * 16, cBytes = m * n4 * 8;
  const f = ensureMemory(mod.memory, aBytes + bBytes + 2 * cBytes);
  const pa = 0, pb = aBytes, pcr = pb + bBytes, pci = pcr + cBytes;
  for (let i = 0; i < m; i++) {
    const src = i * lda, dst = 2 * i * k2;
    for (let p = 0; p < k2; p++) {
      f[dst + 2 * p] = a[src + p];
      f[dst + 2 * p + 1] = p + k2 < k ? a[src + p + k2] : 0;
    }
  }
  const b0 = pb >> 3;
  f.fill(0, b0, b0 + n4 * k2 * 2);
  for (let p = 0; p < k2; p++) {
    const s1 = p * ldb, s2 = (p + k2) * ldb, has2 = p + k2 < k;
    for (let j = 0; j < n; j++) {
      const dd = b0 + (j >> 2) * k2 * 8 + 8 * p + (j & 3);
      f[dd] = b[s1 + j];
      f[dd + 4] = has2 ? -b[s2 + j] : 0;
    }
  }
  const cr = pcr >> 3;
  f.fill(0, cr, cr + 2 * m * n4);
  ztileBlocked(mod, m, n4, k2, pa, k2 * 16, pb, k2 * 64, pcr, pci, n4 * 8);
  for (let i = 0; i < m; i++) {
    const src = cr + i * n4, dst = i * ldc;
    for (let j = 0; j < n; j++) c[dst + j] = f[src + j];
  }
}
