/**
 * Design warnings returned as data by the taper synthesisers.
 * @module
 */

/**
 * Machine-readable kind of a {@link TaperWarning}.
 *
 * @remarks
 * - `'non-monotonic'`: the continuous distribution rises again towards the aperture edge
 *   (Taylor: n̄ too large for the sidelobe level).
 * - `'sidelobes-above-design'`: the continuous design pattern's peak sidelobe exceeds the
 *   requested level by more than 0.5 dB (Taylor: n̄ too small for the sidelobe level).
 * @category Tapers
 */
export type TaperWarningCode = 'non-monotonic' | 'sidelobes-above-design';

/**
 * A non-fatal finding about a taper design; the weights are still valid.
 * @category Tapers
 */
export interface TaperWarning {
  /** Stable tag to branch on. */
  readonly code: TaperWarningCode;
  /** Human-readable explanation with the numbers and a remedy. */
  readonly message: string;
}

/** Normalised sinc, sin(πx)/(πx), exact 1 at 0. @internal */
export function sincPi(x: number): number {
  if (x === 0) return 1;
  const a = Math.PI * x;
  return Math.sin(a) / a;
}
