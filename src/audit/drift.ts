import type { Fit } from '../artifact/schema.js';
import { SeenTokens } from '../lexicon/SeenTokens.js';
import type { LengthSummary } from '../tally/nearestRank.js';
import type { Drift, TokenCount } from './CoverageReport.js';

/** What {@link drift} needs of the audited corpus. */
export interface DriftInput {
  documents: number;
  oovRate: number;
  length: LengthSummary;
  labelDocuments: ReadonlyMap<string, number>;
  /** The first `n` tokens, most frequent first, with no id in the lexicon that `keep` accepts. */
  oovTokens: (n: number, keep: (token: string) => boolean) => TokenCount[];
  /** How many unseen tokens to list. */
  top: number;
}

/**
 * Compares an audited corpus with the lexicon's fit record: OOV rate, lengths and label shares then
 * and now, and the most frequent tokens the fit corpus never had (when the fit carries its filter of
 * seen tokens; otherwise those with no id in the lexicon).
 */
export function drift(fit: Fit, now: DriftInput): Drift {
  const labels = new Map<string, { fit: number; now: number }>();
  for (const l of fit.labels) labels.set(l.label, { fit: fit.documents === 0 ? 0 : l.documents / fit.documents, now: 0 });
  for (const [label, docs] of now.labelDocuments) {
    const entry = labels.get(label) ?? { fit: 0, now: 0 };
    entry.now = now.documents === 0 ? 0 : docs / now.documents;
    labels.set(label, entry);
  }
  const seen = fit.seen === null ? null : SeenTokens.parse(fit.seen);
  const unseen = now.oovTokens(now.top, seen === null ? () => true : (t) => !seen.has(t));
  const sorted = [...labels.entries()].sort((a, b) => (a[0] < b[0] ? -1 : a[0] > b[0] ? 1 : 0));
  return {
    oovRate: { fit: fit.oovRate, now: now.oovRate },
    length: { fit: fit.length, now: now.length },
    // fromEntries defines own properties, so labels such as "__proto__" stay ordinary members.
    labels: Object.fromEntries(sorted),
    unseenTokens: unseen,
    unseenBasis: seen === null ? 'vocabulary' : 'fit',
  };
}
