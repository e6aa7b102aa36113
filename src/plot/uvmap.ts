/**
 * u-v maps: a raster of a pattern over direction cosines with a colour bar.
 * @module
 */
import { encode } from 'fast-png';
import { scaleLinear } from 'd3-scale';
import { interpolateViridis } from 'd3-scale-chromatic';
import { color as parseColor } from 'd3-color';
import { DimensionError, DomainError } from '../errors.js';
import { assertFinite } from '../internal/validate.js';
import { type PlotFrameOptions, base64, checkSeries, esc, fmt, openSvg, resolveFrame, tickText } from './svg.js';

/**
 * Options of {@link uvMapSvg}.
 * @category Plots
 */
export interface UvMapOptions extends PlotFrameOptions {
  /** u sample positions, ascending, length nu (direction cosine, dimensionless). */
  u: ArrayLike<number>;
  /** v sample positions, ascending, length nv. */
  v: ArrayLike<number>;
  /** Pattern values [dB], row-major nv×nu (row j is v[j]); NaN marks points outside the visible region (drawn transparent). */
  valueDb: ArrayLike<number>;
  /**
   * Level mapped to the bottom of the colour scale [dB]; lower values are clamped.
   * @defaultValue -40
   */
  floorDb?: number;
  /**
   * Level mapped to the top of the colour scale [dB].
   * @defaultValue 0
   */
  ceilingDb?: number;
  /**
   * Draw the unit circle u² + v² = 1 (the visible-region boundary).
   * @defaultValue true
   */
  showVisibleCircle?: boolean;
}

/**
 * The colour of a level on the u-v map colour scale (viridis, a perceptually
 * uniform map: van der Walt & Smith, matplotlib colormaps, 2015), as 8-bit RGB.
 * @param valueDb - Level [dB].
 * @param floorDb - Level at the bottom of the scale [dB].
 * @param ceilingDb - Level at the top of the scale [dB].
 * @returns `[r, g, b]`, each 0–255.
 * @category Plots
 */
export function uvMapColor(valueDb: number, floorDb: number, ceilingDb: number): [number, number, number] {
  const t = Math.min(Math.max((valueDb - floorDb) / (ceilingDb - floorDb), 0), 1);
  const c = parseColor(interpolateViridis(t))?.rgb();
  if (!c) throw new DomainError(`invalid level ${valueDb} dB for the colour scale.`);
  return [Math.round(c.r), Math.round(c.g), Math.round(c.b)];
}

/**
 * A u-v map of a pattern in dB as an SVG with an embedded PNG raster (one
 * pixel per sample, nearest-neighbour scaled), labelled axes and a colour bar.
 * @param options - Sample grid, values, levels and frame options.
 * @returns SVG markup; the raster is `<image class="raster">` with a base64 PNG, the colour bar `<g class="colorbar">`.
 * @throws `DimensionError` if `valueDb.length !== nu·nv`; `DomainError` on ±Infinity values.
 * @category Plots
 */
export function uvMapSvg(options: UvMapOptions): string {
  const { u, v, valueDb } = options;
  checkSeries('u', u);
  checkSeries('v', v);
  const nu = u.length, nv = v.length;
  if (nu < 2 || nv < 2) throw new DimensionError(`invalid arguments "u", "v": expected at least 2 samples each, received ${nu} and ${nv}.`);
  checkSeries('valueDb', valueDb, nu * nv, true);
  const floor = options.floorDb ?? -40;
  const ceil = options.ceilingDb ?? 0;
  assertFinite('floorDb', floor);
  assertFinite('ceilingDb', ceil);
  if (!(ceil > floor)) throw new DomainError(`invalid argument "floorDb": expected a floor below the ceiling ${ceil} dB, received ${floor} dB.`);
  const rgba = new Uint8Array(4 * nu * nv);
  for (let j = 0; j < nv; j++) {
    const row = nv - 1 - j; // image rows go top-down; v increases upward
    for (let i = 0; i < nu; i++) {
      const val = valueDb[j * nu + i];
      const p = 4 * (row * nu + i);
      if (Number.isNaN(val)) continue;
      if (val === Infinity) throw new DomainError(`invalid argument "valueDb": entry ${j * nu + i} is +Infinity.`);
      const [r, g, b] = uvMapColor(val, floor, ceil);
      rgba[p] = r; rgba[p + 1] = g; rgba[p + 2] = b; rgba[p + 3] = 255;
    }
  }
  const png = encode({ width: nu, height: nv, data: rgba, channels: 4, depth: 8 });
  const f = resolveFrame(options, { width: 560, height: 480 });
  // Room for the title and, below it, the colour bar's unit label.
  const top = f.title ? f.fontSize * 3.6 : f.fontSize * 1.8;
  const barW = f.fontSize * 1.2;
  const side = Math.min(f.width - f.fontSize * 11 - barW, f.height - top - f.fontSize * 4);
  const left = f.fontSize * 4.5;
  const bottom = top + side;
  const u0 = u[0], u1 = u[nu - 1], v0 = v[0], v1 = v[nv - 1];
  const sx = (x: number) => left + ((x - u0) / (u1 - u0)) * side;
  const sy = (y: number) => bottom - ((y - v0) / (v1 - v0)) * side;
  const parts = [openSvg(f, 'u-v map')];
  parts.push(`<image class="raster" x="${fmt(left)}" y="${fmt(top)}" width="${fmt(side)}" height="${fmt(side)}" preserveAspectRatio="none" style="image-rendering:pixelated" href="data:image/png;base64,${base64(png)}"/>`);
  parts.push(`<rect class="frame" x="${fmt(left)}" y="${fmt(top)}" width="${fmt(side)}" height="${fmt(side)}" fill="none" stroke="#59616b"/>`);
  if (options.showVisibleCircle ?? true) {
    parts.push(`<ellipse class="visible-circle" cx="${fmt(sx(0))}" cy="${fmt(sy(0))}" rx="${fmt(Math.abs(sx(1) - sx(0)))}" ry="${fmt(Math.abs(sy(1) - sy(0)))}" fill="none" stroke="#ffffff" stroke-dasharray="4 3"/>`);
  }
  const ticks = [u0, (u0 + u1) / 2, u1];
  for (const t of ticks) parts.push(`<text class="tick-x" data-value="${t}" x="${fmt(sx(t))}" y="${fmt(bottom + f.fontSize * 1.3)}" text-anchor="middle" fill="#333">${tickText(t.toFixed(2))}</text>`);
  for (const t of [v0, (v0 + v1) / 2, v1]) parts.push(`<text class="tick-y" data-value="${t}" x="${fmt(left - 4)}" y="${fmt(sy(t) + f.fontSize * 0.35)}" text-anchor="end" fill="#333">${tickText(t.toFixed(2))}</text>`);
  parts.push(`<text class="label-x" x="${fmt(left + side / 2)}" y="${fmt(bottom + f.fontSize * 2.8)}" text-anchor="middle">u = sinθ cosφ</text>`);
  parts.push(`<text class="label-y" x="${fmt(f.fontSize * 1.2)}" y="${fmt(top + side / 2)}" text-anchor="middle" transform="rotate(-90 ${fmt(f.fontSize * 1.2)} ${fmt(top + side / 2)})">v = sinθ sinφ</text>`);
  // Colour bar: vertical gradient of discrete steps, labelled in dB.
  const bx = left + side + f.fontSize * 1.5;
  const steps = 64;
  parts.push(`<g class="colorbar" data-floor="${floor}" data-ceiling="${ceil}">`);
  for (let s = 0; s < steps; s++) {
    const lv = floor + ((s + 0.5) / steps) * (ceil - floor);
    const [r, g, b] = uvMapColor(lv, floor, ceil);
    const y = bottom - ((s + 1) / steps) * side;
    parts.push(`<rect x="${fmt(bx)}" y="${fmt(y)}" width="${fmt(barW)}" height="${fmt(side / steps + 0.5)}" fill="rgb(${r},${g},${b})"/>`);
  }
  for (const lv of scaleLinear().domain([floor, ceil]).ticks(5)) {
    const y = bottom - ((lv - floor) / (ceil - floor)) * side;
    parts.push(`<text class="colorbar-tick" data-value="${lv}" x="${fmt(bx + barW + 4)}" y="${fmt(y + f.fontSize * 0.35)}" fill="#333">${esc(tickText(String(lv)))}</text>`);
  }
  parts.push(`<text class="colorbar-label" x="${fmt(bx + barW / 2)}" y="${fmt(top - 4)}" text-anchor="middle" fill="#222">dB</text></g>`);
  parts.push('</svg>');
  return parts.join('');
}
