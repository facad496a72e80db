import type { Lexicon } from '../lexicon/Lexicon.js';
import { topRanked } from '../lexicon/topRanked.js';
import type { Shape } from '../lexicon/Shape.js';
import { summarizeLengths } from '../tally/nearestRank.js';
import type { LabelledText } from '../tally/Tally.js';
import { AuditCounts } from './AuditCounts.js';
import type { CoverageReport, TokenCount } from './CoverageReport.js';
import { coverageCurve } from './coverageCurve.js';
import { drift } from './drift.js';
import { identifyingTokensOf } from './identifyingTokens.js';
import { suggest } from './suggest.js';
import { cutAdvice, lengthCandidates, windowFigures } from './windowFigures.js';

/** Options of {@link auditCorpus}. */
export interface AuditOptions {
  /** The shape to count truncation and padding for; default the lexicon's own (none: figures are 0). */
  shape?: Shape | null;
  /** How many OOV tokens to list (default 50). */
  top?: number;
  /** Compare with the lexicon's fit record (default: when it has one). */
  drift?: boolean;
}

/**
 * Audits a corpus against a lexicon in one streaming pass: OOV, truncation and padding overall and
 * per label, the coverage curve, cap and length suggestions, the most frequent OOV tokens and, when
 * the lexicon has a fit record, drift. Uses the lexicon's own tokenize and ids, so every figure agrees
 * with `encode`. Memory grows with the number of distinct tokens, not with the corpus. Browser-safe.
 * @example const report = await auditCorpus(readCorpus('live.jsonl'), lexicon); report.oovRate
 */
export async function auditCorpus(
  documents: AsyncIterable<string | LabelledText> | Iterable<string | LabelledText>,
  lexicon: Lexicon,
  options: AuditOptions = {},
): Promise<CoverageReport> {
  const shape = options.shape === undefined ? lexicon.shape : options.shape;
  const counts = new AuditCounts(lexicon, shape === null ? null : shape.length);
  for await (const doc of documents) {
    if (typeof doc === 'string') counts.add(doc, undefined);
    else counts.add(doc.text, doc.label);
  }
  return auditReport(counts, lexicon, options);
}

/** The report from an audit's counts (made here, or merged from threads). */
export function auditReport(counts: AuditCounts, lexicon: Lexicon, options: AuditOptions = {}): CoverageReport {
  const shape = options.shape === undefined ? lexicon.shape : options.shape;
  const { tally, labels, oovTokens, truncatedDocuments, droppedTokens, paddingTokens } = counts;
  // Every count, most first, in one typed array; the top OOV tokens by the freeze rule's order, found
  // without ranking every token (a corpus may have tens of millions).
  const rankedCounts = tally.countList().sort().reverse();
  const chosenCap = lexicon.encoding.tokens.length - lexicon.encoding.layout.reserved;
  const top = options.top ?? 50;
  const oovRanked = (n: number, keep: (token: string) => boolean): TokenCount[] =>
    topRanked((visit) => tally.forEachCount(visit), n, (token) => !lexicon.has(token) && keep(token)).map(([token, count]) => ({ token, count }));
  const topOov = oovRanked(top, () => true);
  const lengthSummary = summarizeLengths(tally.lengths);
  const oovRate = tally.tokens === 0 ? 0 : oovTokens / tally.tokens;
  const sortedLabels = [...labels.entries()].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));

  const report: CoverageReport = {
    documents: tally.documents,
    tokens: tally.tokens,
    types: tally.types,
    oovTokens,
    oovRate,
    shape,
    truncatedDocuments,
    droppedTokens,
    paddingTokens,
    length: lengthSummary,
    // fromEntries defines own properties, so labels such as "__proto__" stay ordinary members.
    labels: Object.fromEntries(sortedLabels),
    topOov,
    suggest: { ...suggest(rankedCounts, tally.tokens, tally.lengths), cut: cutAdvice(tally.lengths, counts.oovPositions, shape, lengthSummary.p95) },
    coverage: coverageCurve(rankedCounts, tally.tokens, [chosenCap]),
    windows: windowFigures(tally.lengths, counts.oovPositions, lengthCandidates(lengthSummary, shape)),
    lengthHistogram: [...tally.lengths.entries()].sort((a, b) => a[0] - b[0]).map(([l, documents]) => ({ length: l, documents })),
    lexicon: { fingerprint: lexicon.fingerprint, tokens: lexicon.encoding.tokens.length, size: lexicon.size, reserved: lexicon.encoding.layout.reserved },
    capTie: lexicon.fit?.capTie ?? null,
    identifyingTokens: identifyingTokensOf(lexicon),
  };
  if ((options.drift ?? true) && lexicon.fit !== null) {
    report.drift = drift(lexicon.fit, {
      documents: tally.documents,
      oovRate,
      length: lengthSummary,
      labelDocuments: new Map(sortedLabels.map(([l, a]) => [l, a.documents])),
      oovTokens: oovRanked,
      top,
    });
  }
  return report;
}
