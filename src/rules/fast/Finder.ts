import { scanWork } from './scanWork.js';

/** Where a rule matched: `text[start, end)`. */
export interface Found {
  start: number;
  end: number;
}

/**
 * One of wink-tokenizer's rules as wink applies it: finds the leftmost match in `text` that starts at
 * or after `from` (the one a global regular expression's search from `from` finds), puts it in
 * `found` and returns true, or returns false when there is none. No rule matches the empty string.
 */
export type Finder = (text: string, from: number, found: Found) => boolean;

/**
 * The finder that runs `pattern` itself (a copy of it, so no `lastIndex` is shared with other users).
 * Linear for the patterns it is used with: none of them backtracks more than a bounded distance.
 */
export function finderOf(pattern: RegExp): Finder {
  const own = new RegExp(pattern.source, pattern.flags.includes('g') ? pattern.flags : `${pattern.flags}g`);
  return (text, from, found) => {
    own.lastIndex = from;
    const m = own.exec(text);
    if (m === null) {
      scanWork.units += text.length - from;
      return false;
    }
    found.start = m.index;
    found.end = m.index + m[0].length;
    scanWork.units += found.end - from;
    return true;
  };
}
