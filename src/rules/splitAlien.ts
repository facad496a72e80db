/**
 * How a token wink-tokenizer tags `alien` is split again (encoding contract, rule 2): each Han,
 * Hiragana or Katakana character alone; a maximal run of other letters, marks and digits; any other
 * non-space character alone.
 */
export const ALIEN_SPLIT =
  /[\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}]|(?:(?![\p{sc=Han}\p{sc=Hiragana}\p{sc=Katakana}])[\p{L}\p{M}\p{N}])+|\S/gu;

/**
 * Splits one alien token into the contract's pieces, appending them to `out`.
 * @example splitAlien('東京へ行く', []) // ['東', '京', 'へ', '行', 'く']
 */
export function splitAlien(value: string, out: string[]): string[] {
  for (const m of value.matchAll(ALIEN_SPLIT)) out.push(m[0]);
  return out;
}
