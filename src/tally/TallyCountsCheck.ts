import { inputError, type LexlockError, type Where } from '../LexlockError.js';

const AGAIN = 'count the part again with lexlock tally';

/** `BAD_TALLY` at a member (or, given a line, at that line), with what to do. */
export function badTally(where: Where, field: string, detail: string): LexlockError {
  return inputError('BAD_TALLY', { ...where, field }, `${detail}; ${AGAIN}`);
}

/**
 * The checks of a tally's `counts` entries, one entry at a time: tokens distinct and in JavaScript
 * string order, documents at most occurrences and at most the tally's documents, and at the end as many
 * entries as `types` says and occurrences that add up to `tokens`. `where` of each entry names its
 * member (`counts[3]`) or, in a file read line by line, its line.
 */
export class TallyCountsCheck {
  readonly #totals: { documents: number; tokens: number; types: number };
  readonly #where: Where;
  #previous: string | undefined;
  #occurrences = 0;
  #entries = 0;

  constructor(totals: { documents: number; tokens: number; types: number }, where: Where) {
    this.#totals = totals;
    this.#where = where;
  }

  /** Checks the next entry; `field` names it (`counts[3]`), `line` its line when read by lines. */
  entry(token: string, n: number, df: number, field: string, line?: number): void {
    const where = line === undefined ? this.#where : { ...this.#where, line };
    const previous = this.#previous;
    if (previous !== undefined && !(previous < token)) {
      throw badTally(where, field, `token ${JSON.stringify(token)} comes after ${JSON.stringify(previous)}; tokens must be distinct and in JavaScript string order`);
    }
    if (df > n) throw badTally(where, field, `token ${JSON.stringify(token)} occurs ${n} times but in ${df} documents`);
    if (df > this.#totals.documents) throw badTally(where, field, `token ${JSON.stringify(token)} occurs in ${df} documents but the tally has ${this.#totals.documents}`);
    this.#previous = token;
    this.#occurrences += n;
    this.#entries += 1;
  }

  /** Checks the totals once every entry has been seen. */
  end(): void {
    if (this.#entries !== this.#totals.types) throw badTally(this.#where, 'types', `types is ${this.#totals.types} but counts has ${this.#entries} entries`);
    if (this.#occurrences !== this.#totals.tokens) throw badTally(this.#where, 'counts', `the counts add up to ${this.#occurrences} tokens but tokens is ${this.#totals.tokens}`);
  }
}
