import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CandidateTable } from '../../src/tally/CandidateTable.js';
import { SpaceSaving } from '../../src/tally/SpaceSaving.js';
import { spanHashes } from '../../src/tally/spanHashes.js';

function hashOf(text: string, from: number, to: number, folded: boolean): number {
  const out = new Int32Array(3);
  spanHashes(text, from, to, folded, out);
  return out[0] as number;
}

describe('CandidateTable', () => {
  it('finds exactly the chosen counters, by the summary find of the same span (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 60 }).map((n) => `w${n}`), { minLength: 1, maxLength: 200 }), fc.integer({ min: 1, max: 40 }), fc.integer({ min: 2, max: 5 }), (stream, k, every) => {
        const s = new SpaceSaving(k, 10_000);
        for (const t of stream) s.offerToken(t);
        const chosen = [...s.monitored()].filter((_, i) => i % every === 0);
        // In lent storage, full of leftovers: the table clears what it takes.
        const storage = new Float64Array(CandidateTable.bytesFor(chosen.length) / 8 + 3).fill(-7.5);
        const table = new CandidateTable(s, chosen.length, storage.buffer);
        for (const c of chosen) table.add(c);
        for (let n = 0; n <= 60; n++) {
          const t = `w${n}`;
          const c = s.find(hashOf(t, 0, t.length, false), t, 0, t.length, false);
          expect(table.find(hashOf(t, 0, t.length, false), t, 0, t.length, false), t).toBe(chosen.includes(c) ? c : -1);
        }
      }),
      { numRuns: 300 },
    );
  });

  it('finds a token by a span of any text, read lower-cased when folded', () => {
    const s = new SpaceSaving(4, 100);
    for (const t of ['ferry', 'pier', 'ferry']) s.offerToken(t);
    const table = new CandidateTable(s, s.size);
    for (const c of s.monitored()) table.add(c);
    const text = 'The FERRY left the Pier';
    const ferry = s.find(hashOf('ferry', 0, 5, false), 'ferry', 0, 5, false);
    expect(ferry).toBeGreaterThanOrEqual(0);
    expect(table.find(hashOf(text, 4, 9, true), text, 4, 9, true)).toBe(ferry);
    expect(table.find(hashOf(text, 4, 9, false), text, 4, 9, false)).toBe(-1);
    expect(table.find(hashOf(text, 19, 23, true), text, 19, 23, true)).toBeGreaterThanOrEqual(0);
    expect(table.find(hashOf(text, 0, 3, true), text, 0, 3, true)).toBe(-1);
  });

  it('takes two 4-byte slots a candidate at least, in a power of two', () => {
    expect([CandidateTable.bytesFor(0), CandidateTable.bytesFor(8), CandidateTable.bytesFor(9), CandidateTable.bytesFor(50_239)]).toEqual([128, 128, 256, 131_072 * 8]);
  });

  it('refuses storage smaller than it needs', () => {
    expect(() => new CandidateTable(new SpaceSaving(4, 100), 9, new ArrayBuffer(255))).toThrow('a table of 9 candidates needs 256 bytes, not 255');
  });
});
