/**
 * Segmentation and topology of a wire structure: segments, junctions, ground
 * contacts, the piecewise-sinusoidal basis functions and where ports and
 * loads sit, with the boundary validation of the inputs.
 * @internal
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite, assertInRange, assertInteger, assertPositive, describeValue } from '../internal/validate.js';
import { assertVector3 } from '../element/types.js';
import type { Vector3 } from '../geometry/layout.js';
import { WireGeometryError, type WireStructure } from './types.js';

/** Stride of one segment record in a geometry table: x0, y0, z0, ux, uy, uz, length, radius. */
export const SEG = 8;

/** Ends of wires closer than this fraction of the smaller radius are one junction. */
const JUNCTION_TOLERANCE = 1e-3;

/** @internal Where a port or load sits before the basis functions exist. */
interface NodeRef {
  /** 'interior': between segments `seg` and `seg + 1`; 'end': at terminal `terminal`. */
  readonly kind: 'interior' | 'end';
  readonly seg: number;
  readonly terminal: number;
}

/**
 * @internal A segmented structure in its own coordinates: geometry table,
 * wire and segment bookkeeping, wire ends (terminals) and their junctions.
 */
export interface SegmentedStructure {
  /** Number of segments S. */
  readonly segmentCount: number;
  /** Geometry table, S records of {@link SEG} numbers. */
  readonly geo: Float64Array;
  /** Wire of each segment. */
  readonly segmentWire: Int32Array;
  /** Index of each segment along its wire. */
  readonly segmentOnWire: Int32Array;
  /** Terminal t = 2w + e is end e (0 first point, 1 last point) of wire w: its segment. */
  readonly terminalSegment: Int32Array;
  /** Junction clusters of terminals (each of size ≥ 2). */
  readonly clusters: readonly (readonly number[])[];
  /** Cluster index of each terminal, −1 for an unjoined end. */
  readonly terminalCluster: Int32Array;
  /** Port positions. */
  readonly portNodes: readonly NodeRef[];
  /** Load positions. */
  readonly loadNodes: readonly NodeRef[];
  /** Port names. */
  readonly portNames: readonly string[];
}

function wireError(msg: string, wire: number, segment = -1, element = -1): WireGeometryError {
  return new WireGeometryError(msg, { wire, segment, element });
}

/** @internal Validates a structure and cuts it into segments no longer than `maxSegmentM` (per wire overrides apply). */
export function segmentStructure(name: string, s: WireStructure, maxSegmentM: number, wavelengthM: number): SegmentedStructure {
  if (s === null || typeof s !== 'object' || !Array.isArray(s.wires) || !Array.isArray(s.ports)) {
    throw new DomainError(`invalid argument "${name}": expected a WireStructure {wires, ports, loads?}, received ${describeValue(s)}.`);
  }
  if (s.wires.length === 0) throw new DomainError(`invalid argument "${name}.wires": expected at least one wire, received an empty array.`);
  if (s.ports.length === 0) throw new DomainError(`invalid argument "${name}.ports": expected at least one port, received an empty array; give e.g. {wire: 0} for a centre feed.`);
  const loads = s.loads ?? [];
  if (!Array.isArray(loads)) throw new DomainError(`invalid argument "${name}.loads": expected an array, received ${describeValue(loads)}.`);
  const nw = s.wires.length;
  // positions (arc length) that must be segment ends, per wire
  const forced: number[][] = Array.from({ length: nw }, () => []);
  const place = (what: string, w: number, frac: number | undefined): void => {
    assertInteger(`${what}.wire`, w, 0, nw - 1);
    assertInRange(`${what}.atFraction`, frac ?? 0.5, 0, 1);
    forced[w].push(frac ?? 0.5);
  };
  s.ports.forEach((p, i) => {
    if (p === null || typeof p !== 'object') throw new DomainError(`invalid argument "${name}.ports[${i}]": expected {wire, atFraction?, name?}, received ${describeValue(p)}.`);
    place(`${name}.ports[${i}]`, p.wire, p.atFraction);
  });
  loads.forEach((l, i) => {
    if (l === null || typeof l !== 'object') throw new DomainError(`invalid argument "${name}.loads[${i}]": expected a WireLoad, received ${describeValue(l)}.`);
    place(`${name}.loads[${i}]`, l.wire, l.atFraction);
  });
  const geo: number[] = [], segWire: number[] = [], segOn: number[] = [];
  const wireArc: number[][] = [];
  const wireFirst: number[] = [], wireLength: number[] = [];
  for (let w = 0; w < nw; w++) {
    const wire = s.wires[w];
    const wn = `${name}.wires[${w}]`;
    if (wire === null || typeof wire !== 'object' || !Array.isArray(wire.pointsM)) {
      throw new DomainError(`invalid argument "${wn}": expected {pointsM, radiusM, segments?}, received ${describeValue(wire)}.`);
    }
    if (typeof wire.radiusM !== 'number' || !Number.isFinite(wire.radiusM) || !(wire.radiusM > 0)) {
      throw wireError(`invalid argument "${wn}.radiusM": wire ${w} needs a finite radius > 0 [m], received ${describeValue(wire.radiusM)}; a thin-wire model needs the true (small) radius.`, w);
    }
    const pts = wire.pointsM;
    if (pts.length < 2) throw wireError(`invalid argument "${wn}.pointsM": wire ${w} needs at least two points, received ${pts.length}.`, w);
    pts.forEach((p: Vector3, i: number) => assertVector3(`${wn}.pointsM[${i}]`, p));
    const cum = [0];
    for (let i = 1; i < pts.length; i++) {
      const len = Math.hypot(pts[i][0] - pts[i - 1][0], pts[i][1] - pts[i - 1][1], pts[i][2] - pts[i - 1][2]);
      if (!(len > 0)) {
        throw wireError(`invalid argument "${wn}.pointsM": wire ${w} has a zero-length piece between points ${i - 1} and ${i} ([${pts[i].join(', ')}] twice); remove the repeated point.`, w);
      }
      cum.push(cum[i - 1] + len);
    }
    const total = cum[cum.length - 1];
    let maxLen = maxSegmentM;
    if (wire.segments !== undefined) {
      assertInteger(`${wn}.segments`, wire.segments, 1);
      maxLen = total / wire.segments;
    }
    const tol = 1e-9 * total;
    const breaks = [...cum, ...forced[w].map((f) => f * total)].sort((a, b) => a - b);
    const uniq: number[] = [];
    for (const b of breaks) if (uniq.length === 0 || b - uniq[uniq.length - 1] > tol) uniq.push(b);
    uniq[uniq.length - 1] = total;
    const arcs: number[] = [0];
    let piece = 0;
    wireFirst.push(segWire.length);
    wireLength.push(total);
    for (let b = 0; b + 1 < uniq.length; b++) {
      const s0 = uniq[b], s1 = uniq[b + 1];
      while (piece < pts.length - 2 && s0 >= cum[piece + 1] - tol) piece++;
      const p0 = pts[piece], p1 = pts[piece + 1];
      const plen = cum[piece + 1] - cum[piece];
      const ux = (p1[0] - p0[0]) / plen, uy = (p1[1] - p0[1]) / plen, uz = (p1[2] - p0[2]) / plen;
      const n = Math.max(1, Math.ceil((s1 - s0) / maxLen - 1e-9));
      const d = (s1 - s0) / n;
      for (let q = 0; q < n; q++) {
        const t = s0 + q * d - cum[piece];
        geo.push(p0[0] + t * ux, p0[1] + t * uy, p0[2] + t * uz, ux, uy, uz, d, wire.radiusM);
        segWire.push(w);
        segOn.push(segOn.length > 0 && segWire[segWire.length - 2] === w ? segOn[segOn.length - 1] + 1 : 0);
        arcs.push(s0 + (q + 1) * d);
        if (d < wire.radiusM) {
          throw wireError(`wire ${w} segment ${segOn[segOn.length - 1]} is ${d.toPrecision(4)} m long, shorter than the wire radius ${wire.radiusM} m; the thin-wire model needs segments of at least a few radii: use fewer segments, a thinner wire, or move ports/loads apart.`, w, segOn[segOn.length - 1]);
        }
        if (d > 0.25 * wavelengthM) {
          throw wireError(`wire ${w} segment ${segOn[segOn.length - 1]} is ${(d / wavelengthM).toPrecision(3)} λ long, more than the 0.25 λ a piecewise-sinusoidal segment allows; raise the segment count or lower maxSegmentWavelengths.`, w, segOn[segOn.length - 1]);
        }
      }
    }
    arcs[arcs.length - 1] = total;
    wireArc.push(arcs);
  }
  const segmentCount = segWire.length;
  const g = Float64Array.from(geo);
  // terminals and junctions
  const nt = 2 * nw;
  const terminalSegment = new Int32Array(nt);
  const tp = new Float64Array(3 * nt), tr = new Float64Array(nt);
  for (let w = 0; w < nw; w++) {
    const first = wireFirst[w], last = (w + 1 < nw ? wireFirst[w + 1] : segmentCount) - 1;
    terminalSegment[2 * w] = first; terminalSegment[2 * w + 1] = last;
    const p0 = s.wires[w].pointsM[0], p1 = s.wires[w].pointsM[s.wires[w].pointsM.length - 1];
    tp.set(p0, 6 * w); tp.set(p1, 6 * w + 3);
    tr[2 * w] = tr[2 * w + 1] = s.wires[w].radiusM;
  }
  const terminalCluster = new Int32Array(nt).fill(-1);
  const clusters: number[][] = [];
  for (let a = 0; a < nt; a++) {
    for (let b = a + 1; b < nt; b++) {
      const dist = Math.hypot(tp[3 * a] - tp[3 * b], tp[3 * a + 1] - tp[3 * b + 1], tp[3 * a + 2] - tp[3 * b + 2]);
      if (dist > JUNCTION_TOLERANCE * Math.min(tr[a], tr[b])) continue;
      const ca = terminalCluster[a], cb = terminalCluster[b];
      if (ca < 0 && cb < 0) { terminalCluster[a] = terminalCluster[b] = clusters.length; clusters.push([a, b]); } else if (ca >= 0 && cb < 0) { terminalCluster[b] = ca; clusters[ca].push(b); } else if (cb >= 0 && ca < 0) { terminalCluster[a] = cb; clusters[cb].push(a); } else if (ca !== cb) {
        for (const t of clusters[cb]) { terminalCluster[t] = ca; clusters[ca].push(t); }
        clusters[cb] = [];
      }
    }
  }
  const locate = (what: string, w: number, frac: number | undefined): NodeRef => {
    const arcs = wireArc[w];
    const target = (frac ?? 0.5) * wireLength[w];
    let j = 0;
    for (let i = 1; i < arcs.length; i++) if (Math.abs(arcs[i] - target) < Math.abs(arcs[j] - target)) j = i;
    if (j === 0 || j === arcs.length - 1) return { kind: 'end', seg: -1, terminal: 2 * w + (j === 0 ? 0 : 1) };
    return { kind: 'interior', seg: wireFirst[w] + j - 1, terminal: -1 };
  };
  const portNodes = s.ports.map((p, i) => locate(`${name}.ports[${i}]`, p.wire, p.atFraction));
  const loadNodes = loads.map((l, i) => locate(`${name}.loads[${i}]`, l.wire, l.atFraction));
  const portNames = s.ports.map((p, i) => {
    if (p.name !== undefined && typeof p.name !== 'string') throw new DomainError(`invalid argument "${name}.ports[${i}].name": expected a string, received ${describeValue(p.name)}.`);
    return p.name ?? String(i + 1);
  });
  return {
    segmentCount, geo: g, segmentWire: Int32Array.from(segWire), segmentOnWire: Int32Array.from(segOn),
    terminalSegment, clusters: clusters.filter((c) => c.length > 0), terminalCluster: remapClusters(terminalCluster, clusters),
    portNodes, loadNodes, portNames,
  };
}

function remapClusters(tc: Int32Array, clusters: number[][]): Int32Array {
  const map = new Int32Array(clusters.length).fill(-1);
  let k = 0;
  clusters.forEach((c, i) => { if (c.length > 0) map[i] = k++; });
  return tc.map((c) => (c < 0 ? -1 : map[c]));
}

/**
 * @internal The piecewise-sinusoidal (PWS) basis of a segmented structure:
 * each basis function is 1 at its node and falls sinusoidally to 0 at the far
 * ends of its two half-modes. Half-mode h = 2s + 0 rises along segment s
 * (0 at its start, 1 at its end), h = 2s + 1 falls (1 at its start).
 */
export interface PwsBasis {
  /** Number of basis functions L. */
  readonly count: number;
  /** CSR start of each half-mode's entries (length 2S + 1). */
  readonly halfStart: Int32Array;
  /** Basis function of each entry. */
  readonly halfBasis: Int32Array;
  /** Sign (+1/−1) of each entry. */
  readonly halfSign: Float64Array;
  /** Basis and sign of each port. */
  readonly portBasis: Int32Array;
  readonly portSign: Float64Array;
  /** Basis of each load. */
  readonly loadBasis: Int32Array;
}

/**
 * @internal Builds the PWS basis given which terminals touch the ground plane.
 * Interior nodes: rise on s, fall on s + 1. A junction of J ends: J − 1 functions
 * from its first end into each other end. A grounded end: one function from
 * the ground into the wire (its image supplies the other half).
 */
export function pwsBasis(m: SegmentedStructure, grounded: Uint8Array, element = -1): PwsBasis {
  const entries: [number, number, number][] = []; // [half, basis, sign]
  let count = 0;
  const interiorBasis = new Int32Array(m.segmentCount).fill(-1);
  for (let s = 0; s + 1 < m.segmentCount; s++) {
    if (m.segmentWire[s] !== m.segmentWire[s + 1]) continue;
    entries.push([2 * s, count, 1], [2 * (s + 1) + 1, count, 1]);
    interiorBasis[s] = count++;
  }
  const terminalBasis = new Int32Array(grounded.length).fill(-1);
  // current flowing into the node along the terminal's segment: rise (+) at a last end, −fall at a first end
  const inflow = (t: number): [number, number] => {
    const s = m.terminalSegment[t];
    return t % 2 === 1 ? [2 * s, 1] : [2 * s + 1, -1];
  };
  for (let t = 0; t < grounded.length; t++) {
    if (!grounded[t]) continue;
    const [h, sg] = inflow(t);
    entries.push([h, count, -sg]); // out of the ground into the wire
    terminalBasis[t] = count++;
  }
  for (const c of m.clusters) {
    if (grounded[c[0]]) continue;
    const [h0, s0] = inflow(c[0]);
    for (let j = 1; j < c.length; j++) {
      const [hj, sj] = inflow(c[j]);
      entries.push([h0, count, s0], [hj, count, -sj]);
      if (c.length === 2) { terminalBasis[c[0]] = count; terminalBasis[c[1]] = count; }
      count++;
    }
  }
  entries.sort((a, b) => a[0] - b[0]);
  const halfStart = new Int32Array(2 * m.segmentCount + 1);
  for (const e of entries) halfStart[e[0] + 1]++;
  for (let h = 0; h < 2 * m.segmentCount; h++) halfStart[h + 1] += halfStart[h];
  const halfBasis = Int32Array.from(entries.map((e) => e[1]));
  const halfSign = Float64Array.from(entries.map((e) => e[2]));
  const resolve = (what: string, i: number, r: NodeRef): [number, number] => {
    if (r.kind === 'interior') return [interiorBasis[r.seg], 1];
    const t = r.terminal, w = t >> 1, seg = m.segmentOnWire[m.terminalSegment[t]];
    if (grounded[t]) {
      // positive along the wire: into the wire at a first end, out of it (into the ground) at a last end
      return [terminalBasis[t], t % 2 === 0 ? 1 : -1];
    }
    const c = m.terminalCluster[t];
    if (c < 0) {
      throw new WireGeometryError(`${what} ${i} sits at the free ${t % 2 === 0 ? 'first' : 'last'} end of wire ${w} (segment ${seg}), where no current flows; move it inside the wire or join that end to another wire or the ground.`, { wire: w, segment: seg, element });
    }
    const members = m.clusters[c];
    if (members.length > 2) {
      throw new WireGeometryError(`${what} ${i} sits on a junction of ${members.length} wire ends (wire ${w}, segment ${seg}), where the branch it feeds is ambiguous; move it into one of the wires.`, { wire: w, segment: seg, element });
    }
    // the basis flows into the node along members[0] and out along members[1]
    if (members[0] === t) return [terminalBasis[t], t % 2 === 1 ? 1 : -1];
    return [terminalBasis[t], t % 2 === 0 ? 1 : -1];
  };
  const portBasis = new Int32Array(m.portNodes.length), portSign = new Float64Array(m.portNodes.length);
  m.portNodes.forEach((r, i) => {
    const [b, sg] = resolve('port', i, r);
    for (let j = 0; j < i; j++) {
      if (portBasis[j] === b) throw new WireGeometryError(`ports ${j} and ${i} sit at the same point; give each port its own point.`, { wire: -1, element });
    }
    portBasis[i] = b; portSign[i] = sg;
  });
  const loadBasis = Int32Array.from(m.loadNodes.map((r, i) => resolve('load', i, r)[0]));
  return { count, halfStart, halfBasis, halfSign, portBasis, portSign, loadBasis };
}
