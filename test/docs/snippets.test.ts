/**
 * Examples are tests: every ```ts block under an `@example` tag in src/ and every ```ts block
 * of README.md and docs/*.md runs here (imports of 'phasewise', 'phasewise/plot' and
 * 'phasewise/node' point at the sources), and every value a comment states after a call is
 * compared with the computed one to the digits stated (test/docs/stated.ts). Blocks marked
 * ```ts fragment are shown, not run. Rules: DEVELOPERS.md, "Examples are tests".
 */
import { afterAll, describe, it, expect } from 'vitest';
import { readdirSync } from 'node:fs';
import { join } from 'node:path';
import { instrument, markdownExamples, root, runExample, tsdocExamples, verify, type Example } from './doctest.js';

const tally = { run: 0, fragments: 0, stated: 0 };
afterAll(() => {
  process.stdout.write(`doc examples: ${tally.run} executed, ${tally.fragments} marked fragment (not run), ${tally.stated} stated values checked\n`);
});

async function runChecked(code: string, where: string, name: string): Promise<string[]> {
  const ins = instrument(code, where);
  expect(ins.problems).toEqual([]);
  const lines: string[] = [];
  const seen = await runExample(ins.code, name, (l) => lines.push(l));
  expect(verify(ins.checks, seen)).toEqual([]);
  tally.stated += ins.checks.length;
  return lines;
}

describe('TSDoc @example blocks in src/', () => {
  const examples = tsdocExamples();
  it('there are examples, and fragments are few', () => {
    expect(examples.length).toBeGreaterThan(50);
    expect(examples.filter((e) => e.fragment).length).toBeLessThan(examples.length / 4);
  });
  const run = examples.filter((e) => !e.fragment);
  tally.fragments += examples.length - run.length;
  it.each(run.map((e): [string, Example] => [e.where, e]))('%s', async (where, e) => {
    await runChecked(e.code, where, where);
    tally.run++;
  }, 30000);
});

describe('docs/getting-started.md', () => {
  const b = markdownExamples('docs/getting-started.md');
  it('has the taper, plot, evaluation and band examples', () => expect(b.length).toBe(4));
  it('taper block prints the quoted numbers', async () => {
    const out = await runChecked(b[0].code, b[0].where, 'gs-taper');
    tally.run++;
    expect(out).toEqual(['edge weight 0.2641, taper efficiency 0.8529, loss 0.691 dB']);
    // Identity: directivity loss = −10 log10(taper efficiency) (0.691 = −10 log10 0.8529 to the digits shown).
    expect(-10 * Math.log10(0.8529)).toBeCloseTo(0.691, 3);
  });
  it('plot block: Dolph–Chebyshev sidelobes at the design level (Dolph 1946)', async () => {
    const out = await runChecked(b[1].code, b[1].where, 'gs-plot');
    tally.run++;
    expect(out[0]).toMatch(/highest sidelobe -30\.0 dB$/);
  });
  it('evaluation block runs and prints finite figures', async () => {
    const out = await runChecked(b[2].code, b[2].where, 'gs-eval');
    tally.run++;
    expect(out).toEqual(['T_sys 46.6 K, A_e 0.0210 m², A_e/T_sys 4.501e-4 m²/K']);
  });
  it('band block prints the quoted numbers', async () => {
    const out = await runChecked(b[3].code, b[3].where, 'gs-band');
    expect(out).toEqual(['broadside: band-average A_e/T_sys 0.00348 m²/K, worst 0.00319 m²/K at 2.40 GHz, worst G/T 3.95 dB/K, worst SEFD 864 kJy']);
    // The identity the text states, on the printed values: the worst SEFD is 2k_B/(worst A_e/T_sys), in kJy.
    // 0.00319 is rounded to ±0.000005, so 2k_B/(A_e/T_sys) lies between 2k_B/0.003195 and 2k_B/0.003185.
    const sefdKJy = (aOverT: number) => 2 * 1.380649e-23 / aOverT / 1e-26 / 1e3;
    expect(864).toBeGreaterThanOrEqual(Math.floor(sefdKJy(0.003195)));
    expect(864).toBeLessThanOrEqual(Math.ceil(sefdKJy(0.003185)));
  });
});

const GUIDES = ['README.md', ...readdirSync(join(root, 'docs')).filter((f) => f.endsWith('.md') && f !== 'getting-started.md').sort().map((f) => `docs/${f}`)];

describe.each(GUIDES.filter((g) => markdownExamples(g).length > 0))('%s', (guide) => {
  it('its ts blocks run in order as one script, without NaN, and state true values', async () => {
    const all = markdownExamples(guide);
    const run = all.filter((e) => !e.fragment);
    tally.fragments += all.length - run.length;
    const out = await runChecked(run.map((e) => e.code).join('\n'), guide, guide);
    tally.run += run.length;
    expect(out.join('\n')).not.toMatch(/NaN/);
  }, 60000);
});
