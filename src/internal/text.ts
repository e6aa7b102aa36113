/**
 * Numbers in messages: rounded to the precision a person gives them, not the last bit of a
 * computed value (a band point prints as "1.515 GHz", never "1515000000.0000002 Hz").
 * @internal
 * @module
 */

/**
 * A frequency in the nearest engineering unit, to 7 significant digits ("1.515 GHz", "433.92 MHz").
 * @param f - Frequency [Hz].
 * @returns Text with its unit.
 * @internal
 */
export function hzText(f: number): string {
  if (!Number.isFinite(f)) return `${f} Hz`;
  const a = Math.abs(f);
  const [s, u] = a >= 1e9 ? [f / 1e9, 'GHz'] : a >= 1e6 ? [f / 1e6, 'MHz'] : a >= 1e3 ? [f / 1e3, 'kHz'] : [f, 'Hz'];
  return `${Number(s.toPrecision(7))} ${u}`;
}
