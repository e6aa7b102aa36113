/**
 * Reading results back from `JSON.stringify`: typed arrays, complex values and the printed form.
 * @module
 */
import { Complex } from 'complex.js';
import { ParseError } from '../errors.js';
import { parseJsonText } from '../internal/json.js';
import { displayable } from './attach.js';
import { resultKind } from './format.js';

/** Fields that hold typed arrays in phasewise results (an empty one stringifies as `{}`). */
const TYPED_FIELDS = new Set([
  'data', 'frequencyHz', 'referenceOhm', 'noiseWaves', 'zeros', 'coefficients', 'embeddedElementEfficiency', 'weights',
  'thetaRad', 'phiRad', 'values',
]);

/** Whether an object is what `JSON.stringify` makes of a non-empty typed array: keys "0" … "n−1", numbers. */
function typedArrayObject(x: Record<string, unknown>): number | undefined {
  const keys = Object.keys(x);
  if (keys.length === 0) return undefined;
  for (let i = 0; i < keys.length; i++) {
    if (keys[i] !== String(i) || typeof x[keys[i]] !== 'number') return undefined;
  }
  return keys.length;
}

function revive(key: string, v: unknown): unknown {
  if (v === null || typeof v !== 'object' || Array.isArray(v)) return v;
  const r = v as Record<string, unknown>;
  const n = typedArrayObject(r);
  if (n !== undefined) return Float64Array.from({ length: n }, (_, i) => r[String(i)] as number);
  const keys = Object.keys(r);
  if (keys.length === 0 && TYPED_FIELDS.has(key)) return new Float64Array(0);
  if (keys.length === 2 && typeof r.re === 'number' && typeof r.im === 'number') return new Complex(r.re, r.im);
  const kind = resultKind(r);
  return kind === undefined ? r : displayable(r, kind);
}

/**
 * Reads a phasewise result back from the text `JSON.stringify(result)` wrote: typed arrays
 * (which `JSON.stringify` writes as objects with keys "0", "1", …) become `Float64Array` again,
 * `{re, im}` pairs become complex.js values, and every recognised result (see {@link show})
 * prints as it did before.
 *
 * @remarks
 * `JSON.stringify` writes NaN and ±Infinity as `null`, which this reader keeps as `null`, and
 * −0 as 0; an
 * empty typed array is written as `{}` and read back as an empty `Float64Array` for the fields
 * phasewise results use for typed arrays (`data`, `frequencyHz`, `weights`, `zeros`, …).
 * Functions (e.g. a noise budget's pattern source) are not serialised. Display guide:
 * docs/display.md.
 * @param text - JSON text.
 * @returns The result as plain data on its display prototype.
 * @throws {@link ParseError} if the text is not JSON (with the line and column of the first problem).
 * @example
 * ```ts
 * const z = fromRows([[50, { re: 0, im: 25 }]]);
 * resultFromJSON(JSON.stringify(z)); // [50, 25j]
 * ```
 * @category Display
 */
export function resultFromJSON(text: string): unknown {
  if (typeof text !== 'string') throw new ParseError(`invalid argument "text": expected JSON text (a string), received ${typeof text}.`);
  return reviveTree('', parseJsonText(text, 'the result text'));
}

/** Revives a parsed tree bottom-up, as a JSON.parse reviver would. */
function reviveTree(key: string, v: unknown): unknown {
  if (v === null || typeof v !== 'object') return v;
  if (Array.isArray(v)) return v.map((x, i) => reviveTree(String(i), x));
  const r = v as Record<string, unknown>;
  for (const k of Object.keys(r)) r[k] = reviveTree(k, r[k]);
  return revive(key, r);
}
