import winkTokenizer from 'wink-tokenizer';
import { scanWordTokens } from './fast/scanWordTokens.js';
import type { TextRules } from './TextRules.js';
import { TokenSpans } from './TokenSpans.js';

// One tokenizer instance with default settings; wink keeps no state between calls that affects results.
const wink = winkTokenizer();
const spans = new TokenSpans(true);

/**
 * The word level by definition (encoding contract, rule 2), of already-normalized text: wink-tokenizer
 * on the whole text, token values in order, empty ones dropped, `drop` and `collapse` applied by tag,
 * alien tokens split again. Kept as the reference the fast path is tested and measured against; only
 * tests and the benchmark call it, since wink's time is quadratic in the length of a run without white
 * space on some texts (`a_a_a_…`: about half a second for 16 KiB), which the fast path's is not.
 */
export function plainWordTokens(text: string, rules: Pick<TextRules, 'drop' | 'collapse'>): string[] {
  spans.begin(text, false, rules);
  for (const { value, tag } of wink.tokenize(text)) spans.pair(value, tag);
  return spans.toArray();
}

/**
 * Tokens at the word level, of already-normalized text (encoding contract, rule 2); the same tokens as
 * {@link plainWordTokens}, computed by the fast path, {@link scanWordTokens} (tests/rules/fast checks
 * they are identical).
 */
export function wordTokens(text: string, rules: Pick<TextRules, 'drop' | 'collapse'>): string[] {
  spans.begin(text, false, rules);
  scanWordTokens(spans);
  return spans.toArray();
}
