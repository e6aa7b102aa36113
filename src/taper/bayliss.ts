/**
 * Bayliss difference-pattern line-source taper.
 * @module
 */
import { Matrix, solve } from 'ml-matrix';
import { ConvergenceError } from '../errors.js';
import { assertInteger } from '../internal/validate.js';
import { sampleUniformLine, type LineDistribution } from './aperture.js';
import { assertElementCount, assertSidelobeLevel, type TaperOptions } from './normalize.js';
import { dilatedZeros, taylorA } from './design.js';
import { sincPi, type TaperWarning } from './warning.js';
import { displayable } from '../display/attach.js';

/**
 * A Bayliss difference-pattern line-source design.
 * @category Tapers
 */
export interface BaylissLineSourceDesign {
  /** Odd aperture distribution g(p) = Σ Bₘ sin(2π(m+½)p), p ∈ [−½, ½], positive for p > 0 [dimensionless]. */
  readonly distribution: LineDistribution;
  /** Moved pattern zeros z₁ … z_{n̄−1} in u = L sinθ/λ; zeros from n̄ on stay at u = n + ½ [dimensionless]. */
  readonly zeros: Float64Array;
  /** Coefficients B₀ … B_{n̄−1}, scaled so that max |g| on the aperture is about 1 [dimensionless]. */
  readonly coefficients: Float64Array;
  /** Newton (perturbation) iterations used to place the zeros. */
  readonly iterations: number;
  /** Peak sidelobe of the continuous difference pattern relative to its main-lobe peak, negative [dB, power ratio]. */
  readonly lineSourcePeakSidelobeDb: number;
  /** u of the difference main-lobe peak [dimensionless]. */
  readonly mainLobePeakU: number;
  /** Design warnings (sidelobes beyond n̄ above the design level). */
  readonly warnings: readonly TaperWarning[];
}

/**
 * A Bayliss taper sampled on an N-element line, with its design.
 * @category Tapers
 */
export interface BaylissTaperResult extends BaylissLineSourceDesign {
  /** N real, antisymmetric weights (wₙ = −w_{N−1−n}) [dimensionless]. */
  readonly weights: Float64Array;
}

const MAX_ITERATIONS = 100;
const TOLERANCE_NEPER = 1e-10;

/** ln|D(u)| of the Bayliss-form pattern D(u) = u cos(πu) Π(1 − u²/zₖ²) / Π_{n<n̄}(1 − u²/cₙ²), cₙ = n + ½. */
function logAbsPattern(u: number, zeros: Float64Array, nbar: number): number {
  const au = Math.abs(u);
  const near = Math.round(au - 0.5);
  let value = Math.log(au);
  if (near >= 0 && near < nbar) {
    // cos(πu)/(1 − u²/c²) = ±c² π sinc(c − |u|)/(c + |u|): exact through the removable pole.
    const c = near + 0.5;
    value += Math.log((c * c * Math.PI * Math.abs(sincPi(c - au))) / (c + au));
  } else {
    value += Math.log(Math.abs(Math.cos(Math.PI * au)));
  }
  for (let n = 0; n < nbar; n++) {
    if (n === near) continue;
    const c = n + 0.5;
    value -= Math.log(Math.abs(1 - (au * au) / (c * c)));
  }
  for (let k = 0; k < zeros.length; k++) value += Math.log(Math.abs(1 - (au * au) / (zeros[k] * zeros[k])));
  return value;
}

/** Maximum of ln|D| on (lo, hi), where |D| is unimodal, by golden-section search. */
function peakBetween(lo: number, hi: number, zeros: Float64Array, nbar: number): { u: number; value: number } {
  const g = (Math.sqrt(5) - 1) / 2;
  let a = lo, b = hi;
  let x1 = b - g * (b - a), x2 = a + g * (b - a);
  let f1 = logAbsPattern(x1, zeros, nbar), f2 = logAbsPattern(x2, zeros, nbar);
  for (let i = 0; i < 80 && b - a > 1e-13 * hi; i++) {
    if (f1 < f2) { a = x1; x1 = x2; f1 = f2; x2 = a + g * (b - a); f2 = logAbsPattern(x2, zeros, nbar); }
    else { b = x2; x2 = x1; f2 = f1; x1 = b - g * (b - a); f1 = logAbsPattern(x1, zeros, nbar); }
  }
  return f1 > f2 ? { u: x1, value: f1 } : { u: x2, value: f2 };
}

/**
 * Designs a Bayliss difference-pattern line source: an odd distribution whose pattern has a
 * null at broadside, a split main lobe, and near-in sidelobes at the requested level.
 *
 * @remarks
 * Pattern form (Bayliss 1968): D(u) = u cos(πu) Π_{k=1}^{n̄−1}(1 − u²/zₖ²) / Π_{n=0}^{n̄−1}(1 − u²/(n+½)²),
 * u = L sinθ/λ; the zeros from n̄ on are those of the uniform-odd (sin-series) line source,
 * u = n + ½. Distribution g(p) = Σ_{m=0}^{n̄−1} Bₘ sin(2π(m+½)p) with
 * Bₘ ∝ (−1)^m cₘ² Π_k(1 − cₘ²/zₖ²) / Π_{n≠m}(1 − cₘ²/cₙ²), cₘ = m + ½ (our derivation: the
 * pattern of sin(2πcₘp) vanishes at every other half-integer u).
 *
 * Zero placement: Bayliss tabulated fitted polynomials for his parameters A and ξₙ; we do not
 * hold them reliably, so the n̄−1 moved zeros are solved numerically instead, by Elliott's
 * perturbation (Newton) iteration on ln|D| at the sidelobe peaks, until the first n̄−1
 * sidelobes all equal the requested level relative to the difference main-lobe peak (to
 * 1e-10 neper). Start: zₖ = σ√(A² + k²), σ = (n̄+½)/√(A² + n̄²), A = arccosh(R)/π.
 * The result is the equal-near-sidelobe member of Bayliss's family; sidelobes beyond n̄
 * decay like those of the uniform-odd source.
 *
 * References:
 * - E. T. Bayliss, "Design of monopulse antenna difference patterns with low sidelobes",
 *   Bell Syst. Tech. J. 47(5), 1968, pp. 623–650.
 * - R. S. Elliott, "Design of line source antennas for difference patterns with sidelobes of
 *   individually arbitrary heights", IEEE Trans. Antennas Propag. AP-24(3), 1976, pp. 310–316
 *   (from memory).
 *
 * @param sllDb - Design sidelobe level, positive dB below the difference main-lobe peak (power ratio), in (0, 200].
 * @param nbar - n̄, integer in [1, 60] (number of moved zeros + 1).
 * @returns The design, with distribution, zeros, coefficients and warnings.
 * @throws {@link DomainError} if `sllDb` is not in (0, 200] or n̄ is not an integer in [1, 60].
 * @throws {@link ConvergenceError} if the zero placement does not converge (an unreachable
 *   level for this n̄; lower the level or change n̄).
 * @category Tapers
 */
export function baylissLineSource(sllDb: number, nbar: number): BaylissLineSourceDesign {
  assertSidelobeLevel('sllDb', sllDb);
  assertInteger('nbar', nbar, 1, 60);
  const m = nbar - 1;
  const a = taylorA(sllDb);
  const sigma = (nbar + 0.5) / Math.sqrt(a * a + nbar * nbar);
  let zeros = dilatedZeros(a, sigma, m, 0);
  const target = -(sllDb / 20) * Math.LN10;
  const edges = (z: Float64Array): number[] => [0, ...z, nbar + 0.5];
  const evaluate = (z: Float64Array) => {
    const e = edges(z);
    const peaks = [] as { u: number; value: number }[];
    for (let i = 0; i < e.length - 1 && i <= m; i++) peaks.push(peakBetween(e[i], e[i + 1], z, nbar));
    const residual = new Float64Array(m);
    let worst = 0;
    for (let k = 1; k <= m; k++) {
      residual[k - 1] = peaks[k].value - peaks[0].value - target;
      worst = Math.max(worst, Math.abs(residual[k - 1]));
    }
    return { peaks, residual, worst };
  };
  let state = evaluate(zeros);
  let iterations = 0;
  while (state.worst > TOLERANCE_NEPER) {
    if (++iterations > MAX_ITERATIONS) {
      throw new ConvergenceError(`baylissLineSource: zero placement for ${sllDb} dB, n̄ = ${nbar} did not converge in ${MAX_ITERATIONS} iterations (worst sidelobe error ${(state.worst * 20 / Math.LN10).toExponential(2)} dB); try a different n̄ or level.`);
    }
    // ∂ ln|D(v)| / ∂z = 2v² / (z (z² − v²)); sidelobe peaks are stationary in u.
    const jac = new Matrix(m, m);
    const v0 = state.peaks[0].u;
    for (let k = 1; k <= m; k++) {
      const v = state.peaks[k].u;
      for (let n = 0; n < m; n++) {
        const z = zeros[n];
        jac.set(k - 1, n, (2 * v * v) / (z * (z * z - v * v)) - (2 * v0 * v0) / (z * (z * z - v0 * v0)));
      }
    }
    const rhs = Matrix.columnVector(Array.from(state.residual, (x) => -x));
    const step = solve(jac, rhs).to1DArray();
    // Damp until the zeros stay ordered inside (0, n̄ + ½) and the residual decreases.
    let lambda = 1;
    for (;;) {
      const trial = new Float64Array(m);
      let ordered = true;
      for (let n = 0; n < m; n++) {
        trial[n] = zeros[n] + lambda * step[n];
        if (!(trial[n] > (n === 0 ? 0 : trial[n - 1])) || !(trial[n] < nbar + 0.5)) ordered = false;
      }
      if (ordered) {
        const next = evaluate(trial);
        if (next.worst < state.worst || lambda < 1e-3) { zeros = trial; state = next; break; }
      }
      lambda /= 2;
      if (lambda < 1e-6) {
        throw new ConvergenceError(`baylissLineSource: zero placement for ${sllDb} dB, n̄ = ${nbar} stalled (worst sidelobe error ${(state.worst * 20 / Math.LN10).toExponential(2)} dB); try a different n̄ or level.`);
      }
    }
  }
  const coefficients = new Float64Array(nbar);
  for (let mm = 0; mm < nbar; mm++) {
    const c = mm + 0.5;
    let b = (mm % 2 === 0 ? 1 : -1) * c * c;
    for (let k = 0; k < m; k++) b *= 1 - (c * c) / (zeros[k] * zeros[k]);
    for (let n = 0; n < nbar; n++) if (n !== mm) b /= 1 - (c * c) / ((n + 0.5) * (n + 0.5));
    coefficients[mm] = b;
  }
  const raw: LineDistribution = (p) => {
    let g = 0;
    for (let mm = 0; mm < nbar; mm++) g += coefficients[mm] * Math.sin(2 * Math.PI * (mm + 0.5) * p);
    return g;
  };
  let gMax = 0;
  for (let i = 0; i <= 512; i++) gMax = Math.max(gMax, Math.abs(raw((0.5 * i) / 512)));
  for (let mm = 0; mm < nbar; mm++) coefficients[mm] /= gMax;
  const distribution = raw; // reads the rescaled coefficients
  // Scan the continuous pattern beyond the moved zeros for the overall peak sidelobe.
  const e = edges(zeros);
  let worstSidelobe = -Infinity;
  for (let i = 1; i < e.length - 1; i++) worstSidelobe = Math.max(worstSidelobe, state.peaks[i].value);
  for (let n = nbar; n < nbar + 4; n++) worstSidelobe = Math.max(worstSidelobe, peakBetween(n + 0.5, n + 1.5, zeros, nbar).value);
  const lineSourcePeakSidelobeDb = ((worstSidelobe - state.peaks[0].value) * 20) / Math.LN10;
  const warnings: TaperWarning[] = [];
  if (lineSourcePeakSidelobeDb > -sllDb + 0.5) {
    warnings.push({
      code: 'sidelobes-above-design',
      message: `Bayliss line source for ${sllDb} dB with n̄ = ${nbar} reaches a sidelobe of ${lineSourcePeakSidelobeDb.toFixed(2)} dB beyond the n̄ region; increase n̄.`,
    });
  }
  return { distribution, zeros, coefficients, iterations, lineSourcePeakSidelobeDb, mainLobePeakU: state.peaks[0].u, warnings };
}

/**
 * Bayliss difference taper of an N-element uniform line: the continuous Bayliss distribution
 * sampled at the cell centres pₙ = (n − (N−1)/2)/N of an aperture of length N·d.
 *
 * @remarks
 * See {@link baylissLineSource} for the design and references. Weights are real and
 * antisymmetric (negative for n < (N−1)/2); the array pattern has an exact null at broadside.
 * As array weights they enter AF = wᴴa (docs/conventions.md).
 *
 * @param elementCount - Number of elements N, integer ≥ 2.
 * @param sllDb - Design sidelobe level, positive dB below the difference peak (power ratio), in (0, 200].
 * @param nbar - n̄, integer in [1, 60].
 * @param options - Normalisation (default peak = 1).
 * @returns The weights and the line-source design.
 * @throws {@link DomainError} if N is not an integer ≥ 2, `sllDb` is not in (0, 200] or n̄ is out of range.
 * @throws {@link ConvergenceError} if the zero placement does not converge.
 * @example
 * ```ts
 * const { weights } = baylissTaper(32, 30, 5); // antisymmetric:
 * weights.reduce((a, b) => a + b); // ≈ 0.000000
 * ```
 * @category Tapers
 */
export function baylissTaper(elementCount: number, sllDb: number, nbar: number, options: TaperOptions = {}): BaylissTaperResult {
  assertElementCount('elementCount', elementCount, 2);
  const design = baylissLineSource(sllDb, nbar);
  const weights = sampleUniformLine(design.distribution, elementCount, options);
  // Enforce exact antisymmetry (the sine series is odd; this removes rounding asymmetry).
  for (let i = 0; i < elementCount >> 1; i++) {
    const v = 0.5 * (weights[elementCount - 1 - i] - weights[i]);
    weights[i] = -v;
    weights[elementCount - 1 - i] = v;
  }
  if (elementCount % 2 === 1) weights[elementCount >> 1] = 0;
  return displayable({ ...design, weights }, 'Taper');
}
