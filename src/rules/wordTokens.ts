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
 * alien tokens split again. Kept as the reference the fast path is tested and measured against.
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
