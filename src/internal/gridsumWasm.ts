/**
 * The array factor of a full rectangular grid over arbitrary directions on
 * WebAssembly SIMD (`wasm/gridsum.wat`): per direction the bilinear form
 * xᵀ B y of the mirror-paired column and row phase tables with the paired
 * weight matrix B, two directions per pass. This file computes the seeds of
 * the phase recurrences (the only cos/sin calls) and moves data in and out.
 * No checks.
 * @internal
 * @module
 */
import { ensureMemory, kernelModule } from './wasm/runtime.js';

/** Raw exports of the grid-sum module (byte addresses into `memory`); arguments as in wasm/gridsum.wat. */
export interface GridsumFunctions {
  gridsum: (pairs: number, hx: number, oddx: number, hy: number, oddy: number, nyp: number,
    pb: number, ps: number, sBytes: number, yOff: number, mOff: number, px: number, py: number, pout: number) => void;
}

/** The grid-sum module, or null on the scalar path. */
export const loadGridsum = kernelModule<GridsumFunctions>('gridsum');

/** Re-seed period of the phase recurrences of the array-factor kernels (steps between directly computed values). */
export const PHASE_RESEED = 16;
/** Direction pairs per call of the kernel (bounds the seed block). */
const BLOCK_PAIRS = 512;

/** A full grid: `cols` × `rows` elements on two symmetric progressions. */
export interface GridSumShape {
  /** Number of columns D along axis a, and their spacing [m]. */
  readonly cols: number;
  readonly colStep: number;
  /** Number of rows R along axis b, and their spacing [m]. */
  readonly rows: number;
  readonly rowStep: number;
  /** Axes (0 = x, 1 = y, 2 = z) of the columns, the rows and the plane normal. */
  readonly axisA: number;
  readonly axisB: number;
  readonly axisC: number;
  /** Centre of the grid along a and b, and its plane's coordinate along c [m]. */
  readonly midA: number;
  readonly midB: number;
  readonly planeC: number;
}

/** Half length h and parity of the mirror-paired table of an axis with `count` values. */
export function pairedHalf(count: number): { h: number; odd: number } {
  return { h: count >> 1, odd: count & 1 };
}

/** Columns of B (the row table's length) rounded up to the kernel's block of four. */
export function pairedColumns(rows: number): number {
  return (rows + 3) & ~3;
}

/**
 * Writes the seeds of one axis for direction lane `t` at double index `at`:
 * the step e^{jθ} and e^{jφ_{16j}}, φ_i = θ·(i + ½) (even count) or θ·(i + 1) (odd), θ = s·Δ.
 */
function axisSeeds(f: Float64Array, at: number, t: number, theta: number, h: number, odd: number): void {
  const shift = odd ? 1 : 0.5;
  let c = Math.cos(theta * shift), s = Math.sin(theta * shift);
  const sr = odd ? c : c * c - s * s, si = odd ? s : 2 * c * s;
  f[at + t] = sr; f[at + 2 + t] = si;
  for (let j = 0, o = at + 4; PHASE_RESEED * j < h; j++, o += 4) {
    if (j > 0) { const ph = theta * (PHASE_RESEED * j + shift); c = Math.cos(ph); s = Math.sin(ph); }
    f[o + t] = c; f[o + 2 + t] = s;
  }
}

/**
 * AF for directions[3m…] (m in [m0, m1)) into out[2m], out[2m+1], from the
 * paired weight matrix `b` (nx rows of {@link pairedColumns} entries, [re, im]).
 * `k` is the wavenumber [rad/m]. Returns false (doing nothing) on the scalar path.
 */
export function simdGridSum(shape: GridSumShape, b: Float64Array, directions: Float64Array, k: number, out: Float64Array, m0: number, m1: number): boolean {
  const mod = loadGridsum();
  if (mod === null) return false;
  const { h: hx, odd: oddx } = pairedHalf(shape.cols);
  const { h: hy, odd: oddy } = pairedHalf(shape.rows);
  const ny = 2 * hy + oddy, nyp = pairedColumns(ny);
  const nsx = Math.ceil(hx / PHASE_RESEED), nsy = Math.ceil(hy / PHASE_RESEED);
  // per pair (bytes): x step + seeds | y step + seeds | centre phase
  const yOff = 32 * (1 + nsx), mOff = yOff + 32 * (1 + nsy), sBytes = mOff + 32;
  const pairsTotal = (m1 - m0 + 1) >> 1;
  const blockPairs = Math.min(BLOCK_PAIRS, pairsTotal);
  const nx = 2 * hx + oddx;
  const pb = 0, ps = b.length * 8, px = ps + blockPairs * sBytes, py = px + 16 * nx, pout = py + 16 * nyp;
  const f = ensureMemory(mod.memory, pout + 32 * blockPairs);
  f.set(b, pb);
  const { axisA, axisB, axisC, colStep, rowStep, midA, midB, planeC } = shape;
  const centred = midA === 0 && midB === 0 && planeC === 0;
  for (let p0 = 0; p0 < pairsTotal; p0 += BLOCK_PAIRS) {
    const pairs = Math.min(BLOCK_PAIRS, pairsTotal - p0);
    for (let q = 0; q < pairs; q++) {
      const base = (ps + q * sBytes) >> 3;
      for (let t = 0; t < 2; t++) {
        // an odd count repeats the last direction in the unused lane
        const m = Math.min(m0 + 2 * (p0 + q) + t, m1 - 1);
        const sa = k * directions[3 * m + axisA], sb = k * directions[3 * m + axisB], sc = k * directions[3 * m + axisC];
        axisSeeds(f, base, t, sa * colStep, hx, oddx);
        axisSeeds(f, base + (yOff >> 3), t, sb * rowStep, hy, oddy);
        const mo = base + (mOff >> 3);
        if (centred) { f[mo + t] = 1; f[mo + 2 + t] = 0; } else {
          const ph = sa * midA + sb * midB + sc * planeC;
          f[mo + t] = Math.cos(ph); f[mo + 2 + t] = Math.sin(ph);
        }
      }
    }
    mod.gridsum(pairs, hx, oddx, hy, oddy, nyp, pb, ps, sBytes, yOff, mOff, px, py, pout);
    const first = m0 + 2 * p0, count = Math.min(2 * pairs, m1 - first);
    out.set(f.subarray(pout >> 3, (pout >> 3) + 2 * count), 2 * first);
  }
  return true;
}
