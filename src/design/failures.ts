/**
 * Failed elements of a design: which elements failed (a list or a seeded random
 * fraction) and the working array's ports at a band frequency, the failed ports
 * terminated inside the coupled network (imperfect module's failedArrayPorts).
 * @module
 */
import { failedArrayPorts, randomFailures, type FailedArrayPorts, type FailedPortTermination } from '../imperfect/failures.js';
import type { ArrayPortSource } from '../reception/index.js';
import { fieldError } from './schema.js';
import type { DesignFailures } from './types.js';
import { wrapField } from './bandData.js';
import type { PreparedDesign } from './build.js';

/**
 * The failed element indices of a design's `imperfections.failures` (ascending), checked
 * against the layout's element count. @internal
 */
export function designFailedElements(spec: DesignFailures | undefined, elementCount: number, file: string): Int32Array | undefined {
  if (spec === undefined) return undefined;
  let failed: Int32Array;
  if (spec.elements !== undefined) {
    spec.elements.forEach((e, i) => {
      if (e >= elementCount) throw fieldError(file, `imperfections.failures.elements[${i}]`, `expected an element index below ${elementCount} (the layout's element count), received ${e}`);
    });
    failed = Int32Array.from(spec.elements).sort();
  } else {
    failed = randomFailures(elementCount, spec.fraction as number, spec.seed ?? 1);
  }
  if (failed.length >= elementCount) {
    throw fieldError(file, spec.elements !== undefined ? 'imperfections.failures.elements' : 'imperfections.failures.fraction',
      `expected at least one working element, received failures of all ${elementCount} elements`);
  }
  return failed;
}

/**
 * The imperfect module's termination of a design's failed ports. @internal
 */
export function designFailureTermination(spec: DesignFailures): FailedPortTermination {
  if (spec.termination === 'open') return { kind: 'open' };
  if (spec.termination === 'matched') return { kind: 'matched', referenceOhm: spec.referenceOhm ?? 50 };
  const z = spec.amplifierInputOhm ?? 0;
  return { kind: 'amplifierInput', impedanceOhm: typeof z === 'number' ? { re: z, im: 0 } : z };
}

/**
 * The ports the beamformer uses at one band frequency: all of them, or — with failed elements
 * in the design — the working ports with the failed ones terminated in the coupled network.
 *
 * @remarks
 * The array's ports at f ({@link designPortsAt}) are reduced by the imperfect module's
 * {@link failedArrayPorts}: impedance matrix Z' = Z_KK − Z_KF(Z_FF + Z_L)⁻¹Z_FK and embedded
 * patterns of the working ports including the currents the failed elements carry (none when
 * open), so embedded patterns, noise, A_e/T_sys and G/T are those of the remaining array, not a
 * zero weight on the array factor. Network theory: D. M. Pozar, *Microwave Engineering*, 4th
 * ed., Wiley, 2012, Sect. 4.2 (from memory). Conventions: docs/conventions.md.
 * @param prepared - The prepared design.
 * @param ports - The complete array's ports at the frequency ({@link designPortsAt}).
 * @returns The working ports (with `keptPorts` and `failedPorts`, port indices: both ports of a failed crossed pair fail), or `ports` itself without failures.
 * @throws {@link DesignError} naming `imperfections.failures` if the terminated network cannot be formed.
 * @category Design
 */
export function designLivePorts(prepared: PreparedDesign, ports: ArrayPortSource): DesignLivePorts {
  const failed = prepared.failedElements, spec = prepared.design.imperfections?.failures;
  if (failed === undefined || spec === undefined || failed.length === 0) return ports;
  // every port of a failed element fails (both ports of a crossed pair)
  const ppe = prepared.portsPerElement;
  const failedPorts = ppe === 1 ? failed : Int32Array.from({ length: failed.length * ppe }, (_, i) => failed[Math.floor(i / ppe)] * ppe + (i % ppe));
  // a pattern source in gives a pattern source out
  return wrapField(prepared.fileName, 'imperfections.failures', () => failedArrayPorts(ports, failedPorts, designFailureTermination(spec)) as DesignLivePorts);
}

/**
 * The ports a design's beamformer uses: an {@link ArrayPortSource}, with the index maps of
 * {@link FailedArrayPorts} when elements failed.
 * @category Design
 */
export type DesignLivePorts = ArrayPortSource & Partial<Pick<FailedArrayPorts, 'keptPorts' | 'failedPorts'>>;

/**
 * The taper amplitude of every (working) port: its element's amplitude (both ports of a crossed
 * pair share it; a dead element's amplitude is simply missing). @internal
 */
export function designPortTaper(p: PreparedDesign, kept?: Int32Array): Float64Array | undefined {
  const t = p.taper;
  if (!t) return undefined;
  const ppe = p.portsPerElement;
  if (!kept && ppe === 1) return t;
  const ports = kept ?? Int32Array.from({ length: t.length * ppe }, (_, i) => i);
  return Float64Array.from(ports, (i) => t[Math.floor(i / ppe)]);
}
