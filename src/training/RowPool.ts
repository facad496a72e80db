import type { BatchBuffer } from './BatchBuffer.js';
import type { Pcg32 } from './Pcg32.js';

/**
 * Rows held back to shuffle a stream in bounded memory: up to `capacity` rows of `length` ids, in
 * typed arrays allocated once (4 x `length` + 8 bytes a row, plus a reference to its key). While it
 * fills, rows are only held; once full, each new row sends a held row drawn at random into the batch
 * and takes its slot; at the end the rows left go out in random order, each drawn from those still
 * held as a Fisher-Yates shuffle draws (the last one without a draw).
 */
export class RowPool {
  private readonly ids: Int32Array;
  private readonly lengths: Int32Array;
  private readonly labels: Int32Array;
  private readonly keys: string[];
  /** Rows held. */
  size = 0;

  constructor(
    readonly capacity: number,
    private readonly length: number,
    private readonly random: Pcg32,
  ) {
    this.ids = new Int32Array(capacity * length);
    this.lengths = new Int32Array(capacity);
    this.labels = new Int32Array(capacity);
    this.keys = new Array<string>(capacity);
  }

  /** Holds a row; when the pool is full, a held row drawn at random goes into `batch` first and the new row takes its slot. */
  offer(ids: Int32Array, kept: number, label: number, key: string, batch: BatchBuffer): void {
    let slot = this.size;
    if (slot === this.capacity) {
      slot = this.random.below(this.capacity);
      this.moveOut(slot, batch);
    } else {
      this.size += 1;
    }
    this.ids.set(ids, slot * this.length);
    this.lengths[slot] = kept;
    this.labels[slot] = label;
    this.keys[slot] = key;
  }

  /** Sends one held row, drawn at random, into `batch`; the last held row fills the slot it leaves. */
  drawInto(batch: BatchBuffer): void {
    const last = this.size - 1;
    const slot = last === 0 ? 0 : this.random.below(this.size);
    this.moveOut(slot, batch);
    if (slot !== last) {
      this.ids.copyWithin(slot * this.length, last * this.length, (last + 1) * this.length);
      this.lengths[slot] = this.lengths[last] as number;
      this.labels[slot] = this.labels[last] as number;
      this.keys[slot] = this.keys[last] as string;
    }
    this.keys[last] = '';
    this.size = last;
  }

  private moveOut(slot: number, batch: BatchBuffer): void {
    batch.put(this.ids, slot * this.length, this.lengths[slot] as number, this.labels[slot] as number, this.keys[slot] as string);
  }
}
