/**
 * The phasewise error family. Every public function validates its arguments at
 * the boundary and throws one of these classes with a message that names the
 * argument, states what was expected, what was received and, where possible, a
 * remedy.
 *
 * @module
 */

/**
 * Base class of every error phasewise throws on purpose.
 *
 * @remarks
 * `code` is a stable machine-readable tag (`'dimension'`, `'domain'`,
 * `'singular'`, `'not-positive-definite'`, `'convergence'`, `'capacity'`, `'parse'`) so that
 * callers can branch without string matching.
 * @category Errors
 */
export class NumericError extends Error {
  /** Stable machine-readable tag of the error kind. */
  readonly code: string;
  /**
   * @param message - Human-readable description: argument, requirement, received value, remedy.
   * @param code - Stable tag of the error kind.
   */
  constructor(message: string, code = 'numeric') {
    super(message);
    this.name = 'NumericError';
    this.code = code;
  }
}

/**
 * A matrix, vector or array argument has the wrong shape or length.
 * @category Errors
 */
export class DimensionError extends NumericError {
  /** @param message - Description naming the argument, expected and received shapes. */
  constructor(message: string) {
    super(message, 'dimension');
    this.name = 'DimensionError';
  }
}

/**
 * A numeric argument lies outside its valid domain (NaN, infinite, negative
 * where a positive value is required, out of range, not Hermitian, …).
 * @category Errors
 */
export class DomainError extends NumericError {
  /** @param message - Description naming the argument, valid range and received value. */
  constructor(message: string) {
    super(message, 'domain');
    this.name = 'DomainError';
  }
}

/**
 * A linear system cannot be solved because its matrix is singular (exactly or
 * to working precision).
 * @category Errors
 */
export class SingularMatrixError extends NumericError {
  /** Zero-based pivot (or frequency/beam index, where stated) at which singularity was detected, or -1. */
  readonly index: number;
  /**
   * @param message - Description naming the matrix and where it failed.
   * @param index - Zero-based pivot index at which the failure was detected, or -1.
   * @param code - Error tag; subclasses override it.
   */
  constructor(message: string, index = -1, code = 'singular') {
    super(message, code);
    this.name = 'SingularMatrixError';
    this.index = index;
  }
}

/**
 * A Hermitian matrix that must be positive definite is not (Cholesky found a
 * non-positive pivot).
 * @category Errors
 */
export class NotPositiveDefiniteError extends SingularMatrixError {
  /**
   * @param message - Description naming the matrix and the failing pivot.
   * @param index - Zero-based pivot at which the Cholesky factorisation failed.
   */
  constructor(message: string, index: number) {
    super(message, index, 'not-positive-definite');
    this.name = 'NotPositiveDefiniteError';
  }
}

/**
 * An iterative method did not reach its tolerance within its iteration budget.
 * @category Errors
 */
export class ConvergenceError extends NumericError {
  /** @param message - Description of the method, the budget and the residual reached. */
  constructor(message: string) {
    super(message, 'convergence');
    this.name = 'ConvergenceError';
  }
}

/**
 * A job is larger than the memory (or another resource) available to it; the
 * message names the size, the estimate and the limit.
 * @category Errors
 */
export class CapacityError extends NumericError {
  /** Estimated requirement [bytes]. */
  readonly requiredBytes: number;
  /** Limit it exceeds [bytes]. */
  readonly limitBytes: number;
  /**
   * @param message - What is too large, the estimate, the limit and a remedy.
   * @param requiredBytes - Estimated requirement [bytes].
   * @param limitBytes - The limit [bytes].
   */
  constructor(message: string, requiredBytes: number, limitBytes: number) {
    super(message, 'capacity');
    this.name = 'CapacityError';
    this.requiredBytes = requiredBytes;
    this.limitBytes = limitBytes;
  }
}

/**
 * Text input (Touchstone, pattern files, CSV tables, design files) is malformed.
 * @category Errors
 */
export class ParseError extends NumericError {
  /** One-based line number where the problem was found, or 0 when not line-oriented. */
  readonly line: number;
  /** One-based column of the problem on its line, or 0 when unknown. */
  readonly column: number;
  /** File the text came from, when read from a file (the Node readers set it). */
  readonly file: string | undefined;
  /** The message without the place prefix. */
  readonly detail: string;
  /**
   * @param message - What was expected and what was found (the place is prefixed automatically).
   * @param line - One-based line number, or 0.
   * @param column - One-based column, or 0.
   * @param file - File name, when the text came from a file.
   */
  constructor(message: string, line = 0, column = 0, file?: string) {
    super(placePrefix(file, line, column) + message, 'parse');
    this.name = 'ParseError';
    this.line = line;
    this.column = column;
    this.file = file;
    this.detail = message;
  }
  /**
   * The same error, naming the file it came from (`file:line:column: what`).
   * @param file - File name as the user gave it.
   * @returns A new ParseError with the file in its message.
   */
  inFile(file: string): ParseError {
    return new ParseError(this.detail, this.line, this.column, file);
  }
}

/** `file:line:column: `, `file: `, `line L, column C: ` or `line L: ` (whatever is known). */
function placePrefix(file: string | undefined, line: number, column: number): string {
  if (file !== undefined) return `${[file, line > 0 ? line : undefined, line > 0 && column > 0 ? column : undefined].filter((x) => x !== undefined).join(':')}: `;
  if (line > 0) return column > 0 ? `line ${line}, column ${column}: ` : `line ${line}: `;
  return '';
}

/**
 * A design file (the receiving-array job's JSON description) is invalid: a field
 * is missing, has the wrong type or range, or names data the library rejects
 * (a band outside an imported file's coverage, a noise table with too few points…).
 *
 * @remarks
 * The message names the file and the field path (`beams.cone.maxThetaDeg`), what
 * was expected and what was found; `file` and `fields` carry the same facts as data.
 * @category Errors
 */
export class DesignError extends NumericError {
  /** Name of the design file as given by the caller. */
  readonly file: string;
  /** Field paths the problems refer to, in the order reported. */
  readonly fields: readonly string[];
  /**
   * @param file - Design file name.
   * @param problems - One entry per problem: the field path and the message (expected, received).
   */
  constructor(file: string, problems: ReadonlyArray<{ field: string; message: string }>) {
    super(`invalid design file "${file}":\n${problems.map((p) => `  field "${p.field}": ${p.message}`).join('\n')}`, 'design');
    this.name = 'DesignError';
    this.file = file;
    this.fields = problems.map((p) => p.field);
  }
}
