/**
 * Secondary (reflector) far-field patterns by physical optics and by the
 * aperture-field method.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { gemmKernel } from '../internal/gemm.js';
import { assertFiniteArray, assertInteger, assertPositive } from '../internal/validate.js';
import { type CMatrix, zeros } from '../linalg/cmatrix.js';
import { wavenumberRadPerM } from '../units/convert.js';
import type { PortPatternSource, SampledPortPatterns } from '../reception/patterns.js';
import { assertPatternSource } from '../reception/patterns.js';
import type { Paraboloid } from './paraboloid.js';
import { type ApertureSamples, incidentAmplitudes, sampleAperture } from './surface.js';

/**
 * Options of the secondary-pattern functions.
 * @category Reflector
 */
export interface SecondaryPatternOptions {
  /** Gauss–Legendre order in the aperture radius; default from the electrical size and the widest requested angle (see remarks of {@link reflectorIntegrationOrders}). */
  radialOrder?: number;
  /** Number of uniform azimuth samples; default as for `radialOrder`. */
  azimuthOrder?: number;
  /**
   * Remove the currents (PO) or aperture field (aperture method) in the central blockage. On a
   * symmetric dish the radial rule then starts at the blockage edge (an exact split); on an
   * offset dish the nodes inside the blockage are dropped.
   * @defaultValue true when the reflector has a blockage diameter
   */
  applyBlockage?: boolean;
}

/**
 * Secondary patterns of the feed ports: θ̂ and φ̂ components of the scattered
 * far field in the reflector frame, phase referenced to the focus, in the
 * embedded-pattern convention (usable directly by the reception module).
 * @category Reflector
 */
export interface SecondaryPatterns extends SampledPortPatterns {
  /** Radial × azimuthal integration points used. */
  integrationPoints: number;
  /** Radial Gauss–Legendre order used. */
  radialOrder: number;
  /** Azimuthal sample count used. */
  azimuthOrder: number;
}

/**
 * Integration orders over the projected aperture.
 * @category Reflector
 */
export interface ReflectorIntegrationOrders {
  /** Gauss–Legendre nodes in the aperture radius. */
  radialOrder: number;
  /** Uniform samples in the aperture azimuth. */
  azimuthOrder: number;
}

/**
 * Default integration orders for a reflector and a set of directions.
 *
 * @remarks
 * The integrand's phase varies by k·a·sinθ_max across the aperture radius a
 * for the widest requested direction, which fixes the number of radial
 * oscillations and the azimuthal harmonics. The rule takes
 * N_ρ = ⌈0.6·k a sinθ_max⌉ + 24 Gauss–Legendre nodes and
 * N_φ = 2⌈1.1·k a sinθ_max⌉ + 48 azimuth samples (trapezoid, spectrally
 * accurate for periodic integrands), which the tests show to give ≤ 1e-3
 * relative error in the main beam and first sidelobes of a 100 λ dish. Wide
 * angle sets therefore cost more; split them into cones if needed.
 * @param dish - Reflector.
 * @param frequencyHz - Frequency [Hz].
 * @param maxThetaRad - Largest angle from +z among the requested directions [rad].
 * @returns `{ radialOrder, azimuthOrder }`.
 * @category Reflector
 */
export function reflectorIntegrationOrders(dish: Paraboloid, frequencyHz: number, maxThetaRad: number): ReflectorIntegrationOrders {
  const k = wavenumberRadPerM(frequencyHz);
  const ka = k * (dish.diameterM / 2 + dish.offsetM);
  const s = Math.min(1, Math.abs(Math.sin(Math.min(maxThetaRad, Math.PI / 2))));
  return { radialOrder: Math.ceil(0.6 * ka * s) + 24, azimuthOrder: 2 * Math.ceil(1.1 * ka * s) + 48 };
}

function checkDirections(thetaRad: Float64Array, phiRad: Float64Array): void {
  if (!(thetaRad instanceof Float64Array) || !(phiRad instanceof Float64Array)) {
    throw new DimensionError('invalid arguments "thetaRad", "phiRad": expected Float64Arrays of equal length.');
  }
  if (thetaRad.length !== phiRad.length) {
    throw new DimensionError(`invalid argument "phiRad": expected ${thetaRad.length} angles (one per θ), received ${phiRad.length}.`);
  }
  assertFiniteArray('thetaRad', thetaRad);
  assertFiniteArray('phiRad', phiRad);
}

/** Everything both methods need before their own source terms. */
interface Setup {
  s: ApertureSamples;
  k: number;
  nr: number;
  na: number;
  block: boolean;
  p: number;
  n: number;
  f: number;
  /** Source vectors per port and point (x, y, z components), N×P interleaved each. */
  src: [Float64Array, Float64Array, Float64Array];
  /** Incident amplitudes per port and point (x, y, z components). */
  e: [Float64Array, Float64Array, Float64Array];
}

function setUp(dish: Paraboloid, feed: PortPatternSource, thetaRad: Float64Array, phiRad: Float64Array, options: SecondaryPatternOptions): Setup {
  assertPatternSource('feed', feed);
  assertPositive('frequencyHz', feed.frequencyHz, 'Hz');
  checkDirections(thetaRad, phiRad);
  let tmax = 0;
  for (let i = 0; i < thetaRad.length; i++) tmax = Math.max(tmax, Math.abs(thetaRad[i]));
  const def = reflectorIntegrationOrders(dish, feed.frequencyHz, tmax);
  const nr = options.radialOrder ?? def.radialOrder;
  const na = options.azimuthOrder ?? def.azimuthOrder;
  assertInteger('radialOrder', nr, 2, 20000);
  assertInteger('azimuthOrder', na, 4, 200000);
  const block = options.applyBlockage ?? dish.blockageDiameterM > 0;
  const s = sampleAperture(dish, nr, na, block);
  const p = s.count, n = feed.portCount;
  return {
    s, k: wavenumberRadPerM(feed.frequencyHz), nr, na, block, p, n, f: dish.focalLengthM,
    src: [new Float64Array(2 * n * p), new Float64Array(2 * n * p), new Float64Array(2 * n * p)],
    e: incidentAmplitudes(s, feed),
  };
}

function result(u: Setup, feed: PortPatternSource, thetaRad: Float64Array, phiRad: Float64Array, out: { theta: CMatrix; phi: CMatrix }): SecondaryPatterns {
  return {
    thetaRad, phiRad, thetaComponentV: out.theta, phiComponentV: out.phi, driveCurrentA: feed.driveCurrentA, frequencyHz: feed.frequencyHz,
    integrationPoints: u.p, radialOrder: u.nr, azimuthOrder: u.na,
  };
}

const DIRECTION_BLOCK = 128;

/**
 * Projects per-point source vectors onto θ̂/φ̂ for all directions:
 * out[n, m] = scale(θ_m)·Σ_p src_c[n, p]·exp(jk r̂_m·r_p), c = x, y, z, with
 * the exponentials formed per block of directions and summed with the
 * shared complex product kernel.
 */
function radiate(
  src: [Float64Array, Float64Array, Float64Array], nFeeds: number, s: ApertureSamples, k: number,
  thetaRad: Float64Array, phiRad: Float64Array, scale: (theta: number) => [number, number], usePlaneZ: boolean,
): { theta: CMatrix; phi: CMatrix } {
  const m = thetaRad.length, p = s.count;
  const theta = zeros(nFeeds, m), phi = zeros(nFeeds, m);
  const e = new Float64Array(2 * p * DIRECTION_BLOCK);
  const ku = new Float64Array(DIRECTION_BLOCK), kv = new Float64Array(DIRECTION_BLOCK), kw = new Float64Array(DIRECTION_BLOCK);
  const acc = [new Float64Array(2 * nFeeds * DIRECTION_BLOCK), new Float64Array(2 * nFeeds * DIRECTION_BLOCK), new Float64Array(2 * nFeeds * DIRECTION_BLOCK)];
  for (let m0 = 0; m0 < m; m0 += DIRECTION_BLOCK) {
    const b = Math.min(DIRECTION_BLOCK, m - m0);
    // k·r̂ of the block's directions, formed once per block.
    for (let j = 0; j < b; j++) {
      const t = thetaRad[m0 + j], f = phiRad[m0 + j];
      const st = Math.sin(t);
      ku[j] = k * st * Math.cos(f); kv[j] = k * st * Math.sin(f); kw[j] = usePlaneZ ? 0 : k * Math.cos(t);
    }
    for (let q = 0; q < p; q++) {
      const xq = s.x[q], yq = s.y[q], zq = s.z[q];
      const row = 2 * q * b;
      for (let j = 0; j < b; j++) {
        const arg = ku[j] * xq + kv[j] * yq + kw[j] * zq;
        e[row + 2 * j] = Math.cos(arg);
        e[row + 2 * j + 1] = Math.sin(arg);
      }
    }
    for (let c = 0; c < 3; c++) gemmKernel(nFeeds, b, p, src[c], 0, p, e, 0, b, acc[c], 0, b, false);
    for (let j = 0; j < b; j++) {
      const t = thetaRad[m0 + j], f = phiRad[m0 + j];
      const ct = Math.cos(t), st = Math.sin(t), cp = Math.cos(f), sp = Math.sin(f);
      const [gr, gi] = scale(t);
      for (let n = 0; n < nFeeds; n++) {
        const i = 2 * (n * b + j);
        const xr = acc[0][i], xi = acc[0][i + 1], yr = acc[1][i], yi = acc[1][i + 1], zr = acc[2][i], zi = acc[2][i + 1];
        const tr = ct * cp * xr + ct * sp * yr - st * zr, ti = ct * cp * xi + ct * sp * yi - st * zi;
        const pr = -sp * xr + cp * yr, pi = -sp * xi + cp * yi;
        const o = 2 * (n * m + m0 + j);
        theta.data[o] = gr * tr - gi * ti; theta.data[o + 1] = gr * ti + gi * tr;
        phi.data[o] = gr * pr - gi * pi; phi.data[o + 1] = gr * pi + gi * pr;
      }
    }
  }
  return { theta, phi };
}

/**
 * Secondary far-field patterns of feeds on a paraboloid by physical optics.
 *
 * @remarks
 * Each feed's field E_inc = f(r̂')·e^{−jkρ_f}/ρ_f (far field of the feed at
 * the reflector, phase centre at the focus) induces the PO current
 * J = 2 n̂ × H_inc with H_inc = r̂' × E_inc/η on the illuminated surface; the
 * scattered far field is E = f_sec(r̂)·e^{−jkr}/r with
 * f_sec = −j k η/(4π) ∫ [J − (J·r̂) r̂] e^{jk r̂·r'} dS (e^{+jωt}; C. A. Balanis,
 * *Advanced Engineering Electromagnetics*, 2nd ed., 2012, §7.10 and §12.3;
 * W. V. T. Rusch & P. D. Potter, *Analysis of Reflector Antennas*, 1970 —
 * from memory). The surface integral is taken over the projected aperture
 * with n̂ dS = (−x/2f, −y/2f, 1) dx dy, Gauss–Legendre in radius and uniform
 * in azimuth; the direction phases are shared by all feeds and summed with
 * the complex product kernel in blocks of directions, so many feeds cost
 * little more than one. Edge (rim) diffraction beyond PO is not modelled.
 * A secondary pattern is in the same embedded-pattern convention as the feed:
 * driving the feed port with I₀ radiates E = f_sec·e^{−jkr}/r from the dish.
 * @param dish - Reflector (see {@link Paraboloid} for the frames).
 * @param feed - The feed ports' patterns in the feed frame (a reception-module pattern source: an array feed, or `analyticFeedSource` of pattern functions); its frequency is used.
 * @param thetaRad - Directions: θ from the reflector axis +z [rad], length M.
 * @param phiRad - Directions: φ [rad], length M.
 * @param options - Integration orders and blockage.
 * @returns f_θ, f_φ (N × M, as sampled port patterns) and the integration points used.
 * @throws {@link DimensionError} on mismatched direction arrays; {@link DomainError} on non-finite input.
 * @category Reflector
 */
export function secondaryPatternsPhysicalOptics(
  dish: Paraboloid, feed: PortPatternSource, thetaRad: Float64Array, phiRad: Float64Array, options: SecondaryPatternOptions = {},
): SecondaryPatterns {
  const u = setUp(dish, feed, thetaRad, phiRad, options);
  const { s, k, block, p, n, f, src } = u;
  const [ex, ey, ez] = u.e;
  for (let q = 0; q < p; q++) {
    if (block && s.blocked[q]) continue;
    const rf = s.rf[q];
    const ux = s.x[q] / rf, uy = s.y[q] / rf, uz = s.z[q] / rf;
    const nx = -s.x[q] / (2 * f), ny = -s.y[q] / (2 * f), nz = 1;
    const ph = -k * rf;
    const mag = (s.w[q] / rf) * (k / (4 * Math.PI));
    // g = −j·e^{−jkρ_f}·mag = mag·(sin ph − j cos ph)
    const gr = mag * Math.sin(ph), gi = -mag * Math.cos(ph);
    for (let i = 0; i < n; i++) {
      const o = 2 * (i * p + q);
      const exr = ex[o], exi = ex[o + 1], eyr = ey[o], eyi = ey[o + 1], ezr = ez[o], ezi = ez[o + 1];
      // h = r̂' × e; c = 2 N × h (PO current per unit projected area, times η)
      const hxr = uy * ezr - uz * eyr, hxi = uy * ezi - uz * eyi;
      const hyr = uz * exr - ux * ezr, hyi = uz * exi - ux * ezi;
      const hzr = ux * eyr - uy * exr, hzi = ux * eyi - uy * exi;
      const cxr = 2 * (ny * hzr - nz * hyr), cxi = 2 * (ny * hzi - nz * hyi);
      const cyr = 2 * (nz * hxr - nx * hzr), cyi = 2 * (nz * hxi - nx * hzi);
      const czr = 2 * (nx * hyr - ny * hxr), czi = 2 * (nx * hyi - ny * hxi);
      src[0][o] = gr * cxr - gi * cxi; src[0][o + 1] = gr * cxi + gi * cxr;
      src[1][o] = gr * cyr - gi * cyi; src[1][o + 1] = gr * cyi + gi * cyr;
      src[2][o] = gr * czr - gi * czi; src[2][o + 1] = gr * czi + gi * czr;
    }
  }
  const out = radiate(src, n, s, k, thetaRad, phiRad, () => [1, 0], false);
  return result(u, feed, thetaRad, phiRad, out);
}

/**
 * Secondary far-field patterns by the aperture-field (projected-aperture)
 * method, for comparison with physical optics.
 *
 * @remarks
 * Geometrical optics carries each feed ray to the reflector and, after
 * reflection E_r = 2(n̂·E_i)n̂ − E_i, to the plane z = 0 through the focus
 * (equal path 2f for every ray of a paraboloid). The plane's field E_a is
 * radiated as a Huygens source: f_θ = (jk/4π)(1 + cosθ)(F_x cosφ + F_y sinφ),
 * f_φ = (jk/4π)(1 + cosθ)(F_y cosφ − F_x sinφ), F = ∫ E_a e^{jk(x u + y v)} dA
 * (S. Silver, *Microwave Antenna Theory and Design*, 1949, ch. 5; Balanis,
 * *Antenna Theory*, 4th ed., 2016, §12.4 — from memory). It agrees with PO
 * in the main beam and near sidelobes of a dish many wavelengths across,
 * and departs from it at wide angles and for small f/D, where the aperture
 * is no longer a good stand-in for the curved surface (the tests quantify
 * this).
 * @param dish - Reflector.
 * @param feed - The feed ports' patterns in the feed frame (a reception-module pattern source: an array feed, or `analyticFeedSource` of pattern functions); its frequency is used.
 * @param thetaRad - Directions θ [rad], length M.
 * @param phiRad - Directions φ [rad], length M.
 * @param options - Integration orders and blockage.
 * @returns f_θ, f_φ (N × M, as sampled port patterns) and the integration points used.
 * @throws {@link DimensionError} on mismatched direction arrays; {@link DomainError} on non-finite input.
 * @category Reflector
 */
export function secondaryPatternsApertureField(
  dish: Paraboloid, feed: PortPatternSource, thetaRad: Float64Array, phiRad: Float64Array, options: SecondaryPatternOptions = {},
): SecondaryPatterns {
  const u = setUp(dish, feed, thetaRad, phiRad, options);
  const { s, k, block, p, n, f, src } = u;
  const [ex, ey, ez] = u.e;
  const pathPhase = -k * 2 * f;
  const cpp = Math.cos(pathPhase), spp = Math.sin(pathPhase);
  for (let q = 0; q < p; q++) {
    if (block && s.blocked[q]) continue;
    const rf = s.rf[q];
    const nx0 = -s.x[q] / (2 * f), ny0 = -s.y[q] / (2 * f);
    const nn = Math.hypot(nx0, ny0, 1);
    const nx = nx0 / nn, ny = ny0 / nn, nz = 1 / nn;
    const g = s.w[q] / rf;
    for (let i = 0; i < n; i++) {
      const o = 2 * (i * p + q);
      const dr = nx * ex[o] + ny * ey[o] + nz * ez[o];
      const di = nx * ex[o + 1] + ny * ey[o + 1] + nz * ez[o + 1];
      // Reflected transverse field at the plane: (2(n̂·e)n̂ − e)/ρ_f · e^{−jk2f} · w
      const axr = 2 * dr * nx - ex[o], axi = 2 * di * nx - ex[o + 1];
      const ayr = 2 * dr * ny - ey[o], ayi = 2 * di * ny - ey[o + 1];
      src[0][o] = g * (axr * cpp - axi * spp); src[0][o + 1] = g * (axr * spp + axi * cpp);
      src[1][o] = g * (ayr * cpp - ayi * spp); src[1][o + 1] = g * (ayr * spp + ayi * cpp);
    }
  }
  // radiate() projects (F_x, F_y, 0) on θ̂ = (cosθcosφ, cosθsinφ, −sinθ), φ̂; the Huygens
  // factor (jk/4π)(1 + cosθ)/cosθ turns cosθ·(F_x cosφ + F_y sinφ) into the formula above.
  const out = radiate(src, n, s, k, thetaRad, phiRad, (t) => {
    const c = Math.cos(t);
    if (Math.abs(c) < 1e-12) throw new DomainError('invalid argument "thetaRad": the aperture-field method is not evaluated at θ = 90°; use physical optics.');
    return [0, ((k / (4 * Math.PI)) * (1 + c)) / c];
  }, true);
  // The φ̂ projection carries no cosθ factor: undo the 1/cosθ on it.
  for (let j = 0; j < thetaRad.length; j++) {
    const c = Math.cos(thetaRad[j]);
    for (let i = 0; i < n; i++) {
      const o = 2 * (i * thetaRad.length + j);
      out.phi.data[o] *= c; out.phi.data[o + 1] *= c;
    }
  }
  return result(u, feed, thetaRad, phiRad, out);
}
