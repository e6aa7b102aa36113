/**
 * Error handling of the command line: exit codes 0 done, 1 internal fault, 2 bad input
 * (with a message naming the problem), 3 results written but a physical check failed.
 * @internal
 * @module
 */
import { NumericError } from '../errors.js';

/** A command-line usage problem (unknown option, missing argument, invalid value). @internal */
export class UsageError extends NumericError {
  constructor(message: string) {
    super(message, 'usage');
    this.name = 'UsageError';
  }
}

/**
 * Results were computed and written, but some failed a physical check (energy, reciprocity,
 * passivity, model validity): exit 3 unless --accept-failed-checks. @internal
 */
export class FailedChecksError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'FailedChecksError';
  }
}

/** Exit code for an error: 3 for failed physical checks, 2 for bad input, 1 for anything else. @internal */
export function exitCodeFor(e: unknown): number {
  if (e instanceof FailedChecksError) return 3;
  return e instanceof NumericError ? 2 : 1;
}
