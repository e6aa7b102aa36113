/**
 * The kernel threads: the product kernel `ztile` (ztile.wat) on more than one
 * core. Worker threads share one `WebAssembly.Memory({shared: true})` with the
 * calling thread and are synchronised with Atomics on a small control block (a
 * SharedArrayBuffer). A job is one call of the kernel over many rows (or
 * column groups) cut into contiguous chunks; every thread, the caller
 * included, claims chunks with a compare-and-swap and runs the same kernel on
 * them, then the caller waits (Atomics.wait, bounded) until every chunk is
 * done. Each output element is formed by exactly one thread with the same
 * summation order, so results are bit-identical for any thread count.
 *
 * Node only (worker_threads, reached through `process.getBuiltinModule`, so
 * bundles for browsers need no stub): a page's main thread may not block in
 * Atomics.wait, so browsers run the kernels on one thread. Workers start at
 * the first job large enough to split and are `unref()`ed: they never keep a
 * process alive. Until a worker is ready the caller simply does its chunks,
 * so a worker that fails to start only costs speed.
 *
 * Partitioning of the product into column blocks of the packed B and row
 * blocks of C follows K. Goto and R. van de Geijn, "Anatomy of
 * high-performance matrix multiplication", ACM TOMS 34(3), 2008 (from
 * memory): a (column block, row block) pair of C is the unit of parallel work,
 * its B block shared in L2 by all the rows of the part.
 * No checks.
 * @internal
 * @module
 */
import { ztileWasm } from './modules.js';
import { compiledModule, decodeBase64, wasmSettings } from './runtime.js';

/** The kernel's arguments (byte addresses and strides, see ztile.wat). */
export type ZtileFunction = (m: number, n: number, k: number, pa: number, lda: number, pb: number, ldbq: number, pcr: number, pci: number, ldc: number, ldcq: number) => void;

/** The loaded product kernel: its function, its memory and whether that memory is shared with threads. */
export interface ZtileKernel {
  ztile: ZtileFunction;
  memory: WebAssembly.Memory;
  shared: boolean;
}

/** Upper bound of the default thread count (the product kernel saturates memory bandwidth beyond). */
export const DEFAULT_THREAD_CAP = 8;
/** Largest accepted thread count. */
export const MAX_THREADS = 64;
/**
 * Complex multiply–adds of one job from which it is split across threads: the measured
 * break-even of two threads against one for a square product (n = 64: 0.94×, n = 80: 1.02×,
 * n = 96: 1.42×; DEVELOPERS.md "Kernel threads").
 */
export const PARALLEL_MIN_WORK = 80 * 80 * 80;
/** A waiting caller gives up when no chunk has completed for this long (a worker died holding one). */
const STALL_MS = 60_000;

/**
 * Everything the worker threads run, as one self-contained function (only
 * globals inside), so that its source text is the worker's code: the control
 * block layout, the chunk runner shared by caller and workers, the claim loop
 * and the worker's main loop.
 */
function threadCode() {
  /** Control block (Int32Array indices). NEXT holds (job tag << 16) | next chunk; tag 0 = closed. */
  const L = { SEQ: 0, NEXT: 1, DONE: 2, COUNT: 3, KIND: 4, FAIL: 5, WORKERS: 6, ARGS: 8, READY: 32, RAN: 96, SIZE: 160 };
  /** Job kinds. */
  const KIND = { BLOCKS: 0, SWEEP: 1 };

  /** Runs chunk c of the current job (arguments in the control block). */
  function runChunk(ctrl: Int32Array, ztile: ZtileFunction, c: number): void {
    const a = L.ARGS, kind = ctrl[L.KIND];
    if (kind === KIND.BLOCKS) {
      // C += A·B in blocks of bc columns × bd inner steps (the packed B block stays in L2 while
      // the chunk's rows stream past it); chunk c = column block ⌊c/parts⌋ and part c mod parts
      // of its rows, which start at row 0, or at the block's first column for a lower triangle
      const m = ctrl[a], n4 = ctrl[a + 1], k = ctrl[a + 2], pa = ctrl[a + 3] >>> 0, lda = ctrl[a + 4], pb = ctrl[a + 5] >>> 0, ldbq = ctrl[a + 6];
      const pcr = ctrl[a + 7] >>> 0, pci = ctrl[a + 8] >>> 0, ldc = ctrl[a + 9], lower = ctrl[a + 10] !== 0, bc = ctrl[a + 11], bd = ctrl[a + 12], parts = ctrl[a + 13];
      const j0 = Math.floor(c / parts) * bc, part = c % parts, nb = Math.min(bc, n4 - j0), i0 = lower ? j0 : 0;
      const r0 = i0 + Math.floor(((m - i0) * part) / parts), r1 = i0 + Math.floor(((m - i0) * (part + 1)) / parts);
      if (r1 <= r0) return;
      for (let p0 = 0; p0 < k; p0 += bd) {
        ztile(r1 - r0, nb, Math.min(bd, k - p0), pa + r0 * lda + p0 * 16, lda, pb + (j0 >> 2) * ldbq + p0 * 64, ldbq,
          pcr + r0 * ldc + j0 * 8, pci + r0 * ldc + j0 * 8, ldc, 32);
      }
    } else {
      // triangular substitution, row by row, on the four-column groups [q0, q1) of the panel
      const n = ctrl[a], lower = ctrl[a + 1] !== 0, coef = ctrl[a + 2] >>> 0, px = ctrl[a + 3] >>> 0, gb = ctrl[a + 4], groups = ctrl[a + 5], per = ctrl[a + 6];
      const q0 = c * per, w4 = 4 * (Math.min(groups, q0 + per) - q0), base = px + q0 * gb;
      for (let step = 1; step < n; step++) {
        const i = lower ? step : n - 1 - step;
        // start of row i's coefficients: lower rows hold i entries, upper rows n − 1 − i
        const rs = lower ? (i * (i - 1)) / 2 : i * (n - 1) - (i * (i - 1)) / 2;
        const pc = base + i * 64;
        ztile(1, w4, step, coef + rs * 16, 0, base + (lower ? 0 : i + 1) * 64, gb, pc, pc + 32, 0, gb);
      }
    }
  }

  /** Claims and runs chunks of job `tag` until none is left; a failing chunk sets FAIL; `ran` counts the chunks run. */
  function claimChunks(ctrl: Int32Array, ztile: ZtileFunction, tag: number, ran: number): void {
    if (tag === 0) return; // closed: no job open
    for (;;) {
      const v = Atomics.load(ctrl, L.NEXT);
      if (v >>> 16 !== tag) return;
      const c = v & 0xffff;
      if (c >= Atomics.load(ctrl, L.COUNT)) return;
      if (Atomics.compareExchange(ctrl, L.NEXT, v, v + 1) !== v) continue;
      try {
        runChunk(ctrl, ztile, c);
      } catch {
        Atomics.store(ctrl, L.FAIL, 1);
      }
      if (ran >= 0) Atomics.add(ctrl, ran, 1);
      Atomics.add(ctrl, L.DONE, 1);
      Atomics.notify(ctrl, L.DONE);
    }
  }

  /** A worker: instantiate the kernel on the shared memory, say ready, then serve jobs forever. */
  function workerMain(data: { module: WebAssembly.Module; memory: WebAssembly.Memory; control: SharedArrayBuffer; index: number }): void {
    const ctrl = new Int32Array(data.control);
    const ztile = new WebAssembly.Instance(data.module, { env: { memory: data.memory } }).exports.ztile as ZtileFunction;
    Atomics.store(ctrl, L.READY + data.index, 1);
    let seen = 0;
    for (;;) {
      Atomics.wait(ctrl, L.SEQ, seen);
      seen = Atomics.load(ctrl, L.SEQ);
      if (data.index < Atomics.load(ctrl, L.WORKERS)) claimChunks(ctrl, ztile, Atomics.load(ctrl, L.NEXT) >>> 16, L.RAN + data.index);
    }
  }

  return { L, KIND, runChunk, claimChunks, workerMain };
}

const { L, KIND, runChunk, claimChunks } = threadCode();
export { KIND as JOB_KIND };

/**
 * The worker's source: the function above, evaluated with `{ eval: true }` (as a script, or as a
 * module when the parent runs with `--input-type=module`, so no `require`); `__name` stands in
 * for the helper a bundler may wrap named functions in.
 */
const WORKER_SOURCE = `'use strict';\nconst __name = (f) => f;\n(${threadCode.toString()})().workerMain(process.getBuiltinModule('node:worker_threads').workerData);\n`;

/** The parts of Node's worker_threads used here. */
interface WorkerLike {
  unref(): void;
  on(event: 'error' | 'exit', listener: (x: unknown) => void): void;
}
type WorkerConstructor = new (source: string, options: { eval: true; workerData: unknown }) => WorkerLike;

/** Node's built-in module of that name, or undefined outside Node (or before `process.getBuiltinModule`, Node 20.16). */
function nodeBuiltin<T>(name: string): T | undefined {
  const proc = (globalThis as { process?: { getBuiltinModule?: (id: string) => unknown } }).process;
  if (typeof proc?.getBuiltinModule !== 'function') return undefined;
  try {
    return proc.getBuiltinModule(name) as T | undefined;
  } catch {
    return undefined;
  }
}

/** Default thread count: the cores the runtime reports, at most {@link DEFAULT_THREAD_CAP}. */
export function defaultThreadCount(): number {
  const os = nodeBuiltin<{ availableParallelism?: () => number; cpus?: () => unknown[] }>('node:os');
  const nav = (globalThis as { navigator?: { hardwareConcurrency?: number } }).navigator;
  const cores = os?.availableParallelism?.() ?? os?.cpus?.().length ?? nav?.hardwareConcurrency ?? 1;
  return Math.max(1, Math.min(DEFAULT_THREAD_CAP, Math.floor(cores)));
}

/** The thread setting: the count asked for (undefined: the default); for tests, the worker's source and the split threshold. */
export const threadSettings: { requested: number | undefined; workerSource: string; minWork: number } = { requested: undefined, workerSource: WORKER_SOURCE, minWork: PARALLEL_MIN_WORK };

/** State of the kernel threads. */
interface Pool {
  ctrl: Int32Array;
  workers: WorkerLike[];
  /** Why the pool stopped being used, once it did. */
  failed?: string;
  /** Tag of the last job (1 … 0x7fff). */
  tag: number;
}

let kernel: ZtileKernel | null | undefined;
/** Why the memory is not shared (when it is not). */
let singleReason = '';
let pool: Pool | undefined;
let workerCtor: WorkerConstructor | undefined;

/** Instantiates ztile: on a shared memory where threads can run (Node with worker_threads), else on a local one. */
function instantiate(): ZtileKernel | null {
  const local = compiledModule('ztile');
  if (local === undefined) return null;
  const wt = nodeBuiltin<{ Worker?: WorkerConstructor }>('node:worker_threads');
  if (typeof wt?.Worker !== 'function') {
    singleReason = typeof (globalThis as { window?: unknown }).window === 'object'
      ? 'in a browser the kernels run on the page\'s thread (its main thread may not block in Atomics.wait)'
      : 'this runtime has no worker_threads reachable through process.getBuiltinModule (Node ≥ 20.16)';
  } else if (typeof SharedArrayBuffer !== 'function') {
    singleReason = 'this runtime has no SharedArrayBuffer';
  } else {
    try {
      const memory = new WebAssembly.Memory({ initial: 1, maximum: 65536, shared: true });
      const module = new WebAssembly.Module(decodeBase64(ztileWasm));
      const ztile = new WebAssembly.Instance(module, { env: { memory } }).exports.ztile as ZtileFunction;
      workerCtor = wt.Worker;
      sharedModule = module;
      return { ztile, memory, shared: true };
    } catch (e) {
      singleReason = `shared WebAssembly memory is unavailable (${e instanceof Error ? e.message : String(e)})`;
    }
  }
  const memory = new WebAssembly.Memory({ initial: 1 });
  const ztile = new WebAssembly.Instance(local, { env: { memory } }).exports.ztile as ZtileFunction;
  return { ztile, memory, shared: false };
}
let sharedModule: WebAssembly.Module | undefined;

/** The product kernel, or null on the scalar path (no SIMD, or switched off in `wasmSettings`). */
export function loadZtile(): ZtileKernel | null {
  if (kernel === undefined) kernel = instantiate();
  return wasmSettings.enabled ? kernel : null;
}

/** Threads a job may use now: the setting where the memory is shared and the pool works, else 1. */
export function threadsInUse(): number {
  const k = loadZtile();
  if (k === null || !k.shared || pool?.failed !== undefined) return 1;
  return threadSettings.requested ?? defaultThreadCount();
}

/** The thread count and its reason, for `simdStatus()`. */
export function threadStatus(): { threads: number; reason: string } {
  const k = loadZtile();
  if (k === null) return { threads: 1, reason: 'the scalar path runs on one thread' };
  if (!k.shared) return { threads: 1, reason: singleReason };
  if (pool?.failed !== undefined) return { threads: 1, reason: `the kernel threads stopped: ${pool.failed}` };
  const n = threadsInUse();
  if (n === 1) return { threads: 1, reason: 'one thread (setKernelThreads(1))' };
  const ready = pool === undefined ? 0 : pool.workers.filter((_, w) => Atomics.load(pool!.ctrl, L.READY + w) === 1).length;
  const started = pool === undefined ? 'start at the first product of at least 80³ complex multiply–adds' : `${Math.min(ready, n - 1)} of ${n - 1} ready`;
  return { threads: n, reason: `${n} threads: the calling thread and ${n - 1} worker thread${n > 2 ? 's' : ''} (worker_threads; ${started}) on one shared WebAssembly memory` };
}

/** The pool with at least `workers` workers, started lazily; undefined when it cannot be used. */
function ensurePool(workers: number, k: ZtileKernel): Pool | undefined {
  if (pool === undefined) pool = { ctrl: new Int32Array(new SharedArrayBuffer(4 * L.SIZE)), workers: [], tag: 0 };
  if (pool.failed !== undefined) return undefined;
  const p = pool;
  while (p.workers.length < Math.min(workers, MAX_THREADS - 1)) {
    const index = p.workers.length;
    try {
      const w = new workerCtor!(threadSettings.workerSource, { eval: true, workerData: { module: sharedModule, memory: k.memory, control: p.ctrl.buffer, index } });
      w.unref();
      w.on('error', (e) => { p.failed ??= `worker ${index} failed: ${e instanceof Error ? e.message : String(e)}`; });
      p.workers.push(w);
    } catch (e) {
      p.failed = `starting a worker thread failed: ${e instanceof Error ? e.message : String(e)}`;
      return undefined;
    }
  }
  return p;
}

/**
 * Runs one job of the product kernel: `chunks` chunks of kind `kind` with the
 * given integer arguments (see `runChunk` in `threadCode`), on the calling
 * thread alone or, for at least {@link PARALLEL_MIN_WORK} complex
 * multiply–adds, together with the worker threads. Every chunk writes its own
 * part of the output, so the result does not depend on who ran which chunk.
 */
export function runJob(k: ZtileKernel, kind: number, args: readonly number[], chunks: number, work: number): void {
  const threads = chunks > 1 && work >= threadSettings.minWork ? threadsInUse() : 1;
  const p = threads > 1 ? ensurePool(threads - 1, k) : undefined;
  // the single-thread path writes the job to a private block and runs every chunk itself
  const ctrl = p?.ctrl ?? localCtrl;
  Atomics.store(ctrl, L.NEXT, 0); // closed while the job is written
  for (let i = 0; i < args.length; i++) ctrl[L.ARGS + i] = args[i] | 0;
  ctrl[L.KIND] = kind;
  Atomics.store(ctrl, L.COUNT, chunks);
  Atomics.store(ctrl, L.DONE, 0);
  Atomics.store(ctrl, L.FAIL, 0);
  if (p === undefined) {
    for (let c = 0; c < chunks; c++) runChunk(ctrl, k.ztile, c);
    return;
  }
  p.tag = (p.tag % 0x7fff) + 1;
  Atomics.store(ctrl, L.WORKERS, threads - 1);
  Atomics.store(ctrl, L.NEXT, p.tag << 16);
  Atomics.add(ctrl, L.SEQ, 1);
  Atomics.notify(ctrl, L.SEQ);
  claimChunks(ctrl, k.ztile, p.tag, -1);
  let done = Atomics.load(ctrl, L.DONE), since = Date.now();
  while (done < chunks) {
    Atomics.wait(ctrl, L.DONE, done, 100);
    const d = Atomics.load(ctrl, L.DONE);
    if (d !== done) {
      done = d; since = Date.now();
    } else if (Date.now() - since > STALL_MS) {
      p.failed = `no progress for ${STALL_MS / 1000} s on a job (a worker thread stopped while holding part of it)`;
      throw new Error(`phasewise: ${p.failed}; later products run on one thread`);
    }
  }
  Atomics.store(ctrl, L.NEXT, 0);
  if (Atomics.load(ctrl, L.FAIL) !== 0) throw new Error('phasewise: the product kernel failed in a worker thread');
}
const localCtrl = new Int32Array(L.SIZE);

/** For tests: chunks run by each worker so far and whether each is ready. */
export function workerCounts(): { ready: boolean[]; ran: number[] } {
  const p = pool;
  if (p === undefined) return { ready: [], ran: [] };
  return { ready: p.workers.map((_, w) => Atomics.load(p.ctrl, L.READY + w) === 1), ran: p.workers.map((_, w) => Atomics.load(p.ctrl, L.RAN + w)) };
}
