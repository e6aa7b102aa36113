/**
 * Port bookkeeping: reorder, rename, and combine networks side by side.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { describeValue } from '../internal/validate.js';
import { convertMultiport, fromScatteringStack, powerScatteringStack, renormalizeStack } from './convert.js';
import { type Multiport, assertMultiport, checkPortNames, withFields } from './multiport.js';
import { displayable } from '../display/attach.js';

/** Validates a list of distinct port indices of `net`. @internal */
export function checkPortList(name: string, ports: ReadonlyArray<number>, n: number, allowEmpty = false): number[] {
  if (!Array.isArray(ports) || (!allowEmpty && ports.length === 0)) {
    throw new DimensionError(`invalid argument "${name}": expected a non-empty array of port indices, received ${describeValue(ports)}.`);
  }
  const seen = new Set<number>();
  for (const p of ports) {
    if (!Number.isInteger(p) || p < 0 || p >= n) {
      throw new DomainError(`invalid argument "${name}": port index ${describeValue(p)} is not an integer in [0, ${n - 1}] (zero-based; the network has ${n} ports).`);
    }
    if (seen.has(p)) throw new DomainError(`invalid argument "${name}": port ${p} is listed twice.`);
    seen.add(p);
  }
  return ports.slice();
}

/** Picks rows/cols `idx` of every N×N matrix of a stack. @internal */
export function pickStack(src: Float64Array, n: number, nf: number, idx: ReadonlyArray<number>): Float64Array {
  const m = idx.length;
  const out = new Float64Array(2 * nf * m * m);
  for (let k = 0; k < nf; k++) {
    const o = 2 * k * n * n, p = 2 * k * m * m;
    for (let i = 0; i < m; i++) {
      for (let j = 0; j < m; j++) {
        const q = o + 2 * (idx[i] * n + idx[j]);
        out[p + 2 * (i * m + j)] = src[q];
        out[p + 2 * (i * m + j) + 1] = src[q + 1];
      }
    }
  }
  return out;
}

function pickRefs(ref: Float64Array, idx: ReadonlyArray<number>): Float64Array {
  const out = new Float64Array(2 * idx.length);
  idx.forEach((p, i) => { out[2 * i] = ref[2 * p]; out[2 * i + 1] = ref[2 * p + 1]; });
  return out;
}

/**
 * Puts the ports of a network in a new order.
 *
 * @remarks
 * Port i of the result is port `order[i]` of `net`. Impedance, admittance and scattering
 * data are permuted symmetrically; a two-port in chain or transfer form is reordered
 * through its scattering matrix and returned in its original form.
 * @param net - The network.
 * @param order - A permutation of 0 … N − 1 (zero-based port indices).
 * @returns A new network.
 * @throws {@link DomainError} if `order` is not a permutation.
 * @category Network
 */
export function reorderPorts(net: Multiport, order: ReadonlyArray<number>): Multiport {
  assertMultiport('net', net);
  const idx = checkPortList('order', order, net.ports);
  if (idx.length !== net.ports) {
    throw new DimensionError(`invalid argument "order": expected a permutation of all ${net.ports} ports, received ${idx.length} indices; to drop ports use keepPorts.`);
  }
  const nf = net.frequencyHz.length;
  const twoPortForm = net.form === 'chain' || net.form === 'transfer';
  const base = twoPortForm ? convertMultiport(net, 'scattering') : net;
  const out = withFields(base, {
    data: pickStack(base.data, net.ports, nf, idx),
    referenceOhm: pickRefs(net.referenceOhm, idx),
    portNames: idx.map((p) => net.portNames[p]),
    noiseWaves: net.noiseWaves ? pickStack(net.noiseWaves, net.ports, nf, idx) : undefined,
  });
  return twoPortForm ? convertMultiport(out, net.form) : out;
}

/**
 * Gives the ports new names.
 * @param net - The network.
 * @param names - One string per port.
 * @returns A new network (data shared by copy).
 * @throws {@link DimensionError} on a wrong count.
 * @category Network
 */
export function renamePorts(net: Multiport, names: ReadonlyArray<string>): Multiport {
  assertMultiport('net', net);
  return withFields(net, { portNames: checkPortNames(names, net.ports), data: net.data.slice() });
}

/** Checks that two networks share a frequency grid (relative 1e-9). @internal */
export function assertSameFrequencies(a: Multiport, b: Multiport, nameB: string): void {
  const fa = a.frequencyHz, fb = b.frequencyHz;
  let ok = fa.length === fb.length;
  for (let k = 0; ok && k < fa.length; k++) ok = Math.abs(fa[k] - fb[k]) <= 1e-9 * Math.max(Math.abs(fa[k]), 1);
  if (!ok) {
    throw new DimensionError(`invalid argument "${nameB}": its frequencies (${fb.length} points) differ from those of the first network (${fa.length} points); resample one with interpolateMultiport.`);
  }
}

/**
 * Places networks side by side, uncoupled, as one network.
 *
 * @remarks
 * The ports of `nets[0]` come first, then those of `nets[1]`, …. The result is in power-wave
 * scattering form with the concatenated references (block-diagonal S); noise waves are
 * combined block-diagonally (a network without noise waves counts as noiseless).
 * @param nets - Networks on the same frequency grid.
 * @returns A new network with ΣNᵢ ports.
 * @throws {@link DimensionError} on differing frequency grids or an empty list.
 * @category Network
 */
export function combineMultiports(nets: ReadonlyArray<Multiport>): Multiport {
  if (!Array.isArray(nets) || nets.length === 0) {
    throw new DimensionError(`invalid argument "nets": expected a non-empty array of networks, received ${describeValue(nets)}.`);
  }
  nets.forEach((m, i) => assertMultiport(`nets[${i}]`, m));
  nets.forEach((m, i) => { if (i > 0) assertSameFrequencies(nets[0], m, `nets[${i}]`); });
  const nf = nets[0].frequencyHz.length;
  const n = nets.reduce((acc, m) => acc + m.ports, 0);
  const s = new Float64Array(2 * nf * n * n);
  const ref = new Float64Array(2 * n);
  const anyNoise = nets.some((m) => m.noiseWaves);
  const noise = anyNoise ? new Float64Array(s.length) : undefined;
  const names: string[] = [];
  let off = 0;
  for (const m of nets) {
    const sm = powerScatteringStack(m);
    const p = m.ports;
    for (let k = 0; k < nf; k++) {
      for (let i = 0; i < p; i++) {
        const dst = 2 * (k * n * n + (off + i) * n + off);
        const src = 2 * (k * p * p + i * p);
        s.set(sm.subarray(src, src + 2 * p), dst);
        if (noise && m.noiseWaves) noise.set(m.noiseWaves.subarray(src, src + 2 * p), dst);
      }
    }
    ref.set(m.referenceOhm, 2 * off);
    names.push(...m.portNames);
    off += p;
  }
  return displayable<Multiport>({
    ports: n, frequencyHz: nets[0].frequencyHz.slice(), form: 'scattering', data: s, referenceOhm: ref,
    waves: 'power', portNames: names, ...(noise ? { noiseWaves: noise } : {}),
  }, 'Multiport');
}

/** The network as power-wave S with its own references (form 'scattering'). @internal */
export function asPowerScattering(net: Multiport): Multiport {
  if (net.form === 'scattering' && net.waves === 'power') return net;
  return withFields(net, { form: 'scattering', waves: 'power', data: powerScatteringStack(net) });
}

/** Converts a power-wave scattering network back to the given wave definition (same references). @internal */
export function toWaves(net: Multiport, waves: Multiport['waves']): Multiport {
  if (waves === net.waves) return net;
  const s = renormalizeStack(net.data, net.ports, net.frequencyHz.length, net.referenceOhm, net.waves, net.referenceOhm, waves, undefined, net.frequencyHz).s;
  return withFields(net, { waves, data: fromScatteringStack(s, 'scattering', net) });
}
