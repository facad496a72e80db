import { scanTokens } from './scanTokens.js';
import type { TextRules } from './TextRules.js';
import { TokenSpans } from './TokenSpans.js';

const spans = new TokenSpans(true);

/**
 * Turns one text into its tokens under the given rules: normalize, lower-case, tokenize
 * (see {@link scanTokens}, which it makes strings of).
 * @example tokenize("Can't wait!", resolveRules()) // ['ca', "n't", 'wait', '!']
 */
export function tokenize(text: string, rules: TextRules): string[] {
  return scanTokens(text, rules, spans, false).toArray();
}
