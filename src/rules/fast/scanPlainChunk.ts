import { TYPE_CODE, type SpanSink } from '../TokenSpans.js';

// Character classes for code units below 256 (anything above is "other").
const OTHER = 0;
const LETTER = 1;
const DIGIT = 2;
const PUNCT = 3;
const CURRENCY = 4;
const SYMBOL = 5;

const CLASS = new Uint8Array(256);
for (let c = 0x61; c <= 0x7a; c++) CLASS[c] = LETTER;
for (let c = 0x41; c <= 0x5a; c++) CLASS[c] = LETTER;
// wink's Latin-1 letter ranges: U+00C0-U+00D6, U+00D8-U+00F6, U+00F8-U+00FF.
for (let c = 0xc0; c <= 0xff; c++) if (c !== 0xd7 && c !== 0xf7) CLASS[c] = LETTER;
for (let c = 0x30; c <= 0x39; c++) CLASS[c] = DIGIT;
// Punctuation wink tags one character at a time and no earlier rule of its can claim here
// (the apostrophe and backtick are left out: the apostrophe belongs to words and contractions).
for (const ch of ',.!?;:"()[]{}-') CLASS[ch.charCodeAt(0)] = PUNCT;
// wink's currency signs below U+0100.
for (const ch of '$£¥') CLASS[ch.charCodeAt(0)] = CURRENCY;
// wink's symbols below U+0100 that no earlier rule of its can claim without an `@` (e-mail, mention)
// or a `#` (hashtag) in the chunk, both left out; `<` is taken only when no `3` follows (`<3`).
for (const ch of '~%^+=*|/<>&') CLASS[ch.charCodeAt(0)] = SYMBOL;

// After ':' or ';' only these may follow without risking an emoticon (`:-)`, `;d`, `:[`…). No letter
// may follow, which also keeps out times written `10:am`.
const AFTER_EMOTICON_START = new Uint8Array(256);
// White space below U+0100 may follow too: it ends the chunk.
for (const ch of ',.!?;:"0123456789 \t\n\v\f\r\u00A0') AFTER_EMOTICON_START[ch.charCodeAt(0)] = 1;

const COLON = 0x3a;
const SEMICOLON = 0x3b;
const DOT = 0x2e;
const COMMA = 0x2c;
const HYPHEN = 0x2d;
const SLASH = 0x2f;
const LESS_THAN = 0x3c;
const THREE = 0x33;

const WORD = TYPE_CODE.word;
const NUMBER = TYPE_CODE.number;
const PUNCTUATION = TYPE_CODE.punctuation;
const SYMBOL_TYPE = TYPE_CODE.symbol;
const CURRENCY_TYPE = TYPE_CODE.currency;

function classAt(text: string, i: number): number {
  const code = text.charCodeAt(i);
  return code < 256 ? (CLASS[code] as number) : OTHER;
}

/**
 * Whether the two code units after a digit could begin wink's time suffix (`am`, `a.m.`, `pm`, `hours`,
 * `hrs`) or an ordinal's (`th`, `st`, `nd`, `rd`), in either case: a conservative test (`ho` and `hr`
 * stand for `hours` and `hrs`), so a letter after a digit is taken only when neither rule can match.
 */
function mayStartSuffix(first: number, second: number): boolean {
  const a = first | 0x20;
  const b = second | 0x20;
  if (a === 0x61 || a === 0x70) return b === 0x6d || second === DOT; // a/p then m or '.'
  if (a === 0x68) return b === 0x6f || b === 0x72; // h then o or r
  if (a === 0x74) return b === 0x68; // th
  if (a === 0x73) return b === 0x74; // st
  if (a === 0x6e || a === 0x72) return b === 0x64; // nd, rd
  return false;
}

/**
 * Tokenizes directly the chunk that starts at `start` (a chunk ends at white space, at `end`, or at the
 * end of the text) as far as every wink-tokenizer rule that could apply is one this scanner reproduces:
 * runs of Latin-1 letters (`word`), ASCII digits joined by single `,` `-` `.` `/` (`number`; digits, a
 * `/` and digits are a number on their own, as wink's first number pattern says), single punctuation
 * marks (`punctuation`), `$ £ ¥` (`currency`) and `~ % ^ + = * | / < > &` (`symbol`). It stops at any
 * other character, at letters after a digit that could begin a time or an ordinal (`10am`, `2nd`), at
 * a `:`/`;` followed by anything but `, . ! ? " : ;`, a digit or white space (emoticons, `10:am`), and
 * at `<3`. Reports each token to `out` as a span (moved by `shift`: where `text` starts in the text the
 * spans point into) with wink's tag, in wink's order, and returns where it stopped: the chunk was plain
 * only if that is its end (white space, `end` or the end of the text); otherwise the caller must drop
 * what was reported. Every decision is the same for A-Z as for a-z, so ASCII text may be scanned
 * before it is lower-cased.
 * @example scanPlainChunk('(well-known), ok', 0, out) // 13; out gets (0, 1, punctuation), (1, 5, word), (5, 6, punctuation), …
 */
export function scanPlainChunk(text: string, start: number, out: SpanSink, end = text.length, shift = 0): number {
  let i = start;
  while (i < end) {
    const kind = classAt(text, i);
    if (kind === LETTER) {
      if (i > start && classAt(text, i - 1) === DIGIT && i + 1 < end && mayStartSuffix(text.charCodeAt(i), text.charCodeAt(i + 1))) break;
      const from = i;
      for (i++; i < end && classAt(text, i) === LETTER; i++);
      out.span(from + shift, i + shift, WORD);
    } else if (kind === DIGIT) {
      const from = i;
      for (i++; i < end && classAt(text, i) === DIGIT; i++);
      if (i + 1 < end && text.charCodeAt(i) === SLASH && classAt(text, i + 1) === DIGIT) {
        // wink's first number pattern: digits, '/', digits; nothing more joins.
        for (i += 2; i < end && classAt(text, i) === DIGIT; i++);
      } else {
        for (;;) {
          const joint = text.charCodeAt(i);
          if (i + 1 < end && (joint === DOT || joint === COMMA || joint === HYPHEN || joint === SLASH) && classAt(text, i + 1) === DIGIT) i += 2;
          else break;
          for (; i < end && classAt(text, i) === DIGIT; i++);
        }
      }
      out.span(from + shift, i + shift, NUMBER);
    } else if (kind === PUNCT) {
      const code = text.charCodeAt(i);
      if ((code === COLON || code === SEMICOLON) && i + 1 < end && AFTER_EMOTICON_START[text.charCodeAt(i + 1)] !== 1) break;
      out.span(i + shift, i + shift + 1, PUNCTUATION);
      i++;
    } else if (kind === CURRENCY || kind === SYMBOL) {
      if (kind === SYMBOL && text.charCodeAt(i) === LESS_THAN && i + 1 < end && text.charCodeAt(i + 1) === THREE) break;
      out.span(i + shift, i + shift + 1, kind === SYMBOL ? SYMBOL_TYPE : CURRENCY_TYPE);
      i++;
    } else break;
  }
  return i;
}
