/**
 * The physical self-checks of a receiving-array evaluation, as data: energy
 * (η_rad ≤ 1), the bounded efficiencies, the Twiss residual of the sphere
 * rule, passivity of Z, and whatever model-validity checks the ports carry.
 * @module
 */
import { physicalCheck, type PhysicalCheck } from '../checks.js';
import { DomainError } from '../errors.js';
import { describeValue } from '../internal/validate.js';
import type { ImpedancePassivity } from '../network/checks.js';
import type { NoiseBudget } from './budget.js';
import type { BeamFigures } from './figures.js';

/**
 * Inputs of {@link receivingArrayChecks}: the pieces of one evaluation at one frequency.
 * @category Reception
 */
export interface ReceivingArrayCheckInput {
  /** The noise budget (its radiation and isotropic matrices feed the Twiss residual). */
  readonly budget: NoiseBudget;
  /** Figures of every beam. */
  readonly beams: ReadonlyArray<BeamFigures>;
  /**
   * True when the array has no ohmic loss, so that the brightness integral at
   * uniform T must equal the Twiss matrix 2k_B T B (Z + Zᴴ) exactly (then the
   * residual measures the sphere rule). For lossy arrays the residual is the
   * loss itself and is not a check.
   */
  readonly lossless: boolean;
  /** Passivity of Z (network module's impedancePassivity). */
  readonly passivity: ImpedancePassivity;
  /** Relative integration error of the figures, from a refinement of the rule (linear); adds the check `integrationRefinement`. @defaultValue unknown (no refinement check) */
  readonly integrationError?: number;
  /** T_rec,min [K], NaN when it could not be computed. */
  readonly minimumReceiverTemperatureK?: number;
  /** Why T_rec,min could not be computed (shown in the failed check). */
  readonly minimumReceiverTemperatureFailure?: string;
  /** Embedded element efficiencies (linear); empty when they could not be computed. */
  readonly embeddedElementEfficiency?: Float64Array;
  /** Why the embedded element efficiencies could not be computed. */
  readonly embeddedElementEfficiencyFailure?: string;
  /** Model-validity checks carried by the ports (e.g. from dipoleArrayPorts). */
  readonly portChecks?: ReadonlyArray<PhysicalCheck>;
  /** Accepted relative integration error (linear): the bound of the Twiss residual, and the allowance of η_rad ≤ 1 and of the bounded efficiencies. @defaultValue 1e-3 */
  readonly integrationTolerance?: number;
}

/**
 * Relative Twiss residual ‖R_rad,1K − R_iso,1K‖_F / ‖R_iso,1K‖_F of a noise budget (linear).
 *
 * @remarks
 * For a lossless array the brightness integral at uniform T equals the Twiss
 * matrix 2k_B T B (Z + Zᴴ) (conventions, "thermal noise" and "brightness noise";
 * docs/conventions.md), so the residual is the sphere rule's error for this
 * array's patterns: it cannot see a brightness discontinuity (use a refined
 * rule for that), but it grows quickly when the rule under-resolves the
 * array phase. R. Q. Twiss, "Nyquist's and Thevenin's theorems generalized
 * for nonreciprocal linear networks", J. Appl. Phys. 26(5), 1955 (from memory).
 * Cost O(N²).
 * @param budget - The noise budget.
 * @returns The residual (linear, ≥ 0).
 * @category Reception
 */
export function twissResidual(budget: NoiseBudget): number {
  const a = budget.radiationPerK.data, b = budget.isotropicPerK.data;
  let num = 0, den = 0;
  for (let k = 0; k < a.length; k++) { num += (a[k] - b[k]) ** 2; den += b[k] * b[k]; }
  return den > 0 ? Math.sqrt(num / den) : Infinity;
}

/** Largest distance of a list of values outside [0, 1]. */
function outsideUnitInterval(values: Iterable<number | undefined>): number {
  let worst = 0;
  for (const v of values) {
    if (v === undefined) continue;
    if (!Number.isFinite(v)) return NaN;
    worst = Math.max(worst, v - 1, -v);
  }
  return worst;
}

/**
 * The physical checks of one receiving-array evaluation (one frequency).
 *
 * @remarks
 * Always present, in this order:
 * The allowance of the energy and efficiency bounds is the accepted integration
 * error (`integrationTolerance`); a larger estimated error fails
 * `integrationRefinement` and does not widen the bounds.
 * - `radiationEfficiency`: the largest beam η_rad ≤ 1 + allowance
 *   (energy conservation; Warnick et al., IEEE Trans. Antennas Propag. 58(6),
 *   2010, from memory);
 * - `spilloverEfficiency` and, when present, `noiseMatchingEfficiency` and
 *   `embeddedElementEfficiency`: every value within [0, 1] (their definitions
 *   are ratios of a part to a whole). The aperture efficiency A_e/A_phys is
 *   deliberately not bounded: a finite array over an infinite ground plane, or
 *   with elements near its rim, collects from beyond N·d² (docs/reception.md
 *   derives it), and gain and directivity are not efficiencies;
 * - `impedancePassivity`: (Z + Zᴴ)/2 positive definite (value: its smallest
 *   eigenvalue [Ω]; verdict from its Cholesky factorisation);
 * - `minimumReceiverTemperature`: T_rec,min exists (fails when Z is not passive);
 * - `integrationRefinement` (when an integration error is given): the error ≤ tolerance;
 * - `twissResidual` (lossless arrays only): {@link twissResidual} ≤ tolerance;
 * - then the ports' own model-validity checks.
 * @param input - The pieces of the evaluation.
 * @returns The checks (plain data).
 * @throws {@link DomainError} for a malformed input.
 * @category Reception
 */
export function receivingArrayChecks(input: ReceivingArrayCheckInput): PhysicalCheck[] {
  if (input === null || typeof input !== 'object' || input.budget === undefined || !Array.isArray(input.beams)) {
    throw new DomainError(`invalid argument "input": expected {budget, beams, lossless, passivity, ...}, received ${describeValue(input)}.`);
  }
  const err = input.integrationError ?? 0;
  if (!(err >= 0)) throw new DomainError(`invalid argument "input.integrationError": expected a relative error ≥ 0, received ${describeValue(err)}.`);
  const tolTwiss = input.integrationTolerance ?? 1e-3;
  if (!(tolTwiss > 0)) throw new DomainError(`invalid argument "input.integrationTolerance": expected a relative error > 0, received ${describeValue(tolTwiss)}.`);
  // The bounds allow the accepted integration error: an estimated error above it fails
  // `integrationRefinement` itself and must not widen the bounds (with an error of 31.9 from a
  // far too coarse rule, η_rad = 32.9 would otherwise sit exactly on 1 + error).
  const allow = tolTwiss;
  const out: PhysicalCheck[] = [];
  let etaMax = 0;
  for (const b of input.beams) etaMax = Number.isNaN(b.radiationEfficiency) ? NaN : Math.max(etaMax, b.radiationEfficiency);
  out.push(physicalCheck('radiationEfficiency', etaMax, 'atMost', 1 + allow,
    `largest beam radiation efficiency η_rad (linear); energy conservation demands η_rad ≤ 1 within the integration error (accepted ${allow.toExponential(1)}); a larger value means the sphere rule or the patterns are wrong`,
    ['radiationEfficiency', 'directivity', 'skyTemperatureK', 'spilloverTemperatureK', 'systemTemperatureK']));
  out.push(physicalCheck('spilloverEfficiency', outsideUnitInterval(input.beams.map((b) => b.spilloverEfficiency)), 'atMost', allow,
    'largest distance of a beam spillover efficiency η_sp from [0, 1] (linear); it is a fraction of the radiated response',
    ['spilloverEfficiency']));
  if (input.beams.some((b) => b.noiseMatchingEfficiency !== undefined)) {
    out.push(physicalCheck('noiseMatchingEfficiency', outsideUnitInterval(input.beams.map((b) => b.noiseMatchingEfficiency)), 'atMost', 1e-6,
      'largest distance of a beam noise-matching efficiency T_rec,min/T_rec from [0, 1] (linear); T_rec,min is the minimum over all weights',
      ['noiseMatchingEfficiency']));
  }
  const eee = input.embeddedElementEfficiency;
  if (input.embeddedElementEfficiencyFailure !== undefined) {
    out.push(physicalCheck('embeddedElementEfficiency', NaN, 'atMost', allow,
      `embedded element efficiencies could not be computed: ${input.embeddedElementEfficiencyFailure}`, ['embeddedElementEfficiency']));
  } else if (eee !== undefined && eee.length > 0) {
    out.push(physicalCheck('embeddedElementEfficiency', outsideUnitInterval(eee), 'atMost', allow,
      'largest distance of an embedded element efficiency from [0, 1] (linear); a passive port cannot radiate more than its generator offers',
      ['embeddedElementEfficiency']));
  }
  const p = input.passivity;
  out.push({
    ...physicalCheck('impedancePassivity', p.smallestEigenvalueOhm, 'atLeast', 0,
      `smallest eigenvalue of (Z + Zᴴ)/2 [Ω] (Lanczos${p.converged ? '' : ' estimate, an upper bound'}; verdict from its Cholesky factorisation, or from the sign of that estimate when array figures are off above 500 ports); a negative value means the impedance matrix creates power — for analytic dipoles the one-mode model's limit, for imported data a non-passive network`,
      ['minimumReceiverTemperatureK', 'embeddedElementEfficiency', 'systemTemperatureK']),
    passed: p.positiveDefinite,
  });
  const tMin = input.minimumReceiverTemperatureK;
  if (tMin !== undefined) {
    out.push(physicalCheck('minimumReceiverTemperature', tMin, 'atLeast', 0,
      input.minimumReceiverTemperatureFailure === undefined
        ? 'the minimum receiver temperature T_rec,min [K] over all weights exists and is ≥ 0'
        : `the minimum receiver temperature T_rec,min [K] could not be computed: ${input.minimumReceiverTemperatureFailure}`,
      ['minimumReceiverTemperatureK', 'noiseMatchingEfficiency']));
  }
  if (input.integrationError !== undefined) {
    out.push(physicalCheck('integrationRefinement', err, 'atMost', tolTwiss,
      'largest change of a beam figure between the evaluation\'s sphere rule and a refined adaptive rule (split at every brightness and pattern discontinuity), relative to T_sys for temperatures and to itself for A_e/T_sys, absolute for efficiencies (linear): the integration error',
      ['systemTemperatureK', 'skyTemperatureK', 'spilloverTemperatureK', 'lossTemperatureK', 'sensitivityM2PerK', 'radiationEfficiency', 'spilloverEfficiency']));
  }
  if (input.lossless) {
    out.push(physicalCheck('twissResidual', twissResidual(input.budget), 'atMost', tolTwiss,
      'relative Frobenius residual between the brightness integral at uniform temperature and the Twiss matrix 2k_B T B (Z + Zᴴ) (linear): the sphere rule\'s adequacy for this array (blind to brightness jumps)',
      ['systemTemperatureK', 'skyTemperatureK', 'spilloverTemperatureK', 'radiationEfficiency', 'sensitivityM2PerK']));
  }
  if (input.portChecks !== undefined) out.push(...input.portChecks);
  return out;
}
