import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { freeze } from '../../src/lexicon/freeze.js';
import { peekText } from '../../src/lexicon/peekText.js';
import type { Shape } from '../../src/lexicon/Shape.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

// peekText lays open what encode does; what it shows must add up to the row encode gives.
const lexicon = freeze(Tally.fromTexts(['the ferry was late again', 'the ferry was lovely', 'late late late'], resolveRules()), {
  shape: { length: 4, pad: 'start', cut: 'end' },
});
const WORDS = ['the', 'ferry', 'was', 'late', 'again', 'lovely', 'sadly', ',', 'Ferry', '🎉', 'Лодка', ' ', '  '];
const text = fc.oneof(fc.array(fc.constantFrom(...WORDS), { maxLength: 16 }).map((w) => w.join(' ')), fc.string({ maxLength: 30 }));
const shape: fc.Arbitrary<Shape | null> = fc.option(
  fc.record({ length: fc.integer({ min: 1, max: 12 }), pad: fc.constantFrom('start', 'end'), cut: fc.constantFrom('start', 'end') }) as fc.Arbitrary<Shape>,
);

describe('peekText', () => {
  it('worked example: cut at the end, zeros at the start (ids ranked by hand: late 2, ferry 3, the 4, was 5, again 6)', () => {
    const peek = peekText(lexicon, 'late sadly');
    expect(peek.tokens).toEqual([
      { token: 'late', id: 2, oov: false, slot: 2 },
      { token: 'sadly', id: 1, oov: true, slot: 3 },
    ]);
    expect([peek.oovTokens, peek.cutTokens, peek.zeros, Array.from(peek.row)]).toEqual([1, 0, 2, [0, 0, 2, 1]]);
    const cut = peekText(lexicon, 'the ferry was late again', { shape: { length: 2, pad: 'end', cut: 'start' } });
    expect(cut.tokens.map((t) => t.slot)).toEqual([null, null, null, 0, 1]);
    expect([cut.cutTokens, cut.zeros, Array.from(cut.row)]).toEqual([3, 0, [2, 6]]);
  });

  it('adds up to encode\'s row: tokens, ids, OOV, slots, cuts and zeros (property)', () => {
    fc.assert(
      fc.property(text, shape, (t, s) => {
        const peek = peekText(lexicon, t, { shape: s });
        const row = Array.from(lexicon.encode(t, { shape: s }));
        expect(Array.from(peek.row)).toEqual(row);
        expect(peek.shape).toEqual(s);
        expect(peek.tokens.map((k) => k.token)).toEqual(lexicon.tokenize(t));
        expect(peek.tokens.map((k) => k.id)).toEqual(Array.from(lexicon.idsOf(lexicon.tokenize(t))));
        expect(peek.oovTokens).toBe(peek.tokens.filter((k) => k.id === lexicon.oovId && k.oov).length);
        expect(peek.tokens.every((k) => k.oov === (k.id === lexicon.oovId))).toBe(true);
        // Every kept token's id is at its slot, slots run on one by one, and the rest of the row is zeros.
        const kept = peek.tokens.filter((k) => k.slot !== null);
        kept.forEach((k, i) => {
          expect(row[k.slot as number]).toBe(k.id);
          if (i > 0) expect(k.slot).toBe((kept[i - 1]?.slot as number) + 1);
        });
        const slots = new Set(kept.map((k) => k.slot));
        const rest = row.filter((_, i) => !slots.has(i));
        expect(rest.every((id) => id === 0)).toBe(true);
        expect(rest.length).toBe(peek.zeros);
        expect(peek.cutTokens).toBe(peek.tokens.length - kept.length);
        if (s === null) {
          expect([peek.cutTokens, peek.zeros, row.length]).toEqual([0, 0, peek.tokens.length]);
          return;
        }
        expect(kept.length).toBe(Math.min(peek.tokens.length, s.length));
        // The cut tokens are at the cut end, the zeros at the pad end.
        const cutAt = peek.tokens.map((k) => k.slot === null);
        const cutPart = s.cut === 'end' ? cutAt.slice(kept.length) : cutAt.slice(0, peek.cutTokens);
        expect(cutPart.every(Boolean)).toBe(true);
        const zerosAt = s.pad === 'start' ? row.slice(0, peek.zeros) : row.slice(row.length - peek.zeros);
        expect(zerosAt.every((id) => id === 0)).toBe(true);
        if (kept.length > 0) expect(kept[0]?.slot).toBe(s.pad === 'start' ? peek.zeros : 0);
      }),
      { numRuns: 300 },
    );
  });
});
