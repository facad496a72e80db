import type { Lexicon } from '../../lexicon/Lexicon.js';
import type { Shape } from '../../lexicon/Shape.js';
import type { AuditCounts } from '../AuditCounts.js';
import type { CoverageReport } from '../CoverageReport.js';
import { oovBands } from './oovBands.js';
import { CAP_FIGURES, LIVE_LABELS, lengthGrid } from './pageBudget.js';
import type { PageData, PageSeries } from './PageData.js';
import { StopIndex } from './StopGrid.js';

/** Sums documents and their tokens by length stop. */
function byLength(lengths: ReadonlyMap<number, number>, index: StopIndex): { documentsUpTo: number[]; tokensUpTo: number[] } {
  const documentsUpTo = new Array<number>(index.stops.length).fill(0);
  const tokensUpTo = new Array<number>(index.stops.length).fill(0);
  for (const [length, documents] of lengths) {
    const b = index.bucketOf(length);
    documentsUpTo[b] = (documentsUpTo[b] as number) + documents;
    tokensUpTo[b] = (tokensUpTo[b] as number) + documents * length;
  }
  return { documentsUpTo, tokensUpTo };
}

/**
 * The report page's data from an audit counted with page counts (`AuditCounts.page`): the cap grid it
 * was counted on, a length grid within the budget, the series of the whole corpus and of the labels
 * with the most documents (as many as the budget holds, at most LIVE_LABELS), and `build`, the
 * arguments of the matching `lexlock build` besides the cap and the length.
 */
export function pageDataOf(
  counts: AuditCounts,
  report: CoverageReport,
  how: { lexicon: Lexicon; shape: Shape | null; build: PageData['build']; ranking: PageData['ranking'] },
): PageData {
  const { lexicon, shape, build, ranking } = how;
  const page = counts.page;
  if (page === null) throw new Error('pageData needs an audit counted with page counts');
  const capStops = page.index.stops.length;
  const room = Math.max(0, Math.min(LIVE_LABELS, Math.floor(CAP_FIGURES / capStops) - 1));
  const live = [...page.labels.entries()]
    .map(([name, entry]) => ({ name, entry, audit: report.labels[name] }))
    .sort((a, b) => (b.audit?.documents ?? 0) - (a.audit?.documents ?? 0) || (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))
    .slice(0, room)
    .sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0));
  const chosenLength = shape === null ? null : shape.length;
  const lengthIndex = new StopIndex(lengthGrid(Math.max(1, report.length.max, chosenLength ?? 0), chosenLength, live.length));
  const overall: PageSeries = {
    name: null,
    documents: report.documents,
    tokens: report.tokens,
    kept: [...page.overall],
    ...byLength(counts.tally.lengths, lengthIndex),
  };
  const labels = live.map(({ name, entry, audit }): PageSeries => ({
    name,
    documents: audit?.documents ?? 0,
    tokens: audit?.tokens ?? 0,
    kept: [...entry.ranks],
    ...byLength(entry.lengths, lengthIndex),
  }));
  const top = report.topOov;
  const sameCount = top.length > 1 && top.every((t) => t.count === top[0]?.count);
  return {
    ranking,
    cap: { chosen: report.lexicon.tokens - report.lexicon.reserved, grid: page.index.grid },
    length: { chosen: chosenLength, grid: lengthIndex.grid },
    pad: shape?.pad ?? 'end',
    cut: shape?.cut ?? 'end',
    overall,
    labels,
    labelsLeftOut: page.labels.size - labels.length,
    build,
    oovBands: sameCount ? oovBands(counts.tally, lexicon) : null,
  };
}
