/**
 * Frequency interpolation of a multiport.
 * @module
 */
import { hzText } from '../internal/text.js';
import { DomainError } from '../errors.js';
import { describeValue } from '../internal/validate.js';
import { type Multiport, assertMultiport, checkFrequencies, withFields } from './multiport.js';

/**
 * Interpolation rule of {@link interpolateMultiport}.
 *
 * - `'real-imaginary'`: linear in the real and imaginary parts of each entry.
 * - `'magnitude-phase'`: linear in the magnitude and in the unwrapped phase of each entry
 *   (phase unwrapped along the original grid: steps larger than π are taken as 2π jumps).
 * @category Network
 */
export type InterpolationRule = 'real-imaginary' | 'magnitude-phase';

/**
 * Resamples a network on new frequencies by piecewise-linear interpolation of each entry.
 *
 * @remarks
 * The stored form is interpolated as it is (interpolate the form that varies smoothly:
 * usually S for distributed circuits). No extrapolation: every new frequency must lie in
 * [f₀, f_last] of the network. Noise waves are interpolated linearly in re/im.
 * @param net - The network.
 * @param frequencyHz - New frequencies [Hz], strictly increasing, inside the network's range.
 * @param rule - Interpolation rule (default `'real-imaginary'`).
 * @returns A new network on the new grid.
 * @throws {@link DomainError} on frequencies outside the range or a bad rule.
 * @category Network
 */
export function interpolateMultiport(net: Multiport, frequencyHz: ArrayLike<number>, rule: InterpolationRule = 'real-imaginary'): Multiport {
  assertMultiport('net', net);
  if (rule !== 'real-imaginary' && rule !== 'magnitude-phase') {
    throw new DomainError(`invalid argument "rule": expected 'real-imaginary' or 'magnitude-phase', received ${describeValue(rule)}.`);
  }
  const fNew = checkFrequencies('frequencyHz', frequencyHz);
  const f = net.frequencyHz;
  const lo = f[0], hi = f[f.length - 1];
  for (let k = 0; k < fNew.length; k++) {
    if (fNew[k] < lo || fNew[k] > hi) {
      throw new DomainError(`invalid argument "frequencyHz": entry ${k} (${hzText(fNew[k])}) lies outside the network's range [${hzText(lo)}, ${hzText(hi)}]; interpolation does not extrapolate.`);
    }
  }
  const nn = net.ports * net.ports;
  const nf = f.length;
  // locate each new frequency: index j with f[j] ≤ x ≤ f[j+1], weight t
  const idx = new Int32Array(fNew.length);
  const wt = new Float64Array(fNew.length);
  let j = 0;
  for (let k = 0; k < fNew.length; k++) {
    while (j < nf - 2 && f[j + 1] < fNew[k]) j++;
    idx[k] = j;
    wt[k] = nf === 1 ? 0 : (fNew[k] - f[j]) / (f[j + 1] - f[j]);
  }
  const linear = (src: Float64Array): Float64Array => {
    const out = new Float64Array(2 * fNew.length * nn);
    for (let k = 0; k < fNew.length; k++) {
      const a = 2 * idx[k] * nn, b = nf === 1 ? a : a + 2 * nn, t = wt[k];
      for (let q = 0; q < 2 * nn; q++) out[2 * k * nn + q] = (1 - t) * src[a + q] + t * src[b + q];
    }
    return out;
  };
  let data: Float64Array;
  if (rule === 'real-imaginary') {
    data = linear(net.data);
  } else {
    const mag = new Float64Array(nf * nn), ph = new Float64Array(nf * nn);
    for (let e = 0; e < nn; e++) {
      let prev = 0;
      for (let k = 0; k < nf; k++) {
        const q = 2 * (k * nn + e);
        mag[k * nn + e] = Math.hypot(net.data[q], net.data[q + 1]);
        let p = Math.atan2(net.data[q + 1], net.data[q]);
        if (k > 0) p += 2 * Math.PI * Math.round((prev - p) / (2 * Math.PI));
        ph[k * nn + e] = p;
        prev = p;
      }
    }
    data = new Float64Array(2 * fNew.length * nn);
    for (let k = 0; k < fNew.length; k++) {
      const a = idx[k] * nn, b = nf === 1 ? a : a + nn, t = wt[k];
      for (let e = 0; e < nn; e++) {
        const m = (1 - t) * mag[a + e] + t * mag[b + e];
        const p = (1 - t) * ph[a + e] + t * ph[b + e];
        data[2 * (k * nn + e)] = m * Math.cos(p);
        data[2 * (k * nn + e) + 1] = m * Math.sin(p);
      }
    }
  }
  return withFields(net, { frequencyHz: fNew, data, noiseWaves: net.noiseWaves ? linear(net.noiseWaves) : undefined });
}
