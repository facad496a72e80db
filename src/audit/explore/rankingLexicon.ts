import { Lexicon } from '../../lexicon/Lexicon.js';
import { topRanked } from '../../lexicon/topRanked.js';
import type { Tally } from '../../tally/Tally.js';

/** What {@link rankingLexicon} puts in place of a fingerprint: the lexicon is never written or compared. */
export const RANKING_FINGERPRINT = 'ranking:not-a-lexicon';

/**
 * Every token of a tally counted at least `minCount` times, in the order `freeze` ranks them (count
 * descending, then JavaScript string order: topRanked), as a lexicon with the rules and layout of
 * `like` (a lexicon frozen from the same tally, without reserved tokens): its ids give each token's
 * rank. No fit record, fingerprint or canaries, which freeze would spend time on for every token.
 * @example rankingLexicon(tally, 1, lexicon).encoding.tokens.length // tally.types
 */
export function rankingLexicon(tally: Tally, minCount: number, like: Lexicon): Lexicon {
  const ranked = topRanked((visit) => tally.forEachCount(visit), Number.POSITIVE_INFINITY, (_token, count) => count >= minCount && count > 0);
  return new Lexicon({ ...like.encoding, tokens: ranked.map(([token]) => token) }, null, [], RANKING_FINGERPRINT);
}
