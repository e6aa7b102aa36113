/**
 * Grating lobes of planar lattices: which Floquet modes enter visible space,
 * grating-lobe circles for a u-v diagram, the grating-lobe-free scan cone and
 * the largest spacing for a required cone.
 * @module
 */
import { assertInRange, assertInteger } from '../internal/validate.js';
import { wavelengthM, wavenumberRadPerM } from '../units/convert.js';
import { type PlanarLattice, rectangularLattice, scaleLattice, shortestReciprocalVector, triangularLattice } from './lattice.js';

/**
 * One circle of a grating-lobe diagram.
 * @category Floquet
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
 * @category Floquet
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
 * @category Floquet
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
 * @category Floquet
 */
export function latticeScaleForScanCone(lattice: PlanarLattice, scanConeRad: number, frequencyHz: number): number {
  assertInRange('scanConeRad', scanConeRad, 0, Math.PI / 2, 'rad');
  const k = wavenumberRadPerM(frequencyHz);
  return shortestReciprocalVector(lattice) / (k * (1 + Math.sin(scanConeRad)));
}

/**
 * Largest spacings of square and equilateral-triangular lattices free of grating lobes over a
 * scan cone, and the element-count saving of the triangular lattice.
 * @category Floquet
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
 * @category Floquet
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
