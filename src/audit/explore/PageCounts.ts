import type { Lexicon } from '../../lexicon/Lexicon.js';
import { StopIndex, type StopGrid } from './StopGrid.js';

/** The additive figures of {@link PageCounts}, as a worker thread sends them back. */
export interface PageParts {
  overall: Float64Array;
  labels: ReadonlyMap<string, { ranks: Float64Array; lengths: ReadonlyMap<number, number> }>;
}

/**
 * What the report page's cap and length controls need, counted during the audit: token occurrences
 * by the rank of their token (summed between the cap grid's stops), overall and per label, and
 * documents by length per label. A token is ranked by the ranking lexicon (the lexicon audited, or
 * one holding every token of the corpus when the audit froze its own): reserved tokens count at cap 0
 * (always kept), a token of rank r (0 first) at every cap above r, a token it does not know at none.
 */
export class PageCounts {
  readonly index: StopIndex;
  readonly ranking: Lexicon;
  readonly overall: Float64Array;
  readonly labels = new Map<string, { ranks: Float64Array; lengths: Map<number, number> }>();
  /** Id of the ranking's first ranked token, and how many it ranks. */
  readonly #firstToken: number;
  readonly #firstRanked: number;
  readonly #ranked: number;

  constructor(grid: StopGrid, ranking: Lexicon) {
    this.index = new StopIndex(grid);
    this.ranking = ranking;
    this.overall = new Float64Array(this.index.stops.length);
    const layout = ranking.encoding.layout;
    this.#firstToken = layout.oov === 'first' ? 2 : 1;
    this.#firstRanked = this.#firstToken + layout.reserved;
    this.#ranked = ranking.encoding.tokens.length - layout.reserved;
  }

  /** The bucket of an id of the ranking (-1: never kept, an OOV id). */
  bucketOfId(id: number): number {
    const rank = id - this.#firstRanked;
    if (rank >= 0 && rank < this.#ranked) return this.index.bucketOf(rank + 1);
    return id >= this.#firstToken && id < this.#firstRanked ? 0 : -1;
  }

  /** Counts one document of `n` tokens by their ids under the ranking. */
  add(ids: Int32Array, n: number, label: string | undefined): void {
    const overall = this.overall;
    let entry: { ranks: Float64Array; lengths: Map<number, number> } | undefined;
    if (label !== undefined) {
      entry = this.labels.get(label);
      if (entry === undefined) {
        entry = { ranks: new Float64Array(overall.length), lengths: new Map() };
        this.labels.set(label, entry);
      }
      entry.lengths.set(n, (entry.lengths.get(n) ?? 0) + 1);
    }
    const ranks = entry?.ranks;
    for (let i = 0; i < n; i++) {
      const bucket = this.bucketOfId(ids[i] as number);
      if (bucket < 0) continue;
      overall[bucket] = (overall[bucket] as number) + 1;
      if (ranks !== undefined) ranks[bucket] = (ranks[bucket] as number) + 1;
    }
  }

  /** Adds figures counted elsewhere on the same grid. */
  merge(parts: PageParts): void {
    addInto(this.overall, parts.overall);
    for (const [label, p] of parts.labels) {
      let entry = this.labels.get(label);
      if (entry === undefined) {
        entry = { ranks: new Float64Array(this.overall.length), lengths: new Map() };
        this.labels.set(label, entry);
      }
      addInto(entry.ranks, p.ranks);
      for (const [length, documents] of p.lengths) entry.lengths.set(length, (entry.lengths.get(length) ?? 0) + documents);
    }
  }

  /** The additive state, for sending to another thread. */
  parts(): PageParts {
    return { overall: this.overall, labels: this.labels };
  }
}

function addInto(target: Float64Array, source: Float64Array): void {
  for (let i = 0; i < target.length; i++) target[i] = (target[i] as number) + (source[i] ?? 0);
}
