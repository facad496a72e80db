import { describe, expect, it } from 'vitest';
import { SHOWN_TOKEN_MOST, shownToken } from '../../../src/audit/report/shownToken.js';

// A page shows each token of its lists (top OOV tokens, count bands, drift) whole up to a bound, so a
// corpus of very long tokens (pasted data, base64) cannot push the page past its size bound.
describe('shownToken', () => {
  it.each([
    ['ferry', 'ferry'],
    ['a'.repeat(SHOWN_TOKEN_MOST), 'a'.repeat(SHOWN_TOKEN_MOST)],
    // The head takes what the tail leaves of the bound: 80 - 17 and 80 - 22 code points.
    ['a'.repeat(SHOWN_TOKEN_MOST + 1), `${'a'.repeat(63)}… (81 characters)`],
    ['b'.repeat(200_000), `${'b'.repeat(58)}… (200,000 characters)`],
  ])('%#: shows a token within the bound', (token, shown) => {
    expect(shownToken(token)).toBe(shown);
  });

  it('counts and cuts by code point, never half a surrogate pair', () => {
    const token = '😀'.repeat(SHOWN_TOKEN_MOST + 5);
    expect(shownToken('😀'.repeat(SHOWN_TOKEN_MOST))).toBe('😀'.repeat(SHOWN_TOKEN_MOST));
    expect(shownToken(token)).toBe(`${'😀'.repeat(63)}… (85 characters)`);
  });

  it('is never longer than the bound in code points', () => {
    for (let n = 0; n < 3 * SHOWN_TOKEN_MOST; n += 7) expect([...shownToken('x'.repeat(n) + 'é'.repeat(n))].length).toBeLessThanOrEqual(SHOWN_TOKEN_MOST);
  });
});
