/** The most code points a page shows of one token (of its lists: top OOV tokens, count bands, drift). */
export const SHOWN_TOKEN_MOST = 80;

/**
 * A token as a page lists it: whole up to {@link SHOWN_TOKEN_MOST} code points, else its first code
 * points, `…` and its length, within that bound, so a corpus of very long tokens (pasted data,
 * base64) keeps the page within its size bound. Cuts between code points, never inside a pair.
 * @example shownToken('ferry') // 'ferry'
 */
export function shownToken(token: string): string {
  // A string of at most SHOWN_TOKEN_MOST code units has at most that many code points.
  if (token.length <= SHOWN_TOKEN_MOST) return token;
  const points = [...token];
  if (points.length <= SHOWN_TOKEN_MOST) return token;
  const tail = `… (${points.length.toLocaleString('en-US')} characters)`;
  // The tail is ASCII past its first character, so its length in code units is its length in code points.
  return `${points.slice(0, SHOWN_TOKEN_MOST - tail.length).join('')}${tail}`;
}
