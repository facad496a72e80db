import { WHITE_SPACE_TABLE } from './fast/whiteSpaceTable.js';
import { TYPE_CODE, type TokenSpans } from './TokenSpans.js';

/** Character tokens have no type of their own; drop and collapse do not exist at this level. */
const CHAR_TYPE = TYPE_CODE.word;
/** The token a run of white space becomes when spaces are kept. */
const SPACE = ' ';

/**
 * Character-level tokens (encoding contract, rule 2) of `out.text`: every code point that is not white
 * space (the engine's `\s`; none lies outside the first plane) is a token, reported to `out` as a
 * span; each maximal run of white space is one token, a single U+0020 space, when `spaces` is `keep`,
 * and nothing when it is `drop`. A lone surrogate is a code point of its own. In steps of bounded work,
 * so a caller can pause between them.
 */
export class CharScan {
  #out: TokenSpans | null = null;
  #keep = true;
  #at = 0;
  #inSpace = false;
  /** A window (see {@link beginWindow}): where the text is read up to, and the tokens wanted. */
  #limit = -1;
  #want = Number.POSITIVE_INFINITY;

  /** Starts on `out.text`. */
  begin(out: TokenSpans, spaces: 'keep' | 'drop'): void {
    this.#out = out;
    this.#keep = spaces === 'keep';
    this.#at = 0;
    this.#inSpace = false;
    this.#limit = -1;
    this.#want = Number.POSITIVE_INFINITY;
  }

  /**
   * Starts on `out.text` read from `from` up to `limit` only (both between code points), stopping as
   * soon as `out` holds `want` tokens. Every token found is the whole text's, whatever follows: a run
   * of white space is one token (or none) however far it goes on. {@link extendWindow} reads further.
   */
  beginWindow(out: TokenSpans, spaces: 'keep' | 'drop', from: number, limit: number, want: number): void {
    this.begin(out, spaces);
    this.#at = from;
    this.#limit = limit;
    this.#want = want;
  }

  /** Goes on in a window that now reads `out.text` (the same text, or the same text made longer) up to `limit`. */
  extendWindow(out: TokenSpans, limit: number): void {
    this.#out = out;
    this.#limit = limit;
  }

  /**
   * Goes on for about `budget` code units (Infinity: to the end); true once every token is in `out`,
   * or, in a window, once `want` tokens are or the limit is reached.
   */
  step(budget: number): boolean {
    const out = this.#out as TokenSpans;
    const text = out.text;
    const n = this.#limit < 0 ? text.length : this.#limit;
    const keep = this.#keep;
    const until = Math.min(n, this.#at + budget);
    const want = this.#want;
    let inSpace = this.#inSpace;
    let i = this.#at;
    while (i < until && out.count < want) {
      const code = text.charCodeAt(i);
      if (code >= 0xd800 && code <= 0xdbff && i + 1 < n) {
        const next = text.charCodeAt(i + 1);
        if (next >= 0xdc00 && next <= 0xdfff) {
          out.span(i, i + 2, CHAR_TYPE);
          inSpace = false;
          i += 2;
          continue;
        }
      }
      if (WHITE_SPACE_TABLE[code] !== 1) {
        out.span(i, i + 1, CHAR_TYPE);
        inSpace = false;
      } else if (keep && !inSpace) {
        out.addString(SPACE);
        inSpace = true;
      }
      i += 1;
    }
    this.#at = i;
    this.#inSpace = inSpace;
    if (i < n && out.count < want) return false;
    this.#out = null;
    return true;
  }
}

const shared = new CharScan();

/**
 * The character level of `out.text` all at once (see {@link CharScan}, which it runs to the end).
 * @example scanCharTokens(out, 'keep') // out.text 'a \t b😀' -> 'a', ' ', 'b', '😀'
 */
export function scanCharTokens(out: TokenSpans, spaces: 'keep' | 'drop'): void {
  shared.begin(out, spaces);
  shared.step(Number.POSITIVE_INFINITY);
}
