/**
 * How results carry their printed form: one shared prototype per result kind whose only
 * members are Node's inspect hook and the kind, both symbol-keyed and non-enumerable. The
 * result's own properties stay exactly its plain data, so `JSON.stringify`, structural equality
 * and structured clone (worker threads) see nothing new; see DEVELOPERS.md, "Printed results".
 * No Node module is imported: the hook is reached through `Symbol.for`.
 * @module
 */
import { RESULT_KIND, resultKind, show, type ResultKind } from './format.js';

/**
 * The symbol through which Node's `util.inspect` (REPL, `console.log`, notebook kernels that
 * print values with it) asks an object for its own text: `Symbol.for('nodejs.util.inspect.custom')`.
 * @category Display
 */
export const INSPECT_SYMBOL: unique symbol = Symbol.for('nodejs.util.inspect.custom') as typeof INSPECT_SYMBOL;

/** The hook Node calls: the result's {@link show} text. */
function inspectHook(this: unknown): string {
  return show(this);
}

const prototypes = new Map<ResultKind, object>();

/**
 * The shared prototype of a result kind (created once): `Object.prototype` plus the inspect
 * hook and the kind, non-enumerable and symbol-keyed. @internal
 */
export function displayPrototype(kind: ResultKind): object {
  let p = prototypes.get(kind);
  if (p === undefined) {
    p = Object.create(Object.prototype, {
      [INSPECT_SYMBOL]: { value: inspectHook, enumerable: false, writable: true, configurable: true },
      [RESULT_KIND]: { value: kind, enumerable: false, writable: false, configurable: false },
    }) as object;
    prototypes.set(kind, p);
  }
  return p;
}

/**
 * The same plain data as `value` (a shallow copy of its own enumerable properties) on the
 * prototype of `kind`, so that it prints as a summary in Node's REPL. Cold paths only (one
 * copy per result); hot factories create their objects on the prototype directly. @internal
 */
export function displayable<T extends object>(value: T, kind: ResultKind): T {
  return Object.assign(Object.create(displayPrototype(kind)) as T, value);
}

/**
 * Gives plain result data its printed form again, in place of a copy: every object inside
 * `value` (arrays and records, depth first) that {@link resultKind} recognises and that has lost
 * its display prototype — after a structured clone (a worker thread, `structuredClone`), a
 * spread, or `JSON.parse` — is replaced by the same data on the prototype of its kind.
 *
 * @remarks
 * Records and arrays are rebuilt only where something changes; typed arrays, functions and
 * values already on a display prototype are returned as they are. The data are not modified.
 * Display guide: docs/display.md.
 * @param value - A result, or a structure holding results.
 * @returns The same data, printing as phasewise results do.
 * @example
 * ```ts
 * const z = structuredClone(fromRows([[1, 2]])); // plain again
 * resultKind(z); // 'CMatrix'
 * restoreDisplay(z) === z; // false
 * ```
 * @category Display
 */
export function restoreDisplay<T>(value: T): T {
  return restore(value, 0) as T;
}

function restore(value: unknown, depth: number): unknown {
  if (value === null || typeof value !== 'object' || ArrayBuffer.isView(value) || depth > 12) return value;
  if (Array.isArray(value)) {
    if (value.length === 0 || typeof value[0] !== 'object') return value;
    let changed = false;
    const out = value.map((x) => { const r = restore(x, depth + 1); if (r !== x) changed = true; return r; });
    return changed ? out : value;
  }
  const proto = Object.getPrototypeOf(value);
  if (proto !== Object.prototype && proto !== null) return value;
  const rec = value as Record<string, unknown>;
  let copy: Record<string, unknown> | undefined;
  for (const k of Object.keys(rec)) {
    const r = restore(rec[k], depth + 1);
    if (r !== rec[k]) (copy ??= { ...rec })[k] = r;
  }
  const data = copy ?? rec;
  const kind = resultKind(data);
  return kind === undefined ? data : displayable(data, kind);
}
