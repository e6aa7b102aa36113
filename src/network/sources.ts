/**
 * Multiports with internal sources: Thevenin and Norton equivalents, load
 * voltages, currents and powers, available power, mismatch factor and the
 * active reflection coefficient.
 *
 * Conventions: RMS phasors (P = Re{V I*}), currents into the ports.
 * Thevenin form V = Z I + v_oc; Norton form I = Y V − i_sc with Y = Z⁻¹ and
 * i_sc = Y v_oc the currents the network drives into short circuits.
 * @module
 */
import { DimensionError, DomainError, NotPositiveDefiniteError } from '../errors.js';
import { type CMatrix, type ComplexLike, complexParts } from '../linalg/cmatrix.js';
import { add, hermitianPart, multiply } from '../linalg/ops.js';
import { inverse, solve } from '../linalg/lu.js';
import { choleskyFactor, choleskySolve } from '../linalg/cholesky.js';
import { assertColumn, assertFiniteCMatrix, assertSquare } from '../internal/validate.js';
import { gemmKernel } from '../internal/gemm.js';
import { scatteringStack } from './convert.js';
import { type Multiport, assertMultiport } from './multiport.js';

/**
 * A Norton equivalent: I = Y V − i_sc.
 * @category Network
 */
export interface NortonEquivalent {
  /** Admittance matrix Y [S], N×N. */
  readonly admittanceS: CMatrix;
  /** Short-circuit currents i_sc [A RMS], N×1: the currents driven out of the ports into shorts. */
  readonly shortCircuitCurrentA: CMatrix;
}

/**
 * A Thevenin equivalent: V = Z I + v_oc.
 * @category Network
 */
export interface TheveninEquivalent {
  /** Impedance matrix Z [Ω], N×N. */
  readonly impedanceOhm: CMatrix;
  /** Open-circuit voltages v_oc [V RMS], N×1. */
  readonly openCircuitVoltageV: CMatrix;
}

function checkThevenin(z: CMatrix, v: CMatrix): void {
  assertSquare('impedanceOhm', z);
  assertFiniteCMatrix('impedanceOhm', z);
  assertColumn('openCircuitVoltageV', v, z.rows, 'one voltage per port');
  assertFiniteCMatrix('openCircuitVoltageV', v);
}

/**
 * Norton equivalent of a Thevenin equivalent: Y = Z⁻¹, i_sc = Y v_oc.
 * @param thevenin - Z [Ω] (N×N) and v_oc [V] (N×1).
 * @returns Y [S] and i_sc [A].
 * @throws {@link SingularMatrixError} if Z is singular; {@link DimensionError} on shapes.
 * @category Network
 */
export function nortonFromThevenin(thevenin: TheveninEquivalent): NortonEquivalent {
  checkThevenin(thevenin.impedanceOhm, thevenin.openCircuitVoltageV);
  const y = inverse(thevenin.impedanceOhm);
  return { admittanceS: y, shortCircuitCurrentA: multiply(y, thevenin.openCircuitVoltageV) };
}

/**
 * Thevenin equivalent of a Norton equivalent: Z = Y⁻¹, v_oc = Z i_sc.
 * @param norton - Y [S] (N×N) and i_sc [A] (N×1).
 * @returns Z [Ω] and v_oc [V].
 * @throws {@link SingularMatrixError} if Y is singular; {@link DimensionError} on shapes.
 * @category Network
 */
export function theveninFromNorton(norton: NortonEquivalent): TheveninEquivalent {
  assertSquare('admittanceS', norton.admittanceS);
  assertFiniteCMatrix('admittanceS', norton.admittanceS);
  assertColumn('shortCircuitCurrentA', norton.shortCircuitCurrentA, norton.admittanceS.rows, 'one current per port');
  const z = inverse(norton.admittanceS);
  return { impedanceOhm: z, openCircuitVoltageV: multiply(z, norton.shortCircuitCurrentA) };
}

/**
 * Result of {@link loadResponse}.
 * @category Network
 */
export interface LoadResponseResult {
  /** Port voltages [V RMS], N×1. */
  readonly voltageV: CMatrix;
  /** Currents flowing out of the network into the load at each port [A RMS], N×1 (= −I). */
  readonly loadCurrentA: CMatrix;
  /** Power delivered into the load at each port, Re{Vₙ i_Lₙ*} [W]. */
  readonly portPowerW: Float64Array;
  /** Total power delivered to the load [W]. */
  readonly totalPowerW: number;
  /** Available power of the sources, ¼ v_ocᴴ (Re Z)⁻¹ v_oc [W]. */
  readonly availablePowerW: number;
  /** Mismatch factor totalPowerW / availablePowerW, in [0, 1] for passive Z. */
  readonly mismatchFactor: number;
}

/**
 * Voltages, currents and powers of a Thevenin source network closed by a load matrix.
 *
 * @remarks
 * The load obeys V = Z_L i_L with i_L = −I, so i_L = (Z + Z_L)⁻¹ v_oc and V = Z_L i_L.
 * The available power is the maximum of the delivered power over all loads, reached at
 * Z_L = Zᴴ: P_av = ¼ v_ocᴴ R⁻¹ v_oc with R = (Z + Zᴴ)/2 (requires R positive definite).
 * Source: H. A. Haus and R. B. Adler, *Circuit Theory of Linear Noisy Networks*, Wiley,
 * 1959, ch. 3 (from memory); one-port case: P_av = |v_oc|²/(4 Re Z).
 * @param thevenin - Z [Ω] (N×N) and v_oc [V RMS] (N×1).
 * @param loadOhm - Load impedance matrix Z_L [Ω], N×N (diagonal for separate port loads).
 * @returns Voltages, load currents, powers, available power and the mismatch factor.
 * @throws {@link DimensionError} on shapes; {@link SingularMatrixError} if Z + Z_L is singular;
 *   {@link NotPositiveDefiniteError} if Re Z is not positive definite (no available power).
 * @category Network
 */
export function loadResponse(thevenin: TheveninEquivalent, loadOhm: CMatrix): LoadResponseResult {
  const z = thevenin.impedanceOhm, v = thevenin.openCircuitVoltageV;
  checkThevenin(z, v);
  assertSquare('loadOhm', loadOhm);
  assertFiniteCMatrix('loadOhm', loadOhm);
  if (loadOhm.rows !== z.rows) {
    throw new DimensionError(`invalid argument "loadOhm": expected ${z.rows}×${z.rows} (one row and column per port of "impedanceOhm"), received ${loadOhm.rows}×${loadOhm.cols}.`);
  }
  const iL = solve(add(z, loadOhm), v);
  const vv = multiply(loadOhm, iL);
  const n = z.rows;
  const portPowerW = new Float64Array(n);
  let total = 0;
  for (let i = 0; i < n; i++) {
    const p = vv.data[2 * i] * iL.data[2 * i] + vv.data[2 * i + 1] * iL.data[2 * i + 1];
    portPowerW[i] = p;
    total += p;
  }
  const pav = availablePower(thevenin);
  return { voltageV: vv, loadCurrentA: iL, portPowerW, totalPowerW: total, availablePowerW: pav, mismatchFactor: total / pav };
}

/**
 * Available power of an N-port Thevenin source: ¼ v_ocᴴ (Re Z)⁻¹ v_oc.
 * @param thevenin - Z [Ω] and v_oc [V RMS].
 * @returns Available power [W].
 * @throws {@link NotPositiveDefiniteError} if (Z + Zᴴ)/2 is not positive definite.
 * @category Network
 */
export function availablePower(thevenin: TheveninEquivalent): number {
  const z = thevenin.impedanceOhm, v = thevenin.openCircuitVoltageV;
  checkThevenin(z, v);
  const r = hermitianPart(z);
  const f = choleskyFactor(r);
  if (!f.positiveDefinite) {
    throw new NotPositiveDefiniteError(`invalid argument "impedanceOhm": its Hermitian part (Z + Zᴴ)/2 is not positive definite (pivot ${f.failedPivot}), so the source has no finite available power.`, f.failedPivot);
  }
  const x = choleskySolve(f, v);
  let p = 0;
  for (let i = 0; i < z.rows; i++) p += v.data[2 * i] * x.data[2 * i] + v.data[2 * i + 1] * x.data[2 * i + 1];
  return p / 4;
}

/**
 * Mismatch factor between a source impedance and a load impedance: 4 R_s R_L / |Z_s + Z_L|².
 *
 * @remarks
 * The fraction of the source's available power delivered to the load (1 at Z_L = Z_s*).
 * Source: D. M. Pozar, *Microwave Engineering*, 4th ed., 2012, §2.8 (from memory).
 * @param sourceOhm - Source impedance [Ω], real part > 0.
 * @param loadOhm - Load impedance [Ω], real part ≥ 0.
 * @returns Mismatch factor, dimensionless, in [0, 1].
 * @throws {@link DomainError} on Re Z_s ≤ 0, Re Z_L < 0 or non-finite values.
 * @category Network
 */
export function mismatchFactor(sourceOhm: ComplexLike, loadOhm: ComplexLike): number {
  const [rs, xs] = complexParts('sourceOhm', sourceOhm);
  const [rl, xl] = complexParts('loadOhm', loadOhm);
  if (!(rs > 0)) throw new DomainError(`invalid argument "sourceOhm": expected a real part > 0 [Ω], received ${rs}.`);
  if (!(rl >= 0)) throw new DomainError(`invalid argument "loadOhm": expected a real part ≥ 0 [Ω], received ${rl}.`);
  return (4 * rs * rl) / ((rs + rl) ** 2 + (xs + xl) ** 2);
}

/**
 * Active reflection coefficient of every port for one or many fixed excitations: Γₙ = (S a)ₙ / aₙ.
 *
 * @remarks
 * S is the network's scattering matrix with its own references and wave definition; each
 * column of `incidentWaves` is one vector of incident waves a (the same at every frequency).
 * The reflection a port sees while all ports are driven (scan reflection of an array).
 * The conversion to S is done once per call and the excitations are applied with one matrix
 * product S·A per frequency, so pass every scan excitation in one call (K columns) rather than
 * calling once per beam. Source: D. M. Pozar, "The active element pattern", IEEE Trans. AP
 * 42(8), 1994 (from memory).
 * @param net - The network.
 * @param incidentWaves - Incident waves, N×K [√W] (one excitation per column), every entry ≠ 0.
 * @returns Γ, (F·K)×N CMatrix, dimensionless: row f·K + k holds frequency index f, excitation k
 *   (for one excitation, row f is frequency f).
 * @throws {@link DimensionError} on a wrong number of rows; {@link DomainError} if some aₙ = 0.
 * @example
 * ```ts
 * // two scan excitations of a 2-port at one frequency in one call: rows = frequencies × excitations
 * const net = createMultiport('scattering', [1e9], [fromRows([[0.1, 0.2], [0.2, 0.1]])]);
 * activeReflection(net, fromRows([[1, 1], [1, -1]])).rows; // 2
 * ```
 * @category Network
 */
export function activeReflection(net: Multiport, incidentWaves: CMatrix): CMatrix {
  assertMultiport('net', net);
  const n = net.ports;
  assertFiniteCMatrix('incidentWaves', incidentWaves);
  if (incidentWaves.rows !== n || incidentWaves.cols < 1) {
    throw new DimensionError(`invalid argument "incidentWaves": expected ${n}×K (one incident wave per port, one column per excitation), received ${incidentWaves.rows}×${incidentWaves.cols}.`);
  }
  const kx = incidentWaves.cols;
  const a = incidentWaves.data;
  for (let i = 0; i < n * kx; i++) {
    if (a[2 * i] === 0 && a[2 * i + 1] === 0) {
      throw new DomainError(`invalid argument "incidentWaves": entry (${Math.floor(i / kx)}, ${i % kx}) is 0, so the active reflection of port ${Math.floor(i / kx)} is undefined; excite every port.`);
    }
  }
  const s = scatteringStack(net);
  const nf = net.frequencyHz.length;
  const out = new Float64Array(2 * nf * kx * n);
  const sa = new Float64Array(2 * n * kx);
  for (let f = 0; f < nf; f++) {
    gemmKernel(n, kx, n, s, f * n * n, n, a, 0, kx, sa, 0, kx, false);
    for (let i = 0; i < n; i++) {
      for (let k = 0; k < kx; k++) {
        const q = 2 * (i * kx + k), re = sa[q], im = sa[q + 1];
        const ar = a[q], ai = a[q + 1], m = ar * ar + ai * ai;
        const o = 2 * ((f * kx + k) * n + i);
        out[o] = (re * ar + im * ai) / m;
        out[o + 1] = (im * ar - re * ai) / m;
      }
    }
  }
  return { rows: nf * kx, cols: n, data: out };
}
