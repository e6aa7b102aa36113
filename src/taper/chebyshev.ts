/**
 * Dolph–Chebyshev taper.
 * @module
 */
import { assertElementCount, assertSidelobeLevel, normalizeTaper, type TaperOptions } from './normalize.js';

/**
 * Dolph–Chebyshev weights of an N-element uniform line: the narrowest main beam for
 * equal sidelobes at a given level.
 *
 * @remarks
 * Design pattern, with ψ the inter-element phase and R = 10^(sllDb/20):
 * AF(ψ) = T_{N−1}(x₀ cos(ψ/2)), x₀ = cosh(arccosh(R)/(N−1)), so AF(0) = R and every
 * sidelobe has |AF| = 1.
 *
 * Method (our derivation): AF is sampled at the N points ψₖ = 2πk/N and inverted by the
 * real, symmetric form of the inverse DFT; with mₙ = n − (N−1)/2,
 * wₙ = (1/N)·[F₀ + 2 Σ_{k=1}^{⌊(N−1)/2⌋} Fₖ cos(2πk mₙ/N)], Fₖ = T_{N−1}(x₀ cos(πk/N)).
 * The pairing of k with N−k makes the half-integer phase of even N drop out exactly
 * (the k = N/2 term vanishes). Fₖ is evaluated without cancellation near x = 1:
 * t = x − 1 = 2 sinh²(β/2) − 2x₀ sin²(πk/2N) with β = arccosh(R)/(N−1); for t > 0
 * Fₖ = cosh((N−1)·log1p(t + √(t(t+2)))), otherwise Fₖ = cos(2(N−1)·asin(√(−t/2))).
 * Cost O(N²/4) multiply–adds through a cosine table; no FFT is needed (fft.js supports
 * powers of two only). Weights are real and symmetric; as array weights they enter AF = wᴴa.
 *
 * References:
 * - C. L. Dolph, "A current distribution for broadside arrays which optimizes the
 *   relationship between beam width and side-lobe level", Proc. IRE 34(6), 1946, pp. 335–348.
 * - F. J. Harris, "On the use of windows for harmonic analysis with the discrete Fourier
 *   transform", Proc. IEEE 66(1), 1978, §on the Dolph–Chebyshev window (from memory).
 *
 * @param elementCount - Number of elements N, integer ≥ 2.
 * @param sllDb - Sidelobe level as a positive number of dB below the peak (power ratio in dB,
 *   i.e. 20·log₁₀ of the field ratio), in (0, 200]; tested over 10–120 dB.
 * @param options - Normalisation (default peak = 1).
 * @returns N real weights [dimensionless].
 * @throws {@link DomainError} if N is not an integer ≥ 2 or `sllDb` is not in (0, 200].
 * @example
 * ```ts
 * dolphChebyshevTaper(5, 20); // ≈ [0.5176, 0.8326, 1, 0.8326, 0.5176] (scipy.signal.windows.chebwin(5, 20))
 * ```
 * @category Tapers
 */
export function dolphChebyshevTaper(elementCount: number, sllDb: number, options: TaperOptions = {}): Float64Array {
  assertElementCount('elementCount', elementCount, 2);
  assertSidelobeLevel('sllDb', sllDb);
  const n = elementCount;
  const order = n - 1;
  const r = Math.pow(10, sllDb / 20);
  const acoshR = Math.log(r + Math.sqrt((r - 1) * (r + 1)));
  const beta = acoshR / order;
  const x0 = Math.cosh(beta);
  const sh = Math.sinh(beta / 2);
  const x0MinusOne = 2 * sh * sh;
  const half = Math.floor(order / 2);
  // Pattern samples F_k for k = 0..half.
  const f = new Float64Array(half + 1);
  f[0] = r;
  for (let k = 1; k <= half; k++) {
    const s = Math.sin((Math.PI * k) / (2 * n));
    const t = x0MinusOne - 2 * x0 * s * s;
    f[k] = t > 0
      ? Math.cosh(order * Math.log1p(t + Math.sqrt(t * (t + 2))))
      : Math.cos(2 * order * Math.asin(Math.sqrt(-t / 2)));
  }
  // cos(π j / N), j = 0..2N−1.
  const twoN = 2 * n;
  const table = new Float64Array(twoN);
  for (let j = 0; j < twoN; j++) table[j] = Math.cos((Math.PI * j) / n);
  const w = new Float64Array(n);
  const centreCount = Math.ceil(n / 2);
  for (let i = 0; i < centreCount; i++) {
    // 2π k mᵢ / N = π k (2i − N + 1) / N → table index k·step mod 2N.
    let step = (2 * i - n + 1) % twoN;
    if (step < 0) step += twoN;
    let idx = 0;
    let acc = 0;
    for (let k = 1; k <= half; k++) {
      idx += step;
      if (idx >= twoN) idx -= twoN;
      acc += f[k] * table[idx];
    }
    const v = (f[0] + 2 * acc) / n;
    w[i] = v;
    w[n - 1 - i] = v;
  }
  return normalizeTaper(w, options.normalization);
}
