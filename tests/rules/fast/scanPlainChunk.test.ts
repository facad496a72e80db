// The direct scanner checked against wink-tokenizer itself on the chunk (differential): whenever it
// accepts a chunk, its value/tag pairs must be exactly wink's.
import fc from 'fast-check';
import winkTokenizer from 'wink-tokenizer';
import { describe, expect, it } from 'vitest';
import { scanPlainChunk } from '../../../src/rules/fast/scanPlainChunk.js';
import { SpanRecorder } from './SpanRecorder.js';

const wink = winkTokenizer();

function winkPairs(chunk: string): string[] {
  return wink.tokenize(chunk).flatMap(({ value, tag }) => [value, tag]);
}

/** The scanner's pairs for `chunk` between white space (and at the text's end), or null if it stops early. */
function scanned(chunk: string): string[] | null {
  const text = `  ${chunk} z`;
  const inside = new SpanRecorder(text);
  const stop = scanPlainChunk(text, 2, inside);
  const atEnd = new SpanRecorder(chunk);
  const stopAtEnd = scanPlainChunk(chunk, 0, atEnd);
  if ((stop === 2 + chunk.length) !== (stopAtEnd === chunk.length)) return ['white space and end of text differ'];
  if (stop !== 2 + chunk.length) return null;
  expect(atEnd.pairs).toEqual(inside.pairs);
  return inside.pairs;
}

/** Where the scanner stops in `chunk` and the spans it reports, as plain data. */
function stopsAndSpans(chunk: string): unknown {
  const out = new SpanRecorder(chunk);
  return [scanPlainChunk(chunk, 0, out), out.spans];
}

describe('scanPlainChunk', () => {
  it.each<[string, string[] | null]>([
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
    ['7x', ['7', 'number', 'x', 'word']],
    ['ref-46943-91f2', ['ref', 'word', '-', 'punctuation', '46943-91', 'number', 'f', 'word', '2', 'number']],
    ['835484f3e322', ['835484', 'number', 'f', 'word', '3', 'number', 'e', 'word', '322', 'number']],
    ['1/4', ['1/4', 'number']],
    ['1/2.5', ['1/2', 'number', '.', 'punctuation', '5', 'number']],
    ['1.2/3', ['1.2/3', 'number']],
    ['12/3/4', ['12/3', 'number', '/', 'symbol', '4', 'number']],
    ['+0000,', ['+', 'symbol', '0000', 'number', ',', 'punctuation']],
    ['charset=utf-8', ['charset', 'word', '=', 'symbol', 'utf', 'word', '-', 'punctuation', '8', 'number']],
    ['text/plain;', ['text', 'word', '/', 'symbol', 'plain', 'word', ';', 'punctuation']],
    ['>', ['>', 'symbol']],
    ['<30', null],
    ['a&b|c~d^e%*', ['a', 'word', '&', 'symbol', 'b', 'word', '|', 'symbol', 'c', 'word', '~', 'symbol', 'd', 'word', '^', 'symbol', 'e', 'word', '%', 'symbol', '*', 'symbol']],
  ])('takes %j as wink does (null: leaves it to wink)', (chunk, expected) => {
    expect(scanned(chunk)).toEqual(expected);
    if (expected !== null) expect(winkPairs(chunk)).toEqual(expected);
  });

  it.each(["can't", 'boats\'', ':)', ';d', ':-(', 'x:[', '1st', '10am', '10:am', '3:45pm', '1.5a.m', '3hrs', '4Hours', '12th', '2nd', '3rd', '<3', 'x<3', '×', 'Паром', '😀', '@a', '#a', '€5', 'ſ', 'http://x.io'])(
    'leaves %j to wink',
    (chunk) => {
      expect(scanned(chunk)).toBeNull();
    },
  );

  it('equals wink on every chunk it accepts (fast-check, chunks over a risky alphabet)', () => {
    const alphabet = [...'aApPhHdDsSmMrtnoux09125ßÿÀ×÷,.!?;:"()[]{}-\'`*/<>3@#$£¥€µſ_~%^+=|&'];
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

  it('decides the same for A-Z as for a-z, so encode may scan ASCII before lower-casing it (fast-check)', () => {
    const ascii = [...'aApPhHdDsSmMrRtTnNoOuUxX0912,.!?;:"()[]{}-\'`*/<>3@#$_~%^+=|&'];
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...ascii), { minLength: 1, maxLength: 8 }), (chars) => {
        const chunk = chars.join('');
        expect(stopsAndSpans(chunk)).toEqual(stopsAndSpans(chunk.toLowerCase()));
      }),
      { numRuns: 20_000 },
    );
  });

  it('moves every span by `shift` and stops at `end`', () => {
    const out = new SpanRecorder('xxxxxxxx');
    expect(scanPlainChunk('ab,cd', 0, out, 4, 3)).toBe(4);
    expect(out.spans).toEqual([[3, 5, 'word'], [5, 6, 'punctuation'], [6, 7, 'word']]);
  });

  it('equals wink on every three-character chunk over the characters that decide its stops (exhaustive)', () => {
    // Letters that begin time and ordinal suffixes, digits, every joint, symbol and punctuation mark.
    const risky = [...'apmhorstnd.xAPM0123,-/:;<>3+*=()"!?$'];
    let accepted = 0;
    let mismatched = 0;
    for (const a of risky) for (const b of risky) for (const c of risky) {
      const chunk = a + b + c;
      const got = scanned(chunk);
      if (got === null) continue;
      accepted += 1;
      if (JSON.stringify(got) !== JSON.stringify(winkPairs(chunk))) mismatched += 1;
    }
    expect(mismatched).toBe(0);
    expect(accepted).toBeGreaterThan(20_000);
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
