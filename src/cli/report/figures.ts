/**
 * The figures of a design report drawn from the library's band result
 * (DesignEvaluation): SVG renderings only, no physics. Single-frequency plane
 * designs keep the figure names of earlier reports; band designs add figures
 * versus frequency and one cut/map per report frequency.
 * @internal
 * @module
 */
import type { DesignEvaluation, FrequencyEvaluation, DesignBeamFigures } from '../../design/index.js';
import { linePlotSvg, patternCutSvg, smithChartSvg, gratingLobeDiagramSvg, uvMapSvg } from '../../plot/index.js';
import { powerToDb } from '../../units/convert.js';

/** A report figure: file name, caption and SVG. @internal */
export interface ReportFigure { file: string; caption: string; svg: string }

/** Frequency in the report's unit (MHz below 1 GHz, else GHz). @internal */
export function frequencyUnit(ev: DesignEvaluation): { scale: number; unit: 'MHz' | 'GHz' } {
  return ev.frequenciesHz[ev.frequenciesHz.length - 1] < 1e9 ? { scale: 1e-6, unit: 'MHz' } : { scale: 1e-9, unit: 'GHz' };
}

/** Label of beam k: the signed scan angle (plane) or (θ, φ). @internal */
export function beamLabel(ev: DesignEvaluation, k: number): string {
  const b = ev.beams;
  if (b.kind === 'plane' && b.scanAngleDeg) return `beam at ${round(b.scanAngleDeg[k])}°`;
  return `θ ${round(b.thetaDeg[k])}°, φ ${round(b.phiDeg[k])}°`;
}

const round = (x: number) => Number(x.toFixed(2));

/** Beams drawn as separate traces (the pattern cuts' beams, from the library). */
function tracedBeams(ev: DesignEvaluation): number[] {
  const r = ev.reportFrequencyIndices.map((i) => ev.frequencies[i].patternCuts).find((c) => c !== undefined);
  return r ? r.map((c) => c.beam) : [0];
}

function suffix(ev: DesignEvaluation, i: number): string {
  if (ev.frequenciesHz.length === 1) return '';
  return `-${Number((ev.frequenciesHz[i] / 1e6).toPrecision(8))}MHz`;
}

function fText(ev: DesignEvaluation, i: number): string {
  const { scale, unit } = frequencyUnit(ev);
  return `${Number((ev.frequenciesHz[i] * scale).toPrecision(7))} ${unit}`;
}

/** Every figure of the report. @internal */
export function reportFigureList(ev: DesignEvaluation): ReportFigure[] {
  const out: ReportFigure[] = [];
  const band = ev.frequenciesHz.length > 1;
  const shown = tracedBeams(ev);
  const centre = ev.reportFrequencyIndices[Math.floor((ev.reportFrequencyIndices.length - 1) / 2)];
  const { scale, unit } = frequencyUnit(ev);
  const fx = ev.frequenciesHz.map((f) => f * scale);
  const col = (r: FrequencyEvaluation, key: keyof DesignBeamFigures) => r.beams.map((b) => b[key] as number);

  if (band) {
    const perBeam = (key: keyof DesignBeamFigures) => shown.map((k) => ({ label: beamLabel(ev, k), x: fx, y: ev.frequencies.map((r) => r.beams[k][key] as number) }));
    out.push({
      file: 'sensitivity-vs-frequency.svg', caption: `A_e/T_sys versus frequency for ${shown.length} beams (m²/K).`,
      svg: linePlotSvg({ title: 'Sensitivity A_e/T_sys across the band', xLabel: `frequency [${unit}]`, yLabel: 'A_e/T_sys [m²/K]', yFromZero: true, traces: perBeam('sensitivityM2PerK') }),
    });
    out.push({
      file: 'gt-vs-frequency.svg', caption: 'G/T versus frequency (dB/K, gain and T_sys referred to the beamformer output).',
      svg: linePlotSvg({ title: 'G/T across the band', xLabel: `frequency [${unit}]`, yLabel: 'G/T [dB/K]', traces: perBeam('gainOverTemperatureDbPerK') }),
    });
    const k0 = shown[0];
    out.push({
      file: 'system-temperature-vs-frequency.svg', caption: `System noise temperature and its parts versus frequency, ${beamLabel(ev, k0)} (K).`,
      svg: linePlotSvg({
        title: `T_sys and its parts across the band (${beamLabel(ev, k0)})`, xLabel: `frequency [${unit}]`, yLabel: 'noise temperature [K]',
        traces: ([['T_sys', 'systemTemperatureK'], ['receiver', 'receiverTemperatureK'], ['sky', 'skyTemperatureK'], ['spillover', 'spilloverTemperatureK'], ['ohmic loss', 'lossTemperatureK']] as const)
          .map(([label, key]) => ({ label, x: fx, y: ev.frequencies.map((r) => r.beams[k0][key]) })),
      }),
    });
  }

  if (ev.beams.kind === 'plane' && ev.beams.scanAngleDeg) {
    const scan = ev.beams.scanAngleDeg;
    const xLabel = `scan angle in the φ = ${round(ev.beams.planePhiDeg ?? 0)}° plane [deg]`;
    const r = ev.frequencies[centre];
    const at = band ? ` at ${fText(ev, centre)}` : '';
    out.push({
      file: 'system-temperature.svg', caption: `System noise temperature and its parts over the scan${at} (K).`,
      svg: linePlotSvg({
        title: `System noise temperature and its parts${at}`, xLabel, yLabel: 'noise temperature [K]',
        traces: ([['T_sys', 'systemTemperatureK'], ['receiver', 'receiverTemperatureK'], ['sky', 'skyTemperatureK'], ['spillover', 'spilloverTemperatureK'], ['ohmic loss', 'lossTemperatureK']] as const)
          .map(([label, key]) => ({ label, x: scan, y: col(r, key) })),
      }),
    });
    out.push({
      file: 'sensitivity.svg', caption: `A_e/T_sys over the scan${band ? ' at the report frequencies' : ''} (m²/K).`,
      svg: linePlotSvg({
        title: 'Sensitivity A_e/T_sys over the scan', xLabel, yLabel: 'A_e/T_sys [m²/K]', yFromZero: true,
        traces: ev.reportFrequencyIndices.map((i) => ({ label: band ? fText(ev, i) : 'A_e/T_sys', x: scan, y: col(ev.frequencies[i], 'sensitivityM2PerK') })),
      }),
    });
    const eff: { label: string; x: number[]; y: number[] }[] = [
      { label: 'radiation', x: scan, y: col(r, 'radiationEfficiency') },
      { label: 'spillover', x: scan, y: col(r, 'spilloverEfficiency') },
      { label: 'noise matching', x: scan, y: col(r, 'noiseMatchingEfficiency') },
    ];
    if (r.beams[0].apertureEfficiency !== undefined) eff.unshift({ label: 'aperture', x: scan, y: col(r, 'apertureEfficiency') });
    out.push({ file: 'efficiencies.svg', caption: `Efficiencies over the scan${at} (linear).`, svg: linePlotSvg({ title: `Efficiencies${at}`, xLabel, yLabel: 'efficiency [linear]', traces: eff }) });
  }

  if (ev.beams.kind === 'cone' && ev.beams.stepUV !== undefined) {
    // A_e/T_sys over the scan coverage on its u-v grid, in dB relative to the best beam at that frequency.
    const s = ev.beams.stepUV;
    const m = Math.round(Math.max(...ev.beams.u.map(Math.abs), ...ev.beams.v.map(Math.abs)) / s);
    const axis = Array.from({ length: 2 * m + 1 }, (_, i) => (i - m) * s);
    for (const i of ev.reportFrequencyIndices) {
      const beams = ev.frequencies[i].beams;
      const best = Math.max(...beams.map((b) => b.sensitivityM2PerK));
      const grid = new Float64Array(axis.length * axis.length).fill(NaN);
      let low = 0;
      beams.forEach((b, k) => {
        const iu = Math.round(ev.beams.u[k] / s) + m, iv = Math.round(ev.beams.v[k] / s) + m;
        const db = powerToDb(b.sensitivityM2PerK / best);
        grid[iv * axis.length + iu] = db;
        low = Math.min(low, db);
      });
      // Colour scale from the lowest value (rounded down to 0.5 dB, at least 1 dB deep) to 0 dB.
      const floorDb = Math.min(-1, Math.floor(low * 2) / 2);
      const at = band ? ` at ${fText(ev, i)}` : '';
      out.push({
        file: `sensitivity-map${suffix(ev, i)}.svg`,
        caption: `A_e/T_sys over the scan coverage${at}, dB relative to the best beam there (${best.toPrecision(4)} m²/K); one cell per beam, colour scale ${floorDb} to 0 dB.`,
        svg: uvMapSvg({ title: `A_e/T_sys over the scan coverage${at} [dB re best]`, u: axis, v: axis, valueDb: grid, floorDb, ceilingDb: 0, showVisibleCircle: false }),
      });
    }
  }

  for (const i of ev.reportFrequencyIndices) {
    const r = ev.frequencies[i];
    if (!r.patternCuts || !r.cutAngleDeg) continue;
    const at = band ? ` at ${fText(ev, i)}` : '';
    const plane = ev.beams.kind === 'plane';
    out.push({
      file: `pattern-cut${suffix(ev, i)}.svg`,
      caption: `Beam patterns${at}, ${plane ? 'in the scan plane' : 'each in its own φ plane'}, relative to the largest peak (dB).`,
      svg: patternCutSvg({
        title: `Beam patterns${at}`, angleLabel: plane ? 'angle in the scan plane [deg]' : 'angle from broadside in the beam’s φ plane [deg]', levelLabel: 'relative power [dB]', floorDb: -40,
        traces: r.patternCuts.map((c) => ({ label: beamLabel(ev, c.beam), angleRad: (r.cutAngleDeg as number[]).map((a) => (a * Math.PI) / 180), valueDb: c.valueDb })),
      }),
    });
  }

  const ar = ev.frequencies[centre].activeReflection;
  if (ar) {
    const at = band ? ` at ${fText(ev, centre)}` : '';
    const nb = ev.beams.thetaDeg.length;
    const first = beamLabel(ev, 0).replace(/^beam at /, ''), last = beamLabel(ev, nb - 1).replace(/^beam at /, '');
    out.push({
      file: 'active-reflection.svg',
      caption: `Active reflection coefficient of ${ar.map((t) => t.label).join(' and ')} over the beams${at} (phase-steered transmit excitation, 50 Ω reference); each locus runs from the filled dot (${first}) to the open ring (${last}).`,
      svg: smithChartSvg({ title: `Active reflection coefficient over the scan (50 Ω)${at}`, z0Ohm: 50, traces: ar.map((t) => ({ label: t.label, gammaRe: t.re, gammaIm: t.im, startLabel: first, endLabel: last })) }),
    });
  }
  if (ev.gratingLobes) {
    out.push({
      file: 'grating-lobes.svg', caption: `Grating-lobe diagram at the highest frequency (${fText(ev, ev.frequenciesHz.length - 1)}) in direction cosines u, v: a grating lobe appears for a scan inside the green scan region (sin θ ≤ ${Number(ev.gratingLobes.maxScanSinTheta.toPrecision(3))}) wherever a red lattice-image circle overlaps it; none overlapping means grating-lobe free.`,
      svg: gratingLobeDiagramSvg({ title: 'Grating-lobe diagram (u-v plane)', scanRadius: ev.gratingLobes.maxScanSinTheta, gratingCircles: ev.gratingLobes.circles.map((c) => ({ u: c.u, v: c.v, radius: c.radius })) }),
    });
  }
  out.push(...failureCostFigures(ev, shown, fx, unit));
  out.push(...polarizationFigures(ev));
  const imp = ev.imperfections;
  if (imp && band) {
    const traces = shown.map((k) => ({ label: beamLabel(ev, k), x: fx, y: imp.beams[k].pointingErrorDeg.map((v) => (v === null ? NaN : v)) }));
    const f0 = `${Number((imp.designFrequencyHz * scale).toPrecision(7))} ${unit}`;
    const sa = imp.subarrays;
    const hardware = imp.steering === 'phase' ? `phase shifters set at ${f0}`
      : imp.steering === 'elementDelay' ? 'true time delay per element'
        : `phase shifters set at ${f0} within ${sa?.count ?? ''} subarrays of ${sa?.perX ?? ''}×${sa?.perY ?? ''} elements, true time delay between them`;
    out.push({
      file: 'beam-squint.svg',
      caption: `Beam pointing error across the band (deg), ${hardware}.`,
      svg: linePlotSvg({ title: 'Beam squint across the band', xLabel: `frequency [${unit}]`, yLabel: 'pointing error [deg]', traces }),
    });
    if (imp.beams[0].gainLossDb) {
      out.push({
        file: 'steering-gain-loss.svg',
        caption: `Gain loss at each beam's intended direction across the band (dB; array factor, equal amplitudes), ${hardware}.`,
        svg: linePlotSvg({
          title: 'Steering gain loss across the band', xLabel: `frequency [${unit}]`, yLabel: 'gain loss [dB]',
          traces: shown.map((k) => ({ label: beamLabel(ev, k), x: fx, y: imp.beams[k].gainLossDb as number[] })),
        }),
      });
    }
    // exact nulls (at f₀, or for a broadside beam at every frequency) are left out, not drawn at a floor
    const lobeTraces = imp.beams[0].subarrayLobeDb ? shown
      .map((k) => ({ label: beamLabel(ev, k), x: fx, y: (imp.beams[k].subarrayLobeDb as Array<number | null>).map((v) => (v === null || v < -80 ? NaN : v)) }))
      .filter((t) => t.y.some((v) => !Number.isNaN(v))) : [];
    if (lobeTraces.length > 0) {
      out.push({
        file: 'subarray-lobes.svg',
        caption: `Highest lobe at the grating directions of the subarray-centre lattice (periods ${(sa?.periodM ?? []).map((p) => (p === null ? '—' : `${Number(p.toPrecision(4))} m`)).join(' × ')}), relative to the beam peak, across the band (dB). Levels below −80 dB are not drawn: at ${f0} the element phases are exact and the lobes fall on nulls, and so do a broadside beam's at every frequency${lobeTraces.length < shown.length ? ` (beams without a drawn point are left out)` : ''}.`,
        svg: linePlotSvg({
          title: 'Subarray quantisation lobes across the band', xLabel: `frequency [${unit}]`, yLabel: 'lobe level re beam peak [dB]',
          traces: lobeTraces,
        }),
      });
    }
  }
  if (imp && imp.beams.some((b) => b.sidelobeFloorDb !== undefined || b.weightSidelobeFloorDb !== undefined)) {
    const x = imp.beams.map((_, k) => (ev.beams.kind === 'plane' && ev.beams.scanAngleDeg ? ev.beams.scanAngleDeg[k] : k));
    const traces = [
      ...(imp.beams[0].sidelobeFloorDb !== undefined ? [{ label: 'random-error floor', x, y: imp.beams.map((b) => b.sidelobeFloorDb as number) }] : []),
      ...(imp.beams[0].weightSidelobeFloorDb !== undefined ? [{ label: 'digital-weight floor', x, y: imp.beams.map((b) => b.weightSidelobeFloorDb as number) }] : []),
      ...(imp.phaseQuantizationLobeDb !== undefined ? [{ label: 'phase-quantisation lobe', x, y: imp.beams.map(() => imp.phaseQuantizationLobeDb as number) }] : []),
    ];
    out.push({
      file: 'imperfection-floors.svg',
      caption: `Expected sidelobe floors and the largest phase-quantisation lobe relative to the beam peak (dB), closed forms at ${Number((imp.designFrequencyHz * scale).toPrecision(7))} ${unit} for phase-steered equal-amplitude weights.`,
      svg: linePlotSvg({ title: 'Imperfection floors', xLabel: ev.beams.kind === 'plane' ? 'scan angle [deg]' : 'beam index', yLabel: 'level re beam peak [dB]', traces }),
    });
  }
  return out;
}

/** The cost of the failed elements per beam: A_e/T_sys (≡ G/T) loss versus frequency, or over the beams at one frequency. */
function failureCostFigures(ev: DesignEvaluation, shown: number[], fx: number[], unit: string): ReportFigure[] {
  const fl = ev.failures;
  if (!fl || !ev.frequencies[0].failureCost) return [];
  const what = `${fl.failedElements.length} failed element${fl.failedElements.length > 1 ? 's' : ''} (${fl.termination} termination), ${fl.workingElementCount} working`;
  const cost = (i: number, k: number) => (ev.frequencies[i].failureCost as NonNullable<FrequencyEvaluation['failureCost']>)[k];
  if (ev.frequenciesHz.length > 1) {
    return [{
      file: 'failure-cost.svg',
      caption: `Cost of the ${what}: loss of A_e/T_sys (equal to the loss of G/T) against the intact array, versus frequency (dB).`,
      svg: linePlotSvg({
        title: 'Failure cost across the band', xLabel: `frequency [${unit}]`, yLabel: 'A_e/T_sys (G/T) loss [dB]',
        traces: shown.map((k) => ({ label: beamLabel(ev, k), x: fx, y: ev.frequencies.map((_, i) => cost(i, k).sensitivityLossDb) })),
      }),
    }];
  }
  const plane = ev.beams.kind === 'plane' && ev.beams.scanAngleDeg;
  const x = ev.beams.thetaDeg.map((_, k) => (plane ? (ev.beams.scanAngleDeg as number[])[k] : k));
  return [{
    file: 'failure-cost.svg',
    caption: `Cost of the ${what}: loss of A_e/T_sys (equal to the loss of G/T) and of A_e against the intact array, per beam (dB).`,
    svg: linePlotSvg({
      title: 'Failure cost per beam', xLabel: plane ? 'scan angle [deg]' : 'beam index', yLabel: 'loss [dB]',
      traces: [
        { label: 'A_e/T_sys (G/T) loss', x, y: x.map((_, k) => cost(0, k).sensitivityLossDb) },
        { label: 'A_e loss', x, y: x.map((_, k) => cost(0, k).effectiveAreaLossDb) },
      ],
    }),
  }];
}

/** Highest IXR drawn [dB]: larger values (300 = infinite) are drawn at this level, as the captions say. */
const IXR_TOP_DB = 80;

/** IXR of the X/Y beam pair over the scan coverage and the Ludwig-3 cross-polar level (crossed-dipole designs). */
function polarizationFigures(ev: DesignEvaluation): ReportFigure[] {
  if (!ev.frequencies[0].polarization) return [];
  const out: ReportFigure[] = [];
  const band = ev.frequenciesHz.length > 1;
  const pol = (i: number) => ev.frequencies[i].polarization as NonNullable<FrequencyEvaluation['polarization']>;
  const clip = 'IXR above 80 dB (300 dB in figures.json: infinite, at the numerical limit) is drawn at 80 dB';
  // Sensitivity of each polarisation's beam at the central report frequency (both beam layouts).
  const sensitivityFigure = (x: number[], xLabel: string): ReportFigure => {
    const c = ev.reportFrequencyIndices[Math.floor((ev.reportFrequencyIndices.length - 1) / 2)];
    const at = band ? ` at ${fText(ev, c)}` : '';
    return {
      file: 'polarization-sensitivity.svg',
      caption: `A_e/T_sys of the X beam, the Y beam and the design's beam for an unpolarised source (total flux of both polarisations)${at} (m²/K); each of the pair collects one polarisation.`,
      svg: linePlotSvg({
        title: `Sensitivity per polarisation${at}`, xLabel, yLabel: 'A_e/T_sys [m²/K]', yFromZero: true,
        traces: [
          { label: 'X beam', x, y: pol(c).sensitivityXM2PerK },
          { label: 'Y beam', x, y: pol(c).sensitivityYM2PerK },
          { label: 'design beam (all ports)', x, y: ev.frequencies[c].beams.map((b) => b.sensitivityM2PerK) },
        ],
      }),
    };
  };
  const what = 'the X/Y beam pair (conjugate-field match of each polarisation\'s ports)';
  if (ev.beams.kind === 'cone' && ev.beams.stepUV !== undefined) {
    const s = ev.beams.stepUV;
    const m = Math.round(Math.max(...ev.beams.u.map(Math.abs), ...ev.beams.v.map(Math.abs)) / s);
    const axis = Array.from({ length: 2 * m + 1 }, (_, i) => (i - m) * s);
    for (const i of ev.reportFrequencyIndices) {
      const grid = new Float64Array(axis.length * axis.length).fill(NaN);
      let low = Infinity;
      pol(i).ixrDb.forEach((x, k) => {
        grid[(Math.round(ev.beams.v[k] / s) + m) * axis.length + Math.round(ev.beams.u[k] / s) + m] = Math.min(x, IXR_TOP_DB);
        low = Math.min(low, x);
      });
      const floorDb = Math.min(IXR_TOP_DB - 10, Math.floor(low / 5) * 5);
      const at = band ? ` at ${fText(ev, i)}` : '';
      out.push({
        file: `ixr-map${suffix(ev, i)}.svg`,
        caption: `Intrinsic cross-polarisation ratio (IXR, Carozzi & Woan 2011) of ${what} over the scan coverage${at}, dB; one cell per beam, colour scale ${floorDb} to ${IXR_TOP_DB} dB; ${clip}.`,
        svg: uvMapSvg({ title: `IXR over the scan coverage${at} [dB]`, u: axis, v: axis, valueDb: grid, floorDb, ceilingDb: IXR_TOP_DB, showVisibleCircle: false }),
      });
    }
    out.push(sensitivityFigure(ev.beams.thetaDeg.map((_, k) => k), 'beam index'));
    return out;
  }
  const plane = ev.beams.kind === 'plane' && ev.beams.scanAngleDeg;
  const x = ev.beams.thetaDeg.map((_, k) => (plane ? (ev.beams.scanAngleDeg as number[])[k] : k));
  const xLabel = plane ? `scan angle in the φ = ${round(ev.beams.planePhiDeg ?? 0)}° plane [deg]` : 'beam index';
  out.push({
    file: 'ixr.svg',
    caption: `Intrinsic cross-polarisation ratio (IXR, Carozzi & Woan 2011) of ${what} per beam${band ? ' at the report frequencies' : ''} (dB); ${clip}.`,
    svg: linePlotSvg({
      title: 'IXR over the scan', xLabel, yLabel: 'IXR [dB]',
      traces: ev.reportFrequencyIndices.map((i) => ({ label: band ? fText(ev, i) : 'IXR', x, y: pol(i).ixrDb.map((v) => Math.min(v, IXR_TOP_DB)) })),
    }),
  });
  const c = ev.reportFrequencyIndices[Math.floor((ev.reportFrequencyIndices.length - 1) / 2)];
  const at = band ? ` at ${fText(ev, c)}` : '';
  out.push({
    file: 'cross-polar.svg',
    caption: `Ludwig-3 cross- over co-polar power of the X and Y beams at their beam directions${at} (dB); levels below −80 dB (−300 in figures.json: zero) are drawn at −80 dB.`,
    svg: linePlotSvg({
      title: `Cross-polar level per beam${at}`, xLabel, yLabel: 'cross-polar level [dB re co-polar]',
      traces: [
        { label: 'X beam', x, y: pol(c).crossPolarXDb.map((v) => Math.max(v, -80)) },
        { label: 'Y beam', x, y: pol(c).crossPolarYDb.map((v) => Math.max(v, -80)) },
      ],
    }),
  });
  out.push(sensitivityFigure(x, xLabel));
  return out;
}
