import type { CoverageReport } from '../../CoverageReport.js';
import { formatCount } from '../formatCount.js';
import { formatPercent, UNIT_SPACE } from '../formatPercent.js';
import { formatTick } from '../formatTick.js';
import { shareOf } from '../shareOf.js';
import { groupedBars } from '../svg/groupedBars.js';
import { PALETTE } from '../svg/palette.js';
import { chartFigure } from './chartFigure.js';
import { htmlTable, type Column } from './htmlTable.js';
import { figuresAt } from '../../explore/figuresAt.js';
import type { PageData } from '../../explore/PageData.js';
import { note } from './note.js';
import { sortedEntries } from './sortedEntries.js';

/** The chart shows at most this many labels (those with the most documents). */
export const MAX_CHART_LABELS = 30;
/** The table shows at most this many (those with the most documents), so the page's size stays bounded. */
export const MAX_TABLE_LABELS = 500;

/**
 * OOV rate and truncated-document share per label, side by side, and a table of every label; given
 * the page's data, the table also has each label's dropped tokens and padding share (all four follow
 * the page's controls).
 */
export function labelSection(report: CoverageReport, page: PageData | null = null): string {
  const heading = '<h2>By label</h2>';
  const entries = sortedEntries(report.labels);
  if (entries.length === 0) return `<section id="labels">${heading}${note('This corpus has no labels, so there are no per-label figures.')}</section>`;
  const shown =
    entries.length <= MAX_CHART_LABELS
      ? entries
      : [...entries].sort((a, b) => b[1].documents - a[1].documents).slice(0, MAX_CHART_LABELS).sort((a, b) => (a[0] < b[0] ? -1 : 1));
  const cut = report.shape === null ? 'no length set' : `longer than ${formatCount(report.shape.length)} tokens`;
  const title = 'OOV rate and truncated documents per label';
  const svg = groupedBars({
    id: 'chart-labels',
    title,
    description: `For each of ${formatCount(shown.length)} labels: the share of its token occurrences that are OOV, and the share of its documents that are truncated (${cut}).`,
    series: [
      { name: 'OOV rate (% of the label\'s tokens)', tag: 'OOV', colour: PALETTE.primary, hatched: false },
      { name: 'truncated (% of the label\'s documents)', tag: 'cut', colour: PALETTE.accent, hatched: true },
    ],
    groups: shown.map(([name, a]) => ({
      name,
      note: `${formatCount(a.documents)} documents`,
      values: [shareOf(a.oovTokens, a.tokens) * 100, shareOf(a.truncatedDocuments, a.documents) * 100],
    })),
    xTitle: 'share (%)',
    format: (v) => formatPercent(v / 100),
    tickFormat: (v) => `${formatTick(v)}${UNIT_SPACE}%`,
  });
  const caption =
    (entries.length > shown.length
      ? `Showing the ${formatCount(shown.length)} labels with the most documents of ${formatCount(entries.length)}; the table lists ${entries.length > MAX_TABLE_LABELS ? `the ${formatCount(MAX_TABLE_LABELS)} with the most` : 'all'}. `
      : '') +
    `Solid bars: OOV rate; striped bars: truncated documents (${cut}).`;
  const listed =
    entries.length <= MAX_TABLE_LABELS
      ? entries
      : [...entries].sort((a, b) => b[1].documents - a[1].documents).slice(0, MAX_TABLE_LABELS).sort((a, b) => (a[0] < b[0] ? -1 : 1));
  const columns: Column[] = [
    { heading: 'label', code: true },
    { heading: 'documents', numeric: true },
    { heading: 'tokens', numeric: true },
    { heading: 'OOV rate', numeric: true, live: 'label-oov' },
    { heading: 'truncated documents', numeric: true, live: 'label-truncated' },
  ];
  if (page !== null) columns.push({ heading: 'tokens dropped', numeric: true, live: 'label-dropped' }, { heading: 'padding share', numeric: true, live: 'label-padding' });
  const length = report.shape?.length ?? null;
  const table = htmlTable(
    listed.length === entries.length ? 'Every label' : `The ${formatCount(listed.length)} labels with the most documents, of ${formatCount(entries.length)}`,
    columns,
    listed.map(([name, a]) => {
      const row = [name, formatCount(a.documents), formatCount(a.tokens), formatPercent(shareOf(a.oovTokens, a.tokens)), formatPercent(shareOf(a.truncatedDocuments, a.documents))];
      if (page === null) return row;
      const series = page.labels.find((l) => l.name === name);
      if (series === undefined || length === null) return [...row, '–', '–'];
      const f = figuresAt(page, series, page.cap.chosen, length);
      return [...row, formatCount(f.droppedTokens), formatPercent(shareOf(f.paddingTokens, series.documents * length))];
    }),
  );
  return `<section id="labels">${heading}${chartFigure(title, svg, caption)}${table}</section>`;
}
