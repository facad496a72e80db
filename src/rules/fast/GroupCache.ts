/**
 * A bounded memo of chunk group -> wink-tokenizer's value/tag pairs. When it grows past `limit`
 * entries it is emptied and starts again, so memory stays bounded on text with many one-off chunks.
 */
export class GroupCache {
  readonly #entries = new Map<string, readonly string[]>();
  readonly #limit: number;

  /** @param limit entries kept before the memo is emptied. */
  constructor(limit = 100_000) {
    this.#limit = limit;
  }

  /** The pairs stored for `group`, if any. */
  get(group: string): readonly string[] | undefined {
    return this.#entries.get(group);
  }

  /** Stores the pairs for `group`, emptying the memo first when it is full. */
  set(group: string, pairs: readonly string[]): void {
    if (this.#entries.size >= this.#limit) this.#entries.clear();
    this.#entries.set(group, pairs);
  }

  /** Entries stored now. */
  get size(): number {
    return this.#entries.size;
  }
}
