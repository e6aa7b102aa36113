/**
 * Runs every ```ts block of the README and of every guide in docs/ (imports of 'phasewise',
 * 'phasewise/plot' and 'phasewise/node' point at the sources); for the getting-started guide it
 * also checks the numbers the text quotes.
 */
import { describe, it, expect, vi } from 'vitest';
import { mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { dirname, join, resolve } from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';

const root = resolve(dirname(fileURLToPath(import.meta.url)), '../..');

function blocks(file: string): string[] {
  const text = readFileSync(join(root, file), 'utf8');
  return [...text.matchAll(/```ts\n([\s\S]*?)```/g)].map((m) => m[1]);
}

const ENTRIES = [['phasewise', 'index.ts'], ['phasewise/plot', 'plot/index.ts'], ['phasewise/node', 'node.ts']] as const;
const srcUrl = (p: string) => pathToFileURL(join(root, 'src', p)).href;

/**
 * Makes a guide's code a module: named imports from the package are gathered into one import
 * per entry point (guides often show fragments without imports, or repeat them per block);
 * namespace imports are pointed at the sources.
 */
async function asModule(code: string): Promise<string> {
  let body = code.replace(/import\s+(type\s+)?\{[\s\S]*?\}\s+from\s+'phasewise(\/plot|\/node)?';?\n?/g, '');
  for (const [spec, file] of ENTRIES) body = body.split(`from '${spec}'`).join(`from '${srcUrl(file)}'`);
  const taken = new Set<string>();
  const imports: string[] = [];
  for (const [, file] of ENTRIES) {
    const mod = await import(srcUrl(file));
    const names = Object.keys(mod).filter((k) => !taken.has(k) && new RegExp(`(?<![\\w.$])${k.replace(/\$/g, '\\$')}(?![\\w$])`).test(body));
    names.forEach((k) => taken.add(k));
    if (names.length > 0) imports.push(`import { ${names.join(', ')} } from '${srcUrl(file)}';`);
  }
  return imports.join('\n') + '\n' + body;
}

async function runSnippet(code: string, name: string): Promise<string[]> {
  const dir = join(root, 'node_modules', '.cache', 'phasewise-snippets');
  mkdirSync(dir, { recursive: true });
  const file = join(dir, `${name}-${process.pid}.ts`);
  writeFileSync(file, await asModule(code));
  const lines: string[] = [];
  const spy = vi.spyOn(console, 'log').mockImplementation((...a: unknown[]) => { lines.push(a.join(' ')); });
  try {
    await import(pathToFileURL(file).href);
  } finally {
    spy.mockRestore();
    rmSync(file, { force: true });
  }
  return lines;
}

describe('docs/getting-started.md', () => {
  const b = blocks('docs/getting-started.md');
  it('has the taper, plot and evaluation examples', () => expect(b.length).toBe(3));
  it('taper block prints the quoted numbers', async () => {
    const out = await runSnippet(b[0], 'gs-taper');
    expect(out).toEqual(['edge weight 0.2641, taper efficiency 0.8529, loss 0.691 dB']);
    // Identity: directivity loss = −10 log10(taper efficiency) (0.691 = −10 log10 0.8529 to the digits shown).
    expect(-10 * Math.log10(0.8529)).toBeCloseTo(0.691, 3);
  });
  it('plot block: Dolph–Chebyshev sidelobes at the design level (Dolph 1946)', async () => {
    const out = await runSnippet(b[1], 'gs-plot');
    expect(out[0]).toMatch(/highest sidelobe -30\.0 dB$/);
  });
  it('evaluation block runs and prints finite figures', async () => {
    const out = await runSnippet(b[2], 'gs-eval');
    expect(out).toEqual(['T_sys 46.6 K, A_e 0.0210 m², A_e/T_sys 4.501e-4 m²/K']);
  });
});

const GUIDES = ['README.md', ...readdirSync(join(root, 'docs')).filter((f) => f.endsWith('.md') && f !== 'getting-started.md').sort().map((f) => `docs/${f}`)];

describe.each(GUIDES.filter((g) => blocks(g).length > 0))('%s', (guide) => {
  it('its ts blocks run in order as one script, without NaN', async () => {
    const out = await runSnippet(blocks(guide).join('\n'), guide.replace(/\W+/g, '-'));
    expect(out.join('\n')).not.toMatch(/NaN/);
  }, 30000);
});
