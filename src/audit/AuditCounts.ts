import type { Lexicon } from '../lexicon/Lexicon.js';
import { Tally, type TallyCounts } from '../tally/Tally.js';
import type { LabelAudit } from './CoverageReport.js';
import { OovPositions, type OovPositionCounts } from './OovPositions.js';

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
}

/**
 * What an audit counts, document by document: the corpus tally, OOV and truncation overall and per
 * label. Everything adds up, so counts made over parts of a corpus (threads) merge to the same.
 */
export class AuditCounts implements Omit<AuditParts, 'tally'> {
  readonly tally: Tally;
  readonly oovPositions = new OovPositions();
  readonly labels = new Map<string, LabelAudit>();
  oovTokens = 0;
  truncatedDocuments = 0;
  droppedTokens = 0;
  paddingTokens = 0;
  private readonly lexicon: Lexicon;
  private readonly length: number | null;

  constructor(lexicon: Lexicon, length: number | null) {
    this.lexicon = lexicon;
    this.length = length;
    this.tally = new Tally(lexicon.rules);
  }

  /** Counts one document through the lexicon's own tokenize and ids. */
  add(text: string, label: string | undefined): void {
    const tokens = this.lexicon.tokenize(text);
    const ids = this.lexicon.idsOf(tokens);
    this.tally.addTokens(tokens, label);
    let oov = 0;
    for (let i = 0; i < ids.length; i++) if (ids[i] === this.lexicon.oovId) oov += 1;
    this.oovTokens += oov;
    if (oov > 0) this.oovPositions.add(ids, this.lexicon.oovId);
    const cut = this.length !== null && ids.length > this.length;
    if (this.length !== null) {
      if (cut) {
        this.truncatedDocuments += 1;
        this.droppedTokens += ids.length - this.length;
      } else this.paddingTokens += this.length - ids.length;
    }
    if (label !== undefined) this.addLabel(label, { documents: 1, tokens: ids.length, oovTokens: oov, truncatedDocuments: cut ? 1 : 0 });
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
