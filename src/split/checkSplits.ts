import { LexlockError } from '../LexlockError.js';
import type { Split } from './Split.js';
import { SHARE_TOLERANCE } from './Split.js';

/** A split name: letters, digits, `-`, `_` and `.`, first a letter or a digit, at most 64 characters. */
const NAME = /^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$/;

/**
 * Refuses (`BAD_OPTION`) splits that cannot name outputs or do not share out every document: no
 * parts, a name that is not a safe file name (see above) or that repeats another one (letter case
 * aside, as file systems that ignore case would), a share that is not a number above 0, or shares
 * that do not add up to 1 (within 1e-9).
 * @example checkSplits([{ name: 'train', share: 0.8 }, { name: 'test', share: 0.2 }]); // passes
 */
export function checkSplits(splits: readonly Split[]): void {
  if (splits.length === 0) throw bad('no parts given; name each part and its share, such as train=0.8,test=0.2');
  const seen = new Map<string, string>();
  let sum = 0;
  for (const { name, share } of splits) {
    if (typeof name !== 'string' || !NAME.test(name)) {
      throw bad(`${JSON.stringify(name)} cannot name a part: it names a file or folder, so use letters, digits, -, _ and . (first a letter or digit), at most 64 characters`);
    }
    const folded = name.toLowerCase();
    const other = seen.get(folded);
    if (other !== undefined) throw bad(`${JSON.stringify(name)} is named twice${other === name ? '' : ` (as ${JSON.stringify(other)}: letter case aside, one file name)`}; give every part a name of its own`);
    seen.set(folded, name);
    if (typeof share !== 'number' || !Number.isFinite(share) || share <= 0 || share > 1) {
      throw bad(`the share of ${JSON.stringify(name)}, ${String(share)}, is not a number above 0 and at most 1`);
    }
    sum += share;
  }
  if (Math.abs(sum - 1) > SHARE_TOLERANCE) {
    throw bad(`the shares add up to ${Number(sum.toPrecision(12))}, not 1 (${splits.map((s) => `${s.name} ${s.share}`).join(', ')}); make them add up to 1`);
  }
}

/**
 * Refuses (`BAD_OPTION`) a seed that is not a whole number from 0 to 2^53 - 1.
 * @example checkSeed(7); // passes
 */
export function checkSeed(seed: number): void {
  if (!Number.isSafeInteger(seed) || seed < 0) {
    throw new LexlockError('BAD_OPTION', `split seed ${String(seed)} is not a whole number from 0 to 2^53 - 1 (9007199254740991)`, { field: 'seed' });
  }
}

function bad(detail: string): LexlockError {
  return new LexlockError('BAD_OPTION', `split: ${detail}`, { field: 'split' });
}
