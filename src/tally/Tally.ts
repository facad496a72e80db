import { LexlockError } from '../LexlockError.js';
import { canonicalJson } from '../artifact/canonicalJson.js';
import { detached } from '../rules/detached.js';
import { tokenize } from '../rules/tokenize.js';
import type { TextRules } from '../rules/TextRules.js';
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

/** Options of a {@link Tally}. */
export interface TallyOptions {
  /**
   * Tokens one internal Map holds before the next one starts (default {@link MAP_ENTRIES_MOST}; a
   * JavaScript Map holds at most 2^24). Tests set it low to exercise tallies of more tokens than that.
   */
  entriesPerMap?: number;
}

/** Room for this many tokens' figures at first; it doubles when full. */
const FIRST_ROOM = 1024;

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
  // Token -> its number (the order first counted, from 0); the figures of token n are at [n] of the
  // arrays below, so a token costs its string and a map entry, not an object of its own.
  readonly #numbers: TokenMap<number>;
  #count: Float64Array = new Float64Array(FIRST_ROOM);
  #documentsOf: Float64Array = new Float64Array(FIRST_ROOM);
  /** The number of the last document counted with token n in it (document frequency is counted once a document); 0 for none. */
  #last: Float64Array = new Float64Array(FIRST_ROOM);
  // Snapshots handed out by `counts` and `documentFrequency`, dropped when the tally changes.
  #counts: ReadonlyMap<string, number> | null = null;
  #frequency: ReadonlyMap<string, number> | null = null;

  constructor(rules: TextRules, options: TallyOptions = {}) {
    this.rules = rules;
    this.#numbers = new TokenMap(options.entriesPerMap);
  }

  /** Occurrences of `token` (0 when never counted). */
  countOf(token: string): number {
    const n = this.#numbers.get(token);
    return n === undefined ? 0 : (this.#count[n] as number);
  }

  /** The number of `token`: its place in the order first counted (as {@link Tally.entries}), or -1. */
  numberOf(token: string): number {
    return this.#numbers.get(token) ?? -1;
  }

  /** Documents `token` occurs in (0 when never counted). */
  documentsOf(token: string): number {
    const n = this.#numbers.get(token);
    return n === undefined ? 0 : (this.#documentsOf[n] as number);
  }

  /** Every counted token with its occurrences and document frequency, in the order first counted. */
  *entries(): IterableIterator<[token: string, count: number, documents: number]> {
    let n = 0;
    for (const token of this.#numbers.keys()) {
      yield [token, this.#count[n] as number, this.#documentsOf[n] as number];
      n++;
    }
  }

  /** Calls `visit` with every counted token and its occurrences, in the order first counted (no pair made for each). */
  forEachCount(visit: (token: string, count: number) => void): void {
    let n = 0;
    for (const token of this.#numbers.keys()) visit(token, this.#count[n++] as number);
  }

  /** Every counted token, in the order first counted. */
  tokenList(): IterableIterator<string> {
    return this.#numbers.keys();
  }

  /** Occurrences of every counted token, in the order first counted (index n: token number n). */
  countList(): Float64Array {
    return this.#count.slice(0, this.#numbers.size);
  }

  /** Occurrences per token: a read-only snapshot, made once and kept until the tally changes. */
  get counts(): ReadonlyMap<string, number> {
    if (this.#counts === null) this.#counts = this.#snapshot(this.#count);
    return this.#counts;
  }

  /** Documents each token occurs in: a read-only snapshot, as {@link Tally.counts}. */
  get documentFrequency(): ReadonlyMap<string, number> {
    if (this.#frequency === null) this.#frequency = this.#snapshot(this.#documentsOf);
    return this.#frequency;
  }

  /** Distinct tokens counted. */
  get types(): number {
    return this.#numbers.size;
  }

  /** Counts one document's tokens (already tokenized under `this.rules`). */
  addTokens(tokens: readonly string[], label?: string): this {
    return this.#add(tokens, label, null, null);
  }

  /**
   * Counts one document (documents, tokens, length, label) but keeps per-token counts only for the
   * tokens `keep` accepts (null: all), for a second pass that counts known candidates exactly.
   */
  addSome(tokens: readonly string[], label: string | undefined, keep: ReadonlySet<string> | null): this {
    return this.#add(tokens, label, keep, null);
  }

  /**
   * Counts one document's tokens as {@link Tally.addTokens} does and writes each token's number
   * (see {@link Tally.numberOf}) into `numbers`, which must hold at least `tokens.length`.
   */
  addNumbered(tokens: readonly string[], label: string | undefined, numbers: Int32Array): this {
    return this.#add(tokens, label, null, numbers);
  }

  #add(tokens: readonly string[], label: string | undefined, keep: ReadonlySet<string> | null, numbers: Int32Array | null): this {
    this.#changed();
    this.documents += 1;
    const document = this.documents;
    this.tokens += tokens.length;
    this.lengths.set(tokens.length, (this.lengths.get(tokens.length) ?? 0) + 1);
    const map = this.#numbers;
    for (let k = 0; k < tokens.length; k++) {
      const t = tokens[k] as string;
      if (keep !== null && !keep.has(t)) continue;
      let n = map.get(t);
      if (n === undefined) {
        n = this.#newNumber(detached(t));
        this.#count[n] = 1;
        this.#documentsOf[n] = 1;
        this.#last[n] = document;
      } else {
        const count = this.#count;
        count[n] = (count[n] as number) + 1;
        if (this.#last[n] !== document) {
          this.#last[n] = document;
          const documents = this.#documentsOf;
          documents[n] = (documents[n] as number) + 1;
        }
      }
      if (numbers !== null) numbers[k] = n;
    }
    if (label !== undefined) addLabel(this.labels, label, 1, tokens.length);
    return this;
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
    let n = this.#numbers.get(token);
    if (n === undefined) {
      n = this.#newNumber(token);
      this.#count[n] = count;
      this.#documentsOf[n] = documents;
    } else {
      this.#count[n] = (this.#count[n] as number) + count;
      this.#documentsOf[n] = (this.#documentsOf[n] as number) + documents;
    }
    // 0 matches no document counted here, so a later document still counts as a new one.
    this.#last[n] = 0;
    return n;
  }

  /** Numbers a new token, making room for its figures. */
  #newNumber(token: string): number {
    const n = this.#numbers.size;
    if (n === this.#count.length) {
      const room = n * 2;
      this.#count = grown(this.#count, room);
      this.#documentsOf = grown(this.#documentsOf, room);
      this.#last = grown(this.#last, room);
    }
    this.#numbers.add(token, n);
    return n;
  }

  /** Token -> figure n of `figures`, for every token: a Map (a {@link TokenMap} past what one Map holds). */
  #snapshot(figures: Float64Array): ReadonlyMap<string, number> {
    const out = this.#numbers.size <= MAP_ENTRIES_MOST ? new Map<string, number>() : new TokenMap<number>();
    let n = 0;
    for (const token of this.#numbers.keys()) out.set(token, figures[n++] as number);
    return out;
  }

  /** Tokenizes and counts one text (or labelled text); returns its tokens. */
  add(item: string | LabelledText): string[] {
    const text = typeof item === 'string' ? item : item.text;
    const tokens = tokenize(text, this.rules);
    this.addTokens(tokens, typeof item === 'string' ? undefined : item.label);
    return tokens;
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
    return { documents, tokens, types: [...this.#numbers.keys()], occurrences: this.#count.slice(0, n), documentFrequency: this.#documentsOf.slice(0, n), lengths, labels };
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

/** `figures` copied into an array of `room` places. */
function grown(figures: Float64Array, room: number): Float64Array {
  const out = new Float64Array(room);
  out.set(figures);
  return out;
}

function addLabel(labels: Map<string, LabelCounts>, label: string, documents: number, tokens: number): void {
  const c = labels.get(label);
  if (c === undefined) labels.set(label, { documents, tokens });
  else {
    c.documents += documents;
    c.tokens += tokens;
  }
}
