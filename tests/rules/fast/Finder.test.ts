// The finders that run wink's own patterns: finderOf over the rest of a text, windowFinderOf over
// windows (so a long search can pause). Both must find exactly the pattern's matches, whatever the
// window, on text full of what the patterns look for.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { finderOf, windowFinderOf } from '../../../src/rules/fast/Finder.js';
import { WINK_PATTERNS } from '../../../src/rules/fast/winkPatterns.js';
import { adversarialText, PIECES } from './adversarialText.js';
import { matchesOf, patternMatches } from './matches.js';

const WINDOWED = ['emoji', 'emoticon', 'time'] as const;
const near = fc.array(fc.constantFrom(...PIECES, '1', '2', ':', ' ', 'a', 'm', '.', '-', ';', '<', '3', '\u200D', '\uFE0F', '\uD83D', '\uDE00'), { maxLength: 40 }).map((p) => p.join(''));

describe('windowFinderOf', () => {
  it.each(WINDOWED)('is used only for %s, a pattern without unbounded repetition (its source length bounds what an attempt reads)', (name) => {
    const outsideClasses = WINK_PATTERNS[name].source.replace(/\[(?:\\.|[^\]\\])*\]/g, '[]').replace(/\\./g, 'x');
    expect(outsideClasses).not.toMatch(/[*+{]/);
    expect(WINK_PATTERNS[name].flags).not.toContain('u');
  });

  it.each(WINDOWED)('finds %s matches as the pattern does, with any window', (name) => {
    const find = windowFinderOf(WINK_PATTERNS[name]);
    fc.assert(
      fc.property(fc.oneof(near, adversarialText), fc.integer({ min: 1, max: 24 }), (text, window) => {
        const expected = patternMatches(WINK_PATTERNS[name], text);
        expect(matchesOf(find, text, window)).toEqual(expected);
        expect(matchesOf(find, text)).toEqual(expected);
      }),
      { numRuns: 1500 },
    );
  });
});

describe('finderOf', () => {
  it.each(['url', 'mention', 'hashtagL1', 'hashtagDV', 'currency', 'wordL1', 'wordDV', 'punctuation', 'symbol'] as const)('finds %s matches as the pattern does', (name) => {
    const find = finderOf(WINK_PATTERNS[name]);
    fc.assert(
      fc.property(adversarialText, (text) => {
        expect(matchesOf(find, text, 7)).toEqual(patternMatches(WINK_PATTERNS[name], text));
      }),
      { numRuns: 500 },
    );
  });
});
