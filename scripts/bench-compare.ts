/**
 * npm run bench:compare — times phasewise kernels and, where python3 with numpy
 * is available, the same work in numpy (single thread) in the same run, and
 * prints medians with the phasewise/numpy ratio.
 *
 * Kernels come from every scripts/compare/*.ts file exporting
 * `kernels: CompareKernel[]` (see scripts/compare/types.ts).
 * Usage: npm run bench:compare [-- <name filter>] [--seconds 1.0]
 */
import { spawnSync } from 'node:child_process';
import { readdirSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import type { CompareKernel } from './compare/types.js';

const here = dirname(fileURLToPath(import.meta.url));
const args = process.argv.slice(2);
let seconds = 1.0;
const filters: string[] = [];
for (let i = 0; i < args.length; i++) {
  if (args[i] === '--seconds') seconds = Number(args[++i]);
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

function timePhasewise(k: CompareKernel): { medianMs: number; samples: number } {
  const state = k.setup();
  const warmEnd = performance.now() + 0.25 * seconds * 1000;
  let warm = 0;
  while (warm < 5 || performance.now() < warmEnd) { consume(k.run(state)); warm++; if (warm > 10000) break; }
  const samples: number[] = [];
  const end = performance.now() + seconds * 1000;
  while (samples.length < 10 || (performance.now() < end && samples.length < 5000)) {
    const t0 = performance.now();
    consume(k.run(state));
    samples.push(performance.now() - t0);
  }
  return { medianMs: median(samples), samples: samples.length };
}

const PY_RUNNER = String.raw`
import json, sys, time
try:
    import numpy as np
except Exception as e:
    print(json.dumps({"error": "numpy not importable: %s" % e})); sys.exit(0)
cases = json.loads(sys.stdin.read())
seconds = cases["seconds"]
out = {"numpy": np.__version__, "results": {}}
for c in cases["kernels"]:
    ns = {"np": np, "rng": np.random.default_rng(1)}
    try:
        exec(c["setup"], ns)
        code = compile(c["run"], "<run>", "exec")
        t_end = time.perf_counter() + 0.25 * seconds
        n = 0
        while n < 5 or time.perf_counter() < t_end:
            exec(code, ns); n += 1
        samples = []
        t_end = time.perf_counter() + seconds
        while len(samples) < 10 or (time.perf_counter() < t_end and len(samples) < 5000):
            t0 = time.perf_counter(); exec(code, ns); samples.append((time.perf_counter() - t0) * 1e3)
        samples.sort()
        m = len(samples) // 2
        out["results"][c["name"]] = samples[m] if len(samples) % 2 else 0.5 * (samples[m - 1] + samples[m])
    except Exception as e:
        out["results"][c["name"]] = "n/a (%s)" % type(e).__name__
print(json.dumps(out))
`;

function timeNumpy(ks: CompareKernel[]): { version?: string; results: Record<string, number | string>; note?: string } {
  const withNumpy = ks.filter((k) => k.numpySnippet);
  if (withNumpy.length === 0) return { results: {}, note: 'no kernel has a numpy counterpart' };
  const payload = JSON.stringify({ seconds, kernels: withNumpy.map((k) => ({ name: k.name, ...k.numpySnippet })) });
  // Single-threaded BLAS for a like-for-like comparison; other variables (e.g. OPENBLAS_CORETYPE) are kept.
  const env = { ...process.env, OMP_NUM_THREADS: '1', OPENBLAS_NUM_THREADS: '1', MKL_NUM_THREADS: '1', VECLIB_MAXIMUM_THREADS: '1', NUMEXPR_NUM_THREADS: '1' };
  const r = spawnSync('python3', ['-c', PY_RUNNER], { input: payload, env, encoding: 'utf8', maxBuffer: 1 << 24 });
  if (r.error || r.status !== 0) return { results: {}, note: `python3 not available (${r.error ? r.error.message : `exit ${r.status}: ${r.stderr.trim().split('\n').pop()}`})` };
  let parsed: { error?: string; numpy?: string; results?: Record<string, number | string> };
  try {
    parsed = JSON.parse(r.stdout.trim().split('\n').pop() ?? '{}');
  } catch {
    return { results: {}, note: 'could not read the python3 output' };
  }
  if (parsed.error) return { results: {}, note: parsed.error };
  return { version: parsed.numpy, results: parsed.results ?? {} };
}

function fmt(x: number | string | undefined): string {
  if (x === undefined) return '—';
  if (typeof x === 'string') return x;
  return x < 0.1 ? x.toFixed(4) : x < 10 ? x.toFixed(3) : x.toFixed(1);
}

async function main(): Promise<void> {
  const ks = await loadKernels();
  if (ks.length === 0) {
    process.stdout.write('no kernels matched\n');
    return;
  }
  process.stdout.write(`phasewise bench:compare — node ${process.version}, ${ks.length} kernels, ~${seconds} s each\n`);
  const ours = ks.map((k) => {
    const r = timePhasewise(k);
    process.stdout.write(`  timed ${k.name}: ${fmt(r.medianMs)} ms (${r.samples} samples)\n`);
    return r;
  });
  const np = timeNumpy(ks);
  if (np.note) process.stdout.write(`numpy: ${np.note}; printing phasewise alone.\n`);
  else process.stdout.write(`numpy ${np.version} (single thread: OMP/OPENBLAS/MKL_NUM_THREADS=1)\n`);
  const rows = ks.map((k, i) => {
    const npv = np.results[k.name];
    const ratio = typeof npv === 'number' ? (ours[i].medianMs / npv).toFixed(1) + '×' : '—';
    const target = k.targetMs === undefined ? '—' : `≤ ${k.targetMs}`;
    const meets = k.targetMs === undefined ? '' : ours[i].medianMs <= k.targetMs ? 'yes' : 'no';
    return [k.name, fmt(ours[i].medianMs), fmt(npv), ratio, target, meets];
  });
  const head = ['kernel', 'phasewise median [ms]', 'numpy median [ms]', 'phasewise/numpy', 'target [ms]', 'met'];
  const widths = head.map((h, c) => Math.max(h.length, ...rows.map((r) => r[c].length)));
  const line = (r: string[]): string => '| ' + r.map((v, c) => v.padEnd(widths[c])).join(' | ') + ' |';
  process.stdout.write('\n' + line(head) + '\n' + '|' + widths.map((w) => '-'.repeat(w + 2)).join('|') + '|\n');
  for (const r of rows) process.stdout.write(line(r) + '\n');
}

main().catch((e: unknown) => {
  process.stderr.write(`bench:compare failed: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exit(1);
});
