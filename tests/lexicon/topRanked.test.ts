import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { topRanked } from '../../src/lexicon/topRanked.js';

// The freeze rule (encoding contract, rule 4) written as one comparator: count descending, ties by
// JavaScript's `<` on strings (UTF-16 code units).
function byTheRule(counts: Map<string, number>, minCount: number): Array<[string, number]> {
  return [...counts].filter(([, n]) => n >= minCount).sort((a, b) => b[1] - a[1] || (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
}

const visiting = (counts: Map<string, number>) => (visit: (token: string, count: number) => void) => {
  for (const [t, n] of counts) visit(t, n);
};

describe('topRanked', () => {
  it.each<[string, Array<[string, number]>, number, number, Array<[string, number]>]>([
    ['count first, then string order', [['b', 2], ['a', 2], ['c', 5]], 1, 9, [['c', 5], ['a', 2], ['b', 2]]],
    ['the first n only', [['b', 2], ['a', 2], ['c', 5]], 1, 2, [['c', 5], ['a', 2]]],
    ['minCount drops the rare', [['x', 1], ['y', 3]], 2, 9, [['y', 3]]],
    ['UTF-16 code units, not locale or code points: upper case first, an astral emoji before U+FFFD', [['é', 1], ['Z', 1], ['a', 1], ['😀', 1], ['\uFFFD', 1]], 1, 9, [['Z', 1], ['a', 1], ['é', 1], ['😀', 1], ['\uFFFD', 1]]],
    ['none asked for', [['a', 1]], 1, 0, []],
  ])('%s', (_name, entries, minCount, n, expected) => {
    expect(topRanked(visiting(new Map(entries)), n, (_t, c) => c >= minCount)).toEqual(expected);
  });

  it('equals the first n of the rule as one comparator, on any counts (fast-check)', () => {
    fc.assert(
      fc.property(
        fc.dictionary(fc.string({ unit: 'binary', maxLength: 4 }), fc.integer({ min: 1, max: 6 })),
        fc.integer({ min: 1, max: 4 }),
        fc.oneof(fc.nat(30), fc.constant(Infinity)),
        (record, minCount, n) => {
          const counts = new Map(Object.entries(record));
          expect(topRanked(visiting(counts), n, (_t, c) => c >= minCount)).toEqual(byTheRule(counts, minCount).slice(0, n));
        },
      ),
      { numRuns: 500 },
    );
  });
});
