/**
 * A register-tiled WebAssembly SIMD kernel for the complex matrix product:
 * a 1-row × 4-column tile of C stays in four f64x2 register pairs while the
 * inner dimension runs, so each step loads four vectors of B and two scalars
 * of A for four complex multiply–adds, and C is loaded and stored once per
 * tile (the streaming kernel of zgemm-wasm.ts loads and stores C every few
 * steps). Measured about 20 % faster than that kernel on 100×100×258. No checks.
 * @internal
 * @module
 */
import { I32, OP, SIMD, V128, c32, functionBody, get, set, simd, lazyModule, vload, vsplat, vstore, vzero } from './wasm-assembler.js';

/**
 * ztile(m, n, k, pa, lda, pb, pcr, pci, ldc): for i < m, j < n (n a multiple
 * of 4), p < k: Cre/Cim[i, j] += A[i, p]·B[p, j]. A interleaved complex, row
 * stride `lda` bytes. B packed in panels of four columns: panel q at
 * pb + q·k·64, and within it for each p the 64 bytes [re j0..j3 | im j0..j3].
 * C as real/imaginary planes, row stride `ldc` bytes.
 */
function ztileBody(): number[] {
  const M = 0, N = 1, K = 2, PA = 3, LDA = 4, PB = 5, PCR = 6, PCI = 7, LDC = 8;
  const I = 9, Q = 10, P = 11, A0 = 12, BP = 13, KB = 14, CR = 15, CI = 16, QN = 17, K16 = 18;
  const nI32 = 10;
  // v128 locals: accumulators (vector v of the tile, part h), B vectors, the two A splats
  const V0 = 9 + nI32;
  const ACC = (v: number, h: number): number => V0 + 2 * v + h;
  const BV = (v: number, h: number): number => V0 + 4 + 2 * v + h;
  const AR = V0 + 8, AI = V0 + 9;
  const mul = simd(SIMD.f64x2Mul), add = simd(SIMD.f64x2Add), sub = simd(SIMD.f64x2Sub);
  // acc += a1·b1 ± a2·b2 (the two products summed first: one dependent add per accumulator and step)
  const mac2 = (acc: number, a1: number, b1: number, a2: number, b2: number, minus: boolean): number[] => [
    ...get(acc), ...get(a1), ...get(b1), ...mul, ...get(a2), ...get(b2), ...mul, ...(minus ? sub : add), ...add, ...set(acc),
  ];
  const step: number[] = [
    ...get(BP), ...vload(0), ...set(BV(0, 0)),
    ...get(BP), ...vload(16), ...set(BV(1, 0)),
    ...get(BP), ...vload(32), ...set(BV(0, 1)),
    ...get(BP), ...vload(48), ...set(BV(1, 1)),
    ...get(A0), ...get(P), OP.i32Add, ...vsplat(0), ...set(AR),
    ...get(A0), ...get(P), OP.i32Add, ...vsplat(8), ...set(AI),
    // cr += ar·br − ai·bi, ci += ar·bi + ai·br
    ...[0, 1].flatMap((v) => [...mac2(ACC(v, 0), AR, BV(v, 0), AI, BV(v, 1), true), ...mac2(ACC(v, 1), AR, BV(v, 1), AI, BV(v, 0), false)]),
  ];
  // C[i, 4q + 2v …] (+)= tile; the column offset of panel q is q·32 bytes
  const storeTile = [0, 1].flatMap((h) => [0, 1].flatMap((v) => {
    const at = [...get(h === 0 ? CR : CI), ...get(Q), ...c32(5), OP.i32Shl, ...c32(16 * v), OP.i32Add, OP.i32Add];
    return [...at, ...at, ...vload(), ...get(ACC(v, h)), ...add, ...vstore()];
  }));
  const code: number[] = [
    ...get(K), ...c32(6), OP.i32Shl, ...set(KB), // bytes per B panel
    ...get(K), ...c32(4), OP.i32Shl, ...set(K16), // bytes per A row
    ...get(N), ...c32(2), OP.i32ShrU, ...set(QN),
    ...c32(0), ...set(I),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(I), ...get(M), OP.i32GeU, OP.brIf, 1,
    ...get(PA), ...get(I), ...get(LDA), OP.i32Mul, OP.i32Add, ...set(A0),
    ...get(PCR), ...get(I), ...get(LDC), OP.i32Mul, OP.i32Add, ...set(CR),
    ...get(PCI), ...get(I), ...get(LDC), OP.i32Mul, OP.i32Add, ...set(CI),
    ...c32(0), ...set(Q),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(Q), ...get(QN), OP.i32GeU, OP.brIf, 1,
    ...[0, 1].flatMap((v) => [0, 1].flatMap((h) => [...vzero(), ...set(ACC(v, h))])),
    ...get(PB), ...get(Q), ...get(KB), OP.i32Mul, OP.i32Add, ...set(BP),
    // P runs over A byte offsets 0, 16, …, 16(k−1); BP advances 64 per step
    ...c32(0), ...set(P),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(P), ...get(K16), OP.i32GeU, OP.brIf, 1,
    ...step,
    ...get(BP), ...c32(64), OP.i32Add, ...set(BP),
    ...get(P), ...c32(16), OP.i32Add, ...set(P),
    OP.br, 0,
    OP.end, OP.end,
    ...storeTile,
    ...get(Q), ...c32(1), OP.i32Add, ...set(Q),
    OP.br, 0,
    OP.end, OP.end,
    ...get(I), ...c32(1), OP.i32Add, ...set(I),
    OP.br, 0,
    OP.end, OP.end,
  ];
  return functionBody([[nI32, I32], [10, V128]], code);
}

/** Raw exports of the tiled product module (byte addresses into `memory`). */
export interface ZtileModule {
  memory: WebAssembly.Memory;
  ztile: (m: number, n: number, k: number, pa: number, lda: number, pb: number, pcr: number, pci: number, ldc: number) => void;
}

/** The tiled product module, or null when WebAssembly SIMD is unavailable or switched off. */
export const loadZtile = lazyModule<ZtileModule>(() => [{ name: 'ztile', params: 9, body: ztileBody() }]);
