import type { Found } from './Finder.js';
import { scanWork } from './scanWork.js';

// The classes of wink-tokenizer's e-mail pattern (WINK_PATTERNS.email): the local part's first
// character, the characters after it (a backtick too), and the part after the `@`, which is matched by
// its own pattern from the `@` on. Code units from 128 up are in neither class (a test checks every
// one against the engine), so a table of 128 is the whole class.
const LOCAL_FIRST = /[-!#$%&'*+\/=?^\w{|}~]/i;
const LOCAL_NEXT = /[-!#$%&'*+\/=?^\w`{|}~]/i;
/**
 * The e-mail pattern after its `@`, as a sticky pattern (tests check it is the tail of wink's): the
 * definition {@link domainEnd} reproduces without the engine's backtracking stack.
 */
export const DOMAIN = /[a-z0-9](?:-?\.?[a-z0-9])*(?:\.[a-z](?:-?[a-z0-9])*)+/iy;

const FIRST = 1;
const NEXT = 2;
const LOCAL = new Uint8Array(128);
for (let c = 0; c < 128; c++) {
  const ch = String.fromCharCode(c);
  if (LOCAL_FIRST.test(ch)) LOCAL[c] = (LOCAL[c] as number) | FIRST;
  if (LOCAL_NEXT.test(ch)) LOCAL[c] = (LOCAL[c] as number) | NEXT;
}

const DOT = 0x2e;
const AT = 0x40;
const HYPHEN = 0x2d;

/** `[a-z0-9]` with flag `i` (ASCII only without flag `u`); false for NaN. */
function isAlnum(code: number): boolean {
  const lower = code | 0x20;
  return (code >= 0x30 && code <= 0x39) || (lower >= 0x61 && lower <= 0x7a);
}

/** `[a-z]` with flag `i`. */
function isLetter(code: number): boolean {
  const lower = code | 0x20;
  return lower >= 0x61 && lower <= 0x7a;
}

/** Where one `-?\.?[a-z0-9]` that starts at `p` ends, or -1 (its parts can match only one way). */
function loopStep(text: string, p: number): number {
  let q = p;
  if (text.charCodeAt(q) === HYPHEN) q++;
  if (text.charCodeAt(q) === DOT) q++;
  return isAlnum(text.charCodeAt(q)) ? q + 1 : -1;
}

/**
 * Where {@link DOMAIN} matching from `at` ends, or -1, in linear time and without the engine's stack
 * (run as a pattern on a run of a few million characters V8 gives up: "Maximum call stack size
 * exceeded"). The pattern's first loop, `(?:-?\.?[a-z0-9])*`, can split the text into steps only one
 * way; it takes as many as it can, then gives them back one at a time until its tail,
 * `(?:\.[a-z](?:-?[a-z0-9])*)+`, matches where it stands, which happens exactly where a given-back step
 * was `.` and a letter (where it stopped the tail cannot match, or it would have taken one more
 * step). So the match runs from the last such step on, as far as the tail takes it greedily.
 */
export function domainEnd(text: string, at: number): number {
  if (!isAlnum(text.charCodeAt(at))) return -1;
  let lastDotLetter = -1;
  let p = at + 1;
  for (let next = loopStep(text, p); next >= 0; next = loopStep(text, p)) {
    if (text.charCodeAt(p) === DOT && isLetter(text.charCodeAt(p + 1))) lastDotLetter = p;
    p = next;
  }
  if (lastDotLetter < 0) return -1;
  // The tail from there, greedily: `.` and a letter, then (-?[a-z0-9])*, as often as it comes.
  let q = lastDotLetter;
  while (text.charCodeAt(q) === DOT && isLetter(text.charCodeAt(q + 1))) {
    q += 2;
    for (;;) {
      if (isAlnum(text.charCodeAt(q))) q += 1;
      else if (text.charCodeAt(q) === HYPHEN && isAlnum(text.charCodeAt(q + 1))) q += 2;
      else break;
    }
  }
  scanWork.units += p - at;
  return q;
}

/** Whether code unit `code` (NaN past the end of a text) is in class `bit`. */
function isLocal(code: number, bit: number): boolean {
  return code < 128 && ((LOCAL[code] as number) & bit) !== 0;
}

/**
 * wink-tokenizer's e-mail rule (WINK_PATTERNS.email) in linear time: the leftmost match at or after
 * `from`, as the regular expression's search finds it. The pattern run as it is retries every start in
 * a long run of local-part characters and scans to the run's end each time (quadratic). Here: from a
 * start `s` the local part can only end at one place `e`, as far as its characters (single dots between
 * them) reach, because neither `@` nor what stops the run is a local-part character, so backtracking
 * cannot end it anywhere else; every start between `s` and `e` reaches the same `e`, so when `e` is no
 * `@`, or the part after it (matched once, by {@link domainEnd}) fails, all of them fail and the search
 * goes on at `e`. Each character is looked at a bounded number of times.
 * @example findEmail('a_b <ann@ferry.example>', 0, found) // true; found 5 to 22
 */
export function findEmail(text: string, from: number, found: Found): boolean {
  const n = text.length;
  let steps = 0;
  let s = from;
  while (s < n) {
    steps += 1;
    if (!isLocal(text.charCodeAt(s), FIRST)) {
      s++;
      continue;
    }
    let e = s + 1;
    for (;;) {
      const code = text.charCodeAt(e);
      if (isLocal(code, NEXT)) e += 1;
      else if (code === DOT && isLocal(text.charCodeAt(e + 1), NEXT)) e += 2;
      else break;
    }
    steps += e - s;
    if (text.charCodeAt(e) === AT) {
      const end = domainEnd(text, e + 1);
      if (end >= 0) {
        found.start = s;
        found.end = end;
        scanWork.units += steps;
        return true;
      }
    }
    s = e;
  }
  scanWork.units += steps;
  found.start = n;
  return false;
}
