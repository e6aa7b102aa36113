/**
 * Surface waves of a grounded dielectric slab and the scan angles at which a Floquet mode
 * phase-matches one of them (scan blindness).
 * @module
 */
import { assertFinite, assertInteger, assertPositive } from '../internal/validate.js';
import { DomainError } from '../errors.js';
import { wavenumberRadPerM } from '../units/convert.js';
import type { PlanarLattice } from '../geometry/lattice.js';

/**
 * A bound surface-wave mode of a grounded dielectric slab.
 * @category Floquet
 */
export interface SlabSurfaceWave {
  /** Mode name: 'TM0', 'TE1', 'TM2', 'TE3', … */
  readonly name: string;
  /** 'TM' or 'TE' to z. */
  readonly kind: 'TM' | 'TE';
  /** Propagation constant β [rad/m], k₀ < β < √εr k₀. */
  readonly betaRadPerM: number;
}

function bisect(f: (x: number) => number, lo: number, hi: number): number {
  let flo = f(lo);
  for (let it = 0; it < 200; it++) {
    const mid = 0.5 * (lo + hi);
    const fm = f(mid);
    if (fm === 0) return mid;
    if ((fm > 0) === (flo > 0)) { lo = mid; flo = fm; } else { hi = mid; }
    if (hi - lo <= 1e-15 * Math.abs(hi)) break;
  }
  return 0.5 * (lo + hi);
}

/**
 * Bound surface waves of a lossless grounded dielectric slab from its dispersion equations.
 *
 * @remarks
 * With k_d = √(εr k₀² − β²) and α = √(β² − k₀²): TM modes solve εr α = k_d tan(k_d t), TE modes
 * k_d cot(k_d t) = −α. TM0 has no cut-off; TE1 exists for t > λ/(4√(εr − 1)). Each root is bracketed
 * on its branch of tan and found by bisection to machine precision.
 * Reference: D. M. Pozar, *Microwave Engineering*, 4th ed., Wiley, 2012, §3.6 (grounded dielectric slab; from memory);
 * R. E. Collin, *Field Theory of Guided Waves*, 2nd ed., IEEE Press, 1991, ch. 11 (from memory).
 * @param relativePermittivity - εr ≥ 1.
 * @param thicknessM - Slab thickness t [m], > 0.
 * @param frequencyHz - Frequency [Hz], > 0.
 * @returns The bound modes, in order of decreasing β (TM0 first).
 * @throws {@link DomainError} for εr < 1 or non-positive thickness or frequency.
 * @category Floquet
 */
export function groundedSlabSurfaceWaves(relativePermittivity: number, thicknessM: number, frequencyHz: number): SlabSurfaceWave[] {
  assertFinite('relativePermittivity', relativePermittivity);
  if (!(relativePermittivity >= 1)) {
    throw new DomainError(`invalid argument "relativePermittivity": expected a lossless dielectric with εr ≥ 1, received ${relativePermittivity}.`);
  }
  assertPositive('thicknessM', thicknessM, 'm');
  const k0 = wavenumberRadPerM(frequencyHz);
  const er = relativePermittivity;
  const t = thicknessM;
  const V = k0 * Math.sqrt(er - 1); // k_d ranges over (0, V)
  const out: SlabSurfaceWave[] = [];
  if (V === 0) return out;
  const alpha = (kd: number): number => Math.sqrt(Math.max(0, V * V - kd * kd));
  const betaOf = (kd: number): number => Math.sqrt(er * k0 * k0 - kd * kd);
  const eps = 1e-14;
  for (let j = 0; ; j++) {
    const lo = (j * Math.PI) / t;
    if (lo >= V) break;
    // TM_{2j}: εr α − k_d tan(k_d t), positive at the left end, negative before the pole / at V.
    const hi = Math.min(V, ((j + 0.5) * Math.PI) / t);
    const fTm = (kd: number): number => er * alpha(kd) * Math.cos(kd * t) - kd * Math.sin(kd * t);
    const kdTm = bisect(fTm, lo + eps * V, hi * (1 - eps));
    out.push({ name: `TM${2 * j}`, kind: 'TM', betaRadPerM: betaOf(kdTm) });
    // TE_{2j+1}: k_d cos(k_d t) + α sin(k_d t) = 0 on (j π + π/2, (j+1)π)/t, if it starts below V.
    const loTe = ((j + 0.5) * Math.PI) / t;
    if (loTe < V) {
      const hiTe = Math.min(V, ((j + 1) * Math.PI) / t);
      const fTe = (kd: number): number => kd * Math.cos(kd * t) + alpha(kd) * Math.sin(kd * t);
      if (fTe(hiTe * (1 - eps)) * fTe(loTe * (1 + eps)) < 0) {
        out.push({ name: `TE${2 * j + 1}`, kind: 'TE', betaRadPerM: betaOf(bisect(fTe, loTe * (1 + eps), hiTe * (1 - eps))) });
      }
    }
  }
  out.sort((p, q) => q.betaRadPerM - p.betaRadPerM);
  return out;
}

/**
 * A scan angle predicted by surface-wave phase matching.
 * @category Floquet
 */
export interface PhaseMatchPrediction {
  /** Scan polar angle at which |k_t,mn| = β [rad]. */
  readonly thetaRad: number;
  /** Floquet index m. */
  readonly m: number;
  /** Floquet index n. */
  readonly n: number;
  /** Name of the surface wave matched. */
  readonly surfaceWave: string;
}

/**
 * Scan angles in the plane φ at which a Floquet mode (m, n) ≠ (0, 0) has the transverse wavenumber of
 * a surface wave, |k₀ sinθ (cosφ, sinφ) + m b₁ + n b₂| = β (the phase-matching condition of scan blindness).
 *
 * @remarks
 * Reference for the phenomenon: D. M. Pozar and D. H. Schaubert, "Scan blindness in infinite phased
 * arrays of printed dipoles", IEEE Trans. Antennas Propag. 32(6), 1984 (from memory).
 * @param lattice - Array lattice.
 * @param frequencyHz - Frequency [Hz].
 * @param phiRad - Scan plane azimuth [rad].
 * @param surfaceWaves - Surface waves (e.g. from {@link groundedSlabSurfaceWaves}).
 * @param maxOrder - Largest |m|, |n| examined; default 2.
 * @returns Predictions with θ ∈ [0, π/2], sorted by angle.
 * @throws {@link DomainError} for a non-positive frequency or non-finite azimuth.
 * @category Floquet
 */
export function phaseMatchedScanAngles(lattice: PlanarLattice, frequencyHz: number, phiRad: number, surfaceWaves: readonly SlabSurfaceWave[], maxOrder = 2): PhaseMatchPrediction[] {
  const k0 = wavenumberRadPerM(frequencyHz);
  assertFinite('phiRad', phiRad);
  assertInteger('maxOrder', maxOrder, 1, 50);
  const c = Math.cos(phiRad), sn = Math.sin(phiRad);
  const out: PhaseMatchPrediction[] = [];
  for (const sw of surfaceWaves) {
    for (let m = -maxOrder; m <= maxOrder; m++) {
      for (let n = -maxOrder; n <= maxOrder; n++) {
        if (m === 0 && n === 0) continue;
        const gx = m * lattice.b1xRadPerM + n * lattice.b2xRadPerM;
        const gy = m * lattice.b1yRadPerM + n * lattice.b2yRadPerM;
        // k0² s² + 2 k0 s (ĉ·g) + |g|² − β² = 0
        const B = 2 * k0 * (c * gx + sn * gy);
        const C = gx * gx + gy * gy - sw.betaRadPerM * sw.betaRadPerM;
        const A = k0 * k0;
        const disc = B * B - 4 * A * C;
        if (disc < 0) continue;
        for (const sgn of [-1, 1]) {
          const s = (-B + sgn * Math.sqrt(disc)) / (2 * A);
          if (s >= 0 && s <= 1) out.push({ thetaRad: Math.asin(s), m, n, surfaceWave: sw.name });
        }
      }
    }
  }
  out.sort((p, q) => p.thetaRad - q.thetaRad);
  return out;
}
