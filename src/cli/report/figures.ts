/**
 * The figures of a design report: data (with units) and their SVG renderings.
 * Every number is taken from the library's results; the SVGs are drawn from
 * the same numbers.
 * @internal
 * @module
 */
import type { ReceivingArrayEvaluation, BeamFigures } from '../../reception/index.js';
import { samplePatterns } from '../../reception/index.js';
import { gratingLobeCircles } from '../../floquet/grating-lobes.js';
import { linePlotSvg, patternCutSvg, smithChartSvg, gratingLobeDiagramSvg } from '../../plot/index.js';
import { powerToDb } from '../../units/convert.js';
import { wavenumberRadPerM } from '../../units/convert.js';
import { beamPowerPatterns, scanPlaneDirections, type BuiltDesign } from '../design/build.js';
import { createMultiport } from '../../network/multiport.js';
import { activeReflection } from '../../network/sources.js';
import { zeros } from '../../linalg/cmatrix.js';

/** One beam's row of figures.json. @internal */
export type BeamRow = { scanAngleDeg: number; thetaDeg: number; phiDeg: number } & BeamFigures;

/** A line figure (x against one or more y series). @internal */
export interface LineFigure {
  file: string; title: string; xLabel: string; yLabel: string; xUnit: string; yUnit: string;
  x: number[]; traces: { label: string; y: number[] }[];
}

/** The content of figures.json. @internal */
export interface ReportFigures {
  design: string;
  title: string;
  frequencyHz: number;
  bandwidthHz: number;
  elementCount: number;
  beamformer: string;
  quadrature: { thetaCount: number; phiCount: number };
  units: Record<string, string>;
  beams: BeamRow[];
  array: {
    minimumReceiverTemperatureK: number;
    embeddedElementEfficiency: number[];
    positionsM: number[][];
  };
  figures: {
    patternCut: { file: string; title: string; xLabel: string; yLabel: string; xUnit: 'deg'; yUnit: 'dB'; angleDeg: number[]; traces: { label: string; scanAngleDeg: number; valueDb: number[] }[] };
    systemTemperature: LineFigure;
    sensitivity: LineFigure;
    efficiencies: LineFigure;
    activeReflection?: { file: string; title: string; unit: string; referenceOhm: number; scanAngleDeg: number[]; traces: { label: string; element: number; re: number[]; im: number[] }[] };
    gratingLobes?: { file: string; title: string; unit: string; scanRadius: number; circles: { m: number; n: number; u: number; v: number; radius: number }[] };
  };
}

const CUT_POINTS = 361;

function pickBeams(count: number, max: number): number[] {
  if (count <= max) return Array.from({ length: count }, (_, i) => i);
  const s = new Set<number>();
  for (let i = 0; i < max; i++) s.add(Math.round((i * (count - 1)) / (max - 1)));
  return [...s];
}

const r = (x: number) => Array.from({ length: x }, (_, i) => i);

/** Computes every figure of the report from the evaluation. @internal */
export function reportFigures(b: BuiltDesign, ev: ReceivingArrayEvaluation, designName: string): ReportFigures {
  const d = b.design;
  const f = d.frequencyHz;
  const n = b.layout.count;
  const scan = Array.from(b.scanAngleDeg);
  const beams: BeamRow[] = ev.beams.map((fig, k) => ({
    scanAngleDeg: scan[k],
    thetaDeg: (b.description.beams.thetaRad[k] * 180) / Math.PI,
    phiDeg: (b.description.beams.phiRad[k] * 180) / Math.PI,
    ...fig,
  }));

  // Pattern cut in the scan plane for up to five beams, normalised to the largest peak.
  const angleDeg = r(CUT_POINTS).map((i) => -90 + (180 * i) / (CUT_POINTS - 1));
  const dirs = scanPlaneDirections(angleDeg, b.planePhiRad);
  const cutPatterns = samplePatterns(b.ports.patterns, dirs.thetaRad, dirs.phiRad);
  const shown = pickBeams(ev.weights.cols, 5);
  const power = beamPowerPatterns(ev.weights, cutPatterns);
  let peak = 0;
  for (const k of shown) for (const v of power[k]) peak = Math.max(peak, v);
  const cutTraces = shown.map((k) => ({
    label: `beam at ${scan[k]}°`, scanAngleDeg: scan[k],
    valueDb: Array.from(power[k], (v) => (v > 0 ? powerToDb(v / peak) : -300)),
  }));

  const col = (key: keyof BeamFigures) => ev.beams.map((x) => x[key] as number);
  const xLabel = `scan angle in the φ = ${d.beams.planePhiDeg ?? 0}° plane [deg]`;
  const systemTemperature: LineFigure = {
    file: 'system-temperature.svg', title: 'System noise temperature and its parts', xLabel, yLabel: 'noise temperature [K]', xUnit: 'deg', yUnit: 'K', x: scan,
    traces: [
      { label: 'T_sys', y: col('systemTemperatureK') },
      { label: 'receiver', y: col('receiverTemperatureK') },
      { label: 'sky', y: col('skyTemperatureK') },
      { label: 'spillover', y: col('spilloverTemperatureK') },
      { label: 'ohmic loss', y: col('lossTemperatureK') },
    ],
  };
  const sensitivity: LineFigure = {
    file: 'sensitivity.svg', title: 'Sensitivity A_e/T_sys', xLabel, yLabel: 'A_e/T_sys [m²/K]', xUnit: 'deg', yUnit: 'm²/K', x: scan,
    traces: [{ label: 'A_e/T_sys', y: col('sensitivityM2PerK') }],
  };
  const effTraces = [
    { label: 'radiation', y: col('radiationEfficiency') },
    { label: 'spillover', y: col('spilloverEfficiency') },
    { label: 'noise matching', y: col('noiseMatchingEfficiency') },
  ];
  if (ev.beams[0].apertureEfficiency !== undefined) effTraces.unshift({ label: 'aperture', y: col('apertureEfficiency') });
  const efficiencies: LineFigure = {
    file: 'efficiencies.svg', title: 'Efficiencies', xLabel, yLabel: 'efficiency [linear]', xUnit: 'deg', yUnit: 'linear', x: scan, traces: effTraces,
  };

  const out: ReportFigures = {
    design: designName,
    title: d.title ?? designName,
    frequencyHz: f, bandwidthHz: d.bandwidthHz, elementCount: n,
    beamformer: d.beams.beamformer ?? 'max-snr',
    quadrature: { thetaCount: b.quadrature.thetaCount, phiCount: b.quadrature.phiCount },
    units: { ...ev.units, scanAngleDeg: 'deg', thetaDeg: 'deg', phiDeg: 'deg', minimumReceiverTemperatureK: 'K', embeddedElementEfficiency: 'linear', positionsM: 'm', frequencyHz: 'Hz', bandwidthHz: 'Hz' },
    beams,
    array: {
      minimumReceiverTemperatureK: ev.minimumReceiverTemperatureK,
      embeddedElementEfficiency: Array.from(ev.embeddedElementEfficiency),
      positionsM: r(n).map((i) => Array.from(b.layout.positionsM.subarray(3 * i, 3 * i + 3))),
    },
    figures: {
      patternCut: { file: 'pattern-cut.svg', title: 'Beam patterns in the scan plane', xLabel: 'angle in the scan plane [deg]', yLabel: 'relative power [dB]', xUnit: 'deg', yUnit: 'dB', angleDeg, traces: cutTraces },
      systemTemperature, sensitivity, efficiencies,
    },
  };

  // Active reflection coefficients Γₙ = Σₘ Sₙₘ cₘ/cₙ of the phase-steered transmit excitation cₘ = exp(−j k r̂·rₘ)
  // (the conjugate of the DESIGN steering vector), for the centre and the outermost element.
  const net = createMultiport('impedance', [f], [b.ports.impedanceOhm]);
  const k0 = wavenumberRadPerM(f);
  const p = b.layout.positionsM;
  let centre = 0, edge = 0, rc = Infinity, re = -1;
  for (let i = 0; i < n; i++) {
    const rr = Math.hypot(p[3 * i], p[3 * i + 1]);
    if (rr < rc - 1e-12) { rc = rr; centre = i; }
    if (rr > re + 1e-12) { re = rr; edge = i; }
  }
  const elems = centre === edge ? [centre] : [centre, edge];
  const traces = elems.map((e) => ({ label: e === centre ? `element ${e} (centre)` : `element ${e} (edge)`, element: e, re: [] as number[], im: [] as number[] }));
  const excitation = zeros(n, 1);
  for (let k = 0; k < scan.length; k++) {
    const th = b.description.beams.thetaRad[k], ph = b.description.beams.phiRad[k];
    const ux = Math.sin(th) * Math.cos(ph), uy = Math.sin(th) * Math.sin(ph), uz = Math.cos(th);
    for (let m = 0; m < n; m++) {
      const phase = -k0 * (ux * p[3 * m] + uy * p[3 * m + 1] + uz * p[3 * m + 2]);
      excitation.data[2 * m] = Math.cos(phase); excitation.data[2 * m + 1] = Math.sin(phase);
    }
    const gamma = activeReflection(net, excitation).data; // 1×N
    for (const t of traces) { t.re.push(gamma[2 * t.element]); t.im.push(gamma[2 * t.element + 1]); }
  }
  out.figures.activeReflection = { file: 'active-reflection.svg', title: 'Active reflection coefficient over the scan (50 Ω)', unit: 'linear (complex)', referenceOhm: 50, scanAngleDeg: scan, traces };

  if (b.lattice) {
    const maxScan = Math.max(...scan.map(Math.abs));
    const circles = gratingLobeCircles(b.lattice, f, 2).filter((c) => c.m !== 0 || c.n !== 0)
      .map((c) => ({ m: c.m, n: c.n, u: c.centerU, v: c.centerV, radius: c.radius }));
    out.figures.gratingLobes = { file: 'grating-lobes.svg', title: 'Grating-lobe diagram (u-v plane)', unit: 'direction cosines', scanRadius: Math.sin((maxScan * Math.PI) / 180), circles };
  }
  return out;
}

/** SVG renderings of the figures, by file name. @internal */
export function reportSvgs(fig: ReportFigures): Map<string, string> {
  const out = new Map<string, string>();
  const g = fig.figures;
  out.set(g.patternCut.file, patternCutSvg({
    title: g.patternCut.title, angleLabel: g.patternCut.xLabel, levelLabel: g.patternCut.yLabel, floorDb: -40,
    traces: g.patternCut.traces.map((t) => ({ label: t.label, angleRad: g.patternCut.angleDeg.map((a) => (a * Math.PI) / 180), valueDb: t.valueDb })),
  }));
  for (const lf of [g.systemTemperature, g.sensitivity, g.efficiencies]) {
    // Small sensitivities are drawn in cm²/K so the tick labels stay short (figures.json keeps m²/K).
    const small = lf === g.sensitivity && Math.max(...lf.traces[0].y.map(Math.abs)) < 0.1;
    const yLabel = small ? 'A_e/T_sys [cm²/K]' : lf.yLabel;
    out.set(lf.file, linePlotSvg({ title: lf.title, xLabel: lf.xLabel, yLabel, traces: lf.traces.map((t) => ({ label: t.label, x: lf.x, y: small ? t.y.map((v) => v * 1e4) : t.y })) }));
  }
  if (g.activeReflection) {
    out.set(g.activeReflection.file, smithChartSvg({
      title: g.activeReflection.title, z0Ohm: g.activeReflection.referenceOhm,
      traces: g.activeReflection.traces.map((t) => ({ label: t.label, gammaRe: t.re, gammaIm: t.im })),
    }));
  }
  if (g.gratingLobes) {
    out.set(g.gratingLobes.file, gratingLobeDiagramSvg({
      title: g.gratingLobes.title, scanRadius: g.gratingLobes.scanRadius,
      gratingCircles: g.gratingLobes.circles.map((c) => ({ u: c.u, v: c.v, radius: c.radius })),
    }));
  }
  return out;
}
