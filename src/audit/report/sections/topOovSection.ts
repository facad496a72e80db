import type { CoverageReport } from '../../CoverageReport.js';
import { formatCount } from '../formatCount.js';
import { formatPercent } from '../formatPercent.js';
import { shareOf } from '../shareOf.js';
import { htmlTable } from './htmlTable.js';
import { note } from './note.js';

/** The most frequent OOV tokens with their counts and share of all token occurrences. */
export function topOovSection(report: CoverageReport): string {
  const heading = '<h2>Most frequent OOV tokens</h2>';
  if (report.topOov.length === 0) return `<section id="oov">${heading}${note('No token of this corpus is out of the vocabulary.')}</section>`;
  const table = htmlTable(
    `The ${formatCount(report.topOov.length)} most frequent of the corpus's ${formatCount(report.oovTokens)} OOV token occurrences`,
    [{ heading: 'token', code: true }, { heading: 'count', numeric: true }, { heading: 'share of tokens', numeric: true }],
    report.topOov.map((t) => [t.token, formatCount(t.count), formatPercent(shareOf(t.count, report.tokens))]),
  );
  return `<section id="oov">${heading}${table}</section>`;
}
