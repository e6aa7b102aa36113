/**
 * Two-dimensional lattices of planar arrays: primitive vectors, reciprocal
 * lattice and unit-cell area.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertPositive, describeValue } from '../internal/validate.js';

/**
 * A 2-D Bravais lattice in the xy-plane (the plane of a planar array).
 *
 * @remarks
 * Element positions are rₘₙ = m·a₁ + n·a₂. The reciprocal vectors obey
 * aᵢ·bⱼ = 2π δᵢⱼ, so exp(−j (m b₁ + n b₂)·r) = 1 at every element.
 * @category Geometry
 */
export interface PlanarLattice {
  /** First primitive vector, x component [m]. */
  readonly a1xM: number;
  /** First primitive vector, y component [m]. */
  readonly a1yM: number;
  /** Second primitive vector, x component [m]. */
  readonly a2xM: number;
  /** Second primitive vector, y component [m]. */
  readonly a2yM: number;
  /** First reciprocal vector, x component [rad/m]. */
  readonly b1xRadPerM: number;
  /** First reciprocal vector, y component [rad/m]. */
  readonly b1yRadPerM: number;
  /** Second reciprocal vector, x component [rad/m]. */
  readonly b2xRadPerM: number;
  /** Second reciprocal vector, y component [rad/m]. */
  readonly b2yRadPerM: number;
  /** Unit-cell area |a₁ × a₂| [m²]. */
  readonly cellAreaM2: number;
}

/**
 * Lattice from two primitive vectors in the xy-plane.
 *
 * @remarks
 * Reciprocal vectors: b₁ = 2π (a₂ × ẑ)/(a₁·(a₂ × ẑ)), b₂ = 2π (ẑ × a₁)/(a₂·(ẑ × a₁)), i.e.
 * b₁ = (2π/D)(a₂y, −a₂x), b₂ = (2π/D)(−a₁y, a₁x) with D = a₁x a₂y − a₁y a₂x.
 * Reference: N. W. Ashcroft and N. D. Mermin, *Solid State Physics*, 1976, ch. 5 (from memory).
 *
 * @param a1M - First primitive vector [x, y] [m].
 * @param a2M - Second primitive vector [x, y] [m].
 * @returns The lattice with reciprocal vectors [rad/m] and cell area [m²].
 * @throws {@link DomainError} if an entry is not finite, or the vectors are collinear (cell area ≤ 1e-12·|a₁||a₂|).
 * @example
 * ```ts
 * planarLattice([0.05, 0], [0.025, 0.0433]).cellAreaM2; // ≈ 2.165e-3
 * ```
 * @category Geometry
 */
export function planarLattice(a1M: readonly [number, number], a2M: readonly [number, number]): PlanarLattice {
  assertFinite('a1M[0]', a1M[0]);
  assertFinite('a1M[1]', a1M[1]);
  assertFinite('a2M[0]', a2M[0]);
  assertFinite('a2M[1]', a2M[1]);
  const [a1x, a1y] = a1M;
  const [a2x, a2y] = a2M;
  const det = a1x * a2y - a1y * a2x;
  const n1 = Math.hypot(a1x, a1y);
  const n2 = Math.hypot(a2x, a2y);
  if (n1 === 0 || n2 === 0 || Math.abs(det) <= 1e-12 * n1 * n2) {
    throw new DomainError(
      `invalid arguments "a1M", "a2M": expected two non-collinear, non-zero primitive vectors, received [${a1x}, ${a1y}] and [${a2x}, ${a2y}] (cross product ${det}); choose vectors that span the plane.`,
    );
  }
  const s = (2 * Math.PI) / det;
  return {
    a1xM: a1x, a1yM: a1y, a2xM: a2x, a2yM: a2y,
    b1xRadPerM: s * a2y, b1yRadPerM: -s * a2x,
    b2xRadPerM: -s * a1y, b2yRadPerM: s * a1x,
    cellAreaM2: Math.abs(det),
  };
}

/**
 * Rectangular lattice with spacing dx along x and dy along y.
 * @param dxM - Spacing along x [m], > 0.
 * @param dyM - Spacing along y [m], > 0.
 * @returns Lattice with a₁ = (dx, 0), a₂ = (0, dy).
 * @throws {@link DomainError} if a spacing is not positive.
 * @category Geometry
 */
export function rectangularLattice(dxM: number, dyM: number): PlanarLattice {
  assertPositive('dxM', dxM, 'm');
  assertPositive('dyM', dyM, 'm');
  return planarLattice([dxM, 0], [0, dyM]);
}

/**
 * Equilateral triangular lattice of nearest-neighbour distance d, rows along x.
 * @param sideM - Nearest-neighbour distance d [m], > 0.
 * @returns Lattice with a₁ = (d, 0), a₂ = (d/2, d√3/2); cell area (√3/2) d².
 * @throws {@link DomainError} if `sideM` is not positive.
 * @category Geometry
 */
export function triangularLattice(sideM: number): PlanarLattice {
  assertPositive('sideM', sideM, 'm');
  return planarLattice([sideM, 0], [sideM / 2, (sideM * Math.sqrt(3)) / 2]);
}

/**
 * The same lattice shape multiplied by a scale factor.
 * @param lattice - Lattice.
 * @param factor - Scale factor (dimensionless), > 0.
 * @returns Lattice with primitive vectors factor·a₁, factor·a₂.
 * @throws {@link DomainError} if `factor` is not positive.
 * @category Geometry
 */
export function scaleLattice(lattice: PlanarLattice, factor: number): PlanarLattice {
  assertPositive('factor', factor);
  return planarLattice([lattice.a1xM * factor, lattice.a1yM * factor], [lattice.a2xM * factor, lattice.a2yM * factor]);
}

/**
 * Length of the shortest non-zero reciprocal-lattice vector min |m b₁ + n b₂| [rad/m],
 * found by Lagrange–Gauss reduction of the reciprocal basis.
 * @internal
 */
export function shortestReciprocalVector(lattice: PlanarLattice): number {
  let ux = lattice.b1xRadPerM, uy = lattice.b1yRadPerM;
  let vx = lattice.b2xRadPerM, vy = lattice.b2yRadPerM;
  // Lagrange–Gauss reduction: afterwards u is a shortest vector.
  for (let it = 0; it < 200; it++) {
    if (ux * ux + uy * uy > vx * vx + vy * vy) {
      const tx = ux, ty = uy;
      ux = vx; uy = vy; vx = tx; vy = ty;
    }
    const mu = Math.round((ux * vx + uy * vy) / (ux * ux + uy * uy));
    if (mu === 0) break;
    vx -= mu * ux;
    vy -= mu * uy;
  }
  return Math.min(Math.hypot(ux, uy), Math.hypot(vx, vy));
}

/**
 * Validates a lattice value given by a caller (as {@link planarLattice} returns it): every field
 * finite, non-collinear primitive vectors; recomputes the reciprocal vectors from a₁, a₂ so that
 * a hand-built object cannot carry inconsistent ones.
 * @internal
 */
export function assertLattice(name: string, lattice: unknown): PlanarLattice {
  const l = lattice as Partial<PlanarLattice> | null;
  if (l === null || typeof l !== 'object' || typeof l.a1xM !== 'number' || typeof l.a1yM !== 'number' || typeof l.a2xM !== 'number' || typeof l.a2yM !== 'number') {
    throw new DomainError(`invalid argument "${name}": expected a PlanarLattice (planarLattice, rectangularLattice, triangularLattice or a lattice layout's "lattice"), received ${describeValue(lattice)}.`);
  }
  return planarLattice([l.a1xM, l.a1yM], [l.a2xM, l.a2yM]);
}
