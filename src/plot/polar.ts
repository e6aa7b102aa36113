/**
 * Polar pattern cuts.
 * @module
 */
import { DomainError } from '../errors.js';
import { assertFinite } from '../internal/validate.js';
import type { PatternCutTrace } from './line.js';
import { type PlotFrameOptions, TRACE_COLORS, checkSeries, drawCornerLegend, esc, fmt, openSvg, pointsInBox, resolveFrame } from './svg.js';

/**
 * Options of {@link polarCutSvg}.
 * @category Plots
 */
export interface PolarCutOptions extends PlotFrameOptions {
  /** Cuts to draw; the angle is measured from the vertical (boresight up), increasing clockwise. */
  traces: readonly PatternCutTrace[];
  /**
   * Level at the centre of the chart [dB].
   * @defaultValue two ring steps below the highest sidelobe, rounded down to a ring and at
   * most −30 dB (−40 dB when no trace has a sidelobe), so low sidelobes (a Taylor
   * pattern's) keep a visible radius instead of collapsing onto the centre
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
 * The default floor of {@link polarCutSvg} [dB]: two ring steps below the highest
 * sidelobe (a local maximum below its trace's peak) of the trace whose highest sidelobe
 * is lowest, rounded down to a ring step,
 * at most −30 dB and at least −100 dB; −40 dB when no trace has a sidelobe.
 * @internal
 */
export function autoFloorDb(traces: readonly PatternCutTrace[], step: number): number {
  let side = Infinity;
  for (const t of traces) {
    const v = t.valueDb, n = v.length;
    let peak = -Infinity, highest = -Infinity;
    for (let k = 0; k < n; k++) if (v[k] > peak) peak = v[k];
    for (let k = 1; k + 1 < n; k++) {
      if (v[k] >= v[k - 1] && v[k] >= v[k + 1] && (v[k] > v[k - 1] || v[k] > v[k + 1]) && v[k] < peak - 1 && Number.isFinite(v[k])) highest = Math.max(highest, v[k]);
    }
    if (highest > -Infinity) side = Math.min(side, highest);
  }
  if (side === Infinity) return -40;
  return Math.max(-100, Math.min(-30, step * Math.floor((side - 2 * step) / step)));
}

/**
 * Polar pattern cut(s) in dB: radius linear in dB from the floor (centre) to
 * the ceiling (outer ring); boresight (angle 0) points up. The dB labels of the
 * rings are written along the spoke (a multiple of 15°) where no trace passes.
 * @param options - Cuts, levels and frame options.
 * @returns SVG markup; each cut is a `<path class="trace">` with `data-points`.
 * @throws `DomainError` on NaN levels or a floor not below the ceiling.
 * @category Plots
 */
export function polarCutSvg(options: PolarCutOptions): string {
  const ceil = options.ceilingDb ?? 0;
  const step = options.ringStepDb ?? 10;
  const floor = options.floorDb ?? autoFloorDb(options.traces, step);
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
  const rings: number[] = [];
  for (let db = ceil; db > floor - 1e-9; db -= step) {
    rings.push(db);
    parts.push(`<circle class="ring" data-value="${db}" cx="${fmt(cx)}" cy="${fmt(cy)}" r="${fmt(rad(db))}" fill="none" stroke="#dfe3e8"/>`);
  }
  for (let deg = 0; deg < 360; deg += 30) {
    const a = (deg * Math.PI) / 180;
    const x = cx + r0 * Math.sin(a), y = cy - r0 * Math.cos(a);
    parts.push(`<line class="spoke" x1="${fmt(cx)}" y1="${fmt(cy)}" x2="${fmt(x)}" y2="${fmt(y)}" stroke="#eceff2"/>`);
    const lx = cx + (r0 + f.fontSize * 1.2) * Math.sin(a), ly = cy - (r0 + f.fontSize * 1.2) * Math.cos(a) + f.fontSize * 0.35;
    parts.push(`<text class="tick-angle" x="${fmt(lx)}" y="${fmt(ly)}" text-anchor="middle" fill="#333">${deg > 180 ? deg - 360 : deg}°</text>`);
  }
  const samples: number[] = [];
  const traceSvg: string[] = [];
  options.traces.forEach((t, i) => {
    checkSeries(`traces[${i}].angleRad`, t.angleRad);
    checkSeries(`traces[${i}].valueDb`, t.valueDb, t.angleRad.length, true);
    let d = '';
    for (let k = 0; k < t.angleRad.length; k++) {
      const v = t.valueDb[k];
      if (Number.isNaN(v)) throw new DomainError(`invalid argument "traces[${i}].valueDb": entry ${k} is NaN.`);
      const r = rad(v);
      const a = t.angleRad[k];
      const x = cx + r * Math.sin(a), y = cy - r * Math.cos(a);
      d += `${k === 0 ? 'M' : 'L'}${fmt(x)},${fmt(y)}`;
      const m = samples.length;
      if (m >= 2) {
        const x0 = samples[m - 2], y0 = samples[m - 1], q = k === 0 ? 1 : Math.max(1, Math.ceil(Math.hypot(x - x0, y - y0) / 3));
        for (let s = 1; s < q; s++) samples.push(x0 + ((x - x0) * s) / q, y0 + ((y - y0) * s) / q);
      }
      samples.push(x, y);
    }
    traceSvg.push(`<path class="trace" data-label="${esc(t.label)}" data-points="${t.angleRad.length}" d="${d}" fill="none" stroke="${TRACE_COLORS[i % TRACE_COLORS.length]}" stroke-width="1.6"/>`);
  });
  // Ring labels along the spoke (multiples of 15°, nearest the bottom first) whose label boxes meet no trace.
  const fs = f.fontSize * 0.85;
  const boxes = (deg: number) => rings.filter((db) => db > floor + 1e-9 && db < ceil - 1e-9).map((db) => {
    const a = (deg * Math.PI) / 180, r = rad(db), w = `${db} dB`.length * fs * 0.55;
    const x = cx + r * Math.sin(a), y = cy - r * Math.cos(a) + fs * 0.35;
    return { db, x, y, bx: x - w / 2, by: y - fs * 0.9, w, h: fs * 1.1 };
  });
  let bestDeg = 180, bestN = Infinity;
  for (let q = 0; q < 24; q++) {
    const deg = 180 + (q % 2 === 0 ? 1 : -1) * Math.ceil(q / 2) * 15;
    const bs = boxes(deg);
    let n = bs.reduce((acc, b) => acc + pointsInBox(samples, b.bx, b.by, b.w, b.h), 0);
    // Labels that overlap each other (near-horizontal spokes) or an angle label count as covered.
    for (let i = 1; i < bs.length; i++) if (Math.abs(bs[i].y - bs[i - 1].y) < bs[i].h && Math.abs(bs[i].x - bs[i - 1].x) < bs[i].w) n += 1000;
    if (Math.abs(Math.sin((deg * Math.PI) / 180)) > 0.9) n += 1000;
    if (n < bestN) { bestN = n; bestDeg = deg; }
    if (n === 0) break;
  }
  for (const b of boxes(bestDeg)) {
    parts.push(`<text class="ring-label" data-angle-deg="${bestDeg}" x="${fmt(b.x)}" y="${fmt(b.y)}" text-anchor="middle" fill="#555" font-size="${fmt(fs)}" stroke="#ffffff" stroke-width="3" paint-order="stroke">${b.db} dB</text>`);
  }
  parts.push(`<text class="floor-label" x="${fmt(f.width - f.fontSize)}" y="${fmt(f.height - f.fontSize)}" text-anchor="end" fill="#555" font-size="${fmt(fs)}">outer ring ${fmt(ceil)} dB, centre ${fmt(floor)} dB</text>`);
  parts.push('</g>', ...traceSvg);
  if (options.traces.length > 1) parts.push(drawCornerLegend(f, options.traces.map((t) => t.label)));
  parts.push('</svg>');
  return parts.join('');
}
