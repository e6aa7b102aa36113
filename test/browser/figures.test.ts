/**
 * Every figure a user gets — the report folders of the demo and of the shipped example designs,
 * the figures the example scripts write, and the playground's plots — laid out by a real browser
 * (Debian's chromium driven by playwright-core) and checked by its own geometry:
 * - no two text labels overlap, and no label leaves the figure;
 * - no plotted point of a trace lies under the legend box;
 * - a trace that coincides with another everywhere is drawn with markers, so it stays visible;
 * - every trace has a legend entry when the figure has a legend.
 * Screenshots land in reports/figures/ for a person to look at.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { inspectFigure } from '../helpers/figureGeometry.js';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const CHROMIUM = '/usr/bin/chromium';

function collectSvgs(folder: string, prefix: string): Array<{ name: string; svg: string }> {
  return readdirSync(folder).filter((f) => f.endsWith('.svg')).sort().map((f) => ({ name: `${prefix}/${f}`, svg: readFileSync(join(folder, f), 'utf8') }));
}

describe('every figure passes the browser layout check', () => {
  let context: BrowserContext | undefined;
  let page: Page;
  let work = '';
  let userDataDir = '';
  const figures: Array<{ name: string; svg: string }> = [];

  beforeAll(async () => {
    if (!existsSync(join(root, 'dist', 'cli.js'))) throw new Error('dist/cli.js is missing: run `npm run build` first (`npm test` does).');
    if (!existsSync(CHROMIUM)) throw new Error(`${CHROMIUM} not found: install Debian's chromium (.ci/run does this when it is missing).`);
    work = mkdtempSync(join(tmpdir(), 'phasewise-figures-'));
    const cli = (args: string[]) => execFileSync(process.execPath, [join(root, 'dist', 'cli.js'), ...args], { cwd: work, stdio: ['ignore', 'pipe', 'pipe'] });
    cli(['demo', '--out', join(work, 'demo'), '--no-progress']);
    figures.push(...collectSvgs(join(work, 'demo'), 'demo'));
    for (const d of readdirSync(join(root, 'examples', 'designs')).filter((f) => f.endsWith('.json')).sort()) {
      const out = join(work, d.replace(/\.json$/, ''));
      try {
        cli(['evaluate', join(root, 'examples', 'designs', d), '--out', out, '--no-progress']);
      } catch (e) {
        // Exit 3 (a failed check) still writes the report; its figures are checked like the others.
        if ((e as { status?: number }).status !== 3) throw e;
      }
      figures.push(...collectSvgs(out, d));
    }
    // The example scripts write their figures to examples-output/ under the working directory.
    for (const f of readdirSync(join(root, 'examples')).filter((x) => x.endsWith('.ts')).sort()) {
      execFileSync(join(root, 'node_modules', '.bin', 'tsx'), [join(root, 'examples', f)], { cwd: work, stdio: ['ignore', 'pipe', 'pipe'] });
    }
    if (existsSync(join(work, 'examples-output'))) figures.push(...collectSvgs(join(work, 'examples-output'), 'examples'));
    userDataDir = mkdtempSync(join(tmpdir(), 'phasewise-chromium-'));
    context = await chromium.launchPersistentContext(userDataDir, {
      executablePath: CHROMIUM, headless: true, viewport: { width: 1000, height: 800 },
      args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
    });
    page = context.pages()[0] ?? await context.newPage();
    mkdirSync(join(root, 'reports', 'figures'), { recursive: true });
  }, 300_000);

  afterAll(async () => {
    await context?.close();
    if (userDataDir) rmSync(userDataDir, { recursive: true, force: true });
    if (work) rmSync(work, { recursive: true, force: true });
  });

  it('finds the figures of the demo, every example design and every example script', () => {
    expect(figures.filter((f) => f.name.startsWith('demo/')).length).toBeGreaterThanOrEqual(5);
    expect(figures.filter((f) => f.name.startsWith('examples/')).length).toBeGreaterThanOrEqual(2);
  });

  it('no overlapping or clipped labels, nothing under a legend, no hidden trace', async () => {
    const failures: string[] = [];
    for (const f of figures) {
      await page.setContent(`<!doctype html><html><body style="margin:0;background:#fff"><div id="fig" style="display:inline-block">${f.svg}</div></body></html>`);
      const p = await page.evaluate(inspectFigure, '#fig svg');
      await page.locator('#fig').screenshot({ path: join(root, 'reports', 'figures', `${f.name.replace(/[^a-z0-9.-]+/gi, '_')}.png`) });
      expect(p.texts, `${f.name} has no text`).toBeGreaterThan(0);
      for (const [kind, list] of [['overlapping labels', p.textOverlaps], ['labels outside the figure', p.textOutside], ['points under the legend', p.underLegend], ['hidden traces', p.hiddenTraces]] as const) {
        if (list.length > 0) failures.push(`${f.name}: ${kind}: ${list.slice(0, 4).join('; ')}${list.length > 4 ? ` (+${list.length - 4})` : ''}`);
      }
    }
    expect(failures, failures.join('\n')).toEqual([]);
  }, 300_000);
});
