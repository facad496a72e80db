import { findEmail } from './findEmail.js';
import { finderOf, type Finder, type Found } from './Finder.js';
import { findOrdinal } from './findOrdinal.js';
import { scanWork } from './scanWork.js';
import { splitWord } from './splitWord.js';
import { WINK_PATTERNS as P } from './winkPatterns.js';
import type { PairSink } from '../TokenSpans.js';

/** One of wink-tokenizer's rules: how its matches are found, and the tag they get. */
interface Rule {
  find: Finder;
  tag: string;
}

/**
 * wink-tokenizer 5.3.0's rules with its default settings, in its order (`rgxsMaster` without the
 * quoted phrase, which its default configuration leaves out). Each finds what its pattern finds; the
 * e-mail and ordinal patterns, quadratic when run as they are, are found by linear scanners.
 */
const RULES: readonly Rule[] = [
  { find: finderOf(P.url), tag: 'url' },
  { find: findEmail, tag: 'email' },
  { find: finderOf(P.mention), tag: 'mention' },
  { find: finderOf(P.hashtagL1), tag: 'hashtag' },
  { find: finderOf(P.hashtagDV), tag: 'hashtag' },
  { find: finderOf(P.emoji), tag: 'emoji' },
  { find: finderOf(P.emoticon), tag: 'emoticon' },
  { find: finderOf(P.time), tag: 'time' },
  { find: findOrdinal, tag: 'ordinal' },
  { find: finderOf(P.numberL1), tag: 'number' },
  { find: finderOf(P.numberDV), tag: 'number' },
  { find: finderOf(P.currency), tag: 'currency' },
  { find: finderOf(P.wordL1), tag: 'word' },
  { find: finderOf(P.wordDV), tag: 'word' },
  { find: finderOf(P.punctuation), tag: 'punctuation' },
  { find: finderOf(P.symbol), tag: 'symbol' },
];

const SPACES = new RegExp(P.spaces);
/** One per rule: a rule's search is done with before a later rule's starts on a part of it. */
const FOUND: readonly Found[] = RULES.map(() => ({ start: 0, end: 0 }));

/**
 * What is left between matches of rule `k`: trimmed, and when anything is left, given to the next rule
 * (as wink trims each part it leaves and then the part again before its next rule).
 */
function rest(part: string, k: number, sink: PairSink): void {
  const trimmed = part.trim();
  if (trimmed !== '') applyRule(trimmed, k, sink);
}

/**
 * wink's step for rule `k` on `text`: the rule's matches become tokens of its tag (a word with an
 * apostrophe goes through {@link splitWord}), and the text before, between and after them goes to the
 * rules after it, in order. After the last rule the text left is split at white space into `alien`
 * tokens.
 */
function applyRule(text: string, k: number, sink: PairSink): void {
  const rule = RULES[k];
  if (rule === undefined) {
    scanWork.units += text.length;
    for (const piece of text.split(SPACES)) sink.pair(piece.trim(), 'alien');
    return;
  }
  const found = FOUND[k] as Found;
  let at = 0;
  while (rule.find(text, at, found)) {
    const { start, end } = found;
    if (start > at) rest(text.slice(at, start), k + 1, sink);
    const value = text.slice(start, end);
    if (rule.tag === 'word') splitWord(value, sink);
    else sink.pair(value, rule.tag);
    at = end;
  }
  if (at < text.length) rest(at === 0 ? text : text.slice(at), k + 1, sink);
}

/**
 * wink-tokenizer's tokens of `text` with its default settings, reported to `sink` as value/tag pairs
 * (encoding contract, rule 2): the same pairs as `wink.tokenize(text)`, in time linear in the text's
 * length. wink's own way, kept here step for step: each rule in turn finds its matches in what the
 * rules before it left, and the parts between matches, trimmed, go on to the next rule. Its patterns
 * are the same (WINK_PATTERNS), but the three that backtrack without bound (e-mail, ordinal,
 * possessive) are replaced by scanners that find the same matches in linear time (findEmail,
 * findOrdinal, splitWord); tests/rules/fast/cascadePairs.test.ts proves the pairs equal to wink's.
 * @example cascadePairs("can't@", sink) // sink gets ('ca', 'word'), ("n't", 'word'), ('@', 'symbol')
 */
export function cascadePairs(text: string, sink: PairSink): void {
  const trimmed = text.trim();
  if (trimmed !== '') applyRule(trimmed, 0, sink);
}
