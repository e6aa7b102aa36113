/**
 * Cuppen's divide-and-conquer for the eigenvalues and eigenvectors of a real
 * symmetric tridiagonal matrix, with Gu–Eisenstat eigenvectors, so that the
 * vector accumulation is a few real matrix products instead of O(n²) plane
 * rotations. No argument checks.
 * @internal
 * @module
 */
import { tridiagonalQl } from './tridiagonal.js';
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Subproblems of at most this order are solved by implicit QL (the rotations are cheap there). */
const LEAF = 32;
const EPS = 2.220446049250313e-16;

/**
 * Eigenvalues (returned in `d`, ascending) and eigenvectors of the real
 * symmetric tridiagonal matrix with diagonal `d` and off-diagonal `e` (e[i]
 * couples i and i+1). Returns Zᵀ (n×n row-major): eigenvector j (for d[j]) is
 * CONTIGUOUS at [j·n, j·n + n).
 *
 * Method (Cuppen, "A divide and conquer method for the symmetric tridiagonal
 * eigenproblem", Numer. Math. 36, 1981; Gu & Eisenstat, "A divide-and-conquer
 * algorithm for the symmetric tridiagonal eigenproblem", SIAM J. Matrix Anal.
 * Appl. 16(1), 1995, both from memory): T = diag(T̂₁, T̂₂) + ρ v vᵀ with
 * v = (e_last; ±e_first); the halves are solved recursively (QL below
 * {@link LEAF}), which leaves D + ρ z zᵀ, z = diag(Q₁, Q₂)ᵀ v. Entries with
 * ρ|zᵢ| below 8ε·max(|D|, |z|) and pairs of nearly equal dᵢ (rotated so that
 * one z entry vanishes, as Gu & Eisenstat describe) are deflated; the rest
 * are the roots of the secular equation 1 + ρ Σ zⱼ²/(dⱼ − λ) = 0, one in each
 * gap, found by a safeguarded rational iteration in coordinates shifted to
 * the nearer pole (so every dⱼ − λ is accurate); z is then recomputed from
 * the roots by the Löwner formula (Gu–Eisenstat), which makes the vectors
 * (ẑⱼ/(dⱼ − λᵢ))ⱼ numerically orthogonal, and Q = diag(Q₁, Q₂) U is formed
 * as two real products, one over the rows of each half, each only over the
 * columns that are nonzero there.
 * Backward stable: ‖T Z − Z Λ‖ and ‖ZᵀZ − I‖ are O(n ε ‖T‖).
 */
export function tridiagonalDivideConquer(d: Float64Array, e: Float64Array, n: number): Float64Array {
  const r = solve(d.slice(0, n), e.slice(0, Math.max(0, n - 1)));
  d.set(r.lam, 0);
  return r.q;
}

interface Eig {
  /** Eigenvalues ascending. */
  lam: Float64Array;
  /** Eigenvectors, s×s, vector j contiguous at j·s (for lam[j]). */
  q: Float64Array;
}

/** The recursion on one subproblem (d, e are its own copies and are modified). */
function solve(d: Float64Array, e: Float64Array): Eig {
  const s = d.length;
  if (s <= LEAF) return leaf(d, e);
  const n1 = s >> 1;
  const beta = e[n1 - 1];
  const rho = Math.abs(beta), sg = beta < 0 ? -1 : 1;
  d[n1 - 1] -= rho;
  d[n1] -= rho;
  const left = solve(d.slice(0, n1), e.slice(0, n1 - 1));
  const right = solve(d.slice(n1), e.slice(n1));
  return merge(left, right, n1, s - n1, rho, sg);
}

/** A leaf: implicit QL with the rotations accumulated, then sorted. */
function leaf(d: Float64Array, e: Float64Array): Eig {
  const s = d.length;
  const z = new Float64Array(s * s);
  for (let i = 0; i < s; i++) z[i * s + i] = 1;
  const ee = new Float64Array(s);
  ee.set(e.subarray(0, s - 1));
  tridiagonalQl(d, ee, s, z);
  const order = sortedOrder(d, s);
  const lam = new Float64Array(s), q = new Float64Array(s * s);
  for (let j = 0; j < s; j++) {
    const c = order[j];
    lam[j] = d[c];
    for (let i = 0; i < s; i++) q[j * s + i] = z[i * s + c];
  }
  return { lam, q };
}

/** Indices 0 … count−1 in ascending order of v[index]. */
function sortedOrder(v: Float64Array, count: number): Int32Array {
  return Int32Array.from({ length: count }, (_, i) => i).sort((x, y) => v[x] - v[y]);
}

/** Column kinds of diag(Q₁, Q₂) after deflation rotations: nonzero in the top rows only, in both, in the bottom rows only. */
const TOP = 0, MIXED = 1, BOTTOM = 2;

/** Merges two solved halves coupled by ρ v vᵀ, v = (e_{n1}; sg·e_1). */
function merge(left: Eig, right: Eig, n1: number, n2: number, rho0: number, sg: number): Eig {
  const s = n1 + n2;
  // D and z = diag(Q₁, Q₂)ᵀ v / √2 (unit norm), ρ = 2ρ₀
  const dAll = new Float64Array(s), zAll = new Float64Array(s);
  const inv = Math.SQRT1_2;
  for (let j = 0; j < n1; j++) { dAll[j] = left.lam[j]; zAll[j] = inv * left.q[j * n1 + n1 - 1]; }
  for (let j = 0; j < n2; j++) { dAll[n1 + j] = right.lam[j]; zAll[n1 + j] = sg * inv * right.q[j * n2]; }
  const rho = 2 * rho0;
  const kind = new Uint8Array(s);
  kind.fill(BOTTOM, n1);
  // columns changed by deflation rotations, as full s-vectors
  const rotated = new Map<number, Float64Array>();
  const column = (j: number): Float64Array => {
    let c = rotated.get(j);
    if (c === undefined) {
      c = new Float64Array(s);
      if (j < n1) c.set(left.q.subarray(j * n1, (j + 1) * n1), 0);
      else c.set(right.q.subarray((j - n1) * n2, (j - n1 + 1) * n2), n1);
      rotated.set(j, c);
    }
    return c;
  };
  /** Rows r0 … r0+rows−1 of column j into dst at off. */
  const copyColumn = (j: number, r0: number, rows: number, dst: Float64Array, off: number): void => {
    const c = rotated.get(j);
    if (c !== undefined) { dst.set(c.subarray(r0, r0 + rows), off); return; }
    const top = j < n1, src = top ? left.q : right.q, m = top ? n1 : n2, jj = top ? j : j - n1, lo = top ? 0 : n1;
    // the part of [r0, r0 + rows) inside this column's half; zero elsewhere
    const a = Math.max(r0, lo), b = Math.min(r0 + rows, lo + m);
    dst.fill(0, off, off + rows);
    if (b > a) dst.set(src.subarray(jj * m + a - lo, jj * m + b - lo), off + a - r0);
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
  const dk = new Float64Array(k), zk = new Float64Array(k), w2 = new Float64Array(k);
  let zz = 0;
  for (let i = 0; i < k; i++) { dk[i] = dAll[keep[i]]; zk[i] = zAll[keep[i]]; w2[i] = rho * zk[i] * zk[i]; zz += w2[i]; }
  // roots one by one, each with the differences row[j] = dk[j] − λᵢ, which are folded at once into
  // the Löwner formula ρ ẑⱼ² = −Πᵢ (dⱼ − λᵢ) / Π_{i≠j} (dⱼ − dᵢ) (sign of zⱼ), so no k×k array is kept
  const lam = new Float64Array(k), org = new Int32Array(k), shift = new Float64Array(k), row = new Float64Array(k);
  const zh = new Float64Array(k).fill(1);
  for (let i = 0; i < k; i++) {
    secularRoot(i, dk, w2, zz, lam, row, org, shift);
    const di = dk[i];
    for (let j = 0; j < i; j++) zh[j] *= row[j] / (dk[j] - di);
    zh[i] *= row[i];
    for (let j = i + 1; j < k; j++) zh[j] *= row[j] / (dk[j] - di);
  }
  for (let j = 0; j < k; j++) zh[j] = (zk[j] < 0 ? -1 : 1) * Math.sqrt(Math.max(0, -zh[j]));
  // the kept columns grouped by kind: TOP, MIXED, BOTTOM
  const byKind = Int32Array.from({ length: k }, (_, i) => i).sort((a, b) => kind[keep[a]] - kind[keep[b]]);
  let nTop = 0, nBottom = 0;
  for (let r = 0; r < k; r++) { const kd = kind[keep[byKind[r]]]; if (kd === TOP) nTop++; else if (kd === BOTTOM) nBottom++; }
  // Uᵀ (k×k): row i = eigenvector i of D + ρ z zᵀ, ∝ (ẑⱼ / (dⱼ − λᵢ))ⱼ, unit norm, entries in byKind order
  const ut = new Float64Array(k * k), tmp = new Float64Array(k);
  for (let i = 0; i < k; i++) {
    // dk[j] − λᵢ again, by the same operations as in secularRoot
    const base = dk[org[i]], t = shift[i];
    let nrm = 0;
    for (let j = 0; j < k; j++) { const v = zh[j] / ((dk[j] - base) - t); tmp[j] = v; nrm += v * v; }
    const sc = 1 / Math.sqrt(nrm), u0 = i * k;
    for (let r = 0; r < k; r++) ut[u0 + r] = sc * tmp[byKind[r]];
  }
  // the final order: all eigenvalues ascending (secular roots, then deflated d merged in)
  const defl = Int32Array.from(deflated).sort((a, b) => dAll[a] - dAll[b]);
  const vals = new Float64Array(s), dest = new Int32Array(k), out = new Float64Array(s * s);
  for (let a = 0, b = 0, t = 0; t < s; t++) {
    if (b >= defl.length || (a < k && lam[a] <= dAll[defl[b]])) { vals[t] = lam[a]; dest[a++] = t; }
    else { vals[t] = dAll[defl[b]]; copyColumn(defl[b++], 0, s, out, t * s); }
  }
  // new vectors, half by half: (rows of the half)ᵀ = Uᵀ[:, cols] · (Q[rows, cols])ᵀ
  const halves: [number, number, number, number][] = [[0, n1, 0, k - nBottom], [n1, n2, nTop, k - nTop]];
  const qt = new Float64Array(Math.max(n1, n2) * k), res = new Float64Array(Math.max(n1, n2) * k);
  for (const [r0, rows, c0, cols] of halves) {
    if (cols === 0) continue;
    for (let c = 0; c < cols; c++) copyColumn(keep[byKind[c0 + c]], r0, rows, qt, c * rows);
    realProduct(k, rows, cols, ut.subarray(c0), k, qt, rows, res, rows);
    for (let i = 0; i < k; i++) out.set(res.subarray(i * rows, (i + 1) * rows), dest[i] * s + r0);
  }
  return { lam: vals, q: out };
}

/** Scratch of {@link secularSums}: ψ, ψ′, φ, φ′. */
const sums = new Float64Array(4);

/**
 * The two parts of the secular function at τ (coordinates of `delta`, the
 * poles relative to the origin; w2 = ρz²): ψ = Σ_{j≤i} w2ⱼ/(δⱼ − τ) and
 * φ = Σ_{j>i}, with their derivatives, into out = [ψ, ψ′, φ, φ′].
 */
function secularSums(i: number, delta: Float64Array, w2: Float64Array, tau: number, out: Float64Array): void {
  const k = delta.length;
  let psi = 0, dpsi = 0, phi = 0, dphi = 0;
  for (let j = 0; j <= i; j++) { const t = 1 / (delta[j] - tau), w = w2[j] * t; psi += w; dpsi += w * t; }
  for (let j = i + 1; j < k; j++) { const t = 1 / (delta[j] - tau), w = w2[j] * t; phi += w; dphi += w * t; }
  out[0] = psi; out[1] = dpsi; out[2] = phi; out[3] = dphi;
}

/**
 * Root i of 1 + Σⱼ w2ⱼ/(dⱼ − λ) = 0 with w2 = ρz² (d ascending, ρ > 0, z
 * nonzero; zz = Σ w2): λᵢ in (dᵢ, dᵢ₊₁), or (d_{k−1}, d_{k−1} + zz] for the
 * last. Writes λᵢ to lam[i] and dⱼ − λᵢ to delta[j], computed from the nearer
 * pole d[org[i]] as (dⱼ − d[org[i]]) − shift[i] so they are accurate (and can
 * be recomputed bit for bit). Iteration: the sum over the poles up to dᵢ and the
 * sum over those beyond are each modelled by one pole at dᵢ resp. dᵢ₊₁ plus a
 * constant, matched in value and slope at the current point, and the model's
 * root in the gap is taken (rational interpolation as in Bunch, Nielsen &
 * Sorensen, "Rank-one modification of the symmetric eigenproblem", Numer.
 * Math. 31, 1978, from memory), safeguarded by bisection on a bracket that
 * shrinks at every step.
 */
function secularRoot(i: number, d: Float64Array, w2: Float64Array, zz: number, lam: Float64Array, delta: Float64Array, org: Int32Array, shift: Float64Array): void {
  const k = d.length;
  const last = i === k - 1;
  // origin: the nearer pole, decided by the sign at the midpoint of the gap; τ = λ − d[org]
  let origin = i, lo: number, hi: number, tau: number, have = false;
  for (let j = 0; j < k; j++) delta[j] = d[j] - d[i];
  if (last) {
    lo = 0; hi = zz; tau = 0.5 * zz;
  } else {
    const mid = 0.5 * (d[i + 1] - d[i]);
    secularSums(i, delta, w2, mid, sums);
    have = true;
    if (1 + sums[0] + sums[2] >= 0) { lo = 0; hi = mid; tau = mid; }
    else {
      origin = i + 1; lo = -mid; hi = 0; tau = -mid;
      for (let j = 0; j < k; j++) delta[j] = d[j] - d[origin];
    }
  }
  const base = d[origin];
  for (let iter = 0; iter < 200; iter++) {
    if (!have) secularSums(i, delta, w2, tau, sums);
    have = false;
    const psi = sums[0], dpsi = sums[1], phi = sums[2], dphi = sums[3];
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
    if (next > lo && next < hi) {
      // a model step at the level of rounding: the root is found without another evaluation
      const small = Math.abs(next - tau) <= 2 * EPS * Math.abs(next);
      tau = next;
      if (small) break;
    } else {
      tau = 0.5 * (lo + hi);
    }
  }
  lam[i] = base + tau;
  org[i] = origin;
  shift[i] = tau;
  for (let j = 0; j < k; j++) delta[j] -= tau;
}

/** Exports of wasm/dtile.wat (byte addresses into its memory); arguments as documented there. */
interface RealTileFunctions {
  dtile: (m: number, n: number, k: number, pa: number, lda: number, pb: number, ldbq: number, pc: number, ldc: number) => void;
}

const loadRealTile = kernelModule<RealTileFunctions>('dtile');

/** Columns of C per call of the real kernel: the packed B block (k × 64 doubles, ≤ 256 KiB for k ≤ 512) stays in L2 while A streams past. */
const REAL_BLOCK_COLUMNS = 64;

/**
 * C (m×n, row-major, leading dimension ldc) = A (m×k, lda) · B (k×n, ldb), all
 * real: on the SIMD real product kernel (wasm/dtile.wat, B packed in
 * four-column panels, one thread) when the product is large enough, else by a
 * scalar loop.
 */
export function realProduct(m: number, n: number, k: number, a: Float64Array, lda: number, b: Float64Array, ldb: number, c: Float64Array, ldc: number): void {
  const mod = m >= 4 && n >= 4 && m * n * k >= 8192 ? loadRealTile() : null;
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
  const n4 = (n + 3) & ~3;
  // layout (bytes): A (m·k·8) | B panels (n4/4 panels of k·32) | C (m·n4·8)
  const aBytes = m * k * 8, bBytes = n4 * k * 8;
  const f = ensureMemory(mod.memory, aBytes + bBytes + m * n4 * 8);
  const pa = 0, pb = aBytes, pc = pb + bBytes;
  for (let i = 0; i < m; i++) f.set(a.subarray(i * lda, i * lda + k), i * k);
  const b0 = pb >> 3;
  for (let p = 0; p < k; p++) {
    const s = p * ldb;
    for (let j = 0; j < n; j++) f[b0 + (j >> 2) * k * 4 + 4 * p + (j & 3)] = b[s + j];
    for (let j = n; j < n4; j++) f[b0 + (j >> 2) * k * 4 + 4 * p + (j & 3)] = 0;
  }
  const c0 = pc >> 3;
  f.fill(0, c0, c0 + m * n4);
  for (let j0 = 0; j0 < n4; j0 += REAL_BLOCK_COLUMNS) {
    const w = Math.min(REAL_BLOCK_COLUMNS, n4 - j0);
    mod.dtile(m, w, k, pa, k * 8, pb + (j0 >> 2) * k * 32, k * 32, pc + j0 * 8, n4 * 8);
  }
  for (let i = 0; i < m; i++) c.set(f.subarray(c0 + i * n4, c0 + i * n4 + n), i * ldc);
}
