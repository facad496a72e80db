import { LexlockError } from '../../LexlockError.js';
import type { Lexicon } from '../../lexicon/Lexicon.js';
import type { TopOverlap } from './LexiconComparison.js';

/** The K values `compareLexicons` reports when none are asked for (those the lexicons reach). */
export const DEFAULT_TOPS: readonly number[] = [100, 1000, 5000, 20000];

/** A lexicon's ranked tokens: its token list without the reserved tokens that lead it. */
function ranked(lexicon: Lexicon): readonly string[] {
  return lexicon.encoding.tokens.slice(lexicon.encoding.layout.reserved);
}

/**
 * The K values to report: `tops` checked, sorted and deduplicated; by default the
 * {@link DEFAULT_TOPS} below the smaller ranked vocabulary, plus that vocabulary's size itself.
 * Throws `BAD_OPTION` for a K that is not a whole number of at least 1.
 */
export function topsFor(a: Lexicon, b: Lexicon, tops?: readonly number[]): number[] {
  if (tops !== undefined) {
    for (const k of tops) {
      if (!Number.isSafeInteger(k) || k < 1) {
        throw new LexlockError('BAD_OPTION', `tops: ${String(k)} is not a whole number of at least 1`, { field: 'tops' });
      }
    }
    return [...new Set(tops)].sort((x, y) => x - y);
  }
  const smaller = Math.min(ranked(a).length, ranked(b).length);
  const out = DEFAULT_TOPS.filter((k) => k < smaller);
  if (smaller > 0) out.push(smaller);
  return out;
}

/**
 * For each K: how many tokens the first K ranked tokens of `a` and of `b` have in common, and
 * `share = shared / K`. A lexicon with fewer than K ranked tokens contributes all of them, so then
 * `share` stays below 1 even for equal vocabularies.
 * @example topOverlap(a, b, [100]) // [{ k: 100, shared: 93, share: 0.93 }]
 */
export function topOverlap(a: Lexicon, b: Lexicon, tops?: readonly number[]): TopOverlap[] {
  const rankInA = new Map<string, number>();
  ranked(a).forEach((token, i) => rankInA.set(token, i));
  const rankedB = ranked(b);
  return topsFor(a, b, tops).map((k) => {
    let shared = 0;
    const end = Math.min(k, rankedB.length);
    for (let i = 0; i < end; i++) {
      const rank = rankInA.get(rankedB[i] as string);
      if (rank !== undefined && rank < k) shared += 1;
    }
    return { k, shared, share: shared / k };
  });
}
