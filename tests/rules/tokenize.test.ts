import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { splitAlien } from '../../src/rules/splitAlien.js';

describe('tokenize at the word level (defaults: NFKC, lower-case)', () => {
  // Expected tokens follow wink-tokenizer 5.3.0's documented behaviour (contractions split, times
  // with a space kept whole) plus the contract's alien split; tests/reference checks it on a real corpus.
  it.each([
    ["I can't go", ['i', 'ca', "n't", 'go']],
    ['Depart 10 am sharp', ['depart', '10 am', 'sharp']],
    ['mail help@ferry.example now', ['mail', 'help@ferry.example', 'now']],
    ['see https://ferry.example.org/x?y=1', ['see', 'https://ferry.example.org/x?y=1']],
    ['ﬁne ①', ['fine', '1']],
    ['Паром ОПОЗДАЛ', ['паром', 'опоздал']],
    ['東京へ行く', ['東', '京', 'へ', '行', 'く']],
    ['서울항구', ['서울항구']],
    ['constructor toString valueOf', ['constructor', 'tostring', 'valueof']],
    ['', []],
    ['   \n\t ', []],
  ])('%j -> %j', (text, expected) => {
    expect(tokenize(text, resolveRules())).toEqual(expected);
  });

  it('keeps case and skips normalization when asked', () => {
    // Without NFKC the ligature is no Latin letter to wink-tokenizer: it is left over as an alien piece.
    expect(tokenize('ﬁne Ferry', resolveRules({ case: 'keep', unicode: 'none' }))).toEqual(['ﬁ', 'ne', 'Ferry']);
  });

  it('drops and collapses token types by the tokenizer tags', () => {
    const rules = resolveRules({ drop: ['punctuation'], collapse: ['number', 'url'] });
    expect(tokenize('Gate 12, see https://a.example.org!', rules)).toEqual(['gate', '<number>', 'see', '<url>']);
  });
});

describe('splitAlien (contract rule 2 regular expression)', () => {
  it.each([
    ['Привет', ['Привет']],
    ['日本語テキスト', ['日', '本', '語', 'テ', 'キ', 'ス', 'ト']],
    ['abcд123', ['abcд123']],
    ['x→y', ['x', '→', 'y']],
    ['é́', ['é́']],
  ])('%j -> %j', (value, expected) => {
    expect(splitAlien(value, [])).toEqual(expected);
  });
});

describe('character level', () => {
  it('keeps every non-white-space code point, astral ones whole, and each run of white space as one space', () => {
    expect(tokenize('a b\u00a0c😀\n', resolveRules({ level: 'char', unicode: 'none', case: 'keep' }))).toEqual(['a', ' ', 'b', ' ', 'c', '😀', ' ']);
    expect(tokenize(' Ab \t\r\n ﬁ', resolveRules({ level: 'char' }))).toEqual([' ', 'a', 'b', ' ', 'f', 'i']);
  });

  it('drops white space with spaces: drop', () => {
    expect(tokenize('a b\u00a0c😀\n', resolveRules({ level: 'char', unicode: 'none', case: 'keep', spaces: 'drop' }))).toEqual(['a', 'b', 'c', '😀']);
    expect(tokenize('Ab ﬁ', resolveRules({ level: 'char', spaces: 'drop' }))).toEqual(['a', 'b', 'f', 'i']);
  });
});

describe('resolveRules', () => {
  it('fills defaults and records the tokenizer', () => {
    expect(resolveRules()).toEqual({ level: 'word', unicode: 'NFKC', case: 'lower', drop: [], collapse: [], spaces: null, tokenizer: 'wink-tokenizer@5.3.0' });
    expect(resolveRules({ level: 'char' })).toEqual({ level: 'char', unicode: 'NFKC', case: 'lower', drop: [], collapse: [], spaces: 'keep', tokenizer: 'lexlock-chars@1' });
    expect(resolveRules({ level: 'char', spaces: 'drop' }).spaces).toBe('drop');
  });

  it('sorts and de-duplicates type lists so equal rules serialize equally', () => {
    expect(resolveRules({ drop: ['url', 'emoji', 'url'] }).drop).toEqual(['emoji', 'url']);
  });

  it.each([
    [{ drop: ['nonsense'] }, 'drop: unknown token type "nonsense"; use one of alien, currency, email, emoji, emoticon, hashtag, mention, number, ordinal, punctuation, quoted_phrase, symbol, time, url, word'],
    [{ level: 'char', drop: ['url'] }, 'drop/collapse: token types exist at the word level only; remove them or use level word'],
    [{ drop: ['url'], collapse: ['url'] }, 'drop/collapse: "url" is both dropped and collapsed; choose one'],
    [{ unicode: 'NFD' }, 'unicode: "NFD" is not a normalization; use NFKC, NFC or none'],
    [{ spaces: 'keep' }, 'spaces: white space is kept or dropped at the character level only (the word level never makes a token of it); remove it or use level char'],
    [{ level: 'char', spaces: 'squeeze' }, 'spaces: "squeeze" is not a space rule; use keep or drop'],
  ])('refuses %j', (input, message) => {
    expect(() => resolveRules(input as never)).toThrow(message);
  });

  it('names the tokenizer version that is installed', async () => {
    const pkg = (await import('wink-tokenizer/package.json', { with: { type: 'json' } })).default as { version: string };
    expect(resolveRules().tokenizer).toBe(`wink-tokenizer@${pkg.version}`);
  });
});
