import { utf8BomLength } from './utf8Bom.js';

/** One line of a file: its bytes without the line feed (a trailing CR is kept), its 1-based number and byte offset. */
export interface Line {
  bytes: Buffer;
  line: number;
  byteOffset: number;
}

const LF = 0x0a;
const CR = 0x0d;

/**
 * Splits a byte stream into lines on 0x0A, chunk by chunk, without decoding: a multi-byte character
 * can never straddle a line break, so each line decodes alone. A UTF-8 BOM at the start of line 1 is
 * dropped (its offset then starts at 3). Memory holds only the unfinished line.
 * @example
 * const s = new LineSplitter(); s.push(Buffer.from('a\nb')); s.end() // [{ bytes: <Buffer 62>, line: 2, byteOffset: 2 }]
 */
export class LineSplitter {
  #pieces: Buffer[] = [];
  #offset = 0;
  #line = 1;

  /** The lines that `chunk` completes, in order. */
  push(chunk: Buffer): Line[] {
    const out: Line[] = [];
    let start = 0;
    let lf = chunk.indexOf(LF);
    while (lf !== -1) {
      let bytes: Buffer;
      if (this.#pieces.length > 0) {
        this.#pieces.push(chunk.subarray(start, lf));
        bytes = Buffer.concat(this.#pieces);
        this.#pieces = [];
      } else {
        bytes = chunk.subarray(start, lf);
      }
      out.push(this.#emit(bytes));
      start = lf + 1;
      lf = chunk.indexOf(LF, start);
    }
    if (start < chunk.length) this.#pieces.push(start === 0 ? chunk : chunk.subarray(start));
    return out;
  }

  /** The last line, when the input does not end with a line feed. */
  end(): Line[] {
    if (this.#pieces.length === 0) return [];
    const bytes = Buffer.concat(this.#pieces);
    this.#pieces = [];
    return [this.#emit(bytes)];
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
 * what a reader makes of a group dies young, which keeps garbage collection cheap.
 */
export async function* readLines(chunks: AsyncIterable<Buffer>): AsyncGenerator<Line[], void, undefined> {
  const splitter = new LineSplitter();
  for await (const chunk of chunks) yield* groups(splitter.push(chunk));
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
