// The URL and e-mail route of the fast path checked against wink-tokenizer itself (differential):
// whenever scanLinkChunk takes a chunk, its value/tag pairs must be exactly wink's on that chunk.
import fc from 'fast-check';
import winkTokenizer from 'wink-tokenizer';
import { describe, expect, it } from 'vitest';
import { scanLinkChunk } from '../../../src/rules/fast/scanLinkChunk.js';
import { SpanRecorder } from './SpanRecorder.js';

const wink = winkTokenizer();

function winkPairs(chunk: string): string[] {
  return wink.tokenize(chunk).flatMap(({ value, tag }) => [value, tag]);
}

/** The route's pairs for `chunk` placed inside other text (so bounds matter), or null if it declines. */
function linked(chunk: string): string[] | null {
  const text = `ab ${chunk} cd`;
  const out = new SpanRecorder(text);
  return scanLinkChunk(text, 3, 3 + chunk.length, out) ? out.pairs : null;
}

describe('scanLinkChunk', () => {
  it.each<[string, string[] | null]>([
    ['<ann.lee@example.net>;', ['<', 'symbol', 'ann.lee@example.net', 'email', '>', 'symbol', ';', 'punctuation']],
    ['https://www.example.org/track/957a8e?ref=739', ['https://www.example.org/track/957a8e?ref=739', 'url']],
    ['(https://example.net/help),', ['(', 'punctuation', 'https://example.net/help', 'url', ')', 'punctuation', ',', 'punctuation']],
    ['x=a.b@c.io', ['x=a.b@c.io', 'email']],
    ['a..b@c.com', ['a', 'word', '.', 'punctuation', '.', 'punctuation', 'b@c.com', 'email']],
    ['<5b2e.8801@mail.example.com>', ['<', 'symbol', '5b2e.8801@mail.example.com', 'email', '>', 'symbol']],
    ['10<a@b.co>am', ['10', 'number', '<', 'symbol', 'a@b.co', 'email', '>', 'symbol', 'am', 'word']],
    ['@deck', null],
    ['a@b.co@x', null],
    ["it's@b.co", ["it's@b.co", 'email']],
    ["don't:a@b.co", null],
    ['http://x.io:)', null],
  ])('takes %j as wink does (null: leaves it to wink)', (chunk, expected) => {
    expect(linked(chunk)).toEqual(expected);
    if (expected !== null) expect(winkPairs(chunk)).toEqual(expected);
  });

  it('reports spans of the whole text, inside parts included', () => {
    const text = 'see (https://example.net/a),x@y.io! now';
    const out = new SpanRecorder(text);
    expect(scanLinkChunk(text, 4, 35, out)).toBe(true);
    expect(out.spans.map(([from, to]) => text.slice(from, to))).toEqual(['(', 'https://example.net/a', ')', ',', 'x@y.io', '!']);
  });

  it('takes an upper-case chunk exactly as its lower-case form (both patterns ignore case)', () => {
    for (const chunk of ['<Ann.Lee@Example.NET>;', 'HTTPS://WWW.EXAMPLE.ORG/Track?Ref=7', '10<A@B.CO>AM', 'A..B@C.COM']) {
      const upper = new SpanRecorder(chunk);
      const lower = new SpanRecorder(chunk.toLowerCase());
      expect(scanLinkChunk(chunk, 0, chunk.length, upper)).toBe(scanLinkChunk(chunk.toLowerCase(), 0, chunk.length, lower));
      expect(upper.spans).toEqual(lower.spans);
      expect(upper.spans.length).toBeGreaterThan(0);
    }
  });

  // Pieces of addresses and URLs glued with no white space: a chunk as the fast path meets it.
  const PIECES = [
    'https://', 'http://', 'ftp://', 'www.', 'example', '.org', '.co.uk', '/track/', '?ref=', '#top', '=', '-', '_', '.', '..',
    '@', 'ann', 'b.lee', '9f3a', '12', '10', 'am', 'pm', '2nd', '<', '>', ';', ',', ':', ')', '(', '"', "'", '`', '+', '*', '%',
    '~', '|', '{', '}', '/', ':)', '<3', '#sun', 'é', 'Ж', '😀', '$', '€',
  ];
  it('equals wink on every chunk it takes (fast-check, glued address and URL pieces)', () => {
    let taken = 0;
    fc.assert(
      fc.property(fc.array(fc.constantFrom(...PIECES), { minLength: 1, maxLength: 12 }), (pieces) => {
        const chunk = pieces.join('');
        const got = linked(chunk);
        if (got !== null) {
          taken += 1;
          expect(got).toEqual(winkPairs(chunk));
        }
      }),
      { numRuns: 20_000 },
    );
    // The property says something only if the route took a fair share of the chunks.
    expect(taken).toBeGreaterThan(2_000);
  });
});
