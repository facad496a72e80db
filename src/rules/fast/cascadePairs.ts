import { findEmail } from './findEmail.js';
import { finderOf, windowFinderOf, type Finder, type Found } from './Finder.js';
import { findNumberDV, findNumberL1 } from './findNumber.js';
import { findOrdinal } from './findOrdinal.js';
import { scanWork } from './scanWork.js';
import { splitWord } from './splitWord.js';
import { WINK_PATTERNS as P } from './winkPatterns.js';
import type { PairSink } from '../TokenSpans.js';

/** One of wink-tokenizer's rules: how its matches are found, the tag they get, and what a match needs. */
interface Rule {
  find: Finder;
  tag: string;
  /** Characters of which a match holds at least one (see {@link kindsOf}); 0: nothing to check. */
  needs: number;
}

// Kinds of characters some rules cannot match without (a match of the rule holds at least one).
const AT = 1;
const HASH = 2;
const COLON = 4;
const EMOTICON_START = 8;
const DIGIT = 16;
const NON_ASCII = 32;
const DOLLAR = 64;
const STAR = 128;

/** The kinds of characters in `text` (see {@link Rule.needs}). */
function kindsOf(text: string): number {
  let kinds = 0;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (c >= 0x80) kinds |= NON_ASCII;
    else if (c >= 0x30 && c <= 0x39) kinds |= DIGIT;
    else if (c === 0x40) kinds |= AT;
    else if (c === 0x23) kinds |= HASH;
    else if (c === 0x3a) kinds |= COLON | EMOTICON_START;
    else if (c === 0x3b || c === 0x3c) kinds |= EMOTICON_START;
    else if (c === 0x24) kinds |= DOLLAR;
    else if (c === 0x2a) kinds |= STAR;
  }
  return kinds;
}

/**
 * wink-tokenizer 5.3.0's rules with its default settings, in its order (`rgxsMaster` without the
 * quoted phrase, which its default configuration leaves out). Each finds what its pattern finds; the
 * e-mail and ordinal patterns, quadratic when run as they are, and the number patterns, which V8
 * gives up on for a run of a few million digits, are found by linear scanners of their own.
 */
const RULES: readonly Rule[] = [
  { find: finderOf(P.url), tag: 'url', needs: COLON },
  { find: findEmail, tag: 'email', needs: AT },
  { find: finderOf(P.mention), tag: 'mention', needs: AT },
  { find: finderOf(P.hashtagL1), tag: 'hashtag', needs: HASH },
  { find: finderOf(P.hashtagDV), tag: 'hashtag', needs: HASH },
  // Its only ASCII characters are # * and digits, as keycap bases (tests/rules/fast/winkPatterns.test.ts).
  { find: windowFinderOf(P.emoji), tag: 'emoji', needs: NON_ASCII | HASH | STAR | DIGIT },
  { find: windowFinderOf(P.emoticon), tag: 'emoticon', needs: EMOTICON_START },
  { find: windowFinderOf(P.time), tag: 'time', needs: DIGIT },
  { find: findOrdinal, tag: 'ordinal', needs: DIGIT },
  { find: findNumberL1, tag: 'number', needs: DIGIT },
  { find: findNumberDV, tag: 'number', needs: NON_ASCII },
  { find: finderOf(P.currency), tag: 'currency', needs: DOLLAR | NON_ASCII },
  { find: finderOf(P.wordL1), tag: 'word', needs: 0 },
  { find: finderOf(P.wordDV), tag: 'word', needs: NON_ASCII },
  { find: finderOf(P.punctuation), tag: 'punctuation', needs: 0 },
  { find: finderOf(P.symbol), tag: 'symbol', needs: 0 },
];

const SPACES = new RegExp(P.spaces);
/** Where the rule being searched matched: read at once, before any other search. */
const FOUND: Found = { start: 0, end: 0 };
/** Frames at most: one a rule, and one for what is left after the last. */
const DEPTH = RULES.length + 1;
/** How far one search looks when the work comes in steps (see Finder's `limit`). */
const WINDOW = 1 << 16;

/** A match of rule `k` in `text`, reported as wink reports it (a word through {@link splitWord}). */
function report(text: string, start: number, end: number, k: number, sink: PairSink): void {
  const value = text.slice(start, end);
  const tag = (RULES[k] as Rule).tag;
  if (tag === 'word') splitWord(value, sink);
  else sink.pair(value, tag);
}

/**
 * wink-tokenizer's tokens of one text with its default settings, reported to a {@link PairSink} as
 * value/tag pairs (encoding contract, rule 2): the same pairs as `wink.tokenize(text)`, in time linear
 * in the text's length, and in steps of bounded work, so a caller can pause between them (a text of
 * many megabytes without white space is one group). wink's own way, kept step for step: each rule in
 * turn finds its matches in what the rules before it left, the parts before, between and after them,
 * trimmed, go to the next rule in order, and what is left after the last rule is split at white space
 * into `alien` tokens. wink does this by recursion; here the recursion is a stack of frames (a part,
 * its rule, where its search is, and the match waiting for the part before it), at most one a rule
 * deep. Its patterns are wink's (WINK_PATTERNS), but those that backtrack without bound (e-mail,
 * ordinal, possessive) or keep a saved state a character (number; e-mail again) are replaced by
 * scanners that find the same matches in linear time and no stack (findEmail, findOrdinal,
 * findNumberL1/DV, splitWord); tests/rules/fast/cascadePairs.test.ts proves the pairs equal to wink's.
 */
export class GroupCascade {
  readonly #texts: string[] = new Array<string>(DEPTH).fill('');
  readonly #rules = new Int32Array(DEPTH);
  readonly #at = new Int32Array(DEPTH);
  /** Where a frame's search goes on: no match of its rule starts between `#at` and here. */
  readonly #searchFrom = new Int32Array(DEPTH);
  /** The match of a frame's rule that waits while the part before it is tokenized (end -1: none). */
  readonly #waitingStart = new Int32Array(DEPTH);
  readonly #waitingEnd = new Int32Array(DEPTH);
  #depth = 0;
  #sink: PairSink | null = null;
  /** The kinds of characters in the whole text: a rule that needs none of them is skipped. */
  #kinds = 0;

  /** Starts on `text` (trimmed first, as wink trims it), reporting to `sink`. */
  begin(text: string, sink: PairSink): void {
    const trimmed = text.trim();
    this.#sink = sink;
    this.#depth = 0;
    this.#kinds = kindsOf(trimmed);
    this.#push(trimmed, 0);
  }

  /**
   * Goes on for about `budget` steps of {@link scanWork} (Infinity: to the end); true once every token
   * has been reported.
   */
  step(budget: number): boolean {
    const sink = this.#sink as PairSink;
    const until = scanWork.units + budget;
    while (this.#depth > 0) {
      if (scanWork.units >= until) return false;
      const d = this.#depth - 1;
      const text = this.#texts[d] as string;
      const k = this.#rules[d] as number;
      const waitingEnd = this.#waitingEnd[d] as number;
      if (waitingEnd >= 0) {
        // The part before this frame's match is done: the match comes next.
        report(text, this.#waitingStart[d] as number, waitingEnd, k, sink);
        this.#at[d] = waitingEnd;
        this.#searchFrom[d] = waitingEnd;
        this.#waitingEnd[d] = -1;
      }
      const rule = RULES[k];
      if (rule === undefined) {
        scanWork.units += text.length;
        this.#pop(d);
        for (const piece of text.split(SPACES)) sink.pair(piece.trim(), 'alien');
        continue;
      }
      const at = this.#at[d] as number;
      // Every part is a part of the text: a rule none of whose characters it has cannot match there.
      const possible = rule.needs === 0 || (this.#kinds & rule.needs) !== 0;
      if (possible) {
        const from = this.#searchFrom[d] as number;
        const limit = budget === Number.POSITIVE_INFINITY ? text.length : Math.min(text.length, from + WINDOW);
        if (rule.find(text, from, FOUND, limit)) {
          const { start, end } = FOUND;
          const before = start > at ? text.slice(at, start).trim() : '';
          if (before === '') {
            report(text, start, end, k, sink);
            this.#at[d] = end;
            this.#searchFrom[d] = end;
          } else {
            this.#waitingStart[d] = start;
            this.#waitingEnd[d] = end;
            this.#push(before, k + 1);
          }
          continue;
        }
        if (FOUND.start < text.length) {
          // Not searched to the end yet (a window): go on from there at the next turn of the loop.
          this.#searchFrom[d] = FOUND.start;
          continue;
        }
      }
      // No match left: what follows the last one takes this frame's place, with the next rule.
      this.#pop(d);
      if (at < text.length) this.#push((at === 0 ? text : text.slice(at)).trim(), k + 1);
    }
    this.#sink = null;
    return true;
  }

  /** Ends frame `d`, the top one, letting go of its text. */
  #pop(d: number): void {
    this.#texts[d] = '';
    this.#depth = d;
  }

  /** A frame for `text` under rule `k`, when anything is left of it. */
  #push(text: string, k: number): void {
    if (text === '') return;
    const d = this.#depth;
    this.#texts[d] = text;
    this.#rules[d] = k;
    this.#at[d] = 0;
    this.#searchFrom[d] = 0;
    this.#waitingEnd[d] = -1;
    this.#depth = d + 1;
  }
}

const shared = new GroupCascade();

/**
 * wink-tokenizer's tokens of `text` with its default settings, reported to `sink` as value/tag pairs,
 * all at once (see {@link GroupCascade}, which it runs to the end).
 * @example cascadePairs("can't@", sink) // sink gets ('ca', 'word'), ("n't", 'word'), ('@', 'symbol')
 */
export function cascadePairs(text: string, sink: PairSink): void {
  shared.begin(text, sink);
  shared.step(Number.POSITIVE_INFINITY);
}
