/**
 * Connections of multiports: joining ports, terminating ports with loads,
 * cascading two-ports, adding series and shunt elements.
 *
 * One engine does all of it, in power-wave scattering form. The ports to be
 * eliminated ("internal" ports i) obey a_i = Γ b_i, where Γ swaps the waves of
 * each joined pair (the pair first renormalised to one common real
 * reference, so that a joined port's incident wave is its partner's reflected
 * wave) or holds the reflection coefficient of each load. Then
 *
 *   S_red = S_ee + S_ei Γ (I − S_ii Γ)⁻¹ S_ie,
 *   c_red = c_e + S_ei Γ (I − S_ii Γ)⁻¹ c_i  (noise waves),
 *
 * the reduction of V. A. Monaco and P. Tiberio, "Computer-aided analysis of
 * microwave circuits", IEEE Trans. MTT 22(3), 1974, and K. C. Gupta, R. Garg,
 * R. Chadha, *Computer-Aided Design of Microwave Circuits*, Artech House,
 * 1981, ch. on connection-scattering matrices (from memory).
 * @module
 */
import { hzText } from '../internal/text.js';
import { DimensionError, DomainError, SingularMatrixError } from '../errors.js';
import { type CMatrix, type ComplexLike, complexParts } from '../linalg/cmatrix.js';
import { adjoint, multiply, pick } from '../linalg/ops.js';
import { solveSmallInPlace } from '../internal/batched.js';
import { assertNonNegative, describeValue } from '../internal/validate.js';
import { K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { convertMultiport, renormalizeStack } from './convert.js';
import { type Multiport, assertMultiport, createMultiport, waveCoefficients, withFields } from './multiport.js';
import { asPowerScattering, checkPortList, combineMultiports, toWaves } from './ports.js';
import { displayable } from '../display/attach.js';

/**
 * A load impedance for {@link terminatePorts}: a constant [Ω] (number or complex), one value
 * per frequency [Ω] (array of length F), or `'open'` / `'short'`.
 * @category Network
 */
export type PortLoad = ComplexLike | ReadonlyArray<ComplexLike> | 'open' | 'short';

/** Engine: eliminates internal ports of a power-wave scattering network. */
function reduce(
  net: Multiport,
  pairs: ReadonlyArray<readonly [number, number]>,
  loads: ReadonlyArray<{ port: number; gamma: Float64Array; temperatureK: number }>,
): Multiport {
  const n = net.ports;
  const nf = net.frequencyHz.length;
  const internal: number[] = [];
  const partner: number[] = [];
  for (const [p, q] of pairs) {
    internal.push(p, q);
    partner.push(internal.length - 1, internal.length - 2); // partner of internal[j] is internal[partner[j]]
  }
  const loadGamma: Array<Float64Array | null> = internal.map(() => null);
  const loadTemp: number[] = internal.map(() => 0);
  for (const { port, gamma, temperatureK } of loads) {
    internal.push(port);
    partner.push(internal.length - 1);
    loadGamma.push(gamma);
    loadTemp.push(temperatureK);
  }
  const hotLoads = loadTemp.some((t) => t > 0);
  const m = internal.length;
  const isInternal = new Set(internal);
  const ext: number[] = [];
  for (let p = 0; p < n; p++) if (!isInternal.has(p)) ext.push(p);
  const e = ext.length;
  if (e === 0) {
    throw new DimensionError('invalid connection: every port would be eliminated; leave at least one external port.');
  }
  // renormalise every joined pair to one common real reference
  let s = net.data;
  let noise = net.noiseWaves;
  const ref = net.referenceOhm;
  const newRef = ref.slice();
  let needRenorm = false;
  for (const [p, q] of pairs) {
    const r0 = Math.hypot(ref[2 * p], ref[2 * p + 1]);
    for (const t of [p, q]) {
      if (ref[2 * t] !== r0 || ref[2 * t + 1] !== 0) needRenorm = true;
      newRef[2 * t] = r0; newRef[2 * t + 1] = 0;
    }
  }
  if (needRenorm) {
    const r = renormalizeStack(s, n, nf, ref, 'power', newRef, 'power', noise, net.frequencyHz);
    s = r.s;
    noise = r.noise;
  }
  const nn = n * n;
  const gam = new Float64Array(2 * m); // γ of internal port j at the current frequency
  const w = new Float64Array(2 * m * m);
  const x = new Float64Array(2 * m * e);
  const out = new Float64Array(2 * nf * e * e);
  if (!noise && hotLoads) noise = new Float64Array(2 * nf * nn); // a noiseless network closed by warm loads
  const outNoise = noise ? new Float64Array(2 * nf * e * e) : undefined;
  const wt = noise ? new Float64Array(2 * m * m) : undefined;
  const ut = noise ? new Float64Array(2 * m * e) : undefined;
  for (let k = 0; k < nf; k++) {
    const o = 2 * k * nn;
    for (let j = 0; j < m; j++) {
      const g = loadGamma[j];
      if (g) { gam[2 * j] = g[2 * k]; gam[2 * j + 1] = g[2 * k + 1]; } else { gam[2 * j] = 1; gam[2 * j + 1] = 0; }
    }
    // W = I − S_ii Γ, (S_ii Γ)_{jl} = S_{i_j, i_π(l)} γ_π(l)
    for (let j = 0; j < m; j++) {
      for (let l = 0; l < m; l++) {
        const pl = partner[l];
        const q = o + 2 * (internal[j] * n + internal[pl]);
        const sr = s[q], si = s[q + 1], gr = gam[2 * pl], gi = gam[2 * pl + 1];
        w[2 * (j * m + l)] = (j === l ? 1 : 0) - (sr * gr - si * gi);
        w[2 * (j * m + l) + 1] = -(sr * gi + si * gr);
      }
      for (let l = 0; l < e; l++) {
        const q = o + 2 * (internal[j] * n + ext[l]);
        x[2 * (j * e + l)] = s[q]; x[2 * (j * e + l) + 1] = s[q + 1];
      }
    }
    if (wt) {
      // keep Wᵀ for the noise solve
      for (let j = 0; j < m; j++) for (let l = 0; l < m; l++) {
        wt[2 * (l * m + j)] = w[2 * (j * m + l)]; wt[2 * (l * m + j) + 1] = w[2 * (j * m + l) + 1];
      }
    }
    if (solveSmallInPlace(m, e, w, 0, x, 0) >= 0) {
      throw new SingularMatrixError(`connecting ports: I − S_ii Γ is singular at frequency index ${k} (${hzText(net.frequencyHz[k])}); the connection has no unique solution there (e.g. a lossless resonance or two ideal opens joined); move the frequency or add loss.`, k);
    }
    const ok = 2 * k * e * e;
    for (let a = 0; a < e; a++) {
      for (let b = 0; b < e; b++) {
        const q = o + 2 * (ext[a] * n + ext[b]);
        let re = s[q], im = s[q + 1];
        for (let l = 0; l < m; l++) {
          const pl = partner[l];
          const q2 = o + 2 * (ext[a] * n + internal[pl]);
          const gr = gam[2 * pl], gi = gam[2 * pl + 1];
          const ar = s[q2] * gr - s[q2 + 1] * gi, ai = s[q2] * gi + s[q2 + 1] * gr;
          const xr = x[2 * (l * e + b)], xi = x[2 * (l * e + b) + 1];
          re += ar * xr - ai * xi; im += ar * xi + ai * xr;
        }
        out[ok + 2 * (a * e + b)] = re; out[ok + 2 * (a * e + b) + 1] = im;
      }
    }
    if (noise && outNoise && wt && ut) {
      // Uᵀ = W⁻ᵀ (S_ei Γ)ᵀ; (S_eiΓ)ᵀ_{l,a} = S_{e_a, i_π(l)} γ_π(l)
      for (let l = 0; l < m; l++) {
        const pl = partner[l];
        const gr = gam[2 * pl], gi = gam[2 * pl + 1];
        for (let a = 0; a < e; a++) {
          const q2 = o + 2 * (ext[a] * n + internal[pl]);
          ut[2 * (l * e + a)] = s[q2] * gr - s[q2 + 1] * gi;
          ut[2 * (l * e + a) + 1] = s[q2] * gi + s[q2 + 1] * gr;
        }
      }
      solveSmallInPlace(m, e, wt, 0, ut, 0);
      // K = [I_e | U] over the order (ext, internal)
      const kd = new Float64Array(2 * e * (e + m));
      for (let a = 0; a < e; a++) {
        kd[2 * (a * (e + m) + a)] = 1;
        for (let l = 0; l < m; l++) {
          kd[2 * (a * (e + m) + e + l)] = ut[2 * (l * e + a)];
          kd[2 * (a * (e + m) + e + l) + 1] = ut[2 * (l * e + a) + 1];
        }
      }
      const kk: CMatrix = { rows: e, cols: e + m, data: kd };
      const order = ext.concat(internal);
      const c = pick({ rows: n, cols: n, data: noise.subarray(o, o + 2 * nn) }, order, order);
      const cr = multiply(multiply(kk, c), adjoint(kk));
      if (hotLoads) {
        // load noise waves n (a_i = Γ b_i + n, E|n_l|² = k_B T_l (1 − |γ_l|²)) reach the outputs through
        // V = U S_ii + S_ei (e×m): add V D Vᴴ
        const v = new Float64Array(2 * e * m);
        for (let a = 0; a < e; a++) for (let l = 0; l < m; l++) {
          const q0 = o + 2 * (ext[a] * n + internal[l]);
          let re = s[q0], im = s[q0 + 1];
          for (let j = 0; j < m; j++) {
            const ur = ut[2 * (j * e + a)], ui = ut[2 * (j * e + a) + 1];
            const q1 = o + 2 * (internal[j] * n + internal[l]);
            re += ur * s[q1] - ui * s[q1 + 1]; im += ur * s[q1 + 1] + ui * s[q1];
          }
          const g2 = gam[2 * l] ** 2 + gam[2 * l + 1] ** 2;
          const sd = Math.sqrt(Math.max(0, K_BOLTZMANN_J_PER_K * loadTemp[l] * (1 - g2)));
          v[2 * (a * m + l)] = re * sd; v[2 * (a * m + l) + 1] = im * sd;
        }
        const vm: CMatrix = { rows: e, cols: m, data: v };
        const extra = multiply(vm, adjoint(vm));
        for (let q = 0; q < cr.data.length; q++) cr.data[q] += extra.data[q];
      }
      outNoise.set(cr.data, ok);
    }
  }
  const refOut = new Float64Array(2 * e);
  ext.forEach((p, i) => { refOut[2 * i] = ref[2 * p]; refOut[2 * i + 1] = ref[2 * p + 1]; });
  return displayable<Multiport>({
    ports: e, frequencyHz: net.frequencyHz.slice(), form: 'scattering', data: out, referenceOhm: refOut,
    waves: 'power', portNames: ext.map((p) => net.portNames[p]), ...(outNoise ? { noiseWaves: outNoise } : {}),
  }, 'Multiport');
}

/** Reflection coefficient stack (interleaved, length 2F) of a load seen from a port (power waves). */
function loadReflection(name: string, load: PortLoad, refRe: number, refIm: number, nf: number): Float64Array {
  const out = new Float64Array(2 * nf);
  const { g, h } = waveCoefficients(Float64Array.of(refRe, refIm), 'power');
  const gamma = (zr: number, zi: number, k: number): void => {
    // Γ = (Z_L − g)/(Z_L + h)
    const nr = zr - g[0], ni = zi - g[1], dr = zr + h[0], di = zi + h[1];
    const dm = dr * dr + di * di;
    if (!(dm > 0)) {
      throw new DomainError(`invalid argument "${name}": the load equals −Z_r* of its port (${-h[0]} + ${-h[1]}j Ω)${nf > 1 ? ` at frequency index ${k}` : ''}, so its reflection coefficient is infinite; such a load cannot terminate a power-wave port.`);
    }
    out[2 * k] = (nr * dr + ni * di) / dm;
    out[2 * k + 1] = (ni * dr - nr * di) / dm;
  };
  if (load === 'open') {
    for (let k = 0; k < nf; k++) out[2 * k] = 1;
    return out;
  }
  if (load === 'short') {
    for (let k = 0; k < nf; k++) gamma(0, 0, k);
    return out;
  }
  if (Array.isArray(load)) {
    if (load.length !== nf) {
      throw new DimensionError(`invalid argument "${name}": a frequency-dependent load needs ${nf} values (one per frequency), received ${load.length}.`);
    }
    load.forEach((z, k) => { const [zr, zi] = complexParts(`${name}[${k}]`, z); gamma(zr, zi, k); });
    return out;
  }
  const [zr, zi] = complexParts(name, load as ComplexLike);
  for (let k = 0; k < nf; k++) gamma(zr, zi, k);
  return out;
}

/**
 * Terminates some ports of a network with loads and returns the network seen at the others.
 *
 * @remarks
 * Each listed port is closed by its own (uncoupled) load. Loads are noiseless unless
 * `options.loadTemperatureK` is given: a load at temperature T with reflection Γ then sends the
 * noise wave E|n|² = k_B T (1 − |Γ|²) per hertz into its port (Bosma 1967, from memory), and the
 * result carries noise waves. The
 * remaining ports keep their order, names and references; the result is in scattering form
 * (with the network's wave definition). A coupled load network is attached with
 * {@link joinPorts} instead. Method: see the module notes (connection-scattering reduction).
 * @param net - The network.
 * @param ports - Zero-based indices of the ports to terminate (distinct).
 * @param loads - One {@link PortLoad} per listed port [Ω] (a frequency-dependent load is itself an array).
 * @param options - `loadTemperatureK`: physical temperature of the loads [K], one for all or one per listed port (default: noiseless).
 * @returns The reduced network.
 * @throws {@link DimensionError} on mismatched counts or if no port would remain;
 *   {@link DomainError} on bad port indices or loads; {@link SingularMatrixError} (frequency
 *   index) where the terminated network has no solution.
 * @example
 * ```ts
 * // a 100 Ω series resistor as a two-port: Z = [[Z₁ + R, Z₁], [Z₁, Z₁]] with a 1e9 Ω shunt Z₁ (nearly open)
 * const twoPort = createMultiport('impedance', [1e9], [fromRows([[1e9 + 100, 1e9], [1e9, 1e9]])]);
 * const oneport = terminatePorts(twoPort, [1], [50]); // input with a 50 Ω load: 150 Ω, Γ = 0.5
 * oneport.data; // ≈ [0.5000, 0]
 * ```
 * @category Network
 */
export function terminatePorts(
  net: Multiport, ports: ReadonlyArray<number>, loads: ReadonlyArray<PortLoad>,
  options: { loadTemperatureK?: number | ReadonlyArray<number> } = {},
): Multiport {
  assertMultiport('net', net);
  const list = checkPortList('ports', ports, net.ports);
  const nf = net.frequencyHz.length;
  if (!Array.isArray(loads) || loads.length !== list.length) {
    throw new DimensionError(`invalid argument "loads": expected ${list.length} loads (one per terminated port), received ${describeValue(loads)}; wrap a frequency-dependent load in its own array.`);
  }
  const perPort = loads;
  const tl = options.loadTemperatureK ?? 0;
  const temps = Array.isArray(tl) ? tl : list.map(() => tl as number);
  if (temps.length !== list.length) {
    throw new DimensionError(`invalid option "loadTemperatureK": expected one temperature or ${list.length} (one per terminated port), received ${temps.length}.`);
  }
  temps.forEach((t, i) => assertNonNegative(`loadTemperatureK[${i}]`, t, 'K'));
  const p = asPowerScattering(net);
  const reduced = reduce(p, [], list.map((port, i) => ({
    port, gamma: loadReflection(`loads[${i}]`, perPort[i], p.referenceOhm[2 * port], p.referenceOhm[2 * port + 1], nf), temperatureK: temps[i],
  })));
  return toWaves(reduced, net.waves);
}

/**
 * Keeps some ports of a network, closing the others in a stated way.
 *
 * @remarks
 * `'matched'` closes each dropped port in its own reference impedance Z_r (then the
 * incident power wave a_i = 0; the conjugate Z_r* is the load that draws the most power), so the kept block of S is simply S restricted to
 * the kept ports; `'open'` gives the kept block of Z; `'short'` the kept block of Y.
 * The kept ports appear in the order given.
 * @param net - The network.
 * @param ports - Zero-based indices of the ports to keep, in the desired order.
 * @param others - How the dropped ports are closed.
 * @returns A network with `ports.length` ports, in scattering form.
 * @throws {@link DomainError} on bad indices or `others`.
 * @category Network
 */
export function keepPorts(net: Multiport, ports: ReadonlyArray<number>, others: 'matched' | 'open' | 'short'): Multiport {
  assertMultiport('net', net);
  const keep = checkPortList('ports', ports, net.ports);
  if (others !== 'matched' && others !== 'open' && others !== 'short') {
    throw new DomainError(`invalid argument "others": expected 'matched', 'open' or 'short', received ${describeValue(others)}.`);
  }
  const drop: number[] = [];
  for (let q = 0; q < net.ports; q++) if (!keep.includes(q)) drop.push(q);
  let reduced = net;
  if (drop.length > 0) {
    const loads: PortLoad[] = drop.map((q) => (others === 'matched'
      ? { re: net.referenceOhm[2 * q], im: net.referenceOhm[2 * q + 1] } : others));
    reduced = terminatePorts(net, drop, loads);
  }
  // reduced ports are the kept ones in ascending order; reorder to the requested order
  const ascending = keep.slice().sort((a, b) => a - b);
  const order = keep.map((p) => ascending.indexOf(p));
  const out = reduced.form === 'scattering' ? reduced : convertMultiport(reduced, 'scattering');
  return reorderScattering(out, order);
}

function reorderScattering(net: Multiport, order: number[]): Multiport {
  if (order.every((v, i) => v === i)) return net;
  const n = net.ports, nf = net.frequencyHz.length;
  const data = new Float64Array(net.data.length);
  const noise = net.noiseWaves ? new Float64Array(net.data.length) : undefined;
  for (let k = 0; k < nf; k++) for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const d = 2 * (k * n * n + i * n + j), s = 2 * (k * n * n + order[i] * n + order[j]);
    data[d] = net.data[s]; data[d + 1] = net.data[s + 1];
    if (noise && net.noiseWaves) { noise[d] = net.noiseWaves[s]; noise[d + 1] = net.noiseWaves[s + 1]; }
  }
  const ref = new Float64Array(2 * n);
  order.forEach((p, i) => { ref[2 * i] = net.referenceOhm[2 * p]; ref[2 * i + 1] = net.referenceOhm[2 * p + 1]; });
  return withFields(net, { data, referenceOhm: ref, portNames: order.map((p) => net.portNames[p]), noiseWaves: noise });
}

/**
 * Joins pairs of ports of one network to each other (V equal, currents opposite).
 *
 * @remarks
 * The joined ports disappear; the others keep their order, names and references. Result in
 * scattering form with the network's wave definition. Method: module notes.
 * @param net - The network.
 * @param pairs - Pairs [p, q] of zero-based port indices; no port may appear twice.
 * @returns The reduced network.
 * @throws {@link DomainError} on bad or repeated indices; {@link DimensionError} if no port
 *   would remain; {@link SingularMatrixError} (frequency index) at a singular connection.
 * @category Network
 */
export function joinPortPairs(net: Multiport, pairs: ReadonlyArray<readonly [number, number]>): Multiport {
  assertMultiport('net', net);
  if (!Array.isArray(pairs) || pairs.length === 0) {
    throw new DimensionError(`invalid argument "pairs": expected a non-empty array of [p, q] port pairs, received ${describeValue(pairs)}.`);
  }
  const flat: number[] = [];
  for (const pr of pairs) {
    if (!Array.isArray(pr) || pr.length !== 2) {
      throw new DimensionError(`invalid argument "pairs": every entry must be a [p, q] pair, received ${describeValue(pr)}.`);
    }
    flat.push(pr[0], pr[1]);
  }
  checkPortList('pairs', flat, net.ports);
  const reduced = reduce(asPowerScattering(net), pairs, []);
  return toWaves(reduced, net.waves);
}

/**
 * Joins port `p` of a network to its own port `q`.
 * @param net - The network.
 * @param p - Zero-based port index.
 * @param q - Zero-based port index, ≠ p.
 * @returns The network with N − 2 ports (scattering form).
 * @throws As {@link joinPortPairs}.
 * @category Network
 */
export function joinOwnPorts(net: Multiport, p: number, q: number): Multiport {
  return joinPortPairs(net, [[p, q]]);
}

/**
 * Joins port `portA` of network `a` to port `portB` of network `b`.
 *
 * @remarks
 * The result's ports are a's remaining ports, then b's remaining ports, with their names and
 * references; scattering form with power waves. Both networks must share the frequency grid.
 * @param a - First network.
 * @param portA - Zero-based port index in `a`.
 * @param b - Second network.
 * @param portB - Zero-based port index in `b`.
 * @returns The joined network with N_a + N_b − 2 ports.
 * @throws {@link DimensionError} on differing frequency grids or if no port remains;
 *   {@link DomainError} on bad indices; {@link SingularMatrixError} (frequency index).
 * @category Network
 */
export function joinPorts(a: Multiport, portA: number, b: Multiport, portB: number): Multiport {
  assertMultiport('a', a);
  assertMultiport('b', b);
  checkPortList('portA', [portA], a.ports);
  checkPortList('portB', [portB], b.ports);
  return joinPortPairs(combineMultiports([a, b]), [[portA, a.ports + portB]]);
}

/**
 * Cascades two-ports: port 2 of each joined to port 1 of the next.
 *
 * @remarks
 * Equivalent to multiplying chain matrices (Pozar 2012, §4.4, from memory) but computed by
 * the scattering connection, so it also works where a chain matrix does not exist.
 * @param nets - Two or more two-ports on one frequency grid.
 * @returns The cascade, a two-port (scattering form, power waves, references of the outer ports).
 * @throws {@link DimensionError} if a network is not a two-port, fewer than two are given, or
 *   frequency grids differ; {@link SingularMatrixError} (frequency index).
 * @category Network
 */
export function cascadeTwoPorts(...nets: Multiport[]): Multiport {
  if (nets.length < 2) throw new DimensionError(`invalid arguments: cascadeTwoPorts needs at least two two-ports, received ${nets.length}.`);
  nets.forEach((m, i) => {
    assertMultiport(`nets[${i}]`, m);
    if (m.ports !== 2) throw new DimensionError(`invalid argument "nets[${i}]": expected a two-port, received a ${m.ports}-port; use joinPorts for general connections.`);
  });
  let acc = nets[0];
  for (let i = 1; i < nets.length; i++) acc = joinPorts(acc, 1, nets[i], 0);
  return acc;
}

function elementAt(net: Multiport, port: number, chain: (k: number) => [number, number, number, number, number, number, number, number]): Multiport {
  const nf = net.frequencyHz.length;
  const data = new Float64Array(8 * nf);
  for (let k = 0; k < nf; k++) data.set(chain(k), 8 * k);
  const r = { re: net.referenceOhm[2 * port], im: net.referenceOhm[2 * port + 1] };
  return createMultiport('chain', net.frequencyHz, data, { referenceOhm: [r, r] });
}

function perFrequency(name: string, v: ComplexLike | ReadonlyArray<ComplexLike>, nf: number): Float64Array {
  const out = new Float64Array(2 * nf);
  if (Array.isArray(v)) {
    if (v.length !== nf) throw new DimensionError(`invalid argument "${name}": expected one value or ${nf} (one per frequency), received ${v.length}.`);
    v.forEach((z, k) => { const [re, im] = complexParts(`${name}[${k}]`, z); out[2 * k] = re; out[2 * k + 1] = im; });
  } else {
    const [re, im] = complexParts(name, v as ComplexLike);
    for (let k = 0; k < nf; k++) { out[2 * k] = re; out[2 * k + 1] = im; }
  }
  return out;
}

function insertAt(net: Multiport, port: number, element: Multiport): Multiport {
  // join net's port to element port 0; element port 1 becomes the new port, moved back to `port`
  const joined = joinPorts(net, port, element, 0);
  const n = net.ports;
  const order: number[] = [];
  for (let i = 0; i < n; i++) order.push(i < port ? i : i === port ? n - 1 : i - 1);
  const out = reorderScattering(joined, order);
  const names = net.portNames.slice();
  return toWaves(withFields(out, { portNames: names }), net.waves);
}

/**
 * Adds an ideal series impedance in front of one port: the new port voltage is V + Z_s I.
 * @param net - The network.
 * @param port - Zero-based port index.
 * @param impedanceOhm - Series impedance [Ω], constant or one per frequency.
 * @returns A network with the same ports (scattering form, same references).
 * @throws {@link DomainError} on a bad port or value; {@link DimensionError} on a wrong count.
 * @category Network
 */
export function addSeriesImpedance(net: Multiport, port: number, impedanceOhm: ComplexLike | ReadonlyArray<ComplexLike>): Multiport {
  assertMultiport('net', net);
  checkPortList('port', [port], net.ports);
  const z = perFrequency('impedanceOhm', impedanceOhm, net.frequencyHz.length);
  // the element's port 0 faces the network, port 1 is the new outer port: chain [[1, Z], [0, 1]]
  return insertAt(net, port, elementAt(net, port, (k) => [1, 0, z[2 * k], z[2 * k + 1], 0, 0, 1, 0]));
}

/**
 * Adds an ideal shunt admittance across one port: the new port current is I + Y_p V.
 * @param net - The network.
 * @param port - Zero-based port index.
 * @param admittanceS - Shunt admittance [S], constant or one per frequency.
 * @returns A network with the same ports (scattering form, same references).
 * @throws {@link DomainError} on a bad port or value; {@link DimensionError} on a wrong count.
 * @category Network
 */
export function addShuntAdmittance(net: Multiport, port: number, admittanceS: ComplexLike | ReadonlyArray<ComplexLike>): Multiport {
  assertMultiport('net', net);
  checkPortList('port', [port], net.ports);
  const y = perFrequency('admittanceS', admittanceS, net.frequencyHz.length);
  return insertAt(net, port, elementAt(net, port, (k) => [1, 0, 0, 0, y[2 * k], y[2 * k + 1], 1, 0]));
}
