/**
 * Grating lobes of planar lattices: which Floquet modes enter visible space,
 * grating-lobe circles for a u-v diagram, the grating-lobe-free scan cone and
 * the largest spacing for a required cone, and the grating lobes of one scan (one grating-lobe
 * API for every module: pattern, floquet, taper, design and the command line).
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertInRange, assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import type { Vector3 } from './layout.js';
import { wavelengthM, wavenumberRadPerM } from '../units/convert.js';
import { type PlanarLattice, assertLattice, planarLattice, rectangularLattice, scaleLattice, shortestReciprocalVector, triangularLattice } from './lattice.js';

/**
 * One circle of a grating-lobe diagram.
 * @category Geometry
 */
export interface GratingLobeCircle {
  /** Floquet index along b₁. */
  readonly m: number;
  /** Floquet index along b₂. */
  readonly n: number;
  /** Centre u = (m b₁ + n b₂)ₓ/k (dimensionless). */
  readonly centerU: number;
  /** Centre v = (m b₁ + n b₂)ᵧ/k (dimensionless). */
  readonly centerV: number;
  /** Radius: 1 (the unit circle of visible space). */
  readonly radius: number;
}

/**
 * Data of a grating-lobe diagram (the lobes present at one scan: the pattern module's `gratingLobes`): the visible-space unit circle copied to every reciprocal-lattice point (m b₁ + n b₂)/k.
 *
 * @remarks
 * A scan point (u₀, v₀) lying inside the circle centred at −(m b₁ + n b₂)/k produces the grating
 * lobe (m, n); because the reciprocal lattice is symmetric, the set of circles is the same, so the
 * grating-lobe-free scan region is the part of the central unit circle outside every other circle.
 * Reference: R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, ch. 2 (from memory).
 * @param lattice - Array lattice.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param maxOrder - Largest |m|, |n| listed; default 2.
 * @returns Circles, the central (0, 0) one first, then by distance of the centre from the origin.
 * @throws {@link DomainError} for a non-positive frequency or a bad `maxOrder`.
 * @category Geometry
 */
export function gratingLobeCircles(lattice: PlanarLattice, frequencyHz: number, maxOrder = 2): GratingLobeCircle[] {
  const k = wavenumberRadPerM(frequencyHz);
  assertInteger('maxOrder', maxOrder, 0, 100);
  const circles: GratingLobeCircle[] = [];
  for (let m = -maxOrder; m <= maxOrder; m++) {
    for (let n = -maxOrder; n <= maxOrder; n++) {
      circles.push({
        m, n,
        centerU: (m * lattice.b1xRadPerM + n * lattice.b2xRadPerM) / k,
        centerV: (m * lattice.b1yRadPerM + n * lattice.b2yRadPerM) / k,
        radius: 1,
      });
    }
  }
  circles.sort((p, q) => Math.hypot(p.centerU, p.centerV) - Math.hypot(q.centerU, q.centerV));
  return circles;
}

/**
 * Largest scan cone θ ≤ θ_max (all azimuths) free of grating lobes for a lattice and frequency.
 *
 * @remarks
 * With c = min over (m, n) ≠ (0, 0) of |m b₁ + n b₂|/k, every scan with sinθ₀ < c − 1 keeps all
 * grating lobes outside visible space, and a scan at sinθ₀ = c − 1 along the shortest reciprocal
 * vector puts one on the horizon: sin θ_max = c − 1 (clamped to [0, 1]). For a square lattice of
 * spacing d this is d/λ = 1/(1 + sinθ_max); for an equilateral triangular lattice of side d,
 * d/λ = 2/(√3 (1 + sinθ_max)).
 * Reference: R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, ch. 2 (from memory).
 * @param lattice - Array lattice.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns θ_max [rad]; 0 when a grating lobe is visible even at broadside, π/2 when no scan produces one.
 * @throws {@link DomainError} for a non-positive frequency.
 * @category Geometry
 */
export function gratingLobeFreeScanConeRad(lattice: PlanarLattice, frequencyHz: number): number {
  const k = wavenumberRadPerM(frequencyHz);
  const s = shortestReciprocalVector(lattice) / k - 1;
  if (s <= 0) return 0;
  if (s >= 1) return Math.PI / 2;
  return Math.asin(s);
}

/**
 * Scale factor that makes a lattice shape just free of grating lobes over a scan cone: the
 * lattice {@link scaleLattice}(lattice, factor) has θ_max equal to `scanConeRad`.
 * @param lattice - Lattice shape (any size).
 * @param scanConeRad - Required cone half-angle θ_max [rad], in [0, π/2].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns The largest allowed scale factor (dimensionless).
 * @throws {@link DomainError} for a non-positive frequency or a cone outside [0, π/2].
 * @category Geometry
 */
export function latticeScaleForScanCone(lattice: PlanarLattice, scanConeRad: number, frequencyHz: number): number {
  assertInRange('scanConeRad', scanConeRad, 0, Math.PI / 2, 'rad');
  const k = wavenumberRadPerM(frequencyHz);
  return shortestReciprocalVector(lattice) / (k * (1 + Math.sin(scanConeRad)));
}

/**
 * Largest spacings of square and equilateral-triangular lattices free of grating lobes over a
 * scan cone, and the element-count saving of the triangular lattice.
 * @category Geometry
 */
export interface ScanConeSpacing {
  /** Square lattice spacing d = λ/(1 + sinθ_max) [m]. */
  readonly squareSpacingM: number;
  /** Equilateral triangle side d = 2λ/(√3 (1 + sinθ_max)) [m]. */
  readonly triangularSideM: number;
  /** Square cell area [m²]. */
  readonly squareCellAreaM2: number;
  /** Triangular cell area (√3/2) d² [m²]. */
  readonly triangularCellAreaM2: number;
  /** Elements of the triangular lattice per element of the square one for the same aperture: √3/2 ≈ 0.866. */
  readonly elementCountRatio: number;
  /** Fraction of elements saved by the triangular lattice: 1 − √3/2 ≈ 0.134. */
  readonly elementSaving: number;
}

/**
 * Largest element spacing that keeps grating lobes out of visible space over a scan cone, for
 * square and equilateral triangular lattices.
 *
 * @remarks
 * Computed from the reciprocal lattices ({@link latticeScaleForScanCone}). The triangular lattice
 * covers the same cone with cells 2/√3 ≈ 1.155 times larger, i.e. 13.4 % fewer elements.
 * References: E. D. Sharp, "A triangular arrangement of planar-array elements that reduces the
 * number of needed elements", IRE Trans. Antennas Propag., 9(2), 1961 (from memory); R. C. Hansen,
 * *Phased Array Antennas*, 2nd ed., Wiley, 2009, ch. 2 (from memory).
 * @param scanConeRad - Required cone half-angle θ_max [rad], in [0, π/2].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns Spacings [m], cell areas [m²] and the element-count figures.
 * @throws {@link DomainError} for a non-positive frequency or a cone outside [0, π/2].
 * @category Geometry
 */
export function spacingForScanCone(scanConeRad: number, frequencyHz: number): ScanConeSpacing {
  assertInRange('scanConeRad', scanConeRad, 0, Math.PI / 2, 'rad');
  const lambda = wavelengthM(frequencyHz);
  const square = scaleLattice(rectangularLattice(lambda, lambda), latticeScaleForScanCone(rectangularLattice(lambda, lambda), scanConeRad, frequencyHz));
  const tri = scaleLattice(triangularLattice(lambda), latticeScaleForScanCone(triangularLattice(lambda), scanConeRad, frequencyHz));
  const ratio = square.cellAreaM2 / tri.cellAreaM2;
  return {
    squareSpacingM: square.a1xM,
    triangularSideM: tri.a1xM,
    squareCellAreaM2: square.cellAreaM2,
    triangularCellAreaM2: tri.cellAreaM2,
    elementCountRatio: ratio,
    elementSaving: 1 - ratio,
  };
}

/**
 * One grating lobe (a visible Floquet image of the main beam).
 * @category Geometry
 */
export interface GratingLobe {
  /** Image order along the first reciprocal vector. */
  readonly orderP: number;
  /** Image order along the second reciprocal vector (0 for a line array). */
  readonly orderQ: number;
  /** Direction cosine u of the lobe. */
  readonly u: number;
  /** Direction cosine v of the lobe. */
  readonly v: number;
  /** Unit vector of the lobe in the front hemisphere (z ≥ 0). */
  readonly direction: Vector3;
}

/**
 * Grating lobes of a planar lattice scanned to (u₀, v₀): the visible Floquet images of the main beam.
 *
 * @remarks
 * With w = a(r̂₀), AF peaks wherever k(r̂ − r̂₀)·rₘₙ ∈ 2πℤ for every lattice vector, i.e. at
 * (u, v) = (u₀, v₀) + (p b₁ + q b₂)/k with the reciprocal basis aᵢ·bⱼ = 2πδᵢⱼ (the Floquet
 * images). Those with u² + v² ≤ 1 are visible (R. J. Mailloux, *Phased Array Antenna Handbook*,
 * 2nd ed., Artech House, 2005, §2.1 — from memory). The main beam (p = q = 0) is not listed.
 * One grating-lobe API of the library: the diagram circles ({@link gratingLobeCircles}) and the
 * free scan cone ({@link gratingLobeFreeScanConeRad}) take the same {@link PlanarLattice}.
 * The form `gratingLobes(basis1M, basis2M, frequencyHz, scanU, scanV)` of earlier versions is
 * deprecated and kept for one minor version.
 * @param lattice - The array's lattice (e.g. `layout.lattice` of a lattice layout, {@link planarLattice}).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param scanU - u₀ of the scan direction.
 * @param scanV - v₀ of the scan direction (u₀² + v₀² ≤ 1).
 * @returns The visible grating lobes, nearest to the main beam first.
 * @throws {@link DomainError} for a bad lattice or frequency or an invisible scan direction.
 * @example
 * ```ts
 * // square lattice, d = 0.6λ at 3 GHz, scanned to u₀ = 0.5: one lobe at u = 0.5 − 1/0.6 = −1.1667 → invisible
 * gratingLobes(rectangularLattice(0.06, 0.06), 2.99792458e9, 0.5, 0); // []
 * // scanned to u₀ = 0.7 the lobe at u = 0.7 − 1/0.6 is visible:
 * gratingLobes(rectangularLattice(0.06, 0.06), 2.99792458e9, 0.7, 0); // [{ orderP: -1, u: -0.9667, … }]
 * ```
 * @category Geometry
 */
export function gratingLobes(lattice: PlanarLattice, frequencyHz: number, scanU: number, scanV: number): GratingLobe[];
/** @deprecated Pass a {@link PlanarLattice}: `gratingLobes(planarLattice(basis1M, basis2M), frequencyHz, scanU, scanV)`. */
export function gratingLobes(basis1M: readonly [number, number], basis2M: readonly [number, number], frequencyHz: number, scanU: number, scanV: number): GratingLobe[];
export function gratingLobes(...args: unknown[]): GratingLobe[] {
  let lattice: PlanarLattice, frequencyHz: number, scanU: number, scanV: number;
  if (Array.isArray(args[0])) {
    for (const [name, v] of [['basis1M', args[0]], ['basis2M', args[1]]] as const) {
      if (!Array.isArray(v) || v.length !== 2 || !Number.isFinite(v[0]) || !Number.isFinite(v[1])) {
        throw new DomainError(`invalid argument "${name}": expected a finite [x, y] pair in metres, received ${describeValue(v)}.`);
      }
    }
    lattice = planarLattice(args[0] as [number, number], args[1] as [number, number]);
    [frequencyHz, scanU, scanV] = args.slice(2) as number[];
  } else {
    lattice = assertLattice('lattice', args[0]);
    [frequencyHz, scanU, scanV] = args.slice(1) as number[];
  }
  const k = wavenumberRadPerM(frequencyHz);
  assertFinite('scanU', scanU);
  assertFinite('scanV', scanV);
  if (scanU * scanU + scanV * scanV > 1 + 1e-12) {
    throw new DomainError(`invalid arguments "scanU", "scanV": u₀² + v₀² = ${scanU * scanU + scanV * scanV} > 1 is outside the visible region; scan to a real direction.`);
  }
  const g1x = lattice.b1xRadPerM / k, g1y = lattice.b1yRadPerM / k, g2x = lattice.b2xRadPerM / k, g2y = lattice.b2yRadPerM / k;
  // |p g₁ + q g₂| ≤ 2 ⇒ |p| ≤ 2|a₁|k/2π + 1 (p = a₁·(image shift)·k/2π)
  const pMax = Math.ceil((2 * Math.hypot(lattice.a1xM, lattice.a1yM) * k) / (2 * Math.PI)) + 1;
  const qMax = Math.ceil((2 * Math.hypot(lattice.a2xM, lattice.a2yM) * k) / (2 * Math.PI)) + 1;
  const out: Array<GratingLobe & { d: number }> = [];
  for (let p = -pMax; p <= pMax; p++) {
    for (let q = -qMax; q <= qMax; q++) {
      if (p === 0 && q === 0) continue;
      const u = scanU + p * g1x + q * g2x, v = scanV + p * g1y + q * g2y;
      const s = u * u + v * v;
      if (s <= 1) out.push({ orderP: p, orderQ: q, u, v, direction: [u, v, Math.sqrt(1 - s)], d: Math.hypot(u - scanU, v - scanV) });
    }
  }
  out.sort((a, b) => a.d - b.d);
  return out.map(({ d: _d, ...lobe }) => lobe);
}

/**
 * Grating lobes of a uniform line array (spacing d along x) scanned to u₀ = sinθ₀:
 * uₚ = u₀ + pλ/d with |uₚ| ≤ 1, p ≠ 0 (Balanis 2016, §6.3 — from memory).
 * @param spacingM - Element spacing d [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param scanU - u₀ = sin of the scan angle from broadside, in [−1, 1].
 * @returns Visible lobes (orderQ = 0, v = 0, direction in the xz-plane), nearest first.
 * @throws {@link DomainError} for bad inputs.
 * @category Geometry
 */
export function lineGratingLobes(spacingM: number, frequencyHz: number, scanU: number): GratingLobe[] {
  assertPositive('spacingM', spacingM, 'm');
  assertFinite('scanU', scanU);
  if (Math.abs(scanU) > 1) throw new DomainError(`invalid argument "scanU": expected u₀ in [−1, 1], received ${scanU}.`);
  const g = wavelengthM(frequencyHz) / spacingM;
  const out: GratingLobe[] = [];
  const pMax = Math.ceil(2 / g) + 1;
  for (let p = -pMax; p <= pMax; p++) {
    const u = scanU + p * g;
    if (p !== 0 && Math.abs(u) <= 1) out.push({ orderP: p, orderQ: 0, u, v: 0, direction: [u, 0, Math.sqrt(1 - u * u)] });
  }
  return out.sort((a, b) => Math.abs(a.u - scanU) - Math.abs(b.u - scanU));
}
