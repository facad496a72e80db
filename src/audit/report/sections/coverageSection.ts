import type { CoverageReport } from '../../CoverageReport.js';
import { formatCount } from '../formatCount.js';
import { formatPercent, UNIT_SPACE } from '../formatPercent.js';
import { extent } from '../svg/axis.js';
import { lineChart } from '../svg/lineChart.js';
import type { VerticalMarker } from '../svg/VerticalMarker.js';
import { chartFigure } from './chartFigure.js';
import { coverageAt } from './coverageAt.js';
import { note } from './note.js';

/** The coverage curve: share of token occurrences covered against the cap (log scale), chosen cap marked. */
export function coverageSection(report: CoverageReport): string {
  const title = 'Token occurrences covered, by vocabulary cap';
  const heading = '<h2>Vocabulary coverage</h2>';
  const curve = [...report.coverage].filter((p) => p.cap > 0).sort((a, b) => a.cap - b.cap);
  const cap = report.lexicon.tokens - report.lexicon.reserved;
  const range = extent(curve.map((p) => p.cap));
  if (range === null) return `<section id="coverage">${heading}${note('No coverage figures: the lexicon or the corpus has no tokens.')}</section>`;
  const chosenShare = coverageAt(curve, cap);
  const markers: VerticalMarker[] = [];
  if (cap > 0) markers.push({ x: cap, y: chosenShare * 100, label: `chosen cap ${formatCount(cap)}: ${formatPercent(chosenShare)} covered`, kind: 'chosen', live: 'cap-marker' });
  const suggestions: Array<[string, number]> = [
    ['90', report.suggest.capFor90],
    ['95', report.suggest.capFor95],
    ['99', report.suggest.capFor99],
  ];
  for (const [share, at] of suggestions) {
    if (at > 0) markers.push({ x: at, label: `${share}${UNIT_SPACE}%`, kind: 'suggestion' });
  }
  const domain: [number, number] = [range[0], Math.max(range[1], cap)];
  const svg = lineChart({
    id: 'chart-coverage',
    title,
    description: `Share of the corpus's ${formatCount(report.tokens)} token occurrences that the lexicon's first N tokens cover, for N from ${formatCount(domain[0])} to ${formatCount(domain[1])}. The chosen cap of ${formatCount(cap)} covers ${formatPercent(chosenShare)}.`,
    points: curve.map((p) => ({ x: p.cap, y: p.share * 100 })),
    xTitle: 'cap (tokens kept, log scale)',
    yTitle: 'token occurrences covered (%)',
    xLog: true,
    xDomain: domain,
    xFormat: formatCount,
    y: { min: 0, max: 100, format: (v) => `${formatCount(v)}${UNIT_SPACE}%` },
    markers,
  });
  const caption =
    `The solid line marks the chosen cap (${formatCount(cap)} tokens kept), at ${formatPercent(chosenShare)} of token occurrences covered; ` +
    `with this lexicon, ${formatPercent(report.oovRate)} of them (${formatCount(report.oovTokens)}) map to the OOV id. Dashed lines: the smallest caps that would cover ` +
    suggestions.map(([share, at]) => `${share}${UNIT_SPACE}% (${formatCount(at)})`).join(', ') +
    '.' +
    (Math.abs(chosenShare - (1 - report.oovRate)) > 0.0005
      ? ` The curve ranks tokens by their counts in this corpus, so it shows the best a vocabulary of each size could do here; the lexicon's own tokens cover ${formatPercent(1 - report.oovRate)}.`
      : '');
  return `<section id="coverage">${heading}${chartFigure(title, svg, caption)}</section>`;
}
