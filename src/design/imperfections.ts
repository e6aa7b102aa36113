/**
 * The figures of a design's imperfections block: closed-form random-error and
 * quantisation costs per beam and the beam pointing across the band.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import type { Vector3 } from '../geometry/layout.js';
import { radToDeg } from '../units/convert.js';
import { steeringVector } from '../pattern/steering.js';
import { randomErrorFigures, type RandomErrorModel } from '../imperfect/errorModel.js';
import { digitalWeightFigures } from '../imperfect/quantization.js';
import type { PreparedDesign } from './build.js';

/**
 * Imperfection figures of one beam (see {@link DesignImperfectionFigures}).
 * @category Design
 */
export interface DesignImperfectionBeam {
  /** Expected directivity loss from the random errors [dB] (positive = loss). */
  readonly directivityLossDb?: number;
  /** Mean sidelobe floor from the random errors, relative to the beam peak [dB]. */
  readonly sidelobeFloorDb?: number;
  /** Mean sidelobe floor from rounding the digital weights, relative to the beam peak [dB]. */
  readonly weightSidelobeFloorDb?: number;
  /** SNR loss from rounding the digital weights, white noise [dB]. */
  readonly weightSnrLossDb?: number;
  /** Beam pointing error per band frequency [deg] (0 with element time delay; null where the beam leaves visible space). */
  readonly pointingErrorDeg: Array<number | null>;
}

/**
 * Figures of a design's `imperfections` block (docs/imperfect.md, docs/design.md).
 * @category Design
 */
export interface DesignImperfectionFigures {
  /** Frequency the closed forms are evaluated at and the phase shifters are set at (the centre band point) [Hz]. */
  readonly designFrequencyHz: number;
  /** Weights the closed forms use: phase-steered, equal amplitude (the beamformer's own weights differ per frequency). */
  readonly weights: 'phase-steered, equal amplitude';
  /** Steering hardware across the band. */
  readonly steering: 'phase' | 'elementDelay';
  /** Largest quantisation lobe of the phase shifters, 1/(2ᵏ − 1)² relative to the beam [dB] (Miller 1964, from memory). */
  readonly phaseQuantizationLobeDb?: number;
  /** Per beam, in beam order. */
  readonly beams: DesignImperfectionBeam[];
}

/**
 * Evaluates a design's `imperfections` block with the imperfect module's closed forms.
 *
 * @remarks
 * Random errors: {@link randomErrorFigures} (Ruze's average pattern) for phase-steered,
 * equal-amplitude weights at the centre band point. Digital weights: {@link digitalWeightFigures}.
 * Phase-shifter bits: the largest periodic quantisation lobe 1/(2ᵏ − 1)² ({@link phaseQuantizationLobes}).
 * Pointing: phase shifters set at the centre point f₀ keep k·sin θ fixed, so
 * sin θ(f) = (f₀/f)·sin θ₀ in the beam's plane; element time delay removes the squint.
 * @param prepared - The prepared design (with `design.imperfections`).
 * @returns The figures, or undefined without an imperfections block.
 * @category Design
 */
export function designImperfectionFigures(prepared: PreparedDesign): DesignImperfectionFigures | undefined {
  const spec = prepared.design.imperfections;
  if (!spec) return undefined;
  const band = prepared.frequenciesHz, f0 = band[Math.floor((band.length - 1) / 2)];
  const e = spec.errors, dist = e?.distribution ?? 'gaussian';
  const model: RandomErrorModel = {
    ...(e?.amplitudeDb ? { amplitude: { distribution: dist, rms: 10 ** (e.amplitudeDb / 20) - 1 } } : {}),
    ...(e?.phaseDeg ? { phaseRad: { distribution: dist, rms: (e.phaseDeg * Math.PI) / 180 } } : {}),
    ...(e?.positionM ? { positionM: { distribution: dist, rms: [e.positionM, e.positionM, e.positionM] as const } } : {}),
  };
  const steering = spec.steering ?? 'phase';
  const b = prepared.beams, layout = prepared.layout;
  const beams: DesignImperfectionBeam[] = [];
  for (let k = 0; k < b.thetaRad.length; k++) {
    const t = b.thetaRad[k], ph = b.phiRad[k];
    const dir: Vector3 = [Math.sin(t) * Math.cos(ph), Math.sin(t) * Math.sin(ph), Math.cos(t)];
    const w: CMatrix = steeringVector(layout, dir, f0);
    const row: { -readonly [K in keyof DesignImperfectionBeam]: DesignImperfectionBeam[K] } = {
      pointingErrorDeg: Array.from(band, (f) => {
        if (steering === 'elementDelay') return 0;
        const s = (Math.sin(t) * f0) / f;
        return Math.abs(s) > 1 ? null : radToDeg(Math.asin(s) - t);
      }),
    };
    if (Object.keys(model).length > 0) {
      const fig = randomErrorFigures(layout, w, dir, f0, model);
      row.directivityLossDb = fig.directivityLossDb;
      row.sidelobeFloorDb = fig.sidelobeFloorDb;
    }
    if (spec.weightBits !== undefined) {
      const dw = digitalWeightFigures(w, layout.count, spec.weightBits);
      row.weightSidelobeFloorDb = dw.sidelobeFloorDb;
      row.weightSnrLossDb = dw.snrLossDb;
    }
    beams.push(row);
  }
  return {
    designFrequencyHz: f0, weights: 'phase-steered, equal amplitude', steering,
    ...(spec.phaseBits !== undefined ? { phaseQuantizationLobeDb: -20 * Math.log10(2 ** spec.phaseBits - 1) } : {}),
    beams,
  };
}
