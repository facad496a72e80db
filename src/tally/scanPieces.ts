import { normalize } from '../rules/normalize.js';
import { scanTokens } from '../rules/scanTokens.js';
import type { TextRules } from '../rules/TextRules.js';
import type { TokenSpans } from '../rules/TokenSpans.js';

/** Characters of a piece: text is tokenized this many at a time (fewer where no cut falls at the mark, more in an uncut run). */
export const PIECE_CHARS = 1024;
/** NFKC makes at most 18 code units of one (U+FDFA), 2 bytes each: bytes a raw run takes per character while it is normalized. */
const NORMALIZE_BYTES_PER_CHAR = 2 * 18 * 2;
/**
 * Bytes tokenizing takes per character of normalized text, at most: measured up to 80 (wink-tokenizer's
 * objects for contractions and alien scripts, see DEVELOPERS.md), with room to spare.
 */
export const TOKENIZE_BYTES_PER_CHAR = 120;

const SPACE = 0x20;
const TAB = 0x09;
const LF = 0x0a;
const CR = 0x0d;
const COLON = 0x3a;
const WHITE = /\s/u;

/** Whether code unit `c` is an ASCII digit, ':' or white space: what may not come just before a cut. */
function holdsOn(c: number): boolean {
  return (c >= 0x30 && c <= 0x39) || c === COLON || c === SPACE || c === TAB || c === LF || c === CR;
}

/**
 * Whether a text may be cut just before `text[i]` with the tokens on either side unchanged: `text[i]`
 * is ASCII white space (space, tab, LF, CR) and what comes before it, once normalized, is neither
 * white space (so a run of it stays one, for the character level) nor a digit or ':' (wink-tokenizer's
 * time rule, `10 am`, is the only one that matches across white space: DEVELOPERS.md, "the one path
 * from text to tokens"; `① am` is `1 am` once NFKC is done). ASCII white space never combines with
 * what comes before it under NFC or NFKC, nor changes how a final sigma is lower-cased, so the pieces
 * normalized one by one give the normalized text. `rules` is null for text already normalized.
 */
function cutsBefore(text: string, i: number, rules: TextRules | null): boolean {
  const c = text.charCodeAt(i);
  if (c !== SPACE && c !== TAB && c !== LF && c !== CR) return false;
  const before = text.charCodeAt(i - 1);
  if (before < 0x80) return !holdsOn(before);
  let last = String.fromCharCode(before);
  // The whole character before the cut: a surrogate pair's two halves.
  if (before >= 0xdc00 && before <= 0xdfff && i >= 2) {
    const high = text.charCodeAt(i - 2);
    if (high >= 0xd800 && high <= 0xdbff) last = String.fromCharCode(high, before);
  }
  if (rules !== null) last = normalize(last, rules);
  const end = last.charCodeAt(last.length - 1);
  return !(end < 0x80 ? holdsOn(end) : WHITE.test(String.fromCharCode(end)));
}

/** Where the piece of `text` that starts at `from` ends: the last cut within `most` characters, else the first one after, else the end. */
function pieceEnd(text: string, from: number, most: number, rules: TextRules | null): number {
  const mark = from + most;
  if (mark >= text.length) return text.length;
  for (let i = mark; i > from; i--) if (cutsBefore(text, i, rules)) return i;
  for (let i = mark + 1; i < text.length; i++) if (cutsBefore(text, i, rules)) return i;
  return text.length;
}

/** What a normalizing cut may not come before: marks, letters with case or that case skips (a final sigma looks past them), Hangul jamo that join a syllable. */
const JOINS_BEFORE = /[\p{M}\p{Cased}\p{Case_Ignorable}\u1160-\u11ff]/u;

/**
 * Whether `text` may be cut just before `text[i]` for normalizing and lower-casing as `rules` say, the
 * pieces done one by one giving the whole done at once: `text[i]` starts a character that normalization
 * leaves as it is and that never composes with what comes before it (a starter, quick-check Yes: Unicode
 * UAX #15, "Stable Code Points"), has no case and is not skipped by the final-sigma rule (Unicode's
 * Final_Sigma condition), so lower-casing on either side is unchanged.
 */
function normalCutBefore(text: string, i: number, rules: TextRules): boolean {
  const c = text.charCodeAt(i);
  if (c >= 0xdc00 && c <= 0xdfff) return false;
  const high = c >= 0xd800 && c <= 0xdbff;
  const next = text.charCodeAt(i + 1);
  const char = high && next >= 0xdc00 && next <= 0xdfff ? text.slice(i, i + 2) : text[i] as string;
  if (high && char.length === 1) return false;
  if (rules.unicode !== 'none' && char.normalize(rules.unicode) !== char) return false;
  return !JOINS_BEFORE.test(char);
}

/**
 * The length of `piece` normalized as `rules` say, found `most` characters at a time where
 * {@link normalCutBefore} allows, so that only one such chunk is normalized at once; -1 when a chunk
 * (no cut in it) would take more than `bytes` to normalize.
 */
function normalizedLength(piece: string, rules: TextRules, most: number, bytes: number): number {
  let length = 0;
  for (let at = 0; at < piece.length; ) {
    let end = Math.min(piece.length, at + most);
    if (end < piece.length) {
      let cut = end;
      while (cut > at && !normalCutBefore(piece, cut, rules)) cut--;
      if (cut === at) {
        cut = end + 1;
        while (cut < piece.length && !normalCutBefore(piece, cut, rules)) cut++;
      }
      end = cut;
    }
    if ((end - at) * NORMALIZE_BYTES_PER_CHAR > bytes) return -1;
    length += normalize(piece.slice(at, end), rules).length;
    at = end;
  }
  return length;
}

function isAscii(text: string): boolean {
  for (let i = 0; i < text.length; i++) if (text.charCodeAt(i) > 0x7f) return false;
  return true;
}

/** The rules for text already normalized and lower-cased as `rules` say: the same tokens, nothing done to the text again. */
const plainRules = new WeakMap<TextRules, TextRules>();
function plainOf(rules: TextRules): TextRules {
  let plain = plainRules.get(rules);
  if (plain === undefined) {
    plain = { ...rules, unicode: 'none', case: 'keep' };
    plainRules.set(rules, plain);
  }
  return plain;
}

/** What {@link scanPieces} could not tokenize within its limit. */
export interface SkippedRuns {
  /** The bytes the longest of them would have needed. */
  bytes: number;
  /** Their characters once normalized, at most (an uncut run NFKC did not get to counts 18 a character). */
  chars: number;
}

/**
 * Tokenizes `text` under `rules` a piece at a time, leaving each piece's tokens in `spans` and calling
 * `each` with it: the pieces' tokens, one after another, are exactly `tokenize(text, rules)`'s, but
 * memory holds one piece (about {@link PIECE_CHARS} characters) at a time, not a whole document's
 * tokens. A piece is normalized, cut again where its normalized text allows, and tokenized with the
 * normalization already done. An uncut run longer than `runBytes` allows (NFKC may make it 18 times
 * longer; tokenizing takes {@link TOKENIZE_BYTES_PER_CHAR} a character) is not tokenized: what it would
 * have needed is returned (null when the whole text went through). `pieceChars` is for tests.
 * @example scanPieces(book, resolveRules(), spans, (s) => count(s), 8 * 2 ** 20) // null
 */
export function scanPieces(
  text: string,
  rules: TextRules,
  spans: TokenSpans,
  each: (spans: TokenSpans) => void,
  runBytes: number,
  pieceChars = PIECE_CHARS,
): SkippedRuns | null {
  let skipped: SkippedRuns | null = null;
  const skip = (bytes: number, chars: number) => {
    skipped ??= { bytes: 0, chars: 0 };
    skipped.bytes = Math.max(skipped.bytes, bytes);
    skipped.chars += chars;
  };
  for (let at = 0; at < text.length; ) {
    const end = pieceEnd(text, at, pieceChars, rules);
    const piece = text.slice(at, end);
    at = end;
    if (isAscii(piece)) {
      // ASCII is read lower-cased where it lies (scanTokens folds it): nothing to normalize.
      const bytes = piece.length * TOKENIZE_BYTES_PER_CHAR;
      if (bytes > runBytes) skip(bytes, piece.length);
      else each(scanTokens(piece, rules, spans, true));
      continue;
    }
    if (piece.length * NORMALIZE_BYTES_PER_CHAR > runBytes) {
      // Too long to normalize at once with room for NFKC's worst: find its normalized length a chunk at a
      // time, and go on only if the normalized text fits (then its runs are measured as any others).
      const length = normalizedLength(piece, rules, pieceChars, runBytes);
      if (length < 0) {
        skip(piece.length * 18 * TOKENIZE_BYTES_PER_CHAR, piece.length * 18);
        continue;
      }
      if (length * 2 * 2 > runBytes) {
        skip(length * TOKENIZE_BYTES_PER_CHAR, length);
        continue;
      }
    }
    const normal = normalize(piece, rules);
    const plain = plainOf(rules);
    for (let from = 0; from < normal.length; ) {
      const to = pieceEnd(normal, from, pieceChars, null);
      const bytes = (to - from) * TOKENIZE_BYTES_PER_CHAR;
      if (bytes > runBytes) skip(bytes, to - from);
      else each(scanTokens(normal.slice(from, to), plain, spans, true));
      from = to;
    }
  }
  return skipped;
}
