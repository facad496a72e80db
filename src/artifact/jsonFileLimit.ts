import { inputError, type Where } from '../LexlockError.js';

/**
 * The most bytes a lexicon or tally file may have: 536,870,888, the longest string V8 makes (2^29 - 24
 * UTF-16 code units on 64-bit systems, Node's `buffer.constants.MAX_STRING_LENGTH`). Such a file is
 * read as one JSON text, and N bytes of UTF-8 decode to at most N code units, so every file within the
 * limit can be decoded and none past it can. A lexicon of 30,000 words of 3 to 10 letters has 0.4 MiB.
 */
export const JSON_FILE_MOST_BYTES = 2 ** 29 - 24;

/** What to do about a file over the limit, by kind. */
const ADVICE = {
  lexicon: 'check that it is a lexicon file written by lexlock build',
  tally: 'build from the corpus itself (with --memory-limit if memory is short), or count the parts with --collapse number,url so they hold fewer distinct tokens',
};

/**
 * `FILE_TOO_LARGE` for a lexicon or tally file of `size` bytes (null: past the limit, size unknown), e.g.
 * `lexicon.json: this file has 1,073,741,824 bytes, more than the 536,870,888 bytes a lexicon file may have ...`.
 */
export function jsonFileTooLarge(kind: 'lexicon' | 'tally', size: number | null, where: Where) {
  const has = size === null ? '' : `${size.toLocaleString('en-US')} bytes, `;
  return inputError(
    'FILE_TOO_LARGE',
    where,
    `this file has ${has}more than the ${JSON_FILE_MOST_BYTES.toLocaleString('en-US')} bytes a ${kind} file may have (the longest string V8 makes); ${ADVICE[kind]}`,
  );
}

/** Throws {@link jsonFileTooLarge} when `size` bytes are more than {@link JSON_FILE_MOST_BYTES}. */
export function checkJsonFileSize(kind: 'lexicon' | 'tally', size: number, where: Where): void {
  if (size > JSON_FILE_MOST_BYTES) throw jsonFileTooLarge(kind, size, where);
}

/** A leading byte order mark (U+FEFF) dropped: editors may save one before a JSON text. */
export function withoutBom(text: string): string {
  return text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
}
