/**
 * A reusable, allocation-free pattern evaluator for one layout and weight set.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertPositive } from '../internal/validate.js';
import { wavenumberRadPerM } from '../units/convert.js';
import { assertLayout, type ArrayLayout } from '../geometry/layout.js';
import { assertWeights } from './validate.js';
import { evaluateArrayFactor, kernelWork, loadWeights, planArrayFactor } from './kernel.js';
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
      if (!isotropic) {
        for (let i = 0; i < m; i++) {
          const f = elementFactorAt(element, directions[3 * i], directions[3 * i + 1], directions[3 * i + 2]);
          out[2 * i] *= f;
          out[2 * i + 1] *= f;
        }
      }
      return out;
    },
  };
}
