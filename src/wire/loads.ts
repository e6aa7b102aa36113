/**
 * Impedance of a lumped wire load at one frequency.
 * @module
 */
import { DomainError } from '../errors.js';
import { complexParts } from '../linalg/cmatrix.js';
import { assertNonNegative, assertPositive, describeValue } from '../internal/validate.js';
import type { WireLoad } from './types.js';

/**
 * Impedance [Ω] of a lumped load at one frequency.
 *
 * @remarks
 * Series: Z = R + jωL + 1/(jωC); parallel: 1/Z = 1/R + 1/(jωL) + jωC, each term
 * present only when its value is given (time dependence e^{+jωt},
 * docs/conventions.md). A given `impedanceOhm` (fixed or a function of
 * frequency) is used as is and must have a real part ≥ 0 (passive).
 * @param load - The load.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param name - Argument name for messages.
 * @returns [Re Z, Im Z] [Ω].
 * @throws {@link DomainError} for negative or missing values, a mix of R/L/C with `impedanceOhm`, or an active impedance.
 * @example
 * ```ts
 * wireLoadImpedance({ wire: 0, resistanceOhm: 50, inductanceH: 1e-9 }, 1e9); // [50, 6.283…]
 * ```
 * @category Wire
 */
export function wireLoadImpedance(load: WireLoad, frequencyHz: number, name = 'load'): [number, number] {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (load === null || typeof load !== 'object') throw new DomainError(`invalid argument "${name}": expected a WireLoad, received ${describeValue(load)}.`);
  const w = 2 * Math.PI * frequencyHz;
  const { resistanceOhm: r, inductanceH: l, capacitanceF: c } = load;
  const rlc = r !== undefined || l !== undefined || c !== undefined;
  if (load.impedanceOhm !== undefined) {
    if (rlc) throw new DomainError(`invalid argument "${name}": give either impedanceOhm or resistanceOhm/inductanceH/capacitanceF, not both.`);
    const v = typeof load.impedanceOhm === 'function' ? load.impedanceOhm(frequencyHz) : load.impedanceOhm;
    const z = complexParts(`${name}.impedanceOhm`, v);
    if (z[0] < 0) throw new DomainError(`invalid argument "${name}.impedanceOhm": expected a passive load (real part ≥ 0) [Ω], received ${z[0]} + ${z[1]}j at ${frequencyHz} Hz.`);
    return z;
  }
  if (!rlc) throw new DomainError(`invalid argument "${name}": expected at least one of resistanceOhm, inductanceH, capacitanceF or impedanceOhm.`);
  const connection = load.connection ?? 'series';
  if (connection === 'series') {
    if (r !== undefined) assertNonNegative(`${name}.resistanceOhm`, r, 'Ω');
    if (l !== undefined) assertNonNegative(`${name}.inductanceH`, l, 'H');
    if (c !== undefined) assertPositive(`${name}.capacitanceF`, c, 'F');
    return [r ?? 0, (l ?? 0) * w - (c === undefined ? 0 : 1 / (w * c))];
  }
  if (connection !== 'parallel') throw new DomainError(`invalid argument "${name}.connection": expected 'series' or 'parallel', received ${describeValue(connection)}.`);
  if (r !== undefined) assertPositive(`${name}.resistanceOhm`, r, 'Ω');
  if (l !== undefined) assertPositive(`${name}.inductanceH`, l, 'H');
  if (c !== undefined) assertNonNegative(`${name}.capacitanceF`, c, 'F');
  const gr = r === undefined ? 0 : 1 / r;
  const bi = (c ?? 0) * w - (l === undefined ? 0 : 1 / (w * l));
  const den = gr * gr + bi * bi;
  if (den === 0) throw new DomainError(`invalid argument "${name}": the parallel load is an open circuit at ${frequencyHz} Hz (its admittance is 0); remove it instead.`);
  return [gr / den, -bi / den];
}
