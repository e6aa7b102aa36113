/**
 * Figures shown inline: the MIME bundle notebook kernels display, the REPL summary, and the file
 * written in one call.
 */
import { describe, it, expect } from 'vitest';
import { inspect } from 'node:util';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import { figure, figureMimeBundle, patternCutSvg, polarCutSvg } from '../../src/plot/index.js';
import { writeFigure } from '../../src/node.js';
import { DomainError } from '../../src/errors.js';
import { show } from '../../src/index.js';

const cut = patternCutSvg({ title: 'cut <A & B>', traces: [{ label: 'uniform', angleRad: [-1, 0, 1], valueDb: [-20, 0, -20] }] });

describe('figure', () => {
  const fig = figure(cut);
  it('reads size and title from the SVG', () => {
    expect(fig.widthPx).toBe(640);
    expect(fig.heightPx).toBe(400);
    expect(fig.title).toBe('cut <A & B>');
    expect(Object.keys(fig)).toEqual(['svg', 'title', 'widthPx', 'heightPx']);
    expect(figure(polarCutSvg({ traces: [{ label: 'p', angleRad: [0, 1, 2], valueDb: [0, -3, -10] }] }), 'polar').title).toBe('polar');
  });
  it('gives the MIME bundle under the Jupyter display symbol: valid SVG and a text summary', () => {
    const bundle = (fig as unknown as Record<symbol, () => Record<string, string>>)[Symbol.for('Jupyter.display')]();
    expect(bundle).toEqual(figureMimeBundle(fig));
    expect(XMLValidator.validate(bundle['image/svg+xml'])).toBe(true);
    const root = new XMLParser({ ignoreAttributes: false, attributeNamePrefix: '' }).parse(bundle['image/svg+xml']).svg;
    expect(root.width).toBe('640');
    expect(bundle['text/plain']).toBe('Figure 640×400 px "cut <A & B>" (SVG, ' + cut.length + ' characters)');
  });
  it('prints a summary in the REPL, is its SVG as a string, and stays plain data', () => {
    expect(inspect(fig)).toBe(show(fig));
    expect(String(fig)).toBe(cut);
    expect(JSON.parse(JSON.stringify(fig))).toEqual({ svg: cut, title: 'cut <A & B>', widthPx: 640, heightPx: 400 });
  });
  it('rejects text that is not an SVG element', () => {
    expect(() => figure('<div/>')).toThrow(DomainError);
    expect(() => figure('<svg viewBox="0 0 1 1"></svg>')).toThrow(/width and height/);
  });
  it('writes the file in one call', () => {
    const dir = mkdtempSync(join(tmpdir(), 'phasewise-fig-'));
    try {
      const p = writeFigure(fig, join(dir, 'cut.svg'));
      expect(readFileSync(p, 'utf8')).toBe(cut);
      expect(() => writeFigure(fig, join(dir, 'cut.png'))).toThrow(DomainError);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});
