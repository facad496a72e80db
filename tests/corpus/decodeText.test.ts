import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { decodeText } from '../../src/corpus/decodeText.js';
import type { CorpusStats } from '../../src/corpus/CorpusStats.js';

const fresh = (): CorpusStats => ({ documents: 0, replaced: 0, skipped: 0, bytes: 0 });

describe('decodeText', () => {
  // Unicode Standard §3.9, Table 3-8 "U+FFFD for maximal subparts" (from memory): the bytes
  // 61 F1 80 80 E1 80 C2 62 80 63 80 BF 64 decode to a, 3x U+FFFD, b, U+FFFD, c, 2x U+FFFD, d.
  const table38 = Buffer.from([0x61, 0xf1, 0x80, 0x80, 0xe1, 0x80, 0xc2, 0x62, 0x80, 0x63, 0x80, 0xbf, 0x64]);

  it('returns valid UTF-8 as is, U+FEFF inside a document included, and counts nothing', () => {
    const stats = fresh();
    expect(decodeText(Buffer.from('\uFEFFcafé 🎉', 'utf8'), { line: 1, byteOffset: 0 }, { badText: 'fail', stats, file: 'x.txt' })).toBe('\uFEFFcafé 🎉');
    expect(stats).toEqual(fresh());
  });

  it('replace: decodes with the WHATWG replacement and counts the document', () => {
    const stats = fresh();
    const text = decodeText(table38, { line: 1, byteOffset: 0 }, { badText: 'replace', stats, file: 'x.txt' });
    expect(text).toBe('a\uFFFD\uFFFD\uFFFDb\uFFFDc\uFFFD\uFFFDd');
    expect(stats.replaced).toBe(1);
    expect(stats.skipped).toBe(0);
  });

  it('skip: returns null and counts the document', () => {
    const stats = fresh();
    expect(decodeText(table38, { line: 1, byteOffset: 0 }, { badText: 'skip', stats, file: 'x.txt' })).toBeNull();
    expect(stats.skipped).toBe(1);
    expect(stats.replaced).toBe(0);
  });

  it.each([
    // [what, bytes, start, message]
    ['the first bad byte of one line', table38, { line: 3, byteOffset: 50 }, 'x.txt line 3: invalid UTF-8 at byte 51'],
    ['a bad byte on the third line of a record', Buffer.from([0x61, 0x0a, 0x62, 0x0a, 0x63, 0xff]), { line: 7, byteOffset: 100, row: 4 }, 'x.txt line 9 (row 4): invalid UTF-8 at byte 105'],
  ])('fail: BAD_UTF8 names %s', (_, bytes, start, place) => {
    let error: unknown;
    try {
      decodeText(bytes, start, { badText: 'fail', stats: fresh(), file: 'x.txt' });
    } catch (e) {
      error = e;
    }
    expect(isLexlockError(error)).toBe(true);
    if (!isLexlockError(error)) return;
    expect(error.code).toBe('BAD_UTF8');
    expect(error.message).toBe(`${place}; fix the file's encoding or pass --bad-text replace or --bad-text skip`);
  });
});
