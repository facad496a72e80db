// splitAlien, the scanner, checked against ALIEN_SPLIT, the contract's regular expression (rule 2):
// the same pieces on every text below, and an answer where V8 gives up running the expression (a run
// of millions of letters of a script wink leaves alone).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ALIEN_SPLIT, splitAlien } from '../../src/rules/splitAlien.js';
import { orRangeError } from './fast/matches.js';

const PARTS = ['П', 'р', 'ы', 'é', 'e\u0301', '\u0301', '東', 'へ', 'フ', 'ー', '서', '울', '१', '٣', 'a', '1', '→', '!', ' ', '\u00A0', '\u3000', '😀', '𝒜', '𠀀', '\uD800', '\uDC00', '\u200D', '\uFE0F', '_', '\uFEFF', 'ǅ', 'ª'];
const alien = fc.array(fc.oneof(fc.constantFrom(...PARTS), fc.string({ unit: 'binary', maxLength: 3 })), { maxLength: 30 }).map((p) => p.join(''));

describe('splitAlien', () => {
  it('gives the matches of the contract\'s expression on fast-check text of every kind of character', () => {
    fc.assert(
      fc.property(alien, (value) => {
        expect(splitAlien(value, [])).toEqual([...value.matchAll(ALIEN_SPLIT)].map((m) => m[0]));
      }),
      { numRuns: 5000 },
    );
  });

  it('splits a run of 4 million Cyrillic letters, on which V8 (Node 20) gives up running the expression', () => {
    const run = 'ы'.repeat(4 * 1024 * 1024);
    const pieces = splitAlien(`${run}東${run}`, []);
    expect(pieces.map((p) => p.length)).toEqual([run.length, 1, run.length]);
    // Where the engine can run the expression, it agrees.
    const viaPattern = orRangeError(() => [...`${run}東${run}`.matchAll(ALIEN_SPLIT)].map((m) => m[0].length));
    if (viaPattern !== 'RangeError') expect(viaPattern).toEqual([run.length, 1, run.length]);
  });
});
