import type { LexlockError } from '../LexlockError.js';
import { lineTooLong } from './recordLimit.js';
import { utf8BomLength } from './utf8Bom.js';

/** One line of a file: its bytes without the line feed (a trailing CR is kept), its 1-based number and byte offset. */
export interface Line {
  bytes: Buffer;
  line: number;
  byteOffset: number;
}

/** The most bytes one line may have (a trailing CR and the BOM of line 1 not counted), and the file to name when one has more. */
export interface LineLimit {
  readonly maxBytes: number;
  readonly file: string;
}

const LF = 0x0a;
const CR = 0x0d;

/**
 * Splits a byte stream into lines on 0x0A, chunk by chunk, without decoding: a multi-byte character
 * can never straddle a line break, so each line decodes alone. A UTF-8 BOM at the start of line 1 is
 * dropped (its offset then starts at 3). Memory holds only the unfinished line; with a
 * {@link LineLimit}, at most `maxBytes` + 4 of it: a longer line is refused as soon as that many of
 * its bytes are in, before it is put together. The refusal (`RECORD_TOO_LARGE`, see {@link failure})
 * comes after the lines before it: `push` returns those, and throws it the next time it is called, as
 * `end` does.
 * @example
 * const s = new LineSplitter(); s.push(Buffer.from('a\nb')); s.end() // [{ bytes: <Buffer 62>, line: 2, byteOffset: 2 }]
 */
export class LineSplitter {
  #pieces: Buffer[] = [];
  /** Bytes in `#pieces`. */
  #held = 0;
  #offset = 0;
  #line = 1;
  readonly #limit: LineLimit | null;
  #failure: LexlockError | null = null;

  constructor(limit: LineLimit | null = null) {
    this.#limit = limit;
  }

  /** The `RECORD_TOO_LARGE` error for the line that went over the limit, once one has; null before. */
  get failure(): LexlockError | null {
    return this.#failure;
  }

  /** The lines that `chunk` completes, in order (up to a line over the limit). */
  push(chunk: Buffer): Line[] {
    if (this.#failure !== null) throw this.#failure;
    const out: Line[] = [];
    let start = 0;
    let lf = chunk.indexOf(LF);
    while (lf !== -1) {
      let bytes: Buffer;
      if (this.#pieces.length > 0) {
        this.#pieces.push(chunk.subarray(start, lf));
        bytes = Buffer.concat(this.#pieces);
        this.#pieces = [];
        this.#held = 0;
      } else {
        bytes = chunk.subarray(start, lf);
      }
      if (this.#tooLong(bytes)) {
        this.#fail(bytes);
        return out;
      }
      out.push(this.#emit(bytes));
      start = lf + 1;
      lf = chunk.indexOf(LF, start);
    }
    if (start < chunk.length) {
      const rest = start === 0 ? chunk : chunk.subarray(start);
      this.#pieces.push(rest);
      this.#held += rest.length;
      // The line is over the limit whatever ends it: only a CR (and, on line 1, a BOM) go uncounted.
      if (this.#limit !== null && this.#held > this.#limit.maxBytes + 1 + (this.#line === 1 ? 3 : 0)) {
        this.#fail(Buffer.concat(this.#pieces, Math.min(3, this.#held)));
      }
    }
    return out;
  }

  /** The last line, when the input does not end with a line feed. */
  end(): Line[] {
    if (this.#failure !== null) throw this.#failure;
    if (this.#pieces.length === 0) return [];
    const bytes = Buffer.concat(this.#pieces);
    this.#pieces = [];
    this.#held = 0;
    if (this.#tooLong(bytes)) {
      this.#fail(bytes);
      throw this.#failure;
    }
    return [this.#emit(bytes)];
  }

  /** True when the line `bytes` (the current one) has more bytes than the limit, its CR and BOM not counted. */
  #tooLong(bytes: Buffer): boolean {
    if (this.#limit === null) return false;
    let n = bytes.length;
    if (n > 0 && bytes[n - 1] === CR) n -= 1;
    if (this.#line === 1) n -= utf8BomLength(bytes);
    return n > this.#limit.maxBytes;
  }

  /** Refuses the current line, which starts with `head`, and drops what is held of it. */
  #fail(head: Buffer): void {
    const limit = this.#limit!; // only called with a limit
    const byteOffset = this.#line === 1 ? utf8BomLength(head) : this.#offset;
    this.#failure = lineTooLong({ file: limit.file, line: this.#line, byteOffset }, limit.maxBytes);
    this.#pieces = [];
    this.#held = 0;
  }

  #emit(bytes: Buffer): Line {
    let byteOffset = this.#offset;
    this.#offset += bytes.length + 1;
    const line = this.#line++;
    if (line === 1 && utf8BomLength(bytes) === 3) {
      bytes = bytes.subarray(3);
      byteOffset = 3;
    }
    return { bytes, line, byteOffset };
  }
}

/** About how many bytes of lines {@link readLines} hands out at once. */
const GROUP_BYTES = 1 << 16;

/**
 * The lines of a byte stream (see {@link LineSplitter}), in groups of about 64 KiB: small enough that
 * what a reader makes of a group dies young, which keeps garbage collection cheap. With a `limit`, a
 * line longer than it throws `RECORD_TOO_LARGE` after the groups of the lines before it, and no more
 * of the stream is read.
 */
export async function* readLines(chunks: AsyncIterable<Buffer>, limit: LineLimit | null = null): AsyncGenerator<Line[], void, undefined> {
  const splitter = new LineSplitter(limit);
  for await (const chunk of chunks) {
    yield* groups(splitter.push(chunk));
    if (splitter.failure !== null) throw splitter.failure;
  }
  yield* groups(splitter.end());
}

function* groups(lines: Line[]): Generator<Line[], void, undefined> {
  if (lines.length === 0) return;
  let from = 0;
  let bytes = 0;
  for (let i = 0; i < lines.length; i++) {
    bytes += lines[i]!.bytes.length + 1;
    if (bytes >= GROUP_BYTES) {
      yield lines.slice(from, i + 1);
      from = i + 1;
      bytes = 0;
    }
  }
  if (from < lines.length) yield from === 0 ? lines : lines.slice(from);
}

/** `bytes` without one trailing carriage return (CRLF line ends). */
export function stripCr(bytes: Buffer): Buffer {
  return bytes.length > 0 && bytes[bytes.length - 1] === CR ? bytes.subarray(0, bytes.length - 1) : bytes;
}
