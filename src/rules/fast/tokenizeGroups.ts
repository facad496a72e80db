import winkTokenizer from 'wink-tokenizer';

// A tokenizer of our own, default settings; wink keeps no state between calls that affects results.
const wink = winkTokenizer();

/** Joins groups for one wink call. A private-use character between single spaces is a chunk of its own. */
const MARK = '\uE000';
const SEPARATOR = ` ${MARK} `;

/**
 * wink-tokenizer's value/tag pairs for each chunk group, from one wink call on all of them joined by
 * `" \uE000 "`. Exact because no wink rule but the time rule matches white space, and a time match
 * needs a digit or `:` before its one white space and `a`, `p` or `h` after it; the mark is neither,
 * and wink tags it `alien` on its own. A group holding the mark itself is tokenized alone.
 * @example tokenizeGroups(['10 am', "can't"]) // [['10 am', 'time'], ['ca', 'word', "n't", 'word']]
 */
export function tokenizeGroups(groups: readonly string[]): string[][] {
  const out: string[][] = groups.map(() => []);
  const joined: number[] = [];
  for (let g = 0; g < groups.length; g++) {
    const group = groups[g] as string;
    if (group.includes(MARK)) {
      const pairs = out[g] as string[];
      for (const { value, tag } of wink.tokenize(group)) pairs.push(value, tag);
    } else joined.push(g);
  }
  if (joined.length === 0) return out;
  const tokens = wink.tokenize(joined.map((g) => groups[g] as string).join(SEPARATOR));
  let k = 0;
  let pairs = out[joined[0] as number] as string[];
  for (const { value, tag } of tokens) {
    if (value === MARK && tag === 'alien') {
      k += 1;
      pairs = out[joined[k] as number] as string[];
    } else pairs.push(value, tag);
  }
  return out;
}
