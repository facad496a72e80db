import { spanHashes } from './spanHashes.js';

const NONE = -1;
/** Code units before each token in the arena: its length (two units) and its counter (two units). */
const HEADER = 4;
/** A counter's place in the header when the token no longer belongs to one (both units 0xffff). */
const RELEASED = -1;
const A = 0x41;
const Z = 0x5a;
/** After making room the arena keeps at least this share free, so it is not compacted token after token. */
const SLACK = 1 / 8;

/** Hash slots for `capacity` counters: a power of two, at least twice the counters (never more than half full). */
function slotsFor(capacity: number): number {
  let slots = 16;
  while (slots < capacity * 2) slots *= 2;
  return slots;
}

/**
 * The Space-Saving heavy-hitters summary (Metwally, Agrawal, El Abbadi, "Efficient computation of
 * frequent and top-k elements in data streams", ICDT 2005): at most `capacity` counters; a new token
 * takes over the counter with the smallest count, whose count it inherits as its possible error.
 * Every token whose true count exceeds `total / capacity` is monitored, each estimate is at most `error`
 * above the truth, and a token that is not monitored occurred at most {@link floor} times.
 *
 * Its memory is fixed when it is made and known to the byte ({@link SpaceSaving.bytesFor}): counters
 * and the stream summary's groups live in typed arrays, the tokens' code units in an arena of
 * `arenaUnits`, looked up by a span of any text (no string is made to count a token). When the arena
 * cannot hold a new token even after compaction, counters with the smallest count are given up (the
 * summary then holds fewer counters, and {@link dropped} says how many): the bounds above still hold,
 * with `floor` the largest count ever given up.
 */
export class SpaceSaving {
  readonly capacity: number;
  readonly arenaUnits: number;
  /** Tokens offered so far. */
  total = 0;
  // Counter c: its estimated count and error, its neighbours in its group's list, its group, where its
  // token's code units start in the arena (NONE when it monitors none), their length, its table hash.
  readonly #count: Float64Array;
  readonly #error: Float64Array;
  readonly #prev: Int32Array;
  readonly #next: Int32Array;
  readonly #group: Int32Array;
  readonly #start: Int32Array;
  readonly #length: Int32Array;
  readonly #hash: Int32Array;
  // Group g (all counters with one count, in a list ordered by count): its count, first counter, the
  // groups above and below it. Free groups are chained through #gHigher.
  readonly #gCount: Float64Array;
  readonly #gFirst: Int32Array;
  readonly #gHigher: Int32Array;
  readonly #gLower: Int32Array;
  #lowest = NONE;
  #freeGroup = NONE;
  #groupsUsed = 0;
  // Free counters are chained through #next.
  #freeCounter = NONE;
  #countersUsed = 0;
  #size = 0;
  // Open addressing with linear probing: counter + 1 per slot, 0 for empty.
  readonly #slots: Int32Array;
  readonly #mask: number;
  readonly #units: Uint16Array;
  #end = 0;
  #live = 0;
  #floor = 0;
  #dropped = 0;
  #unfollowed = 0;
  readonly #hashes = new Int32Array(3);

  /**
   * @param capacity counters at most
   * @param arenaUnits UTF-16 code units for the monitored tokens (each also takes 4 for its header)
   */
  constructor(capacity: number, arenaUnits: number) {
    if (!Number.isSafeInteger(capacity) || capacity < 1 || capacity >= 2 ** 30) throw new RangeError(`capacity ${capacity} is not a whole number from 1 to 2^30 - 1`);
    if (!Number.isSafeInteger(arenaUnits) || arenaUnits <= HEADER || arenaUnits >= 2 ** 31) throw new RangeError(`arenaUnits ${arenaUnits} is not a whole number from ${HEADER + 1} to 2^31 - 1`);
    this.capacity = capacity;
    this.arenaUnits = arenaUnits;
    this.#count = new Float64Array(capacity);
    this.#error = new Float64Array(capacity);
    this.#prev = new Int32Array(capacity);
    this.#next = new Int32Array(capacity);
    this.#group = new Int32Array(capacity);
    // Only counters handed out are ever read (#countersUsed), and each gets its start when it does.
    this.#start = new Int32Array(capacity);
    this.#length = new Int32Array(capacity);
    this.#hash = new Int32Array(capacity);
    const groups = capacity + 2;
    this.#gCount = new Float64Array(groups);
    this.#gFirst = new Int32Array(groups);
    this.#gHigher = new Int32Array(groups);
    this.#gLower = new Int32Array(groups);
    const slots = slotsFor(capacity);
    this.#slots = new Int32Array(slots);
    this.#mask = slots - 1;
    this.#units = new Uint16Array(arenaUnits);
  }

  /** The bytes a summary of `capacity` counters and `arenaUnits` code units takes: its typed arrays. */
  static bytesFor(capacity: number, arenaUnits: number): number {
    return capacity * (8 + 8 + 4 * 6) + (capacity + 2) * (8 + 4 * 3) + slotsFor(capacity) * 4 + arenaUnits * 2;
  }

  /** Code units a token of `length` takes in the arena, its header included. */
  static unitsFor(length: number): number {
    return length + HEADER;
  }

  /** How many tokens are monitored. */
  get size(): number {
    return this.#size;
  }

  /**
   * The most any token that is not monitored can have occurred: the largest count ever given up
   * (0 while no counter has been taken over or given up; Infinity once a token longer than the whole
   * arena had to go unfollowed).
   */
  get floor(): number {
    return this.#unfollowed > 0 ? Infinity : this.#floor;
  }

  /** Counters given up to make room in the arena (see the class comment). */
  get dropped(): number {
    return this.#dropped;
  }

  /** Counts one occurrence of a token given as a string. */
  offerToken(token: string): void {
    spanHashes(token, 0, token.length, false, this.#hashes);
    this.offer(this.#hashes[0] as number, token, 0, token.length, false);
  }

  /**
   * Counts one occurrence of the token `text[from, to)` (A-Z read as a-z when `folded`), whose table
   * hash is `hash` (see spanHashes). True when the token was monitored already: then it had been
   * offered before, so a caller that records every distinct token (a Bloom filter, a distinct-count
   * estimate) has recorded this one and may skip it.
   */
  offer(hash: number, text: string, from: number, to: number, folded: boolean): boolean {
    this.total += 1;
    const known = this.find(hash, text, from, to, folded);
    if (known !== NONE) {
      this.#raise(known);
      return true;
    }
    const length = to - from;
    if (!this.#makeRoom(length + HEADER)) {
      this.#unfollowed += 1;
      return false;
    }
    let c = this.#takeCounter();
    if (c === NONE) {
      // Take over a counter with the smallest count: the newcomer inherits it as its possible error.
      c = this.#gFirst[this.#lowest] as number;
      this.#release(c);
      c = this.#takeCounter();
    }
    this.#store(c, hash, text, from, to, folded);
    this.#raise(c);
    return false;
  }

  /** The counter monitoring `text[from, to)` (A-Z read as a-z when `folded`), whose table hash is `hash`, or -1. */
  find(hash: number, text: string, from: number, to: number, folded: boolean): number {
    const slots = this.#slots;
    const mask = this.#mask;
    const length = to - from;
    for (let s = hash & mask; ; s = (s + 1) & mask) {
      const c = (slots[s] as number) - 1;
      if (c < 0) return NONE;
      if (this.#hash[c] === hash && this.#length[c] === length && this.#sameAs(c, text, from, folded)) return c;
    }
  }

  /** Whether counter `c` monitors `text[from, to)` (A-Z read as a-z when `folded`). */
  holds(c: number, text: string, from: number, to: number, folded: boolean): boolean {
    return this.#start[c] !== NONE && this.#length[c] === to - from && this.#sameAs(c, text, from, folded);
  }

  /** The table hash of the token counter `c` monitors (see spanHashes). */
  hashAt(c: number): number {
    return this.#hash[c] as number;
  }

  /** Every monitored counter, in no particular order. */
  monitored(): Int32Array {
    const out = new Int32Array(this.#size);
    let k = 0;
    for (let c = 0; c < this.#countersUsed; c++) if (this.#start[c] !== NONE) out[k++] = c;
    return out;
  }

  /** Monitored tokens with their estimated counts and errors, in no particular order. */
  *entries(): IterableIterator<{ token: string; count: number; error: number }> {
    for (const c of this.monitored()) yield { token: this.tokenAt(c), count: this.#count[c] as number, error: this.#error[c] as number };
  }

  /** Counter `c`'s estimated count (never below the true count). */
  countAt(c: number): number {
    return this.#count[c] as number;
  }

  /** Counter `c`'s possible error: its true count is at least `countAt(c) - errorAt(c)`. */
  errorAt(c: number): number {
    return this.#error[c] as number;
  }

  /** The length in UTF-16 code units of the token counter `c` monitors. */
  lengthAt(c: number): number {
    return this.#length[c] as number;
  }

  /** The token counter `c` monitors. */
  tokenAt(c: number): string {
    const start = this.#start[c] as number;
    const end = start + (this.#length[c] as number);
    let out = '';
    for (let at = start; at < end; at += 8192) out += String.fromCharCode(...this.#units.subarray(at, Math.min(end, at + 8192)));
    return out;
  }

  /** The order of two counters' tokens in JavaScript's default string order (UTF-16 code units): negative, 0 or positive. */
  compareTokens(a: number, b: number): number {
    const units = this.#units;
    const sa = this.#start[a] as number;
    const sb = this.#start[b] as number;
    const la = this.#length[a] as number;
    const lb = this.#length[b] as number;
    const n = Math.min(la, lb);
    for (let k = 0; k < n; k++) {
      const d = (units[sa + k] as number) - (units[sb + k] as number);
      if (d !== 0) return d;
    }
    return la - lb;
  }

  #sameAs(c: number, text: string, from: number, folded: boolean): boolean {
    const units = this.#units;
    const start = this.#start[c] as number;
    const length = this.#length[c] as number;
    if (folded) {
      for (let k = 0; k < length; k++) {
        const code = text.charCodeAt(from + k);
        if (units[start + k] !== (code >= A && code <= Z ? code + 32 : code)) return false;
      }
    } else {
      for (let k = 0; k < length; k++) if (units[start + k] !== text.charCodeAt(from + k)) return false;
    }
    return true;
  }

  #takeCounter(): number {
    if (this.#freeCounter !== NONE) {
      const c = this.#freeCounter;
      this.#freeCounter = this.#next[c] as number;
      return c;
    }
    return this.#countersUsed < this.capacity ? this.#countersUsed++ : NONE;
  }

  /** Puts a new token in counter `c`: its code units at the arena's end, its place in the table, count {@link floor}. */
  #store(c: number, hash: number, text: string, from: number, to: number, folded: boolean): void {
    const units = this.#units;
    const length = to - from;
    const at = this.#end;
    units[at] = length & 0xffff;
    units[at + 1] = length >>> 16;
    units[at + 2] = c & 0xffff;
    units[at + 3] = c >>> 16;
    const start = at + HEADER;
    for (let k = 0; k < length; k++) {
      const code = text.charCodeAt(from + k);
      units[start + k] = folded && code >= A && code <= Z ? code + 32 : code;
    }
    this.#end = start + length;
    this.#live += length + HEADER;
    this.#start[c] = start;
    this.#length[c] = length;
    this.#hash[c] = hash;
    let s = hash & this.#mask;
    while (this.#slots[s] !== 0) s = (s + 1) & this.#mask;
    this.#slots[s] = c + 1;
    // Any token not monitored occurred at most `floor` times: the newcomer's count and its possible error.
    this.#error[c] = this.#floor;
    this.#attachAtFloor(c);
    this.#size += 1;
  }

  /** Stops monitoring counter `c`: out of the table, its code units released, out of its group; `floor` takes its count. */
  #release(c: number): void {
    this.#unslot(c);
    const at = (this.#start[c] as number) - HEADER;
    this.#units[at + 2] = 0xffff;
    this.#units[at + 3] = 0xffff;
    this.#live -= (this.#length[c] as number) + HEADER;
    this.#start[c] = NONE;
    const group = this.#group[c] as number;
    this.#detach(c);
    this.#dropIfEmpty(group);
    this.#floor = Math.max(this.#floor, this.#count[c] as number);
    this.#next[c] = this.#freeCounter;
    this.#freeCounter = c;
    this.#size -= 1;
  }

  /** Removes counter `c` from the hash table, moving later entries of its probe run back (Knuth's algorithm R). */
  #unslot(c: number): void {
    const slots = this.#slots;
    const mask = this.#mask;
    let i = (this.#hash[c] as number) & mask;
    while (slots[i] !== c + 1) i = (i + 1) & mask;
    for (;;) {
      slots[i] = 0;
      let j = i;
      for (;;) {
        j = (j + 1) & mask;
        const entry = slots[j] as number;
        if (entry === 0) return;
        const home = (this.#hash[entry - 1] as number) & mask;
        // The entry at j may stay unless its home slot lies cyclically in (i, j].
        if (i <= j ? i < home && home <= j : i < home || home <= j) continue;
        slots[i] = entry;
        i = j;
        break;
      }
    }
  }

  /**
   * Makes room at the arena's end for `units` code units: compacts the arena, and if that is not
   * enough gives up counters with the smallest count until it is, with {@link SLACK} to spare.
   * False when the token is longer than the whole arena.
   */
  #makeRoom(units: number): boolean {
    if (this.#end + units <= this.arenaUnits) return true;
    if (units > this.arenaUnits) return false;
    this.#compact();
    const wanted = Math.min(this.arenaUnits, units + Math.ceil(this.arenaUnits * SLACK));
    if (this.arenaUnits - this.#end >= wanted) return true;
    while (this.#size > 0 && this.arenaUnits - this.#live < wanted) {
      this.#release(this.#gFirst[this.#lowest] as number);
      this.#dropped += 1;
    }
    this.#compact();
    return this.arenaUnits - this.#end >= units;
  }

  /** Moves every monitored token's code units to the front of the arena, in the order they lie. */
  #compact(): void {
    const units = this.#units;
    let write = 0;
    for (let at = 0; at < this.#end; ) {
      const length = (units[at] as number) | ((units[at + 1] as number) << 16);
      const owner = (units[at + 2] as number) | ((units[at + 3] as number) << 16);
      const size = length + HEADER;
      if (owner !== RELEASED) {
        if (write !== at) units.copyWithin(write, at, at + size);
        this.#start[owner] = write + HEADER;
        write += size;
      }
      at += size;
    }
    this.#end = write;
  }

  #newGroup(count: number, lower: number, higher: number): number {
    let g = this.#freeGroup;
    if (g !== NONE) this.#freeGroup = this.#gHigher[g] as number;
    else g = this.#groupsUsed++;
    this.#gCount[g] = count;
    this.#gFirst[g] = NONE;
    this.#gLower[g] = lower;
    this.#gHigher[g] = higher;
    if (lower !== NONE) this.#gHigher[lower] = g;
    else this.#lowest = g;
    if (higher !== NONE) this.#gLower[higher] = g;
    return g;
  }

  /** Puts counter `c` in the group of count {@link floor}, the lowest (every count is at least the floor). */
  #attachAtFloor(c: number): void {
    let g = this.#lowest;
    if (g === NONE || this.#gCount[g] !== this.#floor) g = this.#newGroup(this.#floor, NONE, g);
    this.#count[c] = this.#floor;
    this.#attach(c, g);
  }

  #attach(c: number, g: number): void {
    const first = this.#gFirst[g] as number;
    this.#group[c] = g;
    this.#prev[c] = NONE;
    this.#next[c] = first;
    if (first !== NONE) this.#prev[first] = c;
    this.#gFirst[g] = c;
  }

  #detach(c: number): void {
    const prev = this.#prev[c] as number;
    const next = this.#next[c] as number;
    if (prev !== NONE) this.#next[prev] = next;
    else this.#gFirst[this.#group[c] as number] = next;
    if (next !== NONE) this.#prev[next] = prev;
  }

  #dropIfEmpty(g: number): void {
    if (this.#gFirst[g] !== NONE) return;
    const lower = this.#gLower[g] as number;
    const higher = this.#gHigher[g] as number;
    if (lower !== NONE) this.#gHigher[lower] = higher;
    else this.#lowest = higher;
    if (higher !== NONE) this.#gLower[higher] = lower;
    this.#gHigher[g] = this.#freeGroup;
    this.#freeGroup = g;
  }

  /** Moves counter `c` from its group to the group of count + 1, making it when missing. */
  #raise(c: number): void {
    const from = this.#group[c] as number;
    const count = (this.#gCount[from] as number) + 1;
    let to = this.#gHigher[from] as number;
    if (to === NONE || this.#gCount[to] !== count) to = this.#newGroup(count, from, to);
    this.#detach(c);
    this.#count[c] = count;
    this.#attach(c, to);
    this.#dropIfEmpty(from);
  }
}
