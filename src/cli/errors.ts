/**
 * Error handling of the command line: bad input exits with 2 and a message,
 * internal failures with 1.
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

/** Exit code for an error: 2 for bad input, 1 for anything else. @internal */
export function exitCodeFor(e: unknown): number {
  return e instanceof NumericError ? 2 : 1;
}
