/**
 * Running band frequencies on a worker pool (workerpool: worker threads in
 * Node), one block of frequencies per task. Each frequency is evaluated
 * independently and deterministically, so the result does not depend on the
 * worker count.
 * @internal
 * @module
 */
import { existsSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { fileURLToPath } from 'node:url';
import workerpool from 'workerpool';
import { evaluateDesignFrequency, prepareDesign, validateDesign, type FrequencyEvaluation } from '../design/index.js';
import { designReader } from './files.js';
import { UsageError } from './errors.js';

/** What a worker needs to evaluate a block of frequencies. @internal */
export interface BlockTask {
  /** Parsed design data (validated again in the worker). */
  designData: unknown;
  /** Path of the design file (files it names resolve from its folder). */
  designFile: string;
  /** Name used in messages. */
  fileName: string;
  /** Frequency indices of the block. */
  indices: number[];
}

/** Evaluates a block of frequencies (runs in a worker or in-process). @internal */
export function evaluateBlock(task: BlockTask): FrequencyEvaluation[] {
  const design = validateDesign(task.designData, task.fileName);
  const prepared = prepareDesign(design, { fileName: task.fileName, readFile: designReader(task.designFile) });
  return task.indices.map((i) => evaluateDesignFrequency(prepared, i));
}

/** Default worker count: every core. @internal */
export function defaultWorkers(): number {
  return Math.max(1, availableParallelism());
}

/** The bundled worker script beside this module (dist/cli-worker.js), when present. */
function workerScript(): string | undefined {
  try {
    const p = fileURLToPath(new URL('./cli-worker.js', import.meta.url));
    return existsSync(p) ? p : undefined;
  } catch {
    return undefined;
  }
}

/**
 * Evaluates frequency indices on up to `workers` threads, one contiguous block per worker
 * (in-process when workers = 1, when there is one frequency, or when no worker script is
 * bundled — running from source). Results come back in index order.
 * @internal
 */
export async function evaluateFrequencies(task: Omit<BlockTask, 'indices'>, indices: readonly number[], workers: number, onBlock?: (done: number, total: number) => void): Promise<FrequencyEvaluation[]> {
  const script = workerScript();
  const nBlocks = Math.min(workers, indices.length);
  if (nBlocks <= 1 || script === undefined) {
    const out: FrequencyEvaluation[] = [];
    for (let i = 0; i < indices.length; i++) {
      out.push(...evaluateBlock({ ...task, indices: [indices[i]] }));
      onBlock?.(i + 1, indices.length);
    }
    return out;
  }
  // Interleaved blocks balance the cost (higher frequencies need larger sphere rules).
  const blocks = Array.from({ length: nBlocks }, (_, b) => indices.filter((_, j) => j % nBlocks === b));
  const pool = workerpool.pool(script, { maxWorkers: nBlocks, workerType: 'thread' });
  try {
    let done = 0;
    const parts = await Promise.all(blocks.map((b) => pool.exec('evaluateBlock', [{ ...task, indices: b }]).then((r: FrequencyEvaluation[]) => {
      done += b.length;
      onBlock?.(done, indices.length);
      return r;
    }, (e: unknown) => {
      const m = /^phasewise-numeric:[^:]*:[^:]*:([\s\S]*)$/.exec(e instanceof Error ? e.message : String(e));
      throw m ? new UsageError(m[1]) : e;
    })));
    const byIndex = new Map<number, FrequencyEvaluation>();
    blocks.forEach((b, j) => b.forEach((idx, t) => byIndex.set(idx, parts[j][t])));
    return indices.map((i) => byIndex.get(i) as FrequencyEvaluation);
  } finally {
    await pool.terminate();
  }
}
