import { describe, it, expect } from 'vitest';
import { realProduct, tridiagonalDivideConquer } from '../../src/internal/divideConquer.js';
import { tridiagonalQl } from '../../src/internal/tridiagonal.js';
import { wasmSettings } from '../../src/internal/wasm/runtime.js';

const EPS = Number.EPSILON;

/** A deterministic stream in [−0.5, 0.5) (a linear congruential generator; only variety matters here). */
function stream(seed: number): () => number {
  let s = seed;
  return () => { s = (s * 1103515245 + 12345) % 2147483648; return s / 2147483648 - 0.5; };
}

/** max |T z_j − λ_j z_j| and max |ZᵀZ − I| for eigenvectors stored contiguously (zt = Zᵀ). */
function residuals(d0: Float64Array, e0: Float64Array, lam: Float64Array, zt: Float64Array): { res: number; orth: number } {
  const n = d0.length;
  let res = 0, orth = 0;
  for (let j = 0; j < n; j++) {
    for (let i = 0; i < n; i++) {
      let t = d0[i] * zt[j * n + i];
      if (i > 0) t += e0[i - 1] * zt[j * n + i - 1];
      if (i < n - 1) t += e0[i] * zt[j * n + i + 1];
      res = Math.max(res, Math.abs(t - lam[j] * zt[j * n + i]));
    }
  }
  for (let a = 0; a < n; a++) for (let b = a; b < n; b++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += zt[a * n + i] * zt[b * n + i];
    orth = Math.max(orth, Math.abs(s - (a === b ? 1 : 0)));
  }
  return { res, orth };
}

describe('real product of the divide-and-conquer updates (SIMD kernel dtile and scalar loop)', () => {
  it('equals the definition on shapes with rows and columns not multiples of four', () => {
    const r = stream(7);
    for (const [m, n, k] of [[5, 7, 33], [64, 61, 47], [130, 9, 100], [3, 200, 70], [37, 128, 1]]) {
      const a = Float64Array.from({ length: m * (k + 2) }, r), b = Float64Array.from({ length: k * (n + 3) }, r);
      const ref = new Float64Array(m * n);
      for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) {
        let s = 0;
        for (let p = 0; p < k; p++) s += a[i * (k + 2) + p] * b[p * (n + 3) + j];
        ref[i * n + j] = s;
      }
      for (const simd of [true, false]) {
        wasmSettings.enabled = simd;
        try {
          const c = new Float64Array(m * (n + 1)).fill(NaN);
          realProduct(m, n, k, a, k + 2, b, n + 3, c, n + 1);
          for (let i = 0; i < m; i++) for (let j = 0; j < n; j++) {
            expect(Math.abs(c[i * (n + 1) + j] - ref[i * n + j])).toBeLessThanOrEqual(4 * k * EPS);
          }
        } finally {
          wasmSettings.enabled = true;
        }
      }
    }
  });
});

describe('tridiagonal divide and conquer', () => {
  it('Toeplitz (d = 2, e = 1): λ_j = 2 + 2 cos(jπ/(n+1)), z_j ∝ sin(i j π/(n+1)) (n = 100, 257)', () => {
    // The closed form of the second-difference matrix, checked by substitution: with z_i = sin(i k h),
    // h = π/(n+1), z_{i−1} + z_{i+1} = 2 cos(k h) z_i and z_0 = z_{n+1} = 0.
    for (const n of [100, 257]) {
      const d = new Float64Array(n).fill(2), e = new Float64Array(n).fill(1);
      e[n - 1] = 0;
      const zt = tridiagonalDivideConquer(d, e, n);
      const h = Math.PI / (n + 1);
      for (let j = 0; j < n; j++) {
        const k = n - j; // ascending order: largest k first
        expect(Math.abs(d[j] - (2 + 2 * Math.cos(k * h)))).toBeLessThanOrEqual(10 * n * EPS);
        // |⟨z_j, s_k⟩| = 1 for the unit vector s_k ∝ sin(i k h) (eigenvalues distinct)
        let dot = 0, nrm = 0;
        for (let i = 0; i < n; i++) { const s = Math.sin((i + 1) * k * h); dot += zt[j * n + i] * s; nrm += s * s; }
        expect(Math.abs(Math.abs(dot) / Math.sqrt(nrm) - 1)).toBeLessThanOrEqual(1e-12);
      }
    }
  });

  it('deflation: zero coupling, equal diagonal, tiny coupling, glued blocks, clusters — T Z = Z Λ, ZᵀZ = I, Λ = QL values', () => {
    const r = stream(3);
    const cases: [string, number, (i: number) => number, (i: number) => number][] = [
      ['e = 0, d = 1', 120, () => 1, () => 0],
      ['d = 1, e ~ 1e-12', 120, () => 1, () => 1e-12 * r()],
      ['Wilkinson blocks glued by 1e-10', 147, (i) => Math.abs((i % 21) - 10), (i) => (i % 21 === 20 ? 1e-10 : 1)],
      ['d = 1 + 1e-14 noise, e ~ 1e-13', 96, () => 1 + 1e-14 * r(), () => 1e-13 * r()],
      ['±1 alternating, e = 1e-9', 200, (i) => (i % 2 ? 1 : -1), () => 1e-9],
      ['random', 300, () => r(), () => r()],
    ];
    for (const [name, n, fd, fe] of cases) {
      const d0 = Float64Array.from({ length: n }, (_, i) => fd(i));
      const e0 = Float64Array.from({ length: n }, (_, i) => (i < n - 1 ? fe(i) : 0));
      const d = d0.slice(), zt = tridiagonalDivideConquer(d, e0, n);
      let tn = 0;
      for (let i = 0; i < n; i++) tn = Math.max(tn, Math.abs(d0[i]) + Math.abs(e0[i]) + (i > 0 ? Math.abs(e0[i - 1]) : 0));
      const { res, orth } = residuals(d0, e0, d, zt);
      expect(res, name).toBeLessThanOrEqual(20 * EPS * tn * Math.sqrt(n));
      expect(orth, name).toBeLessThanOrEqual(20 * EPS * Math.sqrt(n));
      const dq = d0.slice(), eq = e0.slice();
      tridiagonalQl(dq, eq, n, null);
      dq.sort();
      for (let i = 0; i < n; i++) {
        if (i > 0) expect(d[i], name).toBeGreaterThanOrEqual(d[i - 1]);
        expect(Math.abs(d[i] - dq[i]), name).toBeLessThanOrEqual(10 * n * EPS * tn);
      }
    }
  });

  it('without WebAssembly SIMD (scalar products) gives the SIMD results to rounding', () => {
    const r = stream(11), n = 150;
    const d0 = Float64Array.from({ length: n }, r), e0 = Float64Array.from({ length: n }, (_, i) => (i < n - 1 ? r() : 0));
    const run = (): { d: Float64Array; zt: Float64Array } => {
      const d = d0.slice(), zt = tridiagonalDivideConquer(d, e0, n);
      return { d, zt };
    };
    const simd = run();
    wasmSettings.enabled = false;
    let scalar: { d: Float64Array; zt: Float64Array };
    try { scalar = run(); } finally { wasmSettings.enabled = true; }
    for (let i = 0; i < n; i++) expect(Math.abs(scalar.d[i] - simd.d[i])).toBeLessThanOrEqual(1e-13);
    // eigenvectors up to sign (the eigenvalues are well separated here)
    for (let j = 0; j < n; j++) {
      let dot = 0;
      for (let i = 0; i < n; i++) dot += scalar.zt[j * n + i] * simd.zt[j * n + i];
      expect(Math.abs(Math.abs(dot) - 1)).toBeLessThanOrEqual(1e-10);
    }
  });
});
