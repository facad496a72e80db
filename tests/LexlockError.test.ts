import { describe, expect, it } from 'vitest';
import { LexlockError, formatWhere, inputError, isLexlockError } from '../src/LexlockError.js';

describe('LexlockError', () => {
  it.each([
    [{ file: 'reviews.csv', line: 4 }, 'reviews.csv line 4'],
    [{ file: 'reviews.csv', line: 7, row: 6 }, 'reviews.csv line 7 (row 6)'],
    [{ file: 'reviews.csv', row: 6 }, 'reviews.csv row 6'],
    [{ file: 'a.bin', byteOffset: 1031 }, 'a.bin byte 1031'],
    [{ file: 'lex.json', field: 'encoding.tokens' }, 'lex.json member encoding.tokens'],
    [{ file: 'r.csv', line: 1, field: 'text' }, 'r.csv line 1'],
    [{ field: '--cap' }, ''],
    [{}, ''],
  ])('formats %j as %j', (where, text) => {
    expect(formatWhere(where)).toBe(text);
  });

  it('prefixes the place and keeps code and where', () => {
    const e = inputError('CSV_UNCLOSED_QUOTE', { file: 'reviews.csv', line: 4, byteOffset: 80 }, 'quote opened here is never closed');
    expect(e.message).toBe('reviews.csv line 4: quote opened here is never closed');
    expect([e.code, e.where.byteOffset, e.name, e.isUsage]).toEqual(['CSV_UNCLOSED_QUOTE', 80, 'LexlockError', false]);
    expect(inputError('EMPTY_CORPUS', {}, 'no documents').message).toBe('no documents');
  });

  it('tells usage errors from input errors, and recognizes itself', () => {
    expect(new LexlockError('USAGE_BAD_VALUE', 'x').isUsage).toBe(true);
    expect(new LexlockError('BAD_OPTION', 'x').isUsage).toBe(true);
    expect(new LexlockError('BAD_UTF8', 'x').isUsage).toBe(false);
    expect(isLexlockError(new LexlockError('IO', 'x'))).toBe(true);
    expect(isLexlockError(new Error('x'))).toBe(false);
    expect(isLexlockError({ name: 'LexlockError', code: 'IO' })).toBe(false);
  });
});
