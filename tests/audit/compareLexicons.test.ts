import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { compareLexicons, COMPARISON_SAMPLE } from '../../src/audit/compareLexicons.js';
import type { LexiconComparison } from '../../src/audit/compare/LexiconComparison.js';
import { freeze, type FreezeOptions } from '../../src/lexicon/freeze.js';
import type { Lexicon } from '../../src/lexicon/Lexicon.js';
import type { Shape } from '../../src/lexicon/Shape.js';
import { resolveRules, type TextRules } from '../../src/rules/TextRules.js';
import { Tally, type LabelledText } from '../../src/tally/Tally.js';

const lower = resolveRules();
const keep = resolveRules({ case: 'keep' });

function lex(texts: Array<string | LabelledText>, options: FreezeOptions = {}, rules: TextRules = lower): Lexicon {
  return freeze(Tally.fromTexts(texts, rules), options);
}

// Hand-ranked: the 2, ferry 2 (tie: "ferry" < "the"), then late, left, was (1 each, string order).
// Ids with OOV first: ferry 2, the 3, late 4, left 5, was 6.
const FERRY = ['the ferry was late', 'the ferry left'];
const base = lex(FERRY);
const labelled: LabelledText[] = [
  { text: 'the ferry', label: 'pos' },
  { text: 'late', label: 'neg' },
];

const NO_LABELS = { a: null, b: null, onlyInA: [], onlyInB: [], moved: [] };
const NOTHING = { count: 0, first: [] };

/** The members a comparison of two lexicons with these parts has when nothing else differs. */
function expected(a: Lexicon, b: Lexicon, parts: Partial<LexiconComparison>): LexiconComparison {
  return {
    sameFingerprint: false,
    fingerprints: { a: a.fingerprint, b: b.fingerprint },
    rules: [],
    layout: [],
    shape: null,
    tokens: { a: 5, b: 5, shared: 5 },
    onlyInA: NOTHING,
    onlyInB: NOTHING,
    moved: NOTHING,
    topOverlap: [{ k: 5, shared: 5, share: 1 }],
    labels: NO_LABELS,
    ...parts,
  };
}

describe('compareLexicons', () => {
  it('reports two lexicons with the same encoding as the same, whatever corpus made them', () => {
    // Every count doubled: same ranking, same encoding, another fit.
    const b = lex([...FERRY, ...FERRY]);
    expect(b.fit?.tokens).toBe(14);
    expect(compareLexicons(base, b)).toEqual({ ...expected(base, b, {}), sameFingerprint: true });
    expect(base.fingerprint).toBe(b.fingerprint);
  });

  it.each<[string, () => [Lexicon, Lexicon], (a: Lexicon, b: Lexicon) => Partial<LexiconComparison>]>([
    [
      'a token added at the end (zigzag ranks last: nothing moves)',
      () => [base, lex([...FERRY, 'zigzag'])],
      () => ({ tokens: { a: 5, b: 6, shared: 5 }, onlyInB: { count: 1, first: ['zigzag'] } }),
    ],
    [
      'a token added in the middle (lovely ranks before was: was moves 6 -> 7)',
      () => [base, lex([...FERRY, 'lovely'])],
      () => ({
        tokens: { a: 5, b: 6, shared: 5 },
        onlyInB: { count: 1, first: ['lovely'] },
        moved: { count: 1, first: [{ token: 'was', a: 6, b: 7 }] },
        // b's top 5: ferry, the, late, left, lovely: 4 of a's.
        topOverlap: [{ k: 5, shared: 4, share: 0.8 }],
      }),
    ],
    [
      'a count change (late 3 outranks ferry and the)',
      () => [base, lex(['the ferry was late', 'the ferry left late', 'late'])],
      () => ({
        // b: late 2, ferry 3, the 4, left 5, was 6.
        moved: {
          count: 3,
          first: [
            { token: 'ferry', a: 2, b: 3 },
            { token: 'the', a: 3, b: 4 },
            { token: 'late', a: 4, b: 2 },
          ],
        },
      }),
    ],
    [
      'case lower vs keep',
      () => [lex(['The ferry', 'the Ferry']), lex(['The ferry', 'the Ferry'], {}, keep)],
      () => ({
        // a: ferry 2, the 3. b: Ferry 2, The 3, ferry 4, the 5 (upper case sorts first).
        rules: [{ member: 'case', a: 'lower', b: 'keep' }],
        tokens: { a: 2, b: 4, shared: 2 },
        onlyInB: { count: 2, first: ['Ferry', 'The'] },
        moved: {
          count: 2,
          first: [
            { token: 'ferry', a: 2, b: 4 },
            { token: 'the', a: 3, b: 5 },
          ],
        },
        topOverlap: [{ k: 2, shared: 0, share: 0 }],
      }),
    ],
    [
      'OOV first vs last (every id moves down by one)',
      () => [base, lex(FERRY, { oov: 'last' })],
      () => ({
        layout: [{ member: 'oov', a: 'first', b: 'last' }],
        moved: {
          count: 5,
          first: [
            { token: 'ferry', a: 2, b: 1 },
            { token: 'the', a: 3, b: 2 },
            { token: 'late', a: 4, b: 3 },
            { token: 'left', a: 5, b: 4 },
            { token: 'was', a: 6, b: 5 },
          ],
        },
      }),
    ],
    [
      'a reserved token (left out of the top-K)',
      () => [lex(FERRY, { reserved: ['<start>'] }), base],
      () => ({
        layout: [{ member: 'reserved', a: 1, b: 0 }],
        tokens: { a: 6, b: 5, shared: 5 },
        onlyInA: { count: 1, first: ['<start>'] },
        moved: {
          count: 5,
          first: [
            { token: 'ferry', a: 3, b: 2 },
            { token: 'the', a: 4, b: 3 },
            { token: 'late', a: 5, b: 4 },
            { token: 'left', a: 6, b: 5 },
            { token: 'was', a: 7, b: 6 },
          ],
        },
      }),
    ],
    [
      'a cap',
      () => [lex(FERRY, { cap: 3 }), base],
      () => ({
        tokens: { a: 3, b: 5, shared: 3 },
        onlyInB: { count: 2, first: ['left', 'was'] },
        topOverlap: [{ k: 3, shared: 3, share: 1 }],
      }),
    ],
    [
      'a shape',
      () => [base, lex(FERRY, { shape: { length: 4, pad: 'start', cut: 'end' } })],
      () => ({ shape: { a: null, b: { length: 4, pad: 'start', cut: 'end' } } }),
    ],
    [
      'labels added and moved (aardvark sorts first)',
      () => [lex(labelled), lex([...labelled, { text: '', label: 'aardvark' }])],
      () => ({
        tokens: { a: 3, b: 3, shared: 3 },
        topOverlap: [{ k: 3, shared: 3, share: 1 }],
        labels: {
          a: 2,
          b: 3,
          onlyInA: [],
          onlyInB: ['aardvark'],
          moved: [
            { label: 'neg', a: 0, b: 1 },
            { label: 'pos', a: 1, b: 2 },
          ],
        },
      }),
    ],
    [
      'no labels vs labels',
      () => [lex(labelled, { labels: false }), lex(labelled)],
      () => ({
        tokens: { a: 3, b: 3, shared: 3 },
        topOverlap: [{ k: 3, shared: 3, share: 1 }],
        labels: { a: null, b: 2, onlyInA: [], onlyInB: ['neg', 'pos'], moved: [] },
      }),
    ],
  ])('reports %s', (_what, make, parts) => {
    const [a, b] = make();
    expect(compareLexicons(a, b)).toEqual(expected(a, b, parts(a, b)));
  });

  it('lists every differing rule, in the order level, unicode, case, drop, collapse, spaces, tokenizer', () => {
    const a = lex(['Ferry 12, late!']);
    const b = lex(['Ferry 12, late!'], {}, resolveRules({ unicode: 'NFC', case: 'keep', drop: ['punctuation'], collapse: ['number'] }));
    expect(compareLexicons(a, b).rules).toEqual([
      { member: 'unicode', a: 'NFKC', b: 'NFC' },
      { member: 'case', a: 'lower', b: 'keep' },
      { member: 'drop', a: [], b: ['punctuation'] },
      { member: 'collapse', a: [], b: ['number'] },
    ]);
    const chars = lex(['ab'], {}, resolveRules({ level: 'char' }));
    expect(compareLexicons(lex(['ab']), chars).rules).toEqual([
      { member: 'level', a: 'word', b: 'char' },
      { member: 'spaces', a: null, b: 'keep' },
      { member: 'tokenizer', a: 'wink-tokenizer@5.3.0', b: 'lexlock-chars@1' },
    ]);
  });

  it('computes top-K overlaps for the K asked for, sorted and once each; K beyond the vocabulary divides by K', () => {
    // a ranks ferry, the, late, left, was; b ranks late, ferry, the, left, was.
    const b = lex(['the ferry was late', 'the ferry left late', 'late']);
    expect(compareLexicons(base, b, { tops: [10, 1, 3, 2, 3] }).topOverlap).toEqual([
      { k: 1, shared: 0, share: 0 },
      { k: 2, shared: 1, share: 0.5 },
      { k: 3, shared: 3, share: 1 },
      { k: 10, shared: 5, share: 0.5 },
    ]);
    expect(compareLexicons(base, b, { tops: [] }).topOverlap).toEqual([]);
  });

  it('uses the default K values below the smaller vocabulary, plus its size, and samples 20 tokens', () => {
    // a: w000…w249, b: w050…w349, every token once, so both rank in string order.
    const names = (from: number, to: number) => Array.from({ length: to - from }, (_, i) => `w${String(from + i).padStart(3, '0')}`);
    const tallyOf = (tokens: string[]) => new Tally(lower).addTokens(tokens);
    const a = freeze(tallyOf(names(0, 250)));
    const b = freeze(tallyOf(names(50, 350)));
    const c = compareLexicons(a, b);
    expect(COMPARISON_SAMPLE).toBe(20);
    expect(c.tokens).toEqual({ a: 250, b: 300, shared: 200 });
    // top 100: w000…w099 and w050…w149 share w050…w099; top 250: w000…w249 and w050…w299 share w050…w249.
    expect(c.topOverlap).toEqual([
      { k: 100, shared: 50, share: 0.5 },
      { k: 250, shared: 200, share: 0.8 },
    ]);
    expect(c.onlyInA).toEqual({ count: 50, first: names(0, 20) });
    expect(c.onlyInB).toEqual({ count: 100, first: names(250, 270) });
    // w050 is id 52 in a and id 2 in b, and so on.
    expect(c.moved.count).toBe(200);
    expect(c.moved.first).toEqual(names(50, 70).map((token, i) => ({ token, a: 52 + i, b: 2 + i })));
  });

  it.each([
    [[0], 'tops: 0 is not a whole number of at least 1'],
    [[100, -5], 'tops: -5 is not a whole number of at least 1'],
    [[1.5], 'tops: 1.5 is not a whole number of at least 1'],
    [[Number.NaN], 'tops: NaN is not a whole number of at least 1'],
  ])('refuses tops %j', (tops, message) => {
    let error: unknown = null;
    try {
      compareLexicons(base, base, { tops });
    } catch (e) {
      error = e;
    }
    expect(error).toMatchObject({ name: 'LexlockError', code: 'BAD_OPTION', message });
  });
});

// Property tests: small random lexicons (at most 11 tokens, so the 20-token samples are complete).
const TOKENS = ['a', 'b', 'c', 'd', 'F', 'g', 'é', 'zz'];
const LABELS = ['mixed', 'neg', 'pos'];

interface Spec {
  counts: Record<string, number>;
  labels: string[];
  case: 'lower' | 'keep';
  oov: 'first' | 'last';
  cap: number | null;
  reserved: string[];
  shape: Shape | null;
}

const specArb: fc.Arbitrary<Spec> = fc.record({
  counts: fc.dictionary(fc.constantFrom(...TOKENS), fc.integer({ min: 1, max: 4 }), { maxKeys: TOKENS.length }),
  labels: fc.subarray(LABELS),
  case: fc.constantFrom('lower' as const, 'keep' as const),
  oov: fc.constantFrom('first' as const, 'last' as const),
  cap: fc.option(fc.integer({ min: 0, max: 8 }), { nil: null }),
  reserved: fc.subarray(['<start>', '<end>', 'a']),
  shape: fc.option(
    fc.record({
      length: fc.integer({ min: 1, max: 3 }),
      pad: fc.constantFrom('start' as const, 'end' as const),
      cut: fc.constantFrom('start' as const, 'end' as const),
    }),
    { nil: null },
  ),
});

function build(spec: Spec, scale = 1): Lexicon {
  const t = new Tally(resolveRules({ case: spec.case }));
  for (const [token, n] of Object.entries(spec.counts)) t.addTokens(Array.from({ length: n * scale }, () => token));
  for (const label of spec.labels) t.addTokens([], label);
  return freeze(t, { oov: spec.oov, cap: spec.cap, reserved: spec.reserved, shape: spec.shape });
}

const TWEAKS = ['same', 'double', 'case', 'oov', 'cap', 'label', 'shape', 'count', 'reserved'] as const;

/** A spec and a near copy: the same, the same with counts doubled (same encoding), or one member changed. */
const pairArb: fc.Arbitrary<[Lexicon, Lexicon]> = fc.oneof(
  fc.tuple(specArb, specArb).map(([x, y]): [Lexicon, Lexicon] => [build(x), build(y)]),
  fc.tuple(specArb, fc.constantFrom(...TWEAKS)).map(([x, tweak]): [Lexicon, Lexicon] => {
    const y: Spec = { ...x, counts: { ...x.counts } };
    if (tweak === 'case') y.case = x.case === 'lower' ? 'keep' : 'lower';
    if (tweak === 'oov') y.oov = x.oov === 'first' ? 'last' : 'first';
    if (tweak === 'cap') y.cap = x.cap === null ? 2 : null;
    if (tweak === 'label') y.labels = x.labels.includes('neg') ? x.labels.filter((l) => l !== 'neg') : [...x.labels, 'neg'];
    if (tweak === 'shape') y.shape = x.shape === null ? { length: 2, pad: 'start', cut: 'start' } : null;
    if (tweak === 'reserved') y.reserved = x.reserved.length === 0 ? ['a'] : [];
    if (tweak === 'count') y.counts.zz = (x.counts.zz ?? 0) + 3;
    return [build(x), build(y, tweak === 'double' ? 2 : 1)];
  }),
);

function byToken<T extends { token: string }>(list: readonly T[]): T[] {
  return [...list].sort((x, y) => (x.token < y.token ? -1 : x.token > y.token ? 1 : 0));
}

function byLabel<T extends { label: string }>(list: readonly T[]): T[] {
  return [...list].sort((x, y) => (x.label < y.label ? -1 : x.label > y.label ? 1 : 0));
}

/** compare(b, a) as compare(a, b) predicts it; the moved lists sorted, as each follows its own a's order. */
function mirror(c: LexiconComparison): LexiconComparison {
  return {
    ...c,
    fingerprints: { a: c.fingerprints.b, b: c.fingerprints.a },
    rules: c.rules.map((d) => ({ ...d, a: d.b, b: d.a }) as typeof d),
    layout: c.layout.map((d) => ({ ...d, a: d.b, b: d.a }) as typeof d),
    shape: c.shape === null ? null : { a: c.shape.b, b: c.shape.a },
    tokens: { a: c.tokens.b, b: c.tokens.a, shared: c.tokens.shared },
    onlyInA: c.onlyInB,
    onlyInB: c.onlyInA,
    moved: { count: c.moved.count, first: byToken(c.moved.first.map((m) => ({ token: m.token, a: m.b, b: m.a }))) },
    labels: {
      a: c.labels.b,
      b: c.labels.a,
      onlyInA: c.labels.onlyInB,
      onlyInB: c.labels.onlyInA,
      moved: byLabel(c.labels.moved.map((m) => ({ label: m.label, a: m.b, b: m.a }))),
    },
  };
}

function sortedMoves(c: LexiconComparison): LexiconComparison {
  return { ...c, moved: { ...c.moved, first: byToken(c.moved.first) }, labels: { ...c.labels, moved: byLabel(c.labels.moved) } };
}

function reportsNoDifference(c: LexiconComparison): boolean {
  const l = c.labels;
  return (
    c.rules.length === 0 &&
    c.layout.length === 0 &&
    c.shape === null &&
    c.onlyInA.count === 0 &&
    c.onlyInB.count === 0 &&
    c.moved.count === 0 &&
    l.a === l.b &&
    l.onlyInA.length === 0 &&
    l.onlyInB.length === 0 &&
    l.moved.length === 0
  );
}

describe('compareLexicons (properties)', () => {
  it('compare(a, a) reports the same fingerprint, no difference and full top-K overlap', () => {
    fc.assert(
      fc.property(specArb, (spec) => {
        const a = build(spec);
        const c = compareLexicons(a, build(spec));
        expect(c.sameFingerprint).toBe(true);
        expect(reportsNoDifference(c)).toBe(true);
        expect(c.tokens).toEqual({ a: a.encoding.tokens.length, b: a.encoding.tokens.length, shared: a.encoding.tokens.length });
        for (const t of c.topOverlap) expect([t.shared, t.share]).toEqual([t.k, 1]);
      }),
    );
  });

  it('compare(b, a) is the mirror image of compare(a, b)', () => {
    fc.assert(
      fc.property(pairArb, ([a, b]) => {
        expect(sortedMoves(compareLexicons(b, a))).toEqual(mirror(compareLexicons(a, b)));
      }),
    );
  });

  it('reports no difference exactly when the fingerprints are the same', () => {
    fc.assert(
      fc.property(pairArb, ([a, b]) => {
        const c = compareLexicons(a, b);
        expect(reportsNoDifference(c)).toBe(c.sameFingerprint);
        expect(c.sameFingerprint).toBe(a.fingerprint === b.fingerprint);
      }),
    );
  });
});
