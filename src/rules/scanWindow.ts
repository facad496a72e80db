import { WordScan } from './fast/scanWordTokens.js';
import { WHITE_SPACE_TABLE } from './fast/whiteSpaceTable.js';
import { normalize } from './normalize.js';
import { CharScan } from './scanCharTokens.js';
import { isPrepared, scanTokens } from './scanTokens.js';
import type { TextRules } from './TextRules.js';
import { mayCutBefore, pieceEnd } from './TokenScan.js';
import type { TokenSpans } from './TokenSpans.js';

/** The end of a text a row loses when the text has more tokens than the row holds (a shape's `cut`). */
export type CutEnd = 'start' | 'end';

const words = new WordScan();
const chars = new CharScan();

/**
 * The code units a first window reads for `want` tokens: about ten a word (a word and its white space
 * take five to seven in prose and mail), two a character, so one window mostly does.
 */
export function firstWindow(want: number, rules: Pick<TextRules, 'level'>): number {
  return rules.level === 'char' ? 2 * want + 16 : 10 * want + 64;
}

/** The index of the first code unit of `text[from, to)` above U+007F, or `to`. */
function asciiUpTo(text: string, from: number, to: number): number {
  for (let i = from; i < to; i++) if (text.charCodeAt(i) > 0x7f) return i;
  return to;
}

/**
 * Finds in `out` the tokens of `text` (the tokens {@link scanTokens} finds) that a row of `want` keeps
 * when the text loses its `cut` end, reading only as much of the text as they need:
 *
 * - cut `end`: `out` holds the text's first `out.count` tokens, `want` or more (all of them when the
 *   text has fewer), read from the start until the first `want` are sure;
 * - cut `start`: the last `want` tokens of `out` are the text's last `want` (all of them when `out`
 *   holds fewer than `want`), read from a place near the end where the tokens before cannot change
 *   those after.
 *
 * So `keptOf(out.count, shape)` and `firstKept(out.count, shape)` pick from `out` the ids a row of
 * `want` keeps, the ids the whole text's tokens give (tests/rules/scanWindow.test.ts proves it against
 * scanTokens on adversarial and hostile text, every rule set, both ends). A text no longer than
 * `first` code units, or one whose tokens were found ahead (keepPrepared), is scanned whole.
 *
 * Why a window gives the whole text's tokens: normalization is done in pieces cut only where the
 * whole text's normalization is the pieces' (see `mayCutBefore`; ASCII needs none and is read folded,
 * and an ASCII stretch normalizes alike wherever it is cut); the word level's groups are decided by
 * what lies up to the character after the white space that ends them (see `WordScan.beginWindow`),
 * and a group never spans a run of white space wink's time rule cannot cross; the character level is a
 * scan whose only state is "in white space", and a run of white space is one `' '` wherever it is
 * entered.
 * @example scanWindow(text, rules, out, 200, 'end') // out holds at least the text's first 200 tokens (or all of them)
 */
export function scanWindow(text: string, rules: TextRules, out: TokenSpans, want: number, cut: CutEnd, first = firstWindow(want, rules)): TokenSpans {
  if (text.length <= first || isPrepared(text, rules)) return scanTokens(text, rules, out, true);
  return cut === 'end' ? scanHead(text, rules, out, want, first) : scanTail(text, rules, out, want, first);
}

function spacesOf(rules: TextRules): 'keep' | 'drop' {
  return rules.spaces === 'drop' ? 'drop' : 'keep';
}

/** Cut `end`: windows from the start, each twice as long as the last, until `want` tokens are sure. */
function scanHead(text: string, rules: TextRules, out: TokenSpans, want: number, first: number): TokenSpans {
  const n = text.length;
  const char = rules.level === 'char';
  // ASCII is read in place, folded: a window then costs nothing but its tokens. The character after
  // the window must be ASCII too, since a mark there would compose with the window's last one.
  let limit = Math.min(n, first);
  let size = first;
  let checked = Math.min(n, limit + 1);
  if (asciiUpTo(text, 0, checked) === checked) {
    out.begin(text, rules.case === 'lower', rules);
    if (char) chars.beginWindow(out, spacesOf(rules), 0, limit, want);
    else words.beginWindow(out, 0, limit, want, limit === n);
    for (;;) {
      if (char) chars.step(Number.POSITIVE_INFINITY);
      else words.step(Number.POSITIVE_INFINITY);
      if (limit === n || (char ? out.count >= want : words.enough)) return out;
      const next = Math.min(n, 2 * limit);
      // Text other than ASCII further on: start again, normalizing (at most once, so in linear time).
      const more = Math.min(n, next + 1);
      if (asciiUpTo(text, checked, more) < more) {
        size = next;
        break;
      }
      checked = more;
      limit = next;
      if (char) chars.extendWindow(out, limit);
      else {
        out.count = words.sureCount;
        words.beginWindow(out, words.sureAt, limit, want, limit === n);
      }
    }
  }
  // Normalized: the window is the normalization of the text up to a place it may be cut, made longer
  // piece by piece; the tokens sure so far point into its start, which stays the same.
  let read = 0;
  let normal = '';
  for (;;) {
    const end = pieceEnd(text, read, Math.max(1, size - read));
    const piece = normalize(read === 0 && end === n ? text : text.slice(read, end), rules);
    const final = end === n;
    if (read === 0) {
      normal = piece;
      out.begin(normal, false, rules);
      if (char) chars.beginWindow(out, spacesOf(rules), 0, normal.length, want);
      else words.beginWindow(out, 0, normal.length, want, final);
    } else {
      normal += piece;
      out.text = normal;
      if (char) chars.extendWindow(out, normal.length);
      else {
        out.count = words.sureCount;
        words.beginWindow(out, words.sureAt, normal.length, want, final);
      }
    }
    read = end;
    if (char) chars.step(Number.POSITIVE_INFINITY);
    else words.step(Number.POSITIVE_INFINITY);
    if (final || (char ? out.count >= want : words.enough)) return out;
    size = 2 * read;
  }
}

/** Whether a time suffix (a, p or h, either case) may start at this code unit: what may join a group over one white space. */
function startsTimeSuffix(code: number): boolean {
  const lower = code | 0x20;
  return lower === 0x61 || lower === 0x70 || lower === 0x68;
}

/**
 * Whether a normalized tail that starts at white space starts a group of the whole text: its white
 * space is not the single one wink's time rule may join over (`10 am`), because the tail has no second
 * character, or that is white space too, or it cannot start a time suffix.
 */
function startsGroup(tail: string): boolean {
  if (tail.length === 0 || WHITE_SPACE_TABLE[tail.charCodeAt(0)] !== 1) return false;
  if (tail.length === 1) return true;
  const next = tail.charCodeAt(1);
  return WHITE_SPACE_TABLE[next] === 1 || !startsTimeSuffix(next);
}

/**
 * Where a tail may start at the word level, searching back from `from`: white space where the text
 * may be cut for normalization, not followed by an ASCII a, p or h (a character that normalizes to
 * one, such as a full-width `ａ`, is caught by {@link startsGroup} on the normalized tail). 0 when there
 * is none: the whole text.
 */
function wordTailStart(text: string, from: number): number {
  const n = text.length;
  for (let s = from; s > 0; s--) {
    const code = text.charCodeAt(s);
    if (WHITE_SPACE_TABLE[code] !== 1 || !mayCutBefore(code)) continue;
    if (s + 1 >= n) return s;
    const next = text.charCodeAt(s + 1);
    if (next > 0x7f || !startsTimeSuffix(next)) return s;
  }
  return 0;
}

/** Where a tail may start at the character level, searching back from `from`: where the text may be cut for normalization. */
function charTailStart(text: string, from: number): number {
  for (let s = from; s > 0; s--) if (mayCutBefore(text.charCodeAt(s))) return s;
  return 0;
}

/**
 * Cut `start`: a tail of the text, longer each time, until it has `want` tokens. At the character level
 * a tail that starts inside a run of white space starts with that run's `' '`, the token the whole text
 * has there too, so its tokens are the whole text's last ones wherever it starts.
 */
function scanTail(text: string, rules: TextRules, out: TokenSpans, want: number, first: number): TokenSpans {
  const n = text.length;
  const char = rules.level === 'char';
  let size = first;
  for (;;) {
    let from = n - size;
    let start = 0;
    let inPlace = false;
    for (;;) {
      start = from <= 0 ? 0 : char ? charTailStart(text, from) : wordTailStart(text, from);
      if (start === 0) return scanTokens(text, rules, out, true);
      if (asciiUpTo(text, start, n) === n) {
        // An ASCII tail normalizes alike wherever it is cut; it is read in place, folded.
        out.begin(text, rules.case === 'lower', rules);
        inPlace = true;
        break;
      }
      const tail = normalize(text.slice(start), rules);
      if (char || startsGroup(tail)) {
        out.begin(tail, false, rules);
        break;
      }
      from = start - 1;
    }
    const at = inPlace ? start : 0;
    if (char) chars.beginWindow(out, spacesOf(rules), at, out.text.length, Number.POSITIVE_INFINITY);
    else words.beginWindow(out, at, out.text.length, Number.POSITIVE_INFINITY, true);
    if (char) chars.step(Number.POSITIVE_INFINITY);
    else words.step(Number.POSITIVE_INFINITY);
    if (out.count >= want) return out;
    // Too few: a longer tail, as long as the tokens found so far suggest (at least half as long again).
    const read = n - start;
    const guess = out.count === 0 ? 4 * read : Math.ceil(((read * want) / out.count) * 1.25);
    size = Math.max(Math.ceil(1.5 * read), guess);
  }
}
