import type { CoverageReport } from '../CoverageReport.js';
import { escapeHtml } from './escapeHtml.js';
import type { ReportContext } from './ReportContext.js';
import { REPORT_STYLES } from './reportStyles.js';
import { coverageSection } from './sections/coverageSection.js';
import { driftSection } from './sections/driftSection.js';
import { headerSection } from './sections/headerSection.js';
import { labelSection } from './sections/labelSection.js';
import { lengthSection } from './sections/lengthSection.js';
import { summarySection } from './sections/summarySection.js';
import { topOovSection } from './sections/topOovSection.js';
import { windowSection } from './sections/windowSection.js';

export type { ReportContext } from './ReportContext.js';

/**
 * Security policy of the page: no scripts, no fetches of any kind; only its own inline styles.
 * Same-document references (`url(#pattern)`) are not fetches and stay allowed.
 */
const POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

/**
 * One self-contained HTML page (inline CSS and SVG, no scripts, nothing fetched) showing a
 * {@link CoverageReport}: summary, coverage curve, length histogram, what the model sees at each candidate
 * length, per-label figures, top OOV tokens, drift.
 * @example await writeFile('audit.html', renderReport(report, { corpus: 'tickets.csv', lexiconFile: 'tickets.lexicon.json', settings: {}, generatedAt: new Date().toISOString(), lexlockVersion: VERSION }))
 */
export function renderReport(report: CoverageReport, context: ReportContext): string {
  const sections = [
    headerSection(report, context),
    summarySection(report),
    coverageSection(report),
    lengthSection(report),
    windowSection(report),
    labelSection(report),
    topOovSection(report),
    report.drift === undefined ? '' : driftSection(report.drift),
  ];
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${POLICY}">`,
    '<meta name="viewport" content="width=device-width, initial-scale=1">',
    '<meta name="generator" content="lexlock">',
    `<title>Vocabulary audit: ${escapeHtml(context.corpus)}</title>`,
    `<style>${REPORT_STYLES}</style>`,
    '</head>',
    '<body>',
    '<main>',
    ...sections.filter((s) => s !== ''),
    '</main>',
    `<footer>lexlock ${escapeHtml(context.lexlockVersion)} · generated ${escapeHtml(context.generatedAt)} · lexicon <code>${escapeHtml(report.lexicon.fingerprint)}</code></footer>`,
    '</body>',
    '</html>',
    '',
  ].join('\n');
}
