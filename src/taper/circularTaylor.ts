/**
 * Circular Taylor taper for planar apertures.
 * @module
 */
import besselj0 from '@stdlib/math-base-special-besselj0';
import besselj1 from '@stdlib/math-base-special-besselj1';
import type { ArrayLayout } from '../geometry/layout.js';
import { assertInteger } from '../internal/validate.js';
import { sampleRadialDistribution, type RadialDistribution, type RadialSampleOptions } from './aperture.js';
import { besselJ1Zeros } from './besselZeros.js';
import { dilatedZeros, isMonotonicDecreasing, taylorA } from './design.js';
import { assertSidelobeLevel } from './normalize.js';
import type { TaperWarning } from './warning.js';
import { displayable } from '../display/attach.js';

/**
 * A circular Taylor aperture design.
 * @category Tapers
 */
export interface CircularTaylorDesign {
  /** Radial distribution g(ρ), ρ = r/a ∈ [0, 1], g = 1 + Σ Cₘ J₀(γₘρ) [dimensionless]. */
  readonly distribution: RadialDistribution;
  /** Taylor's A = arccosh(R)/π [dimensionless]. */
  readonly a: number;
  /** Dilation factor σ = μ_{n̄}/√(A² + (n̄ − ½)²), μₙ = j₁,ₙ/π [dimensionless]. */
  readonly sigma: number;
  /** Pattern zeros uₙ = σ√(A² + (n − ½)²), n = 1 … n̄−1, in u = 2a sinθ/λ [dimensionless]. */
  readonly zeros: Float64Array;
  /** Coefficients C₁ … C_{n̄−1} of the J₀(γₘρ) terms, γₘ = j₁,ₘ [dimensionless]. */
  readonly coefficients: Float64Array;
  /** Peak sidelobe of the continuous aperture pattern, negative [dB, power ratio]. */
  readonly aperturePeakSidelobeDb: number;
  /** Whether g(ρ) decreases monotonically from centre to rim. */
  readonly monotonic: boolean;
  /** Design warnings. */
  readonly warnings: readonly TaperWarning[];
}

/**
 * A circular Taylor taper sampled at planar element positions, with its design.
 * @category Tapers
 */
export interface CircularTaylorTaperResult extends CircularTaylorDesign {
  /** One real weight per element [dimensionless]. */
  readonly weights: Float64Array;
}

/**
 * Designs a circular Taylor aperture distribution: a circularly symmetric pattern with the
 * first n̄−1 sidelobe rings near the requested level.
 *
 * @remarks
 * With R = 10^(sllDb/20), A = arccosh(R)/π, μₙ = j₁,ₙ/π (zeros of J₁, see
 * {@link besselJ1Zeros}), σ = μ_{n̄}/√(A² + (n̄−½)²), uₙ = σ√(A² + (n−½)²), the pattern is
 * F(u) = [2J₁(πu)/(πu)] Π_{n=1}^{n̄−1}(1 − u²/uₙ²)/(1 − u²/μₙ²), u = 2a sinθ/λ. The
 * distribution is g(ρ) = 1 + Σ_{m=1}^{n̄−1} Cₘ J₀(πμₘρ) with
 * Cₘ = −Π_n(1 − μₘ²/uₙ²) / (J₀(πμₘ) Π_{n≠m}(1 − μₘ²/μₙ²)) (from the orthogonality of
 * J₀(πμₘρ) on the unit disc; our derivation). Warnings as for {@link taylorLineSource},
 * checked on 513 radii and on the pattern from u₁ to μ_{n̄} + 3.
 *
 * References:
 * - T. T. Taylor, "Design of circular apertures for narrow beamwidth and low sidelobes",
 *   IRE Trans. Antennas Propag. AP-8(1), 1960, pp. 17–22.
 *
 * @param sllDb - Design sidelobe level, positive dB below the peak (power ratio), in (0, 200].
 * @param nbar - n̄, integer in [1, 1000].
 * @returns The design.
 * @throws {@link DomainError} if `sllDb` is not in (0, 200] or n̄ is out of range.
 * @category Tapers
 */
export function circularTaylorAperture(sllDb: number, nbar: number): CircularTaylorDesign {
  assertSidelobeLevel('sllDb', sllDb);
  assertInteger('nbar', nbar, 1, 1000);
  const a = taylorA(sllDb);
  const a2 = a * a;
  const gamma = besselJ1Zeros(nbar);
  const mu = gamma.map((g) => g / Math.PI);
  const sigma = mu[nbar - 1] / Math.sqrt(a2 + (nbar - 0.5) * (nbar - 0.5));
  const zeros = dilatedZeros(a, sigma, nbar - 1, 0.5);
  const coefficients = new Float64Array(nbar - 1);
  for (let m = 1; m < nbar; m++) {
    const m2 = mu[m - 1] * mu[m - 1];
    let c = -1 / besselj0(gamma[m - 1]);
    for (let n = 1; n < nbar; n++) {
      c *= 1 - m2 / (zeros[n - 1] * zeros[n - 1]);
      if (n !== m) c /= 1 - m2 / (mu[n - 1] * mu[n - 1]);
    }
    coefficients[m - 1] = c;
  }
  const distribution: RadialDistribution = (rho) => {
    let g = 1;
    for (let m = 1; m < nbar; m++) g += coefficients[m - 1] * besselj0(gamma[m - 1] * rho);
    return g;
  };
  const pattern = (u: number): number => {
    const x = Math.PI * u;
    let f = x === 0 ? 1 : (2 * besselj1(x)) / x;
    for (let n = 1; n < nbar; n++) f *= (1 - (u * u) / (zeros[n - 1] * zeros[n - 1])) / (1 - (u * u) / (mu[n - 1] * mu[n - 1]));
    return f;
  };
  let peak = 0;
  const start = nbar > 1 ? zeros[0] : mu[0];
  const steps = 64;
  for (let u = start; u <= mu[nbar - 1] + 3; u += 1 / steps) {
    let nearPole = false;
    for (let n = 0; n < nbar - 1; n++) if (Math.abs(u - mu[n]) < 1e-9) nearPole = true;
    if (!nearPole) peak = Math.max(peak, Math.abs(pattern(u)));
  }
  const aperturePeakSidelobeDb = 20 * Math.log10(peak);
  const monotonic = isMonotonicDecreasing(distribution, 0, 1);
  const warnings: TaperWarning[] = [];
  if (!monotonic) {
    warnings.push({ code: 'non-monotonic', message: `circular Taylor distribution for ${sllDb} dB with n̄ = ${nbar} is not monotonic (it rises again towards the rim); a smaller n̄ keeps it monotonic.` });
  }
  if (aperturePeakSidelobeDb > -sllDb + 0.5) {
    warnings.push({ code: 'sidelobes-above-design', message: `circular Taylor aperture for ${sllDb} dB with n̄ = ${nbar} reaches a sidelobe of ${aperturePeakSidelobeDb.toFixed(2)} dB, above the design level; increase n̄.` });
  }
  return { distribution, a, sigma, zeros, coefficients, aperturePeakSidelobeDb, monotonic, warnings };
}

/**
 * Circular Taylor taper sampled at arbitrary planar element positions inside a circle.
 *
 * @remarks
 * wₙ = g(ρₙ) with ρₙ the element's distance from the centre divided by `radiusM`; see
 * {@link circularTaylorAperture}. For a filled lattice take the area-equivalent radius
 * a = √(N·A_cell/π) (common practice; see {@link sampleRadialDistribution}). Weights are real; as array
 * weights they enter AF = wᴴa (docs/conventions.md).
 *
 * @param layout - Element positions (geometry module); their projection on the xy-plane is used,
 *   disabled elements get weight 0.
 * @param radiusM - Aperture radius a [m], > 0; every element must lie within it.
 * @param sllDb - Design sidelobe level, positive dB below the peak (power ratio), in (0, 200].
 * @param nbar - n̄, integer in [1, 1000].
 * @param options - Aperture centre and normalisation (default peak = 1).
 * @returns The weights and the aperture design.
 * @throws {@link DomainError} on bad levels, n̄, radius, non-finite positions or elements outside the circle.
 * @throws {@link DimensionError} if `layout` is malformed.
 * @category Tapers
 */
export function circularTaylorTaper(
  layout: ArrayLayout,
  radiusM: number,
  sllDb: number,
  nbar: number,
  options: RadialSampleOptions = {},
): CircularTaylorTaperResult {
  const design = circularTaylorAperture(sllDb, nbar);
  return displayable({ ...design, weights: sampleRadialDistribution(design.distribution, layout, radiusM, options) }, 'Taper');
}
