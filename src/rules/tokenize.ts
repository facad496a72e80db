import { charTokens } from './charTokens.js';
import { normalize } from './normalize.js';
import type { TextRules } from './TextRules.js';
import { wordTokens } from './wordTokens.js';

/**
 * Turns one text into its tokens under the given rules: normalize, lower-case, tokenize.
 * This is the only path from text to tokens: tally, encode, canaries and audits all call it.
 * @example tokenize("Can't wait!", resolveRules()) // ['ca', "n't", 'wait', '!']
 */
export function tokenize(text: string, rules: TextRules): string[] {
  const normal = normalize(text, rules);
  return rules.level === 'char' ? charTokens(normal) : wordTokens(normal, rules);
}
