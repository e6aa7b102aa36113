/**
 * Feed patterns for reflector analysis.
 * @module
 */
import { assertColumn, assertFinite, assertFiniteCMatrix, assertNonNegative, assertPositive } from '../internal/validate.js';
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import type { PortPatternSource } from '../reception/patterns.js';

/**
 * A far-field sample of a feed: θ̂ and φ̂ components in the feed frame [V].
 * @category Reflector
 */
export interface FeedFieldSample {
  /** Re f_θ [V]. */
  thetaRe: number;
  /** Im f_θ [V]. */
  thetaIm: number;
  /** Re f_φ [V]. */
  phiRe: number;
  /** Im f_φ [V]. */
  phiIm: number;
}

/**
 * A feed's far-field pattern in its own frame (boresight +z_f toward the
 * vertex; see `Paraboloid`), in the embedded-pattern convention: driving the
 * feed port with current I₀ radiates E = f(θ_f, φ_f)·e^{−jkr}/r, phase
 * referenced to the focus. Array elements displaced from the focus carry
 * their position phase exp(+j k r̂·rₙ) in f.
 * @category Reflector
 */
export type FeedPattern = ((thetaRad: number, phiRad: number) => FeedFieldSample) & {
  /**
   * Polar angles θ_f in (0, π) [rad] where the pattern jumps or has a kink (e.g. π/2 for a
   * pattern that stops at the horizon); integrals over the pattern are split there.
   */
  readonly edgesRad?: readonly number[];
};

/**
 * A body-of-revolution feed with separate E- and H-plane patterns, linearly
 * polarised along x_f (or y_f): f = E(θ)cosφ θ̂ − H(θ)sinφ φ̂ for x, and
 * f = E(θ)sinφ θ̂ + H(θ)cosφ φ̂ for y (Ludwig's third definition: the
 * pattern is purely co-polar when E = H; P.-S. Kildal, IEEE Trans. Antennas
 * Propag. 33(8), 1985, BOR1 feeds).
 * @param ePlane - E-plane amplitude E(θ) [V] (real).
 * @param hPlane - H-plane amplitude H(θ) [V] (real).
 * @param polarization - 'x' or 'y' (feed frame).
 * @param edgesRad - Angles θ [rad] in (0, π) where E or H jumps or has a kink (see {@link FeedPattern}). @defaultValue none
 * @returns The feed pattern.
 * @throws {@link DomainError} for a bad polarization or edge.
 * @category Reflector
 */
export function bodyOfRevolutionFeed(
  ePlane: (thetaRad: number) => number, hPlane: (thetaRad: number) => number, polarization: 'x' | 'y' = 'x', edgesRad: readonly number[] = [],
): FeedPattern {
  if (polarization !== 'x' && polarization !== 'y') throw new DomainError(`invalid argument "polarization": expected 'x' or 'y', received ${String(polarization)}.`);
  edgesRad.forEach((t, i) => {
    if (typeof t !== 'number' || !(t > 0 && t < Math.PI)) throw new DomainError(`invalid argument "edgesRad[${i}]": expected an angle in (0, π) rad, received ${String(t)}.`);
  });
  const f = (theta: number, phi: number): FeedFieldSample => {
    const e = ePlane(theta), h = hPlane(theta);
    const c = Math.cos(phi), s = Math.sin(phi);
    return polarization === 'x'
      ? { thetaRe: e * c, thetaIm: 0, phiRe: -h * s, phiIm: 0 }
      : { thetaRe: e * s, thetaIm: 0, phiRe: h * c, phiIm: 0 };
  };
  return Object.assign(f, { edgesRad: edgesRad.slice() });
}

/**
 * The cosⁿθ feed model: E(θ) = H(θ) = A·cosⁿθ for θ < π/2 and 0 behind,
 * purely co-polar (Ludwig 3), polarised along x_f. A common idealised feed
 * for reflector efficiency studies (P.-S. Kildal, *Foundations of Antennas*,
 * 2000, from memory).
 * @param n - Exponent n ≥ 0 (dimensionless); larger n gives a narrower pattern.
 * @param amplitudeV - Peak amplitude A [V] (efficiencies do not depend on it).
 * @returns The feed pattern, with its edge at θ = π/2 declared (`edgesRad`).
 * @category Reflector
 */
export function cosinePowerFeed(n: number, amplitudeV = 1): FeedPattern {
  assertNonNegative('n', n);
  assertFinite('amplitudeV', amplitudeV);
  const g = (t: number) => (t < Math.PI / 2 ? amplitudeV * Math.cos(t) ** n : 0);
  return bodyOfRevolutionFeed(g, g, 'x', [Math.PI / 2]);
}

/**
 * Wraps analytic feed patterns (one function per port) as a reception-module
 * pattern source in the feed frame, so that the reflector functions and the
 * reception module's noise integrals take them like any other array.
 * @param feeds - One pattern function per port (feed frame) [V].
 * @param frequencyHz - Frequency the patterns describe [Hz], > 0.
 * @param driveCurrentA - RMS drive current I₀ the patterns are referred to [A], > 0.
 * @returns A pattern source with `feeds.length` ports.
 * @throws {@link DimensionError} for an empty list or a non-function entry.
 * @category Reflector
 */
export function analyticFeedSource(feeds: readonly FeedPattern[], frequencyHz: number, driveCurrentA = 1): PortPatternSource {
  if (!Array.isArray(feeds) || feeds.length === 0) throw new DimensionError('invalid argument "feeds": expected at least one feed pattern function.');
  feeds.forEach((f, i) => {
    if (typeof f !== 'function') throw new DimensionError(`invalid argument "feeds[${i}]": expected a function (θ, φ) → field sample.`);
  });
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  assertPositive('driveCurrentA', driveCurrentA, 'A');
  return {
    portCount: feeds.length,
    frequencyHz,
    driveCurrentA,
    fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
      for (let n = 0; n < feeds.length; n++) {
        const f = feeds[n];
        for (let k = 0; k < count; k++) {
          const v = f(thetaRad[start + k], phiRad[start + k]);
          const o = 2 * (n * ld + k);
          outTheta[o] = v.thetaRe; outTheta[o + 1] = v.thetaIm;
          outPhi[o] = v.phiRe; outPhi[o + 1] = v.phiIm;
        }
      }
    },
  };
}

/**
 * The radiated pattern of a beamformed array feed as one feed pattern: for
 * receive weights w (y = wᴴv) the equivalent transmit excitation is conj(w)
 * (docs/conventions.md), so f_w = Σₙ conj(wₙ)·fₙ.
 * @param source - The array feed's ports (feed frame).
 * @param weights - Receive weights w, N×1.
 * @returns A single feed pattern, e.g. for {@link feedEfficiencies}-style analysis.
 * @throws {@link DimensionError} if `weights` is not N×1.
 * @category Reflector
 */
export function beamformedFeedPattern(source: PortPatternSource, weights: CMatrix): FeedPattern {
  assertColumn('weights', weights, source.portCount, 'one weight per feed port');
  assertFiniteCMatrix('weights', weights);
  const n = source.portCount;
  const th = new Float64Array(2 * n), ph = new Float64Array(2 * n);
  const t1 = new Float64Array(1), p1 = new Float64Array(1);
  const w = weights.data;
  return (thetaRad, phiRad) => {
    t1[0] = thetaRad; p1[0] = phiRad;
    source.fill(t1, p1, 0, 1, th, ph, 1);
    let tr = 0, ti = 0, pr = 0, pi = 0;
    for (let i = 0; i < n; i++) {
      const wr = w[2 * i], wi = -w[2 * i + 1];
      tr += wr * th[2 * i] - wi * th[2 * i + 1]; ti += wr * th[2 * i + 1] + wi * th[2 * i];
      pr += wr * ph[2 * i] - wi * ph[2 * i + 1]; pi += wr * ph[2 * i + 1] + wi * ph[2 * i];
    }
    return { thetaRe: tr, thetaIm: ti, phiRe: pr, phiIm: pi };
  };
}
