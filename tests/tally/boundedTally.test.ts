import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { caughtError } from '../helpers/caughtError.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { SeenTokens } from '../../src/lexicon/SeenTokens.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { boundedTally, type BoundedTally } from '../../src/tally/boundedTally.js';
import { DistinctEstimate } from '../../src/tally/DistinctEstimate.js';
import { memoryPlan, type MemoryPlan } from '../../src/tally/memoryPlan.js';
import { spanHashes } from '../../src/tally/spanHashes.js';
import { Tally } from '../../src/tally/Tally.js';
import { letters, seeded } from '../helpers/generatedCorpora.js';

const rules = resolveRules();

/** Documents with Zipf-like word frequencies: word i appears about 1/i as often (Zipf 1949). */
function zipfDocuments(seed: number, documents: number, vocabulary: number): string[] {
  const next = seeded(seed);
  return Array.from({ length: documents }, () => Array.from({ length: 12 }, () => letters(Math.floor(vocabulary ** next()))).join(' '));
}

/**
 * Documents of 12 words in which many tokens share each count: `groups` counts (1, 4, 9, … `groups`²), `perGroup`
 * tokens of each, and as many tokens that occur once, every occurrence shuffled (seeded), so a cap falls inside a group of equal counts
 * and the tokens it keeps are chosen by string order (common practice: ties are where top-k counts err).
 */
function tiedDocuments(seed: number, groups: number, perGroup: number): string[] {
  const next = seeded(seed);
  const words: string[] = [];
  for (let g = 1; g <= groups; g++) for (let k = 0; k < perGroup; k++) for (let n = 0; n < g * g; n++) words.push(letters(g * perGroup + k));
  for (let k = 0; k < perGroup * groups; k++) words.push(`once${letters(k)}`);
  for (let i = words.length - 1; i > 0; i--) {
    const j = Math.floor(next() * (i + 1));
    [words[i], words[j]] = [words[j] as string, words[i] as string];
  }
  const docs: string[] = [];
  for (let i = 0; i < words.length; i += 12) docs.push(words.slice(i, i + 12).join(' '));
  return docs;
}

/** A real plan for 32 MiB with only `counters` counters and `arenaUnits` of arena: the seam that makes a small corpus need two passes. */
function smallPlan(counters: number, arenaUnits = counters * 12): MemoryPlan {
  return { ...memoryPlan(32, 100), counters, arenaUnits };
}

/** The fit members a bounded build must share with an unbounded one (README, Bounded memory). */
const SAME = ['documents', 'tokens', 'oovTokens', 'oovRate', 'length', 'labels', 'truncation', 'capTie', 'cap', 'minCount'] as const;

/** Checks a proven bounded count against the exact tally: same lexicon, the fit as README says. */
function expectLikeExact(bounded: BoundedTally, docs: readonly string[], cap: number, minCount: number): void {
  const exact = freeze(Tally.fromTexts(docs, rules), { cap, minCount });
  const lexicon = freeze(bounded.tally, { cap, minCount, measured: bounded.measured });
  expect(lexicon.fingerprint).toBe(exact.fingerprint);
  const b = lexicon.fit as NonNullable<typeof lexicon.fit>;
  const e = exact.fit as NonNullable<typeof exact.fit>;
  for (const member of SAME) expect(b[member], member).toEqual(e[member]);
  const shares = new Map(e.coverage.map((c) => [c.cap, c.share]));
  for (const c of b.coverage) expect(c.share, `coverage at ${c.cap}`).toBe(shares.get(c.cap));
  if (bounded.passes === 1) {
    expect(b).toEqual({ ...e, createdAt: b.createdAt });
  } else {
    expect(b.typesEstimated).toBe(true);
    // HyperLogLog with 2^14 registers (Flajolet et al. 2007): standard error 0.8 %; small counts are exact-ish (linear counting).
    expect(Math.abs(b.types - e.types) / e.types).toBeLessThan(0.05);
  }
  // The filter of every token of the corpus: never "not seen" for one of them; bit for bit the filter
  // of the distinct tokens sized for `types` (pass 1 adds a token only when first met: the same bits).
  expect(b.seen).not.toBeNull();
  const seen = SeenTokens.parse(b.seen as NonNullable<typeof b.seen>);
  for (const d of docs) for (const t of d.split(' ')) expect(seen.has(t), t).toBe(true);
  const distinct = new Set(docs.flatMap((d) => d.split(' ')));
  expect(b.seen).toEqual(SeenTokens.of(distinct, b.types)?.toJSON());
  if (bounded.passes === 2) {
    // The estimate of every distinct token added once (HyperLogLog keeps a maximum: repeats change nothing),
    // or the counters in use when more: never fewer than them.
    const estimate = new DistinctEstimate();
    const out = new Int32Array(3);
    for (const t of distinct) {
      spanHashes(t, 0, t.length, false, out);
      estimate.add(out[1] as number, out[2] as number);
    }
    if (estimate.estimate() >= bounded.capacity) expect(b.types).toBe(estimate.estimate());
    else expect(b.types).toBeGreaterThanOrEqual(estimate.estimate());
  }
}

describe('boundedTally', () => {
  it('gives the lexicon of an exact tally whenever it proves the top cap, else names a limit that does (property)', async () => {
    let proven = 0;
    let twoPasses = 0;
    let refused = 0;
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 1, max: 2 ** 31 }), fc.integer({ min: 5, max: 40 }), fc.integer({ min: 1, max: 3 }), fc.integer({ min: 40, max: 400 }), async (seed, cap, minCount, counters) => {
        const docs = zipfDocuments(seed, 300, 400);
        try {
          const bounded = await boundedTally(() => docs, rules, { cap, minCount, memoryLimitMiB: 32, plan: smallPlan(counters) });
          expectLikeExact(bounded, docs, cap, minCount);
          proven += 1;
          if (bounded.passes === 2) twoPasses += 1;
        } catch (e) {
          // Refusing is allowed; silently giving another lexicon is not. The limit it names must do.
          expect((e as { code?: string }).code).toBe('MEMORY_LIMIT');
          refused += 1;
          const named = Number(/try --memory-limit (\d+)$/.exec((e as Error).message)?.[1]);
          expectLikeExact(await boundedTally(() => docs, rules, { cap, minCount, memoryLimitMiB: named }), docs, cap, minCount);
        }
      }),
      { numRuns: 40 },
    );
    // The check must mostly succeed here, not refuse its way out, and take the second pass often.
    expect(proven).toBeGreaterThan(10);
    expect(twoPasses).toBeGreaterThan(5);
    expect(refused).toBeGreaterThan(0);
  });

  it('gives the lexicon of an exact tally on corpora of many tied counts, or names a limit that does (property)', async () => {
    let twoPasses = 0;
    let refused = 0;
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 1, max: 2 ** 31 }), fc.integer({ min: 2, max: 9 }), fc.integer({ min: 3, max: 60 }), fc.integer({ min: 1, max: 100 }), fc.integer({ min: 20, max: 300 }), async (seed, groups, perGroup, cap, counters) => {
        const docs = tiedDocuments(seed, groups, perGroup);
        try {
          const bounded = await boundedTally(() => docs, rules, { cap, minCount: 1, memoryLimitMiB: 32, plan: smallPlan(counters) });
          expectLikeExact(bounded, docs, cap, 1);
          if (bounded.passes === 2) twoPasses += 1;
        } catch (e) {
          expect((e as { code?: string }).code).toBe('MEMORY_LIMIT');
          refused += 1;
          const named = Number(/try --memory-limit (\d+)$/.exec((e as Error).message)?.[1]);
          expectLikeExact(await boundedTally(() => docs, rules, { cap, minCount: 1, memoryLimitMiB: named }), docs, cap, 1);
        }
      }),
      { numRuns: 40 },
    );
    expect(twoPasses).toBeGreaterThan(5);
    expect(refused).toBeGreaterThan(0);
  });

  it('proves a small cap on a skewed corpus with few counters, in two passes', async () => {
    const docs = zipfDocuments(7, 500, 2000);
    const bounded = await boundedTally(() => docs, rules, { cap: 10, minCount: 1, memoryLimitMiB: 32, plan: smallPlan(200) });
    expect([bounded.capacity, bounded.passes]).toEqual([200, 2]);
    expectLikeExact(bounded, docs, 10, 1);
  });

  it('counts in one pass, exactly, when every distinct token has a counter', async () => {
    const docs = zipfDocuments(7, 500, 2000);
    const bounded = await boundedTally(() => docs, rules, { cap: 10, minCount: 1, memoryLimitMiB: 32 });
    expect([bounded.passes, bounded.floor, bounded.measured.typesEstimated]).toEqual([1, 0, false]);
    expectLikeExact(bounded, docs, 10, 1);
  });

  it('counts reserved tokens exactly and keeps them out of the ranking', async () => {
    const docs = zipfDocuments(3, 400, 3000).map((d, i) => (i % 3 === 0 ? `${d} zzz` : d));
    const exact = freeze(Tally.fromTexts(docs, rules), { cap: 8, reserved: ['zzz', 'never'] });
    const bounded = await boundedTally(() => docs, rules, { cap: 8, minCount: 1, reserved: ['zzz', 'never'], memoryLimitMiB: 32, plan: smallPlan(150) });
    expect(bounded.passes).toBe(2);
    const lexicon = freeze(bounded.tally, { cap: 8, reserved: ['zzz', 'never'], measured: bounded.measured });
    expect(lexicon.fingerprint).toBe(exact.fingerprint);
    expect(lexicon.fit?.oovTokens).toBe(exact.fit?.oovTokens);
  });

  it('keeps only reserved tokens with a cap of 0, whatever the counters', async () => {
    const docs = zipfDocuments(5, 300, 3000);
    const exact = freeze(Tally.fromTexts(docs, rules), { cap: 0, reserved: ['<s>'] });
    const bounded = await boundedTally(() => docs, rules, { cap: 0, minCount: 1, reserved: ['<s>'], memoryLimitMiB: 32, plan: smallPlan(10) });
    expect(freeze(bounded.tally, { cap: 0, reserved: ['<s>'], measured: bounded.measured }).fingerprint).toBe(exact.fingerprint);
  });

  it('refuses, naming a limit, when the counters are too few', async () => {
    const docs = zipfDocuments(3, 200, 5000);
    const e = await caughtError(() => boundedTally(() => docs, rules, { cap: 500, minCount: 1, memoryLimitMiB: 40, plan: smallPlan(20) }));
    expect(e.message).toMatch(
      /^--memory-limit 40 holds 20 counters, too few to prove the top 500 tokens exact on this corpus: the last of them occurs (at least )?(once|[\d,]+ times), but a token not followed may have occurred up to (once|[\d,]+ times); about [\d,]+ counters would do; the lexicon, of up to 500 tokens, may take about [\d.]+ MiB while it is made, more than the [\d.]+ MiB --memory-limit 40 leaves for it; try --memory-limit \d+$/,
    );
  });

  it('refuses a document with an uncut run longer than the limit allows, and names a limit that takes it', async () => {
    const docs = ['a b c', `d ${'x'.repeat(30000)} e`, 'a b'];
    const plan = { ...memoryPlan(32, 10), runBytes: 100_000 };
    const e = await caughtError(() => boundedTally(() => docs, rules, { cap: 10, minCount: 1, memoryLimitMiB: 32, plan }));
    expect(e.message).toMatch(/^document 2 holds text with no white space to cut it at that takes about 3.44 MiB to tokenize, more than the 98 KiB --memory-limit 32 allows; try --memory-limit \d+$/);
    const named = Number(/(\d+)$/.exec(e.message)?.[1]);
    expectLikeExact(await boundedTally(() => docs, rules, { cap: 10, minCount: 1, memoryLimitMiB: named }), docs, 10, 1);
  });

  it('refuses more labels than the limit keeps, and names a limit that keeps them', async () => {
    const docs = Array.from({ length: 3000 }, (_, i) => ({ text: `w${letters(i % 50)} common`, label: `label-${i}` }));
    const plan = { ...memoryPlan(32, 10), labelBytes: 10_000 };
    const e = await caughtError(() => boundedTally(() => docs, rules, { cap: 10, minCount: 1, memoryLimitMiB: 32, plan }));
    expect(e.message).toMatch(/^the corpus has more labels than the 10 KiB --memory-limit 32 keeps for them; try --memory-limit \d+$/);
    const named = Number(/(\d+)$/.exec(e.message)?.[1]);
    const bounded = await boundedTally(() => docs, rules, { cap: 10, minCount: 1, memoryLimitMiB: named });
    expect(bounded.tally.labels.size).toBe(3000);
  });

  it('refuses when the corpus changes between its two passes', async () => {
    let opened = 0;
    const e = await caughtError(() =>
      boundedTally(() => (++opened === 1 ? zipfDocuments(1, 200, 3000) : zipfDocuments(1, 199, 3000)), rules, { cap: 5, minCount: 1, memoryLimitMiB: 32, plan: smallPlan(50) }),
    );
    expect(e.message).toMatch(/^the corpus changed while it was counted: the first pass read 200 documents and 2,400 tokens, the second 199 and 2,388; count it again once nothing writes to it$/);
  });
});
