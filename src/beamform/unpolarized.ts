/**
 * Beamformers for an unpolarized source: the array responds to the two field components
 * (θ̂ and φ̂) through two response matrices, and the beam keeps the principal polarization.
 * Physics-free (any two N×K responses); the reception module calls these with the embedded
 * patterns of the ports.
 * @module
 */
import { DimensionError, DomainError, NotPositiveDefiniteError } from '../errors.js';
import { type CMatrix, matrixView, zeros } from '../linalg/cmatrix.js';
import { choleskyFactor, choleskySolve } from '../linalg/cholesky.js';
import { assertCMatrix, assertFiniteCMatrix, describeValue } from '../internal/validate.js';

function checkResponses(responseTheta: CMatrix, responsePhi: CMatrix): number {
  assertCMatrix('responseTheta', responseTheta);
  assertCMatrix('responsePhi', responsePhi);
  assertFiniteCMatrix('responseTheta', responseTheta);
  assertFiniteCMatrix('responsePhi', responsePhi);
  if (responsePhi.rows !== responseTheta.rows || responsePhi.cols !== responseTheta.cols) {
    throw new DimensionError(`invalid argument "responsePhi": expected ${responseTheta.rows}×${responseTheta.cols} like "responseTheta", received ${responsePhi.rows}×${responsePhi.cols}.`);
  }
  if (responseTheta.rows < 1) throw new DimensionError('invalid argument "responseTheta": expected at least one port (row), received 0.');
  return responseTheta.rows;
}

/**
 * Maximum-SNR weights for an unpolarized point source in each of K beam directions.
 *
 * @remarks
 * The unpolarized signal correlation R_s ∝ P Pᴴ with P = [a_θ a_φ] (N×2, the responses to the
 * two field components) has rank two, so the maximum of wᴴR_s w / wᴴR_n w is the largest
 * eigenvalue of the 2×2 matrix Pᴴ R_n⁻¹ P, reached by w = R_n⁻¹ P u with u its principal
 * eigenvector (closed form). One Cholesky factorization of R_n serves every beam. Source:
 * generalized Rayleigh quotient, e.g. H. L. Van Trees, *Optimum Array Processing*, Wiley, 2002,
 * §6.2 (from memory). Convention y = wᴴx (docs/conventions.md).
 * @param responseTheta - Response to the θ̂ field component, N×K (column k = beam k).
 * @param responsePhi - Response to the φ̂ field component, N×K.
 * @param noise - Noise correlation R_n, N×N Hermitian positive definite (same units squared as the responses).
 * @returns Weights, N×K, each column of unit 2-norm.
 * @throws {@link DimensionError} for mismatched sizes; {@link NotPositiveDefiniteError} if R_n is not positive definite; {@link DomainError} for a beam with no response.
 * @category Beamforming
 */
export function maxSnrWeightsUnpolarizedSource(responseTheta: CMatrix, responsePhi: CMatrix, noise: CMatrix): CMatrix {
  const n = checkResponses(responseTheta, responsePhi);
  assertFiniteCMatrix('noise', noise);
  if (noise.rows !== n || noise.cols !== n) {
    throw new DimensionError(`invalid argument "noise": expected ${n}×${n} (one row per port of the responses), received ${noise.rows}×${noise.cols}.`);
  }
  const f = choleskyFactor(noise);
  if (!f.positiveDefinite) {
    throw new NotPositiveDefiniteError(`invalid argument "noise": the noise correlation is not positive definite (Cholesky pivot ${f.failedPivot}); add receiver or loss noise, or check the budget.`, f.failedPivot);
  }
  const kb = responseTheta.cols;
  // right-hand sides [f_θ(k), f_φ(k)] for every beam: N × 2K
  const rhs = new Float64Array(2 * n * 2 * kb);
  const ft = responseTheta.data, fp = responsePhi.data;
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < kb; k++) {
      const s = 2 * (i * kb + k), d = 2 * (i * 2 * kb + 2 * k);
      rhs[d] = ft[s]; rhs[d + 1] = ft[s + 1]; rhs[d + 2] = fp[s]; rhs[d + 3] = fp[s + 1];
    }
  }
  const y = choleskySolve(f, { rows: n, cols: 2 * kb, data: rhs }).data;
  const out = new Float64Array(2 * n * kb);
  for (let k = 0; k < kb; k++) {
    // B = Pᴴ Y (2×2 Hermitian): a = f_θᴴ y_θ, d = f_φᴴ y_φ, b = f_θᴴ y_φ
    let a = 0, d = 0, br = 0, bi = 0;
    for (let i = 0; i < n; i++) {
      const s = 2 * (i * kb + k), t = 2 * (i * 2 * kb + 2 * k);
      a += ft[s] * y[t] + ft[s + 1] * y[t + 1];
      d += fp[s] * y[t + 2] + fp[s + 1] * y[t + 3];
      br += ft[s] * y[t + 2] + ft[s + 1] * y[t + 3];
      bi += ft[s] * y[t + 3] - ft[s + 1] * y[t + 2];
    }
    const bAbs = Math.hypot(br, bi);
    const lam = (a + d) / 2 + Math.sqrt(((a - d) / 2) ** 2 + bAbs * bAbs);
    // principal eigenvector u = [b, λ − a] (or a basis vector when b = 0)
    let u0r: number, u0i: number, u1r: number;
    if (bAbs > 1e-300 * Math.max(Math.abs(a), Math.abs(d), 1e-300)) { u0r = br; u0i = bi; u1r = lam - a; } else if (a >= d) { u0r = 1; u0i = 0; u1r = 0; } else { u0r = 0; u0i = 0; u1r = 1; }
    let norm = 0;
    for (let i = 0; i < n; i++) {
      const t = 2 * (i * 2 * kb + 2 * k);
      const wr = y[t] * u0r - y[t + 1] * u0i + y[t + 2] * u1r;
      const wi = y[t] * u0i + y[t + 1] * u0r + y[t + 3] * u1r;
      out[2 * (i * kb + k)] = wr; out[2 * (i * kb + k) + 1] = wi;
      norm += wr * wr + wi * wi;
    }
    norm = Math.sqrt(norm);
    if (!(norm > 0)) throw new DomainError(`beam ${k}: the array has no response in this direction (all patterns are zero); choose another beam direction.`);
    for (let i = 0; i < n; i++) { out[2 * (i * kb + k)] /= norm; out[2 * (i * kb + k) + 1] /= norm; }
  }
  return matrixView(n, kb, out);
}

/**
 * Conjugate-field (matched-field) weights of each beam for an unpolarized source, with an
 * optional real amplitude taper.
 *
 * @remarks
 * With P = [a_θ a_φ] (N×2) the responses at the beam direction, the beam matches the principal
 * polarization of the array response: c is the principal eigenvector of the 2×2 Gram matrix PᴴP
 * (closed form) and w = diag(g)·P c, normalised to unit 2-norm, g the taper (all ones by
 * default). This is the maximum-SNR beam of {@link maxSnrWeightsUnpolarizedSource} for spatially
 * white noise (R_n ∝ I). Source: generalized Rayleigh quotient (H. L. Van Trees, *Optimum Array
 * Processing*, Wiley, 2002, §6.2, from memory).
 * @param responseTheta - Response to the θ̂ field component, N×K.
 * @param responsePhi - Response to the φ̂ field component, N×K.
 * @param amplitude - Real taper gₙ ≥ 0 per port (dimensionless), length N. @defaultValue all ones
 * @returns Weights, N×K, each column of unit 2-norm (a zero column where the response vanishes).
 * @throws {@link DimensionError} for mismatched sizes or an `amplitude` without one value per port.
 * @category Beamforming
 */
export function matchedFieldWeightsUnpolarizedSource(responseTheta: CMatrix, responsePhi: CMatrix, amplitude?: ArrayLike<number>): CMatrix {
  const n = checkResponses(responseTheta, responsePhi);
  if (amplitude !== undefined && (amplitude === null || typeof amplitude.length !== 'number' || amplitude.length !== n)) {
    throw new DimensionError(`invalid argument "amplitude": expected ${n} real values (one per port), received ${describeValue(amplitude)}.`);
  }
  const m = responseTheta.cols;
  const t = responseTheta.data, f = responsePhi.data;
  const w = zeros(n, m);
  for (let k = 0; k < m; k++) {
    let gtt = 0, gff = 0, gre = 0, gim = 0; // Gram matrix [gtt g; g* gff], g = f_θᴴ f_φ
    for (let i = 0; i < n; i++) {
      const o = 2 * (i * m + k);
      gtt += t[o] ** 2 + t[o + 1] ** 2;
      gff += f[o] ** 2 + f[o + 1] ** 2;
      gre += t[o] * f[o] + t[o + 1] * f[o + 1];
      gim += t[o] * f[o + 1] - t[o + 1] * f[o];
    }
    // Principal eigenvector (cT, cF) of the 2×2 Hermitian Gram matrix, cF real.
    const half = (gtt - gff) / 2, gAbs = Math.hypot(gre, gim);
    const lam = (gtt + gff) / 2 + Math.hypot(half, gAbs);
    let cTr: number, cTi: number, cF: number;
    if (gAbs <= 1e-300) {
      cTr = gtt >= gff ? 1 : 0; cTi = 0; cF = gtt >= gff ? 0 : 1;
    } else {
      const s = Math.hypot(gre, gim, lam - gtt);
      cTr = gre / s; cTi = gim / s; cF = (lam - gtt) / s;
    }
    let norm = 0;
    for (let i = 0; i < n; i++) {
      const o = 2 * (i * m + k), g = amplitude === undefined ? 1 : amplitude[i];
      const re = g * (t[o] * cTr - t[o + 1] * cTi + f[o] * cF);
      const im = g * (t[o] * cTi + t[o + 1] * cTr + f[o + 1] * cF);
      w.data[o] = re; w.data[o + 1] = im;
      norm += re * re + im * im;
    }
    if (norm > 0) {
      const s = 1 / Math.sqrt(norm);
      for (let i = 0; i < n; i++) { const o = 2 * (i * m + k); w.data[o] *= s; w.data[o + 1] *= s; }
    }
  }
  return w;
}
