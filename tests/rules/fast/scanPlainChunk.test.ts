// The direct scanner checked against wink-tokenizer itself on the chunk (differential): whenever it
// accepts a chunk, its value/tag pairs must be exactly wink's.
import fc from 'fast-check';
import winkTokenizer from 'wink-tokenizer';
import { describe, expect, it } from 'vitest';
import { scanPlainChunk } from '../../../src/rules/fast/scanPlainChunk.js';

const wink = winkTokenizer();

function winkPairs(chunk: string): string[] {
  return wink.tokenize(chunk).flatMap(({ value, tag }) => [value, tag]);
}

/** The scanner's pairs for `chunk` between white space (and at the text's end), or null if it stops early. */
function scanned(chunk: string): string[] | null {
  const raw: string[] = ['before', 'x'];
  const stop = scanPlainChunk(`  ${chunk} z`, 2, raw);
  const atEnd: string[] = [];
  const stopAtEnd = scanPlainChunk(chunk, 0, atEnd);
  if ((stop === 2 + chunk.length) !== (stopAtEnd === chunk.length)) return ['white space and end of text differ'];
  if (stop !== 2 + chunk.length) return null;
  expect(raw.slice(0, 2)).toEqual(['before', 'x']);
  expect(atEnd).toEqual(raw.slice(2));
  return raw.slice(2);
}

describe('scanPlainChunk', () => {
  it.each([
    ['ferry', ['ferry', 'word']],
    ['(Ærø),', ['(', 'punctuation', 'Ærø', 'word', ')', 'punctuation', ',', 'punctuation']],
    ['1200.', ['1200', 'number', '.', 'punctuation']],
    ['...', ['.', 'punctuation', '.', 'punctuation', '.', 'punctuation']],
    ['late:', ['late', 'word', ':', 'punctuation']],
    ['well-known,', ['well', 'word', '-', 'punctuation', 'known', 'word', ',', 'punctuation']],
    ['$1,200.50.', ['$', 'currency', '1,200.50', 'number', '.', 'punctuation']],
    ['12-12-2026', ['12-12-2026', 'number']],
    ['1--2', ['1', 'number', '-', 'punctuation', '-', 'punctuation', '2', 'number']],
    ['10:30', ['10', 'number', ':', 'punctuation', '30', 'number']],
    ['u.s.a.', ['u', 'word', '.', 'punctuation', 's', 'word', '.', 'punctuation', 'a', 'word', '.', 'punctuation']],
    ['id7', ['id', 'word', '7', 'number']],
    ['10:', ['10', 'number', ':', 'punctuation']],
  ])('takes %j as wink does', (chunk, expected) => {
    expect(scanned(chunk)).toEqual(expected);
    expect(winkPairs(chunk)).toEqual(expected);
  });

  it.each(["can't", 'boats\'', ':)', ';d', ':-(', 'x:[', '1st', '10am', '10:am', '3:45pm', '7x', '×', 'Паром', '😀', '@a', '#a', '1/4', '€5', 'ſ', 'http://x.io'])(
    'leaves %j to wink',
    (chunk) => {
      expect(scanned(chunk)).toBeNull();
    },
  );

  it('equals wink on every chunk it accepts (fast-check, chunks over a risky alphabet)', () => {
    const alphabet = [...'aApPhHdDsSmMrtnoux09125ßÿÀ×÷,.!?;:"()[]{}-\'`*/<3@#$£¥€µſ_'];
    let accepted = 0;
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...alphabet), { minLength: 1, maxLength: 8 }), (chars) => {
        const chunk = chars.join('');
        const got = scanned(chunk);
        if (got !== null) {
          accepted += 1;
          expect(got).toEqual(winkPairs(chunk));
        }
      }),
      { numRuns: 20_000 },
    );
    // The property says something only if the scanner took a fair share of the chunks.
    expect(accepted).toBeGreaterThan(500);
  });

  it('equals wink on every one- and two-character chunk of Latin-1 (exhaustive)', () => {
    let mismatched = 0;
    for (let a = 0x21; a < 0x100; a++) {
      for (let b = 0x20; b < 0x100; b++) {
        const chunk = b === 0x20 ? String.fromCharCode(a) : String.fromCharCode(a, b);
        if (/\s/.test(chunk)) continue;
        const got = scanned(chunk);
        if (got !== null && JSON.stringify(got) !== JSON.stringify(winkPairs(chunk))) mismatched += 1;
      }
    }
    expect(mismatched).toBe(0);
  });
});
