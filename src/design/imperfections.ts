/**
 * The figures of a design's imperfections block: closed-form random-error and
 * quantisation costs per beam, the subarray partition, and the beam pointing,
 * gain loss and subarray lobes across the band.
 * @module
 */
import type { CMatrix } from '../linalg/cmatrix.js';
import type { Vector3 } from '../geometry/layout.js';
import { radToDeg } from '../units/convert.js';
import { steeringVector } from '../pattern/steering.js';
import { randomErrorFigures, type RandomErrorModel } from '../imperfect/errorModel.js';
import { digitalWeightFigures } from '../imperfect/quantization.js';
import { beamSquint, gridSubarrays, type SubarrayLayout } from '../imperfect/subarrays.js';
import type { Design } from './types.js';
import { fieldError } from './schema.js';
import { wrapField } from './bandData.js';
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
  /**
   * Gain loss at the intended direction per band frequency, −10·log10(|AF(r̂₀, f)|²/N²) [dB]
   * (array factor of the steering hardware, equal amplitudes; planar layouts).
   */
  readonly gainLossDb?: number[];
  /**
   * Subarray delay: highest array-factor level at the grating directions of the subarray-centre
   * lattice per band frequency, relative to the beam peak [dB] (null where none is visible;
   * −300 for an exact null, e.g. at f₀ for equal amplitudes).
   */
  readonly subarrayLobeDb?: Array<number | null>;
}

/**
 * The subarray partition of a design (see {@link DesignImperfectionFigures}).
 * @category Design
 */
export interface DesignSubarrayFigures {
  /** Number of subarrays. */
  readonly count: number;
  /** Elements per subarray along x (or along a line layout). */
  readonly perX: number;
  /** Elements per subarray along y. */
  readonly perY: number;
  /** Periods of the subarray-centre lattice along x and y [m]; null along an axis holding one subarray. */
  readonly periodM: [number | null, number | null];
  /** Subarray of each element, layout order. */
  readonly index: number[];
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
  readonly steering: 'phase' | 'elementDelay' | 'subarrayDelay';
  /** The subarray partition (design `imperfections.subarrays`). */
  readonly subarrays?: DesignSubarrayFigures;
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
 * sin θ(f) = (f₀/f)·sin θ₀ in the beam's plane; element time delay removes the squint;
 * subarray delay (phase within, time delay between subarrays) is found numerically by
 * {@link beamSquint}, which also gives the gain loss at the intended direction for every
 * hardware (planar layouts) and the subarray-lattice lobes.
 * (R. J. Mailloux, *Phased Array Antenna Handbook*, 3rd ed., 2017, wideband scanning and
 * subarrays, from memory.)
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
  const b = prepared.beams, layout = prepared.layout, sub = prepared.subarrays;
  let planar = true;
  for (let i = 0; i < layout.count; i++) if (layout.positionsM[3 * i + 2] !== 0) planar = false;
  const beams: DesignImperfectionBeam[] = [];
  for (let k = 0; k < b.thetaRad.length; k++) {
    const t = b.thetaRad[k], ph = b.phiRad[k];
    const dir: Vector3 = [Math.sin(t) * Math.cos(ph), Math.sin(t) * Math.sin(ph), Math.cos(t)];
    const w: CMatrix = steeringVector(layout, dir, f0);
    const squint = planar ? beamSquint(layout, dir, f0, band, steering, sub) : undefined;
    const row: { -readonly [K in keyof DesignImperfectionBeam]: DesignImperfectionBeam[K] } = {
      pointingErrorDeg: Array.from(band, (f, i) => {
        if (steering === 'elementDelay') return 0;
        if (steering === 'subarrayDelay') return radToDeg((squint as NonNullable<typeof squint>)[i].pointingErrorRad);
        const s = (Math.sin(t) * f0) / f;
        return Math.abs(s) > 1 ? null : radToDeg(Math.asin(s) - t);
      }),
    };
    if (squint) row.gainLossDb = squint.map((q) => q.gainLossDb);
    // −300 dB stands for an exact null (as in the pattern cuts), so the result stays JSON
    if (squint && steering === 'subarrayDelay') row.subarrayLobeDb = squint.map((q) => (q.subarrayLobeDb === undefined ? null : Math.max(-300, q.subarrayLobeDb)));
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
  const perY = spec.subarrays?.perY ?? 1;
  return {
    designFrequencyHz: f0, weights: 'phase-steered, equal amplitude', steering,
    ...(sub && spec.subarrays ? {
      subarrays: {
        count: sub.count, perX: spec.subarrays.perX, perY, index: Array.from(sub.index),
        periodM: (sub.periodM ?? [Infinity, Infinity]).map((x) => (Number.isFinite(x) ? x : null)) as [number | null, number | null],
      },
    } : {}),
    ...(spec.phaseBits !== undefined ? { phaseQuantizationLobeDb: -20 * Math.log10(2 ** spec.phaseBits - 1) } : {}),
    beams,
  };
}

/**
 * The subarray partition of a design's `imperfections.subarrays` on its layout's lattice
 * (gridSubarrays): blocks of a rectangular layout, or runs of a line layout. @internal
 */
export function designSubarrays(d: Design, file: string): SubarrayLayout | undefined {
  const spec = d.imperfections?.subarrays;
  if (spec === undefined) return undefined;
  const l = d.layout, perY = spec.perY ?? 1;
  if (l.kind === 'rectangular') {
    return wrapField(file, 'imperfections.subarrays', () => gridSubarrays({ countX: l.countX, countY: l.countY, spacingXM: l.spacingXM, spacingYM: l.spacingYM }, spec.perX, perY));
  }
  if (l.kind === 'line') {
    if (perY !== 1) throw fieldError(file, 'imperfections.subarrays.perY', `expected 1 or nothing for a line layout (perX counts along the line), received ${perY}`);
    const alongY = l.axis === 'y';
    const grid = { countX: alongY ? 1 : l.count, countY: alongY ? l.count : 1, spacingXM: l.spacingM, spacingYM: l.spacingM };
    return wrapField(file, 'imperfections.subarrays', () => (alongY ? gridSubarrays(grid, 1, spec.perX) : gridSubarrays(grid, spec.perX, 1)));
  }
  throw fieldError(file, 'imperfections.subarrays', `expected a "line" or "rectangular" layout (contiguous subarrays on its lattice), received a "${l.kind}" layout`);
}
