// splitWord checked against wink-tokenizer itself (differential): a run of letters and apostrophes
// that starts with a letter is one match of wink's word rule, so wink's tokens for it are what its
// contraction and possessive handling makes of that word.
import fc from 'fast-check';
import winkTokenizer from 'wink-tokenizer';
import contractions from 'wink-tokenizer/src/eng-contractions.js';
import { describe, expect, it } from 'vitest';
import { splitWord } from '../../../src/rules/fast/splitWord.js';

const wink = winkTokenizer();
const winkPairs = (text: string): string[] => wink.tokenize(text).flatMap(({ value, tag }) => [value, tag]);

function split(word: string): string[] {
  const pairs: string[] = [];
  splitWord(word, { pair: (value, tag) => void pairs.push(value, tag) });
  return pairs;
}

const LETTERS = ['a', 's', 'S', 'x', 'X', 'n', 't', 'd', 'v', 'e', 'é', 'ÿ', 'Ø'];
const word = fc
  .tuple(fc.constantFrom(...LETTERS), fc.array(fc.constantFrom(...LETTERS, "'", "'", "'s", "'S", "s'", "n't"), { maxLength: 12 }))
  .map(([first, rest]) => first + rest.join(''));

describe('splitWord', () => {
  it.each<[string, string[]]>([
    ['ferry', ['ferry', 'word']],
    ["won't", ['wo', 'word', "n't", 'word']],
    ["captain's", ['captain', 'word', "'s", 'word']],
    ["bus's", ['bus', 'word', "'s", 'word']],
    ["boats'", ['boats', 'word', "'", 'word']],
    ["x'yz's", ['yz', 'word', "'s", 'word']],
    ["é's", ["é's", 'word']],
    ["s'", ["s'", 'word']],
    ["a'b", ["a'b", 'word']],
  ])('%j -> %j', (input, expected) => {
    expect(winkPairs(input)).toEqual(expected);
    expect(split(input)).toEqual(expected);
  });

  it("splits every word of wink's contraction table as wink does", () => {
    const words = Object.keys(contractions);
    expect(words.length).toBeGreaterThan(100);
    for (const w of words) expect(split(w)).toEqual(winkPairs(w));
  });

  it('splits fast-check words of letters and apostrophes as wink does', () => {
    fc.assert(
      fc.property(word, (w) => {
        expect(split(w)).toEqual(winkPairs(w));
      }),
      { numRuns: 5000 },
    );
  });
});
