/**
 * The Galerkin reaction between piecewise-sinusoidal half-modes on two
 * straight wire segments (the matrix-fill kernel of the thin-wire method of
 * moments).
 *
 * @remarks
 * For currents I_m, I_n along unit tangents t̂_m, t̂_n the reaction
 * (mixed-potential form of −∫E_n·J_m dl, e^{+jωt}) is
 *
 *   Z_mn = (jηk/4π) ∫∫ [ (t̂_m·t̂_n) I_m I_n − I_m′ I_n′ / k² ] e^{−jkR}/R dl dl′
 *
 * (R. F. Harrington, *Field Computation by Moment Methods*, Macmillan, 1968,
 * ch. 4, eqs. (4-6)–(4-10), from memory). With the half-modes
 * sin(kt)/sin(kd) and sin(k(d−t))/sin(kd) (J. H. Richmond, "Radiation and
 * scattering by thin-wire structures in the complex frequency domain", NASA
 * CR-2396, 1974, from memory) the inner integral along the source segment is
 * exact in sine and cosine integrals; the kernel is split:
 *
 * - Im Z uses cos(kR_a)/R_a with the reduced (thin-wire) distance
 *   R_a = √(|r − r′|² + a²), a² the mean of the two squared radii: the source
 *   filament on the axis, the test filament on the surface. Near pairs: inner
 *   integral in closed form, outer Gauss–Legendre graded towards the points
 *   where the inner integral varies on the scale of the radius.
 * - Re Z uses sin(k|r − r′|)/|r − r′| between the axial filaments. This part of
 *   the kernel is regular, so no radius is needed, and Re Z is then exactly the
 *   radiated power of the filament currents whose far field the module reports
 *   (the power identity and the Twiss identity hold to quadrature error).
 *
 * Pairs far apart use a tensor Gauss–Legendre rule whose order grows as the
 * pair gets closer.
 * @internal
 * @module
 */
import { lineIntegral, segmentDistance } from '../element/inducedEmf.js';
import type { DipoleGeometry } from '../element/types.js';
import { gaussLegendre } from '../geometry/quadrature.js';
import { ETA0_OHM } from '../units/constants.js';
import { SEG } from './mesh.js';

const RULES = new Map<number, { x: Float64Array; w: Float64Array }>();
/** Gauss–Legendre rule on [0, 1]. */
function rule01(n: number): { x: Float64Array; w: Float64Array } {
  let r = RULES.get(n);
  if (!r) {
    const g = gaussLegendre(n);
    r = { x: g.nodes.map((v) => (v + 1) / 2), w: g.weights.map((v) => v / 2) };
    RULES.set(n, r);
  }
  return r;
}

/** Values of the two half-modes and their derivatives /k at the nodes of a rule. */
interface NodeValues { x: Float64Array; w: Float64Array; fr: Float64Array; ff: Float64Array; gr: Float64Array; gf: Float64Array; q: number; d: number; k: number }
const MAX_NODES = 512;
function nodeValues(): NodeValues {
  return { x: new Float64Array(MAX_NODES), w: new Float64Array(MAX_NODES), fr: new Float64Array(MAX_NODES), ff: new Float64Array(MAX_NODES), gr: new Float64Array(MAX_NODES), gf: new Float64Array(MAX_NODES), q: -1, d: 0, k: 0 };
}
const nodesS = nodeValues(), nodesT = nodeValues();

function fillModes(v: NodeValues, n: number, k: number, d: number): void {
  const s = 1 / Math.sin(k * d);
  for (let i = 0; i < n; i++) {
    const x = v.x[i];
    v.fr[i] = Math.sin(k * x) * s; v.gr[i] = Math.cos(k * x) * s;
    v.ff[i] = Math.sin(k * (d - x)) * s; v.gf[i] = -Math.cos(k * (d - x)) * s;
  }
}

function gaussNodes(v: NodeValues, q: number, k: number, d: number): number {
  if (v.q === q && v.d === d && v.k === k) return q; // same rule on a segment of the same length
  v.q = q; v.d = d; v.k = k;
  const r = rule01(q);
  for (let i = 0; i < q; i++) { v.x[i] = r.x[i] * d; v.w[i] = r.w[i] * d; }
  fillModes(v, q, k, d);
  return q;
}

/**
 * Tensor rule over both segments; adds (η k/4π)·scale·Σ w w′ A (sin(kr)/r + j·cos(kR_a)/R_a)
 * into out (the imaginary part only when `withImag`).
 */
function tensorPart(out: Float64Array, k: number, gs: Float64Array, i: number, gt: Float64Array, j: number, q: number, a2: number, scale: number, withImag: boolean): void {
  const o = i * SEG, p = j * SEG;
  const sx = gs[o], sy = gs[o + 1], sz = gs[o + 2], ux = gs[o + 3], uy = gs[o + 4], uz = gs[o + 5], ds = gs[o + 6];
  const tx = gt[p], ty = gt[p + 1], tz = gt[p + 2], vx = gt[p + 3], vy = gt[p + 4], vz = gt[p + 5], dt = gt[p + 6];
  const c = ux * vx + uy * vy + uz * vz;
  const ns = gaussNodes(nodesS, q, k, ds), nt = gaussNodes(nodesT, q, k, dt);
  let rrR = 0, rfR = 0, frR = 0, ffR = 0, rrI = 0, rfI = 0, frI = 0, ffI = 0;
  for (let a = 0; a < ns; a++) {
    const xa = nodesS.x[a];
    const px = sx + xa * ux - tx, py = sy + xa * uy - ty, pz = sz + xa * uz - tz;
    const fra = nodesS.fr[a], ffa = nodesS.ff[a], gra = nodesS.gr[a], gfa = nodesS.gf[a], wa = nodesS.w[a];
    for (let b = 0; b < nt; b++) {
      const xb = nodesT.x[b];
      const dx = px - xb * vx, dy = py - xb * vy, dz = pz - xb * vz;
      const r2 = dx * dx + dy * dy + dz * dz;
      const r = Math.sqrt(r2);
      const kr = k * r;
      const skr = Math.sin(kr);
      const gRe = kr < 1e-8 ? k : skr / r;
      const w = wa * nodesT.w[b];
      const frb = nodesT.fr[b], ffb = nodesT.ff[b], grb = nodesT.gr[b], gfb = nodesT.gf[b];
      const arr = w * (c * fra * frb - gra * grb), arf = w * (c * fra * ffb - gra * gfb);
      const afr = w * (c * ffa * frb - gfa * grb), aff = w * (c * ffa * ffb - gfa * gfb);
      rrR += arr * gRe; rfR += arf * gRe; frR += afr * gRe; ffR += aff * gRe;
      if (withImag) {
        let gIm: number;
        if (a2 < 1e-6 * r2 && k * a2 < 2e-6 * r) {
          // R_a = r + a²/2r to O(a⁴/r³): cos(kR_a)/R_a by one Taylor step about r (error < 1e-12 relative)
          const e = (0.5 * a2) / r2;
          gIm = (Math.cos(kr) - skr * kr * e) * (1 - e) / r;
        } else {
          const ra = Math.sqrt(r2 + a2);
          gIm = Math.cos(k * ra) / ra;
        }
        rrI += arr * gIm; rfI += arf * gIm; frI += afr * gIm; ffI += aff * gIm;
      }
    }
  }
  const f = (ETA0_OHM * k / (4 * Math.PI)) * scale;
  out[0] += f * rrR; out[2] += f * rfR; out[4] += f * frR; out[6] += f * ffR;
  if (withImag) { out[1] += f * rrI; out[3] += f * rfI; out[5] += f * frI; out[7] += f * ffI; }
}

const lint = new Float64Array(2);
const breaksX = new Float64Array(8), breaksH = new Float64Array(8), rightEdges = new Float64Array(64);

/** Gauss nodes on [0, d] graded geometrically (ratio 2) towards each breakpoint, 6 nodes per cell. */
function gradedNodes(v: NodeValues, d: number, nb: number): number {
  const r = rule01(6);
  let n = 0;
  const cell = (x0: number, x1: number): void => {
    if (n + 6 > MAX_NODES || !(x1 > x0)) return;
    for (let q = 0; q < 6; q++) { v.x[n] = x0 + r.x[q] * (x1 - x0); v.w[n] = r.w[q] * (x1 - x0); n++; }
  };
  for (let b = 0; b + 1 < nb; b++) {
    const x0 = breaksX[b], x1 = breaksX[b + 1], mid = (x0 + x1) / 2;
    let a = x0, h = breaksH[b];
    while (a + h < mid) { cell(a, a + h); a += h; h *= 2; }
    let e = x1; h = breaksH[b + 1];
    let nr = 0;
    while (e - h > mid && nr < rightEdges.length) { rightEdges[nr++] = e; e -= h; h *= 2; }
    cell(a, e);
    for (let q = nr - 1; q >= 0; q--) cell(q === nr - 1 ? e : rightEdges[q + 1], rightEdges[q]);
  }
  return n;
}

/** Distance from the point x along segment (gs, i) to the nearer end of segment (gt, j). */
function distanceToEnds(gs: Float64Array, o: number, x: number, gt: Float64Array, p: number): number {
  const px = gs[o] + x * gs[o + 3], py = gs[o + 1] + x * gs[o + 4], pz = gs[o + 2] + x * gs[o + 5];
  const d0 = Math.hypot(px - gt[p], py - gt[p + 1], pz - gt[p + 2]);
  const e = gt[p + 6];
  const d1 = Math.hypot(px - gt[p] - e * gt[p + 3], py - gt[p + 1] - e * gt[p + 4], pz - gt[p + 2] - e * gt[p + 5]);
  return Math.min(d0, d1);
}

/** Imaginary part of a near pair: closed-form inner integral along T, graded outer rule along S. */
function nearImag(out: Float64Array, k: number, gs: Float64Array, i: number, gt: Float64Array, j: number, a2: number, scale: number): void {
  const o = i * SEG, p = j * SEG;
  const sx = gs[o], sy = gs[o + 1], sz = gs[o + 2], ux = gs[o + 3], uy = gs[o + 4], uz = gs[o + 5], ds = gs[o + 6];
  const tx = gt[p], ty = gt[p + 1], tz = gt[p + 2], vx = gt[p + 3], vy = gt[p + 4], vz = gt[p + 5], dt = gt[p + 6];
  const c = ux * vx + uy * vy + uz * vz;
  const a = Math.sqrt(a2);
  // breakpoints: the ends of S and the projections of T's ends that fall inside S
  let nb = 0;
  const tol = 1e-9 * ds;
  const add = (x: number): void => {
    for (let q = 0; q < nb; q++) if (Math.abs(breaksX[q] - x) < tol) return;
    breaksX[nb++] = x;
  };
  add(0); add(ds);
  for (let e = 0; e < 2; e++) {
    const ex = tx + e * dt * vx - sx, ey = ty + e * dt * vy - sy, ez = tz + e * dt * vz - sz;
    const x = ex * ux + ey * uy + ez * uz;
    if (x > tol && x < ds - tol) add(x);
  }
  for (let q = 1; q < nb; q++) { // insertion sort of at most four breakpoints
    const v = breaksX[q];
    let r = q - 1;
    while (r >= 0 && breaksX[r] > v) { breaksX[r + 1] = breaksX[r]; r--; }
    breaksX[r + 1] = v;
  }
  for (let q = 0; q < nb; q++) breaksH[q] = Math.max(a, distanceToEnds(gs, o, breaksX[q], gt, p));
  nodesS.q = -1;
  const n = gradedNodes(nodesS, ds, nb);
  fillModes(nodesS, n, k, ds);
  const st = 1 / Math.sin(k * dt);
  const ckd = Math.cos(k * dt), skd = Math.sin(k * dt);
  let rr = 0, rf = 0, fr = 0, ff = 0;
  for (let q = 0; q < n; q++) {
    const x = nodesS.x[q];
    const wx = sx + x * ux - tx, wy = sy + x * uy - ty, wz = sz + x * uz - tz;
    const s0 = wx * vx + wy * vy + wz * vz;
    const rho2 = Math.max(0, wx * wx + wy * wy + wz * wz - s0 * s0) + a2;
    const cs = Math.cos(k * s0), ss = Math.sin(k * s0);
    lineIntegral(lint, k, rho2, -s0, dt - s0, -1);
    // J+ = e^{jks0} L−
    const jpr = cs * lint[0] - ss * lint[1], jpi = cs * lint[1] + ss * lint[0];
    lineIntegral(lint, k, rho2, -s0, dt - s0, 1);
    // J− = e^{−jks0} L+
    const jmr = cs * lint[0] + ss * lint[1], jmi = cs * lint[1] - ss * lint[0];
    // only real parts of the source integrals are needed (Im Z = (ηk/4π) Re S)
    // ∫rise·G = (J+ − J−)/(2j sT): real part (Im(J+) − Im(J−))/(2 sT)
    const iR = ((jpi - jmi) / 2) * st;
    // ∫fall·G = (e^{jkd}J− − e^{−jkd}J+)/(2j sT): real part Im(...)/(2 sT)
    const iF = ((skd * jmr + ckd * jmi) - (-skd * jpr + ckd * jpi)) / 2 * st;
    // ∫(rise′/k)·G = (J+ + J−)/(2 sT)
    const gR = ((jpr + jmr) / 2) * st;
    // ∫(fall′/k)·G = −(e^{jkd}J− + e^{−jkd}J+)/(2 sT)
    const gF = -((ckd * jmr - skd * jmi) + (ckd * jpr + skd * jpi)) / 2 * st;
    const w = nodesS.w[q];
    const fra = nodesS.fr[q], ffa = nodesS.ff[q], gra = nodesS.gr[q], gfa = nodesS.gf[q];
    rr += w * (c * fra * iR - gra * gR); rf += w * (c * fra * iF - gra * gF);
    fr += w * (c * ffa * iR - gfa * gR); ff += w * (c * ffa * iF - gfa * gF);
  }
  const f = (ETA0_OHM * k / (4 * Math.PI)) * scale;
  out[1] += f * rr; out[3] += f * rf; out[5] += f * fr; out[7] += f * ff;
}

const geoA: DipoleGeometry = { cx: 0, cy: 0, cz: 0, ax: 0, ay: 0, az: 1, halfLengthM: 1, radiusM: 1 };
const geoB: DipoleGeometry = { cx: 0, cy: 0, cz: 0, ax: 0, ay: 0, az: 1, halfLengthM: 1, radiusM: 1 };
function asDipole(g: DipoleGeometry, t: Float64Array, o: number): DipoleGeometry {
  const h = t[o + 6] / 2;
  g.cx = t[o] + h * t[o + 3]; g.cy = t[o + 1] + h * t[o + 4]; g.cz = t[o + 2] + h * t[o + 5];
  g.ax = t[o + 3]; g.ay = t[o + 4]; g.az = t[o + 5]; g.halfLengthM = h; g.radiusM = t[o + 7];
  return g;
}

/**
 * Adds scale × the 2×2 reaction of the half-modes of test segment i (table gs)
 * and source segment j (table gt) into out (interleaved, order rise-rise,
 * rise-fall, fall-rise, fall-fall; test first) [Ω].
 */
export function addSegmentReaction(out: Float64Array, k: number, gs: Float64Array, i: number, gt: Float64Array, j: number, scale: number): void {
  const o = i * SEG, p = j * SEG;
  const ds = gs[o + 6], dt = gt[p + 6];
  const dmax = Math.max(ds, dt);
  const a2 = (gs[o + 7] * gs[o + 7] + gt[p + 7] * gt[p + 7]) / 2;
  const cx = gs[o] + (ds / 2) * gs[o + 3] - gt[p] - (dt / 2) * gt[p + 3];
  const cy = gs[o + 1] + (ds / 2) * gs[o + 4] - gt[p + 1] - (dt / 2) * gt[p + 4];
  const cz = gs[o + 2] + (ds / 2) * gs[o + 5] - gt[p + 2] - (dt / 2) * gt[p + 5];
  const lower = Math.hypot(cx, cy, cz) - (ds + dt) / 2;
  // thresholds shrunk by 1e-9 so that pairs exactly on a threshold (lattices) are classified the same
  // wherever they sit, keeping the matrix invariant under translation to rounding
  const th = dmax * (1 - 1e-9);
  if (lower >= 8 * th) {
    tensorPart(out, k, gs, i, gt, j, k * dmax > 0.35 ? 4 : 3, a2, scale, true);
    return;
  }
  const dist = segmentDistance(asDipole(geoA, gs, o), asDipole(geoB, gt, p));
  if (dist >= 4 * th) tensorPart(out, k, gs, i, gt, j, 4, a2, scale, true);
  else if (dist >= 1.5 * th) tensorPart(out, k, gs, i, gt, j, 6, a2, scale, true);
  else {
    tensorPart(out, k, gs, i, gt, j, 6, a2, scale, false);
    nearImag(out, k, gs, i, gt, j, a2, scale);
  }
}
