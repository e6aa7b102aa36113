/**
 * Figures of merit of a beamformed receiving array: SNR, system noise
 * temperature and its decomposition, sensitivity, effective area and the
 * efficiencies, for any weights or for the max-SNR weights.
 * @module
 */
import { DimensionError, DomainError, NotPositiveDefiniteError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { choleskyFactor, choleskySolve } from '../linalg/cholesky.js';
import { inverse } from '../linalg/lu.js';
import { generalizedHermitianEigen } from '../linalg/eigen.js';
import { quadraticForm } from '../linalg/ops.js';
import { assertFiniteCMatrix, assertNonNegative, assertPositive, describeValue } from '../internal/validate.js';
import { ETA0_OHM, K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { wavelengthM } from '../units/convert.js';
import type { NoiseBudget } from './budget.js';
import { assertSampledPatterns, type SampledPortPatterns } from './patterns.js';

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

/** @internal wᴴ(f_θ f_θᴴ + f_φ f_φᴴ)w for direction column k. */
function signalPower(w: Float64Array, wOff: number, p: SampledPortPatterns, k: number): number {
  const n = p.thetaComponentV.rows, m = p.thetaComponentV.cols;
  const ft = p.thetaComponentV.data, fp = p.phiComponentV.data;
  let tr = 0, ti = 0, pr = 0, pi = 0;
  for (let i = 0; i < n; i++) {
    const wr = w[wOff + 2 * i], wi = -w[wOff + 2 * i + 1]; // conj(w)
    const a = 2 * (i * m + k);
    tr += wr * ft[a] - wi * ft[a + 1]; ti += wr * ft[a + 1] + wi * ft[a];
    pr += wr * fp[a] - wi * fp[a + 1]; pi += wr * fp[a + 1] + wi * fp[a];
  }
  return tr * tr + ti * ti + pr * pr + pi * pi;
}

function column(w: CMatrix, j: number): CMatrix {
  const n = w.rows;
  const d = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) { d[2 * i] = w.data[2 * (i * w.cols + j)]; d[2 * i + 1] = w.data[2 * (i * w.cols + j) + 1]; }
  return { rows: n, cols: 1, data: d };
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
 *   A_e / T_sys = 2 k_B SNR / S exactly (DESIGN, "sensitivity") and A_e = λ²G/4π;
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
  const out: BeamFigures[] = [];
  for (let j = 0; j < kBeams; j++) out.push(figuresOfColumn(budget, column(weights, j), beamPatterns, j, options));
  return out;
}

function checkOptions(o: BeamFigureOptions): void {
  if (o === null || typeof o !== 'object') throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(o)}.`);
  if (o.physicalAreaM2 !== undefined) assertPositive('options.physicalAreaM2', o.physicalAreaM2, 'm²');
  if (o.fluxDensityWPerM2Hz !== undefined) assertNonNegative('options.fluxDensityWPerM2Hz', o.fluxDensityWPerM2Hz, 'W m⁻² Hz⁻¹');
  if (o.minimumReceiverTemperatureK !== undefined) assertNonNegative('options.minimumReceiverTemperatureK', o.minimumReceiverTemperatureK, 'K');
}

/** @internal Figures of one beam (no validation). */
export function figuresOfColumn(budget: NoiseBudget, w: CMatrix, p: SampledPortPatterns, k: number, o: BeamFigureOptions): BeamFigures {
  const pIso = quadraticForm(w, budget.isotropicPerK);
  if (!(pIso > 0)) {
    throw new DomainError(`invalid beam ${k}: the isotropic noise response wᴴ·2k_B B(Z + Zᴴ)·w is ${pIso}; the weights are zero or the impedance matrix is not passive.`);
  }
  const pSky = quadraticForm(w, budget.sky), pGround = quadraticForm(w, budget.ground);
  const pLoss = quadraticForm(w, budget.loss), pRec = quadraticForm(w, budget.receiver);
  const pRad = quadraticForm(w, budget.radiationPerK), pSkyRegion = quadraticForm(w, budget.skyRegionPerK);
  const tSys = (pSky + pGround + pLoss + pRec) / pIso;
  const lambda = wavelengthM(budget.frequencyHz);
  const i0 = budget.driveCurrentA;
  const sig = signalPower(w.data, 0, p, k);
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
  return fig;
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
 * @param noise - Total noise correlation R_n [V²], N×N Hermitian positive definite.
 * @param beamPatterns - Patterns at the K beam directions, N×K.
 * @returns Weights, N×K, each column of unit 2-norm.
 * @throws {@link DimensionError} for mismatched sizes; {@link NotPositiveDefiniteError} if R_n is not positive definite.
 * @category Reception
 */
export function maxSnrWeightsUnpolarized(noise: CMatrix, beamPatterns: SampledPortPatterns): CMatrix {
  const n = assertSampledPatterns('beamPatterns', beamPatterns);
  assertFiniteCMatrix('noise', noise);
  if (noise.rows !== n || noise.cols !== n) {
    throw new DimensionError(`invalid argument "noise": expected ${n}×${n} (the port count of "beamPatterns"), received ${noise.rows}×${noise.cols}.`);
  }
  const f = choleskyFactor(noise);
  if (!f.positiveDefinite) {
    throw new NotPositiveDefiniteError(`invalid argument "noise": the noise correlation is not positive definite (Cholesky pivot ${f.failedPivot}); add receiver or loss noise, or check the budget.`, f.failedPivot);
  }
  const kb = beamPatterns.thetaRad.length;
  // right-hand sides [f_θ(k), f_φ(k)] for every beam: N × 2K
  const rhs = new Float64Array(2 * n * 2 * kb);
  const ft = beamPatterns.thetaComponentV.data, fp = beamPatterns.phiComponentV.data;
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < kb; k++) {
      const s = 2 * (i * kb + k), d = 2 * (i * 2 * kb + 2 * k);
      rhs[d] = ft[s]; rhs[d + 1] = ft[s + 1]; rhs[d + 2] = fp[s]; rhs[d + 3] = fp[s + 1];
    }
  }
  const y = choleskySolve(f, { rows: n, cols: 2 * kb, data: rhs }).data;
  const out = new Float64Array(2 * n * kb);
  for (let k = 0; k < kb; k++) {
    // B = Pᴴ Y (2×2 Hermitian): a = f_θᴴ y_θ, d = f_φᴴ y_φ, b = f_θᴴ y_φ
    let a = 0, d = 0, br = 0, bi = 0;
    for (let i = 0; i < n; i++) {
      const s = 2 * (i * kb + k), t = 2 * (i * 2 * kb + 2 * k);
      a += ft[s] * y[t] + ft[s + 1] * y[t + 1];
      d += fp[s] * y[t + 2] + fp[s + 1] * y[t + 3];
      br += ft[s] * y[t + 2] + ft[s + 1] * y[t + 3];
      bi += ft[s] * y[t + 3] - ft[s + 1] * y[t + 2];
    }
    const bAbs = Math.hypot(br, bi);
    const lam = (a + d) / 2 + Math.sqrt(((a - d) / 2) ** 2 + bAbs * bAbs);
    // principal eigenvector u = [b, λ − a] (or a basis vector when b = 0)
    let u0r: number, u0i: number, u1r: number;
    if (bAbs > 1e-300 * Math.max(Math.abs(a), Math.abs(d), 1e-300)) { u0r = br; u0i = bi; u1r = lam - a; } else if (a >= d) { u0r = 1; u0i = 0; u1r = 0; } else { u0r = 0; u0i = 0; u1r = 1; }
    let norm = 0;
    for (let i = 0; i < n; i++) {
      const t = 2 * (i * 2 * kb + 2 * k);
      const wr = y[t] * u0r - y[t + 1] * u0i + y[t + 2] * u1r;
      const wi = y[t] * u0i + y[t + 1] * u0r + y[t + 3] * u1r;
      out[2 * (i * kb + k)] = wr; out[2 * (i * kb + k) + 1] = wi;
      norm += wr * wr + wi * wi;
    }
    norm = Math.sqrt(norm);
    if (!(norm > 0)) throw new DomainError(`beam ${k}: the array has no response in this direction (all patterns are zero); choose another beam direction.`);
    for (let i = 0; i < n; i++) { out[2 * (i * kb + k)] /= norm; out[2 * (i * kb + k) + 1] /= norm; }
  }
  return { rows: n, cols: kb, data: out };
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
  checkBeamPatterns(budget, beamPatterns);
  checkOptions(options);
  const weights = options.weights ?? maxSnrWeightsUnpolarized(budget.total, beamPatterns);
  const kb = beamPatterns.thetaRad.length;
  assertFiniteCMatrix('options.weights', weights);
  if (weights.rows !== budget.portCount || weights.cols !== kb) {
    throw new DimensionError(`invalid argument "options.weights": expected ${budget.portCount}×${kb}, received ${weights.rows}×${weights.cols}.`);
  }
  if (options.onProgress !== undefined && typeof options.onProgress !== 'function') {
    throw new DomainError(`invalid argument "options.onProgress": expected a function (done, total) → void, received ${describeValue(options.onProgress)}.`);
  }
  const beams: BeamFigures[] = [];
  for (let j = 0; j < kb; j++) {
    beams.push(figuresOfColumn(budget, column(weights, j), beamPatterns, j, options));
    options.onProgress?.(j + 1, kb);
  }
  return { weights, beams };
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
  const f = inverse(a).data;
  const rr = budget.radiationPerK.data, s = 1 / (4 * K_BOLTZMANN_J_PER_K * budget.bandwidthHz);
  const out = new Float64Array(n);
  for (let c = 0; c < n; c++) {
    let acc = 0;
    for (let i = 0; i < n; i++) {
      const ur = f[2 * (i * n + c)], ui = f[2 * (i * n + c) + 1];
      let tr = 0, ti = 0;
      for (let j = 0; j < n; j++) {
        const vr = f[2 * (j * n + c)], vi = f[2 * (j * n + c) + 1];
        const r = rr[2 * (i * n + j)], im = rr[2 * (i * n + j) + 1];
        tr += r * vr - im * vi; ti += r * vi + im * vr;
      }
      acc += ur * tr + ui * ti;
    }
    out[c] = 4 * zl[c][0] * acc * s;
  }
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
 * @param budget - Noise budget.
 * @returns T_rec,min [K].
 * @throws {@link NotPositiveDefiniteError} if Z + Zᴴ is not positive definite (a non-passive array).
 * @category Reception
 */
export function minimumReceiverTemperature(budget: NoiseBudget): number {
  const e = generalizedHermitianEigen(budget.receiver, budget.isotropicPerK, { valuesOnly: true });
  return Math.max(0, e.values[0]);
}
