/**
 * Feed-efficiency factorisation of a paraboloid (spillover, polarisation,
 * illumination, phase, blockage) from a feed pattern.
 * @module
 */
import { DomainError } from '../errors.js';
import { gaussLegendre } from '../geometry/quadrature.js';
import { assertInteger } from '../internal/validate.js';
import type { FeedPattern } from './feed.js';
import type { Paraboloid } from './paraboloid.js';

/**
 * Options of {@link feedEfficiencies}.
 * @category Reflector
 */
export interface FeedEfficiencyOptions {
  /**
   * Gauss–Legendre order in θ on each piece between breakpoints (0, the blockage edge, the rim
   * θ0, π/2, the feed's declared edges, π).
   * @defaultValue 96
   */
  thetaOrder?: number;
  /**
   * Uniform samples in φ.
   * @defaultValue 64
   */
  phiOrder?: number;
  /**
   * Co-polar reference: the feed's x or y polarisation (Ludwig 3 / BOR1).
   * @defaultValue 'x'
   */
  polarization?: 'x' | 'y';
}

/**
 * Sub-efficiencies of a feed on a symmetric paraboloid; their product is the
 * aperture efficiency (all dimensionless, in [0, 1]).
 * @category Reflector
 */
export interface FeedEfficiencies {
  /** Fraction of the feed's radiated power intercepted by the dish, η_s. */
  spillover: number;
  /** Co-polar BOR1 fraction of the intercepted power (Kildal 1985), η_pol: ∫|CO|²/(∫|f|²/2π) over θ < θ0. */
  polarization: number;
  /** Illumination (amplitude taper) efficiency of the co-polar BOR1 component, η_ill. */
  illumination: number;
  /** Phase efficiency (feed phase-centre errors) of the co-polar BOR1 component, η_φ. */
  phase: number;
  /** Blockage efficiency from the central blockage diameter (1 without blockage), η_b. */
  blockage: number;
  /** Aperture efficiency η_ap = η_s η_pol η_ill η_φ η_b. */
  aperture: number;
  /** Edge illumination relative to the aperture centre including the extra path loss to the rim (co-polar BOR1 power |CO|²) [dB]. */
  edgeTaperDb: number;
  /** The rim half-angle θ0 used [rad]. */
  rimHalfAngleRad: number;
}

/** Co-polar BOR1 amplitude CO(θ) = (1/2π)∮ f·ĉo(φ) dφ [V] (ĉo the Ludwig-3 unit vector), by the np-point rule. */
function coPolarBor1(feed: FeedPattern, t: number, np: number, pol: 'x' | 'y', acc: { re: number; im: number; power: number }): void {
  let re = 0, im = 0, power = 0;
  const dphi = (2 * Math.PI) / np;
  for (let j = 0; j < np; j++) {
    const p = (j + 0.5) * dphi;
    const v = feed(t, p);
    const mag2 = v.thetaRe ** 2 + v.thetaIm ** 2 + v.phiRe ** 2 + v.phiIm ** 2;
    if (!Number.isFinite(mag2)) throw new DomainError(`invalid feed pattern: non-finite value at θ_f = ${t}, φ_f = ${p} rad.`);
    // Ludwig-3 co-polar unit vector: x: θ̂cosφ − φ̂sinφ; y: θ̂sinφ + φ̂cosφ.
    const a = pol === 'x' ? Math.cos(p) : Math.sin(p), b = pol === 'x' ? -Math.sin(p) : Math.cos(p);
    re += v.thetaRe * a + v.phiRe * b;
    im += v.thetaIm * a + v.phiIm * b;
    power += mag2;
  }
  acc.re = re / np; acc.im = im / np; acc.power = power * dphi;
}

/**
 * Feed efficiencies of a prime-focus paraboloid by the BOR1 factorisation of
 * P.-S. Kildal, "Factorization of the feed efficiency of paraboloids and
 * Cassegrain antennas", IEEE Trans. Antennas Propag. 33(8), 1985 (from memory).
 *
 * @remarks
 * The co-polar BOR1 component of the feed pattern f is CO(θ) = (1/2π)∮ f·ĉo dφ, ĉo the
 * Ludwig-3 co-polar unit vector; for a BOR1 feed f = E(θ)cosφ θ̂ − H(θ)sinφ φ̂ it is
 * CO = (E + H)/2 and the cross-polar component is XP = (E − H)/2. With θ0 the rim half-angle
 * and P(θ) = ∮|f|²dφ:
 * η_s = ∫_0^θ0 P sinθ dθ / ∫_0^π P sinθ dθ;
 * η_pol = 2π∫_0^θ0 |CO|² sinθ dθ / ∫_0^θ0 P sinθ dθ (power in CO; the rest is XP and, for a
 * feed that is not BOR1, higher φ-harmonics, none of which reach the boresight);
 * η_ill = 2cot²(θ0/2)(∫_0^θ0 |CO| tan(θ/2) dθ)² / ∫_0^θ0 |CO|² sinθ dθ;
 * η_φ = |∫ CO tan(θ/2) dθ|² / (∫ |CO| tan(θ/2) dθ)²;
 * η_b = |1 − ∫_0^θb CO tan(θ/2) dθ / ∫_0^θ0 CO tan(θ/2) dθ|², θb = 2 atan(D_b/(4f)) the
 * blockage edge seen from the focus (field-cancellation form, common practice).
 * The product is η_ap = 4π cot²(θ0/2)|∫ CO tan(θ/2) dθ|² / ∫_0^π P sinθ dθ, the aperture-field
 * gain over 4πA/λ² (equal to the Ludwig-3 co-polar aperture integral, whose cos 2φ part
 * integrates to zero). The θ integrals use Gauss–Legendre on every piece between 0, θb, θ0, π/2,
 * the feed's declared edges ({@link FeedPattern} `edgesRad`) and π, so a step in the integrand
 * at any of them is integrated exactly; φ uses the uniform rule. Only symmetric (prime-focus,
 * zero-offset) dishes are accepted.
 * @param dish - Symmetric paraboloid.
 * @param feed - Feed pattern (feed frame, boresight at the vertex).
 * @param options - Quadrature orders and co-polar reference.
 * @returns The sub-efficiencies and their product.
 * @throws {@link DomainError} for an offset dish or a feed that radiates no (co-polar) power.
 * @example
 * ```ts
 * // cos θ feed (n = 1) on f/D = 0.4: η_s = 1 − cos³θ0 (closed form)
 * const dish = paraboloidReflector({ diameterM: 12, focalLengthM: 4.8 });
 * feedEfficiencies(dish, cosinePowerFeed(1)).spillover; // ≈ 0.9159 (= 1 − cos³θ0, θ0 = 64.0°)
 * ```
 * @category Reflector
 */
export function feedEfficiencies(dish: Paraboloid, feed: FeedPattern, options: FeedEfficiencyOptions = {}): FeedEfficiencies {
  if (dish.offsetM !== 0) throw new DomainError(`invalid argument "dish": the Kildal factorisation here is for symmetric dishes (offsetM = 0), received offsetM = ${dish.offsetM}; use secondary patterns for offset dishes.`);
  const nt = options.thetaOrder ?? 96, np = options.phiOrder ?? 64;
  assertInteger('thetaOrder', nt, 4, 10000);
  assertInteger('phiOrder', np, 4, 100000);
  const pol = options.polarization ?? 'x';
  if (pol !== 'x' && pol !== 'y') throw new DomainError(`invalid argument "polarization": expected 'x' or 'y', received ${String(pol)}.`);
  const t0 = dish.rimHalfAngleRad;
  const f = dish.focalLengthM;
  const tb = dish.blockageDiameterM > 0 ? 2 * Math.atan(dish.blockageDiameterM / (4 * f)) : 0;
  const edges = (feed.edgesRad ?? []).filter((t) => t > 0 && t < Math.PI);
  const cuts = [...new Set([0, tb, t0, Math.PI / 2, ...edges, Math.PI])].sort((a, b) => a - b);
  const gl = gaussLegendre(nt);
  let pIn = 0, pOut = 0, coIn = 0;
  let sumAbs = 0, sumRe = 0, sumIm = 0, blkRe = 0, blkIm = 0;
  const acc = { re: 0, im: 0, power: 0 };
  for (let s = 0; s + 1 < cuts.length; s++) {
    const lo = cuts[s], hi = cuts[s + 1];
    if (!(hi - lo > 1e-15)) continue;
    const inside = hi <= t0, blocked = hi <= tb;
    for (let i = 0; i < nt; i++) {
      const t = lo + 0.5 * (hi - lo) * (gl.nodes[i] + 1);
      const wt = 0.5 * (hi - lo) * gl.weights[i];
      const st = Math.sin(t);
      coPolarBor1(feed, t, np, pol, acc);
      if (!inside) { pOut += acc.power * st * wt; continue; }
      pIn += acc.power * st * wt;
      const c2 = acc.re * acc.re + acc.im * acc.im;
      coIn += 2 * Math.PI * c2 * st * wt;
      const w = Math.tan(t / 2) * wt;
      sumAbs += Math.sqrt(c2) * w;
      sumRe += acc.re * w; sumIm += acc.im * w;
      if (blocked) { blkRe += acc.re * w; blkIm += acc.im * w; }
    }
  }
  const total = pIn + pOut;
  if (!(total > 0) || !(coIn > 0)) throw new DomainError('invalid feed pattern: it radiates no (co-polar) power toward the dish.');
  // Edge taper: co-polar BOR1 power at the rim vs the centre, with the path-loss ratio (ρ_f(0)/ρ_f(θ0))².
  coPolarBor1(feed, t0 * (1 - 1e-9), np, pol, acc);
  const edgeCo = acc.re * acc.re + acc.im * acc.im;
  coPolarBor1(feed, 1e-9, np, pol, acc);
  const centreCo = acc.re * acc.re + acc.im * acc.im;
  const cot2 = 1 / Math.tan(t0 / 2) ** 2;
  const spill = pIn / total;
  const polar = coIn / pIn;
  const illum = (2 * Math.PI * 2 * cot2 * sumAbs * sumAbs) / coIn;
  const phase = (sumRe * sumRe + sumIm * sumIm) / (sumAbs * sumAbs);
  const blk = tb > 0 ? ((sumRe - blkRe) ** 2 + (sumIm - blkIm) ** 2) / (sumRe * sumRe + sumIm * sumIm) : 1;
  const pathLoss = Math.cos(t0 / 2) ** 4; // (ρ_f(0)/ρ_f(θ0))² with ρ_f = f/cos²(θ/2)
  return {
    spillover: spill,
    polarization: polar,
    illumination: illum,
    phase,
    blockage: blk,
    aperture: spill * polar * illum * phase * blk,
    edgeTaperDb: 10 * Math.log10((edgeCo / centreCo) * pathLoss),
    rimHalfAngleRad: t0,
  };
}
