import type { Found } from './Finder.js';
import { scanWork } from './scanWork.js';

// The classes of wink-tokenizer's e-mail pattern (WINK_PATTERNS.email): the local part's first
// character, the characters after it (a backtick too), and the part after the `@`, which is matched by
// its own pattern from the `@` on. Code units from 128 up are in neither class (a test checks every
// one against the engine), so a table of 128 is the whole class.
const LOCAL_FIRST = /[-!#$%&'*+\/=?^\w{|}~]/i;
const LOCAL_NEXT = /[-!#$%&'*+\/=?^\w`{|}~]/i;
/** The e-mail pattern after its `@`, as a sticky pattern (tests check it is the tail of wink's). */
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
 * `@`, or the part after it (matched once, by {@link DOMAIN}) fails, all of them fail and the search
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
      DOMAIN.lastIndex = e + 1;
      const m = DOMAIN.exec(text);
      if (m !== null) {
        found.start = s;
        found.end = e + 1 + m[0].length;
        scanWork.units += steps + m[0].length;
        return true;
      }
    }
    s = e;
  }
  scanWork.units += steps;
  return false;
}
