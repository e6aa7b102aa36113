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
   * Gauss–Legendre order in θ on each of [0, θ0] and [θ0, π].
   * @defaultValue 96
   */
  thetaOrder?: number;
  /**
   * Uniform samples in φ.
   * @defaultValue 64
   */
  phiOrder?: number;
  /**
   * Co-polar reference: the feed's Ludwig-3 x or y polarisation.
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
  /** Co-polar fraction of the intercepted power (Ludwig 3), η_pol. */
  polarization: number;
  /** Illumination (amplitude taper) efficiency, η_ill. */
  illumination: number;
  /** Phase efficiency (feed phase-centre errors), η_φ. */
  phase: number;
  /** Blockage efficiency from the central blockage diameter (1 without blockage), η_b. */
  blockage: number;
  /** Aperture efficiency η_ap = η_s η_pol η_ill η_φ η_b. */
  aperture: number;
  /** Edge illumination relative to the aperture centre including the extra path loss to the rim (co-polar, φ-averaged power) [dB]. */
  edgeTaperDb: number;
  /** The rim half-angle θ0 used [rad]. */
  rimHalfAngleRad: number;
}

/**
 * Feed efficiencies of a prime-focus paraboloid by the factorisation of
 * P.-S. Kildal, "Factorization of the feed efficiency of paraboloids and
 * Cassegrain antennas", IEEE Trans. Antennas Propag. 33(8), 1985 (from memory).
 *
 * @remarks
 * With the feed pattern f (feed frame), its Ludwig-3 co-polar component f_co,
 * and θ0 the rim half-angle:
 * η_s = ∫_{θ<θ0}|f|²dΩ / ∮|f|²dΩ; η_pol = ∫_{θ<θ0}|f_co|²dΩ / ∫_{θ<θ0}|f|²dΩ;
 * η_ill = (cot²(θ0/2)/π)(∫∫|f_co| tan(θ/2) dθdφ)² / ∫_{θ<θ0}|f_co|²dΩ;
 * η_φ = |∫∫ f_co tan(θ/2) dθdφ|² / (∫∫|f_co| tan(θ/2) dθdφ)².
 * The product is η_ap = (cot²(θ0/2)/π)|∫∫ f_co tan(θ/2) dθdφ|²/∮|f|²dΩ, the
 * aperture-field gain over 4πA/λ². The blockage efficiency removes the
 * co-polar aperture field inside the blockage diameter,
 * η_b = |1 − ∫_blocked E_co dA / ∫ E_co dA|² (field-cancellation form, common
 * practice). Integrals use Gauss–Legendre in θ split at θ0 (so the rim
 * discontinuity is integrated exactly) × uniform φ.
 * Only symmetric (prime-focus, zero-offset) dishes are accepted.
 * @param dish - Symmetric paraboloid.
 * @param feed - Feed pattern (feed frame, boresight at the vertex).
 * @param options - Quadrature orders and co-polar reference.
 * @returns The sub-efficiencies and their product.
 * @throws {@link DomainError} for an offset dish or a feed that radiates no power.
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
  const rb = dish.blockageDiameterM / 2;
  const gl = gaussLegendre(nt);
  let pIn = 0, pOut = 0, coIn = 0;
  let sumAbsRe = 0, sumRe = 0, sumIm = 0, blkRe = 0, blkIm = 0;
  let edgeCo = 0, centreCo = 0;
  const dphi = (2 * Math.PI) / np;
  for (const [lo, hi, inside] of [[0, t0, true], [t0, Math.PI, false]] as const) {
    for (let i = 0; i < nt; i++) {
      const t = lo + 0.5 * (hi - lo) * (gl.nodes[i] + 1);
      const wt = 0.5 * (hi - lo) * gl.weights[i];
      const st = Math.sin(t), tanHalf = Math.tan(t / 2);
      const rho = 2 * f * tanHalf; // aperture radius of the ray
      for (let j = 0; j < np; j++) {
        const p = (j + 0.5) * dphi;
        const v = feed(t, p);
        const mag2 = v.thetaRe ** 2 + v.thetaIm ** 2 + v.phiRe ** 2 + v.phiIm ** 2;
        if (!Number.isFinite(mag2)) throw new DomainError(`invalid feed pattern: non-finite value at θ_f = ${t}, φ_f = ${p} rad.`);
        if (!inside) { pOut += mag2 * st * wt * dphi; continue; }
        pIn += mag2 * st * wt * dphi;
        // Ludwig-3 co-polar unit vector: x: θ̂cosφ − φ̂sinφ; y: θ̂sinφ + φ̂cosφ.
        const a = pol === 'x' ? Math.cos(p) : Math.sin(p), b = pol === 'x' ? -Math.sin(p) : Math.cos(p);
        const cr = v.thetaRe * a + v.phiRe * b, ci = v.thetaIm * a + v.phiIm * b;
        const c2 = cr * cr + ci * ci;
        coIn += c2 * st * wt * dphi;
        const w = tanHalf * wt * dphi;
        sumAbsRe += Math.sqrt(c2) * w;
        sumRe += cr * w; sumIm += ci * w;
        if (rho < rb) { blkRe += cr * w; blkIm += ci * w; }
      }
    }
  }
  // Edge taper: co-polar power at the rim vs centre, with the path-loss ratio (ρ_f(0)/ρ_f(θ0))².
  for (let j = 0; j < np; j++) {
    const p = (j + 0.5) * dphi;
    const a = pol === 'x' ? Math.cos(p) : Math.sin(p), b = pol === 'x' ? -Math.sin(p) : Math.cos(p);
    const e = feed(t0 * (1 - 1e-9), p), c = feed(1e-9, p);
    edgeCo += (e.thetaRe * a + e.phiRe * b) ** 2 + (e.thetaIm * a + e.phiIm * b) ** 2;
    centreCo += (c.thetaRe * a + c.phiRe * b) ** 2 + (c.thetaIm * a + c.phiIm * b) ** 2;
  }
  const total = pIn + pOut;
  if (!(total > 0) || !(coIn > 0)) throw new DomainError('invalid feed pattern: it radiates no (co-polar) power toward the dish.');
  const cot2 = 1 / Math.tan(t0 / 2) ** 2;
  const spill = pIn / total;
  const polar = coIn / pIn;
  const illum = ((cot2 / Math.PI) * sumAbsRe * sumAbsRe) / coIn;
  const phase = (sumRe * sumRe + sumIm * sumIm) / (sumAbsRe * sumAbsRe);
  const blk = rb > 0 ? ((sumRe - blkRe) ** 2 + (sumIm - blkIm) ** 2) / (sumRe * sumRe + sumIm * sumIm) : 1;
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
