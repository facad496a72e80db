import type { TextRules } from './TextRules.js';
import { wellFormed } from './wellFormed.js';

/**
 * Applies the text rules that come before tokenizing (encoding contract, rule 1): lone surrogates
 * become U+FFFD (see {@link wellFormed}), then Unicode normalization, then locale-free lower-casing.
 * @example normalize('ﬁne Å', { unicode: 'NFKC', case: 'lower' }) // 'fine å'
 */
export function normalize(text: string, rules: Pick<TextRules, 'unicode' | 'case'>): string {
  const whole = wellFormed(text);
  const normal = rules.unicode === 'none' ? whole : whole.normalize(rules.unicode);
  return rules.case === 'lower' ? normal.toLowerCase() : normal;
}
