const WHITE_SPACE = /\s/u;

/**
 * Character-level tokens (encoding contract, rule 2): every code point that is not white space.
 * @example charTokens('a b😀') // ['a', 'b', '😀']
 */
export function charTokens(text: string): string[] {
  const out: string[] = [];
  for (const ch of text) {
    if (!WHITE_SPACE.test(ch)) out.push(ch);
  }
  return out;
}
