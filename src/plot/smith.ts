/**
 * Smith chart of reflection coefficients.
 * @module
 */
import { DomainError } from '../errors.js';
import { type PlotFrameOptions, TRACE_COLORS, checkSeries, clipId, esc, fmt, legendBoxSvg, legendSize, openSvg, pointsInBox, resolveFrame } from './svg.js';

/**
 * One reflection-coefficient locus (for example one port over frequency).
 * @category Plots
 */
export interface SmithTrace {
  /** Legend label. */
  label: string;
  /** Real parts of Γ (dimensionless). */
  gammaRe: ArrayLike<number>;
  /** Imaginary parts of Γ, same length. */
  gammaIm: ArrayLike<number>;
  /** What the first point is (for example "−40°" or "1.2 GHz"), written beside its filled dot. */
  startLabel?: string;
  /** What the last point is, written beside its open ring. */
  endLabel?: string;
}

/**
 * Options of {@link smithChartSvg}.
 * @category Plots
 */
export interface SmithChartOptions extends PlotFrameOptions {
  /** Loci to draw; the first point of each is marked with a filled dot, the last with an open ring. */
  traces: readonly SmithTrace[];
  /**
   * Reference impedance named in the caption [Ω].
   * @defaultValue 50
   */
  z0Ohm?: number;
}

/**
 * A Smith chart (P. H. Smith, "Transmission line calculator", Electronics 12,
 * 1939) with constant-resistance circles and constant-reactance arcs at
 * normalised values 0.2, 0.5, 1, 2, 5, and the given Γ loci. Points with
 * |Γ| > 1 (active ports) are drawn outside the unit circle, not clipped. Each
 * locus starts at a filled dot and ends at an open ring, labelled with its
 * `startLabel`/`endLabel`; with two or more loci a legend box sits inside the
 * chart where no locus passes (below the chart, the SVG made taller, when none is free).
 * @param options - Loci and frame options.
 * @returns SVG markup; each locus is a `<path class="trace">` with `data-points`, `<circle class="start">`, `<circle class="end">` and `<text class="end-label">`.
 * @throws `DomainError` on non-finite Γ.
 * @category Plots
 */
export function smithChartSvg(options: SmithChartOptions): string {
  const f = resolveFrame(options, { width: 480, height: 480 });
  const z0 = options.z0Ohm ?? 50;
  if (!(z0 > 0) || !Number.isFinite(z0)) throw new DomainError(`invalid argument "z0Ohm": expected a finite number > 0 [Ω], received ${z0}.`);
  // Room above the circle for the title and the +j1 label that sits 7 % outside the rim.
  const top = (f.title ? f.fontSize * 3 : f.fontSize * 1.5) + f.fontSize * 1.2;
  const r0 = Math.min(f.width / 2 - f.fontSize * 3, (f.height - top - f.fontSize * 3.5) / 2 / 1.07);
  const cx = f.width / 2, cy = top + r0 + f.fontSize * 0.5;
  const X = (g: number) => cx + r0 * g;
  const Y = (g: number) => cy - r0 * g;
  const parts = [openSvg(f, 'Smith chart')];
  const clip = clipId('smith-disc', [cx, cy, r0]);
  parts.push(`<clipPath id="${clip}"><circle cx="${fmt(cx)}" cy="${fmt(cy)}" r="${fmt(r0)}"/></clipPath>`);
  parts.push('<g class="axes" fill="none" stroke="#d5dae0">');
  parts.push(`<circle class="unit-circle" cx="${fmt(cx)}" cy="${fmt(cy)}" r="${fmt(r0)}" stroke="#59616b"/>`);
  parts.push(`<line x1="${fmt(X(-1))}" y1="${fmt(cy)}" x2="${fmt(X(1))}" y2="${fmt(cy)}"/>`);
  const values = [0.2, 0.5, 1, 2, 5];
  for (const r of values) {
    parts.push(`<circle class="r-circle" data-value="${r}" cx="${fmt(X(r / (1 + r)))}" cy="${fmt(cy)}" r="${fmt(r0 / (1 + r))}"/>`);
  }
  for (const x of values) {
    for (const s of [1, -1]) {
      parts.push(`<circle class="x-arc" data-value="${s * x}" cx="${fmt(X(1))}" cy="${fmt(Y(s / x))}" r="${fmt(r0 / x)}" clip-path="url(#${clip})"/>`);
    }
  }
  parts.push('</g><g class="tick-labels" fill="#555" font-size="' + fmt(f.fontSize * 0.8) + '">');
  // Scale labels are obstacles for the end labels placed below.
  const scaleBoxes: { x: number; y: number; w: number; h: number }[] = [];
  for (const r of values) {
    const lx = X((r - 1) / (r + 1)) + 2;
    scaleBoxes.push({ x: lx, y: cy - 3 - f.fontSize * 0.8, w: String(r).length * f.fontSize * 0.5 + 2, h: f.fontSize * 0.8 });
    parts.push(`<text x="${fmt(lx)}" y="${fmt(cy - 3)}">${r}</text>`);
  }
  for (const x of values) {
    // The reactance arc x meets the unit circle at Γ = (x² − 1 + 2jx)/(x² + 1).
    const gr = (x * x - 1) / (x * x + 1), gi = (2 * x) / (x * x + 1);
    for (const [sign, gy] of [['+', gi], ['−', -gi]] as const) {
      const text = `${sign}j${x}`, w = text.length * f.fontSize * 0.5 + 2;
      scaleBoxes.push({ x: X(gr * 1.07) - w / 2, y: Y(gy * 1.07) + 3 - f.fontSize * 0.8, w, h: f.fontSize * 0.8 });
      parts.push(`<text x="${fmt(X(gr * 1.07))}" y="${fmt(Y(gy * 1.07) + 3)}" text-anchor="middle">${text}</text>`);
    }
  }
  parts.push('</g>');
  // Pixel samples along every locus and its end labels: the legend avoids them.
  const taken: number[] = [];
  const placed: { x: number; y: number; w: number; h: number }[] = [...scaleBoxes];
  const requests: { x: number; y: number; dx: number; dy: number; text: string; cls: string; c: string }[] = [];
  options.traces.forEach((t, i) => {
    checkSeries(`traces[${i}].gammaRe`, t.gammaRe);
    checkSeries(`traces[${i}].gammaIm`, t.gammaIm, t.gammaRe.length);
    const c = TRACE_COLORS[i % TRACE_COLORS.length];
    const n = t.gammaRe.length;
    let d = '';
    for (let k = 0; k < n; k++) {
      const x = X(t.gammaRe[k]), y = Y(t.gammaIm[k]);
      d += `${k === 0 ? 'M' : 'L'}${fmt(x)},${fmt(y)}`;
      if (k > 0) {
        const x0 = X(t.gammaRe[k - 1]), y0 = Y(t.gammaIm[k - 1]);
        const m = Math.max(1, Math.ceil(Math.hypot(x - x0, y - y0) / 3));
        for (let s = 1; s <= m; s++) taken.push(x0 + ((x - x0) * s) / m, y0 + ((y - y0) * s) / m);
      } else taken.push(x, y);
    }
    parts.push(`<path class="trace" data-label="${esc(t.label)}" data-points="${n}" d="${d}" fill="none" stroke="${c}" stroke-width="1.6"/>`);
    if (n === 0) return;
    const mark = (k: number, cls: 'start' | 'end') => {
      const x = X(t.gammaRe[k]), y = Y(t.gammaIm[k]);
      parts.push(cls === 'start'
        ? `<circle class="start" cx="${fmt(x)}" cy="${fmt(y)}" r="3" fill="${c}"/>`
        : `<circle class="end" cx="${fmt(x)}" cy="${fmt(y)}" r="3.5" fill="#ffffff" stroke="${c}" stroke-width="1.6"/>`);
    };
    const label = (k: number, away: number, text: string | undefined, cls: string) => {
      if (!text) return;
      const x = X(t.gammaRe[k]), y = Y(t.gammaIm[k]);
      let dx = 1, dy = 0;
      if (away >= 0) {
        const ax = x - X(t.gammaRe[away]), ay = y - Y(t.gammaIm[away]), l = Math.hypot(ax, ay);
        if (l > 0) { dx = ax / l; dy = ay / l; }
      }
      requests.push({ x, y, dx, dy, text, cls, c });
    };
    mark(0, 'start');
    if (n > 1) mark(n - 1, 'end');
    // Ends closer than 8 px (a locus that returns, e.g. the centre element of a symmetric scan) share one label.
    const near = n > 1 && Math.hypot(X(t.gammaRe[0]) - X(t.gammaRe[n - 1]), Y(t.gammaIm[0]) - Y(t.gammaIm[n - 1])) < 8;
    if (near && t.startLabel && t.endLabel) {
      label(0, 1, `${t.startLabel}, ${t.endLabel}`, 'both');
    } else {
      label(0, n > 1 ? 1 : -1, t.startLabel, 'start');
      if (n > 1) label(n - 1, n - 2, t.endLabel, 'end');
    }
  });
  // End labels, placed after every locus is sampled: preferred side away from the neighbouring
  // point, then the other sides and diagonals, the first whose box meets no locus and no label.
  const lines: number[] = taken.slice();
  for (const r of requests) {
    const w = r.text.length * f.fontSize * 0.55, hh = f.fontSize * 0.9;
    const dirs: number[][] = [];
    for (let q = 0; q < 8; q++) {
      const a = (q * Math.PI) / 4, cs = Math.cos(a), sn = Math.sin(a);
      dirs.push([r.dx * cs - r.dy * sn, r.dx * sn + r.dy * cs]);
    }
    dirs.sort((p, q) => Math.hypot(p[0] - r.dx, p[1] - r.dy) - Math.hypot(q[0] - r.dx, q[1] - r.dy));
    let box: { x: number; lx: number; ly: number; anchor: string } | undefined;
    // Nearest first; a label crowded out at 9 px moves out to 20 and 34 px (further from its end marker, still beside it).
    search: for (const dist of [9, 20, 34]) {
      for (const [ux, uy] of dirs) {
        const lx = r.x + ux * dist, ly = r.y + uy * dist + f.fontSize * 0.35 + (uy > 0.3 ? f.fontSize * 0.3 : 0);
        const anchor = ux > 0.3 ? 'start' : ux < -0.3 ? 'end' : 'middle';
        const bx = anchor === 'start' ? lx : anchor === 'end' ? lx - w : lx - w / 2;
        const free = !placed.some((b) => b.x < bx + w && bx < b.x + b.w && b.y < ly && ly - hh < b.y + b.h) && pointsInBox(lines, bx, ly - hh, w, hh) === 0;
        if (!box) box = { x: bx, lx, ly, anchor };
        if (free) { box = { x: bx, lx, ly, anchor }; break search; }
      }
    }
    const bb = box as { x: number; lx: number; ly: number; anchor: string };
    placed.push({ x: bb.x, y: bb.ly - hh, w, h: hh });
    for (let s = 0; s <= 4; s++) taken.push(bb.x + (w * s) / 4, bb.ly - hh / 2);
    parts.push(`<text class="end-label" data-end="${r.cls}" x="${fmt(bb.lx)}" y="${fmt(bb.ly)}" text-anchor="${bb.anchor}" fill="${r.c}" font-size="${fmt(f.fontSize * 0.85)}">${esc(r.text)}</text>`);
  }
  let extra = 0;
  if (options.traces.length > 1) {
    const entries = options.traces.map((t, i) => ({ label: t.label, color: TRACE_COLORS[i % TRACE_COLORS.length], marker: 'circle' as const }));
    const { w, h } = legendSize(f, entries);
    // Candidate places inside the disc (each box wholly inside the unit circle), lower half first
    // (capacitive, low-resistance loci are rarer), then the upper half.
    let best: { x: number; y: number; n: number } | undefined;
    for (const [gx, gy] of [[-0.5, -0.45], [0, -0.55], [0.45, -0.45], [-0.5, 0.45], [0, 0.55], [0.45, 0.45], [-0.55, 0]]) {
      const x = X(gx) - w / 2, y = Y(gy) - h / 2;
      const inside = [[x, y], [x + w, y], [x, y + h], [x + w, y + h]].every(([px, py]) => Math.hypot(px - cx, py - cy) < r0 - 2);
      if (!inside) continue;
      const n = pointsInBox(taken, x, y, w, h);
      if (!best || n < best.n) best = { x, y, n };
    }
    if (!best || best.n > 0) {
      extra = Math.ceil(h + 6);
      best = { x: f.fontSize, y: f.height, n: 0 };
    }
    parts.push(legendBoxSvg(f, best.x, best.y, entries));
  }
  if (extra > 0) parts[0] = openSvg({ ...f, height: f.height + extra }, 'Smith chart');
  parts.push(`<text class="caption" x="${fmt(f.width - f.fontSize)}" y="${fmt(f.height - f.fontSize)}" text-anchor="end" fill="#333">Γ, normalised to ${fmt(z0)} Ω · ● first, ○ last point</text>`);
  parts.push('</svg>');
  return parts.join('');
}
