import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const rules = resolveRules();

function snapshot(t: Tally) {
  const sorted = <V>(m: ReadonlyMap<string | number, V>) => [...m.entries()].sort((a, b) => (String(a[0]) < String(b[0]) ? -1 : 1));
  return {
    documents: t.documents,
    tokens: t.tokens,
    counts: sorted(t.counts),
    df: sorted(t.documentFrequency),
    lengths: sorted(t.lengths),
    labels: sorted(t.labels),
  };
}

describe('Tally', () => {
  it('counts occurrences, document frequency, lengths and labels (hand-counted)', () => {
    const t = Tally.fromTexts(
      [
        { text: 'the ferry the boat', label: 'x' },
        { text: 'the dock', label: 'y' },
        'boat boat',
      ],
      rules,
    );
    expect(t.documents).toBe(3);
    expect(t.tokens).toBe(8);
    expect(t.types).toBe(4);
    expect(Object.fromEntries(t.counts)).toEqual({ the: 3, ferry: 1, boat: 3, dock: 1 });
    expect(Object.fromEntries(t.documentFrequency)).toEqual({ the: 2, ferry: 1, boat: 2, dock: 1 });
    expect(Object.fromEntries(t.lengths)).toEqual({ 4: 1, 2: 2 });
    expect(Object.fromEntries(t.labels)).toEqual({ x: { documents: 1, tokens: 4 }, y: { documents: 1, tokens: 2 } });
  });

  it('counts tokens that are also object keys like any other', () => {
    const t = new Tally(rules);
    t.addTokens(['constructor', '__proto__', 'tostring', 'valueof', 'constructor', 'hasOwnProperty']);
    expect(t.counts.get('constructor')).toBe(2);
    expect(t.counts.get('__proto__')).toBe(1);
    expect(t.counts.get('tostring')).toBe(1);
    expect(t.types).toBe(5);
  });

  it('reads async iterables without holding them', async () => {
    async function* texts() {
      yield 'a b';
      yield { text: 'b c', label: 'l' };
    }
    const t = await Tally.fromAsync(texts(), rules);
    expect(t.counts.get('b')).toBe(2);
    expect(t.labels.get('l')).toEqual({ documents: 1, tokens: 2 });
  });

  it('refuses to merge tallies counted under different rules', () => {
    const a = new Tally(rules);
    const b = new Tally(resolveRules({ level: 'char' }));
    expect(() => a.merge(b)).toThrow(/^cannot merge tallies counted under different rules/);
  });

  // Invariant from the encoding contract, rule 3: merging in any order or split gives the same tally.
  it('merges by addition: any split and any order give the same tally (property)', () => {
    const doc = fc.record({
      tokens: fc.array(fc.constantFrom('a', 'b', 'c', 'constructor', '__proto__', 'é', '😀'), { maxLength: 6 }),
      label: fc.option(fc.constantFrom('x', 'y', 'toString'), { nil: undefined }),
    });
    fc.assert(
      fc.property(fc.array(doc, { maxLength: 30 }), fc.array(fc.nat(), { maxLength: 5 }), fc.infiniteStream(fc.nat()), (docs, cuts, order) => {
        const whole = new Tally(rules);
        for (const d of docs) whole.addTokens(d.tokens, d.label);
        const points = [...new Set(cuts.map((c) => (docs.length === 0 ? 0 : c % (docs.length + 1))))].sort((x, y) => x - y);
        const parts: Tally[] = [];
        let from = 0;
        for (const p of [...points, docs.length]) {
          const part = new Tally(rules);
          for (const d of docs.slice(from, p)) part.addTokens(d.tokens, d.label);
          parts.push(part);
          from = p;
        }
        const it = order[Symbol.iterator]();
        const shuffled = parts.map((p) => [it.next().value as number, p] as const).sort((x, y) => x[0] - y[0]).map(([, p]) => p);
        const merged = shuffled.reduce((acc, p) => acc.merge(p), new Tally(rules));
        expect(snapshot(merged)).toEqual(snapshot(whole));
      }),
      { numRuns: 200 },
    );
  });
});
