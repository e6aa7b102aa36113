import { describe, it, expect } from 'vitest';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { decode } from 'fast-png';
import {
  linePlotSvg, patternCutSvg, polarCutSvg, uvMapSvg, uvMapColor, smithChartSvg, gratingLobeDiagramSvg, zeroPlotSvg,
} from '../../src/plot/index.js';
import { DimensionError, DomainError } from '../../src/errors.js';

const parser = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '' });

/** All elements with a given tag anywhere in a parsed tree. */
function findAll(node: unknown, tag: string, out: Record<string, string>[] = []): Record<string, string>[] {
  if (Array.isArray(node)) { node.forEach((n) => findAll(n, tag, out)); return out; }
  if (node && typeof node === 'object') {
    for (const [k, v] of Object.entries(node)) {
      if (k === tag) (Array.isArray(v) ? v : [v]).forEach((e) => out.push(e as Record<string, string>));
      findAll(v, tag, out);
    }
  }
  return out;
}

function parse(svg: string) {
  expect(XMLValidator.validate(svg)).toBe(true);
  return parser.parse(svg);
}

/** Coordinates of an SVG path made only of M/L commands. */
function pathPoints(d: string): [number, number][] {
  return [...d.matchAll(/[ML]\s*(-?[\d.]+),\s*(-?[\d.]+)/g)].map((m) => [Number(m[1]), Number(m[2])]);
}

describe('linePlotSvg and patternCutSvg', () => {
  const theta = Array.from({ length: 181 }, (_, i) => ((i - 90) * Math.PI) / 180);
  // A sin(x)/x-shaped test pattern (any data serve; the checks are about rendering).
  const db = theta.map((t) => { const x = 8 * Math.sin(t); return x === 0 ? 0 : 20 * Math.log10(Math.abs(Math.sin(x) / x)); });

  it('is valid XML, deterministic, and has one path per trace with the right point count', () => {
    const svg = patternCutSvg({ traces: [{ label: 'uniform', angleRad: theta, valueDb: db }, { label: 'half', angleRad: theta.slice(0, 50), valueDb: db.slice(0, 50) }], floorDb: -40, title: 'cut' });
    expect(svg).toBe(patternCutSvg({ traces: [{ label: 'uniform', angleRad: theta, valueDb: db }, { label: 'half', angleRad: theta.slice(0, 50), valueDb: db.slice(0, 50) }], floorDb: -40, title: 'cut' }));
    const tree = parse(svg);
    const paths = findAll(tree, 'path').filter((p) => p.class === 'trace');
    expect(paths.map((p) => Number(p['data-points']))).toEqual([181, 50]);
    expect(pathPoints(paths[0].d).length).toBe(181);
  });
  it('axis ticks cover the data range and the floor clamps nulls', () => {
    const svg = patternCutSvg({ traces: [{ label: 'p', angleRad: theta, valueDb: db.map((v, i) => (i === 10 ? -Infinity : v)) }], floorDb: -40 });
    const tree = parse(svg);
    const xt = findAll(tree, 'text').filter((t) => t.class === 'tick-x').map((t) => Number(t['data-value']));
    const yt = findAll(tree, 'text').filter((t) => t.class === 'tick-y').map((t) => Number(t['data-value']));
    expect(Math.min(...xt)).toBe(-90);
    expect(Math.max(...xt)).toBe(90);
    expect(Math.min(...yt)).toBe(-40);
    expect(Math.max(...yt)).toBe(0);
    // Every plotted y pixel lies inside the frame (values below the floor are clamped).
    const frame = findAll(tree, 'rect').find((r) => r.class === 'frame')!;
    const top = Number(frame.y), bottom = top + Number(frame.height);
    const pts = pathPoints(findAll(tree, 'path').find((p) => p.class === 'trace')!.d);
    expect(pts.every(([, y]) => y >= top - 0.01 && y <= bottom + 0.01)).toBe(true);
    expect(svg).toContain('θ [deg]');
    expect(svg).toContain('relative power [dB]');
  });
  it('line plot maps data linearly onto the axes', () => {
    const svg = linePlotSvg({ traces: [{ label: 'T', x: [0, 10, 20], y: [100, 150, 200] }], xLabel: 'scan [deg]', yLabel: 'T_sys [K]', xRange: [0, 20], yRange: [100, 200] });
    const tree = parse(svg);
    const pts = pathPoints(findAll(tree, 'path').find((p) => p.class === 'trace')!.d);
    // Equal steps in data give equal steps in pixels (to the 0.01 px rounding).
    expect(Math.abs((pts[1][0] - pts[0][0]) - (pts[2][0] - pts[1][0]))).toBeLessThan(0.02);
    expect(Math.abs((pts[1][1] - pts[0][1]) - (pts[2][1] - pts[1][1]))).toBeLessThan(0.02);
    expect(pts[2][1]).toBeLessThan(pts[0][1]); // larger values are higher up
  });
  it('bad input', () => {
    expect(() => linePlotSvg({ traces: [], xLabel: 'x', yLabel: 'y' })).toThrow(DimensionError);
    expect(() => linePlotSvg({ traces: [{ label: 'a', x: [0, 1], y: [1] }], xLabel: 'x', yLabel: 'y' })).toThrow(DimensionError);
    expect(() => linePlotSvg({ traces: [{ label: 'a', x: [0, 1], y: [1, Infinity] }], xLabel: 'x', yLabel: 'y' })).toThrow(DomainError);
    expect(() => patternCutSvg({ traces: [{ label: 'a', angleRad: [0], valueDb: [NaN] }] })).toThrow(DomainError);
    expect(() => linePlotSvg({ traces: [{ label: 'a', x: [0, 1], y: [0, 1] }], xLabel: 'x', yLabel: 'y', widthPx: 10 })).toThrow(DomainError);
  });
});

describe('polarCutSvg', () => {
  it('places boresight at the top and the ceiling on the outer ring', () => {
    const svg = polarCutSvg({ traces: [{ label: 'p', angleRad: [0, Math.PI / 2], valueDb: [0, -40] }], floorDb: -40, ceilingDb: 0 });
    const tree = parse(svg);
    const rings = findAll(tree, 'circle').filter((c) => c.class === 'ring');
    expect(rings.map((r) => Number(r['data-value']))).toEqual([0, -10, -20, -30, -40]);
    const outer = rings[0];
    const pts = pathPoints(findAll(tree, 'path').find((p) => p.class === 'trace')!.d);
    expect(pts[0][0]).toBeCloseTo(Number(outer.cx), 1);
    expect(Number(outer.cy) - pts[0][1]).toBeCloseTo(Number(outer.r), 1);
    expect(pts[1][0]).toBeCloseTo(Number(outer.cx), 1); // floor level sits at the centre
  });
});

describe('uvMapSvg', () => {
  it('raster pixels follow the colour scale, NaN is transparent, and v increases upward', () => {
    const u = [-1, 0, 1], v = [-1, 0, 1];
    const val = [-40, -20, NaN, -10, 0, -5, -30, -35, -39];
    const svg = uvMapSvg({ u, v, valueDb: val, floorDb: -40, ceilingDb: 0 });
    const tree = parse(svg);
    const img = findAll(tree, 'image').find((i) => i.class === 'raster')!;
    const b64 = img.href.replace('data:image/png;base64,', '');
    const png = decode(Uint8Array.from(atob(b64), (c) => c.charCodeAt(0)));
    expect([png.width, png.height]).toEqual([3, 3]);
    const px = (row: number, col: number) => Array.from(png.data.slice(4 * (row * 3 + col), 4 * (row * 3 + col) + 4));
    // Sample (v = −1, u = −1) is the bottom-left pixel (image row 2).
    expect(px(2, 0)).toEqual([...uvMapColor(-40, -40, 0), 255]);
    expect(px(1, 1)).toEqual([...uvMapColor(0, -40, 0), 255]);
    expect(px(2, 2)[3]).toBe(0); // NaN → transparent
    // viridis endpoints (matplotlib's table): dark purple #440154 at 0, yellow #fde725 at 1.
    expect(uvMapColor(-40, -40, 0)).toEqual([0x44, 0x01, 0x54]);
    expect(uvMapColor(0, -40, 0)).toEqual([0xfd, 0xe7, 0x25]);
    const bar = findAll(tree, 'g').find((g) => g.class === 'colorbar')!;
    expect(Number(bar['data-floor'])).toBe(-40);
  });
  it('bad input', () => {
    expect(() => uvMapSvg({ u: [0, 1], v: [0, 1], valueDb: [0, 0, 0] })).toThrow(DimensionError);
    expect(() => uvMapSvg({ u: [0, 1], v: [0, 1], valueDb: [0, 0, 0, 0], floorDb: 0, ceilingDb: -1 })).toThrow(DomainError);
  });
});

describe('smithChartSvg', () => {
  it('Γ = 0 is the centre and the r = 1 circle passes through it (z = 1 ↔ Γ = 0)', () => {
    const svg = smithChartSvg({ traces: [{ label: 'port 1', gammaRe: [0, 0.5], gammaIm: [0, -0.2] }] });
    const tree = parse(svg);
    const unit = findAll(tree, 'circle').find((c) => c.class === 'unit-circle')!;
    const pts = pathPoints(findAll(tree, 'path').find((p) => p.class === 'trace')!.d);
    expect(pts[0]).toEqual([Number(unit.cx), Number(unit.cy)]);
    const r1 = findAll(tree, 'circle').find((c) => c.class === 'r-circle' && c['data-value'] === '1')!;
    expect(Math.abs(Number(r1.cx) - Number(r1.r) - Number(unit.cx))).toBeLessThan(0.02);
    expect(svg).toContain('normalised to 50 Ω');
  });
});

describe('circle diagrams', () => {
  it('grating-lobe diagram draws one circle per image and the scan region', () => {
    const svg = gratingLobeDiagramSvg({ gratingCircles: [{ u: 1.5, v: 0, radius: 1 }, { u: -1.5, v: 0, radius: 1 }], scanRadius: 0.5 });
    const tree = parse(svg);
    expect(findAll(tree, 'ellipse').filter((e) => e.class === 'grating').length).toBe(2);
    expect(() => gratingLobeDiagramSvg({ gratingCircles: [], scanRadius: 1.2 })).toThrow(DomainError);
  });
  it('zero plot marks every zero and the visible arc', () => {
    const zr = [Math.cos(2), Math.cos(4)], zi = [Math.sin(2), Math.sin(4)];
    const svg = zeroPlotSvg({ zerosRe: zr, zerosIm: zi, visibleStartRad: -Math.PI, visibleEndRad: Math.PI });
    const tree = parse(svg);
    expect(findAll(tree, 'circle').filter((c) => c.class === 'zero').length).toBe(2);
    expect(() => zeroPlotSvg({ zerosRe: [1], zerosIm: [], visibleStartRad: 0, visibleEndRad: 1 })).toThrow(DimensionError);
  });
});

describe('clip paths of plots inlined in one document', () => {
  // An HTML page holds one id space: each plot must reference its own clip shape, and plots of
  // different sizes must not share a clip id (else the second is clipped to the first's area).
  const clipIds = (svg: string) => ({
    defined: [...svg.matchAll(/<clipPath id="([^"]+)"/g)].map((m) => m[1]),
    used: [...new Set([...svg.matchAll(/clip-path="url\(#([^)]+)\)"/g)].map((m) => m[1]))],
  });
  const trace = { label: 'a', x: [0, 1, 2], y: [0, -3, -1] };
  const plots = [
    linePlotSvg({ traces: [trace], xLabel: 'x', yLabel: 'y', widthPx: 400, heightPx: 300 }),
    linePlotSvg({ traces: [trace], xLabel: 'x', yLabel: 'y', widthPx: 520, heightPx: 340 }),
    smithChartSvg({ traces: [{ label: 'S11', gammaRe: [0.1, 0.2], gammaIm: [0, 0.1] }], widthPx: 300, heightPx: 300 }),
    smithChartSvg({ traces: [{ label: 'S11', gammaRe: [0.1, 0.2], gammaIm: [0, 0.1] }], widthPx: 420, heightPx: 420 }),
    gratingLobeDiagramSvg({ gratingCircles: [{ u: 1.5, v: 0, radius: 1 }], scanRadius: 0.5, widthPx: 300, heightPx: 300 }),
    gratingLobeDiagramSvg({ gratingCircles: [{ u: 1.5, v: 0, radius: 1 }], scanRadius: 0.5, widthPx: 400, heightPx: 400 }),
  ];

  it('each plot uses only the clip path it defines', () => {
    for (const svg of plots) {
      const { defined, used } = clipIds(svg);
      expect(defined).toHaveLength(1);
      expect(used).toEqual(defined);
    }
  });

  it('plots of different geometry get different ids; the same plot twice gets the same (deterministic) id', () => {
    const ids = plots.map((svg) => clipIds(svg).defined[0]);
    expect(new Set(ids).size).toBe(ids.length);
    expect(clipIds(linePlotSvg({ traces: [trace], xLabel: 'x', yLabel: 'y', widthPx: 400, heightPx: 300 })).defined[0]).toBe(ids[0]);
    for (const id of ids) expect(id).toMatch(/^[A-Za-z][\w-]*$/);
  });
});
