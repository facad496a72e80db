import { sha256Bytes } from '../../artifact/sha256.js';
import type { CoverageReport } from '../CoverageReport.js';
import type { PageData } from '../explore/PageData.js';
import { base64Of } from './live/base64Of.js';
import { controlsSection } from './live/controlsSection.js';
import { PAGE_SCRIPT } from './live/pageScript.js';
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
 * Security policy of the page: nothing fetched of any kind; only its own inline styles and, when it
 * has one, its own inline script, allowed by the script's SHA-256 (CSP Level 2 hash source), so no
 * other script runs even if one were slipped in. Same-document references (`url(#pattern)`) are not
 * fetches and stay allowed.
 */
function policy(script: string | null): string {
  const scripts = script === null ? '' : ` script-src 'sha256-${base64Of(sha256Bytes(new TextEncoder().encode(script)))}';`;
  return `default-src 'none';${scripts} style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'`;
}

/**
 * The page's data as a JSON data block (`<` written as `\u003c`, so no text in it can end the block):
 * what the script reads, so not the OOV count bands, which the page shows as a table of their own.
 */
function dataBlock(data: PageData): string {
  const read: Omit<PageData, 'oovBands'> & { oovBands?: undefined } = { ...data, oovBands: undefined };
  return `<script type="application/json" id="page-data">${JSON.stringify(read).replace(/</g, '\\u003c')}</script>`;
}

/**
 * One self-contained HTML page (inline CSS and SVG, nothing fetched) showing a {@link CoverageReport}:
 * summary, coverage curve, length histogram, what the model sees at each candidate length, per-label
 * figures, top OOV tokens, drift. Given `page` (what `lexlock audit --report` counts), it also holds
 * cap and length controls and the one script that makes them recompute the figures; without it, no script.
 * @example await writeFile('audit.html', renderReport(report, { corpus: 'tickets.csv', lexiconFile: 'tickets.lexicon.json', settings: {}, generatedAt: new Date().toISOString(), lexlockVersion: VERSION }))
 */
export function renderReport(report: CoverageReport, context: ReportContext, data: PageData | null = null): string {
  // A corpus without tokens has no cap or length to try.
  const page = data !== null && data.overall.tokens > 0 ? data : null;
  const script = page === null ? null : PAGE_SCRIPT;
  const sections = [
    headerSection(report, context),
    page === null ? '' : controlsSection(page, report.suggest.lengthFor95),
    summarySection(report),
    coverageSection(report),
    lengthSection(report),
    windowSection(report),
    labelSection(report, page),
    topOovSection(report, page?.oovBands ?? null),
    report.drift === undefined ? '' : driftSection(report.drift),
  ];
  return [
    '<!DOCTYPE html>',
    '<html lang="en">',
    '<head>',
    '<meta charset="utf-8">',
    `<meta http-equiv="Content-Security-Policy" content="${policy(script)}">`,
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
    page === null ? '' : dataBlock(page),
    script === null ? '' : `<script>${script}</script>`,
    '</body>',
    '</html>',
    '',
  ]
    .filter((line, i, all) => line !== '' || i === all.length - 1)
    .join('\n');
}
