/**
 * JSON text to data, with syntax errors placed by line and column.
 * @internal
 * @module
 */
import { parse as scanJson, printParseErrorCode, type ParseError as ScanError } from 'jsonc-parser';
import { ParseError } from '../errors.js';

/** One-based line and column of a character offset in `text`. @internal */
export function lineColumn(text: string, offset: number): { line: number; column: number } {
  const before = text.slice(0, Math.max(0, offset));
  const lastBreak = before.lastIndexOf('\n');
  return { line: before.split('\n').length, column: offset - lastBreak };
}

const WORDING: Record<string, string> = {
  InvalidSymbol: 'unexpected character',
  InvalidNumberFormat: 'malformed number',
  PropertyNameExpected: 'expected a property name in double quotes',
  ValueExpected: 'expected a value',
  ColonExpected: 'expected ":" after the property name',
  CommaExpected: 'expected "," between entries',
  CloseBraceExpected: 'expected "}" to close the object',
  CloseBracketExpected: 'expected "]" to close the array',
  EndOfFileExpected: 'expected the end of the text after the top-level value',
  InvalidCommentToken: 'comments are not allowed in JSON',
  UnexpectedEndOfComment: 'unterminated comment (comments are not allowed in JSON)',
  UnexpectedEndOfString: 'unterminated string',
  UnexpectedEndOfNumber: 'malformed number',
  InvalidUnicode: 'invalid \\u escape',
  InvalidEscapeCharacter: 'invalid escape character in a string',
  InvalidCharacter: 'control character inside a string',
};

/**
 * Parses JSON text; a syntax error becomes a {@link ParseError} with the 1-based line and
 * column of the first problem (located with `jsonc-parser`'s scanner in strict mode, because
 * V8's own messages do not always give a position) and a plain-words reason. NaN and Infinity,
 * which JSON does not have, are named as such.
 * @param text - JSON text.
 * @param what - What the text is, for the message (e.g. "the design file").
 * @returns The parsed value.
 * @throws {@link ParseError} for malformed JSON.
 * @internal
 */
export function parseJsonText(text: string, what: string): unknown {
  try {
    return JSON.parse(text) as unknown;
  } catch {
    const errors: ScanError[] = [];
    scanJson(text, errors, { disallowComments: true, allowTrailingComma: false, allowEmptyContent: false });
    const first = errors[0];
    const offset = first?.offset ?? text.length;
    const { line, column } = lineColumn(text, offset);
    const token = /^[A-Za-z_+-]*\w*/.exec(text.slice(offset))?.[0] ?? '';
    let reason = first ? WORDING[printParseErrorCode(first.error)] ?? printParseErrorCode(first.error) : 'not valid JSON';
    if (/^[+-]?(NaN|Infinity)$/.test(token)) reason = `${token} is not a JSON value (JSON has no NaN or Infinity: write a finite number)`;
    else if (first && text.trim() === '') reason = 'the text is empty';
    else if (token && first?.error !== undefined && printParseErrorCode(first.error) === 'InvalidSymbol') reason = `unexpected "${token.slice(0, 20)}"`;
    throw new ParseError(`${what} is not valid JSON: ${reason}`, line, column);
  }
}
