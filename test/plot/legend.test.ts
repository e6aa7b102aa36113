/**
 * Line-plot legibility: the legend never covers plotted points, coincident and edge traces
 * stay visible, unsorted x draws no zig-zag.
 */
import { describe, it, expect } from 'vitest';
import { linePlotSvg } from '../../src/plot/index.js';

function legendBox(svg: string): { x: number; y: number; w: number; h: number } {
  const m = /<rect class="legend-box" x="([\d.-]+)" y="([\d.-]+)" width="([\d.-]+)" height="([\d.-]+)"/.exec(svg);
  if (!m) throw new Error('no legend box');
  return { x: Number(m[1]), y: Number(m[2]), w: Number(m[3]), h: Number(m[4]) };
}

function pathVertices(svg: string): number[][] {
  const out: number[][] = [];
  for (const m of svg.matchAll(/<path class="trace"[^>]* d="([^"]*)"/g)) {
    for (const p of m[1].matchAll(/[ML]([\d.-]+),([\d.-]+)/g)) out.push([Number(p[1]), Number(p[2])]);
  }
  return out;
}

const x = Array.from({ length: 41 }, (_, i) => i);

describe('linePlotSvg legend and traces', () => {
  it('puts the legend where no plotted point is, for data filling the top right, the top left or the middle', () => {
    const cases = [
      x.map((v) => v * v), // rises to the top right
      x.map((v) => (40 - v) ** 2), // falls from the top left
      x.map((v) => Math.exp(-((v - 20) ** 2) / 20)), // a peak in the middle
    ];
    for (const y of cases) {
      const svg = linePlotSvg({ xLabel: 'x [1]', yLabel: 'y [1]', traces: [{ label: 'data', x, y }, { label: 'half', x, y: y.map((v) => v / 2) }] });
      const b = legendBox(svg);
      for (const [px, py] of pathVertices(svg)) {
        expect(px >= b.x && px <= b.x + b.w && py >= b.y && py <= b.y + b.h, `vertex (${px}, ${py}) under the legend`).toBe(false);
      }
    }
  });

  it('when every place inside covers data, the legend goes below the plot and the SVG grows', () => {
    const noisy = x.map((v) => (v % 2 === 0 ? 0 : 1));
    const svg = linePlotSvg({ xLabel: 'x', yLabel: 'y', traces: [{ label: 'a', x, y: noisy }, { label: 'b', x, y: noisy.map((v) => 1 - v) }] });
    const height = Number(/<svg [^>]*height="(\d+)"/.exec(svg)![1]);
    expect(height).toBeGreaterThan(400);
    expect(legendBox(svg).y).toBeGreaterThanOrEqual(400);
  });

  it('a trace identical to an earlier one is dashed, marked and named in the legend; sparse and zero traces get markers', () => {
    const y = [1, 2, 3, 2, 1];
    const svg = linePlotSvg({ xLabel: 'x', yLabel: 'y', traces: [{ label: 'S21', x: [0, 1, 2, 3, 4], y }, { label: 'S12', x: [0, 1, 2, 3, 4], y }, { label: 'zero', x: [0, 1, 2, 3, 4], y: [0, 0, 0, 0, 0] }] });
    expect(svg).toContain('S12 (coincides with S21)');
    expect(svg).toMatch(/data-label="S12"[^>]*stroke-dasharray/);
    expect((svg.match(/<rect class="marker"/g) ?? []).length).toBe(5); // squares on the twin
    expect((svg.match(/<circle class="marker"/g) ?? []).length).toBe(10); // circles on the sparse S21 and the zero trace
  });

  it('unsorted x is drawn in x order (no zig-zag)', () => {
    const svg = linePlotSvg({ xLabel: 'x', yLabel: 'y', traces: [{ label: 'a', x: [30, -30, 0, 10, -10], y: [1, 1, 0, 0.2, 0.2] }] });
    const xs = pathVertices(svg).map((v) => v[0]);
    expect(xs).toEqual([...xs].sort((p, q) => p - q));
  });
});

describe('linePlotSvg yFromZero', () => {
  it('a ratio-scale axis starts at zero, so an 8 % swing does not fill the plot', () => {
    const y = x.map((v) => 0.07 + 0.006 * Math.sin(v / 6)); // 0.064 … 0.076, an ~17 % swing
    const ticks = (svg: string) => [...svg.matchAll(/<text class="tick-y" data-value="([^"]*)"/g)].map((m) => Number(m[1]));
    const plain = linePlotSvg({ xLabel: 'x [1]', yLabel: 'y [1]', traces: [{ label: 'A_e/T_sys', x, y }] });
    const zero = linePlotSvg({ xLabel: 'x [1]', yLabel: 'y [1]', yFromZero: true, traces: [{ label: 'A_e/T_sys', x, y }] });
    expect(Math.min(...ticks(plain))).toBeGreaterThan(0.05);
    expect(Math.min(...ticks(zero))).toBe(0);
  });
});
