/**
 * Sampling of the reflector surface and the incident feed field on it
 * (shared by the physical-optics and aperture-field methods).
 * @internal
 * @module
 */
import { gaussLegendre } from '../geometry/quadrature.js';
import type { Paraboloid } from './paraboloid.js';
import type { FeedPattern } from './feed.js';
import { DomainError } from '../errors.js';

/** Integration points over the projected aperture (disk of radius D/2 around the offset). @internal */
export interface ApertureSamples {
  /** Number of points P. */
  count: number;
  /** Reflector-frame coordinates of the surface points [m]. */
  x: Float64Array;
  y: Float64Array;
  z: Float64Array;
  /** Distance from the focus ρ_f [m]. */
  rf: Float64Array;
  /** Quadrature weight of the projected area element [m²]. */
  w: Float64Array;
  /** Whether the point lies in the central blockage. */
  blocked: Uint8Array;
}

/** Gauss–Legendre in ρ × uniform in φ over the aperture disk. @internal */
export function sampleAperture(dish: Paraboloid, radialOrder: number, azimuthOrder: number): ApertureSamples {
  const a = dish.diameterM / 2;
  const gl = gaussLegendre(radialOrder);
  const p = radialOrder * azimuthOrder;
  const s: ApertureSamples = {
    count: p, x: new Float64Array(p), y: new Float64Array(p), z: new Float64Array(p), rf: new Float64Array(p), w: new Float64Array(p), blocked: new Uint8Array(p),
  };
  const f = dish.focalLengthM;
  const rb = dish.blockageDiameterM / 2;
  let k = 0;
  for (let i = 0; i < radialOrder; i++) {
    const rho = 0.5 * a * (gl.nodes[i] + 1);
    const wr = 0.5 * a * gl.weights[i] * rho * ((2 * Math.PI) / azimuthOrder);
    for (let j = 0; j < azimuthOrder; j++) {
      const ph = (2 * Math.PI * (j + 0.5)) / azimuthOrder;
      const x = dish.offsetM + rho * Math.cos(ph), y = rho * Math.sin(ph);
      const z = (x * x + y * y) / (4 * f) - f;
      s.x[k] = x; s.y[k] = y; s.z[k] = z;
      s.rf[k] = z + 2 * f; // focal distance equals the distance to the directrix z = −2f
      s.w[k] = wr;
      // Blockage is a disk centred on the paraboloid axis in the projected aperture.
      s.blocked[k] = x * x + y * y < rb * rb ? 1 : 0;
      k++;
    }
  }
  return s;
}

/**
 * Incident field amplitude vector e (reflector-frame Cartesian, complex) at
 * each surface point, such that E_inc = e·exp(−jkρ_f)/ρ_f. Writes 6 numbers
 * per point: [exRe, exIm, eyRe, eyIm, ezRe, ezIm]. @internal
 */
export function incidentAmplitudes(s: ApertureSamples, feed: FeedPattern, out: Float64Array): Float64Array {
  for (let k = 0; k < s.count; k++) {
    // Direction from the focus to the point, in the feed frame (x, −y, −z).
    const dx = s.x[k] / s.rf[k], dy = -s.y[k] / s.rf[k], dz = -s.z[k] / s.rf[k];
    const th = Math.atan2(Math.hypot(dx, dy), dz);
    const ph = Math.atan2(dy, dx);
    const v = feed(th, ph);
    if (!Number.isFinite(v.thetaRe) || !Number.isFinite(v.thetaIm) || !Number.isFinite(v.phiRe) || !Number.isFinite(v.phiIm)) {
      throw new DomainError(`invalid feed pattern: non-finite value at θ_f = ${th}, φ_f = ${ph} rad.`);
    }
    const ct = Math.cos(th), st = Math.sin(th), cp = Math.cos(ph), sp = Math.sin(ph);
    // θ̂_f = (ct cp, ct sp, −st), φ̂_f = (−sp, cp, 0) in the feed frame.
    const fxr = v.thetaRe * ct * cp - v.phiRe * sp, fxi = v.thetaIm * ct * cp - v.phiIm * sp;
    const fyr = v.thetaRe * ct * sp + v.phiRe * cp, fyi = v.thetaIm * ct * sp + v.phiIm * cp;
    const fzr = -v.thetaRe * st, fzi = -v.thetaIm * st;
    // Back to the reflector frame: (x, −y, −z).
    const o = 6 * k;
    out[o] = fxr; out[o + 1] = fxi; out[o + 2] = -fyr; out[o + 3] = -fyi; out[o + 4] = -fzr; out[o + 5] = -fzi;
  }
  return out;
}
