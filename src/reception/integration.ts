/**
 * The sphere rule that adapts to the array and its environment: split where
 * the brightness or the patterns jump, sized from the array's electrical
 * extent and element heights, and paired with a finer rule for the
 * refinement estimate of the integration error.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertPositive, describeValue } from '../internal/validate.js';
import type { Vector3 } from '../geometry/layout.js';
import { sphereQuadratureOrder } from '../geometry/quadrature.js';
import { splitSphereRule } from '../geometry/splitRule.js';
import { C0_M_PER_S } from '../units/constants.js';
import type { QuadratureDirections } from './patterns.js';
import type { PortGeometry } from './ports.js';

/**
 * Options of {@link adaptiveSphereRule}.
 * @category Reception
 */
export interface AdaptiveSphereRuleOptions {
  /** Great circles where the environment jumps, by their normals (NoiseEnvironment.edgeNormals). @defaultValue none */
  readonly edgeNormals?: ReadonlyArray<Vector3>;
  /** Target error of one plane-wave term (sphereQuadratureOrder's tolerance). @defaultValue 1e-8 */
  readonly tolerance?: number;
  /** Node-count factor (> 0): 1 for the rule itself, larger for the refinement rule. @defaultValue 1 */
  readonly refinement?: number;
}

/**
 * An adaptive sphere rule and how it was built.
 * @category Reception
 */
export interface AdaptiveSphereRule extends QuadratureDirections {
  /** Polar axis of the product rule (array coordinates). */
  readonly polarAxis: Vector3;
  /** Gauss–Legendre nodes in cosθ′ (before splitting). */
  readonly thetaCount: number;
  /** Nodes in φ′ (before splitting). */
  readonly phiCount: number;
  /** Electrical size used for the orders, k·(extent incl. ground images) + k·element size (dimensionless). */
  readonly electricalSizeRad: number;
  /** 'line' when the polar axis follows a line array, 'edges' when it is set by the discontinuities. */
  readonly kind: 'line' | 'edges';
}

function normalise(v: Vector3): [number, number, number] {
  const r = Math.hypot(v[0], v[1], v[2]);
  return [v[0] / r, v[1] / r, v[2] / r];
}
const dot3 = (a: Vector3, b: Vector3): number => a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
const cross3 = (a: Vector3, b: Vector3): [number, number, number] => [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];

/**
 * A sphere rule for the brightness integrals of an array, split at every jump
 * of the integrand and sized from the array.
 *
 * @remarks
 * Discontinuities: the environment's edges (a horizon, tilted or not) and,
 * over an infinite ground plane, the plane itself (the patterns vanish below
 * it, with a kink from the image at grazing incidence). They are great
 * circles; the rule's polar axis is chosen so that each becomes a meridian or
 * the equator of a {@link splitSphereRule}, where Gauss–Legendre pieces
 * integrate the smooth parts with spectral accuracy:
 * - a line array lying in every discontinuity plane: polar axis along the
 *   line (the array phase then depends on cosθ′ alone and φ′ only resolves
 *   the element pattern); the circles are meridians;
 * - two distinct circles (a tilted horizon over a ground plane): polar axis
 *   along their intersection, both circles are meridians;
 * - one circle: polar axis along its normal, the θ′ rule split at the equator.
 * Orders: {@link sphereQuadratureOrder} for the electrical size
 * a = k·(extent of the elements and their ground images) + k·(element size)
 * (along the line for a line array; the transverse size k·(2·height +
 * element size) sizes φ′ there), times `refinement`. A plain product rule
 * misses the spillover of the shipped L-band example by 23 % (issue 17); this
 * rule converges there (tested against the numpy reference in
 * test/reception/fixtures).
 * @param geometry - Element positions, element size and ground plane [m].
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Environment edges, tolerance, refinement factor.
 * @returns Directions [rad] and weights [sr] with the rule's description.
 * @throws {@link DomainError} for malformed geometry or options.
 * @category Reception
 */
export function adaptiveSphereRule(geometry: PortGeometry, frequencyHz: number, options: AdaptiveSphereRuleOptions = {}): AdaptiveSphereRule {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  if (geometry === null || typeof geometry !== 'object' || !(geometry.positionsM instanceof Float64Array) || geometry.positionsM.length % 3 !== 0 || geometry.positionsM.length === 0) {
    throw new DomainError(`invalid argument "geometry": expected {positionsM: Float64Array of 3N values, elementSizeM, groundPlaneZM?}, received ${describeValue(geometry)}.`);
  }
  const refinement = options.refinement ?? 1;
  assertPositive('options.refinement', refinement);
  const tol = options.tolerance ?? 1e-8;
  assertPositive('options.tolerance', tol);
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const pos = geometry.positionsM, n = pos.length / 3;
  const ground = geometry.groundPlaneZM;
  // the phase extent: elements and their images
  const pts: number[][] = [];
  for (let i = 0; i < n; i++) {
    pts.push([pos[3 * i], pos[3 * i + 1], pos[3 * i + 2]]);
    if (ground !== undefined) pts.push([pos[3 * i], pos[3 * i + 1], 2 * ground - pos[3 * i + 2]]);
  }
  const c = [0, 0, 0];
  for (const p of pts) { c[0] += p[0] / pts.length; c[1] += p[1] / pts.length; c[2] += p[2] / pts.length; }
  let radius = 0;
  for (const p of pts) radius = Math.max(radius, Math.hypot(p[0] - c[0], p[1] - c[1], p[2] - c[2]));
  const size = Math.max(0, geometry.elementSizeM);
  let height = 0;
  if (ground !== undefined) for (let i = 0; i < n; i++) height = Math.max(height, pos[3 * i + 2] - ground);
  // discontinuity normals, parallel ones merged
  const normals: [number, number, number][] = [];
  const add = (v: Vector3): void => {
    const u = normalise(v);
    if (!normals.some((w) => Math.hypot(...cross3(u, w)) < 1e-9)) normals.push(u);
  };
  if (ground !== undefined) add([0, 0, 1]);
  for (const e of options.edgeNormals ?? []) add(e);
  // line array?
  let axis: [number, number, number] | null = null;
  if (n >= 2) {
    let far = 0, fi = 0;
    for (let i = 1; i < n; i++) { const d = Math.hypot(pos[3 * i] - pos[0], pos[3 * i + 1] - pos[1], pos[3 * i + 2] - pos[2]); if (d > far) { far = d; fi = i; } }
    if (far > 0) {
      const a = normalise([pos[3 * fi] - pos[0], pos[3 * fi + 1] - pos[1], pos[3 * fi + 2] - pos[2]]);
      let off = 0;
      for (let i = 0; i < n; i++) {
        const d: Vector3 = [pos[3 * i] - pos[0], pos[3 * i + 1] - pos[1], pos[3 * i + 2] - pos[2]];
        off = Math.max(off, Math.hypot(...cross3(d, a)));
      }
      if (off <= 1e-9 * far && normals.every((w) => Math.abs(dot3(w, a)) < 1e-9)) axis = a;
    }
  }
  const meridians = (p: Vector3, e1: Vector3): number[] => {
    const e2 = cross3(p, e1);
    const out: number[] = [];
    for (const w of normals) {
      const a = Math.atan2(-dot3(e1, w), dot3(e2, w));
      out.push(a, a + Math.PI);
    }
    return out;
  };
  const scaled = (v: number): number => Math.max(4, Math.ceil(v * refinement));
  if (axis !== null) {
    const aLong = 2 * k * radius + k * size;
    const aTrans = k * (2 * height + size);
    const th = sphereQuadratureOrder(aLong + aTrans, { tolerance: tol }).thetaCount;
    const ph = sphereQuadratureOrder(aTrans, { tolerance: tol }).phiCount + 8;
    const base: Vector3 = normals.length > 0 ? normals[0] : Math.abs(axis[2]) < 0.9 ? [0, 0, 1] : [1, 0, 0];
    const b = dot3(base, axis);
    const e1p = normalise([base[0] - b * axis[0], base[1] - b * axis[1], base[2] - b * axis[2]]);
    const rule = splitSphereRule({ polarAxis: axis, referenceAxis: e1p, thetaCount: scaled(th), phiCount: scaled(ph), phiSplitsRad: meridians(axis, e1p) });
    return { ...rule, polarAxis: axis, thetaCount: scaled(th), phiCount: scaled(ph), electricalSizeRad: aLong + aTrans, kind: 'line' };
  }
  const a = 2 * k * radius + k * size;
  const order = sphereQuadratureOrder(a, { tolerance: tol });
  if (normals.length >= 2) {
    const p = normalise(cross3(normals[0], normals[1]));
    const rule = splitSphereRule({ polarAxis: p, referenceAxis: normals[0], thetaCount: scaled(order.thetaCount), phiCount: scaled(order.phiCount), phiSplitsRad: meridians(p, normals[0]) });
    return { ...rule, polarAxis: p, thetaCount: scaled(order.thetaCount), phiCount: scaled(order.phiCount), electricalSizeRad: a, kind: 'edges' };
  }
  const p: Vector3 = normals.length === 1 ? normals[0] : [0, 0, 1];
  const rule = splitSphereRule({ polarAxis: p, thetaCount: scaled(order.thetaCount), phiCount: scaled(order.phiCount), thetaSplits: normals.length === 1 ? [0] : [] });
  return { ...rule, polarAxis: p, thetaCount: scaled(order.thetaCount), phiCount: scaled(order.phiCount), electricalSizeRad: a, kind: 'edges' };
}
