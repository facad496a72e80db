import { Lexicon } from '../../lexicon/Lexicon.js';
import type { Tally } from '../../tally/Tally.js';

/** What {@link rankingLexicon} puts in place of a fingerprint: the lexicon is never written or compared. */
export const RANKING_FINGERPRINT = 'ranking:not-a-lexicon';

/**
 * Every token of a tally counted at least `minCount` times, in the order `freeze` ranks them (count
 * descending, then JavaScript string order), as a lexicon with the rules and layout of `like` (a
 * lexicon frozen from the same tally, without reserved tokens): its ids give each token's rank. Made
 * with one sort of token numbers and no fit record, fingerprint or canaries, which freeze would spend
 * time on for every token.
 * @example rankingLexicon(tally, 1, lexicon).encoding.tokens.length // tally.types
 */
export function rankingLexicon(tally: Tally, minCount: number, like: Lexicon): Lexicon {
  const tokens = [...tally.tokenList()];
  const counts = tally.countList();
  const kept: number[] = [];
  for (let i = 0; i < tokens.length; i++) if ((counts[i] as number) >= minCount && (counts[i] as number) > 0) kept.push(i);
  kept.sort((a, b) => {
    const difference = (counts[b] as number) - (counts[a] as number);
    if (difference !== 0) return difference;
    const x = tokens[a] as string;
    const y = tokens[b] as string;
    return x < y ? -1 : x > y ? 1 : 0;
  });
  const encoding = { ...like.encoding, tokens: kept.map((i) => tokens[i] as string) };
  return new Lexicon(encoding, null, [], RANKING_FINGERPRINT);
}
