/**
 * JSON syntax errors are placed by 1-based line and column and worded for people (issue 21).
 * The expected places are counted by hand from the texts below.
 */
import { describe, it, expect } from 'vitest';
import { parseJsonText } from '../../src/internal/json.js';
import { ParseError } from '../../src/errors.js';

function failure(text: string): ParseError {
  try {
    parseJsonText(text, 'the file');
  } catch (e) {
    expect(e).toBeInstanceOf(ParseError);
    return e as ParseError;
  }
  throw new Error(`expected ${JSON.stringify(text)} to fail`);
}

describe('parseJsonText', () => {
  it('parses valid JSON exactly as JSON.parse does', () => {
    const text = '{"a": [1, 2.5e3, -0.25], "b": {"c": null, "d": "x\\u00e9"}}';
    expect(parseJsonText(text, 'x')).toEqual(JSON.parse(text));
  });
  it('places each kind of error at its line and column', () => {
    const cases: Array<[string, number, number, RegExp]> = [
      ['{"a": 1,\n "b": NaN}', 2, 7, /NaN is not a JSON value \(JSON has no NaN or Infinity/],
      ['{"a": -Infinity}', 1, 7, /-Infinity is not a JSON value/],
      ['{"a": 1,\n "b": }', 2, 7, /expected a value/],
      ['{"a": 1,}', 1, 9, /expected a property name in double quotes/],
      ['[1, 2', 1, 6, /expected "]" to close the array/],
      ['{"a": 1}\n x', 2, 2, /unexpected "x"/],
      ['// note\n{}', 1, 1, /comments are not allowed in JSON/],
      ['', 1, 1, /the text is empty/],
      ['{\n  "a": 1\n  "b": 2\n}', 3, 3, /expected "," between entries/],
    ];
    for (const [text, line, column, reason] of cases) {
      const e = failure(text);
      expect([e.line, e.column], JSON.stringify(text)).toEqual([line, column]);
      expect(e.message, JSON.stringify(text)).toMatch(new RegExp(`^line ${line}, column ${column}: the file is not valid JSON: `));
      expect(e.detail, JSON.stringify(text)).toMatch(reason);
      expect(e.inFile('d.json').message).toMatch(new RegExp(`^d\\.json:${line}:${column}: the file is not valid JSON`));
    }
  });
});
