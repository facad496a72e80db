/**
 * Characters a terminal shows as nothing or as something else: controls, format characters (zero-width
 * joiners, bidirectional marks, U+FEFF), separators other than the space, private-use and unassigned
 * code points.
 */
const HIDDEN = /[\p{Cc}\p{Cf}\p{Co}\p{Cn}\p{Zl}\p{Zp}]|(?! )\p{Zs}/gu;

/**
 * A token (or text) as a JSON string literal with every character that would not show escaped as
 * `\uXXXX`, and a combining mark at the start too (it would sit on the quote), so two tokens that look
 * alike never print alike: `"a\u200bb"`, `"\u0301"`, `" "`.
 * @example visibleToken('late\u00a0ferry') // '"late\\u00a0ferry"'
 */
export function visibleToken(token: string): string {
  const escape = (c: string) => [...c].map((ch) => escapeUnits(ch)).join('');
  const quoted = JSON.stringify(token).replace(HIDDEN, escape);
  return quoted.replace(/^"(\p{M})/u, (_, mark: string) => `"${escape(mark)}`);
}

/** `\uXXXX` for each UTF-16 code unit of a character (a pair for one above U+FFFF, as JSON writes it). */
function escapeUnits(ch: string): string {
  let out = '';
  for (let i = 0; i < ch.length; i++) out += `\\u${ch.charCodeAt(i).toString(16).padStart(4, '0')}`;
  return out;
}
