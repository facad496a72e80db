import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SpanIndex } from '../../src/rules/SpanIndex.js';

describe('SpanIndex', () => {
  it('numbers strings in the order added; a repeated one keeps its first number', () => {
    const index = new SpanIndex(['ferry', 'late', 'ferry']);
    expect(index.size).toBe(2);
    expect([index.indexOf('ferry'), index.indexOf('late'), index.indexOf('pier')]).toEqual([0, 1, -1]);
    expect(index.add('late')).toBe(1);
    expect(index.add('pier')).toBe(2);
    expect([index.keyAt(2), index.keyAt(3)]).toEqual(['pier', undefined]);
  });

  it.each<[string, number, number, boolean, number]>([
    ['The Ferry was LATE', 4, 9, true, 0],
    ['The Ferry was LATE', 4, 9, false, -1],
    ['The Ferry was LATE', 14, 18, true, 1],
    ['the ferry', 4, 9, false, 0],
    ['ferryman', 0, 5, false, 0],
    ['ferryman', 0, 8, false, -1],
    ['', 0, 0, false, 2],
    ['Ä', 0, 1, true, -1], // only A-Z are read lower-cased
  ])('finds %j [%i, %i) folded %s at %i', (text, from, to, folded, expected) => {
    const index = new SpanIndex(['ferry', 'late', '']);
    expect(index.indexOfSpan(text, from, to, folded)).toBe(expected);
  });

  it('agrees with a Map on any strings, through growth and clear (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.string({ unit: 'binary', maxLength: 6 }), { maxLength: 300 }), fc.array(fc.string({ maxLength: 6 })), (keys, probes) => {
        const index = new SpanIndex();
        const map = new Map<string, number>();
        for (const key of keys) {
          if (!map.has(key)) map.set(key, map.size);
          expect(index.add(key)).toBe(map.get(key));
        }
        expect(index.size).toBe(map.size);
        for (const probe of [...keys, ...probes]) {
          expect(index.indexOf(probe)).toBe(map.get(probe) ?? -1);
          // The same string as a span of a longer text.
          expect(index.indexOfSpan(`<${probe}>`, 1, probe.length + 1, false)).toBe(map.get(probe) ?? -1);
        }
        index.clear();
        expect(index.size).toBe(0);
        if (keys.length > 0) expect(index.indexOf(keys[0] as string)).toBe(-1);
      }),
      { numRuns: 300 },
    );
  });

  it('reads an ASCII span lower-cased exactly as the lower-cased string (fast-check)', () => {
    fc.assert(
      fc.property(fc.array(fc.string({ unit: 'grapheme-ascii', maxLength: 5 }), { minLength: 1, maxLength: 50 }), (words) => {
        const index = new SpanIndex(words.map((w) => w.toLowerCase()));
        for (const word of words) {
          const upper = word.toUpperCase();
          expect(index.indexOfSpan(upper, 0, upper.length, true)).toBe(index.indexOf(word.toLowerCase()));
        }
      }),
      { numRuns: 300 },
    );
  });

  it('refuses, rather than wrap around, keys past the code units one index holds', () => {
    // Where a key starts is an Int32: past 2^31 - 1 code units it would wrap and find wrong keys.
    const index = new SpanIndex(['ferry'], 9);
    expect(index.add('late')).toBe(1);
    expect(index.add('ferry')).toBe(0); // held already: nothing added
    expect(() => index.add('x')).toThrow(
      expect.objectContaining({
        code: 'MEMORY_LIMIT',
        message: 'the distinct tokens counted hold more than 9 code units in all, more than one index holds; build with --memory-limit (a bounded count keeps only the tokens that can make the cap)',
      }),
    );
    expect([index.size, index.indexOf('x'), index.indexOf('late')]).toEqual([2, -1, 1]);
  });
});
