/**
 * Peak finding on a sampled spectrum with parabolic sub-grid refinement.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertFiniteArray, assertInteger } from '../internal/validate.js';

/**
 * One peak found by {@link findSpectrumPeaks}.
 * @category Beamforming
 */
export interface SpectrumPeak {
  /** Index of the grid sample at the local maximum. */
  readonly index: number;
  /** Refined position [unit of the grid, e.g. rad or direction cosine]. */
  readonly position: number;
  /** Spectrum value at the refined position (from the fitted parabola) [unit of the spectrum]. */
  readonly value: number;
}

/**
 * Options of {@link findSpectrumPeaks}.
 * @category Beamforming
 */
export interface SpectrumPeakOptions {
  /** Keep at most this many peaks, largest first. @defaultValue all */
  maxPeaks?: number;
  /**
   * Quantity the three-point parabola is fitted to: `'value'` the spectrum itself (right for quadratic forms such
   * as the Bartlett spectrum), `'log'` its logarithm (general positive spectra), `'reciprocal'` 1/value (right for
   * the Capon and MUSIC spectra, whose reciprocals aᴴR⁻¹a and aᴴE_nE_nᴴa are smooth quadratic forms).
   * @defaultValue `'value'`
   */
  refineOn?: 'value' | 'log' | 'reciprocal';
}

/**
 * Local maxima of a sampled spectrum with three-point parabolic refinement.
 *
 * @remarks
 * A sample is a peak when it exceeds its left neighbour and is not below its
 * right neighbour (the first sample of a plateau); the two end samples are
 * never peaks (they cannot be refined). The parabola through the three
 * samples (on a possibly non-uniform grid) gives the refined position, kept
 * within the neighbouring samples (common practice: quadratic interpolation of
 * spectral peaks, e.g. J. O. Smith & X. Serra, Proc. ICMC 1987, from memory).
 * @param spectrum - Spectrum samples, length M ≥ 3, finite (positive for `'log'`/`'reciprocal'`).
 * @param grid - Strictly increasing sample positions, length M [any unit].
 * @param options - See {@link SpectrumPeakOptions}.
 * @returns Peaks sorted by value, largest first (the value is the fitted peak value, or the sample value where the fit gives none).
 * @throws {@link DimensionError} on length mismatch; {@link DomainError} on non-finite values, a non-increasing grid,
 *   non-positive values for `'log'`/`'reciprocal'`, or a bad option.
 * @category Beamforming
 */
export function findSpectrumPeaks(spectrum: ArrayLike<number>, grid: ArrayLike<number>, options: SpectrumPeakOptions = {}): SpectrumPeak[] {
  const m = spectrum.length;
  if (grid.length !== m || m < 3) {
    throw new DimensionError(`invalid arguments "spectrum"/"grid": expected equal lengths ≥ 3, received ${m} and ${grid.length}.`);
  }
  assertFiniteArray('spectrum', spectrum);
  assertFiniteArray('grid', grid);
  for (let i = 1; i < m; i++) {
    if (!(grid[i] > grid[i - 1])) throw new DomainError(`invalid argument "grid": expected strictly increasing positions, but grid[${i}] = ${grid[i]} ≤ grid[${i - 1}] = ${grid[i - 1]}.`);
  }
  const mode = options.refineOn ?? 'value';
  if (mode !== 'value' && mode !== 'log' && mode !== 'reciprocal') {
    throw new DomainError(`invalid option "refineOn": expected 'value', 'log' or 'reciprocal', received ${JSON.stringify(mode)}.`);
  }
  const maxPeaks = options.maxPeaks ?? m;
  assertInteger('maxPeaks', maxPeaks, 0);
  if (mode !== 'value') {
    for (let i = 0; i < m; i++) {
      if (!(spectrum[i] > 0)) throw new DomainError(`invalid argument "spectrum": entry ${i} is ${spectrum[i]}; refineOn '${mode}' needs positive values.`);
    }
  }
  const fwd = (v: number) => (mode === 'value' ? v : mode === 'log' ? Math.log(v) : -1 / v);
  const inv = (y: number) => (mode === 'value' ? y : mode === 'log' ? Math.exp(y) : -1 / y);
  const peaks: SpectrumPeak[] = [];
  for (let i = 1; i < m - 1; i++) {
    if (!(spectrum[i] > spectrum[i - 1] && spectrum[i] >= spectrum[i + 1])) continue;
    const x0 = grid[i - 1], x1 = grid[i], x2 = grid[i + 1];
    const y0 = fwd(spectrum[i - 1]), y1 = fwd(spectrum[i]), y2 = fwd(spectrum[i + 1]);
    // Parabola through three points: divided differences.
    const d01 = (y1 - y0) / (x1 - x0), d12 = (y2 - y1) / (x2 - x1);
    const c2 = (d12 - d01) / (x2 - x0);
    let pos = x1, val = spectrum[i];
    if (c2 < 0) {
      const c1 = d01 - c2 * (x0 + x1); // y = c2·x² + c1·x + c0
      pos = Math.min(Math.max(-c1 / (2 * c2), x0), x2);
      const fitted = inv(y0 + d01 * (pos - x0) + c2 * (pos - x0) * (pos - x1)); // Newton form
      // The vertex of a concave fit is never below the sample; for 'reciprocal' a fitted 1/value ≤ 0 (a null
      // spectrum reaching zero) has no finite peak value, so the sample value is kept.
      if (Number.isFinite(fitted) && fitted >= val) val = fitted;
    }
    peaks.push({ index: i, position: pos, value: val });
  }
  peaks.sort((a, b) => b.value - a.value);
  return peaks.slice(0, maxPeaks);
}
