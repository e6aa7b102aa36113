/**
 * The worker-thread entry of the command line (dist/cli-worker.js): exposes
 * the frequency-block evaluation to the pool.
 * @internal
 * @module
 */
import workerpool from 'workerpool';
import { NumericError } from '../errors.js';
import { evaluateBlock, type BlockTask } from './parallel.js';

workerpool.worker({
  evaluateBlock(task: BlockTask) {
    try {
      return evaluateBlock(task);
    } catch (e) {
      // Keep the error kind across the thread boundary (bad input → exit 2).
      if (e instanceof NumericError) throw new Error(`phasewise-numeric:${e.name}:${e.code}:${e.message}`);
      throw e;
    }
  },
});
