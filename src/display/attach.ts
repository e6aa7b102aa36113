/**
 * How results carry their printed form: one shared prototype per result kind whose only
 * members are Node's inspect hook and the kind, both symbol-keyed and non-enumerable. The
 * result's own properties stay exactly its plain data, so `JSON.stringify`, structural equality
 * and structured clone (worker threads) see nothing new; see DEVELOPERS.md, "Printed results".
 * No Node module is imported: the hook is reached through `Symbol.for`.
 * @module
 */
import { RESULT_KIND, show, type ResultKind } from './format.js';

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
