/**
 * The one complex-matrix type of phasewise, its factories, element access and
 * serialisation.
 * @module
 */
import { Complex } from 'complex.js';
import { DimensionError, DomainError, ParseError } from '../errors.js';
import { assertCMatrix, assertInteger, describeValue } from '../internal/validate.js';
import type { CMatrix } from './types.js';
import { displayPrototype } from '../display/attach.js';
import { show } from '../display/format.js';

/** Shared prototype of every matrix the factories make: prints as a summary in Node (docs/display.md). */
const CMATRIX_PROTOTYPE = displayPrototype('CMatrix');

/** A matrix object on the display prototype, fields as given (no checks). */
function makeMatrix(rows: number, cols: number, data: Float64Array): CMatrix {
  const m = Object.create(CMATRIX_PROTOTYPE) as { rows: number; cols: number; data: Float64Array };
  m.rows = rows;
  m.cols = cols;
  m.data = data;
  return m;
}

export type { CMatrix } from './types.js';

/**
 * A complex scalar as accepted at the API surface: a real number, a plain
 * `{re, im}` object, or a complex.js value.
 * @category Complex core
 */
export type ComplexLike = number | ComplexParts | Complex;

/**
 * A plain complex value by its parts.
 * @category Complex core
 */
export interface ComplexParts {
  /** Real part. */
  re: number;
  /** Imaginary part. */
  im: number;
}

/**
 * Serialised form of a {@link CMatrix} (see {@link matrixToJSON}).
 * @category Complex core
 */
export interface CMatrixJSON {
  /** Number of rows. */
  rows: number;
  /** Number of columns. */
  cols: number;
  /** Real parts, row-major, length rows·cols. */
  re: number[];
  /** Imaginary parts, row-major, length rows·cols. */
  im: number[];
}

function checkDims(rows: number, cols: number): void {
  assertInteger('rows', rows, 0);
  assertInteger('cols', cols, 0);
}

/**
 * Wraps an existing interleaved buffer as a CMatrix without copying.
 * @param rows - Number of rows, integer ≥ 0.
 * @param cols - Number of columns, integer ≥ 0.
 * @param data - Interleaved storage of length 2·rows·cols.
 * @returns A CMatrix view sharing `data`.
 * @throws {@link DimensionError} if the buffer length does not match.
 * @category Complex core
 */
export function matrixView(rows: number, cols: number, data: Float64Array): CMatrix {
  checkDims(rows, cols);
  if (!(data instanceof Float64Array) || data.length !== 2 * rows * cols) {
    throw new DimensionError(`invalid argument "data": expected a Float64Array of length ${2 * rows * cols} (2·${rows}·${cols}), received ${describeValue(data)}.`);
  }
  return makeMatrix(rows, cols, data);
}

/**
 * A rows×cols matrix of zeros.
 * @param rows - Number of rows, integer ≥ 0.
 * @param cols - Number of columns, integer ≥ 0 (default: `rows`).
 * @returns A new zero matrix.
 * @category Complex core
 */
export function zeros(rows: number, cols: number = rows): CMatrix {
  checkDims(rows, cols);
  return makeMatrix(rows, cols, new Float64Array(2 * rows * cols));
}

/**
 * The n×n identity matrix.
 * @param n - Order, integer ≥ 0.
 * @returns A new identity matrix.
 * @category Complex core
 */
export function identity(n: number): CMatrix {
  const m = zeros(n, n);
  for (let i = 0; i < n; i++) m.data[2 * (i * n + i)] = 1;
  return m;
}

/**
 * Reads a complex scalar from any {@link ComplexLike} form.
 * @param name - Argument name used in error messages.
 * @param z - The value.
 * @returns `[re, im]`.
 * @throws {@link DomainError} if the value is not a finite number or complex value.
 * @category Complex core
 */
export function complexParts(name: string, z: ComplexLike): [number, number] {
  let re: number;
  let im: number;
  if (typeof z === 'number') {
    re = z;
    im = 0;
  } else if (z !== null && typeof z === 'object' && typeof z.re === 'number' && typeof z.im === 'number') {
    re = z.re;
    im = z.im;
  } else {
    throw new DomainError(`invalid argument "${name}": expected a number, {re, im} or complex.js value, received ${describeValue(z)}.`);
  }
  if (!Number.isFinite(re) || !Number.isFinite(im)) {
    throw new DomainError(`invalid argument "${name}": expected a finite complex value, received ${re} + ${im}j.`);
  }
  return [re, im];
}

/**
 * Builds a matrix from nested rows of scalars.
 * @param rows - Array of rows, each an array of numbers, `{re, im}` objects or complex.js values; all rows the same length.
 * @returns A new CMatrix.
 * @throws {@link DimensionError} on ragged rows; {@link DomainError} on non-finite entries.
 * @example
 * ```ts
 * const z = fromRows([[73.1, { re: 0, im: 42.5 }], [1, 2]]);
 * ```
 * @category Complex core
 */
export function fromRows(rows: ReadonlyArray<ReadonlyArray<ComplexLike>>): CMatrix {
  if (!Array.isArray(rows)) {
    throw new DimensionError(`invalid argument "rows": expected an array of rows, received ${describeValue(rows)}.`);
  }
  const r = rows.length;
  const c = r === 0 ? 0 : (Array.isArray(rows[0]) ? rows[0].length : -1);
  const m = zeros(r, Math.max(c, 0));
  for (let i = 0; i < r; i++) {
    const row = rows[i];
    if (!Array.isArray(row) || row.length !== c) {
      throw new DimensionError(`invalid argument "rows": row ${i} has ${Array.isArray(row) ? row.length : 'no'} entries, expected ${c} like row 0.`);
    }
    for (let j = 0; j < c; j++) {
      const [re, im] = complexParts(`rows[${i}][${j}]`, row[j]);
      m.data[2 * (i * c + j)] = re;
      m.data[2 * (i * c + j) + 1] = im;
    }
  }
  return m;
}

/**
 * Builds a matrix from separate real and imaginary parts.
 * @param re - Real parts, row-major, length rows·cols.
 * @param im - Imaginary parts, row-major, length rows·cols (or omitted/null for a real matrix).
 * @param rows - Number of rows.
 * @param cols - Number of columns (default 1: a column vector).
 * @returns A new CMatrix.
 * @throws {@link DimensionError} if lengths disagree.
 * @category Complex core
 */
export function fromParts(re: ArrayLike<number>, im: ArrayLike<number> | null | undefined, rows: number, cols = 1): CMatrix {
  checkDims(rows, cols);
  const n = rows * cols;
  if (re.length !== n) throw new DimensionError(`invalid argument "re": expected length ${n} (${rows}×${cols}), received ${re.length}.`);
  if (im && im.length !== n) throw new DimensionError(`invalid argument "im": expected length ${n} (${rows}×${cols}), received ${im.length}.`);
  const m = zeros(rows, cols);
  for (let k = 0; k < n; k++) {
    m.data[2 * k] = re[k];
    m.data[2 * k + 1] = im ? im[k] : 0;
  }
  return m;
}

/**
 * A column vector from a list of scalars.
 * @param values - Entries (numbers, `{re, im}` or complex.js values).
 * @returns An n×1 CMatrix.
 * @category Complex core
 */
export function columnVector(values: ReadonlyArray<ComplexLike>): CMatrix {
  const m = zeros(values.length, 1);
  for (let i = 0; i < values.length; i++) {
    const [re, im] = complexParts(`values[${i}]`, values[i]);
    m.data[2 * i] = re;
    m.data[2 * i + 1] = im;
  }
  return m;
}

/**
 * A square diagonal matrix.
 * @param values - Diagonal entries (numbers, `{re, im}` or complex.js values), or a real Float64Array.
 * @returns An n×n CMatrix.
 * @category Complex core
 */
export function diagonal(values: ReadonlyArray<ComplexLike> | Float64Array): CMatrix {
  const n = values.length;
  const m = zeros(n, n);
  for (let i = 0; i < n; i++) {
    const [re, im] = complexParts(`values[${i}]`, values[i] as ComplexLike);
    m.data[2 * (i * n + i)] = re;
    m.data[2 * (i * n + i) + 1] = im;
  }
  return m;
}

/**
 * A deep copy.
 * @param a - Matrix to copy.
 * @returns A new CMatrix with its own storage.
 * @category Complex core
 */
export function clone(a: CMatrix): CMatrix {
  assertCMatrix('a', a);
  return makeMatrix(a.rows, a.cols, a.data.slice());
}

function checkIndex(a: CMatrix, i: number, j: number): void {
  if (!Number.isInteger(i) || i < 0 || i >= a.rows) {
    throw new DimensionError(`invalid argument "i": expected an integer row index in [0, ${a.rows - 1}], received ${describeValue(i)}.`);
  }
  if (!Number.isInteger(j) || j < 0 || j >= a.cols) {
    throw new DimensionError(`invalid argument "j": expected an integer column index in [0, ${a.cols - 1}], received ${describeValue(j)}.`);
  }
}

/**
 * Entry (i, j) as a complex.js value.
 * @param a - Matrix.
 * @param i - Zero-based row.
 * @param j - Zero-based column (default 0, convenient for vectors).
 * @returns The entry.
 * @category Complex core
 */
export function entry(a: CMatrix, i: number, j = 0): Complex {
  checkIndex(a, i, j);
  const k = 2 * (i * a.cols + j);
  return new Complex(a.data[k], a.data[k + 1]);
}

/**
 * Writes entry (i, j) in place.
 * @param a - Matrix (modified).
 * @param i - Zero-based row.
 * @param j - Zero-based column.
 * @param value - New value.
 * @returns `a`.
 * @category Complex core
 */
export function setEntry(a: CMatrix, i: number, j: number, value: ComplexLike): CMatrix {
  checkIndex(a, i, j);
  const [re, im] = complexParts('value', value);
  const k = 2 * (i * a.cols + j);
  a.data[k] = re;
  a.data[k + 1] = im;
  return a;
}

/**
 * Real parts, row-major.
 * @param a - Matrix.
 * @returns Float64Array of length rows·cols.
 * @category Complex core
 */
export function realPart(a: CMatrix): Float64Array {
  assertCMatrix('a', a);
  const n = a.rows * a.cols;
  const out = new Float64Array(n);
  for (let k = 0; k < n; k++) out[k] = a.data[2 * k];
  return out;
}

/**
 * Imaginary parts, row-major.
 * @param a - Matrix.
 * @returns Float64Array of length rows·cols.
 * @category Complex core
 */
export function imagPart(a: CMatrix): Float64Array {
  assertCMatrix('a', a);
  const n = a.rows * a.cols;
  const out = new Float64Array(n);
  for (let k = 0; k < n; k++) out[k] = a.data[2 * k + 1];
  return out;
}

/**
 * Nested rows of complex.js values (convenient for printing and tests).
 * @param a - Matrix.
 * @returns `rows` arrays of `cols` complex.js values.
 * @category Complex core
 */
export function toRows(a: CMatrix): Complex[][] {
  assertCMatrix('a', a);
  const out: Complex[][] = [];
  for (let i = 0; i < a.rows; i++) {
    const row: Complex[] = [];
    for (let j = 0; j < a.cols; j++) {
      const k = 2 * (i * a.cols + j);
      row.push(new Complex(a.data[k], a.data[k + 1]));
    }
    out.push(row);
  }
  return out;
}

/**
 * JSON-safe serialisation (separate real and imaginary arrays).
 * @param a - Matrix.
 * @returns A plain object; `JSON.stringify` it freely.
 * @category Complex core
 */
export function matrixToJSON(a: CMatrix): CMatrixJSON {
  return { rows: a.rows, cols: a.cols, re: Array.from(realPart(a)), im: Array.from(imagPart(a)) };
}

/**
 * Inverse of {@link matrixToJSON}; validates the object.
 * @param json - Parsed object with `rows`, `cols`, `re`, `im`.
 * @returns A new CMatrix.
 * @throws {@link ParseError} if fields are missing or inconsistent.
 * @category Complex core
 */
export function matrixFromJSON(json: CMatrixJSON): CMatrix {
  if (json === null || typeof json !== 'object') throw new ParseError(`expected an object {rows, cols, re, im}, received ${describeValue(json)}`);
  const { rows, cols, re, im } = json;
  if (!Number.isInteger(rows) || rows < 0 || !Number.isInteger(cols) || cols < 0) {
    throw new ParseError(`fields "rows" and "cols" must be integers ≥ 0, received ${describeValue(rows)} and ${describeValue(cols)}`);
  }
  const n = rows * cols;
  if (!Array.isArray(re) || re.length !== n) throw new ParseError(`field "re" must be an array of ${n} numbers, received ${describeValue(re)}`);
  if (!Array.isArray(im) || im.length !== n) throw new ParseError(`field "im" must be an array of ${n} numbers, received ${describeValue(im)}`);
  for (let k = 0; k < n; k++) {
    if (typeof re[k] !== 'number' || !Number.isFinite(re[k]) || typeof im[k] !== 'number' || !Number.isFinite(im[k])) {
      throw new ParseError(`entry ${k} of "re"/"im" is not a finite number`);
    }
  }
  return fromParts(re, im, rows, cols);
}

/**
 * A readable multi-line rendering for notebooks and debugging: shape, Frobenius norm and the
 * entries, large matrices elided to their corners (the text {@link show} gives a matrix).
 * @param a - Matrix.
 * @param digits - Significant digits per part (default 5).
 * @returns Text with a header line and one line per shown row; elided rows and columns are `⋮` and `…`.
 * @throws {@link DimensionError} if `a` is not a CMatrix; {@link DomainError} if `digits` is not an integer in [1, 17].
 * @category Complex core
 */
export function formatMatrix(a: CMatrix, digits = 5): string {
  assertCMatrix('a', a);
  assertInteger('digits', digits, 1, 17);
  return show(a, { digits, maxRows: 12, maxCols: 8 });
}
