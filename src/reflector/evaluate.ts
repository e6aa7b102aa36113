/**
 * Reception through a reflector with an array feed: the single-call
 * evaluation of "reflector + array feed + amplifiers + environment + beams".
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertNonNegative, assertPositive } from '../internal/validate.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import type { NoiseParametersInput } from '../network/noise.js';
import { type SphereQuadrature, sphereQuadrature } from '../geometry/quadrature.js';
import type { QuadratureDirections } from '../reception/patterns.js';
import { weightedDirections } from '../geometry/directions.js';
import type { ArrayPortSource } from '../reception/ports.js';
import { type LossModel, arrayNoiseBudget } from '../reception/budget.js';
import { type BeamFigures, beamFigures, maxSnrWeightsUnpolarized, minimumReceiverTemperature } from '../reception/figures.js';
import { type ArrayEvaluation, FIGURE_UNITS } from '../reception/evaluate.js';
import { receivingArrayChecks } from '../reception/checks.js';
import { impedancePassivity } from '../network/checks.js';
import type { Paraboloid } from './paraboloid.js';
import { type SecondaryPatternOptions, type SecondaryPatterns, secondaryPatternsPhysicalOptics } from './secondary.js';

/**
 * Whether a ray leaving the focus in feed-frame direction (θ_f, φ_f) hits the
 * reflector surface inside its projected aperture (works for offset dishes).
 * @param dish - Reflector.
 * @param thetaRad - Feed-frame polar angle θ_f [rad].
 * @param phiRad - Feed-frame azimuth φ_f [rad].
 * @returns True when the ray is intercepted by the dish.
 * @category Reflector
 */
export function rayHitsReflector(dish: Paraboloid, thetaRad: number, phiRad: number): boolean {
  // Reflector-frame direction d = (x_f, −y_f, −z_f); the ray meets the paraboloid at ρ_f = 2f/(1 − d_z).
  const st = Math.sin(thetaRad);
  const dx = st * Math.cos(phiRad), dy = -st * Math.sin(phiRad), dz = -Math.cos(thetaRad);
  if (dz >= 1 - 1e-15) return false;
  const rf = (2 * dish.focalLengthM) / (1 - dz);
  const x = rf * dx - dish.offsetM, y = rf * dy, a = dish.diameterM / 2;
  return x * x + y * y <= a * a;
}

/**
 * Sphere rule in the feed frame for a reflector's noise integrals, split at the rim.
 *
 * @remarks
 * Seen from the focus of a symmetric paraboloid the rim is the cone θ_f = θ0: the brightness
 * steps there from the reflected sky to the ground behind, so a product rule (Gauss–Legendre
 * in cos θ_f × trapezoid in φ_f) with a node boundary at θ0 integrates the step exactly, where
 * a rule split only at the horizon converges slowly (its error is set by how the step falls
 * between nodes). The rule is also split at the horizon θ_f = π/2, where feeds backed by a
 * ground plane stop. On an offset dish the rim is not a cone about the feed axis and no product
 * rule splits it; pass a rule of your own there.
 * @param dish - Symmetric paraboloid (offsetM = 0).
 * @param thetaCount - Gauss–Legendre nodes in cos θ_f on each of the three pieces. @defaultValue 48
 * @param phiCount - Trapezoid nodes in φ_f. @defaultValue 96
 * @returns The rule (3·thetaCount × phiCount directions).
 * @throws {@link DomainError} for an offset dish or bad counts.
 * @example
 * ```ts
 * const q = reflectorFeedQuadrature(paraboloidReflector({ diameterM: 12, focalLengthM: 4.8 }), 8, 16);
 * q.thetaCount, q.count; // 24, 384
 * ```
 * @category Reflector
 */
export function reflectorFeedQuadrature(dish: Paraboloid, thetaCount = 48, phiCount = 96): SphereQuadrature {
  if (dish.offsetM !== 0) {
    throw new DomainError(`invalid argument "dish": the rim of an offset dish (offsetM = ${dish.offsetM} m) is not a cone about the feed axis, so no product rule splits at it; pass a sphere rule of your own.`);
  }
  return sphereQuadrature(thetaCount, phiCount, { splitAtThetaRad: [dish.rimHalfAngleRad], splitAtHorizon: true });
}

/**
 * Description of a reflector antenna with an array feed for {@link evaluateReflectorArrayFeed}.
 * @category Reflector
 */
export interface ReflectorArrayFeedDescription {
  /** The reflector (its frame is the frame of the beam directions). */
  readonly dish: Paraboloid;
  /** The feed's ports: open-circuit embedded patterns in the feed frame (phase reference at the focus) and the feed array's impedance matrix Z_A [Ω]. */
  readonly feed: ArrayPortSource;
  /**
   * Sphere quadrature in the feed frame for the noise integrals (a geometry-module rule or
   * explicit directions).
   * @defaultValue {@link reflectorFeedQuadrature}(dish) — split at the rim; required for offset dishes
   */
  readonly feedQuadrature?: SphereQuadrature | QuadratureDirections;
  /** Brightness of the sky reflected into the feed by the dish [K], ≥ 0. */
  readonly skyTemperatureK: number;
  /** Brightness seen by feed spillover past the rim (ground behind a zenith-pointing dish) [K], ≥ 0. */
  readonly groundTemperatureK: number;
  /** Bandwidth B [Hz], > 0. */
  readonly bandwidthHz: number;
  /** Amplifier noise parameters, one shared set or one per port. @defaultValue noiseless receivers */
  readonly amplifiers?: NoiseParametersInput | ReadonlyArray<NoiseParametersInput>;
  /** Physical temperature of the feed structure [K]. @defaultValue 290 */
  readonly physicalTemperatureK?: number;
  /** Ohmic-loss model of the feed (reception module). @defaultValue 'fromPatterns' */
  readonly loss?: LossModel;
  /** Beam directions in the reflector frame [rad]. */
  readonly beams: {
    /** Polar angles of the beams from the dish axis [rad]. */
    readonly thetaRad: Float64Array;
    /** Azimuths of the beams [rad]. */
    readonly phiRad: Float64Array;
  };
  /** Open-circuit beam weights, N×K. @defaultValue max-SNR weights for an unpolarized source per beam */
  readonly weights?: CMatrix;
  /** Flux density of an unpolarized test source for the SNR [W m⁻² Hz⁻¹]. */
  readonly fluxDensityWPerM2Hz?: number;
  /** Integration controls of the physical-optics secondary patterns. */
  readonly secondaryOptions?: SecondaryPatternOptions;
}

/**
 * Result of {@link evaluateReflectorArrayFeed}: the shared array-evaluation shape (the noise budget
 * of the feed ports — sky through the dish, spillover, loss, receivers — weights, beams, T_rec,min,
 * physical checks, the feed-side rule and units) and the secondary beam patterns.
 * @category Reflector
 */
export interface ReflectorArrayFeedEvaluation extends ArrayEvaluation {
  /** Secondary patterns of every port at the beam directions [V]. */
  readonly beamPatterns: SecondaryPatterns;
  /**
   * The same array as `beams` (figures per beam: T_sys and parts, A_e, A_e/T_sys, efficiencies
   * with the dish's projected area as the physical area).
   * @deprecated Read `beams`, the field every array evaluation has; kept for one minor version.
   */
  readonly figures: BeamFigures[];
}

/**
 * Evaluates a reflector antenna with an array feed: noise of every feed port,
 * each port's response to a distant source through the dish, beams and the
 * IEEE receiving-array figures of merit.
 *
 * @remarks
 * Noise is computed on the feed side with the reception module's brightness
 * integral: a feed-frame direction whose ray hits the dish sees the sky
 * reflected by the (lossless) dish, every other direction sees the ground
 * brightness — the spillover split of the array-feed noise model (Warnick,
 * Ivashina, Maaskant, Woestenburg, IEEE Trans. Antennas Propag. 58(6), 2010;
 * K. F. Warnick & B. D. Jeffs, "Efficiencies and system temperature for a
 * beamforming array", IEEE AWPL 7, 2008 — from memory). Signals use each
 * port's physical-optics secondary pattern, which is an embedded pattern of
 * the whole antenna, so the reception row of docs/conventions.md applies
 * unchanged. T_sys is referred to the isotropic noise response of the feed
 * ports, 2k_B B(Z + Zᴴ) (IEEE Std 145-2013 receiving-array definitions). The default feed-side
 * rule is split at the rim ({@link reflectorFeedQuadrature}), where the brightness steps.
 * Scattering from the feed and struts onto the dish and back is neglected.
 * @param d - Reflector, feed, environment, amplifiers and beams.
 * @returns Budget, secondary beam patterns, weights and figures per beam.
 * @throws {@link DimensionError} on port-count mismatch; {@link DomainError} for negative temperatures or a feed whose frequency differs from the patterns'.
 * @category Reflector
 */
export function evaluateReflectorArrayFeed(d: ReflectorArrayFeedDescription): ReflectorArrayFeedEvaluation {
  assertNonNegative('skyTemperatureK', d.skyTemperatureK, 'K');
  assertNonNegative('groundTemperatureK', d.groundTemperatureK, 'K');
  assertPositive('bandwidthHz', d.bandwidthHz, 'Hz');
  if (d.feed === null || typeof d.feed !== 'object') throw new DomainError('invalid argument "feed": expected {patterns, impedanceOhm}.');
  if (d.feed.impedanceOhm.rows !== d.feed.patterns.portCount) {
    throw new DimensionError(`invalid argument "feed.impedanceOhm": expected ${d.feed.patterns.portCount}×${d.feed.patterns.portCount} (one row per feed port), received ${d.feed.impedanceOhm.rows}×${d.feed.impedanceOhm.cols}.`);
  }
  const rule = d.feedQuadrature ?? reflectorFeedQuadrature(d.dish);
  const quadrature = weightedDirections(rule);
  const dish = d.dish;
  const budget = arrayNoiseBudget({
    patterns: d.feed.patterns,
    quadrature,
    impedanceOhm: d.feed.impedanceOhm,
    environment: {
      brightnessK: (t: number, p: number) => (rayHitsReflector(dish, t, p) ? d.skyTemperatureK : d.groundTemperatureK),
      isSky: (t: number, p: number) => rayHitsReflector(dish, t, p),
    },
    amplifiers: d.amplifiers,
    physicalTemperatureK: d.physicalTemperatureK,
    bandwidthHz: d.bandwidthHz,
    loss: d.loss,
  });
  const beamPatterns = secondaryPatternsPhysicalOptics(dish, d.feed.patterns, d.beams.thetaRad, d.beams.phiRad, d.secondaryOptions);
  const weights = d.weights ?? maxSnrWeightsUnpolarized(beamPatterns, budget.total);
  if (weights.rows !== budget.portCount || weights.cols !== d.beams.thetaRad.length) {
    throw new DimensionError(`invalid argument "weights": expected ${budget.portCount}×${d.beams.thetaRad.length} (ports × beams), received ${weights.rows}×${weights.cols}.`);
  }
  const tMin = minimumReceiverTemperature(budget);
  const figures = beamFigures(budget, weights, beamPatterns, {
    physicalAreaM2: dish.apertureAreaM2,
    fluxDensityWPerM2Hz: d.fluxDensityWPerM2Hz,
    minimumReceiverTemperatureK: tMin,
  });
  const checks = receivingArrayChecks({
    budget, beams: figures, lossless: d.loss === 'lossless', passivity: impedancePassivity(d.feed.impedanceOhm), minimumReceiverTemperatureK: tMin,
  });
  return { budget, beamPatterns, weights, beams: figures, figures, minimumReceiverTemperatureK: tMin, checks, quadrature, units: FIGURE_UNITS };
}
