import { scanWork } from './scanWork.js';

/** Where a rule matched: `text[start, end)`; after a search that found none, `start` is where it stopped. */
export interface Found {
  start: number;
  end: number;
}

/**
 * One of wink-tokenizer's rules as wink applies it: finds the leftmost match in `text` that starts at
 * or after `from` (the one a global regular expression's search from `from` finds), puts it in `found`
 * and returns true. Returns false when no match starts before `found.start`, which it sets: the end of
 * the text when there is none at all, or a place from `limit` on where it stopped looking (a caller
 * that pauses between steps searches again from there). No rule matches the empty string.
 */
export type Finder = (text: string, from: number, found: Found, limit: number) => boolean;

/**
 * The finder that runs `pattern` itself (a copy of it, so no `lastIndex` is shared with other users),
 * over the rest of the text. For the patterns it is used with, a search costs a few nanoseconds a code
 * unit at most and none backtracks more than a bounded distance.
 */
export function finderOf(pattern: RegExp): Finder {
  const own = new RegExp(pattern.source, pattern.flags.includes('g') ? pattern.flags : `${pattern.flags}g`);
  return (text, from, found) => {
    own.lastIndex = from;
    const m = own.exec(text);
    if (m === null) {
      scanWork.units += text.length - from;
      found.start = text.length;
      return false;
    }
    found.start = m.index;
    found.end = m.index + m[0].length;
    scanWork.units += found.end - from;
    return true;
  };
}

/**
 * The finder that runs `pattern`, a pattern without an unbounded repetition (no `*`, `+` or `{n,}`; its
 * optional parts aside, it matches a fixed sequence), on a window of the text: matches that start
 * before `limit` are looked for in `text[from, limit + the pattern's length)`. Each element of such a
 * pattern takes one code unit at most, so an attempt never reads further than the pattern's source is
 * long from where it starts, and the window gives it the same answer as the whole text. For wink's
 * emoji pattern, which costs 20-45 ns a code unit (a search through 64 MiB: up to 3 s in one call),
 * so that a caller can pause between windows.
 */
export function windowFinderOf(pattern: RegExp): Finder {
  const own = new RegExp(pattern.source, pattern.flags.includes('g') ? pattern.flags : `${pattern.flags}g`);
  const reach = pattern.source.length;
  return (text, from, found, limit) => {
    const n = text.length;
    const whole = limit + reach >= n;
    const window = from === 0 && whole ? text : text.slice(from, whole ? n : limit + reach);
    own.lastIndex = 0;
    const m = own.exec(window);
    if (m !== null && (whole || m.index < limit - from)) {
      found.start = from + m.index;
      found.end = found.start + m[0].length;
      scanWork.units += found.end - from;
      return true;
    }
    const stop = whole ? n : limit;
    scanWork.units += stop - from;
    found.start = stop;
    return false;
  };
}
