/**
 * Input descriptions of the thin-wire method-of-moments engine: wires, ports,
 * lumped loads, one wire structure (an element or a whole antenna) and the
 * typed error naming the offending wire and segment.
 * @module
 */
import { DomainError } from '../errors.js';
import type { ComplexLike } from '../linalg/cmatrix.js';
import type { Vector3 } from '../geometry/layout.js';

/**
 * One thin wire: a straight piece (two points) or a polyline, with one radius.
 *
 * @remarks
 * The wire is cut into segments automatically (see {@link WireSolveOptions});
 * every polyline vertex, port and load position is a segment end. Ends of
 * wires that coincide (within a thousandth of the smaller radius) form a
 * junction where the currents obey Kirchhoff's current law; an end touching
 * the ground plane is connected to it.
 * @category Wire
 */
export interface WireSpec {
  /** Points of the polyline [m], at least two; consecutive points distinct. */
  readonly pointsM: ReadonlyArray<Vector3>;
  /** Wire radius a [m], > 0 and ≪ λ. */
  readonly radiusM: number;
  /**
   * Number of segments of the whole wire (overrides the automatic length rule
   * for this wire; each straight piece gets its share, at least one).
   * @defaultValue automatic, from `maxSegmentWavelengths`
   */
  readonly segments?: number;
}

/**
 * A delta-gap port at a point of a wire.
 *
 * @remarks
 * The port sits at the arc-length fraction `atFraction` of its wire, measured
 * from the wire's first point. Positive port current flows along the wire in
 * the direction of increasing arc length (at a grounded end: from the ground
 * into the wire). A port may sit at an interior point, at an end joined to
 * exactly one other wire end, or at an end touching the ground plane (a
 * monopole feed); never at a free end (no current flows there) nor at a
 * junction of three or more wire ends (the branch would be ambiguous).
 * @category Wire
 */
export interface WirePort {
  /** Index of the wire in {@link WireStructure.wires}. */
  readonly wire: number;
  /** Position along the wire as a fraction of its length, in [0, 1]. @defaultValue 0.5 (the middle) */
  readonly atFraction?: number;
  /** Name of the port. @defaultValue its one-based index */
  readonly name?: string;
}

/**
 * A lumped load at a point of a wire (in series with the wire there).
 *
 * @remarks
 * Either a fixed or frequency-dependent complex impedance `impedanceOhm`, or
 * an R, L, C combination: `connection: 'series'` (default) gives
 * Z = R + jωL + 1/(jωC); `'parallel'` gives 1/Z = 1/R + 1/(jωL) + jωC, each
 * term present only when its value is given. Time dependence e^{+jωt}
 * (docs/conventions.md). Placement rules as for {@link WirePort}; a load may
 * share its point with a port (the load is then in series with the port).
 * @category Wire
 */
export interface WireLoad {
  /** Index of the wire. */
  readonly wire: number;
  /** Position along the wire as a fraction of its length, in [0, 1]. @defaultValue 0.5 */
  readonly atFraction?: number;
  /** Resistance R [Ω], ≥ 0 (series) or > 0 (parallel). */
  readonly resistanceOhm?: number;
  /** Inductance L [H], ≥ 0 (series) or > 0 (parallel). */
  readonly inductanceH?: number;
  /** Capacitance C [F], > 0 (series) or ≥ 0 (parallel). */
  readonly capacitanceF?: number;
  /** How R, L and C are combined. @defaultValue 'series' */
  readonly connection?: 'series' | 'parallel';
  /** Complex impedance [Ω] (real part ≥ 0), fixed or a function of frequency [Hz]; excludes R, L, C. */
  readonly impedanceOhm?: ComplexLike | ((frequencyHz: number) => ComplexLike);
}

/**
 * A wire antenna: its wires, its ports and its loads. Used both for a whole
 * structure and as the element template of an array ({@link placeWireElement}).
 * @category Wire
 */
export interface WireStructure {
  /** The wires, at least one. */
  readonly wires: ReadonlyArray<WireSpec>;
  /** The ports, at least one. */
  readonly ports: ReadonlyArray<WirePort>;
  /** Lumped loads. @defaultValue none */
  readonly loads?: ReadonlyArray<WireLoad>;
}

/**
 * Invalid wire geometry: a zero-length piece, a zero radius, a segment
 * shorter than its radius or longer than a quarter wavelength, wires that
 * overlap or cross without being joined, a port or load at a free end or at
 * a junction of three or more wires, a wire below the ground plane.
 *
 * @remarks
 * `wire` and `segment` are zero-based indices of the first offending wire and
 * segment (segments counted along the wire from its first point; −1 when the
 * problem is not tied to one segment); `otherWire` and `otherSegment` name the
 * second party of an overlap, else −1. For an array built by
 * {@link placeWireElement}, `element` is the zero-based element index (else −1).
 * @category Wire
 */
export class WireGeometryError extends DomainError {
  /** Zero-based wire index. */
  readonly wire: number;
  /** Zero-based segment index along the wire, or −1. */
  readonly segment: number;
  /** Zero-based index of the second wire of an overlap, or −1. */
  readonly otherWire: number;
  /** Zero-based segment index on the second wire, or −1. */
  readonly otherSegment: number;
  /** Zero-based element index in an array, or −1. */
  readonly element: number;
  /**
   * @param message - Description naming wire, segment, requirement and remedy.
   * @param where - Indices of the offending wire(s), segment(s) and element.
   */
  constructor(message: string, where: { wire: number; segment?: number; otherWire?: number; otherSegment?: number; element?: number }) {
    super(message);
    this.name = 'WireGeometryError';
    this.wire = where.wire;
    this.segment = where.segment ?? -1;
    this.otherWire = where.otherWire ?? -1;
    this.otherSegment = where.otherSegment ?? -1;
    this.element = where.element ?? -1;
  }
}
