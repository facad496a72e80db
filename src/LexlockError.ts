/** Where in an input a problem was found; every member is optional and filled in as known. */
export interface Where {
  /** File or corpus path as the user named it. */
  file?: string;
  /** 1-based physical line in the file. */
  line?: number;
  /** 1-based data row (CSV/TSV: the header is row 0). */
  row?: number;
  /** Field, flag or lexicon member concerned. */
  field?: string;
  /** 0-based byte offset from the start of the file. */
  byteOffset?: number;
}

/** Stable error codes; tools and tests may rely on them. */
export type LexlockErrorCode =
  | 'BAD_UTF8'
  | 'SKIPPED_TEXT'
  | 'CSV_UNCLOSED_QUOTE'
  | 'CSV_FIELD_COUNT'
  | 'CSV_BAD_HEADER'
  | 'CSV_BAD_QUOTE'
  | 'JSONL_NOT_JSON'
  | 'JSONL_NOT_OBJECT'
  | 'MISSING_FIELD'
  | 'MISSING_LABELS'
  | 'DUPLICATE_KEY'
  | 'BAD_FIELD_TYPE'
  | 'EMPTY_CORPUS'
  | 'CORPUS_NOT_FOUND'
  | 'CORPUS_KIND'
  | 'NOT_JSON'
  | 'NOT_A_LEXICON'
  | 'NEWER_FORMAT'
  | 'OLD_FORMAT'
  | 'BAD_LEXICON'
  | 'FINGERPRINT_MISMATCH'
  | 'DUPLICATE_TOKEN'
  | 'CANARY_MISMATCH'
  | 'BAD_OPTION'
  | 'ID_OUT_OF_RANGE'
  | 'UNKNOWN_LABEL'
  | 'BAD_TEXT'
  | 'RECORD_TOO_LARGE'
  | 'NOT_A_FILE'
  | 'FILE_TOO_LARGE'
  | 'OUTPUT_EXISTS'
  | 'OUTPUT_SYMLINK'
  | 'OUTPUT_BUSY'
  | 'IO'
  | 'NPY_SHAPE'
  | 'WRITER_CLOSED'
  | 'MEMORY_LIMIT'
  | 'CORPUS_CHANGED'
  | 'NOT_A_TALLY'
  | 'BAD_TALLY'
  | 'TALLY_RULES_DIFFER'
  | 'USAGE_UNKNOWN_FLAG'
  | 'USAGE_BAD_VALUE'
  | 'USAGE_MISSING'
  | 'USAGE_UNKNOWN_COMMAND';

/**
 * The one error type lexlock throws on purpose. `message` says what is wrong, where, and what to do;
 * `code` is stable; `where` holds the place as far as it is known.
 * @example
 * try { parseLexicon(text) } catch (e) { if (isLexlockError(e) && e.code === 'FINGERPRINT_MISMATCH') ... }
 */
export class LexlockError extends Error {
  override readonly name = 'LexlockError';
  readonly code: LexlockErrorCode;
  readonly where: Where;

  constructor(code: LexlockErrorCode, message: string, where: Where = {}) {
    super(message);
    this.code = code;
    this.where = where;
  }

  /** True for errors that come from how lexlock was called (CLI exit code 2) rather than from the input. */
  get isUsage(): boolean {
    return this.code.startsWith('USAGE_') || this.code === 'BAD_OPTION';
  }
}

/** Type guard for {@link LexlockError}, safe across package copies (checks the name and code). */
export function isLexlockError(value: unknown): value is LexlockError {
  return (
    value instanceof LexlockError ||
    (value instanceof Error && value.name === 'LexlockError' && typeof (value as { code?: unknown }).code === 'string')
  );
}

/**
 * Formats a place as the start of a message: `reviews.csv line 4`, `reviews.csv line 7 (row 6)`,
 * `reviews.csv byte 1031`, `lexicon.json member encoding.tokens` (a field is named only without a line).
 */
export function formatWhere(where: Where): string {
  const parts: string[] = [];
  if (where.file !== undefined) parts.push(where.file);
  if (where.line !== undefined) parts.push(`line ${where.line}`);
  else if (where.row !== undefined) parts.push(`row ${where.row}`);
  if (where.line !== undefined && where.row !== undefined) parts.push(`(row ${where.row})`);
  if (where.line === undefined && where.row === undefined && where.byteOffset !== undefined) {
    parts.push(`byte ${where.byteOffset}`);
  }
  if (where.file !== undefined && where.line === undefined && where.row === undefined && where.field !== undefined) {
    parts.push(`member ${where.field}`);
  }
  return parts.join(' ');
}

/** Builds a LexlockError whose message starts with the formatted place: `file line 4: what; what to do`. */
export function inputError(code: LexlockErrorCode, where: Where, detail: string): LexlockError {
  const place = formatWhere(where);
  return new LexlockError(code, place === '' ? detail : `${place}: ${detail}`, where);
}
