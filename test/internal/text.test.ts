/** Numbers in messages are rounded to the precision a person gives them (issue 21). */
import { describe, it, expect } from 'vitest';
import { hzText } from '../../src/internal/text.js';
import { parseTouchstone } from '../../src/network/touchstone.js';

describe('hzText', () => {
  it('rounds computed band points to 7 significant digits in an engineering unit', () => {
    expect(hzText(1515000000.0000002)).toBe('1.515 GHz');
    expect(hzText(1.4e9 + (0.2e9 * 23) / 40)).toBe('1.515 GHz'); // a linspace point 1.4–1.6 GHz, 41 points
    expect(hzText(433.92e6)).toBe('433.92 MHz');
    expect(hzText(12.5e3)).toBe('12.5 kHz');
    expect(hzText(50)).toBe('50 Hz');
    expect(hzText(Number.NaN)).toBe('NaN Hz');
  });
  it('parser messages print frequencies that way', () => {
    const text = '# GHz S RI R 50\n1.5150000000000002 0.1 0\n1.5 0.1 0\n';
    expect(() => parseTouchstone(text, { ports: 1 })).toThrow('1.5 GHz follows 1.515 GHz');
  });
});
