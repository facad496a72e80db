import { TYPE_CODE, type SpanSink } from '../TokenSpans.js';
import { scanPlainChunk } from './scanPlainChunk.js';

// wink-tokenizer 5.3.0's URL and e-mail patterns, written out again because the library does not
// export them; the fast path's differential tests (tests/rules/fast) fail if they ever drift from it.
// Both ignore case, so ASCII text may be scanned before it is lower-cased.
const URL = /(?:https?:\/\/)(?:[\da-z\.-]+)\.(?:[a-z\.]{2,6})(?:[\/\w\.\-\?#=]*)*\/?/gi;
const EMAIL = /[-!#$%&'*+\/=?^\w{|}~](?:\.?[-!#$%&'*+\/=?^\w`{|}~])*@[a-z0-9](?:-?\.?[a-z0-9])*(?:\.[a-z](?:-?[a-z0-9])*)+/gi;

/** Takes `text[from, to)` as one rule and those after it would, reporting spans moved by `shift`; false if it cannot. */
type Rest = (text: string, from: number, to: number, out: SpanSink, shift: number) => boolean;

/**
 * wink's way with one rule: its matches in `text[from, to)` become tokens of `type`, and the text
 * between them is left to the rules after it (`rest`). False as soon as `rest` cannot take a part.
 */
function splitBy(pattern: RegExp, type: number, rest: Rest): Rest {
  return (text, from, to, out, shift) => {
    // The rule sees the part alone, as wink's would after the rules before it.
    const part = from === 0 && to === text.length ? text : text.slice(from, to);
    const base = shift + from;
    pattern.lastIndex = 0;
    let at = 0;
    for (let m = pattern.exec(part); m !== null; m = pattern.exec(part)) {
      if (m.index > at && !rest(part, at, m.index, out, base)) return false;
      at = m.index + m[0].length;
      out.span(base + m.index, base + at, type);
    }
    return at >= part.length || rest(part, at, part.length, out, base);
  };
}

const plainPart: Rest = (text, from, to, out, shift) => scanPlainChunk(text, from, out, to, shift) === to;

/** The chunk's URLs, then its e-mail addresses in what is left, then the plain scanner on the rest. */
const urlsThenAddresses: Rest = splitBy(URL, TYPE_CODE.url, splitBy(EMAIL, TYPE_CODE.email, plainPart));

/**
 * Tokenizes the chunk `text[start, end)` (no white space in it) that holds a URL or an e-mail address
 * as wink-tokenizer would: its URL rule first, then its e-mail rule on what is left, then
 * {@link scanPlainChunk} on each remaining part, which must take all of it. Reports spans of `text` to
 * `out` and returns true, or returns false, having reported some, when a part is not plain: the caller
 * then drops what was reported and leaves the chunk to wink.
 * @example scanLinkChunk('<ann@example.org>;', 0, 18, out) // true; out gets (0, 1, symbol), (1, 16, email), (16, 17, symbol), …
 */
export function scanLinkChunk(text: string, start: number, end: number, out: SpanSink): boolean {
  return urlsThenAddresses(text, start, end, out, 0);
}
