import type { CoverageReport } from '../../CoverageReport.js';
import { binLengths } from '../binLengths.js';
import { formatCount } from '../formatCount.js';
import { formatPercent, UNIT_SPACE } from '../formatPercent.js';
import { shareOf } from '../shareOf.js';
import { histogram } from '../svg/histogram.js';
import type { VerticalMarker } from '../svg/VerticalMarker.js';
import { chartFigure } from './chartFigure.js';
import { note } from './note.js';

/** The document-length histogram, the chosen length marked and the truncated documents hatched. */
export function lengthSection(report: CoverageReport): string {
  const heading = '<h2>Document lengths</h2>';
  const shape = report.shape;
  const { width, bins } = binLengths(report.lengthHistogram, shape?.length ?? null);
  if (bins.length === 0) return `<section id="lengths">${heading}${note('No documents, so no lengths to show.')}</section>`;
  const truncatedShare = shareOf(report.truncatedDocuments, report.documents);
  const markers: VerticalMarker[] = [];
  if (shape !== null) markers.push({ x: shape.length + 0.5, label: `chosen length ${formatCount(shape.length)}: ${formatPercent(truncatedShare)} truncated`, kind: 'chosen', live: 'length-marker' });
  const suggestions: Array<[string, number]> = [
    ['90', report.suggest.lengthFor90],
    ['95', report.suggest.lengthFor95],
    ['99', report.suggest.lengthFor99],
  ];
  for (const [share, at] of suggestions) markers.push({ x: at + 0.5, label: `${share}${UNIT_SPACE}%`, kind: 'suggestion' });
  const title = 'Documents by length';
  const binText = width === 1 ? 'one bar per length' : `bins of ${formatCount(width)} lengths each (e.g. ${formatCount(bins[0]?.from ?? 0)}–${formatCount(bins[0]?.to ?? 0)} tokens)`;
  const svg = histogram({
    id: 'chart-lengths',
    title,
    description:
      `How many documents have each length in tokens, ${binText}, from ${formatCount(report.length.min)} to ${formatCount(report.length.max)} tokens.` +
      (shape === null ? '' : ` Documents longer than the chosen length of ${formatCount(shape.length)} are truncated: ${formatPercent(truncatedShare)} of documents.`),
    bins,
    xTitle: width === 1 ? 'tokens per document' : `tokens per document (bins of ${formatCount(width)})`,
    yTitle: 'documents',
    format: formatCount,
    baseName: shape === null ? 'documents' : `kept whole (≤ ${formatCount(shape.length)} tokens)`,
    overName: shape === null ? 'truncated (none: no length set)' : `truncated (> ${formatCount(shape.length)} tokens): ${formatPercent(truncatedShare)}`,
    markers,
  });
  const caption =
    `Bar width: ${width === 1 ? '1 token (one bar per length)' : `${formatCount(width)} tokens`}. ` +
    (shape === null
      ? 'No sequence length is set, so nothing is truncated or padded. '
      : `${formatCount(report.truncatedDocuments)} documents (${formatPercent(truncatedShare)}) are longer than ${formatCount(shape.length)} tokens and lose ` +
        `${formatCount(report.droppedTokens)} tokens (${formatPercent(shareOf(report.droppedTokens, report.tokens))} of all) from their ${shape.cut}; ` +
        `shorter ones get padding zeros at the ${shape.pad}. `) +
    'Dashed lines: the smallest lengths that keep a share of documents whole (nearest rank): ' +
    suggestions.map(([share, at]) => `${share}${UNIT_SPACE}% (${formatCount(at)} tokens)`).join(', ') +
    '.';
  return `<section id="lengths">${heading}${chartFigure(title, svg, caption)}</section>`;
}
