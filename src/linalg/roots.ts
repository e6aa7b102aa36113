/**
 * Roots of polynomials with complex coefficients (Aberth–Ehrlich iteration)
 * and the monic expansion of a polynomial from its roots.
 * @module
 */
import { ConvergenceError, DimensionError, DomainError } from '../errors.js';
import { assertCMatrix, assertFiniteCMatrix, assertInteger } from '../internal/validate.js';
import type { CMatrix } from './cmatrix.js';
import { matrixView } from './cmatrix.js';

const EPS = 2.220446049250313e-16;

/**
 * Options of {@link polynomialRoots}.
 * @category Complex core
 */
export interface PolynomialRootsOptions {
  /**
   * Iteration budget of the simultaneous Aberth–Ehrlich iteration.
   * @defaultValue 500
   */
  maxIterations?: number;
}

/**
 * Evaluates the Newton correction p(z)/p′(z) of the monic-normalised
 * polynomial c (descending, c[0] = 1, degree d) at z = (zr, zi), choosing the
 * reversed polynomial for |z| > 1 so that no power of z can overflow.
 * Writes [corrRe, corrIm, |p| / errorBound] to `out`; a ratio ≤ 1 means p(z)
 * vanishes to within the rounding error of its evaluation.
 */
function newtonCorrection(c: Float64Array, ca: Float64Array, d: number, zr: number, zi: number, out: Float64Array): void {
  const r2 = zr * zr + zi * zi;
  if (r2 <= 1) {
    let pr = 1, pi = 0, dr = 0, di = 0, bound = 1;
    const az = Math.sqrt(r2);
    for (let k = 1; k <= d; k++) {
      const ndr = dr * zr - di * zi + pr, ndi = dr * zi + di * zr + pi;
      dr = ndr; di = ndi;
      const npr = pr * zr - pi * zi + c[2 * k], npi = pr * zi + pi * zr + c[2 * k + 1];
      pr = npr; pi = npi;
      bound = bound * az + ca[k];
    }
    const dd = dr * dr + di * di;
    if (dd === 0) { out[0] = 0; out[1] = 0; } else {
      out[0] = (pr * dr + pi * di) / dd;
      out[1] = (pi * dr - pr * di) / dd;
    }
    out[2] = Math.sqrt(pr * pr + pi * pi) / (4 * d * EPS * bound);
    return;
  }
  // y = 1/z; q(y) = Σ c_k y^k (k = 0 … d, ascending in y); p/p′ = z / (d − y q′(y)/q(y))
  const yr = zr / r2, yi = -zi / r2;
  const ay = 1 / Math.sqrt(r2);
  let qr = c[2 * d], qi = c[2 * d + 1], dr = 0, di = 0, bound = ca[d];
  for (let k = d - 1; k >= 0; k--) {
    const ndr = dr * yr - di * yi + qr, ndi = dr * yi + di * yr + qi;
    dr = ndr; di = ndi;
    const nqr = qr * yr - qi * yi + c[2 * k], nqi = qr * yi + qi * yr + c[2 * k + 1];
    qr = nqr; qi = nqi;
    bound = bound * ay + ca[k];
  }
  const qq = qr * qr + qi * qi;
  if (qq === 0) { out[0] = 0; out[1] = 0; out[2] = 0; return; }
  // t = y q′/q
  const ur = (dr * qr + di * qi) / qq, ui = (di * qr - dr * qi) / qq;
  const tr = yr * ur - yi * ui, ti = yr * ui + yi * ur;
  const denr = d - tr, deni = -ti;
  const den = denr * denr + deni * deni;
  if (den === 0) { out[0] = 0; out[1] = 0; } else {
    out[0] = (zr * denr + zi * deni) / den;
    out[1] = (zi * denr - zr * deni) / den;
  }
  out[2] = Math.sqrt(qq) / (4 * d * EPS * bound);
}

/**
 * Initial approximations on circles whose radii come from the upper convex hull
 * of the points (k, log|a_k|), a_k the coefficient of z^k (Bini 1996).
 */
function initialGuesses(ca: Float64Array, d: number, z: Float64Array): void {
  // ascending index k ↔ descending index d − k
  const hull: number[] = [];
  for (let k = 0; k <= d; k++) {
    const mag = ca[d - k];
    if (mag === 0) continue;
    const y = Math.log(mag);
    while (hull.length >= 2) {
      const k1 = hull[hull.length - 2], k2 = hull[hull.length - 1];
      const y1 = Math.log(ca[d - k1]), y2 = Math.log(ca[d - k2]);
      // remove k2 if it lies on or below the segment k1 → k
      if ((y2 - y1) * (k - k1) <= (y - y1) * (k2 - k1)) hull.pop(); else break;
    }
    hull.push(k);
  }
  const sigma = 0.7;
  let idx = 0;
  for (let h = 0; h + 1 < hull.length; h++) {
    const k1 = hull[h], k2 = hull[h + 1], cnt = k2 - k1;
    const radius = Math.pow(ca[d - k1] / ca[d - k2], 1 / cnt);
    for (let j = 0; j < cnt; j++) {
      const ang = (2 * Math.PI * j) / cnt + (2 * Math.PI * k1) / d + sigma;
      z[2 * idx] = radius * Math.cos(ang);
      z[2 * idx + 1] = radius * Math.sin(ang);
      idx++;
    }
  }
}

/** Aberth–Ehrlich iteration plus Newton polishing on a monic polynomial of degree d ≥ 2 with c[d] ≠ 0. */
function aberth(c: Float64Array, d: number, maxIterations: number): Float64Array {
  const ca = new Float64Array(d + 1);
  for (let k = 0; k <= d; k++) ca[k] = Math.hypot(c[2 * k], c[2 * k + 1]);
  const z = new Float64Array(2 * d);
  initialGuesses(ca, d, z);
  const done = new Uint8Array(d);
  const nc = new Float64Array(3);
  let remaining = d;
  for (let it = 0; it < maxIterations && remaining > 0; it++) {
    for (let i = 0; i < d; i++) {
      if (done[i]) continue;
      const zr = z[2 * i], zi = z[2 * i + 1];
      newtonCorrection(c, ca, d, zr, zi, nc);
      if (nc[2] <= 1) { done[i] = 1; remaining--; continue; }
      const nr = nc[0], ni = nc[1];
      let sr = 0, si = 0;
      for (let j = 0; j < d; j++) {
        if (j === i) continue;
        const dr = zr - z[2 * j], di = zi - z[2 * j + 1];
        const dd = dr * dr + di * di;
        if (dd === 0) continue;
        sr += dr / dd;
        si -= di / dd;
      }
      // w = N / (1 − N S)
      const denr = 1 - (nr * sr - ni * si), deni = -(nr * si + ni * sr);
      const den = denr * denr + deni * deni;
      let wr = nr, wi = ni;
      if (den > 0) {
        wr = (nr * denr + ni * deni) / den;
        wi = (ni * denr - nr * deni) / den;
      }
      z[2 * i] = zr - wr;
      z[2 * i + 1] = zi - wi;
      if (Math.hypot(wr, wi) <= EPS * Math.hypot(zr, zi)) { done[i] = 1; remaining--; }
    }
  }
  if (remaining > 0) {
    throw new ConvergenceError(`polynomialRoots: the Aberth–Ehrlich iteration left ${remaining} of ${d} roots unconverged after ${maxIterations} iterations; raise "maxIterations" or check the coefficients for extreme dynamic range.`);
  }
  // Newton polishing: accept a step only while it decreases the residual ratio.
  for (let i = 0; i < d; i++) {
    let zr = z[2 * i], zi = z[2 * i + 1];
    newtonCorrection(c, ca, d, zr, zi, nc);
    let res = nc[2];
    for (let step = 0; step < 3 && res > 0; step++) {
      const tr = zr - nc[0], ti = zi - nc[1];
      const cr = nc[0], ci = nc[1];
      newtonCorrection(c, ca, d, tr, ti, nc);
      if (!(nc[2] < res)) break;
      zr = tr; zi = ti; res = nc[2];
      if (Math.hypot(cr, ci) <= EPS * Math.hypot(zr, zi)) break;
    }
    z[2 * i] = zr; z[2 * i + 1] = zi;
  }
  return z;
}

/**
 * All complex roots of the polynomial c₀ zⁿ + c₁ zⁿ⁻¹ + … + cₙ.
 *
 * @remarks
 * Leading exact-zero coefficients are stripped (they only lower the degree);
 * trailing exact-zero coefficients give exact zero roots. Degree 1 is solved
 * directly; higher degrees by the simultaneous Aberth–Ehrlich iteration
 * started on circles from the Newton polygon of the coefficient moduli, with
 * a stopping test on the rounding-error bound of the Horner evaluation
 * (the reversed polynomial is evaluated for |z| > 1), followed by Newton
 * polishing steps that are kept only while they reduce the residual.
 * Accuracy: each root is a root of a polynomial whose coefficients differ by
 * a few ε relative (backward stable). A root of multiplicity m is therefore
 * only accurate to about ε^{1/m}·|root| (e.g. ~1e-8 for a double root) — an
 * intrinsic property of the problem, not of the method.
 * Roots are returned sorted by argument in (−π, π], then by modulus.
 *
 * References:
 * - O. Aberth, "Iteration methods for finding all zeros of a polynomial simultaneously",
 *   Math. Comp. 27(122), 1973 (from memory).
 * - L. W. Ehrlich, "A modified Newton method for polynomials", Comm. ACM 10(2), 1967 (from memory).
 * - D. A. Bini, "Numerical computation of polynomial zeros by means of Aberth's method",
 *   Numer. Algorithms 13, 1996 (initial guesses, from memory).
 * @param coefficients - Column vector (n+1)×1 of complex coefficients, highest power first, finite.
 * @param options - Iteration budget.
 * @returns Column vector of the n roots (n = degree after stripping leading zeros; 0×1 for a non-zero constant).
 * @throws {@link DimensionError} if `coefficients` is not a non-empty column vector.
 * @throws {@link DomainError} on NaN/±Infinity coefficients or when every coefficient is zero.
 * @throws {@link ConvergenceError} if the iteration does not converge within the budget.
 * @example
 * ```ts
 * polynomialRoots(columnVector([1, 0, 1])); // ≈ [−1.000000j, 1.000000j]ᵀ (z² + 1)
 * ```
 * @category Complex core
 */
export function polynomialRoots(coefficients: CMatrix, options: PolynomialRootsOptions = {}): CMatrix {
  assertCMatrix('coefficients', coefficients);
  if (coefficients.cols !== 1 || coefficients.rows < 1) {
    throw new DimensionError(`invalid argument "coefficients": expected an (n+1)×1 column of coefficients, highest power first, received ${coefficients.rows}×${coefficients.cols}; pass a column vector.`);
  }
  assertFiniteCMatrix('coefficients', coefficients);
  const { maxIterations = 500 } = options;
  assertInteger('maxIterations', maxIterations, 1);
  const src = coefficients.data;
  const len = coefficients.rows;
  let first = 0;
  while (first < len && src[2 * first] === 0 && src[2 * first + 1] === 0) first++;
  if (first === len) {
    throw new DomainError('invalid argument "coefficients": every coefficient is zero, so every complex number is a root; pass a polynomial with at least one non-zero coefficient.');
  }
  let last = len - 1;
  while (src[2 * last] === 0 && src[2 * last + 1] === 0) last--;
  const zeroRoots = len - 1 - last;
  const d = last - first; // degree of the part without zero roots
  // monic normalisation
  const c = new Float64Array(2 * (d + 1));
  const lr = src[2 * first], li = src[2 * first + 1];
  const l2 = lr * lr + li * li;
  for (let k = 0; k <= d; k++) {
    const ar = src[2 * (first + k)], ai = src[2 * (first + k) + 1];
    c[2 * k] = (ar * lr + ai * li) / l2;
    c[2 * k + 1] = (ai * lr - ar * li) / l2;
  }
  let z: Float64Array;
  if (d === 0) z = new Float64Array(0);
  else if (d === 1) z = Float64Array.of(-c[2], -c[3]);
  else z = aberth(c, d, maxIterations);
  const total = d + zeroRoots;
  const all = new Float64Array(2 * total);
  all.set(z);
  const idx = Array.from({ length: total }, (_, i) => i);
  const arg = (i: number): number => (all[2 * i] === 0 && all[2 * i + 1] === 0 ? 0 : Math.atan2(all[2 * i + 1], all[2 * i]));
  idx.sort((p, q) => arg(p) - arg(q) || Math.hypot(all[2 * p], all[2 * p + 1]) - Math.hypot(all[2 * q], all[2 * q + 1]));
  const out = new Float64Array(2 * total);
  for (let r = 0; r < total; r++) {
    out[2 * r] = all[2 * idx[r]];
    out[2 * r + 1] = all[2 * idx[r] + 1];
  }
  return matrixView(total, 1, out);
}

/**
 * Coefficients of the monic polynomial Πₖ (z − rₖ), highest power first.
 *
 * @remarks
 * Expanded one linear factor at a time (c ← c·(z − r)), the roots taken in
 * Leja order (each next root farthest, in product of distances, from those
 * already used), which keeps intermediate coefficients small (e.g. for zeros
 * spread around the unit circle: L. Reichel, "Newton interpolation at Leja
 * points", BIT 30, 1990, from memory). Used to build array
 * polynomials from prescribed zeros (Schelkunoff's unit-circle method).
 * The expansion is forward stable only for moderately sized degrees or roots
 * of similar modulus; the coefficients of high-degree polynomials with widely
 * spread roots lose relative accuracy in their small entries.
 * (S. A. Schelkunoff, "A mathematical theory of linear arrays", Bell Syst.
 * Tech. J. 22, 1943, from memory, for the use.)
 * @param roots - Column vector n×1 of complex roots (n ≥ 0; a 0×1 vector gives the constant 1).
 * @returns Column vector (n+1)×1: 1, c₁, …, cₙ.
 * @throws {@link DimensionError} if `roots` is not a column vector; {@link DomainError} on NaN/±Infinity.
 * @example
 * ```ts
 * polynomialFromRoots(columnVector([1, -1])); // [1, 0, −1]ᵀ (z² − 1)
 * ```
 * @category Complex core
 */
export function polynomialFromRoots(roots: CMatrix): CMatrix {
  assertCMatrix('roots', roots);
  if (roots.cols !== 1 && !(roots.rows === 0)) {
    throw new DimensionError(`invalid argument "roots": expected an n×1 column vector, received ${roots.rows}×${roots.cols}; pass a column vector.`);
  }
  assertFiniteCMatrix('roots', roots);
  const n = roots.rows, src = roots.data;
  // Leja order: each next root maximises the product of distances to those
  // already taken (log-sum), which keeps the intermediate coefficients small.
  const r = new Float64Array(2 * n);
  const taken = new Uint8Array(n);
  const score = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    let best = -1;
    for (let i = 0; i < n; i++) {
      if (taken[i]) continue;
      const s = k === 0 ? Math.hypot(src[2 * i], src[2 * i + 1]) : score[i];
      if (best < 0 || s > (k === 0 ? Math.hypot(src[2 * best], src[2 * best + 1]) : score[best])) best = i;
    }
    taken[best] = 1;
    r[2 * k] = src[2 * best];
    r[2 * k + 1] = src[2 * best + 1];
    for (let i = 0; i < n; i++) {
      if (!taken[i]) score[i] += Math.log(Math.hypot(src[2 * i] - r[2 * k], src[2 * i + 1] - r[2 * k + 1]));
    }
  }
  const c = new Float64Array(2 * (n + 1));
  c[0] = 1;
  for (let k = 0; k < n; k++) {
    const rr = r[2 * k], ri = r[2 * k + 1];
    // c_new[j] = c[j] − r c[j−1], j from k+1 down to 1
    for (let j = k + 1; j >= 1; j--) {
      const pr = c[2 * (j - 1)], pi = c[2 * (j - 1) + 1];
      c[2 * j] -= rr * pr - ri * pi;
      c[2 * j + 1] -= rr * pi + ri * pr;
    }
  }
  return matrixView(n + 1, 1, c);
}
