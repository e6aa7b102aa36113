/**
 * Polar pattern cuts.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite } from '../internal/validate.js';
import type { PatternCutTrace } from './line.js';
import { type PlotFrameOptions, TRACE_COLORS, checkSeries, drawCornerLegend, esc, fmt, openSvg, resolveFrame } from './svg.js';

/**
 * Options of {@link polarCutSvg}.
 * @category Plots
 */
export interface PolarCutOptions extends PlotFrameOptions {
  /** Cuts to draw; the angle is measured from the vertical (boresight up), increasing clockwise. */
  traces: readonly PatternCutTrace[];
  /**
   * Level at the centre of the chart [dB].
   * @defaultValue -40
   */
  floorDb?: number;
  /**
   * Level of the outer ring [dB].
   * @defaultValue 0
   */
  ceilingDb?: number;
  /**
   * Spacing of the level rings [dB].
   * @defaultValue 10
   */
  ringStepDb?: number;
}

/**
 * Polar pattern cut(s) in dB: radius linear in dB from the floor (centre) to
 * the ceiling (outer ring); boresight (angle 0) points up.
 * @param options - Cuts, levels and frame options.
 * @returns SVG markup; each cut is a `<path class="trace">` with `data-points`.
 * @throws `DomainError` on NaN levels or a floor not below the ceiling.
 * @category Plots
 */
export function polarCutSvg(options: PolarCutOptions): string {
  const floor = options.floorDb ?? -40;
  const ceil = options.ceilingDb ?? 0;
  const step = options.ringStepDb ?? 10;
  assertFinite('floorDb', floor);
  assertFinite('ceilingDb', ceil);
  if (!(ceil > floor)) throw new DomainError(`invalid argument "floorDb": expected a floor below the ceiling ${ceil} dB, received ${floor} dB.`);
  if (!(step > 0)) throw new DomainError(`invalid argument "ringStepDb": expected > 0, received ${step}.`);
  const f = resolveFrame(options, { width: 480, height: 480 });
  const cx = f.width / 2;
  const top = (f.title ? f.fontSize * 3 : f.fontSize * 1.5) + f.fontSize * 0.6;
  const r0 = Math.min(f.width / 2 - f.fontSize * 3, (f.height - top - f.fontSize * 2) / 2);
  const cy = top + f.fontSize + r0;
  const rad = (db: number) => (r0 * (Math.min(Math.max(db, floor), ceil) - floor)) / (ceil - floor);
  const parts = [openSvg(f, 'polar pattern cut'), '<g class="axes">'];
  for (let db = ceil; db > floor - 1e-9; db -= step) {
    parts.push(`<circle class="ring" data-value="${db}" cx="${fmt(cx)}" cy="${fmt(cy)}" r="${fmt(rad(db))}" fill="none" stroke="#dfe3e8"/>`);
    parts.push(`<text class="ring-label" x="${fmt(cx + 3)}" y="${fmt(cy - rad(db) - 2)}" fill="#555" font-size="${fmt(f.fontSize * 0.85)}">${db} dB</text>`);
  }
  for (let deg = 0; deg < 360; deg += 30) {
    const a = (deg * Math.PI) / 180;
    const x = cx + r0 * Math.sin(a), y = cy - r0 * Math.cos(a);
    parts.push(`<line class="spoke" x1="${fmt(cx)}" y1="${fmt(cy)}" x2="${fmt(x)}" y2="${fmt(y)}" stroke="#eceff2"/>`);
    const lx = cx + (r0 + f.fontSize * 1.2) * Math.sin(a), ly = cy - (r0 + f.fontSize * 1.2) * Math.cos(a) + f.fontSize * 0.35;
    parts.push(`<text class="tick-angle" x="${fmt(lx)}" y="${fmt(ly)}" text-anchor="middle" fill="#333">${deg > 180 ? deg - 360 : deg}°</text>`);
  }
  parts.push('</g>');
  options.traces.forEach((t, i) => {
    checkSeries(`traces[${i}].angleRad`, t.angleRad);
    checkSeries(`traces[${i}].valueDb`, t.valueDb, t.angleRad.length, true);
    let d = '';
    for (let k = 0; k < t.angleRad.length; k++) {
      const v = t.valueDb[k];
      if (Number.isNaN(v)) throw new DomainError(`invalid argument "traces[${i}].valueDb": entry ${k} is NaN.`);
      const r = rad(v);
      const a = t.angleRad[k];
      d += `${k === 0 ? 'M' : 'L'}${fmt(cx + r * Math.sin(a))},${fmt(cy - r * Math.cos(a))}`;
    }
    parts.push(`<path class="trace" data-label="${esc(t.label)}" data-points="${t.angleRad.length}" d="${d}" fill="none" stroke="${TRACE_COLORS[i % TRACE_COLORS.length]}" stroke-width="1.6"/>`);
  });
  if (options.traces.length > 1) parts.push(drawCornerLegend(f, options.traces.map((t) => t.label)));
  parts.push('</svg>');
  return parts.join('');
}
