import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { detached } from '../../src/rules/detached.js';

// What detached buys (not keeping a document alive through a token cut from it) is memory, measured
// by the benchmark's peak RSS; here: it never changes the text.
describe('detached', () => {
  it('returns the same text, for any string cut from any other (fast-check)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', maxLength: 200 }), fc.nat(), fc.nat(), (text, a, b) => {
        const from = a % (text.length + 1);
        const to = from + (b % (text.length - from + 1));
        const cut = text.slice(from, to);
        expect(detached(cut)).toBe(cut);
      }),
    );
  });
});
