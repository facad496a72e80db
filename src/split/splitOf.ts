import { sha256Bytes } from '../artifact/sha256.js';
import { checkSeed, checkSplits } from './checkSplits.js';
import { DEFAULT_SEED, type Split } from './Split.js';

const utf8 = new TextEncoder();
/** 2^52: a digest's first 52 bits, divided by it, are a number in [0, 1) a double holds exactly. */
const TWO_52 = 2 ** 52;

/**
 * Where a key falls in [0, 1) under a seed: the first 52 bits of the SHA-256 (FIPS 180-4) digest of
 * the UTF-8 bytes of the seed's decimal digits, `:`, and the key (a lone surrogate as U+FFFD, as
 * TextEncoder writes it), read as a big-endian number and divided by 2^52. It depends on nothing
 * but the key and the seed, so a document keeps its place when others come or go.
 * @example splitPoint('m0001', 0) // the same number in every run, on every machine
 */
export function splitPoint(key: string, seed: number = DEFAULT_SEED): number {
  const d = sha256Bytes(utf8.encode(`${seed}:${key}`));
  // 7 bytes are 56 bits; the last 4 of them are dropped. Each step stays below 2^53, so it is exact.
  const high = (((d[0] as number) * 256 + (d[1] as number)) * 256 + (d[2] as number)) * 256 + (d[3] as number); // 32 bits
  const low = (((d[4] as number) * 256 + (d[5] as number)) * 16) + ((d[6] as number) >> 4); // 20 bits
  return (high * 2 ** 20 + low) / TWO_52;
}

/**
 * A function that gives the index of the split a key belongs to: the first split whose running
 * total of shares is above the key's {@link splitPoint}; the last split ends at 1 exactly, so
 * shares that add up to 1 within 1e-9 leave no key out. Checks the splits and the seed once
 * (`BAD_OPTION`).
 * @example const chooser = splitChooser([{ name: 'train', share: 0.8 }, { name: 'test', share: 0.2 }], 0); chooser('m0001') // 0 or 1
 */
export function splitChooser(splits: readonly Split[], seed: number = DEFAULT_SEED): (key: string) => number {
  checkSplits(splits);
  checkSeed(seed);
  const ends = new Float64Array(splits.length);
  let total = 0;
  for (let i = 0; i < splits.length; i++) {
    total += (splits[i] as Split).share;
    ends[i] = total;
  }
  ends[splits.length - 1] = 1;
  const last = splits.length - 1;
  return (key) => {
    const point = splitPoint(key, seed);
    for (let i = 0; i < last; i++) if (point < (ends[i] as number)) return i;
    return last;
  };
}

/**
 * The name of the split a document's key belongs to, under a seed (default 0): stable when the corpus
 * grows, shrinks or is reordered, and each split's share is met within sampling error (overall and
 * within every label), since the key's hash is as good as a uniform draw. `lexlock encode --split`
 * assigns documents the same way. Refuses bad splits or seeds (`BAD_OPTION`).
 * @example splitOf('m0001', [{ name: 'train', share: 0.8 }, { name: 'valid', share: 0.1 }, { name: 'test', share: 0.1 }], 0) // 'train', 'valid' or 'test', always the same
 */
export function splitOf(key: string, splits: readonly Split[], seed: number = DEFAULT_SEED): string {
  return (splits[splitChooser(splits, seed)(key)] as Split).name;
}
