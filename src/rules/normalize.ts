import type { TextRules } from './TextRules.js';

/**
 * Applies the text rules that come before tokenizing (encoding contract, rule 1):
 * Unicode normalization, then locale-free lower-casing.
 * @example normalize('ﬁne Å', { unicode: 'NFKC', case: 'lower' }) // 'fine å'
 */
export function normalize(text: string, rules: Pick<TextRules, 'unicode' | 'case'>): string {
  const normal = rules.unicode === 'none' ? text : text.normalize(rules.unicode);
  return rules.case === 'lower' ? normal.toLowerCase() : normal;
}
