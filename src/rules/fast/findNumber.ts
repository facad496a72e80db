import type { Found } from './Finder.js';
import { scanWork } from './scanWork.js';

const SLASH = 0x2f;

/** `[\.,-\/]` of wink's number patterns: `.`, and the range `,` to `/` (`,` `-` `.` `/`). */
function isJoint(code: number): boolean {
  return code >= 0x2c && code <= 0x2f;
}

/** An ASCII digit (`\d` without flag `u`); false for NaN, past the end of a text. */
function isAsciiDigit(code: number): boolean {
  return code >= 0x30 && code <= 0x39;
}

/** A Devanagari digit, U+0966 to U+096F. */
function isDevanagariDigit(code: number): boolean {
  return code >= 0x966 && code <= 0x96f;
}

/**
 * A finder for wink's number pattern over one kind of digit `D` (`D+\/D+|D(?:[\.,-\/]?D)*(?:\.D+)?`)
 * that takes linear time and no stack. The pattern's own search backtracks through one saved state a
 * digit: V8 gives up on a run of a few million digits ("Maximum call stack size exceeded"), where this
 * gives the match the pattern defines. Both alternatives start with a digit and the second always
 * matches there, so the leftmost match starts at the first digit; the first alternative wins when the
 * run of digits is followed by `/` and a digit (its `D+` can only give way to `/` at the run's end),
 * else the second takes digits, and a joint followed by a digit, as long as they come (its last
 * optional part can never add to that: a `.` and digits would have been taken already).
 */
function numberFinder(isDigit: (code: number) => boolean) {
  return (text: string, from: number, found: Found): boolean => {
    const n = text.length;
    let s = from;
    while (s < n && !isDigit(text.charCodeAt(s))) s++;
    if (s >= n) {
      scanWork.units += n - from;
      found.start = n;
      return false;
    }
    let end = s + 1;
    while (isDigit(text.charCodeAt(end))) end++;
    if (text.charCodeAt(end) === SLASH && isDigit(text.charCodeAt(end + 1))) {
      for (end += 2; isDigit(text.charCodeAt(end)); end++);
    } else {
      while (isJoint(text.charCodeAt(end)) && isDigit(text.charCodeAt(end + 1))) for (end += 2; isDigit(text.charCodeAt(end)); end++);
    }
    found.start = s;
    found.end = end;
    scanWork.units += end - from;
    return true;
  };
}

/** wink's Latin-1 number rule (WINK_PATTERNS.numberL1), in linear time (see numberFinder). */
export const findNumberL1 = numberFinder(isAsciiDigit);
/** wink's Devanagari number rule (WINK_PATTERNS.numberDV), in linear time (see numberFinder). */
export const findNumberDV = numberFinder(isDevanagariDigit);
