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
 * Code units of text the windows of this thread have looked at since it started: checked for ASCII,
 * searched for a place to start a tail, normalized, or given to a scanner. Tests read it to prove that
 * a window reads what its row needs, not the whole text, and never a part more than a few times;
 * nothing else depends on it.
 */
export const windowWork = { units: 0 };

/**
 * The code units a first window reads for `want` tokens: about ten a word (a word and its white space
 * take five to seven in prose and mail), two a character, so one window mostly does.
 */
export function firstWindow(want: number, rules: Pick<TextRules, 'level'>): number {
  return rules.level === 'char' ? 2 * want + 16 : 10 * want + 64;
}

/** The index of the first code unit of `text[from, to)` above U+007F, or `to`. */
function asciiUpTo(text: string, from: number, to: number): number {
  windowWork.units += to - from;
  for (let i = from; i < to; i++) if (text.charCodeAt(i) > 0x7f) return i;
  return to;
}

/** `normalize`, counted in {@link windowWork}. */
function normalized(text: string, rules: TextRules): string {
  windowWork.units += text.length;
  return normalize(text, rules);
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
  if (text.length <= first || isPrepared(text, rules)) {
    windowWork.units += text.length;
    return scanTokens(text, rules, out, true);
  }
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
  // Where this window's scan starts: the character scan goes on where it stopped, the word scan from its last sure group.
  let scanned = 0;
  if (asciiUpTo(text, 0, checked) === checked) {
    out.begin(text, rules.case === 'lower', rules);
    if (char) chars.beginWindow(out, spacesOf(rules), 0, limit, want);
    else words.beginWindow(out, 0, limit, want, limit === n);
    for (;;) {
      windowWork.units += limit - (char ? scanned : words.sureAt);
      scanned = limit;
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
  scanned = 0;
  for (;;) {
    const end = pieceEnd(text, read, Math.max(1, size - read));
    const piece = normalized(read === 0 && end === n ? text : text.slice(read, end), rules);
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
    windowWork.units += normal.length - (char ? scanned : words.sureAt);
    scanned = normal.length;
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
 * Whether normalized text that starts at white space starts a group of the whole text there: its
 * white space is not the single one wink's time rule may join over (`10 am`), because what follows it
 * is white space too, or cannot start a time suffix.
 */
function startsGroup(head: string): boolean {
  if (WHITE_SPACE_TABLE[head.charCodeAt(0)] !== 1) return false;
  const next = head.charCodeAt(1);
  return WHITE_SPACE_TABLE[next] === 1 || !startsTimeSuffix(next);
}

/**
 * Where a tail may start at the word level, searching back from `from`: white space where the text
 * may be cut for normalization and whose normalized form {@link startsGroup}. Its next character
 * decides: an ASCII one normalizes to itself (or, with a mark after it, to a letter that is no a, p or
 * h either); any other is normalized with what follows up to the next place the text may be cut
 * (`ａ` becomes `a`), a stretch no other candidate reads. 0 when there is none: the whole text.
 */
function wordTailStart(text: string, from: number, rules: TextRules): number {
  const n = text.length;
  for (let s = from; s > 0; s--) {
    windowWork.units += 1;
    const code = text.charCodeAt(s);
    if (WHITE_SPACE_TABLE[code] !== 1 || !mayCutBefore(code)) continue;
    if (s + 1 >= n) return s;
    const next = text.charCodeAt(s + 1);
    if (next <= 0x7f ? WHITE_SPACE_TABLE[next] === 1 || !startsTimeSuffix(next) : startsGroup(normalized(text.slice(s, pieceEnd(text, s + 1, 1)), rules))) return s;
  }
  return 0;
}

/** Where a tail may start at the character level, searching back from `from`: where the text may be cut for normalization. */
function charTailStart(text: string, from: number): number {
  for (let s = from; s > 0; s--) {
    windowWork.units += 1;
    if (mayCutBefore(text.charCodeAt(s))) return s;
  }
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
    const from = n - size;
    const start = from <= 0 ? 0 : char ? charTailStart(text, from) : wordTailStart(text, from, rules);
    if (start === 0) {
      windowWork.units += n;
      return scanTokens(text, rules, out, true);
    }
    // An ASCII tail is read in place, folded (the text before it changes nothing of it).
    const inPlace = asciiUpTo(text, start, n) === n;
    if (inPlace) out.begin(text, rules.case === 'lower', rules);
    else out.begin(normalized(text.slice(start), rules), false, rules);
    const at = inPlace ? start : 0;
    windowWork.units += out.text.length - at;
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
