import contractions from 'wink-tokenizer/src/eng-contractions.js';
import type { PairSink } from '../TokenSpans.js';
import { scanWork } from './scanWork.js';

const APOSTROPHE = 0x27;

/** An ASCII letter in either case: `[a-z]` with flag `i` and without `u` matches only these. */
function isAsciiLetter(code: number): boolean {
  const lower = code | 0x20;
  return lower >= 0x61 && lower <= 0x7a;
}

/** Where the run of ASCII letters that ends just before `end` in `word` starts. */
function lettersFrom(word: string, end: number): number {
  let i = end;
  while (i > 0 && isAsciiLetter(word.charCodeAt(i - 1))) i--;
  scanWork.units += end - i;
  return i;
}

/**
 * What wink-tokenizer makes of a word its word rule matched, reported to `sink` as value/tag pairs:
 * the word itself, or, when it holds an apostrophe, its parts from wink's own table of contractions
 * (`can't`: `ca`, `n't`), else its possessive split (WINK_PATTERNS.possessiveSingular, `([a-z]+)('s)$`
 * with flag `i`: the run of ASCII letters before a final `'s`, then `'s`; possessivePlural,
 * `([a-z]+s)(')$`: a run of at least two ASCII letters ending in `s` before a final `'`, then `'`),
 * else the word. As wink does, a possessive keeps only that run of letters (`x'yz's` gives `yz`,
 * `'s`). The patterns run as they are retry every start in a long run of letters (quadratic); the run is
 * found here by one step back from the end, so the cost is linear in the word.
 * @example splitWord("captain's", sink) // sink gets ('captain', 'word'), ("'s", 'word')
 */
export function splitWord(word: string, sink: PairSink): void {
  if (!word.includes("'")) {
    sink.pair(word, 'word');
    return;
  }
  scanWork.units += word.length;
  const parts = contractions[word];
  if (parts !== undefined) {
    for (const part of parts) sink.pair(part.value, part.tag);
    return;
  }
  const n = word.length;
  // ...'s or ...'S after an ASCII letter
  if (n >= 3 && (word.charCodeAt(n - 1) | 0x20) === 0x73 && word.charCodeAt(n - 2) === APOSTROPHE && isAsciiLetter(word.charCodeAt(n - 3))) {
    sink.pair(word.slice(lettersFrom(word, n - 2), n - 2), 'word');
    sink.pair(word.slice(n - 2), 'word');
    return;
  }
  // ...Xs' or ...XS' with X an ASCII letter
  if (n >= 3 && word.charCodeAt(n - 1) === APOSTROPHE && (word.charCodeAt(n - 2) | 0x20) === 0x73 && isAsciiLetter(word.charCodeAt(n - 3))) {
    sink.pair(word.slice(lettersFrom(word, n - 1), n - 1), 'word');
    sink.pair("'", 'word');
    return;
  }
  sink.pair(word, 'word');
}
