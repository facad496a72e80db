import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';
import { freeze } from '../../src/lexicon/freeze.js';

const rules = resolveRules();

function tallyOf(counts: Record<string, number>): Tally {
  const t = new Tally(rules);
  for (const [token, n] of Object.entries(counts)) t.addTokens(Array.from({ length: n }, () => token));
  return t;
}

describe('freeze (encoding contract, rule 4)', () => {
  // Hand-ranked: count descending, ties in UTF-16 code unit order ('B' < 'a' < 'b' < 'é').
  const tally = tallyOf({ b: 3, a: 3, é: 3, B: 3, ferry: 5, rare: 1 });

  it('ranks by count, then string order, and puts OOV first by default', () => {
    const lex = freeze(tally);
    expect(lex.encoding.tokens).toEqual(['ferry', 'B', 'a', 'b', 'é', 'rare']);
    expect([lex.idOf('ferry'), lex.idOf('B'), lex.idOf('rare'), lex.idOf('unseen')]).toEqual([2, 3, 7, 1]);
    expect(lex.oovId).toBe(1);
    expect(lex.size).toBe(8);
  });

  it('caps and drops rare tokens; OOV last takes cap+1', () => {
    const lex = freeze(tally, { cap: 3, minCount: 2, oov: 'last' });
    expect(lex.encoding.tokens).toEqual(['ferry', 'B', 'a']);
    expect([lex.idOf('ferry'), lex.idOf('a'), lex.idOf('b')]).toEqual([1, 3, 4]);
    expect(lex.oovId).toBe(4);
    expect(lex.size).toBe(5);
  });

  it('gives reserved tokens the ids right after the specials, outside the cap', () => {
    const lex = freeze(tally, { cap: 2, reserved: ['<start>', 'a', '__proto__'] });
    expect(lex.encoding.tokens).toEqual(['<start>', 'a', '__proto__', 'ferry', 'B']);
    expect([lex.idOf('<start>'), lex.idOf('a'), lex.idOf('__proto__'), lex.idOf('ferry'), lex.idOf('b')]).toEqual([2, 3, 4, 5, 1]);
    const last = freeze(tally, { cap: 2, oov: 'last', reserved: ['<start>'] });
    expect([last.idOf('<start>'), last.idOf('ferry'), last.idOf('B'), last.oovId]).toEqual([1, 2, 3, 4]);
  });

  it('records the fit: figures hand-computed from the tally', () => {
    const lex = freeze(tally, { cap: 2, source: 'x.csv', now: new Date('2026-01-02T03:04:05Z') });
    const fit = lex.fit!;
    expect(fit.documents).toBe(6);
    expect(fit.tokens).toBe(18);
    expect(fit.types).toBe(6);
    // kept: ferry (5) + B (3) = 8 of 18 tokens; 10 are OOV.
    expect(fit.oovTokens).toBe(10);
    expect(fit.oovRate).toBeCloseTo(10 / 18, 12);
    expect(fit.createdAt).toBe('2026-01-02T03:04:05.000Z');
    expect(fit.coverage).toEqual([
      { cap: 2, share: 8 / 18 },
      { cap: 6, share: 1 },
    ]);
    expect(fit.length).toEqual({ min: 1, p50: 3, p90: 5, p95: 5, p99: 5, max: 5 });
  });

  it('records truncation under a shape', () => {
    const lex = freeze(tally, { shape: { length: 3, pad: 'start', cut: 'end' } });
    // Documents of 5 tokens (1) are cut: 1 document, 2 tokens dropped.
    expect(lex.fit!.truncation).toEqual({ length: 3, truncatedDocuments: 1, droppedTokens: 2 });
  });

  it('stores labels in JavaScript string order', () => {
    const t = Tally.fromTexts([{ text: 'a', label: 'zeta' }, { text: 'b', label: 'Alpha' }, { text: 'c', label: 'constructor' }], rules);
    const lex = freeze(t);
    expect(lex.labels).toEqual(['Alpha', 'constructor', 'zeta']);
    expect(lex.labelId('constructor')).toBe(1);
    expect(freeze(t, { labels: false }).encoding.labels).toBeNull();
  });

  it.each([
    [{ cap: -3 }, 'cap: -3 is not a whole number of at least 0'],
    [{ minCount: 0 }, 'minCount: 0 is not a whole number of at least 1'],
    [{ oov: 'middle' }, 'oov: "middle" is not a place; use first or last'],
    [{ reserved: ['x', 'x'] }, 'reserved: "x" is listed twice'],
    [{ reserved: [''] }, 'reserved: a reserved token cannot be empty'],
    [{ shape: { length: 0, pad: 'start', cut: 'start' } }, 'length: 0 is not a positive whole number of tokens'],
    [{ shape: { length: 5, pad: 'middle', cut: 'start' } }, 'pad: "middle" is not an end of a row; use start (zeros before the tokens) or end (zeros after them)'],
  ])('refuses %j', (options, message) => {
    expect(() => freeze(tally, options as never)).toThrow(message);
  });

  it('fingerprints by encoding only: same encoding from other corpora and times, same fingerprint', () => {
    const a = freeze(tallyOf({ x: 2, y: 1 }), { now: new Date(0), source: 'a' });
    const b = freeze(tallyOf({ x: 9, y: 4 }), { now: new Date(1e12), source: 'b' });
    expect(a.fingerprint).toBe(b.fingerprint);
    expect(a.fingerprint).toMatch(/^sha256:[0-9a-f]{64}$/);
    expect(freeze(tallyOf({ x: 1, y: 2 })).fingerprint).not.toBe(a.fingerprint);
  });
});
