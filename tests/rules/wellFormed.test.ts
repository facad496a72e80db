import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { wellFormed } from '../../src/rules/wellFormed.js';

// U+FFFD for a lone surrogate is what the WHATWG Encoding Standard's UTF-8 encoder writes (TextEncoder).
describe('wellFormed', () => {
  it.each([
    ['a\uD800b', 'a\uFFFDb'],
    ['\uDC00', '\uFFFD'],
    ['\uDBFF\uDBFF\uDFFF', '\uFFFD\uDBFF\uDFFF'],
    ['😀', '😀'],
    ['plain', 'plain'],
    ['', ''],
  ])('%j -> %j, as TextEncoder writes it', (text, expected) => {
    expect(wellFormed(text)).toBe(expected);
    expect(new TextDecoder().decode(new TextEncoder().encode(text))).toBe(expected);
  });

  it('returns the very same string when there is nothing to replace', () => {
    const text = 'ferry ⛴ late';
    expect(Object.is(wellFormed(text), text)).toBe(true);
  });

  it('makes lone surrogates tokens of U+FFFD at both levels, so a lexicon can hold them', () => {
    expect(tokenize('late\uD800 again', resolveRules())).toEqual(tokenize('late\uFFFD again', resolveRules()));
    expect(tokenize('a\uDC00', resolveRules({ level: 'char' }))).toEqual(['a', '\uFFFD']);
  });
});
