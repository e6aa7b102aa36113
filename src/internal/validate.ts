/**
 * Boundary validation helpers shared by every module. Messages follow the
 * style guide: argument, requirement, received value, remedy.
 * @internal
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/types.js';

/** Short printable form of any received value. */
export function describeValue(x: unknown): string {
  if (typeof x === 'number') return Number.isNaN(x) ? 'NaN' : String(x);
  if (x === null) return 'null';
  if (x === undefined) return 'undefined';
  if (Array.isArray(x)) return `an array of length ${x.length}`;
  if (ArrayBuffer.isView(x)) return `a ${x.constructor.name} of length ${(x as unknown as { length: number }).length}`;
  if (typeof x === 'object' && x !== null && 'rows' in x && 'cols' in x) {
    const m = x as { rows: unknown; cols: unknown };
    return `a ${String(m.rows)}×${String(m.cols)} matrix`;
  }
  return typeof x;
}

/** Throws DomainError unless `x` is a finite number. */
export function assertFinite(name: string, x: number, remedy = ''): void {
  if (typeof x !== 'number' || !Number.isFinite(x)) {
    throw new DomainError(`invalid argument "${name}": expected a finite number, received ${describeValue(x)}${remedy ? `; ${remedy}` : ''}.`);
  }
}

/** Throws DomainError unless `x` is a finite number > 0. */
export function assertPositive(name: string, x: number, unit = ''): void {
  if (typeof x !== 'number' || !Number.isFinite(x) || x <= 0) {
    throw new DomainError(`invalid argument "${name}": expected a finite number > 0${unit ? ` [${unit}]` : ''}, received ${describeValue(x)}.`);
  }
}

/** Throws DomainError unless `x` is a finite number ≥ 0. */
export function assertNonNegative(name: string, x: number, unit = ''): void {
  if (typeof x !== 'number' || !Number.isFinite(x) || x < 0) {
    throw new DomainError(`invalid argument "${name}": expected a finite number ≥ 0${unit ? ` [${unit}]` : ''}, received ${describeValue(x)}.`);
  }
}

/** Throws DomainError unless `x` is an integer in [min, max]. */
export function assertInteger(name: string, x: number, min = -Infinity, max = Infinity): void {
  if (typeof x !== 'number' || !Number.isInteger(x) || x < min || x > max) {
    const range = max === Infinity ? `≥ ${min}` : `in [${min}, ${max}]`;
    throw new DomainError(`invalid argument "${name}": expected an integer ${range}, received ${describeValue(x)}.`);
  }
}

/** Throws DomainError unless min ≤ x ≤ max (finite). */
export function assertInRange(name: string, x: number, min: number, max: number, unit = ''): void {
  if (typeof x !== 'number' || !Number.isFinite(x) || x < min || x > max) {
    throw new DomainError(`invalid argument "${name}": expected a number in [${min}, ${max}]${unit ? ` [${unit}]` : ''}, received ${describeValue(x)}.`);
  }
}

/** Throws DomainError if any entry of a real array is NaN or infinite. */
export function assertFiniteArray(name: string, x: ArrayLike<number>): void {
  for (let i = 0; i < x.length; i++) {
    const v = x[i];
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new DomainError(`invalid argument "${name}": entry ${i} is ${describeValue(v)}; every entry must be a finite number.`);
    }
  }
}

/** Throws DimensionError unless `x` is a CMatrix-shaped object with consistent storage. */
export function assertCMatrix(name: string, x: CMatrix): void {
  if (
    x === null || typeof x !== 'object' || !(x.data instanceof Float64Array) ||
    !Number.isInteger(x.rows) || !Number.isInteger(x.cols) || x.rows < 0 || x.cols < 0 ||
    x.data.length !== 2 * x.rows * x.cols
  ) {
    throw new DimensionError(`invalid argument "${name}": expected a CMatrix {rows, cols, data: Float64Array of length 2·rows·cols}, received ${describeValue(x)}; build one with zeros, fromRows or fromParts.`);
  }
}

/** Throws DomainError if any entry of a CMatrix is NaN or infinite. */
export function assertFiniteCMatrix(name: string, x: CMatrix): void {
  assertCMatrix(name, x);
  const d = x.data;
  for (let k = 0; k < d.length; k++) {
    if (!Number.isFinite(d[k])) {
      const e = k >> 1;
      const i = Math.floor(e / x.cols);
      const j = e - i * x.cols;
      throw new DomainError(`invalid argument "${name}": entry (${i}, ${j}) has a ${k & 1 ? 'imaginary' : 'real'} part ${describeValue(d[k])}; every entry must be finite.`);
    }
  }
}

/** Throws DimensionError unless `x` is square (and, optionally, non-empty). */
export function assertSquare(name: string, x: CMatrix, allowEmpty = false): void {
  assertCMatrix(name, x);
  if (x.rows !== x.cols || (!allowEmpty && x.rows === 0)) {
    throw new DimensionError(`invalid argument "${name}": expected a non-empty square matrix, received ${x.rows}×${x.cols}.`);
  }
}

/** Throws DimensionError unless `x` has the given shape. */
export function assertShape(name: string, x: CMatrix, rows: number, cols: number, hint = ''): void {
  assertCMatrix(name, x);
  if (x.rows !== rows || x.cols !== cols) {
    throw new DimensionError(`invalid argument "${name}": expected ${rows}×${cols}${hint ? ` (${hint})` : ''}, received ${x.rows}×${x.cols}.`);
  }
}

/** Throws DimensionError unless `x` is a column vector (n×1, n ≥ 1), optionally of length n. */
export function assertColumn(name: string, x: CMatrix, n?: number, hint = ''): void {
  assertCMatrix(name, x);
  if (x.cols !== 1 || x.rows < 1 || (n !== undefined && x.rows !== n)) {
    const want = n === undefined ? 'an n×1 column vector (n ≥ 1)' : `${n}×1${hint ? ` (${hint})` : ''}`;
    throw new DimensionError(`invalid argument "${name}": expected ${want}, received ${x.rows}×${x.cols}; pass a column vector.`);
  }
}
