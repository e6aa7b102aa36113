/**
 * The playground page in a real browser (Debian's chromium driven by playwright-core):
 * the page is built with Vite from the BUILT library (dist/, written by `npm run build`,
 * which `npm test` runs first), served on 127.0.0.1, and its numbers are compared with the
 * library's own results for the same inputs. A screenshot is saved to reports/.
 */
import { describe, it, expect, beforeAll, afterAll } from 'vitest';
import { execFileSync } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync, statSync } from 'node:fs';
import { createServer, type Server } from 'node:http';
import { tmpdir } from 'node:os';
import { dirname, extname, join, normalize, resolve, sep } from 'node:path';
import { fileURLToPath } from 'node:url';
import type { AddressInfo } from 'node:net';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { inspectFigure } from '../helpers/figureGeometry.js';
import {
  uniformLineLayout, dolphChebyshevTaper, fromParts, hadamard, steeringVector, directivity, linearArrayFigures,
  patternEvaluator, cutFigures, wavelengthM, radToDeg, parseTouchstone, ParseError, dipoleArrayPorts,
  evaluateReceivingArray, skyAndGroundEnvironment, sphereQuadrature, taylorTaper, fromRows, createMultiport, formatTouchstone,
  type WireDipole,
} from '../../src/index.js';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const pageDist = join(root, 'playground', 'dist');
const CHROMIUM = '/usr/bin/chromium';
const TYPES: Record<string, string> = {
  '.html': 'text/html; charset=utf-8', '.js': 'text/javascript; charset=utf-8', '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml', '.png': 'image/png', '.map': 'application/json',
};

/** A tiny static file server for playground/dist on a random free port of 127.0.0.1. */
function serveStatic(dir: string): Promise<Server> {
  const server = createServer((req, res) => {
    const path = decodeURIComponent(new URL(req.url ?? '/', 'http://127.0.0.1').pathname);
    const file = normalize(join(dir, path === '/' ? 'index.html' : path));
    if (!file.startsWith(dir + sep) || !existsSync(file) || !statSync(file).isFile()) {
      res.writeHead(404, { 'content-type': 'text/plain' }).end('not found');
      return;
    }
    res.writeHead(200, { 'content-type': TYPES[extname(file)] ?? 'application/octet-stream' }).end(readFileSync(file));
  });
  return new Promise((ok) => server.listen(0, '127.0.0.1', () => ok(server)));
}

/** The full-precision number a figure element carries in data-value. */
async function figure(page: Page, id: string): Promise<number> {
  const raw = await page.locator(`#${id}`).getAttribute('data-value');
  return raw === null || raw === '' ? NaN : Number(raw);
}

/** Waits until a figure's data-value differs from `before`. */
async function figureChange(page: Page, id: string, before: string | null): Promise<void> {
  await page.waitForFunction(
    ([sel, old]) => { const v = document.querySelector(sel)?.getAttribute('data-value'); return !!v && v !== old; },
    [`#${id}`, before] as const,
  );
}

/** Waits (up to 5 s) for an element's text to contain `text`, then asserts it (so a failure shows the text). */
async function expectText(page: Page, selector: string, text: string): Promise<void> {
  await page.waitForFunction(([sel, t]) => (document.querySelector(sel)?.textContent ?? '').includes(t), [selector, text] as const, { timeout: 5000 })
    .catch(() => undefined);
  expect(await page.locator(selector).textContent()).toContain(text);
}

/** The library's values for the designer's inputs: N isotropic elements on x, spacing d, taper t, scan θ₀ in xz. */
function designerReference(taper: Float64Array, spacingM: number, frequencyHz: number, scanRad: number) {
  const layout = uniformLineLayout(taper.length, spacingM);
  const dir: [number, number, number] = [Math.sin(scanRad), 0, Math.cos(scanRad)];
  const w = hadamard(fromParts(taper, null, taper.length), steeringVector(layout, dir, frequencyHz));
  const ev = patternEvaluator(layout, w, frequencyHz);
  return {
    weights: w,
    directivity: directivity(layout, w, dir, frequencyHz),
    cut: cutFigures((t) => ev.magnitudeAt(Math.sin(t), 0, Math.cos(t)), -Math.PI / 2, Math.PI / 2),
  };
}

describe('playground page in chromium', () => {
  let server: Server | undefined;
  let context: BrowserContext | undefined;
  let page: Page;
  let origin = '';
  let userDataDir = '';
  const consoleErrors: string[] = [];
  const foreignRequests: string[] = [];

  beforeAll(async () => {
    if (!existsSync(join(root, 'dist', 'index.js')) || !existsSync(join(root, 'dist', 'plot.js'))) {
      throw new Error('dist/index.js or dist/plot.js is missing: run `npm run build` first (`npm test` does).');
    }
    if (!existsSync(CHROMIUM)) {
      throw new Error(`${CHROMIUM} not found: install Debian's chromium (\`apt-get update && apt-get install -y chromium\`; .ci/run does this when it is missing).`);
    }
    execFileSync(process.execPath, [join(root, 'node_modules', 'vite', 'bin', 'vite.js'), 'build', '--config', 'playground/vite.config.ts', '--logLevel', 'error'], {
      cwd: root, stdio: ['ignore', 'pipe', 'pipe'],
    });
    server = await serveStatic(pageDist);
    origin = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
    userDataDir = mkdtempSync(join(tmpdir(), 'phasewise-chromium-'));
    context = await chromium.launchPersistentContext(userDataDir, {
      executablePath: CHROMIUM,
      headless: true,
      viewport: { width: 1280, height: 900 },
      args: ['--no-sandbox', '--disable-gpu', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync', '--disable-quic'],
    });
    page = context.pages()[0] ?? await context.newPage();
    page.on('console', (m) => { if (m.type() === 'error') consoleErrors.push(m.text()); });
    page.on('pageerror', (e) => consoleErrors.push(`uncaught: ${e.message}`));
    page.on('request', (r) => {
      const u = new URL(r.url());
      if (u.protocol !== 'data:' && u.protocol !== 'blob:' && u.hostname !== '127.0.0.1') foreignRequests.push(r.url());
    });
    await page.goto(`${origin}/`);
    await page.waitForSelector('body[data-ready="yes"]');
    await page.waitForFunction(() => !!document.querySelector('#designer-directivity')?.getAttribute('data-value')
      && !!document.querySelector('#sens-tsys')?.getAttribute('data-value'));
    mkdirSync(join(root, 'reports'), { recursive: true });
    await page.screenshot({ path: join(root, 'reports', 'playground-initial.png'), fullPage: true });
  }, 120_000);

  afterAll(async () => {
    await context?.close();
    if (server) await new Promise((ok) => server!.close(ok));
    if (userDataDir) rmSync(userDataDir, { recursive: true, force: true });
  });

  it('array designer: the default 16-element λ/2 Dolph–Chebyshev 30 dB line shows the library\'s figures', async () => {
    const f = 3e9, d = wavelengthM(f) / 2;
    const taper = dolphChebyshevTaper(16, 30);
    const ref = designerReference(taper, d, f, 0);
    // Same calls in Node and in the page: equal to rounding of the transcendental functions.
    expect(await figure(page, 'designer-directivity')).toBeCloseTo(ref.directivity.directivityDb, 10);
    expect(await figure(page, 'designer-beamwidth')).toBeCloseTo(radToDeg(ref.cut.halfPowerWidth as number), 9);
    expect(await figure(page, 'designer-sidelobe')).toBeCloseTo(ref.cut.peakSidelobeDb as number, 9);
    expect(await figure(page, 'designer-count-out')).toBe(16);
    // Outside checks: the closed-form line directivity Σ sinc (Balanis, Antenna Theory, 4th ed., 2016, §6.4,
    // from memory) agrees with the sphere quadrature, and a Dolph–Chebyshev design has equal sidelobes at
    // the design level (C. L. Dolph, Proc. IRE 34(6), 1946, from memory).
    const closed = linearArrayFigures(ref.weights, d, f);
    expect(await figure(page, 'designer-directivity')).toBeCloseTo(closed.directivityDb, 9);
    expect(await figure(page, 'designer-sidelobe')).toBeCloseTo(-30, 2);
    await expectText(page, '#designer-grating', 'No grating lobe');
  });

  it('array designer: changing inputs redraws the plots and updates the figures', async () => {
    const cutBefore = await page.locator('#designer-cut').innerHTML();
    const uvBefore = await page.locator('#designer-uv').innerHTML();
    const dBefore = await page.locator('#designer-directivity').getAttribute('data-value');
    await page.selectOption('#designer-taper', 'uniform');
    await figureChange(page, 'designer-directivity', dBefore);
    // Uniform λ/2 line at broadside: D = N exactly (Balanis 2016, §6.4, from memory).
    expect(10 ** ((await figure(page, 'designer-directivity')) / 10)).toBeCloseTo(16, 8);
    expect(await figure(page, 'designer-sidelobe')).toBeCloseTo(-13.15, 1); // uniform line, −13.26 dB as N → ∞
    expect(await page.locator('#designer-cut').innerHTML()).not.toBe(cutBefore);
    expect(await page.locator('#designer-cut svg').count()).toBe(1);

    // Scan to 40° with spacing 0.8 λ: a grating lobe at u = sin 40° − 1/0.8 = −0.607 (Floquet image).
    const uvUniform = await page.locator('#designer-uv').innerHTML();
    const d2 = await page.locator('#designer-directivity').getAttribute('data-value');
    await page.fill('#designer-spacing', '0.8');
    await page.fill('#designer-scan', '40');
    await figureChange(page, 'designer-directivity', d2);
    // (two edits: the grating-lobe text below waits for the second)
    await expectText(page, '#designer-grating', 'Grating lobes in visible space (1)');
    await expectText(page, '#designer-grating', `u = ${(Math.sin((40 * Math.PI) / 180) - 1 / 0.8).toFixed(3)}`);
    expect(await page.locator('#designer-uv').innerHTML()).not.toBe(uvUniform);
    expect(uvBefore).not.toBe(uvUniform);
    const f = 3e9;
    const ref = designerReference(new Float64Array(16).fill(1), 0.8 * wavelengthM(f), f, (40 * Math.PI) / 180);
    expect(await figure(page, 'designer-directivity')).toBeCloseTo(ref.directivity.directivityDb, 10);

    // Taylor n̄ = 5, 35 dB on the same scanned line: the page's weights are the library's.
    const taylor = designerReference(taylorTaper(16, 35, 5).weights, 0.8 * wavelengthM(f), f, (40 * Math.PI) / 180);
    await page.selectOption('#designer-taper', 'taylor');
    await page.fill('#designer-sll', '35');
    // Two edits, each redrawing after a short pause: wait for the result of both.
    await page.waitForFunction((want) => Math.abs(Number(document.querySelector('#designer-directivity')?.getAttribute('data-value')) - want) < 1e-6,
      taylor.directivity.directivityDb, { timeout: 5000 }).catch(() => undefined);
    expect(await figure(page, 'designer-directivity')).toBeCloseTo(taylor.directivity.directivityDb, 10);

    // A bad input reaches the library, whose DomainError is shown in the panel's alert.
    await page.fill('#designer-spacing', '-1');
    await expectText(page, '#designer-status', 'DomainError');
    await expectText(page, '#designer-status', 'spacingM');
    expect(await page.locator('#designer-status').getAttribute('role')).toBe('alert');
    const d5 = await page.locator('#designer-directivity').getAttribute('data-value');
    await page.fill('#designer-spacing', '0.5');
    await figureChange(page, 'designer-directivity', d5);

    // A planar layout: a 6 × 6 grid has 36 elements.
    const d3 = await page.locator('#designer-directivity').getAttribute('data-value');
    await page.selectOption('#designer-layout', 'grid');
    await page.fill('#designer-count', '6');
    await figureChange(page, 'designer-directivity', d3);
    await page.waitForFunction(() => document.querySelector('#designer-count-out')?.getAttribute('data-value') === '36', undefined, { timeout: 5000 })
      .catch(() => undefined);
    expect(await figure(page, 'designer-count-out')).toBe(36);
    expect(await page.locator('#designer-status').textContent()).toBe('');

    // Zero elements per side: a message about that input, not about a library argument (issue 21).
    await page.fill('#designer-count', '0');
    await expectText(page, '#designer-status', 'elements per side must be a whole number from 1 to 40 here (received 0)');
    expect(await page.locator('#designer-status').textContent()).not.toMatch(/boundary|widthM/);
    await page.fill('#designer-count', '6');
    await page.waitForFunction(() => document.querySelector('#designer-status')?.textContent === '', undefined, { timeout: 5000 });
  });

  it('network viewer: draws the sample and shows a malformed paste\'s parse error with its line number', async () => {
    expect(await page.locator('#network-smith svg').count()).toBe(1);
    expect(await page.locator('#network-magnitude svg').count()).toBe(1);
    expect(await figure(page, 'network-ports')).toBe(2);
    expect(await figure(page, 'network-points')).toBe(81);
    // The sample is an R-L-C two-port: reciprocal and passive (to the file's rounding).
    expect(await figure(page, 'network-reciprocity')).toBeLessThan(1e-5);
    expect(await figure(page, 'network-passivity')).toBeLessThan(1e-5);
    await expectText(page, '#network-reciprocity-verdict', 'reciprocal');
    await expectText(page, '#network-passivity-verdict', 'passive');

    const bad = '! a made-up one-port\n# MHz S RI R 50\n100 0.2 0.1\n200 0.25 o.05\n';
    let expected: ParseError | undefined;
    try { parseTouchstone(bad); } catch (e) { expected = e as ParseError; }
    expect(expected).toBeInstanceOf(ParseError);
    expect(expected!.line).toBe(4);
    await page.fill('#network-text', bad);
    const box = page.locator('#network-error');
    await box.waitFor({ state: 'visible', timeout: 5000 });
    expect(await page.locator('#network-results').getAttribute('data-stale')).toBe('yes');
    expect(await box.getAttribute('data-line')).toBe('4');
    await expectText(page, '#network-error', 'line 4');
    await expectText(page, '#network-error', expected!.message);

    // A valid paste clears the error and redraws.
    const smithBefore = await page.locator('#network-smith').innerHTML();
    await page.fill('#network-text', '# MHz S RI R 50\n100 0.2 0.1\n200 0.25 0.05\n300 0.3 -0.1\n');
    await box.waitFor({ state: 'hidden', timeout: 5000 });
    await page.waitForFunction((old) => document.querySelector('#network-smith')?.innerHTML !== old, smithBefore);
    expect(await figure(page, 'network-ports')).toBe(1);

    // A version 1 three-port picked as a file: its .s3p name gives the port count.
    const s3 = (a: number) => fromRows([[a, 0.5, 0.5], [0.5, a, 0.5], [0.5, 0.5, a]]);
    const threePort = formatTouchstone(createMultiport('scattering', [1e9, 1.5e9, 2e9], [s3(-0.1), s3(-0.2), s3(-0.3)]), { version: 1 });
    await page.setInputFiles('#network-file', { name: 'invented-divider.s3p', mimeType: 'text/plain', buffer: Buffer.from(threePort) });
    await page.waitForFunction(() => document.querySelector('#network-ports')?.getAttribute('data-value') === '3');
    expect(await figure(page, 'network-points')).toBe(3);

    // Dropping a file on the text box loads it too.
    await page.evaluate((text) => {
      const dt = new DataTransfer();
      dt.items.add(new File([text], 'dropped.s1p', { type: 'text/plain' }));
      document.querySelector('#network-drop')!.dispatchEvent(new DragEvent('drop', { dataTransfer: dt, bubbles: true, cancelable: true }));
    }, '# GHz S MA R 50\n1 0.5 -30\n2 0.4 -60\n');
    await page.waitForFunction(() => document.querySelector('#network-ports')?.getAttribute('data-value') === '1');
    expect(await figure(page, 'network-points')).toBe(2);
    await expectText(page, '#network-file-name', 'dropped.s1p');
  });

  it('sensitivity sketch: T_sys and A_e/T_sys equal the reception module\'s for the default inputs', async () => {
    // Defaults: 3 × 3 x-dipoles, 0.48 λ, a = λ/400, λ/2 apart, λ/4 over ground, 1.4 GHz, T_min 25 K,
    // R_n 4 Ω, Y_opt 20 mS, sky 10 K, ground 290 K, array tilted 30° from zenith, 24 × 48 sphere rule,
    // max-SNR beam at the array's broadside.
    const f = 1.4e9, lambda = wavelengthM(f);
    const dipoles: WireDipole[] = [];
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) {
      dipoles.push({ centerM: [(i - 1) * lambda / 2, (j - 1) * lambda / 2, lambda / 4], axis: [1, 0, 0], lengthM: 0.48 * lambda, radiusM: lambda / 400 });
    }
    const r = evaluateReceivingArray({
      ports: dipoleArrayPorts(dipoles, f, { groundPlane: { zM: 0 } }),
      quadrature: sphereQuadrature(24, 48),
      bandwidthHz: 1e6,
      environment: skyAndGroundEnvironment({ skyK: 10, groundK: 290, tiltRad: Math.PI / 6 }),
      amplifiers: { minimumNoiseTemperatureK: 25, noiseResistanceOhm: 4, optimumSourceAdmittanceS: { re: 0.02, im: 0 } },
      loss: 'lossless',
      beams: { thetaRad: Float64Array.of(0), phiRad: Float64Array.of(0) },
      physicalAreaM2: 9 * (lambda / 2) ** 2,
    }).beams[0];
    const tsys = await figure(page, 'sens-tsys'), aet = await figure(page, 'sens-aet');
    expect(Math.abs(tsys - r.systemTemperatureK) / r.systemTemperatureK).toBeLessThan(1e-9);
    expect(Math.abs(aet - r.sensitivityM2PerK) / r.sensitivityM2PerK).toBeLessThan(1e-9);
    // G/T = (4π/λ²)·A_e/T_sys and SEFD = 2k_B/(A_e/T_sys) (IEEE Std 145-2013; Thompson, Moran & Swenson 2017; from memory).
    expect(await figure(page, 'sens-gt')).toBeCloseTo(10 * Math.log10(((4 * Math.PI) / (lambda * lambda)) * r.sensitivityM2PerK), 9);
    expect((await figure(page, 'sens-sefd')) / ((2 * 1.380649e-23) / r.sensitivityM2PerK / 1e-26)).toBeCloseTo(1, 9);
    // Identity: T_sys is the sum of its parts (Warnick et al., IEEE TAP 58(6), 2010, from memory).
    const parts = (await figure(page, 'sens-tsky')) + (await figure(page, 'sens-tspill')) + (await figure(page, 'sens-trec'));
    expect(parts).toBeCloseTo(tsys, 8);
    expect(await figure(page, 'sens-tspill')).toBeGreaterThan(0);

    // Offline once loaded: a warmer amplifier raises T_sys without any network access.
    await context!.setOffline(true);
    const before = await page.locator('#sens-tsys').getAttribute('data-value');
    await page.fill('#sens-tmin', '60');
    await figureChange(page, 'sens-tsys', before);
    expect(await figure(page, 'sens-tsys')).toBeGreaterThan(tsys);
    // Facing the zenith, the infinite ground plane hides the warm ground entirely (image theory):
    // no spillover noise, and the sky part of a lossless array is the sky brightness.
    const tilted = await page.locator('#sens-tsys').getAttribute('data-value');
    await page.fill('#sens-tilt', '0');
    await figureChange(page, 'sens-tsys', tilted);
    expect(Math.abs(await figure(page, 'sens-tspill'))).toBeLessThan(1e-9);
    expect(await figure(page, 'sens-tsky')).toBeCloseTo(10, 1);
    await context!.setOffline(false);
  });

  it('logs no console error, requests nothing off localhost, and leaves a screenshot', async () => {
    await page.fill('#network-text', '');
    await page.click('#network-demo');
    await page.locator('#network-error').waitFor({ state: 'hidden', timeout: 5000 });
    const shot = join(root, 'reports', 'playground-after-edits.png');
    await page.screenshot({ path: shot, fullPage: true });
    expect(statSync(shot).size).toBeGreaterThan(10_000);
    // Every clip-path reference resolves to a clip path inside the same plot (the page inlines several).
    const strayClips = await page.evaluate(() => Array.from(document.querySelectorAll('[clip-path]')).filter((el) => {
      const id = /url\(#([^)]+)\)/.exec(el.getAttribute('clip-path') ?? '')?.[1] ?? '';
      return document.getElementById(id)?.closest('svg') !== el.closest('svg');
    }).length);
    expect(strayClips).toBe(0);
    // Every plot on the page passes the same layout check as the report's figures.
    const count = await page.evaluate(() => document.querySelectorAll('svg[role="img"]').length);
    expect(count).toBeGreaterThanOrEqual(3);
    const failures: string[] = [];
    for (let i = 0; i < count; i++) {
      await page.evaluate((k) => document.querySelectorAll('svg[role="img"]')[k].setAttribute('data-check', 'yes'), i);
      const p = await page.evaluate(inspectFigure, 'svg[data-check="yes"]');
      await page.evaluate(() => document.querySelector('svg[data-check="yes"]')?.removeAttribute('data-check'));
      for (const [kind, list] of [['overlapping labels', p.textOverlaps], ['labels outside the figure', p.textOutside], ['points under the legend', p.underLegend], ['hidden traces', p.hiddenTraces]] as const) {
        if (list.length > 0) failures.push(`plot ${i + 1}: ${kind}: ${list.slice(0, 4).join('; ')}`);
      }
    }
    expect(failures, failures.join('\n')).toEqual([]);
    expect(consoleErrors).toEqual([]);
    expect(foreignRequests).toEqual([]);
  });
});
