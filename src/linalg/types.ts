/**
 * The complex-matrix type on its own (no code), so that the validation helpers can name it
 * without importing the module that uses them.
 * @module
 */

/**
 * Dense complex matrix, row-major, interleaved `[re, im]`.
 *
 * @remarks
 * Entry (i, j) has its real part at `data[2·(i·cols + j)]` and its imaginary
 * part at `data[2·(i·cols + j) + 1]`. Column vectors are `CMatrix` values with
 * `cols === 1`. Every phasewise module takes and returns this type; the
 * `data` buffer may be read and written directly in hot loops.
 * Conventions: docs/conventions.md.
 * @category Complex core
 */
export interface CMatrix {
  /** Number of rows, ≥ 0. */
  readonly rows: number;
  /** Number of columns, ≥ 0. */
  readonly cols: number;
  /** Length 2·rows·cols; element (i, j) starts at 2·(i·cols + j). */
  readonly data: Float64Array;
}
