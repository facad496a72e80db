import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { rankTokens } from '../../src/lexicon/rankTokens.js';

// The freeze rule (encoding contract, rule 4) written as one comparator: count descending, ties by
// JavaScript's `<` on strings (UTF-16 code units).
function byTheRule(counts: Map<string, number>, minCount: number): Array<[string, number]> {
  return [...counts].filter(([, n]) => n >= minCount).sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
}

describe('rankTokens', () => {
  it.each<[string, Array<[string, number]>, number, Array<[string, number]>]>([
    ['count first, then string order', [['b', 2], ['a', 2], ['c', 5]], 1, [['c', 5], ['a', 2], ['b', 2]]],
    ['minCount drops the rare', [['x', 1], ['y', 3]], 2, [['y', 3]]],
    ['UTF-16 code units, not locale or code points: upper case first, an astral emoji before U+FFFD', [['é', 1], ['Z', 1], ['a', 1], ['😀', 1], ['\uFFFD', 1]], 1, [['Z', 1], ['a', 1], ['é', 1], ['😀', 1], ['\uFFFD', 1]]],
  ])('%s', (_name, entries, minCount, expected) => {
    expect(rankTokens(new Map(entries), minCount)).toEqual(expected);
  });

  it('equals the rule as one comparator on any counts (fast-check)', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string({ unit: 'binary', maxLength: 4 }), fc.integer({ min: 1, max: 6 })), fc.integer({ min: 1, max: 4 }), (record, minCount) => {
        const counts = new Map(Object.entries(record));
        expect(rankTokens(counts, minCount)).toEqual(byTheRule(counts, minCount));
      }),
      { numRuns: 500 },
    );
  });
});

describe('rankTokens with orderedFirst', () => {
  it('orders the first places by the rule and keeps counts descending after (fast-check)', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string({ unit: 'grapheme-ascii', maxLength: 3 }), fc.integer({ min: 1, max: 5 })), fc.nat(12), (record, first) => {
        const counts = new Map(Object.entries(record));
        const full = byTheRule(counts, 1);
        const got = rankTokens(counts, 1, first);
        expect(got.slice(0, first)).toEqual(full.slice(0, first));
        expect(got.map(([, n]) => n)).toEqual(full.map(([, n]) => n));
        expect(new Set(got.map(([t]) => t))).toEqual(new Set(full.map(([t]) => t)));
      }),
      { numRuns: 500 },
    );
  });
});
