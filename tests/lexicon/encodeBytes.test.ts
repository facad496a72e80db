import { isUtf8 } from 'node:buffer';
import { mkdir, writeFile } from 'node:fs/promises';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { BAD_TEXT_POLICIES, type BadTextPolicy } from '../../src/artifact/badTextPolicy.js';
import { firstInvalidUtf8 } from '../../src/artifact/firstInvalidUtf8.js';
import { decodeText } from '../../src/corpus/decodeText.js';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { utf8BomLength } from '../../src/corpus/utf8Bom.js';
import { decodeBytes } from '../../src/lexicon/decodeBytes.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import { isLexlockError, type LexlockError } from '../../src/LexlockError.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { freshFolderEachTest } from '../helpers/tempFolder.js';

// Lexicon.encodeBytes: one document's UTF-8 bytes -> ids under a bad-text policy, the same ids as the
// corpus readers give the same bytes as a file of a folder corpus (decode, then encode).

const TEXTS = ['the ferry was late again', 'late late \uFFFD ferry', 'a b é 🎉 \uFEFF', 'Лодка опоздала'];
const word = freeze(Tally.fromTexts(TEXTS, resolveRules()), { shape: { length: 12, pad: 'start', cut: 'end' } });
// At the character level with spaces kept, every U+FFFD and every white-space run (U+FEFF included) is a
// token of its own: the level that shows most of what decoding did.
const chars = freeze(Tally.fromTexts(TEXTS, resolveRules({ level: 'char' })));
const withPolicy = (badText: BadTextPolicy) => freeze(Tally.fromTexts(TEXTS, resolveRules({ level: 'char' })), { badText });

const bytes = (...b: number[]) => new Uint8Array(b);
const utf8 = (text: string) => new TextEncoder().encode(text);
const ids = (a: Int32Array) => Array.from(a);

function thrown(fn: () => unknown): LexlockError {
  try {
    fn();
  } catch (e) {
    if (isLexlockError(e)) return e;
    throw e;
  }
  throw new Error('expected a LexlockError, nothing was thrown');
}

// Invalid UTF-8 and what the WHATWG Encoding Standard's UTF-8 decoder (which TextDecoder implements)
// gives for it with replacement: one U+FFFD for each maximal subpart of a bad sequence. The first row is
// the Unicode Standard's example (§3.9, Table 3-8, "U+FFFD for maximal subparts"); the others follow the
// decoder's algorithm (valid second bytes: E0 A0-BF, ED 80-9F, F0 90-BF, F4 80-8F; C0, C1 and F5-FF are
// never valid), worked out by hand from memory of the standard. `first` is the first bad byte's offset.
const INVALID: Array<[string, Uint8Array, string, number]> = [
  ['Table 3-8', bytes(0x61, 0xf1, 0x80, 0x80, 0xe1, 0x80, 0xc2, 0x62, 0x80, 0x63, 0x80, 0xbf, 0x64), 'a\uFFFD\uFFFD\uFFFDb\uFFFDc\uFFFD\uFFFDd', 1],
  ['a lone continuation byte', bytes(0x61, 0x80, 0x62), 'a\uFFFDb', 1],
  ['an overlong slash (C0 AF)', bytes(0xc0, 0xaf), '\uFFFD\uFFFD', 0],
  ['an overlong three-byte form (E0 80 AF)', bytes(0xe0, 0x80, 0xaf), '\uFFFD\uFFFD\uFFFD', 0],
  ['a surrogate written as UTF-8 (ED A0 80)', bytes(0x61, 0xed, 0xa0, 0x80), 'a\uFFFD\uFFFD\uFFFD', 1],
  ['a code point above U+10FFFF (F4 90 80 80)', bytes(0xf4, 0x90, 0x80, 0x80), '\uFFFD\uFFFD\uFFFD\uFFFD', 0],
  ['F5, never a lead byte', bytes(0x62, 0xf5), 'b\uFFFD', 1],
  ['a four-byte sequence cut short, then a letter', bytes(0xf0, 0x9f, 0x98, 0x61), '\uFFFDa', 0],
  ['a four-byte sequence cut short at the end', bytes(0x61, 0xf0, 0x9f, 0x98), 'a\uFFFD', 1],
  ['a byte order mark, then a bad byte (offsets count the mark)', bytes(0xef, 0xbb, 0xbf, 0x61, 0xff), 'a\uFFFD', 4],
  ['half a byte order mark', bytes(0xef, 0xbb, 0x61), '\uFFFDa', 0],
];

describe('decodeBytes', () => {
  it.each(INVALID)('replace: %s as the WHATWG decoder gives it', (_what, input, text) => {
    expect(decodeBytes(input, 'replace')).toBe(text);
  });

  it.each(INVALID)('fail: %s is BAD_UTF8 naming the first bad byte', (_what, input, _text, first) => {
    const e = thrown(() => decodeBytes(input, 'fail'));
    expect([e.code, e.where, e.message]).toEqual([
      'BAD_UTF8',
      { byteOffset: first },
      `invalid UTF-8 at byte ${first}; send UTF-8 text, or pass badText 'replace' to decode it with U+FFFD for each bad sequence`,
    ]);
  });

  it.each(INVALID)('skip: %s is SKIPPED_TEXT, a document the corpus reader would leave out', (_what, input, _text, first) => {
    const e = thrown(() => decodeBytes(input, 'skip'));
    expect([e.code, e.where, e.message]).toEqual([
      'SKIPPED_TEXT',
      { byteOffset: first },
      `invalid UTF-8 at byte ${first}; the bad-text policy skip leaves out a document with invalid UTF-8 (as it left such documents out of the corpus): leave this one out too, or pass badText 'replace'`,
    ]);
  });

  it.each([
    ['a leading byte order mark is dropped, as a corpus reader drops a file\'s', bytes(0xef, 0xbb, 0xbf, 0x61), 'a'],
    ['only one: a second stays U+FEFF', bytes(0xef, 0xbb, 0xbf, 0xef, 0xbb, 0xbf, 0x61), '\uFEFFa'],
    ['one inside the text stays', utf8('a\uFEFFb'), 'a\uFEFFb'],
    ['no bytes: no text', bytes(), ''],
  ])('valid UTF-8 under every policy: %s', (_what, input, text) => {
    for (const policy of BAD_TEXT_POLICIES) expect(decodeBytes(input, policy)).toBe(text);
  });

  it('refuses a policy it does not know (BAD_OPTION)', () => {
    const e = thrown(() => decodeBytes(bytes(0x61), 'drop' as BadTextPolicy));
    expect([e.code, e.message]).toEqual(['BAD_OPTION', 'badText: "drop" is not one of fail, replace, skip']);
  });
});

describe('Lexicon.encodeBytes', () => {
  it('takes the lexicon\'s policy (fit.badText) by default, and options.badText over it', () => {
    const bad = bytes(0x61, 0xff, 0x62);
    expect([withPolicy('fail').badText, withPolicy('replace').badText, withPolicy('skip').badText, chars.badText]).toEqual(['fail', 'replace', 'skip', 'fail']);
    expect(ids(withPolicy('replace').encodeBytes(bad))).toEqual(ids(chars.encode('a\uFFFDb')));
    expect(thrown(() => withPolicy('fail').encodeBytes(bad)).code).toBe('BAD_UTF8');
    expect(thrown(() => withPolicy('skip').encodeBytes(bad)).code).toBe('SKIPPED_TEXT');
    expect(ids(withPolicy('fail').encodeBytes(bad, { badText: 'replace' }))).toEqual(ids(chars.encode('a\uFFFDb')));
    expect(thrown(() => withPolicy('replace').encodeBytes(bad, { badText: 'skip' })).code).toBe('SKIPPED_TEXT');
  });

  it('applies the lexicon\'s shape, or the one given, as encode does', () => {
    const text = 'the ferry was late again, sadly';
    expect(ids(word.encodeBytes(utf8(text)))).toEqual(ids(word.encode(text)));
    expect(ids(word.encodeBytes(utf8(text)))).toHaveLength(12);
    const shape = { length: 3, pad: 'end', cut: 'start' } as const;
    expect(ids(word.encodeBytes(utf8(text), { shape }))).toEqual(ids(word.encode(text, { shape })));
    expect(ids(word.encodeBytes(utf8(text), { shape: null }))).toEqual(ids(word.encode(text, { shape: null })));
  });

  // Any JavaScript string, lone surrogates included: a UTF-8 encoder writes those as U+FFFD (WHATWG
  // Encoding Standard, "UTF-8 encode"), which is what encode makes of them (encoding contract, rule 1).
  const anyText = fc.oneof(
    fc.string({ unit: 'binary', maxLength: 40 }),
    fc.string({ unit: fc.integer({ min: 0, max: 0xffff }).map((u) => String.fromCharCode(u)), maxLength: 40 }),
    fc.array(fc.constantFrom('late', ' ', 'ferry', '\uFEFF', 'é', 'e\u0301', '🎉', '\uD800', 'Лодка', '\n'), { maxLength: 12 }).map((p) => p.join('')),
  );

  it('valid UTF-8: the ids of the text it spells, under every policy, at both levels (property)', () => {
    fc.assert(
      fc.property(anyText, fc.constantFrom(...BAD_TEXT_POLICIES), (text, badText) => {
        const input = utf8(text);
        // One leading U+FEFF is the byte order mark, which decoding drops.
        const spelled = text.startsWith('\uFEFF') ? text.slice(1) : text;
        for (const lexicon of [word, chars]) {
          expect(ids(lexicon.encodeBytes(input, { badText }))).toEqual(ids(lexicon.encode(spelled)));
        }
      }),
      { numRuns: 300 },
    );
  });

  // Bytes that are often UTF-8, often not: pieces of valid text mixed with stray bytes.
  const mixedBytes = fc
    .array(fc.oneof(anyText.map((t) => Array.from(utf8(t))), fc.array(fc.integer({ min: 0x80, max: 0xff }), { minLength: 1, maxLength: 3 }), fc.constant([0xef, 0xbb, 0xbf])), { maxLength: 8 })
    .map((parts) => Uint8Array.from(parts.flat()));

  it('any bytes: the ids a corpus reader gives them (decodeText on a folder file), or its error, under each policy (property)', () => {
    fc.assert(
      fc.property(mixedBytes, fc.constantFrom(...BAD_TEXT_POLICIES), (input, badText) => {
        // The folder reader's steps (readFolder): drop a BOM, then decode under the policy with node:buffer.
        const bom = utf8BomLength(input);
        const stats = { documents: 0, replaced: 0, skipped: 0, bytes: 0 };
        let reference: string | null | LexlockError;
        try {
          reference = decodeText(Buffer.from(input.subarray(bom)), { line: 1, byteOffset: bom }, { badText, stats, file: 'f' });
        } catch (e) {
          if (!isLexlockError(e)) throw e;
          reference = e;
        }
        const valid = isUtf8(input);
        expect(firstInvalidUtf8(input) === -1).toBe(valid);
        if (typeof reference === 'string') {
          expect(ids(chars.encodeBytes(input, { badText }))).toEqual(ids(chars.encode(reference)));
          expect(valid || badText === 'replace').toBe(true);
        } else {
          const e = thrown(() => chars.encodeBytes(input, { badText }));
          expect(e.code).toBe(reference === null ? 'SKIPPED_TEXT' : 'BAD_UTF8');
          // The same first bad byte as the reader names (its offset counts the BOM too).
          expect(e.where.byteOffset).toBe(reference === null ? firstInvalidUtf8(input) : reference.where.byteOffset);
        }
      }),
      { numRuns: 400 },
    );
  });

  describe('against readCorpus on a folder of one file', () => {
    const tmp = freshFolderEachTest();
    const cases: Array<[string, Uint8Array]> = [...INVALID.map(([what, input]) => [what, input] as [string, Uint8Array]), ['valid text after a byte order mark', bytes(0xef, 0xbb, 0xbf, 0x61, 0x20, 0x62)]];

    it.each(cases)('%s: the same ids, the same byte named, the document left out alike', async (_what, input) => {
      await mkdir(tmp.path('corpus'));
      await writeFile(tmp.path('corpus/doc.txt'), input);
      for (const badText of BAD_TEXT_POLICIES) {
        const read: string[] = [];
        let error: LexlockError | null = null;
        try {
          for await (const doc of readCorpus(tmp.path('corpus'), { badText })) read.push(doc.text);
        } catch (e) {
          if (!isLexlockError(e)) throw e;
          error = e;
        }
        if (read.length === 1) {
          expect(ids(chars.encodeBytes(input, { badText }))).toEqual(ids(chars.encode(read[0] as string)));
        } else if (badText === 'skip') {
          // Left out: the corpus held no other document, so the reader says it is empty.
          expect(error?.code).toBe('EMPTY_CORPUS');
          expect(thrown(() => chars.encodeBytes(input, { badText })).code).toBe('SKIPPED_TEXT');
        } else {
          expect(error?.code).toBe('BAD_UTF8');
          expect(thrown(() => chars.encodeBytes(input, { badText })).where.byteOffset).toBe(error?.where.byteOffset);
        }
      }
    });
  });
});
