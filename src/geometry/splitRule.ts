/**
 * Product rules on the sphere about any polar axis, split at parallels and
 * meridians, so that an integrand with jumps on great circles (a horizon, the
 * edge of a ground plane) is smooth on every piece.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFiniteArray, assertInteger, describeValue } from '../internal/validate.js';
import type { Vector3 } from './layout.js';
import { gaussLegendre } from './quadrature.js';

/**
 * Options of {@link splitSphereRule}.
 * @category Geometry
 */
export interface SplitSphereRuleOptions {
  /** Polar axis p̂ of the rule (any non-zero vector; normalised). */
  readonly polarAxis: Vector3;
  /** A vector not parallel to p̂ fixing the meridian φ′ = 0 (its part ⟂ p̂). @defaultValue the array axis least aligned with p̂ */
  readonly referenceAxis?: Vector3;
  /** Gauss–Legendre nodes in cosθ′ over [−1, 1]; split pieces get nodes in proportion to their length plus 4 (at least 8). */
  readonly thetaCount: number;
  /** Values of cosθ′ in (−1, 1) where the θ′ rule is split (parallels). @defaultValue none */
  readonly thetaSplits?: ReadonlyArray<number>;
  /** Nodes in φ′ over the full circle for the trapezoid (no splits); with splits each sector gets Gauss–Legendre nodes in proportion to its width, times π/2, plus 4 (at least 8). */
  readonly phiCount: number;
  /** Meridians φ′ [rad] where the φ′ rule is split. @defaultValue none */
  readonly phiSplitsRad?: ReadonlyArray<number>;
}

/**
 * Directions and solid-angle weights of a {@link splitSphereRule}, in the array frame.
 * @category Geometry
 */
export interface SplitSphereRule {
  /** Polar angle of each node from +z [rad]. */
  readonly thetaRad: Float64Array;
  /** Azimuth of each node from +x [rad]. */
  readonly phiRad: Float64Array;
  /** Solid-angle weight of each node [sr] (summing to 4π). */
  readonly weightSr: Float64Array;
}

function unit(name: string, v: Vector3): [number, number, number] {
  if (!Array.isArray(v) || v.length !== 3) throw new DomainError(`invalid argument "${name}": expected a 3-vector [x, y, z], received ${describeValue(v)}.`);
  assertFiniteArray(name, v);
  const r = Math.hypot(v[0], v[1], v[2]);
  if (!(r > 0)) throw new DomainError(`invalid argument "${name}": expected a non-zero vector, received [${v.join(', ')}].`);
  return [v[0] / r, v[1] / r, v[2] / r];
}

/** Gauss–Legendre pieces of [a, b] split at the given interior points, `total` nodes over a length `span`. */
function piecewiseRule(a: number, b: number, splits: number[], total: number, span: number): { x: number[]; w: number[] } {
  const edges = [a, ...splits.filter((s) => s > a && s < b).sort((p, q) => p - q), b];
  const x: number[] = [], w: number[] = [];
  for (let e = 0; e + 1 < edges.length; e++) {
    const lo = edges[e], hi = edges[e + 1];
    const cnt = Math.max(8, Math.ceil((total * (hi - lo)) / span) + 4);
    const gl = gaussLegendre(cnt);
    for (let i = 0; i < cnt; i++) { x.push(lo + ((gl.nodes[i] + 1) * (hi - lo)) / 2); w.push((gl.weights[i] * (hi - lo)) / 2); }
  }
  return { x, w };
}

/**
 * A product rule on the unit sphere about an arbitrary polar axis p̂:
 * Gauss–Legendre in cosθ′ (split at the given parallels) times a trapezoid in
 * φ′, or, when meridians are given, Gauss–Legendre per sector in φ′ and in θ′
 * itself (weight sinθ′: with cut sectors the integrand is smooth in θ′ but not
 * in cosθ′ at the poles).
 *
 * @remarks
 * Direction r̂ = cosθ′ p̂ + sinθ′ (cosφ′ ê₁ + sinφ′ ê₂) with ê₁ the part of the
 * reference axis orthogonal to p̂ and ê₂ = p̂ × ê₁ (right-handed). Any great
 * circle through p̂ is a meridian (two values of φ′) and any great circle
 * orthogonal to p̂ is the parallel cosθ′ = 0, so an integrand that is smooth
 * apart from jumps on such circles is integrated with the spectral accuracy of
 * Gauss–Legendre on every piece (M. Abramowitz and I. A. Stegun, *Handbook of
 * Mathematical Functions*, NBS, 1964, eq. 25.4.29; the trapezoid rule for the
 * periodic unsplit case). Angles are returned in the array frame
 * (docs/conventions.md: θ from +z, φ from +x toward +y).
 * @param options - Axis, counts and splits.
 * @returns Directions [rad] and weights [sr].
 * @throws {@link DomainError} for a zero or non-finite axis, an axis parallel to the reference, bad counts or splits.
 * @example
 * ```ts
 * const r = splitSphereRule({ polarAxis: [1, 0, 0], thetaCount: 16, phiCount: 16, phiSplitsRad: [0, Math.PI] });
 * r.weightSr.reduce((a, b) => a + b); // 12.566370614359
 * ```
 * @category Geometry
 */
export function splitSphereRule(options: SplitSphereRuleOptions): SplitSphereRule {
  if (options === null || typeof options !== 'object') throw new DomainError(`invalid argument "options": expected SplitSphereRuleOptions, received ${describeValue(options)}.`);
  const p = unit('options.polarAxis', options.polarAxis);
  assertInteger('options.thetaCount', options.thetaCount, 1, 100000);
  assertInteger('options.phiCount', options.phiCount, 1, 1000000);
  const ts = [...(options.thetaSplits ?? [])], ps = [...(options.phiSplitsRad ?? [])];
  assertFiniteArray('options.thetaSplits', ts);
  assertFiniteArray('options.phiSplitsRad', ps);
  let ref: [number, number, number];
  if (options.referenceAxis !== undefined) ref = unit('options.referenceAxis', options.referenceAxis);
  else {
    const ax = [Math.abs(p[0]), Math.abs(p[1]), Math.abs(p[2])];
    const i = ax[0] <= ax[1] && ax[0] <= ax[2] ? 0 : ax[1] <= ax[2] ? 1 : 2;
    ref = [0, 0, 0]; ref[i] = 1;
  }
  const dot = ref[0] * p[0] + ref[1] * p[1] + ref[2] * p[2];
  const e1r = [ref[0] - dot * p[0], ref[1] - dot * p[1], ref[2] - dot * p[2]];
  const e1n = Math.hypot(e1r[0], e1r[1], e1r[2]);
  if (!(e1n > 1e-9)) throw new DomainError('invalid argument "options.referenceAxis": it is parallel to the polar axis; give a vector that is not.');
  const e1 = [e1r[0] / e1n, e1r[1] / e1n, e1r[2] / e1n];
  const e2 = [p[1] * e1[2] - p[2] * e1[1], p[2] * e1[0] - p[0] * e1[2], p[0] * e1[1] - p[1] * e1[0]];
  // With meridian splits the integrand is smooth in θ′ but not in cosθ′ at the poles (the
  // sector cuts the φ′ harmonics that make √(1 − cos²θ′) cancel), so Gauss–Legendre runs in θ′
  // itself with weight sinθ′ (π/2 more nodes for the same band limit); otherwise in cosθ′.
  let th: { x: number[]; w: number[] };
  if (ps.length > 0) {
    const a = piecewiseRule(0, Math.PI, ts.map((c) => Math.acos(Math.max(-1, Math.min(1, c)))), Math.ceil((options.thetaCount * Math.PI) / 2), Math.PI);
    th = { x: a.x.map(Math.cos), w: a.x.map((t, i) => a.w[i] * Math.sin(t)) };
  } else {
    th = piecewiseRule(-1, 1, ts, options.thetaCount, 2);
  }
  let phx: number[], phw: number[];
  if (ps.length === 0) {
    const m = options.phiCount;
    phx = Array.from({ length: m }, (_, j) => (2 * Math.PI * j) / m);
    phw = Array.from({ length: m }, () => (2 * Math.PI) / m);
  } else {
    // sectors between consecutive meridians, taken modulo 2π starting at the first one
    const base = ((ps[0] % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI);
    const rel = ps.map((v) => ((((v - base) % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI)));
    // Gauss–Legendre needs about π/2 times the trapezoid's nodes for the same band limit
    // (its nodes thin out towards the middle of each piece), so the sectors get φ′ nodes in that proportion
    const r = piecewiseRule(0, 2 * Math.PI, rel, Math.ceil((options.phiCount * Math.PI) / 2), 2 * Math.PI);
    phx = r.x.map((v) => v + base); phw = r.w;
  }
  const nt = th.x.length, np = phx.length, count = nt * np;
  const thetaRad = new Float64Array(count), phiRad = new Float64Array(count), weightSr = new Float64Array(count);
  for (let j = 0; j < np; j++) {
    const cp = Math.cos(phx[j]), sp = Math.sin(phx[j]);
    const qx = cp * e1[0] + sp * e2[0], qy = cp * e1[1] + sp * e2[1], qz = cp * e1[2] + sp * e2[2];
    for (let i = 0; i < nt; i++) {
      const c = th.x[i], s = Math.sqrt(Math.max(0, (1 - c) * (1 + c)));
      const x = c * p[0] + s * qx, y = c * p[1] + s * qy, z = c * p[2] + s * qz;
      const k = j * nt + i;
      thetaRad[k] = Math.acos(Math.max(-1, Math.min(1, z)));
      phiRad[k] = Math.atan2(y, x);
      weightSr[k] = th.w[i] * phw[j];
    }
  }
  return { thetaRad, phiRad, weightSr };
}
