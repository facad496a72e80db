import type { CoverageReport } from '../../CoverageReport.js';
import { escapeHtml } from '../escapeHtml.js';
import { formatCount } from '../formatCount.js';
import type { ReportContext } from '../ReportContext.js';
import { describeShape } from '../../../lexicon/Shape.js';
import { htmlTable } from './htmlTable.js';
import { note } from './note.js';

/** The page header: which corpus, which lexicon (file and fingerprint), when, and the settings used. */
export function headerSection(report: CoverageReport, context: ReportContext): string {
  const cap = report.lexicon.tokens - report.lexicon.reserved;
  const facts: Array<[string, string]> = [
    ['Corpus', `<span class="value">${escapeHtml(context.corpus)}</span>`],
    ['Lexicon file', context.lexiconFile === null ? 'none: frozen from this corpus for this audit' : `<span class="value">${escapeHtml(context.lexiconFile)}</span>`],
    ['Lexicon fingerprint', `<code class="fingerprint">${escapeHtml(report.lexicon.fingerprint)}</code>`],
    [
      'Lexicon',
      escapeHtml(
        `${formatCount(cap)} ranked tokens` +
          (report.lexicon.reserved > 0 ? ` + ${formatCount(report.lexicon.reserved)} reserved` : '') +
          `; ids 0 to ${formatCount(report.lexicon.size - 1)} (${formatCount(report.lexicon.size)} rows for an embedding, padding and OOV included)`,
      ),
    ],
    ['Sequence shape', escapeHtml(report.shape === null ? 'none set' : describeShape(report.shape))],
    ['Generated', `${escapeHtml(context.generatedAt)} by lexlock ${escapeHtml(context.lexlockVersion)}`],
  ];
  const settings = Object.entries(context.settings).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
  return [
    '<header class="report-header">',
    `<h1>Vocabulary audit <span class="subject">${escapeHtml(context.corpus)}</span></h1>`,
    '<p class="lede">What the lexicon\'s vocabulary cap and the sequence length cost on this corpus: how many token occurrences fall out of the vocabulary, how many documents lose tokens, and what other settings would give.</p>',
    `<dl class="facts">${facts.map(([k, v]) => `<dt>${escapeHtml(k)}</dt><dd>${v}</dd>`).join('')}</dl>`,
    settings.length === 0 ? note('Settings: none given.') : htmlTable('Settings used for this audit', [{ heading: 'setting' }, { heading: 'value', code: true }], settings),
    '</header>',
  ].join('\n');
}
