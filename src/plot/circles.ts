/**
 * Circle diagrams: grating-lobe diagrams in the u-v plane and Schelkunoff
 * unit-circle zero plots.
 * @module
 */
import { DimensionError, DomainError } from '../errors.js';
import { assertFinite, assertNonNegative, assertPositive } from '../internal/validate.js';
import { type PlotFrameOptions, checkSeries, clipId, fmt, makeArea, openSvg, resolveFrame, drawAxes, legendBoxSvg, legendSize, type LegendEntry } from './svg.js';

/**
 * A circle in the u-v plane (direction-cosine space).
 * @category Plots
 */
export interface UvCircle {
  /** Centre u (dimensionless). */
  u: number;
  /** Centre v (dimensionless). */
  v: number;
  /** Radius (dimensionless). */
  radius: number;
}

/**
 * Options of {@link gratingLobeDiagramSvg}.
 * @category Plots
 */
export interface GratingLobeDiagramOptions extends PlotFrameOptions {
  /** Grating-lobe circles: unit circles centred on the lattice images of the scan point (excluding the main one). */
  gratingCircles: readonly UvCircle[];
  /** Radius of the required scan region around the origin, sin θ_max (0 to 1). */
  scanRadius: number;
  /**
   * Half-width of the plotted u-v window.
   * @defaultValue 2
   */
  extent?: number;
}

/**
 * Grating-lobe diagram: the visible region (unit circle), the grating-lobe
 * circles of a lattice and the required scan region; a grating lobe enters
 * visible space for any scan inside the region that also lies inside a
 * grating circle (Mailloux, *Phased Array Antenna Handbook*, 2nd ed., 2005,
 * §2.1, from memory). Overlaps are drawn, not computed here. A legend under
 * the axes (the SVG is made taller for it) names the three kinds of circle.
 * @param options - Circles, scan region and frame options.
 * @returns SVG markup with `<ellipse class="visible">`, `<ellipse class="grating">` (one per entry), `<ellipse class="scan-region">` and a `<g class="legend">`.
 * @throws `DomainError` on negative radii or a scan radius above 1.
 * @category Plots
 */
export function gratingLobeDiagramSvg(options: GratingLobeDiagramOptions): string {
  const ext = options.extent ?? 2;
  assertPositive('extent', ext);
  assertNonNegative('scanRadius', options.scanRadius);
  if (options.scanRadius > 1) throw new DomainError(`invalid argument "scanRadius": expected sin θ_max in [0, 1], received ${options.scanRadius}.`);
  if (!Array.isArray(options.gratingCircles)) throw new DimensionError('invalid argument "gratingCircles": expected an array of {u, v, radius}.');
  const f = resolveFrame(options, { width: 480, height: 480 });
  const a = makeArea({ ...f, width: Math.min(f.width, f.height + f.fontSize * 3) }, [-ext, ext], [-ext, ext], false);
  const legend: LegendEntry[] = [
    { label: 'visible region (sin θ = 1)', color: '#1f5f8b' },
    { label: `scan region (sin θ ≤ ${Number(options.scanRadius.toPrecision(3))})`, color: '#3f8f5a', area: 0.18 },
    { label: 'grating-lobe circles (lattice images)', color: '#c2423f', area: 0.06, dash: '5 3' },
  ];
  const extra = Math.ceil(legendSize(f, legend).h + 6);
  const parts = [openSvg({ ...f, height: f.height + extra }, 'grating-lobe diagram'), drawAxes(f, a, 'u', 'v', 5, 5)];
  const sx = (x: number) => a.x(x), sy = (y: number) => a.y(y);
  const rx = (r: number) => Math.abs(a.x(r) - a.x(0)), ry = (r: number) => Math.abs(a.y(r) - a.y(0));
  const clip = clipId('gl-area', [a.left, a.top, a.right - a.left, a.bottom - a.top]);
  parts.push(`<clipPath id="${clip}"><rect x="${fmt(a.left)}" y="${fmt(a.top)}" width="${fmt(a.right - a.left)}" height="${fmt(a.bottom - a.top)}"/></clipPath><g clip-path="url(#${clip})">`);
  options.gratingCircles.forEach((c, i) => {
    assertFinite(`gratingCircles[${i}].u`, c.u);
    assertFinite(`gratingCircles[${i}].v`, c.v);
    assertNonNegative(`gratingCircles[${i}].radius`, c.radius);
    parts.push(`<ellipse class="grating" cx="${fmt(sx(c.u))}" cy="${fmt(sy(c.v))}" rx="${fmt(rx(c.radius))}" ry="${fmt(ry(c.radius))}" fill="#c2423f" fill-opacity="0.06" stroke="#c2423f" stroke-dasharray="5 3"/>`);
  });
  parts.push(`<ellipse class="visible" cx="${fmt(sx(0))}" cy="${fmt(sy(0))}" rx="${fmt(rx(1))}" ry="${fmt(ry(1))}" fill="none" stroke="#1f5f8b" stroke-width="1.8"/>`);
  parts.push(`<ellipse class="scan-region" data-radius="${options.scanRadius}" cx="${fmt(sx(0))}" cy="${fmt(sy(0))}" rx="${fmt(rx(options.scanRadius))}" ry="${fmt(ry(options.scanRadius))}" fill="#3f8f5a" fill-opacity="0.18" stroke="#3f8f5a"/>`);
  parts.push('</g>');
  parts.push(legendBoxSvg(f, a.left, f.height, legend));
  parts.push('</svg>');
  return parts.join('');
}

/**
 * Options of {@link zeroPlotSvg}.
 * @category Plots
 */
export interface ZeroPlotOptions extends PlotFrameOptions {
  /** Real parts of the array-polynomial zeros. */
  zerosRe: ArrayLike<number>;
  /** Imaginary parts of the zeros, same length. */
  zerosIm: ArrayLike<number>;
  /** Start of the visible arc, as the angle ψ of exp(jψ) on the unit circle [rad]. */
  visibleStartRad: number;
  /** End of the visible arc (counter-clockwise from the start) [rad]; an arc of ≥ 2π covers the whole circle. */
  visibleEndRad: number;
}

/**
 * Schelkunoff unit-circle diagram: the zeros of the array polynomial and the
 * arc of the unit circle that visible space maps onto (S. A. Schelkunoff,
 * "A mathematical theory of linear arrays", Bell Syst. Tech. J. 22, 1943).
 * @param options - Zeros, visible arc and frame options.
 * @returns SVG markup with `<circle class="zero">` per zero and `<path class="visible-arc">`.
 * @throws `DimensionError` on mismatched zero arrays.
 * @category Plots
 */
export function zeroPlotSvg(options: ZeroPlotOptions): string {
  checkSeries('zerosRe', options.zerosRe);
  checkSeries('zerosIm', options.zerosIm, options.zerosRe.length);
  assertFinite('visibleStartRad', options.visibleStartRad);
  assertFinite('visibleEndRad', options.visibleEndRad);
  let ext = 1.3;
  for (let i = 0; i < options.zerosRe.length; i++) ext = Math.max(ext, 1.1 * Math.hypot(options.zerosRe[i], options.zerosIm[i]));
  const f = resolveFrame(options, { width: 420, height: 420 });
  const a = makeArea({ ...f, width: Math.min(f.width, f.height + f.fontSize * 3) }, [-ext, ext], [-ext, ext], false);
  const parts = [openSvg(f, 'array-polynomial zeros'), drawAxes(f, a, 'Re z', 'Im z', 5, 5)];
  const r = Math.abs(a.x(1) - a.x(0)), ry = Math.abs(a.y(1) - a.y(0));
  parts.push(`<ellipse class="unit-circle" cx="${fmt(a.x(0))}" cy="${fmt(a.y(0))}" rx="${fmt(r)}" ry="${fmt(ry)}" fill="none" stroke="#9aa3ad"/>`);
  const span = options.visibleEndRad - options.visibleStartRad;
  if (span >= 2 * Math.PI - 1e-12) {
    parts.push(`<ellipse class="visible-arc" cx="${fmt(a.x(0))}" cy="${fmt(a.y(0))}" rx="${fmt(r)}" ry="${fmt(ry)}" fill="none" stroke="#1f5f8b" stroke-width="3"/>`);
  } else if (span > 0) {
    const n = Math.max(8, Math.ceil((span / (2 * Math.PI)) * 180));
    let d = '';
    for (let k = 0; k <= n; k++) {
      const t = options.visibleStartRad + (span * k) / n;
      d += `${k === 0 ? 'M' : 'L'}${fmt(a.x(Math.cos(t)))},${fmt(a.y(Math.sin(t)))}`;
    }
    parts.push(`<path class="visible-arc" d="${d}" fill="none" stroke="#1f5f8b" stroke-width="3"/>`);
  }
  for (let i = 0; i < options.zerosRe.length; i++) {
    parts.push(`<circle class="zero" cx="${fmt(a.x(options.zerosRe[i]))}" cy="${fmt(a.y(options.zerosIm[i]))}" r="4" fill="none" stroke="#c2423f" stroke-width="1.6"/>`);
  }
  parts.push('</svg>');
  return parts.join('');
}
