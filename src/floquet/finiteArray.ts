/**
 * Active impedance and active reflection coefficient of the elements of a finite array from its
 * impedance matrix and excitation.
 * @module
 */
import { Complex } from 'complex.js';
import { DomainError } from '../errors.js';
import { assertColumn, assertFiniteCMatrix, assertSquare } from '../internal/validate.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { zeros } from '../linalg/cmatrix.js';
import { multiply, transpose } from '../linalg/ops.js';
import { createMultiport } from '../network/multiport.js';
import { activeReflection } from '../network/sources.js';

/** Validates and converts a reference impedance. @internal */
export function toReferenceImpedance(z0: number | Complex): Complex {
  const z = typeof z0 === 'number' ? new Complex(z0, 0) : new Complex(z0);
  if (!Number.isFinite(z.re) || !Number.isFinite(z.im) || !(z.re > 0)) {
    throw new DomainError(`invalid argument "referenceImpedanceOhm": expected a finite impedance with positive real part [Ω], received ${z.toString()}; use e.g. 50.`);
  }
  return z;
}

/** Γ = (Z − Z₀*)/(Z + Z₀) (Kurokawa power waves). @internal */
export function reflectionFromImpedance(z: Complex, z0: Complex): Complex {
  if (!Number.isFinite(z.re) || !Number.isFinite(z.im)) return new Complex(1, 0);
  return z.sub(z0.conjugate()).div(z.add(z0));
}

/**
 * Active impedance of every element of a finite array: Z_a,n = (Z I)ₙ / Iₙ.
 *
 * @remarks
 * V = Z I with currents into the ports (multiport convention, docs/conventions.md). For a scanned transmit
 * excitation use Iₙ = exp(−j k r̂₀·rₙ), the conjugate of the receive weights wₙ = exp(+j k r̂₀·rₙ).
 * Reference: R. C. Hansen, *Phased Array Antennas*, 2nd ed., Wiley, 2009, ch. 7 (scan impedance; from memory).
 * @param z - Open-circuit impedance matrix, N×N [Ω].
 * @param currents - Port currents, N×1 [A] (any common scale); every entry non-zero.
 * @returns Active impedances, N×1 [Ω].
 * @throws {@link DimensionError} for mismatched shapes; {@link DomainError} for non-finite entries or a zero current.
 * @category Floquet
 */
export function finiteArrayActiveImpedances(z: CMatrix, currents: CMatrix): CMatrix {
  assertSquare('z', z);
  assertColumn('currents', currents, z.rows, 'one current per port of "z"');
  assertFiniteCMatrix('z', z);
  assertFiniteCMatrix('currents', currents);
  const v = multiply(z, currents);
  const out = zeros(z.rows, 1);
  for (let n = 0; n < z.rows; n++) {
    const ir = currents.data[2 * n], ii = currents.data[2 * n + 1];
    const den = ir * ir + ii * ii;
    if (!(den > 0)) {
      throw new DomainError(`invalid argument "currents": entry ${n} is zero; the active impedance of an undriven port is undefined (use a non-zero excitation).`);
    }
    const vr = v.data[2 * n], vi = v.data[2 * n + 1];
    out.data[2 * n] = (vr * ir + vi * ii) / den;
    out.data[2 * n + 1] = (vi * ir - vr * ii) / den;
  }
  return out;
}

/**
 * Active reflection coefficient of every element of a finite array: Γₙ = (Z_a,n − Z₀*)/(Z_a,n + Z₀).
 *
 * @deprecated Use the network module's one active-reflection function,
 * `activeReflection(net, { kind: 'portCurrents', currents })`, with the impedance matrix as a
 * multiport (`createMultiport('impedance', [f], [z], { referenceOhm })`); this alias calls it and
 * stays for one minor version.
 * @remarks
 * Power waves with reference impedance Z₀ (Kurokawa 1965, default 50 Ω, docs/conventions.md).
 * @param z - Open-circuit impedance matrix, N×N [Ω].
 * @param currents - Port currents, N×1 [A].
 * @param referenceImpedanceOhm - Reference impedance Z₀ [Ω], Re Z₀ > 0; default 50.
 * @returns Active reflection coefficients, N×1 (dimensionless).
 * @throws As {@link finiteArrayActiveImpedances}; {@link DomainError} if Re Z₀ ≤ 0.
 * @category Floquet
 */
export function finiteArrayActiveReflections(z: CMatrix, currents: CMatrix, referenceImpedanceOhm: number | Complex = 50): CMatrix {
  const z0 = toReferenceImpedance(referenceImpedanceOhm);
  assertSquare('z', z);
  assertColumn('currents', currents, z.rows, 'one current per port of "z"');
  finiteArrayActiveImpedances(z, currents); // same validation and messages as before
  const net = createMultiport('impedance', [0], [z], { referenceOhm: { re: z0.re, im: z0.im } });
  return transpose(activeReflection(net, { kind: 'portCurrents', currents }));
}
