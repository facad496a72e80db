/**
 * One batch of rows for a training loop: `ids` is row-major (`rows` x `length`), `lengths[r]` how
 * many ids of row r are tokens (the rest is padding), `labels[r]` its label id (-1: none, or one the
 * lexicon does not know), `keys[r]` the key of the document it came from. Every batch has buffers of
 * its own, exactly as long as its rows need, so it can be kept, and handed to a tensor constructor as
 * it is.
 */
export interface KeyedBatch {
  ids: Int32Array;
  lengths: Int32Array;
  labels: Int32Array;
  keys: string[];
  /** Rows in this batch: the rows asked for, or fewer in the last batch of a stream (and only there). */
  rows: number;
  /** Ids a row. */
  length: number;
}

/** Fills batches of up to `capacity` rows of `length` ids, each in buffers of its own. */
export class BatchBuffer {
  private ids: Int32Array | null = null;
  private lengths: Int32Array | null = null;
  private labels: Int32Array | null = null;
  private keys: string[] = [];
  /** Rows filled so far in the batch being filled. */
  rows = 0;

  constructor(
    readonly capacity: number,
    readonly length: number,
  ) {}

  get full(): boolean {
    return this.rows === this.capacity;
  }

  /** Copies a row in: `length` ids of `source` from `from`, with its token count, label id and key. */
  put(source: Int32Array, from: number, kept: number, label: number, key: string): void {
    if (this.ids === null || this.lengths === null || this.labels === null) {
      this.ids = new Int32Array(this.capacity * this.length);
      this.lengths = new Int32Array(this.capacity);
      this.labels = new Int32Array(this.capacity);
      this.keys = [];
    }
    const r = this.rows;
    this.ids.set(source.subarray(from, from + this.length), r * this.length);
    this.lengths[r] = kept;
    this.labels[r] = label;
    this.keys.push(key);
    this.rows = r + 1;
  }

  /** Hands the filled rows over as a batch (copied into buffers of their exact size when short) and starts a new one. */
  take(): KeyedBatch {
    const { ids, lengths, labels, keys, rows, length } = this;
    if (ids === null || lengths === null || labels === null) throw new Error('BatchBuffer.take with no row');
    this.ids = null;
    this.lengths = null;
    this.labels = null;
    this.keys = [];
    this.rows = 0;
    if (rows === this.capacity) return { ids, lengths, labels, keys, rows, length };
    return { ids: ids.slice(0, rows * length), lengths: lengths.slice(0, rows), labels: labels.slice(0, rows), keys, rows, length };
  }
}
