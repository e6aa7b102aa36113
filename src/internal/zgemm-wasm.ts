/**
 * A WebAssembly SIMD (128-bit, f64x2) kernel for the complex matrix product,
 * assembled at load time from the instruction list below (no build step, no
 * binary artefact). Used by `multiplyInto` for products large enough to pay
 * for packing; falls back to the scalar kernel where WebAssembly SIMD is
 * unavailable. No checks.
 * @internal
 * @module
 */

import { I32, OP, SIMD, V128, c32, functionBody, get, set, simd, uleb, vload, vstore, lazyModule, ensureMemory } from './wasm-assembler.js';

/** Inner-dimension unroll of the SIMD kernel (k is padded to a multiple of it); 3 measured fastest of 2, 3, 4 (4 spills registers). */
export const SIMD_UNROLL = 3;

/**
 * zgemm(m, n, k, pa, lda, pbr, pbi, pcr, pci): for i < m, p < k (k a multiple
 * of SIMD_UNROLL), j < n (n even): Cre/Cim[i, j] += A[i, p]·B[p, j]. A
 * interleaved complex with a row stride of `lda` bytes; B and C as separate
 * real/imaginary planes, row stride n·8 bytes. Per step: two columns (one
 * f64x2 vector) and SIMD_UNROLL values of p, with C loaded and stored once:
 *   cr += Σᵤ (arᵤ·brᵤ − aiᵤ·biᵤ),  ci += Σᵤ (arᵤ·biᵤ + aiᵤ·brᵤ).
 */
function zgemmBody(): number[] {
  const U = SIMD_UNROLL;
  // params 0..8
  const M = 0, N = 1, K = 2, PA = 3, LDA = 4, PBR = 5, PBI = 6, PCR = 7, PCI = 8;
  // i32 locals 9..(17+U)
  const I = 9, P = 10, O = 11, ROW = 12, CRR = 13, CRI = 14, B0R = 15, B0I = 16, AP = 17;
  const RU = (u: number): number => 18 + u; // u·ROW, u = 0 … U−1
  const nI32 = 9 + U;
  // v128 locals: AR, AI, XR, XI per u
  const V0 = 9 + nI32;
  const AR = (u: number): number => V0 + u, AI = (u: number): number => V0 + U + u;
  const XR = (u: number): number => V0 + 2 * U + u, XI = (u: number): number => V0 + 3 * U + u;
  const addr = (base: number): number[] => [...get(base), ...get(O), OP.i32Add];
  const addrU = (base: number, u: number): number[] => (u === 0 ? addr(base) : [...addr(base), ...get(RU(u)), OP.i32Add]);
  const splatF64 = (off: number): number[] => [...get(AP), OP.f64Load, 3, ...uleb(off), ...simd(SIMD.f64x2Splat)];
  const mulAdd = (a: number, x: number, sub: boolean): number[] => [...get(a), ...get(x), ...simd(SIMD.f64x2Mul), ...simd(sub ? SIMD.f64x2Sub : SIMD.f64x2Add)];
  const perU = (f: (u: number) => number[]): number[] => Array.from({ length: U }, (_, u) => f(u)).flat();
  const code: number[] = [
    ...get(N), ...c32(3), OP.i32Shl, ...set(ROW),
    ...perU((u) => [...get(ROW), ...c32(u), OP.i32Mul, ...set(RU(u))]),
    ...c32(0), ...set(I),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(I), ...get(M), OP.i32GeU, OP.brIf, 1,
    ...get(PCR), ...get(I), ...get(ROW), OP.i32Mul, OP.i32Add, ...set(CRR),
    ...get(PCI), ...get(I), ...get(ROW), OP.i32Mul, OP.i32Add, ...set(CRI),
    ...get(PA), ...get(I), ...get(LDA), OP.i32Mul, OP.i32Add, ...set(AP),
    ...c32(0), ...set(P),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(P), ...get(K), OP.i32GeU, OP.brIf, 1,
    ...perU((u) => [...splatF64(16 * u), ...set(AR(u)), ...splatF64(16 * u + 8), ...set(AI(u))]),
    ...get(PBR), ...get(P), ...get(ROW), OP.i32Mul, OP.i32Add, ...set(B0R),
    ...get(PBI), ...get(P), ...get(ROW), OP.i32Mul, OP.i32Add, ...set(B0I),
    ...c32(0), ...set(O),
    OP.block, 0x40, OP.loop, 0x40,
    ...get(O), ...get(ROW), OP.i32GeU, OP.brIf, 1,
    ...perU((u) => [...addrU(B0R, u), ...vload(), ...set(XR(u)), ...addrU(B0I, u), ...vload(), ...set(XI(u))]),
    // real part
    ...addr(CRR),
    ...addr(CRR), ...vload(),
    ...perU((u) => [...mulAdd(AR(u), XR(u), false), ...mulAdd(AI(u), XI(u), true)]),
    ...vstore(),
    // imaginary part
    ...addr(CRI),
    ...addr(CRI), ...vload(),
    ...perU((u) => [...mulAdd(AR(u), XI(u), false), ...mulAdd(AI(u), XR(u), false)]),
    ...vstore(),
    ...get(O), ...c32(16), OP.i32Add, ...set(O),
    OP.br, 0,
    OP.end, OP.end,
    ...get(P), ...c32(U), OP.i32Add, ...set(P),
    ...get(AP), ...c32(16 * U), OP.i32Add, ...set(AP),
    OP.br, 0,
    OP.end, OP.end,
    ...get(I), ...c32(1), OP.i32Add, ...set(I),
    OP.br, 0,
    OP.end, OP.end,
  ];
  return functionBody([[nI32, I32], [4 * U, V128]], code);
}

interface ZgemmModule {
  memory: WebAssembly.Memory;
  zgemm: (m: number, n: number, k: number, pa: number, lda: number, pbr: number, pbi: number, pcr: number, pci: number) => void;
}

const load = lazyModule<ZgemmModule>(() => [{ name: 'zgemm', params: 9, body: zgemmBody() }]);

/** Whether the SIMD kernel is available in this runtime. */
export function simdGemmAvailable(): boolean {
  return load() !== null;
}

/** Rows of B packed per pass so the B block (two planes) stays within ~256 KiB. */
function panelRows(nPad: number): number {
  const rows = Math.floor((256 * 1024) / (16 * nPad));
  return Math.max(SIMD_UNROLL, rows - (rows % SIMD_UNROLL));
}

/**
 * C[m×n] (+)= alpha·A[m×k]·B[k×n] (alpha real) on interleaved row-major
 * storage with leading dimensions and offsets in complex elements (the
 * signature of the scalar `gemmKernel`), computed by the SIMD kernel.
 * Returns false (doing nothing) when WebAssembly SIMD is unavailable.
 * A and B are copied into the module memory before C is written, so C may
 * share a buffer with A or B as long as the regions do not overlap.
 */
export function simdGemm(
  m: number, n: number, k: number,
  a: Float64Array, offA: number, lda: number,
  b: Float64Array, offB: number, ldb: number,
  c: Float64Array, offC: number, ldc: number,
  accumulate: boolean, alpha: number,
): boolean {
  const mod = load();
  if (mod === null) return false;
  const nPad = n + (n & 1), kPad = Math.ceil(k / SIMD_UNROLL) * SIMD_UNROLL;
  // layout (bytes): A (m·kPad·16) | Bre (kPad·nPad·8) | Bim | Cre (m·nPad·8) | Cim
  const aBytes = m * kPad * 16, bBytes = kPad * nPad * 8, cBytes = m * nPad * 8;
  const total = aBytes + 2 * bBytes + 2 * cBytes;
  const f = ensureMemory(mod.memory, total);
  const pa = 0, pbr = aBytes, pbi = pbr + bBytes, pcr = pbi + bBytes, pci = pcr + cBytes;
  // A, padded with zero columns up to a multiple of SIMD_UNROLL
  for (let i = 0; i < m; i++) {
    const s = 2 * (offA + i * lda);
    f.set(a.subarray(s, s + 2 * k), 2 * i * kPad);
    if (kPad !== k) f.fill(0, 2 * (i * kPad + k), 2 * (i + 1) * kPad);
  }
  // B planes, zero padding in the extra row/column
  const br = pbr >> 3, bi = pbi >> 3;
  for (let p = 0; p < kPad; p++) {
    const dr = br + p * nPad, di = bi + p * nPad;
    if (p < k) {
      const s = 2 * (offB + p * ldb);
      for (let j = 0; j < n; j++) { f[dr + j] = b[s + 2 * j]; f[di + j] = b[s + 2 * j + 1]; }
      if (nPad !== n) { f[dr + n] = 0; f[di + n] = 0; }
    } else {
      f.fill(0, dr, dr + nPad); f.fill(0, di, di + nPad);
    }
  }
  f.fill(0, pcr >> 3, (pci >> 3) + m * nPad);
  // k in panels so the B block stays in L2
  const step = panelRows(nPad);
  for (let p0 = 0; p0 < kPad; p0 += step) {
    const kb = Math.min(step, kPad - p0);
    mod.zgemm(m, nPad, kb, pa + p0 * 16, kPad * 16, pbr + p0 * nPad * 8, pbi + p0 * nPad * 8, pcr, pci);
  }
  const cr = pcr >> 3, ci = pci >> 3;
  for (let i = 0; i < m; i++) {
    const s = i * nPad, d = 2 * (offC + i * ldc);
    if (accumulate) {
      for (let j = 0; j < n; j++) { c[d + 2 * j] += alpha * f[cr + s + j]; c[d + 2 * j + 1] += alpha * f[ci + s + j]; }
    } else if (alpha === 1) {
      for (let j = 0; j < n; j++) { c[d + 2 * j] = f[cr + s + j]; c[d + 2 * j + 1] = f[ci + s + j]; }
    } else {
      for (let j = 0; j < n; j++) { c[d + 2 * j] = alpha * f[cr + s + j]; c[d + 2 * j + 1] = alpha * f[ci + s + j]; }
    }
  }
  return true;
}
