import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { auditCorpus } from '../../src/audit/auditCorpus.js';
import { capForShare, suggest } from '../../src/audit/suggest.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { encodeCorpus } from '../../src/pipeline/encodeCorpus.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const rules = resolveRules();
// Built from: late x4, ferry x2, the x2, was x2, again, lovely. Cap 3 keeps late, ferry, the.
const lexicon = freeze(
  Tally.fromTexts(
    [
      { text: 'the ferry was late again', label: 'delays' },
      { text: 'the ferry was lovely', label: 'praise' },
      { text: 'late late late', label: 'delays' },
    ],
    rules,
  ),
  { cap: 3 },
);

const heldOut = [
  { text: 'late late ferry', label: 'delays' }, // 3 tokens, 0 OOV
  { text: 'the crossing was rough and late', label: 'delays' }, // 6 tokens, OOV: crossing was rough and = 4
  { text: 'lovely', label: 'praise' }, // 1 token, 1 OOV
  { text: 'rough rough sea', label: 'refunds' }, // 3 tokens, 3 OOV
];

describe('auditCorpus', () => {
  it('gives the hand-counted figures', async () => {
    const r = await auditCorpus(heldOut, lexicon, { shape: { length: 4, pad: 'start', cut: 'end' } });
    expect(r.documents).toBe(4);
    expect(r.tokens).toBe(13);
    expect(r.types).toBe(9); // late ferry the crossing was rough and lovely sea
    expect(r.oovTokens).toBe(8);
    expect(r.oovRate).toBe(8 / 13);
    expect(r.truncatedDocuments).toBe(1); // the 6-token document
    expect(r.droppedTokens).toBe(2);
    expect(r.paddingTokens).toBe(1 + 3 + 1); // 4-3, 4-1, 4-3
    expect(r.length).toEqual({ min: 1, p50: 3, p90: 6, p95: 6, p99: 6, max: 6 });
    expect(r.labels).toEqual({
      delays: { documents: 2, tokens: 9, oovTokens: 4, truncatedDocuments: 1 },
      praise: { documents: 1, tokens: 1, oovTokens: 1, truncatedDocuments: 0 },
      refunds: { documents: 1, tokens: 3, oovTokens: 3, truncatedDocuments: 0 },
    });
    // OOV counts: rough 3, and 1, crossing 1, lovely 1, sea 1, was 1 -> count, then string order.
    expect(r.topOov).toEqual([
      { token: 'rough', count: 3 },
      { token: 'and', count: 1 },
      { token: 'crossing', count: 1 },
      { token: 'lovely', count: 1 },
      { token: 'sea', count: 1 },
      { token: 'was', count: 1 },
    ]);
    // Corpus ranking: late 3, rough 3, ferry 1 … (13 tokens): 90 % needs 12 of 13 -> 9 - 1 = 8 types.
    // 8 falls inside the 7 tokens seen once (ranks 3 to 9): whole counts at 2 (late, rough) or 9 (all).
    expect(r.suggest).toEqual({
      capFor90: 8,
      capFor95: 9,
      capFor99: 9,
      wholeCapsFor90: { below: 2, above: 9 },
      wholeCapsFor95: { below: 9, above: 9 },
      wholeCapsFor99: { below: 9, above: 9 },
      lengthFor90: 6,
      lengthFor95: 6,
      lengthFor99: 6,
      // At length 4 both ends keep 11 tokens, 7 of them OOV (the 6-token document keeps 3 either way).
      cut: { length: 4, knownKept: { cutStart: 4, cutEnd: 4 }, cut: null },
    });
    expect(r.lengthHistogram).toEqual([
      { length: 1, documents: 1 },
      { length: 3, documents: 2 },
      { length: 6, documents: 1 },
    ]);
    expect(r.coverage.at(-1)).toEqual({ cap: 9, share: 1 });
    expect(r.coverage[1]).toEqual({ cap: 2, share: 6 / 13 });
    expect(r.lexicon).toEqual({ fingerprint: lexicon.fingerprint, tokens: 3, size: 5, reserved: 0 });
    // The lexicon's own corpus: late 4, then ferry, the, was 2 each; cap 3 keeps ferry and the by string
    // order and leaves was out: caps 1 or 4 keep whole counts.
    expect(r.capTie).toEqual({ cap: 3, count: 2, tokens: 3, kept: 2, left: 1, below: 1, above: 4 });
  });

  it('compares with the fit record: drift', async () => {
    const r = await auditCorpus(heldOut, lexicon);
    const fit = lexicon.fit!;
    expect(r.drift?.oovRate).toEqual({ fit: fit.oovRate, now: 8 / 13 });
    expect(fit.oovRate).toBe(4 / 12); // was x2, again, lovely are out of the cap-3 vocabulary (ferry, the beat was on string order)
    expect(r.drift?.labels).toEqual({ delays: { fit: 2 / 3, now: 2 / 4 }, praise: { fit: 1 / 3, now: 1 / 4 }, refunds: { fit: 0, now: 1 / 4 } });
    expect(r.drift?.length.fit).toEqual(fit.length);
    // 'was' and 'lovely' have no id but were in the fit corpus: not new. The rest never were.
    expect(r.drift?.unseenTokens).toEqual([
      { token: 'rough', count: 3 },
      { token: 'and', count: 1 },
      { token: 'crossing', count: 1 },
      { token: 'sea', count: 1 },
    ]);
    expect(r.drift?.unseenBasis).toBe('fit');
    expect(r.shape).toBeNull();
    expect([r.truncatedDocuments, r.droppedTokens, r.paddingTokens]).toEqual([0, 0, 0]);
    expect((await auditCorpus(heldOut, lexicon, { drift: false })).drift).toBeUndefined();
  });

  it('agrees with encode on every shared figure (one code path)', async () => {
    const shape = { length: 4, pad: 'end', cut: 'start' } as const;
    const r = await auditCorpus(heldOut, lexicon, { shape });
    const stats = await encodeCorpus(heldOut, lexicon, shape, { row: () => undefined });
    expect([r.documents, r.tokens, r.oovTokens, r.truncatedDocuments, r.droppedTokens]).toEqual([stats.documents, stats.tokens, stats.oovTokens, stats.truncatedDocuments, stats.droppedTokens]);
  });

  it('keeps labels that are object keys as ordinary members', async () => {
    const r = await auditCorpus([{ text: 'a', label: '__proto__' }, { text: 'b', label: 'constructor' }], lexicon);
    expect(Object.keys(r.labels)).toEqual(['__proto__', 'constructor']);
    expect(JSON.parse(JSON.stringify(r)).labels.__proto__).toEqual({ documents: 1, tokens: 1, oovTokens: 1, truncatedDocuments: 0 });
  });
});

describe('suggest', () => {
  // Brute force: the smallest k whose top-k counts reach the share, found by trying every k.
  it('capForShare is the smallest cap reaching the share (property, against brute force)', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 50 }), { maxLength: 60 }), fc.constantFrom(50, 90, 95, 99, 100), (counts, percent) => {
        const ranked = [...counts].sort((a, b) => b - a);
        const total = ranked.reduce((a, b) => a + b, 0);
        let brute = 0;
        if (total > 0) {
          for (let k = 0; k <= ranked.length; k++) {
            const top = ranked.slice(0, k).reduce((a, b) => a + b, 0);
            if (top / total >= percent / 100 - 1e-12) {
              brute = k;
              break;
            }
          }
        }
        expect(capForShare(ranked, total, percent)).toBe(brute);
      }),
      { numRuns: 300 },
    );
  });

  it('gives nearest-rank lengths', () => {
    const lengths = new Map(Array.from({ length: 100 }, (_, i) => [i + 1, 1] as [number, number]));
    expect(suggest([], 0, lengths)).toEqual({
      capFor90: 0,
      capFor95: 0,
      capFor99: 0,
      wholeCapsFor90: { below: 0, above: 0 },
      wholeCapsFor95: { below: 0, above: 0 },
      wholeCapsFor99: { below: 0, above: 0 },
      lengthFor90: 90,
      lengthFor95: 95,
      lengthFor99: 99,
    });
  });
});
