import { detached } from '../detached.js';
import type { PairSink, TokenSpans } from '../TokenSpans.js';
import { cascadePairs, GroupCascade } from './cascadePairs.js';
import { GroupCache } from './GroupCache.js';
import { scanLinkChunk } from './scanLinkChunk.js';
import { scanPlainChunk } from './scanPlainChunk.js';
import { scanWork } from './scanWork.js';
import { WHITE_SPACE_TABLE } from './whiteSpaceTable.js';

const cache = new GroupCache();
/** Groups longer than this are not memoized: they rarely come again. */
const CACHE_MAX_LENGTH = 64;
/** Heap one memo entry takes at most (a group of 64 code units, its key, wink's pairs for it): measured about 550 bytes. */
export const CHUNK_MEMO_BYTES_PER_ENTRY = 640;

/**
 * Keeps the chunk memo within `bytes` of heap from now on, for a process that must stay within a
 * memory limit (the memo holds up to 100,000 groups, up to about 60 MiB, otherwise). Tokens never
 * depend on it: a group not in the memo goes to wink-tokenizer.
 */
export function limitChunkMemo(bytes: number): void {
  cache.resize(Math.floor(bytes / CHUNK_MEMO_BYTES_PER_ENTRY));
}
const AT = 0x40;
const COLON = 0x3a;
/** A chunk longer than this is tokenized by the cascade when the work comes in steps. */
const LONG_CHUNK = 1 << 16;

/** Whether the chunk that starts at `from` runs on for more than `length` code units without white space. */
function chunkLongerThan(text: string, from: number, length: number): boolean {
  const last = Math.min(text.length, from + length + 1);
  for (let i = from; i < last; i++) if (WHITE_SPACE_TABLE[text.charCodeAt(i)] === 1) return false;
  return last - from > length;
}

function isDigitOrColon(code: number): boolean {
  return (code >= 0x30 && code <= 0x39) || code === 0x3a;
}

function startsTimeSuffix(code: number): boolean {
  // a, p, h in either case: what may follow the one white space of wink's time rule.
  const lower = code | 0x20;
  return lower === 0x61 || lower === 0x70 || lower === 0x68;
}

/**
 * The word level (encoding contract, rule 2) of `out.text`, already normalized (or ASCII to be read
 * lower-cased, `out.folded`): token for token the same as wink-tokenizer on the whole text, but faster,
 * and reported to `out` (begun by the caller) as spans where it can, in steps of bounded work so that
 * a caller can pause between them. The text is cut into chunks at white space; wink's rules never
 * match across white space except the time rule (`10 am`), so a chunk ending in a digit or `:` is kept
 * with the next when one white space separates them and that one starts with a, p or h. Plain chunks
 * (see {@link scanPlainChunk}) become spans directly; other groups are taken from a memo of wink's
 * pairs when met before, else as spans when they are URLs or e-mail addresses around plain parts (see
 * {@link scanLinkChunk}, which makes strings to match them), else go through wink's rules one by one
 * ({@link GroupCascade}, linear in the group's length; a long group in steps of its own). A text whose
 * groups are all plain or memoized allocates nothing. Every step is linear in the text's length, so no
 * text, however hostile, costs more than a constant per code unit.
 */
export class WordScan {
  #out: TokenSpans | null = null;
  /** Where the next group (or the white space before it) starts. */
  #at = 0;
  /** A long group being tokenized in steps (`#cascading`), whose pairs go straight to `out`. */
  readonly #cascade = new GroupCascade();
  #cascading = false;
  /** A window (see {@link beginWindow}): where the text is read up to, whether that is its end, the tokens wanted. */
  #windowed = false;
  #limit = 0;
  #final = true;
  #want = 0;
  /**
   * In a window: the end of the last group known complete (one the rest of the text cannot change) and
   * how many tokens `out` held there; `enough` once `want` tokens were reached at such an end.
   */
  sureAt = 0;
  sureCount = 0;
  enough = false;

  /** Starts on `out.text`. */
  begin(out: TokenSpans): void {
    this.#out = out;
    this.#at = 0;
    this.#cascading = false;
    this.#windowed = false;
  }

  /**
   * Starts on `out.text` read from `from` (the start, or a {@link sureAt} of an earlier window of the
   * same text) up to `limit` only, as if the text ended there; `final` says it does. The scan stops
   * (`enough`) at the end of the first group that is complete with `out.count` at `want` or more. A
   * group is complete when nothing after `limit` can change it: its white space and the character
   * after that lie before `limit` (wink's rules never reach further, the time rule's one white space
   * and suffix included), or the text ends at `limit`. Otherwise the tokens up to {@link sureCount} are
   * the whole text's first tokens, and a longer window goes on from {@link sureAt}. Not in steps.
   */
  beginWindow(out: TokenSpans, from: number, limit: number, want: number, final: boolean): void {
    this.#out = out;
    this.#at = from;
    this.#cascading = false;
    this.#windowed = true;
    this.#limit = limit;
    this.#final = final;
    this.#want = want;
    this.sureAt = from;
    this.sureCount = out.count;
    this.enough = false;
  }

  /**
   * Goes on for about `budget` units of work (a code unit of the text passed, or a step of
   * {@link scanWork}; Infinity: to the end); true once every token is in `out`. It stops only between
   * groups, or inside a long group's {@link GroupCascade}.
   */
  step(budget: number): boolean {
    const out = this.#out as TokenSpans;
    const text = out.text;
    const folded = out.folded;
    const windowed = this.#windowed;
    const n = windowed ? this.#limit : text.length;
    // All at once (Infinity), the budget is never looked at: the plain path reads no counter at all.
    const stepped = budget !== Number.POSITIVE_INFINITY;
    const work = stepped ? scanWork.units : 0;
    let i = this.#at;
    const from = i;
    if (this.#cascading) {
      if (!this.#cascade.step(budget)) return false;
      this.#cascading = false;
    }
    while (i < n) {
      if (stepped && i - from + (scanWork.units - work) >= budget) {
        this.#at = i;
        return false;
      }
      // In a window, `i` is where the last group ended: complete when what decided its end lies before
      // the limit (the white space at `i` and the character after it), or the text ends at the limit.
      if (windowed && (i + 2 <= n || this.#final)) {
        this.sureAt = i;
        this.sureCount = out.count;
        if (out.count >= this.#want) {
          this.enough = true;
          this.#at = i;
          this.#out = null;
          return true;
        }
      }
      while (i < n && WHITE_SPACE_TABLE[text.charCodeAt(i)] === 1) i++;
      if (i >= n) break;
      const groupStart = i;
      const saved = out.count;
      // When the work comes in steps, a very long chunk goes to the cascade, which can stop inside it,
      // rather than to the plain and link scanners, which cannot (the same tokens either way).
      const long = stepped && chunkLongerThan(text, i, LONG_CHUNK);
      let end = long ? i : scanPlainChunk(text, i, out, n);
      let plain = !long && (end === n || WHITE_SPACE_TABLE[text.charCodeAt(end)] === 1);
      if (!plain) out.count = saved;
      const stop = long ? -1 : end;
      let joined = false;
      for (;;) {
        while (end < n && WHITE_SPACE_TABLE[text.charCodeAt(end)] !== 1) end++;
        // Keep the next chunk with this group when a time match could span the one white space between.
        if (
          end + 2 <= n &&
          isDigitOrColon(text.charCodeAt(end - 1)) &&
          WHITE_SPACE_TABLE[text.charCodeAt(end + 1)] !== 1 &&
          startsTimeSuffix(text.charCodeAt(end + 1))
        ) {
          if (plain) out.count = saved;
          plain = false;
          joined = true;
          end += 1;
          continue;
        }
        break;
      }
      i = end;
      if (plain) continue;
      const short = end - groupStart <= CACHE_MAX_LENGTH;
      // A group met before (wink's own pairs for it) is taken from the memo without making a string.
      const known = short ? cache.find(text, groupStart, end, folded) : undefined;
      if (known !== undefined) {
        for (let p = 0; p < known.length; p += 2) out.pair(known[p] as string, known[p + 1] as string);
        continue;
      }
      // A chunk the plain scanner stopped in at an '@' or a ':' may hold an address or a URL.
      const at = text.charCodeAt(stop);
      if (!joined && (at === AT || at === COLON)) {
        if (scanLinkChunk(text, groupStart, end, out)) continue;
        out.count = saved;
      }
      const cased = text.slice(groupStart, end);
      const group = folded ? cased.toLowerCase() : cased;
      if (short) {
        memoized(group, out);
        continue;
      }
      this.#cascade.begin(group, out);
      if (!this.#cascade.step(stepped ? Math.max(0, budget - (i - from) - (scanWork.units - work)) : budget)) {
        this.#cascading = true;
        this.#at = i;
        return false;
      }
    }
    this.#at = n;
    this.#out = null;
    if (windowed && this.#final) {
      this.sureAt = n;
      this.sureCount = out.count;
    }
    return true;
  }
}

const shared = new WordScan();

/**
 * The word level of `out.text` all at once (see {@link WordScan}, which it runs to the end).
 * @example scanWordTokens(out) // out.text 'Depart 10 am, ok?' -> 'Depart', '10 am', ',', 'ok', '?'
 */
export function scanWordTokens(out: TokenSpans): void {
  shared.begin(out);
  shared.step(Number.POSITIVE_INFINITY);
}

/** Collects one short group's pairs for the memo (reused: groups are handled one at a time). */
const collected: string[] = [];
const collector: PairSink = { pair: (value, tag) => void collected.push(value, tag) };

/** A short group's pairs from wink's rules, kept in the memo and reported to `out`. */
function memoized(group: string, out: TokenSpans): void {
  collected.length = 0;
  cascadePairs(group, collector);
  cache.set(detached(group), collected.map(detached));
  for (let p = 0; p < collected.length; p += 2) out.pair(collected[p] as string, collected[p + 1] as string);
}
