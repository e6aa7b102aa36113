/**
 * Kernels of the induced-EMF method for thin wires with sinusoidal currents:
 * the exact near field of a sinusoidal filament, the closed form (sine and
 * cosine integrals) for parallel wires, and Gauss–Legendre integration along
 * the receiving wire for any relative orientation.
 *
 * @remarks
 * Everything is referred to the terminal (feed) currents, Z₂₁ = V₂/I₁ with port
 * 2 open: Z₂₁ = −(1/(I₁I₂)) ∫ E₁(t)·â₂ I₂(t) dt (Carter 1932; Balanis, Antenna
 * Theory, 4th ed., 2016, eq. (8-55), from memory). Balanis' curves are referred
 * to the current maxima; the two agree for half-wave dipoles and differ by
 * sin(kh₁) sin(kh₂) otherwise.
 * @internal
 * @module
 */
import sici from '@stdlib/math-base-special-sici';
import { ETA0_OHM } from '../units/constants.js';
import { gaussLegendre, type GaussLegendreRule } from '../geometry/quadrature.js';
import type { DipoleGeometry } from './types.js';

const siciOut = new Float64Array(2);

/** Ci(u) − Ci(v) − j(Si(u) − Si(v)) = ∫_v^u e^{−jx}/x dx, with care when u and v are tiny. */
function expIntegralDifference(out: Float64Array, u: number, v: number, ratioUV: number): void {
  if (u < 1e-4 && v < 1e-4) {
    // Ci(x) = γ + ln x − x²/4 + O(x⁴), Si(x) = x + O(x³)
    out[0] = Math.log(ratioUV) - (u * u - v * v) / 4;
    out[1] = -(u - v);
    return;
  }
  sici.assign(u, siciOut, 1, 0);
  const siU = siciOut[0], ciU = siciOut[1];
  sici.assign(v, siciOut, 1, 0);
  out[0] = ciU - siciOut[1];
  out[1] = -(siU - siciOut[0]);
}

const tmp = new Float64Array(2);
const ends = new Float64Array(4);

/**
 * Fills `ends` for the endpoints a (index 0) and b (index 1) of s with
 * u = k(R + σ s), R = √(d² + s²): ends[i] = u, ends[2+i] = the alternative
 * denominator q when u was computed as k d²/q (cancellation branch), else −1.
 */
function endpointArguments(k: number, d2: number, sa: number, sb: number, sigma: number): void {
  for (let i = 0; i < 2; i++) {
    const s = i === 0 ? sa : sb;
    const r = Math.sqrt(d2 + s * s);
    if (sigma * s >= 0) { ends[i] = k * (r + sigma * s); ends[2 + i] = -1; } else {
      const q = r - sigma * s;
      ends[i] = (k * d2) / q;
      ends[2 + i] = q;
    }
  }
}

/**
 * out = ∫_a^b e^{−jk(R + σ s)}/R ds (σ = ±1), R = √(d² + s²), exactly, by the
 * substitution u = k(R + σ s) (sine and cosine integrals). Also the inner
 * integral of the thin-wire moment method (src/wire). Not re-entrant (module scratch).
 */
export function lineIntegral(out: Float64Array, k: number, d2: number, a: number, b: number, sigma: number): void {
  endpointArguments(k, d2, a, b, sigma);
  const ua = ends[0], ub = ends[1], qa = ends[2], qb = ends[3];
  // σ = +1: u increases with s, ds/R = du/u → E(ub) − E(ua).
  // σ = −1: u decreases with s, ds/R = −du/u → E(ua) − E(ub).
  const hi = sigma > 0 ? ub : ua, lo = sigma > 0 ? ua : ub;
  const qHi = sigma > 0 ? qb : qa, qLo = sigma > 0 ? qa : qb;
  const ratio = qHi > 0 && qLo > 0 ? qLo / qHi : hi / lo;
  expIntegralDifference(out, hi, lo, ratio);
}

/**
 * Mutual impedance [Ω] (re, im into `out`) between two parallel sinusoidal
 * dipoles, terminal-referred: dipole 1 at the origin along z with half-length
 * h1, dipole 2 parallel at radial distance d and axial centre offset H with
 * half-length h2 (same current sense). Exact closed form with Si/Ci; d = wire
 * radius and H = 0, h1 = h2 gives the induced-EMF self impedance.
 *
 * Derivation: E_z of dipole 1 is −j(η I_m/4π) Σₑ wₑ e^{−jkRₑ}/Rₑ over its ends and
 * centre (weights 1, 1, −2cos kh1); writing the current of dipole 2 on each half
 * as a difference of e^{±jks}, each term is ∫ e^{−jk(R ± s)}/R ds, which the
 * substitution u = k(R ± s) turns into ±[Ci(u) − j Si(u)] at the ends.
 */
export function parallelMutualImpedanceInto(out: Float64Array, k: number, h1: number, h2: number, d: number, bigH: number): Float64Array {
  const d2 = d * d;
  const centreWeight = -2 * Math.cos(k * h1);
  let zr = 0, zi = 0;
  for (let e = 0; e < 3; e++) {
    const w = e === 2 ? centreWeight : 1;
    if (w === 0 || Math.abs(w) < 1e-15) continue;
    const ze = e === 0 ? h1 : e === 1 ? -h1 : 0;
    const c = bigH - ze;
    // upper half: (1/2j)[e^{jk(h2+c)} M(c, c+h2) − e^{−jk(h2+c)} P(c, c+h2)]
    // lower half: (1/2j)[e^{jk(h2−c)} P(c−h2, c) − e^{−jk(h2−c)} M(c−h2, c)]
    // M = ∫ e^{−jk(R+s)}/R, P = ∫ e^{−jk(R−s)}/R
    let br = 0, bi = 0;
    const terms: [number, number, number, number][] = [
      [k * (h2 + c), c, c + h2, +1],
      [-k * (h2 + c), c, c + h2, -1],
      [k * (h2 - c), c - h2, c, -1],
      [-k * (h2 - c), c - h2, c, +1],
    ];
    for (let t = 0; t < 4; t++) {
      const [phase, a, b, sigma] = terms[t];
      lineIntegral(tmp, k, d2, a, b, sigma);
      const sign = t === 1 || t === 3 ? -1 : 1;
      const cr = Math.cos(phase), ci = Math.sin(phase);
      br += sign * (cr * tmp[0] - ci * tmp[1]);
      bi += sign * (cr * tmp[1] + ci * tmp[0]);
    }
    zr += w * br; zi += w * bi;
  }
  // Z = j(η/4π)/(sin kh1 sin kh2) · (1/2j) Σ = (η/8π)/(sin kh1 sin kh2) Σ
  const f = ETA0_OHM / (8 * Math.PI * Math.sin(k * h1) * Math.sin(k * h2));
  out[0] = f * zr;
  out[1] = f * zi;
  return out;
}

/**
 * Electric field [V/m] (interleaved x, y, z re/im into `out`, length 6) at point
 * (px, py, pz) of a sinusoidal filament dipole with terminal current 1 A.
 *
 * E_z = −j(ηI_m/4π)[e^{−jkR₁}/R₁ + e^{−jkR₂}/R₂ − 2 cos kh e^{−jkr}/r],
 * E_ρ = j(ηI_m/4πρ)[(z−h)e^{−jkR₁}/R₁ + (z+h)e^{−jkR₂}/R₂ − 2z cos kh e^{−jkr}/r],
 * I_m = 1/sin kh (Balanis, Antenna Theory, 4th ed., 2016, eqs. (8-53a,b) and
 * (8-52), from memory; the E_ρ sign checked by E_r → 0 in the far zone).
 */
export function filamentFieldInto(out: Float64Array, g: DipoleGeometry, k: number, px: number, py: number, pz: number): Float64Array {
  const h = g.halfLengthM;
  const dx = px - g.cx, dy = py - g.cy, dz = pz - g.cz;
  const z = dx * g.ax + dy * g.ay + dz * g.az;
  const rx = dx - z * g.ax, ry = dy - z * g.ay, rz = dz - z * g.az;
  const rho2 = rx * rx + ry * ry + rz * rz;
  const coef = ETA0_OHM / (4 * Math.PI * Math.sin(k * h));
  const ckh = Math.cos(k * h);
  const r1 = Math.sqrt(rho2 + (z - h) * (z - h));
  const r2 = Math.sqrt(rho2 + (z + h) * (z + h));
  const r0 = Math.sqrt(rho2 + z * z);
  const c1 = Math.cos(k * r1) / r1, s1 = -Math.sin(k * r1) / r1;
  const c2 = Math.cos(k * r2) / r2, s2 = -Math.sin(k * r2) / r2;
  const c0 = (-2 * ckh * Math.cos(k * r0)) / r0, s0 = (2 * ckh * Math.sin(k * r0)) / r0;
  // bracket of E_z: b = e1 + e2 + e0; E_z = −j coef b
  const bzr = c1 + c2 + c0, bzi = s1 + s2 + s0;
  const ezr = coef * bzi, ezi = -coef * bzr;
  out[0] = ezr * g.ax; out[1] = ezi * g.ax;
  out[2] = ezr * g.ay; out[3] = ezi * g.ay;
  out[4] = ezr * g.az; out[5] = ezi * g.az;
  if (rho2 > 1e-24 * (h * h)) {
    const brr = (z - h) * c1 + (z + h) * c2 + z * c0;
    const bri = (z - h) * s1 + (z + h) * s2 + z * s0;
    // E_ρ ρ̂ = j coef b_ρ ρvec / ρ²
    const er = (-coef * bri) / rho2, ei = (coef * brr) / rho2;
    out[0] += er * rx; out[1] += ei * rx;
    out[2] += er * ry; out[3] += ei * ry;
    out[4] += er * rz; out[5] += ei * rz;
  }
  return out;
}

const field = new Float64Array(6);
const ruleCache = new Map<number, GaussLegendreRule>();

function cachedRule(n: number): GaussLegendreRule {
  let r = ruleCache.get(n);
  if (!r) { r = gaussLegendre(n); ruleCache.set(n, r); }
  return r;
}

/** Options of the numerical induced-EMF integration. */
export interface WireIntegrationOptions {
  /** Gauss–Legendre nodes per segment. */
  nodesPerSegment: number;
  /** Longest segment as a fraction of the wavelength. */
  maxSegmentWavelengths: number;
}

/**
 * Mutual impedance [Ω] (re, im into `out`) of two sinusoidal dipoles in any
 * relative orientation by composite Gauss–Legendre integration of the exact
 * field of `a` along `b`. Each half of `b` is cut into segments no longer than
 * `maxSegmentWavelengths`·λ and no longer than the shortest distance between
 * the wires (to resolve near-end peaks).
 */
export function generalMutualImpedanceInto(
  out: Float64Array, a: DipoleGeometry, b: DipoleGeometry, k: number, minDistanceM: number, opts: WireIntegrationOptions,
): Float64Array {
  const h2 = b.halfLengthM;
  const lambda = (2 * Math.PI) / k;
  const segLen = Math.min(opts.maxSegmentWavelengths * lambda, Math.max(minDistanceM, 1e-3 * lambda));
  const nSeg = Math.min(256, Math.max(1, Math.ceil(h2 / segLen)));
  const rule = cachedRule(opts.nodesPerSegment);
  const sh2 = Math.sin(k * h2);
  let zr = 0, zi = 0;
  const width = h2 / nSeg;
  for (let half = 0; half < 2; half++) {
    for (let s = 0; s < nSeg; s++) {
      const t0 = s * width;
      for (let q = 0; q < rule.nodes.length; q++) {
        const tau = t0 + (width * (rule.nodes[q] + 1)) / 2; // distance from the feed
        const t = half === 0 ? tau : -tau;
        const cur = Math.sin(k * (h2 - tau)) / sh2;
        filamentFieldInto(field, a, k, b.cx + t * b.ax, b.cy + t * b.ay, b.cz + t * b.az);
        const er = field[0] * b.ax + field[2] * b.ay + field[4] * b.az;
        const ei = field[1] * b.ax + field[3] * b.ay + field[5] * b.az;
        const w = (rule.weights[q] * width) / 2 * cur;
        zr -= w * er; zi -= w * ei;
      }
    }
  }
  out[0] = zr;
  out[1] = zi;
  return out;
}

/** Shortest distance [m] between the axes (segments) of two dipoles. */
export function segmentDistance(a: DipoleGeometry, b: DipoleGeometry): number {
  // segments p(s) = ca + s·âa, s ∈ [−ha, ha]; q(t) = cb + t·âb, t ∈ [−hb, hb]
  const wx = a.cx - b.cx, wy = a.cy - b.cy, wz = a.cz - b.cz;
  const bdot = a.ax * b.ax + a.ay * b.ay + a.az * b.az;
  const dA = a.ax * wx + a.ay * wy + a.az * wz;
  const dB = b.ax * wx + b.ay * wy + b.az * wz;
  const denom = 1 - bdot * bdot;
  const clampA = (x: number) => Math.max(-a.halfLengthM, Math.min(a.halfLengthM, x));
  const clampB = (x: number) => Math.max(-b.halfLengthM, Math.min(b.halfLengthM, x));
  let s: number, t: number;
  if (denom > 1e-14) {
    s = clampA((bdot * dB - dA) / denom);
  } else {
    s = 0;
  }
  t = clampB(dB + bdot * s);
  s = clampA(bdot * t - dA);
  t = clampB(dB + bdot * s);
  // parallel or clamped cases: also test the four endpoints against the other segment
  const dist = (ss: number, tt: number): number => Math.hypot(wx + ss * a.ax - tt * b.ax, wy + ss * a.ay - tt * b.ay, wz + ss * a.az - tt * b.az);
  let best = dist(s, t);
  for (let e = -1; e <= 1; e += 2) {
    const sa = e * a.halfLengthM, tb = e * b.halfLengthM;
    best = Math.min(best, dist(sa, clampB(dB + bdot * sa)), dist(clampA(bdot * tb - dA), tb));
  }
  return best;
}
