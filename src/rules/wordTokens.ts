import winkTokenizer from 'wink-tokenizer';
import { placeholderOf, type TextRules, type TokenType } from './TextRules.js';
import { splitAlien } from './splitAlien.js';

// One tokenizer instance with default settings; wink keeps no state between calls that affects results.
const wink = winkTokenizer();

/**
 * Tokens at the word level, of already-normalized text (encoding contract, rule 2): wink-tokenizer's token
 * values in order, empty ones dropped, alien tokens split again, then the `drop` and `collapse` options.
 */
export function wordTokens(text: string, rules: Pick<TextRules, 'drop' | 'collapse'>): string[] {
  const out: string[] = [];
  const drop = rules.drop.length > 0 ? new Set<string>(rules.drop) : null;
  const collapse = rules.collapse.length > 0 ? new Set<string>(rules.collapse) : null;
  for (const token of wink.tokenize(text)) {
    const { value, tag } = token;
    if (value === '') continue;
    if (drop !== null && drop.has(tag)) continue;
    if (collapse !== null && collapse.has(tag)) {
      out.push(placeholderOf(tag as TokenType));
      continue;
    }
    if (tag === 'alien') splitAlien(value, out);
    else out.push(value);
  }
  return out;
}
