import { LexlockError } from '../LexlockError.js';
import { canonicalJson } from '../artifact/canonicalJson.js';
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

/** The counts of a tally without its rules: what a worker thread sends back. */
export interface TallyCounts {
  readonly documents: number;
  readonly tokens: number;
  readonly counts: ReadonlyMap<string, number>;
  readonly documentFrequency: ReadonlyMap<string, number>;
  readonly lengths: ReadonlyMap<number, number>;
  readonly labels: ReadonlyMap<string, LabelCounts>;
}

/**
 * Counts over a corpus (encoding contract, rule 3): occurrences and document frequency per token,
 * tokens per document, documents and tokens per label. Tallies made under the same rules merge by
 * addition, in any order or split, to the same tally.
 * @example
 * const tally = Tally.fromTexts(['a b', 'b c'], resolveRules());
 * tally.counts.get('b') // 2
 */
export class Tally {
  /** The rules every counted document was tokenized with. */
  readonly rules: TextRules;
  /** Occurrences per token. */
  readonly counts = new Map<string, number>();
  /** Documents each token occurs in. */
  readonly documentFrequency = new Map<string, number>();
  /** Histogram of tokens per document: length -> documents. */
  readonly lengths = new Map<number, number>();
  /** Documents and tokens per label (labelled documents only). */
  readonly labels = new Map<string, LabelCounts>();
  documents = 0;
  tokens = 0;

  constructor(rules: TextRules) {
    this.rules = rules;
  }

  /** Counts one document's tokens (already tokenized under `this.rules`). */
  addTokens(tokens: readonly string[], label?: string): this {
    return this.addSome(tokens, label, null);
  }

  /**
   * Counts one document (documents, tokens, length, label) but keeps per-token counts only for the
   * tokens `keep` accepts (null: all), for a second pass that counts known candidates exactly.
   */
  addSome(tokens: readonly string[], label: string | undefined, keep: ReadonlySet<string> | null): this {
    this.documents += 1;
    this.tokens += tokens.length;
    this.lengths.set(tokens.length, (this.lengths.get(tokens.length) ?? 0) + 1);
    const seen = new Set<string>();
    for (const t of tokens) {
      if (keep !== null && !keep.has(t)) continue;
      this.counts.set(t, (this.counts.get(t) ?? 0) + 1);
      if (!seen.has(t)) {
        seen.add(t);
        this.documentFrequency.set(t, (this.documentFrequency.get(t) ?? 0) + 1);
      }
    }
    if (label !== undefined) {
      const c = this.labels.get(label) ?? { documents: 0, tokens: 0 };
      c.documents += 1;
      c.tokens += tokens.length;
      this.labels.set(label, c);
    }
    return this;
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
    return this.mergeCounts(other);
  }

  /**
   * Adds counts made elsewhere under this tally's rules, such as a worker thread's tally of a batch
   * (the parts survive structured cloning). The caller vouches for the rules; prefer `merge`.
   */
  mergeCounts(other: TallyCounts): this {
    this.documents += other.documents;
    this.tokens += other.tokens;
    addInto(this.counts, other.counts);
    addInto(this.documentFrequency, other.documentFrequency);
    addInto(this.lengths, other.lengths);
    for (const [label, c] of other.labels) {
      const mine = this.labels.get(label) ?? { documents: 0, tokens: 0 };
      mine.documents += c.documents;
      mine.tokens += c.tokens;
      this.labels.set(label, mine);
    }
    return this;
  }

  /** Distinct tokens counted. */
  get types(): number {
    return this.counts.size;
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
}

function addInto<K>(into: Map<K, number>, from: ReadonlyMap<K, number>): void {
  for (const [k, n] of from) into.set(k, (into.get(k) ?? 0) + n);
}
