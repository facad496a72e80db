import type { Found } from './Finder.js';
import { scanWork } from './scanWork.js';

const T = 0x74;
const H = 0x68;
const S = 0x73;
const N = 0x6e;
const D = 0x64;
const R = 0x72;
const ZERO = 0x30;
const ONE = 0x31;
const TWO = 0x32;
const THREE = 0x33;

/** An ASCII digit (the pattern's `\d`, without flag `u`); false for NaN, past the end of a text. */
function isDigit(code: number): boolean {
  return code >= ZERO && code <= 0x39;
}

/** `[04-9]` */
function isThDigit(code: number): boolean {
  return code === ZERO || (code >= 0x34 && code <= 0x39);
}

/** `[02-9]` */
function isTensDigit(code: number): boolean {
  return code === ZERO || (code >= TWO && code <= 0x39);
}

/** Whether `text[at, at + 2)` is the two code units `a`, `b` (the pattern has no flag `i`). */
function pairAt(text: string, at: number, a: number, b: number): boolean {
  return text.charCodeAt(at) === a && text.charCodeAt(at + 1) === b;
}

/**
 * Where the ordinal pattern's match at `s` ends (the first of its alternatives that matches there,
 * in their order), or -1. `s` is a digit and `r` the end of the run of digits it is in.
 */
function ordinalEnd(text: string, s: number, r: number): number {
  const c0 = text.charCodeAt(s);
  const c1 = text.charCodeAt(s + 1);
  // 1\dth | [04-9]th | 1st | 2nd | 3rd
  if (c0 === ONE && isDigit(c1) && pairAt(text, s + 2, T, H)) return s + 4;
  if (isThDigit(c0) && pairAt(text, s + 1, T, H)) return s + 3;
  if (c0 === ONE && pairAt(text, s + 1, S, T)) return s + 3;
  if (c0 === TWO && pairAt(text, s + 1, N, D)) return s + 3;
  if (c0 === THREE && pairAt(text, s + 1, R, D)) return s + 3;
  // [02-9]1st | [02-9]2nd | [02-9]3rd | [02-9][04-9]th
  if (isTensDigit(c0)) {
    if (c1 === ONE && pairAt(text, s + 2, S, T)) return s + 4;
    if (c1 === TWO && pairAt(text, s + 2, N, D)) return s + 4;
    if (c1 === THREE && pairAt(text, s + 2, R, D)) return s + 4;
    if (isThDigit(c1) && pairAt(text, s + 2, T, H)) return s + 4;
  }
  // \d+\d[04-9]th | \d+\d1st | \d+\d2nd | \d+\d3rd: the suffix follows the run's last digit (a letter
  // ends the run), so they match when at least three digits run from s to it.
  if (r - s >= 3) {
    const last = text.charCodeAt(r - 1);
    if (isThDigit(last) && pairAt(text, r, T, H)) return r + 2;
    if (last === ONE && pairAt(text, r, S, T)) return r + 2;
    if (last === TWO && pairAt(text, r, N, D)) return r + 2;
    if (last === THREE && pairAt(text, r, R, D)) return r + 2;
  }
  return -1;
}

/**
 * wink-tokenizer's ordinal rule (WINK_PATTERNS.ordinalL1) in linear time: the leftmost match at or
 * after `from`. The pattern run as it is lets `\d+` take the rest of a run of digits and give it back
 * digit by digit at every start in the run (quadratic in the run's length); here each start costs a
 * few comparisons, with the end of its run of digits found once per run. Every match ends past the
 * run its start is in, so the next search starts on new text.
 * @example findOrdinal('on the 21st', 0, found) // true; found 7 to 11
 */
export function findOrdinal(text: string, from: number, found: Found): boolean {
  const n = text.length;
  let runEnd = from;
  let s = from;
  for (; s < n; s++) {
    if (!isDigit(text.charCodeAt(s))) continue;
    if (s >= runEnd) {
      for (runEnd = s + 1; isDigit(text.charCodeAt(runEnd)); runEnd++);
      scanWork.units += runEnd - s;
    }
    const end = ordinalEnd(text, s, runEnd);
    if (end >= 0) {
      found.start = s;
      found.end = end;
      scanWork.units += s - from + 1;
      return true;
    }
  }
  scanWork.units += s - from;
  found.start = n;
  return false;
}
