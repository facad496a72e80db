import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SpaceSaving } from '../../src/tally/SpaceSaving.js';

// The guarantees of Metwally, Agrawal & El Abbadi (ICDT 2005), Lemmas 3.3-3.5 (from memory): the
// counts sum to the stream length; each estimate is at most `error` above the true count; a token
// counted more than N/k times is monitored; an unmonitored token occurred at most min-count times.
describe('SpaceSaving', () => {
  it('keeps the paper guarantees on any stream (property, against exact counts)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 40 }), { maxLength: 400 }), fc.integer({ min: 1, max: 12 }), (stream, k) => {
        const s = new SpaceSaving(k);
        const exact = new Map<string, number>();
        for (const n of stream) {
          const t = `t${n * n}`; // skewed enough to have heavy hitters
          s.offer(t);
          exact.set(t, (exact.get(t) ?? 0) + 1);
        }
        const entries = [...s.entries()];
        expect(entries.length).toBe(Math.min(k, exact.size));
        expect(entries.reduce((a, e) => a + e.count, 0)).toBe(stream.length);
        const monitored = new Set(entries.map((e) => e.token));
        for (const e of entries) {
          const truth = exact.get(e.token) ?? 0;
          expect(e.count).toBeGreaterThanOrEqual(truth);
          expect(e.count - e.error).toBeLessThanOrEqual(truth);
        }
        for (const [t, n] of exact) {
          if (n * k > stream.length) expect(monitored.has(t)).toBe(true);
          if (!monitored.has(t)) expect(n).toBeLessThanOrEqual(s.floor);
        }
      }),
      { numRuns: 500 },
    );
  });

  it('is exact while counters are free', () => {
    const s = new SpaceSaving(5);
    for (const t of ['a', 'b', 'a', 'c', 'a', 'b']) s.offer(t);
    expect([...s.entries()].sort((x, y) => (x.token < y.token ? -1 : 1))).toEqual([
      { token: 'a', count: 3, error: 0 },
      { token: 'b', count: 2, error: 0 },
      { token: 'c', count: 1, error: 0 },
    ]);
    expect(s.floor).toBe(0);
  });

  it('hands the smallest counter to a newcomer, with that count as its error', () => {
    const s = new SpaceSaving(2);
    for (const t of ['a', 'a', 'b', 'c']) s.offer(t);
    // b (1) is replaced by c: c estimated 2 with error 1.
    expect([...s.entries()].sort((x, y) => (x.token < y.token ? -1 : 1))).toEqual([
      { token: 'a', count: 2, error: 0 },
      { token: 'c', count: 2, error: 1 },
    ]);
    expect(s.floor).toBe(2);
  });
});
