/**
 * Array designer panel: layout, taper and scan → pattern cut, u-v map and figures.
 * Every number comes from the built library; this file only wires inputs to calls.
 */
import {
  type ArrayLayout, type CMatrix, type GratingLobe,
  uniformLineLayout, rectangularGridLayout, triangularLatticeLayout, steeringVector, hadamard, fromParts,
  directivity, patternEvaluator, cutFigures, planeCut, evenlySpaced, arrayFactorMagnitude, uvGrid, visibleDirections,
  lineGratingLobes, gratingLobes, wavelengthM, uniformTaper, dolphChebyshevTaper, taylorTaper, amplitudeToDb,
  radToDeg, degToRad,
} from 'phasewise';
import { patternCutSvg, uvMapSvg } from 'phasewise/plot';
import { byId, inputNumber, selectValue, showFigure, showStatus, describeError, debounce } from './dom.js';

/** Inputs of the designer, as read from the form. */
export interface DesignerInputs {
  layout: 'line' | 'grid' | 'triangular';
  count: number;
  spacingWavelengths: number;
  frequencyHz: number;
  taper: 'uniform' | 'chebyshev' | 'taylor';
  sllDb: number;
  nbar: number;
  scanDeg: number;
}

/** The array the inputs describe: layout, lattice vectors (for grating lobes) and weights. */
export interface DesignedArray {
  layout: ArrayLayout;
  latticeM: [[number, number], [number, number]] | undefined;
  spacingM: number;
  weights: CMatrix;
  scanDirection: [number, number, number];
}

function lineTaper(inputs: DesignerInputs, count: number): Float64Array {
  if (count === 1) return Float64Array.of(1);
  if (inputs.taper === 'chebyshev') return dolphChebyshevTaper(count, inputs.sllDb);
  if (inputs.taper === 'taylor') return taylorTaper(count, inputs.sllDb, inputs.nbar).weights;
  return uniformTaper(count);
}

/** Distinct sorted values of one coordinate (to 1e-9 of the spacing). */
function distinctCoordinates(layout: ArrayLayout, axis: 0 | 1, tol: number): number[] {
  const v: number[] = [];
  for (let n = 0; n < layout.count; n++) v.push(layout.positionsM[3 * n + axis]);
  v.sort((a, b) => a - b);
  const out: number[] = [];
  for (const x of v) if (out.length === 0 || x - out[out.length - 1] > tol) out.push(x);
  return out;
}

/**
 * Taper of any of the three layouts as a product of line tapers over the distinct column
 * positions and the distinct row positions (for a grid this is the separable taper; for
 * the triangular lattice the columns are the half-spaced x positions of both row kinds).
 */
function productTaper(inputs: DesignerInputs, layout: ArrayLayout, spacingM: number): Float64Array {
  const tol = 1e-9 * spacingM;
  const xs = distinctCoordinates(layout, 0, tol), ys = distinctCoordinates(layout, 1, tol);
  const tx = lineTaper(inputs, xs.length), ty = lineTaper(inputs, ys.length);
  const find = (list: number[], x: number): number => list.findIndex((c) => Math.abs(c - x) <= tol);
  const w = new Float64Array(layout.count);
  for (let n = 0; n < layout.count; n++) {
    w[n] = tx[find(xs, layout.positionsM[3 * n])] * ty[find(ys, layout.positionsM[3 * n + 1])];
  }
  return w;
}

/** Builds the layout and the scanned, tapered weights w = t ⊙ a(r̂₀) for the inputs. */
export function designArray(inputs: DesignerInputs): DesignedArray {
  const lambda = wavelengthM(inputs.frequencyHz);
  const d = inputs.spacingWavelengths * lambda;
  let layout: ArrayLayout;
  let latticeM: DesignedArray['latticeM'];
  if (inputs.layout === 'line') {
    layout = uniformLineLayout(inputs.count, d);
  } else if (inputs.layout === 'grid') {
    layout = rectangularGridLayout({ countX: inputs.count, countY: inputs.count, spacingXM: d, spacingYM: d });
    latticeM = [[d, 0], [0, d]];
  } else {
    // Equilateral lattice; the rectangle holds `count` rows and about `count` columns.
    const dy = (d * Math.sqrt(3)) / 2;
    layout = triangularLatticeLayout(d, { kind: 'rectangle', widthM: (inputs.count - 0.5) * d, heightM: (inputs.count - 1) * dy });
    latticeM = [[d, 0], [d / 2, dy]];
  }
  const t = productTaper(inputs, layout, d);
  const th = degToRad(inputs.scanDeg);
  const scanDirection: [number, number, number] = [Math.sin(th), 0, Math.cos(th)];
  const weights = hadamard(fromParts(t, null, layout.count), steeringVector(layout, scanDirection, inputs.frequencyHz));
  return { layout, latticeM, spacingM: d, weights, scanDirection };
}

/** Visible grating lobes of the designed array at its scan angle. */
export function designGratingLobes(inputs: DesignerInputs, a: DesignedArray): GratingLobe[] {
  const u0 = a.scanDirection[0];
  if (a.latticeM === undefined) return lineGratingLobes(a.spacingM, inputs.frequencyHz, u0);
  return gratingLobes(a.latticeM[0], a.latticeM[1], inputs.frequencyHz, u0, 0);
}

function readInputs(): DesignerInputs {
  return {
    layout: selectValue('designer-layout') as DesignerInputs['layout'],
    count: inputNumber('designer-count'),
    spacingWavelengths: inputNumber('designer-spacing'),
    frequencyHz: inputNumber('designer-frequency') * 1e9,
    taper: selectValue('designer-taper') as DesignerInputs['taper'],
    sllDb: inputNumber('designer-sll'),
    nbar: inputNumber('designer-nbar'),
    scanDeg: inputNumber('designer-scan'),
  };
}

const CUT_SAMPLES = 721;
const UV_SAMPLES = 101;
const FLOOR_DB = -50;

function update(): void {
  const inputs = readInputs();
  const taperRow = byId('designer-taper-options');
  taperRow.hidden = inputs.taper === 'uniform';
  byId('designer-nbar-field').hidden = inputs.taper !== 'taylor';
  try {
    if (!(Number.isInteger(inputs.count) && inputs.count >= 1 && inputs.count <= 40)) {
      throw new RangeError(`elements per side must be a whole number from 1 to 40 here (received ${inputs.count}); the library itself has no upper limit.`);
    }
    if (!(Math.abs(inputs.scanDeg) <= 90)) throw new RangeError(`the scan angle must lie in [−90°, 90°] (received ${inputs.scanDeg}°).`);
    const a = designArray(inputs);
    const f = inputs.frequencyHz;

    // φ = 0 cut, θ from −90° to 90°, normalised to the peak.
    const angles = evenlySpaced(-Math.PI / 2, Math.PI / 2, CUT_SAMPLES);
    const cut = planeCut(0, angles);
    const cutMag = arrayFactorMagnitude(a.layout, a.weights, cut.directions, f);
    let peak = 0;
    for (const m of cutMag) peak = Math.max(peak, m);
    const cutDb = Array.from(cutMag, (m) => amplitudeToDbSafe(m / peak));
    byId('designer-cut').innerHTML = patternCutSvg({
      traces: [{ label: 'φ = 0° cut', angleRad: angles, valueDb: cutDb }],
      floorDb: FLOOR_DB, ceilingDb: 0, widthPx: 470, heightPx: 300,
      angleLabel: 'angle from broadside θ [deg]', levelLabel: 'relative power [dB]',
    });

    // u-v map over the visible disc.
    const axis = evenlySpaced(-1, 1, UV_SAMPLES);
    const grid = uvGrid(axis, axis);
    const vis = visibleDirections(grid);
    const uvMag = arrayFactorMagnitude(a.layout, a.weights, vis.directions, f);
    let uvPeak = 0;
    for (const m of uvMag) uvPeak = Math.max(uvPeak, m);
    const uvDb = new Float64Array(grid.count).fill(NaN);
    // Exact nulls (−∞ dB) sit far below the colour floor; the map takes finite levels only.
    vis.indices.forEach((k, i) => { uvDb[k] = Math.max(amplitudeToDbSafe(uvMag[i] / uvPeak), -300); });
    byId('designer-uv').innerHTML = uvMapSvg({ u: axis, v: axis, valueDb: uvDb, floorDb: -40, ceilingDb: 0, widthPx: 340, heightPx: 320 });

    // Figures: directivity (sphere quadrature), beamwidth and sidelobes of the φ = 0 cut.
    const dir = directivity(a.layout, a.weights, a.scanDirection, f);
    const ev = patternEvaluator(a.layout, a.weights, f);
    const figs = cutFigures((t) => ev.magnitudeAt(Math.sin(t), 0, Math.cos(t)), -Math.PI / 2, Math.PI / 2);
    showFigure('designer-count-out', a.layout.count, 6);
    showFigure('designer-directivity', dir.directivityDb, 5, 'dBi');
    showFigure('designer-beamwidth', figs.halfPowerWidth === undefined ? undefined : radToDeg(figs.halfPowerWidth), 4, '°');
    showFigure('designer-sidelobe', figs.peakSidelobeDb, 4, 'dB');
    const lobes = designGratingLobes(inputs, a);
    const warn = byId('designer-grating');
    if (lobes.length > 0) {
      const where = lobes.slice(0, 3).map((l) => `u = ${l.u.toFixed(3)}${l.v !== 0 ? `, v = ${l.v.toFixed(3)}` : ''}`).join('; ');
      warn.textContent = `Grating lobes in visible space (${lobes.length}): ${where}${lobes.length > 3 ? '; …' : ''}. Reduce the spacing or the scan angle.`;
      warn.dataset.kind = 'warning';
    } else {
      warn.textContent = 'No grating lobe enters visible space at this scan angle.';
      warn.dataset.kind = 'ok';
    }
    showStatus('designer-status', '');
  } catch (e) {
    showStatus('designer-status', describeError(e));
  }
}

function amplitudeToDbSafe(ratio: number): number {
  return ratio > 0 ? amplitudeToDb(ratio) : -Infinity;
}

/** Wires the designer's inputs and draws the first result. */
export function initDesigner(): void {
  const form = byId<HTMLFormElement>('designer-form');
  const later = debounce(update, 120);
  const scan = byId<HTMLInputElement>('designer-scan'), slider = byId<HTMLInputElement>('designer-scan-slider');
  slider.addEventListener('input', () => { scan.value = slider.value; });
  scan.addEventListener('input', () => { slider.value = scan.value; });
  form.addEventListener('input', later);
  form.addEventListener('change', later);
  form.addEventListener('submit', (e) => { e.preventDefault(); update(); });
  update();
}
