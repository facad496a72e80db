import type { Lexicon } from '../lexicon/Lexicon.js';
import { compareLabels } from './compare/compareLabels.js';
import { compareTokens } from './compare/compareTokens.js';
import type { LexiconComparison } from './compare/LexiconComparison.js';
import { memberDifferences } from './compare/memberDifferences.js';
import { topOverlap } from './compare/topOverlap.js';

/** How many tokens `onlyInA`, `onlyInB` and `moved` list at most (their counts are complete). */
export const COMPARISON_SAMPLE = 20;

/** Options of {@link compareLexicons}. */
export interface CompareOptions {
  /**
   * The K values of `topOverlap`, each a whole number of at least 1. Default: 100, 1000, 5000 and
   * 20000 where both lexicons have more ranked tokens than that, plus the smaller one's count.
   */
  tops?: readonly number[];
}

/**
 * Puts two lexicons side by side: fingerprints, differing text rules, layout and shape, tokens only
 * in one, shared tokens with another id, top-K overlap and labels. The top-K of a lexicon is its
 * first K ranked tokens after the reserved ones; `share` is shared / K. Two lexicons with the same
 * fingerprint encode every text identically, and then nothing is reported as different.
 * @example compareLexicons(trained, rebuilt, { tops: [1000] }).moved.count // shared tokens with new ids
 */
export function compareLexicons(a: Lexicon, b: Lexicon, options: CompareOptions = {}): LexiconComparison {
  const ea = a.encoding;
  const eb = b.encoding;
  const tokens = compareTokens(a, b, COMPARISON_SAMPLE);
  return {
    sameFingerprint: a.fingerprint === b.fingerprint,
    fingerprints: { a: a.fingerprint, b: b.fingerprint },
    rules: memberDifferences(ea.rules, eb.rules, ['level', 'unicode', 'case', 'drop', 'collapse', 'spaces', 'tokenizer']),
    layout: memberDifferences(ea.layout, eb.layout, ['oov', 'reserved']),
    shape: memberDifferences(ea, eb, ['shape']).length === 0 ? null : { a: ea.shape, b: eb.shape },
    tokens: tokens.tokens,
    onlyInA: tokens.onlyInA,
    onlyInB: tokens.onlyInB,
    moved: tokens.moved,
    topOverlap: topOverlap(a, b, options.tops),
    labels: compareLabels(a, b),
  };
}
