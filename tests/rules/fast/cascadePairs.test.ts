// cascadePairs, lexlock's linear-time rendering of wink-tokenizer's rules, checked against
// wink-tokenizer 5.3.0 itself (differential): its value/tag pairs must be exactly wink's on every text
// below, hostile ones included (issue 13), before and after lower-casing.
import fc from 'fast-check';
import winkTokenizer from 'wink-tokenizer';
import { describe, expect, it } from 'vitest';
import { cascadePairs } from '../../../src/rules/fast/cascadePairs.js';
import { adversarialText, PIECES } from './adversarialText.js';
import { HOSTILE_FAMILIES, hostileFamily, hostileText } from './hostileText.js';

const wink = winkTokenizer();
const winkPairs = (text: string): string[] => wink.tokenize(text).flatMap(({ value, tag }) => [value, tag]);

function cascaded(text: string): string[] {
  const pairs: string[] = [];
  cascadePairs(text, { pair: (value, tag) => void pairs.push(value, tag) });
  return pairs;
}

describe('cascadePairs gives wink-tokenizer its own pairs', () => {
  // Expected values: wink-tokenizer 5.3.0 on each text (checked below as well).
  it.each<[string, string[]]>([
    ["can't", ['ca', 'word', "n't", 'word']],
    ["Couldn't", ['Could', 'word', "n't", 'word']],
    ["she'd've", ['she', 'word', "'d", 'word', "'ve", 'word']],
    ["captain's", ['captain', 'word', "'s", 'word']],
    ["CAPTAIN'S", ['CAPTAIN', 'word', "'S", 'word']],
    ["boats'", ['boats', 'word', "'", 'word']],
    // A possessive keeps only the run of ASCII letters before its apostrophe: wink drops the rest.
    ["x'yz's", ['yz', 'word', "'s", 'word']],
    ["éa's", ['a', 'word', "'s", 'word']],
    ["s'", ["s'", 'word']],
    ["o'clock", ["o'clock", 'word']],
    // 1111th: no alternative matches at the first two digits (a 1 before th), so 11 is a number.
    ['11th 111th 1111th 21st 102nd 3rd 0th', ['11th', 'ordinal', '1', 'number', '11th', 'ordinal', '11', 'number', '11th', 'ordinal', '21st', 'ordinal', '102nd', 'ordinal', '3rd', 'ordinal', '0th', 'ordinal']],
    ['a_b@ferry.example,x@y', ['a_b@ferry.example', 'email', ',', 'punctuation', 'x', 'word', '@y', 'mention']],
    ['a..b@c.com', ['a', 'word', '.', 'punctuation', '.', 'punctuation', 'b@c.com', 'email']],
    ['http://x.io/a_b?c=1 10 am', ['http://x.io/a_b?c=1', 'url', '10 am', 'time']],
    ['  \u00A0 ', []],
    // No rule takes these: wink leaves each run without white space as one alien token.
    ['東京 ы_ы', ['東京', 'alien', 'ы_ы', 'alien']],
  ])('%j', (text, expected) => {
    expect(winkPairs(text)).toEqual(expected);
    expect(cascaded(text)).toEqual(expected);
  });

  it('on every adversarial piece, as it is and lower-cased', () => {
    for (const piece of PIECES) {
      expect(cascaded(piece)).toEqual(winkPairs(piece));
      expect(cascaded(piece.toLowerCase())).toEqual(winkPairs(piece.toLowerCase()));
    }
  });

  it('on fast-check adversarial text (every rule, odd white space, lone surrogates)', () => {
    fc.assert(
      fc.property(adversarialText, (text) => {
        expect(cascaded(text)).toEqual(winkPairs(text));
      }),
      { numRuns: 3000 },
    );
  });

  it('on fast-check hostile text up to 2 KiB (long runs of the characters the slow patterns retry)', () => {
    fc.assert(
      fc.property(hostileFamily, fc.integer({ min: 1, max: 2048 }), fc.boolean(), (family, size, lower) => {
        const text = hostileText(family, size);
        const input = lower ? text.toLowerCase() : text;
        expect(cascaded(input)).toEqual(winkPairs(input));
      }),
      { numRuns: 300 },
    );
  });

  // wink itself takes seconds on each (quadratic): the four families the issue names at 16 KiB, the
  // others at 4 KiB.
  it.each(HOSTILE_FAMILIES.map((family, i) => ({ ...family, size: i < 4 ? 16 * 1024 : 4 * 1024 })))('on $size code units of $name', (family) => {
    const text = hostileText(family, family.size);
    expect(cascaded(text)).toEqual(winkPairs(text));
  });
});
