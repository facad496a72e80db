import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { MAP_ENTRIES_MOST, TokenMap } from '../../src/tally/TokenMap.js';

// A JavaScript Map holds at most 2^24 entries (V8: "Map maximum size exceeded"); 50 million distinct
// tokens stopped a build there. TokenMap starts another Map at `perMap` entries: tested here with a few
// entries a Map instead of 16 million (the real case was measured by hand: README). A Tally numbers its
// tokens in a SpanIndex (typed arrays, no Map): tests/tally/tallySpans.test.ts.

describe('TokenMap', () => {
  it('keeps entries across Maps in the order added (hand-checked)', () => {
    const m = new TokenMap<number>(2);
    m.add('a', 0).add('b', 1).add('c', 2).add('__proto__', 3).set('b', 10).set('e', 4);
    expect([...m]).toEqual([['a', 0], ['b', 10], ['c', 2], ['__proto__', 3], ['e', 4]]);
    expect([m.size, m.get('c'), m.get('__proto__'), m.get('x'), m.has('e'), m.has('x')]).toEqual([5, 2, 3, undefined, true, false]);
    expect([...m.keys()]).toEqual(['a', 'b', 'c', '__proto__', 'e']);
    expect([...m.values()]).toEqual([0, 10, 2, 3, 4]);
    const seen: string[] = [];
    m.forEach((v, k, map) => seen.push(`${k}=${v}:${map === m}`));
    expect(seen).toEqual(['a=0:true', 'b=10:true', 'c=2:true', '__proto__=3:true', 'e=4:true']);
  });

  it.each([0, -1, 1.5, MAP_ENTRIES_MOST + 1])('refuses %d entries a Map', (perMap) => {
    expect(() => new TokenMap(perMap)).toThrow(`perMap ${perMap} is not a whole number from 1 to ${MAP_ENTRIES_MOST}`);
  });

  it('stays below what a JavaScript Map holds', () => {
    expect(MAP_ENTRIES_MOST).toBeLessThan(2 ** 24);
  });

  it('behaves as one Map whatever the entries a Map (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.constantFrom('a', 'b', 'c', 'd', 'e', 'f', 'constructor', '__proto__'), fc.integer()), { maxLength: 40 }), fc.integer({ min: 1, max: 6 }), (sets, perMap) => {
        const split = new TokenMap<number>(perMap);
        const one = new Map<string, number>();
        for (const [k, v] of sets) {
          split.set(k, v);
          one.set(k, v);
        }
        expect([...split]).toEqual([...one]);
        expect(split.size).toBe(one.size);
        for (const k of ['a', 'f', 'z', '__proto__']) expect(split.get(k)).toBe(one.get(k));
      }),
    );
  });
});
