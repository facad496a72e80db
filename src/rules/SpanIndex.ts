import { LexlockError } from '../LexlockError.js';
import type { TokenSpans } from './TokenSpans.js';

/**
 * The seed of every span hash: random per process, so text written to collide cannot be prepared in
 * advance (results never depend on it, only the slots entries land in).
 */
const SEED = Math.floor(Math.random() * 0x1_0000_0000) | 0;
const A = 0x41;
const Z = 0x5a;
/**
 * The most code units the keys of one index may hold in all: where a key starts is an Int32, so more
 * would wrap around. 2^31 - 1 code units (4 GiB of them) is past what an unbounded count holds in memory
 * anyway; a bounded one (--memory-limit) never keeps that many.
 */
export const MOST_UNITS = 0x7fff_ffff;

/** The smallest slot table; it doubles whenever it is half full. */
const MIN_SLOTS = 16;

/**
 * The hash of `text[from, to)`, read with A-Z as a-z when `folded`: equal to the hash of the
 * lower-cased string itself. FNV-1a over UTF-16 code units, then murmur3's finalizer to spread it.
 */
function hashSpan(text: string, from: number, to: number, folded: boolean): number {
  let h = SEED ^ (to - from);
  if (folded) {
    for (let i = from; i < to; i++) {
      const c = text.charCodeAt(i);
      h = Math.imul(h ^ (c >= A && c <= Z ? c + 32 : c), 0x0100_0193);
    }
  } else {
    for (let i = from; i < to; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x0100_0193);
  }
  h ^= h >>> 16;
  h = Math.imul(h, 0x85eb_ca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2_ae35);
  return h ^ (h >>> 16);
}

/**
 * Strings numbered 0, 1, 2… in the order added, found by a span of any text (`text[from, to)`, also
 * read ASCII-lower-cased) without making a string of the span: how encode looks tokens up while
 * allocating nothing. Open addressing with linear probing; never more than half full.
 * @example
 * const index = new SpanIndex(['ferry', 'late']);
 * index.indexOfSpan('The Ferry was LATE', 4, 9, true) // 0
 */
export class SpanIndex {
  #keys: string[] = [];
  /** Every key's UTF-16 code units, one after another: compared without going through the strings. */
  #units = new Uint16Array(64);
  #unitCount = 0;
  /** Where each key's code units start in `#units` (entry + 1 holds where the next one starts). */
  #starts = new Int32Array(MIN_SLOTS / 2 + 1);
  #hashes: Int32Array;
  /** Two numbers a slot: entry number + 1 (0 for an empty slot), then the entry's hash, so a probe reads one place. */
  #slots: Int32Array;
  #mask: number;

  /** The most code units the keys may hold in all ({@link MOST_UNITS}; tests set it low). */
  readonly #mostUnits: number;

  /**
   * @param keys strings to add in order (a repeated one keeps its first number).
   * @param mostUnits the most code units all keys may hold (default {@link MOST_UNITS}).
   */
  constructor(keys: Iterable<string> = [], mostUnits = MOST_UNITS) {
    this.#mostUnits = mostUnits;
    this.#hashes = new Int32Array(MIN_SLOTS / 2);
    this.#slots = new Int32Array(MIN_SLOTS * 2);
    this.#mask = MIN_SLOTS - 1;
    for (const key of keys) this.add(key);
  }

  /** How many strings it holds. */
  get size(): number {
    return this.#keys.length;
  }

  /** The string numbered `index`. */
  keyAt(index: number): string | undefined {
    return this.#keys[index];
  }

  /** Every string, in the order added (number 0 first). */
  keys(): IterableIterator<string> {
    return this.#keys.values();
  }

  /** Every string in the order added, as a new array. */
  keyList(): string[] {
    return this.#keys.slice();
  }

  /** The number of `key`, or -1. */
  indexOf(key: string): number {
    return this.indexOfSpan(key, 0, key.length, false);
  }

  /**
   * The number of token `k` of a scan (see scanTokens), or -1: looked up where it lies in the scanned
   * text, or as the string it was made (a collapsed placeholder, an alien piece).
   */
  indexOfToken(spans: TokenSpans, k: number): number {
    const start = spans.starts[k] as number;
    return start >= 0 ? this.indexOfSpan(spans.text, start, spans.ends[k] as number, spans.folded) : this.indexOf(spans.strings[k] as string);
  }

  /** The number of the string `text[from, to)` (with A-Z read as a-z when `folded`), or -1. */
  indexOfSpan(text: string, from: number, to: number, folded: boolean): number {
    const hash = hashSpan(text, from, to, folded);
    const slots = this.#slots;
    const mask = this.#mask;
    for (let s = hash & mask; ; s = (s + 1) & mask) {
      const entry = (slots[2 * s] as number) - 1;
      if (entry < 0) return -1;
      if (slots[2 * s + 1] === hash && this.#sameAsSpan(entry, text, from, to, folded)) return entry;
    }
  }

  /** Whether key `entry` is `text[from, to)` (A-Z read as a-z when `folded`). */
  #sameAsSpan(entry: number, text: string, from: number, to: number, folded: boolean): boolean {
    const start = this.#starts[entry] as number;
    const length = to - from;
    if ((this.#starts[entry + 1] as number) - start !== length) return false;
    const units = this.#units;
    if (folded) {
      for (let k = 0; k < length; k++) {
        const c = text.charCodeAt(from + k);
        if (units[start + k] !== (c >= A && c <= Z ? c + 32 : c)) return false;
      }
    } else {
      for (let k = 0; k < length; k++) if (units[start + k] !== text.charCodeAt(from + k)) return false;
    }
    return true;
  }

  /** Adds `key` and returns its number; a key already held keeps its number (and `size` stays). */
  add(key: string): number {
    const hash = hashSpan(key, 0, key.length, false);
    const known = this.#find(hash, key);
    if (known >= 0) return known;
    const entry = this.#keys.length;
    if (this.#unitCount + key.length > this.#mostUnits) {
      throw new LexlockError(
        'MEMORY_LIMIT',
        `the distinct tokens counted hold more than ${this.#mostUnits.toLocaleString('en-US')} code units in all, more than one index holds; build with --memory-limit (a bounded count keeps only the tokens that can make the cap)`,
      );
    }
    if (entry === this.#hashes.length) this.#grow();
    const mask = this.#mask;
    let s = hash & mask;
    while (this.#slots[2 * s] !== 0) s = (s + 1) & mask;
    this.#slots[2 * s] = entry + 1;
    this.#slots[2 * s + 1] = hash;
    this.#hashes[entry] = hash;
    this.#keys.push(key);
    if (this.#unitCount + key.length > this.#units.length) {
      const units = new Uint16Array(Math.max(this.#units.length * 2, this.#unitCount + key.length));
      units.set(this.#units);
      this.#units = units;
    }
    for (let k = 0; k < key.length; k++) this.#units[this.#unitCount + k] = key.charCodeAt(k);
    this.#unitCount += key.length;
    this.#starts[entry + 1] = this.#unitCount;
    return entry;
  }

  /** The number of `key` (whose hash is `hash`), or -1. */
  #find(hash: number, key: string): number {
    const mask = this.#mask;
    for (let s = hash & mask; ; s = (s + 1) & mask) {
      const entry = (this.#slots[2 * s] as number) - 1;
      if (entry < 0) return -1;
      if (this.#slots[2 * s + 1] === hash && this.#keys[entry] === key) return entry;
    }
  }

  /** Forgets every string (numbering starts again at 0). */
  clear(): void {
    this.#keys = [];
    this.#units = new Uint16Array(64);
    this.#unitCount = 0;
    this.#starts = new Int32Array(MIN_SLOTS / 2 + 1);
    this.#hashes = new Int32Array(MIN_SLOTS / 2);
    this.#slots = new Int32Array(MIN_SLOTS * 2);
    this.#mask = MIN_SLOTS - 1;
  }

  /** Doubles the slot table and the room for entries (half of it), and puts every entry back. */
  #grow(): void {
    const slotCount = (this.#mask + 1) * 2;
    const slots = new Int32Array(slotCount * 2);
    const hashes = new Int32Array(slotCount / 2);
    hashes.set(this.#hashes);
    const starts = new Int32Array(hashes.length + 1);
    starts.set(this.#starts);
    const mask = slotCount - 1;
    const n = this.#keys.length;
    for (let entry = 0; entry < n; entry++) {
      const hash = hashes[entry] as number;
      let s = hash & mask;
      while (slots[2 * s] !== 0) s = (s + 1) & mask;
      slots[2 * s] = entry + 1;
      slots[2 * s + 1] = hash;
    }
    this.#slots = slots;
    this.#hashes = hashes;
    this.#starts = starts;
    this.#mask = mask;
  }
}
