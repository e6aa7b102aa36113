/**
 * Taylor n̄ line-source taper.
 * @module
 */
import { assertInteger } from '../internal/validate.js';
import { sampleUniformLine, type LineDistribution } from './aperture.js';
import { dilatedZeros, isMonotonicDecreasing, taylorA } from './design.js';
import { assertElementCount, assertSidelobeLevel, type TaperOptions } from './normalize.js';
import { sincPi, type TaperWarning } from './warning.js';
import { displayable } from '../display/attach.js';

/**
 * A Taylor n̄ line-source design.
 * @category Tapers
 */
export interface TaylorLineSourceDesign {
  /**
   * Aperture distribution g(p) = 1 + 2 Σ Fₘ cos(2πmp), p ∈ [−½, ½] [dimensionless], in Taylor's
   * normalisation F₀ = 1: its mean ∫g dp is 1 (the pattern at u = 0 is 1), so its centre value is
   * g(0) = 1 + 2 ΣFₘ, not 1. Divide by g(0) for a unit peak (the sampled `weights` are normalised
   * by their options instead).
   */
  readonly distribution: LineDistribution;
  /** Taylor's A = arccosh(R)/π, R = 10^(sllDb/20) [dimensionless]. */
  readonly a: number;
  /** Dilation (beam-broadening) factor σ = n̄ / √(A² + (n̄ − ½)²) [dimensionless]. */
  readonly sigma: number;
  /** Pattern zeros uₙ = σ√(A² + (n − ½)²), n = 1 … n̄−1, in u = L sinθ/λ [dimensionless]. */
  readonly zeros: Float64Array;
  /** Fourier coefficients F₁ … F_{n̄−1} of g(p) = 1 + 2 Σ Fₘ cos(2πmp) [dimensionless]. */
  readonly coefficients: Float64Array;
  /** Peak sidelobe of the continuous line-source pattern, negative [dB, power ratio]. */
  readonly lineSourcePeakSidelobeDb: number;
  /** Whether g(p) decreases monotonically from the centre to the edges. */
  readonly monotonic: boolean;
  /** Design warnings (non-monotonic distribution, sidelobes above the design level). */
  readonly warnings: readonly TaperWarning[];
}

/**
 * A Taylor taper sampled on an N-element line, with its design.
 * @category Tapers
 */
export interface TaylorTaperResult extends TaylorLineSourceDesign {
  /** N real weights [dimensionless]. */
  readonly weights: Float64Array;
}

/** Pattern samples per unit of u when scanning the continuous pattern for sidelobes. */
const SCAN_STEPS_PER_U = 64;

/**
 * Designs a Taylor n̄ line source: the first n̄−1 sidelobes near the requested level,
 * the remaining ones decaying like those of a uniform line.
 *
 * @remarks
 * With R = 10^(sllDb/20), A = arccosh(R)/π, σ = n̄/√(A² + (n̄−½)²), the pattern
 * F(u) = sinc(u)·Π_{n<n̄}(1 − u²/uₙ²)/(1 − u²/n²) has zeros uₙ = σ√(A² + (n−½)²);
 * the distribution is g(p) = 1 + 2 Σ_{m=1}^{n̄−1} Fₘ cos(2πmp) with
 * Fₘ = (−1)^{m+1} Π_{n=1}^{n̄−1}(1 − m²/uₙ²) / (2 Π_{n≠m}(1 − m²/n²)), the products
 * evaluated in log space. u = L sinθ/λ for a line of length L.
 *
 * Warnings (returned as data, never printed):
 * - `'non-monotonic'` when g(p) rises again towards the edge. This happens when n̄ is too
 *   LARGE for the level (e.g. n̄ ≥ 4 at 20 dB, ≥ 8 at 30 dB, ≥ 12 at 40 dB), checked on
 *   513 points of g.
 * - `'sidelobes-above-design'` when n̄ is too SMALL for the level: the continuous pattern,
 *   scanned from the first zero to u = n̄ + 3, has a sidelobe more than 0.5 dB above the
 *   requested level (e.g. n̄ ≤ 4 at 40 dB). Taylor's rule of thumb n̄ ≥ 2A² + ½ is stricter.
 *
 * References:
 * - T. T. Taylor, "Design of line-source antennas for narrow beamwidth and low side lobes",
 *   IRE Trans. Antennas Propag. AP-3(1), 1955, pp. 16–28.
 * - R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, §3.4 (n̄ limits for a
 *   monotonic distribution) (from memory).
 *
 * @param sllDb - Design sidelobe level, positive dB below the peak (power ratio), in (0, 200].
 * @param nbar - n̄, integer ≥ 1 (n̄ = 1 gives the uniform distribution).
 * @returns The design, with its distribution, zeros, coefficients and warnings.
 * @throws {@link DomainError} if `sllDb` is not in (0, 200] or n̄ is not an integer ≥ 1.
 * @category Tapers
 */
export function taylorLineSource(sllDb: number, nbar: number): TaylorLineSourceDesign {
  assertSidelobeLevel('sllDb', sllDb);
  assertInteger('nbar', nbar, 1, 10_000);
  const a = taylorA(sllDb);
  const a2 = a * a;
  const sigma = nbar / Math.sqrt(a2 + (nbar - 0.5) * (nbar - 0.5));
  const zeros = dilatedZeros(a, sigma, nbar - 1, 0.5);
  const coefficients = new Float64Array(nbar - 1);
  for (let m = 1; m < nbar; m++) {
    const m2 = m * m;
    let logMag = -Math.LN2;
    let negative = (m + 1) % 2 === 1;
    for (let n = 1; n < nbar; n++) {
      const num = 1 - m2 / (zeros[n - 1] * zeros[n - 1]);
      logMag += Math.log(Math.abs(num));
      if (num < 0) negative = !negative;
      if (n !== m) {
        const den = 1 - m2 / (n * n);
        logMag -= Math.log(Math.abs(den));
        if (den < 0) negative = !negative;
      }
    }
    coefficients[m - 1] = (negative ? -1 : 1) * Math.exp(logMag);
  }
  const distribution: LineDistribution = (p) => {
    let g = 1;
    for (let m = 1; m < nbar; m++) g += 2 * coefficients[m - 1] * Math.cos(2 * Math.PI * m * p);
    return g;
  };
  // Continuous pattern F(u) = sinc(u) + Σ Fₘ [sinc(u − m) + sinc(u + m)], F(0) = 1.
  const pattern = (u: number): number => {
    let f = sincPi(u);
    for (let m = 1; m < nbar; m++) f += coefficients[m - 1] * (sincPi(u - m) + sincPi(u + m));
    return f;
  };
  const firstZero = nbar > 1 ? zeros[0] : 1;
  let peak = 0;
  const uEnd = nbar + 3;
  for (let u = firstZero; u <= uEnd; u += 1 / SCAN_STEPS_PER_U) peak = Math.max(peak, Math.abs(pattern(u)));
  const lineSourcePeakSidelobeDb = 20 * Math.log10(peak);
  const monotonic = isMonotonicDecreasing(distribution, 0, 0.5);
  const warnings: TaperWarning[] = [];
  if (!monotonic) {
    warnings.push({
      code: 'non-monotonic',
      message: `Taylor distribution for ${sllDb} dB with n̄ = ${nbar} is not monotonic (it rises again towards the edge); a smaller n̄ keeps it monotonic.`,
    });
  }
  if (lineSourcePeakSidelobeDb > -sllDb + 0.5) {
    warnings.push({
      code: 'sidelobes-above-design',
      message: `Taylor line source for ${sllDb} dB with n̄ = ${nbar} reaches a sidelobe of ${lineSourcePeakSidelobeDb.toFixed(2)} dB, above the design level; increase n̄ (rule of thumb n̄ ≥ 2A² + ½ = ${(2 * a2 + 0.5).toFixed(2)}).`,
    });
  }
  return { distribution, a, sigma, zeros, coefficients, lineSourcePeakSidelobeDb, monotonic, warnings };
}

/**
 * Taylor n̄ taper of an N-element uniform line: the continuous Taylor distribution sampled
 * at the cell centres pₙ = (n − (N−1)/2)/N of an aperture of length N·d.
 *
 * @remarks
 * See {@link taylorLineSource} for the design, its warnings and references. The sampled
 * array reproduces the line-source sidelobes closely when N is several times n̄. Weights
 * are real; as array weights they enter AF = wᴴa (docs/conventions.md).
 *
 * @param elementCount - Number of elements N, integer ≥ 1.
 * @param sllDb - Design sidelobe level, positive dB below the peak (power ratio), in (0, 200].
 * @param nbar - n̄, integer ≥ 1.
 * @param options - Normalisation (default peak = 1).
 * @returns The weights and the line-source design (with warnings).
 * @throws {@link DomainError} if N is not an integer ≥ 1, `sllDb` is not in (0, 200] or n̄ < 1.
 * @example
 * ```ts
 * const { weights, warnings } = taylorTaper(32, 30, 5); // warnings: []
 * ```
 * @category Tapers
 */
export function taylorTaper(elementCount: number, sllDb: number, nbar: number, options: TaperOptions = {}): TaylorTaperResult {
  assertElementCount('elementCount', elementCount);
  const design = taylorLineSource(sllDb, nbar);
  return displayable({ ...design, weights: sampleUniformLine(design.distribution, elementCount, options) }, 'Taper');
}
