import { LexlockError } from '../LexlockError.js';
import { checkSplits } from './checkSplits.js';
import type { Split } from './Split.js';

/** A share as people write it: a decimal such as `0.8` or `.05`. */
const SHARE = /^(?:\d+(?:\.\d*)?|\.\d+)$/;

/**
 * The splits of a text such as `train=0.8,valid=0.1,test=0.1` (`lexlock encode --split`): parts
 * separated by commas, each a name, `=` and a share written as a decimal; checked by
 * {@link checkSplits}. Anything else is `BAD_OPTION` naming the part.
 * @example parseSplits('train=0.9,test=0.1') // [{ name: 'train', share: 0.9 }, { name: 'test', share: 0.1 }]
 */
export function parseSplits(text: string): Split[] {
  const splits: Split[] = [];
  for (const part of text.split(',')) {
    const equals = part.indexOf('=');
    const name = equals === -1 ? part : part.slice(0, equals);
    const share = equals === -1 ? '' : part.slice(equals + 1);
    if (equals === -1 || !SHARE.test(share)) {
      throw new LexlockError(
        'BAD_OPTION',
        `split: ${JSON.stringify(part)} is not a part; write each part as its name, = and its share as a decimal, separated by commas, such as train=0.8,valid=0.1,test=0.1`,
        { field: 'split' },
      );
    }
    splits.push({ name, share: Number(share) });
  }
  checkSplits(splits);
  return splits;
}
