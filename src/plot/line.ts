/**
 * Line plots: any figure against any abscissa, and pattern cuts in dB.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertFinite } from '../internal/validate.js';
import {
  type LegendEntry, type PlotFrameOptions, TRACE_COLORS, angleTicksDeg, checkSeries, clipId, drawAxes, esc, fmt, makeArea, markerSvg, openSvg,
  placeLegend, resolveFrame,
} from './svg.js';

/**
 * One curve of a line plot.
 * @category Plots
 */
export interface LineTrace {
  /** Legend label. */
  label: string;
  /** Abscissae, in the unit stated by the axis label. */
  x: ArrayLike<number>;
  /** Ordinates, same length as `x`; NaN breaks the line (a gap), ±Infinity is not allowed. */
  y: ArrayLike<number>;
}

/**
 * Options of {@link linePlotSvg}.
 * @category Plots
 */
export interface LinePlotOptions extends PlotFrameOptions {
  /** Curves to draw (at least one). */
  traces: readonly LineTrace[];
  /** x-axis title including its unit, e.g. "scan angle θ [deg]". */
  xLabel: string;
  /** y-axis title including its unit, e.g. "T_sys [K]". */
  yLabel: string;
  /** Fixed x range [min, max]; default: the data range, rounded to nice ticks. */
  xRange?: [number, number];
  /** Fixed y range [min, max]; default: the data range, rounded to nice ticks. */
  yRange?: [number, number];
  /** Explicit x tick positions (in x units); default: d3-scale ticks. */
  xTicks?: number[];
  /**
   * Start the automatic y range at zero (for ratio-scale quantities such as A_e/T_sys, where a
   * truncated axis makes a small relative change look large). Ignored with `yRange`.
   * @defaultValue false
   */
  yFromZero?: boolean;
}

function dataRange(traces: readonly LineTrace[], key: 'x' | 'y'): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const t of traces) {
    const a = t[key];
    for (let i = 0; i < a.length; i++) {
      const v = a[i];
      if (Number.isFinite(v)) { if (v < lo) lo = v; if (v > hi) hi = v; }
    }
  }
  if (!Number.isFinite(lo)) throw new DomainError(`invalid argument "traces": no finite ${key} values to plot.`);
  if (lo === hi) { lo -= 1; hi += 1; }
  return [lo, hi];
}

function withZero(r: [number, number], on: boolean): [number, number] {
  return on ? [Math.min(0, r[0]), Math.max(0, r[1])] : r;
}

function checkRange(name: string, r: [number, number] | undefined): void {
  if (r === undefined) return;
  if (!Array.isArray(r) || r.length !== 2) throw new DimensionError(`invalid argument "${name}": expected [min, max], received ${String(r)}.`);
  assertFinite(`${name}[0]`, r[0]);
  assertFinite(`${name}[1]`, r[1]);
  if (!(r[1] > r[0])) throw new DomainError(`invalid argument "${name}": expected min < max, received [${r[0]}, ${r[1]}].`);
}

/**
 * A line plot of one or more traces as an SVG string.
 *
 * @remarks
 * Linear axes with d3-scale "nice" ticks; each trace is one `<path class="trace">`
 * carrying `data-label` and `data-points` attributes (the number of plotted
 * points) so that tests and tools can read it back. Points are drawn in x order.
 * Sparse traces (≤ 15 points) and traces lying on the frame's edge get markers; a
 * trace that coincides with an earlier one is dashed, marked with squares and named
 * "(coincides with …)" in the legend. The legend goes where the data are not (the
 * free corner or edge of the plot area, else a band below the plot). Values outside
 * a fixed range are clipped to the plot area. Deterministic output.
 * @param options - Traces, axis labels (with units) and frame options.
 * @returns SVG markup.
 * @throws `DimensionError` on mismatched trace lengths; `DomainError` on ±Infinity data or invalid ranges.
 * @category Plots
 */
export function linePlotSvg(options: LinePlotOptions): string {
  const { traces, xLabel, yLabel } = options;
  if (!Array.isArray(traces) || traces.length === 0) throw new DimensionError('invalid argument "traces": expected at least one trace.');
  traces.forEach((t, i) => {
    checkSeries(`traces[${i}].x`, t.x);
    checkSeries(`traces[${i}].y`, t.y, t.x.length, true);
    for (let k = 0; k < t.y.length; k++) {
      if (t.y[k] === Infinity || t.y[k] === -Infinity) throw new DomainError(`invalid argument "traces[${i}].y": entry ${k} is infinite; clamp it (e.g. to a dB floor) first.`);
    }
  });
  checkRange('xRange', options.xRange);
  checkRange('yRange', options.yRange);
  const f = resolveFrame(options, { width: 640, height: 400 });
  const a = makeArea(f, options.xRange ?? dataRange(traces, 'x'), options.yRange ?? withZero(dataRange(traces, 'y'), options.yFromZero === true), options.xRange === undefined, options.yRange === undefined);
  const clip = clipId('plot-area', [a.left, a.top, a.right - a.left, a.bottom - a.top]);
  const body: string[] = [`<clipPath id="${clip}"><rect x="${fmt(a.left)}" y="${fmt(a.top)}" width="${fmt(a.right - a.left)}" height="${fmt(a.bottom - a.top)}"/></clipPath>`];
  // Points in x order (an unsorted angle list would draw zig-zags), in pixels.
  const px = traces.map((t) => {
    const idx = Array.from({ length: t.x.length }, (_, k) => k).filter((k) => Number.isFinite(t.x[k])).sort((p, q) => t.x[p] - t.x[q]);
    return idx.map((k) => (Number.isFinite(t.y[k]) ? [Math.round(a.x(t.x[k]) * 100) / 100, Math.round(a.y(t.y[k]) * 100) / 100] : null));
  });
  // A trace drawn exactly over an earlier one (within half a pixel everywhere) is dashed, marked and named in the legend.
  const coincides = px.map((p, j) => px.slice(0, j).findIndex((q) => q.length === p.length && p.length > 0
    && p.every((v, k) => (v === null) === (q[k] === null) && (v === null || (Math.abs(v[0] - (q[k] as number[])[0]) < 0.5 && Math.abs(v[1] - (q[k] as number[])[1]) < 0.5)))));
  const entries: LegendEntry[] = [];
  const dataPx: number[] = [];
  traces.forEach((t, i) => {
    const color = TRACE_COLORS[i % TRACE_COLORS.length];
    const pts = px[i];
    const finite = pts.filter((v): v is number[] => v !== null);
    // Markers where a line alone could hide: sparse series, traces on the frame's edge, coincident traces.
    const onEdge = finite.length > 0 && finite.every((v) => Math.abs(v[1] - a.bottom) < 1 || Math.abs(v[1] - a.top) < 1);
    const twin = coincides[i] >= 0;
    const marker: 'circle' | 'square' | undefined = twin ? 'square' : finite.length <= 15 || onEdge ? 'circle' : undefined;
    const dash = twin ? '7 4' : undefined;
    let d = '', pen = false;
    for (const v of pts) {
      if (v === null) { pen = false; continue; }
      d += `${pen ? 'L' : 'M'}${fmt(v[0])},${fmt(v[1])}`;
      pen = true;
    }
    body.push(`<path class="trace" data-label="${esc(t.label)}" data-points="${finite.length}" d="${d}" fill="none" stroke="${color}" stroke-width="1.6"${dash ? ` stroke-dasharray="${dash}"` : ''} clip-path="url(#${clip})"/>`);
    if (marker) for (const v of finite) body.push(markerSvg(marker, v[0], v[1], color));
    // Pixel samples along the trace (every ~4 px) for the legend placement.
    for (let k = 0; k < pts.length; k++) {
      const v = pts[k], w = pts[k + 1];
      if (v === null) continue;
      dataPx.push(v[0], v[1]);
      if (w === undefined || w === null) continue;
      const steps = Math.ceil(Math.hypot(w[0] - v[0], w[1] - v[1]) / 4);
      for (let s = 1; s < steps; s++) dataPx.push(v[0] + ((w[0] - v[0]) * s) / steps, v[1] + ((w[1] - v[1]) * s) / steps);
    }
    entries.push({ label: twin ? `${t.label} (coincides with ${traces[coincides[i]].label})` : t.label, color, dash, marker });
  });
  const legend = placeLegend(f, a, entries, dataPx);
  const frame = legend.extraHeight > 0 ? { ...f, height: f.height + legend.extraHeight } : f;
  return [openSvg(frame, 'line plot'), drawAxes(f, a, xLabel, yLabel, 8, 6, options.xTicks), ...body, legend.svg, '</svg>'].join('');
}

/**
 * One pattern cut in decibels.
 * @category Plots
 */
export interface PatternCutTrace {
  /** Legend label. */
  label: string;
  /** Angles of the cut [rad] (θ, or any angle the x label names). */
  angleRad: ArrayLike<number>;
  /** Pattern values [dB] (power ratio, typically normalised to 0 dB peak); −Infinity (a null) is drawn at the floor. */
  valueDb: ArrayLike<number>;
}

/**
 * Options of {@link patternCutSvg}.
 * @category Plots
 */
export interface PatternCutOptions extends PlotFrameOptions {
  /** Cuts to draw. */
  traces: readonly PatternCutTrace[];
  /**
   * Lowest level shown [dB]; values below are drawn at the floor.
   * @defaultValue -50
   */
  floorDb?: number;
  /**
   * Highest level shown [dB].
   * @defaultValue the largest value rounded up to 5 dB
   */
  ceilingDb?: number;
  /**
   * Axis title for the angle (shown in degrees).
   * @defaultValue 'θ [deg]'
   */
  angleLabel?: string;
  /**
   * Axis title for the level.
   * @defaultValue 'relative power [dB]'
   */
  levelLabel?: string;
}

/**
 * Rectangular pattern cut(s) in dB against angle in degrees, with a floor.
 * @param options - Cuts, floor and labels.
 * @returns SVG markup (see {@link linePlotSvg} for the structure).
 * @throws `DomainError` if the floor is not below the ceiling or data are NaN.
 * @category Plots
 */
export function patternCutSvg(options: PatternCutOptions): string {
  const floor = options.floorDb ?? -50;
  assertFinite('floorDb', floor);
  let top = options.ceilingDb;
  options.traces.forEach((t, i) => {
    checkSeries(`traces[${i}].angleRad`, t.angleRad);
    checkSeries(`traces[${i}].valueDb`, t.valueDb, t.angleRad.length, true);
    for (let k = 0; k < t.valueDb.length; k++) if (Number.isNaN(t.valueDb[k])) throw new DomainError(`invalid argument "traces[${i}].valueDb": entry ${k} is NaN.`);
  });
  if (top === undefined) {
    let m = -Infinity;
    for (const t of options.traces) for (let k = 0; k < t.valueDb.length; k++) m = Math.max(m, t.valueDb[k]);
    top = Number.isFinite(m) ? Math.ceil(m / 5) * 5 : 0;
    if (top <= floor) top = floor + 10;
  }
  assertFinite('ceilingDb', top);
  if (!(top > floor)) throw new DomainError(`invalid argument "floorDb": expected a floor below the ceiling ${top} dB, received ${floor} dB.`);
  const traces: LineTrace[] = options.traces.map((t) => ({
    label: t.label,
    x: Array.from(t.angleRad, (r) => (r * 180) / Math.PI),
    y: Array.from(t.valueDb, (v) => Math.min(Math.max(v, floor), top as number)),
  }));
  let xlo = Infinity, xhi = -Infinity;
  for (const t of traces) for (const v of t.x as number[]) { xlo = Math.min(xlo, v); xhi = Math.max(xhi, v); }
  if (xlo === xhi) { xlo -= 1; xhi += 1; }
  return linePlotSvg({
    ...options,
    traces,
    xLabel: options.angleLabel ?? 'θ [deg]',
    yLabel: options.levelLabel ?? 'relative power [dB]',
    xRange: [xlo, xhi],
    yRange: [floor, top],
    xTicks: angleTicksDeg(xlo, xhi),
  });
}
