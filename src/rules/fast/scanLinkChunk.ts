import { TYPE_CODE, type SpanSink } from '../TokenSpans.js';
import { findEmail } from './findEmail.js';
import { finderOf, type Finder, type Found } from './Finder.js';
import { scanPlainChunk } from './scanPlainChunk.js';
import { WINK_PATTERNS } from './winkPatterns.js';

// wink-tokenizer's URL and e-mail rules (the e-mail one by its linear scanner). Both ignore case, so
// ASCII text may be scanned before it is lower-cased.
const findUrl = finderOf(WINK_PATTERNS.url);

/** Takes `text[from, to)` as one rule and those after it would, reporting spans moved by `shift`; false if it cannot. */
type Rest = (text: string, from: number, to: number, out: SpanSink, shift: number) => boolean;

/**
 * wink's way with one rule: its matches in `text[from, to)` become tokens of `type`, and the text
 * between them is left to the rules after it (`rest`). False as soon as `rest` cannot take a part.
 */
function splitBy(find: Finder, type: number, rest: Rest): Rest {
  const found: Found = { start: 0, end: 0 };
  return (text, from, to, out, shift) => {
    // The rule sees the part alone, as wink's would after the rules before it.
    const part = from === 0 && to === text.length ? text : text.slice(from, to);
    const base = shift + from;
    let at = 0;
    while (find(part, at, found, part.length)) {
      const { start, end } = found;
      if (start > at && !rest(part, at, start, out, base)) return false;
      at = end;
      out.span(base + start, base + end, type);
    }
    return at >= part.length || rest(part, at, part.length, out, base);
  };
}

const plainPart: Rest = (text, from, to, out, shift) => scanPlainChunk(text, from, out, to, shift) === to;

/** The chunk's URLs, then its e-mail addresses in what is left, then the plain scanner on the rest. */
const urlsThenAddresses: Rest = splitBy(findUrl, TYPE_CODE.url, splitBy(findEmail, TYPE_CODE.email, plainPart));

/**
 * Tokenizes the chunk `text[start, end)` (no white space in it) that holds a URL or an e-mail address
 * as wink-tokenizer would: its URL rule first, then its e-mail rule on what is left, then
 * {@link scanPlainChunk} on each remaining part, which must take all of it. Reports spans of `text` to
 * `out` and returns true, or returns false, having reported some, when a part is not plain: the caller
 * then drops what was reported and leaves the chunk to cascadePairs.
 * @example scanLinkChunk('<ann@example.org>;', 0, 18, out) // true; out gets (0, 1, symbol), (1, 16, email), (16, 17, symbol), …
 */
export function scanLinkChunk(text: string, start: number, end: number, out: SpanSink): boolean {
  return urlsThenAddresses(text, start, end, out, 0);
}
