/**
 * Shared SVG building blocks for the plot module: frames, escaping, number
 * formatting, axes and the trace palette. Deterministic: the same input
 * always gives the same bytes.
 * @module
 */
import { scaleLinear, type ScaleLinear } from 'd3-scale';
import { DimensionError, DomainError } from '../errors.js';
import { assertInteger, assertPositive } from '../internal/validate.js';

/**
 * Size and typography options shared by every plot.
 * @category Plots
 */
export interface PlotFrameOptions {
  /**
   * Width of the SVG [px].
   * @defaultValue 640
   */
  widthPx?: number;
  /**
   * Height of the SVG [px].
   * @defaultValue 400
   */
  heightPx?: number;
  /**
   * CSS font family for all text.
   * @defaultValue 'system-ui, sans-serif'
   */
  fontFamily?: string;
  /**
   * Base font size [px].
   * @defaultValue 12
   */
  fontSizePx?: number;
  /** Title drawn above the plot area; omitted when absent. */
  title?: string;
}

/** Resolved frame geometry. @internal */
export interface Frame {
  width: number;
  height: number;
  font: string;
  fontSize: number;
  title: string | undefined;
}

/**
 * The phasewise trace palette (our own choice of hues, spaced for
 * distinguishability on white).
 * @category Plots
 */
export const TRACE_COLORS: readonly string[] = ['#1f5f8b', '#c2423f', '#3f8f5a', '#b07d1a', '#6b4c9a', '#2b8c8c', '#8a5a44', '#555555'];

/** @internal */
export function resolveFrame(o: PlotFrameOptions, defaults: { width: number; height: number }): Frame {
  const width = o.widthPx ?? defaults.width;
  const height = o.heightPx ?? defaults.height;
  assertInteger('widthPx', width, 120, 10000);
  assertInteger('heightPx', height, 120, 10000);
  const fontSize = o.fontSizePx ?? 12;
  assertPositive('fontSizePx', fontSize, 'px');
  return { width, height, font: o.fontFamily ?? 'system-ui, sans-serif', fontSize, title: o.title };
}

/** Escapes text for XML content and attributes. @internal */
export function esc(s: string): string {
  return s.replace(/&/g, '&amp;').replace(/</g, '&lt;').replace(/>/g, '&gt;').replace(/"/g, '&quot;').replace(/'/g, '&#39;');
}

/** Fixed-precision number for coordinates (2 decimals, no "-0"). @internal */
export function fmt(x: number): string {
  const r = Math.round(x * 100) / 100;
  return (Object.is(r, -0) ? 0 : r).toString();
}

/**
 * Id of a clip path, built from its geometry (the numbers as {@link fmt} writes them). Several
 * plots inlined in one HTML document share one id space, so a fixed id would make every plot
 * clip to the first plot's shape; ids built from the geometry differ whenever the shapes do,
 * and the output stays deterministic. @internal
 */
export function clipId(prefix: string, geometry: readonly number[]): string {
  return `${prefix}-${geometry.map((x) => fmt(x).replace('-', 'm').replace('.', 'p')).join('_')}`;
}

/**
 * Title font size: 1.2 × the base size, reduced (down to 0.8 ×) so that a long title fits the
 * width; average glyph width of a bold sans-serif face taken as 0.6 em. @internal
 */
function titleFontSize(f: Frame): number {
  const fit = (f.width - 16) / (0.6 * (f.title ?? '').length);
  return Math.max(0.8 * f.fontSize, Math.min(1.2 * f.fontSize, fit));
}

/** Tick text with a true minus sign (U+2212), as the line plots' d3 formatter writes it. @internal */
export function tickText(s: string): string {
  return s.replace(/^-/, '−');
}

/** Opening tag of a plot SVG with background and font. @internal */
export function openSvg(f: Frame, role: string): string {
  return (
    `<svg xmlns="http://www.w3.org/2000/svg" width="${f.width}" height="${f.height}" viewBox="0 0 ${f.width} ${f.height}" ` +
    `font-family="${esc(f.font)}" font-size="${fmt(f.fontSize)}" role="img" aria-label="${esc(f.title ?? role)}">` +
    `<rect x="0" y="0" width="${f.width}" height="${f.height}" fill="#ffffff"/>` +
    (f.title ? `<text class="title" x="${fmt(f.width / 2)}" y="${fmt(f.fontSize * 1.6)}" text-anchor="middle" font-size="${fmt(titleFontSize(f))}" font-weight="600">${esc(f.title)}</text>` : '')
  );
}

/** Validates a numeric series (finite entries, given length). @internal */
export function checkSeries(name: string, x: ArrayLike<number>, n?: number, allowNonFinite = false): void {
  if (x === null || typeof x !== 'object' || typeof x.length !== 'number') {
    throw new DimensionError(`invalid argument "${name}": expected an array of numbers, received ${typeof x}.`);
  }
  if (n !== undefined && x.length !== n) {
    throw new DimensionError(`invalid argument "${name}": expected ${n} values (one per abscissa), received ${x.length}.`);
  }
  if (!allowNonFinite) {
    for (let i = 0; i < x.length; i++) {
      if (!Number.isFinite(x[i])) throw new DomainError(`invalid argument "${name}": entry ${i} is ${x[i]}; plot data must be finite.`);
    }
  }
}

/** A rectangular plot area with linear x and y scales. @internal */
export interface Area {
  left: number;
  top: number;
  right: number;
  bottom: number;
  x: ScaleLinear<number, number>;
  y: ScaleLinear<number, number>;
}

/** Builds the plot area for given domains. @internal */
/** Angle ticks [deg] at a step from 5, 10, 15, 30, 45, 60, 90 giving at most `maxCount` ticks. @internal */
export function angleTicksDeg(lo: number, hi: number, maxCount = 13): number[] {
  const steps = [1, 2, 5, 10, 15, 30, 45, 60, 90, 180];
  const step = steps.find((s) => Math.floor(hi / s) - Math.ceil(lo / s) + 1 <= maxCount) ?? 180;
  const out: number[] = [];
  for (let k = Math.ceil(lo / step); k * step <= hi + 1e-9; k++) out.push(k * step);
  return out;
}

export function makeArea(f: Frame, xDomain: [number, number], yDomain: [number, number], niceX: boolean, niceY: boolean = niceX): Area {
  const y = scaleLinear().domain(yDomain);
  if (niceY) y.nice();
  // Left margin: the widest y tick label plus room for the rotated axis title.
  const fmtY = y.tickFormat(6);
  const widest = Math.max(0, ...y.ticks(6).map((t) => fmtY(t).length));
  const left = Math.round(Math.max(f.fontSize * 5, f.fontSize * (0.62 * widest + 2.9)));
  const right = f.width - Math.round(f.fontSize * 1.5);
  const top = Math.round(f.title ? f.fontSize * 3 : f.fontSize * 1.5);
  const bottom = f.height - Math.round(f.fontSize * 3.5);
  const x = scaleLinear().domain(xDomain).range([left, right]);
  if (niceX) x.nice();
  y.range([bottom, top]);
  return { left, top, right, bottom, x, y };
}

/** Gridlines, tick labels and axis titles of a rectangular area. @internal */
export function drawAxes(f: Frame, a: Area, xLabel: string, yLabel: string, xTickCount = 8, yTickCount = 6, xTicks?: number[]): string {
  const parts: string[] = ['<g class="axes" stroke-linecap="square">'];
  const xt = xTicks ?? a.x.ticks(xTickCount);
  const yt = a.y.ticks(yTickCount);
  for (const t of xt) {
    const px = fmt(a.x(t));
    parts.push(`<line class="grid-x" x1="${px}" x2="${px}" y1="${fmt(a.top)}" y2="${fmt(a.bottom)}" stroke="#e3e6ea"/>`);
    parts.push(`<text class="tick-x" data-value="${t}" x="${px}" y="${fmt(a.bottom + f.fontSize * 1.3)}" text-anchor="middle" fill="#333">${esc(a.x.tickFormat(xTickCount)(t))}</text>`);
  }
  for (const t of yt) {
    const py = fmt(a.y(t));
    parts.push(`<line class="grid-y" x1="${fmt(a.left)}" x2="${fmt(a.right)}" y1="${py}" y2="${py}" stroke="#e3e6ea"/>`);
    parts.push(`<text class="tick-y" data-value="${t}" x="${fmt(a.left - f.fontSize * 0.5)}" y="${fmt(a.y(t) + f.fontSize * 0.35)}" text-anchor="end" fill="#333">${esc(a.y.tickFormat(yTickCount)(t))}</text>`);
  }
  parts.push(`<rect class="frame" x="${fmt(a.left)}" y="${fmt(a.top)}" width="${fmt(a.right - a.left)}" height="${fmt(a.bottom - a.top)}" fill="none" stroke="#59616b"/>`);
  parts.push(`<text class="label-x" x="${fmt((a.left + a.right) / 2)}" y="${fmt(f.height - f.fontSize * 0.8)}" text-anchor="middle" fill="#222">${esc(xLabel)}</text>`);
  const cy = (a.top + a.bottom) / 2;
  parts.push(`<text class="label-y" x="${fmt(f.fontSize * 1.2)}" y="${fmt(cy)}" text-anchor="middle" fill="#222" transform="rotate(-90 ${fmt(f.fontSize * 1.2)} ${fmt(cy)})">${esc(yLabel)}</text>`);
  parts.push('</g>');
  return parts.join('');
}

/**
 * How a legend entry is drawn: its colour, an optional dash pattern and marker, or (`area`) a
 * filled swatch for a region. @internal
 */
export interface LegendEntry {
  label: string;
  color: string;
  dash?: string;
  marker?: 'circle' | 'square';
  /** Fill opacity of a region swatch (a filled rectangle instead of a line). */
  area?: number;
}

/** A marker glyph centred at (x, y). @internal */
export function markerSvg(kind: 'circle' | 'square', x: number, y: number, color: string, cls = 'marker'): string {
  return kind === 'circle'
    ? `<circle class="${cls}" cx="${fmt(x)}" cy="${fmt(y)}" r="3" fill="#ffffff" stroke="${color}" stroke-width="1.5"/>`
    : `<rect class="${cls}" x="${fmt(x - 3)}" y="${fmt(y - 3)}" width="6" height="6" fill="${color}" stroke="${color}"/>`;
}

/** Width and height [px] of a legend box for the entries. @internal */
export function legendSize(f: Frame, entries: readonly LegendEntry[]): { w: number; h: number } {
  return { w: Math.max(...entries.map((e) => e.label.length)) * f.fontSize * 0.6 + f.fontSize * 3, h: f.fontSize * 1.4 * entries.length + 6 };
}

/** A legend box with its top-left corner at (x0, y0): one mark and label per entry. @internal */
export function legendBoxSvg(f: Frame, x0: number, y0: number, entries: readonly LegendEntry[]): string {
  const { w, h } = legendSize(f, entries);
  const lh = f.fontSize * 1.4;
  const parts = [`<g class="legend"><rect class="legend-box" x="${fmt(x0)}" y="${fmt(y0)}" width="${fmt(w)}" height="${fmt(h)}" fill="#ffffff" fill-opacity="0.9" stroke="#c5cad1"/>`];
  entries.forEach((e, i) => {
    const y = y0 + 3 + lh * (i + 0.5);
    const x1 = x0 + 6, x2 = x0 + 6 + f.fontSize * 1.6;
    if (e.area !== undefined) {
      parts.push(`<rect class="legend-mark" x="${fmt(x1)}" y="${fmt(y - f.fontSize * 0.4)}" width="${fmt(x2 - x1)}" height="${fmt(f.fontSize * 0.8)}" fill="${e.color}" fill-opacity="${e.area}" stroke="${e.color}"${e.dash ? ` stroke-dasharray="${e.dash}"` : ''}/>`);
    } else {
      parts.push(`<line class="legend-mark" x1="${fmt(x1)}" x2="${fmt(x2)}" y1="${fmt(y)}" y2="${fmt(y)}" stroke="${e.color}" stroke-width="2"${e.dash ? ` stroke-dasharray="${e.dash}"` : ''}/>`);
    }
    if (e.marker) parts.push(markerSvg(e.marker, (x1 + x2) / 2, y, e.color, 'legend-marker'));
    parts.push(`<text x="${fmt(x0 + 10 + f.fontSize * 1.6)}" y="${fmt(y + f.fontSize * 0.35)}" fill="#222">${esc(e.label)}</text>`);
  });
  parts.push('</g>');
  return parts.join('');
}

/** How many of the points (x, y pairs [px]) lie in the box, with a 3 px margin. @internal */
export function pointsInBox(px: ArrayLike<number>, x: number, y: number, w: number, h: number): number {
  let n = 0;
  for (let i = 0; i + 1 < px.length; i += 2) {
    if (px[i] >= x - 3 && px[i] <= x + w + 3 && px[i + 1] >= y - 3 && px[i + 1] <= y + h + 3) n++;
  }
  return n;
}

/**
 * Legend box placed where the data are not: the corner (or edge midpoint) of the plot area
 * that covers the fewest data points (pixel samples along every trace); when every place
 * inside covers data, below the plot, in a band the SVG is made taller for.
 * @returns The markup and the extra height [px] the frame needs (0 when inside).
 * @internal
 */
export function placeLegend(f: Frame, a: Area, entries: readonly LegendEntry[], dataPx: ArrayLike<number>): { svg: string; extraHeight: number } {
  if (entries.length < 2) return { svg: '', extraHeight: 0 };
  const { w, h } = legendSize(f, entries);
  const pad = 6;
  const xs = [a.right - w - pad, a.left + pad, (a.left + a.right - w) / 2];
  const ys = [a.top + pad, a.bottom - h - pad, (a.top + a.bottom - h) / 2];
  let best = { x: xs[0], y: ys[0], n: Infinity };
  for (const y of ys) {
    for (const x of xs) {
      const n = pointsInBox(dataPx, x, y, w, h);
      if (n < best.n) best = { x, y, n };
    }
  }
  let extraHeight = 0;
  if (best.n > 0) {
    // Nowhere free inside: a band under the x-axis title.
    extraHeight = Math.ceil(h + pad);
    best = { x: (a.left + a.right - w) / 2, y: f.height, n: 0 };
  }
  return { svg: legendBoxSvg(f, best.x, best.y, entries), extraHeight };
}

/** Base64 of bytes without Node's Buffer (browser-safe). @internal */
export function base64(bytes: Uint8Array): string {
  const alphabet = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789+/';
  let out = '';
  let i = 0;
  for (; i + 2 < bytes.length; i += 3) {
    const n = (bytes[i] << 16) | (bytes[i + 1] << 8) | bytes[i + 2];
    out += alphabet[(n >> 18) & 63] + alphabet[(n >> 12) & 63] + alphabet[(n >> 6) & 63] + alphabet[n & 63];
  }
  const rest = bytes.length - i;
  if (rest === 1) {
    const n = bytes[i] << 16;
    out += alphabet[(n >> 18) & 63] + alphabet[(n >> 12) & 63] + '==';
  } else if (rest === 2) {
    const n = (bytes[i] << 16) | (bytes[i + 1] << 8);
    out += alphabet[(n >> 18) & 63] + alphabet[(n >> 12) & 63] + alphabet[(n >> 6) & 63] + '=';
  }
  return out;
}

/** Legend as coloured labels stacked in the bottom-left corner (for round charts). @internal */
export function drawCornerLegend(f: Frame, labels: readonly string[]): string {
  return labels.map((l, i) => `<text class="legend-entry" x="${fmt(f.fontSize)}" y="${fmt(f.height - f.fontSize * (labels.length - i))}" fill="${TRACE_COLORS[i % TRACE_COLORS.length]}">${esc(l)}</text>`).join('');
}
