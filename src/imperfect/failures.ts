/**
 * Failed elements carried through the coupled network: the remaining array's
 * ports with the failed ports terminated.
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix, ComplexLike } from '../linalg/cmatrix.js';
import { complexParts } from '../linalg/cmatrix.js';
import { pick } from '../linalg/ops.js';
import { solve } from '../linalg/lu.js';
import { assertInRange, assertInteger, assertSquare, describeValue } from '../internal/validate.js';
import { RandomStream } from '../internal/random.js';
import { createMultiport, multiportMatrix } from '../network/multiport.js';
import { convertMultiport } from '../network/convert.js';
import { terminatePorts } from '../network/connect.js';
import type { ArrayPorts } from '../reception/evaluate.js';
import type { PortPatternSource, SampledPortPatterns } from '../reception/patterns.js';

/**
 * How a failed element's port is terminated: left open (no current flows; e.g.
 * a broken feed), in a matched load (the reference resistance, e.g. a switched
 * termination), or in the input impedance of its (dead) amplifier.
 * @category Imperfect
 */
export type FailedPortTermination = OpenTermination | MatchedTermination | AmplifierInputTermination;

/**
 * A failed port left open (no current flows).
 * @category Imperfect
 */
export interface OpenTermination {
  /** Tag. */
  readonly kind: 'open';
}

/**
 * A failed port closed in a matched (reference) resistance.
 * @category Imperfect
 */
export interface MatchedTermination {
  /** Tag. */
  readonly kind: 'matched';
  /** Reference resistance [Ω], > 0. @defaultValue 50 */
  readonly referenceOhm?: number;
}

/**
 * A failed port closed in the input impedance of its dead amplifier.
 * @category Imperfect
 */
export interface AmplifierInputTermination {
  /** Tag. */
  readonly kind: 'amplifierInput';
  /** Input impedance of the failed amplifier [Ω]. */
  readonly impedanceOhm: ComplexLike;
}

/**
 * The remaining array after failures (an {@link ArrayPorts} of the working
 * ports) and which ports were kept and failed.
 * @category Imperfect
 */
export interface FailedArrayPorts extends ArrayPorts {
  /** Original indices of the working ports, ascending (row k of the new ports is port keptPorts[k]). */
  readonly keptPorts: Int32Array;
  /** Original indices of the failed ports, ascending. */
  readonly failedPorts: Int32Array;
}

/**
 * A seeded random choice of failed elements: round(fraction·N) distinct indices.
 *
 * @remarks
 * Partial Fisher–Yates shuffle (R. A. Fisher and F. Yates, *Statistical
 * Tables*, 1938; Durstenfeld's in-place form, Commun. ACM 7(7), 1964) driven
 * by the library's xoshiro128** stream, so the set is reproducible.
 * @param count - Number of elements N, ≥ 1.
 * @param fraction - Failed fraction, in [0, 1].
 * @param seed - Seed (integer ≥ 0).
 * @returns The failed indices, ascending.
 * @throws {@link DomainError} for bad arguments.
 * @example
 * ```ts
 * randomFailures(100, 0.03, 7).length; // 3
 * ```
 * @category Imperfect
 */
export function randomFailures(count: number, fraction: number, seed: number): Int32Array {
  assertInteger('count', count, 1, 2 ** 31 - 1);
  assertInRange('fraction', fraction, 0, 1);
  assertInteger('seed', seed, 0, Number.MAX_SAFE_INTEGER);
  const k = Math.round(fraction * count), idx = Int32Array.from({ length: count }, (_, i) => i);
  const rng = RandomStream.fromSeed(seed);
  for (let i = 0; i < k; i++) {
    const j = i + Math.floor(rng.nextFloat64() * (count - i));
    const t = idx[i]; idx[i] = idx[j]; idx[j] = t;
  }
  return idx.slice(0, k).sort();
}

/**
 * The ports of an array whose failed elements are terminated, for
 * {@link evaluateReceivingArray}: impedance matrix and embedded open-circuit
 * patterns of the working ports, the coupling through the failed elements
 * included.
 *
 * @remarks
 * Kept ports K, failed ports F terminated by Z_L (V_F = −Z_L I_F). Driving a
 * kept port k with I₀ (other kept ports open) makes the failed ports carry
 * I_F = −(Z_FF + Z_L)⁻¹ Z_Fk I₀, so the new embedded patterns (conventions,
 * "embedded pattern" convention, docs/conventions.md) are
 * f'_k = f_k − Σ_j [(Z_FF + Z_L)⁻¹ Z_FK]_{jk} f_{F_j}, and the new impedance matrix
 * is the Schur complement Z' = Z_KK − Z_KF (Z_FF + Z_L)⁻¹ Z_FK, computed by the
 * network module's {@link terminatePorts} (scattering form). An open
 * termination leaves Z' = Z_KK and f' = f_K (no current flows). The load's
 * noise enters through the evaluation's loss model: a resistive load appears
 * as loss at the array's physical temperature (`loss: 'fromPatterns'`), i.e.
 * the loads are taken to be at that temperature. Amplifier noise parameters
 * and weights of the evaluation must be given for the kept ports only. The
 * port geometry (which sizes the adaptive sphere rule) keeps the working
 * elements' positions for an open termination and every position otherwise
 * (a loaded failed element still radiates).
 * Network theory: e.g. D. M. Pozar, *Microwave Engineering*, 4th ed., Wiley,
 * 2012, Sect. 4.2 (impedance matrix with terminated ports).
 * @param ports - The complete array's ports (N ports).
 * @param failed - Indices of the failed ports (distinct, 0…N−1; at least one port must remain).
 * @param termination - How each failed port is terminated.
 * @returns The working ports, with the index maps.
 * @throws {@link DomainError} for bad indices or termination; {@link SingularMatrixError} if Z_FF + Z_L is singular.
 * @example
 * ```ts
 * const dips = [0, 1, 2].map((i) => ({ centerM: [i * 0.1, 0, 0] as const, axis: [0, 1, 0] as const, lengthM: 0.1, radiusM: 0.001 }));
 * const ports = dipoleArrayPorts(dips, 1.42e9);
 * failedArrayPorts(ports, [1], { kind: 'open' }).keptPorts; // Int32Array [0, 2]
 * ```
 * @category Imperfect
 */
export function failedArrayPorts(ports: ArrayPorts, failed: ArrayLike<number>, termination: FailedPortTermination): FailedArrayPorts {
  const z = ports?.impedanceOhm;
  assertSquare('ports.impedanceOhm', z);
  const n = z.rows;
  if (!failed || typeof failed.length !== 'number') throw new DomainError(`invalid argument "failed": expected a list of port indices, received ${describeValue(failed)}.`);
  const isFailed = new Uint8Array(n);
  for (let i = 0; i < failed.length; i++) {
    const p = failed[i];
    if (!Number.isInteger(p) || p < 0 || p >= n || isFailed[p]) {
      throw new DomainError(`invalid argument "failed": entry ${i} must be a distinct port index in 0…${n - 1}, received ${describeValue(p)}.`);
    }
    isFailed[p] = 1;
  }
  const keptPorts = Int32Array.from({ length: n }, (_, i) => i).filter((i) => !isFailed[i]);
  const failedPorts = Int32Array.from({ length: n }, (_, i) => i).filter((i) => isFailed[i] === 1);
  if (keptPorts.length === 0) throw new DomainError(`invalid argument "failed": every one of the ${n} ports failed; at least one must remain.`);
  let loadRe = 0, loadIm = 0;
  const kind = termination?.kind;
  if (kind === 'matched') {
    loadRe = termination.kind === 'matched' ? termination.referenceOhm ?? 50 : 50;
    if (!(loadRe > 0) || !Number.isFinite(loadRe)) throw new DomainError(`invalid argument "termination.referenceOhm": expected a resistance > 0 Ω, received ${describeValue(loadRe)}.`);
  } else if (kind === 'amplifierInput') {
    [loadRe, loadIm] = complexParts('termination.impedanceOhm', (termination as { impedanceOhm: ComplexLike }).impedanceOhm);
  } else if (kind !== 'open') {
    throw new DomainError(`invalid argument "termination": expected { kind: 'open' }, { kind: 'matched', referenceOhm? } or { kind: 'amplifierInput', impedanceOhm }, received ${describeValue(termination)}.`);
  }
  if (failedPorts.length === 0) return { ...ports, keptPorts, failedPorts };
  // impedance matrix of the kept ports through the network module
  const net = createMultiport('impedance', [1], [z]);
  const loads = Array.from(failedPorts, () => (kind === 'open' ? 'open' as const : { re: loadRe, im: loadIm }));
  const reduced = multiportMatrix(convertMultiport(terminatePorts(net, Array.from(failedPorts), loads), 'impedance'), 0);
  // failed-port currents per unit kept-port drive: A = (Z_FF + Z_L)⁻¹ Z_FK (|F|×|K|); none when open
  let a: CMatrix | undefined;
  if (kind !== 'open') {
    const zff = pick(z, failedPorts, failedPorts);
    for (let j = 0; j < failedPorts.length; j++) {
      zff.data[2 * (j * failedPorts.length + j)] += loadRe;
      zff.data[2 * (j * failedPorts.length + j) + 1] += loadIm;
    }
    a = solve(zff, pick(z, failedPorts, keptPorts));
  }
  const patterns = reducePatterns(ports.patterns, keptPorts, failedPorts, a);
  // Geometry sizes the sphere rule: open failed elements carry no current and drop out; loaded
  // ones still radiate (their currents are in the new patterns), so every position is kept.
  const g = kind === 'open' ? ports.geometry : undefined;
  const geometry = kind !== 'open' ? ports.geometry : g ? {
    ...g, positionsM: Float64Array.from({ length: 3 * keptPorts.length }, (_, i) => g.positionsM[3 * keptPorts[Math.floor(i / 3)] + (i % 3)]),
  } : undefined;
  return {
    patterns, impedanceOhm: reduced, keptPorts, failedPorts,
    ...(ports.checks ? { checks: ports.checks } : {}), ...(geometry ? { geometry } : {}),
  };
}

/** out_k = in_{K_k} − Σ_j A[j][k] in_{F_j} over `count` directions (buffers of leading dimension ld). */
function mixInto(out: Float64Array, ldOut: number, input: Float64Array, ldIn: number, count: number, kept: Int32Array, failed: Int32Array, a: CMatrix | undefined): void {
  const nk = kept.length, nf = failed.length;
  for (let k = 0; k < nk; k++) {
    const o = 2 * k * ldOut, s = 2 * kept[k] * ldIn;
    for (let c = 0; c < 2 * count; c++) out[o + c] = input[s + c];
    if (!a) continue;
    for (let j = 0; j < nf; j++) {
      const ar = a.data[2 * (j * nk + k)], ai = a.data[2 * (j * nk + k) + 1], f = 2 * failed[j] * ldIn;
      for (let c = 0; c < count; c++) {
        const xr = input[f + 2 * c], xi = input[f + 2 * c + 1];
        out[o + 2 * c] -= ar * xr - ai * xi;
        out[o + 2 * c + 1] -= ar * xi + ai * xr;
      }
    }
  }
}

function reducePatterns(
  p: PortPatternSource | SampledPortPatterns, kept: Int32Array, failed: Int32Array, a: CMatrix | undefined,
): PortPatternSource | SampledPortPatterns {
  const nk = kept.length;
  if ('thetaComponentV' in p) {
    const m = p.thetaRad.length;
    const th = new Float64Array(2 * nk * m), ph = new Float64Array(2 * nk * m);
    mixInto(th, m, p.thetaComponentV.data, m, m, kept, failed, a);
    mixInto(ph, m, p.phiComponentV.data, m, m, kept, failed, a);
    return { ...p, thetaComponentV: { rows: nk, cols: m, data: th }, phiComponentV: { rows: nk, cols: m, data: ph } };
  }
  const n = p.portCount;
  let bufT = new Float64Array(0), bufP = new Float64Array(0);
  return {
    portCount: nk, driveCurrentA: p.driveCurrentA, frequencyHz: p.frequencyHz,
    fill(thetaRad, phiRad, start, count, outTheta, outPhi, ld) {
      if (bufT.length < 2 * n * count) { bufT = new Float64Array(2 * n * count); bufP = new Float64Array(2 * n * count); }
      p.fill(thetaRad, phiRad, start, count, bufT, bufP, count);
      mixInto(outTheta, ld, bufT, count, count, kept, failed, a);
      mixInto(outPhi, ld, bufP, count, count, kept, failed, a);
    },
  };
}
