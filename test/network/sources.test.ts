import { describe, it, expect } from 'vitest';
import type { CMatrix } from '../../src/linalg/cmatrix.js';
import {
  nortonFromThevenin, theveninFromNorton, loadResponse, availablePower, mismatchFactor, activeReflection, terminateSourcePorts,
} from '../../src/network/sources.js';
import type { PortLoad } from '../../src/network/connect.js';
import { terminatePorts } from '../../src/network/connect.js';
import { solve, zeros, identity } from '../../src/linalg/index.js';
import { checkReciprocity, checkPassivity, checkLossless } from '../../src/network/checks.js';
import { interpolateMultiport } from '../../src/network/interpolate.js';
import { createMultiport, multiportMatrix } from '../../src/network/multiport.js';
import { convertMultiport, renormalizeMultiport } from '../../src/network/convert.js';
import { fromRows, columnVector, adjoint, multiply, entry, scale, columnVector as col } from '../../src/linalg/index.js';
import { DomainError, DimensionError, NotPositiveDefiniteError } from '../../src/errors.js';
import { expectCMatrixClose, randomMatrix } from '../helpers/matchers.js';
import { randomPassiveImpedance } from './helpers.js';

describe('Thevenin / Norton, loads, available power', () => {
  const z = randomPassiveImpedance(3, 51);
  const v = columnVector([{ re: 1, im: 0.5 }, { re: -0.3, im: 0.2 }, 0.7]);
  it('Norton ↔ Thevenin round trip; i_sc equals the current into shorts', () => {
    const nr = nortonFromThevenin({ impedanceOhm: z, openCircuitVoltageV: v });
    const back = theveninFromNorton(nr);
    expectCMatrixClose(back.openCircuitVoltageV, v, { rtol: 1e-13 });
    // shorted ports: 0 = Z I + v → −I = Z⁻¹ v = i_sc
    expectCMatrixClose(multiply(z, nr.shortCircuitCurrentA), v, { rtol: 1e-13 });
  });
  it('conjugate-matched load draws the available power; mismatch factor ≤ 1 otherwise', () => {
    const t = { impedanceOhm: z, openCircuitVoltageV: v };
    const matched = loadResponse(t, adjoint(z));
    expect(matched.totalPowerW).toBeCloseTo(matched.availablePowerW!, 14);
    expect(matched.mismatchFactor).toBeCloseTo(1, 12);
    const other = loadResponse(t, fromRows([[50, 0, 0], [0, 50, 0], [0, 0, 50]]));
    expect(other.mismatchFactor).toBeLessThan(1);
    // energy: delivered = −Re(Iᴴ V) computed from the port quantities; V = Z I + v_oc with I = −i_L
    const iNet = scale(other.loadCurrentA, -1);
    const vv = multiply(z, iNet);
    for (let i = 0; i < 3; i++) expect(vv.data[2 * i] + v.data[2 * i]).toBeCloseTo(other.voltageV.data[2 * i], 12);
  });
  it('one-port available power |v|²/(4R) and the scalar mismatch factor (Pozar 2012 §2.8, from memory)', () => {
    const zs = { re: 30, im: 40 };
    expect(availablePower({ impedanceOhm: fromRows([[zs]]), openCircuitVoltageV: col([2]) })).toBeCloseTo(4 / 120, 15);
    const r = loadResponse({ impedanceOhm: fromRows([[zs]]), openCircuitVoltageV: col([2]) }, fromRows([[{ re: 50, im: -10 }]]));
    expect(r.mismatchFactor).toBeCloseTo(mismatchFactor(zs, { re: 50, im: -10 }), 14);
    expect(mismatchFactor(zs, { re: 30, im: -40 })).toBeCloseTo(1, 15);
    expect(() => mismatchFactor(0, 50)).toThrow(DomainError);
    expect(() => availablePower({ impedanceOhm: fromRows([[{ re: -1, im: 0 }]]), openCircuitVoltageV: col([1]) })).toThrow(NotPositiveDefiniteError);
    expect(() => loadResponse({ impedanceOhm: z, openCircuitVoltageV: v }, fromRows([[1]]))).toThrow(DimensionError);
  });
  it('active reflection Γₙ = (S a)ₙ/aₙ; single-port excitation on a diagonal S reduces to S_nn', () => {
    const s = randomMatrix(3, 3, 60);
    const net = createMultiport('scattering', [1e9, 2e9], [s, scale(s, 0.5)]);
    const a = columnVector([1, { re: 0, im: 1 }, -1]);
    const g = activeReflection(net, a);
    const sa = multiply(s, a);
    for (let i = 0; i < 3; i++) expect(entry(g, 0, i).sub(entry(sa, i).div(entry(a, i))).abs()).toBeLessThan(1e-15);
    expect(() => activeReflection(net, columnVector([1, 0, 1]))).toThrow(DomainError);
  });
  it('one function, two excitation kinds: port currents give the reflection of the waves they launch (power and pseudo-waves)', () => {
    // Independent route: from I, V = Z I, the waves by their definitions (Kurokawa 1965 power waves;
    // Marks & Williams 1992 pseudo-waves), then Γ = (S a)/a with the network's own S.
    const n = 4, kx = 3;
    const z = randomPassiveImpedance(n, 70);
    const cur = randomMatrix(n, kx, 71);
    for (const waves of ['power', 'pseudo'] as const) {
      const refs = [{ re: 50, im: 0 }, { re: 40, im: 15 }, { re: 75, im: -20 }, { re: 50, im: 5 }];
      const net = createMultiport('impedance', [1e9], [z], { referenceOhm: refs, waves });
      const g = activeReflection(net, { kind: 'portCurrents', currents: cur });
      const v = multiply(z, cur);
      const a = zeros(n, kx);
      for (let i = 0; i < n; i++) for (let k = 0; k < kx; k++) {
        const zr = entry(fromRows([[refs[i]]]), 0, 0);
        const ai = entry(v, i, k).add(zr.mul(entry(cur, i, k))).mul(waves === 'power' ? 1 / (2 * Math.sqrt(zr.re)) : Math.sqrt(zr.re) / (2 * zr.abs()));
        a.data[2 * (i * kx + k)] = ai.re; a.data[2 * (i * kx + k) + 1] = ai.im;
      }
      const viaWaves = activeReflection(convertMultiport(net, 'scattering'), { kind: 'incidentWaves', waves: a });
      expectCMatrixClose(g, viaWaves, { rtol: 1e-10 });
      // The bare-matrix form of earlier versions still means incident waves.
      expectCMatrixClose(activeReflection(net, a), viaWaves, { rtol: 1e-12 });
    }
    expect(() => activeReflection(createMultiport('impedance', [1e9], [z]), { kind: 'portCurrents', currents: columnVector([1, 0, 1, 1]) })).toThrow(/excitation\.currents/);
  });
  it('active reflection for K excitations in one call: row f·K + k is (S_f a_k)ₙ / a_k,n (40 ports, 7 scan excitations)', () => {
    const n = 40, kx = 7;
    const s = randomMatrix(n, n, 61);
    const net = createMultiport('scattering', [1e9, 2e9], [s, scale(s, 0.5)]);
    const a = randomMatrix(n, kx, 62);
    const g = activeReflection(net, a);
    expect(g.rows).toBe(2 * kx);
    for (let f = 0; f < 2; f++) {
      const sa = multiply(f === 0 ? s : scale(s, 0.5), a);
      for (let k = 0; k < kx; k++) for (let i = 0; i < n; i++) {
        expect(entry(g, f * kx + k, i).sub(entry(sa, i, k).div(entry(a, i, k))).abs()).toBeLessThan(1e-12 * (1 + entry(g, f * kx + k, i).abs()));
      }
    }
  });
});

/**
 * Independent solve of the full circuit: unknowns x = [V; I] (2N), equations V − Z I = v_oc and one
 * constraint per port: 'open' I = 0, 'short' V = 0, an impedance V + Z_L I = 0 (the load takes −I),
 * or a given injected current I = c (a test source). Plain Kirchhoff bookkeeping, no Schur complement.
 */
function solveCircuit(z: CMatrix, voc: CMatrix, ports: ({ kind: 'load'; load: PortLoad } | { kind: 'current'; a: number })[]): { v: CMatrix; i: CMatrix } {
  const n = z.rows;
  const m = zeros(2 * n, 2 * n), rhs = zeros(2 * n, 1);
  const set = (r: number, c: number, re: number, im = 0) => { m.data[2 * (r * 2 * n + c)] = re; m.data[2 * (r * 2 * n + c) + 1] = im; };
  for (let r = 0; r < n; r++) {
    set(r, r, 1);
    for (let c = 0; c < n; c++) set(r, n + c, -z.data[2 * (r * n + c)], -z.data[2 * (r * n + c) + 1]);
    rhs.data[2 * r] = voc.data[2 * r]; rhs.data[2 * r + 1] = voc.data[2 * r + 1];
  }
  ports.forEach((p, k) => {
    const r = n + k;
    if (p.kind === 'current') { set(r, n + k, 1); rhs.data[2 * r] = p.a; return; }
    if (p.load === 'open') set(r, n + k, 1);
    else if (p.load === 'short') set(r, k, 1);
    else { const zl = p.load as { re: number; im: number }; set(r, k, 1); set(r, n + k, zl.re, zl.im); }
  });
  const x = solve(m, rhs);
  return { v: { rows: n, cols: 1, data: x.data.slice(0, 2 * n) }, i: { rows: n, cols: 1, data: x.data.slice(2 * n) } };
}

describe('terminateSourcePorts: Thevenin and Norton at some ports of a source-bearing multiport', () => {
  const z = randomPassiveImpedance(5, 91);
  const voc = columnVector([{ re: 1, im: 0.5 }, { re: -0.3, im: 0.2 }, 0.7, { re: 0, im: -0.4 }, 0.25]);
  const closed = [1, 3, 4];
  const loads: PortLoad[] = [{ re: 50, im: 10 }, 'short', 'open'];
  const kept = [0, 2];
  const loadFor = (p: number): PortLoad => loads[closed.indexOf(p)];
  const e = terminateSourcePorts({ impedanceOhm: z, openCircuitVoltageV: voc }, closed, loads);
  it('v_th equals the open-circuit voltages of the full circuit; Z_th its responses to test currents', () => {
    expect(e.ports).toEqual(kept);
    const oc = solveCircuit(z, voc, [0, 1, 2, 3, 4].map((p) => (kept.includes(p) ? { kind: 'current' as const, a: 0 } : { kind: 'load' as const, load: loadFor(p) })));
    expectCMatrixClose(e.openCircuitVoltageV, { rows: 2, cols: 1, data: Float64Array.of(oc.v.data[0], oc.v.data[1], oc.v.data[4], oc.v.data[5]) }, { rtol: 1e-12 });
    // Z_th column j: voltages at the kept ports for a 1 A test current into kept port j, sources off.
    const zero = zeros(5, 1);
    kept.forEach((pj, j) => {
      const r = solveCircuit(z, zero, [0, 1, 2, 3, 4].map((p) => (kept.includes(p) ? { kind: 'current' as const, a: p === pj ? 1 : 0 } : { kind: 'load' as const, load: loadFor(p) })));
      kept.forEach((pi, i) => {
        expect(Math.abs(e.impedanceOhm.data[2 * (i * 2 + j)] - r.v.data[2 * pi])).toBeLessThan(1e-10 * 50);
        expect(Math.abs(e.impedanceOhm.data[2 * (i * 2 + j) + 1] - r.v.data[2 * pi + 1])).toBeLessThan(1e-10 * 50);
      });
    });
  });
  it('the Norton dual: i_sc equals the currents the full circuit drives into shorts at the kept ports', () => {
    const sc = solveCircuit(z, voc, [0, 1, 2, 3, 4].map((p) => ({ kind: 'load' as const, load: kept.includes(p) ? 'short' : loadFor(p) })));
    // i_sc is the current out of the port into the short: −I.
    const isc = e.norton!.shortCircuitCurrentA;
    kept.forEach((p, i) => {
      expect(Math.abs(isc.data[2 * i] + sc.i.data[2 * p])).toBeLessThan(1e-12);
      expect(Math.abs(isc.data[2 * i + 1] + sc.i.data[2 * p + 1])).toBeLessThan(1e-12);
    });
  });
  it('Z_th agrees with terminatePorts on the same loads (scattering at 50 Ω converted back)', () => {
    const net = terminatePorts(createMultiport('impedance', [1e9], [z]), closed, loads);
    expectCMatrixClose(multiportMatrix(convertMultiport(net, 'impedance'), 0), e.impedanceOhm, { rtol: 1e-11 });
  });
  it('rejects closing every port, a bad load and a multi-frequency load', () => {
    const t = { impedanceOhm: z, openCircuitVoltageV: voc };
    expect(() => terminateSourcePorts(t, [0, 1, 2, 3, 4], [1, 1, 1, 1, 1])).toThrow(DimensionError);
    expect(() => terminateSourcePorts(t, [0], ['nope' as unknown as PortLoad])).toThrow(DomainError);
    expect(() => terminateSourcePorts(t, [0], [[1, 2]])).toThrow(DimensionError);
    expect(() => terminateSourcePorts(t, [0, 1], [1])).toThrow(DimensionError);
  });
});

describe('loadResponse takes the PortLoad list of terminatePorts', () => {
  const z = randomPassiveImpedance(3, 17);
  const voc = columnVector([1, { re: 0, im: 1 }, -0.5]);
  it("per-port loads with 'open' and 'short' match the full-circuit solve", () => {
    const loads: PortLoad[] = [{ re: 50, im: -5 }, 'open', 'short'];
    const r = loadResponse({ impedanceOhm: z, openCircuitVoltageV: voc }, loads);
    const c = solveCircuit(z, voc, loads.map((load) => ({ kind: 'load' as const, load })));
    expectCMatrixClose(r.voltageV, c.v, { rtol: 1e-12 });
    expectCMatrixClose(r.loadCurrentA, scale(c.i, -1), { rtol: 1e-12 });
    expect(Math.abs(r.portPowerW[1])).toBe(0);
    expect(Math.abs(r.portPowerW[2])).toBe(0);
    // The list form equals the matrix form for the same impedances.
    const m = loadResponse({ impedanceOhm: z, openCircuitVoltageV: voc }, fromRows([[{ re: 50, im: -5 }, 0, 0], [0, 20, 0], [0, 0, 0]]));
    const l = loadResponse({ impedanceOhm: z, openCircuitVoltageV: voc }, [{ re: 50, im: -5 }, 20, 'short']);
    expectCMatrixClose(l.voltageV, m.voltageV, { rtol: 1e-13 });
  });
  it('a lossless source: voltages without a throw, no available power (issue 23)', () => {
    // One-port j50 Ω, v_oc = 1 V into 50 Ω: V = 50/(50 + 50j) → |V| = 1/√2 (voltage divider).
    const r = loadResponse({ impedanceOhm: fromRows([[{ re: 0, im: 50 }]]), openCircuitVoltageV: col([1]) }, [50]);
    expect(Math.hypot(r.voltageV.data[0], r.voltageV.data[1])).toBeCloseTo(Math.SQRT1_2, 14);
    expect(r.availablePowerW).toBeUndefined();
    expect(r.mismatchFactor).toBeUndefined();
    expect(r.totalPowerW).toBeCloseTo(0.5 / 50, 14); // |V|²/R = 0.5/50 W
  });
});

describe('physical checks report violation sizes', () => {
  it('reciprocal passive Z with complex references: reciprocal, passive, lossy', () => {
    const z = randomPassiveImpedance(4, 71);
    const net = renormalizeMultiport(createMultiport('impedance', [1e9], [z]), [{ re: 20, im: 30 }, 50, { re: 70, im: -10 }, 40]);
    expect(checkReciprocity(net).violation).toBeLessThan(1e-14);
    expect(checkPassivity(net).satisfied).toBe(true);
    const l = checkLossless(net);
    expect(l.satisfied).toBe(false);
    expect(l.violation).toBeGreaterThan(1e-3);
  });
  it('a lossless network (unitary S = Cayley transform of jX) and a gain block', () => {
    // Z = jX with X real symmetric is lossless: S = (jX − R)(jX + R)⁻¹ unitary for real R
    const x = randomPassiveImpedance(3, 72);
    for (let q = 0; q < x.data.length; q += 2) x.data[q] = 0;
    const lossless = createMultiport('impedance', [1e9], [x]);
    expect(checkLossless(lossless).violation).toBeLessThan(1e-12);
    const amp = createMultiport('scattering', [1e9, 2e9], [fromRows([[0.1, 0], [3, 0.2]]), fromRows([[0.1, 0], [0.5, 0.2]])]);
    const p = checkPassivity(amp);
    expect(p.satisfied).toBe(false);
    expect(p.worstIndex).toBe(0);
    // σ_max of [[0.1, 0], [3, 0.2]] from the closed form of a 2×2 real matrix (numpy.linalg.svd gives 3.0083…)
    const m = [[0.1, 0], [3, 0.2]];
    const t = m[0][0] ** 2 + m[0][1] ** 2 + m[1][0] ** 2 + m[1][1] ** 2, d = m[0][0] * m[1][1] - m[0][1] * m[1][0];
    const smax = Math.sqrt((t + Math.sqrt(t * t - 4 * d * d)) / 2);
    expect(p.violation).toBeCloseTo(smax - 1, 12);
    expect(checkPassivity(amp).perFrequency[1]).toBe(0);
    expect(checkReciprocity(amp).violation).toBeCloseTo(3, 14);
    expect(() => checkReciprocity(amp, -1)).toThrow(DomainError);
  });
});

describe('interpolateMultiport', () => {
  it('linear in re/im is exact for data linear in frequency; magnitude/phase is exact for a delay line', () => {
    const f = [1e9, 2e9, 3e9];
    const lin = createMultiport('impedance', f, f.map((x) => fromRows([[{ re: x / 1e8, im: -x / 1e9 }]])));
    const i1 = interpolateMultiport(lin, [1.5e9, 2.75e9]);
    expect(i1.data[0]).toBeCloseTo(15, 12);
    expect(i1.data[3]).toBeCloseTo(-2.75, 12);
    // a matched delay line of 0.7 ns: S21 = exp(−jωτ) (phase spans several turns over the band)
    const tau = 0.7e-9;
    const grid = Array.from({ length: 11 }, (_, k) => 1e9 + 2e8 * k);
    const line = (x: number) => { const p = -2 * Math.PI * x * tau; return fromRows([[0, { re: Math.cos(p), im: Math.sin(p) }], [{ re: Math.cos(p), im: Math.sin(p) }, 0]]); };
    const net = createMultiport('scattering', grid, grid.map(line));
    const fq = [1.13e9, 2.55e9, 2.99e9];
    const got = interpolateMultiport(net, fq, 'magnitude-phase');
    fq.forEach((x, k) => expectCMatrixClose(multiportMatrix(got, k), line(x), { rtol: 1e-12 }));
    expect(() => interpolateMultiport(net, [0.5e9])).toThrow(DomainError);
    expect(() => interpolateMultiport(net, [1.5e9], 'cubic' as never)).toThrow(DomainError);
  });
});
