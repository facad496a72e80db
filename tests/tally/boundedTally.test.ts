import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { BYTES_PER_COUNTER, boundedTally } from '../../src/tally/boundedTally.js';
import { Tally } from '../../src/tally/Tally.js';

const rules = resolveRules();

/** A whole number written in letters (a, b, …, z, ba, bb, …) so wink-tokenizer keeps it one word. */
function letters(n: number): string {
  let out = '';
  do {
    out = String.fromCharCode(97 + (n % 26)) + out;
    n = Math.floor(n / 26);
  } while (n > 0);
  return out;
}

/** Documents with Zipf-like word frequencies: word i appears about 1/i as often (Zipf 1949). */
function zipfDocuments(seed: number, documents: number, vocabulary: number): string[] {
  let x = seed >>> 0 || 1;
  const next = () => ((x = (Math.imul(x, 1664525) + 1013904223) >>> 0), x / 2 ** 32);
  const out: string[] = [];
  for (let d = 0; d < documents; d++) {
    const words: string[] = [];
    for (let w = 0; w < 12; w++) words.push(letters(Math.floor(vocabulary ** next())));
    out.push(words.join(' '));
  }
  return out;
}

describe('boundedTally', () => {
  it('gives the same lexicon as an exact tally whenever it proves the top cap (property)', async () => {
    let proven = 0;
    await fc.assert(
      fc.asyncProperty(fc.integer({ min: 1, max: 2 ** 31 }), fc.integer({ min: 5, max: 40 }), fc.integer({ min: 1, max: 3 }), async (seed, cap, minCount) => {
        const docs = zipfDocuments(seed, 300, 400);
        const exact = freeze(Tally.fromTexts(docs, rules), { cap, minCount });
        try {
          const bounded = await boundedTally(() => docs, rules, { cap, minCount, budgetBytes: 150 * BYTES_PER_COUNTER });
          const lexicon = freeze(bounded.tally, { cap, minCount });
          expect(lexicon.fingerprint).toBe(exact.fingerprint);
          expect(bounded.tally.documents).toBe(300);
          expect(bounded.tally.tokens).toBe(3600);
          expect(lexicon.fit?.oovTokens).toBe(exact.fit?.oovTokens);
          proven += 1;
        } catch (e) {
          // Refusing is allowed; silently giving another lexicon is not.
          expect((e as { code?: string }).code).toBe('MEMORY_LIMIT');
        }
      }),
      { numRuns: 60 },
    );
    expect(proven).toBeGreaterThan(10); // the check must mostly succeed here, not refuse its way out
  });

  it('proves a small cap on a skewed corpus with few counters', async () => {
    const docs = zipfDocuments(7, 500, 2000);
    const bounded = await boundedTally(() => docs, rules, { cap: 10, minCount: 1, budgetBytes: 200 * BYTES_PER_COUNTER });
    expect(bounded.capacity).toBe(200);
    expect(freeze(bounded.tally, { cap: 10 }).fingerprint).toBe(freeze(Tally.fromTexts(docs, rules), { cap: 10 }).fingerprint);
  });

  it('refuses, naming a budget that would do, when the counters are too few', async () => {
    const docs = zipfDocuments(3, 200, 5000);
    await expect(boundedTally(() => docs, rules, { cap: 500, minCount: 1, budgetBytes: 20 * BYTES_PER_COUNTER })).rejects.toThrow(
      /^the memory limit holds 20 counters, too few to prove the top 500 tokens exact on this corpus: the last of them occurs (once|[\d,]+ times), but a token not followed may have occurred up to (once|[\d,]+ times); about [\d,]+ counters would do: try --memory-limit \d+$/,
    );
  });
});
