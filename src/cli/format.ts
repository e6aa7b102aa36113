/**
 * Plain-text tables for the terminal.
 * @internal
 * @module
 */

/** Formats a number with the given significant digits (no exponent for ordinary magnitudes). @internal */
export function num(x: number, digits = 5): string {
  if (!Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  if (a !== 0 && (a < 1e-3 || a >= 1e7)) return x.toExponential(digits - 1);
  return Number(x.toPrecision(digits)).toString();
}

/** Left-aligned text table with a header row. @internal */
export function table(header: readonly string[], rows: ReadonlyArray<readonly string[]>): string {
  const w = header.map((h, j) => Math.max(h.length, ...rows.map((r) => (r[j] ?? '').length)));
  const line = (r: readonly string[]) => r.map((c, j) => c.padEnd(w[j])).join('  ').trimEnd();
  return [line(header), line(w.map((n) => '-'.repeat(n))), ...rows.map(line)].join('\n');
}
