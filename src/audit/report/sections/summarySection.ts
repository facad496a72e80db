import type { WholeCaps } from '../../../lexicon/capTie.js';
import type { CoverageReport } from '../../CoverageReport.js';
import { describeCapTie } from '../../describeCapTie.js';
import { NO_IDENTIFYING_TOKENS, describeIdentifying, identifyingAdvice } from '../../describeIdentifying.js';
import { escapeHtml } from '../escapeHtml.js';
import { formatCount } from '../formatCount.js';
import { formatPercent } from '../formatPercent.js';
import { shareOf } from '../shareOf.js';
import { cutAdviceParagraph } from './windowSection.js';

/**
 * One summary card: a headline figure with a name and a line of detail. `live` names the figure and
 * detail (`data-live="<live>-figure"`, `"<live>-detail"`) for the page's script, which rewrites them.
 */
function card(name: string, figure: string, detail: string, live?: string): string {
  const tag = (part: string) => (live === undefined ? '' : ` data-live="${live}-${part}"`);
  return `<div class="card"><div class="card-name">${escapeHtml(name)}</div><div class="card-figure"${tag('figure')}>${escapeHtml(figure)}</div><div class="card-detail"${tag('detail')}>${escapeHtml(detail)}</div></div>`;
}

/** The headline figures: documents, tokens, OOV rate, truncation, dropped and padding tokens, suggestions. */
export function summarySection(report: CoverageReport): string {
  const shape = report.shape;
  const slots = shape === null ? 0 : report.documents * shape.length;
  const l = report.length;
  const s = report.suggest;
  const cards = [
    card('Documents', formatCount(report.documents), `${formatCount(Object.keys(report.labels).length)} labels`),
    card('Tokens', formatCount(report.tokens), `${formatCount(report.types)} distinct; ${formatCount(l.p50)} per document (median)`),
    card('OOV rate', formatPercent(report.oovRate), `${formatCount(report.oovTokens)} token occurrences with no id of their own`, 'oov'),
    card(
      'Truncated documents',
      shape === null ? '–' : formatPercent(shareOf(report.truncatedDocuments, report.documents)),
      shape === null ? 'no sequence length set' : `${formatCount(report.truncatedDocuments)} longer than ${formatCount(shape.length)} tokens`,
      'truncated',
    ),
    card(
      'Dropped tokens',
      shape === null ? '–' : formatCount(report.droppedTokens),
      shape === null ? 'no sequence length set' : `${formatPercent(shareOf(report.droppedTokens, report.tokens))} of all tokens, cut from the ${shape.cut} of long documents`,
      'dropped',
    ),
    card(
      'Padding tokens',
      shape === null ? '–' : formatCount(report.paddingTokens),
      shape === null ? 'no sequence length set' : `${formatPercent(shareOf(report.paddingTokens, slots))} of the ${formatCount(slots)} ids, zeros at the ${shape.pad} of short rows`,
      'padding',
    ),
  ];
  const whole = (w: WholeCaps) => (w.below === w.above ? 'the same' : `${formatCount(w.below)} or ${formatCount(w.above)}`);
  const rows: Array<[string, string, string, string]> = [
    ['90 %', formatCount(s.capFor90), whole(s.wholeCapsFor90), formatCount(s.lengthFor90)],
    ['95 %', formatCount(s.capFor95), whole(s.wholeCapsFor95), formatCount(s.lengthFor95)],
    ['99 %', formatCount(s.capFor99), whole(s.wholeCapsFor99), formatCount(s.lengthFor99)],
  ];
  const suggestions =
    '<table class="suggestions"><caption>Suggestions: the smallest cap that covers a share of token occurrences, the nearest caps that keep whole counts (no token chosen by string order among tokens of equal count), and the smallest length that keeps that share of documents whole</caption>' +
    '<thead><tr><th scope="col">share</th><th scope="col" class="num">cap (tokens kept)</th><th scope="col" class="num">caps keeping whole counts</th><th scope="col" class="num">length (tokens per document)</th></tr></thead><tbody>' +
    rows
      .map(([share, cap, wholeCaps, length]) => `<tr><th scope="row">${escapeHtml(share)}</th><td class="num">${escapeHtml(cap)}</td><td class="num">${escapeHtml(wholeCaps)}</td><td class="num">${escapeHtml(length)}</td></tr>`)
      .join('') +
    '</tbody></table>';
  const tie =
    report.capTie === null
      ? ''
      : `<p class="cap-tie"><strong>The lexicon's cap cuts through a tie.</strong> ${escapeHtml(describeCapTie(report.capTie))} (in the corpus the lexicon was built from).</p>`;
  const identifying = describeIdentifying(report.identifyingTokens);
  const people =
    identifying === null
      ? `<p class="note">In the lexicon's vocabulary, ${escapeHtml(NO_IDENTIFYING_TOKENS)}.</p>`
      : `<p class="identifying"><strong>The lexicon's vocabulary may identify people.</strong> ${escapeHtml(identifying)}; ${escapeHtml(identifyingAdvice(report.identifyingTokens))}.</p>`;
  const lengths =
    `<p class="percentiles">Tokens per document (nearest rank): min ${escapeHtml(formatCount(l.min))} · median ${escapeHtml(formatCount(l.p50))} · ` +
    `p90 ${escapeHtml(formatCount(l.p90))} · p95 ${escapeHtml(formatCount(l.p95))} · p99 ${escapeHtml(formatCount(l.p99))} · max ${escapeHtml(formatCount(l.max))}</p>`;
  return `<section id="summary"><h2>Summary</h2><div class="cards">${cards.join('')}</div>${tie}${people}${lengths}${suggestions}${cutAdviceParagraph(report)}</section>`;
}
