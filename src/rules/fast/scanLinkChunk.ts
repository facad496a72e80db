import { scanPlainChunk } from './scanPlainChunk.js';

// wink-tokenizer 5.3.0's URL and e-mail patterns, written out again because the library does not
// export them; the fast path's differential tests (tests/rules/fast) fail if they ever drift from it.
const URL = /(?:https?:\/\/)(?:[\da-z\.-]+)\.(?:[a-z\.]{2,6})(?:[\/\w\.\-\?#=]*)*\/?/gi;
const EMAIL = /[-!#$%&'*+\/=?^\w{|}~](?:\.?[-!#$%&'*+\/=?^\w`{|}~])*@[a-z0-9](?:-?\.?[a-z0-9])*(?:\.[a-z](?:-?[a-z0-9])*)+/gi;

type Rest = (text: string, from: number, to: number, raw: string[], tagged: boolean) => boolean;

/**
 * wink's way with one rule: its matches in `text[from, to)` become tokens with `tag`, and the text
 * between them is left to the rules after it (`rest`). False as soon as `rest` cannot take a part.
 */
function splitBy(pattern: RegExp, tag: string, rest: Rest): Rest {
  return (text, from, to, raw, tagged) => {
    const part = from === 0 && to === text.length ? text : text.slice(from, to);
    pattern.lastIndex = 0;
    let at = 0;
    for (let m = pattern.exec(part); m !== null; m = pattern.exec(part)) {
      if (m.index > at && !rest(part, at, m.index, raw, tagged)) return false;
      if (tagged) raw.push(m[0], tag);
      else raw.push(m[0]);
      at = m.index + m[0].length;
    }
    return at >= part.length || rest(part, at, part.length, raw, tagged);
  };
}

const plainPart: Rest = (text, from, to, raw, tagged) => scanPlainChunk(text, from, raw, tagged, to) === to;

/** The chunk's URLs, then its e-mail addresses in what is left, then the plain scanner on the rest. */
const urlsThenAddresses: Rest = splitBy(URL, 'url', splitBy(EMAIL, 'email', plainPart));

/**
 * Tokenizes the chunk `text[start, end)` (no white space in it) that holds a URL or an e-mail address
 * as wink-tokenizer would: its URL rule first, then its e-mail rule on what is left, then
 * {@link scanPlainChunk} on each remaining part, which must take all of it. Appends value/tag pairs to
 * `raw` (values alone when `tagged` is false) and returns true, or returns false, having appended
 * some, when a part is not plain: the caller then drops what was appended and leaves the chunk to wink.
 * @example scanLinkChunk('<ann@example.org>;', 0, 18, raw, true) // true; raw gets '<', 'symbol', 'ann@example.org', 'email', '>', …
 */
export function scanLinkChunk(text: string, start: number, end: number, raw: string[], tagged: boolean): boolean {
  return urlsThenAddresses(text, start, end, raw, tagged);
}
