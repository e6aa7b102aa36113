/**
 * WebAssembly SIMD kernel of the Hermitian rank-two update of the Householder
 * tridiagonalisation, A ← A − u qᴴ − q uᴴ on the strict lower triangle of the
 * trailing block, one complex entry (an f64x2 [re, im]) per step.
 * Assembled at load time; callers fall back to their scalar loop where
 * WebAssembly SIMD is unavailable. No checks.
 * @internal
 * @module
 */
import { I32, OP, SIMD, V128, c32, f64load, functionBody, get, set, simd, vload, vstore, lazyModule, ensureMemory } from './wasm-assembler.js';

/**
 * rank2(pw, rowBytes, k1, n, pqc, pqs, puc, pus, pu, pq): for k1 ≤ j < i < n,
 * W[i, j] −= ū_i·QC_j + ũ_i·QS_j + q̄_i·UC_j + q̃_i·US_j with (ū, ũ) = (Re, Im) of
 * u_i splatted, QC_j = (Re q_j, −Im q_j), QS_j = (Im q_j, Re q_j), and UC, US
 * likewise from u: that is W[i, j] −= u_i conj(q_j) + q_i conj(u_j).
 * Arrays hold one complex (16 bytes) per index j, u and q interleaved.
 */
function rank2Body(): number[] {
  const PW = 0, ROW = 1, K1 = 2, N = 3, PQC = 4, PQS = 5, PUC = 6, PUS = 7, PU = 8, PQ = 9;
  const I = 10, JB = 11, END = 12, RP = 13, A = 14;
  const SUR = 15, SUI = 16, SQR = 17, SQI = 18, W = 19;
  const splat = (base: number, off: number): number[] => [...get(base), ...get(I), ...c32(4), OP.i32Shl, OP.i32Add, ...f64load(off), ...simd(SIMD.f64x2Splat)];
  const term = (s: number, arr: number): number[] => [...get(s), ...get(arr), ...get(JB), OP.i32Add, ...vload(), ...simd(SIMD.f64x2Mul), ...simd(SIMD.f64x2Sub)];
  const code: number[] = [
    ...get(K1), ...set(I),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(I), ...get(N), OP.i32GeU, OP.brIf, 1,
    ...get(PW), ...get(I), ...get(ROW), OP.i32Mul, OP.i32Add, ...set(RP),
    ...splat(PU, 0), ...set(SUR), ...splat(PU, 8), ...set(SUI),
    ...splat(PQ, 0), ...set(SQR), ...splat(PQ, 8), ...set(SQI),
    ...get(K1), ...c32(4), OP.i32Shl, ...set(JB),
    ...get(I), ...c32(4), OP.i32Shl, ...set(END),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(JB), ...get(END), OP.i32GeU, OP.brIf, 1,
    ...get(RP), ...get(JB), OP.i32Add, ...set(A),
    ...get(A), ...vload(), ...set(W),
    ...get(A),
    ...get(W), ...term(SUR, PQC), ...term(SUI, PQS), ...term(SQR, PUC), ...term(SQI, PUS),
    ...vstore(),
    ...get(JB), ...c32(16), OP.i32Add, ...set(JB),
    OP.br, 0,
    OP.end, OP.end,
    ...get(I), ...c32(1), OP.i32Add, ...set(I),
    OP.br, 0,
    OP.end, OP.end,
  ];
  return functionBody([[5, I32], [5, V128]], code);
}

interface Rank2Module {
  memory: WebAssembly.Memory;
  rank2: (pw: number, rowBytes: number, k1: number, n: number, pqc: number, pqs: number, puc: number, pus: number, pu: number, pq: number) => void;
}

const load = lazyModule<Rank2Module>(() => [{ name: 'rank2', params: 10, body: rank2Body() }]);

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
