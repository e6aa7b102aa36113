/**
 * Sensitivity sketch panel: a small grid of half-wave dipoles a quarter wavelength over a
 * ground plane, amplifier noise parameters and a sky/ground environment → T_sys, A_e/T_sys,
 * G/T and SEFD of the maximum-SNR beam at the array's broadside, via the design module (the
 * same job the command line runs on a design file). The
 * array may be tilted from the zenith so that part of its half-space sees the warm ground.
 */
import { type FrequencyEvaluation, evaluateDesign, validateDesign, wavelengthM } from 'phasewise';
import { byId, inputNumber, showFigure, showStatus, describeError, debounce } from './dom.js';

/** Inputs of the sketch, as read from the form. */
export interface SensitivityInputs {
  /** Dipoles per side of the square grid. */
  perSide: number;
  frequencyHz: number;
  minimumNoiseTemperatureK: number;
  noiseResistanceOhm: number;
  skyK: number;
  groundK: number;
  /** Angle between the array's broadside and the zenith [deg]. */
  tiltDeg: number;
}

/** Fixed parts of the model, stated on the page. */
export const SKETCH_MODEL = {
  /** Element spacing [wavelengths]. */
  spacingWavelengths: 0.5,
  /** Dipole length [wavelengths]. */
  lengthWavelengths: 0.48,
  /** Wire radius [wavelengths]. */
  radiusWavelengths: 1 / 400,
  /** Height over the ground plane [wavelengths]. */
  heightWavelengths: 0.25,
  /** Optimum source admittance of the amplifiers [S] (20 mS, i.e. 50 Ω). */
  optimumSourceAdmittanceS: { re: 0.02, im: 0 },
  /** Gauss–Legendre θ nodes × uniform φ nodes of the coarse sphere rule. */
  thetaNodes: 24,
  phiNodes: 48,
  /** Noise bandwidth [Hz] (the figures shown do not depend on it). */
  bandwidthHz: 1e6,
} as const;

/** The sketch as a phasewise design (the same JSON a design file holds). */
export function sketchDesign(inputs: SensitivityInputs): Record<string, unknown> {
  const m = SKETCH_MODEL;
  const lambda = wavelengthM(inputs.frequencyHz);
  const d = m.spacingWavelengths * lambda;
  return {
    title: 'playground sensitivity sketch',
    frequencyHz: inputs.frequencyHz,
    bandwidthHz: m.bandwidthHz,
    layout: { kind: 'rectangular', countX: inputs.perSide, countY: inputs.perSide, spacingXM: d, spacingYM: d },
    elements: { kind: 'dipole', lengthM: m.lengthWavelengths * lambda, radiusM: m.radiusWavelengths * lambda, axis: [1, 0, 0], groundPlaneHeightM: m.heightWavelengths * lambda },
    amplifiers: { minimumNoiseTemperatureK: inputs.minimumNoiseTemperatureK, noiseResistanceOhm: inputs.noiseResistanceOhm, optimumSourceAdmittanceS: m.optimumSourceAdmittanceS },
    environment: { skyK: inputs.skyK, groundK: inputs.groundK, tiltDeg: inputs.tiltDeg },
    beams: { pointings: [{ thetaDeg: 0, phiDeg: 0 }] },
    physicalAreaM2: inputs.perSide * inputs.perSide * d * d,
    quadrature: { thetaCount: m.thetaNodes, phiCount: m.phiNodes },
  };
}

/** Evaluates the sketch through the library's design job: the same calls the browser test makes to check the page. */
export function evaluateSketch(inputs: SensitivityInputs): FrequencyEvaluation {
  return evaluateDesign(validateDesign(sketchDesign(inputs), 'sketch')).frequencies[0];
}

function readInputs(): SensitivityInputs {
  return {
    perSide: inputNumber('sens-count'),
    frequencyHz: inputNumber('sens-frequency') * 1e6,
    minimumNoiseTemperatureK: inputNumber('sens-tmin'),
    noiseResistanceOhm: inputNumber('sens-rn'),
    skyK: inputNumber('sens-sky'),
    groundK: inputNumber('sens-ground'),
    tiltDeg: inputNumber('sens-tilt'),
  };
}

function update(): void {
  const inputs = readInputs();
  try {
    if (!(inputs.tiltDeg >= 0 && inputs.tiltDeg <= 90)) throw new RangeError(`the tilt must lie in [0°, 90°] (received ${inputs.tiltDeg}°).`);
    if (!(inputs.perSide >= 1 && inputs.perSide <= 5)) throw new RangeError(`dipoles per side must be 1 to 5 in this sketch (received ${inputs.perSide}).`);
    const t0 = performance.now();
    const r = evaluateSketch(inputs);
    const b = r.beams[0];
    byId('sens-elements').textContent = String(inputs.perSide * inputs.perSide);
    showFigure('sens-tsys', b.systemTemperatureK, 4, 'K');
    showFigure('sens-tsky', b.skyTemperatureK, 4, 'K');
    showFigure('sens-tspill', b.spilloverTemperatureK, 4, 'K');
    showFigure('sens-trec', b.receiverTemperatureK, 4, 'K');
    showFigure('sens-ae', b.effectiveAreaM2, 4, 'm²');
    showFigure('sens-aet', b.sensitivityM2PerK, 4, 'm²/K');
    showFigure('sens-nm', b.noiseMatchingEfficiency, 4);
    showFigure('sens-gt', b.gainOverTemperatureDbPerK, 4, 'dB/K');
    showFigure('sens-sefd', b.sefdJy, 4, 'Jy');
    byId('sens-time').textContent = `computed in ${Math.round(performance.now() - t0)} ms`;
    showStatus('sens-status', '');
  } catch (e) {
    showStatus('sens-status', describeError(e));
  }
}

/** Wires the sketch's inputs and computes the first result. */
export function initSensitivity(): void {
  const form = byId<HTMLFormElement>('sens-form');
  const later = debounce(update, 250);
  form.addEventListener('input', later);
  form.addEventListener('change', later);
  form.addEventListener('submit', (e) => { e.preventDefault(); update(); });
  update();
}
