/**
 * Polarimetric figures of a dual-polarised design (crossed dipoles): the Jones
 * matrix of each beam direction's X/Y beam pair, its intrinsic
 * cross-polarisation ratio, the Ludwig-3 cross-polar level of each beam and the sensitivity of
 * each polarisation's beam.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { samplePatterns, matchedFieldWeightsUnpolarized, beamFigures, type ArrayPortSource, type NoiseBudget } from '../reception/index.js';
import { systemEquivalentFluxDensityJy } from '../reception/merit.js';
import { beamJonesMatrices, intrinsicCrossPolarizationRatio, jonesCrossPolarRatios } from '../imperfect/polarization.js';
import { powerToDb } from '../units/convert.js';
import type { PreparedDesign } from './build.js';
import type { DesignLivePorts } from './failures.js';
import { designPortTaper } from './failures.js';

/** Largest |level| reported [dB]: 300 dB stands for an infinite IXR or an exact zero (numerical limit). */
const LIMIT_DB = 300;

/**
 * Polarimetric figures of a dual-polarised design at one frequency, per beam direction.
 * @category Design
 */
export interface DesignPolarization {
  /** How the beam pair is formed. */
  readonly beamPair: 'conjugate-field match of the X ports and of the Y ports';
  /**
   * Per beam: the 2×2 Jones matrix J of the pair (row X, Y beam; column Ludwig-3 co, cross with
   * x̂ reference), volts per unit drive, interleaved re/im J₀₀, J₀₁, J₁₀, J₁₁ (8 numbers).
   */
  readonly jones: number[][];
  /** Intrinsic cross-polarisation ratio of J per beam [dB] (300: infinite, at the numerical limit). */
  readonly ixrDb: number[];
  /** Ludwig-3 cross- over co-polar power of the X beam, |J₀₁|²/|J₀₀|², per beam [dB] (−300: zero). */
  readonly crossPolarXDb: number[];
  /** Ludwig-3 cross- over co-polar power of the Y beam, |J₁₀|²/|J₁₁|², per beam [dB] (−300: zero). */
  readonly crossPolarYDb: number[];
  /**
   * Sensitivity A_e/T_sys of the X beam for an unpolarised source, per beam [m²/K] (the
   * receiving-array definition of the reception module: 2k_B·SNR/S with S the total flux of
   * both polarisations, so an ideal single-polarisation beam collects half of it).
   */
  readonly sensitivityXM2PerK: number[];
  /** Sensitivity A_e/T_sys of the Y beam for an unpolarised source, per beam [m²/K]. */
  readonly sensitivityYM2PerK: number[];
  /** System-equivalent flux density of the X beam, 2k_B/(A_e/T_sys), per beam [Jy]. */
  readonly sefdXJy: number[];
  /** System-equivalent flux density of the Y beam, per beam [Jy]. */
  readonly sefdYJy: number[];
}

/**
 * The Jones matrix, IXR and Ludwig-3 cross-polar levels of a crossed-dipole design's beams at
 * one frequency.
 *
 * @remarks
 * At each beam direction two beams are formed: X over the X-dipole ports and Y over the
 * Y-dipole ports, each the conjugate-field match of its ports' patterns (principal
 * polarisation; the design's taper when the beamformer is "taper"), the other ports weighted 0.
 * Their Jones matrix per direction is the imperfect module's {@link beamJonesMatrices} (rows:
 * beams; columns: Ludwig-3 co- and cross-polar components with x̂ reference, A. C. Ludwig, IEEE
 * Trans. Antennas Propag. 21(1), 1973, from memory); IXR = ((σ₁ + σ₂)/(σ₁ − σ₂))² of J
 * ({@link intrinsicCrossPolarizationRatio}; T. D. Carozzi and G. Woan, IEEE Trans. Antennas
 * Propag. 59(6), 2011, from memory). What is invariant: the raw IXR of J depends only on J's
 * condition number, so it is unchanged by a scalar gain and by unitary changes of polarisation
 * basis (J → a·U·J·V); it is *not* unchanged by a general invertible 2×2 applied to J. The IXR of
 * J(r₀)⁻¹·J(r̂) relative to a calibration direction r₀ is unchanged by any invertible output
 * calibration C (J → C·J): pass `jones` to intrinsicCrossPolarizationRatio with `reference`.
 * Polarimetric sensitivity for unpolarised sources: each beam of the pair is a receiving-array
 * beam, so its A_e/T_sys and SEFD follow the definitions of the main figures (IEEE Std 145-2013
 * receiving-array terms; K. F. Warnick et al., IEEE Trans. Antennas Propag. 58(6), 2010, from
 * memory): T_sys referred to the isotropic noise response, the source unpolarised with total flux
 * S. These are the per-polarisation figures a dual-polarised radiometer quotes; with an ideal
 * orthogonal pair each sees S/2.
 * @param prepared - The prepared design (crossed-dipole elements).
 * @param ports - The (working) ports at the frequency ({@link designLivePorts}).
 * @param budget - The ports' open-circuit noise budget at the frequency (the evaluation's).
 * @returns The figures per beam, or undefined for single-polarisation elements.
 * @category Design
 */
export function designPolarizationAt(prepared: PreparedDesign, ports: DesignLivePorts | ArrayPortSource, budget: NoiseBudget): DesignPolarization | undefined {
  if (prepared.portsPerElement !== 2) return undefined;
  const kept = 'keptPorts' in ports ? ports.keptPorts : undefined;
  const n = ports.impedanceOhm.rows;
  const original = kept ?? Int32Array.from({ length: n }, (_, i) => i);
  const { thetaRad, phiRad } = prepared.beams;
  const k = thetaRad.length;
  const s = samplePatterns(ports.patterns, thetaRad, phiRad);
  const taper = prepared.design.beams.beamformer === 'taper' ? designPortTaper(prepared, kept) : undefined;
  const pair = [0, 1].map((pol) => {
    const idx = Int32Array.from(original.keys()).filter((i) => original[i] % 2 === pol);
    const sub = (m: CMatrix): CMatrix => {
      const out = { rows: idx.length, cols: k, data: new Float64Array(2 * idx.length * k) };
      idx.forEach((i, r) => out.data.set(m.data.subarray(2 * i * k, 2 * (i + 1) * k), 2 * r * k));
      return out;
    };
    const w = matchedFieldWeightsUnpolarized({ ...s, thetaComponentV: sub(s.thetaComponentV), phiComponentV: sub(s.phiComponentV) }, taper ? Array.from(idx, (i) => taper[i]) : undefined);
    return { idx, w };
  });
  const jones: number[][] = [], ixrDb: number[] = [], crossPolarXDb: number[] = [], crossPolarYDb: number[] = [];
  const dB = (x: number) => Math.max(-LIMIT_DB, Math.min(LIMIT_DB, powerToDb(x)));
  for (let b = 0; b < k; b++) {
    // the pair's weights over all working ports for this beam
    const [wx, wy] = pair.map(({ idx, w }) => {
      const full = { rows: n, cols: 1, data: new Float64Array(2 * n) };
      idx.forEach((i, r) => { full.data[2 * i] = w.data[2 * (r * k + b)]; full.data[2 * i + 1] = w.data[2 * (r * k + b) + 1]; });
      return full;
    });
    const j = beamJonesMatrices(ports.patterns, wx, wy, thetaRad.subarray(b, b + 1), phiRad.subarray(b, b + 1)).jones;
    jones.push(Array.from(j));
    ixrDb.push(dB(intrinsicCrossPolarizationRatio(j)[0]));
    const c = jonesCrossPolarRatios(j);
    crossPolarXDb.push(dB(c.x[0]));
    crossPolarYDb.push(dB(c.y[0]));
  }
  // Each beam of the pair through the reception module's figures (weights over all working ports).
  const [sx, sy] = pair.map(({ idx, w }) => {
    const full = { rows: n, cols: k, data: new Float64Array(2 * n * k) };
    idx.forEach((i, r) => full.data.set(w.data.subarray(2 * r * k, 2 * (r + 1) * k), 2 * i * k));
    return beamFigures(budget, full, s).map((b) => b.sensitivityM2PerK);
  });
  return {
    beamPair: 'conjugate-field match of the X ports and of the Y ports', jones, ixrDb, crossPolarXDb, crossPolarYDb,
    sensitivityXM2PerK: sx, sensitivityYM2PerK: sy, sefdXJy: sx.map(systemEquivalentFluxDensityJy), sefdYJy: sy.map(systemEquivalentFluxDensityJy),
  };
}
