/**
 * Test fixture: z-directed Hertzian dipoles (length L, uniform current) at
 * given positions, and the closed-form mutual radiation resistance of parallel
 * z-directed short dipoles. These are independent references for the
 * reception module (not a library feature).
 *
 * f_θ = j η k I₀ L sinθ e^{+jk r̂·rₙ} / 4π (C. A. Balanis, Antenna Theory, 4th ed.,
 * 2016, eq. (4-26a), from memory). Radiation resistance matrix
 * R_mn = (η k² L² / 4π)[j₀(kρ) − j₁(kρ)/(kρ) + (z-offset terms omitted: elements
 * share one z)], with ρ the horizontal separation; R_nn = η k² L²/(6π) =
 * (2π/3) η (L/λ)² (Balanis eq. (4-19)).
 */
import type { PortPatternSource } from '../../src/reception/patterns.js';
import { C0_M_PER_S, ETA0_OHM } from '../../src/units/constants.js';

export function hertzianSource(xy: ReadonlyArray<[number, number]>, lengthM: number, frequencyHz: number, driveCurrentA = 1): PortPatternSource {
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const amp = (ETA0_OHM * k * driveCurrentA * lengthM) / (4 * Math.PI);
  return {
    portCount: xy.length, driveCurrentA, frequencyHz,
    fill(th, ph, start, count, outT, outP, ld) {
      for (let c = 0; c < count; c++) {
        const t = th[start + c], p = ph[start + c];
        const st = Math.sin(t), ux = st * Math.cos(p), uy = st * Math.sin(p);
        for (let n = 0; n < xy.length; n++) {
          const ph0 = k * (ux * xy[n][0] + uy * xy[n][1]);
          const q = 2 * (n * ld + c);
          // j·amp·sinθ·e^{jψ} = amp·sinθ·(−sinψ + j cosψ)
          outT[q] = -amp * st * Math.sin(ph0); outT[q + 1] = amp * st * Math.cos(ph0);
          outP[q] = 0; outP[q + 1] = 0;
        }
      }
    },
  };
}

/** Closed-form radiation resistance matrix [Ω] (real, symmetric) as interleaved N×N data. */
export function hertzianResistance(xy: ReadonlyArray<[number, number]>, lengthM: number, frequencyHz: number): Float64Array {
  const k = (2 * Math.PI * frequencyHz) / C0_M_PER_S;
  const n = xy.length, c = (ETA0_OHM * k * k * lengthM * lengthM) / (4 * Math.PI);
  const out = new Float64Array(2 * n * n);
  for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) {
    const x = k * Math.hypot(xy[i][0] - xy[j][0], xy[i][1] - xy[j][1]);
    const g = x < 1e-3 ? 2 / 3 - (x * x) / 15 : Math.sin(x) / x - (Math.sin(x) / (x * x) - Math.cos(x) / x) / x;
    out[2 * (i * n + j)] = c * g;
  }
  return out;
}
