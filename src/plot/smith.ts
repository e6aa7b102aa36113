/**
 * Smith chart of reflection coefficients.
 * @module
 */
import { DomainError } from '../errors.js';
import { type PlotFrameOptions, TRACE_COLORS, checkSeries, drawCornerLegend, esc, fmt, openSvg, resolveFrame } from './svg.js';

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
}

/**
 * Options of {@link smithChartSvg}.
 * @category Plots
 */
export interface SmithChartOptions extends PlotFrameOptions {
  /** Loci to draw; the first point of each is marked with a dot. */
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
 * |Γ| > 1 (active ports) are drawn outside the unit circle, not clipped.
 * @param options - Loci and frame options.
 * @returns SVG markup; each locus is a `<path class="trace">` with `data-points`.
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
  parts.push(`<clipPath id="smith-disc"><circle cx="${fmt(cx)}" cy="${fmt(cy)}" r="${fmt(r0)}"/></clipPath>`);
  parts.push('<g class="axes" fill="none" stroke="#d5dae0">');
  parts.push(`<circle class="unit-circle" cx="${fmt(cx)}" cy="${fmt(cy)}" r="${fmt(r0)}" stroke="#59616b"/>`);
  parts.push(`<line x1="${fmt(X(-1))}" y1="${fmt(cy)}" x2="${fmt(X(1))}" y2="${fmt(cy)}"/>`);
  const values = [0.2, 0.5, 1, 2, 5];
  for (const r of values) {
    parts.push(`<circle class="r-circle" data-value="${r}" cx="${fmt(X(r / (1 + r)))}" cy="${fmt(cy)}" r="${fmt(r0 / (1 + r))}"/>`);
  }
  for (const x of values) {
    for (const s of [1, -1]) {
      parts.push(`<circle class="x-arc" data-value="${s * x}" cx="${fmt(X(1))}" cy="${fmt(Y(s / x))}" r="${fmt(r0 / x)}" clip-path="url(#smith-disc)"/>`);
    }
  }
  parts.push('</g><g class="tick-labels" fill="#555" font-size="' + fmt(f.fontSize * 0.8) + '">');
  for (const r of values) parts.push(`<text x="${fmt(X((r - 1) / (r + 1)) + 2)}" y="${fmt(cy - 3)}">${r}</text>`);
  for (const x of values) {
    // The reactance arc x meets the unit circle at Γ = (x² − 1 + 2jx)/(x² + 1).
    const gr = (x * x - 1) / (x * x + 1), gi = (2 * x) / (x * x + 1);
    parts.push(`<text x="${fmt(X(gr * 1.07))}" y="${fmt(Y(gi * 1.07) + 3)}" text-anchor="middle">+j${x}</text>`);
    parts.push(`<text x="${fmt(X(gr * 1.07))}" y="${fmt(Y(-gi * 1.07) + 3)}" text-anchor="middle">−j${x}</text>`);
  }
  parts.push('</g>');
  options.traces.forEach((t, i) => {
    checkSeries(`traces[${i}].gammaRe`, t.gammaRe);
    checkSeries(`traces[${i}].gammaIm`, t.gammaIm, t.gammaRe.length);
    const c = TRACE_COLORS[i % TRACE_COLORS.length];
    let d = '';
    for (let k = 0; k < t.gammaRe.length; k++) d += `${k === 0 ? 'M' : 'L'}${fmt(X(t.gammaRe[k]))},${fmt(Y(t.gammaIm[k]))}`;
    parts.push(`<path class="trace" data-label="${esc(t.label)}" data-points="${t.gammaRe.length}" d="${d}" fill="none" stroke="${c}" stroke-width="1.6"/>`);
    if (t.gammaRe.length > 0) parts.push(`<circle class="start" cx="${fmt(X(t.gammaRe[0]))}" cy="${fmt(Y(t.gammaIm[0]))}" r="3" fill="${c}"/>`);
  });
  parts.push(drawCornerLegend(f, options.traces.map((t) => t.label)));
  parts.push(`<text class="caption" x="${fmt(f.width - f.fontSize)}" y="${fmt(f.height - f.fontSize)}" text-anchor="end" fill="#333">Γ, normalised to ${fmt(z0)} Ω</text>`);
  parts.push('</svg>');
  return parts.join('');
}
