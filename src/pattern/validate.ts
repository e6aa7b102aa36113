/**
 * Boundary checks shared by the pattern functions.
 * @internal
 * @module
 */
import { DimensionError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertColumn, assertFiniteCMatrix } from '../internal/validate.js';
import type { ArrayLayout } from '../geometry/layout.js';

/** Throws unless `weights` is a finite N×1 column matching the layout. */
export function assertWeights(weights: CMatrix, layout: ArrayLayout): void {
  assertColumn('weights', weights, layout.count, 'one complex weight per element of "layout"');
  assertFiniteCMatrix('weights', weights);
}

/** Throws unless `out` is an M×1 CMatrix. */
export function assertOutColumn(name: string, out: CMatrix, m: number): void {
  if (!out || !(out.data instanceof Float64Array) || out.rows !== m || out.cols !== 1 || out.data.length !== 2 * m) {
    throw new DimensionError(`invalid argument "${name}": expected an ${m}×1 CMatrix (one entry per direction), received ${out ? `${out.rows}×${out.cols}` : String(out)}.`);
  }
}
