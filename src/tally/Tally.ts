import { LexlockError } from '../LexlockError.js';
import { canonicalJson } from '../artifact/canonicalJson.js';
import { detached } from '../rules/detached.js';
import { scanTokens } from '../rules/scanTokens.js';
import { SpanIndex } from '../rules/SpanIndex.js';
import type { TextRules } from '../rules/TextRules.js';
import { TokenSpans } from '../rules/TokenSpans.js';
import { COUNT, DOCUMENTS, TokenFigures } from './TokenFigures.js';
import { MAP_ENTRIES_MOST, TokenMap } from './TokenMap.js';

/** A text with an optional label, as corpus readers and callers hand them in. */
export interface LabelledText {
  text: string;
  label?: string | undefined;
}

/** Per-label figures of a tally. */
export interface LabelCounts {
  documents: number;
  tokens: number;
}

/**
 * The counts of a tally without its rules, in a form that crosses threads cheaply (a worker's reply):
 * token `i` of `types` occurred `occurrences[i]` times, in `documentFrequency[i]` documents.
 */
export interface TallyCounts {
  readonly documents: number;
  readonly tokens: number;
  readonly types: readonly string[];
  readonly occurrences: Float64Array;
  readonly documentFrequency: Float64Array;
  readonly lengths: ReadonlyMap<number, number>;
  readonly labels: ReadonlyMap<string, LabelCounts>;
}


/** Where {@link Tally.add} and {@link Tally.addNumberedText} leave a text's tokens (reused: one text at a time). */
const scanned = new TokenSpans();

/**
 * Counts over a corpus (encoding contract, rule 3): occurrences and document frequency per token,
 * tokens per document, documents and tokens per label. Tallies made under the same rules merge by
 * addition, in any order or split, to the same tally.
 * @example
 * const tally = Tally.fromTexts(['a b', 'b c'], resolveRules());
 * tally.countOf('b') // 2
 */
export class Tally {
  /** The rules every counted document was tokenized with. */
  readonly rules: TextRules;
  /** Histogram of tokens per document: length -> documents. */
  readonly lengths = new Map<number, number>();
  /** Documents and tokens per label (labelled documents only). */
  readonly labels = new Map<string, LabelCounts>();
  documents = 0;
  tokens = 0;
  // Token -> its number (the order first counted, from 0), found by a span of a text as well as by a
  // string, so counting a text makes no string for a token already counted; the figures of token n
  // are in #figures (TokenFigures), so a token costs its string and an index entry, not an object.
  readonly #numbers = new SpanIndex();
  readonly #figures = new TokenFigures();
  // Snapshots handed out by `counts` and `documentFrequency`, dropped when the tally changes.
  #counts: ReadonlyMap<string, number> | null = null;
  #frequency: ReadonlyMap<string, number> | null = null;

  constructor(rules: TextRules) {
    this.rules = rules;
  }

  /** Occurrences of `token` (0 when never counted). */
  countOf(token: string): number {
    const n = this.#numbers.indexOf(token);
    return n < 0 ? 0 : this.#figures.at(n, COUNT);
  }

  /** The number of `token`: its place in the order first counted (as {@link Tally.entries}), or -1. */
  numberOf(token: string): number {
    return this.#numbers.indexOf(token);
  }

  /** Documents `token` occurs in (0 when never counted). */
  documentsOf(token: string): number {
    const n = this.#numbers.indexOf(token);
    return n < 0 ? 0 : this.#figures.at(n, DOCUMENTS);
  }

  /** Every counted token with its occurrences and document frequency, in the order first counted. */
  *entries(): IterableIterator<[token: string, count: number, documents: number]> {
    let n = 0;
    for (const token of this.#numbers.keys()) {
      yield [token, this.#figures.at(n, COUNT), this.#figures.at(n, DOCUMENTS)];
      n++;
    }
  }

  /** Calls `visit` with every counted token and its occurrences, in the order first counted (no pair made for each). */
  forEachCount(visit: (token: string, count: number) => void): void {
    let n = 0;
    for (const token of this.#numbers.keys()) visit(token, this.#figures.at(n++, COUNT));
  }

  /** Every counted token, in the order first counted. */
  tokenList(): IterableIterator<string> {
    return this.#numbers.keys();
  }

  /** Occurrences of every counted token, in the order first counted (index n: token number n). */
  countList(): Float64Array {
    return this.#figures.column(COUNT, this.#numbers.size);
  }

  /** Occurrences per token: a read-only snapshot, made once and kept until the tally changes. */
  get counts(): ReadonlyMap<string, number> {
    if (this.#counts === null) this.#counts = this.#snapshot(COUNT);
    return this.#counts;
  }

  /** Documents each token occurs in: a read-only snapshot, as {@link Tally.counts}. */
  get documentFrequency(): ReadonlyMap<string, number> {
    if (this.#frequency === null) this.#frequency = this.#snapshot(DOCUMENTS);
    return this.#frequency;
  }

  /** Distinct tokens counted. */
  get types(): number {
    return this.#numbers.size;
  }

  /** Counts one document's tokens (already tokenized under `this.rules`). */
  addTokens(tokens: readonly string[], label?: string): this {
    this.#begin(tokens.length);
    for (const token of tokens) {
      const n = this.#numbers.indexOf(token);
      if (n >= 0) this.#countAgain(n);
      else this.#countNew(token);
    }
    if (label !== undefined) addLabel(this.labels, label, 1, tokens.length);
    return this;
  }

  /**
   * Tokenizes `text` under `this.rules` and counts it as {@link Tally.add} does; returns each token's
   * number (see {@link Tally.numberOf}), in order.
   */
  addNumberedText(text: string, label?: string): Int32Array {
    scanTokens(text, this.rules, scanned, true);
    const numbers = new Int32Array(scanned.count);
    this.addSpans(scanned, label, numbers);
    return numbers;
  }

  /**
   * Counts one document given as the tokens a scan left in `spans` (see {@link scanTokens}, under
   * `this.rules`): each token is looked up where it lies in the scanned text, so only a token never
   * counted before becomes a string. With `numbers` (at least `spans.count` long), writes each token's
   * number there.
   */
  addSpans(spans: TokenSpans, label?: string, numbers: Int32Array | null = null): this {
    const total = this.#begin(spans.count);
    for (let k = 0; k < total; k++) {
      const counted = this.#countToken(spans, k);
      if (numbers !== null) numbers[k] = counted;
    }
    if (label !== undefined) addLabel(this.labels, label, 1, total);
    return this;
  }

  /**
   * Counts one document given as a scan's tokens, as {@link Tally.addSpans} does (documents, tokens,
   * length, label), but keeps per-token figures only for the tokens at the first `count` places of
   * `picked` (in order): a caller that counts the other tokens itself (an audit counts known tokens
   * by id) adds those with {@link Tally.addToken}.
   */
  addPickedSpans(spans: TokenSpans, label: string | undefined, picked: Int32Array, count: number): this {
    this.#begin(spans.count);
    for (let p = 0; p < count; p++) this.#countToken(spans, picked[p] as number);
    if (label !== undefined) addLabel(this.labels, label, 1, spans.count);
    return this;
  }

  /** Counts token `k` of `spans` in the document being counted; returns its number. */
  #countToken(spans: TokenSpans, k: number): number {
    const n = this.#numbers.indexOfToken(spans, k);
    return n >= 0 ? this.#countAgain(n) : this.#countNew(spans.tokenAt(k));
  }

  /** Counts a new document of `tokens` tokens (its length); returns `tokens`. */
  #begin(tokens: number): number {
    this.#changed();
    this.documents += 1;
    this.tokens += tokens;
    this.lengths.set(tokens, (this.lengths.get(tokens) ?? 0) + 1);
    return tokens;
  }

  /** One more occurrence of token `n` in the document being counted; returns `n`. */
  #countAgain(n: number): number {
    this.#figures.occur(n, this.documents);
    return n;
  }

  /** The first occurrence of `token` (not counted before), in the document being counted; returns its number. */
  #countNew(token: string): number {
    return this.#countAgain(this.#numbers.add(detached(token)));
  }

  /**
   * Adds `count` occurrences in `documents` documents of `token`, as read from a tally file or made
   * elsewhere; the documents themselves are counted by the caller.
   */
  addToken(token: string, count: number, documents: number): this {
    this.#changed();
    this.#addCounts(token, count, documents);
    return this;
  }

  /** {@link Tally.addToken} without the cache reset; returns the token's number. */
  #addCounts(token: string, count: number, documents: number): number {
    const n = this.#numbers.add(token);
    this.#figures.add(n, count, documents);
    return n;
  }

  /** Token -> figure n of `figures`, for every token: a Map (a {@link TokenMap} past what one Map holds). */
  #snapshot(figure: number): ReadonlyMap<string, number> {
    const out = this.#numbers.size <= MAP_ENTRIES_MOST ? new Map<string, number>() : new TokenMap<number>();
    let n = 0;
    for (const token of this.#numbers.keys()) out.set(token, this.#figures.at(n++, figure));
    return out;
  }

  /** Tokenizes and counts one text (or labelled text), making no string for a token already counted. */
  add(item: string | LabelledText): this {
    if (typeof item === 'string') return this.addSpans(scanTokens(item, this.rules, scanned, true));
    return this.addSpans(scanTokens(item.text, this.rules, scanned, true), item.label);
  }

  /** Adds another tally's counts to this one. Refuses tallies counted under other rules. */
  merge(other: Tally): this {
    if (canonicalJson(other.rules) !== canonicalJson(this.rules)) {
      throw new LexlockError(
        'BAD_OPTION',
        `cannot merge tallies counted under different rules (${canonicalJson(this.rules)} vs ${canonicalJson(other.rules)}); count both parts with the same rules`,
        { field: 'rules' },
      );
    }
    return this.mergeCounts(other.toCounts());
  }

  /**
   * Adds counts made elsewhere under this tally's rules, such as a worker thread's tally of a batch
   * (see {@link Tally.toCounts}). The caller vouches for the rules; prefer `merge`. Given `numbers`
   * (as long as `other.types`), writes there what each of those tokens is numbered here.
   */
  mergeCounts(other: TallyCounts, numbers?: Int32Array): this {
    this.#changed();
    this.documents += other.documents;
    this.tokens += other.tokens;
    const { types, occurrences, documentFrequency } = other;
    for (let i = 0; i < types.length; i++) {
      const n = this.#addCounts(types[i] as string, occurrences[i] as number, documentFrequency[i] as number);
      if (numbers !== undefined) numbers[i] = n;
    }
    for (const [length, n] of other.lengths) this.lengths.set(length, (this.lengths.get(length) ?? 0) + n);
    for (const [label, c] of other.labels) addLabel(this.labels, label, c.documents, c.tokens);
    return this;
  }

  /** The counts as flat arrays, to send to another thread (structured cloning copies arrays fast). */
  toCounts(): TallyCounts {
    const n = this.#numbers.size;
    const { documents, tokens, lengths, labels } = this;
    return { documents, tokens, types: this.#numbers.keyList(), occurrences: this.#figures.column(COUNT, n), documentFrequency: this.#figures.column(DOCUMENTS, n), lengths, labels };
  }

  /** Counts texts from a synchronous iterable. */
  static fromTexts(texts: Iterable<string | LabelledText>, rules: TextRules): Tally {
    const tally = new Tally(rules);
    for (const t of texts) tally.add(t);
    return tally;
  }

  /** Counts texts from an async iterable (a stream, a corpus reader) without holding them. */
  static async fromAsync(texts: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>, rules: TextRules): Promise<Tally> {
    const tally = new Tally(rules);
    for await (const t of texts) tally.add(t);
    return tally;
  }

  #changed(): void {
    this.#counts = null;
    this.#frequency = null;
  }
}

function addLabel(labels: Map<string, LabelCounts>, label: string, documents: number, tokens: number): void {
  const c = labels.get(label);
  if (c === undefined) labels.set(label, { documents, tokens });
  else {
    c.documents += documents;
    c.tokens += tokens;
  }
}
