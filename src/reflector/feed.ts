/**
 * Feed patterns for reflector analysis.
 * @module
 */
import { assertFinite, assertNonNegative } from '../internal/validate.js';
import { DomainError } from '../errors.js';

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
export type FeedPattern = (thetaRad: number, phiRad: number) => FeedFieldSample;

/**
 * A body-of-revolution feed with separate E- and H-plane patterns, linearly
 * polarised along x_f (or y_f): f = E(θ)cosφ θ̂ − H(θ)sinφ φ̂ for x, and
 * f = E(θ)sinφ θ̂ + H(θ)cosφ φ̂ for y (Ludwig's third definition: the
 * pattern is purely co-polar when E = H; P.-S. Kildal, IEEE Trans. Antennas
 * Propag. 33(8), 1985, BOR1 feeds).
 * @param ePlane - E-plane amplitude E(θ) [V] (real).
 * @param hPlane - H-plane amplitude H(θ) [V] (real).
 * @param polarization - 'x' or 'y' (feed frame).
 * @returns The feed pattern.
 * @category Reflector
 */
export function bodyOfRevolutionFeed(ePlane: (thetaRad: number) => number, hPlane: (thetaRad: number) => number, polarization: 'x' | 'y' = 'x'): FeedPattern {
  if (polarization !== 'x' && polarization !== 'y') throw new DomainError(`invalid argument "polarization": expected 'x' or 'y', received ${String(polarization)}.`);
  return (theta, phi) => {
    const e = ePlane(theta), h = hPlane(theta);
    const c = Math.cos(phi), s = Math.sin(phi);
    return polarization === 'x'
      ? { thetaRe: e * c, thetaIm: 0, phiRe: -h * s, phiIm: 0 }
      : { thetaRe: e * s, thetaIm: 0, phiRe: h * c, phiIm: 0 };
  };
}

/**
 * The cosⁿθ feed model: E(θ) = H(θ) = A·cosⁿθ for θ < π/2 and 0 behind,
 * purely co-polar (Ludwig 3), polarised along x_f. A common idealised feed
 * for reflector efficiency studies (P.-S. Kildal, *Foundations of Antennas*,
 * 2000, from memory).
 * @param n - Exponent n ≥ 0 (dimensionless); larger n gives a narrower pattern.
 * @param amplitudeV - Peak amplitude A [V] (efficiencies do not depend on it).
 * @returns The feed pattern.
 * @category Reflector
 */
export function cosinePowerFeed(n: number, amplitudeV = 1): FeedPattern {
  assertNonNegative('n', n);
  assertFinite('amplitudeV', amplitudeV);
  const g = (t: number) => (t < Math.PI / 2 ? amplitudeV * Math.cos(t) ** n : 0);
  return bodyOfRevolutionFeed(g, g, 'x');
}
