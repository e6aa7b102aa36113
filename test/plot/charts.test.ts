/**
 * Round-chart legibility (issue 21): Smith-chart loci say which end is which and keep their
 * legend inside the chart, clear of every locus; polar cuts label their rings where no trace
 * is and keep a Taylor pattern's sidelobes off the centre; the grating-lobe diagram names its
 * circles. Checked on the SVG text, as test/plot/legend.test.ts does for line plots.
 */
import { describe, it, expect } from 'vitest';
import { gratingLobeDiagramSvg, polarCutSvg, smithChartSvg } from '../../src/plot/index.js';
import { taylorTaper } from '../../src/taper/taylor.js';

const num = (s: string, re: RegExp): number => Number(re.exec(s)![1]);

function traceVertices(svg: string): number[][] {
  const out: number[][] = [];
  for (const m of svg.matchAll(/<path class="trace"[^>]* d="([^"]*)"/g)) {
    for (const p of m[1].matchAll(/[ML]([\d.-]+),([\d.-]+)/g)) out.push([Number(p[1]), Number(p[2])]);
  }
  return out;
}

describe('smithChartSvg', () => {
  const arc = (g: number, from: number, to: number) => {
    const re: number[] = [], im: number[] = [];
    for (let k = 0; k <= 20; k++) { const a = from + ((to - from) * k) / 20; re.push(g * Math.cos(a)); im.push(g * Math.sin(a)); }
    return { re, im };
  };

  it('labels both ends of every locus and marks the first filled, the last open', () => {
    const a = arc(0.4, 0.2, 1.4), b = arc(0.6, -0.4, 0.9);
    const svg = smithChartSvg({ traces: [
      { label: 'S11', gammaRe: a.re, gammaIm: a.im, startLabel: '1 GHz', endLabel: '2 GHz' },
      { label: 'S22', gammaRe: b.re, gammaIm: b.im, startLabel: '1 GHz', endLabel: '2 GHz' },
    ] });
    expect((svg.match(/<circle class="start"/g) ?? []).length).toBe(2);
    expect((svg.match(/<circle class="end"[^>]*fill="#ffffff"/g) ?? []).length).toBe(2);
    expect((svg.match(/<text class="end-label" data-end="start"[^>]*>1 GHz</g) ?? []).length).toBe(2);
    expect((svg.match(/<text class="end-label" data-end="end"[^>]*>2 GHz</g) ?? []).length).toBe(2);
  });

  it('a locus that returns to its start gets one label naming both ends', () => {
    const svg = smithChartSvg({ traces: [{ label: 'centre', gammaRe: [0.1, 0.2, 0.1], gammaIm: [0, 0.05, 0], startLabel: '-40°', endLabel: '40°' }] });
    expect(svg).toMatch(/data-end="both"[^>]*>-40°, 40°</);
  });

  it('the legend box lies inside the chart disc (under it when no place inside is free) and covers no locus vertex', () => {
    for (const [from, to] of [[-3, -0.2], [0.2, 3], [-1.5, 1.5]]) {
      const a = arc(0.5, from, to), b = arc(0.3, from, to);
      const svg = smithChartSvg({ traces: [{ label: 'element 30 (centre)', gammaRe: a.re, gammaIm: a.im }, { label: 'element 0 (edge)', gammaRe: b.re, gammaIm: b.im }] });
      const x = num(svg, /class="legend-box" x="([\d.-]+)"/), y = num(svg, /class="legend-box" x="[\d.-]+" y="([\d.-]+)"/);
      const w = num(svg, /class="legend-box"[^>]* width="([\d.-]+)"/), h = num(svg, /class="legend-box"[^>]* height="([\d.-]+)"/);
      const cx = num(svg, /class="unit-circle" cx="([\d.-]+)"/), cy = num(svg, /class="unit-circle" cx="[\d.-]+" cy="([\d.-]+)"/), r = num(svg, /class="unit-circle"[^>]* r="([\d.-]+)"/);
      if (from !== -1.5) {
        for (const [px, py] of [[x, y], [x + w, y], [x, y + h], [x + w, y + h]]) expect(Math.hypot(px - cx, py - cy)).toBeLessThan(r);
      } else {
        // Loci around the whole centre leave no room inside: the legend goes under the chart, in a band the SVG grows by.
        expect(y).toBeGreaterThanOrEqual(480);
        expect(y + h).toBeLessThanOrEqual(num(svg, /<svg [^>]*height="(\d+)"/));
      }
      for (const [px, py] of traceVertices(svg)) expect(px >= x && px <= x + w && py >= y && py <= y + h, `vertex (${px}, ${py}) under the legend`).toBe(false);
    }
  });
});

describe('polarCutSvg', () => {
  const taylor = () => {
    const { weights } = taylorTaper(24, 35, 5);
    const angleRad: number[] = [], valueDb: number[] = [];
    for (let k = 0; k <= 720; k++) {
      const a = -Math.PI / 2 + (Math.PI * k) / 720;
      let re = 0, im = 0;
      for (let n = 0; n < 24; n++) { const p = Math.PI * (n - 11.5) * Math.sin(a); re += weights[n] * Math.cos(p); im += weights[n] * Math.sin(p); }
      angleRad.push(a); valueDb.push(10 * Math.log10(Math.max(re * re + im * im, 1e-30)));
    }
    const peak = Math.max(...valueDb);
    return { angleRad, valueDb: valueDb.map((v) => v - peak) };
  };

  it('the default floor lies two rings under a 35 dB Taylor pattern’s sidelobes (−60 dB), so they keep a radius', () => {
    const svg = polarCutSvg({ traces: [{ label: 'Taylor', ...taylor() }] });
    expect(svg).toContain('centre -60 dB');
    // The −35 dB sidelobes sit at (60 − 35)/60 of the radius, not on the −40 dB centre.
    expect(svg).toContain('data-value="-50"');
    // Without sidelobes the floor stays −40 dB.
    expect(polarCutSvg({ traces: [{ label: 'lobe', angleRad: [-1, 0, 1], valueDb: [-20, 0, -20] }] })).toContain('centre -40 dB');
  });

  it('ring labels sit on a spoke where no trace passes (a forward beam leaves the back free)', () => {
    const angleRad: number[] = [], valueDb: number[] = [];
    for (let k = 0; k <= 180; k++) { const a = -Math.PI / 2 + (Math.PI * k) / 180; angleRad.push(a); valueDb.push(10 * Math.log10(Math.max(Math.cos(a) ** 4, 1e-4))); }
    const svg = polarCutSvg({ traces: [{ label: 'beam', angleRad, valueDb }], floorDb: -40 });
    const labels = [...svg.matchAll(/<text class="ring-label"[^>]* x="([\d.-]+)" y="([\d.-]+)"[^>]*>([^<]*)</g)];
    expect(labels.length).toBe(3); // −10, −20, −30 (outer ring and centre are named in the corner note)
    const v = traceVertices(svg);
    for (const l of labels) {
      const x = Number(l[1]), y = Number(l[2]), w = l[3].length * 6;
      for (const [px, py] of v) expect(px > x - w / 2 - 2 && px < x + w / 2 + 2 && py > y - 11 && py < y + 2, `${l[3]} over the trace at (${px}, ${py})`).toBe(false);
    }
  });
});

describe('gratingLobeDiagramSvg', () => {
  it('has a legend for the visible circle, the scan region and the grating circles, below the axes', () => {
    const svg = gratingLobeDiagramSvg({ gratingCircles: [{ u: 1.9, v: 0, radius: 1 }], scanRadius: 0.643 });
    expect(svg).toContain('visible region (sin θ = 1)');
    expect(svg).toContain('scan region (sin θ ≤ 0.643)');
    expect(svg).toContain('grating-lobe circles');
    const height = num(svg, /<svg [^>]*height="(\d+)"/);
    const y = num(svg, /class="legend-box" x="[\d.-]+" y="([\d.-]+)"/), h = num(svg, /class="legend-box"[^>]* height="([\d.-]+)"/);
    expect(y).toBeGreaterThanOrEqual(480); // under the 480 px frame of the axes
    expect(y + h).toBeLessThanOrEqual(height);
    expect((svg.match(/<rect class="legend-mark"/g) ?? []).length).toBe(2); // two region swatches and one line
  });
});
