/**
 * Estimating the number of sources from the eigenvalues of a sample
 * correlation matrix by information-theoretic criteria.
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertHermitian, hermitianEigen } from '../linalg/eigen.js';
import { HERMITIAN_TOLERANCE } from './conditioning.js';
import { assertInteger } from '../internal/validate.js';

/**
 * Result of {@link estimateSourceCount}.
 * @category Beamforming
 */
export interface SourceCountResult {
  /** Number of sources chosen by the requested criterion. */
  readonly count: number;
  /** Eigenvalues of the sample correlation, descending [unit of R]. */
  readonly eigenvalues: Float64Array;
  /** MDL(k) for k = 0 … N−1 (minimum-description-length criterion) [nats]. */
  readonly mdl: Float64Array;
  /** AIC(k) for k = 0 … N−1 (Akaike information criterion) [nats]. */
  readonly aic: Float64Array;
}

/**
 * Number of sources by the MDL or AIC criterion of Wax and Kailath.
 *
 * @remarks
 * With the eigenvalues l₁ ≥ … ≥ l_N of the sample correlation of T snapshots
 * and, for each candidate k, the ratio of the geometric to the arithmetic mean
 * of the N−k smallest ones, g(k)/a(k):
 * AIC(k) = −2T(N−k) ln(g/a) + 2k(2N−k),
 * MDL(k) = −T(N−k) ln(g/a) + ½ k(2N−k) ln T,
 * and the estimate minimises the criterion over k = 0 … N−1 (M. Wax and T.
 * Kailath, "Detection of signals by information theoretic criteria", IEEE
 * Trans. ASSP 33(2), 1985, from memory; equation numbers not held). MDL is consistent; AIC
 * tends to overestimate at large T. Assumes spatially white noise (pre-whiten
 * coloured noise) and T ≥ N.
 * @param correlation - Sample correlation matrix, N×N Hermitian (see {@link sampleCorrelation}).
 * @param snapshotCount - Number of snapshots T behind it, integer ≥ 1.
 * @param criterion - `'mdl'` (default) or `'aic'`.
 * @returns The count and both criteria.
 * @throws {@link DimensionError} if not square; {@link DomainError} if not Hermitian, on a bad count or criterion, or a non-positive eigenvalue
 *   (fewer snapshots than elements, or no noise).
 * @category Beamforming
 */
export function estimateSourceCount(correlation: CMatrix, snapshotCount: number, criterion: 'mdl' | 'aic' = 'mdl'): SourceCountResult {
  assertInteger('snapshotCount', snapshotCount, 1);
  if (criterion !== 'mdl' && criterion !== 'aic') {
    throw new DomainError(`invalid argument "criterion": expected 'mdl' or 'aic', received ${JSON.stringify(criterion)}.`);
  }
  assertHermitian('correlation', correlation, HERMITIAN_TOLERANCE);
  const asc = hermitianEigen(correlation, { valuesOnly: true }).values;
  const n = asc.length;
  const l = new Float64Array(n);
  for (let i = 0; i < n; i++) l[i] = asc[n - 1 - i];
  if (!(l[n - 1] > 0)) {
    throw new DomainError(`invalid argument "correlation": its smallest eigenvalue is ${l[n - 1]}; the criteria need a positive definite sample correlation (more snapshots than elements, with noise).`);
  }
  const t = snapshotCount;
  const mdl = new Float64Array(n), aic = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    const m = n - k;
    let logSum = 0, sum = 0;
    for (let i = k; i < n; i++) {
      logSum += Math.log(l[i]);
      sum += l[i];
    }
    const logRatio = logSum / m - Math.log(sum / m); // ln(g/a) ≤ 0
    const logLik = -t * m * logRatio;
    const free = k * (2 * n - k);
    mdl[k] = logLik + 0.5 * free * Math.log(t);
    aic[k] = 2 * logLik + 2 * free;
  }
  const crit = criterion === 'mdl' ? mdl : aic;
  let best = 0;
  for (let k = 1; k < n; k++) if (crit[k] < crit[best]) best = k;
  return { count: best, eigenvalues: l, mdl, aic };
}
