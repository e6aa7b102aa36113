/**
 * Geometry check of a figure laid out by a browser: overlapping or clipped labels, points under
 * the legend, traces hidden under others (issue 21). Used by the browser tests.
 */
/** What the in-page geometry check reports for one figure. */
export interface FigureProblems {
  textOverlaps: string[];
  textOutside: string[];
  underLegend: string[];
  hiddenTraces: string[];
  traces: number;
  texts: number;
}

/**
 * Runs in the page (pass it to `page.evaluate` with a selector): measures the SVG the selector
 * names, as laid out by the browser, and lists the problems. Self-contained: no closure.
 */
export function inspectFigure(selector: string): FigureProblems {
  const svg = document.querySelector(selector) as SVGSVGElement;
  const frame = svg.getBoundingClientRect();
  const texts = Array.from(svg.querySelectorAll('text')).filter((t) => (t.textContent ?? '').trim() !== '');
  // A text's box is its font box (ascent + descent); the ink of digits and capitals fills about
  // its middle 60 %, so the boxes compared are trimmed by 20 % at top and bottom.
  const boxes = texts.map((t) => {
    const r = t.getBoundingClientRect();
    const trim = 0.2 * r.height;
    return { t: (t.textContent ?? '').trim(), b: { left: r.left, right: r.right, top: r.top + trim, bottom: r.bottom - trim } };
  });
  const textOverlaps: string[] = [];
  const textOutside: string[] = [];
  for (let i = 0; i < boxes.length; i++) {
    const a = boxes[i].b;
    if (a.left < frame.left - 0.5 || a.right > frame.right + 0.5 || a.top < frame.top - 0.5 || a.bottom > frame.bottom + 0.5) textOutside.push(boxes[i].t);
    for (let j = i + 1; j < boxes.length; j++) {
      const b = boxes[j].b;
      const w = Math.min(a.right, b.right) - Math.max(a.left, b.left);
      const h = Math.min(a.bottom, b.bottom) - Math.max(a.top, b.top);
      if (w > 1 && h > 1) textOverlaps.push(`"${boxes[i].t}" × "${boxes[j].t}"`);
    }
  }
  const paths = Array.from(svg.querySelectorAll('path.trace, polyline.trace')) as SVGGeometryElement[];
  const sample = (p: SVGGeometryElement): Array<[number, number]> => {
    const len = p.getTotalLength();
    const m = p.getScreenCTM()!;
    const out: Array<[number, number]> = [];
    const n = Math.max(2, Math.min(400, Math.ceil(len / 2)));
    for (let k = 0; k <= n; k++) {
      const q = p.getPointAtLength((k / n) * len);
      out.push([m.a * q.x + m.c * q.y + m.e, m.b * q.x + m.d * q.y + m.f]);
    }
    return out;
  };
  const points = paths.map(sample);
  const legend = svg.querySelector('.legend-box');
  const underLegend: string[] = [];
  if (legend) {
    const l = legend.getBoundingClientRect();
    points.forEach((pts, i) => {
      const inside = pts.filter(([x, y]) => x > l.left + 1 && x < l.right - 1 && y > l.top + 1 && y < l.bottom - 1);
      if (inside.length > 0) underLegend.push(`trace ${i + 1} (${paths[i].getAttribute('data-label') ?? ''}): ${inside.length} points`);
    });
  }
  // A trace every point of which lies within 1 px of another trace is hidden unless it has markers.
  const hiddenTraces: string[] = [];
  const near = (a: Array<[number, number]>, b: Array<[number, number]>) => a.every(([x, y]) => b.some(([u, v]) => Math.hypot(x - u, y - v) < 1));
  for (let i = 0; i < points.length; i++) {
    for (let j = 0; j < points.length; j++) {
      if (i === j || !near(points[i], points[j])) continue;
      const g = paths[i].parentElement;
      const marked = (g?.querySelector('.marker, [class*="marker"]') ?? null) !== null || paths[i].hasAttribute('marker-mid') || paths[i].hasAttribute('stroke-dasharray');
      if (!marked) hiddenTraces.push(`trace ${i + 1} lies on trace ${j + 1}`);
    }
  }
  return { textOverlaps, textOutside, underLegend, hiddenTraces, traces: paths.length, texts: texts.length };
}

