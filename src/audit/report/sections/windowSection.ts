import type { CoverageReport } from '../../CoverageReport.js';
import { describeCutAdvice } from '../../describeCutAdvice.js';
import { escapeHtml } from '../escapeHtml.js';
import { formatCount } from '../formatCount.js';
import { formatPercent } from '../formatPercent.js';
import { shareOf } from '../shareOf.js';
import { htmlTable } from './htmlTable.js';
import { note } from './note.js';

/** Which end of long documents to cut, in words, as the report's suggestions say it. */
export function cutAdviceParagraph(report: CoverageReport): string {
  if (report.documents === 0) return '';
  return `<p class="cut-advice"><strong>Which end to cut:</strong> ${escapeHtml(describeCutAdvice(report.suggest.cut))}.</p>`;
}

/**
 * What the model sees: the rows of each candidate length (this corpus's p50, p90, p95 and p99 document
 * lengths and the chosen one): documents cut, tokens dropped, the share of all ids that are padding,
 * and the OOV rate of the tokens the rows keep when long documents lose their start or their end.
 */
export function windowSection(report: CoverageReport): string {
  const heading = '<h2>What the model sees</h2>';
  if (report.windows.length === 0) return `<section id="windows">${heading}${note('No document has a token, so there are no row lengths to weigh.')}</section>`;
  const rate = (share: number | undefined) => (share === undefined ? '–' : formatPercent(share));
  const table = htmlTable(
    'Rows of each candidate length: the whole-document figures above describe the corpus; these describe the ids a model gets',
    [
      { heading: 'length', numeric: true },
      { heading: 'candidate' },
      { heading: 'documents cut', numeric: true },
      { heading: 'tokens dropped', numeric: true },
      { heading: 'padding', numeric: true },
      { heading: 'OOV kept, cut start', numeric: true },
      { heading: 'OOV kept, cut end', numeric: true },
    ],
    report.windows.map((w) => [
      formatCount(w.length),
      w.candidates.join(', '),
      `${formatCount(w.truncatedDocuments)} (${formatPercent(shareOf(w.truncatedDocuments, report.documents))})`,
      formatCount(w.droppedTokens),
      formatPercent(w.paddingShare),
      rate(w.keptOovRate?.cutStart),
      rate(w.keptOovRate?.cutEnd),
    ]),
  );
  const explain = note(
    'Padding is the share of all ids (documents × length) that are zeros: input, and compute, spent on nothing. ' +
      'OOV kept is the share of the tokens the rows keep that have no id of their own, when long documents lose their first tokens or their last.',
  );
  return `<section id="windows">${heading}${table}${explain}</section>`;
}
