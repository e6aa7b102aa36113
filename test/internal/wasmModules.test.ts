import { readFileSync } from 'node:fs';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { MODULES_FILE, generateModulesSource } from '../../scripts/build-wasm.js';
import { emitFallbackWarning, fallbackWarningText, probeHost, type WasmHost } from '../../src/internal/wasm/runtime.js';
import { simdStatus } from '../../src/linalg/simd.js';

describe('WebAssembly kernels from their .wat sources', () => {
  it('regenerating src/internal/wasm/modules.ts from the .wat files with wabt is byte-identical to the checked-in file', async () => {
    const regenerated = await generateModulesSource();
    const checkedIn = readFileSync(MODULES_FILE, 'utf8');
    // on failure: run `npm run build:wasm` and commit the result
    expect(regenerated).toBe(checkedIn);
  });

  it('Node ≥ 20 runs the SIMD path (WebAssembly 2.0 includes 128-bit SIMD)', () => {
    expect(simdStatus()).toMatchObject({ path: 'wasm-simd', reason: expect.stringContaining('SIMD') });
  });
});

describe('the scalar fallback decision and its warning', () => {
  const real = WebAssembly as unknown as WasmHost;

  it('no WebAssembly at all: scalar, and the reason says so', () => {
    const r = probeHost(undefined);
    expect(r.path).toBe('scalar');
    expect(r.reason).toMatch(/no WebAssembly/);
  });

  it('a WebAssembly without SIMD (validation fails): scalar, naming the rejected kernel', () => {
    const noSimd: WasmHost = { Module: real.Module, Instance: real.Instance, validate: () => false };
    const r = probeHost(noSimd);
    expect(r.path).toBe('scalar');
    expect(r.reason).toMatch(/rejects the 128-bit SIMD kernel '\w+'/);
    expect(r.modules).toEqual({});
  });

  it('a compile error is reported with its message', () => {
    const broken: WasmHost = {
      Module: class { constructor() { throw new RangeError('out of executable memory'); } } as unknown as WasmHost['Module'],
      Instance: real.Instance, validate: () => true,
    };
    expect(probeHost(broken)).toMatchObject({ path: 'scalar', reason: expect.stringContaining('out of executable memory') });
  });

  it('the warning goes through process.emitWarning with a stable code, and is skipped where there is no process', () => {
    const calls: unknown[][] = [];
    const proc = { emitWarning(...args: unknown[]) { calls.push(args); } };
    expect(emitFallbackWarning('test reason', proc)).toBe(true);
    expect(calls).toEqual([[fallbackWarningText('test reason'), { type: 'PhasewiseWarning', code: 'PHASEWISE_SIMD_FALLBACK' }]]);
    expect(fallbackWarningText('test reason').split('\n')).toHaveLength(1);
    expect(emitFallbackWarning('test reason', undefined)).toBe(false);
    expect(emitFallbackWarning('test reason', {})).toBe(false);
  });

  describe('in a runtime without WebAssembly (fresh module state)', () => {
    afterEach(() => {
      vi.unstubAllGlobals();
      vi.restoreAllMocks();
      vi.resetModules();
    });

    it('simdStatus reports scalar, the warning is emitted once, and the product still equals the SIMD result to rounding', async () => {
      const { multiply } = await import('../../src/linalg/ops.js');
      const { randomMatrix, expectCMatrixClose } = await import('../helpers/matchers.js');
      const a = randomMatrix(30, 20, 1), b = randomMatrix(20, 25, 2);
      const withSimd = multiply(a, b);
      vi.resetModules();
      vi.stubGlobal('WebAssembly', undefined);
      const warn = vi.spyOn(process, 'emitWarning').mockImplementation(() => undefined);
      const fresh = await import('../../src/linalg/simd.js');
      const ops = await import('../../src/linalg/ops.js');
      const scalar = ops.multiply(a, b);
      expect(fresh.simdStatus()).toEqual({ path: 'scalar', reason: 'this runtime has no WebAssembly', threads: 1, threadsReason: 'the scalar path runs on one thread' });
      ops.multiply(a, b);
      expect(warn).toHaveBeenCalledTimes(1);
      expect(warn.mock.calls[0][1]).toEqual({ type: 'PhasewiseWarning', code: 'PHASEWISE_SIMD_FALLBACK' });
      // k = 20 terms of products of entries ≤ √2: rounding well below 1e-13 relative
      expectCMatrixClose(scalar, withSimd, { rtol: 1e-13 });
    });
  });
});
