/**
 * Paraboloidal reflector geometry and the feed frame.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertNonNegative, assertPositive } from '../internal/validate.js';

/**
 * Options of {@link paraboloidReflector}.
 * @category Reflector
 */
export interface ParaboloidOptions {
  /** Diameter D of the projected (circular) aperture [m], > 0. */
  diameterM: number;
  /** Focal length f of the parent paraboloid [m], > 0. */
  focalLengthM: number;
  /**
   * Offset of the aperture centre from the paraboloid axis, along +x [m], ≥ 0
   * (0: prime-focus symmetric dish; > 0: offset-fed dish cut from the same parent).
   * @defaultValue 0
   */
  offsetM?: number;
  /**
   * Diameter of a central circular blockage in the aperture (feed and its support) [m], ≥ 0.
   * @defaultValue 0
   */
  blockageDiameterM?: number;
}

/**
 * A paraboloidal reflector.
 *
 * @remarks
 * Reflector frame: right-handed, focus at the origin, paraboloid axis along z,
 * vertex at z = −f, surface z = (x² + y²)/(4f) − f, main beam toward +z.
 * Feed frame: the feed's own coordinates with its boresight +z_f pointing at
 * the vertex: x_f = x, y_f = −y, z_f = −z (a rotation by π about x), so a
 * feed polarised along x_f illuminates the dish polarised along x.
 * Conventions: docs/conventions.md.
 * @category Reflector
 */
export interface Paraboloid {
  /** Aperture diameter D [m]. */
  readonly diameterM: number;
  /** Focal length f [m]. */
  readonly focalLengthM: number;
  /** Aperture-centre offset from the axis [m]. */
  readonly offsetM: number;
  /** Central blockage diameter [m]. */
  readonly blockageDiameterM: number;
  /** f/D (dimensionless). */
  readonly focalRatio: number;
  /** Projected aperture area πD²/4 [m²]. */
  readonly apertureAreaM2: number;
  /** For a symmetric dish, the half-angle θ0 subtended by the rim at the focus, 2·atan(D/(4f)) [rad]; for an offset dish, the largest feed angle to the rim [rad]. */
  readonly rimHalfAngleRad: number;
}

/**
 * A paraboloidal reflector from its diameter, focal length and optional offset.
 * @param options - Diameter, focal length, offset and blockage.
 * @returns The reflector description (see {@link Paraboloid} for the frames).
 * @throws {@link DomainError} for non-positive D or f, negative offset, or a blockage larger than the aperture.
 * @example
 * ```ts
 * const dish = paraboloidReflector({ diameterM: 12, focalLengthM: 4.8 }); // f/D = 0.4
 * ```
 * @category Reflector
 */
export function paraboloidReflector(options: ParaboloidOptions): Paraboloid {
  const d = options.diameterM, f = options.focalLengthM;
  assertPositive('diameterM', d, 'm');
  assertPositive('focalLengthM', f, 'm');
  const off = options.offsetM ?? 0;
  const b = options.blockageDiameterM ?? 0;
  assertNonNegative('offsetM', off, 'm');
  assertNonNegative('blockageDiameterM', b, 'm');
  if (b >= d) throw new DomainError(`invalid argument "blockageDiameterM": expected less than the aperture diameter ${d} m, received ${b} m.`);
  const rimRho = off + d / 2;
  const rim = 2 * Math.atan(rimRho / (2 * f));
  return {
    diameterM: d,
    focalLengthM: f,
    offsetM: off,
    blockageDiameterM: b,
    focalRatio: f / d,
    apertureAreaM2: (Math.PI * d * d) / 4,
    rimHalfAngleRad: rim,
  };
}

/**
 * Beam-deviation factor of a paraboloid: the ratio of the secondary-beam scan
 * angle to the feed's angular displacement seen from the vertex, for a small
 * lateral feed displacement δ: θ_beam ≈ BDF·δ/f.
 *
 * @remarks
 * Ruze's approximation BDF = (1 + κ (D/4f)²)/(1 + (D/4f)²) with κ ≈ 0.36 for a
 * typical tapered illumination (J. Ruze, "Lateral-feed displacement in a
 * paraboloid", IEEE Trans. Antennas Propag. 13(5), 1965; Y. T. Lo, "On the
 * beam deviation factor of a parabolic reflector", IRE Trans. Antennas
 * Propag. 8(3), 1960 — both from memory). The displacement is away from the
 * axis and the beam moves to the opposite side.
 * @param focalRatio - f/D of the dish, > 0.
 * @param kappa - Illumination constant κ (dimensionless); 0.36 by default.
 * @returns The beam-deviation factor (dimensionless, < 1).
 * @category Reflector
 */
export function beamDeviationFactor(focalRatio: number, kappa = 0.36): number {
  assertPositive('focalRatio', focalRatio);
  assertFinite('kappa', kappa);
  const q = 1 / (4 * focalRatio);
  return (1 + kappa * q * q) / (1 + q * q);
}
