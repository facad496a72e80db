// One wink call on joined groups checked against wink-tokenizer on each group alone (differential).
import fc from 'fast-check';
import winkTokenizer from 'wink-tokenizer';
import { describe, expect, it } from 'vitest';
import { tokenizeGroups } from '../../../src/rules/fast/tokenizeGroups.js';
import { PIECES } from './adversarialText.js';

const wink = winkTokenizer();
const alone = (group: string): string[] => wink.tokenize(group).flatMap(({ value, tag }) => [value, tag]);

describe('tokenizeGroups', () => {
  it('gives each group what wink gives it alone, a group holding the mark included', () => {
    const groups = ['10 am', "can't", 'a\uE000b', 'https://x.io/a', '\uE000', 'Паром'];
    expect(tokenizeGroups(groups)).toEqual(groups.map(alone));
  });

  it('equals wink per group on fast-check groups of adversarial pieces', () => {
    const group = fc.array(fc.constantFrom(...PIECES), { minLength: 1, maxLength: 3 }).map((p) => p.join(''));
    fc.assert(
      fc.property(fc.array(group, { maxLength: 12 }), (groups) => {
        expect(tokenizeGroups(groups)).toEqual(groups.map(alone));
      }),
      { numRuns: 2000 },
    );
  });
});
