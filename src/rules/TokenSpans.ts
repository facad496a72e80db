import { splitAlien } from './splitAlien.js';
import { placeholderOf, TOKEN_TYPES, type TextRules, type TokenType } from './TextRules.js';

/** Each token type's number: its place in {@link TOKEN_TYPES}. */
export const TYPE_CODE = Object.fromEntries(TOKEN_TYPES.map((type, code) => [type, code])) as Readonly<Record<TokenType, number>>;

const CODE_OF_TAG = new Map<string, number>(TOKEN_TYPES.map((type, code) => [type, code]));
const PLACEHOLDERS: readonly string[] = TOKEN_TYPES.map(placeholderOf);
const ALIEN: TokenType = 'alien';

/** What the scanners report tokens to: `text[from, to)` of the scanned text is a token of `type` (a {@link TYPE_CODE}). */
export interface SpanSink {
  span(from: number, to: number, type: number): void;
}

/** What wink-tokenizer's tokens are reported to: `value` tagged `tag` (one of {@link TOKEN_TYPES}). */
export interface PairSink {
  pair(value: string, tag: string): void;
}

const KEEP = 0;
const DROP = 1;
const COLLAPSE = 2;
/** Past this many tokens the buffers are let go after use rather than kept for the next text. */
const KEPT_CAPACITY = 1 << 16;
const FIRST_CAPACITY = 64;

/**
 * One text's tokens, in order, each either a span of the scanned text (`starts[k]` to `ends[k]`) or a
 * string (`starts[k]` is -1 and the token is `strings[k]`), with the rules' `drop` and `collapse`
 * already applied. Reused from text to text, so scanning a text allocates nothing for its tokens;
 * {@link tokenAt} makes a token's string only when asked.
 *
 * When `folded` is true the scanned text is ASCII that still needs lower-casing: spans are read with
 * A-Z as a-z (lower-casing ASCII changes no length and no scanning decision).
 */
export class TokenSpans implements SpanSink, PairSink {
  /** The text the spans point into. */
  text = '';
  folded = false;
  /** How many tokens there are. */
  count = 0;
  starts = new Int32Array(FIRST_CAPACITY);
  ends = new Int32Array(FIRST_CAPACITY);
  strings: string[] = [];
  #tagged = false;
  readonly #action = new Uint8Array(TOKEN_TYPES.length);
  readonly #makeStrings: boolean;

  /**
   * @param makeStrings make each span's string as it is added, for callers that want every token as a
   * string anyway (tokenize): one step instead of spans first and strings after.
   */
  constructor(makeStrings = false) {
    this.#makeStrings = makeStrings;
  }

  /** Empties the buffer for a new scan of `text` under `rules`' drop and collapse. */
  begin(text: string, folded: boolean, rules: Pick<TextRules, 'drop' | 'collapse'>): void {
    if (this.starts.length > KEPT_CAPACITY) {
      this.starts = new Int32Array(FIRST_CAPACITY);
      this.ends = new Int32Array(FIRST_CAPACITY);
    }
    if (this.strings.length > KEPT_CAPACITY) this.strings = [];
    this.text = text;
    this.folded = folded;
    this.count = 0;
    this.#tagged = rules.drop.length > 0 || rules.collapse.length > 0;
    if (this.#tagged) {
      this.#action.fill(KEEP);
      for (const type of rules.drop) this.#action[TYPE_CODE[type]] = DROP;
      for (const type of rules.collapse) this.#action[TYPE_CODE[type]] = COLLAPSE;
    }
  }

  /** A token of `type` that is `text[from, to)`: kept as a span, dropped or collapsed as the rules say. */
  span(from: number, to: number, type: number): void {
    if (this.#tagged) {
      const action = this.#action[type];
      if (action === DROP) return;
      if (action === COLLAPSE) {
        this.addString(PLACEHOLDERS[type] as string);
        return;
      }
    }
    const k = this.count;
    if (k === this.starts.length) this.#grow();
    if (this.#makeStrings) {
      const token = this.text.slice(from, to);
      this.starts[k] = -1;
      this.strings[k] = this.folded ? token.toLowerCase() : token;
    } else {
      this.starts[k] = from;
      this.ends[k] = to;
    }
    this.count = k + 1;
  }

  /**
   * One of wink-tokenizer's tokens, `value` tagged `tag` (encoding contract, rule 2): an empty value
   * is no token, `drop` and `collapse` apply by tag, and an alien token is split again.
   */
  pair(value: string, tag: string): void {
    if (value === '') return;
    if (this.#tagged) {
      const type = CODE_OF_TAG.get(tag) ?? -1;
      const action = type >= 0 ? this.#action[type] : KEEP;
      if (action === DROP) return;
      if (action === COLLAPSE) {
        this.addString(PLACEHOLDERS[type] as string);
        return;
      }
    }
    if (tag === ALIEN) for (const piece of splitAlien(value, [])) this.addString(piece);
    else this.addString(value);
  }

  /** A token given as a string, added as it is. */
  addString(value: string): void {
    const k = this.#room();
    this.starts[k] = -1;
    this.strings[k] = value;
  }

  /**
   * Takes over the tokens of `other` (a scan of the same text under the same rules, made ahead),
   * leaving `other` with this one's old buffers. Made strings of when this one makes strings.
   */
  takeFrom(other: TokenSpans): void {
    [this.starts, other.starts] = [other.starts, this.starts];
    [this.ends, other.ends] = [other.ends, this.ends];
    [this.strings, other.strings] = [other.strings, this.strings];
    this.text = other.text;
    this.folded = other.folded;
    this.count = other.count;
    other.count = 0;
    other.text = '';
    if (!this.#makeStrings) return;
    for (let k = 0; k < this.count; k++) {
      if ((this.starts[k] as number) < 0) continue;
      this.strings[k] = this.tokenAt(k);
      this.starts[k] = -1;
    }
  }

  /** Token `k` as a string. */
  tokenAt(k: number): string {
    const start = this.starts[k] as number;
    if (start < 0) return this.strings[k] as string;
    const token = this.text.slice(start, this.ends[k]);
    return this.folded ? token.toLowerCase() : token;
  }

  /** Every token as a string, in order. */
  toArray(): string[] {
    if (this.#makeStrings) return this.strings.slice(0, this.count);
    const out: string[] = [];
    if (this.folded) {
      for (let k = 0; k < this.count; k++) out.push(this.tokenAt(k));
      return out;
    }
    const { text, starts, ends, strings, count } = this;
    for (let k = 0; k < count; k++) {
      const start = starts[k] as number;
      out.push(start < 0 ? (strings[k] as string) : text.slice(start, ends[k]));
    }
    return out;
  }

  /** The index of a new token, growing the buffers when they are full. */
  #room(): number {
    const k = this.count;
    if (k === this.starts.length) this.#grow();
    this.count = k + 1;
    return k;
  }

  /** Doubles the room for tokens. */
  #grow(): void {
    const starts = new Int32Array(this.starts.length * 2);
    const ends = new Int32Array(this.starts.length * 2);
    starts.set(this.starts);
    ends.set(this.ends);
    this.starts = starts;
    this.ends = ends;
  }
}
