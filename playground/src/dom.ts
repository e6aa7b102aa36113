/** Small DOM helpers shared by the three panels. */

/** The element with this id (throws a TypeError naming the id if the markup lacks it). */
export function byId<T extends HTMLElement>(id: string): T {
  const el = document.getElementById(id);
  if (!el) throw new TypeError(`playground markup lacks #${id}`);
  return el as T;
}

/** The numeric value of an <input>, or NaN when it is empty or not a number. */
export function inputNumber(id: string): number {
  const raw = byId<HTMLInputElement>(id).value.trim();
  return raw === '' ? NaN : Number(raw);
}

/** The value of a <select>. */
export function selectValue(id: string): string {
  return byId<HTMLSelectElement>(id).value;
}

/**
 * Shows a computed figure: the rounded text for people, the full-precision number in
 * `data-value` (the browser test compares it with the library's own result).
 */
export function showFigure(id: string, value: number | undefined, digits = 4, unit = ''): void {
  const el = byId(id);
  if (value === undefined || !Number.isFinite(value)) {
    el.textContent = '—';
    el.dataset.value = '';
    return;
  }
  el.textContent = `${formatNumber(value, digits)}${unit ? `\u2009${unit}` : ''}`;
  el.dataset.value = String(value);
}

/** Rounds to `digits` significant figures, switching to exponent notation for very small or large values. */
export function formatNumber(x: number, digits = 4): string {
  const a = Math.abs(x);
  // Rounding residue of a level that is exactly zero in theory (e.g. a grating lobe at 0 dB).
  if (a < 1e-9) return '0';
  if (a >= 1e-3 && a < 1e6) return Number(x.toPrecision(digits)).toString();
  return x.toExponential(digits - 1);
}

/** Writes a message into a panel's status line (an ARIA live region); empty clears it. */
export function showStatus(id: string, message: string, kind: 'error' | 'warning' | 'info' = 'error'): void {
  const el = byId(id);
  el.textContent = message;
  el.dataset.kind = message ? kind : '';
}

/** A message for any thrown value: the library's errors carry their own readable text. */
export function describeError(e: unknown): string {
  if (e instanceof Error) return `${e.name}: ${e.message}`;
  return String(e);
}

/** Calls `fn` once the inputs have been quiet for `ms` milliseconds. */
export function debounce(fn: () => void, ms: number): () => void {
  let timer: ReturnType<typeof setTimeout> | undefined;
  return () => {
    if (timer !== undefined) clearTimeout(timer);
    timer = setTimeout(() => { timer = undefined; fn(); }, ms);
  };
}
