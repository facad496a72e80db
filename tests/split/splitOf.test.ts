// Stable splits (issue 14, point 3): a document's split depends on a hash of its key and a seed only.
// Outside checks: the hash is SHA-256 (FIPS 180-4), checked against its published example vectors and
// against Node's own SHA-256 (node:crypto, OpenSSL) as a general-purpose reference; the shares are
// checked against the binomial bound |k - np| <= 4 sqrt(np(1 - p)) (four standard deviations of the
// binomial count k of n draws with probability p: the normal approximation, common practice). With
// a fixed seed every assignment is fixed, so these checks cannot be flaky: they pass or fail for good.
import { createHash } from 'node:crypto';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { sha256Bytes } from '../../src/artifact/sha256.js';
import { checkSplits } from '../../src/split/checkSplits.js';
import { parseSplits } from '../../src/split/parseSplits.js';
import { DEFAULT_SEED, type Split } from '../../src/split/Split.js';
import { splitChooser, splitOf, splitPoint } from '../../src/split/splitOf.js';
import { caughtError } from '../helpers/caughtError.js';

const hex = (bytes: Uint8Array) => Buffer.from(bytes).toString('hex');
const THREE: Split[] = [
  { name: 'train', share: 0.8 },
  { name: 'valid', share: 0.1 },
  { name: 'test', share: 0.1 },
];

/** The binomial bound named above: is k within 4 standard deviations of n p? */
function withinBinomial(k: number, n: number, p: number): boolean {
  return Math.abs(k - n * p) <= 4 * Math.sqrt(n * p * (1 - p));
}

describe('the hash: SHA-256', () => {
  // Digests of NIST's FIPS 180-4 examples (written from memory; node:crypto recomputes them below).
  it.each([
    ['abc', 'ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad'],
    ['abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq', '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1'],
    ['', 'e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855'],
  ])('sha256Bytes(%j) is the published digest', (message, digest) => {
    expect(hex(sha256Bytes(new TextEncoder().encode(message)))).toBe(digest);
    expect(createHash('sha256').update(message).digest('hex')).toBe(digest);
  });

  it('splitPoint is the first 52 bits of SHA-256("seed:key") over 2^52, as node:crypto computes it (fast-check)', () => {
    fc.assert(
      fc.property(fc.string({ unit: 'grapheme', maxLength: 30 }), fc.nat({ max: 2 ** 40 }), (key, seed) => {
        const digest = createHash('sha256').update(Buffer.from(`${seed}:${key}`, 'utf8')).digest();
        const first52 = digest.readBigUInt64BE(0) >> 12n;
        expect(splitPoint(key, seed)).toBe(Number(first52) / 2 ** 52);
      }),
      { numRuns: 300 },
    );
  });

  it('a worked example: key m0001 under seed 0', () => {
    // SHA-256("0:m0001") from node:crypto; its first 13 hex digits are the 52 bits.
    const digest = createHash('sha256').update('0:m0001').digest('hex');
    expect(splitPoint('m0001', 0)).toBe(parseInt(digest.slice(0, 13), 16) / 2 ** 52);
    expect(splitPoint('m0001')).toBe(splitPoint('m0001', DEFAULT_SEED));
    expect(DEFAULT_SEED).toBe(0);
  });
});

describe('splitOf', () => {
  it('is stable: a key keeps its split when the corpus grows or is reordered (fast-check)', () => {
    fc.assert(
      fc.property(fc.uniqueArray(fc.string({ maxLength: 12 }), { maxLength: 40 }), fc.uniqueArray(fc.string({ maxLength: 12 }), { maxLength: 40 }), fc.nat(), (keys, more, seed) => {
        const before = new Map(keys.map((k) => [k, splitOf(k, THREE, seed)]));
        const grown = [...more, ...keys].reverse();
        const chooser = splitChooser(THREE, seed);
        for (const k of grown) if (before.has(k)) expect(THREE[chooser(k)]?.name).toBe(before.get(k));
      }),
    );
  });

  it.each([0, 1, 14, 2 ** 53 - 1])('meets every share within the binomial bound on 20,000 keys, seed %i', (seed) => {
    const n = 20_000;
    const counts = new Map<string, number>();
    for (let i = 1; i <= n; i++) {
      const name = splitOf(`m${String(i).padStart(5, '0')}`, THREE, seed);
      counts.set(name, (counts.get(name) ?? 0) + 1);
    }
    for (const { name, share } of THREE) expect(withinBinomial(counts.get(name) ?? 0, n, share), `${name}: ${counts.get(name)} of ${n}`).toBe(true);
  });

  it('other seeds give other assignments', () => {
    const keys = Array.from({ length: 200 }, (_, i) => String(i + 1));
    const moved = keys.filter((k) => splitOf(k, THREE, 0) !== splitOf(k, THREE, 1)).length;
    // Two independent draws disagree with probability 1 - (0.8² + 0.1² + 0.1²) = 0.34.
    expect(withinBinomial(moved, 200, 0.34)).toBe(true);
  });

  it('leaves no key out when the shares add up to 1 only within the tolerance', () => {
    const splits = [
      { name: 'a', share: 0.7 },
      { name: 'b', share: 0.2 },
      { name: 'c', share: 0.1 },
    ];
    expect(0.7 + 0.2 + 0.1).toBeLessThan(1);
    const chooser = splitChooser(splits, 0);
    for (let i = 0; i < 1000; i++) expect(chooser(String(i))).toBeLessThan(3);
    expect(splitOf('x', [{ name: 'all', share: 1 }], 5)).toBe('all');
  });
});

describe('parseSplits and checkSplits', () => {
  it('reads names and shares in the order given', () => {
    expect(parseSplits('train=0.8,valid=0.1,test=0.1')).toEqual(THREE);
    expect(parseSplits('b=.25,a=0.75')).toEqual([
      { name: 'b', share: 0.25 },
      { name: 'a', share: 0.75 },
    ]);
  });

  it.each([
    ['train=0.8,test=0.1', 'split: the shares add up to 0.9, not 1 (train 0.8, test 0.1); make them add up to 1'],
    ['train=0.8,test=0.3', 'split: the shares add up to 1.1, not 1 (train 0.8, test 0.3); make them add up to 1'],
    ['train=0.8,test', 'split: "test" is not a part; write each part as its name, = and its share as a decimal, separated by commas, such as train=0.8,valid=0.1,test=0.1'],
    ['train=80%,test=20%', 'split: "train=80%" is not a part; write each part as its name, = and its share as a decimal, separated by commas, such as train=0.8,valid=0.1,test=0.1'],
    ['train=1e0', 'split: "train=1e0" is not a part; write each part as its name, = and its share as a decimal, separated by commas, such as train=0.8,valid=0.1,test=0.1'],
    ['train=0.5,,test=0.5', 'split: "" is not a part; write each part as its name, = and its share as a decimal, separated by commas, such as train=0.8,valid=0.1,test=0.1'],
    ['train=1,none=0', 'split: the share of "none", 0, is not a number above 0 and at most 1'],
    ['train=0.5,Train=0.5', 'split: "Train" is named twice (as "train": letter case aside, one file name); give every part a name of its own'],
    ['a=0.5,a=0.5', 'split: "a" is named twice; give every part a name of its own'],
    ['../x=0.5,y=0.5', 'split: "../x" cannot name a part: it names a file or folder, so use letters, digits, -, _ and . (first a letter or digit), at most 64 characters'],
    ['.hidden=1', 'split: ".hidden" cannot name a part: it names a file or folder, so use letters, digits, -, _ and . (first a letter or digit), at most 64 characters'],
    ['=1', 'split: "" cannot name a part: it names a file or folder, so use letters, digits, -, _ and . (first a letter or digit), at most 64 characters'],
    ['a b=1', 'split: "a b" cannot name a part: it names a file or folder, so use letters, digits, -, _ and . (first a letter or digit), at most 64 characters'],
  ])('refuses %j (BAD_OPTION)', async (text, message) => {
    const error = await caughtError(async () => parseSplits(text));
    expect([error.code, error.message]).toEqual(['BAD_OPTION', message]);
  });

  it('checkSplits refuses what a library caller can pass and parseSplits cannot read', async () => {
    for (const [splits, message] of [
      [[], 'split: no parts given; name each part and its share, such as train=0.8,test=0.2'],
      [[{ name: 'a', share: Number.NaN }], 'split: the share of "a", NaN, is not a number above 0 and at most 1'],
      [[{ name: 'a', share: 2 }, { name: 'b', share: -1 }], 'split: the share of "a", 2, is not a number above 0 and at most 1'],
    ] as Array<[Split[], string]>) {
      expect((await caughtError(async () => checkSplits(splits))).message).toBe(message);
    }
    expect((await caughtError(async () => splitOf('k', THREE, -1))).message).toBe('split seed -1 is not a whole number from 0 to 2^53 - 1 (9007199254740991)');
    expect((await caughtError(async () => splitOf('k', THREE, 1.5))).code).toBe('BAD_OPTION');
  });
});
