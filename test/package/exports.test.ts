/**
 * Checks of the built package (dist/, written by `npm run build`, which `npm test` runs first):
 * every entry loads as ESM and CJS, the error classes are shared between entries (so
 * `instanceof` works across `phasewise` and `phasewise/node`), and the browser-safe entries
 * never reach a Node built-in.
 */
import { describe, it, expect } from 'vitest';
import { existsSync, readFileSync } from 'node:fs';
import { builtinModules, createRequire } from 'node:module';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');
const dist = join(root, 'dist');
const pkg = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { exports: Record<string, Record<string, string> | string> };

function importsOf(file: string): string[] {
  const text = readFileSync(file, 'utf8');
  return [...text.matchAll(/(?:from|import)\s*\(?\s*['"]([^'"]+)['"]/g)].map((m) => m[1]);
}

/** All files reachable from an ESM file through relative imports (the file included). */
function reachableFiles(entry: string): Set<string> {
  const seen = new Set<string>();
  const stack = [entry];
  while (stack.length) {
    const f = stack.pop() as string;
    if (seen.has(f)) continue;
    seen.add(f);
    for (const s of importsOf(f)) if (s.startsWith('.')) stack.push(join(dirname(f), s));
  }
  return seen;
}

/** All bare specifiers reachable from an ESM file through relative imports. */
function reachableBareImports(entry: string): Set<string> {
  const seen = new Set<string>(), bare = new Set<string>();
  const stack = [entry];
  while (stack.length) {
    const f = stack.pop() as string;
    if (seen.has(f)) continue;
    seen.add(f);
    for (const s of importsOf(f)) {
      if (s.startsWith('.')) stack.push(join(dirname(f), s));
      else bare.add(s);
    }
  }
  return bare;
}

describe('built package', () => {
  it('dist exists (npm test builds it first)', () => {
    expect(existsSync(join(dist, 'index.js')), 'run `npm run build` before the tests').toBe(true);
  });

  it('every export-map target exists', () => {
    for (const [key, target] of Object.entries(pkg.exports)) {
      if (typeof target === 'string') continue;
      for (const file of Object.values(target)) expect(existsSync(join(root, file)), `${key} → ${file}`).toBe(true);
    }
  });

  it('every module has a subpath (phasewise/linalg, …) whose exports are the same bindings as the root (one class family)', async () => {
    const core = await import(pathToFileURL(join(dist, 'index.js')).href);
    const modules = Object.keys(pkg.exports).filter((k) => !['.', './plot', './node', './package.json'].includes(k)).map((k) => k.slice(2));
    expect(modules.length).toBeGreaterThanOrEqual(15);
    for (const m of modules) {
      const sub = await import(pathToFileURL(join(dist, `${m}.js`)).href);
      const names = Object.keys(sub);
      expect(names.length, m).toBeGreaterThan(0);
      for (const name of names) expect(sub[name], `${m}.${name}`).toBe(core[name]);
    }
    // The generic names have an unambiguous home.
    const linalg = await import(pathToFileURL(join(dist, 'linalg.js')).href);
    for (const name of ['add', 'scale', 'trace', 'entry']) expect(typeof linalg[name], name).toBe('function');
  });

  it('ESM entries share one error family across phasewise and phasewise/node', async () => {
    const core = await import(pathToFileURL(join(dist, 'index.js')).href);
    const node = await import(pathToFileURL(join(dist, 'node.js')).href);
    const plot = await import(pathToFileURL(join(dist, 'plot.js')).href);
    expect(typeof core.solve).toBe('function');
    expect(typeof plot.linePlotSvg).toBe('function');
    let caught: unknown;
    try { node.readYFactorCsv(join(root, 'does-not-exist.csv')); } catch (e) { caught = e; }
    expect(caught).toBeInstanceOf(core.ParseError);
    expect(caught).toBeInstanceOf(core.NumericError);
  });

  it('CJS entries load and share one error family', () => {
    const require = createRequire(join(root, 'package.json'));
    const core = require(join(dist, 'index.cjs'));
    const node = require(join(dist, 'node.cjs'));
    const plot = require(join(dist, 'plot.cjs'));
    expect(plot.linePlotSvg({ traces: [{ label: 'a', x: [0, 1], y: [0, 1] }], xLabel: 'x', yLabel: 'y' })).toContain('<svg');
    expect(() => node.readYFactorCsv(join(root, 'does-not-exist.csv'))).toThrow(core.ParseError);
    const z = core.fromRows([[2, 0], [0, 4]]);
    expect(core.solve(z, core.columnVector([2, 4])).data[2]).toBe(1);
  });

  it('the browser-safe entries reach no Node built-in', () => {
    const nodeModules = new Set(builtinModules);
    for (const entry of ['index.js', 'plot.js']) {
      const bare = [...reachableBareImports(join(dist, entry))];
      const builtins = bare.filter((s) => s.startsWith('node:') || nodeModules.has(s) || nodeModules.has(s.split('/')[0]));
      expect(builtins, `${entry} imports ${builtins.join(', ')}`).toEqual([]);
    }
  });

  it("results print through Node's inspect hook reached by Symbol.for, not by importing util", async () => {
    const core = await import(pathToFileURL(join(dist, 'index.js')).href);
    const plot = await import(pathToFileURL(join(dist, 'plot.js')).href);
    const { inspect } = await import('node:util');
    const z = core.fromRows([[1, 2], [3, 4]]);
    expect(inspect(z)).toMatch(/^CMatrix 2×2 complex/);
    expect(inspect(plot.figure(plot.linePlotSvg({ traces: [{ label: 'a', x: [0, 1], y: [0, 1] }], xLabel: 'x', yLabel: 'y' })))).toMatch(/^Figure 640×400 px/);
    // the shared chunks of the browser entries name the hook only through the global symbol registry
    const chunks = [...reachableFiles(join(dist, 'index.js')), ...reachableFiles(join(dist, 'plot.js'))].map((f) => readFileSync(f, 'utf8')).join('\n');
    expect(chunks).toContain('Symbol.for("nodejs.util.inspect.custom")');
    expect(chunks).not.toMatch(/\brequire\(\s*["'](node:)?util["']\)/);
  });
});
