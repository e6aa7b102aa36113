/**
 * From a validated design to the library's inputs: layout and lattice
 * (geometry builders), beam directions (a scan plane, a list of pointings or a
 * cone on a u-v grid), ports at each band frequency (analytic dipoles
 * re-evaluated per frequency, or imported Touchstone + pattern data), amplifier
 * noise parameters, sky and environment. Browser-safe: files named in the
 * design are read through a caller-supplied reader.
 * @module
 */
import { hzText } from '../internal/text.js';
import type { CMatrix } from '../linalg/cmatrix.js';
import { degToRad } from '../units/convert.js';
import {
  arrayLayout, rectangularGridLayout, triangularLatticeLayout, uniformLineLayout, layoutCentroid,
  type ArrayLayout,
} from '../geometry/index.js';
import type { PlanarLattice } from '../geometry/lattice.js';
import { parseTouchstone } from '../network/touchstone.js';
import { interpolateMultiport } from '../network/interpolate.js';
import { convertMultiport } from '../network/convert.js';
import { multiportMatrix, type Multiport } from '../network/multiport.js';
import { parsePatternCsv, parsePatternJson } from '../element/patternFormats.js';
import { embeddedPatternSet, type EmbeddedPatternSet } from '../element/patternSet.js';
import { dipolesFromLayout } from '../element/fromLayout.js';
import type { WireDipole } from '../element/types.js';
import {
  dipoleArrayPorts, dipoleModelChecks, patternSetPorts, skyAndGroundEnvironment, skyTemperatureAt,
  type ArrayPortSource, type BeamDirections, type NoiseEnvironment,
} from '../reception/index.js';
import { placeWireElement } from '../wire/array.js';
import { buildModel } from '../wire/model.js';
import { wireArrayPorts } from '../wire/patterns.js';
import type { WireStructure } from '../wire/types.js';
import { circularTaylorTaper, cosineDistribution, sampleRadialDistribution, uniformTaper } from '../taper/index.js';
import { fieldError, type Design } from './schema.js';
import { designFailedElements } from './failures.js';
import { designSubarrays } from './imperfections.js';
import type { SubarrayLayout } from '../imperfect/subarrays.js';
import {
  amplifierBand, assertCovered, designFrequencies, touchstoneOptions, wrapField,
  type AmplifierBand, type DesignFileReader,
} from './bandData.js';

/**
 * Beam directions of a design, one entry per beam.
 * @category Design
 */
export interface DesignBeams {
  /** How the beams were given: a scan plane, a list of pointings, or a cone filled on a u-v grid. */
  readonly kind: 'plane' | 'pointings' | 'cone';
  /** Polar angle of each beam from +z [rad]. */
  readonly thetaRad: Float64Array;
  /** Azimuth of each beam from +x toward +y [rad]. */
  readonly phiRad: Float64Array;
  /** Signed scan angle in the plane [deg] (plane beams: negative angles lie at φ = plane + 180°). */
  readonly scanAngleDeg?: Float64Array;
  /** Azimuth of the scan plane [rad] (plane beams). */
  readonly planePhiRad?: number;
  /** u = sin θ cos φ of each beam (cone beams; also set for the other kinds). */
  readonly u: Float64Array;
  /** v = sin θ sin φ of each beam. */
  readonly v: Float64Array;
  /** Grid step of a cone in u and v (cone beams). */
  readonly stepUV?: number;
}

/**
 * A design prepared for evaluation: everything that does not depend on
 * frequency is built once; {@link designPortsAt} and the per-frequency parts
 * of {@link PreparedDesign} give the rest.
 * @category Design
 */
export interface PreparedDesign {
  /** The validated design. */
  readonly design: Design;
  /** The design file's name (used in every message). */
  readonly fileName: string;
  /** Band frequencies [Hz], strictly increasing. */
  readonly frequenciesHz: Float64Array;
  /** Element positions [m] in the xy-plane (dipole feeds are raised by the ground-plane height). */
  readonly layout: ArrayLayout;
  /** The layout's lattice, when it has one (grating-lobe diagram). */
  readonly lattice?: PlanarLattice;
  /** Beam directions. */
  readonly beams: DesignBeams;
  /** Taper amplitudes per element (taper beamformer), else undefined. */
  readonly taper?: Float64Array;
  /** Amplifier noise parameters at a frequency (undefined: noiseless receivers). @internal */
  readonly amplifiersAt: AmplifierBand;
  /** Imported data, parsed once. @internal */
  readonly imported?: ImportedElements;
  /** Indices into frequenciesHz of the frequencies the report draws cuts and maps at. */
  readonly reportFrequencyIndices: readonly number[];
  /** Failed element indices, ascending (design `imperfections.failures`), else undefined. */
  readonly failedElements?: Int32Array;
  /** Subarray partition (design `imperfections.subarrays`), else undefined. */
  readonly subarrays?: SubarrayLayout;
  /** Ports per element: 2 for crossed dipoles (port 2n + p is element n's polarisation p), else 1. */
  readonly portsPerElement: 1 | 2;
}

/** @internal Imported element data, parsed once. */
export interface ImportedElements {
  readonly network: Multiport;
  readonly patterns: readonly EmbeddedPatternSet[];
}

function buildLayout(d: Design, file: string): { layout: ArrayLayout; lattice?: PlanarLattice; spacingM?: number } {
  const l = d.layout;
  return wrapField(file, 'layout', () => {
    switch (l.kind) {
      case 'line':
        return { layout: uniformLineLayout(l.count, l.spacingM, { axis: l.axis ?? 'x' }), spacingM: l.spacingM };
      case 'rectangular': {
        const layout = rectangularGridLayout({ countX: l.countX, countY: l.countY, spacingXM: l.spacingXM, spacingYM: l.spacingYM });
        return { layout, lattice: layout.lattice, spacingM: Math.min(l.spacingXM, l.spacingYM) };
      }
      case 'triangular': {
        const b = l.boundary;
        const boundary = b.kind === 'circle'
          ? { kind: 'circle' as const, radiusM: b.radiusM }
          : { kind: 'hexagon' as const, circumradiusM: b.circumradiusM, rotationRad: degToRad(b.rotationDeg ?? 0) };
        const layout = triangularLatticeLayout(l.spacingM, boundary);
        return { layout, lattice: layout.lattice, spacingM: l.spacingM };
      }
      case 'positions':
        return { layout: arrayLayout(l.positionsM) };
    }
  });
}

/** Beam directions of the design. @internal */
export function designBeams(b: Design['beams']): DesignBeams {
  const uv = (th: Float64Array, ph: Float64Array) => ({
    u: th.map((t, i) => Math.sin(t) * Math.cos(ph[i])), v: th.map((t, i) => Math.sin(t) * Math.sin(ph[i])),
  });
  if (b.pointings !== undefined) {
    const thetaRad = Float64Array.from(b.pointings, (p) => degToRad(p.thetaDeg));
    const phiRad = Float64Array.from(b.pointings, (p) => degToRad(p.phiDeg));
    return { kind: 'pointings', thetaRad, phiRad, ...uv(thetaRad, phiRad) };
  }
  if (b.cone !== undefined) {
    // u-v grid of step s centred on broadside, kept inside sin(maxθ) (with a rounding slack).
    const s = b.cone.stepUV, r = Math.sin(degToRad(b.cone.maxThetaDeg));
    const m = Math.floor(r / s + 1e-9);
    const u: number[] = [], v: number[] = [];
    for (let j = -m; j <= m; j++) {
      for (let i = -m; i <= m; i++) {
        if (Math.hypot(i * s, j * s) <= r * (1 + 1e-12) + 1e-15) { u.push(i * s); v.push(j * s); }
      }
    }
    const thetaRad = Float64Array.from(u, (x, k) => Math.asin(Math.min(1, Math.hypot(x, v[k]))));
    const phiRad = Float64Array.from(u, (x, k) => (x === 0 && v[k] === 0 ? 0 : Math.atan2(v[k], x)));
    return { kind: 'cone', thetaRad, phiRad, u: Float64Array.from(u), v: Float64Array.from(v), stepUV: s };
  }
  const t = b.thetaDeg as NonNullable<Design['beams']['thetaDeg']>;
  const scan = !('fromDeg' in t)
    ? Float64Array.from(t)
    : Float64Array.from({ length: t.count }, (_, i) => (t.count === 1 ? t.fromDeg : t.fromDeg + ((t.toDeg - t.fromDeg) * i) / (t.count - 1)));
  const planePhiRad = degToRad(b.planePhiDeg ?? 0);
  const { thetaRad, phiRad } = scanPlaneDirections(scan, planePhiRad);
  return { kind: 'plane', thetaRad, phiRad, scanAngleDeg: scan, planePhiRad, ...uv(thetaRad, phiRad) };
}

/**
 * Directions of signed angles s in the plane φ = φp: θ = |s|, φ = φp (s ≥ 0) or φp + π.
 * @param angleDeg - Signed angles from broadside [deg].
 * @param planePhiRad - Azimuth of the plane [rad].
 * @returns θ and φ per angle [rad].
 * @category Design
 */
export function scanPlaneDirections(angleDeg: ArrayLike<number>, planePhiRad: number): BeamDirections {
  const n = angleDeg.length;
  const thetaRad = new Float64Array(n), phiRad = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    thetaRad[i] = degToRad(Math.abs(angleDeg[i]));
    phiRad[i] = angleDeg[i] < 0 ? planePhiRad + Math.PI : planePhiRad;
  }
  return { thetaRad, phiRad };
}

function taperAmplitudes(d: Design, layout: ArrayLayout, spacingM: number | undefined, file: string): Float64Array | undefined {
  if (d.beams.beamformer !== 'taper') return undefined;
  const t = d.beams.taper;
  if (t === undefined || t.kind === 'uniform') return uniformTaper(layout.count);
  const [cx, cy] = layoutCentroid(layout);
  let rMax = 0;
  for (let i = 0; i < layout.count; i++) rMax = Math.max(rMax, Math.hypot(layout.positionsM[3 * i] - cx, layout.positionsM[3 * i + 1] - cy));
  // Aperture rim half a spacing beyond the outermost element (common practice).
  const radiusM = rMax + (spacingM ?? Math.max(rMax * 0.1, 1e-9)) / 2;
  const opts = { centreXM: cx, centreYM: cy };
  return wrapField(file, 'beams.taper', () => {
    if (t.kind === 'cosine') {
      const g = cosineDistribution(t.pedestal ?? 0);
      return sampleRadialDistribution((rho) => g(rho / 2), layout, radiusM, opts);
    }
    return circularTaylorTaper(layout, radiusM, t.sidelobeDb, t.nbar ?? 5, opts).weights;
  });
}

function readNamed(file: string, field: string, name: string, read: DesignFileReader | undefined): string {
  if (read === undefined) throw fieldError(file, field, `expected a file reader from the caller to read "${name}" (pass options.readFile), received none`);
  try {
    return read(name);
  } catch (e) {
    throw fieldError(file, field, `cannot read "${name}": ${(e as Error).message}`);
  }
}

function importElements(d: Design, file: string, band: Float64Array, layout: ArrayLayout, read: DesignFileReader | undefined): ImportedElements | undefined {
  const e = d.elements;
  if (e.kind !== 'imported') return undefined;
  const tsText = readNamed(file, 'elements.touchstoneFile', e.touchstoneFile, read);
  const ts = wrapField(file, 'elements.touchstoneFile', () => parseTouchstone(tsText, touchstoneOptions(e.touchstoneFile)));
  const network = ts.network;
  assertCovered(file, 'elements.touchstoneFile', `"${e.touchstoneFile}"`, network.frequencyHz, band);
  const names = typeof e.patternFile === 'string' ? [e.patternFile] : e.patternFile;
  const patterns = names.map((name, i) => {
    const field = typeof e.patternFile === 'string' ? 'elements.patternFile' : `elements.patternFile[${i}]`;
    const text = readNamed(file, field, name, read);
    const lower = name.toLowerCase();
    if (!lower.endsWith('.json') && !lower.endsWith('.csv')) throw fieldError(file, field, `expected a pattern file named *.json or *.csv, received "${name}"`);
    const set = wrapField(file, field, () => (lower.endsWith('.json') ? parsePatternJson(text) : parsePatternCsv(text)));
    if (set.portCount !== network.ports) {
      throw fieldError(file, field, `expected patterns of ${network.ports} ports (the Touchstone file's port count), received ${set.portCount}`);
    }
    return set;
  }).sort((a, b) => a.frequencyHz - b.frequencyHz);
  for (let i = 1; i < patterns.length; i++) {
    if (!(patterns[i].frequencyHz > patterns[i - 1].frequencyHz * (1 + 1e-9))) {
      throw fieldError(file, 'elements.patternFile', `expected one pattern file per frequency, received two at ${hzText(patterns[i].frequencyHz)}`);
    }
  }
  if (layout.count !== network.ports) {
    throw fieldError(file, 'layout', `expected ${network.ports} elements (the imported port count), received a layout of ${layout.count}`);
  }
  // Every band frequency must have pattern data (or neighbours to interpolate between, when asked).
  for (const f of band) patternSetAt(patterns, f, e.interpolatePatterns === true, file);
  return { network, patterns };
}

/** Relative frequency tolerance for taking a pattern file as "at" a band frequency (0.1 %). */
const PATTERN_MATCH = 1e-3;

function patternSetAt(sets: readonly EmbeddedPatternSet[], f: number, interpolate: boolean, file: string): EmbeddedPatternSet {
  let best = 0;
  for (let i = 1; i < sets.length; i++) if (Math.abs(sets[i].frequencyHz - f) < Math.abs(sets[best].frequencyHz - f)) best = i;
  if (Math.abs(sets[best].frequencyHz - f) <= PATTERN_MATCH * f) return sets[best];
  const covered = sets.map((s) => hzText(s.frequencyHz)).join(', ');
  let hi = sets.findIndex((s) => s.frequencyHz > f);
  if (!interpolate || hi <= 0) {
    const why = interpolate ? 'outside the range they cover (no extrapolation)' : 'not within 0.1 % of any of them; set elements.interpolatePatterns to true to interpolate between neighbours';
    throw fieldError(file, 'elements.patternFile', `no embedded patterns at ${hzText(f)}: the pattern files are at ${covered}; ${why} (nearest: ${hzText(sets[best].frequencyHz)})`);
  }
  return interpolatePatternSets(sets[hi - 1], sets[hi], f, file);
}

/**
 * Embedded patterns at f by linear interpolation of the complex samples of the two
 * neighbouring sets (same grid, same excitation). Accurate only while the pattern phase
 * changes little between the two frequencies (k·r_max·Δf/f ≪ 1 for phase centres a distance
 * r_max from the reference origin); documented in docs/design.md.
 */
function interpolatePatternSets(a: EmbeddedPatternSet, b: EmbeddedPatternSet, f: number, file: string): EmbeddedPatternSet {
  const same = a.thetaRad.length === b.thetaRad.length && a.phiRad.length === b.phiRad.length
    && a.thetaRad.every((x, i) => Math.abs(x - b.thetaRad[i]) < 1e-12) && a.phiRad.every((x, i) => Math.abs(x - b.phiRad[i]) < 1e-12)
    && JSON.stringify(a.excitation) === JSON.stringify(b.excitation);
  if (!same) {
    throw fieldError(file, 'elements.patternFile', `cannot interpolate between the pattern files at ${hzText(a.frequencyHz)} and ${hzText(b.frequencyHz)}: they must share the θ-φ grid and the excitation record`);
  }
  const t = (f - a.frequencyHz) / (b.frequencyHz - a.frequencyHz);
  const mix = (x: CMatrix, y: CMatrix): CMatrix => ({ rows: x.rows, cols: x.cols, data: x.data.map((v, i) => (1 - t) * v + t * y.data[i]) });
  return embeddedPatternSet({ ...a, frequencyHz: f, thetaComponentV: mix(a.thetaComponentV, b.thetaComponentV), phiComponentV: mix(a.phiComponentV, b.phiComponentV) });
}

type WireElementsField = Extract<Design['elements'], { kind: 'wire' }>;

/** The design's wire element (template coordinates, raised by groundPlaneHeightM) at every layout position. */
function wireArray(e: WireElementsField, layout: ArrayLayout): ReturnType<typeof placeWireElement> {
  const element: WireStructure = { wires: e.wires, ports: [e.port], loads: e.loads };
  return placeWireElement(element, layout, { heightM: e.groundPlaneHeightM ?? 0 });
}

function wireOptions(e: WireElementsField): { groundPlane?: { zM: number }; maxSegmentWavelengths?: number } {
  return { ...(e.groundPlaneHeightM === undefined ? {} : { groundPlane: { zM: 0 } }), ...(e.maxSegmentWavelengths === undefined ? {} : { maxSegmentWavelengths: e.maxSegmentWavelengths }) };
}

/** Options of {@link prepareDesign}. @category Design */
export interface PrepareDesignOptions {
  /** Name of the design file, used in messages. @defaultValue "design" */
  readonly fileName?: string;
  /** Reader for files the design names (Touchstone, pattern files), relative to the design file. @defaultValue none (designs naming files are rejected) */
  readonly readFile?: DesignFileReader;
}

/**
 * Prepares a validated design for evaluation: layout, lattice, beams, taper, amplifier
 * band and imported data, checking that every band frequency is covered by the data files.
 * @param design - A validated design ({@link validateDesign} / {@link parseDesign}).
 * @param options - File name for messages and a reader for the files it names.
 * @returns The prepared design.
 * @throws {@link DesignError} naming the field the library rejected.
 * @category Design
 */
export function prepareDesign(design: Design, options: PrepareDesignOptions = {}): PreparedDesign {
  const file = options.fileName ?? 'design';
  const d = design;
  const frequenciesHz = designFrequencies(d, file);
  const { layout, lattice, spacingM } = buildLayout(d, file);
  const beams = designBeams(d.beams);
  const taper = taperAmplitudes(d, layout, spacingM, file);
  const amplifiersAt = amplifierBand(d, file, frequenciesHz, options.readFile);
  const imported = importElements(d, file, frequenciesHz, layout, options.readFile);
  if (d.elements.kind === 'wire') {
    // the geometry checks (segment lengths depend on λ) at both ends of the band, before any solve
    for (const f of [frequenciesHz[0], frequenciesHz[frequenciesHz.length - 1]]) {
      wrapField(file, 'elements', () => buildModel(wireArray(d.elements as WireElementsField, layout), f, wireOptions(d.elements as WireElementsField)));
    }
  }
  checkElementModel(d, file, frequenciesHz);
  const failedElements = designFailedElements(d.imperfections?.failures, layout.count, file);
  const subarrays = designSubarrays(d, file);
  return {
    design: d, fileName: file, frequenciesHz, layout, lattice, beams, taper, amplifiersAt, imported, reportFrequencyIndices: reportFrequencies(d, frequenciesHz),
    portsPerElement: d.elements.kind === 'crossedDipole' ? 2 : 1,
    ...(failedElements ? { failedElements } : {}), ...(subarrays ? { subarrays } : {}),
  };
}

/**
 * Refuses a dipole design outside the one-mode model's validity at the highest band
 * frequency (reception's dipoleModelChecks: length ≤ 1 λ, radius ≤ 0.01 λ, common practice),
 * before any integral is sized for it.
 */
function checkElementModel(d: Design, file: string, band: Float64Array): void {
  const e = d.elements;
  if (e.kind !== 'dipole' && e.kind !== 'crossedDipole') return;
  const fMax = band[band.length - 1];
  const failed = dipoleModelChecks([{ centerM: [0, 0, 0], axis: [1, 0, 0], lengthM: e.lengthM, radiusM: e.radiusM }], fMax).filter((c) => !c.passed);
  if (failed.length > 0) {
    const c = failed[0];
    throw fieldError(file, c.name === 'elementModel.wireRadius' ? 'elements.radiusM' : 'elements.lengthM',
      `fails the model-validity check "${c.name}" at ${hzText(fMax)}: ${c.value.toPrecision(4)} > ${c.limit} (${c.meaning})`);
  }
}

function reportFrequencies(d: Design, band: Float64Array): number[] {
  const nearest = (f: number) => {
    let best = 0;
    for (let i = 1; i < band.length; i++) if (Math.abs(band[i] - f) < Math.abs(band[best] - f)) best = i;
    return best;
  };
  const wanted = d.report?.frequenciesHz ?? [band[0], band[Math.floor((band.length - 1) / 2)], band[band.length - 1]];
  return [...new Set(wanted.map(nearest))].sort((a, b) => a - b);
}

/**
 * The array's ports at one band frequency: analytic dipoles re-evaluated at f (one-mode
 * induced-EMF model, element module; crossed dipoles give two ports per element, X then Y,
 * the crossed pair's own mutual impedance being zero by symmetry), wire elements solved at f by the thin-wire method of
 * moments (wire module: the template placed at every layout position, segmented for f, full
 * coupling, open-circuit embedded patterns), or the imported network interpolated to f
 * (network module, real–imaginary rule) with the embedded patterns at f.
 * @param prepared - The prepared design.
 * @param frequencyHz - A band frequency [Hz].
 * @returns Patterns and Z [Ω].
 * @throws {@link DesignError} naming the field the library rejected.
 * @category Design
 */
export function designPortsAt(prepared: PreparedDesign, frequencyHz: number): ArrayPortSource {
  const { design: d, fileName: file, layout } = prepared;
  const e = d.elements;
  if (e.kind === 'dipole') {
    const dipoles: WireDipole[] = wrapField(file, 'elements', () => dipolesFromLayout(layout, { lengthM: e.lengthM, radiusM: e.radiusM, axis: e.axis, heightM: e.groundPlaneHeightM ?? 0 }));
    return wrapField(file, 'elements', () => dipoleArrayPorts(dipoles, frequencyHz, e.groundPlaneHeightM === undefined ? {} : { groundPlane: { zM: 0 } }));
  }
  if (e.kind === 'crossedDipole') {
    // X and Y dipoles interleaved: port 2n is element n's X dipole, port 2n + 1 its Y dipole
    const r = degToRad(e.rotationDeg ?? 0);
    const along = (axis: readonly [number, number, number]) => wrapField(file, 'elements', () => dipolesFromLayout(layout, { lengthM: e.lengthM, radiusM: e.radiusM, axis, heightM: e.groundPlaneHeightM ?? 0 }));
    const xs = along([Math.cos(r), Math.sin(r), 0]), ys = along([-Math.sin(r), Math.cos(r), 0]);
    const dipoles = xs.flatMap((x, n) => [x, ys[n]]);
    return wrapField(file, 'elements', () => dipoleArrayPorts(dipoles, frequencyHz, e.groundPlaneHeightM === undefined ? {} : { groundPlane: { zM: 0 } }));
  }
  if (e.kind === 'wire') {
    return wrapField(file, 'elements', () => wireArrayPorts(wireArray(e, layout), frequencyHz, wireOptions(e)));
  }
  const imp = prepared.imported as ImportedElements;
  const at = wrapField(file, 'elements.touchstoneFile', () => interpolateMultiport(imp.network, [frequencyHz]));
  const z = multiportMatrix(convertMultiport(at, 'impedance'), 0);
  const set = patternSetAt(imp.patterns, frequencyHz, e.interpolatePatterns === true, file);
  return wrapField(file, 'elements', () => patternSetPorts(set, z));
}

/**
 * The environment of a design at one frequency.
 * @category Design
 */
export interface DesignEnvironmentAt {
  /** Brightness and sky region for the reception module. */
  readonly environment: NoiseEnvironment;
  /** Sky brightness used [K]. */
  readonly skyK: number;
}

/**
 * The noise environment at one band frequency (sky law evaluated at f; ground and tilt fixed).
 * @param prepared - The prepared design.
 * @param frequencyHz - Frequency [Hz].
 * @returns The environment and the sky temperature used [K].
 * @category Design
 */
export function designEnvironmentAt(prepared: PreparedDesign, frequencyHz: number): DesignEnvironmentAt {
  const env = prepared.design.environment;
  const skyK = skyTemperatureAt(env.skyK, frequencyHz);
  const environment = wrapField(prepared.fileName, 'environment', () => skyAndGroundEnvironment({
    skyK, groundK: env.groundK ?? 290, tiltRad: degToRad(env.tiltDeg ?? 0), tiltAzimuthRad: degToRad(env.tiltAzimuthDeg ?? 0),
  }));
  return { environment, skyK };
}
