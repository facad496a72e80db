import { prepareTokens } from '../rules/prepareTokens.js';
import { dropPrepared } from '../rules/scanTokens.js';
import type { TextRules } from '../rules/TextRules.js';
import type { LabelledText } from '../tally/Tally.js';

/** Work between two turns of the event loop, at most (milliseconds): SIGINT and SIGTERM wait no longer. */
export const TURN_EVERY_MS = 100;
/**
 * Documents from this many code units on are tokenized ahead, in steps, with turns in between; a
 * shorter one takes at most about 60 ms in one go (the slowest text measured: 240 ms a MiB, one token
 * a code unit).
 */
export const LONG_DOCUMENT = 256 * 1024;
/** The work of one step on a long document (code units normalized, or units of tokenizing): a few ms. */
const STEP = 1 << 18;

/** How the consumer of a stream of documents tokenizes them, so that a long one can be tokenized ahead. */
export interface Tokenizing {
  rules: TextRules;
  /** The consumer wants strings (a tally) rather than spans (encoding, auditing). */
  strings: boolean;
}

/**
 * Gives the event loop a turn once at least {@link TURN_EVERY_MS} have passed since the last, so that
 * signal handlers (src/bin.ts), worker replies and I/O run while a long loop works. The clock is read
 * once a document (cheap), and the loop turns only when due. With `tokenizing`, a document of
 * {@link LONG_DOCUMENT} code units or more is tokenized ahead in steps with turns between them
 * (prepareTokens), so that the consumer's own tokenizing of it takes the tokens at once: one 64 MiB
 * document can take seconds, and a signal is still seen within about {@link TURN_EVERY_MS}.
 */
export class LoopTurns {
  readonly #tokenizing: Tokenizing | null;
  readonly #now: () => number;
  #last: number;

  /** @param now the clock, in milliseconds (tests give one of their own). */
  constructor(tokenizing: Tokenizing | null = null, now: () => number = () => performance.now()) {
    this.#tokenizing = tokenizing;
    this.#now = now;
    this.#last = now();
  }

  /** Whether a turn is due. */
  due(): boolean {
    return this.#now() - this.#last >= TURN_EVERY_MS;
  }

  /** One turn of the event loop: everything waiting (a signal, I/O) runs before this resolves. */
  async take(): Promise<void> {
    await new Promise((resolve) => setImmediate(resolve));
    this.#last = this.#now();
  }

  /**
   * What to await before a document is handled: a turn when due, and a long document's tokens found
   * ahead; null when there is nothing to wait for (so a loop pays no promise for most documents).
   */
  before(text: string): Promise<void> | null {
    if (this.#tokenizing !== null && text.length >= LONG_DOCUMENT) return this.#prepare(text, this.#tokenizing);
    return this.due() ? this.take() : null;
  }

  /** Lets go of tokens found ahead that nothing took (a loop that stopped early). */
  done(): void {
    if (this.#tokenizing !== null) dropPrepared();
  }

  async #prepare(text: string, { rules, strings }: Tokenizing): Promise<void> {
    const prepared = prepareTokens(text, rules, strings);
    do if (this.due()) await this.take();
    while (!prepared.step(STEP));
    if (this.due()) await this.take();
  }
}

/**
 * The documents of `documents` with {@link LoopTurns} before each: for a consumer that loops over a
 * stream itself (an audit, a bounded tally), also when a reader never waits on the event loop (a folder
 * read with synchronous reads).
 */
export async function* withTurns<D extends string | LabelledText>(
  documents: AsyncIterable<D> | Iterable<D>,
  tokenizing: Tokenizing | null,
  turns = new LoopTurns(tokenizing),
): AsyncGenerator<D> {
  try {
    for await (const doc of documents) {
      const wait = turns.before(typeof doc === 'string' ? doc : doc.text);
      if (wait !== null) await wait;
      yield doc;
    }
  } finally {
    turns.done();
  }
}
