/**
 * Signal correlation matrices of point sources at the open-circuit terminals.
 * @module
 */
import { DomainError } from '../errors.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { assertInteger, assertNonNegative, assertPositive } from '../internal/validate.js';
import { ETA0_OHM } from '../units/constants.js';
import { wavelengthM } from '../units/convert.js';
import { assertSampledPatterns, type SampledPortPatterns } from './patterns.js';
import { parsePolarization, type IncidentPolarization } from './planeWave.js';
import { matrixView } from '../linalg/cmatrix.js';

/**
 * Options of {@link pointSourceCorrelation}.
 * @category Reception
 */
export interface PointSourceOptions {
  /** Flux density S of the source [W m⁻² Hz⁻¹] (1 Jy = 1e-26; see janskyToSi), ≥ 0. */
  fluxDensityWPerM2Hz: number;
  /** Bandwidth B [Hz], > 0. */
  bandwidthHz: number;
  /**
   * Polarization of a fully polarized source; only the shape matters (the
   * amplitude is rescaled so that the flux density is S).
   * @defaultValue unpolarized
   */
  polarization?: IncidentPolarization;
}

/**
 * Signal correlation E[v vᴴ] at the open-circuit terminals for a point source
 * in one sampled direction.
 *
 * @remarks
 * Unpolarized (conventions, "point source"):
 * R_s,mn = (2 S B λ² / (η |I₀|²)) fₘ·fₙ*, the sum over θ̂ and φ̂ components.
 * Fully polarized with unit polarization vector ê: the field has |E|² = η S B,
 * so R_s = (4 S B λ² / (η |I₀|²)) (fₘ·ê)(fₙ·ê)*; averaging two orthogonal
 * polarizations of flux S/2 each gives back the unpolarized form. Both follow
 * from the reception row vₙ = −j(4π/(ηkI₀)) fₙ·E.
 *
 * @param patterns - Embedded patterns at M directions (N ports).
 * @param directionIndex - Index k of the source direction among the M samples.
 * @param options - Flux density, bandwidth and optional polarization.
 * @returns R_s [V²], N×N Hermitian, rank 1 (polarized) or ≤ 2 (unpolarized).
 * @throws {@link DomainError} for a negative flux, a non-positive bandwidth or a bad index.
 * @example
 * ```ts
 * // a half-wave dipole along x at λ = 1 m, a 10 Jy source at zenith, 1 MHz:
 * const { patterns: source } = dipoleArrayPorts([{ centerM: [0, 0, 0], axis: [1, 0, 0], lengthM: 0.5, radiusM: 1e-5 }], 299792458);
 * const patterns = samplePatterns(source, Float64Array.of(0), Float64Array.of(0));
 * const rs = pointSourceCorrelation(patterns, 0, { fluxDensityWPerM2Hz: janskyToSi(10), bandwidthHz: 1e6 });
 * rs.data[0]; // ≈ 1.909e-18 V² (= η S B (λ/π)²/2: half the flux in the dipole's polarisation)
 * ```
 * @category Reception
 */
export function pointSourceCorrelation(patterns: SampledPortPatterns, directionIndex: number, options: PointSourceOptions): CMatrix {
  const n = assertSampledPatterns('patterns', patterns);
  const m = patterns.thetaRad.length;
  assertInteger('directionIndex', directionIndex, 0, m - 1);
  if (options === null || typeof options !== 'object') {
    throw new DomainError('invalid argument "options": expected {fluxDensityWPerM2Hz, bandwidthHz, polarization?}.');
  }
  assertNonNegative('options.fluxDensityWPerM2Hz', options.fluxDensityWPerM2Hz, 'W m⁻² Hz⁻¹');
  assertPositive('options.bandwidthHz', options.bandwidthHz, 'Hz');
  const lambda = wavelengthM(patterns.frequencyHz);
  const i0 = patterns.driveCurrentA;
  const base = (options.fluxDensityWPerM2Hz * options.bandwidthHz * lambda * lambda) / (ETA0_OHM * i0 * i0);
  const ft = patterns.thetaComponentV.data, fp = patterns.phiComponentV.data;
  const out = new Float64Array(2 * n * n);
  if (options.polarization === undefined) {
    const s = 2 * base;
    for (let i = 0; i < n; i++) {
      const a = 2 * (i * m + directionIndex);
      for (let j = 0; j < n; j++) {
        const b = 2 * (j * m + directionIndex);
        const o = 2 * (i * n + j);
        out[o] = s * (ft[a] * ft[b] + ft[a + 1] * ft[b + 1] + fp[a] * fp[b] + fp[a + 1] * fp[b + 1]);
        out[o + 1] = s * (ft[a + 1] * ft[b] - ft[a] * ft[b + 1] + fp[a + 1] * fp[b] - fp[a] * fp[b + 1]);
      }
    }
    return matrixView(n, n, out);
  }
  const e = new Float64Array(4);
  parsePolarization('options.polarization', options.polarization)(patterns.phiRad[directionIndex], e);
  const norm2 = e[0] * e[0] + e[1] * e[1] + e[2] * e[2] + e[3] * e[3];
  if (!(norm2 > 0)) {
    throw new DomainError('invalid argument "options.polarization": the field is zero; give a non-zero polarization (only its shape is used).');
  }
  const s = (4 * base) / norm2;
  const pr = new Float64Array(n), pi = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    const a = 2 * (i * m + directionIndex);
    pr[i] = ft[a] * e[0] - ft[a + 1] * e[1] + fp[a] * e[2] - fp[a + 1] * e[3];
    pi[i] = ft[a] * e[1] + ft[a + 1] * e[0] + fp[a] * e[3] + fp[a + 1] * e[2];
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const o = 2 * (i * n + j);
      out[o] = s * (pr[i] * pr[j] + pi[i] * pi[j]);
      out[o + 1] = s * (pi[i] * pr[j] - pr[i] * pi[j]);
    }
  }
  return matrixView(n, n, out);
}
