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
import { DimensionError, DomainError, NotPositiveDefiniteError, SingularMatrixError } from '../errors.js';
import { type CMatrix, type ComplexLike, complexParts, zeros, matrixView } from '../linalg/cmatrix.js';
import { add, hermitianPart, multiply, pick, subtract } from '../linalg/ops.js';
import { inverse, solve } from '../linalg/lu.js';
import { choleskyFactor, choleskySolve } from '../linalg/cholesky.js';
import { assertColumn, assertFiniteCMatrix, assertSquare } from '../internal/validate.js';
import { gemmKernel } from '../internal/gemm.js';
import { convertMultiport, scatteringStack } from './convert.js';
import { type Multiport, assertMultiport } from './multiport.js';
import type { PortLoad } from './connect.js';
import { checkPortList } from './ports.js';

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
  /**
   * Available power of the sources, ¼ v_ocᴴ (Re Z)⁻¹ v_oc [W]; absent when (Z + Zᴴ)/2 is not
   * positive definite (a lossless or active source has no finite available power).
   */
  readonly availablePowerW?: number;
  /** Mismatch factor totalPowerW / availablePowerW, in [0, 1] for passive Z; absent with `availablePowerW`. */
  readonly mismatchFactor?: number;
}

/** One port's load for a single-frequency source network: its impedance, or open (no current). */
interface ParsedLoad { open: boolean; re: number; im: number }

function parseLoads(name: string, loads: ReadonlyArray<PortLoad>, count: number, what: string): ParsedLoad[] {
  if (!Array.isArray(loads) || loads.length !== count) {
    throw new DimensionError(`invalid argument "${name}": expected ${count} loads (${what}), received ${Array.isArray(loads) ? loads.length : typeof loads}.`);
  }
  return loads.map((load: PortLoad, i): ParsedLoad => {
    if (load === 'open') return { open: true, re: 0, im: 0 };
    if (load === 'short') return { open: false, re: 0, im: 0 };
    if (Array.isArray(load)) {
      if (load.length !== 1) {
        throw new DimensionError(`invalid argument "${name}[${i}]": a Thevenin equivalent holds one frequency, so a per-frequency load needs exactly 1 value, received ${load.length}.`);
      }
      const [re, im] = complexParts(`${name}[${i}][0]`, load[0]);
      return { open: false, re, im };
    }
    const [re, im] = complexParts(`${name}[${i}]`, load as ComplexLike);
    return { open: false, re, im };
  });
}

/** Diagonal matrix of the listed loads' impedances. */
function loadDiagonal(loads: ReadonlyArray<ParsedLoad>): CMatrix {
  const m = zeros(loads.length);
  loads.forEach((l, i) => { m.data[2 * (i * loads.length + i)] = l.re; m.data[2 * (i * loads.length + i) + 1] = l.im; });
  return m;
}

/** The available power, or undefined when Re Z is not positive definite. */
function availablePowerIfFinite(z: CMatrix, v: CMatrix): number | undefined {
  const f = choleskyFactor(hermitianPart(z));
  if (!f.positiveDefinite) return undefined;
  const x = choleskySolve(f, v);
  let p = 0;
  for (let i = 0; i < z.rows; i++) p += v.data[2 * i] * x.data[2 * i] + v.data[2 * i + 1] * x.data[2 * i + 1];
  return p / 4;
}

/**
 * Voltages, currents and powers of a Thevenin source network closed by loads.
 *
 * @remarks
 * The loads are either one {@link PortLoad} per port (the type {@link terminatePorts} takes:
 * an impedance, `'open'` or `'short'`; a per-frequency list must hold one value) or a coupled
 * load impedance matrix Z_L (N×N). A load obeys V = Z_L i_L with i_L = −I, so on the ports
 * that are not open i_L = (Z + Z_L)⁻¹ v_oc (restricted to them) and V = Z_L i_L; an open port
 * carries no current and shows V = v_oc − Z i_L there.
 * The available power is the maximum of the delivered power over all loads, reached at
 * Z_L = Zᴴ: P_av = ¼ v_ocᴴ R⁻¹ v_oc with R = (Z + Zᴴ)/2; when R is not positive definite
 * (a lossless source) it and the mismatch factor are left out and the voltages, currents and
 * powers are still returned.
 * Source: H. A. Haus and R. B. Adler, *Circuit Theory of Linear Noisy Networks*, Wiley,
 * 1959, ch. 3 (from memory); one-port case: P_av = |v_oc|²/(4 Re Z).
 * Conventions: docs/conventions.md (RMS phasors, currents into the ports).
 * @param thevenin - Z [Ω] (N×N) and v_oc [V RMS] (N×1).
 * @param loads - One {@link PortLoad} per port [Ω], or a load impedance matrix Z_L [Ω], N×N.
 * @returns Voltages, load currents, powers, and (for Re Z positive definite) the available power and mismatch factor.
 * @throws {@link DimensionError} on shapes; {@link DomainError} on a bad load;
 *   {@link SingularMatrixError} if Z + Z_L (on the ports not open) is singular.
 * @example
 * ```ts
 * // a lossless 1-port source, v_oc = 1 V, j50 Ω, into 50 Ω: |V| = 1/√2
 * const r = loadResponse({ impedanceOhm: fromRows([[{ re: 0, im: 50 }]]), openCircuitVoltageV: columnVector([1]) }, [50]);
 * Math.hypot(r.voltageV.data[0], r.voltageV.data[1]); // ≈ 0.707107
 * 'availablePowerW' in r; // false (a lossless source has no finite available power)
 * ```
 * @category Network
 */
export function loadResponse(thevenin: TheveninEquivalent, loads: CMatrix | ReadonlyArray<PortLoad>): LoadResponseResult {
  const z = thevenin.impedanceOhm, v = thevenin.openCircuitVoltageV;
  checkThevenin(z, v);
  const n = z.rows;
  let active: number[];
  let zl: CMatrix;
  if (Array.isArray(loads)) {
    const parsed = parseLoads('loads', loads, n, 'one per port of "impedanceOhm"');
    active = parsed.flatMap((l, i) => (l.open ? [] : [i]));
    zl = loadDiagonal(active.map((i) => parsed[i]));
  } else {
    const m = loads as CMatrix;
    assertSquare('loads', m);
    assertFiniteCMatrix('loads', m);
    if (m.rows !== n) {
      throw new DimensionError(`invalid argument "loads": expected ${n}×${n} (one row and column per port of "impedanceOhm"), received ${m.rows}×${m.cols}.`);
    }
    active = Array.from({ length: n }, (_, i) => i);
    zl = m;
  }
  const all = Array.from({ length: n }, (_, i) => i);
  const iA = active.length > 0 ? solve(add(pick(z, active, active), zl), pick(v, active, [0])) : zeros(0, 1);
  const vA = active.length > 0 ? multiply(zl, iA) : zeros(0, 1);
  // All port voltages: V = v_oc − Z_{·A} i_A (I = −i_L, no current at open ports).
  const vv = active.length > 0 ? subtract(v, multiply(pick(z, all, active), iA)) : zeros(n, 1);
  if (active.length === 0) vv.data.set(v.data);
  const iL = zeros(n, 1);
  active.forEach((p, k) => {
    iL.data[2 * p] = iA.data[2 * k]; iL.data[2 * p + 1] = iA.data[2 * k + 1];
    vv.data[2 * p] = vA.data[2 * k]; vv.data[2 * p + 1] = vA.data[2 * k + 1];
  });
  const portPowerW = new Float64Array(n);
  let total = 0;
  for (let i = 0; i < n; i++) {
    const p = vv.data[2 * i] * iL.data[2 * i] + vv.data[2 * i + 1] * iL.data[2 * i + 1];
    portPowerW[i] = p;
    total += p;
  }
  const pav = availablePowerIfFinite(z, v);
  return pav === undefined
    ? { voltageV: vv, loadCurrentA: iL, portPowerW, totalPowerW: total }
    : { voltageV: vv, loadCurrentA: iL, portPowerW, totalPowerW: total, availablePowerW: pav, mismatchFactor: total / pav };
}

/**
 * Thevenin and Norton equivalents at the remaining ports of a source network when some ports
 * are closed by loads: what element p delivers with its neighbours terminated.
 * @category Network
 */
export interface TerminatedSourceEquivalent extends TheveninEquivalent {
  /** Indices of the remaining ports in the original network, ascending; row i of the result is port `ports[i]`. */
  readonly ports: readonly number[];
  /** The Norton dual Y = Z_th⁻¹, i_sc = Y v_th; absent when Z_th is singular. */
  readonly norton?: NortonEquivalent;
}

/**
 * Closes some ports of a Thevenin source network with loads and returns the Thevenin (and
 * Norton) equivalent at the others.
 *
 * @remarks
 * Partition the ports into kept K and loaded L (open loads drop out: they carry no current).
 * With the loads Z_L (diagonal) on L, V_L = −Z_L I_L, elimination of I_L gives
 * Z_th = Z_KK − Z_KL (Z_LL + Z_L)⁻¹ Z_LK and v_th = v_K − Z_KL (Z_LL + Z_L)⁻¹ v_L: the
 * Schur complement, i.e. Thevenin's theorem applied to the loaded multiport (e.g.
 * C. A. Desoer and E. S. Kuh, *Basic Circuit Theory*, McGraw-Hill, 1969, ch. 16, from memory).
 * Z_th is what {@link terminatePorts} gives in scattering form for the same loads; this
 * function also carries the sources through. Loads are the {@link PortLoad} of
 * {@link terminatePorts}. Conventions: docs/conventions.md (RMS, currents into the ports).
 * @param thevenin - Z [Ω] (N×N) and v_oc [V RMS] (N×1).
 * @param ports - Zero-based indices of the ports to close (distinct), at least one port must remain.
 * @param loads - One {@link PortLoad} per listed port [Ω].
 * @returns Z_th [Ω] and v_th [V RMS] at the remaining ports, their indices, and the Norton dual.
 * @throws {@link DimensionError} on shapes or if no port remains; {@link DomainError} on bad
 *   indices or loads; {@link SingularMatrixError} if Z_LL + Z_L is singular.
 * @example
 * ```ts
 * // two coupled ports with sources; port 1 closed by 50 Ω:
 * const t = { impedanceOhm: fromRows([[{ re: 73, im: 42.5 }, { re: -12.5, im: -29.9 }], [{ re: -12.5, im: -29.9 }, { re: 73, im: 42.5 }]]),
 *   openCircuitVoltageV: columnVector([1, 1]) };
 * const e = terminateSourcePorts(t, [1], [50]);
 * e.ports; // [0]
 * e.openCircuitVoltageV; // ≈ [1.1658 + 0.1858j] V (v₀ − Z₀₁ v₁/(Z₁₁ + 50))
 * e.impedanceOhm; // ≈ [76.482 + 35.219j] Ω (Z₀₀ − Z₀₁²/(Z₁₁ + 50))
 * ```
 * @category Network
 */
export function terminateSourcePorts(thevenin: TheveninEquivalent, ports: ReadonlyArray<number>, loads: ReadonlyArray<PortLoad>): TerminatedSourceEquivalent {
  const z = thevenin.impedanceOhm, v = thevenin.openCircuitVoltageV;
  checkThevenin(z, v);
  const n = z.rows;
  const closed = checkPortList('ports', ports, n);
  const parsed = parseLoads('loads', loads, closed.length, 'one per listed port');
  const kept = Array.from({ length: n }, (_, i) => i).filter((i) => !closed.includes(i));
  if (kept.length === 0) throw new DimensionError(`invalid argument "ports": closing all ${n} ports leaves no port for an equivalent; keep at least one.`);
  const l = closed.filter((_, k) => !parsed[k].open);
  const zl = loadDiagonal(parsed.filter((p) => !p.open));
  let zth = pick(z, kept, kept), vth = pick(v, kept, [0]);
  if (l.length > 0) {
    const a = add(pick(z, l, l), zl);
    const x = solve(a, pick(z, l, kept));
    const y = solve(a, pick(v, l, [0]));
    const zkl = pick(z, kept, l);
    zth = subtract(zth, multiply(zkl, x));
    vth = subtract(vth, multiply(zkl, y));
  }
  let norton: NortonEquivalent | undefined;
  try {
    norton = nortonFromThevenin({ impedanceOhm: zth, openCircuitVoltageV: vth });
  } catch (e) {
    if (!(e instanceof SingularMatrixError)) throw e;
  }
  return norton ? { impedanceOhm: zth, openCircuitVoltageV: vth, ports: kept, norton } : { impedanceOhm: zth, openCircuitVoltageV: vth, ports: kept };
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
 * How the ports of an array are driven, for {@link activeReflection}.
 * - `incidentWaves`: incident waves a (N×K, one excitation per column) in the network's own wave
 *   definition and references [√W].
 * - `portCurrents`: port currents I (N×K) [A], currents into the ports (multiport convention,
 *   docs/conventions.md); the voltages are V = Z I with the network's impedance matrix, and the
 *   waves follow from V and I by the network's wave definition (Kurokawa power waves or
 *   pseudo-waves). A scanned transmit excitation is Iₙ = exp(−j k r̂₀·rₙ).
 * @category Network
 */
export type PortExcitation = IncidentWaveExcitation | PortCurrentExcitation;

/**
 * Ports driven by incident waves (see {@link PortExcitation}).
 * @category Network
 */
export interface IncidentWaveExcitation {
  /** Tag of the excitation kind. */
  readonly kind: 'incidentWaves';
  /** Incident waves a, N×K [√W], in the network's wave definition and references; every entry ≠ 0. */
  readonly waves: CMatrix;
}

/**
 * Ports driven by port currents (see {@link PortExcitation}).
 * @category Network
 */
export interface PortCurrentExcitation {
  /** Tag of the excitation kind. */
  readonly kind: 'portCurrents';
  /** Port currents I, N×K [A], into the ports; every entry ≠ 0. */
  readonly currents: CMatrix;
}

/**
 * Active reflection coefficient of every port for one or many fixed excitations: Γₙ = bₙ/aₙ,
 * the reflection a port sees while all ports are driven (scan reflection of an array).
 *
 * @remarks
 * The one active-reflection function of the library. Driven by incident waves a, b = S a with
 * the network's scattering matrix (its own references and wave definition). Driven by port
 * currents I, V = Z I and a, b follow from V and I: power waves a = (V + Z_r I)/(2√Re Z_r),
 * b = (V − Z_r* I)/(2√Re Z_r) (K. Kurokawa, IEEE Trans. MTT 13(2), 1965), so that
 * Γ = (Z_a − Z_r*)/(Z_a + Z_r) with the active impedance Z_a = Vₙ/Iₙ; pseudo-waves
 * a, b = (√Re Z_r/(2|Z_r|))(V ± Z_r I) (R. B. Marks, D. F. Williams, J. Res. NIST 97(5),
 * 1992). The conversion of the network is done once per call and the excitations are applied
 * with one matrix product per frequency, so pass every scan excitation in one call (K columns).
 * Source of the quantity: D. M. Pozar, "The active element pattern", IEEE Trans. AP 42(8), 1994
 * (from memory).
 * @param net - The network.
 * @param excitation - A {@link PortExcitation}; a bare N×K matrix means incident waves (the
 *   form of earlier versions).
 * @returns Γ, (F·K)×N CMatrix, dimensionless: row f·K + k holds frequency index f, excitation k
 *   (for one excitation, row f is frequency f).
 * @throws {@link DimensionError} on a wrong number of rows; {@link DomainError} if some port is
 *   not driven (aₙ = 0, or Iₙ = 0 for currents).
 * @example
 * ```ts
 * // two scan excitations of a 2-port at one frequency in one call: rows = frequencies × excitations
 * const net = createMultiport('scattering', [1e9], [fromRows([[0.1, 0.2], [0.2, 0.1]])]);
 * activeReflection(net, { kind: 'incidentWaves', waves: fromRows([[1, 1], [1, -1]]) }).rows; // 2
 * ```
 * @category Network
 */
export function activeReflection(net: Multiport, excitation: PortExcitation | CMatrix): CMatrix {
  assertMultiport('net', net);
  const byCurrents = 'kind' in excitation && excitation.kind === 'portCurrents';
  const name = byCurrents ? 'excitation.currents' : 'kind' in excitation ? 'excitation.waves' : 'incidentWaves';
  const x = 'kind' in excitation ? (excitation.kind === 'portCurrents' ? excitation.currents : excitation.waves) : excitation;
  if ('kind' in excitation && excitation.kind !== 'portCurrents' && excitation.kind !== 'incidentWaves') {
    throw new DomainError(`invalid argument "excitation.kind": expected 'incidentWaves' or 'portCurrents', received ${String((excitation as { kind: unknown }).kind)}.`);
  }
  const n = net.ports;
  assertFiniteCMatrix(name, x);
  if (x.rows !== n || x.cols < 1) {
    throw new DimensionError(`invalid argument "${name}": expected ${n}×K (one value per port, one column per excitation), received ${x.rows}×${x.cols}.`);
  }
  const kx = x.cols;
  for (let i = 0; i < n * kx; i++) {
    if (x.data[2 * i] === 0 && x.data[2 * i + 1] === 0) {
      throw new DomainError(`invalid argument "${name}": entry (${Math.floor(i / kx)}, ${i % kx}) is 0, so the active reflection of port ${Math.floor(i / kx)} is undefined; drive every port.`);
    }
  }
  const m = byCurrents ? convertMultiport(net, 'impedance').data : scatteringStack(net);
  const nf = net.frequencyHz.length;
  const out = new Float64Array(2 * nf * kx * n);
  const mx = new Float64Array(2 * n * kx);
  const ref = net.referenceOhm, power = net.waves === 'power';
  for (let f = 0; f < nf; f++) {
    gemmKernel(n, kx, n, m, f * n * n, n, x.data, 0, kx, mx, 0, kx, false);
    for (let i = 0; i < n; i++) {
      const zr = ref[2 * i], zi = ref[2 * i + 1];
      for (let k = 0; k < kx; k++) {
        const q = 2 * (i * kx + k);
        let ar = x.data[q], ai = x.data[q + 1], br = mx[q], bi = mx[q + 1];
        if (byCurrents) {
          // mx holds V = Z I; b/a with a ∝ V + Z_r I and b ∝ V − Z_r* I (power) or V − Z_r I (pseudo); the scale cancels.
          const ir = ar, ii = ai, vr = br, vi = bi;
          ar = vr + zr * ir - zi * ii; ai = vi + zr * ii + zi * ir;
          const sgn = power ? -1 : 1;
          br = vr - zr * ir + sgn * zi * ii; bi = vi - zr * ii - sgn * zi * ir;
          if (ar === 0 && ai === 0) throw new DomainError(`port ${i}: no incident wave for excitation ${k} at frequency index ${f} (V = −Z_r I), so the active reflection is undefined.`);
        }
        const d = ar * ar + ai * ai;
        const o = 2 * ((f * kx + k) * n + i);
        out[o] = (br * ar + bi * ai) / d;
        out[o + 1] = (bi * ar - br * ai) / d;
      }
    }
  }
  return matrixView(nf * kx, n, out);
}
