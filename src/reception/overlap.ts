/**
 * The isotropic-noise (pattern-overlap) matrix of a set of port patterns.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import { ETA0_OHM, K_BOLTZMANN_J_PER_K } from '../units/constants.js';
import { brightnessCorrelation, isotropicBrightness } from './brightness.js';
import type { PortPatternSource, QuadratureDirections, SampledPortPatterns } from './patterns.js';

/**
 * Pattern-overlap (isotropic-noise) matrix of port patterns: Ω_mn = (1/4π) ∮ fₘ(r̂)·fₙ*(r̂) dΩ.
 *
 * @remarks
 * The embedded patterns fₙ [V] follow docs/conventions.md ("embedded pattern", every other
 * port open). Ω is the open-circuit noise correlation in an isotropic bath without its scale:
 * by the "brightness noise" row of the conventions, E[v vᴴ] = (4 k_B T B / (η|I₀|²))·4π Ω at a
 * uniform brightness T, so this function evaluates that brightness integral at 1 K and 1 Hz and
 * rescales it (one integration code for both). For a lossless array Twiss's theorem
 * E[v vᴴ] = 2 k_B T B (Z + Zᴴ) makes Ω = η|I₀|²(Z + Zᴴ)/(8π) (R. Q. Twiss, J. Appl. Phys.
 * 26(5), 1955, from memory; tested). Elements with one pattern f at positions rₙ have
 * fₙ = f·aₙ with the steering vector aₙ = exp(+j k r̂·rₙ), and Ω is then the layout's
 * {@link isotropicNoiseMatrix} with that element factor, times the pattern scale.
 * @param patterns - Port pattern source, or samples on exactly the quadrature's directions [V].
 * @param quadrature - Sphere rule (directions and weights [rad, sr]).
 * @returns Ω, N×N Hermitian positive semidefinite [V²].
 * @throws {@link DimensionError} / {@link DomainError} as {@link brightnessCorrelation}.
 * @category Reception
 */
export function patternOverlapMatrix(patterns: PortPatternSource | SampledPortPatterns, quadrature: QuadratureDirections): CMatrix {
  const r = brightnessCorrelation(patterns, quadrature, isotropicBrightness(1), 1);
  const i0 = patterns.driveCurrentA;
  const s = (ETA0_OHM * i0 * i0) / (4 * K_BOLTZMANN_J_PER_K) / (4 * Math.PI);
  for (let k = 0; k < r.data.length; k++) r.data[k] *= s;
  return r;
}
