/**
 * npm run bench:compare — times phasewise kernels and, where python3 with numpy
 * is available, the same work in numpy, interleaved in the same run, and prints
 * medians with the phasewise/numpy ratio.
 *
 * Interleaving: the run is split into rounds; in each round every kernel is
 * timed in phasewise and then in numpy, so both see the same machine load.
 * The ratio printed is the median over rounds of the per-round ratios, and the
 * load average (1 min) is printed at the start and at the end.
 *
 * Both sides run on one thread: phasewise is pinned with setKernelThreads(1)
 * (its dense kernels would otherwise use every core, see DEVELOPERS.md "Kernel
 * threads") and numpy runs single-threaded (OMP/OPENBLAS/MKL_NUM_THREADS=1) in two
 * persistent python3 workers: one with the machine's OpenBLAS variables as set
 * (OPENBLAS_CORETYPE, OPENBLAS_L2_SIZE, … — printed), one with every OPENBLAS_*
 * variable except the thread count unset (OpenBLAS picks its kernel for the CPU,
 * e.g. AVX-512). Each worker prints the OpenBLAS core it actually uses.
 * Each numpy counterpart is taken in its best formulation: where a kernel
 * lists alternatives, each is timed briefly and the fastest is used (named in
 * the table).
 *
 * Kernels come from every scripts/compare/*.ts file exporting
 * `kernels: CompareKernel[]` (see scripts/compare/types.ts).
 * `--threads N` runs both sides on N threads instead (setKernelThreads(N) and
 * OMP/OPENBLAS/MKL_NUM_THREADS=N), a like-for-like multi-core comparison.
 * Usage: npm run bench:compare [-- <name filter>] [--seconds 1.0] [--rounds 3] [--threads 1]
 */
import { spawn, type ChildProcessWithoutNullStreams } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { loadavg } from 'node:os';
import { dirname, join } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { CompareKernel } from './compare/types.js';
import { setKernelThreads } from '../src/linalg/simd.js';

const here = dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
let seconds = 1.0, rounds = 3, threads = 1;
const filters: string[] = [];
for (let i = 0; i < args.length; i++) {
  if (args[i] === '--seconds') seconds = Number(args[++i]);
  else if (args[i] === '--rounds') rounds = Math.max(1, Math.round(Number(args[++i])));
  else if (args[i] === '--threads') threads = Math.max(1, Math.round(Number(args[++i])));
  else filters.push(args[i].toLowerCase());
}

async function loadKernels(): Promise<CompareKernel[]> {
  const dir = join(here, 'compare');
  const files = readdirSync(dir).filter((f) => f.endsWith('.ts') && f !== 'types.ts').sort();
  const out: CompareKernel[] = [];
  for (const f of files) {
    const mod = (await import(pathToFileURL(join(dir, f)).href)) as { kernels?: CompareKernel[] };
    if (Array.isArray(mod.kernels)) out.push(...mod.kernels);
  }
  return out.filter((k) => filters.length === 0 || filters.some((s) => k.name.toLowerCase().includes(s)));
}

function consume(x: unknown): void {
  const v = x instanceof Float64Array ? x[0] : (x as { data?: Float64Array } | null)?.data?.[0];
  if (typeof v === 'number' && Number.isNaN(v)) throw new Error('kernel produced NaN');
}

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  const m = s.length >> 1;
  return s.length % 2 ? s[m] : 0.5 * (s[m - 1] + s[m]);
}

/** Median and fastest sample of one timing slice of `budgetS` seconds (at least 5 samples), after a short warm-up. */
function timeSlice(run: () => void, budgetS: number, warmS: number): { median: number; best: number } {
  const warmEnd = performance.now() + warmS * 1000;
  let warm = 0;
  while (warm < 3 || performance.now() < warmEnd) { run(); if (++warm > 10000) break; }
  const samples: number[] = [];
  const end = performance.now() + budgetS * 1000;
  while (samples.length < 5 || (performance.now() < end && samples.length < 5000)) {
    const t0 = performance.now();
    run();
    samples.push(performance.now() - t0);
  }
  return { median: median(samples), best: Math.min(...samples) };
}

const PY_WORKER = String.raw`
import ctypes, glob, json, os, sys, time
def reply(x): sys.stdout.write(json.dumps(x) + "\n"); sys.stdout.flush()
try:
    import numpy as np
except Exception as e:
    reply({"error": "numpy not importable: %s" % e}); sys.exit(0)
core = "unknown"
try:
    libs = glob.glob(os.path.join(os.path.dirname(np.__file__), "..", "numpy.libs", "*openblas*.so*"))
    lib = ctypes.CDLL(libs[0])
    for sym in ("scipy_openblas_get_corename64_", "openblas_get_corename64_", "openblas_get_corename"):
        f = getattr(lib, sym, None)
        if f is not None:
            f.restype = ctypes.c_char_p; core = f().decode(); break
except Exception:
    pass
reply({"numpy": np.__version__, "core": core})
def median(s):
    s = sorted(s); m = len(s) // 2
    return s[m] if len(s) % 2 else 0.5 * (s[m - 1] + s[m])
def slice_ms(code, ns, budget, warm):
    # median and fastest sample [ms]
    t_end = time.perf_counter() + warm; n = 0
    while n < 3 or time.perf_counter() < t_end:
        exec(code, ns); n += 1
    samples = []; t_end = time.perf_counter() + budget
    while len(samples) < 5 or (time.perf_counter() < t_end and len(samples) < 5000):
        t0 = time.perf_counter(); exec(code, ns); samples.append((time.perf_counter() - t0) * 1e3)
    return median(samples), min(samples)
state = {}
for line in sys.stdin:
    req = json.loads(line)
    name = req["name"]
    try:
        if req["cmd"] == "setup":
            ns = {"np": np, "rng": np.random.default_rng(1)}
            exec(req["setup"], ns)
            alts = [("numpy", req["run"])] + [(a["label"], a["run"]) for a in req.get("alternatives", [])]
            best = None
            for label, run in alts:
                code = compile(run, "<run>", "exec")
                ms = slice_ms(code, ns, 0.1 * req["seconds"], 0.05 * req["seconds"])[1]
                if best is None or ms < best[0]: best = (ms, label, code)
            state[name] = (ns, best[2])
            reply({"name": name, "label": best[1]})
        else:
            ns, code = state[name]
            med, best = slice_ms(code, ns, req["seconds"], 0.05 * req["seconds"])
            reply({"name": name, "ms": med, "best": best})
    except Exception as e:
        reply({"name": name, "error": "%s: %s" % (type(e).__name__, e)})
`;

/** One persistent python3 worker answering one JSON line per request. */
class NumpyWorker {
  private readonly proc: ChildProcessWithoutNullStreams;
  private readonly lines: AsyncIterator<string>;
  private readonly failed: Promise<IteratorResult<string>>;
  constructor(readonly label: string, env: NodeJS.ProcessEnv) {
    this.proc = spawn('python3', ['-c', PY_WORKER], { env, stdio: ['pipe', 'pipe', 'pipe'] });
    this.lines = createInterface({ input: this.proc.stdout })[Symbol.asyncIterator]();
    this.failed = new Promise((resolve) => this.proc.once('error', () => resolve({ done: true, value: undefined })));
  }
  async next(): Promise<Record<string, unknown>> {
    const r = await Promise.race([this.lines.next(), this.failed]);
    if (r.done) return { error: 'python3 not available' };
    return JSON.parse(r.value) as Record<string, unknown>;
  }
  async ask(req: Record<string, unknown>): Promise<Record<string, unknown>> {
    this.proc.stdin.write(JSON.stringify(req) + '\n');
    return this.next();
  }
  close(): void { this.proc.stdin.end(); }
}

const THREADS_ENV = Object.fromEntries(['OMP_NUM_THREADS', 'OPENBLAS_NUM_THREADS', 'MKL_NUM_THREADS', 'VECLIB_MAXIMUM_THREADS', 'NUMEXPR_NUM_THREADS'].map((v) => [v, String(threads)]));

function envAsSet(): NodeJS.ProcessEnv {
  return { ...process.env, ...THREADS_ENV };
}
function envUnset(): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {};
  for (const [k, v] of Object.entries(process.env)) if (!k.startsWith('OPENBLAS_') && !k.startsWith('GOTO')) env[k] = v;
  return { ...env, ...THREADS_ENV };
}

function fmt(x: number | undefined): string {
  if (x === undefined || !Number.isFinite(x)) return '—';
  return x < 0.1 ? x.toFixed(4) : x < 10 ? x.toFixed(3) : x.toFixed(1);
}
const load1 = (): string => loadavg().map((v) => v.toFixed(2)).join(', ');

async function main(): Promise<void> {
  const ks = await loadKernels();
  if (ks.length === 0) {
    process.stdout.write('no kernels matched\n');
    return;
  }
  const blasVars = Object.entries(process.env).filter(([k]) => k.startsWith('OPENBLAS_')).map(([k, v]) => `${k}=${v}`).join(' ') || '(none)';
  process.stdout.write(`phasewise bench:compare — node ${process.version}, ${ks.length} kernels, ${rounds} rounds of ~${(seconds / rounds).toFixed(2)} s per kernel and side\n`);
  process.stdout.write(`load average at start (1, 5, 15 min): ${load1()}\n`);
  const ourThreads = setKernelThreads(threads);
  process.stdout.write(`phasewise kernel threads: ${ourThreads} (setKernelThreads(${threads})); numpy: OMP/OPENBLAS/MKL_NUM_THREADS=${threads}\n`);
  const workers = [new NumpyWorker('as set', envAsSet()), new NumpyWorker('unset', envUnset())];
  const live: NumpyWorker[] = [];
  for (const w of workers) {
    const hello = await w.next();
    if (typeof hello.error === 'string') { process.stdout.write(`numpy (${w.label}): ${hello.error}; skipped.\n`); w.close(); continue; }
    live.push(w);
    process.stdout.write(`numpy ${String(hello.numpy)}, ${threads === 1 ? 'one thread' : `${threads} threads`}, OpenBLAS variables ${w.label === 'as set' ? `as set: ${blasVars}` : 'unset'} → OpenBLAS core ${String(hello.core)}\n`);
  }
  const slice = seconds / rounds;
  const labels = new Map<string, string>();
  for (const w of live) {
    for (const k of ks) {
      if (!k.numpySnippet) continue;
      const r = await w.ask({ cmd: 'setup', name: k.name, seconds: slice, ...k.numpySnippet });
      labels.set(`${w.label}/${k.name}`, typeof r.error === 'string' ? `n/a (${r.error})` : String(r.label));
    }
  }
  const states = ks.map((k) => k.setup());
  const ours: number[][] = ks.map(() => []), oursBest: number[] = ks.map(() => Infinity);
  const theirs: number[][][] = live.map(() => ks.map(() => []));
  const theirsBest: number[][] = live.map(() => ks.map(() => Infinity));
  for (let round = 0; round < rounds; round++) {
    for (let i = 0; i < ks.length; i++) {
      const k = ks[i];
      const t = timeSlice(() => consume(k.run(states[i])), slice, round === 0 ? Math.max(0.5, 0.25 * slice) : 0.05 * slice);
      ours[i].push(t.median);
      oursBest[i] = Math.min(oursBest[i], t.best);
      for (let w = 0; w < live.length; w++) {
        if (!k.numpySnippet || labels.get(`${live[w].label}/${k.name}`)?.startsWith('n/a')) continue;
        const r = await live[w].ask({ cmd: 'time', name: k.name, seconds: slice });
        if (typeof r.ms === 'number') theirs[w][i].push(r.ms);
        if (typeof r.best === 'number') theirsBest[w][i] = Math.min(theirsBest[w][i], r.best);
      }
    }
    process.stdout.write(`  round ${round + 1}/${rounds} done (load ${load1()})\n`);
  }
  for (const w of live) w.close();
  const head = ['kernel', 'phasewise [ms]'];
  for (const w of live) head.push(`numpy ${w.label} [ms]`, `ratio (${w.label})`, `best/best (${w.label})`);
  head.push('target', 'met');
  const notes: string[] = [];
  const rows = ks.map((k, i) => {
    const row = [k.name, fmt(median(ours[i]))];
    let unsetRatio: number | undefined;
    for (let w = 0; w < live.length; w++) {
      const t = theirs[w][i];
      if (t.length === 0) { row.push(k.numpySnippet ? labels.get(`${live[w].label}/${k.name}`) ?? '—' : '—', '—', '—'); continue; }
      const ratio = median(ours[i].map((o, r) => o / t[Math.min(r, t.length - 1)]));
      if (live[w].label === 'unset' || live.length === 1) unsetRatio = ratio;
      const label = labels.get(`${live[w].label}/${k.name}`);
      if (label !== 'numpy' && label !== undefined && w === live.length - 1) notes.push(`${k.name}: numpy's fastest formulation is "${label}"`);
      row.push(fmt(median(t)), ratio.toFixed(2) + '×', (oursBest[i] / theirsBest[w][i]).toFixed(2) + '×');
    }
    const target = k.targetRatio !== undefined ? `≤ ${k.targetRatio}× numpy` : k.targetMs !== undefined ? `≤ ${k.targetMs} ms` : '—';
    const met = k.targetRatio !== undefined ? (unsetRatio === undefined ? '?' : unsetRatio <= k.targetRatio ? 'yes' : 'no')
      : k.targetMs !== undefined ? (median(ours[i]) <= k.targetMs ? 'yes' : 'no') : '';
    row.push(target, met);
    return row;
  });
  const widths = head.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c].length)));
  const line = (r: string[]): string => '| ' + r.map((v, c) => v.padEnd(widths[c])).join(' | ') + ' |';
  process.stdout.write('\n' + line(head) + '\n' + '|' + widths.map((w) => '-'.repeat(w + 2)).join('|') + '|\n');
  for (const r of rows) process.stdout.write(line(r) + '\n');
  for (const n of notes) process.stdout.write(`note: ${n}\n`);
  process.stdout.write(`ratio = median over rounds of phasewise/numpy medians timed back to back; best/best = fastest sample over fastest sample (closest to a quiet machine when the load is high); ratio targets are judged on the median ratio against numpy with OpenBLAS variables unset.\nload average at end (1, 5, 15 min): ${load1()}\n`);
}

main().catch((e: unknown) => {
  process.stderr.write(`bench:compare failed: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exit(1);
});
