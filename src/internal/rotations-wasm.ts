/**
 * WebAssembly SIMD kernel applying the plane rotations of one implicit QL
 * sweep to the accumulated eigenvector matrix, two matrix rows per f64x2
 * lane pair and eight rows per pass (four independent running values hide
 * the latency of the recurrence). Assembled at load time; callers fall back
 * to their scalar loop where WebAssembly SIMD is unavailable. No checks.
 * @internal
 * @module
 */
import { I32, OP, SIMD, V128, c32, f64load, functionBody, get, set, simd, vload, vstore, lazyModule, ensureMemory } from './wasm-assembler.js';

/**
 * rotate(pz, rowBytes, lo, m, pc, ps): Zt is stored by rows t (row stride
 * `rowBytes`, a multiple of 64), with rotation t mixing rows t and t+1:
 * for every column group of eight doubles, carry = Zt[m];
 * for t = m−1 … lo: Zt[t+1] = s_t·Zt[t] + c_t·carry, carry = c_t·Zt[t] − s_t·carry;
 * finally Zt[lo] = carry. c_t, s_t are f64 arrays at byte addresses pc, ps.
 */
function rotateBody(): number[] {
  const PZ = 0, ROW = 1, LO = 2, M = 3, PC = 4, PS = 5;
  const KB = 6, T = 7, PTR = 8;
  const CS = 9, SN = 10, C = (u: number): number => 11 + u, Z = (u: number): number => 15 + u;
  const u4 = [0, 1, 2, 3];
  const code: number[] = [
    ...c32(0), ...set(KB),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(KB), ...get(ROW), OP.i32GeU, OP.brIf, 1,
    // ptr = pz + m·row + kb; carries = Zt[m]
    ...get(PZ), ...get(M), ...get(ROW), OP.i32Mul, OP.i32Add, ...get(KB), OP.i32Add, ...set(PTR),
    ...u4.flatMap((u) => [...get(PTR), ...vload(16 * u), ...set(C(u))]),
    ...get(M), ...c32(1), OP.i32Sub, ...set(T),
    ...get(PTR), ...get(ROW), OP.i32Sub, ...set(PTR),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(T), ...get(LO), OP.i32LtS, OP.brIf, 1,
    ...get(PC), ...get(T), ...c32(3), OP.i32Shl, OP.i32Add, ...f64load(), ...simd(SIMD.f64x2Splat), ...set(CS),
    ...get(PS), ...get(T), ...c32(3), OP.i32Shl, OP.i32Add, ...f64load(), ...simd(SIMD.f64x2Splat), ...set(SN),
    ...u4.flatMap((u) => [...get(PTR), ...vload(16 * u), ...set(Z(u))]),
    // Zt[t+1] = s·z + c·carry
    ...u4.flatMap((u) => [
      ...get(PTR), ...get(ROW), OP.i32Add,
      ...get(SN), ...get(Z(u)), ...simd(SIMD.f64x2Mul), ...get(CS), ...get(C(u)), ...simd(SIMD.f64x2Mul), ...simd(SIMD.f64x2Add),
      ...vstore(16 * u),
    ]),
    // carry = c·z − s·carry
    ...u4.flatMap((u) => [
      ...get(CS), ...get(Z(u)), ...simd(SIMD.f64x2Mul), ...get(SN), ...get(C(u)), ...simd(SIMD.f64x2Mul), ...simd(SIMD.f64x2Sub), ...set(C(u)),
    ]),
    ...get(T), ...c32(1), OP.i32Sub, ...set(T),
    ...get(PTR), ...get(ROW), OP.i32Sub, ...set(PTR),
    OP.br, 0,
    OP.end, OP.end,
    // Zt[lo] = carry (ptr is one row above lo)
    ...u4.flatMap((u) => [...get(PTR), ...get(ROW), OP.i32Add, ...get(C(u)), ...vstore(16 * u)]),
    ...get(KB), ...c32(64), OP.i32Add, ...set(KB),
    OP.br, 0,
    OP.end, OP.end,
  ];
  return functionBody([[3, I32], [10, V128]], code);
}

interface RotationModule {
  memory: WebAssembly.Memory;
  rotate: (pz: number, rowBytes: number, lo: number, m: number, pc: number, ps: number) => void;
}

const load = lazyModule<RotationModule>(() => [{ name: 'rotate', params: 6, body: rotateBody() }]);

/** Workspace of one QL run in the module memory. */
export interface RotationWorkspace {
  /** Row stride of Zt in doubles (n rounded up to a multiple of 8). */
  readonly stride: number;
  /** View of the memory: Zt at 0 (n rows of `stride`), then c and s (n each). */
  readonly view: Float64Array;
  /** Offsets (in doubles) of the cosine and sine arrays. */
  readonly cOffset: number;
  readonly sOffset: number;
  /** Applies rotations t = m−1 … lo recorded at view[cOffset + t], view[sOffset + t]. */
  apply(lo: number, m: number): void;
}

/** A workspace for an n×n rotation accumulation initialised to Zt = I, or null without WebAssembly SIMD. */
export function rotationWorkspace(n: number): RotationWorkspace | null {
  const mod = load();
  if (mod === null) return null;
  const stride = Math.ceil(n / 8) * 8;
  const bytes = 8 * (n * stride + 2 * n);
  const view = ensureMemory(mod.memory, bytes);
  view.fill(0, 0, n * stride);
  for (let i = 0; i < n; i++) view[i * stride + i] = 1;
  const cOffset = n * stride, sOffset = cOffset + n;
  return {
    stride, view, cOffset, sOffset,
    apply(lo: number, m: number): void { mod.rotate(0, stride * 8, lo, m, cOffset * 8, sOffset * 8); },
  };
}
