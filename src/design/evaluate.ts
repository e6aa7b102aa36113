/**
 * The receiving-array job across a band: one call from a validated design to
 * every figure of merit per frequency × beam (T_sys and its parts, A_e/T_sys,
 * G/T, SEFD, efficiencies), band summaries per beam, and the data of the
 * report's figures — plain JSON-able data, browser-safe.
 * @module
 */
import { hzText } from '../internal/text.js';
import { zeros } from '../linalg/cmatrix.js';
import type { PhysicalCheck } from '../checks.js';
import type { WireArrayPortSource } from '../wire/patterns.js';
import { NumericError } from '../errors.js';
import { layoutDiameterM, sphereQuadrature, sphereQuadratureForLayout, sphereQuadratureOrder, type SphereQuadrature } from '../geometry/index.js';
import { displayable, restoreDisplay } from '../display/attach.js';
import { gratingLobeCircles } from '../geometry/gratingLobes.js';
import { createMultiport } from '../network/multiport.js';
import { convertMultiport } from '../network/convert.js';
import { terminatePorts } from '../network/connect.js';
import { activeReflection } from '../network/sources.js';
import { powerToDb, radToDeg, wavenumberRadPerM } from '../units/convert.js';
import {
  beamPowerPatterns, evaluateReceivingArray, gainOverTemperatureDbPerK, matchedFieldWeightsUnpolarized, samplePatterns,
  systemEquivalentFluxDensityJy, evaluationCost, adaptiveSphereRule, type AdaptiveSphereRule, type ArrayPortSource, type BeamFigures,
  type EvaluationCost, type NoiseEnvironment, type ReceivingArrayEvaluation,
} from '../reception/index.js';
import { designLivePorts, designPortTaper, type DesignLivePorts } from './failures.js';
import { designPolarizationAt, type DesignPolarization } from './polarization.js';
import type { Design } from './schema.js';
import { fieldError } from './schema.js';
import { designImperfectionFigures, type DesignImperfectionFigures } from './imperfections.js';
import {
  designEnvironmentAt, designPortsAt, prepareDesign, scanPlaneDirections,
  type PrepareDesignOptions, type PreparedDesign,
} from './build.js';

/**
 * Figures of one beam at one frequency: the reception module's figures plus G/T and SEFD.
 * @category Design
 */
export interface DesignBeamFigures extends BeamFigures {
  /** G/T = (4π/λ²)·A_e/T_sys [dB/K], referred to the beamformer output (see gainOverTemperatureDbPerK). */
  readonly gainOverTemperatureDbPerK: number;
  /** SEFD = 2k_B·T_sys/A_e [Jy]. */
  readonly sefdJy: number;
}

/**
 * A pattern cut of one beam: relative power along a great circle through broadside.
 * @category Design
 */
export interface DesignPatternCut {
  /** Index of the beam. */
  readonly beam: number;
  /** Azimuth of the cut plane [deg]; positive angles lie at this φ, negative ones at φ + 180°. */
  readonly planePhiDeg: number;
  /** Beam output power relative to the largest peak of the cuts at this frequency [dB]. */
  readonly valueDb: number[];
}

/**
 * Amplifier noise parameters used at one frequency (back end folded in).
 * @category Design
 */
export interface UsedNoiseParameters {
  /** T_min [K] (including T₂/G of the back end). */
  readonly minimumNoiseTemperatureK: number;
  /** R_n [Ω]. */
  readonly noiseResistanceOhm: number;
  /** Y_opt [S]. */
  readonly optimumSourceAdmittanceS: {
    /** Conductance [S]. */
    readonly re: number;
    /** Susceptance [S]. */
    readonly im: number;
  };
}

/**
 * Active reflection coefficient of one element over the beams (dimensionless, 50 Ω reference).
 * @category Design
 */
export interface ActiveReflectionTrace {
  /** Element (port) index. */
  readonly element: number;
  /** Label: the element and whether it is the centre or the outermost one. */
  readonly label: string;
  /** Re Γ per beam. */
  readonly re: number[];
  /** Im Γ per beam. */
  readonly im: number[];
}

/**
 * Beam directions of a band result.
 * @category Design
 */
export interface DesignEvaluationBeams {
  /** How the beams were given. */
  readonly kind: 'plane' | 'pointings' | 'cone';
  /** θ per beam [deg]. */
  readonly thetaDeg: number[];
  /** φ per beam [deg]. */
  readonly phiDeg: number[];
  /** Signed scan angle per beam [deg] (plane beams). */
  readonly scanAngleDeg?: number[];
  /** Azimuth of the scan plane [deg] (plane beams). */
  readonly planePhiDeg?: number;
  /** u = sin θ cos φ per beam. */
  readonly u: number[];
  /** v = sin θ sin φ per beam. */
  readonly v: number[];
  /** Grid step of a cone (direction cosines). */
  readonly stepUV?: number;
}

/**
 * One grating-lobe circle of the lattice in the u-v plane (direction cosines).
 * @category Design
 */
export interface GratingCircle {
  /** Lattice order along the first reciprocal vector. */
  readonly m: number;
  /** Lattice order along the second reciprocal vector. */
  readonly n: number;
  /** Centre u. */
  readonly u: number;
  /** Centre v. */
  readonly v: number;
  /** Radius (1: the visible region). */
  readonly radius: number;
}

/**
 * What the failed elements cost one beam at one frequency: the same beam of the array without
 * failures, and the differences (design `imperfections.failures`).
 * @category Design
 */
export interface FailureCostBeam {
  /** A_e/T_sys of the intact array [m²/K]. */
  readonly intactSensitivityM2PerK: number;
  /** G/T of the intact array [dB/K]. */
  readonly intactGainOverTemperatureDbPerK: number;
  /** T_sys of the intact array [K]. */
  readonly intactSystemTemperatureK: number;
  /** A_e of the intact array [m²]. */
  readonly intactEffectiveAreaM2: number;
  /** Loss of A_e/T_sys, 10·log10(intact/with failures) [dB] (power ratio; equal to the G/T loss in dB). */
  readonly sensitivityLossDb: number;
  /** Loss of A_e, 10·log10(intact/with failures) [dB] (power ratio). */
  readonly effectiveAreaLossDb: number;
  /** T_sys with failures minus T_sys intact [K]. */
  readonly systemTemperatureChangeK: number;
}

/**
 * Everything computed at one band frequency.
 * @category Design
 */
export interface FrequencyEvaluation {
  /** Frequency [Hz]. */
  readonly frequencyHz: number;
  /** Sky brightness used [K]. */
  readonly skyK: number;
  /** Amplifier noise parameters used (back end folded in), absent for noiseless receivers. */
  readonly amplifiers?: UsedNoiseParameters;
  /** Sphere rule of the noise integrals. */
  readonly quadrature: {
    /**
     * `'design'`: the design's own θ × φ rule; `'adaptive'`: the reception module's adaptive rule
     * (split at the horizon, tilted horizon and ground plane, sized from the elements and their
     * images); `'layout'`: a product rule sized for the layout (elements without geometry).
     */
    readonly kind: 'design' | 'adaptive' | 'layout';
    /** Gauss–Legendre nodes in θ (before any split). */
    readonly thetaCount: number;
    /** Nodes in φ (before any split). */
    readonly phiCount: number;
    /** Directions of the rule. */
    readonly directionCount: number;
  };
  /**
   * Integration error of every figure of every beam: |figure on this rule − figure on a refined
   * adaptive rule|, in the figure's unit (empty objects when the elements carry no geometry).
   */
  readonly integrationErrors: Array<Partial<Record<keyof BeamFigures, number>>>;
  /** Figures per beam, in beam order. */
  readonly beams: DesignBeamFigures[];
  /** The array's minimum receiver temperature T_rec,min [K]; null when its check failed (see `checks`) or the array figures were not computed. */
  readonly minimumReceiverTemperatureK: number | null;
  /** Embedded element efficiency per (working) port (linear); empty when they could not be computed (see `checks`) or were not computed. */
  readonly embeddedElementEfficiency: number[];
  /** Whether the array figures (T_rec,min, embedded element efficiencies) were computed: by default up to 1024 working ports (O(N³) each; reception's `arrayFigures: 'auto'`). */
  readonly arrayFiguresComputed: boolean;
  /**
   * Physical self-checks at this frequency (reception module's receivingArrayChecks, with the
   * element model's validity): a failed check marks the figures it names as untrustworthy.
   */
  readonly checks: PhysicalCheck[];
  /** Pattern cuts (report frequencies only). */
  readonly patternCuts?: DesignPatternCut[];
  /** Angles of the cut samples [deg] (report frequencies only). */
  readonly cutAngleDeg?: number[];
  /**
   * Active reflection coefficient of the centre and the outermost element over the beams
   * (report frequencies only), 50 Ω reference, for the phase-steered transmit excitation
   * conj(a(r̂)) — the network module's activeReflection.
   */
  readonly activeReflection?: ActiveReflectionTrace[];
  /**
   * With failed elements (`imperfections.failures`): per beam, the intact array's figures and
   * what the failures cost. The beam figures above are those of the array with its failures;
   * the intact array's checks are in `checks`, named `intactArray.…`.
   */
  readonly failureCost?: FailureCostBeam[];
  /** Crossed-dipole designs: the X/Y beam pair's Jones matrix, IXR and Ludwig-3 cross-polar levels per beam. */
  readonly polarization?: DesignPolarization;
}

/**
 * Band summary of one beam.
 * @category Design
 */
export interface BeamBandSummary {
  /** Smallest A_e/T_sys over the band [m²/K]. */
  readonly worstSensitivityM2PerK: number;
  /** Frequency of the smallest A_e/T_sys [Hz]. */
  readonly worstFrequencyHz: number;
  /** Largest A_e/T_sys over the band [m²/K]. */
  readonly bestSensitivityM2PerK: number;
  /** Arithmetic mean of A_e/T_sys over the frequency points [m²/K]. */
  readonly meanSensitivityM2PerK: number;
  /** Band average (1/(f_max − f_min))∫A_e/T_sys df by the trapezoid rule over the points [m²/K] (the single value for one point). */
  readonly bandAverageSensitivityM2PerK: number;
  /** Smallest G/T over the band [dB/K]. */
  readonly worstGainOverTemperatureDbPerK: number;
  /** Largest SEFD over the band [Jy]. */
  readonly worstSefdJy: number;
  /** Largest loss of A_e/T_sys from the failed elements over the band [dB] (designs with failures). */
  readonly worstFailureLossDb?: number;
  /** Smallest IXR of the X/Y beam pair over the band [dB] (crossed-dipole designs). */
  readonly worstIxrDb?: number;
}

/**
 * Result of {@link evaluateDesign}: plain data (JSON round-trips), units in field names.
 * @category Design
 */
export interface DesignEvaluation {
  /** Title of the design (or the file name). */
  readonly title: string;
  /** The design file's name. */
  readonly fileName: string;
  /** Number of elements (ports) of the layout, failed ones included. */
  readonly elementCount: number;
  /** The failed elements (design `imperfections.failures`), when there are any. */
  readonly failures?: {
    /** Indices of the failed elements, ascending. */
    readonly failedElements: number[];
    /** Number of working elements (ports the beamformer uses). */
    readonly workingElementCount: number;
    /** Termination of the failed ports. */
    readonly termination: 'open' | 'matched' | 'amplifier';
  };
  /** Beamformer used. */
  readonly beamformer: 'max-snr' | 'conjugate-field' | 'taper';
  /** Noise bandwidth B [Hz]. */
  readonly bandwidthHz: number;
  /** Band frequencies [Hz]. */
  readonly frequenciesHz: number[];
  /** Indices of the frequencies the report draws cuts, maps and Smith charts at. */
  readonly reportFrequencyIndices: number[];
  /** Beam directions: kind, θ and φ [deg], signed scan angle [deg] (plane beams), u and v. */
  readonly beams: DesignEvaluationBeams;
  /** Element positions [m]. */
  readonly positionsM: number[][];
  /** Grating-lobe circles at the highest band frequency (lattice layouts), u-v centres and radius (direction cosines). */
  readonly gratingLobes?: {
    /** The frequency of the diagram [Hz]. */
    readonly frequencyHz: number;
    /** sin θ of the widest beam (radius of the scan region). */
    readonly maxScanSinTheta: number;
    /** The circles of the lattice's grating lobes. */
    readonly circles: GratingCircle[];
  };
  /** Figures of the design's imperfections block (present when the design has one). */
  readonly imperfections?: DesignImperfectionFigures;
  /** Per-frequency results, in band order. */
  readonly frequencies: FrequencyEvaluation[];
  /** Band summary per beam. */
  readonly bandSummary: BeamBandSummary[];
  /** Every failed check of the band, with its frequency (empty: every figure passed its checks). */
  readonly failedChecks: FailedCheck[];
}

/**
 * A failed physical check and the frequency it failed at.
 * @category Design
 */
export interface FailedCheck extends PhysicalCheck {
  /** Frequency [Hz]. */
  readonly frequencyHz: number;
}

/** Options of {@link evaluateDesign}. @category Design */
export interface EvaluateDesignOptions extends PrepareDesignOptions {
  /** Called after each frequency: frequencies done, total. */
  readonly onProgress?: (done: number, total: number) => void;
}

const CUT_POINTS = 361;

/** Up to `max` indices spread evenly over 0…count−1. @internal */
export function spreadIndices(count: number, max: number): number[] {
  if (count <= max) return Array.from({ length: count }, (_, i) => i);
  const s = new Set<number>();
  for (let i = 0; i < max; i++) s.add(Math.round((i * (count - 1)) / (max - 1)));
  return [...s];
}

/**
 * Beams shown in cuts and per-beam band figures: up to five spread over the list; for a cone,
 * broadside and the edge beams toward φ = 0°, 45° and 90° (not their mirror images, which a
 * symmetric array would draw on top of each other). @internal
 */
export function shownBeams(p: PreparedDesign): number[] {
  const b = p.beams;
  if (b.kind !== 'cone') return spreadIndices(b.thetaRad.length, 5);
  const pick = (phiRad: number) => {
    const cu = Math.cos(phiRad), cv = Math.sin(phiRad);
    let best = 0, bestScore = -Infinity;
    for (let i = 0; i < b.u.length; i++) {
      // Farthest along the direction, penalising the sideways offset.
      const score = phiRad < 0 ? -Math.hypot(b.u[i], b.v[i]) : cu * b.u[i] + cv * b.v[i] - 2 * Math.abs(cu * b.v[i] - cv * b.u[i]);
      if (score > bestScore + 1e-12) { bestScore = score; best = i; }
    }
    return best;
  };
  return [...new Set([pick(-1), pick(0), pick(Math.PI / 4), pick(Math.PI / 2)])];
}

/**
 * The sphere rule of the noise integrals at one band frequency: the design's own
 * `quadrature`; else the reception module's adaptive rule (`'adaptive'`) when the ports carry
 * their geometry (dipoles, wire elements); else a product rule sized for the layout at f
 * (geometry's sphereQuadratureForLayout, tolerance 1e-6) for imported data.
 * @param prepared - The prepared design.
 * @param frequencyHz - Frequency [Hz].
 * @param ports - The ports at f (their geometry, when present, sizes the adaptive rule).
 * @param environment - The environment at f (its edges split the adaptive rule).
 * @returns The rule and its kind.
 * @category Design
 */
export function designQuadratureAt(prepared: PreparedDesign, frequencyHz: number, ports: ArrayPortSource, environment: NoiseEnvironment): DesignSphereRule {
  const q = prepared.design.quadrature;
  if (q) return { kind: 'design', rule: sphereQuadrature(q.thetaCount, q.phiCount) };
  if (ports.geometry) return { kind: 'adaptive', rule: adaptiveSphereRule(ports.geometry, frequencyHz, { edgeNormals: environment.edgeNormals }) };
  return { kind: 'layout', rule: sphereQuadratureForLayout(prepared.layout, frequencyHz, { tolerance: 1e-6 }) };
}

/**
 * The sphere rule a design uses at one frequency, and which kind it is.
 * @category Design
 */
export interface DesignSphereRule {
  /** Where the rule comes from (see FrequencyEvaluation.quadrature). */
  readonly kind: 'design' | 'adaptive' | 'layout';
  /** The rule: directions [rad], weights [sr] and its node counts. */
  readonly rule: SphereQuadrature | AdaptiveSphereRule;
}

/**
 * Estimated cost of band frequencies of a design.
 * @category Design
 */
export interface DesignCostEstimate {
  /** Time on one core summed over the frequencies [s] (model constants from the development machine, ±50 %). */
  readonly totalS: number;
  /** Peak memory of the largest frequency [bytes]. */
  readonly peakBytes: number;
  /** Per-frequency estimates, in the order of the indices. */
  readonly perFrequency: EvaluationCost[];
}

/**
 * Estimated cost of evaluating band frequencies of a design (reception module's
 * evaluationCost per frequency, from the port, direction and beam counts).
 * @param prepared - The prepared design.
 * @param indices - Band indices to evaluate. @defaultValue all
 * @returns Time on one core [s] summed over the frequencies, the peak memory of one frequency [bytes], and the per-frequency estimates.
 * @category Design
 */
export function estimateDesignCost(prepared: PreparedDesign, indices?: readonly number[]): DesignCostEstimate {
  const idx = indices ?? Array.from(prepared.frequenciesHz, (_, i) => i);
  const perFrequency = idx.map((i) => {
    // Node counts only: the rule itself is not built (it may be what does not fit).
    const own = prepared.design.quadrature;
    const q = own ?? sphereQuadratureOrder(wavenumberRadPerM(prepared.frequenciesHz[i]) * layoutDiameterM(prepared.layout), { tolerance: 1e-6 });
    return evaluationCost({ portCount: prepared.layout.count * prepared.portsPerElement, directionCount: q.thetaCount * q.phiCount, beamCount: prepared.beams.thetaRad.length });
  });
  return {
    totalS: perFrequency.reduce((a, c) => a + c.totalS, 0),
    peakBytes: Math.max(0, ...perFrequency.map((c) => c.peakBytes)),
    perFrequency,
  };
}

/**
 * The reception module's evaluation of one set of ports at f with the design's beamformer,
 * sphere rule and loss model (terminated failed ports in a resistive load add loss).
 */
function receiveAt(p: PreparedDesign, f: number, ports: DesignLivePorts, environment: NoiseEnvironment, amplifiers: ReturnType<NonNullable<PreparedDesign['amplifiersAt']>> | undefined): { ev: ReceivingArrayEvaluation; sphere: DesignSphereRule } {
  const d = p.design, kept = ports.keptPorts;
  const sphere = designQuadratureAt(p, f, ports, environment);
  const kind = d.beams.beamformer ?? 'max-snr';
  const beams = { thetaRad: p.beams.thetaRad, phiRad: p.beams.phiRad };
  const taper = designPortTaper(p, kept);
  const weights = kind === 'max-snr' ? undefined : matchedFieldWeightsUnpolarized(samplePatterns(ports.patterns, beams.thetaRad, beams.phiRad), taper);
  // wire elements are lossless unless they carry loads (whose dissipation the patterns then lack);
  // failed ports in a load dissipate: their loss comes from the patterns
  const e = d.elements;
  const lossless = (e.kind === 'dipole' || e.kind === 'crossedDipole' || (e.kind === 'wire' && (e.loads ?? []).length === 0))
    && (kept === undefined || d.imperfections?.failures?.termination === 'open');
  try {
    const ev = evaluateReceivingArray({
      ports, quadrature: sphere.rule, bandwidthHz: d.bandwidthHz, environment, amplifiers,
      physicalTemperatureK: d.environment.physicalTemperatureK ?? 290,
      loss: lossless ? 'lossless' : 'fromPatterns',
      beams, weights, physicalAreaM2: d.physicalAreaM2,
    });
    return { ev, sphere };
  } catch (err) {
    if (err instanceof NumericError && err.name !== 'DesignError') {
      const hint = e.kind === 'imported' ? ' (the noise integrals need embedded patterns over the whole sphere, θ from 0 to 180°)' : '';
      throw fieldError(p.fileName, e.kind === 'imported' ? 'elements.patternFile' : 'elements', `cannot evaluate at ${hzText(f)}: ${err.message}${hint}`);
    }
    throw err;
  }
}

/**
 * Evaluates one band frequency of a prepared design.
 *
 * @remarks
 * Ports at f ({@link designPortsAt}), the environment at f, the amplifiers at f, a sphere rule
 * (the design's, or one sized for the layout at f: geometry's sphereQuadratureForLayout with
 * tolerance 1e-6), then the reception module's evaluateReceivingArray with the design's
 * beamformer: max-SNR (default), conjugate-field or taper (matchedFieldWeightsUnpolarized).
 * G/T and SEFD per beam from A_e/T_sys. At report frequencies also the pattern cuts and the
 * active reflection over the beams. The result at f equals a direct evaluateReceivingArray
 * call with the same inputs (tested to 1e-12). With failed elements (`imperfections.failures`)
 * the ports are those of the working elements with the failed ports terminated in the coupled
 * network ({@link designLivePorts}); the beamformer uses the working ports only (a taper keeps
 * the working elements' amplitudes), a resistive termination adds its loss ('fromPatterns'),
 * and the intact array is evaluated as well for the failure cost per beam (`failureCost`).
 * @param prepared - The prepared design.
 * @param index - Index into prepared.frequenciesHz.
 * @returns The frequency's results.
 * @throws {@link DesignError} naming the design and what failed.
 * @category Design
 */
export function evaluateDesignFrequency(prepared: PreparedDesign, index: number): FrequencyEvaluation {
  const p = prepared, d = p.design;
  const f = p.frequenciesHz[index];
  const allPorts = designPortsAt(p, f);
  const ports = designLivePorts(p, allPorts);
  const kept = ports.keptPorts;
  const env = designEnvironmentAt(p, f);
  const skyK = env.skyK;
  const amplifiers = p.amplifiersAt?.(f);
  const { ev, sphere } = receiveAt(p, f, ports, env.environment, amplifiers);
  const quadrature = sphere.rule;
  const beamRows: DesignBeamFigures[] = ev.beams.map((b) => displayable({
    ...b,
    gainOverTemperatureDbPerK: gainOverTemperatureDbPerK(b.sensitivityM2PerK, f),
    sefdJy: systemEquivalentFluxDensityJy(b.sensitivityM2PerK),
  }, 'BeamFigures'));
  const out: { -readonly [K in keyof FrequencyEvaluation]: FrequencyEvaluation[K] } = {
    frequencyHz: f, skyK,
    quadrature: { kind: sphere.kind, thetaCount: quadrature.thetaCount, phiCount: quadrature.phiCount, directionCount: ev.quadrature.thetaRad.length },
    integrationErrors: ev.integrationErrors,
    beams: beamRows,
    minimumReceiverTemperatureK: Number.isFinite(ev.minimumReceiverTemperatureK) ? ev.minimumReceiverTemperatureK : null,
    embeddedElementEfficiency: Array.from(ev.embeddedElementEfficiency),
    arrayFiguresComputed: ev.arrayFiguresComputed,
    // wire elements add their own solution checks (reciprocity, passivity, thin-wire validity)
    checks: 'solution' in allPorts ? [...ev.checks, ...(allPorts as WireArrayPortSource).solution.checks] : ev.checks,
  };
  const pol = designPolarizationAt(p, ports, ev.budget);
  if (pol) out.polarization = pol;
  if (kept) {
    // The same frequency without the failures: the cost of the failures per beam.
    const intact = receiveAt(p, f, allPorts, env.environment, amplifiers).ev;
    out.failureCost = intact.beams.map((b, k) => {
      const live = beamRows[k];
      return {
        intactSensitivityM2PerK: b.sensitivityM2PerK,
        intactGainOverTemperatureDbPerK: gainOverTemperatureDbPerK(b.sensitivityM2PerK, f),
        intactSystemTemperatureK: b.systemTemperatureK,
        intactEffectiveAreaM2: b.effectiveAreaM2,
        sensitivityLossDb: powerToDb(b.sensitivityM2PerK / live.sensitivityM2PerK),
        effectiveAreaLossDb: powerToDb(b.effectiveAreaM2 / live.effectiveAreaM2),
        systemTemperatureChangeK: live.systemTemperatureK - b.systemTemperatureK,
      };
    });
    // the intact array's checks guard the cost figures
    out.checks = [...out.checks, ...intact.checks.map((c) => ({ ...c, name: `intactArray.${c.name}`, meaning: `${c.meaning} (the array without its failures, for the failure cost)` }))];
  }
  if (amplifiers) {
    const y = amplifiers.optimumSourceAdmittanceS;
    const yc = typeof y === 'number' ? { re: y, im: 0 } : Array.isArray(y) ? { re: y[0], im: y[1] } : { re: (y as { re: number }).re, im: (y as { im: number }).im };
    out.amplifiers = { minimumNoiseTemperatureK: amplifiers.minimumNoiseTemperatureK, noiseResistanceOhm: amplifiers.noiseResistanceOhm, optimumSourceAdmittanceS: yc };
  }
  if (p.reportFrequencyIndices.includes(index)) {
    const shown = shownBeams(p);
    const angleDeg = Array.from({ length: CUT_POINTS }, (_, i) => -90 + (180 * i) / (CUT_POINTS - 1));
    const cuts: DesignPatternCut[] = [];
    let peak = 0;
    const powers: Float64Array[] = [];
    for (const k of shown) {
      const planePhiRad = p.beams.kind === 'plane' ? (p.beams.planePhiRad as number) : p.beams.phiRad[k];
      const dirs = scanPlaneDirections(angleDeg, planePhiRad);
      const w = zeros(ev.weights.rows, 1);
      for (let i = 0; i < w.rows; i++) { w.data[2 * i] = ev.weights.data[2 * (i * ev.weights.cols + k)]; w.data[2 * i + 1] = ev.weights.data[2 * (i * ev.weights.cols + k) + 1]; }
      const pw = beamPowerPatterns(w, samplePatterns(ports.patterns, dirs.thetaRad, dirs.phiRad))[0];
      for (const v of pw) peak = Math.max(peak, v);
      powers.push(pw);
      cuts.push({ beam: k, planePhiDeg: radToDeg(planePhiRad), valueDb: [] });
    }
    cuts.forEach((c, i) => { (c.valueDb as number[]).push(...Array.from(powers[i], (v) => (v > 0 ? powerToDb(v / peak) : -300))); });
    out.patternCuts = cuts;
    out.cutAngleDeg = angleDeg;
    out.activeReflection = activeReflectionOverBeams(p, ports.impedanceOhm, f, kept);
  }
  return displayable<FrequencyEvaluation>(out, 'FrequencyEvaluation');
}

/** Γ of the centre and the outermost element (crossed dipoles: their X ports) for the phase-steered excitation of every beam (50 Ω). */
function activeReflectionOverBeams(p: PreparedDesign, zAll: import('../linalg/cmatrix.js').CMatrix, f: number, kept?: Int32Array): FrequencyEvaluation['activeReflection'] {
  const all = p.layout.positionsM, ppe = p.portsPerElement;
  // each port's original index; crossed dipoles: a single-polarisation (X) beam, the Y ports
  // receiving no incident wave, i.e. terminated in the 50 Ω reference
  const portIndex = kept ?? Int32Array.from({ length: zAll.rows }, (_, i) => i);
  let net = createMultiport('impedance', [f], [zAll]);
  let ports = portIndex;
  if (ppe === 2) {
    const other = Array.from(portIndex.keys()).filter((i) => portIndex[i] % 2 === 1);
    net = convertMultiport(terminatePorts(net, other, other.map(() => ({ re: 50, im: 0 }))), 'impedance');
    ports = portIndex.filter((q) => q % 2 === 0);
  }
  const pos = Float64Array.from({ length: 3 * ports.length }, (_, i) => all[3 * Math.floor(ports[Math.floor(i / 3)] / ppe) + (i % 3)]);
  const n = ports.length;
  const name = (e: number) => (ppe === 1 ? `element ${ports[e]}` : `port ${ports[e]} (element ${Math.floor(ports[e] / 2)} X)`);
  const k0 = wavenumberRadPerM(f);
  let centre = 0, edge = 0, rc = Infinity, re = -1;
  for (let i = 0; i < n; i++) {
    const rr = Math.hypot(pos[3 * i], pos[3 * i + 1]);
    if (rr < rc - 1e-12) { rc = rr; centre = i; }
    if (rr > re + 1e-12) { re = rr; edge = i; }
  }
  const elems = centre === edge ? [centre] : [centre, edge];
  const traces = elems.map((e) => ({ element: e, label: `${name(e)} (${e === centre ? 'centre' : 'edge'})`, re: [] as number[], im: [] as number[] }));
  // All beams' phase-steered excitations in one call: one Z → S conversion, one product.
  const kBeams = p.beams.thetaRad.length;
  const excitation = zeros(n, kBeams);
  for (let k = 0; k < kBeams; k++) {
    const th = p.beams.thetaRad[k], ph = p.beams.phiRad[k];
    const ux = Math.sin(th) * Math.cos(ph), uy = Math.sin(th) * Math.sin(ph), uz = Math.cos(th);
    for (let m = 0; m < n; m++) {
      // conj of the steering vector exp(+j k r̂·r): the transmit excitation equivalent to w = a(r̂).
      const phase = -k0 * (ux * pos[3 * m] + uy * pos[3 * m + 1] + uz * pos[3 * m + 2]);
      const o = 2 * (m * kBeams + k);
      excitation.data[o] = Math.cos(phase); excitation.data[o + 1] = Math.sin(phase);
    }
  }
  const gamma = activeReflection(net, excitation).data; // row k: beam k, column: port
  for (let k = 0; k < kBeams; k++) {
    for (const t of traces) { t.re.push(gamma[2 * (k * n + t.element)]); t.im.push(gamma[2 * (k * n + t.element) + 1]); }
  }
  return traces.map((t) => ({ ...t, element: ports[t.element] }));
}

/**
 * Assembles the band result from per-frequency results (from one run, worker blocks or shards).
 *
 * @remarks
 * Band summaries per beam: worst, best and arithmetic-mean A_e/T_sys over the points, the
 * band average by the trapezoid rule over frequency, the worst G/T and SEFD.
 * @param prepared - The prepared design.
 * @param frequencies - One result per band frequency, in band order.
 * @returns The band result.
 * @throws {@link DesignError} if a frequency is missing or out of order.
 * @category Design
 */
export function assembleDesignEvaluation(prepared: PreparedDesign, frequencies: readonly FrequencyEvaluation[]): DesignEvaluation {
  const p = prepared, d = p.design, band = p.frequenciesHz;
  if (frequencies.length !== band.length || frequencies.some((r, i) => r.frequencyHz !== band[i])) {
    throw fieldError(p.fileName, 'frequencyHz', `expected results at all ${band.length} band frequencies in order, received ${frequencies.length}`);
  }
  const kBeams = p.beams.thetaRad.length;
  const bandSummary: BeamBandSummary[] = [];
  for (let k = 0; k < kBeams; k++) {
    const s = frequencies.map((r) => r.beams[k].sensitivityM2PerK);
    let worst = 0, best = 0;
    for (let i = 1; i < s.length; i++) { if (s[i] < s[worst]) worst = i; if (s[i] > s[best]) best = i; }
    let avg = s[0];
    if (s.length > 1) {
      let integral = 0;
      for (let i = 1; i < s.length; i++) integral += 0.5 * (s[i] + s[i - 1]) * (band[i] - band[i - 1]);
      avg = integral / (band[band.length - 1] - band[0]);
    }
    bandSummary.push({
      worstSensitivityM2PerK: s[worst], worstFrequencyHz: band[worst], bestSensitivityM2PerK: s[best],
      meanSensitivityM2PerK: s.reduce((a, b) => a + b, 0) / s.length, bandAverageSensitivityM2PerK: avg,
      worstGainOverTemperatureDbPerK: Math.min(...frequencies.map((r) => r.beams[k].gainOverTemperatureDbPerK)),
      worstSefdJy: Math.max(...frequencies.map((r) => r.beams[k].sefdJy)),
      ...(frequencies[0].polarization ? { worstIxrDb: Math.min(...frequencies.map((r) => (r.polarization as DesignPolarization).ixrDb[k])) } : {}),
      ...(frequencies[0].failureCost ? { worstFailureLossDb: Math.max(...frequencies.map((r) => (r.failureCost as FailureCostBeam[])[k].sensitivityLossDb)) } : {}),
    });
  }
  const b = p.beams;
  const out: { -readonly [K in keyof DesignEvaluation]: DesignEvaluation[K] } = {
    title: d.title ?? p.fileName,
    fileName: p.fileName,
    elementCount: p.layout.count,
    beamformer: d.beams.beamformer ?? 'max-snr',
    bandwidthHz: d.bandwidthHz,
    frequenciesHz: Array.from(band),
    reportFrequencyIndices: [...p.reportFrequencyIndices],
    beams: {
      kind: b.kind, thetaDeg: Array.from(b.thetaRad, radToDeg), phiDeg: Array.from(b.phiRad, radToDeg),
      ...(b.scanAngleDeg ? { scanAngleDeg: Array.from(b.scanAngleDeg), planePhiDeg: radToDeg(b.planePhiRad as number) } : {}),
      u: Array.from(b.u), v: Array.from(b.v), ...(b.stepUV !== undefined ? { stepUV: b.stepUV } : {}),
    },
    positionsM: Array.from({ length: p.layout.count }, (_, i) => Array.from(p.layout.positionsM.subarray(3 * i, 3 * i + 3))),
    // Results from worker threads or shards arrive as plain data: give them their printed form again.
    frequencies: frequencies.map((r) => restoreDisplay(r)),
    bandSummary,
    failedChecks: frequencies.flatMap((r) => r.checks.filter((c) => !c.passed).map((c) => ({ ...c, frequencyHz: r.frequencyHz }))),
  };
  const spec = d.imperfections?.failures;
  if (p.failedElements && p.failedElements.length > 0 && spec) {
    out.failures = { failedElements: Array.from(p.failedElements), workingElementCount: p.layout.count - p.failedElements.length, termination: spec.termination };
  }
  const imperfections = designImperfectionFigures(p);
  if (imperfections) out.imperfections = imperfections;
  if (p.lattice) {
    const fMax = band[band.length - 1];
    const maxScan = Math.max(...Array.from(b.thetaRad, (t) => Math.sin(t)));
    out.gratingLobes = {
      frequencyHz: fMax, maxScanSinTheta: maxScan,
      circles: gratingLobeCircles(p.lattice, fMax, 2).filter((c) => c.m !== 0 || c.n !== 0).map((c) => ({ m: c.m, n: c.n, u: c.centerU, v: c.centerV, radius: c.radius })),
    };
  }
  return displayable<DesignEvaluation>(out, 'DesignEvaluation');
}

/**
 * Evaluates a design over its whole band and scan coverage.
 *
 * @remarks
 * {@link prepareDesign}, then {@link evaluateDesignFrequency} at every band frequency in order
 * on the calling thread, then {@link assembleDesignEvaluation}. The command line runs the same
 * frequencies on a worker pool and across shards; the result is identical whatever the split.
 * Definitions: docs/conventions.md and docs/design.md.
 * @param design - A validated design ({@link parseDesign} / {@link validateDesign}).
 * @param options - File name for messages, a reader for the files the design names, progress callback.
 * @returns Figures per frequency × beam, band summaries and report data.
 * @throws {@link DesignError} naming the field the library rejected.
 * @example
 * ```ts
 * const design = validateDesign({
 *   frequencyHz: { fromHz: 1.3e9, toHz: 1.5e9, count: 3 }, bandwidthHz: 1e6,
 *   layout: { kind: 'line', count: 4, spacingM: 0.1 },
 *   elements: { kind: 'dipole', lengthM: 0.1, radiusM: 5e-4, axis: [0, 1, 0], groundPlaneHeightM: 0.05 },
 *   amplifiers: { minimumNoiseTemperatureK: 30, noiseResistanceOhm: 5, optimumSourceAdmittanceS: 0.02 },
 *   environment: { skyK: 10, groundK: 290 },
 *   beams: { thetaDeg: [0, 20] },
 *   quadrature: { thetaCount: 24, phiCount: 48 },
 * }, 'line.json');
 * const result = evaluateDesign(design);
 * result.bandSummary[0].worstSensitivityM2PerK; // m²/K, broadside beam
 * ```
 * @category Design
 */
export function evaluateDesign(design: Design, options: EvaluateDesignOptions = {}): DesignEvaluation {
  const prepared = prepareDesign(design, options);
  const results: FrequencyEvaluation[] = [];
  const total = prepared.frequenciesHz.length;
  for (let i = 0; i < total; i++) {
    results.push(evaluateDesignFrequency(prepared, i));
    options.onProgress?.(i + 1, total);
  }
  return assembleDesignEvaluation(prepared, results);
}

/**
 * The frequency indices of block `index` (0-based) when a band of `count` points is cut into
 * `blocks` contiguous blocks of near-equal size (sizes differ by at most one).
 * @param count - Number of band frequencies, ≥ 1.
 * @param blocks - Number of blocks, 1 … count.
 * @param index - Block index, 0 … blocks − 1.
 * @returns The indices, increasing.
 * @category Design
 */
export function frequencyBlock(count: number, blocks: number, index: number): number[] {
  const lo = Math.floor((index * count) / blocks), hi = Math.floor(((index + 1) * count) / blocks);
  return Array.from({ length: hi - lo }, (_, i) => lo + i);
}
