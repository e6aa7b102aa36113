/**
 * Conversions between the forms of a {@link Multiport} and renormalisation of
 * its reference impedances.
 *
 * Every form is taken to scattering parameters through the port relations
 * V = d₁a + d₂b, I = d₃(a − b) that invert the wave definition
 * a = f(V + gI), b = f(V − hI) (power waves: f = 1/(2√R_r), g = Z_r, h = Z_r*),
 * so that a network described by the linear relations M_v V + M_i I = 0 has
 * S = −(M_v D₂ − M_i D₃)⁻¹(M_v D₁ + M_i D₃). The inverse directions use the
 * transposed systems so that each frequency costs one LU solve of order N.
 * @module
 */
import { hzText } from '../internal/text.js';
import { DimensionError, DomainError, SingularMatrixError } from '../errors.js';
import type { ComplexLike, CMatrix } from '../linalg/cmatrix.js';
import { adjoint, multiply } from '../linalg/ops.js';
import { batchedSolveInPlace, batchedTransposeInPlace, solveSmallInPlace } from '../internal/batched.js';
import { describeValue } from '../internal/validate.js';
import {
  type Multiport, type MultiportForm, type WaveDefinition,
  assertMultiport, packReferences, voltageCurrentCoefficients, waveCoefficients, withFields,
} from './multiport.js';
import { factorInPlace, luSolveRaw } from '../linalg/lu.js';

function singular(what: string, idx: number, net: { frequencyHz: Float64Array }, remedy: string): SingularMatrixError {
  return new SingularMatrixError(`${what} is singular at frequency index ${idx} (${hzText(net.frequencyHz[idx])}); ${remedy}.`, idx);
}

/** Port count from which the Z/Y → S conversion uses the blocked LU instead of the small-matrix solver. */
const BLOCKED_SOLVE_MIN_PORTS = 24;

/** Scattering stack of `net` with respect to its own references and wave definition. @internal */
export function scatteringStack(net: Multiport): Float64Array {
  const n = net.ports;
  const nf = net.frequencyHz.length;
  const nn = n * n;
  const src = net.data;
  if (net.form === 'scattering') return src.slice();
  if (net.form === 'transfer') return transferToScattering(src, nf, net);
  const { d1, d2, d3 } = voltageCurrentCoefficients(net.referenceOhm, net.waves);
  const rhs = new Float64Array(2 * nf * nn);
  const fail = (k: number): SingularMatrixError => singular(`converting the ${net.form} form to scattering parameters: the port relation matrix`, k, net, 'the network has no scattering matrix with these reference impedances; choose other references');
  if (net.form === 'impedance' || net.form === 'admittance') {
    // one scratch matrix, solved frequency by frequency (cache-friendly, half the memory)
    const lhs = new Float64Array(2 * nn);
    // Z: LHS = Z D₃ + D₂, RHS = Z D₃ − D₁.  Y: LHS = Y D₂ + D₃, RHS = D₃ − Y D₁.
    const isZ = net.form === 'impedance';
    const cl = isZ ? d3 : d2;
    const cr = isZ ? d3 : d1;
    const dl = isZ ? d2 : d3;
    const dr = isZ ? d1 : d3;
    const sr = isZ ? 1 : -1;
    for (let k = 0; k < nf; k++) {
      const o = 2 * k * nn;
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const l = 2 * (i * n + j);
          const q = o + l;
          const mr = src[q], mi = src[q + 1];
          const lr = cl[2 * j], li = cl[2 * j + 1];
          const rr = cr[2 * j], ri = cr[2 * j + 1];
          lhs[l] = mr * lr - mi * li;
          lhs[l + 1] = mr * li + mi * lr;
          rhs[q] = sr * (mr * rr - mi * ri);
          rhs[q + 1] = sr * (mr * ri + mi * rr);
        }
        const l = 2 * (i * n + i);
        lhs[l] += dl[2 * i]; lhs[l + 1] += dl[2 * i + 1];
        rhs[o + l] -= sr * dr[2 * i]; rhs[o + l + 1] -= sr * dr[2 * i + 1];
      }
      if (n >= BLOCKED_SOLVE_MIN_PORTS) {
        // Large port counts (array impedance matrices): the blocked LU of the complex core (its
        // SIMD product kernel does the N³ work); the scalar small-matrix solver is for few ports.
        const piv = Int32Array.from({ length: n }, (_, i) => i);
        if (factorInPlace(n, lhs, piv).exactlySingular) throw fail(k);
        rhs.set(luSolveRaw(n, n, lhs, piv, rhs.subarray(o, o + 2 * nn)), o);
      } else if (solveSmallInPlace(n, n, lhs, 0, rhs, k * nn) >= 0) throw fail(k);
    }
    return rhs;
  }
  {
    const lhs = new Float64Array(2 * nf * nn);
    // chain: M_v = [[1, −A], [0, −C]], M_i = [[0, B], [1, D]]
    const mv = new Float64Array(8), mi = new Float64Array(8);
    for (let k = 0; k < nf; k++) {
      const o = 8 * k;
      mv.fill(0); mi.fill(0);
      mv[0] = 1; mv[2] = -src[o]; mv[3] = -src[o + 1]; mv[6] = -src[o + 4]; mv[7] = -src[o + 5];
      mi[2] = src[o + 2]; mi[3] = src[o + 3]; mi[4] = 1; mi[6] = src[o + 6]; mi[7] = src[o + 7];
      for (let i = 0; i < 2; i++) {
        for (let j = 0; j < 2; j++) {
          const q = 2 * (i * 2 + j);
          const vr = mv[q], vi = mv[q + 1], ir = mi[q], ii = mi[q + 1];
          lhs[o + q] = vr * d2[2 * j] - vi * d2[2 * j + 1] - (ir * d3[2 * j] - ii * d3[2 * j + 1]);
          lhs[o + q + 1] = vr * d2[2 * j + 1] + vi * d2[2 * j] - (ir * d3[2 * j + 1] + ii * d3[2 * j]);
          rhs[o + q] = -(vr * d1[2 * j] - vi * d1[2 * j + 1] + ir * d3[2 * j] - ii * d3[2 * j + 1]);
          rhs[o + q + 1] = -(vr * d1[2 * j + 1] + vi * d1[2 * j] + ir * d3[2 * j + 1] + ii * d3[2 * j]);
        }
      }
    }
    const bad = batchedSolveInPlace(n, n, nf, lhs, rhs);
    if (bad >= 0) throw fail(bad);
  }
  return rhs;
}

function transferToScattering(t: Float64Array, nf: number, net: Multiport): Float64Array {
  // [a1; b1] = T [b2; a2]:  S21 = 1/T11, S22 = −T12/T11, S11 = T21/T11, S12 = det T / T11
  const s = new Float64Array(8 * nf);
  for (let k = 0; k < nf; k++) {
    const o = 8 * k;
    const t11r = t[o], t11i = t[o + 1], t12r = t[o + 2], t12i = t[o + 3];
    const t21r = t[o + 4], t21i = t[o + 5], t22r = t[o + 6], t22i = t[o + 7];
    const m = t11r * t11r + t11i * t11i;
    if (!(m > 0)) throw singular('the transfer-form entry T11', k, net, 'T11 = 1/S21 must be finite and non-zero');
    const ir = t11r / m, ii = -t11i / m;
    const detr = t11r * t22r - t11i * t22i - (t12r * t21r - t12i * t21i);
    const deti = t11r * t22i + t11i * t22r - (t12r * t21i + t12i * t21r);
    s[o] = t21r * ir - t21i * ii; s[o + 1] = t21r * ii + t21i * ir;
    s[o + 2] = detr * ir - deti * ii; s[o + 3] = detr * ii + deti * ir;
    s[o + 4] = ir; s[o + 5] = ii;
    s[o + 6] = -(t12r * ir - t12i * ii); s[o + 7] = -(t12r * ii + t12i * ir);
  }
  return s;
}

/** Converts a scattering stack (w.r.t. `net`'s references and waves) to the requested form. @internal */
export function fromScatteringStack(s: Float64Array, form: MultiportForm, net: Multiport): Float64Array {
  const n = net.ports;
  const nf = net.frequencyHz.length;
  const nn = n * n;
  if (form === 'scattering') return s;
  if (form === 'transfer') {
    const t = new Float64Array(8 * nf);
    for (let k = 0; k < nf; k++) {
      const o = 8 * k;
      const s11r = s[o], s11i = s[o + 1], s12r = s[o + 2], s12i = s[o + 3];
      const s21r = s[o + 4], s21i = s[o + 5], s22r = s[o + 6], s22i = s[o + 7];
      const m = s21r * s21r + s21i * s21i;
      if (!(m > 0)) throw singular('the transmission entry S21', k, net, 'the transfer form needs S21 ≠ 0');
      const ir = s21r / m, ii = -s21i / m;
      const detr = s11r * s22r - s11i * s22i - (s12r * s21r - s12i * s21i);
      const deti = s11r * s22i + s11i * s22r - (s12r * s21i + s12i * s21r);
      t[o] = ir; t[o + 1] = ii;
      t[o + 2] = -(s22r * ir - s22i * ii); t[o + 3] = -(s22r * ii + s22i * ir);
      t[o + 4] = s11r * ir - s11i * ii; t[o + 5] = s11r * ii + s11i * ir;
      t[o + 6] = -(detr * ir - deti * ii); t[o + 7] = -(detr * ii + deti * ir);
    }
    return t;
  }
  const { d1, d2, d3 } = voltageCurrentCoefficients(net.referenceOhm, net.waves);
  if (form === 'chain') {
    const out = new Float64Array(8 * nf);
    for (let k = 0; k < nf; k++) {
      const o = 8 * k;
      // V = (D1 + D2 S) a, I = D3 (I − S) a
      const vm = new Float64Array(8), im = new Float64Array(8);
      for (let i = 0; i < 2; i++) {
        for (let j = 0; j < 2; j++) {
          const q = 2 * (i * 2 + j);
          const sr = s[o + q], si = s[o + q + 1];
          vm[q] = d2[2 * i] * sr - d2[2 * i + 1] * si + (i === j ? d1[2 * i] : 0);
          vm[q + 1] = d2[2 * i] * si + d2[2 * i + 1] * sr + (i === j ? d1[2 * i + 1] : 0);
          const er = (i === j ? 1 : 0) - sr, ei = -si;
          im[q] = d3[2 * i] * er - d3[2 * i + 1] * ei;
          im[q + 1] = d3[2 * i] * ei + d3[2 * i + 1] * er;
        }
      }
      // L = [Vm row 0; Im row 0], R = [Vm row 1; −Im row 1], ABCD = L R⁻¹
      const l = [vm[0], vm[1], vm[2], vm[3], im[0], im[1], im[2], im[3]];
      const r = [vm[4], vm[5], vm[6], vm[7], -im[4], -im[5], -im[6], -im[7]];
      const detr = r[0] * r[6] - r[1] * r[7] - (r[2] * r[4] - r[3] * r[5]);
      const deti = r[0] * r[7] + r[1] * r[6] - (r[2] * r[5] + r[3] * r[4]);
      const dm = detr * detr + deti * deti;
      if (!(dm > 0)) throw singular('the output-port voltage/current map', k, net, 'the chain form needs a two-port with transmission (S21 ≠ 0)');
      const ir = detr / dm, ii = -deti / dm;
      // R⁻¹ = [[r11, −r01], [−r10, r00]] / det
      const inv = [r[6], r[7], -r[2], -r[3], -r[4], -r[5], r[0], r[1]];
      for (let q = 0; q < 8; q += 2) {
        const a = inv[q], b = inv[q + 1];
        inv[q] = a * ir - b * ii; inv[q + 1] = a * ii + b * ir;
      }
      for (let i = 0; i < 2; i++) {
        for (let j = 0; j < 2; j++) {
          let re = 0, imv = 0;
          for (let p = 0; p < 2; p++) {
            const ar = l[2 * (i * 2 + p)], ai = l[2 * (i * 2 + p) + 1];
            const br = inv[2 * (p * 2 + j)], bi = inv[2 * (p * 2 + j) + 1];
            re += ar * br - ai * bi; imv += ar * bi + ai * br;
          }
          out[o + 2 * (i * 2 + j)] = re; out[o + 2 * (i * 2 + j) + 1] = imv;
        }
      }
    }
    return out;
  }
  // Z: X = (I − Sᵀ)⁻¹(D1 + Sᵀ D2), Z_ij = X_ji / d3_j
  // Y: X = (D1 + Sᵀ D2)⁻¹(I − Sᵀ), Y_ij = X_ji · d3_i
  const u = new Float64Array(2 * nf * nn); // I − Sᵀ
  const w = new Float64Array(2 * nf * nn); // D1 + Sᵀ D2
  for (let k = 0; k < nf; k++) {
    const o = 2 * k * nn;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const q = o + 2 * (i * n + j);
        const p = o + 2 * (j * n + i);
        const sr = s[p], si = s[p + 1];
        u[q] = (i === j ? 1 : 0) - sr; u[q + 1] = -si;
        w[q] = sr * d2[2 * j] - si * d2[2 * j + 1] + (i === j ? d1[2 * i] : 0);
        w[q + 1] = sr * d2[2 * j + 1] + si * d2[2 * j] + (i === j ? d1[2 * i + 1] : 0);
      }
    }
  }
  const isZ = form === 'impedance';
  const bad = isZ ? batchedSolveInPlace(n, n, nf, u, w) : batchedSolveInPlace(n, n, nf, w, u);
  if (bad >= 0) {
    throw singular(isZ ? 'I − S (so the impedance matrix does not exist)' : 'D₁ + Sᵀ D₂ (so the admittance matrix does not exist)', bad, net, isZ ? 'use the admittance or scattering form' : 'use the impedance or scattering form');
  }
  const x = isZ ? w : u;
  batchedTransposeInPlace(n, nf, x);
  for (let k = 0; k < nf; k++) {
    const o = 2 * k * nn;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const q = o + 2 * (i * n + j);
        const xr = x[q], xi = x[q + 1];
        if (isZ) {
          // divide by d3_j
          const cr = d3[2 * j], ci = d3[2 * j + 1];
          const m = cr * cr + ci * ci;
          x[q] = (xr * cr + xi * ci) / m; x[q + 1] = (xi * cr - xr * ci) / m;
        } else {
          const cr = d3[2 * i], ci = d3[2 * i + 1];
          x[q] = xr * cr - xi * ci; x[q + 1] = xr * ci + xi * cr;
        }
      }
    }
  }
  return x;
}

/** Inverts every matrix of a stack (Z ↔ Y), naming the first singular frequency. @internal */
function invertStack(src: Float64Array, net: Multiport, what: string): Float64Array {
  const n = net.ports, nf = net.frequencyHz.length, nn = n * n;
  const a = src.slice();
  const b = new Float64Array(2 * nf * nn);
  for (let k = 0; k < nf; k++) for (let i = 0; i < n; i++) b[2 * (k * nn + i * n + i)] = 1;
  const bad = batchedSolveInPlace(n, n, nf, a, b);
  if (bad >= 0) throw singular(what, bad, net, 'the inverse form does not exist there; use the scattering form');
  return b;
}

const ALL_FORMS: readonly MultiportForm[] = ['impedance', 'admittance', 'scattering', 'chain', 'transfer'];

/**
 * Converts a network to another form, keeping its reference impedances and wave definition.
 *
 * @remarks
 * Z ↔ Y by matrix inversion; every other pair through the scattering matrix with the
 * network's references (see the module notes). Chain: [V₁; I₁] = [A B; C D][V₂; −I₂];
 * transfer: [a₁; b₁] = T [b₂; a₂]. For real equal references the two-port formulas reduce to
 * D. M. Pozar, *Microwave Engineering*, 4th ed., Wiley, 2012, Table 4.2 (from memory).
 * @param net - The network.
 * @param form - Target form.
 * @returns A new network in `form` (noise waves carried unchanged).
 * @throws {@link SingularMatrixError} with `index` = the first frequency index where the
 *   target form does not exist (e.g. Z of a network with a short-circuit mode);
 *   {@link DimensionError} for the chain/transfer forms of a network that is not a two-port.
 * @example
 * ```ts
 * const s = convertMultiport(createMultiport('impedance', [1e9], [fromRows([[75]])]), 'scattering');
 * multiportMatrix(s, 0); // ≈ [0.2000] (S11 = (75 − 50)/(75 + 50))
 * ```
 * @category Network
 */
export function convertMultiport(net: Multiport, form: MultiportForm): Multiport {
  assertMultiport('net', net);
  if (!ALL_FORMS.includes(form)) {
    throw new DomainError(`invalid argument "form": expected one of ${ALL_FORMS.join(', ')}, received ${describeValue(form)}.`);
  }
  if ((form === 'chain' || form === 'transfer') && net.ports !== 2) {
    throw new DimensionError(`invalid argument "form": the ${form} form exists for two-ports only, but "net" has ${net.ports} ports.`);
  }
  if (form === net.form) return withFields(net, { data: net.data.slice() });
  let data: Float64Array;
  if (net.form === 'impedance' && form === 'admittance') data = invertStack(net.data, net, 'the impedance matrix');
  else if (net.form === 'admittance' && form === 'impedance') data = invertStack(net.data, net, 'the admittance matrix');
  else data = fromScatteringStack(scatteringStack(net), form, net);
  return withFields(net, { form, data });
}

/**
 * Wave-to-wave renormalisation of a scattering stack (and optional power-wave noise stack)
 * from (oldRef, oldWaves) to (newRef, newWaves). Noise is only transformed when both
 * wave definitions are 'power'. @internal
 */
export function renormalizeStack(
  s: Float64Array, n: number, nf: number,
  oldRef: Float64Array, oldWaves: WaveDefinition, newRef: Float64Array, newWaves: WaveDefinition,
  noise: Float64Array | undefined, freqForErrors: Float64Array,
): { s: Float64Array; noise: Float64Array | undefined } {
  const nn = n * n;
  const o = waveCoefficients(oldRef, oldWaves);
  const w = waveCoefficients(newRef, newWaves);
  // a' = P a + Q b, b' = R a + T b  (diagonal)
  const P = new Float64Array(2 * n), Q = new Float64Array(2 * n), R = new Float64Array(2 * n), T = new Float64Array(2 * n);
  for (let i = 0; i < n; i++) {
    const gr = o.g[2 * i], gi = o.g[2 * i + 1], hr = o.h[2 * i], hi = o.h[2 * i + 1];
    const g2r = w.g[2 * i], g2i = w.g[2 * i + 1], h2r = w.h[2 * i], h2i = w.h[2 * i + 1];
    const dr = o.f[i] * (gr + hr), di = o.f[i] * (gi + hi);
    const m = dr * dr + di * di;
    const cr = (w.f[i] * dr) / m, ci = (-w.f[i] * di) / m; // f'/(f(g+h))
    const put = (arr: Float64Array, xr: number, xi: number): void => {
      arr[2 * i] = cr * xr - ci * xi; arr[2 * i + 1] = cr * xi + ci * xr;
    };
    put(P, hr + g2r, hi + g2i);
    put(Q, gr - g2r, gi - g2i);
    put(R, hr - h2r, hi - h2i);
    put(T, gr + h2r, gi + h2i);
  }
  // S'ᵀ = (P + Sᵀ Q)⁻¹ (R + Sᵀ T)
  const a = new Float64Array(2 * nf * nn), b = new Float64Array(2 * nf * nn);
  for (let k = 0; k < nf; k++) {
    const off = 2 * k * nn;
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        const q = off + 2 * (i * n + j), p = off + 2 * (j * n + i);
        const sr = s[p], si = s[p + 1];
        a[q] = sr * Q[2 * j] - si * Q[2 * j + 1]; a[q + 1] = sr * Q[2 * j + 1] + si * Q[2 * j];
        b[q] = sr * T[2 * j] - si * T[2 * j + 1]; b[q + 1] = sr * T[2 * j + 1] + si * T[2 * j];
      }
      const q = off + 2 * (i * n + i);
      a[q] += P[2 * i]; a[q + 1] += P[2 * i + 1];
      b[q] += R[2 * i]; b[q + 1] += R[2 * i + 1];
    }
  }
  const bad = batchedSolveInPlace(n, n, nf, a, b);
  if (bad >= 0) {
    throw new SingularMatrixError(`renormalising: P + Sᵀ Q is singular at frequency index ${bad} (${hzText(freqForErrors[bad])}); the network has no scattering matrix with the new reference impedances.`, bad);
  }
  batchedTransposeInPlace(n, nf, b);
  let outNoise: Float64Array | undefined;
  if (noise) {
    // c' = (T − S' Q) c
    outNoise = new Float64Array(noise.length);
    for (let k = 0; k < nf; k++) {
      const off = 2 * k * nn;
      const mdat = new Float64Array(2 * nn);
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const q = off + 2 * (i * n + j);
          const sr = b[q], si = b[q + 1];
          mdat[2 * (i * n + j)] = -(sr * Q[2 * j] - si * Q[2 * j + 1]);
          mdat[2 * (i * n + j) + 1] = -(sr * Q[2 * j + 1] + si * Q[2 * j]);
        }
        mdat[2 * (i * n + i)] += T[2 * i]; mdat[2 * (i * n + i) + 1] += T[2 * i + 1];
      }
      const mm: CMatrix = { rows: n, cols: n, data: mdat };
      const c: CMatrix = { rows: n, cols: n, data: noise.subarray(off, off + 2 * nn) };
      outNoise.set(multiply(multiply(mm, c), adjoint(mm)).data, off);
    }
  }
  return { s: b, noise: outNoise };
}

/**
 * Changes the reference impedances (and optionally the wave definition) of a network.
 *
 * @remarks
 * With a = f(V + gI), b = f(V − hI) at each port, the new waves are a' = P a + Q b,
 * b' = R a + T b with diagonal P, Q, R, T, so S' = (R + T S)(P + Q S)⁻¹ — no detour through
 * Z, which may not exist. Impedance, admittance and chain data do not depend on the
 * references and are returned unchanged (with the new references recorded); scattering and
 * transfer data are transformed. Noise waves transform as c' = (T − S'Q) c.
 * For a reciprocal network (Z = Zᵀ) the power-wave S stays symmetric for any complex
 * references: with R = Re Z_r, X = Im Z_r, S = ½R^{-1/2}(Z + jX − R)(Z + jX + R)⁻¹ 2R^{1/2},
 * a Cayley transform of the symmetric Z + jX. Pseudo-wave S is not symmetric in general.
 * Source: K. Kurokawa, "Power waves and the scattering matrix", IEEE Trans. MTT 13(2), 1965 (from memory).
 * @param net - The network.
 * @param referenceOhm - New reference impedance(s) [Ω]: one for all ports or one per port; real part > 0.
 * @param waves - New wave definition (default: keep the network's).
 * @returns A new network with the new references.
 * @throws {@link DomainError} if a reference has real part ≤ 0; {@link DimensionError} on a
 *   wrong number of references; {@link SingularMatrixError} (frequency index) if the network
 *   has no scattering matrix with the new references.
 * @category Network
 */
export function renormalizeMultiport(
  net: Multiport,
  referenceOhm: ComplexLike | ReadonlyArray<ComplexLike>,
  waves: WaveDefinition = net.waves,
): Multiport {
  assertMultiport('net', net);
  if (waves !== 'power' && waves !== 'pseudo') {
    throw new DomainError(`invalid argument "waves": expected 'power' or 'pseudo', received ${describeValue(waves)}.`);
  }
  const ref = packReferences('referenceOhm', referenceOhm, net.ports);
  return renormalizePacked(net, ref, waves);
}

/** {@link renormalizeMultiport} with packed, validated references. @internal */
export function renormalizePacked(net: Multiport, ref: Float64Array, waves: WaveDefinition): Multiport {
  const n = net.ports, nf = net.frequencyHz.length;
  let noise = net.noiseWaves;
  if (noise) {
    // noise waves are power waves w.r.t. the references: transform power(old) → power(new)
    const sp = net.waves === 'power' ? scatteringStack(net)
      : renormalizeStack(scatteringStack(net), n, nf, net.referenceOhm, net.waves, net.referenceOhm, 'power', undefined, net.frequencyHz).s;
    noise = renormalizeStack(sp, n, nf, net.referenceOhm, 'power', ref, 'power', noise, net.frequencyHz).noise;
  }
  if (net.form !== 'scattering' && net.form !== 'transfer') {
    return withFields(net, { referenceOhm: ref, waves, data: net.data.slice(), noiseWaves: noise });
  }
  const s = renormalizeStack(scatteringStack(net), n, nf, net.referenceOhm, net.waves, ref, waves, undefined, net.frequencyHz).s;
  const moved = withFields(net, { referenceOhm: ref, waves, form: 'scattering', data: s, noiseWaves: noise });
  return net.form === 'transfer' ? withFields(moved, { form: 'transfer', data: fromScatteringStack(s, 'transfer', moved) }) : moved;
}

/** Power-wave scattering stack of a network w.r.t. its own references. @internal */
export function powerScatteringStack(net: Multiport): Float64Array {
  const s = scatteringStack(net);
  if (net.waves === 'power') return s;
  return renormalizeStack(s, net.ports, net.frequencyHz.length, net.referenceOhm, net.waves, net.referenceOhm, 'power', undefined, net.frequencyHz).s;
}
