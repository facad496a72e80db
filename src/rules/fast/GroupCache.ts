import { SpanIndex } from '../SpanIndex.js';

/**
 * A bounded memo of chunk group -> wink-tokenizer's value/tag pairs, looked up by a span of the text
 * (no string made for the lookup). When it grows past `limit` entries it is emptied and starts again,
 * so memory stays bounded on text with many one-off chunks.
 */
export class GroupCache {
  readonly #groups = new SpanIndex();
  #pairs: (readonly string[])[] = [];
  #limit: number;

  /** @param limit entries kept before the memo is emptied. */
  constructor(limit = 100_000) {
    this.#limit = limit;
  }

  /** Keeps at most `limit` entries from now on (emptied now if it holds more). */
  resize(limit: number): void {
    this.#limit = Math.max(1, limit);
    if (this.#groups.size > this.#limit) {
      this.#groups.clear();
      this.#pairs = [];
    }
  }

  /** The pairs stored for `group`, if any. */
  get(group: string): readonly string[] | undefined {
    return this.find(group, 0, group.length, false);
  }

  /** The pairs stored for the group `text[from, to)` (read ASCII-lower-cased when `folded`), if any. */
  find(text: string, from: number, to: number, folded: boolean): readonly string[] | undefined {
    const entry = this.#groups.indexOfSpan(text, from, to, folded);
    return entry < 0 ? undefined : this.#pairs[entry];
  }

  /** Stores the pairs for `group`, emptying the memo first when it is full. */
  set(group: string, pairs: readonly string[]): void {
    if (this.#groups.size >= this.#limit) {
      this.#groups.clear();
      this.#pairs = [];
    }
    this.#pairs[this.#groups.add(group)] = pairs;
  }

  /** Entries stored now. */
  get size(): number {
    return this.#groups.size;
  }
}
