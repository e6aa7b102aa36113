/**
 * Seeded, cross-platform reproducible random numbers for simulations.
 *
 * Generator: xoshiro128** 1.1 (D. Blackman and S. Vigna, "Scrambled linear
 * pseudorandom number generators", ACM Trans. Math. Softw. 47(4), 2021), a
 * 32-bit generator with 128 bits of state and period 2¹²⁸ − 1. All of its
 * arithmetic is 32-bit integer arithmetic (`Math.imul`, shifts), so the stream
 * of integers and of uniform doubles is bit-identical on every JavaScript
 * engine and platform.
 *
 * Seeding: the 64-bit seed is expanded into the four 32-bit state words by
 * SplitMix64 (G. L. Steele, D. Lea and C. H. Flood, "Fast splittable
 * pseudorandom number generators", OOPSLA 2014), as the xoshiro authors
 * recommend; two SplitMix64 outputs give (low word, high word) of each pair.
 *
 * Uniform doubles: 53 random bits, (a ≫ 5)·2²⁶ + (b ≫ 6), divided by 2⁵³, in [0, 1).
 *
 * Normals: the Box–Muller transform (G. E. P. Box and M. E. Muller, Ann. Math.
 * Statist. 29(2), 1958), both outputs used. It relies on `Math.log`, `Math.sqrt`,
 * `Math.cos`, `Math.sin`; `Math.sqrt` is exact everywhere, the others are
 * implementation-defined to the last bit, so normals agree across engines to a
 * few units in the last place rather than bit for bit.
 *
 * @internal
 * @module
 */

const MASK64 = (1n << 64n) - 1n;

function splitMix64(state: { s: bigint }): bigint {
  state.s = (state.s + 0x9e3779b97f4a7c15n) & MASK64;
  let z = state.s;
  z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
  z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
  return z ^ (z >> 31n);
}

/** A xoshiro128** stream with uniform, normal and complex-normal draws. */
export class RandomStream {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spareNormal = 0;
  private hasSpare = false;

  /**
   * @param state - Four 32-bit state words (not all zero), as unsigned integers.
   */
  constructor(state: readonly [number, number, number, number]) {
    this.s0 = state[0] >>> 0;
    this.s1 = state[1] >>> 0;
    this.s2 = state[2] >>> 0;
    this.s3 = state[3] >>> 0;
    if ((this.s0 | this.s1 | this.s2 | this.s3) === 0) this.s0 = 1; // the all-zero state is a fixed point
  }

  /** A stream seeded by SplitMix64 from a non-negative integer seed < 2⁶⁴ (numbers above 2⁵³ lose precision). */
  static fromSeed(seed: number | bigint): RandomStream {
    const st = { s: BigInt(seed) & MASK64 };
    const a = splitMix64(st);
    const b = splitMix64(st);
    return new RandomStream([
      Number(a & 0xffffffffn), Number(a >> 32n), Number(b & 0xffffffffn), Number(b >> 32n),
    ]);
  }

  /** Next 32-bit output, unsigned. */
  nextUint32(): number {
    const s1 = this.s1;
    const r = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return r;
  }

  /** Uniform double in [0, 1) with 53 random bits. */
  nextFloat64(): number {
    const a = this.nextUint32() >>> 5;
    const b = this.nextUint32() >>> 6;
    return (a * 67108864 + b) / 9007199254740992;
  }

  /** Standard normal N(0, 1) by Box–Muller (pairs cached). */
  nextNormal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spareNormal;
    }
    const u1 = 1 - this.nextFloat64(); // (0, 1]
    const u2 = this.nextFloat64();
    const r = Math.sqrt(-2 * Math.log(u1));
    const phi = 2 * Math.PI * u2;
    this.spareNormal = r * Math.sin(phi);
    this.hasSpare = true;
    return r * Math.cos(phi);
  }

  /**
   * Fills `out[offset + 2k], out[offset + 2k + 1]` (k < count) with circularly
   * symmetric complex normal samples of unit variance E|z|² = 1.
   */
  fillComplexNormal(out: Float64Array, count: number, offset = 0): void {
    const s = Math.SQRT1_2;
    for (let k = 0; k < 2 * count; k++) out[offset + k] = s * this.nextNormal();
  }
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
