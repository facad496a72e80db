/**
 * The most entries one JavaScript Map or Set holds: V8 stops at 2^24 (16,777,216) with "Map maximum
 * size exceeded". {@link TokenMap} starts another Map below that.
 */
export const MAP_ENTRIES_MOST = 16_000_000;

/**
 * A map from strings (tokens) that holds any number of entries, memory allowing: Maps of at most
 * `perMap` entries each, filled one after another, so iteration keeps the order entries were added.
 * A lookup tries the Maps in turn; while there is one (up to 16 million tokens) it costs what a Map does.
 * @example
 * const numbers = new TokenMap<number>(2);
 * numbers.add('a', 0).add('b', 1).add('c', 2); // 'c' goes to a second Map
 * [numbers.get('c'), numbers.size, [...numbers.keys()]] // [2, 3, ['a', 'b', 'c']]
 */
export class TokenMap<V> implements ReadonlyMap<string, V> {
  readonly #maps: Array<Map<string, V>>;
  #last: Map<string, V>;
  #size = 0;
  readonly #perMap: number;

  /** @param perMap entries a Map takes before the next one starts (tests set it low to exercise that). */
  constructor(perMap = MAP_ENTRIES_MOST) {
    if (!Number.isSafeInteger(perMap) || perMap < 1 || perMap > MAP_ENTRIES_MOST) {
      throw new RangeError(`perMap ${perMap} is not a whole number from 1 to ${MAP_ENTRIES_MOST}`);
    }
    this.#perMap = perMap;
    this.#last = new Map();
    this.#maps = [this.#last];
  }

  get size(): number {
    return this.#size;
  }

  get(key: string): V | undefined {
    const maps = this.#maps;
    if (maps.length === 1) return this.#last.get(key);
    for (let i = 0; i < maps.length; i++) {
      const value = (maps[i] as Map<string, V>).get(key);
      if (value !== undefined) return value;
    }
    return undefined;
  }

  has(key: string): boolean {
    const maps = this.#maps;
    for (let i = 0; i < maps.length; i++) if ((maps[i] as Map<string, V>).has(key)) return true;
    return false;
  }

  /** Adds a key that is not in the map yet (the caller has looked): no search of the earlier Maps. */
  add(key: string, value: V): this {
    if (this.#last.size >= this.#perMap) {
      this.#last = new Map();
      this.#maps.push(this.#last);
    }
    this.#last.set(key, value);
    this.#size += 1;
    return this;
  }

  /** Sets a key's value, adding the key when it is new. */
  set(key: string, value: V): this {
    for (const map of this.#maps) {
      if (map.has(key)) {
        map.set(key, value);
        return this;
      }
    }
    return this.add(key, value);
  }

  *entries(): MapIterator<[string, V]> {
    for (const map of this.#maps) yield* map.entries();
  }

  *keys(): MapIterator<string> {
    for (const map of this.#maps) yield* map.keys();
  }

  *values(): MapIterator<V> {
    for (const map of this.#maps) yield* map.values();
  }

  [Symbol.iterator](): MapIterator<[string, V]> {
    return this.entries();
  }

  forEach(callback: (value: V, key: string, map: ReadonlyMap<string, V>) => void, thisArg?: unknown): void {
    for (const [key, value] of this.entries()) callback.call(thisArg, value, key, this);
  }
}
