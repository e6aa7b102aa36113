/**
 * A priori cost of evaluateReceivingArray: time per stage and peak memory from
 * the element, direction and beam counts, so that a caller can print an
 * estimate before a long job and refuse layouts beyond memory.
 * @module
 */
import { CapacityError, DomainError } from '../errors.js';
import { assertInteger, describeValue } from '../internal/validate.js';

/**
 * Port count up to which `arrayFigures: 'auto'` computes the array figures (T_rec,min and the
 * embedded element efficiencies, O(N³) each; see `ReceivingArrayDescription.arrayFigures`).
 * @category Reception
 */
export const ARRAY_FIGURES_AUTO_MAX_PORTS = 1024;

/**
 * Port count up to which the passivity check of Z always factors (Z + Zᴴ)/2 (N³/3 complex
 * multiply–adds, about 0.2 s at N = 1261 on one core), array figures or not.
 * @category Reception
 */
export const PASSIVITY_CHOLESKY_MAX_PORTS = 2048;

/** @internal Resolves the `arrayFigures` option (true, false or 'auto') for n ports. */
export function arrayFiguresWanted(what: string, option: unknown, n: number): boolean {
  const o = option ?? 'auto';
  if (o === 'auto') return n <= ARRAY_FIGURES_AUTO_MAX_PORTS;
  if (typeof o !== 'boolean') {
    throw new DomainError(`invalid argument "${what}": expected true, false or 'auto', received ${describeValue(option)}.`);
  }
  return o;
}

/**
 * Sizes of one evaluation.
 * @category Reception
 */
export interface EvaluationSize {
  /** Number of ports N, integer ≥ 1. */
  readonly portCount: number;
  /** Directions of the sphere rule M (all rules of the evaluation together), integer ≥ 1. */
  readonly directionCount: number;
  /** Number of beams K, integer ≥ 1. */
  readonly beamCount: number;
  /** Whether the array figures (T_rec,min, embedded element efficiencies) are computed: as the evaluation's option (`'auto'`: up to 1024 ports). @defaultValue 'auto' */
  readonly arrayFigures?: boolean | 'auto';
  /**
   * Distinct element displacements when the displacement path applies
   * (identical, phase-shifted element patterns), e.g. from shiftedElementPorts;
   * absent for the general path.
   */
  readonly displacementCount?: number;
  /** Whether the brightness integrals are repeated on the 1.5× refined rule (ports with geometry). @defaultValue true */
  readonly refinement?: boolean;
}

/**
 * Estimated cost of one evaluation (one frequency).
 * @category Reception
 */
export interface EvaluationCost {
  /** Estimated wall-clock time per stage [s]. */
  readonly stagesS: {
    /** Induced-EMF impedance matrix (analytic elements; 0 for imported data is not assumed). */
    readonly impedance: number;
    /** Brightness integrals (patterns and their correlations). */
    readonly brightness: number;
    /** Coupled receiver noise Z Σ Zᴴ. */
    readonly receiverNoise: number;
    /** Cholesky of the total noise, weights and beam figures. */
    readonly beams: number;
    /** Passivity, T_rec,min and embedded element efficiencies. */
    readonly arrayFigures: number;
  };
  /** Sum of the stages [s]. */
  readonly totalS: number;
  /** Estimated peak memory [bytes]. */
  readonly peakBytes: number;
}

// Measured on the development machine (2-core x86-64, Node 20, WebAssembly SIMD), one core:
// seconds per unit of work. Recorded in docs/reception.md ("What it costs"); re-measure with
// bench/reception/scale.bench.ts when the kernels change. Busy machines are slower in proportion to the load.
const T_PATTERN = 1.8e-7; // one dipole far-field sample (with ground image), per port·direction
const T_HERK = 3.6e-10; // one complex multiply–add of the blocked rank-k update, per N²·M and map
const T_CUBE_CHOL = 1.7e-10; // blocked Cholesky, per N³
const T_CUBE_HERK = 4.0e-10; // Z Σ Zᴴ rank-N update, per N³
const T_CUBE_INV = 1.45e-9; // LU and inverse, per N³
const T_CUBE_GEMM = 5.6e-10; // complex product, per N³
const T_SQUARE = 3e-9; // one scalar pass over an N×N matrix (Lanczos step, fills), per N²
const T_IMPEDANCE = 2.7e-7; // induced-EMF table fill (reused integrals), per N²
const T_DISPLACEMENT = 1e-9; // one multiply–add of the displacement sums (SIMD product), per displacement cell·direction·map

/** Number of N×N complex matrices alive at the peak of an evaluation (budget, factors, inverse, kernel buffers). */
const PEAK_MATRICES = 22;

/**
 * Estimates the time and memory of {@link evaluateReceivingArray} before running it.
 *
 * @remarks
 * Stage models (operation counts; the constants are measured on the
 * development machine, so treat the times as ±50 %, not as a promise):
 * impedance ∝ N² (integrals reused per repeated geometry); brightness ∝ N·M
 * pattern samples + 2·N²·M rank-k work on the general path, or ∝ D·M + N² on
 * the displacement path (D distinct displacements), 3.25 times that with the
 * refinement rule (2.25 times the directions); receiver noise ∝ N³ (one
 * rank-N update); beams ∝ N³/3 (one Cholesky) + N²K; array figures ∝ N³ (one
 * Cholesky each of Re Z and R_rec, Lanczos steps ∝ N², one LU inverse and
 * one product for the efficiencies). Peak memory ≈ 22 N×N complex matrices
 * (16 bytes per entry) plus the pattern blocks.
 * @param size - Port, direction and beam counts.
 * @returns Stage times [s], total [s] and peak memory [bytes].
 * @throws {@link DomainError} for counts that are not positive integers.
 * @example
 * ```ts
 * const c = evaluationCost({ portCount: 1200, directionCount: 20000, beamCount: 25 });
 * c.peakBytes; // 5.18e8
 * ```
 * @category Reception
 */
export function evaluationCost(size: EvaluationSize): EvaluationCost {
  if (size === null || typeof size !== 'object') {
    throw new DomainError(`invalid argument "size": expected {portCount, directionCount, beamCount}, received ${describeValue(size)}.`);
  }
  assertInteger('size.portCount', size.portCount, 1, Number.MAX_SAFE_INTEGER);
  assertInteger('size.directionCount', size.directionCount, 1, Number.MAX_SAFE_INTEGER);
  assertInteger('size.beamCount', size.beamCount, 1, Number.MAX_SAFE_INTEGER);
  if (size.displacementCount !== undefined) assertInteger('size.displacementCount', size.displacementCount, 1, Number.MAX_SAFE_INTEGER);
  const n = size.portCount, m = size.directionCount, k = size.beamCount;
  const n2 = n * n, n3 = n2 * n;
  const once = size.displacementCount === undefined
    ? T_PATTERN * n * m + 2 * T_HERK * n2 * m
    : T_PATTERN * m + 4 * T_DISPLACEMENT * size.displacementCount * m + 8 * T_SQUARE * n2;
  // the refinement rule has 1.5² times the directions
  const brightness = (size.refinement ?? true) ? once * (1 + 2.25) : once;
  const arrayFigures = arrayFiguresWanted('size.arrayFigures', size.arrayFigures, n)
    ? 2 * T_CUBE_CHOL * n3 + 200 * 3 * T_SQUARE * n2 + T_CUBE_INV * n3 + T_CUBE_GEMM * n3
    : 0;
  const stagesS = {
    impedance: T_IMPEDANCE * n2,
    brightness,
    receiverNoise: T_CUBE_HERK * n3,
    beams: T_CUBE_CHOL * n3 + 8 * T_CUBE_GEMM * n2 * k + 10 * T_SQUARE * n2,
    arrayFigures,
  };
  const totalS = stagesS.impedance + stagesS.brightness + stagesS.receiverNoise + stagesS.beams + stagesS.arrayFigures;
  const peakBytes = 16 * PEAK_MATRICES * n2 + 64 * n * 128 + 48 * m;
  return { stagesS, totalS, peakBytes };
}

/**
 * Throws a {@link CapacityError} when an evaluation's estimated peak memory exceeds a limit.
 * @param cost - From {@link evaluationCost}.
 * @param limitBytes - Memory available to the job [bytes], > 0.
 * @param what - Description of the size for the message (e.g. "1000 × 1000 rectangular layout").
 * @returns Nothing.
 * @throws {@link CapacityError} naming the size, the estimate and the limit.
 * @category Reception
 */
export function assertEvaluationFits(cost: EvaluationCost, limitBytes: number, what: string): void {
  if (!(limitBytes > 0) || !Number.isFinite(limitBytes)) {
    throw new DomainError(`invalid argument "limitBytes": expected a finite number of bytes > 0, received ${describeValue(limitBytes)}.`);
  }
  if (cost.peakBytes > limitBytes) {
    throw new CapacityError(
      `${what} needs about ${(cost.peakBytes / 1e9).toPrecision(3)} GB of memory and ${cost.totalS.toPrecision(3)} s (estimate), beyond the ${(limitBytes / 1e9).toPrecision(3)} GB available; reduce the number of elements.`,
      cost.peakBytes, limitBytes,
    );
  }
}
