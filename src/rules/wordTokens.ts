import winkTokenizer from 'wink-tokenizer';
import { fastWordTokens } from './fast/fastWordTokens.js';
import { finishTokens } from './fast/finishTokens.js';
import type { TextRules } from './TextRules.js';

// One tokenizer instance with default settings; wink keeps no state between calls that affects results.
const wink = winkTokenizer();

/**
 * The word level by definition (encoding contract, rule 2): wink-tokenizer on the whole text, token
 * values in order, empty ones dropped, alien tokens split again, then `drop` and `collapse` by tag.
 * Kept as the reference the fast path is tested and measured against.
 */
export function plainWordTokens(text: string, rules: Pick<TextRules, 'drop' | 'collapse'>): string[] {
  const raw: string[] = [];
  for (const { value, tag } of wink.tokenize(text)) raw.push(value, tag);
  return finishTokens(raw, rules, []);
}

/**
 * Tokens at the word level, of already-normalized text (encoding contract, rule 2); the same tokens as
 * {@link plainWordTokens}, computed by the fast path (tests/rules/fast checks they are identical).
 */
export function wordTokens(text: string, rules: Pick<TextRules, 'drop' | 'collapse'>): string[] {
  return fastWordTokens(text, rules);
}
