/**
 * Frequency-dependent inputs of a design: the band itself, amplifier noise
 * parameters across the band (fixed, tabulated, or from a two-port Touchstone
 * noise block, with the back end folded in by Friis), and coverage checks that
 * name the frequencies a data file covers.
 * @module
 */
import { hzText } from '../internal/text.js';
import type { NoiseParametersInput } from '../network/noise.js';
import { noiseParametersFromFigure } from '../network/noise.js';
import { parseTouchstone } from '../network/touchstone.js';
import { interpolateMultiport } from '../network/interpolate.js';
import { multiportMatrix } from '../network/multiport.js';
import { NumericError } from '../errors.js';
import { dbToPower } from '../units/convert.js';
import { fieldError, type Design } from './schema.js';

/** Reads a file named in a design (a path relative to the design file); supplied by the caller. @category Design */
export type DesignFileReader = (name: string) => string;

/**
 * The design's frequency points, strictly increasing [Hz].
 * @throws DesignError for a list that does not increase or a range with toHz < fromHz.
 * @internal
 */
export function designFrequencies(d: Design, file: string): Float64Array {
  const f = d.frequencyHz;
  if (typeof f === 'number') return Float64Array.of(f);
  if (!('fromHz' in f)) {
    for (let i = 1; i < f.length; i++) {
      if (!(f[i] > f[i - 1])) throw fieldError(file, `frequencyHz[${i}]`, `expected frequencies in increasing order, received ${hzText(f[i])} after ${hzText(f[i - 1])}`);
    }
    return Float64Array.from(f);
  }
  if (f.count > 1 && !(f.toHz > f.fromHz)) throw fieldError(file, 'frequencyHz.toHz', `expected toHz > fromHz (${hzText(f.fromHz)}) for ${f.count} points, received ${hzText(f.toHz)}`);
  if (f.count === 1 && f.toHz !== f.fromHz) throw fieldError(file, 'frequencyHz.count', `expected count ≥ 2 for a band from ${hzText(f.fromHz)} to ${hzText(f.toHz)}, received 1`);
  return Float64Array.from({ length: f.count }, (_, i) => (f.count === 1 ? f.fromHz : f.fromHz + ((f.toHz - f.fromHz) * i) / (f.count - 1)));
}

/**
 * Throws unless every band frequency lies inside [covered[0], covered[last]]
 * (relative slack 1e-9), naming the covered range.
 * @internal
 */
export function assertCovered(file: string, field: string, what: string, covered: ArrayLike<number>, band: ArrayLike<number>): void {
  const lo = covered[0], hi = covered[covered.length - 1];
  for (let i = 0; i < band.length; i++) {
    const f = band[i];
    if (f < lo * (1 - 1e-9) || f > hi * (1 + 1e-9)) {
      throw fieldError(file, field, `${what} covers ${hzText(lo)} to ${hzText(hi)} (${covered.length} points), but the design asks for ${hzText(f)}; narrow frequencyHz or supply data covering it`);
    }
  }
}

/** Index j with x[j] ≤ f ≤ x[j+1] and the weight t of x[j+1] (x increasing, f inside). */
function bracket(x: ArrayLike<number>, f: number): [number, number] {
  const n = x.length;
  if (n === 1 || f <= x[0]) return [0, 0];
  if (f >= x[n - 1]) return [n - 2, 1];
  let lo = 0, hi = n - 1;
  while (hi - lo > 1) { const mid = (lo + hi) >> 1; if (x[mid] <= f) lo = mid; else hi = mid; }
  return [lo, (f - x[lo]) / (x[lo + 1] - x[lo])];
}

/** Linear interpolation of y(x) at f (x increasing, f inside). @internal */
export function lerpAt(x: ArrayLike<number>, y: ArrayLike<number>, f: number): number {
  const [j, t] = bracket(x, f);
  return t === 0 ? y[j] : (1 - t) * y[j] + t * y[j + 1];
}

/** Per-frequency amplifier noise parameters of a design (undefined: noiseless receivers). @internal */
export type AmplifierBand = ((frequencyHz: number) => NoiseParametersInput) | undefined;

function complexOf(v: number | { re: number; im: number }): { re: number; im: number } {
  return typeof v === 'number' ? { re: v, im: 0 } : v;
}

/**
 * The amplifiers' noise parameters at any band frequency, with the back end folded in.
 *
 * @remarks
 * Tables are interpolated linearly in frequency (T_min, R_n, Re and Im of Y_opt; for a
 * Touchstone noise block T_min, R_n and Re/Im of Γ_opt, then converted). A second stage of
 * noise temperature T₂ behind an LNA of available gain G adds T₂/G to the amplifier's noise
 * temperature for every source impedance (Friis cascade, H. T. Friis, Proc. IRE 32(7), 1944,
 * from memory); that is, T_min → T_min + T₂/G with R_n and Y_opt unchanged — exact when G does
 * not depend on the source impedance, the usual approximation for a well-isolated LNA. With a
 * Touchstone file and no gainDb, G = |S21|² of the file (the transducer gain between its
 * reference impedances, standing in for the available gain).
 * @internal
 */
export function amplifierBand(d: Design, file: string, band: Float64Array, read: DesignFileReader | undefined): AmplifierBand {
  const a = d.amplifiers;
  if (a === undefined) return undefined;
  const t2 = a.secondStageTemperatureK ?? 0;
  const fixedGain = a.gainDb === undefined ? undefined : dbToPower(a.gainDb);
  if (t2 > 0 && fixedGain === undefined && !('touchstoneFile' in a)) {
    throw fieldError(file, 'amplifiers.gainDb', 'expected the LNA gain [dB] when secondStageTemperatureK is given (the Friis cascade needs it), received nothing');
  }
  if ('minimumNoiseTemperatureK' in a) {
    const add = t2 > 0 ? t2 / (fixedGain as number) : 0;
    const p = { minimumNoiseTemperatureK: a.minimumNoiseTemperatureK + add, noiseResistanceOhm: a.noiseResistanceOhm, optimumSourceAdmittanceS: a.optimumSourceAdmittanceS };
    return () => p;
  }
  if ('table' in a) {
    const t = a.table;
    assertCovered(file, 'amplifiers.table.frequencyHz', 'the amplifier noise table', t.frequencyHz, band);
    const y = t.optimumSourceAdmittanceS.map(complexOf);
    const gRe = y.map((v) => v.re), gIm = y.map((v) => v.im);
    const add = t2 > 0 ? t2 / (fixedGain as number) : 0;
    return (f) => ({
      minimumNoiseTemperatureK: lerpAt(t.frequencyHz, t.minimumNoiseTemperatureK, f) + add,
      noiseResistanceOhm: lerpAt(t.frequencyHz, t.noiseResistanceOhm, f),
      optimumSourceAdmittanceS: { re: lerpAt(t.frequencyHz, gRe, f), im: lerpAt(t.frequencyHz, gIm, f) },
    });
  }
  if (read === undefined) throw fieldError(file, 'amplifiers.touchstoneFile', 'expected a file reader from the caller to read it (pass options.readFile), received none');
  let text: string;
  try {
    text = read(a.touchstoneFile);
  } catch (e) {
    throw fieldError(file, 'amplifiers.touchstoneFile', `cannot read "${a.touchstoneFile}": ${(e as Error).message}`);
  }
  const ts = wrapField(file, 'amplifiers.touchstoneFile', () => parseTouchstone(text, touchstoneOptions(a.touchstoneFile)));
  if (ts.network.ports !== 2) throw fieldError(file, 'amplifiers.touchstoneFile', `expected a two-port file with a noise block, received ${ts.network.ports} ports`);
  const nz = ts.noise;
  if (nz === undefined) throw fieldError(file, 'amplifiers.touchstoneFile', `expected a noise-parameter block after the network data in "${a.touchstoneFile}", received none`);
  if (nz.frequencyHz.length < 2 && band.length > 1) throw fieldError(file, 'amplifiers.touchstoneFile', `expected at least 2 noise-data rows to cover a band, received ${nz.frequencyHz.length}`);
  assertCovered(file, 'amplifiers.touchstoneFile', `the noise block of "${a.touchstoneFile}"`, nz.frequencyHz, band);
  if (fixedGain === undefined && t2 > 0) assertCovered(file, 'amplifiers.touchstoneFile', `the network data of "${a.touchstoneFile}"`, ts.network.frequencyHz, band);
  const gr = Array.from({ length: nz.frequencyHz.length }, (_, i) => nz.optimumReflection[2 * i]);
  const gi = Array.from({ length: nz.frequencyHz.length }, (_, i) => nz.optimumReflection[2 * i + 1]);
  return (f) => {
    const fminDb = lerpAt(nz.frequencyHz, nz.minimumNoiseFigureDb, f);
    const p = noiseParametersFromFigure(fminDb, lerpAt(nz.frequencyHz, nz.noiseResistanceOhm, f), { re: lerpAt(nz.frequencyHz, gr, f), im: lerpAt(nz.frequencyHz, gi, f) }, nz.referenceOhm);
    let add = 0;
    if (t2 > 0) {
      let g = fixedGain;
      if (g === undefined) {
        const s = multiportMatrix(interpolateMultiport(ts.network, [f]), 0);
        g = s.data[4] ** 2 + s.data[5] ** 2; // |S21|², entry (1, 0) of the 2×2
      }
      add = t2 / g;
    }
    return { minimumNoiseTemperatureK: p.minimumNoiseTemperatureK + add, noiseResistanceOhm: p.noiseResistanceOhm, optimumSourceAdmittanceS: { re: p.optimumSourceAdmittanceS.re, im: p.optimumSourceAdmittanceS.im } };
  };
}

/** Port count of a version 1 Touchstone file from its .sNp extension. @internal */
export function touchstoneOptions(name: string): { ports?: number } {
  const m = /\.[sS](\d+)[pP]$/.exec(name);
  return m ? { ports: Number(m[1]) } : {};
}

/** Runs f, turning a library error into a DesignError on `field`. @internal */
export function wrapField<T>(file: string, field: string, f: () => T): T {
  try {
    return f();
  } catch (e) {
    if (e instanceof NumericError && e.name !== 'DesignError') throw fieldError(file, field, e.message);
    throw e;
  }
}
