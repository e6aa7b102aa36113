/**
 * Stated values in example comments: the grammar the doc-test harness reads after a call
 * (`// ≈ 73.08 + 42.52j Ω`, `// Float64Array [1]`, `// { thetaCount: 47, … }`) and the
 * comparison "to the digits stated" (DEVELOPERS.md, "Examples are tests").
 *
 * Grammar (whitespace allowed between tokens; Unicode minus − accepted for -):
 *   value   := number | complex | array | object | string | true | false | null
 *   number  := [+-]digits[.digits][e[+-]digits][…]      (… = the digits are truncated, not rounded)
 *   complex := number (+|-) number j  |  number j        (a + bj; a lone bj is purely imaginary)
 *   array   := [TypeName] '[' value (',' value)* [',' …] ']' ['ᵀ']   (TypeName checks the constructor)
 *   object  := '{' key ':' value (',' key ':' value)* [',' …] '}'   (the named keys only)
 * A number stated with d decimals (of its mantissa, times 10^e) must lie within half a unit
 * of its last digit (a whole unit when followed by …) of the computed value.
 */

/** A parsed stated value. */
export type Stated =
  | { kind: 'number'; value: number; tol: number; text: string }
  | { kind: 'complex'; re: Stated & { kind: 'number' } | null; im: Stated & { kind: 'number' }; text: string }
  | { kind: 'array'; items: Stated[]; open: boolean; typeName: string | null; text: string }
  | { kind: 'object'; entries: [string, Stated][]; text: string }
  | { kind: 'literal'; value: string | boolean | null; text: string };

class Cursor {
  pos = 0;
  constructor(readonly s: string) {}
  /** Matches `re` after any whitespace at the cursor; moves past it only on a match. */
  take(re: RegExp): RegExpExecArray | null {
    let at = this.pos;
    while (at < this.s.length && /\s/.test(this.s[at])) at++;
    const r = new RegExp(re.source, 'yu');
    r.lastIndex = at;
    const m = r.exec(this.s);
    if (m) this.pos = at + m[0].length;
    return m;
  }
}

const NUM = /[+\-−]?(\d+)(?:\.(\d+))?(?:e([+\-−]?\d+))?(…)?/;

function parseNumber(c: Cursor): (Stated & { kind: 'number' }) | null {
  const m = c.take(NUM);
  if (!m) return null;
  const text = m[0];
  const value = Number(text.replace(/−/g, '-').replace('…', ''));
  const decimals = m[2]?.length ?? 0;
  const exponent = m[3] ? Number(m[3].replace('−', '-')) : 0;
  const unit = Math.pow(10, exponent - decimals);
  return { kind: 'number', value, tol: m[4] ? unit : 0.5 * unit, text };
}

function parseValue(c: Cursor): Stated | null {
  const start = c.pos;
  const lit = c.take(/(true|false|null)(?![\w])|'([^']*)'/);
  if (lit) {
    const value = lit[2] !== undefined ? lit[2] : lit[1] === 'null' ? null : lit[1] === 'true';
    return { kind: 'literal', value, text: lit[0] };
  }
  const typeName = c.take(/([A-Z]\w*Array|Array)(?=\s*\[)/);
  if (c.take(/\[/)) {
    const items: Stated[] = [];
    let open = false;
    if (!c.take(/\]/)) {
      for (;;) {
        if (c.take(/…/)) { open = true; if (!c.take(/\]/)) return null; break; }
        const v = parseValue(c);
        if (!v) return null;
        items.push(v);
        if (c.take(/\]/)) break;
        if (!c.take(/,/)) return null;
      }
    }
    c.take(/ᵀ/);
    return { kind: 'array', items, open, typeName: typeName ? typeName[1] : null, text: c.s.slice(start, c.pos).trim() };
  }
  if (typeName) return null;
  if (c.take(/\{/)) {
    const entries: [string, Stated][] = [];
    if (!c.take(/\}/)) {
      for (;;) {
        if (c.take(/…/)) { if (!c.take(/\}/)) return null; break; }
        const key = c.take(/([A-Za-z_$][\w$]*)\s*:/);
        if (!key) return null;
        const v = parseValue(c);
        if (!v) return null;
        entries.push([key[1], v]);
        if (c.take(/\}/)) break;
        if (!c.take(/,/)) return null;
      }
    }
    return { kind: 'object', entries, text: c.s.slice(start, c.pos).trim() };
  }
  const a = parseNumber(c);
  if (!a) return null;
  if (c.take(/j(?![\w])/)) return { kind: 'complex', re: null, im: a, text: c.s.slice(start, c.pos).trim() };
  const save = c.pos;
  const sign = c.take(/[+\-−]/);
  if (sign) {
    const b = parseNumber(c);
    if (b && !/^[+\-−]/.test(b.text) && c.take(/j(?![\w])/)) {
      const im = { ...b, value: /[-−]/.test(sign[0]) ? -b.value : b.value };
      return { kind: 'complex', re: a, im, text: c.s.slice(start, c.pos).trim() };
    }
  }
  c.pos = save;
  return a;
}

/**
 * Parses `count` comma-separated stated values at the start of `text` (after an optional
 * `≈`, `=` or `→`). The value must be followed by the end of the comment or by a break
 * (space, `(`, `,`, `;`): text after it (units, a parenthesis) is commentary.
 * @returns the values, or null when the text does not start with them.
 */
export function parseStated(text: string, count = 1): Stated[] | null {
  const c = new Cursor(text);
  c.take(/[≈=→]/);
  const out: Stated[] = [];
  for (let i = 0; i < count; i++) {
    if (i > 0 && !c.take(/,/)) return null;
    const v = parseValue(c);
    if (!v) return null;
    out.push(v);
  }
  if (c.pos < text.length && !/^[\s(,;]/u.test(text.slice(c.pos))) return null;
  return out;
}

/** A `path: value` / `path = value` assertion. */
export interface PathAssertion { path: string; stated: Stated }

/**
 * Parses a comment of assertions `path: value` or `path = value` (optionally `≈ value`),
 * separated by `,` or `;`; parsing stops at the first segment that is not one (the rest is
 * commentary). `path` is a JavaScript member path (`r.values`, `f.firstNullAt[1]`).
 */
export function parseAssertions(text: string): PathAssertion[] {
  const c = new Cursor(text);
  const out: PathAssertion[] = [];
  for (;;) {
    const save = c.pos;
    const p = c.take(/([A-Za-z_$][\w$]*(?:\.[A-Za-z_$][\w$]*|\[\d+\])*)\s*(?::|=(?!=))\s*≈?/);
    if (!p) break;
    const v = parseValue(c);
    if (!v || (c.pos < text.length && !/^[\s(,;]/u.test(text.slice(c.pos)))) { c.pos = save; break; }
    out.push({ path: p[1], stated: v });
    const sep = c.take(/[,;]/);
    if (!sep) break;
  }
  return out;
}

interface ComplexLike { re: number; im: number }
const isCMatrix = (x: unknown): x is { rows: number; cols: number; data: Float64Array } =>
  typeof x === 'object' && x !== null && 'rows' in x && 'cols' in x && (x as { data?: unknown }).data instanceof Float64Array;

function asComplex(x: unknown): ComplexLike | null {
  if (typeof x === 'number') return { re: x, im: 0 };
  if (isCMatrix(x) && x.rows * x.cols === 1) return { re: x.data[0], im: x.data[1] };
  if (typeof x === 'object' && x !== null && typeof (x as ComplexLike).re === 'number' && typeof (x as ComplexLike).im === 'number') return x as ComplexLike;
  return null;
}

function items(x: unknown): unknown[] | null {
  if (isCMatrix(x)) {
    const out: ComplexLike[] = [];
    for (let k = 0; k < x.rows * x.cols; k++) out.push({ re: x.data[2 * k], im: x.data[2 * k + 1] });
    return out;
  }
  if (Array.isArray(x) || ArrayBuffer.isView(x)) return Array.from(x as ArrayLike<unknown>);
  return null;
}

const within = (actual: number, s: Stated & { kind: 'number' }, tol = s.tol): boolean =>
  Math.abs(actual - s.value) <= tol * (1 + 1e-9) + 1e-13 * Math.abs(s.value);

const show = (x: unknown): string => {
  if (isCMatrix(x)) return `CMatrix ${x.rows}×${x.cols} [${Array.from({ length: Math.min(x.rows * x.cols, 8) }, (_, k) => `${x.data[2 * k]}${x.data[2 * k + 1] < 0 ? '' : '+'}${x.data[2 * k + 1]}j`).join(', ')}]`;
  if (ArrayBuffer.isView(x)) return `${x.constructor.name} [${Array.from(x as unknown as ArrayLike<number>).slice(0, 8).join(', ')}]`;
  try { return JSON.stringify(x) ?? String(x); } catch { return String(x); }
};

/**
 * Compares a computed value with a stated one.
 * @returns null when they agree, else a message naming the mismatch.
 */
export function compareStated(actual: unknown, stated: Stated, where = 'value'): string | null {
  switch (stated.kind) {
    case 'literal':
      return actual === stated.value ? null : `${where}: stated ${stated.text}, computed ${show(actual)}`;
    case 'number': {
      const z = asComplex(actual);
      if (!z) return `${where}: stated the number ${stated.text}, computed ${show(actual)}`;
      return within(z.re, stated) && within(z.im, { ...stated, value: 0 }, stated.tol)
        ? null : `${where}: stated ${stated.text} (± ${stated.tol.toPrecision(2)}), computed ${show(actual)}`;
    }
    case 'complex': {
      const z = asComplex(actual);
      if (!z) return `${where}: stated the complex ${stated.text}, computed ${show(actual)}`;
      const re = stated.re ?? { ...stated.im, value: 0 };
      return within(z.re, re) && within(z.im, stated.im)
        ? null : `${where}: stated ${stated.text}, computed ${z.re} ${z.im < 0 ? '−' : '+'} ${Math.abs(z.im)}j`;
    }
    case 'array': {
      const xs = items(actual);
      if (!xs) return `${where}: stated the array ${stated.text}, computed ${show(actual)}`;
      if (stated.typeName !== null && (actual as object).constructor?.name !== stated.typeName) {
        return `${where}: stated a ${stated.typeName}, computed a ${(actual as object).constructor?.name}`;
      }
      if (stated.open ? xs.length < stated.items.length : xs.length !== stated.items.length) {
        return `${where}: stated ${stated.items.length}${stated.open ? '+' : ''} entries ${stated.text}, computed ${xs.length}: ${show(actual)}`;
      }
      for (let i = 0; i < stated.items.length; i++) {
        const m = compareStated(xs[i], stated.items[i], `${where}[${i}]`);
        if (m) return m;
      }
      return null;
    }
    case 'object': {
      if (typeof actual !== 'object' || actual === null) return `${where}: stated an object ${stated.text}, computed ${show(actual)}`;
      for (const [key, v] of stated.entries) {
        if (!(key in actual)) return `${where}: stated a field "${key}" that the computed value lacks`;
        const m = compareStated((actual as Record<string, unknown>)[key], v, `${where}.${key}`);
        if (m) return m;
      }
      return null;
    }
  }
}
