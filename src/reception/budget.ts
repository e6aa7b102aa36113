/**
 * The noise budget of a receiving array: every open-circuit correlation
 * matrix the figures of merit need, computed once.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertFiniteCMatrix, assertSquare, assertPositive, describeValue } from '../internal/validate.js';
import { T0_K } from '../units/constants.js';
import { receiverNoiseCorrelation } from './amplifier.js';
import {
  aboveHorizon, brightnessCorrelations, brightnessQuadraticForms, brightnessValues, checkTemperature, zenithInArrayFrame,
  type Brightness, type BrightnessOptions, type HorizonOrientation,
} from './brightness.js';
import {
  assertQuadrature, asPatternSource,
  type PortPatternSource, type QuadratureDirections, type SampledPortPatterns,
} from './patterns.js';
import { ohmicLossNoiseCorrelation } from './thermal.js';
import { columnQuadraticForms, type BudgetForms } from './figures.js';
import { thermalImpedanceNoise, type NoiseParametersInput } from '../network/noise.js';
import type { Vector3 } from '../geometry/layout.js';
import { matrixView } from '../linalg/cmatrix.js';
import { add, scale } from '../linalg/ops.js';

/**
 * The noise environment: a brightness distribution and which directions count
 * as "sky" (the rest is "ground", i.e. spillover, in the decomposition).
 * @category Reception
 */
export interface NoiseEnvironment {
  /** Brightness temperature [K]: a map on the quadrature's directions or a function of (θ, φ) [rad]. */
  readonly brightnessK: Brightness;
  /**
   * The sky region (IEEE Std 145-2013: the solid angle the spillover efficiency
   * refers to); directions where it returns false are ground/spillover.
   * @defaultValue every direction is sky
   */
  readonly isSky?: (thetaRad: number, phiRad: number) => boolean;
  /**
   * Great circles on which the brightness (or the sky region) jumps, each
   * given by its unit normal in array coordinates (e.g. the local zenith for a
   * horizon); the adaptive sphere rule splits there.
   * @defaultValue none (a smooth environment)
   */
  readonly edgeNormals?: ReadonlyArray<Vector3>;
}

/**
 * An isotropic environment at temperature T (all sky).
 * @param temperatureK - Brightness [K], ≥ 0.
 * @returns The environment.
 * @throws {@link DomainError} for a negative temperature.
 * @category Reception
 */
export function isotropicEnvironment(temperatureK: number): NoiseEnvironment {
  checkTemperature('temperatureK', temperatureK);
  return { brightnessK: () => temperatureK };
}

/**
 * Options of {@link skyAndGroundEnvironment}.
 * @category Reception
 */
export interface SkyAndGroundEnvironmentOptions extends HorizonOrientation {
  /** Sky brightness above the horizon [K], ≥ 0; a number (uniform) or a function of (θ, φ). */
  skyK: number | ((thetaRad: number, phiRad: number) => number);
  /** Ground brightness below the horizon [K], ≥ 0. @defaultValue 290 */
  groundK?: number;
}

/**
 * Sky above the local horizon (uniform or a user function) and warm ground
 * below it, for an array tilted by any angle; the sky region is the upper
 * half-space of the local horizon, whose great circle is the environment's edge.
 * @param options - Temperatures [K] and tilt [rad].
 * @returns The environment.
 * @throws {@link DomainError} for negative temperatures or a bad tilt.
 * @category Reception
 */
export function skyAndGroundEnvironment(options: SkyAndGroundEnvironmentOptions): NoiseEnvironment {
  const sky = options.skyK;
  if (typeof sky === 'number') checkTemperature('options.skyK', sky);
  else if (typeof sky !== 'function') throw new DomainError(`invalid argument "options.skyK": expected a temperature [K] or a function (θ, φ) → K, received ${describeValue(sky)}.`);
  const ground = options.groundK ?? 290;
  checkTemperature('options.groundK', ground);
  const up = aboveHorizon(options);
  const skyAt = typeof sky === 'number' ? () => sky : sky;
  return { brightnessK: (th, ph) => (up(th, ph) ? skyAt(th, ph) : ground), isSky: up, edgeNormals: [zenithInArrayFrame(options)] };
}

/**
 * How the ohmic loss of the array is described.
 * @category Reception
 */
export type LossModel = 'fromPatterns' | 'lossless' | ElementEfficiencyLoss | LossResistance;

/**
 * Loss described by a loss resistance matrix.
 * @category Reception
 */
export interface LossResistance {
  /** Loss resistance matrix R_loss [Ω], N×N Hermitian positive semidefinite. */
  readonly lossResistanceOhm: CMatrix;
}

/**
 * Loss described by each element's own radiation efficiency (no mutual loss resistance).
 * @category Reception
 */
export interface ElementEfficiencyLoss {
  /** Radiation efficiency eₙ of each port's element, in (0, 1]. */
  readonly radiationEfficiency: Float64Array;
}

/**
 * Inputs of {@link arrayNoiseBudget}.
 * @category Reception
 */
export interface NoiseBudgetInput {
  /** Embedded patterns of the N ports (a source, or samples on exactly the quadrature's directions). */
  readonly patterns: PortPatternSource | SampledPortPatterns;
  /** Sphere quadrature [rad, sr]. */
  readonly quadrature: QuadratureDirections;
  /** Array impedance matrix Z_A [Ω], N×N, same ports as the patterns. */
  readonly impedanceOhm: CMatrix;
  /** External noise environment. */
  readonly environment: NoiseEnvironment;
  /** Amplifier noise parameters (one shared set or one per port). @defaultValue noiseless receivers */
  readonly amplifiers?: NoiseParametersInput | ReadonlyArray<NoiseParametersInput>;
  /** Physical temperature of the array structure [K]. @defaultValue T0 = 290 K */
  readonly physicalTemperatureK?: number;
  /** Bandwidth B [Hz], > 0. */
  readonly bandwidthHz: number;
  /** Ohmic-loss description. @defaultValue 'fromPatterns' (Twiss minus radiation) */
  readonly loss?: LossModel;
  /** Block size of the quadrature sums. */
  readonly blockOptions?: BrightnessOptions;
}

/**
 * Open-circuit correlation matrices of a receiving array [V²], all N×N Hermitian.
 * @category Reception
 */
export interface NoiseBudget {
  /** Number of ports N. */
  readonly portCount: number;
  /** Frequency [Hz]. */
  readonly frequencyHz: number;
  /** Bandwidth B [Hz]. */
  readonly bandwidthHz: number;
  /** Drive current of the patterns [A]. */
  readonly driveCurrentA: number;
  /** Z_A [Ω]. */
  readonly impedanceOhm: CMatrix;
  /** Physical temperature of the structure [K]. */
  readonly physicalTemperatureK: number;
  /** Isotropic noise response per kelvin, 2 k_B B (Z + Zᴴ) [V²/K]: the T_sys reference. */
  readonly isotropicPerK: CMatrix;
  /** Radiation part of the isotropic response per kelvin (brightness integral, T ≡ 1 K) [V²/K]. */
  readonly radiationPerK: CMatrix;
  /** Brightness integral with T = 1 K on the sky region only [V²/K]. */
  readonly skyRegionPerK: CMatrix;
  /** External noise from the sky region [V²]. */
  readonly sky: CMatrix;
  /** External noise from the ground region (spillover) [V²]. */
  readonly ground: CMatrix;
  /** Ohmic-loss noise [V²]. */
  readonly loss: CMatrix;
  /** Coupled receiver noise [V²]. */
  readonly receiver: CMatrix;
  /** Total noise sky + ground + loss + receiver [V²]. */
  readonly total: CMatrix;
}


/**
 * Computes the noise budget of a receiving array at its open-circuit terminals.
 *
 * @remarks
 * One blocked pass over the quadrature gives four brightness integrals (conventions,
 * "brightness noise"): T·1_sky, T·1_ground, 1_sky and 1_ground (each direction
 * enters two of them, so the cost is that of two full integrals). Loss noise:
 * 2k_B T_phys B (Z + Zᴴ) − T_phys·R_rad,1K (conventions, "thermal noise"), or the
 * per-element efficiency model, or zero. Receiver noise: the coupled-amplifier
 * model (conventions, "coupled amplifiers"). Reference: K. F. Warnick, M. V.
 * Ivashina, R. Maaskant, B. Woestenburg, "Unified definitions of efficiencies
 * and system noise temperature for receiving antenna arrays", IEEE Trans.
 * Antennas Propag. 58(6), 2010 (from memory).
 * @param input - Patterns, quadrature, impedance matrix, environment, amplifiers, temperatures, bandwidth.
 * @returns The budget.
 * @throws {@link DimensionError} when patterns and impedance matrix have different port counts,
 *   or maps and quadrature differ in length; {@link DomainError} for negative temperatures and
 *   non-physical amplifier parameters.
 * @category Reception
 */
export function arrayNoiseBudget(input: NoiseBudgetInput): NoiseBudget {
  if (input === null || typeof input !== 'object') {
    throw new DomainError(`invalid argument "input": expected a NoiseBudgetInput, received ${describeValue(input)}.`);
  }
  const src = asPatternSource('input.patterns', input.patterns);
  const z = input.impedanceOhm;
  assertSquare('input.impedanceOhm', z);
  assertFiniteCMatrix('input.impedanceOhm', z);
  const n = src.portCount;
  if (z.rows !== n) {
    throw new DimensionError(`invalid argument "input.impedanceOhm": the patterns describe ${n} ports but the impedance matrix is ${z.rows}×${z.cols}; both must describe the same ports.`);
  }
  const q = input.quadrature;
  assertQuadrature('input.quadrature', q);
  const b = input.bandwidthHz;
  assertPositive('input.bandwidthHz', b, 'Hz');
  const tPhys = input.physicalTemperatureK ?? T0_K;
  checkTemperature('input.physicalTemperatureK', tPhys);
  const env = input.environment;
  if (env === null || typeof env !== 'object') {
    throw new DomainError(`invalid argument "input.environment": expected a NoiseEnvironment {brightnessK, isSky?}, received ${describeValue(env)}.`);
  }
  const ext = externalNoise(src, q, env, b, input.blockOptions ?? {});
  const { sky, ground, skyRegionPerK, radiationPerK } = ext;
  const isotropicPerK = thermalImpedanceNoise(z, 1, b);
  const loss = lossNoise(input.loss ?? 'fromPatterns', z, tPhys, b, radiationPerK);
  const receiver = input.amplifiers === undefined
    ? { rows: n, cols: n, data: new Float64Array(2 * n * n) }
    : receiverNoiseCorrelation(z, input.amplifiers, b);
  const total = new Float64Array(2 * n * n);
  for (let k = 0; k < total.length; k++) total[k] = sky.data[k] + ground.data[k] + loss.data[k] + receiver.data[k];
  return {
    portCount: n, frequencyHz: src.frequencyHz, bandwidthHz: b, driveCurrentA: src.driveCurrentA,
    impedanceOhm: z, physicalTemperatureK: tPhys,
    isotropicPerK, radiationPerK, skyRegionPerK, sky, ground, loss, receiver,
    total: { rows: n, cols: n, data: total },
  };
}

/** The four brightness maps of an environment on a rule: T on the sky region, T on the ground region, 1 on each region. */
function regionMaps(q: QuadratureDirections, env: NoiseEnvironment): Float64Array[] {
  const t = brightnessValues('input.environment.brightnessK', env.brightnessK, q);
  const m = q.thetaRad.length;
  const tSky = new Float64Array(m), tGround = new Float64Array(m), oneSky = new Float64Array(m), oneGround = new Float64Array(m);
  for (let k = 0; k < m; k++) {
    const sky = env.isSky === undefined ? true : env.isSky(q.thetaRad[k], q.phiRad[k]);
    if (sky) { tSky[k] = t[k]; oneSky[k] = 1; } else { tGround[k] = t[k]; oneGround[k] = 1; }
  }
  return [tSky, tGround, oneSky, oneGround];
}

/** The value T when `t` equals T·`region` at every direction (`region` a 0/1 indicator), else null. */
function constantOn(t: Float64Array, region: Float64Array): number | null {
  let c: number | null = null;
  for (let k = 0; k < t.length; k++) {
    if (region[k] === 0) continue;
    if (c === null) c = t[k];
    else if (t[k] !== c) return null;
  }
  return c ?? 0;
}

/** @internal The four brightness integrals of a budget (one blocked pass): sky, ground, 1 K on the sky region and on all directions. */
export function externalNoise(
  src: PortPatternSource, q: QuadratureDirections, env: NoiseEnvironment, b: number, options: BrightnessOptions,
): { sky: CMatrix; ground: CMatrix; skyRegionPerK: CMatrix; radiationPerK: CMatrix } {
  const maps = regionMaps(q, env);
  // A brightness constant on each region (the usual sky-and-ground model): the T-weighted
  // integrals are multiples of the 1 K ones, so two integrals serve all four (linearity).
  const tSkyConst = constantOn(maps[0], maps[2]), tGroundConst = constantOn(maps[1], maps[3]);
  let sky: CMatrix, ground: CMatrix, skyRegionPerK: CMatrix, groundRegionPerK: CMatrix;
  if (tSkyConst !== null && tGroundConst !== null) {
    [skyRegionPerK, groundRegionPerK] = brightnessCorrelations(src, q, [maps[2], maps[3]], b, options);
    sky = scale(skyRegionPerK, tSkyConst);
    ground = scale(groundRegionPerK, tGroundConst);
  } else {
    [sky, ground, skyRegionPerK, groundRegionPerK] = brightnessCorrelations(src, q, maps, b, options);
  }
  const radiationPerK = add(skyRegionPerK, groundRegionPerK);
  return { sky, ground, skyRegionPerK, radiationPerK };
}

/** @internal The loss-noise matrix of a loss model. */
export function lossNoise(lossModel: LossModel, z: CMatrix, tPhys: number, b: number, radiationPerK: CMatrix): CMatrix {
  const n = z.rows;
  if (lossModel === 'lossless') return matrixView(n, n, new Float64Array(2 * n * n));
  if (lossModel === 'fromPatterns') return ohmicLossNoiseCorrelation(z, tPhys, b, { isotropicRadiationPerK: radiationPerK });
  if (lossModel !== null && typeof lossModel === 'object' && 'lossResistanceOhm' in lossModel) return ohmicLossNoiseCorrelation(z, tPhys, b, { lossResistanceOhm: lossModel.lossResistanceOhm });
  if (lossModel !== null && typeof lossModel === 'object') return ohmicLossNoiseCorrelation(z, tPhys, b, { radiationEfficiency: lossModel.radiationEfficiency });
  throw new DomainError(`invalid argument "input.loss": expected 'fromPatterns', 'lossless', {radiationEfficiency} or {lossResistanceOhm}, received ${describeValue(lossModel)}.`);
}


/**
 * @internal The beam figures' quadratic forms with the brightness integrals (and the
 * pattern-derived loss) redone on another rule, for the refinement estimate: the forms of
 * the budget's matrices on that rule, without forming the matrices where the displacement
 * path applies. Receiver noise and Z are shared, so `iso` and `rec` (and a loss
 * model that does not use the patterns) are taken from `base`, the forms on the evaluation's rule.
 */
export function budgetFormsOnRule(
  budget: NoiseBudget, src: PortPatternSource, q: QuadratureDirections, env: NoiseEnvironment, lossModel: LossModel,
  weights: CMatrix, base: BudgetForms,
): BudgetForms {
  const [sky, ground, skyRegion, groundRegion] = brightnessQuadraticForms(src, q, regionMaps(q, env), budget.bandwidthHz, weights, columnQuadraticForms);
  const rad = skyRegion.map((v, k) => v + groundRegion[k]);
  // 'fromPatterns': loss = T_phys·(R_iso,1K − R_rad,1K), so its form is T_phys·(iso − rad)
  const loss = lossModel === 'fromPatterns' ? base.iso.map((v, k) => budget.physicalTemperatureK * (v - rad[k])) : base.loss;
  return { iso: base.iso, sky, ground, loss, rec: base.rec, rad, skyRegion };
}
