/**
 * One call from "this receiving array" to every figure of merit: the entry
 * point of the command line and the demo.
 * @module
 */
import { ConvergenceError, DimensionError, DomainError, SingularMatrixError } from '../errors.js';
import type { CMatrix, ComplexLike } from '../linalg/cmatrix.js';
import { complexParts } from '../linalg/cmatrix.js';
import { assertPositive, describeValue } from '../internal/validate.js';
import type { SphereQuadrature } from '../geometry/quadrature.js';
import type { NoiseParametersInput } from '../network/noise.js';
import { arrayNoiseBudget, budgetFormsOnRule, type LossModel, type NoiseBudget, type NoiseEnvironment } from './budget.js';
import {
  embeddedElementEfficiencies, figuresOfForms, minimumReceiverTemperatureFrom, scanSweepWithForms, type BeamFigures,
} from './figures.js';
import { adaptiveSphereRule } from './integration.js';
import { receivingArrayChecks } from './checks.js';
import type { PhysicalCheck } from '../checks.js';
import { impedancePassivityWithFactor } from '../network/checks.js';
import type { CholeskyResult } from '../linalg/cholesky.js';
import type { PortGeometry } from './ports.js';
import { K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import {
  assertPatternSource, samplePatterns, asPatternSource,
  type PortPatternSource, type QuadratureDirections, type SampledPortPatterns,
} from './patterns.js';
import { weightedDirections } from '../geometry/directions.js';
import { ARRAY_FIGURES_AUTO_MAX_PORTS, PASSIVITY_CHOLESKY_MAX_PORTS, arrayFiguresWanted } from './cost.js';
import { displayable } from '../display/attach.js';

/**
 * The N ports of a receiving array: embedded open-circuit patterns and the
 * impedance matrix (analytic elements through a pattern source, or imported
 * data as samples).
 * @category Reception
 */
export interface ArrayPorts {
  /** Embedded patterns (conventions, "embedded pattern"). */
  readonly patterns: PortPatternSource | SampledPortPatterns;
  /** Impedance matrix Z_A [Ω], N×N. */
  readonly impedanceOhm: CMatrix;
  /** Model-validity checks of the ports (e.g. from dipoleArrayPorts), copied into the evaluation's checks. */
  readonly checks?: ReadonlyArray<PhysicalCheck>;
  /** Where the elements are (dipoleArrayPorts fills it); needed by `quadrature: 'adaptive'` and the refinement check. */
  readonly geometry?: PortGeometry;
}

/**
 * Beam directions, one beam per entry.
 * @category Reception
 */
export interface BeamDirections {
  /** Polar angles from +z [rad]. */
  readonly thetaRad: Float64Array;
  /** Azimuths from +x toward +y [rad], same length. */
  readonly phiRad: Float64Array;
}

/**
 * Wall-clock time of the stages of {@link evaluateReceivingArray} [ms].
 * @category Reception
 */
export interface EvaluationTimings {
  /** Noise budget (brightness integrals, loss, receiver noise) [ms]. */
  readonly noiseBudget: number;
  /** Patterns at the beam directions [ms]. */
  readonly beamPatterns: number;
  /** Weights and per-beam figures [ms]. */
  readonly weightsAndFigures: number;
  /** Passivity of Z, minimum receiver temperature and embedded element efficiencies [ms]. */
  readonly arrayFigures: number;
  /** Physical checks [ms]. */
  readonly checks: number;
  /** Brightness integrals on the refinement rule and the figures' differences [ms]. */
  readonly refinement: number;
}

/**
 * Everything {@link evaluateReceivingArray} needs.
 * @category Reception
 */
export interface ReceivingArrayDescription {
  /** The array's ports. */
  readonly ports: ArrayPorts;
  /**
   * Sphere quadrature for the noise integrals: `'adaptive'` (adaptiveSphereRule from the ports'
   * geometry and the environment's edges; recommended), a geometry-module rule or explicit directions.
   * Whenever the ports carry their geometry, the result is also computed on a refined adaptive
   * rule and the differences are reported as `integrationErrors` and the check `integrationRefinement`.
   */
  readonly quadrature: SphereQuadrature | QuadratureDirections | 'adaptive';
  /** Bandwidth B [Hz], > 0. */
  readonly bandwidthHz: number;
  /** External noise environment. */
  readonly environment: NoiseEnvironment;
  /** Amplifier noise parameters. @defaultValue noiseless receivers */
  readonly amplifiers?: NoiseParametersInput | ReadonlyArray<NoiseParametersInput>;
  /** Terminations for the embedded element efficiency (amplifier input impedances) [Ω]. @defaultValue 50 Ω each (common practice) */
  readonly terminationOhm?: ComplexLike | ReadonlyArray<ComplexLike>;
  /** Physical temperature of the array [K]. @defaultValue 290 */
  readonly physicalTemperatureK?: number;
  /** Ohmic-loss model. @defaultValue 'fromPatterns' */
  readonly loss?: LossModel;
  /** Beam directions [rad]. */
  readonly beams: BeamDirections;
  /** Open-circuit weights, N×K. @defaultValue max-SNR weights for an unpolarized source */
  readonly weights?: CMatrix;
  /** Physical area for the aperture efficiency [m²]. */
  readonly physicalAreaM2?: number;
  /** Flux density of an unpolarized test source for the SNR [W m⁻² Hz⁻¹]. */
  readonly fluxDensityWPerM2Hz?: number;
  /**
   * Compute the array figures (minimum receiver temperature, embedded element
   * efficiencies): `true`, `false`, or `'auto'` — computed up to
   * {@link ARRAY_FIGURES_AUTO_MAX_PORTS} ports. They are per-array diagnostics,
   * not needed by any beam figure, and each costs O(N³) (a Cholesky
   * factorisation and a Lanczos iteration of O(N²) per step for T_rec,min; an LU
   * inverse and a product, 2N³ complex multiply–adds, for the efficiencies):
   * about 3 s at N = 1261 and 40 s at N = 3169 on one core of the development
   * machine, several times the beam figures. Whether they were computed is
   * `arrayFiguresComputed` of the result. The passivity check of Z is a Cholesky
   * factorisation of (Z + Zᴴ)/2 whenever the array figures are computed or
   * N ≤ {@link PASSIVITY_CHOLESKY_MAX_PORTS}; above, without array figures, a
   * Lanczos estimate of its smallest eigenvalue (a negative estimate proves
   * non-passivity; a positive one is strong evidence, not proof).
   * @defaultValue 'auto'
   */
  readonly arrayFigures?: boolean | 'auto';
  /** Accepted relative integration error: bound of the Twiss residual of a lossless array (see twissResidual) and allowance of η_rad ≤ 1. @defaultValue 1e-3 */
  readonly integrationTolerance?: number;
  /** Progress callback: stage name, beams done, total beams. */
  readonly onProgress?: (stage: 'noise' | 'beams', done: number, total: number) => void;
}

/**
 * What every array evaluation returns — the direct receiving array ({@link evaluateReceivingArray})
 * and the reflector with an array feed (`evaluateReflectorArrayFeed`) alike: one result shape, so
 * code that reads beams, checks and units serves both pipelines.
 * @category Reception
 */
export interface ArrayEvaluation {
  /** The open-circuit noise budget [V²]. */
  readonly budget: NoiseBudget;
  /** Open-circuit weights used, N×K. */
  readonly weights: CMatrix;
  /** Figures of merit per beam. */
  readonly beams: BeamFigures[];
  /** The array's minimum receiver temperature T_rec,min [K]; NaN exactly when the check `minimumReceiverTemperature` failed or array figures were not requested. */
  readonly minimumReceiverTemperatureK: number;
  /** Physical self-checks (receivingArrayChecks); a failed check marks the figures it names as untrustworthy. */
  readonly checks: PhysicalCheck[];
  /** The sphere rule of the noise integrals [rad, sr]. */
  readonly quadrature: QuadratureDirections;
  /** Unit of every figure, by field name of {@link BeamFigures}. */
  readonly units: Readonly<Record<keyof BeamFigures, string>>;
}

/**
 * Result of {@link evaluateReceivingArray}: the shared {@link ArrayEvaluation} fields and the
 * direct array's own; every dimensional field carries its unit in its name.
 * @category Reception
 */
export interface ReceivingArrayEvaluation extends ArrayEvaluation {
  /** Embedded element efficiency of each port (linear); empty when they could not be computed (failed check `embeddedElementEfficiency`) or were not requested. */
  readonly embeddedElementEfficiency: Float64Array;
  /** Whether the array figures (T_rec,min, embedded element efficiencies) were computed: the `arrayFigures` option, with `'auto'` resolved by the port count. */
  readonly arrayFiguresComputed: boolean;
  /**
   * Integration error of every figure of every beam: |figure on the evaluation's rule − figure
   * on the refined adaptive rule| with the same weights, in the figure's unit. Empty objects
   * when the ports carry no geometry (no refinement possible).
   */
  readonly integrationErrors: Array<Partial<Record<keyof BeamFigures, number>>>;
  /** Wall-clock time of the stages [ms]. */
  readonly timingsMs: EvaluationTimings;
}

/** Units of the BeamFigures fields. @internal */
export const FIGURE_UNITS: Readonly<Record<keyof BeamFigures, string>> = {
  systemTemperatureK: 'K', skyTemperatureK: 'K', spilloverTemperatureK: 'K', lossTemperatureK: 'K',
  receiverTemperatureK: 'K', effectiveAreaM2: 'm²', sensitivityM2PerK: 'm²/K', gain: 'linear', directivity: 'linear',
  radiationEfficiency: 'linear', spilloverEfficiency: 'linear', apertureEfficiency: 'linear', snr: 'linear',
  noiseMatchingEfficiency: 'linear',
};

function toQuadrature(q: SphereQuadrature | QuadratureDirections | 'adaptive', d: ReceivingArrayDescription, frequencyHz: number): QuadratureDirections {
  if (q === 'adaptive') {
    if (d.ports.geometry === undefined) {
      throw new DomainError('invalid argument "description.quadrature": \'adaptive\' needs the element positions in "description.ports.geometry" (dipoleArrayPorts provides them); give them or pass an explicit rule.');
    }
    return adaptiveSphereRule(d.ports.geometry, frequencyHz, { edgeNormals: d.environment?.edgeNormals });
  }
  return weightedDirections(q);
}

/** Refinement factor of the node counts of the check rule (common practice: a clearly finer rule). */
const REFINEMENT = 1.5;

/** Figures compared by the refinement check, relative to T_sys (temperatures) or to themselves. */
function refinementMeasure(fine: BeamFigures, coarse: BeamFigures): { errors: Partial<Record<keyof BeamFigures, number>>; worst: number } {
  const errors: Partial<Record<keyof BeamFigures, number>> = {};
  for (const key of Object.keys(fine) as Array<keyof BeamFigures>) {
    const a = fine[key], b = coarse[key];
    if (typeof a === 'number' && typeof b === 'number') errors[key] = Math.abs(a - b);
  }
  const t = Math.abs(coarse.systemTemperatureK);
  const rel = (x: number | undefined, ref: number): number => (x === undefined ? 0 : ref > 0 ? x / ref : x);
  const worst = Math.max(
    rel(errors.systemTemperatureK, t), rel(errors.skyTemperatureK, t), rel(errors.spilloverTemperatureK, t), rel(errors.lossTemperatureK, t),
    rel(errors.sensitivityM2PerK, Math.abs(coarse.sensitivityM2PerK)), errors.radiationEfficiency ?? 0, errors.spilloverEfficiency ?? 0,
  );
  return { errors, worst };
}

/**
 * Evaluates a receiving array: noise budget, beam weights (max-SNR by default)
 * and every figure of merit at each beam direction.
 *
 * @remarks
 * Stages: (1) arrayNoiseBudget — sky/ground brightness integrals by blocked
 * sphere quadrature, ohmic loss, coupled amplifier noise; (2) patterns at the
 * beam directions; (3) weights (maxSnrWeightsUnpolarized unless given) and
 * beamFigures through scanSweep; (4) minimum receiver temperature and embedded
 * element efficiencies. Definitions: K. F. Warnick, M. V. Ivashina,
 * R. Maaskant, B. Woestenburg, IEEE Trans. Antennas Propag. 58(6), 2010, and
 * IEEE Std 145-2013 (from memory); see beamFigures.
 * Stage (4) shares one Cholesky factorisation of (Z + Zᴴ)/2 between the
 * passivity check and T_rec,min; a figure that cannot be computed (Z not
 * passive, a singular Z + Z_L) becomes NaN / empty with a failed check, and
 * the other figures are still computed. Stage (5) builds the physical checks
 * (receivingArrayChecks).
 * @param description - Ports, quadrature, environment, amplifiers, beams and options.
 * @returns Budget, weights, per-beam figures, array figures, physical checks, units and stage timings.
 * @throws {@link DimensionError} for inconsistent port counts or grids; {@link DomainError} for
 *   negative temperatures, non-physical amplifiers and bad options; {@link NotPositiveDefiniteError}
 *   if the total noise is not positive definite when max-SNR weights are requested.
 * @example
 * ```ts fragment
 * const result = evaluateReceivingArray({
 *   ports: { patterns: source, impedanceOhm: z },
 *   quadrature: sphereQuadrature(32, 64),
 *   bandwidthHz: 1e6,
 *   environment: skyAndGroundEnvironment({ skyK: 10, groundK: 290 }),
 *   amplifiers: { minimumNoiseTemperatureK: 25, noiseResistanceOhm: 4, optimumSourceAdmittanceS: 0.02 },
 *   beams: { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(0) },
 * });
 * result.beams[0].systemTemperatureK;
 * ```
 * @category Reception
 */
export function evaluateReceivingArray(description: ReceivingArrayDescription): ReceivingArrayEvaluation {
  if (description === null || typeof description !== 'object') {
    throw new DomainError(`invalid argument "description": expected a ReceivingArrayDescription, received ${describeValue(description)}.`);
  }
  const d = description;
  if (d.ports === null || typeof d.ports !== 'object') {
    throw new DomainError(`invalid argument "description.ports": expected {patterns, impedanceOhm}, received ${describeValue(d.ports)}.`);
  }
  const source = asPatternSource('description.ports.patterns', d.ports.patterns);
  assertPatternSource('description.ports.patterns', source);
  if (d.beams === null || typeof d.beams !== 'object') {
    throw new DomainError(`invalid argument "description.beams": expected {thetaRad, phiRad}, received ${describeValue(d.beams)}.`);
  }
  if (d.physicalAreaM2 !== undefined) assertPositive('description.physicalAreaM2', d.physicalAreaM2, 'm²');
  const quadrature = toQuadrature(d.quadrature, d, source.frequencyHz);
  const n = source.portCount;
  const terminations = terminationList(d.terminationOhm, n);
  const progress = d.onProgress;
  if (progress !== undefined && typeof progress !== 'function') {
    throw new DomainError(`invalid argument "description.onProgress": expected a function, received ${describeValue(progress)}.`);
  }

  const arrayFigures = arrayFiguresWanted('description.arrayFigures', d.arrayFigures, n);
  let t = performance.now();
  const budget = arrayNoiseBudget({
    patterns: source, quadrature, impedanceOhm: d.ports.impedanceOhm, environment: d.environment,
    amplifiers: d.amplifiers, physicalTemperatureK: d.physicalTemperatureK, bandwidthHz: d.bandwidthHz, loss: d.loss,
  });
  const tBudget = performance.now() - t;
  progress?.('noise', 0, d.beams.thetaRad.length);

  t = performance.now();
  const beamPatterns = samplePatterns(source, d.beams.thetaRad, d.beams.phiRad);
  const tPatterns = performance.now() - t;

  // Array figures: one Cholesky of (Z + Zᴴ)/2 serves the passivity check and T_rec,min.
  t = performance.now();
  const isoScale = 4 * K_BOLTZMANN_J_PER_K * budget.bandwidthHz; // R_iso,1K = isoScale·(Z + Zᴴ)/2
  const passivity = impedancePassivityWithFactor(d.ports.impedanceOhm, 30, arrayFigures || n <= PASSIVITY_CHOLESKY_MAX_PORTS, { matrix: budget.isotropicPerK, scale: isoScale });
  let tMin = NaN, tMinFailure: string | undefined;
  if (arrayFigures) {
    try {
      tMin = minimumReceiverTemperatureFrom(budget, passivity.factor as CholeskyResult, 1);
    } catch (e) {
      if (!(e instanceof SingularMatrixError || e instanceof ConvergenceError)) throw e;
      tMinFailure = e.message;
    }
  }
  const tArray0 = performance.now() - t;
  t = performance.now();
  const { result: sweep, forms } = scanSweepWithForms(budget, beamPatterns, {
    weights: d.weights, physicalAreaM2: d.physicalAreaM2, fluxDensityWPerM2Hz: d.fluxDensityWPerM2Hz,
    minimumReceiverTemperatureK: Number.isFinite(tMin) ? tMin : undefined,
    onProgress: progress === undefined ? undefined : (done, total) => progress('beams', done, total),
  });
  const tFigures = performance.now() - t;

  t = performance.now();
  let eff: Float64Array = new Float64Array(0);
  let effFailure: string | undefined;
  if (arrayFigures) {
    try {
      eff = embeddedElementEfficiencies(budget, terminations);
    } catch (e) {
      if (!(e instanceof SingularMatrixError || e instanceof ConvergenceError)) throw e;
      effFailure = e.message;
    }
  }
  const tArray = tArray0 + performance.now() - t;

  // Refinement: the brightness integrals again on a finer adaptive rule, the figures with the same weights.
  t = performance.now();
  let integrationErrors: Array<Partial<Record<keyof BeamFigures, number>>> = sweep.beams.map(() => ({}));
  let integrationError: number | undefined;
  if (d.ports.geometry !== undefined) {
    const fineRule = adaptiveSphereRule(d.ports.geometry, source.frequencyHz, { edgeNormals: d.environment.edgeNormals, refinement: REFINEMENT });
    const fineForms = budgetFormsOnRule(budget, source, fineRule, d.environment, d.loss ?? 'fromPatterns', sweep.weights, forms);
    const fineBeams = figuresOfForms(budget, fineForms, sweep.weights, beamPatterns, {
      physicalAreaM2: d.physicalAreaM2, fluxDensityWPerM2Hz: d.fluxDensityWPerM2Hz, minimumReceiverTemperatureK: Number.isFinite(tMin) ? tMin : undefined,
    });
    integrationError = 0;
    integrationErrors = sweep.beams.map((b, k) => {
      const m = refinementMeasure(fineBeams[k], b);
      integrationError = Math.max(integrationError as number, m.worst);
      return m.errors;
    });
  }
  const tRefine = performance.now() - t;
  t = performance.now();
  const checks = receivingArrayChecks({
    budget, beams: sweep.beams, lossless: d.loss === 'lossless', passivity, integrationError,
    minimumReceiverTemperatureK: arrayFigures ? tMin : undefined, minimumReceiverTemperatureFailure: tMinFailure,
    embeddedElementEfficiency: eff, embeddedElementEfficiencyFailure: effFailure,
    portChecks: d.ports.checks, integrationTolerance: d.integrationTolerance,
  });
  const tChecks = performance.now() - t;
  return displayable<ReceivingArrayEvaluation>({
    budget, weights: sweep.weights, beams: sweep.beams, minimumReceiverTemperatureK: tMin,
    embeddedElementEfficiency: eff, arrayFiguresComputed: arrayFigures, units: FIGURE_UNITS, checks, integrationErrors, quadrature,
    timingsMs: { noiseBudget: tBudget, beamPatterns: tPatterns, weightsAndFigures: tFigures, arrayFigures: tArray, checks: tChecks, refinement: tRefine },
  }, 'ReceivingArrayEvaluation');
}

function terminationList(z: ComplexLike | ReadonlyArray<ComplexLike> | undefined, n: number): { re: number; im: number }[] {
  if (z === undefined) return Array.from({ length: n }, () => ({ re: 50, im: 0 }));
  if (Array.isArray(z) && z.length !== n) {
    throw new DimensionError(`invalid argument "description.terminationOhm": expected ${n} impedances (one per port) or a single shared value, received ${z.length}.`);
  }
  if (Array.isArray(z)) return z.map((v, i) => { const [re, im] = complexParts(`description.terminationOhm[${i}]`, v); return { re, im }; });
  const [re, im] = complexParts('description.terminationOhm', z as ComplexLike);
  return Array.from({ length: n }, () => ({ re, im }));
}
