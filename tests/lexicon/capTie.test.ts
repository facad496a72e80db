import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { describeCapTie } from '../../src/audit/describeCapTie.js';
import { capTie, wholeCapsAround } from '../../src/lexicon/capTie.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const at = (counts: readonly number[]) => (i: number) => counts[i] as number;

describe('capTie (encoding contract, rule 4: a cap inside a group of equal counts)', () => {
  it.each<[string, number[], number, ReturnType<typeof capTie>]>([
    ['a cap on a boundary', [9, 4, 4, 1], 1, null],
    ['a cap after the last token', [9, 4, 4, 1], 4, null],
    ['a cap past the tokens', [9, 4, 4, 1], 10, null],
    ['cap 0', [4, 4], 0, null],
    ['a cap inside the 4s', [9, 4, 4, 4, 1], 2, { cap: 2, count: 4, tokens: 3, kept: 1, left: 2, below: 1, above: 4 }],
    ['a cap inside the first group', [3, 3, 3], 1, { cap: 1, count: 3, tokens: 3, kept: 1, left: 2, below: 0, above: 3 }],
    ['a cap inside the last group', [5, 1, 1, 1, 1], 3, { cap: 3, count: 1, tokens: 4, kept: 2, left: 2, below: 1, above: 5 }],
  ])('%s', (_what, counts, cap, expected) => {
    expect(capTie(counts.length, at(counts), cap)).toEqual(expected);
  });

  it('agrees with counting the group by hand for any descending counts and cap (property)', () => {
    const descending = fc.array(fc.integer({ min: 1, max: 6 }), { maxLength: 40 }).map((a) => a.sort((x, y) => y - x));
    fc.assert(
      fc.property(descending, fc.nat(45), (counts, cap) => {
        const tie = capTie(counts.length, at(counts), cap);
        const cuts = cap > 0 && cap < counts.length && counts[cap - 1] === counts[cap];
        if (!cuts) {
          expect(tie).toBeNull();
          expect(wholeCapsAround(counts.length, at(counts), cap)).toEqual({ below: cap, above: cap });
          return;
        }
        const c = counts[cap] as number;
        const group = counts.filter((n) => n === c).length;
        const before = counts.filter((n) => n > c).length;
        expect(tie).toEqual({ cap, count: c, tokens: group, kept: cap - before, left: before + group - cap, below: before, above: before + group });
      }),
      { numRuns: 2000 },
    );
  });

  it('is said in words, with thousands grouped', () => {
    expect(describeCapTie({ cap: 30000, count: 1, tokens: 14780, kept: 3224, left: 11556, below: 26776, above: 41556 })).toBe(
      'cap 30,000 cuts through the 14,780 tokens seen once: 3,224 kept by string order, 11,556 left out; caps 26,776 or 41,556 keep whole counts',
    );
    expect(describeCapTie({ cap: 3, count: 2, tokens: 3, kept: 2, left: 1, below: 1, above: 4 })).toBe(
      'cap 3 cuts through the 3 tokens seen twice: 2 kept by string order, 1 left out; caps 1 or 4 keep whole counts',
    );
    expect(describeCapTie({ cap: 3, count: 1200, tokens: 3, kept: 2, left: 1, below: 1, above: 4 })).toContain('the 3 tokens seen 1,200 times:');
  });
});

describe('freeze records the tie in fit.capTie', () => {
  const rules = resolveRules();
  // late 4; ferry, the, was 2 each; again, lovely 1 each.
  const tally = Tally.fromTexts(['the ferry was late again', 'the ferry was lovely', 'late late late'], rules);

  it.each<[string, Parameters<typeof freeze>[1], unknown]>([
    ['cap 3 inside the 2s', { cap: 3 }, { cap: 3, count: 2, tokens: 3, kept: 2, left: 1, below: 1, above: 4 }],
    ['cap 4 on a boundary', { cap: 4 }, null],
    ['cap 5 inside the 1s', { cap: 5 }, { cap: 5, count: 1, tokens: 2, kept: 1, left: 1, below: 4, above: 6 }],
    ['no cap', { cap: null }, null],
    // A reserved token leaves the ranking: 'the' reserved, so the 2s are ferry and was.
    ['cap 2 with "the" reserved', { cap: 2, reserved: ['the'] }, { cap: 2, count: 2, tokens: 2, kept: 1, left: 1, below: 1, above: 3 }],
    // minCount 2 leaves the 1s out of the ranking: cap 5 is past every ranked token.
    ['cap 5 with minCount 2', { cap: 5, minCount: 2 }, null],
  ])('%s', (_what, options, expected) => {
    const lexicon = freeze(tally, options);
    expect(lexicon.fit?.capTie).toEqual(expected);
    if (expected !== null) {
      const tie = expected as { kept: number; below: number };
      // The kept part of the group is its first tokens in string order.
      expect(lexicon.encoding.tokens.length - lexicon.encoding.layout.reserved).toBe(tie.below + tie.kept);
    }
  });
});
