/**
 * WebAssembly SIMD kernel of the Householder tridiagonalisation: one fused
 * pass that applies the pending Hermitian rank-two update of step k−1 and
 * forms the Hermitian matrix-vector product of step k over the strict lower
 * triangle of the trailing block (wasm/tridiag.wat). The reduction driving it
 * is in tridiagonal.ts; callers fall back to their scalar loops on the scalar
 * path. No checks.
 * @internal
 * @module
 */
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Exports of wasm/tridiag.wat (byte addresses into its memory); arguments as documented there. */
interface TridiagFunctions {
  rank2mv: (
    pw: number, rowBytes: number, k2: number, n: number, pqc: number, pqs: number, puc: number, pus: number,
    pu: number, pq: number, pvrr: number, pvis: number, pvpr: number, pvii: number, pp: number,
  ) => void;
}

const load = kernelModule<TridiagFunctions>('tridiag');

/** Workspace of one reduction in the module memory. */
export interface TridiagWorkspace {
  /** View of the memory: the n×n interleaved matrix at 0, then the eleven vectors. */
  readonly view: Float64Array;
  /**
   * Offsets (in doubles) of the vectors of wasm/tridiag.wat, each 2n doubles
   * (one [re, im] slot per index): the pending update QC, QS, UC, US, U, Q;
   * the product's vector VRR, VIS, VPR, VII; the product P.
   */
  readonly qc: number; readonly qs: number; readonly uc: number; readonly us: number; readonly u: number; readonly q: number;
  readonly vrr: number; readonly vis: number; readonly vpr: number; readonly vii: number; readonly p: number;
  /** The fused pass over rows/columns k2 … n−1 (strict lower triangle). */
  pass(k2: number): void;
}

/** A workspace for an n×n reduction (all vectors zero), or null on the scalar path. */
export function tridiagWorkspace(n: number): TridiagWorkspace | null {
  const mod = load();
  if (mod === null) return null;
  const m = 2 * n * n, v = 2 * n;
  const view = ensureMemory(mod.memory, 8 * (m + 11 * v));
  view.fill(0, m, m + 11 * v);
  const [qc, qs, uc, us, u, q, vrr, vis, vpr, vii, p] = Array.from({ length: 11 }, (_, t) => m + t * v);
  return {
    view, qc, qs, uc, us, u, q, vrr, vis, vpr, vii, p,
    pass(k2: number): void {
      mod.rank2mv(0, 16 * n, k2, n, qc * 8, qs * 8, uc * 8, us * 8, u * 8, q * 8, vrr * 8, vis * 8, vpr * 8, vii * 8, p * 8);
    },
  };
}
