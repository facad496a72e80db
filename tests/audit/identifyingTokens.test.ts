import { isIPv4 } from 'node:net';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import winkTokenizer from 'wink-tokenizer';
import { IPV4, collapseAdvice, identifyingKindOf, identifyingTokens, identifyingTokensOf, shortExample } from '../../src/audit/identifyingTokens.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { tokenize } from '../../src/rules/tokenize.js';
import { Tally } from '../../src/tally/Tally.js';

describe('identifyingKindOf', () => {
  it.each<[string, string | null]>([
    // wink-tokenizer's own tags (its email, url and mention rules).
    ['tamsin.skerrit@mail.example', 'email'],
    ['help.desk@harbour.example', 'email'],
    ['https://ferries.example.org/routes?id=7', 'url'],
    ['http://harbour.example', 'url'],
    ['@deckhand', 'mention'],
    // Host names without a scheme never reach a vocabulary as one token (wink splits them).
    ['harbour.example', null],
    // Phone-like: 7 to 15 digits (ITU-T E.164 numbers have at most 15, from memory), groups joined by - or .
    ['555-0134', 'phone'],
    ['07700900123', 'phone'],
    ['020-7946-0958', 'phone'],
    ['44-20-7946-0958', 'phone'],
    ['020.7946.0958', 'phone'],
    ['123456789012345', 'phone'],
    ['1234567890123456', null],
    ['1234567', 'phone'],
    ['1-202-555-0134', 'phone'],
    ['123456', null],
    ['12-12-2026', null],
    ['2026-12-12', null],
    ['3.14159265', null],
    ['1,200', null],
    ['14.50', null],
    // IPv4 dotted-decimal (RFC 3986, section 3.2.2).
    ['8.8.8.8', 'ip'],
    ['192.168.0.1', 'ip'],
    ['10.0.0.256', null],
    // Ordinary tokens.
    ['ferry', null],
    ['42nd', null],
    ['10:45pm', null],
    ['<email>', null],
    ['', null],
  ])('%j is %s', (token, kind) => {
    expect(identifyingKindOf(token)).toBe(kind);
  });

  // identifyingKindOf decides tokens of digits, points and hyphens without wink: every one it calls an
  // IP or phone-like must be one token that wink-tokenizer itself tags `number`.
  it('calls a token an IP or phone-like only where wink-tokenizer tags it one number (property)', () => {
    const wink = winkTokenizer();
    const token = fc.array(fc.constantFrom('0', '1', '5', '9', '.', '-'), { minLength: 1, maxLength: 20 }).map((a) => a.join(''));
    const groups = fc.array(fc.stringMatching(/^\d{1,4}$/), { minLength: 1, maxLength: 5 }).chain((g) => fc.constantFrom('.', '-').map((sep) => g.join(sep)));
    let found = 0;
    fc.assert(
      fc.property(fc.oneof(token, groups), (t) => {
        const kind = identifyingKindOf(t);
        if (kind === null) return;
        found += 1;
        expect(wink.tokenize(t).map((w) => [w.value, w.tag])).toEqual([[t, 'number']]);
      }),
      { numRuns: 3000 },
    );
    expect(found).toBeGreaterThan(100);
  });

  // Reference: Node's own net.isIPv4 (a general-purpose library outside the project).
  it('reads dotted quads exactly as node:net isIPv4 does (property)', () => {
    const part = fc.oneof(fc.integer({ min: 0, max: 300 }).map(String), fc.constantFrom('00', '01', '010', '255', '256', ''));
    fc.assert(
      fc.property(fc.array(part, { minLength: 1, maxLength: 5 }), (parts) => {
        const s = parts.join('.');
        expect(IPV4.test(s)).toBe(isIPv4(s));
      }),
      { numRuns: 2000 },
    );
  });

  // Why no IPv6 pattern: the word level never keeps an IPv6 literal as one token.
  it.each(['2001:db8::8a2e:370:7334', 'fe80::1', '::1'])('the word level splits the IPv6 literal %s', (address) => {
    expect(tokenize(address, resolveRules()).length).toBeGreaterThan(1);
  });
});

describe('shortExample', () => {
  it.each<[string, Parameters<typeof shortExample>[1], string]>([
    ['tamsin.skerrit@mail.example', 'email', 'ta…@mail.example'],
    ['t@x.example', 'email', 't…@x.example'],
    ['ab@a-very-long-host-name-for-a-ferry.example', 'email', 'ab…@a-very-long-host-name-f…'],
    ['555-0134', 'phone', '555-01…'],
    ['192.168.0.1', 'ip', '192.168.…'],
    ['https://ferries.example.org/routes?id=7', 'url', 'ferries.example.org/routes?…'],
    ['@deckhand', 'mention', '@deckhand'],
  ])('%s (%s) is shown as %s', (token, kind, shown) => {
    expect(shortExample(token, kind)).toBe(shown);
  });
});

describe('identifyingTokens of a lexicon', () => {
  const texts = [
    'mail tamsin.skerrit@mail.example or call 555-0134, see https://ferries.example.org/t',
    'mail tamsin.skerrit@mail.example again; server 192.168.0.1 and @deckhand',
    'ask o.hale@port.example about the 12-12-2026 crossing',
  ];

  it('counts each kind, most frequent first in the examples, reserved tokens left out', () => {
    const lexicon = freeze(Tally.fromTexts(texts, resolveRules()), { reserved: ['x@reserved.example'] });
    expect(identifyingTokensOf(lexicon)).toEqual({
      tokens: 6,
      email: { tokens: 2, examples: ['ta…@mail.example', 'o.…@port.example'] },
      url: { tokens: 1, examples: ['ferries.example.org/t'] },
      mention: { tokens: 1, examples: ['@deckhand'] },
      phone: { tokens: 1, examples: ['555-01…'] },
      ip: { tokens: 1, examples: ['192.168.…'] },
    });
    expect(collapseAdvice(identifyingTokensOf(lexicon))).toBe('email,url,mention,number');
  });

  it('finds none once they are collapsed, nor at the character level', () => {
    const collapsed = freeze(Tally.fromTexts(texts, resolveRules({ collapse: ['email', 'mention', 'number', 'url'] })));
    expect(collapsed.encoding.tokens).toContain('<email>');
    expect(identifyingTokensOf(collapsed).tokens).toBe(0);
    expect(identifyingTokensOf(freeze(Tally.fromTexts(texts, resolveRules({ level: 'char' })))).tokens).toBe(0);
  });

  it('keeps at most 3 examples of a kind', () => {
    const found = identifyingTokens(['a1@x.example', 'b2@x.example', 'c3@x.example', 'd4@x.example']);
    expect(found.email).toEqual({ tokens: 4, examples: ['a1…@x.example', 'b2…@x.example', 'c3…@x.example'] });
    expect(collapseAdvice(found)).toBe('email');
  });
});
