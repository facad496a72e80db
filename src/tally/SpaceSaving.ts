import { detached } from '../rules/detached.js';

/** One monitored token of a {@link SpaceSaving} summary. */
interface Counter {
  token: string;
  /** Estimated count: never below the true count. */
  count: number;
  /** Most the estimate can exceed the true count by. */
  error: number;
  /** The group of counters with the same count this one belongs to. */
  group: Group;
  prev: Counter | null;
  next: Counter | null;
}

/** All counters with one count, in a list ordered by count (the "stream summary"). */
interface Group {
  count: number;
  first: Counter | null;
  higher: Group | null;
  lower: Group | null;
}

/**
 * The Space-Saving heavy-hitters summary (Metwally, Agrawal, El Abbadi, "Efficient computation of
 * frequent and top-k elements in data streams", ICDT 2005): at most `capacity` counters; a new token
 * takes over the counter with the smallest count. Every token whose true count exceeds
 * `total / capacity` is monitored, each estimate is at most `error` above the truth, and a token that
 * is not monitored occurred at most {@link floor} times. Updates take constant time.
 */
export class SpaceSaving {
  readonly capacity: number;
  private readonly counters = new Map<string, Counter>();
  /** The group with the smallest count. */
  private lowest: Group | null = null;
  /** Tokens offered so far. */
  total = 0;

  constructor(capacity: number) {
    if (!Number.isSafeInteger(capacity) || capacity < 1) throw new RangeError(`capacity ${capacity} is not a positive whole number`);
    this.capacity = capacity;
  }

  /** Counts one occurrence of a token. */
  offer(token: string): void {
    this.total += 1;
    const known = this.counters.get(token);
    if (known !== undefined) {
      this.raise(known);
      return;
    }
    if (this.counters.size < this.capacity) {
      const counter: Counter = { token: detached(token), count: 0, error: 0, group: this.zeroGroup(), prev: null, next: null };
      this.counters.set(counter.token, counter);
      this.attach(counter, counter.group);
      this.raise(counter);
      return;
    }
    // Take over a counter with the smallest count: the newcomer inherits it as its possible error.
    const victim = (this.lowest as Group).first as Counter;
    this.counters.delete(victim.token);
    victim.token = detached(token);
    victim.error = victim.count;
    this.counters.set(victim.token, victim);
    this.raise(victim);
  }

  /** The most any token that is not monitored can have occurred (0 while counters are free). */
  get floor(): number {
    return this.counters.size < this.capacity || this.lowest === null ? 0 : this.lowest.count;
  }

  /** Monitored tokens with their estimated counts and errors. */
  *entries(): IterableIterator<{ token: string; count: number; error: number }> {
    for (const c of this.counters.values()) yield { token: c.token, count: c.count, error: c.error };
  }

  /** How many tokens are monitored. */
  get size(): number {
    return this.counters.size;
  }

  /** A temporary group of count 0 below the lowest, from which raise() moves a new counter to 1. */
  private zeroGroup(): Group {
    const zero: Group = { count: 0, first: null, higher: this.lowest, lower: null };
    if (this.lowest !== null) this.lowest.lower = zero;
    this.lowest = zero;
    return zero;
  }

  private attach(counter: Counter, group: Group): void {
    counter.group = group;
    counter.prev = null;
    counter.next = group.first;
    if (group.first !== null) group.first.prev = counter;
    group.first = counter;
  }

  private detach(counter: Counter): void {
    const group = counter.group;
    if (counter.prev !== null) counter.prev.next = counter.next;
    else group.first = counter.next;
    if (counter.next !== null) counter.next.prev = counter.prev;
    counter.prev = null;
    counter.next = null;
  }

  private dropIfEmpty(group: Group): void {
    if (group.first !== null) return;
    if (group.lower !== null) group.lower.higher = group.higher;
    else this.lowest = group.higher;
    if (group.higher !== null) group.higher.lower = group.lower;
  }

  /** Moves a counter from its group to the group of count + 1, creating it when missing. */
  private raise(counter: Counter): void {
    const from = counter.group;
    const count = from.count + 1;
    let to = from.higher;
    if (to === null || to.count !== count) {
      const made: Group = { count, first: null, higher: to, lower: from };
      if (to !== null) to.lower = made;
      from.higher = made;
      to = made;
    }
    this.detach(counter);
    counter.count = count;
    this.attach(counter, to);
    this.dropIfEmpty(from);
  }
}
