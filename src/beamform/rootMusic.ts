/**
 * Root-MUSIC for uniform linear arrays.
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { polynomialRoots } from '../linalg/roots.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertFiniteCMatrix, assertInteger, assertPositive, assertShape } from '../internal/validate.js';
import { splitSubspaces } from './spectra.js';

/**
 * Geometry of a uniform linear array for {@link rootMusic}.
 * @category Beamforming
 */
export interface UniformLineGeometry {
  /** Element spacing d along the array axis [m], > 0; element n sits at n·d (any common offset is irrelevant). */
  spacingM: number;
  /** Frequency [Hz], > 0. */
  frequencyHz: number;
}

/**
 * Result of {@link rootMusic}.
 * @category Beamforming
 */
export interface RootMusicResult {
  /** Direction cosines u = r̂·x̂ (x̂ the array axis) of the K sources, ascending [dimensionless]. */
  readonly directionCosines: Float64Array;
  /** |z| of the root behind each direction (≤ 1; near 1 for a well-resolved source), in the same order. */
  readonly rootMagnitudes: Float64Array;
}

/**
 * Root-MUSIC direction estimates for a uniform linear array.
 *
 * @remarks
 * With element n at n·d along x̂ and z = exp(j k d u), the steering vector is
 * a(z)ₙ = zⁿ (convention aₙ = exp(+j k r̂·rₙ)), and the MUSIC null spectrum
 * aᴴE_nE_nᴴa equals z^{−(N−1)} p(z) on the unit circle, where p has degree
 * 2N−2 and coefficients the diagonal sums of C = E_nE_nᴴ:
 * p(z) = Σ_{l} (Σ_{n−m=l} C_{mn}) z^{l+N−1}. Its roots come in pairs (z, 1/z*);
 * the K roots inside or on the unit circle closest to it give
 * u = arg(z)/(k d) (A. J. Barabell, "Improving the resolution performance of
 * eigenstructure-based direction-finding algorithms", Proc. IEEE ICASSP 1983,
 * from memory). Only roots with |u| ≤ 1 (visible directions) are used; for
 * d > λ/2 several u share one z and the smallest |u| is returned. Roots by
 * the core's `polynomialRoots`.
 * @param correlation - Correlation matrix R, N×N Hermitian, N ≥ 2.
 * @param sourceCount - Number of sources K, integer in [1, N−1].
 * @param geometry - Spacing and frequency (see {@link UniformLineGeometry}).
 * @returns Direction cosines and root magnitudes.
 * @throws {@link DimensionError} if R is not square; {@link DomainError} on non-Hermitian input, bad counts or geometry,
 *   or fewer than K visible roots.
 * @category Beamforming
 */
export function rootMusic(correlation: CMatrix, sourceCount: number, geometry: UniformLineGeometry): RootMusicResult {
  assertFiniteCMatrix('correlation', correlation);
  const n = correlation.rows;
  assertShape('correlation', correlation, n, n, 'a square matrix');
  if (n < 2) throw new DomainError('invalid argument "correlation": root-MUSIC needs at least 2 elements.');
  assertInteger('sourceCount', sourceCount, 1, n - 1);
  assertPositive('geometry.spacingM', geometry?.spacingM, 'm');
  assertPositive('geometry.frequencyHz', geometry?.frequencyHz, 'Hz');
  const kd = wavenumberRadPerM(geometry.frequencyHz) * geometry.spacingM;
  const en = splitSubspaces('correlation', correlation, sourceCount).noise;
  const m = en.cols, e = en.data;
  // Coefficient of z^{l+N−1} is Σ_{n−m=l} C_{mn}, C = E_n E_nᴴ; highest power (l = N−1) first.
  const coeff = { rows: 2 * n - 1, cols: 1, data: new Float64Array(2 * (2 * n - 1)) };
  for (let r = 0; r < n; r++) {
    for (let c = 0; c < n; c++) {
      let re = 0, im = 0;
      for (let j = 0; j < m; j++) {
        const p = 2 * (r * m + j), q = 2 * (c * m + j);
        re += e[p] * e[q] + e[p + 1] * e[q + 1];
        im += e[p + 1] * e[q] - e[p] * e[q + 1];
      }
      const l = c - r;
      const idx = n - 1 - l;
      coeff.data[2 * idx] += re;
      coeff.data[2 * idx + 1] += im;
    }
  }
  const roots = polynomialRoots(coeff);
  const cand: { u: number; mag: number }[] = [];
  for (let i = 0; i < roots.rows; i++) {
    const zr = roots.data[2 * i], zi = roots.data[2 * i + 1];
    const mag = Math.hypot(zr, zi);
    if (mag > 1) continue;
    const u = Math.atan2(zi, zr) / kd;
    if (Math.abs(u) <= 1) cand.push({ u, mag });
  }
  // Roots on the unit circle come in (near-)double pairs; rounding may push both copies inside, so keep
  // the K closest to the circle but skip a candidate that duplicates an accepted one.
  cand.sort((p, q) => (1 - p.mag) - (1 - q.mag));
  const chosen: { u: number; mag: number }[] = [];
  for (const c of cand) {
    if (chosen.length === sourceCount) break;
    if (chosen.some((d) => Math.abs(d.u - c.u) < 1e-6 && Math.abs(d.mag - c.mag) < 1e-3)) continue;
    chosen.push(c);
  }
  if (chosen.length < sourceCount) {
    throw new DomainError(`root-MUSIC found only ${chosen.length} visible roots inside the unit circle for ${sourceCount} sources; check sourceCount and the geometry.`);
  }
  chosen.sort((p, q) => p.u - q.u);
  return { directionCosines: Float64Array.from(chosen, (c) => c.u), rootMagnitudes: Float64Array.from(chosen, (c) => c.mag) };
}
