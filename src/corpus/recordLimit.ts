import { inputError, type LexlockError, type Where } from '../LexlockError.js';

const MIB = 2 ** 20;

/**
 * Default most bytes of one record (a line of .txt/.jsonl, a record of .csv/.tsv, a file of a
 * folder): 64 MiB. That is far more than any one document a sequence classifier is trained on (a
 * book-length text is a few MiB), so it refuses only files that are not what they seem (no line
 * breaks, a quote never closed, a stray binary file) before they are gathered whole into memory; and
 * while a record is gathered, a reader holds about the record's bytes plus one read chunk.
 */
export const RECORD_LIMIT_DEFAULT = 64 * MIB;

/**
 * The highest record limit accepted: 256 MiB. V8 makes no string longer than 2^29 - 24 UTF-16 code
 * units (`buffer.constants.MAX_STRING_LENGTH`, about 512 Mi); N bytes of UTF-8 decode to at most N
 * units, and a CSV batch (its record joined with up to 64 KiB of others) and fast-csv's own copies
 * need room beside the record, so half of that is kept as the ceiling.
 */
export const RECORD_LIMIT_MOST = 256 * MIB;

/** A record limit as messages say it: `64 MiB` for whole MiB, else `1000 bytes`. */
export function describeLimit(bytes: number): string {
  return bytes % MIB === 0 ? `${bytes / MIB} MiB` : `${bytes} bytes`;
}

const RAISE = 'raise the limit with --record-limit MiB (up to 256)';

/**
 * `RECORD_TOO_LARGE` for a line (without its line feed, a trailing CR and the file's BOM not
 * counted) longer than the limit, e.g.
 * `notes.txt line 7: this line is longer than the record limit of 64 MiB; split it into smaller documents, or raise ...`.
 */
export function lineTooLong(where: Where, limit: number): LexlockError {
  return inputError(
    'RECORD_TOO_LARGE',
    where,
    `this line is longer than the record limit of ${describeLimit(limit)}; split it into smaller documents, or ${RAISE}`,
  );
}

/**
 * `RECORD_TOO_LARGE` for a CSV/TSV record that goes on over several lines (inside quotes) past the
 * limit; `where` is where the record starts, `quoteOffset` the byte where the quote still open was opened.
 */
export function recordTooLong(where: Where, limit: number, quoteOffset: number): LexlockError {
  return inputError(
    'RECORD_TOO_LARGE',
    where,
    `the record that starts here goes on past the record limit of ${describeLimit(limit)} inside the quote opened at byte ${quoteOffset}; ` +
      `close that quote (write each quote inside a field as ""), or ${RAISE}`,
  );
}

/** `RECORD_TOO_LARGE` for a file of a folder corpus with more bytes than the limit. */
export function fileTooLarge(file: string, limit: number): LexlockError {
  return inputError(
    'RECORD_TOO_LARGE',
    { file },
    `this file is larger than the record limit of ${describeLimit(limit)} for one document; split it into smaller files, or ${RAISE}`,
  );
}
