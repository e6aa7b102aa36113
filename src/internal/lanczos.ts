/**
 * Extreme eigenvalues of a Hermitian operator given only by its product with
 * a vector (Lanczos with full reorthogonalisation). No argument checks.
 * @internal
 * @module
 */
import { tridiagonalQl } from './tridiagonal.js';

/** y ← A x for a Hermitian n×n operator A (interleaved complex vectors of length 2n). */
export type HermitianApply = (x: Float64Array, y: Float64Array) => void;

/** Result of {@link lanczosExtremes}. */
export interface LanczosExtremes {
  /** Smallest eigenvalue. */
  readonly min: number;
  /** Largest eigenvalue. */
  readonly max: number;
  /** Lanczos steps taken. */
  readonly steps: number;
  /** True when the requested ends met the tolerance; otherwise min/max are the last Ritz values (min an upper bound of the true minimum, max a lower bound of the true maximum). */
  readonly converged: boolean;
}

/**
 * Smallest and largest eigenvalue of a Hermitian operator by the Lanczos
 * method with full (twice-applied classical Gram–Schmidt) reorthogonalisation.
 *
 * @remarks
 * C. Lanczos, "An iteration method for the solution of the eigenvalue problem
 * of linear differential and integral operators", J. Res. Nat. Bur. Standards
 * 45, 1950; convergence test on the Ritz residual β_j·|s_j| of each extreme
 * Ritz pair (Golub & Van Loan, *Matrix Computations*, 4th ed., 2013, §10.1.4
 * and §10.3, from memory). Cost: one operator product per step plus O(n·j)
 * for the reorthogonalisation. The start vector is deterministic (no random
 * state) and not orthogonal to any eigenvector of a generic operator.
 * Converged when the residual of each requested end (`which`) is ≤ `tol`·max|θ|, or when its Ritz
 * value changed by ≤ `tol`·|θ| over the last steps with a residual ≤ 10⁻³·|θ| (clustered ends); an invariant subspace
 * (β ≈ 0) ends the iteration with exact values.
 * After `maxSteps` steps without convergence the last Ritz values are returned with `converged: false`.
 */
export function lanczosExtremes(n: number, apply: HermitianApply, which: 'min' | 'max' | 'both', tol = 1e-12, maxSteps = Math.min(n, 400)): LanczosExtremes {
  const basis: Float64Array[] = [];
  const alpha: number[] = [], beta: number[] = [];
  let q = new Float64Array(2 * n);
  // deterministic start: a smooth, non-symmetric mixture of all coordinates
  let s = 0;
  for (let i = 0; i < n; i++) { q[2 * i] = 1 + 0.5 * Math.sin(1.7 * i + 0.3); q[2 * i + 1] = 0.25 * Math.cos(0.9 * i); s += q[2 * i] ** 2 + q[2 * i + 1] ** 2; }
  s = 1 / Math.sqrt(s);
  for (let i = 0; i < 2 * n; i++) q[i] *= s;
  const w = new Float64Array(2 * n);
  let lastMin = NaN, lastMax = NaN, lastSteps = 0;
  for (let j = 0; j < Math.min(maxSteps, n); j++) {
    basis.push(q);
    apply(q, w);
    let a = 0;
    for (let i = 0; i < 2 * n; i++) a += q[i] * w[i];
    alpha.push(a);
    // two passes of classical Gram–Schmidt against the whole basis
    for (let pass = 0; pass < 2; pass++) {
      for (const v of basis) {
        let cr = 0, ci = 0;
        for (let i = 0; i < n; i++) { cr += v[2 * i] * w[2 * i] + v[2 * i + 1] * w[2 * i + 1]; ci += v[2 * i] * w[2 * i + 1] - v[2 * i + 1] * w[2 * i]; }
        for (let i = 0; i < n; i++) { w[2 * i] -= cr * v[2 * i] - ci * v[2 * i + 1]; w[2 * i + 1] -= cr * v[2 * i + 1] + ci * v[2 * i]; }
      }
    }
    let b = 0;
    for (let i = 0; i < 2 * n; i++) b += w[i] * w[i];
    b = Math.sqrt(b);
    const m = alpha.length;
    // Ritz values every step while the basis is small, then every fourth step (the QL solve is O(m³))
    if (m > 24 && m % 4 !== 0 && m < Math.min(maxSteps, n) && b > 0) {
      beta.push(b);
      q = new Float64Array(2 * n);
      for (let i = 0; i < 2 * n; i++) q[i] = w[i] / b;
      continue;
    }
    const ritz = tridiagonalRitz(alpha, beta, m);
    const scaleRef = Math.max(Math.abs(ritz.min), Math.abs(ritz.max), 1e-300);
    const invariant = b <= 1e-14 * scaleRef;
    // an end is done when its Ritz residual is below tol·scale, or when its Ritz value has stopped
    // moving (change ≤ tol·|θ| since the last check) while the residual already guarantees 1e-3·|θ|:
    // an eigenvalue lies within the residual of the Ritz value (Golub & Van Loan 2013, Thm 10.1.2)
    const rMin = b * Math.abs(ritz.lastMin), rMax = b * Math.abs(ritz.lastMax);
    const minDone = which === 'max' || rMin <= tol * scaleRef ||
      (Math.abs(ritz.min - lastMin) <= tol * Math.abs(ritz.min) && rMin <= 1e-3 * Math.abs(ritz.min));
    const maxDone = which === 'min' || rMax <= tol * scaleRef ||
      (Math.abs(ritz.max - lastMax) <= tol * Math.abs(ritz.max) && rMax <= 1e-3 * Math.abs(ritz.max));
    if (invariant || m === n || (minDone && maxDone && m >= 2)) {
      return { min: ritz.min, max: ritz.max, steps: m, converged: true };
    }
    lastMin = ritz.min; lastMax = ritz.max; lastSteps = m;
    beta.push(b);
    q = new Float64Array(2 * n);
    for (let i = 0; i < 2 * n; i++) q[i] = w[i] / b;
  }
  return { min: lastMin, max: lastMax, steps: lastSteps, converged: false };
}

/** Extreme eigenvalues of the m×m tridiagonal (alpha, beta) and the last components of their eigenvectors. */
function tridiagonalRitz(alpha: number[], beta: number[], m: number): { min: number; max: number; lastMin: number; lastMax: number } {
  const d = Float64Array.from(alpha), e = new Float64Array(m);
  for (let i = 0; i < m - 1; i++) e[i] = beta[i];
  const z = new Float64Array(m * m);
  for (let i = 0; i < m; i++) z[i * m + i] = 1;
  tridiagonalQl(d, e, m, z);
  let iMin = 0, iMax = 0;
  for (let i = 1; i < m; i++) { if (d[i] < d[iMin]) iMin = i; if (d[i] > d[iMax]) iMax = i; }
  return { min: d[iMin], max: d[iMax], lastMin: z[(m - 1) * m + iMin], lastMax: z[(m - 1) * m + iMax] };
}
