import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { SpaceSaving } from '../../src/tally/SpaceSaving.js';
import { spanHashes } from '../../src/tally/spanHashes.js';

// The guarantees of Metwally, Agrawal & El Abbadi (ICDT 2005), Lemmas 3.3-3.5 (from memory): the
// counts sum to the stream length; each estimate is at most `error` above the true count; a token
// counted more than N/k times is monitored; an unmonitored token occurred at most min-count times.
// Here `floor` is the largest count ever given up, which is at most the smallest count (a tighter bound).

/** Offers a stream and counts it exactly beside. */
function run(s: SpaceSaving, stream: readonly string[]): Map<string, number> {
  const exact = new Map<string, number>();
  for (const t of stream) {
    s.offerToken(t);
    exact.set(t, (exact.get(t) ?? 0) + 1);
  }
  return exact;
}

/** Every bound the summary promises, checked against exact counts. */
function expectBounds(s: SpaceSaving, exact: ReadonlyMap<string, number>): void {
  const entries = [...s.entries()];
  expect(entries.length).toBe(s.size);
  expect(s.size).toBeLessThanOrEqual(s.capacity);
  const monitored = new Set(entries.map((e) => e.token));
  expect(monitored.size).toBe(entries.length);
  for (const e of entries) {
    const truth = exact.get(e.token) ?? 0;
    expect(e.count).toBeGreaterThanOrEqual(truth);
    expect(e.count - e.error).toBeLessThanOrEqual(truth);
  }
  for (const [t, n] of exact) if (!monitored.has(t)) expect(n).toBeLessThanOrEqual(s.floor);
}

const skewed = fc.array(fc.integer({ min: 0, max: 40 }).map((n) => `t${n * n}`), { maxLength: 400 });

describe('SpaceSaving', () => {
  it('keeps the paper guarantees on any stream (property, against exact counts)', () => {
    fc.assert(
      fc.property(skewed, fc.integer({ min: 1, max: 12 }), (stream, k) => {
        const s = new SpaceSaving(k, 10_000);
        const exact = run(s, stream);
        expectBounds(s, exact);
        expect(s.size).toBe(Math.min(k, exact.size));
        expect([...s.entries()].reduce((a, e) => a + e.count, 0)).toBe(stream.length);
        for (const [t, n] of exact) if (n * k > stream.length) expect(s.find(hashOf(t), t, 0, t.length, false)).toBeGreaterThanOrEqual(0);
        expect(s.dropped).toBe(0);
      }),
      { numRuns: 500 },
    );
  });

  it('keeps them when a small arena makes it give counters up (property)', () => {
    let gaveUp = 0;
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 30 }).map((n) => `${'x'.repeat(n % 7)}t${n * n}`), { maxLength: 300 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 12, max: 60 }), (stream, k, arena) => {
        const s = new SpaceSaving(k, arena);
        const exact = run(s, stream);
        expectBounds(s, exact);
        gaveUp += s.dropped;
      }),
      { numRuns: 500 },
    );
    expect(gaveUp).toBeGreaterThan(0);
  });

  it('says whether an offered token was monitored already (property, against the counters before the offer)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 0, max: 30 }).map((n) => `${'x'.repeat(n % 5)}t${n * n}`), { maxLength: 300 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 12, max: 80 }), (stream, k, arena) => {
        const s = new SpaceSaving(k, arena);
        for (const t of stream) {
          const before = new Set([...s.entries()].map((e) => e.token));
          expect(s.offer(hashOf(t), t, 0, t.length, false), t).toBe(before.has(t));
        }
      }),
      { numRuns: 200 },
    );
  });

  it('is exact while counters are free', () => {
    const s = new SpaceSaving(5, 100);
    run(s, ['a', 'b', 'a', 'c', 'a', 'b']);
    expect(sorted(s)).toEqual([
      { token: 'a', count: 3, error: 0 },
      { token: 'b', count: 2, error: 0 },
      { token: 'c', count: 1, error: 0 },
    ]);
    expect(s.floor).toBe(0);
  });

  it('hands the smallest counter to a newcomer, with that count as its error', () => {
    const s = new SpaceSaving(2, 100);
    run(s, ['a', 'a', 'b', 'c']);
    // b (1) is replaced by c: c estimated 2 with error 1; b, given up at 1, occurred at most once.
    expect(sorted(s)).toEqual([
      { token: 'a', count: 2, error: 0 },
      { token: 'c', count: 2, error: 1 },
    ]);
    expect(s.floor).toBe(1);
  });

  it('finds a token by a span of any text, read lower-cased when folded', () => {
    const s = new SpaceSaving(4, 100);
    const out = new Int32Array(3);
    const text = 'The FERRY ferry';
    spanHashes(text, 4, 9, true, out);
    s.offer(out[0] as number, text, 4, 9, true);
    spanHashes(text, 10, 15, false, out);
    s.offer(out[0] as number, text, 10, 15, false);
    expect(sorted(s)).toEqual([{ token: 'ferry', count: 2, error: 0 }]);
    expect(s.find(hashOf('FERRY'), 'FERRY', 0, 5, false)).toBe(-1);
  });

  it('orders tokens as JavaScript sorts strings (UTF-16 code units)', () => {
    const tokens = ['zebra', 'Zebra', 'apple', 'é', '😀', 'app', '\uffff', ''.padEnd(3, 'a')];
    const s = new SpaceSaving(tokens.length, 200);
    run(s, tokens);
    const counters = [...s.monitored()].sort((a, b) => s.compareTokens(a, b));
    expect(counters.map((c) => s.tokenAt(c))).toEqual([...tokens].sort());
  });

  it('goes without a token longer than its whole arena, and says no token is bounded any more', () => {
    const s = new SpaceSaving(4, 20);
    run(s, ['a', 'x'.repeat(30), 'a']);
    expect(sorted(s)).toEqual([{ token: 'a', count: 2, error: 0 }]);
    expect(s.floor).toBe(Infinity);
  });

  it.each([
    [0, 10, 'capacity 0 is not a whole number from 1 to 2^30 - 1'],
    [2, 4, 'arenaUnits 4 is not a whole number from 5 to 2^31 - 1'],
  ])('refuses capacity %d with an arena of %d', (capacity, arena, message) => {
    expect(() => new SpaceSaving(capacity, arena)).toThrow(message);
  });
});

function hashOf(token: string): number {
  const out = new Int32Array(3);
  spanHashes(token, 0, token.length, false, out);
  return out[0] as number;
}

function sorted(s: SpaceSaving) {
  return [...s.entries()].sort((x, y) => (x.token < y.token ? -1 : 1));
}
