import { keepPrepared } from './scanTokens.js';
import type { TextRules } from './TextRules.js';
import { TokenScan } from './TokenScan.js';
import { TokenSpans } from './TokenSpans.js';

/** Tokenizing a text ahead of its use, a step at a time (see {@link prepareTokens}). */
export interface PreparedTokens {
  /** Goes on for about `budget` units of work; true once done, and the tokens are kept for scanTokens. */
  step(budget: number): boolean;
}

/**
 * Starts tokenizing `text` under `rules` ahead of its use, in steps a caller runs with pauses between
 * them (src/pipeline gives the event loop a turn, so a signal is seen during a document that takes
 * seconds). Once `step` returns true, the tokens are kept (see keepPrepared) and the next
 * {@link scanTokens} of the same text under the same rules, by `tokenize`, `Tally.add`,
 * `Lexicon.encode` or an audit, takes them instead of scanning again: the same tokens, found by the
 * same code. `strings`: made as strings as they are found (for a consumer that wants strings, such as
 * a tally), or kept as spans (for encoding).
 * @example const p = prepareTokens(text, rules, true); while (!p.step(1 << 18)) await turn(); tally.add(text);
 */
export function prepareTokens(text: string, rules: TextRules, strings: boolean): PreparedTokens {
  const spans = new TokenSpans(strings);
  const scan = new TokenScan();
  scan.begin(text, rules, spans, true);
  return {
    step(budget) {
      if (!scan.step(budget)) return false;
      keepPrepared(text, rules, spans);
      return true;
    },
  };
}
