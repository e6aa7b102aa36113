/**
 * Gauss–Legendre quadrature and the product rule on the unit sphere
 * (Gauss–Legendre in cosθ × trapezoid in φ), with its order chosen from the
 * electrical size of an array.
 * @module
 */
import type { ThetaPhiGrid } from './grids.js';
import { ConvergenceError, DomainError } from '../errors.js';
import { assertInteger, assertNonNegative, assertPositive, assertInRange } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { layoutDiameterM, type ArrayLayout } from './layout.js';

/**
 * Nodes and weights of an n-point rule on [−1, 1].
 * @category Geometry
 */
export interface GaussLegendreRule {
  /** Nodes xᵢ, ascending, in (−1, 1). */
  readonly nodes: Float64Array;
  /** Weights wᵢ > 0, summing to 2. */
  readonly weights: Float64Array;
}

/**
 * The n-point Gauss–Legendre rule ∫₋₁¹ f(x) dx ≈ Σ wᵢ f(xᵢ), exact for
 * polynomials of degree ≤ 2n − 1.
 *
 * @remarks
 * Nodes are the zeros of Pₙ, found by Newton's method on the three-term
 * recurrence (A&S 22.7.10) from Tricomi's asymptotic first guess
 * xᵢ ≈ cos(π(i − ¼)/(n + ½)); weights wᵢ = 2 / ((1 − xᵢ²) Pₙ′(xᵢ)²)
 * (M. Abramowitz and I. A. Stegun, *Handbook of Mathematical Functions*, NBS,
 * 1964, eq. 25.4.29 and Table 25.4). Cost O(n²); accurate to a few ulp for
 * n up to several thousand.
 * @param n - Number of nodes, integer in [1, 100000].
 * @returns The rule.
 * @throws {@link DomainError} for a bad n; {@link ConvergenceError} if Newton fails (not expected).
 * @example
 * ```ts
 * gaussLegendre(2).nodes; // [-0.5773502691896257, 0.5773502691896257] (±1/√3)
 * ```
 * @category Geometry
 */
export function gaussLegendre(n: number): GaussLegendreRule {
  assertInteger('n', n, 1, 100000);
  const cached = RULES.get(n);
  if (cached !== undefined) return { nodes: cached.nodes.slice(), weights: cached.weights.slice() };
  const rule = computeGaussLegendre(n);
  if (RULES.size >= 64) RULES.delete(RULES.keys().next().value as number);
  RULES.set(n, rule);
  return { nodes: rule.nodes.slice(), weights: rule.weights.slice() };
}

/** Recently computed rules (the nodes cost O(n²) each; sphere rules ask for the same orders repeatedly). */
const RULES = new Map<number, GaussLegendreRule>();

function computeGaussLegendre(n: number): GaussLegendreRule {
  const nodes = new Float64Array(n), weights = new Float64Array(n);
  const half = Math.floor((n + 1) / 2);
  for (let i = 1; i <= half; i++) {
    let x = Math.cos((Math.PI * (i - 0.25)) / (n + 0.5));
    let dp = 0;
    let converged = false;
    for (let it = 0; it < 100; it++) {
      let p0 = 1, p1 = x;
      for (let k = 2; k <= n; k++) {
        const p2 = ((2 * k - 1) * x * p1 - (k - 1) * p0) / k;
        p0 = p1; p1 = p2;
      }
      if (n === 1) { p0 = 1; p1 = x; }
      dp = (n * (p0 - x * p1)) / ((1 - x) * (1 + x));
      const dx = p1 / dp;
      x -= dx;
      if (Math.abs(dx) <= 1e-16 * Math.max(1, Math.abs(x))) {
        // one more evaluation for the derivative at the converged node
        let q0 = 1, q1 = x;
        for (let k = 2; k <= n; k++) { const q2 = ((2 * k - 1) * x * q1 - (k - 1) * q0) / k; q0 = q1; q1 = q2; }
        if (n === 1) { q0 = 1; q1 = x; }
        dp = (n * (q0 - x * q1)) / ((1 - x) * (1 + x));
        converged = true;
        break;
      }
    }
    if (!converged) throw new ConvergenceError(`gaussLegendre: Newton iteration for node ${i} of ${n} did not converge in 100 steps.`);
    if (i === half && n % 2 === 1) x = 0;
    const w = 2 / ((1 - x) * (1 + x) * dp * dp);
    nodes[n - i] = x; nodes[i - 1] = x === 0 ? 0 : -x;
    weights[n - i] = w; weights[i - 1] = w;
  }
  return { nodes, weights };
}

/**
 * A product quadrature rule on the unit sphere.
 *
 * @remarks
 * ∮ f(r̂) dΩ ≈ Σₖ weights[k] · f(directions[k]). The θ nodes are Gauss–Legendre
 * nodes in cosθ; the φ nodes are φⱼ = 2πj/phiCount (trapezoid, exact for
 * Fourier harmonics |m| < phiCount). Direction k = j·thetaCount + i (θ fastest),
 * weight = wᵢ · 2π/phiCount; the weights sum to 4π. The arrays are computed
 * once: loop over them directly for allocation-free integration.
 * @category Geometry
 */
export interface SphereQuadrature extends ThetaPhiGrid {
  /** Solid-angle weights [sr], length count, summing to 4π. */
  readonly weights: Float64Array;
}

/**
 * Options of {@link sphereQuadrature}.
 * @category Geometry
 */
export interface SphereQuadratureOptions {
  /**
   * Apply the θ rule separately on each hemisphere (cosθ ∈ [0, 1] and [−1, 0]),
   * doubling the θ nodes. Use it for integrands with a kink at the horizon
   * (elements that radiate into z > 0 only), where a single Gauss–Legendre rule
   * converges slowly. @defaultValue false
   */
  splitAtHorizon?: boolean;
  /**
   * Further polar angles θ ∈ (0, π) [rad] at which to split the θ rule (each piece gets
   * `thetaCount` nodes): put them where the integrand jumps or has a kink, e.g. at a reflector's
   * rim seen from its feed, so that the step is integrated exactly. @defaultValue none
   */
  splitAtThetaRad?: ReadonlyArray<number>;
}

/**
 * The product rule with the given numbers of θ and φ nodes.
 * @param thetaCount - Gauss–Legendre nodes in cosθ, integer ≥ 1.
 * @param phiCount - Trapezoid nodes in φ, integer ≥ 1.
 * @param options - Hemisphere split and further θ breakpoints.
 * @returns The rule (thetaCount is multiplied by the number of pieces when split).
 * @throws {@link DomainError} for bad counts or breakpoints outside (0, π).
 * @example
 * ```ts
 * const q = sphereQuadrature(8, 16);
 * q.weights.reduce((a, b) => a + b); // 12.566370614359172 (4π)
 * ```
 * @category Geometry
 */
export function sphereQuadrature(thetaCount: number, phiCount: number, options: SphereQuadratureOptions = {}): SphereQuadrature {
  assertInteger('thetaCount', thetaCount, 1, 100000);
  assertInteger('phiCount', phiCount, 1, 10000000);
  const gl = gaussLegendre(thetaCount);
  // cosθ nodes (descending ⇔ θ ascending) and their weights; a split rule maps the n-point rule
  // onto each piece [x_lo, x_hi] of cosθ between the breakpoints (the horizon is cosθ = 0).
  const cuts = [...(options.splitAtThetaRad ?? [])];
  cuts.forEach((t, i) => {
    if (typeof t !== 'number' || !(t > 0 && t < Math.PI)) throw new DomainError(`invalid option "splitAtThetaRad[${i}]": expected an angle in (0, π) rad, received ${String(t)}.`);
  });
  const bounds: number[] = [];
  for (const x of [1, -1, ...cuts.map((t) => (Math.abs(t - Math.PI / 2) < 1e-15 ? 0 : Math.cos(t))), ...(options.splitAtHorizon ? [0] : [])].sort((a, b) => b - a)) {
    if (bounds.length === 0 || bounds[bounds.length - 1] - x > 1e-14) bounds.push(x);
  }
  const xs: number[] = [], ws: number[] = [];
  for (let b = 0; b + 1 < bounds.length; b++) {
    const hi = bounds[b], lo = bounds[b + 1], h = (hi - lo) / 2;
    if (!(h > 0)) continue;
    for (let i = thetaCount - 1; i >= 0; i--) { xs.push(lo + h * (1 + gl.nodes[i])); ws.push(h * gl.weights[i]); }
  }
  const nt = xs.length;
  thetaCount = nt;
  const count = nt * phiCount;
  const thetaRad = new Float64Array(nt), st = new Float64Array(nt), ct = new Float64Array(nt);
  for (let i = 0; i < nt; i++) {
    const x = xs[i];
    ct[i] = x;
    st[i] = Math.sqrt((1 - x) * (1 + x));
    thetaRad[i] = Math.acos(x);
  }
  const phiRad = new Float64Array(phiCount);
  const directions = new Float64Array(3 * count), weights = new Float64Array(count);
  const dphi = (2 * Math.PI) / phiCount;
  for (let j = 0; j < phiCount; j++) {
    const p = j * dphi;
    phiRad[j] = p;
    const cp = Math.cos(p), sp = Math.sin(p);
    for (let i = 0; i < thetaCount; i++) {
      const k = j * thetaCount + i;
      directions[3 * k] = st[i] * cp;
      directions[3 * k + 1] = st[i] * sp;
      directions[3 * k + 2] = ct[i];
      weights[k] = ws[i] * dphi;
    }
  }
  return { thetaCount, phiCount, count, thetaRad, phiRad, directions, weights };
}

/** ln(n!) for integer n ≥ 0 (exact sum below 64, Stirling series above). */
function logFactorial(n: number): number {
  if (n < 64) {
    let s = 0;
    for (let k = 2; k <= n; k++) s += Math.log(k);
    return s;
  }
  const x = n + 1;
  return (x - 0.5) * Math.log(x) - x + 0.5 * Math.log(2 * Math.PI) + 1 / (12 * x) - 1 / (360 * x ** 3) + 1 / (1260 * x ** 5);
}

/**
 * Options of {@link sphereQuadratureOrder}.
 * @category Geometry
 */
export interface SphereQuadratureOrderOptions {
  /** Target absolute error for one unit-amplitude plane-wave term (see remarks). @defaultValue 1e-12 */
  tolerance?: number;
  /** Extra polynomial degree in cosθ of the integrand beyond the array phase (e.g. 2q for a cos^q θ element power pattern). @defaultValue 0 */
  extraDegree?: number;
}

/**
 * Node counts of the sphere rule from an array's electrical size, with an error bound.
 * @category Geometry
 */
export interface SphereQuadratureOrder {
  /** Gauss–Legendre nodes in cosθ. */
  readonly thetaCount: number;
  /** Trapezoid nodes in φ. */
  readonly phiCount: number;
  /** Bound on |rule − exact| for ∮ exp(j k d·r̂) dΩ with k|d| ≤ electrical diameter (absolute, the exact value being 4π sinc). */
  readonly errorEstimate: number;
}

/**
 * Chooses the node counts of {@link sphereQuadrature} for integrating power
 * patterns of an array of electrical diameter a = k·D.
 *
 * @remarks
 * A power pattern |AF|² = Σₘₙ wₘ wₙ* exp(j k r̂·(rₙ − rₘ)) is a sum of plane-wave
 * terms exp(j k d·r̂) with |d| ≤ D. For one term:
 * - θ (Gauss–Legendre, n nodes): the remainder of A&S 25.4.29,
 *   Rₙ = 2^{2n+1}(n!)⁴ / ((2n+1)((2n)!)³) · f^{(2n)}(ξ), with |f^{(2n)}| ≤ 2π a^{2n}
 *   (rigorous for d ∥ z; used as the estimate for other orientations);
 * - φ (trapezoid, N nodes): the aliasing error is bounded by 2π·2·|J_N(b)|
 *   summed over the θ weights (Σwᵢ = 2), with |J_N(b)| ≤ (a/2)^N / N!
 *   (A&S 9.1.62) for b ≤ a.
 * The smallest n and N that bring each part below tolerance/2 are returned,
 * then `extraDegree` adds ⌈p/2⌉ θ nodes and p φ nodes (common practice for a
 * polynomial factor of degree p), and phiCount is rounded up to an even number
 * so that the rule contains antipodal pairs. The error of a pattern integral is at most
 * errorEstimate·(Σ|wₙ|)² for weights w. The bound is conservative: it asks
 * for about 0.68·a θ nodes where a/2 + O(a^{1/3}) usually suffice.
 * @param electricalDiameterRad - a = k·D (dimensionless), ≥ 0.
 * @param options - Tolerance and extra degree.
 * @returns Node counts and the error bound.
 * @throws {@link DomainError} for negative or non-finite inputs.
 * @example
 * ```ts
 * // an 8-wavelength array:
 * sphereQuadratureOrder(2 * Math.PI * 8); // { thetaCount: 47, phiCount: 94, errorEstimate: 1.7e-13 }
 * ```
 * @category Geometry
 */
export function sphereQuadratureOrder(electricalDiameterRad: number, options: SphereQuadratureOrderOptions = {}): SphereQuadratureOrder {
  assertNonNegative('electricalDiameterRad', electricalDiameterRad);
  const tol = options.tolerance ?? 1e-12;
  assertInRange('options.tolerance', tol, 1e-300, 1);
  const extra = options.extraDegree ?? 0;
  assertInteger('options.extraDegree', extra, 0, 10000);
  const a = electricalDiameterRad;
  const la = a > 0 ? Math.log(a) : -Infinity;
  const logTol = Math.log(tol / 2);
  const thetaBound = (n: number): number =>
    Math.log(2 * Math.PI) + (2 * n + 1) * Math.LN2 + 4 * logFactorial(n) - Math.log(2 * n + 1) - 3 * logFactorial(2 * n) + 2 * n * la;
  const phiBound = (m: number): number => Math.log(8 * Math.PI) + m * (la - Math.LN2) - logFactorial(m);
  let n = 1;
  while (thetaBound(n) > logTol) n++;
  let m = 1;
  while (phiBound(m) > logTol) m++;
  m += extra;
  if (m % 2 === 1) m++; // even: the rule then holds antipodal pairs (see PatternEvaluator.evaluateSphereInto)
  const errorEstimate = Math.exp(thetaBound(n)) + Math.exp(phiBound(m - extra));
  return { thetaCount: n + Math.ceil(extra / 2), phiCount: m, errorEstimate };
}

/**
 * A sphere rule together with its plane-wave error bound.
 * @category Geometry
 */
export interface SizedSphereQuadrature extends SphereQuadrature {
  /** The bound of {@link SphereQuadratureOrder.errorEstimate}. */
  readonly errorEstimate: number;
}

/**
 * The sphere rule sized for an array's power pattern at a frequency
 * (D from {@link layoutDiameterM}, a = kD, counts from {@link sphereQuadratureOrder}).
 * @param layout - The array layout.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param options - Tolerance, extra degree and hemisphere split.
 * @returns The rule and its error bound.
 * @throws {@link DomainError} for a bad frequency or options.
 * @category Geometry
 */
export function sphereQuadratureForLayout(
  layout: ArrayLayout,
  frequencyHz: number,
  options: SphereQuadratureOrderOptions & SphereQuadratureOptions = {},
): SizedSphereQuadrature {
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  const a = wavenumberRadPerM(frequencyHz) * layoutDiameterM(layout);
  const order = sphereQuadratureOrder(a, options);
  if (!Number.isFinite(order.errorEstimate)) throw new DomainError('sphereQuadratureForLayout: the error bound overflowed; reduce the tolerance demand.');
  return { ...sphereQuadrature(order.thetaCount, order.phiCount, { splitAtHorizon: options.splitAtHorizon ?? false }), errorEstimate: order.errorEstimate };
}
