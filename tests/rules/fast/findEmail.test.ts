// findEmail checked against wink-tokenizer's own e-mail pattern (WINK_PATTERNS.email, the literal of
// wink's rgxEmail): the same matches, in the same places, on every text below.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DOMAIN, domainEnd, findEmail } from '../../../src/rules/fast/findEmail.js';
import type { Found } from '../../../src/rules/fast/Finder.js';
import { WINK_PATTERNS } from '../../../src/rules/fast/winkPatterns.js';
import { matchesOf, orRangeError, patternMatches } from './matches.js';

const PARTS = ['a', 'Z', 'b', '_', '0', '9', '.', '..', '@', '-', '`', "'", '#', '!', '~', '{', '|', '+', '=', '?', '^', ':', ',', ' ', 'x.io', '.co', 'é', 'ſ', 'K', 'ы', '\u00A0'];
const text = fc.array(fc.constantFrom(...PARTS), { maxLength: 40 }).map((p) => p.join(''));

describe('findEmail', () => {
  it.each<[string, [number, number][]]>([
    ['ann@ferry.example', [[0, 17]]],
    ['a_b <ann@ferry.example>', [[5, 22]]],
    ['a..b@c.com', [[3, 10]]],
    ['`x@y.io', [[1, 7]]],
    ['x@y', []],
    ['a@b.c1', [[0, 6]]],
    ['a@b.1c', []],
    ['a@b@c.de', [[2, 8]]],
    ['a.b.c@d-e.f-g.hi,z@q.rs', [[0, 16], [17, 23]]],
  ])('%j -> %j', (input, expected) => {
    expect(patternMatches(WINK_PATTERNS.email, input)).toEqual(expected);
    expect(matchesOf(findEmail, input)).toEqual(expected);
  });

  it('finds what the pattern finds on fast-check text of local-part characters, dots, @ and domains', () => {
    fc.assert(
      fc.property(text, fc.boolean(), (t, upper) => {
        const input = upper ? t.toUpperCase() : t;
        expect(matchesOf(findEmail, input)).toEqual(patternMatches(WINK_PATTERNS.email, input));
      }),
      { numRuns: 5000 },
    );
  });

  it('finds from any start what the pattern finds from there', () => {
    fc.assert(
      fc.property(text, fc.nat(), (t, n) => {
        const from = t.length === 0 ? 0 : n % t.length;
        const found: Found = { start: -1, end: -1 };
        const pattern = new RegExp(WINK_PATTERNS.email);
        pattern.lastIndex = from;
        const m = pattern.exec(t);
        expect(findEmail(t, from, found) ? [found.start, found.end] : null).toEqual(m === null ? null : [m.index, m.index + m[0].length]);
      }),
      { numRuns: 3000 },
    );
  });

  it('matches the part after the @ as its pattern does (domainEnd against DOMAIN), from any start', () => {
    const domain = fc.array(fc.constantFrom('a', 'Z', '0', '7', '.', '-', '..', '--', '-.', '.-', '.a', '.1', '@', '_', ' '), { maxLength: 30 }).map((p) => p.join(''));
    fc.assert(
      fc.property(domain, fc.nat(), (t, n) => {
        const at = t.length === 0 ? 0 : n % t.length;
        DOMAIN.lastIndex = at;
        const m = DOMAIN.exec(t);
        expect(domainEnd(t, at)).toBe(m === null ? -1 : at + m[0].length);
      }),
      { numRuns: 5000 },
    );
  });

  it('takes an address whose domain runs for 16 million characters, where V8 (Node 20) gives up running the pattern', () => {
    const host = 'b'.repeat(16 * 1024 * 1024);
    const text = `x a@${host}.co y@${host}`;
    expect(matchesOf(findEmail, text)).toEqual([[2, 4 + host.length + 3]]);
    // Where the engine can run the pattern, it agrees.
    const viaPattern = orRangeError(() => {
      DOMAIN.lastIndex = 4;
      return DOMAIN.exec(text)?.[0].length;
    });
    if (viaPattern !== 'RangeError') expect(viaPattern).toBe(host.length + 3);
  });

  it('has local-part classes that no code unit from 128 up is in (so its table of 128 is whole)', () => {
    // The pattern's two classes, taken from its source: the first character's and the others'.
    const classes = [...WINK_PATTERNS.email.source.matchAll(/\[(?:\\.|[^\]\\])*\]/g)].slice(0, 2).map((m) => new RegExp(m[0], 'i'));
    expect(classes.map(String)).toEqual(["/[-!#$%&'*+\\/=?^\\w{|}~]/i", "/[-!#$%&'*+\\/=?^\\w`{|}~]/i"]);
    for (let c = 128; c < 0x10000; c++) {
      const ch = String.fromCharCode(c);
      if (classes.some((k) => k.test(ch))) expect.unreachable(`U+${c.toString(16)} is in a local-part class`);
    }
  });
});
