import { isUtf8 } from 'node:buffer';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { firstInvalidUtf8 } from '../../src/artifact/firstInvalidUtf8.js';

const bytes = (...b: number[]) => Uint8Array.from(b);

describe('firstInvalidUtf8', () => {
  // Well-formed sequences and their limits: Unicode Standard §3.9, Table 3-7 (from memory).
  it.each([
    ['ASCII', bytes(0x61, 0x62, 0x7f)],
    ['U+00E9', bytes(0xc3, 0xa9)],
    ['U+0800, the smallest 3-byte form', bytes(0xe0, 0xa0, 0x80)],
    ['U+20AC', bytes(0xe2, 0x82, 0xac)],
    ['U+D7FF, just below the surrogates', bytes(0xed, 0x9f, 0xbf)],
    ['U+E000, just above the surrogates', bytes(0xee, 0x80, 0x80)],
    ['U+10000, the smallest 4-byte form', bytes(0xf0, 0x90, 0x80, 0x80)],
    ['U+1D11E', bytes(0xf0, 0x9d, 0x84, 0x9e)],
    ['U+10FFFF, the last code point', bytes(0xf4, 0x8f, 0xbf, 0xbf)],
    ['nothing', bytes()],
  ])('%s is well-formed', (_, b) => {
    expect(firstInvalidUtf8(b)).toBe(-1);
  });

  it.each([
    ['a lone continuation byte', bytes(0x61, 0x80), 1],
    ['an overlong 2-byte form (C0 AF)', bytes(0xc0, 0xaf), 0],
    ['C1', bytes(0xc1, 0xbf), 0],
    ['an overlong 3-byte form (E0 80 80)', bytes(0xe0, 0x80, 0x80), 0],
    ['a surrogate (ED A0 80 = U+D800)', bytes(0xed, 0xa0, 0x80), 0],
    ['above U+10FFFF (F4 90 80 80)', bytes(0xf4, 0x90, 0x80, 0x80), 0],
    ['F5, never a lead byte', bytes(0x41, 0xf5, 0x80, 0x80, 0x80), 1],
    ['FF', bytes(0xff), 0],
    ['a sequence cut off by the end', bytes(0x61, 0x62, 0xe2, 0x82), 2],
    ['a sequence cut off by ASCII', bytes(0xe2, 0x82, 0x41), 0],
    ['a 4-byte sequence cut off after 3', bytes(0xf0, 0x9d, 0x84, 0x0a), 0],
  ])('%s is found at its first byte', (_, b, at) => {
    expect(firstInvalidUtf8(b)).toBe(at);
  });

  it('looks only inside [start, end)', () => {
    const b = bytes(0xff, 0x61, 0xe2, 0x82, 0xac, 0xff);
    expect(firstInvalidUtf8(b, 1, 5)).toBe(-1);
    expect(firstInvalidUtf8(b, 1, 4)).toBe(2); // the euro sign cut by the end of the range
  });

  // Reference: the WHATWG Encoding Standard's UTF-8 decoder (Node's TextDecoder) replaces each
  // maximal ill-formed subpart with one U+FFFD, so the first bad byte is where its output first has
  // U+FFFD; and Node's isUtf8 (simdutf) must agree on validity.
  const edgeBytes = fc.oneof(
    fc.integer({ min: 0, max: 255 }),
    fc.constantFrom(0x00, 0x0a, 0x41, 0x7f, 0x80, 0x8f, 0x90, 0x9f, 0xa0, 0xbf, 0xc0, 0xc2, 0xdf, 0xe0, 0xe1, 0xed, 0xee, 0xef, 0xf0, 0xf4, 0xf5, 0xff),
  );
  const input = fc.oneof(
    fc.array(edgeBytes, { maxLength: 24 }).map((a) => Uint8Array.from(a)),
    fc
      .tuple(fc.string({ unit: 'grapheme', maxLength: 12 }), fc.nat(40), fc.integer({ min: 0, max: 255 }))
      .map(([s, at, b]) => {
        const encoded = Buffer.from(s, 'utf8');
        if (encoded.length > 0) encoded[at % encoded.length] = b;
        return new Uint8Array(encoded);
      }),
  );
  it('agrees with the WHATWG decoder and isUtf8 on any bytes', () => {
    const decoder = new TextDecoder('utf-8', { ignoreBOM: true });
    fc.assert(
      fc.property(input, (b) => {
        const decoded = decoder.decode(b);
        const genuine = Buffer.from(b).includes(Buffer.from([0xef, 0xbf, 0xbd]));
        fc.pre(!genuine); // a U+FFFD already in the input would blur the reference
        const firstReplacement = decoded.indexOf('\uFFFD');
        const expected = firstReplacement === -1 ? -1 : Buffer.byteLength(decoded.slice(0, firstReplacement), 'utf8');
        expect(firstInvalidUtf8(b)).toBe(expected);
        expect(isUtf8(b)).toBe(expected === -1);
      }),
      { numRuns: 3000 },
    );
  });
});
