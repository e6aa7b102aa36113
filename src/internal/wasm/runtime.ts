/**
 * Loading of the WebAssembly SIMD kernels (bytes from the generated
 * `modules.ts`), the one decision "SIMD or scalar" for the whole library, its
 * reason, and the one-time warning when the scalar fallback is taken.
 *
 * The decision is made once, at the first kernel use or the first
 * `simdStatus()` call: WebAssembly must exist and every kernel module must
 * validate and compile (the modules use 128-bit SIMD, so a runtime without it
 * rejects them). Either all kernels run on WebAssembly SIMD or none does.
 * Modules are compiled synchronously (each is well under the 4 KiB that
 * browsers allow on the main thread) and each kernel gets its own instance and
 * memory, so the workspace of one kernel is never overwritten by another (the
 * product kernel imports its memory: see `threads.ts`).
 * No checks.
 * @internal
 * @module
 */
import { dtileWasm, gridsumWasm, jacobiWasm, luWasm, rotateWasm, tridiagWasm, ztileLocalWasm } from './modules.js';

/**
 * Switch for tests and benchmarks: with `enabled` false every kernel reports
 * WebAssembly SIMD as unavailable and the scalar fallbacks run (no warning).
 */
export const wasmSettings = { enabled: true };

/**
 * The kernel modules, by name (the .wat file name). The product kernel is probed in its
 * single-thread variant (its memory import not shared); `threads.ts` loads it and, where
 * threads can run, its shared-memory variant.
 */
const SOURCES = { ztile: ztileLocalWasm, dtile: dtileWasm, tridiag: tridiagWasm, rotate: rotateWasm, jacobi: jacobiWasm, gridsum: gridsumWasm, lu: luWasm } as const;
/** Name of a kernel module. */
export type KernelName = keyof typeof SOURCES;

/** Which path the kernels take, and why (the value behind the public `simdStatus()`). */
export interface KernelPath {
  path: 'wasm-simd' | 'scalar';
  reason: string;
}

/** The part of the WebAssembly namespace the loader uses (an argument so tests can pass a stand-in). */
export interface WasmHost {
  Module: new (bytes: Uint8Array<ArrayBuffer>) => WebAssembly.Module;
  Instance: new (module: WebAssembly.Module, imports: WebAssembly.Imports) => WebAssembly.Instance;
  validate(bytes: Uint8Array<ArrayBuffer>): boolean;
}

/** Decodes base64 (atob exists in browsers and in Node ≥ 16). */
export function decodeBase64(s: string): Uint8Array<ArrayBuffer> {
  const bin = atob(s);
  const out = new Uint8Array(bin.length);
  for (let i = 0; i < bin.length; i++) out[i] = bin.charCodeAt(i);
  return out;
}

/** The outcome of probing a host: the path, its reason and the compiled modules when SIMD runs. */
export interface ProbeResult extends KernelPath {
  modules: Partial<Record<KernelName, WebAssembly.Module>>;
}

/**
 * Decides the path for `host` (the global `WebAssembly`, or undefined where
 * there is none): every module must validate and compile.
 */
export function probeHost(host: WasmHost | undefined): ProbeResult {
  if (host === undefined || typeof host.validate !== 'function' || typeof host.Module !== 'function') {
    return { path: 'scalar', reason: 'this runtime has no WebAssembly', modules: {} };
  }
  const modules: Partial<Record<KernelName, WebAssembly.Module>> = {};
  for (const name of Object.keys(SOURCES) as KernelName[]) {
    const bytes = decodeBase64(SOURCES[name]);
    let compiled: WebAssembly.Module;
    try {
      if (!host.validate(bytes)) {
        return { path: 'scalar', reason: `this runtime's WebAssembly rejects the 128-bit SIMD kernel '${name}' (WebAssembly SIMD unsupported)`, modules: {} };
      }
      compiled = new host.Module(bytes);
    } catch (e) {
      return { path: 'scalar', reason: `compiling the WebAssembly SIMD kernel '${name}' failed: ${e instanceof Error ? e.message : String(e)}`, modules: {} };
    }
    modules[name] = compiled;
  }
  return { path: 'wasm-simd', reason: 'WebAssembly SIMD (f64x2) kernels compiled', modules };
}

/** Text of the one-time warning for a fallback with the given reason. */
export function fallbackWarningText(reason: string): string {
  return `phasewise: running the scalar kernels because ${reason}; results agree to rounding, large matrix operations are several times slower (see simdStatus()).`;
}

/** Minimal shape of Node's `process.emitWarning`. */
type EmitWarning = (message: string, options: { type: string; code: string }) => void;

/**
 * Emits the fallback warning through `proc.emitWarning` (called with the
 * global `process`) where that object provides it (Node, Deno, Bun, bundlers that polyfill it); in a
 * browser without it nothing is printed and `simdStatus()` tells the path.
 * Returns whether a warning was emitted.
 */
export function emitFallbackWarning(reason: string, proc: unknown): boolean {
  const emit = (proc as { emitWarning?: EmitWarning } | undefined)?.emitWarning;
  if (typeof emit !== 'function') return false;
  emit.call(proc, fallbackWarningText(reason), { type: 'PhasewiseWarning', code: 'PHASEWISE_SIMD_FALLBACK' });
  return true;
}

let probed: ProbeResult | undefined;

/** The probe of the global WebAssembly, made once; the first scalar outcome emits the warning. */
function probe(): ProbeResult {
  if (probed === undefined) {
    probed = probeHost(typeof WebAssembly === 'object' ? (WebAssembly as unknown as WasmHost) : undefined);
    if (probed.path === 'scalar') emitFallbackWarning(probed.reason, (globalThis as { process?: unknown }).process);
  }
  return probed;
}

/** The path the kernels take now (honours {@link wasmSettings}). */
export function kernelPath(): KernelPath {
  const { path, reason } = probe();
  if (path === 'wasm-simd' && !wasmSettings.enabled) return { path: 'scalar', reason: 'WebAssembly SIMD switched off (internal test switch)' };
  return { path, reason };
}

/** The compiled module `name`, or undefined on the scalar path (whatever {@link wasmSettings} says). */
export function compiledModule(name: KernelName): WebAssembly.Module | undefined {
  return probe().modules[name];
}

/** Raw exports of a kernel module: its memory and its functions (byte addresses into memory). */
export type KernelExports<F> = F & { memory: WebAssembly.Memory };

/**
 * A loader that instantiates kernel module `name` on first use (its own
 * memory) and then returns the cached exports, or null when the scalar path
 * is taken (no SIMD, or switched off in {@link wasmSettings}).
 */
export function kernelModule<F>(name: KernelName): () => KernelExports<F> | null {
  let cached: KernelExports<F> | null | undefined;
  return () => {
    if (cached === undefined) {
      const compiled = probe().modules[name];
      cached = compiled === undefined ? null : (new WebAssembly.Instance(compiled, {}).exports as unknown as KernelExports<F>);
    }
    return wasmSettings.enabled ? cached : null;
  };
}

/** Grows `memory` to at least `bytes` and returns a fresh Float64Array view of it. */
export function ensureMemory(memory: WebAssembly.Memory, bytes: number): Float64Array {
  if (memory.buffer.byteLength < bytes) memory.grow(Math.ceil((bytes - memory.buffer.byteLength) / 65536));
  return new Float64Array(memory.buffer);
}
