// findOrdinal checked against wink-tokenizer's own ordinal pattern (WINK_PATTERNS.ordinalL1, the
// literal of wink's rgxOrdinalL1): the same matches, in the same places, on every text below.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { findOrdinal } from '../../../src/rules/fast/findOrdinal.js';
import { WINK_PATTERNS } from '../../../src/rules/fast/winkPatterns.js';
import { matchesOf, patternMatches } from './matches.js';

const PARTS = ['0', '1', '2', '3', '4', '9', '11', 'th', 'st', 'nd', 'rd', 't', 'h', 's', 'n', 'd', 'r', 'TH', 'St', 'x', ' ', '.', '१'];
const text = fc.array(fc.constantFrom(...PARTS), { maxLength: 30 }).map((p) => p.join(''));

describe('findOrdinal', () => {
  it.each<[string, [number, number][]]>([
    ['1st 2nd 3rd 4th 11th 12th 13th 21st 22nd 23rd 101st 111th 112th', [[0, 3], [4, 7], [8, 11], [12, 15], [16, 20], [21, 25], [26, 30], [31, 35], [36, 40], [41, 45], [46, 51], [53, 57], [59, 63]]],
    ['1111th', [[2, 6]]],
    ['00th 1TH 7st', [[0, 4]]],
    ['9'.repeat(50) + '4th', [[0, 53]]],
  ])('%j -> %j', (input, expected) => {
    expect(patternMatches(WINK_PATTERNS.ordinalL1, input)).toEqual(expected);
    expect(matchesOf(findOrdinal, input)).toEqual(expected);
  });

  it('finds what the pattern finds on fast-check text of digits and suffixes', () => {
    fc.assert(
      fc.property(text, (t) => {
        expect(matchesOf(findOrdinal, t)).toEqual(patternMatches(WINK_PATTERNS.ordinalL1, t));
      }),
      { numRuns: 5000 },
    );
  });
});
