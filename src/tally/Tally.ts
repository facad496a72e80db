import { LexlockError } from '../LexlockError.js';
import { canonicalJson } from '../artifact/canonicalJson.js';
import { detached } from '../rules/detached.js';
import { tokenize } from '../rules/tokenize.js';
import type { TextRules } from '../rules/TextRules.js';

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

/** What a tally knows of one token. */
interface TokenEntry {
  /** The token's number: its place in the order tokens were first counted, from 0. */
  id: number;
  count: number;
  documents: number;
  /** The number of the last document counted with this token in it (document frequency is counted once a document). */
  last: number;
}

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
  // One entry per token: a single hash lookup counts an occurrence and its document.
  readonly #entries = new Map<string, TokenEntry>();
  // Snapshots handed out by `counts` and `documentFrequency`, dropped when the tally changes.
  #counts: Map<string, number> | null = null;
  #frequency: Map<string, number> | null = null;

  constructor(rules: TextRules) {
    this.rules = rules;
  }

  /** Occurrences of `token` (0 when never counted). */
  countOf(token: string): number {
    return this.#entries.get(token)?.count ?? 0;
  }

  /** The number of `token`: its place in the order first counted (as {@link Tally.entries}), or -1. */
  numberOf(token: string): number {
    return this.#entries.get(token)?.id ?? -1;
  }

  /** Documents `token` occurs in (0 when never counted). */
  documentsOf(token: string): number {
    return this.#entries.get(token)?.documents ?? 0;
  }

  /** Every counted token with its occurrences and document frequency, in the order first counted. */
  *entries(): IterableIterator<[token: string, count: number, documents: number]> {
    for (const [token, e] of this.#entries) yield [token, e.count, e.documents];
  }

  /** Every counted token, in the order first counted. */
  tokenList(): IterableIterator<string> {
    return this.#entries.keys();
  }

  /** Occurrences per token: a read-only snapshot, made once and kept until the tally changes. */
  get counts(): ReadonlyMap<string, number> {
    if (this.#counts === null) {
      this.#counts = new Map();
      for (const [token, e] of this.#entries) this.#counts.set(token, e.count);
    }
    return this.#counts;
  }

  /** Documents each token occurs in: a read-only snapshot, as {@link Tally.counts}. */
  get documentFrequency(): ReadonlyMap<string, number> {
    if (this.#frequency === null) {
      this.#frequency = new Map();
      for (const [token, e] of this.#entries) this.#frequency.set(token, e.documents);
    }
    return this.#frequency;
  }

  /** Distinct tokens counted. */
  get types(): number {
    return this.#entries.size;
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
    const entries = this.#entries;
    for (let k = 0; k < tokens.length; k++) {
      const t = tokens[k] as string;
      if (keep !== null && !keep.has(t)) continue;
      let e = entries.get(t);
      if (e === undefined) {
        e = { id: entries.size, count: 1, documents: 1, last: document };
        entries.set(detached(t), e);
      } else {
        e.count += 1;
        if (e.last !== document) {
          e.last = document;
          e.documents += 1;
        }
      }
      if (numbers !== null) numbers[k] = e.id;
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
    let e = this.#entries.get(token);
    // `last` 0 matches no document counted here, so a later document still counts as a new one.
    if (e === undefined) {
      e = { id: this.#entries.size, count, documents, last: 0 };
      this.#entries.set(token, e);
    } else {
      e.count += count;
      e.documents += documents;
      e.last = 0;
    }
    return e.id;
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
    const n = this.#entries.size;
    const types: string[] = new Array<string>(n);
    const occurrences = new Float64Array(n);
    const documentFrequency = new Float64Array(n);
    let i = 0;
    for (const [token, e] of this.#entries) {
      types[i] = token;
      occurrences[i] = e.count;
      documentFrequency[i] = e.documents;
      i++;
    }
    const { documents, tokens, lengths, labels } = this;
    return { documents, tokens, types, occurrences, documentFrequency, lengths, labels };
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
