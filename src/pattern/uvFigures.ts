/**
 * Peak and sidelobe figures of a pattern sampled on a u-v grid.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { describeValue } from '../internal/validate.js';
import type { UvGrid } from '../geometry/grids.js';

/**
 * Result of {@link uvPatternFigures}.
 * @category Pattern
 */
export interface UvPatternFigures {
  /** Grid index of the peak. */
  readonly peakIndex: number;
  /** (u, v) of the peak. */
  readonly peakU: number;
  /** v of the peak. */
  readonly peakV: number;
  /** 1 for grid points in the main lobe, else 0. */
  readonly mainLobe: Uint8Array;
  /** Highest visible sample outside the main lobe relative to the peak [dB, power ratio], or undefined if none. */
  readonly peakSidelobeDb: number | undefined;
  /** Grid index of that sample, or −1. */
  readonly peakSidelobeIndex: number;
  /** Σ|F|² outside / Σ|F|² inside the main lobe over visible points, in the u-v measure du·dv [dB], or undefined. */
  readonly integratedSidelobeRatioDb: number | undefined;
}

/**
 * Main lobe, peak sidelobe and integrated sidelobe ratio of |F| sampled on a u-v grid.
 *
 * @remarks
 * Only visible points (u² + v² ≤ 1) count. The main lobe is the set of points
 * reachable from the peak by steps to a 4-neighbour whose value does not
 * increase — the region inside the first-null contour — so a scanned beam is
 * excluded exactly like a broadside one, whatever its shape. Sidelobe figures
 * come from the samples outside it (no refinement: sample finely enough).
 * @param magnitude - |F| per grid point (length grid.count, ≥ 0).
 * @param grid - The u-v grid.
 * @returns The figures.
 * @throws {@link DimensionError} on length mismatch or no visible point; {@link DomainError} for negative/non-finite samples.
 * @category Pattern
 */
export function uvPatternFigures(magnitude: Float64Array, grid: UvGrid): UvPatternFigures {
  if (!grid || !(magnitude instanceof Float64Array) || magnitude.length !== grid.count) {
    throw new DimensionError(`invalid argument "magnitude": expected a Float64Array of length ${grid ? grid.count : '?'} (one value per grid point), received ${describeValue(magnitude)}.`);
  }
  if (grid.visibleCount < 1) throw new DimensionError('invalid argument "grid": no visible point (u² + v² ≤ 1).');
  let peak = -1;
  for (let k = 0; k < grid.count; k++) {
    const f = magnitude[k];
    if (!Number.isFinite(f) || f < 0) throw new DomainError(`invalid argument "magnitude": entry ${k} is ${describeValue(f)}; magnitudes must be finite and ≥ 0.`);
    if (grid.visible[k] && (peak < 0 || f > magnitude[peak])) peak = k;
  }
  const nu = grid.uCount, nv = grid.vCount;
  const main = new Uint8Array(grid.count);
  const stack = [peak];
  main[peak] = 1;
  while (stack.length) {
    const k = stack.pop()!;
    const i = k % nu, j = (k - i) / nu;
    const nb = [i > 0 ? k - 1 : -1, i < nu - 1 ? k + 1 : -1, j > 0 ? k - nu : -1, j < nv - 1 ? k + nu : -1];
    for (const q of nb) {
      if (q >= 0 && !main[q] && grid.visible[q] && magnitude[q] <= magnitude[k]) { main[q] = 1; stack.push(q); }
    }
  }
  let sl = -1, inside = 0, outside = 0;
  for (let k = 0; k < grid.count; k++) {
    if (!grid.visible[k]) continue;
    const p = magnitude[k] * magnitude[k];
    if (main[k]) inside += p;
    else { outside += p; if (sl < 0 || magnitude[k] > magnitude[sl]) sl = k; }
  }
  const pk = magnitude[peak];
  return {
    peakIndex: peak,
    peakU: grid.uValues[peak % nu],
    peakV: grid.vValues[Math.floor(peak / nu)],
    mainLobe: main,
    peakSidelobeDb: sl >= 0 && pk > 0 ? 20 * Math.log10(magnitude[sl] / pk) : undefined,
    peakSidelobeIndex: sl,
    integratedSidelobeRatioDb: sl >= 0 && inside > 0 ? 10 * Math.log10(outside / inside) : undefined,
  };
}
