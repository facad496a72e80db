import { inputError } from '../LexlockError.js';
import { skipCsvWhitespace } from './csvWhitespace.js';
import type { Line } from './lines.js';
import { recordTooLong } from './recordLimit.js';

/** One CSV/TSV record as bytes (line breaks inside quoted fields included, the record's own line end not), and where it starts. */
export interface CsvRecord {
  bytes: Buffer;
  /** 1-based line the record starts on. */
  line: number;
  /** Absolute byte offset of its first byte. */
  byteOffset: number;
}

const QUOTE = 0x22;
const CR = 0x0d;
const LF_BYTE = Buffer.from([0x0a]);

/**
 * Finds CSV/TSV record boundaries on bytes, line by line, so every record's starting line and byte
 * offset are known before its fields are split (CsvFieldParser). It follows RFC 4180 quoting as fast-csv reads
 * it: a quote opens a field only at the field's start (fast-csv lets white space come first); inside
 * quotes `""` is a quote and line breaks belong to the field; after the closing quote only white
 * space may come before the delimiter or the record's end. A record ends at LF, CRLF or a lone CR
 * outside quotes. Records that are empty or white space only are left out (fast-csv would give them
 * no fields). Bytes are looped over only in lines that hold a quote or a lone CR. A record that goes
 * on over lines past `maxRecordBytes` is refused (`RECORD_TOO_LARGE`) as soon as the lines held of it
 * are more than that, before they are put together; a record inside one line is never longer than
 * the line, which the line splitter bounds.
 */
export class CsvRecordScanner {
  readonly #file: string;
  readonly #delimiter: number;
  readonly #maxRecordBytes: number;
  /** Lines of a record that is still open (inside quotes at a line end). */
  #pieces: Buffer[] = [];
  /** Bytes of the open record so far: its pieces and the line feed after each. */
  #held = 0;
  #line = 0;
  #byteOffset = 0;
  #quoteLine = 0;
  #quoteOffset = 0;

  constructor(file: string, delimiter: ',' | '\t', maxRecordBytes = Number.POSITIVE_INFINITY) {
    this.#file = file;
    this.#delimiter = delimiter.charCodeAt(0);
    this.#maxRecordBytes = maxRecordBytes;
  }

  /**
   * Scans one line and appends the records it completes to `out`. Throws `CSV_BAD_QUOTE` for text
   * after a closing quote, `RECORD_TOO_LARGE` for an open record that has grown past the limit.
   */
  push(line: Line, out: CsvRecord[]): void {
    const b = line.bytes;
    const len = b.length;
    const delimiter = this.#delimiter;
    let inQuotes = this.#pieces.length > 0;
    if (!inQuotes && b.indexOf(QUOTE) === -1) {
      const cr = b.indexOf(CR);
      if (cr === -1 || cr === len - 1) {
        this.#emit(b.subarray(0, cr === -1 ? len : cr), line.line, line.byteOffset, out);
        return;
      }
    }
    let start = 0; // where the current record starts in this line
    let i = 0;
    let fieldStart = !inQuotes;
    let afterQuote = false;
    for (;;) {
      if (inQuotes) {
        const q = b.indexOf(QUOTE, i);
        if (q === -1) {
          // The line ends inside quotes: the record goes on after the line feed.
          if (this.#pieces.length === 0) {
            this.#line = line.line;
            this.#byteOffset = line.byteOffset + start;
          }
          this.#pieces.push(b.subarray(start));
          this.#held += len - start + 1;
          if (this.#held > this.#maxRecordBytes) throw this.#tooLong();
          return;
        }
        if (q + 1 < len && b[q + 1] === QUOTE) {
          i = q + 2; // "" inside quotes is one quote
          continue;
        }
        inQuotes = false;
        afterQuote = true;
        i = q + 1;
      }
      if (afterQuote) {
        afterQuote = false;
        i = skipCsvWhitespace(b, i, len, delimiter);
        if (i < len && b[i] !== delimiter && b[i] !== CR) {
          throw inputError(
            'CSV_BAD_QUOTE',
            { file: this.#file, line: line.line, byteOffset: line.byteOffset + i },
            `text after a closing quote at byte ${line.byteOffset + i}; quote the whole field and write each quote inside it as ""`,
          );
        }
      } else if (fieldStart) {
        const j = skipCsvWhitespace(b, i, len, delimiter);
        if (j < len && b[j] === QUOTE) {
          inQuotes = true;
          this.#quoteLine = line.line;
          this.#quoteOffset = line.byteOffset + j;
          fieldStart = false;
          i = j + 1;
          continue;
        }
      }
      fieldStart = false;
      // An unquoted field (or what follows a closing quote): up to the delimiter, a CR or the line's end.
      let k = i;
      while (k < len && b[k] !== delimiter && b[k] !== CR) k += 1;
      if (k < len && b[k] === delimiter) {
        i = k + 1;
        fieldStart = true;
        continue;
      }
      this.#end(b, start, k, line, out);
      if (k >= len - 1) return; // the line's end, or a CR before its line feed
      start = k + 1; // a lone CR ends a record inside the line
      i = start;
      fieldStart = true;
    }
  }

  /** Call at the end of the input: throws `CSV_UNCLOSED_QUOTE` where the quote of a still-open field was opened. */
  end(): void {
    if (this.#pieces.length === 0) return;
    this.#pieces = [];
    this.#held = 0;
    throw inputError(
      'CSV_UNCLOSED_QUOTE',
      { file: this.#file, line: this.#quoteLine, byteOffset: this.#quoteOffset },
      `quote opened here is never closed (byte ${this.#quoteOffset}); close it with " or escape inner quotes as ""`,
    );
  }

  #end(b: Buffer, start: number, end: number, line: Line, out: CsvRecord[]): void {
    if (this.#pieces.length === 0) {
      this.#emit(b.subarray(start, end), line.line, line.byteOffset + start, out);
      return;
    }
    if (this.#held + end > this.#maxRecordBytes) throw this.#tooLong();
    const parts: Buffer[] = [];
    for (const piece of this.#pieces) parts.push(piece, LF_BYTE);
    parts.push(b.subarray(0, end));
    this.#pieces = [];
    this.#held = 0;
    this.#emit(Buffer.concat(parts), this.#line, this.#byteOffset, out);
  }

  /** The `RECORD_TOO_LARGE` error for the open record; drops what is held of it. */
  #tooLong() {
    this.#pieces = [];
    this.#held = 0;
    return recordTooLong({ file: this.#file, line: this.#line, byteOffset: this.#byteOffset }, this.#maxRecordBytes, this.#quoteOffset);
  }

  #emit(bytes: Buffer, line: number, byteOffset: number, out: CsvRecord[]): void {
    if (skipCsvWhitespace(bytes, 0, bytes.length, this.#delimiter) === bytes.length) return; // empty or white space only
    out.push({ bytes, line, byteOffset });
  }
}
