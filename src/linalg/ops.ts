/**
 * Elementwise and structural operations and the matrix product.
 * @module
 */
import { Complex } from 'complex.js';
import { DimensionError } from '../errors.js';
import { gemmKernel } from '../internal/gemm.js';
import { assertCMatrix, assertInteger, assertSquare, describeValue } from '../internal/validate.js';
import { type CMatrix, type ComplexLike, complexParts, zeros } from './cmatrix.js';

function assertSameShape(a: CMatrix, b: CMatrix): void {
  assertCMatrix('a', a);
  assertCMatrix('b', b);
  if (a.rows !== b.rows || a.cols !== b.cols) {
    throw new DimensionError(`invalid argument "b": expected ${a.rows}×${a.cols} (the shape of "a"), received ${b.rows}×${b.cols}.`);
  }
}

/**
 * Elementwise sum a + b.
 * @param a - Matrix.
 * @param b - Matrix of the same shape.
 * @returns A new matrix.
 * @throws {@link DimensionError} on shape mismatch.
 * @category Complex core
 */
export function add(a: CMatrix, b: CMatrix): CMatrix {
  assertSameShape(a, b);
  const out = zeros(a.rows, a.cols);
  for (let k = 0; k < a.data.length; k++) out.data[k] = a.data[k] + b.data[k];
  return out;
}

/**
 * Elementwise difference a − b.
 * @param a - Matrix.
 * @param b - Matrix of the same shape.
 * @returns A new matrix.
 * @throws {@link DimensionError} on shape mismatch.
 * @category Complex core
 */
export function subtract(a: CMatrix, b: CMatrix): CMatrix {
  assertSameShape(a, b);
  const out = zeros(a.rows, a.cols);
  for (let k = 0; k < a.data.length; k++) out.data[k] = a.data[k] - b.data[k];
  return out;
}

/**
 * Product of a matrix with a complex scalar, s·a.
 * @param a - Matrix.
 * @param s - Scalar (number, `{re, im}` or complex.js value).
 * @returns A new matrix.
 * @category Complex core
 */
export function scale(a: CMatrix, s: ComplexLike): CMatrix {
  assertCMatrix('a', a);
  const [sr, si] = complexParts('s', s);
  const out = zeros(a.rows, a.cols);
  const d = a.data;
  for (let k = 0; k < d.length; k += 2) {
    out.data[k] = sr * d[k] - si * d[k + 1];
    out.data[k + 1] = sr * d[k + 1] + si * d[k];
  }
  return out;
}

/**
 * Elementwise (Hadamard) product a ∘ b.
 * @param a - Matrix.
 * @param b - Matrix of the same shape.
 * @returns A new matrix.
 * @category Complex core
 */
export function hadamard(a: CMatrix, b: CMatrix): CMatrix {
  assertSameShape(a, b);
  const out = zeros(a.rows, a.cols);
  const x = a.data, y = b.data, o = out.data;
  for (let k = 0; k < x.length; k += 2) {
    o[k] = x[k] * y[k] - x[k + 1] * y[k + 1];
    o[k + 1] = x[k] * y[k + 1] + x[k + 1] * y[k];
  }
  return out;
}

/**
 * Matrix product out = a·b into a caller-supplied matrix (allocation-free).
 *
 * @remarks
 * Large products (≥ 4096 complex multiply–adds) run in a WebAssembly SIMD
 * kernel (f64x2 on split real/imaginary planes, assembled at load time);
 * small ones, and runtimes without WebAssembly SIMD, use a scalar row-oriented
 * kernel unrolled by four. `out` must not alias `a` or `b` (checked: a
 * DimensionError is thrown if it does).
 * @param out - Destination, a.rows × b.cols.
 * @param a - Left factor, m×k.
 * @param b - Right factor, k×n.
 * @returns `out`.
 * @throws {@link DimensionError} on incompatible shapes or aliasing.
 * @category Complex core
 */
export function multiplyInto<T extends CMatrix>(out: T, a: CMatrix, b: CMatrix): T {
  if (a.cols !== b.rows || out.rows !== a.rows || out.cols !== b.cols) {
    throw new DimensionError(`invalid arguments to multiplyInto: cannot store (${a.rows}×${a.cols})·(${b.rows}×${b.cols}) into ${out.rows}×${out.cols}.`);
  }
  if (out.data.buffer === a.data.buffer || out.data.buffer === b.data.buffer) {
    throw new DimensionError('invalid argument "out": it shares storage with "a" or "b"; pass a separate destination.');
  }
  gemmKernel(a.rows, b.cols, a.cols, a.data, 0, a.cols, b.data, 0, b.cols, out.data, 0, out.cols, false);
  return out;
}

/**
 * Matrix product a·b.
 * @param a - Left factor, m×k.
 * @param b - Right factor, k×n.
 * @returns A new m×n matrix.
 * @throws {@link DimensionError} if `a.cols !== b.rows`.
 * @example
 * ```ts
 * multiply(identity(2), fromRows([[1], [2]])); // { rows: 2, cols: 1, … }
 * ```
 * @category Complex core
 */
export function multiply(a: CMatrix, b: CMatrix): CMatrix {
  assertCMatrix('a', a);
  assertCMatrix('b', b);
  if (a.cols !== b.rows) {
    throw new DimensionError(`invalid argument "b": expected ${a.cols} rows (the column count of "a", ${a.rows}×${a.cols}), received ${b.rows}×${b.cols}.`);
  }
  return multiplyInto(zeros(a.rows, b.cols), a, b);
}

/**
 * Conjugate (Hermitian) transpose aᴴ.
 * @param a - Matrix, m×n.
 * @returns A new n×m matrix.
 * @category Complex core
 */
export function adjoint(a: CMatrix): CMatrix {
  assertCMatrix('a', a);
  const { rows: m, cols: n } = a;
  const out = zeros(n, m);
  const s = a.data, d = out.data;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      const src = 2 * (i * n + j);
      const dst = 2 * (j * m + i);
      d[dst] = s[src];
      d[dst + 1] = -s[src + 1];
    }
  }
  return out;
}

/**
 * Plain transpose aᵀ (no conjugation).
 * @param a - Matrix, m×n.
 * @returns A new n×m matrix.
 * @category Complex core
 */
export function transpose(a: CMatrix): CMatrix {
  assertCMatrix('a', a);
  const { rows: m, cols: n } = a;
  const out = zeros(n, m);
  const s = a.data, d = out.data;
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      const src = 2 * (i * n + j);
      const dst = 2 * (j * m + i);
      d[dst] = s[src];
      d[dst + 1] = s[src + 1];
    }
  }
  return out;
}

/**
 * Elementwise complex conjugate.
 * @param a - Matrix.
 * @returns A new matrix.
 * @category Complex core
 */
export function conjugate(a: CMatrix): CMatrix {
  assertCMatrix('a', a);
  const out = { rows: a.rows, cols: a.cols, data: a.data.slice() };
  for (let k = 1; k < out.data.length; k += 2) out.data[k] = -out.data[k];
  return out;
}

/**
 * Trace Σᵢ aᵢᵢ of a square matrix.
 * @param a - Square matrix.
 * @returns The trace as a complex.js value.
 * @category Complex core
 */
export function trace(a: CMatrix): Complex {
  assertSquare('a', a, true);
  let re = 0, im = 0;
  for (let i = 0; i < a.rows; i++) {
    re += a.data[2 * (i * a.cols + i)];
    im += a.data[2 * (i * a.cols + i) + 1];
  }
  return new Complex(re, im);
}

/**
 * Frobenius norm ‖a‖_F = sqrt(Σ|aᵢⱼ|²), computed with scaling against overflow.
 * @param a - Matrix.
 * @returns The norm (≥ 0).
 * @category Complex core
 */
export function frobeniusNorm(a: CMatrix): number {
  assertCMatrix('a', a);
  let scaleV = 0;
  let ssq = 1;
  const d = a.data;
  for (let k = 0; k < d.length; k++) {
    const x = Math.abs(d[k]);
    if (x === 0) continue;
    if (scaleV < x) {
      ssq = 1 + ssq * (scaleV / x) * (scaleV / x);
      scaleV = x;
    } else {
      ssq += (x / scaleV) * (x / scaleV);
    }
  }
  return scaleV * Math.sqrt(ssq);
}

/** |re + j·im|: sqrt of the squares when they are safely representable, else Math.hypot (slow but overflow-free). */
function modulus(re: number, im: number): number {
  const s = re * re + im * im;
  return s > 1e-290 && s < 1e290 ? Math.sqrt(s) : Math.hypot(re, im);
}

/**
 * Matrix 1-norm (largest column sum of moduli).
 * @param a - Matrix.
 * @returns ‖a‖₁ (≥ 0).
 * @category Complex core
 */
export function norm1(a: CMatrix): number {
  assertCMatrix('a', a);
  let best = 0;
  for (let j = 0; j < a.cols; j++) {
    let s = 0;
    for (let i = 0; i < a.rows; i++) {
      const k = 2 * (i * a.cols + j);
      s += modulus(a.data[k], a.data[k + 1]);
    }
    if (s > best) best = s;
  }
  return best;
}

/**
 * Matrix ∞-norm (largest row sum of moduli).
 * @param a - Matrix.
 * @returns ‖a‖_∞ (≥ 0).
 * @category Complex core
 */
export function normInf(a: CMatrix): number {
  assertCMatrix('a', a);
  let best = 0;
  for (let i = 0; i < a.rows; i++) {
    let s = 0;
    for (let j = 0; j < a.cols; j++) {
      const k = 2 * (i * a.cols + j);
      s += modulus(a.data[k], a.data[k + 1]);
    }
    if (s > best) best = s;
  }
  return best;
}

/**
 * Largest deviation from Hermitian symmetry, max |aᵢⱼ − conj(aⱼᵢ)| / max(‖a‖_max, tiny).
 * @param a - Square matrix.
 * @returns The relative deviation (0 for an exactly Hermitian matrix).
 * @category Complex core
 */
export function hermitianDeviation(a: CMatrix): number {
  assertSquare('a', a, true);
  const n = a.rows, d = a.data;
  let dev = 0, mag = 0;
  for (let k = 0; k < d.length; k++) mag = Math.max(mag, Math.abs(d[k]));
  // squared moduli in the loop (Math.hypot per entry is slow); entries are
  // first scaled by 1/mag so the squares cannot overflow
  if (mag === 0) return 0;
  const inv = 1 / mag;
  for (let i = 0; i < n; i++) {
    for (let j = i; j < n; j++) {
      const p = 2 * (i * n + j), q = 2 * (j * n + i);
      const dr = d[p] * inv - d[q] * inv, di = d[p + 1] * inv + d[q + 1] * inv;
      const s = dr * dr + di * di;
      if (s > dev) dev = s;
    }
  }
  return Math.sqrt(dev);
}

/**
 * Whether a square matrix is Hermitian to a relative tolerance.
 * @param a - Square matrix.
 * @param tol - Relative tolerance on {@link hermitianDeviation} (default 1e-12).
 * @returns True when aᴴ = a within `tol`.
 * @category Complex core
 */
export function isHermitian(a: CMatrix, tol = 1e-12): boolean {
  return hermitianDeviation(a) <= tol;
}

/**
 * The Hermitian part (a + aᴴ)/2 of a square matrix.
 * @param a - Square matrix.
 * @returns A new exactly Hermitian matrix.
 * @category Complex core
 */
export function hermitianPart(a: CMatrix): CMatrix {
  assertSquare('a', a, true);
  const n = a.rows, d = a.data;
  const out = zeros(n, n), o = out.data;
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const p = 2 * (i * n + j), q = 2 * (j * n + i);
      o[p] = 0.5 * (d[p] + d[q]);
      o[p + 1] = 0.5 * (d[p + 1] - d[q + 1]);
    }
  }
  return out;
}

/**
 * A contiguous block a[rowStart:rowEnd, colStart:colEnd] (end exclusive), copied.
 * @param a - Matrix.
 * @param rowStart - First row (inclusive).
 * @param rowEnd - Last row (exclusive).
 * @param colStart - First column (inclusive).
 * @param colEnd - Last column (exclusive).
 * @returns A new (rowEnd−rowStart)×(colEnd−colStart) matrix.
 * @category Complex core
 */
export function block(a: CMatrix, rowStart: number, rowEnd: number, colStart: number, colEnd: number): CMatrix {
  assertCMatrix('a', a);
  assertInteger('rowStart', rowStart, 0, a.rows);
  assertInteger('rowEnd', rowEnd, rowStart, a.rows);
  assertInteger('colStart', colStart, 0, a.cols);
  assertInteger('colEnd', colEnd, colStart, a.cols);
  const r = rowEnd - rowStart, c = colEnd - colStart;
  const out = zeros(r, c);
  for (let i = 0; i < r; i++) {
    const src = 2 * ((rowStart + i) * a.cols + colStart);
    out.data.set(a.data.subarray(src, src + 2 * c), 2 * i * c);
  }
  return out;
}

/**
 * Rows and columns picked by index lists (any order, repeats allowed), copied.
 * @param a - Matrix.
 * @param rowIndex - Zero-based row indices.
 * @param colIndex - Zero-based column indices (default: all columns).
 * @returns A new rowIndex.length × colIndex.length matrix.
 * @category Complex core
 */
export function pick(a: CMatrix, rowIndex: ArrayLike<number>, colIndex?: ArrayLike<number>): CMatrix {
  assertCMatrix('a', a);
  const cols = colIndex ?? Array.from({ length: a.cols }, (_, j) => j);
  for (let i = 0; i < rowIndex.length; i++) assertInteger(`rowIndex[${i}]`, rowIndex[i], 0, a.rows - 1);
  for (let j = 0; j < cols.length; j++) assertInteger(`colIndex[${j}]`, cols[j], 0, a.cols - 1);
  const out = zeros(rowIndex.length, cols.length);
  for (let i = 0; i < rowIndex.length; i++) {
    for (let j = 0; j < cols.length; j++) {
      const src = 2 * (rowIndex[i] * a.cols + cols[j]);
      const dst = 2 * (i * cols.length + j);
      out.data[dst] = a.data[src];
      out.data[dst + 1] = a.data[src + 1];
    }
  }
  return out;
}

/**
 * Copies `b` into `a` with its top-left corner at (row, col), in place.
 * @param a - Destination matrix (modified).
 * @param row - Top row of the block in `a`.
 * @param col - Left column of the block in `a`.
 * @param b - Block to write; must fit.
 * @returns `a`.
 * @category Complex core
 */
export function setBlock(a: CMatrix, row: number, col: number, b: CMatrix): CMatrix {
  assertCMatrix('a', a);
  assertCMatrix('b', b);
  assertInteger('row', row, 0, a.rows);
  assertInteger('col', col, 0, a.cols);
  if (row + b.rows > a.rows || col + b.cols > a.cols) {
    throw new DimensionError(`invalid argument "b": a ${b.rows}×${b.cols} block at (${row}, ${col}) does not fit in ${a.rows}×${a.cols}.`);
  }
  for (let i = 0; i < b.rows; i++) {
    a.data.set(b.data.subarray(2 * i * b.cols, 2 * (i + 1) * b.cols), 2 * ((row + i) * a.cols + col));
  }
  return a;
}

/**
 * Column j as a new n×1 vector.
 * @param a - Matrix.
 * @param j - Zero-based column.
 * @returns A new column vector.
 * @category Complex core
 */
export function column(a: CMatrix, j: number): CMatrix {
  assertCMatrix('a', a);
  assertInteger('j', j, 0, a.cols - 1);
  return block(a, 0, a.rows, j, j + 1);
}

/**
 * Inner product aᴴb = Σ conj(aᵢ)·bᵢ of two vectors of equal length (any shape, read in storage order).
 * @param a - First vector (conjugated).
 * @param b - Second vector.
 * @returns The inner product.
 * @category Complex core
 */
export function innerProduct(a: CMatrix, b: CMatrix): Complex {
  assertCMatrix('a', a);
  assertCMatrix('b', b);
  if (a.data.length !== b.data.length) {
    throw new DimensionError(`invalid argument "b": expected ${a.rows * a.cols} entries (like "a"), received ${b.rows * b.cols}.`);
  }
  let re = 0, im = 0;
  const x = a.data, y = b.data;
  for (let k = 0; k < x.length; k += 2) {
    re += x[k] * y[k] + x[k + 1] * y[k + 1];
    im += x[k] * y[k + 1] - x[k + 1] * y[k];
  }
  return new Complex(re, im);
}

/**
 * Euclidean norm of a vector (or Frobenius norm of any matrix).
 * @param a - Vector.
 * @returns ‖a‖₂ (≥ 0).
 * @category Complex core
 */
export function vectorNorm(a: CMatrix): number {
  return frobeniusNorm(a);
}

/**
 * Hermitian form wᴴ R w for a square R (real part returned; for Hermitian R the
 * imaginary part is zero to rounding).
 * @param w - Column vector, n×1.
 * @param r - Square matrix, n×n.
 * @returns Re{wᴴ R w}.
 * @category Complex core
 */
export function quadraticForm(w: CMatrix, r: CMatrix): number {
  assertCMatrix('w', w);
  assertSquare('r', r);
  if (w.cols !== 1 || w.rows !== r.rows) {
    throw new DimensionError(`invalid argument "w": expected ${r.rows}×1 (one entry per row of "r"), received ${w.rows}×${w.cols}.`);
  }
  const n = r.rows, x = w.data, d = r.data;
  let acc = 0;
  for (let i = 0; i < n; i++) {
    let sr = 0, si = 0;
    const row = 2 * i * n;
    for (let j = 0; j < n; j++) {
      const ar = d[row + 2 * j], ai = d[row + 2 * j + 1];
      const xr = x[2 * j], xi = x[2 * j + 1];
      sr += ar * xr - ai * xi;
      si += ar * xi + ai * xr;
    }
    acc += x[2 * i] * sr + x[2 * i + 1] * si;
  }
  return acc;
}

/**
 * Largest elementwise modulus difference max |aᵢⱼ − bᵢⱼ|.
 * @param a - Matrix.
 * @param b - Matrix of the same shape.
 * @returns The maximum absolute difference.
 * @category Complex core
 */
export function maxAbsDifference(a: CMatrix, b: CMatrix): number {
  assertSameShape(a, b);
  let m = 0;
  for (let k = 0; k < a.data.length; k += 2) {
    m = Math.max(m, Math.hypot(a.data[k] - b.data[k], a.data[k + 1] - b.data[k + 1]));
  }
  return m;
}

/** Validates a list of matrices that must agree in `dim`; returns that common size. */
function checkParts(parts: ReadonlyArray<CMatrix>, dim: 'rows' | 'cols'): number {
  if (!Array.isArray(parts) || parts.length === 0) throw new DimensionError(`invalid argument "parts": expected a non-empty array of matrices, received ${describeValue(parts)}.`);
  parts.forEach((p, i) => assertCMatrix(`parts[${i}]`, p));
  const size = parts[0][dim];
  parts.forEach((p, i) => {
    if (p[dim] !== size) throw new DimensionError(`invalid argument "parts[${i}]": expected ${size} ${dim === 'rows' ? 'rows' : 'columns'} like parts[0], received ${p[dim]}.`);
  });
  return size;
}

/**
 * Horizontal concatenation [a, b, …] of matrices with equal row counts.
 * @param parts - Matrices to join left to right.
 * @returns A new matrix.
 * @category Complex core
 */
export function concatColumns(parts: ReadonlyArray<CMatrix>): CMatrix {
  const rows = checkParts(parts, 'rows');
  let cols = 0;
  for (const p of parts) cols += p.cols;
  const out = zeros(rows, cols);
  let c = 0;
  for (const p of parts) {
    setBlock(out, 0, c, p);
    c += p.cols;
  }
  return out;
}

/**
 * Vertical concatenation [a; b; …] of matrices with equal column counts.
 * @param parts - Matrices to stack top to bottom.
 * @returns A new matrix.
 * @category Complex core
 */
export function concatRows(parts: ReadonlyArray<CMatrix>): CMatrix {
  const cols = checkParts(parts, 'cols');
  let rows = 0;
  for (const p of parts) rows += p.rows;
  const out = zeros(rows, cols);
  let off = 0;
  for (const p of parts) {
    out.data.set(p.data, off);
    off += p.data.length;
  }
  return out;
}
