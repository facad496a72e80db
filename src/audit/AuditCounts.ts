import { LexlockError } from '../LexlockError.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { scanTokens } from '../rules/scanTokens.js';
import { TokenSpans } from '../rules/TokenSpans.js';
import { Tally, type TallyCounts } from '../tally/Tally.js';
import { COUNT, DOCUMENTS, TokenFigures } from '../tally/TokenFigures.js';
import type { LabelAudit } from './CoverageReport.js';
import { OovPositions, type OovPositionCounts } from './OovPositions.js';
import type { PageCounts, PageParts } from './explore/PageCounts.js';

/** Where {@link AuditCounts.add} leaves a document's tokens (reused: one document at a time). */
const scanned = new TokenSpans();

/** The additive figures of an audit, as a worker thread sends them back. */
export interface AuditParts {
  tally: TallyCounts;
  labels: ReadonlyMap<string, LabelAudit>;
  oovTokens: number;
  truncatedDocuments: number;
  droppedTokens: number;
  paddingTokens: number;
  /** Where documents have their OOV tokens, from either end (for the OOV rate of what rows keep). */
  oovPositions: OovPositionCounts;
  /** What the report page's controls need (when asked for). */
  page?: PageParts;
}

/**
 * What an audit counts, document by document: the corpus tally, OOV and truncation overall and per
 * label. Everything adds up, so counts made over parts of a corpus (threads) merge to the same.
 */
export class AuditCounts implements Omit<AuditParts, 'tally' | 'page'> {
  /** Every document's totals, and the occurrences of tokens outside the lexicon (see {@link AuditCounts.tally}). */
  readonly #tally: Tally;
  /**
   * Occurrences and documents of each lexicon token, by id: a token the lexicon knows is counted by its
   * id, found by the one lookup that gives the id, rather than looked up a second time in the tally.
   */
  readonly #known: TokenFigures;
  /** The current document's ids, then the places of its OOV tokens (room for the longest document so far). */
  #ids = new Int32Array(256);
  #oovPlaces = new Int32Array(256);
  readonly oovPositions = new OovPositions();
  readonly labels = new Map<string, LabelAudit>();
  oovTokens = 0;
  truncatedDocuments = 0;
  droppedTokens = 0;
  paddingTokens = 0;
  private readonly lexicon: Lexicon;
  private readonly length: number | null;
  /** Occurrences by rank and lengths per label, for the report page's controls; null when not asked for. */
  readonly page: PageCounts | null;

  /**
   * With page counts ranked by another lexicon (one holding every token of the corpus, the audited
   * lexicon's first): tokens are looked up there, once, and ids past the audited lexicon's become its OOV id.
   */
  readonly #ranking: Lexicon | null;
  /** The first id the ranking gives that the audited lexicon does not have. */
  readonly #pastLexicon: number;

  constructor(lexicon: Lexicon, length: number | null, page: PageCounts | null = null) {
    this.lexicon = lexicon;
    this.length = length;
    this.page = page;
    this.#ranking = page === null || page.ranking === lexicon ? null : page.ranking;
    this.#pastLexicon = lexicon.size;
    if (this.#ranking !== null) assertPrefix(lexicon, this.#ranking);
    this.#tally = new Tally(lexicon.rules);
    this.#known = new TokenFigures(lexicon.size);
  }

  /** Distinct tokens kept so far outside the lexicon (what grows with the corpus), without settling the counts. */
  get keptTypes(): number {
    return this.#tally.types;
  }

  /** The corpus tally: every token's occurrences and documents, every document's length and label. */
  get tally(): Tally {
    this.#settle();
    return this.#tally;
  }

  /**
   * Counts one document through the lexicon's own tokenizing and ids: its tokens are found once and
   * looked up where they lie in the text, by the lexicon and by the tally (no string made for a token
   * already counted).
   */
  add(text: string, label: string | undefined): void {
    scanTokens(text, this.lexicon.rules, scanned, true);
    const n = scanned.count;
    if (this.#ids.length < n) {
      const room = Math.max(n, 2 * this.#ids.length);
      this.#ids = new Int32Array(room);
      this.#oovPlaces = new Int32Array(room);
    }
    const oovId = this.lexicon.oovId;
    const ranking = this.#ranking;
    const ids = (ranking ?? this.lexicon).idsOfScanned(scanned, this.#ids);
    if (this.page !== null) this.page.add(ids, n, label);
    if (ranking !== null) {
      const past = this.#pastLexicon;
      for (let i = 0; i < n; i++) if ((ids[i] as number) >= past) ids[i] = oovId;
    }
    const known = this.#known;
    // The number the tally gives this document when it counts it below (numbers only grow, merges too).
    const document = this.#tally.documents + 1;
    const oovPlaces = this.#oovPlaces;
    let oov = 0;
    for (let i = 0; i < n; i++) {
      const id = ids[i] as number;
      if (id === oovId) {
        oovPlaces[oov++] = i;
        continue;
      }
      known.occur(id, document);
    }
    this.#tally.addPickedSpans(scanned, label, oovPlaces, oov);
    this.oovTokens += oov;
    if (oov > 0) this.oovPositions.addPlaces(oovPlaces, oov, n);
    const cut = this.length !== null && n > this.length;
    if (this.length !== null) {
      if (cut) {
        this.truncatedDocuments += 1;
        this.droppedTokens += n - this.length;
      } else this.paddingTokens += this.length - n;
    }
    if (label !== undefined) this.addLabel(label, { documents: 1, tokens: n, oovTokens: oov, truncatedDocuments: cut ? 1 : 0 });
  }

  /** Moves the counts kept by id into the tally (as tokens), so that the tally holds them all. */
  #settle(): void {
    const known = this.#known;
    for (let id = 0; id < this.lexicon.size; id++) {
      const count = known.at(id, COUNT);
      if (count === 0) continue;
      this.#tally.addToken(this.lexicon.tokenAt(id) as string, count, known.at(id, DOCUMENTS));
      known.clear(id);
    }
  }

  /** Adds counts made elsewhere (a worker's batch) with the same lexicon and length. */
  merge(parts: AuditParts): this {
    this.tally.mergeCounts(parts.tally);
    for (const [label, a] of parts.labels) this.addLabel(label, a);
    this.oovTokens += parts.oovTokens;
    this.truncatedDocuments += parts.truncatedDocuments;
    this.droppedTokens += parts.droppedTokens;
    this.paddingTokens += parts.paddingTokens;
    this.oovPositions.merge(parts.oovPositions);
    if (parts.page !== undefined) this.page?.merge(parts.page);
    return this;
  }

  /** The additive state, for sending to another thread. */
  parts(): AuditParts {
    return {
      tally: this.tally.toCounts(),
      labels: this.labels,
      oovTokens: this.oovTokens,
      truncatedDocuments: this.truncatedDocuments,
      droppedTokens: this.droppedTokens,
      paddingTokens: this.paddingTokens,
      oovPositions: { fromStart: this.oovPositions.fromStart, fromEnd: this.oovPositions.fromEnd },
      ...(this.page === null ? {} : { page: this.page.parts() }),
    };
  }

  private addLabel(label: string, a: LabelAudit): void {
    const l = this.labels.get(label) ?? { documents: 0, tokens: 0, oovTokens: 0, truncatedDocuments: 0 };
    l.documents += a.documents;
    l.tokens += a.tokens;
    l.oovTokens += a.oovTokens;
    l.truncatedDocuments += a.truncatedDocuments;
    this.labels.set(label, l);
  }
}

/** Checks that `ranking` extends `lexicon`: OOV first in both, no reserved tokens, the same rules and first tokens. */
function assertPrefix(lexicon: Lexicon, ranking: Lexicon): void {
  const a = lexicon.encoding;
  const b = ranking.encoding;
  const same =
    a.layout.oov === 'first' &&
    b.layout.oov === 'first' &&
    a.layout.reserved === 0 &&
    b.layout.reserved === 0 &&
    JSON.stringify(a.rules) === JSON.stringify(b.rules) &&
    a.tokens.length <= b.tokens.length &&
    a.tokens.every((token, i) => b.tokens[i] === token);
  if (!same) {
    throw new LexlockError('BAD_OPTION', "page.ranking must list the audited lexicon's tokens first, under the same rules, with OOV first and no reserved tokens; make it with rankingLexicon", { field: 'page.ranking' });
  }
}
