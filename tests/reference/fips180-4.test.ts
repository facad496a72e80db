// sha256Hex and fingerprintOf checked against FIPS 180-4 (Secure Hash Standard) example vectors and
// against Node's own SHA-256 (node:crypto, backed by OpenSSL) as a second, general-purpose reference.
//
// Source of the digests: NIST's SHA-256 examples published with FIPS 180-4 (one-block "abc", two-block
// 448-bit message) and the long-message vectors that accompany them in NIST's and RFC 6234's test
// suites (empty string, the 896-bit message, one million "a"). All hex digests below are written
// from memory; node:crypto recomputes each of them, so a slip of memory would show as a failure there.
import canonicalizeModule from 'canonicalize';
import fc from 'fast-check';
import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { canonicalJson } from '../../src/artifact/canonicalJson.js';
import { fingerprintOf } from '../../src/artifact/fingerprint.js';
import { sha256Hex } from '../../src/artifact/sha256.js';

// `canonicalize` is CommonJS (`module.exports = serialize`) while its .d.ts declares an ES default
// export; under NodeNext the default import is module.exports itself, so it is the function.
const canonicalize = canonicalizeModule as unknown as (input: unknown) => string | undefined;

function nodeSha256(data: string | Uint8Array): string {
  return createHash('sha256').update(data).digest('hex');
}

const vectors: Array<[string, string, string]> = [
  ['"abc" (FIPS 180-4 example, one block)', 'abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
  ['"" (empty message)', '', 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'],
  [
    '448-bit message (FIPS 180-4 example, two blocks)',
    'abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq',
    '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
  ],
  [
    '896-bit message',
    'abcdefghbcdefghicdefghijdefghijkefghijklfghijklmghijklmnhijklmnoijklmnopjklmnopqklmnopqrlmnopqrsmnopqrstnopqrstu',
    'cf5b16a778af8380036ce59e7b0492370b249b11e8f07a51afac45037afee9d1',
  ],
  ['one million "a"', 'a'.repeat(1_000_000), 'cdc76e5c9914fb9281a1c7e284d73e67f1809a48a497200e046d39ccc7112cd0'],
];

describe('FIPS 180-4 SHA-256 example vectors', () => {
  it.each(vectors)('%s', (_name, message, digest) => {
    expect(sha256Hex(message)).toBe(digest);
  });

  it.each(vectors)('%s, given as bytes', (_name, message, digest) => {
    expect(sha256Hex(new TextEncoder().encode(message))).toBe(digest);
  });

  it.each(vectors)('%s, recomputed by node:crypto', (_name, message, digest) => {
    expect(nodeSha256(message)).toBe(digest);
  });

  it('gives 64 lower-case hex digits', () => {
    // FIPS 180-4 section 6.2: the digest is 256 bits; common practice writes it as lower-case hex.
    expect(sha256Hex('abc')).toMatch(/^[0-9a-f]{64}$/);
  });
});

describe('agreement with node:crypto', () => {
  it('on random strings, hashed as UTF-8 (surrogate pairs and all)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'binary', size: 'medium' }), (s) => {
        expect(sha256Hex(s)).toBe(nodeSha256(Buffer.from(s, 'utf8')));
      }),
      { numRuns: 300 },
    );
  });

  it('on random bytes, across the 55/56/64-byte padding boundaries (FIPS 180-4 section 5.1.1)', () => {
    fc.assert(
      fc.property(fc.uint8Array({ size: 'medium' }), (bytes) => {
        expect(sha256Hex(bytes)).toBe(nodeSha256(bytes));
      }),
      { numRuns: 300 },
    );
  });

  it.each([55, 56, 63, 64, 65, 119, 120, 128])('on %i bytes of 0x61, where padding changes block count', (n) => {
    expect(sha256Hex('a'.repeat(n))).toBe(nodeSha256('a'.repeat(n)));
  });
});

describe('fingerprintOf = "sha256:" + SHA-256 of the RFC 8785 canonical form', () => {
  it('on a known object: canonical text from RFC 8785 rules, digest from node:crypto', () => {
    // RFC 8785 section 3.2.3: members sorted; numbers in ES6 form.
    const value = { b: [1e30, 'x'], a: { d: null, c: true } };
    const canonical = '{"a":{"c":true,"d":null},"b":[1e+30,"x"]}';
    expect(canonicalJson(value)).toBe(canonical);
    expect(fingerprintOf(value)).toBe(`sha256:${nodeSha256(canonical)}`);
  });

  it('on the FIPS "abc" vector: the fingerprint of the JSON string "abc" hashes the 5 bytes "abc" with quotes', () => {
    // The canonical form of the string abc is `"abc"` (RFC 8785 section 3.2.2.2), not the bare letters.
    expect(fingerprintOf('abc')).toBe(`sha256:${nodeSha256('"abc"')}`);
    expect(fingerprintOf('abc')).not.toBe('sha256:ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });

  it('on random JSON, against canonicalize + node:crypto', () => {
    fc.assert(
      fc.property(fc.jsonValue({ stringUnit: 'binary', maxDepth: 3 }), (value) => {
        const reference = canonicalize(value);
        expect(reference).toBeTypeOf('string');
        expect(fingerprintOf(value)).toBe(`sha256:${nodeSha256(Buffer.from(reference as string, 'utf8'))}`);
      }),
      { numRuns: 300 },
    );
  });

  it('is the same for objects that differ only in member order', () => {
    fc.assert(
      fc.property(fc.dictionary(fc.string(), fc.integer()), (dict) => {
        const reversed = Object.fromEntries(Object.entries(dict).reverse());
        expect(fingerprintOf(reversed)).toBe(fingerprintOf(dict));
      }),
      { numRuns: 200 },
    );
  });
});
