/**
 * The solver's view of its input: one segmented template, its placements in
 * space, ground contacts, the basis and the validation of the whole geometry
 * (thin-wire limits, overlaps, the ground plane).
 * @internal
 * @module
 */
import { DomainError } from '../errors.js';
import { assertInRange, assertPositive, describeValue } from '../internal/validate.js';
import { segmentDistance } from '../element/inducedEmf.js';
import { assertGroundPlane, type DipoleGeometry, type GroundPlane } from '../element/types.js';
import { C0_M_PER_S } from '../units/constants.js';
import type { WireElementArray } from './array.js';
import { pwsBasis, SEG, segmentStructure, type PwsBasis, type SegmentedStructure } from './mesh.js';
import { WireGeometryError, type WireStructure } from './types.js';

/**
 * Options of the thin-wire solver.
 * @category Wire
 */
export interface WireSolveOptions {
  /** Longest segment [wavelengths], in (0, 0.25]. @defaultValue 0.05 (λ/20) */
  maxSegmentWavelengths?: number;
  /** Infinite perfectly conducting ground plane z = zM (image theory); wires must lie above it. @defaultValue none (free space) */
  groundPlane?: GroundPlane;
}

/** @internal A validated, placed and segmented model at one frequency. */
export interface PlacedModel {
  readonly frequencyHz: number;
  readonly k: number;
  readonly template: SegmentedStructure;
  readonly basis: PwsBasis;
  /** Number of placements P (1 for a plain structure). */
  readonly placements: number;
  readonly offsets: Float64Array;
  readonly rotations: Float64Array;
  /** Index of each placement's rotation among the distinct ones. */
  readonly rotationId: Int32Array;
  /** Global geometry table (P·S segments) and its ground image (or null). */
  readonly geo: Float64Array;
  readonly image: Float64Array | null;
  readonly plane: GroundPlane | undefined;
  readonly portNames: readonly string[];
  readonly warnings: string[];
  /** Smallest segment length / radius over the structure, largest radius [m]. */
  readonly minLengthToRadius: number;
  readonly maxRadiusM: number;
}

function isElementArray(x: WireStructure | WireElementArray): x is WireElementArray {
  return x !== null && typeof x === 'object' && 'element' in x && 'positionsM' in x;
}

/** @internal Builds and validates the model. */
export function buildModel(input: WireStructure | WireElementArray, frequencyHz: number, options: WireSolveOptions): PlacedModel {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (options === null || typeof options !== 'object') throw new DomainError(`invalid argument "options": expected an object, received ${describeValue(options)}.`);
  const wl = options.maxSegmentWavelengths ?? 0.05;
  assertInRange('options.maxSegmentWavelengths', wl, 1e-6, 0.25);
  if (!(wl > 0)) throw new DomainError(`invalid argument "options.maxSegmentWavelengths": expected a number in (0, 0.25], received ${wl}.`);
  assertGroundPlane('options.groundPlane', options.groundPlane);
  const plane = options.groundPlane;
  const lambda = C0_M_PER_S / frequencyHz;
  const k = (2 * Math.PI) / lambda;
  let element: WireStructure, placements: number, offsets: Float64Array, rotations: Float64Array;
  if (isElementArray(input)) {
    element = input.element;
    placements = input.count;
    if (!Number.isInteger(placements) || placements < 1 || !(input.positionsM instanceof Float64Array) || input.positionsM.length !== 3 * placements ||
      !(input.rotations instanceof Float64Array) || input.rotations.length !== 9 * placements) {
      throw new DomainError(`invalid argument "structure": expected a WireElementArray with count ≥ 1, positionsM of length 3·count and rotations of length 9·count, received ${describeValue(input)}; build it with placeWireElement.`);
    }
    offsets = input.positionsM; rotations = input.rotations;
  } else {
    element = input;
    placements = 1;
    offsets = new Float64Array(3);
    rotations = Float64Array.of(1, 0, 0, 0, 1, 0, 0, 0, 1);
  }
  const template = segmentStructure(isElementArray(input) ? 'structure.element' : 'structure', element, wl * lambda, lambda);
  const S = template.segmentCount;
  // distinct rotations
  const rotationId = new Int32Array(placements);
  const seen: Float64Array[] = [];
  for (let p = 0; p < placements; p++) {
    const r = rotations.subarray(9 * p, 9 * p + 9);
    let id = seen.findIndex((q) => q.every((v, i) => Math.abs(v - r[i]) < 1e-12));
    if (id < 0) { id = seen.length; seen.push(r); }
    rotationId[p] = id;
  }
  // global geometry
  const geo = new Float64Array(placements * S * SEG);
  const tg = template.geo;
  for (let p = 0; p < placements; p++) {
    const R = rotations.subarray(9 * p, 9 * p + 9), ox = offsets[3 * p], oy = offsets[3 * p + 1], oz = offsets[3 * p + 2];
    for (let s = 0; s < S; s++) {
      const a = s * SEG, b = (p * S + s) * SEG;
      const x = tg[a], y = tg[a + 1], z = tg[a + 2], u = tg[a + 3], v = tg[a + 4], w = tg[a + 5];
      geo[b] = R[0] * x + R[1] * y + R[2] * z + ox;
      geo[b + 1] = R[3] * x + R[4] * y + R[5] * z + oy;
      geo[b + 2] = R[6] * x + R[7] * y + R[8] * z + oz;
      geo[b + 3] = R[0] * u + R[1] * v + R[2] * w;
      geo[b + 4] = R[3] * u + R[4] * v + R[5] * w;
      geo[b + 5] = R[6] * u + R[7] * v + R[8] * w;
      geo[b + 6] = tg[a + 6]; geo[b + 7] = tg[a + 7];
    }
  }
  const nt = template.terminalSegment.length;
  const grounded = new Uint8Array(nt);
  let image: Float64Array | null = null;
  if (plane) {
    const zp = plane.zM;
    for (let p = 0; p < placements; p++) {
      for (let t = 0; t < nt; t++) {
        const s = p * S + template.terminalSegment[t], b = s * SEG;
        const z = t % 2 === 0 ? geo[b + 2] : geo[b + 2] + geo[b + 6] * geo[b + 5];
        const g = Math.abs(z - zp) <= 1e-3 * geo[b + 7] ? 1 : 0;
        if (p === 0) grounded[t] = g;
        else if (g !== grounded[t]) {
          throw new WireGeometryError(`element ${p}: the ${t % 2 === 0 ? 'first' : 'last'} end of wire ${t >> 1} ${g ? 'touches' : 'does not touch'} the ground plane, unlike element 0; every placement must meet the ground the same way.`, { wire: t >> 1, element: p });
        }
      }
    }
    image = new Float64Array(geo.length);
    for (let s = 0; s < placements * S; s++) {
      const b = s * SEG;
      image[b] = geo[b]; image[b + 1] = geo[b + 1]; image[b + 2] = 2 * zp - geo[b + 2];
      image[b + 3] = geo[b + 3]; image[b + 4] = geo[b + 4]; image[b + 5] = -geo[b + 5];
      image[b + 6] = geo[b + 6]; image[b + 7] = geo[b + 7];
      // every point at least one radius above the plane, except at a grounded end
      const lo = Math.min(geo[b + 2], geo[b + 2] + geo[b + 6] * geo[b + 5]) - zp;
      const hi = Math.max(geo[b + 2], geo[b + 2] + geo[b + 6] * geo[b + 5]) - zp;
      const ls = s % S;
      const touching = grounded[2 * template.segmentWire[ls]] && template.terminalSegment[2 * template.segmentWire[ls]] === ls ||
        grounded[2 * template.segmentWire[ls] + 1] && template.terminalSegment[2 * template.segmentWire[ls] + 1] === ls;
      if ((!touching && lo < geo[b + 7]) || (touching && hi < geo[b + 7])) {
        throw new WireGeometryError(`wire ${template.segmentWire[ls]} segment ${template.segmentOnWire[ls]}${placements > 1 ? ` of element ${Math.floor(s / S)}` : ''} comes within ${lo.toPrecision(3)} m of the ground plane z = ${zp} m (radius ${geo[b + 7]} m); keep wires at least one radius above the plane or end them on it.`,
          { wire: template.segmentWire[ls], segment: template.segmentOnWire[ls], element: placements > 1 ? Math.floor(s / S) : -1 });
      }
    }
  }
  const basis = pwsBasis(template, grounded, -1);
  checkOverlaps(template, geo, placements);
  const warnings: string[] = [];
  let minRatio = Infinity, maxRadius = 0;
  for (let s = 0; s < S; s++) {
    minRatio = Math.min(minRatio, tg[s * SEG + 6] / tg[s * SEG + 7]);
    maxRadius = Math.max(maxRadius, tg[s * SEG + 7]);
  }
  if (minRatio < 4) warnings.push(`thin-wire limit: a segment is only ${minRatio.toPrecision(3)} radii long (< 4); the reduced kernel loses accuracy, use fewer segments or a thinner wire.`);
  if (k * maxRadius > 0.1) warnings.push(`thin-wire limit: k·a = ${(k * maxRadius).toPrecision(3)} > 0.1 (radius ${maxRadius} m at λ = ${lambda.toPrecision(4)} m); circumferential currents are neglected.`);
  const portNames = placements === 1 ? template.portNames : Array.from({ length: placements * template.portNames.length }, (_, i) => `${Math.floor(i / template.portNames.length) + 1}:${template.portNames[i % template.portNames.length]}`);
  return {
    frequencyHz, k, template, basis, placements, offsets, rotations, rotationId, geo, image, plane, portNames, warnings,
    minLengthToRadius: minRatio, maxRadiusM: maxRadius,
  };
}

/** Segment records as dipole geometries for the shared segment-distance routine. */
function asGeometry(t: Float64Array, s: number): DipoleGeometry {
  const o = s * SEG, h = t[o + 6] / 2;
  return { cx: t[o] + h * t[o + 3], cy: t[o + 1] + h * t[o + 4], cz: t[o + 2] + h * t[o + 5], ax: t[o + 3], ay: t[o + 4], az: t[o + 5], halfLengthM: h, radiusM: t[o + 7] };
}

/** Two segments of the template are adjacent when they share a node (consecutive, or both ends in one junction). */
function adjacent(m: SegmentedStructure, a: number, b: number): boolean {
  if (a === b) return true;
  if (m.segmentWire[a] === m.segmentWire[b] && Math.abs(a - b) === 1) return true;
  const ends = (s: number): number[] => {
    const w = m.segmentWire[s], out: number[] = [];
    if (m.terminalSegment[2 * w] === s) out.push(2 * w);
    if (m.terminalSegment[2 * w + 1] === s) out.push(2 * w + 1);
    return out;
  };
  for (const ta of ends(a)) for (const tb of ends(b)) {
    const c = m.terminalCluster[ta];
    if (c >= 0 && c === m.terminalCluster[tb]) return true;
  }
  return false;
}

/** Same wire and the wire runs straight between the two segments (their distance is the arc length between them). */
function straightBetween(m: SegmentedStructure, a: number, b: number, d: number): boolean {
  if (m.segmentWire[a] !== m.segmentWire[b]) return false;
  const lo = Math.min(a, b), hi = Math.max(a, b);
  let gap = 0;
  for (let s = lo + 1; s < hi; s++) gap += m.geo[s * SEG + 6];
  return d >= 0.999 * gap;
}

/** Throws WireGeometryError when two non-adjacent segments come closer than the sum of their radii. */
function checkOverlaps(m: SegmentedStructure, geo: Float64Array, placements: number): void {
  const S = m.segmentCount, n = S * placements;
  const cx = new Float64Array(n), cy = new Float64Array(n), cz = new Float64Array(n);
  for (let s = 0; s < n; s++) {
    const o = s * SEG, h = geo[o + 6] / 2;
    cx[s] = geo[o] + h * geo[o + 3]; cy[s] = geo[o + 1] + h * geo[o + 4]; cz[s] = geo[o + 2] + h * geo[o + 5];
  }
  for (let a = 0; a < n; a++) {
    const ha = geo[a * SEG + 6] / 2, ra = geo[a * SEG + 7];
    for (let b = a + 1; b < n; b++) {
      const reach = ha + geo[b * SEG + 6] / 2 + ra + geo[b * SEG + 7];
      const dx = cx[a] - cx[b], dy = cy[a] - cy[b], dz = cz[a] - cz[b];
      if (dx * dx + dy * dy + dz * dz > reach * reach) continue;
      const pa = Math.floor(a / S), pb = Math.floor(b / S), la = a % S, lb = b % S;
      if (pa === pb && adjacent(m, la, lb)) continue;
      const d = segmentDistance(asGeometry(geo, a), asGeometry(geo, b));
      if (d < ra + geo[b * SEG + 7] && !(pa === pb && straightBetween(m, la, lb, d))) {
        const wa = m.segmentWire[la], wb = m.segmentWire[lb];
        const where = placements === 1 ? '' : pa === pb ? ` (element ${pa})` : ` (elements ${pa} and ${pb})`;
        throw new WireGeometryError(
          `wire ${wa} segment ${m.segmentOnWire[la]} and wire ${wb} segment ${m.segmentOnWire[lb]}${where} overlap or cross without being joined (axis distance ${d.toPrecision(3)} m < sum of radii ${(ra + geo[b * SEG + 7]).toPrecision(3)} m); move them apart or join them end to end.`,
          { wire: wa, segment: m.segmentOnWire[la], otherWire: wb, otherSegment: m.segmentOnWire[lb], element: placements > 1 ? pa : -1 },
        );
      }
    }
  }
}
