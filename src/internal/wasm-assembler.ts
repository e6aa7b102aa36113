/**
 * A minimal WebAssembly assembler (core + 128-bit SIMD opcodes) used to build
 * the few SIMD kernels of phasewise at load time from readable instruction
 * lists, with no build step and no binary artefact. No checks.
 * @internal
 * @module
 */

/**
 * Switch for tests and benchmarks: with `enabled` false every kernel reports
 * WebAssembly SIMD as unavailable and the scalar fallbacks run.
 */
export const wasmSettings = { enabled: true };

/** Value types. */
export const I32 = 0x7f, V128 = 0x7b;
/** Core opcodes used by the kernels. */
export const OP = {
  block: 0x02, loop: 0x03, end: 0x0b, br: 0x0c, brIf: 0x0d,
  get: 0x20, set: 0x21, tee: 0x22,
  f64Load: 0x2b, i32Const: 0x41,
  i32LtS: 0x48, i32GeU: 0x4f, i32Add: 0x6a, i32Sub: 0x6b, i32Mul: 0x6c, i32Shl: 0x74,
} as const;
/** SIMD sub-opcodes (after the 0xfd prefix). */
export const SIMD = { load: 0, store: 11, f64x2Splat: 20, f64x2Add: 240, f64x2Sub: 241, f64x2Mul: 242 } as const;

/** Unsigned LEB128. */
export function uleb(n: number): number[] {
  const out: number[] = [];
  do {
    let b = n & 0x7f;
    n >>>= 7;
    if (n !== 0) b |= 0x80;
    out.push(b);
  } while (n !== 0);
  return out;
}
/** Signed LEB128. */
export function sleb(n: number): number[] {
  const out: number[] = [];
  for (;;) {
    const b = n & 0x7f;
    n >>= 7;
    if ((n === 0 && (b & 0x40) === 0) || (n === -1 && (b & 0x40) !== 0)) { out.push(b); return out; }
    out.push(b | 0x80);
  }
}
export const simd = (op: number): number[] => [0xfd, ...uleb(op)];
export const get = (l: number): number[] => [OP.get, ...uleb(l)];
export const set = (l: number): number[] => [OP.set, ...uleb(l)];
export const c32 = (v: number): number[] => [OP.i32Const, ...sleb(v)];
/** v128.load / v128.store with a constant byte offset. */
export const vload = (offset = 0): number[] => [...simd(SIMD.load), 4, ...uleb(offset)];
export const vstore = (offset = 0): number[] => [...simd(SIMD.store), 4, ...uleb(offset)];
/** f64.load with a constant byte offset. */
export const f64load = (offset = 0): number[] => [OP.f64Load, 3, ...uleb(offset)];
const section = (id: number, body: number[]): number[] => [id, ...uleb(body.length), ...body];
export const vec = (items: number[][]): number[] => [...uleb(items.length), ...items.flat()];
const name = (s: string): number[] => [...uleb(s.length), ...Array.from(s, (ch) => ch.charCodeAt(0))];

/** One exported function: all parameters i32, no result; `body` includes its locals and size prefix. */
export interface WasmFunction {
  name: string;
  params: number;
  body: number[];
}

/** Encodes a function body: locals groups [count, type] then code (the final `end` is added). */
export function functionBody(locals: Array<[number, number]>, code: number[]): number[] {
  const body = [...vec(locals.map(([count, type]) => [...uleb(count), type])), ...code, OP.end];
  return [...uleb(body.length), ...body];
}

/**
 * Assembles a module exporting `memory` (1 page, growable) and the functions,
 * and instantiates it synchronously. Returns null where WebAssembly or its
 * SIMD extension is unavailable (callers then use their scalar code).
 */
export function instantiate<T>(fns: WasmFunction[]): T | null {
  try {
    if (typeof WebAssembly !== 'object' || typeof WebAssembly.Module !== 'function') return null;
    const types = fns.map((f) => [0x60, ...vec(new Array(f.params).fill([I32])), 0x00]);
    const bytes = Uint8Array.from([
      0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00,
      ...section(1, vec(types)),
      ...section(3, vec(fns.map((_, i) => uleb(i)))),
      ...section(5, vec([[0x00, ...uleb(1)]])),
      ...section(7, vec([[...name('memory'), 0x02, 0x00], ...fns.map((f, i) => [...name(f.name), 0x00, ...uleb(i)])])),
      ...section(10, vec(fns.map((f) => f.body))),
    ]) as Uint8Array<ArrayBuffer>;
    if (!WebAssembly.validate(bytes)) return null;
    return new WebAssembly.Instance(new WebAssembly.Module(bytes), {}).exports as unknown as T;
  } catch {
    return null;
  }
}

/**
 * A loader that assembles and instantiates the module on first use and then
 * returns the cached exports, or null when WebAssembly SIMD is unavailable or
 * switched off in {@link wasmSettings}.
 */
export function lazyModule<T>(fns: () => WasmFunction[]): () => T | null {
  let cached: T | null | undefined;
  return () => {
    if (cached === undefined) cached = instantiate<T>(fns());
    return wasmSettings.enabled ? cached : null;
  };
}

/** Grows `memory` to at least `bytes` and returns a fresh Float64Array view of it. */
export function ensureMemory(memory: WebAssembly.Memory, bytes: number): Float64Array {
  if (memory.buffer.byteLength < bytes) memory.grow(Math.ceil((bytes - memory.buffer.byteLength) / 65536));
  return new Float64Array(memory.buffer);
}
