/**
 * `phasewise demo`: evaluates a bundled design of our own invention and
 * writes its report. The design's dimensions are derived from the operating
 * wavelength here; every figure in the report is computed by the library.
 * @internal
 * @module
 */
import { wavelengthM } from '../../units/convert.js';
import { runDesignData, type ReportRun, type ReportRunOptions } from './evaluate.js';

/** Default report folder of the demo (relative to the working directory). @internal */
export const DEMO_FOLDER = 'phasewise-demo-report';

/**
 * The demo design: a 61-element hexagonal patch of a triangular lattice of
 * x-directed half-wave dipoles a quarter wavelength over a ground plane,
 * receiving S-band satellite telemetry at 2.25 GHz with uncooled amplifiers,
 * scanned over ±40° in the E-plane (φ = 0).
 * @internal
 */
export function demoDesign(): Record<string, unknown> {
  const f = 2.25e9, lambda = wavelengthM(f);
  const d = 0.6 * lambda; // grating-lobe free to 40° on a triangular lattice needs d ≤ 2λ/(√3(1 + sin 40°)) ≈ 0.70 λ
  const round = (x: number) => Number(x.toPrecision(6));
  return {
    title: 'Telemetry ground terminal: 61 dipoles over ground at 2.25 GHz',
    frequencyHz: f,
    bandwidthHz: 5e6,
    layout: { kind: 'triangular', spacingM: round(d), boundary: { kind: 'hexagon', circumradiusM: round(4 * d) } },
    elements: { kind: 'dipole', lengthM: round(0.47 * lambda), radiusM: round(lambda / 200), axis: [1, 0, 0], groundPlaneHeightM: round(lambda / 4) },
    // Uncooled GaAs-class amplifiers (about 0.4 dB noise figure) whose optimum source admittance is
    // the mean broadside active admittance of the array, 1/Σ_j Z_ij = 0.0094 + j0.0023 S (about
    // 100 − j25 Ω; computed by scripts/showcase-match.ts): the amplifiers are noise-matched where the
    // beam is used most, so the noise-matching efficiency is about 0.99 at broadside and falls off scan.
    amplifiers: { minimumNoiseTemperatureK: 30, noiseResistanceOhm: 6, optimumSourceAdmittanceS: { re: 0.0094, im: 0.0023 } },
    environment: { skyK: 6, groundK: 290, tiltDeg: 0, physicalTemperatureK: 295 },
    beams: { planePhiDeg: 0, thetaDeg: { fromDeg: -40, toDeg: 40, count: 17 }, beamformer: 'max-snr' },
    physicalAreaM2: round(61 * (Math.sqrt(3) / 2) * d * d),
  };
}

/** Runs the demo into `outDir`. @internal */
export function runDemo(outDir: string = DEMO_FOLDER, options: ReportRunOptions = {}): Promise<ReportRun> {
  return runDesignData(demoDesign(), 'demo-design.json', outDir, options);
}
