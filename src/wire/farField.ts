/**
 * Far fields of moment-method currents: the radiation integral of each
 * piecewise-sinusoidal half-mode in closed form, gathered per basis function
 * of the element template and placed by phase factors.
 * @internal
 * @module
 */
import { gemmKernel } from '../internal/gemm.js';
import { ETA0_OHM } from '../units/constants.js';
import { SEG } from './mesh.js';
import type { PlacedModel } from './model.js';

/** sin(x)/x, exact at 0. */
function sinc(x: number): number {
  return Math.abs(x) < 1e-4 ? 1 - (x * x) / 6 : Math.sin(x) / x;
}

/**
 * ∫₀ᵈ h(t) e^{jkct} dt for the rising half-mode h = sin(kt)/sin(kd) (out[0..1])
 * and the falling one sin(k(d−t))/sin(kd) (out[2..3]): with
 * E(α) = ∫₀ᵈ e^{jkαt} dt = d e^{jkαd/2} sinc(kαd/2),
 * rise = (E(c+1) − E(c−1))/(2j sin kd), fall = (e^{jkd}E(c−1) − e^{−jkd}E(c+1))/(2j sin kd).
 */
function halfModeIntegrals(out: Float64Array, k: number, d: number, c: number): void {
  const ap = k * (c + 1) * d / 2, am = k * (c - 1) * d / 2;
  const sp = d * sinc(ap), sm = d * sinc(am);
  const epr = sp * Math.cos(ap), epi = sp * Math.sin(ap);
  const emr = sm * Math.cos(am), emi = sm * Math.sin(am);
  const inv = 1 / (2 * Math.sin(k * d));
  // (x)/(2j) = −j x/2: re = im(x)/2, im = −re(x)/2
  out[0] = (epi - emi) * inv; out[1] = -(epr - emr) * inv;
  const ck = Math.cos(k * d), sk = Math.sin(k * d);
  const xr = (ck * emr - sk * emi) - (ck * epr + sk * epi);
  const xi = (ck * emi + sk * emr) - (ck * epi - sk * epr);
  out[2] = xi * inv; out[3] = -xr * inv;
}

const hm = new Float64Array(4);

/**
 * Far field (θ̂, φ̂ parts of f, V per ampere of basis coefficient) of every
 * basis function of the template turned by rotation R and placed at the
 * origin (`image` false), or of its ground image mirrored in z = 0 with the
 * image current rule (`image` true), at `count` directions. Outputs L×count,
 * interleaved.
 */
function templateBasisFarField(
  m: PlacedModel, R: Float64Array, image: boolean,
  st: Float64Array, ct: Float64Array, sp: Float64Array, cp: Float64Array, count: number,
  gth: Float64Array, gph: Float64Array,
): void {
  const t = m.template, S = t.segmentCount, L = m.basis.count, k = m.k;
  const { halfStart, halfBasis, halfSign } = m.basis;
  gth.fill(0, 0, 2 * L * count); gph.fill(0, 0, 2 * L * count);
  const pre = (ETA0_OHM * k) / (4 * Math.PI) * (image ? -1 : 1);
  for (let s = 0; s < S; s++) {
    const a = s * SEG;
    const x = t.geo[a], y = t.geo[a + 1], z = t.geo[a + 2], u = t.geo[a + 3], v = t.geo[a + 4], w = t.geo[a + 5], d = t.geo[a + 6];
    const ax = R[0] * x + R[1] * y + R[2] * z, ay = R[3] * x + R[4] * y + R[5] * z;
    let az = R[6] * x + R[7] * y + R[8] * z;
    const ux = R[0] * u + R[1] * v + R[2] * w, uy = R[3] * u + R[4] * v + R[5] * w;
    let uz = R[6] * u + R[7] * v + R[8] * w;
    if (image) { az = -az; uz = -uz; }
    for (let q = 0; q < count; q++) {
      const rx = st[q] * cp[q], ry = st[q] * sp[q], rz = ct[q];
      halfModeIntegrals(hm, k, d, rx * ux + ry * uy + rz * uz);
      const ph = k * (rx * ax + ry * ay + rz * az);
      // −j·pre·e^{jph}: (sin ph − j cos ph)·pre
      const er = pre * Math.sin(ph), ei = -pre * Math.cos(ph);
      const uth = ct[q] * cp[q] * ux + ct[q] * sp[q] * uy - st[q] * uz;
      const uph = -sp[q] * ux + cp[q] * uy;
      for (let h = 0; h < 2; h++) {
        const ir = hm[2 * h], ii = hm[2 * h + 1];
        const vr = er * ir - ei * ii, vi = er * ii + ei * ir;
        for (let e = halfStart[2 * s + h]; e < halfStart[2 * s + h + 1]; e++) {
          const o = 2 * (halfBasis[e] * count + q), sg = halfSign[e];
          gth[o] += sg * vr * uth; gth[o + 1] += sg * vi * uth;
          gph[o] += sg * vr * uph; gph[o + 1] += sg * vi * uph;
        }
      }
    }
  }
}

/** Scratch buffers reused between calls (grown on demand). */
let scratch = new Float64Array(0);
function buffers(len: number): Float64Array {
  if (scratch.length < len) scratch = new Float64Array(len);
  return scratch;
}

/**
 * @internal Writes ncols patterns f = Σ_b coeffT[c, b]·g_b (θ̂ and φ̂ parts [V]) at
 * directions start … start+count−1 into outTheta/outPhi (row c at 2·c·ld),
 * where g_b is the far field of basis function b of the whole placed model
 * (ground image included; zero below the plane). `coeffT` is ncols×B
 * row-major interleaved; `scale` multiplies every pattern.
 */
export function fillModelPatterns(
  m: PlacedModel, coeffT: Float64Array, ncols: number, scale: number,
  thetaRad: ArrayLike<number>, phiRad: ArrayLike<number>, start: number, count: number,
  outTheta: Float64Array, outPhi: Float64Array, ld: number,
): void {
  const L = m.basis.count, P = m.placements, B = P * L, k = m.k;
  const nb = 2 * B * count, nl = 2 * L * count;
  const buf = buffers(2 * nb + 4 * nl + 4 * count + 2 * count);
  const gth = buf.subarray(0, nb), gph = buf.subarray(nb, 2 * nb);
  const lth = buf.subarray(2 * nb, 2 * nb + nl), lph = buf.subarray(2 * nb + nl, 2 * nb + 2 * nl);
  const ith = buf.subarray(2 * nb + 2 * nl, 2 * nb + 3 * nl), iph = buf.subarray(2 * nb + 3 * nl, 2 * nb + 4 * nl);
  const o4 = 2 * nb + 4 * nl;
  const st = buf.subarray(o4, o4 + count), ct = buf.subarray(o4 + count, o4 + 2 * count);
  const sp = buf.subarray(o4 + 2 * count, o4 + 3 * count), cp = buf.subarray(o4 + 3 * count, o4 + 4 * count);
  for (let q = 0; q < count; q++) {
    const th = thetaRad[start + q], ph = phiRad[start + q];
    st[q] = Math.sin(th); ct[q] = Math.cos(th); sp[q] = Math.sin(ph); cp[q] = Math.cos(ph);
  }
  const plane = m.plane;
  const nRot = Math.max(...m.rotationId) + 1;
  for (let r = 0; r < nRot; r++) {
    const first = m.rotationId.indexOf(r);
    const R = m.rotations.subarray(9 * first, 9 * first + 9);
    templateBasisFarField(m, R, false, st, ct, sp, cp, count, lth, lph);
    if (plane) templateBasisFarField(m, R, true, st, ct, sp, cp, count, ith, iph);
    for (let p = 0; p < P; p++) {
      if (m.rotationId[p] !== r) continue;
      const ox = m.offsets[3 * p], oy = m.offsets[3 * p + 1], oz = m.offsets[3 * p + 2];
      for (let q = 0; q < count; q++) {
        const rx = st[q] * cp[q], ry = st[q] * sp[q], rz = ct[q];
        const ph = k * (rx * ox + ry * oy + rz * oz);
        const pr = Math.cos(ph), pi = Math.sin(ph);
        let qr = 0, qi = 0;
        const below = plane !== undefined && rz < 0;
        if (plane) {
          const phi = k * (rx * ox + ry * oy + rz * (2 * plane.zM - oz));
          qr = Math.cos(phi); qi = Math.sin(phi);
        }
        for (let l = 0; l < L; l++) {
          const src = 2 * (l * count + q), dst = 2 * ((p * L + l) * count + q);
          if (below) { gth[dst] = gth[dst + 1] = gph[dst] = gph[dst + 1] = 0; continue; }
          let ar = lth[src] * pr - lth[src + 1] * pi, ai = lth[src] * pi + lth[src + 1] * pr;
          let br = lph[src] * pr - lph[src + 1] * pi, bi = lph[src] * pi + lph[src + 1] * pr;
          if (plane) {
            ar += ith[src] * qr - ith[src + 1] * qi; ai += ith[src] * qi + ith[src + 1] * qr;
            br += iph[src] * qr - iph[src + 1] * qi; bi += iph[src] * qi + iph[src + 1] * qr;
          }
          gth[dst] = ar; gth[dst + 1] = ai; gph[dst] = br; gph[dst + 1] = bi;
        }
      }
    }
  }
  gemmKernel(ncols, count, B, coeffT, 0, B, gth, 0, count, outTheta, 0, ld, false, scale);
  gemmKernel(ncols, count, B, coeffT, 0, B, gph, 0, count, outPhi, 0, ld, false, scale);
}
