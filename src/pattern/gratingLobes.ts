/**
 * Grating lobes: which Floquet images of the main beam enter visible space.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertPositive, describeValue } from '../internal/validate.js';
import { wavelengthM } from '../units/convert.js';
import type { Vector3 } from '../geometry/layout.js';

/**
 * One grating lobe (a visible Floquet image of the main beam).
 * @category Pattern
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
 * Grating lobes of a planar lattice (basis a₁, a₂ in the xy-plane) scanned to (u₀, v₀).
 *
 * @remarks
 * With w = a(r̂₀), AF peaks wherever k(r̂ − r̂₀)·rₘₙ ∈ 2πℤ for every lattice
 * vector, i.e. at (u, v) = (u₀, v₀) + λ(p b₁ + q b₂) with the reciprocal basis
 * aᵢ·bⱼ = δᵢⱼ (the Floquet images). Those with u² + v² ≤ 1 are visible
 * (R. J. Mailloux, *Phased Array Antenna Handbook*, 2nd ed., Artech House,
 * 2005, §2.1 — from memory). The main beam (p = q = 0) is not listed.
 * @param basis1M - Lattice vector a₁ [m], (x, y).
 * @param basis2M - Lattice vector a₂ [m], (x, y).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param scanU - u₀ of the scan direction.
 * @param scanV - v₀ of the scan direction (u₀² + v₀² ≤ 1).
 * @returns The visible grating lobes, nearest to the main beam first.
 * @throws {@link DomainError} for parallel/non-finite basis vectors, a bad frequency or an invisible scan direction.
 * @example
 * ```ts
 * // square lattice, d = 0.6λ at 3 GHz, scanned to u₀ = 0.5: one lobe at u = 0.5 − 1/0.6 = −1.1667 → invisible
 * gratingLobes([0.06, 0], [0, 0.06], 2.99792458e9, 0.5, 0); // []
 * // scanned to u₀ = 0.7 the lobe at u = 0.7 − 1/0.6 is visible:
 * gratingLobes([0.06, 0], [0, 0.06], 2.99792458e9, 0.7, 0); // [{ orderP: -1, u: -0.9667, … }]
 * ```
 * @category Pattern
 */
export function gratingLobes(
  basis1M: readonly [number, number], basis2M: readonly [number, number], frequencyHz: number, scanU: number, scanV: number,
): GratingLobe[] {
  for (const [name, v] of [['basis1M', basis1M], ['basis2M', basis2M]] as const) {
    if (!Array.isArray(v) || v.length !== 2 || !Number.isFinite(v[0]) || !Number.isFinite(v[1])) {
      throw new DomainError(`invalid argument "${name}": expected a finite [x, y] pair in metres, received ${describeValue(v)}.`);
    }
  }
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  assertFinite('scanU', scanU);
  assertFinite('scanV', scanV);
  if (scanU * scanU + scanV * scanV > 1 + 1e-12) {
    throw new DomainError(`invalid arguments "scanU", "scanV": u₀² + v₀² = ${scanU * scanU + scanV * scanV} > 1 is outside the visible region; scan to a real direction.`);
  }
  const [ax, ay] = basis1M, [bx, by] = basis2M;
  const det = ax * by - ay * bx;
  if (!(Math.abs(det) > 1e-12 * Math.hypot(ax, ay) * Math.hypot(bx, by))) {
    throw new DomainError(`invalid arguments "basis1M", "basis2M": the lattice vectors are parallel (cross product ${det}); give two independent vectors.`);
  }
  const lam = wavelengthM(frequencyHz);
  // reciprocal basis scaled by λ: g₁ = λ(by, −bx)/det, g₂ = λ(−ay, ax)/det
  const g1x = (lam * by) / det, g1y = (-lam * bx) / det, g2x = (-lam * ay) / det, g2y = (lam * ax) / det;
  // |p g₁ + q g₂| ≤ 2 ⇒ |p| ≤ 2|a₁|/λ + 1 (since p = a₁·(image shift)/λ)
  const pMax = Math.ceil((2 * Math.hypot(ax, ay)) / lam) + 1, qMax = Math.ceil((2 * Math.hypot(bx, by)) / lam) + 1;
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
 * @category Pattern
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
