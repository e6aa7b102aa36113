/**
 * Physical checks of a multiport: reciprocity, passivity, losslessness, each
 * reported as a violation size with the frequency where it is worst.
 * @module
 */
import { assertFiniteCMatrix, assertNonNegative, assertSquare } from '../internal/validate.js';
import { gemmKernel } from '../internal/gemm.js';
import { lanczosExtremes } from '../internal/lanczos.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { choleskyFactor, type CholeskyResult } from '../linalg/cholesky.js';
import { hermitianPart } from '../linalg/ops.js';
import { hermitianEigen } from '../linalg/eigen.js';
import { powerScatteringStack } from './convert.js';
import { type Multiport, assertMultiport } from './multiport.js';

/**
 * Result of a physical check.
 * @category Network
 */
export interface NetworkCheckResult {
  /** True when `violation ≤ tolerance`. */
  readonly satisfied: boolean;
  /** Largest violation over frequency (dimensionless; see each check). */
  readonly violation: number;
  /** Frequency index of the largest violation. */
  readonly worstIndex: number;
  /** Violation at every frequency. */
  readonly perFrequency: Float64Array;
  /** Tolerance used. */
  readonly tolerance: number;
}

function summarise(per: Float64Array, tolerance: number): NetworkCheckResult {
  let worst = 0;
  for (let k = 1; k < per.length; k++) if (per[k] > per[worst]) worst = k;
  return { satisfied: per[worst] <= tolerance, violation: per[worst], worstIndex: worst, perFrequency: per, tolerance };
}

/**
 * Reciprocity check: max |S_ij − S_ji| of the power-wave scattering matrix.
 *
 * @remarks
 * A reciprocal network has Z = Zᵀ; its power-wave S (Kurokawa 1965) is then symmetric for
 * any per-port references with positive real part (see {@link renormalizeMultiport}), so the
 * check works on S computed with power waves and the network's own references.
 * @param net - The network.
 * @param tolerance - Allowed max |S_ij − S_ji| (dimensionless), ≥ 0.
 * @returns Violation per frequency and the worst case.
 * @throws {@link DomainError} on a negative tolerance.
 * @category Network
 */
export function checkReciprocity(net: Multiport, tolerance = 1e-9): NetworkCheckResult {
  assertMultiport('net', net);
  assertNonNegative('tolerance', tolerance);
  const s = powerScatteringStack(net);
  const n = net.ports, nf = net.frequencyHz.length;
  const per = new Float64Array(nf);
  for (let k = 0; k < nf; k++) {
    let worst = 0;
    for (let i = 0; i < n; i++) for (let j = i + 1; j < n; j++) {
      const p = 2 * (k * n * n + i * n + j), q = 2 * (k * n * n + j * n + i);
      worst = Math.max(worst, Math.hypot(s[p] - s[q], s[p + 1] - s[q + 1]));
    }
    per[k] = worst;
  }
  return summarise(per, tolerance);
}

function gramExtremes(net: Multiport): Array<{ min: number; max: number }> {
  const s = powerScatteringStack(net);
  const n = net.ports, nf = net.frequencyHz.length;
  const out: Array<{ min: number; max: number }> = [];
  for (let k = 0; k < nf; k++) {
    // SᴴS
    const g = new Float64Array(2 * n * n);
    const o = 2 * k * n * n;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
      let re = 0, im = 0;
      for (let l = 0; l < n; l++) {
        const ar = s[o + 2 * (l * n + i)], ai = -s[o + 2 * (l * n + i) + 1];
        const br = s[o + 2 * (l * n + j)], bi = s[o + 2 * (l * n + j) + 1];
        re += ar * br - ai * bi; im += ar * bi + ai * br;
      }
      g[2 * (i * n + j)] = re; g[2 * (i * n + j) + 1] = i === j ? 0 : im;
    }
    const v = hermitianEigen({ rows: n, cols: n, data: g }, { valuesOnly: true }).values; // ascending
    out.push({ min: Math.max(0, v[0]), max: Math.max(0, v[n - 1]) });
  }
  return out;
}

/**
 * Passivity check: largest singular value of the power-wave S minus one (clipped at 0).
 *
 * @remarks
 * With power waves the net power into the ports is aᴴ(I − SᴴS)a, so a network is passive
 * iff σ_max(S) ≤ 1 (Kurokawa 1965, from memory). Violation = max(0, σ_max − 1).
 * @param net - The network.
 * @param tolerance - Allowed σ_max − 1, ≥ 0.
 * @returns Violation per frequency and the worst case.
 * @throws {@link DomainError} on a negative tolerance.
 * @category Network
 */
export function checkPassivity(net: Multiport, tolerance = 1e-9): NetworkCheckResult {
  assertMultiport('net', net);
  assertNonNegative('tolerance', tolerance);
  const per = Float64Array.from(gramExtremes(net), (v) => Math.max(0, Math.sqrt(v.max) - 1));
  return summarise(per, tolerance);
}

/**
 * Losslessness check: max |σᵢ(S) − 1| over the singular values of the power-wave S.
 *
 * @remarks
 * A lossless network has SᴴS = I (Kurokawa 1965, from memory): every singular value is 1.
 * @param net - The network.
 * @param tolerance - Allowed max |σᵢ − 1|, ≥ 0.
 * @returns Violation per frequency and the worst case.
 * @throws {@link DomainError} on a negative tolerance.
 * @category Network
 */
export function checkLossless(net: Multiport, tolerance = 1e-9): NetworkCheckResult {
  assertMultiport('net', net);
  assertNonNegative('tolerance', tolerance);
  const per = Float64Array.from(gramExtremes(net), (v) => Math.max(Math.abs(Math.sqrt(v.max) - 1), Math.abs(Math.sqrt(v.min) - 1)));
  return summarise(per, tolerance);
}

/**
 * Passivity of an impedance matrix: is its Hermitian part (Z + Zᴴ)/2 positive definite?
 * @category Network
 */
export interface ImpedancePassivity {
  /** True when the Cholesky factorisation of (Z + Zᴴ)/2 succeeds (the network absorbs power for every current vector). */
  readonly positiveDefinite: boolean;
  /** Smallest eigenvalue of (Z + Zᴴ)/2 [Ω] by Lanczos; an upper bound of it when `converged` is false. */
  readonly smallestEigenvalueOhm: number;
  /** Largest eigenvalue of (Z + Zᴴ)/2 [Ω] (a lower bound when not converged). */
  readonly largestEigenvalueOhm: number;
  /** Whether the Lanczos estimates met their tolerance. */
  readonly converged: boolean;
}

/** Largest order whose eigenvalues are computed densely (O(N³), a fraction of a second); above it Lanczos estimates. */
const DENSE_EIGEN_MAX_ORDER = 500;

/**
 * @internal {@link impedancePassivity} that also returns the Cholesky factor of (Z + Zᴴ)/2 for
 * reuse. With `factorise` false (large arrays whose figures need no factor) the verdict is the
 * sign of the Lanczos estimate of the smallest eigenvalue (an upper bound: a negative estimate
 * proves non-passivity, a positive one does not prove passivity) and `factor` is null.
 */
export function impedancePassivityWithFactor(
  impedanceOhm: CMatrix, maxSteps = 150, factorise = true, scaledHermitianPart?: { matrix: CMatrix; scale: number },
): ImpedancePassivity & { factor: CholeskyResult | null } {
  assertSquare('impedanceOhm', impedanceOhm);
  assertFiniteCMatrix('impedanceOhm', impedanceOhm);
  // (Z + Zᴴ)/2 = matrix / scale when the caller already holds a multiple of it (the noise budget's
  // R_iso,1K = 4k_B B·(Z + Zᴴ)/2 saves an N×N copy); the factor is then that of the multiple
  const h = scaledHermitianPart?.matrix ?? hermitianPart(impedanceOhm);
  const inv = scaledHermitianPart === undefined ? 1 : 1 / scaledHermitianPart.scale;
  const n = h.rows;
  const apply = (x: Float64Array, y: Float64Array): void => gemmKernel(n, 1, n, h.data, 0, n, x, 0, 1, y, 0, 1, false, inv);
  if (!factorise && n > DENSE_EIGEN_MAX_ORDER) {
    const e = lanczosExtremes(n, apply, 'both', 1e-10, Math.min(n, maxSteps));
    return { positiveDefinite: e.min > 0, smallestEigenvalueOhm: e.min, largestEigenvalueOhm: e.max, converged: e.converged, factor: null };
  }
  const factor = choleskyFactor(h);
  if (n <= DENSE_EIGEN_MAX_ORDER) {
    const v = hermitianEigen(h, { valuesOnly: true }).values;
    return { positiveDefinite: factor.positiveDefinite, smallestEigenvalueOhm: v[0] * inv, largestEigenvalueOhm: v[n - 1] * inv, converged: true, factor };
  }
  const e = lanczosExtremes(n, apply, 'both', 1e-10, Math.min(n, maxSteps));
  return { positiveDefinite: factor.positiveDefinite, smallestEigenvalueOhm: e.min, largestEigenvalueOhm: e.max, converged: e.converged, factor };
}

/**
 * Passivity check of an impedance matrix Z [Ω]: the net power Re{Iᴴ Z I} = Iᴴ ((Z + Zᴴ)/2) I
 * flowing into the ports must be positive for every current vector.
 *
 * @remarks
 * The verdict comes from the Cholesky factorisation of (Z + Zᴴ)/2 (exact to
 * rounding, one O(N³/3) factorisation); its extreme eigenvalues are computed
 * densely up to N = 500 and estimated by at most 150 Lanczos steps (O(N²)
 * each) above, so the margin is reported at any size.
 * Equivalent to σ_max(S) ≤ 1 of {@link checkPassivity} for any positive real
 * reference impedances (H. A. Haus and R. B. Adler, *Circuit Theory of Linear
 * Noisy Networks*, Wiley, 1959, ch. 3, from memory), without forming S.
 * @param impedanceOhm - Z [Ω], N×N, finite.
 * @returns The verdict and the eigenvalue estimates [Ω].
 * @throws {@link DimensionError} if Z is not square; {@link DomainError} for non-finite entries.
 * @example
 * ```ts
 * impedancePassivity(fromRows([[50, 10], [10, 50]])).positiveDefinite; // true
 * ```
 * @category Network
 */
export function impedancePassivity(impedanceOhm: CMatrix): ImpedancePassivity {
  const { factor: _f, ...rest } = impedancePassivityWithFactor(impedanceOhm);
  return rest;
}
