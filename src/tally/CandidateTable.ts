import type { SpaceSaving } from './SpaceSaving.js';

/** Hash slots for `n` entries: a power of two, at least twice the entries (never more than half full). */
function slotsFor(n: number): number {
  let slots = 16;
  while (slots < n * 2) slots *= 2;
  return slots;
}

/**
 * A small lookup of some of a Space-Saving summary's counters (the candidates a second pass counts
 * exactly), by the same table hash and span as {@link SpaceSaving.find}. A second pass offers every
 * token of the corpus but counts only the candidates, usually a few per cent of the counters: their
 * own table is small enough to stay in the processor's cache, and a token that is no candidate
 * mostly meets an empty slot at once, where the summary's table, sized for every counter, costs a
 * cache miss or more a token. Each slot holds the counter + 1 (0: empty) and its hash, so a probe
 * reads the summary's arena only when the hashes match. It lives in memory its caller lends it
 * (`storage`, {@link bytesFor} bytes at least), so it costs nothing the caller has not counted.
 */
export class CandidateTable {
  readonly #summary: SpaceSaving;
  readonly #slots: Int32Array;
  readonly #hashes: Int32Array;
  readonly #mask: number;

  /** The bytes a table of `n` candidates takes: its two arrays of slots. */
  static bytesFor(n: number): number {
    return slotsFor(n) * 8;
  }

  /**
   * An empty table for up to `n` candidates, in the first {@link bytesFor}(n) bytes of `storage`
   * (cleared here; the table owns them while it is used).
   */
  constructor(summary: SpaceSaving, n: number, storage: ArrayBuffer = new ArrayBuffer(CandidateTable.bytesFor(n))) {
    if (storage.byteLength < CandidateTable.bytesFor(n)) throw new RangeError(`a table of ${n} candidates needs ${CandidateTable.bytesFor(n)} bytes, not ${storage.byteLength}`);
    this.#summary = summary;
    const slots = slotsFor(n);
    this.#slots = new Int32Array(storage, 0, slots).fill(0);
    this.#hashes = new Int32Array(storage, slots * 4, slots);
    this.#mask = slots - 1;
  }

  /** Adds counter `c` of the summary, monitored and not added before (at most `n` in all). */
  add(c: number): void {
    const hash = this.#summary.hashAt(c);
    let s = hash & this.#mask;
    while (this.#slots[s] !== 0) s = (s + 1) & this.#mask;
    this.#slots[s] = c + 1;
    this.#hashes[s] = hash;
  }

  /** The candidate counter monitoring `text[from, to)` (A-Z read as a-z when `folded`), whose table hash is `hash`, or -1. */
  find(hash: number, text: string, from: number, to: number, folded: boolean): number {
    const slots = this.#slots;
    const hashes = this.#hashes;
    const mask = this.#mask;
    for (let s = hash & mask; ; s = (s + 1) & mask) {
      const entry = slots[s] as number;
      if (entry === 0) return -1;
      if (hashes[s] === hash && this.#summary.holds(entry - 1, text, from, to, folded)) return entry - 1;
    }
  }
}
