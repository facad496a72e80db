/** Figures kept a token, and where each is among them. */
const FIGURES = 3;
/** Occurrences. */
export const COUNT = 0;
/** Documents the token occurs in. */
export const DOCUMENTS = 1;
/** The number of the last document counted with the token (document frequency is counted once a document); 0 for none. */
const LAST = 2;

/** Room for this many tokens' figures at first; it doubles when full. */
const FIRST_ROOM = 1024;

/**
 * Occurrences and document frequency of tokens numbered 0, 1, 2…, three figures a token side by side
 * in one typed array, so that counting an occurrence reads one place: what a {@link Tally} keeps per
 * token, and what an audit keeps per lexicon id. No object a token.
 * @example
 * const figures = new TokenFigures();
 * figures.occur(0, 1); figures.occur(0, 1); figures.occur(0, 2);
 * [figures.at(0, COUNT), figures.at(0, DOCUMENTS)] // [3, 2]
 */
export class TokenFigures {
  #figures: Float64Array;

  /** @param room tokens to make room for at first (more are made room for as they come). */
  constructor(room = FIRST_ROOM) {
    this.#figures = new Float64Array(FIGURES * Math.max(1, room));
  }

  /**
   * One occurrence of token `n` in document `document` (numbered from 1 by the caller, counted one
   * after another): its document frequency grows only with its first occurrence in a document.
   */
  occur(n: number, document: number): void {
    const at = FIGURES * n;
    if (at >= this.#figures.length) this.#grow(n);
    const figures = this.#figures;
    figures[at + COUNT] = (figures[at + COUNT] as number) + 1;
    if (figures[at + LAST] !== document) {
      figures[at + LAST] = document;
      figures[at + DOCUMENTS] = (figures[at + DOCUMENTS] as number) + 1;
    }
  }

  /**
   * Adds `count` occurrences in `documents` documents of token `n`, counted elsewhere (a tally file,
   * another thread); a later document counts as a new one for it.
   */
  add(n: number, count: number, documents: number): void {
    const at = FIGURES * n;
    if (at >= this.#figures.length) this.#grow(n);
    const figures = this.#figures;
    figures[at + COUNT] = (figures[at + COUNT] as number) + count;
    figures[at + DOCUMENTS] = (figures[at + DOCUMENTS] as number) + documents;
    figures[at + LAST] = 0;
  }

  /** Figure `figure` ({@link COUNT} or {@link DOCUMENTS}) of token `n` (0 for a token never counted). */
  at(n: number, figure: number): number {
    return (this.#figures[FIGURES * n + figure] as number | undefined) ?? 0;
  }

  /** Figure `figure` of tokens 0 to `tokens` - 1, in order. */
  column(figure: number, tokens: number): Float64Array {
    const out = new Float64Array(tokens);
    const figures = this.#figures;
    const room = Math.min(tokens, figures.length / FIGURES);
    for (let n = 0; n < room; n++) out[n] = figures[FIGURES * n + figure] as number;
    return out;
  }

  /** Forgets token `n`'s figures (as if never counted). */
  clear(n: number): void {
    const at = FIGURES * n;
    if (at >= this.#figures.length) return;
    this.#figures.fill(0, at, at + FIGURES);
  }

  /** Room for token `n`: at least double. */
  #grow(n: number): void {
    const out = new Float64Array(FIGURES * Math.max(n + 1, (2 * this.#figures.length) / FIGURES));
    out.set(this.#figures);
    this.#figures = out;
  }
}
