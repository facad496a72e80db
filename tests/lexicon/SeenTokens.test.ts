import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SeenTokens } from '../../src/lexicon/SeenTokens.js';
import { spanHashes } from '../../src/tally/spanHashes.js';

describe('SeenTokens (a Bloom filter)', () => {
  it('never says "not seen" for a token it holds (property)', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.string({ minLength: 1, maxLength: 12 }), { maxLength: 300 }), (tokens) => {
        const f = SeenTokens.of(tokens, tokens.length)!;
        for (const t of tokens) expect(f.has(t)).toBe(true);
        const back = SeenTokens.parse(JSON.parse(JSON.stringify(f)));
        for (const t of tokens) expect(back.has(t)).toBe(true);
      }),
      { numRuns: 100 },
    );
  });

  // Bloom (1970): with m/n = 10 bits per element and k = 7 hashes the false-positive rate is about
  // (1 - e^(-k n / m))^k = 0.82 %. Measured on 20,000 tokens it never held, it must stay under 2 %.
  it('says "seen" for tokens it never held at about the rate the formula gives', () => {
    const held = Array.from({ length: 20000 }, (_, i) => `held-${i}`);
    const f = SeenTokens.of(held, held.length)!;
    expect(f.hashes).toBe(7);
    let wrong = 0;
    for (let i = 0; i < 20000; i++) if (f.has(`other-${i}`)) wrong += 1;
    expect(wrong / 20000).toBeGreaterThan(0);
    expect(wrong / 20000).toBeLessThan(0.02);
  });

  it('folds a filter filled while counting into the one of() makes of the same tokens, bit for bit (property)', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.string({ minLength: 1, maxLength: 12 }), { maxLength: 400 }), fc.integer({ min: 0, max: 400 }), (tokens, extra) => {
        const collecting = SeenTokens.collecting();
        const h = new Int32Array(3);
        for (const t of tokens) {
          spanHashes(t, 0, t.length, false, h);
          collecting.addHashes(h[1] as number, h[2] as number);
        }
        expect(collecting.folded(tokens.length)).toEqual(SeenTokens.of(tokens, tokens.length));
        // Folded for more tokens than it holds (an estimate too high): a larger filter, still never "not seen".
        const larger = collecting.folded(tokens.length + extra) as SeenTokens;
        for (const t of tokens) expect(larger.has(t)).toBe(true);
      }),
      { numRuns: 100 },
    );
  });

  it('sizes filters in powers of two of at least 10 bits a token', () => {
    expect([1, 6, 7, 100, 209715].map((n) => SeenTokens.of([], n)?.bits.length)).toEqual([8, 8, 16, 128, 262144]);
  });

  it('gives no filter when the vocabulary would need more than 256 KiB', () => {
    expect(SeenTokens.of([], 300000)).toBeNull();
    expect(SeenTokens.of(['a'], 1)).not.toBeNull();
  });
});
