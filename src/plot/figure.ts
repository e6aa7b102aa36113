/**
 * Figures a notebook shows inline: an SVG from any plot function, with the MIME bundle that
 * notebook front ends display and the text summary the REPL prints. Browser-safe; writing the
 * figure to a file is `writeFigure` of `phasewise/node`.
 * @module
 */
import { DomainError } from '../errors.js';
import { displayPrototype } from '../display/attach.js';
import { show } from '../display/format.js';

/**
 * A figure: the SVG markup of a plot with its size and title, as plain data.
 *
 * @remarks
 * Made by {@link figure}. Its prototype (not its own data) carries two symbol-keyed hooks:
 * `Symbol.for('Jupyter.display')`, returning the MIME bundle of {@link figureMimeBundle}, which a
 * notebook kernel following that convention (Deno's Jupyter kernel) displays as SVG when the
 * figure is a cell's last expression; and Node's inspect hook, printing a one-line summary in
 * the REPL. In tslab (a TypeScript kernel for Jupyter), show it with
 * `tslab.display.svg(fig.svg)`. `String(fig)` is the SVG. Display guide: docs/display.md.
 * @category Plots
 */
export interface Figure {
  /** The SVG markup (a complete `<svg>` element). */
  readonly svg: string;
  /** Title (from the SVG's aria-label, or as given). */
  readonly title: string;
  /** Width [px]. */
  readonly widthPx: number;
  /** Height [px]. */
  readonly heightPx: number;
}

/**
 * A MIME bundle as notebook kernels exchange it (Jupyter messaging `display_data`): MIME type
 * → content.
 * @category Plots
 */
export interface MimeBundle {
  /** The SVG markup. */
  readonly 'image/svg+xml': string;
  /** The text a front end without SVG support shows. */
  readonly 'text/plain': string;
}

/**
 * The MIME bundle of a figure: its SVG under `image/svg+xml` and its one-line summary under
 * `text/plain` (Jupyter messaging protocol, `display_data` content, from memory).
 * @param fig - The figure.
 * @returns The bundle.
 * @example
 * ```ts
 * const fig = figure(linePlotSvg({ traces: [{ label: 'a', x: [0, 1], y: [0, 1] }], xLabel: 'x [m]', yLabel: 'y [m]', title: 'demo' }));
 * Object.keys(figureMimeBundle(fig)); // ['image/svg+xml', 'text/plain']
 * ```
 * @category Plots
 */
export function figureMimeBundle(fig: Figure): MimeBundle {
  return { 'image/svg+xml': fig.svg, 'text/plain': show(fig) };
}

let prototype: object | undefined;

/** The figure prototype: the display prototype plus the Jupyter display hook and toString. */
function figurePrototype(): object {
  prototype ??= Object.create(displayPrototype('Figure'), {
    [Symbol.for('Jupyter.display')]: { value(this: Figure) { return figureMimeBundle(this); }, enumerable: false, writable: true, configurable: true },
    toString: { value(this: Figure) { return this.svg; }, enumerable: false, writable: true, configurable: true },
  }) as object;
  return prototype;
}

function attribute(tag: string, name: string): string | undefined {
  const m = new RegExp(`\\s${name}="([^"]*)"`).exec(tag);
  return m ? m[1] : undefined;
}

/**
 * Wraps the SVG of any plot function of this module ({@link linePlotSvg}, {@link patternCutSvg},
 * {@link polarCutSvg}, {@link uvMapSvg}, {@link smithChartSvg}, …) as a {@link Figure} that a
 * notebook shows inline and Node's REPL summarises.
 * @param svg - SVG markup starting with an `<svg` element that states `width` and `height` [px].
 * @param title - Title; default the SVG's `aria-label`.
 * @returns The figure (plain data on the figure prototype).
 * @throws `DomainError` if `svg` is not an SVG element with a numeric width and height.
 * @example
 * ```ts
 * const fig = figure(linePlotSvg({ traces: [{ label: 'a', x: [0, 1], y: [0, 1] }], xLabel: 'x [m]', yLabel: 'y [m]', title: 'demo' }));
 * fig.widthPx; // 640
 * fig.title; // 'demo'
 * ```
 * @category Plots
 */
export function figure(svg: string, title?: string): Figure {
  const open = typeof svg === 'string' ? /^\s*<svg\b[^>]*>/.exec(svg) : null;
  if (open === null) throw new DomainError(`invalid argument "svg": expected SVG markup starting with an <svg> element, received ${typeof svg === 'string' ? `"${svg.slice(0, 40)}…"` : typeof svg}.`);
  const widthPx = Number(attribute(open[0], 'width'));
  const heightPx = Number(attribute(open[0], 'height'));
  if (!(widthPx > 0) || !(heightPx > 0)) throw new DomainError('invalid argument "svg": the <svg> element must state a numeric width and height [px].');
  const label = (attribute(open[0], 'aria-label') ?? 'figure').replace(/&quot;/g, '"').replace(/&#39;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');
  return Object.assign(Object.create(figurePrototype()) as Figure, { svg, title: title ?? label, widthPx, heightPx });
}
