// The character level's tokens by the plainest definition there is: one regular expression. With flag
// `u`, `\s` is ECMA-262's WhiteSpace and LineTerminator (§22.2.2.9, CharacterClassEscape; WhiteSpace is
// TAB, VT, FF, ZWNBSP U+FEFF and every code point of Unicode's Space_Separator category, which with the
// line terminators makes Unicode's White_Space property apart from U+0085 and plus U+FEFF), and `.` with
// flags `su` is any one code point, a lone surrogate included. The fast scanner shares none of this.

/** `text` (already normalized) split into code points, each run of white space one ' ' (keep) or nothing (drop). */
export function plainCharTokens(text: string, spaces: 'keep' | 'drop'): string[] {
  const out: string[] = [];
  for (const [piece] of text.matchAll(/\s+|./gsu)) {
    if (/^\s/u.test(piece)) {
      if (spaces === 'keep') out.push(' ');
    } else out.push(piece);
  }
  return out;
}
