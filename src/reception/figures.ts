/**
 * Figures of merit of a beamformed receiving array: SNR, system noise
 * temperature and its decomposition, sensitivity, effective area and the
 * efficiencies, for any weights or for the max-SNR weights.
 * @module
 */
import { ConvergenceError, DimensionError, DomainError, NotPositiveDefiniteError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { choleskyFactor, type CholeskyResult } from '../linalg/cholesky.js';
import { inverse } from '../linalg/lu.js';
import { lanczosExtremes } from '../internal/lanczos.js';
import { solveLowerInPlace, solveUpperInPlace } from '../internal/triangular.js';
import { gemmKernel } from '../internal/gemm.js';
import { assertFiniteCMatrix, assertNonNegative, assertPositive, describeValue } from '../internal/validate.js';
import { ETA0_OHM, K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { wavelengthM } from '../units/convert.js';
import type { NoiseBudget } from './budget.js';
import { assertSampledPatterns, type SampledPortPatterns } from './patterns.js';
import { displayable } from '../display/attach.js';
import { maxSnrWeightsUnpolarizedSource } from '../beamform/unpolarized.js';

/**
 * Figures of merit of one beam. Temperatures are referred to the isotropic
 * noise response (see {@link beamFigures}).
 * @category Reception
 */
export interface BeamFigures {
  /** System noise temperature T_sys [K]. */
  readonly systemTemperatureK: number;
  /** Sky contribution to T_sys [K] (η_rad η_sp T_sky for a uniform sky). */
  readonly skyTemperatureK: number;
  /** Ground (spillover) contribution to T_sys [K]. */
  readonly spilloverTemperatureK: number;
  /** Ohmic-loss contribution to T_sys [K] ((1 − η_rad) T_phys). */
  readonly lossTemperatureK: number;
  /** Beam-equivalent receiver temperature T_rec [K]. */
  readonly receiverTemperatureK: number;
  /** Effective area A_e for an unpolarized source [m²] (includes radiation efficiency). */
  readonly effectiveAreaM2: number;
  /** Sensitivity A_e / T_sys [m²/K]. */
  readonly sensitivityM2PerK: number;
  /** Gain G = 4π A_e / λ² (linear). */
  readonly gain: number;
  /** Directivity D = G / η_rad (linear). */
  readonly directivity: number;
  /** Radiation efficiency η_rad (linear, ≤ 1 for a passive array). */
  readonly radiationEfficiency: number;
  /** Spillover efficiency η_sp: fraction of the radiated isotropic response from the sky region (linear). */
  readonly spilloverEfficiency: number;
  /** Aperture efficiency A_e / A_phys (linear); present only when a physical area was given. */
  readonly apertureEfficiency?: number;
  /** SNR = wᴴR_s w / wᴴR_n w for the stated flux density (linear); present only when a flux density was given. */
  readonly snr?: number;
  /** Noise-matching efficiency T_rec,min / T_rec (linear); present only when T_rec,min was given. */
  readonly noiseMatchingEfficiency?: number;
}

/**
 * Options of {@link beamFigures}.
 * @category Reception
 */
export interface BeamFigureOptions {
  /** Physical aperture area for the aperture efficiency [m²], > 0. */
  physicalAreaM2?: number;
  /** Flux density of an unpolarized source for the SNR [W m⁻² Hz⁻¹], ≥ 0. */
  fluxDensityWPerM2Hz?: number;
  /** The array's minimum receiver temperature T_rec,min [K] for the noise-matching efficiency. */
  minimumReceiverTemperatureK?: number;
}

/** @internal Validates the beam-direction pattern samples against a budget. */
export function checkBeamPatterns(budget: NoiseBudget, patterns: SampledPortPatterns): void {
  const n = assertSampledPatterns('beamPatterns', patterns);
  if (n !== budget.portCount) {
    throw new DimensionError(`invalid argument "beamPatterns": ${n} ports, but the noise budget has ${budget.portCount}; both must describe the same ports.`);
  }
  if (Math.abs(patterns.frequencyHz - budget.frequencyHz) > 1e-9 * budget.frequencyHz) {
    throw new DomainError(`invalid argument "beamPatterns.frequencyHz": ${patterns.frequencyHz} Hz differs from the budget's ${budget.frequencyHz} Hz.`);
  }
}

/** @internal wᴴ(f_θ f_θᴴ + f_φ f_φᴴ)w for direction column k; w read with stride `ldw` (complex) from `wOff` (doubles). */
function signalPower(w: Float64Array, wOff: number, ldw: number, p: SampledPortPatterns, k: number): number {
  const n = p.thetaComponentV.rows, m = p.thetaComponentV.cols;
  const ft = p.thetaComponentV.data, fp = p.phiComponentV.data;
  let tr = 0, ti = 0, pr = 0, pi = 0;
  for (let i = 0; i < n; i++) {
    const wr = w[wOff + 2 * i * ldw], wi = -w[wOff + 2 * i * ldw + 1]; // conj(w)
    const a = 2 * (i * m + k);
    tr += wr * ft[a] - wi * ft[a + 1]; ti += wr * ft[a + 1] + wi * ft[a];
    pr += wr * fp[a] - wi * fp[a + 1]; pi += wr * fp[a + 1] + wi * fp[a];
  }
  return tr * tr + ti * ti + pr * pr + pi * pi;
}

/**
 * Figures of merit of beams with given open-circuit weights.
 *
 * @remarks
 * All correlations are at the open-circuit terminals; weights applied at the
 * amplifier outputs convert with referWeightsToOpenCircuit (SNR invariant).
 * Following K. F. Warnick, M. V. Ivashina, R. Maaskant, B. Woestenburg,
 * "Unified definitions of efficiencies and system noise temperature for
 * receiving antenna arrays", IEEE Trans. Antennas Propag. 58(6), 2010, and the
 * receiving-array terms of IEEE Std 145-2013 (both from memory), every
 * temperature is referred to the beam's isotropic noise response
 * P_iso = wᴴ·2k_B B (Z + Zᴴ)·w per kelvin (the output power for the array,
 * losses included, in an isotropic thermal environment at its own physical
 * temperature):
 * - T_sys = wᴴR_n w / P_iso, split into sky, spillover (ground), loss and receiver parts;
 * - η_rad = wᴴR_rad,1K w / P_iso; η_sp = wᴴR_sky-region,1K w / wᴴR_rad,1K w;
 * - A_e = λ² wᴴ(f_θ f_θᴴ + f_φ f_φᴴ)w / (η |I₀|² P_iso / (4 k_B B)), which makes
 *   A_e / T_sys = 2 k_B SNR / S exactly (conventions, "sensitivity") and A_e = λ²G/4π;
 * - η_ap = A_e / A_phys; η_nm = T_rec,min / T_rec.
 *
 * @param budget - The noise budget (arrayNoiseBudget).
 * @param weights - Open-circuit weights, N×K (one beam per column).
 * @param beamPatterns - Patterns at the K beam directions (column k ↔ beam k), N×K.
 * @param options - Physical area, flux density, T_rec,min.
 * @returns One BeamFigures per beam.
 * @throws {@link DimensionError} for mismatched port or beam counts; {@link DomainError} for bad options or zero weights.
 * @category Reception
 */
export function beamFigures(budget: NoiseBudget, weights: CMatrix, beamPatterns: SampledPortPatterns, options: BeamFigureOptions = {}): BeamFigures[] {
  checkBeamPatterns(budget, beamPatterns);
  assertFiniteCMatrix('weights', weights);
  const n = budget.portCount, kBeams = beamPatterns.thetaRad.length;
  if (weights.rows !== n || weights.cols !== kBeams) {
    throw new DimensionError(`invalid argument "weights": expected ${n}×${kBeams} (one column per beam direction of "beamPatterns"), received ${weights.rows}×${weights.cols}.`);
  }
  checkOptions(options);
  return figuresOfColumns(budget, weights, beamPatterns, options);
}

function checkOptions(o: BeamFigureOptions): void {
  if (o === null || typeof o !== 'object') throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(o)}.`);
  if (o.physicalAreaM2 !== undefined) assertPositive('options.physicalAreaM2', o.physicalAreaM2, 'm²');
  if (o.fluxDensityWPerM2Hz !== undefined) assertNonNegative('options.fluxDensityWPerM2Hz', o.fluxDensityWPerM2Hz, 'W m⁻² Hz⁻¹');
  if (o.minimumReceiverTemperatureK !== undefined) assertNonNegative('options.minimumReceiverTemperatureK', o.minimumReceiverTemperatureK, 'K');
}

/** Whether every entry is zero. */
function isZero(a: Float64Array): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== 0) return false;
  return true;
}

/**
 * @internal Re{wₖᴴ R wₖ} for every column wₖ of W (N×K) and every matrix R of
 * the list: one matrix product R·W per matrix (SIMD kernel), then K column
 * dot products — O(N²K) with no per-beam pass over R.
 */
export function columnQuadraticForms(w: CMatrix, matrices: ReadonlyArray<CMatrix>): Float64Array[] {
  const n = w.rows, k = w.cols, x = w.data;
  const rw = new Float64Array(2 * n * k);
  return matrices.map((r) => {
    // an all-zero matrix (a lossless budget's loss, an absent receiver) has zero forms: one
    // read-only scan instead of copying it into the product kernel
    if (isZero(r.data)) return new Float64Array(k);
    gemmKernel(n, k, n, r.data, 0, n, x, 0, k, rw, 0, k, false);
    const out = new Float64Array(k);
    for (let i = 0; i < n; i++) {
      for (let c = 0; c < k; c++) {
        const q = 2 * (i * k + c);
        out[c] += x[q] * rw[q] + x[q + 1] * rw[q + 1];
      }
    }
    return out;
  });
}

/**
 * @internal The quadratic forms Re{wₖᴴ R wₖ} of a budget's matrices for every beam k (K values
 * each) — all that the beam figures need from the budget besides its scalars.
 */
export interface BudgetForms {
  readonly iso: Float64Array; readonly sky: Float64Array; readonly ground: Float64Array; readonly loss: Float64Array;
  readonly rec: Float64Array; readonly rad: Float64Array; readonly skyRegion: Float64Array;
}

/** @internal The forms of every budget matrix for the columns of `weights` (seven products R·W). */
export function budgetForms(budget: NoiseBudget, weights: CMatrix): BudgetForms {
  const [iso, sky, ground, loss, rec, rad, skyRegion] = columnQuadraticForms(weights, [
    budget.isotropicPerK, budget.sky, budget.ground, budget.loss, budget.receiver, budget.radiationPerK, budget.skyRegionPerK,
  ]);
  return { iso, sky, ground, loss, rec, rad, skyRegion };
}

/** @internal Figures of every beam (no validation); beam k uses column k of the weights and of the patterns. */
export function figuresOfColumns(budget: NoiseBudget, weights: CMatrix, p: SampledPortPatterns, o: BeamFigureOptions, onBeam?: (done: number, total: number) => void): BeamFigures[] {
  return figuresOfForms(budget, budgetForms(budget, weights), weights, p, o, onBeam);
}

/** @internal Figures of every beam from the budget's forms (no validation). */
export function figuresOfForms(
  budget: NoiseBudget, forms: BudgetForms, weights: CMatrix, p: SampledPortPatterns, o: BeamFigureOptions, onBeam?: (done: number, total: number) => void,
): BeamFigures[] {
  const { iso, sky, ground, loss, rec, rad, skyRegion } = forms;
  const out: BeamFigures[] = [];
  for (let k = 0; k < weights.cols; k++) {
    out.push(figuresFromForms(budget, iso[k], sky[k], ground[k], loss[k], rec[k], rad[k], skyRegion[k], signalPower(weights.data, 2 * k, weights.cols, p, k), p, k, o));
    onBeam?.(k + 1, weights.cols);
  }
  return out;
}

/** @internal Figures of one beam from its quadratic forms (no validation). */
function figuresFromForms(
  budget: NoiseBudget, pIso: number, pSky: number, pGround: number, pLoss: number, pRec: number, pRad: number, pSkyRegion: number,
  sig: number, p: SampledPortPatterns, k: number, o: BeamFigureOptions,
): BeamFigures {
  if (!(pIso > 0)) {
    throw new DomainError(`invalid beam ${k}: the isotropic noise response wᴴ·2k_B B(Z + Zᴴ)·w is ${pIso}; the weights are zero or the impedance matrix is not passive.`);
  }
  const tSys = (pSky + pGround + pLoss + pRec) / pIso;
  const lambda = wavelengthM(budget.frequencyHz);
  const i0 = budget.driveCurrentA;
  const aE = (lambda * lambda * sig * 4 * K_BOLTZMANN_J_PER_K * budget.bandwidthHz) / (ETA0_OHM * i0 * i0 * pIso);
  const gain = (4 * Math.PI * aE) / (lambda * lambda);
  const etaRad = pRad / pIso;
  const tRec = pRec / pIso;
  const fig: {
    -readonly [K in keyof BeamFigures]: BeamFigures[K];
  } = {
    systemTemperatureK: tSys,
    skyTemperatureK: pSky / pIso,
    spilloverTemperatureK: pGround / pIso,
    lossTemperatureK: pLoss / pIso,
    receiverTemperatureK: tRec,
    effectiveAreaM2: aE,
    sensitivityM2PerK: aE / tSys,
    gain,
    directivity: gain / etaRad,
    radiationEfficiency: etaRad,
    spilloverEfficiency: pSkyRegion / pRad,
  };
  if (o.physicalAreaM2 !== undefined) fig.apertureEfficiency = aE / o.physicalAreaM2;
  if (o.fluxDensityWPerM2Hz !== undefined) {
    const s = (2 * o.fluxDensityWPerM2Hz * budget.bandwidthHz * lambda * lambda) / (ETA0_OHM * i0 * i0);
    fig.snr = (s * sig) / (pIso * tSys);
  }
  if (o.minimumReceiverTemperatureK !== undefined && tRec > 0) fig.noiseMatchingEfficiency = o.minimumReceiverTemperatureK / tRec;
  return displayable(fig, 'BeamFigures');
}

/**
 * Maximum-SNR open-circuit weights for an unpolarized point source in each
 * beam direction.
 *
 * @remarks
 * The unpolarized signal correlation R_s ∝ P Pᴴ with P = [f_θ f_φ] (N×2) has
 * rank two, so the maximum of wᴴR_s w / wᴴR_n w is the largest eigenvalue of
 * the 2×2 matrix Pᴴ R_n⁻¹ P, reached by w = R_n⁻¹ P u with u its principal
 * eigenvector (closed form). One Cholesky factorization of R_n serves every
 * beam. The optimum is independent of the reference plane (open circuit or
 * loads). Source: generalized Rayleigh quotient, e.g. H. L. Van Trees, *Optimum
 * Array Processing*, Wiley, 2002, §6.2 (from memory).
 * Argument order (beamPatterns, noise): the response first, the correlation second, as in
 * every weight function (beamform module); the former (noise, beamPatterns) order is still
 * accepted (deprecated overload). The beamformer itself is the beamform module's
 * {@link maxSnrWeightsUnpolarizedSource}, called with the patterns' θ̂ and φ̂ components.
 * @param beamPatterns - Patterns at the K beam directions, N×K.
 * @param noise - Total noise correlation R_n [V²], N×N Hermitian positive definite.
 * @returns Weights, N×K, each column of unit 2-norm.
 * @throws {@link DimensionError} for mismatched sizes; {@link NotPositiveDefiniteError} if R_n is not positive definite.
 * @category Reception
 */
export function maxSnrWeightsUnpolarized(beamPatterns: SampledPortPatterns, noise: CMatrix): CMatrix;
/**
 * @deprecated The (noise, beamPatterns) order; use `maxSnrWeightsUnpolarized(beamPatterns, noise)`.
 * @param noise - Total noise correlation R_n [V²], N×N.
 * @param beamPatterns - Patterns at the K beam directions.
 * @returns Weights, N×K.
 */
export function maxSnrWeightsUnpolarized(noise: CMatrix, beamPatterns: SampledPortPatterns): CMatrix;
export function maxSnrWeightsUnpolarized(first: SampledPortPatterns | CMatrix, second: CMatrix | SampledPortPatterns): CMatrix {
  const oldOrder = first !== null && typeof first === 'object' && 'rows' in first && second !== null && typeof second === 'object' && 'thetaComponentV' in second;
  const beamPatterns = (oldOrder ? second : first) as SampledPortPatterns;
  const noise = (oldOrder ? first : second) as CMatrix;
  const n = assertSampledPatterns('beamPatterns', beamPatterns);
  assertFiniteCMatrix('noise', noise);
  if (noise.rows !== n || noise.cols !== n) {
    throw new DimensionError(`invalid argument "noise": expected ${n}×${n} (the port count of "beamPatterns"), received ${noise.rows}×${noise.cols}.`);
  }
  return maxSnrWeightsUnpolarizedSource(beamPatterns.thetaComponentV, beamPatterns.phiComponentV, noise);
}

/**
 * Options of {@link scanSweep}.
 * @category Reception
 */
export interface ScanSweepOptions extends BeamFigureOptions {
  /** Open-circuit weights, N×K; default: max-SNR weights for an unpolarized source in each direction. */
  weights?: CMatrix;
  /** Called after each beam with (beams done, total beams); for progress bars on long sweeps. */
  onProgress?: (done: number, total: number) => void;
}

/**
 * Result of {@link scanSweep}.
 * @category Reception
 */
export interface ScanSweepResult {
  /** Open-circuit weights used, N×K. */
  readonly weights: CMatrix;
  /** Figures per beam direction. */
  readonly beams: BeamFigures[];
}

/**
 * All figures of merit over a list of beam directions.
 * @param budget - Noise budget.
 * @param beamPatterns - Patterns at the K beam directions.
 * @param options - Weights (default max-SNR), area, flux, T_rec,min and progress callback.
 * @returns Weights and figures per beam.
 * @throws As {@link beamFigures} and {@link maxSnrWeightsUnpolarized}.
 * @category Reception
 */
export function scanSweep(budget: NoiseBudget, beamPatterns: SampledPortPatterns, options: ScanSweepOptions = {}): ScanSweepResult {
  return scanSweepWithForms(budget, beamPatterns, options).result;
}

/** @internal {@link scanSweep} that also returns the budget's quadratic forms of the weights it used. */
export function scanSweepWithForms(budget: NoiseBudget, beamPatterns: SampledPortPatterns, options: ScanSweepOptions = {}): { result: ScanSweepResult; forms: BudgetForms } {
  checkBeamPatterns(budget, beamPatterns);
  checkOptions(options);
  const weights = options.weights ?? maxSnrWeightsUnpolarized(beamPatterns, budget.total);
  const kb = beamPatterns.thetaRad.length;
  assertFiniteCMatrix('options.weights', weights);
  if (weights.rows !== budget.portCount || weights.cols !== kb) {
    throw new DimensionError(`invalid argument "options.weights": expected ${budget.portCount}×${kb}, received ${weights.rows}×${weights.cols}.`);
  }
  if (options.onProgress !== undefined && typeof options.onProgress !== 'function') {
    throw new DomainError(`invalid argument "options.onProgress": expected a function (done, total) → void, received ${describeValue(options.onProgress)}.`);
  }
  const forms = budgetForms(budget, weights);
  const beams = figuresOfForms(budget, forms, weights, beamPatterns, options, options.onProgress);
  return { result: displayable<ScanSweepResult>({ weights, beams }, 'ScanSweepResult'), forms };
}

/**
 * Embedded element efficiency of every port.
 *
 * @remarks
 * Port n is driven by a generator whose internal impedance is its termination
 * Z_L,n while every other port is terminated in its own Z_L; the efficiency is
 * the radiated power over the generator's available power:
 * ηₙ = 4 Re Z_L,n · uₙᴴ R_rad uₙ with uₙ = column n of (Z_A + Z_L)⁻¹ and
 * R_rad = R_rad,1K / (4 k_B B) the radiation resistance matrix. It includes
 * mismatch, coupling into the other terminations and ohmic loss; a single
 * lossless conjugate-matched element gives 1. Source: D. F. Kelley, W. L.
 * Stutzman, "Array antenna pattern modeling methods that include mutual
 * coupling effects", IEEE Trans. Antennas Propag. 41(12), 1993; P. W. Hannan,
 * "The element-gain paradox for a phased-array antenna", IEEE Trans. Antennas
 * Propag. 12(4), 1964 (from memory).
 * @param budget - Noise budget (Z_A and the radiation matrix).
 * @param terminationOhm - Termination impedances Z_L [Ω], one per port (a real or complex value each).
 * @returns ηₙ per port (linear).
 * @throws {@link DimensionError} for a wrong number of terminations; {@link DomainError} for Re Z_L ≤ 0.
 * @category Reception
 */
export function embeddedElementEfficiencies(budget: NoiseBudget, terminationOhm: ReadonlyArray<{ re: number; im: number } | number>): Float64Array {
  const n = budget.portCount;
  if (!Array.isArray(terminationOhm) || terminationOhm.length !== n) {
    throw new DimensionError(`invalid argument "terminationOhm": expected ${n} impedances (one per port), received ${describeValue(terminationOhm)}.`);
  }
  const zl = terminationOhm.map((v, i) => {
    const re = typeof v === 'number' ? v : v?.re, im = typeof v === 'number' ? 0 : v?.im;
    if (!(Number.isFinite(re) && Number.isFinite(im) && re > 0)) {
      throw new DomainError(`invalid argument "terminationOhm[${i}]": expected a passive impedance with a positive real part [Ω], received ${describeValue(v)}.`);
    }
    return [re, im] as [number, number];
  });
  const a = { rows: n, cols: n, data: budget.impedanceOhm.data.slice() };
  for (let i = 0; i < n; i++) { a.data[2 * (i * n + i)] += zl[i][0]; a.data[2 * (i * n + i) + 1] += zl[i][1]; }
  // one LU of Z_A + Z_L (inside inverse), one product R_rad·U (SIMD kernel), then the diagonal of Uᴴ(R_rad U)
  const u = inverse(a).data;
  const ru = new Float64Array(2 * n * n);
  gemmKernel(n, n, n, budget.radiationPerK.data, 0, n, u, 0, n, ru, 0, n, false);
  const s = 1 / (4 * K_BOLTZMANN_J_PER_K * budget.bandwidthHz);
  const acc = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    for (let c = 0; c < n; c++) {
      const q = 2 * (i * n + c);
      acc[c] += u[q] * ru[q] + u[q + 1] * ru[q + 1];
    }
  }
  const out = new Float64Array(n);
  for (let c = 0; c < n; c++) out[c] = 4 * zl[c][0] * acc[c] * s;
  return out;
}

/**
 * The array's minimum receiver temperature: the lowest beam-equivalent
 * receiver temperature over all weights.
 *
 * @remarks
 * T_rec,min = min_w wᴴR_rec w / wᴴR_iso,1K w, the smallest generalized
 * eigenvalue of (R_rec, 2k_B B (Z + Zᴴ)). It is the reference of the
 * noise-matching efficiency η_nm = T_rec,min / T_rec (K. F. Warnick,
 * B. Woestenburg, L. Belostotski, P. Russer, IEEE Trans. Antennas Propag. 57(7),
 * 2009; K. F. Warnick et al., IEEE Trans. Antennas Propag. 58(6), 2010 — from memory).
 * Computed as 1/μ_max with μ_max the largest eigenvalue of L_rec⁻¹ R_iso L_rec⁻ᴴ
 * (R_rec = L_rec L_recᴴ) by Lanczos (C. Lanczos, J. Res. Nat. Bur. Standards 45,
 * 1950, from memory): the receiver spectrum clusters just above T_min, and the
 * reciprocal pencil separates that cluster. Cost: one Cholesky of R_iso (the
 * passivity test), one of R_rec, O(N²) per Lanczos step.
 * @param budget - Noise budget.
 * @returns T_rec,min [K].
 * @throws {@link NotPositiveDefiniteError} if Z + Zᴴ is not positive definite (a non-passive array);
 *   {@link ConvergenceError} if Lanczos does not converge in 400 steps (not observed).
 * @category Reception
 */
export function minimumReceiverTemperature(budget: NoiseBudget): number {
  return minimumReceiverTemperatureFrom(budget, choleskyFactor(budget.isotropicPerK), 1);
}

/**
 * @internal {@link minimumReceiverTemperature} with a Cholesky factorisation of R_iso,1K / isoScale
 * already done (the evaluation factors R_iso,1K itself, so isoScale = 1; a factor of (Z + Zᴴ)/2 needs isoScale = 4 k_B B).
 */
export function minimumReceiverTemperatureFrom(budget: NoiseBudget, isoFactor: CholeskyResult, isoScale: number): number {
  const n = budget.portCount;
  if (!isoFactor.positiveDefinite) {
    throw new NotPositiveDefiniteError(`the isotropic noise response 2k_B B (Z + Zᴴ) is not positive definite (Cholesky pivot ${isoFactor.failedPivot}): the impedance matrix is not passive, so no minimum receiver temperature exists; check the element model's validity or the imported impedance matrix.`, isoFactor.failedPivot);
  }
  const rec = budget.receiver.data;
  let any = false;
  for (let k = 0; k < rec.length && !any; k++) any = rec[k] !== 0;
  if (!any) return 0;
  // The receiver spectrum clusters just above T_min, so the smallest eigenvalue of L⁻¹R_rec L⁻ᴴ
  // converges slowly; the reciprocal pencil (largest μ of L_rec⁻¹ R_iso L_rec⁻ᴴ, μ = 1/T) separates
  // that cluster far better. It needs R_rec positive definite; otherwise the direct pencil is used.
  const recFactor = choleskyFactor(budget.receiver);
  const [f, other, which] = recFactor.positiveDefinite
    ? [recFactor, budget.isotropicPerK.data, 'max' as const]
    : [isoFactor, rec, 'min' as const];
  const l = f.l.data, lh = f.lAdjoint.data;
  const t = new Float64Array(2 * n);
  const e = lanczosExtremes(n, (x, y) => {
    t.set(x);
    solveUpperInPlace(n, 1, lh, t, false);
    gemmKernel(n, 1, n, other, 0, n, t, 0, 1, y, 0, 1, false);
    solveLowerInPlace(n, 1, l, y, false);
  }, which, 1e-10);
  if (!e.converged) {
    throw new ConvergenceError(`minimumReceiverTemperature: the Lanczos iteration did not converge in ${e.steps} steps (estimate ${which === 'max' ? 1 / e.max : e.min / isoScale} K).`);
  }
  return Math.max(0, which === 'max' ? 1 / e.max : e.min / isoScale);
}
