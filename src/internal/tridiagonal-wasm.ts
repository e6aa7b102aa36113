/**
 * WebAssembly SIMD kernel of the Hermitian rank-two update of the Householder
 * tridiagonalisation, A ← A − u qᴴ − q uᴴ on the strict lower triangle of the
 * trailing block, one complex entry (an f64x2 [re, im]) per step.
 * The kernel is wasm/rank2.wat; callers fall back to their scalar loop on
 * the scalar path. No checks.
 * @internal
 * @module
 */
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Exports of wasm/rank2.wat (byte addresses into its memory); arguments as documented there. */
interface Rank2Functions {
  rank2: (pw: number, rowBytes: number, k1: number, n: number, pqc: number, pqs: number, puc: number, pus: number, pu: number, pq: number) => void;
}

const load = kernelModule<Rank2Functions>('rank2');

/** Workspace of one reduction in the module memory. */
export interface Rank2Workspace {
  /** View of the memory: the n×n interleaved matrix at 0, then the six vectors. */
  readonly view: Float64Array;
  /** Offsets (in doubles) of QC, QS, UC, US, U, Q (each 2n doubles). */
  readonly qc: number; readonly qs: number; readonly uc: number; readonly us: number; readonly u: number; readonly q: number;
  /** Runs the update for rows/columns k1 … n−1 (strict lower triangle). */
  update(k1: number): void;
}

/** A workspace for an n×n reduction, or null without WebAssembly SIMD. */
export function rank2Workspace(n: number): Rank2Workspace | null {
  const mod = load();
  if (mod === null) return null;
  const m = 2 * n * n, v = 2 * n;
  const bytes = 8 * (m + 6 * v);
  const view = ensureMemory(mod.memory, bytes);
  const qc = m, qs = m + v, uc = m + 2 * v, us = m + 3 * v, u = m + 4 * v, q = m + 5 * v;
  return {
    view, qc, qs, uc, us, u, q,
    update(k1: number): void { mod.rank2(0, 16 * n, k1, n, qc * 8, qs * 8, uc * 8, us * 8, u * 8, q * 8); },
  };
}
