import type { Drift } from '../../CoverageReport.js';
import { escapeHtml } from '../escapeHtml.js';
import { formatCount } from '../formatCount.js';
import { formatPercent, UNIT_SPACE } from '../formatPercent.js';
import { formatTick } from '../formatTick.js';
import { shownToken } from '../shownToken.js';
import { groupedBars, type BarSeries } from '../svg/groupedBars.js';
import { PALETTE } from '../svg/palette.js';
import { chartFigure } from './chartFigure.js';
import { formatChange } from './formatChange.js';
import { htmlTable } from './htmlTable.js';
import { MAX_CHART_LABELS } from './labelSection.js';
import { note } from './note.js';
import { sortedEntries } from './sortedEntries.js';

const THEN_NOW: readonly BarSeries[] = [
  { name: 'when the lexicon was built', tag: 'then', colour: PALETTE.second, hatched: true },
  { name: 'this corpus', tag: 'now', colour: PALETTE.primary, hatched: false },
];

const BASIS: Record<Drift['unseenBasis'], string> = {
  fit: 'Unseen here means the corpus the lexicon was built from never had the token at all (the lexicon records every token it saw then): these are new words, not words left out by the cap.',
  vocabulary:
    'Unseen here means the lexicon has no id for the token. The lexicon records only the tokens it kept, so some of these may have occurred at build time and fallen under the cap.',
};

/** This corpus against the lexicon's fit record: OOV rate, length percentiles, label shares, unseen tokens. */
export function driftSection(drift: Drift): string {
  const parts: string[] = ['<h2>Drift since the lexicon was built</h2>', note('“Then” is the corpus the lexicon was built from (its fit record); “now” is this corpus.')];
  parts.push(
    htmlTable(
      'OOV rate then and now',
      [{ heading: 'figure' }, { heading: 'then', numeric: true }, { heading: 'now', numeric: true }, { heading: 'change', numeric: true }],
      [['OOV rate', formatPercent(drift.oovRate.fit), formatPercent(drift.oovRate.now), formatChange(drift.oovRate.fit, drift.oovRate.now, 'points', 100)]],
    ),
  );

  const percentiles: Array<[string, keyof Drift['length']['fit']]> = [
    ['min', 'min'],
    ['median', 'p50'],
    ['p90', 'p90'],
    ['p95', 'p95'],
    ['p99', 'p99'],
    ['max', 'max'],
  ];
  const lengthTitle = 'Document length percentiles, then and now';
  const lengthSvg = groupedBars({
    id: 'chart-drift-lengths',
    title: lengthTitle,
    description: `Tokens per document at the median, 90th, 95th and 99th percentile (nearest rank), for the build corpus and this corpus.`,
    series: THEN_NOW,
    groups: percentiles.slice(1, 5).map(([name, key]) => ({ name, values: [drift.length.fit[key], drift.length.now[key]] })),
    xTitle: 'tokens per document',
    format: formatCount,
  });
  parts.push(chartFigure(lengthTitle, lengthSvg, 'Striped bars: the build corpus; solid bars: this corpus. Minimum and maximum are in the table.'));
  parts.push(
    htmlTable(
      'Tokens per document (nearest rank), then and now',
      [{ heading: 'percentile' }, { heading: 'then', numeric: true }, { heading: 'now', numeric: true }, { heading: 'change', numeric: true }],
      percentiles.map(([name, key]) => [name, formatCount(drift.length.fit[key]), formatCount(drift.length.now[key]), formatChange(drift.length.fit[key], drift.length.now[key], 'tokens', 1, 0)]),
    ),
  );

  const labels = sortedEntries(drift.labels);
  if (labels.length === 0) {
    parts.push(note('Neither corpus has labels, so there are no label shares to compare.'));
  } else {
    const shown = labels.length <= MAX_CHART_LABELS ? labels : [...labels].sort((a, b) => b[1].now + b[1].fit - (a[1].now + a[1].fit)).slice(0, MAX_CHART_LABELS);
    const labelTitle = 'Share of documents per label, then and now';
    const labelSvg = groupedBars({
      id: 'chart-drift-labels',
      title: labelTitle,
      description: `The share of documents carrying each of ${formatCount(shown.length)} labels, in the build corpus and in this corpus.`,
      series: THEN_NOW,
      groups: shown.map(([name, s]) => ({ name, values: [s.fit * 100, s.now * 100] })),
      xTitle: 'share of documents (%)',
      format: (v) => formatPercent(v / 100),
      tickFormat: (v) => `${formatTick(v)}${UNIT_SPACE}%`,
    });
    const more = labels.length > shown.length ? ` Showing the ${formatCount(shown.length)} largest of ${formatCount(labels.length)} labels; the table lists all.` : '';
    parts.push(chartFigure(labelTitle, labelSvg, `Striped bars: the build corpus; solid bars: this corpus.${more}`));
    parts.push(
      htmlTable(
        'Share of documents per label, then and now',
        [{ heading: 'label', code: true }, { heading: 'then', numeric: true }, { heading: 'now', numeric: true }, { heading: 'change', numeric: true }],
        labels.map(([name, s]) => [name, formatPercent(s.fit), formatPercent(s.now), formatChange(s.fit, s.now, 'points', 100)]),
      ),
    );
  }

  parts.push('<h3>Most frequent unseen tokens</h3>', `<p class="basis">${escapeHtml(BASIS[drift.unseenBasis])}</p>`);
  parts.push(
    drift.unseenTokens.length === 0
      ? note(drift.unseenBasis === 'fit' ? 'None: every token of this corpus also occurred in the build corpus.' : 'None: every token of this corpus has an id.')
      : htmlTable(
          `The ${formatCount(drift.unseenTokens.length)} most frequent unseen tokens (basis: ${drift.unseenBasis})`,
          [{ heading: 'token', code: true }, { heading: 'count', numeric: true }],
          drift.unseenTokens.map((t) => [shownToken(t.token), formatCount(t.count)]),
        ),
  );
  return `<section id="drift">${parts.join('\n')}</section>`;
}
