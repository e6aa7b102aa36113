/**
 * Adapters from element models and pattern sets to the reception module's
 * on-demand pattern source (`PortPatternSource`), so that brightness integrals
 * over many directions never hold every sample at once.
 *
 * @remarks
 * The reception interface is imported as a type only (no runtime dependency).
 * @module
 */
import { DomainError } from '../errors.js';
import { assertPositive, describeValue } from '../internal/validate.js';
import { C0_M_PER_S } from '../units/constants.js';
import type { PortPatternSource } from '../reception/patterns.js';
import { accumulateElementFarField, checkFarFieldOptions, SINUSOIDAL_CURRENT, type FarFieldOptions } from './farField.js';
import { patternInterpolator } from './patternInterpolation.js';
import type { EmbeddedPatternSet } from './patternSet.js';
import { assertAboveGround, dipoleGeometry, type WireDipole } from './types.js';

/**
 * The open-circuit embedded patterns of a dipole array (single-mode
 * assumption, see {@link dipoleEmbeddedPatterns}) as an on-demand pattern
 * source for the reception module: exact values at any direction, computed per
 * block. Over a ground plane integrate with an even number of θ nodes (see
 * {@link radiationResistanceMatrix}).
 *
 * @param dipoles - The N dipoles.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Drive current I₀ [A] and ground plane.
 * @returns A `PortPatternSource` with N ports.
 * @throws {@link DomainError} for bad dipoles (validated once, here).
 * @category Elements
 */
export function dipolePatternSource(dipoles: ReadonlyArray<WireDipole>, frequencyHz: number, options: FarFieldOptions = {}): PortPatternSource {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const i0 = checkFarFieldOptions(options);
  if (!Array.isArray(dipoles) || dipoles.length === 0) {
    throw new DomainError(`invalid argument "dipoles": expected a non-empty array of WireDipole, received ${describeValue(dipoles)}.`);
  }
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const plane = options.groundPlane;
  const geo = dipoles.map((d, i) => {
    const g = dipoleGeometry(`dipoles[${i}]`, d, k);
    if (plane) assertAboveGround(`dipoles[${i}]`, g, plane);
    return g;
  });
  return {
    portCount: geo.length,
    driveCurrentA: i0,
    frequencyHz,
    fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
      const th = thetaRad.subarray(start, start + count), ph = phiRad.subarray(start, start + count);
      for (let n = 0; n < geo.length; n++) {
        outTheta.fill(0, 2 * n * ld, 2 * (n * ld + count));
        outPhi.fill(0, 2 * n * ld, 2 * (n * ld + count));
        accumulateElementFarField(outTheta, outPhi, n * ld, geo[n], SINUSOIDAL_CURRENT, k, i0, th, ph, plane);
      }
    },
  };
}

/**
 * An open-circuit embedded-pattern set as an on-demand pattern source for the
 * reception module, by interpolation ({@link patternInterpolator}: its method
 * and accuracy apply).
 *
 * @param set - The set; must be open-circuit (convert others with {@link convertPatternExcitation}).
 * @returns A `PortPatternSource` with the set's ports.
 * @throws {@link DomainError} for a set that is not open-circuit or cannot be interpolated; the returned `fill` throws for θ outside the set's grid.
 * @category Elements
 */
export function patternSetSource(set: EmbeddedPatternSet): PortPatternSource {
  const interp = patternInterpolator(set);
  const e = set.excitation;
  if (e.kind !== 'open-circuit-current') {
    throw new DomainError(`invalid argument "set": the reception module expects open-circuit patterns, received "${e.kind}"; convert with convertPatternExcitation first.`);
  }
  const n = set.portCount;
  return {
    portCount: n,
    driveCurrentA: e.driveCurrentA,
    frequencyHz: set.frequencyHz,
    fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
      const r = interp.evaluate(thetaRad.subarray(start, start + count), phiRad.subarray(start, start + count));
      for (let p = 0; p < n; p++) {
        outTheta.set(r.thetaComponentV.data.subarray(2 * p * count, 2 * (p + 1) * count), 2 * p * ld);
        outPhi.set(r.phiComponentV.data.subarray(2 * p * count, 2 * (p + 1) * count), 2 * p * ld);
      }
    },
  };
}
