/**
 * Positive zeros of the Bessel function J₁.
 * @module
 */
import besselj0 from '@stdlib/math-base-special-besselj0';
import besselj1 from '@stdlib/math-base-special-besselj1';
import { ConvergenceError } from '../errors.js';
import { assertInteger } from '../internal/validate.js';

/**
 * The first `count` positive zeros j₁,ₛ of the Bessel function J₁ (j₁,₁ = 3.8317…).
 *
 * @remarks
 * Newton's method on J₁ with J₁′(x) = J₀(x) − J₁(x)/x, started from McMahon's asymptotic
 * expansion j₁,ₛ ≈ β − 3/(8β) + 3/(128β³), β = (s + ¼)π, and iterated to a relative step
 * below 4ε. J₀ and J₁ come from the stdlib-js special-function packages.
 *
 * References:
 * - M. Abramowitz and I. A. Stegun, *Handbook of Mathematical Functions*, NBS, 1964,
 *   eq. 9.5.12 (McMahon's expansion) and Table 9.5 (zeros).
 *
 * @param count - Number of zeros, integer in [0, 100000].
 * @returns Ascending zeros [dimensionless].
 * @throws {@link DomainError} if `count` is not an integer in range.
 * @throws {@link ConvergenceError} if Newton's method fails (not observed).
 * @example
 * ```ts
 * besselJ1Zeros(2); // Float64Array [3.8317059702075125, 7.015586669815619]
 * ```
 * @category Tapers
 */
export function besselJ1Zeros(count: number): Float64Array {
  assertInteger('count', count, 0, 100_000);
  const out = new Float64Array(count);
  for (let s = 1; s <= count; s++) {
    const beta = (s + 0.25) * Math.PI;
    let x = beta - 3 / (8 * beta) + 3 / (128 * beta * beta * beta);
    let converged = false;
    for (let it = 0; it < 30; it++) {
      const j1 = besselj1(x);
      const step = j1 / (besselj0(x) - j1 / x);
      x -= step;
      if (Math.abs(step) <= 4 * Number.EPSILON * x) { converged = true; break; }
    }
    if (!converged) throw new ConvergenceError(`besselJ1Zeros: Newton's method did not converge for zero ${s} within 30 iterations.`);
    out[s - 1] = x;
  }
  return out;
}
