import { describe, expect, it } from 'vitest';
import { visibleToken } from '../../src/commands/visibleToken.js';

// How peek prints a token: a JSON string literal (RFC 8259 §7) in which nothing is invisible. Which
// characters are controls (Cc), format characters (Cf), separators (Z*) and marks (M) is Unicode's
// General_Category as JavaScript's \p{…} reads it.
describe('visibleToken', () => {
  it.each([
    ['a plain word', 'ferry', '"ferry"'],
    ['a quote and a backslash, as JSON escapes them', 'a"b\\', '"a\\"b\\\\"'],
    ['a line feed and a tab, as JSON escapes them', '\n\t', '"\\n\\t"'],
    ['one space stays a space', ' ', '" "'],
    ['a no-break space (Zs)', 'a\u00a0b', '"a\\u00a0b"'],
    ['a zero-width space (Cf)', '\u200b', '"\\u200b"'],
    ['a right-to-left mark (Cf)', 'a\u200f', '"a\\u200f"'],
    ['the byte order mark (Cf)', '\ufeff', '"\\ufeff"'],
    ['a C1 control (Cc), which JSON leaves alone', '\u0085', '"\\u0085"'],
    ['the line separator (Zl)', '\u2028', '"\\u2028"'],
    ['a private-use character (Co)', '\ue000', '"\\ue000"'],
    ['an unassigned code point (Cn) above U+FFFF, as its surrogate pair', '\u{e0080}', '"\\udb40\\udc80"'],
    ['a lone surrogate, as JSON escapes it', '\ud800', '"\\ud800"'],
    ['a combining mark with nothing before it', '\u0301', '"\\u0301"'],
    ['a combining mark after a letter stays', 'e\u0301', '"e\u0301"'],
    ['letters of any script and emoji stay', 'Лодка 東 🎉', '"Лодка 東 🎉"'],
  ])('%s', (_what, token, shown) => {
    expect(visibleToken(token)).toBe(shown);
  });
});
