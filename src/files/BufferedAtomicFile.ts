import { openAtomic, type AtomicFile } from './AtomicFile.js';
import type { CommitStep } from './commitAll.js';

/** Default size of the write buffer: 1 MiB. */
export const DEFAULT_BUFFER_BYTES = 1 << 20;

/**
 * An atomic output file with a write buffer, for writers that append many small pieces. Appended
 * bytes are copied at once, so callers may reuse their arrays as soon as the call returns; await
 * each call to keep memory bounded. Any failure removes the temporary file.
 * @example
 * const out = new BufferedAtomicFile('out.jsonl');
 * await out.appendText('{"a":1}\n'); await out.commit();
 */
export class BufferedAtomicFile {
  /** The destination, as given. */
  readonly path: string;
  private readonly file: Promise<AtomicFile>;
  private readonly capacity: number;
  private chunk: Uint8Array;
  private used = 0;
  private appended = 0;
  /** Settles when every buffer handed over so far has been written. */
  private pending: Promise<void> = Promise.resolve();
  private static readonly encoder = new TextEncoder();

  /**
   * Opens the temporary file beside `path` at once; `bufferBytes` (default 1 MiB) is the write size.
   * `open` makes the file (default openAtomic; openInPlace for a file inside a StagedFolder).
   */
  constructor(path: string, bufferBytes: number = DEFAULT_BUFFER_BYTES, open: (path: string) => Promise<AtomicFile> = openAtomic) {
    this.path = path;
    this.capacity = Math.max(16, Math.floor(bufferBytes));
    this.chunk = new Uint8Array(this.capacity);
    this.file = open(path);
    // A failed open is reported by the next call that awaits the file; do not let it go unhandled.
    this.file.catch(() => undefined);
  }

  /** Resolves once the temporary file is open; throws `IO` when it cannot be created. */
  async ready(): Promise<void> {
    await this.file;
  }

  /** How many bytes have been appended so far (the file's size once flushed). */
  get size(): number {
    return this.appended;
  }

  /** Appends bytes (copied before this returns). */
  append(bytes: Uint8Array): Promise<void> {
    this.appended += bytes.byteLength;
    if (bytes.byteLength <= this.capacity - this.used) {
      this.chunk.set(bytes, this.used);
      this.used += bytes.byteLength;
      return this.pending;
    }
    this.handOver();
    if (bytes.byteLength >= this.capacity) {
      this.queue(bytes.slice());
    } else {
      this.chunk.set(bytes, 0);
      this.used = bytes.byteLength;
    }
    return this.pending;
  }

  /** Appends text as UTF-8. */
  appendText(text: string): Promise<void> {
    let rest = text;
    for (;;) {
      const { read, written } = BufferedAtomicFile.encoder.encodeInto(rest, this.chunk.subarray(this.used));
      this.used += written;
      this.appended += written;
      if (read === rest.length) return this.pending;
      rest = rest.slice(read);
      this.handOver();
    }
  }

  /** Writes bytes at a position already flushed or buffered (e.g. a header); flushes first. */
  async patch(bytes: Uint8Array, position: number): Promise<void> {
    this.handOver();
    await this.pending;
    await (await this.file).writeAt(bytes, position);
  }

  /** Flushes the buffer to disk and closes the file, checking that it holds every byte: ready to commit. */
  async seal(): Promise<void> {
    this.handOver();
    await this.pending;
    await (await this.file).seal();
  }

  /** The step that puts the sealed file in place (see commitAll). */
  async commitStep(): Promise<CommitStep> {
    return (await this.file).commitStep();
  }

  /** Flushes the buffer, then fsyncs, renames over the destination and fsyncs the folder. */
  async commit(): Promise<void> {
    this.handOver();
    await this.pending;
    await (await this.file).commit();
  }

  /** Removes the temporary file; never throws. */
  async abort(): Promise<void> {
    await this.pending.catch(() => undefined);
    const file = await this.file.catch(() => null);
    if (file !== null) await file.abort();
  }

  /** Queues the buffered bytes for writing and starts a fresh buffer. */
  private handOver(): void {
    if (this.used === 0) return;
    const full = this.chunk.subarray(0, this.used);
    this.chunk = new Uint8Array(this.capacity);
    this.used = 0;
    this.queue(full);
  }

  private queue(bytes: Uint8Array): void {
    this.pending = this.pending.then(async () => (await this.file).write(bytes));
    this.pending.catch(() => undefined);
  }
}
