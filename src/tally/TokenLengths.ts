import { SpaceSaving } from './SpaceSaving.js';

/** Lengths below this are counted one by one; longer ones by power of two. */
const EXACT = 1024;
/** Share of its arena SpaceSaving keeps free after making room (its SLACK): the arena must hold this much more. */
const ARENA_SLACK = 8 / 7;

/**
 * The lengths (in UTF-16 code units) of every token occurrence of a corpus, in 16 KiB: exact below
 * 1,024, rounded up to a power of two above. Enough to bound the arena any number of counters needs:
 * n distinct tokens are at most as long as the n longest occurrences.
 */
export class TokenLengths {
  readonly #exact = new Float64Array(EXACT);
  /** #long[b]: occurrences of length in [2^b, 2^(b+1)), for b of 10 and more. */
  readonly #long = new Float64Array(32);
  #longest = 0;

  /** Counts an occurrence of a token of `length` code units. */
  add(length: number): void {
    if (length < EXACT) this.#exact[length] = (this.#exact[length] as number) + 1;
    else {
      const b = 31 - Math.clz32(length);
      this.#long[b] = (this.#long[b] as number) + 1;
    }
    if (length > this.#longest) this.#longest = length;
  }

  /**
   * The code units of the `n` longest occurrences, at most: more than `n` distinct tokens of the corpus
   * can take (a lexicon keeping `n` of them, say).
   */
  longestUnits(n: number): number {
    let left = n;
    let units = 0;
    for (let b = this.#long.length - 1; b >= 10 && left > 0; b--) {
      const k = Math.min(left, this.#long[b] as number);
      units += k * 2 ** (b + 1);
      left -= k;
    }
    for (let length = EXACT - 1; length >= 0 && left > 0; length--) {
      const k = Math.min(left, this.#exact[length] as number);
      units += k * length;
      left -= k;
    }
    return units;
  }

  /**
   * Arena code units enough for SpaceSaving with `counters` counters to never give one up: room for
   * the `counters` longest tokens and one more newcomer, plus the share it keeps free.
   * @example lengths.arenaFor(100000) // about 1.1 million for tokens of 6 code units
   */
  arenaFor(counters: number): number {
    let left = counters;
    let units = 0;
    for (let b = this.#long.length - 1; b >= 10 && left > 0; b--) {
      const n = Math.min(left, this.#long[b] as number);
      units += n * SpaceSaving.unitsFor(2 ** (b + 1));
      left -= n;
    }
    for (let length = EXACT - 1; length >= 0 && left > 0; length--) {
      const n = Math.min(left, this.#exact[length] as number);
      units += n * SpaceSaving.unitsFor(length);
      left -= n;
    }
    return Math.ceil((units + SpaceSaving.unitsFor(this.#longest)) * ARENA_SLACK) + 1;
  }
}
