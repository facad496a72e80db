import { Lexicon } from '../../lexicon/Lexicon.js';
import type { Tally } from '../../tally/Tally.js';

/** What {@link rankingLexicon} puts in place of a fingerprint: the lexicon is never written or compared. */
export const RANKING_FINGERPRINT = 'ranking:not-a-lexicon';

/**
 * Every token of a tally counted at least `minCount` times, in the order `freeze` ranks them (count
 * descending, then JavaScript string order), as a lexicon with the rules and layout of `like` (a
 * lexicon frozen from the same tally, without reserved tokens): its ids give each token's rank. The
 * tokens are grouped by count and each group sorted by the built-in string sort (UTF-16 code units,
 * the order `<` gives), with no fit record, fingerprint or canaries, which freeze would spend time on
 * for every token.
 * @example rankingLexicon(tally, 1, lexicon).encoding.tokens.length // tally.types
 */
export function rankingLexicon(tally: Tally, minCount: number, like: Lexicon): Lexicon {
  const counts = tally.countList();
  const groups = new Map<number, string[]>();
  let i = 0;
  for (const token of tally.tokenList()) {
    const count = counts[i++] as number;
    if (count < minCount || count === 0) continue;
    const group = groups.get(count);
    if (group === undefined) groups.set(count, [token]);
    else group.push(token);
  }
  const tokens: string[] = [];
  for (const count of [...groups.keys()].sort((a, b) => b - a)) {
    const group = (groups.get(count) as string[]).sort();
    for (const token of group) tokens.push(token);
  }
  return new Lexicon({ ...like.encoding, tokens }, null, [], RANKING_FINGERPRINT);
}
