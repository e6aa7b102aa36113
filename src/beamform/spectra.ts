/**
 * Direction-finding spectra over any set of directions given as steering
 * columns: conventional (Bartlett), Capon/MVDR and MUSIC.
 * Convention: steering aₙ(r̂) = exp(+j k r̂·rₙ); beam output y = wᴴx (docs/conventions.md).
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertHermitian, hermitianEigen } from '../linalg/eigen.js';
import { solveLowerTriangular } from '../linalg/cholesky.js';
import { assertFiniteCMatrix, assertInteger, assertShape } from '../internal/validate.js';
import { gemmKernel } from '../internal/gemm.js';
import { HERMITIAN_TOLERANCE, factorCorrelation } from './conditioning.js';

function checkGrid(correlation: CMatrix, steering: CMatrix): number {
  assertFiniteCMatrix('steering', steering);
  if (steering.rows < 1 || steering.cols < 1) {
    throw new DimensionError(`invalid argument "steering": expected N×K steering vectors as columns (N, K ≥ 1), received ${steering.rows}×${steering.cols}.`);
  }
  assertFiniteCMatrix('correlation', correlation);
  assertShape('correlation', correlation, steering.rows, steering.rows, 'one row and column per element, like "steering"');
  assertHermitian('correlation', correlation, HERMITIAN_TOLERANCE);
  return steering.rows;
}

/** Squared column norms of an N×K matrix. */
function columnPowers(a: CMatrix): Float64Array {
  const n = a.rows, k = a.cols, d = a.data;
  const out = new Float64Array(k);
  for (let i = 0; i < n; i++) {
    const r = 2 * i * k;
    for (let j = 0; j < k; j++) out[j] += d[r + 2 * j] ** 2 + d[r + 2 * j + 1] ** 2;
  }
  return out;
}

/**
 * Conventional (Bartlett) spectrum P(aₖ) = aₖᴴ R aₖ / (aₖᴴaₖ)².
 *
 * @remarks
 * The output power of the conjugate-field beam w = a/(aᴴa), normalised to be
 * distortionless (wᴴa = 1), so a single source of power p with unit-modulus
 * steering gives p + σ²/N at its direction. Resolution is limited to about one
 * beamwidth (M. S. Bartlett, *An Introduction to Stochastic Processes*, 1956;
 * H. Krim and M. Viberg, "Two decades of array signal processing research",
 * IEEE Signal Processing Mag. 13(4), 1996, from memory).
 * @param correlation - Correlation matrix R, N×N Hermitian [W or V²].
 * @param steering - Steering vectors of the scan directions as columns, N×K.
 * @returns Spectrum per direction, length K [unit of R].
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite entries or a zero steering column.
 * @category Beamforming
 */
export function bartlettSpectrum(correlation: CMatrix, steering: CMatrix): Float64Array {
  const n = checkGrid(correlation, steering);
  const k = steering.cols;
  const ra = { rows: n, cols: k, data: new Float64Array(2 * n * k) };
  gemmKernel(n, k, n, correlation.data, 0, n, steering.data, 0, k, ra.data, 0, k, false);
  const out = new Float64Array(k);
  const a = steering.data, b = ra.data;
  for (let i = 0; i < n; i++) {
    const r = 2 * i * k;
    for (let j = 0; j < k; j++) out[j] += a[r + 2 * j] * b[r + 2 * j] + a[r + 2 * j + 1] * b[r + 2 * j + 1];
  }
  const p = columnPowers(steering);
  for (let j = 0; j < k; j++) {
    if (!(p[j] > 0)) throw new DomainError(`invalid argument "steering": column ${j} is zero.`);
    out[j] /= p[j] * p[j];
  }
  return out;
}

/**
 * Capon (MVDR) spectrum P(aₖ) = 1 / (aₖᴴ R⁻¹ aₖ).
 *
 * @remarks
 * The output power of the MVDR beam steered to each direction (J. Capon,
 * "High-resolution frequency-wavenumber spectrum analysis", Proc. IEEE 57(8),
 * 1969). Computed as 1/‖L⁻¹aₖ‖² with R = L Lᴴ: one Cholesky factorisation and
 * one triangular solve with all K directions. The module's conditioning policy
 * applies (see {@link diagonalLoading}).
 * @param correlation - Correlation matrix R, N×N Hermitian positive definite [W or V²].
 * @param steering - Steering vectors as columns, N×K.
 * @param options - `diagonalLoading` relative to tr(R)/N (default 0).
 * @returns Spectrum per direction, length K [unit of R].
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite or non-Hermitian input;
 *   {@link NotPositiveDefiniteError} / {@link SingularMatrixError} for a singular R without loading.
 * @category Beamforming
 */
export function caponSpectrum(correlation: CMatrix, steering: CMatrix, options: { diagonalLoading?: number } = {}): Float64Array {
  const n = checkGrid(correlation, steering);
  const f = factorCorrelation('correlation', correlation, n, options.diagonalLoading ?? 0);
  const y = solveLowerTriangular(f.l, steering);
  const q = columnPowers(y);
  const out = new Float64Array(steering.cols);
  for (let j = 0; j < out.length; j++) out[j] = 1 / q[j];
  return out;
}

/**
 * Orthonormal bases of the signal subspace (the `sourceCount` dominant
 * eigenvectors) and of the noise subspace (the rest) of a Hermitian matrix,
 * as N×K and N×(N−K) matrices.
 */
export function splitSubspaces(name: string, correlation: CMatrix, sourceCount: number): { signal: CMatrix; noise: CMatrix; values: Float64Array } {
  const n = assertHermitian(name, correlation, HERMITIAN_TOLERANCE);
  assertInteger('sourceCount', sourceCount, 0, n - 1);
  const { values, vectors } = hermitianEigen(correlation);
  const v = vectors!;
  const ns = n - sourceCount;
  const signal = { rows: n, cols: sourceCount, data: new Float64Array(2 * n * sourceCount) };
  const noise = { rows: n, cols: ns, data: new Float64Array(2 * n * ns) };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const src = 2 * (i * n + j);
      // Ascending values: columns 0…ns−1 are noise; signal columns ordered by descending eigenvalue.
      if (j < ns) {
        noise.data[2 * (i * ns + j)] = v.data[src];
        noise.data[2 * (i * ns + j) + 1] = v.data[src + 1];
      } else {
        const c = n - 1 - j;
        signal.data[2 * (i * sourceCount + c)] = v.data[src];
        signal.data[2 * (i * sourceCount + c) + 1] = v.data[src + 1];
      }
    }
  }
  if (!(values[n - 1] > 0)) throw new DomainError(`invalid argument "${name}": it has no positive eigenvalue.`);
  return { signal, noise, values };
}

/**
 * MUSIC pseudo-spectrum P(aₖ) = aₖᴴaₖ / (aₖᴴ E_n E_nᴴ aₖ).
 *
 * @remarks
 * E_n spans the noise subspace: the eigenvectors of the N − K smallest
 * eigenvalues of R for K sources (R. O. Schmidt, "Multiple emitter location and
 * signal parameter estimation", IEEE Trans. AP 34(3), 1986). The denominator is
 * computed with the smaller of the two subspaces: ‖E_nᴴa‖² directly, or
 * aᴴa − ‖E_sᴴa‖² with the signal subspace E_s when K < N − K (cost N·K per
 * direction instead of N·(N−K)); the difference is floored at N·ε·aᴴa. The
 * pseudo-spectrum is dimensionless and is 1 in directions orthogonal to the
 * signal subspace. Estimate K first with {@link estimateSourceCount}.
 * @param correlation - Correlation matrix R, N×N Hermitian.
 * @param steering - Steering vectors as columns, N×K_dir.
 * @param sourceCount - Number of sources K, integer in [0, N−1].
 * @returns Pseudo-spectrum per direction, length K_dir [dimensionless].
 * @throws {@link DimensionError} on shape mismatch; {@link DomainError} on non-finite or non-Hermitian input or a bad source count.
 * @category Beamforming
 */
export function musicSpectrum(correlation: CMatrix, steering: CMatrix, sourceCount: number): Float64Array {
  const n = checkGrid(correlation, steering);
  assertInteger('sourceCount', sourceCount, 0, n - 1);
  const { signal, noise } = splitSubspaces('correlation', correlation, sourceCount);
  const k = steering.cols;
  const p = columnPowers(steering);
  const useSignal = sourceCount < n - sourceCount;
  const basis = useSignal ? signal : noise;
  const m = basis.cols;
  // Projections Eᴴ A, m×k: gemm with Eᴴ formed explicitly (m×n).
  const eh = new Float64Array(2 * m * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < m; j++) {
      eh[2 * (j * n + i)] = basis.data[2 * (i * m + j)];
      eh[2 * (j * n + i) + 1] = -basis.data[2 * (i * m + j) + 1];
    }
  }
  const proj = new Float64Array(2 * m * k);
  if (m > 0) gemmKernel(m, k, n, eh, 0, n, steering.data, 0, k, proj, 0, k, false);
  const q = columnPowers({ rows: m, cols: k, data: proj });
  const out = new Float64Array(k);
  for (let j = 0; j < k; j++) {
    if (!(p[j] > 0)) throw new DomainError(`invalid argument "steering": column ${j} is zero.`);
    const den = useSignal ? Math.max(p[j] - q[j], n * Number.EPSILON * p[j]) : Math.max(q[j], n * Number.EPSILON * p[j]);
    out[j] = p[j] / den;
  }
  return out;
}
