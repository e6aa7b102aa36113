/**
 * Sampling of the reflector surface and the incident feed field on it
 * (shared by the physical-optics and aperture-field methods).
 * @internal
 * @module
 */
import { gaussLegendre } from '../geometry/quadrature.js';
import type { Paraboloid } from './paraboloid.js';
import type { PortPatternSource } from '../reception/patterns.js';
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

/**
 * Gauss–Legendre in ρ × uniform in φ over the aperture disk. When the blockage is to be
 * removed from a symmetric dish, the radial rule covers the annulus ρ_b ≤ ρ ≤ a instead, so
 * the blockage edge is a node boundary (integrated exactly, not by masking nodes). @internal
 */
export function sampleAperture(dish: Paraboloid, radialOrder: number, azimuthOrder: number, removeBlockage = false): ApertureSamples {
  const a = dish.diameterM / 2;
  const annulus = removeBlockage && dish.offsetM === 0 && dish.blockageDiameterM > 0;
  const r0 = annulus ? dish.blockageDiameterM / 2 : 0;
  const gl = gaussLegendre(radialOrder);
  const p = radialOrder * azimuthOrder;
  const s: ApertureSamples = {
    count: p, x: new Float64Array(p), y: new Float64Array(p), z: new Float64Array(p), rf: new Float64Array(p), w: new Float64Array(p), blocked: new Uint8Array(p),
  };
  const f = dish.focalLengthM;
  const rb = dish.blockageDiameterM / 2;
  let k = 0;
  for (let i = 0; i < radialOrder; i++) {
    const rho = r0 + 0.5 * (a - r0) * (gl.nodes[i] + 1);
    const wr = 0.5 * (a - r0) * gl.weights[i] * rho * ((2 * Math.PI) / azimuthOrder);
    for (let j = 0; j < azimuthOrder; j++) {
      const ph = (2 * Math.PI * (j + 0.5)) / azimuthOrder;
      const x = dish.offsetM + rho * Math.cos(ph), y = rho * Math.sin(ph);
      const z = (x * x + y * y) / (4 * f) - f;
      s.x[k] = x; s.y[k] = y; s.z[k] = z;
      s.rf[k] = z + 2 * f; // focal distance equals the distance to the directrix z = −2f
      s.w[k] = wr;
      // Blockage is a disk centred on the paraboloid axis in the projected aperture.
      s.blocked[k] = !annulus && x * x + y * y < rb * rb ? 1 : 0;
      k++;
    }
  }
  return s;
}

/**
 * Incident field amplitude vectors e (reflector-frame Cartesian, complex) of
 * every port at every surface point, such that E_inc = e·exp(−jkρ_f)/ρ_f.
 * Layout: three N×P interleaved matrices (x, y, z components). @internal
 */
export function incidentAmplitudes(s: ApertureSamples, source: PortPatternSource): [Float64Array, Float64Array, Float64Array] {
  const p = s.count, n = source.portCount;
  const th = new Float64Array(p), ph = new Float64Array(p);
  for (let k = 0; k < p; k++) {
    // Direction from the focus to the point, in the feed frame (x, −y, −z).
    const dx = s.x[k] / s.rf[k], dy = -s.y[k] / s.rf[k], dz = -s.z[k] / s.rf[k];
    th[k] = Math.atan2(Math.hypot(dx, dy), dz);
    ph[k] = Math.atan2(dy, dx);
  }
  const ft = new Float64Array(2 * n * p), fp = new Float64Array(2 * n * p);
  source.fill(th, ph, 0, p, ft, fp, p);
  const ex = new Float64Array(2 * n * p), ey = new Float64Array(2 * n * p), ez = new Float64Array(2 * n * p);
  for (let k = 0; k < p; k++) {
    const ct = Math.cos(th[k]), st = Math.sin(th[k]), cp = Math.cos(ph[k]), sp = Math.sin(ph[k]);
    for (let i = 0; i < n; i++) {
      const o = 2 * (i * p + k);
      const tr = ft[o], ti = ft[o + 1], pr = fp[o], pi = fp[o + 1];
      if (!Number.isFinite(tr) || !Number.isFinite(ti) || !Number.isFinite(pr) || !Number.isFinite(pi)) {
        throw new DomainError(`invalid feed pattern: port ${i} is not finite at θ_f = ${th[k]}, φ_f = ${ph[k]} rad.`);
      }
      // θ̂_f = (ct cp, ct sp, −st), φ̂_f = (−sp, cp, 0) in the feed frame; back to the reflector frame: (x, −y, −z).
      ex[o] = tr * ct * cp - pr * sp; ex[o + 1] = ti * ct * cp - pi * sp;
      ey[o] = -(tr * ct * sp + pr * cp); ey[o + 1] = -(ti * ct * sp + pi * cp);
      ez[o] = tr * st; ez[o + 1] = ti * st;
    }
  }
  return [ex, ey, ez];
}
