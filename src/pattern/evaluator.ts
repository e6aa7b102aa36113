/**
 * A reusable, allocation-free pattern evaluator for one layout and weight set.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout } from '../geometry/layout.js';
import { assertWeights } from './validate.js';
import { evaluateArrayFactor, evaluatePlainWithAntipode, kernelWork, loadWeights, planArrayFactor } from './kernel.js';
import type { SphereQuadrature } from '../geometry/quadrature.js';
import { assertElementFactor, elementFactorAt, type ElementFactor } from './element.js';

/**
 * Evaluates F(r̂) = f(r̂)·wᴴa(r̂) for one layout, weight vector and element
 * factor, without allocating per call (the summation plan is built once).
 * @category Pattern
 */
export interface PatternEvaluator {
  /** Number of elements N. */
  readonly count: number;
  /** Wavenumber k [rad/m]. */
  readonly wavenumberRadPerM: number;
  /**
   * |F| at the unit vector (x, y, z) (not checked for unit length).
   * @param x - Direction cosine along x.
   * @param y - Direction cosine along y.
   * @param z - Direction cosine along z.
   * @returns |F| (field, dimensionless).
   */
  magnitudeAt(x: number, y: number, z: number): number;
  /**
   * F for many directions into `out` (interleaved re/im, length 2M).
   * @param out - Destination, length 2M.
   * @param directions - M unit vectors, xyz-interleaved.
   * @returns `out`.
   */
  evaluateInto(out: Float64Array, directions: Float64Array): Float64Array;
  /**
   * F at every direction of a sphere rule into `out` (interleaved re/im, length 2·rule.count).
   * When the rule holds antipodal pairs (Gauss–Legendre θ nodes are symmetric; an even
   * phiCount pairs φ with φ + π), AF(−r̂) = Σ conj(wₙ) e^{−jk r̂·rₙ} reuses the cos/sin
   * pairs of AF(r̂), halving the cost for layouts without lattice structure; for layouts
   * in the plane z = 0, θ and π − θ share (u, v) as well, quartering it.
   * @param out - Destination, length 2·rule.count.
   * @param rule - The sphere rule.
   * @returns `out`.
   */
  evaluateSphereInto(out: Float64Array, rule: SphereQuadrature): Float64Array;
}

/**
 * Builds a {@link PatternEvaluator}. The pattern-multiplication approximation
 * applies when an element factor other than isotropic is given (see {@link totalPattern}).
 * @param layout - Element positions.
 * @param weights - N×1 weights (copied).
 * @param frequencyHz - Frequency [Hz], > 0.
 * @param element - Element factor. @defaultValue isotropic
 * @returns The evaluator.
 * @throws {@link DimensionError} / {@link DomainError} for bad layout, weights, frequency or element.
 * @category Pattern
 */
export function patternEvaluator(layout: ArrayLayout, weights: CMatrix, frequencyHz: number, element: ElementFactor = { kind: 'isotropic' }): PatternEvaluator {
  assertLayout('layout', layout);
  assertWeights(weights, layout);
  assertPositive('frequencyHz', frequencyHz, 'Hz');
  assertElementFactor(element);
  const plan = planArrayFactor(layout.positionsM);
  const work = kernelWork(plan);
  loadWeights(plan, work, weights.data, layout.enabled);
  const k = wavenumberRadPerM(frequencyHz);
  const dir = new Float64Array(3), val = new Float64Array(2);
  const isotropic = element.kind === 'isotropic';
  let planarZ0 = true;
  for (let n = 0; n < layout.count; n++) if (layout.positionsM[3 * n + 2] !== 0) { planarZ0 = false; break; }
  const applyElement = (out: Float64Array, directions: Float64Array, m: number): void => {
    if (isotropic) return;
    for (let i = 0; i < m; i++) {
      const f = elementFactorAt(element, directions[3 * i], directions[3 * i + 1], directions[3 * i + 2]);
      out[2 * i] *= f;
      out[2 * i + 1] *= f;
    }
  };
  return {
    count: layout.count,
    wavenumberRadPerM: k,
    magnitudeAt(x: number, y: number, z: number): number {
      dir[0] = x; dir[1] = y; dir[2] = z;
      evaluateArrayFactor(plan, work, dir, k, val, 0, 1);
      const a = Math.hypot(val[0], val[1]);
      return isotropic ? a : a * Math.abs(elementFactorAt(element, x, y, z));
    },
    evaluateInto(out: Float64Array, directions: Float64Array): Float64Array {
      const m = directions.length / 3;
      evaluateArrayFactor(plan, work, directions, k, out, 0, m);
      applyElement(out, directions, m);
      return out;
    },
    evaluateSphereInto(out: Float64Array, rule: SphereQuadrature): Float64Array {
      const nt = rule.thetaCount, np = rule.phiCount, dirs = rule.directions;
      // antipode of (iθ, iφ) is (nθ−1−iθ, iφ + nφ/2) when the θ nodes are symmetric and nφ is even
      let paired = !plan.factored && np % 2 === 0;
      for (let i = 0; paired && i < nt; i++) paired = rule.thetaRad[i] + rule.thetaRad[nt - 1 - i] === Math.PI || Math.abs(rule.thetaRad[i] + rule.thetaRad[nt - 1 - i] - Math.PI) < 1e-15;
      if (!paired) {
        evaluateArrayFactor(plan, work, dirs, k, out, 0, rule.count);
      } else {
        const half = np / 2;
        if (planarZ0) {
          // z = 0: AF depends on (u, v) only, and θ ↔ π − θ share (u, v): one pass fills four directions
          const upper = (nt + 1) >> 1;
          for (let j = 0; j < half; j++) {
            for (let i = 0; i < upper; i++) {
              const a = j * nt + i, b = (j + half) * nt + (nt - 1 - i);
              evaluatePlainWithAntipode(plan, work, dirs, k, out, a, b);
              const a2 = j * nt + (nt - 1 - i), b2 = (j + half) * nt + i;
              out[2 * a2] = out[2 * a]; out[2 * a2 + 1] = out[2 * a + 1];
              out[2 * b2] = out[2 * b]; out[2 * b2 + 1] = out[2 * b + 1];
            }
          }
        } else {
          for (let j = 0; j < half; j++) {
            for (let i = 0; i < nt; i++) {
              evaluatePlainWithAntipode(plan, work, dirs, k, out, j * nt + i, (j + half) * nt + (nt - 1 - i));
            }
          }
        }
      }
      applyElement(out, dirs, rule.count);
      return out;
    },
  };
}
