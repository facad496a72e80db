import { LexlockError } from '../LexlockError.js';
import type { AtomicFile } from '../files/AtomicFile.js';
import { BufferedAtomicFile, DEFAULT_BUFFER_BYTES } from '../files/BufferedAtomicFile.js';
import type { CommitStep } from '../files/commitAll.js';

/** Options of {@link JsonlWriter}. */
export interface JsonlWriterOptions {
  /** Size of the write buffer in bytes (default 1 MiB). */
  bufferBytes?: number;
  /** Makes the file (default: openAtomic, a temporary file renamed over `path` by finish). */
  open?: (path: string) => Promise<AtomicFile>;
}

/**
 * Streams one JSON value a line (JSON Lines, UTF-8, `\n` after every line) into a file that appears
 * atomically on {@link JsonlWriter.finish}.
 * @example
 * const out = await JsonlWriter.open('encoded.jsonl');
 * await out.writeLine({ ids: [5, 9, 1], length: 3, label: 'late' });
 * await out.finish();
 */
export class JsonlWriter {
  /** The destination, as given. */
  readonly path: string;
  private readonly out: BufferedAtomicFile;
  private lineCount = 0;
  private closed = false;

  /** Opens the temporary file beside `path`. */
  constructor(path: string, options: JsonlWriterOptions = {}) {
    this.path = path;
    this.out = new BufferedAtomicFile(path, options.bufferBytes ?? DEFAULT_BUFFER_BYTES, options.open);
  }

  /** Like the constructor, but resolves only once the temporary file exists (throws `IO` when it cannot be made). */
  static async open(path: string, options: JsonlWriterOptions = {}): Promise<JsonlWriter> {
    const writer = new JsonlWriter(path, options);
    await writer.out.ready();
    return writer;
  }

  /** Lines written so far. */
  get lines(): number {
    return this.lineCount;
  }

  /**
   * Appends `JSON.stringify(value)` and a newline; await each call. Throws `BAD_FIELD_TYPE` for a
   * value JSON cannot hold (undefined, a function, a symbol); BigInt and cycles throw JSON.stringify's TypeError.
   */
  async writeLine(value: unknown): Promise<void> {
    this.assertOpen();
    const text = JSON.stringify(value) as string | undefined;
    if (text === undefined) {
      throw new LexlockError(
        'BAD_FIELD_TYPE',
        `${this.path} line ${this.lineCount + 1}: a ${typeof value} cannot be written as JSON; pass an object, array, string, number, boolean or null`,
        { file: this.path, line: this.lineCount + 1 },
      );
    }
    this.lineCount += 1;
    await this.out.appendText(`${text}\n`);
  }

  /** Flushes and commits the file. On failure removes the temporary file. */
  async finish(): Promise<void> {
    this.assertOpen();
    this.closed = true;
    try {
      await this.out.commit();
    } catch (e) {
      await this.out.abort();
      throw e;
    }
  }

  /**
   * Flushes the file to disk without putting it in place, for a caller that commits it together with
   * other outputs: then `commitStep()` and commitAll. On failure removes the temporary file.
   */
  async seal(): Promise<void> {
    this.assertOpen();
    this.closed = true;
    try {
      await this.out.seal();
    } catch (e) {
      await this.out.abort();
      throw e;
    }
  }

  /** The step that puts a sealed file in place (see commitAll). */
  commitStep(): Promise<CommitStep> {
    return this.out.commitStep();
  }

  /** Drops the temporary file; the destination is untouched. Never throws. */
  async abort(): Promise<void> {
    this.closed = true;
    await this.out.abort();
  }

  private assertOpen(): void {
    if (this.closed) {
      throw new LexlockError('WRITER_CLOSED', `${this.path}: the writer is already finished or aborted; open a new one to write again`, {
        file: this.path,
      });
    }
  }
}
