/**
 * A child-process check of the kernel threads, shared by the dist/ and installed-package tests.
 */
import { spawnSync } from 'node:child_process';

/**
 * The body run in a child process, with `lib` the linalg entry: a 300×300 product on one thread,
 * then on two (repeated until a worker took part, they start at the first large product), and a
 * SHA-256 of each result.
 */
export const THREADS_SCRIPT = `
const { createHash } = require('node:crypto');
const { multiply, zeros, setKernelThreads, simdStatus } = lib;
const n = 300, a = zeros(n, n);
for (let i = 0; i < a.data.length; i++) a.data[i] = Math.sin(i);
const hash = (m) => createHash('sha256').update(new Uint8Array(m.data.buffer)).digest('hex');
setKernelThreads(1);
const one = hash(multiply(a, a));
setKernelThreads(2);
let two = hash(multiply(a, a));
const until = Date.now() + 5000;
const again = () => {
  two = hash(multiply(a, a));
  if (!/1 of 1 ready/.test(simdStatus().threadsReason) && Date.now() < until) return setTimeout(again, 20);
  two = hash(multiply(a, a));
  console.log(JSON.stringify({ same: one === two, threads: simdStatus().threads, reason: simdStatus().threadsReason }));
};
again();
`;

/** Runs `code` with node, returns its stdout and how long the process lived (ms). */
export function runTimed(args: string[], cwd: string): { out: string; ms: number; status: number | null; err: string } {
  const t0 = Date.now();
  const r = spawnSync('node', args, { cwd, encoding: 'utf8', timeout: 60_000 });
  return { out: r.stdout, ms: Date.now() - t0, status: r.status, err: r.stderr };
}

