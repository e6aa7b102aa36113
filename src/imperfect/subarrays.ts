/**
 * Contiguous subarrays on a rectangular grid, and phase versus true-time-delay
 * steering across a band (beam squint).
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout, type Vector3 } from '../geometry/layout.js';
import { assertUnitVector } from '../geometry/directions.js';
import { assertGridSpec, type RectangularGridSpec } from '../geometry/builders.js';
import { arrayFactorInto } from '../pattern/arrayFactor.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * A partition of an array's elements into subarrays.
 * @category Imperfect
 */
export interface SubarrayLayout {
  /** Subarray of each element, length N (grid order iy·countX + ix for grids). */
  readonly index: Int32Array;
  /** Number of subarrays S. */
  readonly count: number;
  /** Phase centre (mean element position) of each subarray [m], 3S values. */
  readonly centresM: Float64Array;
  /** Periods of the subarray-centre lattice along x and y [m] (grid subarrays: perX·dx, perY·dy; Infinity along an axis holding a single subarray). */
  readonly periodM?: readonly [number, number];
}

/**
 * Contiguous rectangular subarrays of a uniform rectangular grid.
 *
 * @remarks
 * The grid ({@link rectangularGridLayout}, element index iy·countX + ix) is cut
 * into blocks of `perX` × `perY` elements; subarray index sy·(countX/perX) + sx.
 * The subarray centres form a lattice of spacing perX·dx × perY·dy: with phase
 * shifters per element and delay (or a phase) per subarray, its grating lobes
 * are where quantisation lobes of subarray-level steering appear
 * (R. J. Mailloux, *Phased Array Antenna Handbook*, 3rd ed., 2017, ch. on
 * subarrays and time delay, from memory).
 * @param grid - The grid.
 * @param perX - Elements per subarray along x (divides countX).
 * @param perY - Elements per subarray along y (divides countY). @defaultValue 1
 * @returns The partition and the subarray centres.
 * @throws {@link DomainError} if a block size does not divide the grid.
 * @example
 * ```ts
 * gridSubarrays({ countX: 8, countY: 4, spacingXM: 0.05, spacingYM: 0.05 }, 4, 2).count; // 4
 * ```
 * @category Imperfect
 */
export function gridSubarrays(grid: RectangularGridSpec, perX: number, perY = 1): SubarrayLayout {
  assertGridSpec('grid', grid);
  assertInteger('perX', perX, 1, grid.countX);
  assertInteger('perY', perY, 1, grid.countY);
  if (grid.countX % perX !== 0 || grid.countY % perY !== 0) {
    throw new DomainError(`invalid arguments "perX", "perY": expected divisors of the grid counts ${grid.countX}×${grid.countY}, received ${perX}×${perY}.`);
  }
  const sx = grid.countX / perX, sy = grid.countY / perY, count = sx * sy;
  const index = new Int32Array(grid.countX * grid.countY), centresM = new Float64Array(3 * count);
  for (let iy = 0; iy < grid.countY; iy++) {
    for (let ix = 0; ix < grid.countX; ix++) index[iy * grid.countX + ix] = Math.floor(iy / perY) * sx + Math.floor(ix / perX);
  }
  for (let s = 0; s < count; s++) {
    const bx = s % sx, by = Math.floor(s / sx);
    centresM[3 * s] = ((bx + 0.5) * perX - grid.countX / 2) * grid.spacingXM;
    centresM[3 * s + 1] = ((by + 0.5) * perY - grid.countY / 2) * grid.spacingYM;
  }
  return { index, count, centresM, periodM: [sx > 1 ? perX * grid.spacingXM : Infinity, sy > 1 ? perY * grid.spacingYM : Infinity] };
}

/**
 * How a beam is steered across a band: `'phase'` (phase shifters set at the
 * design frequency f₀), `'elementDelay'` (true time delay at every element) or
 * `'subarrayDelay'` (phase shifters at f₀ inside each subarray, true time delay
 * from each subarray centre).
 * @category Imperfect
 */
export type SteeringHardware = 'phase' | 'elementDelay' | 'subarrayDelay';

/**
 * Weights realised at frequency f by steering hardware set for direction r̂₀ at f₀.
 *
 * @remarks
 * With steering aₙ(r̂) = e^{jk r̂·rₙ} (docs/conventions.md): phase steering keeps
 * the phases of f₀, wₙ = e^{jk₀ r̂₀·rₙ}; element delay gives wₙ = e^{jk r̂₀·rₙ};
 * subarray delay gives wₙ = e^{jk₀ r̂₀·(rₙ − c_s)}·e^{jk r̂₀·c_s}, c_s the centre of
 * the element's subarray. The amplitude taper multiplies (conjugate-free) each wₙ.
 * @param layout - Element positions [m].
 * @param direction - Beam direction r̂₀ (unit vector).
 * @param designFrequencyHz - f₀ [Hz], > 0.
 * @param frequencyHz - f [Hz], > 0.
 * @param hardware - Steering hardware.
 * @param subarrays - Required for `'subarrayDelay'`.
 * @param taper - Real amplitude per element (dimensionless). @defaultValue all 1
 * @returns Weights w, N×1.
 * @throws {@link DomainError} for bad arguments or a missing subarray partition.
 * @category Imperfect
 */
export function bandSteeringWeights(
  layout: ArrayLayout, direction: Vector3, designFrequencyHz: number, frequencyHz: number,
  hardware: SteeringHardware, subarrays?: SubarrayLayout, taper?: ArrayLike<number>,
): CMatrix {
  assertLayout('layout', layout);
  assertUnitVector('direction', direction);
  assertPositive('designFrequencyHz', designFrequencyHz, 'Hz');
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const n = layout.count;
  if (hardware !== 'phase' && hardware !== 'elementDelay' && hardware !== 'subarrayDelay') {
    throw new DomainError(`invalid argument "hardware": expected 'phase', 'elementDelay' or 'subarrayDelay', received ${describeValue(hardware)}.`);
  }
  if (hardware === 'subarrayDelay' && (!subarrays || subarrays.index?.length !== n)) {
    throw new DomainError(`invalid argument "subarrays": 'subarrayDelay' needs a partition of all ${n} elements (see gridSubarrays), received ${describeValue(subarrays)}.`);
  }
  if (taper !== undefined && taper.length !== n) {
    throw new DomainError(`invalid argument "taper": expected ${n} amplitudes, received ${describeValue(taper)}.`);
  }
  const k0 = wavenumberRadPerM(designFrequencyHz), k = wavenumberRadPerM(frequencyHz);
  const p = layout.positionsM, out = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const dot = (x: number, y: number, z: number): number => direction[0] * x + direction[1] * y + direction[2] * z;
    let ph: number;
    if (hardware === 'phase') ph = k0 * dot(p[3 * i], p[3 * i + 1], p[3 * i + 2]);
    else if (hardware === 'elementDelay') ph = k * dot(p[3 * i], p[3 * i + 1], p[3 * i + 2]);
    else {
      const s = (subarrays as SubarrayLayout).index[i], c = (subarrays as SubarrayLayout).centresM;
      ph = k0 * dot(p[3 * i] - c[3 * s], p[3 * i + 1] - c[3 * s + 1], p[3 * i + 2] - c[3 * s + 2]) + k * dot(c[3 * s], c[3 * s + 1], c[3 * s + 2]);
    }
    const a = taper ? taper[i] : 1;
    out[2 * i] = a * Math.cos(ph);
    out[2 * i + 1] = a * Math.sin(ph);
  }
  return matrixView(n, 1, out);
}

/**
 * Beam pointing and gain at one frequency of {@link beamSquint}.
 * @category Imperfect
 */
export interface SquintPoint {
  /** Frequency [Hz]. */
  readonly frequencyHz: number;
  /** Direction cosine of the beam peak along the scan plane (dimensionless). */
  readonly peakU: number;
  /** Pointing error: asin(peakU) − asin(u₀) [rad] (angle within the scan plane from broadside). */
  readonly pointingErrorRad: number;
  /** Gain loss at the intended direction, −10·log10(|AF(r̂₀, f)|²/(Σ|wₙ|)²) [dB] (≥ 0). */
  readonly gainLossDb: number;
  /**
   * Subarray delay with a lattice period (`subarrays.periodM`): the highest array-factor level
   * at the grating directions of the subarray-centre lattice, (u₀ + mλ/P_x, v₀ + nλ/P_y) inside
   * visible space, (m, n) ≠ (0, 0), relative to the beam peak [dB]; absent when none is visible.
   */
  readonly subarrayLobeDb?: number;
}

/**
 * Beam squint of a planar array across a band: where the beam peaks and what
 * it loses at the intended direction, for phase or true-time-delay steering.
 *
 * @remarks
 * The peak is searched along the scan plane (the plane through +z and r̂₀) by
 * golden-section refinement of a scan of the array factor within ±3 beamwidths
 * (λ/D) of the phase-steering prediction. For phase steering of a line or plane
 * array the identity is sin θ(f) = (f₀/f)·sin θ₀ (the progressive phase is
 * fixed, so k·sin θ is); time delay removes the squint (R. J. Mailloux,
 * *Phased Array Antenna Handbook*, 3rd ed., 2017, ch. on wideband scanning,
 * from memory; the identity follows from the steering convention). The gain
 * loss is that of the array factor (isotropic elements). With subarray delay
 * the subarray centres are steered by true time delay, so their array factor
 * keeps its grating lobes at (u₀ + mλ/P_x, v₀ + nλ/P_y) for the lattice periods
 * P of the subarray centres; away from f₀ the subarray pattern no longer nulls
 * them and they appear as quantisation lobes of the subarray spacing (Mailloux,
 * ibid., from memory). `subarrayLobeDb` is the array factor there relative to
 * the beam peak (the lobe peaks sit within a fraction of a subarray beamwidth of
 * these points). For a uniform line of S subarrays of P elements the level at
 * u_m is S²·sin²(P x_m/2)/sin²(x_m/2), x_m = (k u_m − k₀u₀)d (geometric series).
 * The peak is searched in the scan plane, the in-plane maximum, which for
 * separable grid weights is the peak.
 * @param layout - Element positions [m] (planar, z = 0).
 * @param direction - Beam direction r̂₀.
 * @param designFrequencyHz - f₀ [Hz].
 * @param frequenciesHz - Frequencies to evaluate [Hz].
 * @param hardware - Steering hardware (see {@link bandSteeringWeights}).
 * @param subarrays - Partition for `'subarrayDelay'`.
 * @param taper - Real amplitudes. @defaultValue all 1
 * @returns One point per frequency.
 * @throws {@link DomainError} for a non-planar layout or bad arguments.
 * @example
 * ```ts
 * const layout = uniformLineLayout(32, 0.05);
 * const s = beamSquint(layout, [0.5, 0, Math.sqrt(0.75)], 3e9, [2.5e9], 'phase');
 * s[0].peakU; // ≈ 0.6000 (0.5 · 3/2.5)
 * ```
 * @category Imperfect
 */
export function beamSquint(
  layout: ArrayLayout, direction: Vector3, designFrequencyHz: number, frequenciesHz: ArrayLike<number>,
  hardware: SteeringHardware, subarrays?: SubarrayLayout, taper?: ArrayLike<number>,
): SquintPoint[] {
  assertLayout('layout', layout);
  for (let i = 0; i < layout.count; i++) {
    if (layout.positionsM[3 * i + 2] !== 0) throw new DomainError(`invalid argument "layout": beamSquint needs a planar array in z = 0; element ${i} has z = ${layout.positionsM[3 * i + 2]} m.`);
  }
  assertUnitVector('direction', direction);
  const s0 = Math.hypot(direction[0], direction[1]);
  const ax = s0 > 0 ? direction[0] / s0 : 1, ay = s0 > 0 ? direction[1] / s0 : 0;
  // extent of the array along the scan plane: max − min of the projections
  let tMin = Infinity, tMax = -Infinity;
  const p = layout.positionsM;
  for (let i = 0; i < layout.count; i++) {
    const t = p[3 * i] * ax + p[3 * i + 1] * ay;
    tMin = Math.min(tMin, t); tMax = Math.max(tMax, t);
  }
  const extent = tMax - tMin;
  const out1 = { rows: 1, cols: 1, data: new Float64Array(2) }, dir = new Float64Array(3);
  return Array.from(frequenciesHz, (f) => {
    assertPositive('frequenciesHz[]', f, 'Hz');
    const w = bandSteeringWeights(layout, direction, designFrequencyHz, f, hardware, subarrays, taper);
    const power = (u: number): number => {
      const uu = Math.max(-1, Math.min(1, u));
      dir[0] = uu * ax; dir[1] = uu * ay; dir[2] = Math.sqrt(1 - uu * uu);
      arrayFactorInto(out1, layout, w, dir, f);
      return out1.data[0] ** 2 + out1.data[1] ** 2;
    };
    const lam = 299792458 / f, bw = extent > 0 ? lam / extent : 1;
    const guess = Math.max(-1, Math.min(1, (s0 * designFrequencyHz) / f));
    const centre = hardware === 'phase' ? guess : s0;
    let best = centre, bestP = -1;
    const steps = 120;
    for (let i = 0; i <= steps; i++) {
      const u = Math.max(-1, Math.min(1, centre - 3 * bw + (6 * bw * i) / steps)), pw = power(u);
      if (pw > bestP) { bestP = pw; best = u; }
    }
    let lo = Math.max(-1, best - (6 * bw) / steps), hi = Math.min(1, best + (6 * bw) / steps);
    const g = (Math.sqrt(5) - 1) / 2;
    let x1 = hi - g * (hi - lo), x2 = lo + g * (hi - lo), f1 = power(x1), f2 = power(x2);
    for (let it = 0; it < 80; it++) {
      if (f1 > f2) { hi = x2; x2 = x1; f2 = f1; x1 = hi - g * (hi - lo); f1 = power(x1); } else { lo = x1; x1 = x2; f1 = f2; x2 = lo + g * (hi - lo); f2 = power(x2); }
    }
    const peakU = 0.5 * (lo + hi);
    let sumA = 0;
    for (let i = 0; i < layout.count; i++) sumA += Math.hypot(w.data[2 * i], w.data[2 * i + 1]);
    const at = power(s0);
    const point: SquintPoint = { frequencyHz: f, peakU, pointingErrorRad: Math.asin(peakU) - Math.asin(s0), gainLossDb: -10 * Math.log10(at / (sumA * sumA)) };
    if (hardware !== 'subarrayDelay' || !subarrays?.periodM) return point;
    const lobe = latticeLobeLevel(layout, w, direction, f, subarrays.periodM, dir, out1);
    return lobe === undefined ? point : { ...point, subarrayLobeDb: 10 * Math.log10(lobe / power(peakU)) };
  });
}

/** Largest |AF|² at the visible grating directions of a lattice of periods P around r̂₀ (undefined: none visible). */
function latticeLobeLevel(
  layout: ArrayLayout, w: CMatrix, direction: Vector3, f: number, periodM: readonly [number, number], dir: Float64Array, out1: CMatrix,
): number | undefined {
  const lam = 299792458 / f;
  // an axis without periodicity (one subarray along it) has no grating orders
  const du = lam / periodM[0], dv = lam / periodM[1];
  const mMax = du > 0 ? Math.ceil(2 / du) : 0, nMax = dv > 0 ? Math.ceil(2 / dv) : 0;
  let best: number | undefined;
  for (let m = -mMax; m <= mMax; m++) {
    for (let n = -nMax; n <= nMax; n++) {
      if (m === 0 && n === 0) continue;
      const u = direction[0] + m * du, v = direction[1] + n * dv, r = u * u + v * v;
      if (r >= 1) continue;
      dir[0] = u; dir[1] = v; dir[2] = Math.sqrt(1 - r);
      arrayFactorInto(out1, layout, w, dir, f);
      const p = out1.data[0] ** 2 + out1.data[1] ** 2;
      if (best === undefined || p > best) best = p;
    }
  }
  return best;
}
