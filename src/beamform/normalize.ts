/**
 * Beam weight normalisations shared by the beamformers.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { quadraticForm } from '../linalg/ops.js';

/**
 * How a beamformer scales its weights (the SNR and pattern shape do not depend on it).
 *
 * - `'distortionless'`: wᴴa = 1 for the look-direction response a (unit gain on the signal).
 * - `'unitNorm'`: wᴴw = 1, phase chosen so that wᴴa is real and positive (when a is known).
 * - `'unitNoise'`: wᴴR_n w = 1 (unit output noise power), phase as for `'unitNorm'`.
 * - `'none'`: the raw solution (e.g. R_n⁻¹a).
 * @category Beamforming
 */
export type BeamNormalization = 'distortionless' | 'unitNorm' | 'unitNoise' | 'none';

const NORMALIZATIONS: ReadonlyArray<BeamNormalization> = ['distortionless', 'unitNorm', 'unitNoise', 'none'];

/** Throws DomainError unless `x` names a normalisation; `allowed` restricts the set. */
export function assertNormalization(x: unknown, allowed: ReadonlyArray<BeamNormalization> = NORMALIZATIONS): asserts x is BeamNormalization {
  if (!allowed.includes(x as BeamNormalization)) {
    throw new DomainError(`invalid option "normalization": expected one of ${allowed.map((s) => `'${s}'`).join(', ')}, received ${JSON.stringify(x)}.`);
  }
}

/**
 * Scales column `col` of the N×K weight matrix `w` in place. `a` is the N×K
 * matrix of look responses (column `col` used) or null; `noise` is needed for
 * `'unitNoise'`.
 */
export function normalizeColumn(w: CMatrix, col: number, mode: BeamNormalization, a: CMatrix | null, noise: CMatrix | null): void {
  if (mode === 'none') return;
  const n = w.rows, k = w.cols, d = w.data;
  // c = wᴴa (look response) when a is known.
  let cr = 0, ci = 0;
  if (a) {
    const ad = a.data, ka = a.cols;
    for (let i = 0; i < n; i++) {
      const p = 2 * (i * k + col), q = 2 * (i * ka + col);
      cr += d[p] * ad[q] + d[p + 1] * ad[q + 1];
      ci += d[p] * ad[q + 1] - d[p + 1] * ad[q];
    }
  }
  const cm = Math.hypot(cr, ci);
  let sr: number, si: number; // multiply w by s
  if (mode === 'distortionless') {
    if (!a || cm === 0) {
      throw new DimensionError('cannot normalise the beam to wᴴa = 1: its response to the look direction is zero (or no look direction is defined); choose normalization \'unitNorm\'.');
    }
    // w ← w·s with s = c/|c|² = 1/conj(c), so that (w s)ᴴa = conj(s)·c = 1.
    sr = cr / (cm * cm);
    si = ci / (cm * cm);
  } else {
    let scaleSq: number;
    if (mode === 'unitNorm') {
      scaleSq = 0;
      for (let i = 0; i < n; i++) scaleSq += d[2 * (i * k + col)] ** 2 + d[2 * (i * k + col) + 1] ** 2;
    } else {
      if (!noise) throw new DimensionError('normalization \'unitNoise\' needs the noise correlation matrix; pass the "noise" option.');
      const wc = { rows: n, cols: 1, data: new Float64Array(2 * n) };
      for (let i = 0; i < n; i++) {
        wc.data[2 * i] = d[2 * (i * k + col)];
        wc.data[2 * i + 1] = d[2 * (i * k + col) + 1];
      }
      scaleSq = quadraticForm(wc, noise);
    }
    if (!(scaleSq > 0)) throw new DimensionError(`cannot normalise the beam with '${mode}': the normalising power is ${scaleSq}.`);
    const m = 1 / Math.sqrt(scaleSq);
    // Phase: make wᴴa real positive, i.e. multiply w by c/|c| (then (w c/|c|)ᴴ a = |c|).
    if (a && cm > 0) {
      sr = (m * cr) / cm;
      si = (m * ci) / cm;
    } else {
      sr = m;
      si = 0;
    }
  }
  for (let i = 0; i < n; i++) {
    const p = 2 * (i * k + col);
    const xr = d[p], xi = d[p + 1];
    d[p] = xr * sr - xi * si;
    d[p + 1] = xr * si + xi * sr;
  }
}
