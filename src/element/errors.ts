/**
 * Typed error of the element module.
 * @module
 */
import { DomainError } from '../errors.js';

/**
 * Two elements of an array overlap or touch, so their mutual impedance (and the
 * impedance matrix) is undefined.
 *
 * @remarks
 * Thrown by the mutual-impedance and impedance-matrix functions when the
 * shortest distance between two wire axes is smaller than the larger of the
 * two wire radii (the wires intersect), or when an element coincides with the
 * ground-plane image of another. `pair` holds the zero-based indices.
 * @category Elements
 */
export class CoincidentElementsError extends DomainError {
  /** Zero-based indices of the offending pair (first ≤ second). */
  readonly pair: readonly [number, number];
  /**
   * @param message - Description naming the pair, their distance and the remedy.
   * @param pair - Zero-based indices of the two elements.
   */
  constructor(message: string, pair: readonly [number, number]) {
    super(message);
    this.name = 'CoincidentElementsError';
    this.pair = pair;
  }
}
