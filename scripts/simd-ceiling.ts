/**
 * npm run bench:ceiling — the WebAssembly SIMD ceiling of this machine and how
 * close the complex product gets to it (one thread).
 *
 * The ceiling is measured, not assumed: a loop of f64x2 multiplies and adds in
 * the proportion of a complex multiply–add without fused multiply–add (one
 * multiply per add), in 6 independent multiply chains and 6 add chains so that
 * latency does not limit it, assembled here from WebAssembly text with wabt (a
 * devDependency). Then the product kernel is timed alone (`ztile` on data
 * already in its memory) and through `multiply` (packing included), at
 * N = 256 and 512, as GFLOP/s (8N³ real operations) and percent of the
 * ceiling. Fastest of several runs, with the load average: on a shared
 * machine the figures are lower bounds.
 * Usage: npm run bench:ceiling
 */
import { loadavg } from 'node:os';
import wabtInit from 'wabt';
import { multiply } from '../src/linalg/ops.js';
import { loadZtile } from '../src/internal/ztileWasm.js';
import { ensureMemory } from '../src/internal/wasm/runtime.js';
import { randomMatrix } from '../test/helpers/matchers.js';

/** Independent multiply chains and add chains (6 each: enough to cover the latency of both pipes, few enough for 16 registers). */
const CHAINS = 6;
const CEILING_WAT = `(module
  (func (export "spin") (param $iters i32) (result f64)
    ${Array.from({ length: CHAINS }, (_, c) => `(local $x${c} v128) (local $y${c} v128)`).join(' ')}
    (local $m v128) (local $a v128)
    (local.set $m (v128.const f64x2 0.999999 0.999999))
    (local.set $a (v128.const f64x2 1e-9 1e-9))
    (block $done (loop $l
      (br_if $done (i32.eqz (local.get $iters)))
      ${Array.from({ length: CHAINS }, (_, c) => `(local.set $x${c} (f64x2.mul (local.get $x${c}) (local.get $m))) (local.set $y${c} (f64x2.add (local.get $y${c}) (local.get $a)))`).join('\n      ')}
      (local.set $iters (i32.sub (local.get $iters) (i32.const 1)))
      (br $l)))
    (f64x2.extract_lane 0 (f64x2.add (local.get $x0) (local.get $y${CHAINS - 1})))))`;

function fastest(run: () => void, reps: number): number {
  for (let w = 0; w < 3; w++) run();
  let best = Infinity;
  for (let r = 0; r < reps; r++) {
    const t0 = performance.now();
    run();
    best = Math.min(best, performance.now() - t0);
  }
  return best;
}

const load = (): string => loadavg().map((v) => v.toFixed(2)).join(', ');

async function main(): Promise<void> {
  process.stdout.write(`load average at start (1, 5, 15 min): ${load()}\n`);
  const wabt = await wabtInit();
  const mod = wabt.parseWat('ceiling.wat', CEILING_WAT, { simd: true });
  mod.resolveNames();
  mod.validate();
  const bytes = mod.toBinary({}).buffer;
  mod.destroy();
  const spin = (new WebAssembly.Instance(new WebAssembly.Module(bytes as Uint8Array<ArrayBuffer>), {}).exports as { spin: (n: number) => number }).spin;
  const iters = 20_000_000;
  const ms = fastest(() => { spin(iters); }, 7);
  // per iteration: CHAINS multiplies and CHAINS adds on two lanes = 4·CHAINS flops
  const ceiling = (4 * CHAINS * iters) / ms / 1e6;
  process.stdout.write(`SIMD ceiling (f64x2 mul + add, no FMA): ${ceiling.toFixed(1)} GFLOP/s\n`);
  const zt = loadZtile();
  for (const n of [256, 512]) {
    const flops = 8 * n ** 3;
    if (zt !== null) {
      const bytesA = n * n * 16;
      ensureMemory(zt.memory, 4 * bytesA);
      const f = new Float64Array(zt.memory.buffer);
      for (let i = 0; i < 4 * bytesA / 8; i++) f[i] = Math.sin(i);
      const t = fastest(() => zt.ztile(n, n, n, 0, n * 16, bytesA, n * 64, 2 * bytesA, 2 * bytesA + n * n * 8, n * 8, 32), 5);
      const g = flops / t / 1e6;
      process.stdout.write(`kernel ztile N = ${n}: ${g.toFixed(1)} GFLOP/s = ${((100 * g) / ceiling).toFixed(0)} % of the ceiling\n`);
    }
    const a = randomMatrix(n, n, 1), b = randomMatrix(n, n, 2);
    const t = fastest(() => { multiply(a, b); }, 5);
    const g = flops / t / 1e6;
    process.stdout.write(`multiply N = ${n} (packing included): ${g.toFixed(1)} GFLOP/s = ${((100 * g) / ceiling).toFixed(0)} % of the ceiling\n`);
  }
  process.stdout.write(`load average at end (1, 5, 15 min): ${load()}\n`);
}

main().catch((e: unknown) => {
  process.stderr.write(`bench:ceiling failed: ${e instanceof Error ? e.message : String(e)}\n`);
  process.exit(1);
});
