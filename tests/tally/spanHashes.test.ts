import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { spanHash, spanHashes } from '../../src/tally/spanHashes.js';

describe('spanHash', () => {
  it("is spanHashes' table hash of the same span, folded or not (property)", () => {
    const out = new Int32Array(3);
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme-composite', maxLength: 40 }), fc.nat(), fc.nat(), (text, a, b) => {
        const from = text.length === 0 ? 0 : a % (text.length + 1);
        const to = from + (text.length - from === 0 ? 0 : b % (text.length - from + 1));
        for (const folded of [false, true]) {
          spanHashes(text, from, to, folded, out);
          expect(spanHash(text, from, to, folded)).toBe(out[0]);
        }
      }),
      { numRuns: 1000 },
    );
  });

  it('reads A-Z as a-z when folded: the lower-cased token hashes the same', () => {
    expect(spanHash('The FERRY', 4, 9, true)).toBe(spanHash('ferry', 0, 5, false));
    expect(spanHash('The FERRY', 4, 9, false)).not.toBe(spanHash('ferry', 0, 5, false));
  });
});
