/**
 * Compares the stored outputs of a notebook with the outputs of a fresh run:
 * - text (streams, `text/plain`): the words and symbols must be equal (runs of spaces count as
 *   one, since table columns widen with their numbers), and every number must agree with the
 *   stored one to its stated digits — within one unit of its last digit (a printed value is a
 *   rounding, so a difference far below the last digit may move it by one);
 * - figures (`image/svg+xml`): both must be well-formed SVG with the same structure — size and
 *   title, the sequence of elements with their classes, each trace's label and point count,
 *   and the text of the title and axis labels — not the same bytes;
 * - other MIME types: equal text.
 * @module
 */
import { XMLValidator } from 'fast-xml-parser';
import { joined, type NotebookOutput } from './kernel.js';

/** A number in printed output (Unicode minus allowed), not part of a word (x1, T2). */
const NUMBER = /(?<![\p{L}_\d.])[-−]?\d+(?:\.\d+)?(?:e[-−+]?\d+)?/gu;

function tokens(text: string): { words: string[]; numbers: string[] } {
  const numbers = text.match(NUMBER) ?? [];
  const words = text.split(NUMBER).map((w) => w.replace(/[ \t]+/g, ' '));
  return { words, numbers };
}

/** The unit of the last stated digit of a printed number. */
function lastDigitUnit(s: string): number {
  const m = /\d+(?:\.(\d+))?(?:e([-−+]?\d+))?$/.exec(s);
  const decimals = m?.[1]?.length ?? 0;
  const exponent = m?.[2] ? Number(m[2].replace('−', '-')) : 0;
  return 10 ** (exponent - decimals);
}

const value = (s: string): number => Number(s.replace(/−/g, '-'));

/**
 * Problems of a fresh text against the stored one (empty when they agree).
 * @param stored - Text stored in the notebook.
 * @param fresh - Text of the fresh run.
 * @param where - Name used in the messages.
 */
export function compareText(stored: string, fresh: string, where: string): string[] {
  const a = tokens(stored), b = tokens(fresh);
  if (a.words.length !== b.words.length || a.words.some((w, i) => w !== b.words[i])) {
    const i = a.words.findIndex((w, k) => w !== b.words[k]);
    return [`${where}: the text differs near "${(a.words[i] ?? '').slice(0, 60)}" (fresh: "${(b.words[i] ?? '').slice(0, 60)}")`];
  }
  const out: string[] = [];
  a.numbers.forEach((s, i) => {
    const tol = lastDigitUnit(s) * (1 + 1e-9);
    if (!(Math.abs(value(s) - value(b.numbers[i])) <= tol)) out.push(`${where}: stored ${s}, computed ${b.numbers[i]} (number ${i + 1} of the text)`);
  });
  return out;
}

/** The structure of an SVG: size, title, elements with their classes, traces, title and axis texts. */
export function svgStructure(svg: string): string[] {
  const out: string[] = [];
  const root = /^\s*<svg\b([^>]*)>/.exec(svg);
  const attr = (tag: string, name: string): string => new RegExp(`\\s${name}="([^"]*)"`).exec(tag)?.[1] ?? '';
  if (root) out.push(`svg ${attr(root[1], 'width')}×${attr(root[1], 'height')} "${attr(root[1], 'aria-label')}"`);
  for (const m of svg.matchAll(/<([a-zA-Z]+)\b([^>]*?)\/?>/g)) {
    const cls = attr(m[2], 'class');
    let item = cls ? `${m[1]}.${cls}` : m[1];
    if (cls === 'trace') item += `[${attr(m[2], 'data-label')}; ${attr(m[2], 'data-points')} points]`;
    out.push(item);
  }
  for (const m of svg.matchAll(/<text class="(title|label-x|label-y)"[^>]*>([^<]*)<\/text>/g)) out.push(`${m[1]}: ${m[2]}`);
  return out;
}

/**
 * Problems of a fresh SVG against the stored one (empty when they agree in structure).
 * @param stored - SVG stored in the notebook.
 * @param fresh - SVG of the fresh run.
 * @param where - Name used in the messages.
 */
export function compareSvg(stored: string, fresh: string, where: string): string[] {
  for (const [name, svg] of [['stored', stored], ['fresh', fresh]] as const) {
    const valid = XMLValidator.validate(svg);
    if (valid !== true) return [`${where}: the ${name} figure is not well-formed XML (${valid.err.msg})`];
  }
  const a = svgStructure(stored), b = svgStructure(fresh);
  const i = a.findIndex((x, k) => x !== b[k]);
  if (i < 0 && a.length === b.length) return [];
  return [`${where}: the figure's structure differs at element ${i < 0 ? a.length : i}: stored ${a[i] ?? '(end)'}, fresh ${b[i] ?? '(end)'}`];
}

/**
 * Problems of a cell's fresh outputs against its stored ones.
 * @param stored - Outputs stored in the notebook.
 * @param fresh - Outputs of the fresh run.
 * @param where - Name used in the messages (notebook and cell).
 */
export function compareOutputs(stored: readonly NotebookOutput[], fresh: readonly NotebookOutput[], where: string): string[] {
  const kinds = (o: readonly NotebookOutput[]): string => o.map((x) => (x.output_type === 'stream' ? `stream:${x.name}` : x.output_type)).join(', ');
  if (kinds(stored) !== kinds(fresh)) return [`${where}: stored outputs [${kinds(stored)}], fresh [${kinds(fresh)}]`];
  const out: string[] = [];
  stored.forEach((s, i) => {
    const f = fresh[i];
    const at = `${where}, output ${i + 1}`;
    if (s.output_type === 'stream' && f.output_type === 'stream') out.push(...compareText(joined(s.text), joined(f.text), at));
    else if (s.output_type === 'error' || f.output_type === 'error') out.push(`${at}: an error output`);
    else if ('data' in s && 'data' in f) {
      const mimes = Object.keys(s.data).sort().join(', ');
      if (mimes !== Object.keys(f.data).sort().join(', ')) { out.push(`${at}: MIME types [${mimes}] stored, [${Object.keys(f.data).sort().join(', ')}] fresh`); return; }
      for (const mime of Object.keys(s.data)) {
        const a = joined(s.data[mime]), b = joined(f.data[mime]);
        if (mime === 'image/svg+xml') out.push(...compareSvg(a, b, `${at} (${mime})`));
        else if (mime === 'text/plain') out.push(...compareText(a, b, `${at} (${mime})`));
        else if (a !== b) out.push(`${at} (${mime}): differs`);
      }
    }
  });
  return out;
}
