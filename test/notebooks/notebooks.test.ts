/**
 * Notebooks never rot: every example notebook (examples/notebooks/*.ipynb) runs here, cell by
 * cell in order, against the built package imported by name (scripts/notebooks/kernel.ts; no
 * Python or Jupyter), and every stored output is checked against the fresh one: text to its
 * stated digits, figures by their SVG structure (scripts/notebooks/compare.ts). Regenerate the
 * stored outputs with `npm run notebooks:update`.
 */
import { describe, it, expect } from 'vitest';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { NOTEBOOK_DIR, executeNotebook, joined, readNotebook } from '../../scripts/notebooks/kernel.js';
import { compareOutputs, compareSvg, compareText } from '../../scripts/notebooks/compare.js';

const names = readdirSync(NOTEBOOK_DIR).filter((f) => f.endsWith('.ipynb')).sort();

describe('example notebooks', () => {
  it('there are at least three, for the TypeScript kernel tslab, with stored outputs', () => {
    expect(names.length).toBeGreaterThanOrEqual(3);
    for (const name of names) {
      const nb = readNotebook(join(NOTEBOOK_DIR, name));
      expect(nb.nbformat, name).toBe(4);
      expect(nb.metadata.kernelspec?.name, name).toBe('tslab');
      expect(nb.metadata.kernelspec?.language, name).toBe('typescript');
      const code = nb.cells.filter((c) => c.cell_type === 'code');
      expect(code.length, name).toBeGreaterThan(2);
      expect(code.every((c) => typeof c.execution_count === 'number'), `${name}: run \`npm run notebooks:update\``).toBe(true);
      expect(code.some((c) => (c.outputs ?? []).some((o) => 'data' in o && 'image/svg+xml' in o.data)), `${name} shows a figure`).toBe(true);
    }
  });

  for (const name of names) {
    it(`${name} runs and reproduces its stored outputs`, () => {
      const path = join(NOTEBOOK_DIR, name);
      const nb = readNotebook(path);
      const run = executeNotebook(path);
      expect(run.error, run.error ? `cell ${run.error.cell}: ${run.error.ename}: ${run.error.evalue}` : '').toBeNull();
      const problems: string[] = [];
      nb.cells.forEach((cell, k) => {
        if (cell.cell_type !== 'code') return;
        problems.push(...compareOutputs(cell.outputs ?? [], run.outputs.get(k) ?? [], `${name}, cell ${k}`));
      });
      expect(problems).toEqual([]);
      // No stored text shows NaN (a result that a check should have caught).
      const text = nb.cells.flatMap((c) => c.outputs ?? []).map((o) => ('text' in o ? joined(o.text) : 'data' in o ? joined(o.data['text/plain']) : '')).join('\n');
      expect(text).not.toMatch(/\bNaN\b/);
    }, 300_000);
  }
});

describe('the output comparison', () => {
  it('numbers agree to their stated digits, words exactly', () => {
    expect(compareText('T_rec = 136.2 K', 'T_rec = 136.25 K', 'a')).toEqual([]);
    expect(compareText('T_rec = 136.2 K', 'T_rec = 136.4 K', 'a')).toHaveLength(1);
    expect(compareText('x 1.5e-4 m²/K', 'x 1.6e-4 m²/K', 'a')).toEqual([]);
    expect(compareText('x 1.5e-4 m²/K', 'x 1.7e-4 m²/K', 'a')).toHaveLength(1);
    expect(compareText('−30.02 dB', '−30.03 dB', 'a')).toEqual([]);
    expect(compareText('A  12.5', 'A 12.5', 'a')).toEqual([]);
    expect(compareText('feed-A1: T', 'feed-A2: T', 'a')).toHaveLength(1);
    expect(compareText('T_sys', 'T_rec', 'a')).toHaveLength(1);
  });
  it('figures agree by structure, not bytes', () => {
    const svg = (points: number, d: string): string => `<svg xmlns="http://www.w3.org/2000/svg" width="640" height="400" aria-label="t"><text class="title" x="1" y="2">t</text><path class="trace" data-label="a" data-points="${points}" d="${d}"/></svg>`;
    expect(compareSvg(svg(3, 'M0,0L1,1L2,2'), svg(3, 'M0,0L1,1.01L2,2'), 'f')).toEqual([]);
    expect(compareSvg(svg(3, 'M0,0'), svg(4, 'M0,0'), 'f')).toHaveLength(1);
    expect(compareSvg(svg(3, 'M0,0'), '<svg><path', 'f')[0]).toMatch(/not well-formed/);
  });
});
