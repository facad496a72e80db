import type { CoverageReport } from '../../CoverageReport.js';
import type { OovBand } from '../../explore/oovBands.js';
import { formatCount } from '../formatCount.js';
import { formatPercent } from '../formatPercent.js';
import { shareOf } from '../shareOf.js';
import { shownToken } from '../shownToken.js';
import { htmlTable } from './htmlTable.js';
import { note } from './note.js';

/** OOV tokens by how often they occur, with a few of each: for when the top tokens all share one count. */
function bandsTable(report: CoverageReport, bands: readonly OovBand[]): string {
  const types = bands.reduce((sum, b) => sum + b.types, 0);
  const count = report.topOov[0]?.count ?? 0;
  return (
    note(
      `The ${formatCount(report.topOov.length)} most frequent OOV tokens all occur ${count === 1 ? 'once' : `${formatCount(count)} times`}, so a list of them in string order would say little; ` +
        `here are the corpus's ${formatCount(types)} distinct OOV tokens by how often they occur.`,
    ) +
    htmlTable(
      `OOV tokens by count: ${formatCount(report.oovTokens)} occurrences of ${formatCount(types)} distinct tokens`,
      [{ heading: 'occurs' }, { heading: 'distinct tokens', numeric: true }, { heading: 'share of OOV occurrences', numeric: true }, { heading: 'first few, in string order', code: true }],
      bands.map((b) => [b.name, formatCount(b.types), formatPercent(shareOf(b.occurrences, report.oovTokens)), b.sample.map(shownToken).join(' · ')]),
    )
  );
}

/**
 * The most frequent OOV tokens with their counts and share of all token occurrences; given `bands`
 * (when those tokens all share one count), OOV tokens by count band instead.
 */
export function topOovSection(report: CoverageReport, bands: readonly OovBand[] | null = null): string {
  const heading = '<h2>Most frequent OOV tokens</h2>';
  if (report.topOov.length === 0) return `<section id="oov">${heading}${note('No token of this corpus is out of the vocabulary.')}</section>`;
  if (bands !== null) return `<section id="oov">${heading}${bandsTable(report, bands)}</section>`;
  const table = htmlTable(
    `The ${formatCount(report.topOov.length)} most frequent of the corpus's ${formatCount(report.oovTokens)} OOV token occurrences`,
    [{ heading: 'token', code: true }, { heading: 'count', numeric: true }, { heading: 'share of tokens', numeric: true }],
    report.topOov.map((t) => [shownToken(t.token), formatCount(t.count), formatPercent(shareOf(t.count, report.tokens))]),
  );
  return `<section id="oov">${heading}${table}</section>`;
}
