import type { CapTie, WholeCaps } from '../lexicon/capTie.js';
import type { IdentifyingTokens } from './identifyingTokens.js';
import type { Shape, ShapeEnd } from '../lexicon/Shape.js';
import type { LengthSummary } from '../tally/nearestRank.js';

/** Per-label audit figures. */
export interface LabelAudit {
  documents: number;
  tokens: number;
  oovTokens: number;
  truncatedDocuments: number;
}

/** A token and how often it occurs. */
export interface TokenCount {
  token: string;
  count: number;
}

/** Caps and lengths that would cover a share of this corpus (nearest-rank for lengths). */
export interface Suggestions {
  capFor90: number;
  capFor95: number;
  capFor99: number;
  /**
   * Around each cap above, the nearest caps that keep whole counts (`below` = `above` = the cap when
   * it does already): a cap inside a group of equal counts keeps part of it by string order.
   */
  wholeCapsFor90: WholeCaps;
  wholeCapsFor95: WholeCaps;
  wholeCapsFor99: WholeCaps;
  lengthFor90: number;
  lengthFor95: number;
  lengthFor99: number;
  /** Which end of long documents to cut so that rows keep more tokens with an id of their own. */
  cut: CutAdvice;
}

/** A length worth weighing: a percentile of this corpus's document lengths, or the length audited. */
export type LengthCandidate = 'p50' | 'p90' | 'p95' | 'p99' | 'chosen';

/** A pair of figures, one for each end a long document may lose. */
export interface ByCutEnd {
  /** Long documents lose their first tokens (shape `cut: start`). */
  cutStart: number;
  /** Long documents lose their last tokens (shape `cut: end`). */
  cutEnd: number;
}

/**
 * What the model sees at one row length: the rows a shape of that length makes of this corpus. Exact
 * counts, from the length of every document and where its OOV tokens are.
 */
export interface WindowFigures {
  length: number;
  /** Which candidates have this length (several when percentiles coincide). */
  candidates: LengthCandidate[];
  /** Documents longer than `length`, which lose tokens. */
  truncatedDocuments: number;
  /** Tokens those documents lose. */
  droppedTokens: number;
  /** Tokens the rows keep: the sum of min(tokens, length) over documents. */
  keptTokens: number;
  /** Padding ids (zeros) in the rows of shorter documents. */
  paddingTokens: number;
  /** `paddingTokens` over all ids (documents × length): the share of the model's input, and compute, spent on zeros. */
  paddingShare: number;
  /**
   * OOV tokens among the kept ones, and their share of `keptTokens`, for each cut end; null for a length
   * above 1,048,576 (longer than a lexicon can store) when some document is longer still, where
   * positions are not counted.
   */
  keptOov: ByCutEnd | null;
  keptOovRate: ByCutEnd | null;
}

/** Which end of long documents to cut, at one length, by the tokens with an id of their own the rows keep. */
export interface CutAdvice {
  /** The length compared at: the length audited, else this corpus's p95 (at least 1, at most 1,048,576). */
  length: number;
  /** Tokens with an id of their own (not OOV) the rows keep, for each cut end. */
  knownKept: ByCutEnd;
  /** The end to cut: the one whose rows keep more known tokens; null when both keep as many (nothing is cut, or a tie). */
  cut: ShapeEnd | null;
}

/** This corpus against the lexicon's fit record: then and now. */
export interface Drift {
  oovRate: { fit: number; now: number };
  length: { fit: LengthSummary; now: LengthSummary };
  /** Share of documents per label, at fit time and now (labels of either). */
  labels: Record<string, { fit: number; now: number }>;
  /** The most frequent tokens of this corpus that the fit corpus never had (see `unseenBasis`). */
  unseenTokens: TokenCount[];
  /**
   * What "unseen" was checked against: `fit` when the lexicon's fit record carries its filter of every
   * token the fit corpus had (a Bloom filter: a rare unseen token may pass as seen, never the reverse),
   * `vocabulary` when it does not (very large vocabularies), so unseen means "has no id".
   */
  unseenBasis: 'fit' | 'vocabulary';
}

/**
 * What a vocabulary cap and a sequence length cost on a corpus. Every figure is an exact count from
 * the same tokenization and ids as `encode`. Member names are a public contract (`lexlock audit --json`).
 */
export interface CoverageReport {
  documents: number;
  /** All tokens of all documents, before any cut. */
  tokens: number;
  /** Distinct tokens in this corpus. */
  types: number;
  oovTokens: number;
  oovRate: number;
  /** The shape truncation figures were computed for, or null (then they are 0). */
  shape: Shape | null;
  truncatedDocuments: number;
  droppedTokens: number;
  paddingTokens: number;
  /** Tokens per document, nearest-rank. */
  length: LengthSummary;
  labels: Record<string, LabelAudit>;
  /** Most frequent OOV tokens, count descending then JavaScript string order. */
  topOov: TokenCount[];
  suggest: Suggestions;
  /**
   * The coverage curve: share of this corpus's token occurrences covered by its own `cap` most
   * frequent tokens (what a vocabulary of that cap would keep), at log-spaced caps up to all types.
   */
  coverage: Array<{ cap: number; share: number }>;
  /**
   * The rows of each candidate length (p50, p90, p95, p99 of document lengths and the length audited,
   * those of at least 1 token), ascending by length: documents cut, tokens dropped, padding, and the
   * OOV rate of what the rows keep for each cut end.
   */
  windows: WindowFigures[];
  /** Documents per length (tokens per document), ascending by length. */
  lengthHistogram: Array<{ length: number; documents: number }>;
  /** The lexicon audited against. */
  lexicon: { fingerprint: string; tokens: number; size: number; reserved: number };
  /**
   * The group of equal counts the lexicon's cap cut through in the corpus it was built from (this
   * corpus with `--cap`), kept in part by string order; null when the cap kept whole counts or the
   * lexicon has no fit record.
   */
  capTie: CapTie | null;
  /**
   * The lexicon's tokens that look like e-mail addresses, URLs, @mentions, phone numbers or IP
   * addresses (see `identifyingTokens`): anyone who loads the lexicon can read them.
   */
  identifyingTokens: IdentifyingTokens;
  /** Present when the lexicon carries a fit record (a lexicon file, not one frozen for this audit). */
  drift?: Drift;
}
