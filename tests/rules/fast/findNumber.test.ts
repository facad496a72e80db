// findNumberL1 and findNumberDV checked against wink-tokenizer's own number patterns
// (WINK_PATTERNS.numberL1/numberDV, the literals of wink's rgxNumberL1/rgxNumberDV): the same matches
// on every text below, and an answer where V8 gives up on the pattern (a run of millions of digits).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findNumberDV, findNumberL1 } from '../../../src/rules/fast/findNumber.js';
import { WINK_PATTERNS } from '../../../src/rules/fast/winkPatterns.js';
import { matchesOf, orRangeError, patternMatches } from './matches.js';

const L1 = ['0', '1', '9', '12', '.', ',', '-', '/', '//', '..', 'a', ' ', ':'];
const DV = ['०', '१', '९', '.', ',', '-', '/', 'a', '1', ' '];
const textOf = (parts: string[]) => fc.array(fc.constantFrom(...parts), { maxLength: 30 }).map((p) => p.join(''));

describe('findNumberL1 and findNumberDV', () => {
  it.each<[string, [number, number][]]>([
    ['1/4/66/777', [[0, 3], [4, 10]]],
    ['12-12-1924 8.8.8.8', [[0, 10], [11, 18]]],
    ['1,1,1,1.00 2.', [[0, 10], [11, 12]]],
    ['x1..2', [[1, 2], [4, 5]]],
    ['1/', [[0, 1]]],
  ])('%j -> %j', (input, expected) => {
    expect(patternMatches(WINK_PATTERNS.numberL1, input)).toEqual(expected);
    expect(matchesOf(findNumberL1, input)).toEqual(expected);
  });

  it('find what the patterns find on fast-check text of digits and joints', () => {
    fc.assert(
      fc.property(textOf(L1), textOf(DV), (l1, dv) => {
        expect(matchesOf(findNumberL1, l1)).toEqual(patternMatches(WINK_PATTERNS.numberL1, l1));
        expect(matchesOf(findNumberDV, dv)).toEqual(patternMatches(WINK_PATTERNS.numberDV, dv));
      }),
      { numRuns: 5000 },
    );
  });

  it('take a run of 16 million digits, on which V8 (Node 20) gives up running the pattern', () => {
    const digits = '1'.repeat(16 * 1024 * 1024);
    const text = `${digits}/2 x`;
    expect(matchesOf(findNumberL1, text)).toEqual([[0, digits.length + 2]]);
    expect(matchesOf(findNumberDV, `${'०'.repeat(1 << 24)}.१`)).toEqual([[0, (1 << 24) + 2]]);
    // Where the engine can run the pattern, it agrees.
    const viaPattern = orRangeError(() => patternMatches(WINK_PATTERNS.numberL1, text));
    if (viaPattern !== 'RangeError') expect(viaPattern).toEqual([[0, digits.length + 2]]);
  });
});
