import { placeholderOf, type TextRules, type TokenType } from '../TextRules.js';
import { splitAlien } from '../splitAlien.js';

/**
 * Turns wink-tokenizer's value/tag pairs (`raw[i]` a value, `raw[i + 1]` its tag) into the word level's
 * tokens (encoding contract, rule 2): empty values dropped, `drop` and `collapse` applied by tag,
 * alien tokens split again. Appends the pairs in `[from, to)` to `out` and returns it.
 */
export function finishTokens(
  raw: readonly string[],
  rules: Pick<TextRules, 'drop' | 'collapse'>,
  out: string[],
  from = 0,
  to: number = raw.length,
): string[] {
  if (rules.drop.length === 0 && rules.collapse.length === 0) {
    for (let i = from; i < to; i += 2) {
      const value = raw[i] as string;
      if (value === '') continue;
      if (raw[i + 1] === 'alien') splitAlien(value, out);
      else out.push(value);
    }
    return out;
  }
  const drop = rules.drop.length > 0 ? new Set<string>(rules.drop) : null;
  const collapse = rules.collapse.length > 0 ? new Set<string>(rules.collapse) : null;
  for (let i = from; i < to; i += 2) {
    const value = raw[i] as string;
    const tag = raw[i + 1] as string;
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
