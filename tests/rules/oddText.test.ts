// Text that looks empty or is not text at all, pinned to what the encoding contract makes of it (issue 6;
// README "Odd input"). Which characters separate tokens is the engine's `\s`: ECMA-262's WhiteSpace
// (which lists U+FEFF, ZWNBSP) and LineTerminator; U+200B, U+200D, U+2060 and U+00AD are format
// characters (Unicode category Cf), not white space, so each is a token like any other symbol.
import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';

const word = resolveRules();
const char = resolveRules({ level: 'char', spaces: 'drop' });
const charSpaces = resolveRules({ level: 'char' });

describe('empty-looking and broken text', () => {
  it.each<[string, string, string[], string[]]>([
    ['zero-width joiner between spaces', 'a \u200D b', ['a', '\u200D', 'b'], ['a', '\u200D', 'b']],
    ['zero-width joiner alone', '\u200D', ['\u200D'], ['\u200D']],
    ['zero-width space inside a word', 'a\u200Bb', ['a', '\u200B', 'b'], ['a', '\u200B', 'b']],
    ['word joiner alone', '\u2060', ['\u2060'], ['\u2060']],
    ['soft hyphen inside a word', 'a\u00ADb', ['a', '\u00AD', 'b'], ['a', '\u00AD', 'b']],
    ['byte order mark: white space', 'a\uFEFFb', ['a', 'b'], ['a', 'b']],
    ['byte order mark alone: no tokens', '\uFEFF', [], []],
    ['combining mark alone', '\u0301', ['\u0301'], ['\u0301']],
    ['combining mark between spaces', 'x \u0301 y', ['x', '\u0301', 'y'], ['x', '\u0301', 'y']],
    ['combining mark after a letter: composed by NFKC', 'e\u0301', ['\u00E9'], ['\u00E9']],
    ['variation selector alone', '\uFE0F', ['\uFE0F'], ['\uFE0F']],
    ['NUL', 'a\u0000b', ['a', '\u0000', 'b'], ['a', '\u0000', 'b']],
    ['right-to-left override', '\u202E abc', ['\u202E', 'abc'], ['\u202E', 'a', 'b', 'c']],
    ['lone high surrogate: U+FFFD', 'a\uD800 b', ['a', '\uFFFD', 'b'], ['a', '\uFFFD', 'b']],
    ['lone low surrogate alone: U+FFFD', '\uDC00', ['\uFFFD'], ['\uFFFD']],
    ['only white space', ' \t\n\u00A0\u3000', [], []],
    ['empty', '', [], []],
  ])('%s', (_name, text, words, chars) => {
    expect(tokenize(text, word)).toEqual(words);
    expect(tokenize(text, char)).toEqual(chars);
  });

  // With spaces kept (the character level's default) each run of white space is one ' ' token.
  it.each<[string, string, string[]]>([
    ['zero-width joiner between spaces', 'a \u200D b', ['a', ' ', '\u200D', ' ', 'b']],
    ['zero-width space inside a word: no space', 'a\u200Bb', ['a', '\u200B', 'b']],
    ['byte order mark: a space', 'a\uFEFFb', ['a', ' ', 'b']],
    ['byte order mark alone: one space', '\uFEFF', [' ']],
    ['only white space: one space', ' \t\n\u00A0\u3000', [' ']],
    ['lone high surrogate then a space', 'a\uD800 b', ['a', '\uFFFD', ' ', 'b']],
    ['empty', '', []],
  ])('%s (spaces kept)', (_name, text, chars) => {
    expect(tokenize(text, charSpaces)).toEqual(chars);
  });
});
