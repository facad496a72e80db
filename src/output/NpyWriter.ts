import { LexlockError } from '../LexlockError.js';
import type { AtomicFile } from '../files/AtomicFile.js';
import { BufferedAtomicFile, DEFAULT_BUFFER_BYTES } from '../files/BufferedAtomicFile.js';
import { int32LittleEndian } from './int32LittleEndian.js';
import { npyHeader } from './npyHeader.js';

/** Options of {@link NpyWriter}. */
export interface NpyWriterOptions {
  /** Size of the write buffer in bytes (default 1 MiB). */
  bufferBytes?: number;
  /** Makes the file (default: openAtomic, a temporary file renamed over `path` by finish). */
  open?: (path: string) => Promise<AtomicFile>;
}

/**
 * Streams int32 rows into an NPY 1.0 file (`<i4`, C order) whose row count is not known up front:
 * the header reserves room for up to 2^53 - 1 rows and is patched with the real shape on
 * {@link NpyWriter.finish}, which also commits the file atomically. `columns` null writes one
 * dimension (one value a row).
 * @example
 * const out = await NpyWriter.open('ids.npy', 128); // or new NpyWriter(...): open errors then surface later
 * for (const row of rows) await out.appendRows(row);
 * await out.finish(); // shape (rows, 128)
 */
export class NpyWriter {
  /** The destination, as given. */
  readonly path: string;
  /** Values per row, or null for a one-dimensional array. */
  readonly columns: number | null;
  private readonly out: BufferedAtomicFile;
  private readonly headerBytes: number;
  private rowCount = 0;
  private closed = false;

  /** Opens the temporary file and writes a placeholder header. */
  constructor(path: string, columns: number | null, options: NpyWriterOptions = {}) {
    if (columns !== null && (!Number.isSafeInteger(columns) || columns < 1)) {
      throw new LexlockError(
        'NPY_SHAPE',
        `${path}: NPY columns must be a whole number from 1 up, or null for one dimension; got ${columns}`,
        { file: path },
      );
    }
    this.path = path;
    this.columns = columns;
    this.headerBytes = npyHeader(this.shapeWith(Number.MAX_SAFE_INTEGER)).byteLength;
    this.out = new BufferedAtomicFile(path, options.bufferBytes ?? DEFAULT_BUFFER_BYTES, options.open);
    void this.out.append(npyHeader(this.shapeWith(0), this.headerBytes));
  }

  /** Like the constructor, but resolves only once the temporary file exists (throws `IO` when it cannot be made). */
  static async open(path: string, columns: number | null, options: NpyWriterOptions = {}): Promise<NpyWriter> {
    const writer = new NpyWriter(path, columns, options);
    await writer.out.ready();
    return writer;
  }

  /** Rows appended so far. */
  get rows(): number {
    return this.rowCount;
  }

  /** The shape the file has once finished with the rows appended so far. */
  get shape(): number[] {
    return this.shapeWith(this.rowCount);
  }

  /**
   * Appends whole rows, row-major (`ids.length` a multiple of `columns`). The values are copied
   * before this returns, so `ids` may be reused; await each call. Throws `NPY_SHAPE` for a partial row.
   */
  async appendRows(ids: Int32Array): Promise<void> {
    this.assertOpen();
    const width = this.columns ?? 1;
    if (ids.length % width !== 0) {
      throw new LexlockError(
        'NPY_SHAPE',
        `${this.path}: ${ids.length} ids do not make whole rows of ${width}; pass a multiple of ${width}`,
        { file: this.path },
      );
    }
    const rows = ids.length / width;
    if (this.rowCount + rows > Number.MAX_SAFE_INTEGER) {
      throw new LexlockError(
        'NPY_SHAPE',
        `${this.path}: more than ${Number.MAX_SAFE_INTEGER} rows; split the output into several files`,
        { file: this.path },
      );
    }
    this.rowCount += rows;
    await this.out.append(int32LittleEndian(ids));
  }

  /** Writes the real shape into the header and commits the file. On failure removes the temporary file. */
  async finish(): Promise<void> {
    this.assertOpen();
    this.closed = true;
    try {
      await this.out.patch(npyHeader(this.shape, this.headerBytes), 0);
      await this.out.commit();
    } catch (e) {
      await this.out.abort();
      throw e;
    }
  }

  /** Drops the temporary file; the destination is untouched. Never throws. */
  async abort(): Promise<void> {
    this.closed = true;
    await this.out.abort();
  }

  private shapeWith(rows: number): number[] {
    return this.columns === null ? [rows] : [rows, this.columns];
  }

  private assertOpen(): void {
    if (this.closed) {
      throw new LexlockError('WRITER_CLOSED', `${this.path}: the writer is already finished or aborted; open a new one to write again`, {
        file: this.path,
      });
    }
  }
}
