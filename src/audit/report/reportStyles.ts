import { PALETTE } from './svg/palette.js';

/**
 * The report page's whole stylesheet (inline, no fonts or files from elsewhere): a readable screen
 * layout and a print layout for A4 that keeps each chart on one page and within its width.
 */
export const REPORT_STYLES = `
:root { color-scheme: light; }
* { box-sizing: border-box; }
body { margin: 0; background: #f6f7f9; color: ${PALETTE.ink}; font: 15px/1.5 system-ui, -apple-system, "Segoe UI", Roboto, "Noto Sans", "DejaVu Sans", sans-serif; }
main { max-width: 760px; margin: 0 auto; padding: 24px 28px 40px; background: #ffffff; }
h1 { font-size: 1.6rem; line-height: 1.25; margin: 0 0 0.4rem; }
h1 .subject { display: block; font-size: 1.05rem; font-weight: 500; color: ${PALETTE.muted}; overflow-wrap: anywhere; }
h2 { font-size: 1.25rem; margin: 2rem 0 0.6rem; padding-top: 0.6rem; border-top: 1px solid ${PALETTE.grid}; break-after: avoid; }
h3 { font-size: 1rem; margin: 1.2rem 0 0.4rem; break-after: avoid; }
.lede { color: ${PALETTE.muted}; margin: 0 0 1rem; }
.facts { display: grid; grid-template-columns: max-content 1fr; gap: 0.2rem 1rem; margin: 0 0 1rem; }
.facts dt { font-weight: 600; }
.facts dd { margin: 0; overflow-wrap: anywhere; }
code { font-family: ui-monospace, "Cascadia Mono", "DejaVu Sans Mono", Menlo, Consolas, monospace; font-size: 0.9em; overflow-wrap: anywhere; }
.fingerprint { font-size: 0.82em; }
.cards { display: grid; grid-template-columns: repeat(3, 1fr); gap: 10px; margin: 0.5rem 0 1rem; }
.card { border: 1px solid ${PALETTE.grid}; border-radius: 6px; padding: 8px 10px; break-inside: avoid; }
.card-name { font-size: 0.8rem; color: ${PALETTE.muted}; text-transform: uppercase; letter-spacing: 0.03em; }
.card-figure { font-size: 1.45rem; font-weight: 650; font-variant-numeric: tabular-nums; }
.card-detail { font-size: 0.82rem; color: ${PALETTE.muted}; }
table { border-collapse: collapse; margin: 0.6rem 0 1rem; font-size: 0.9rem; width: 100%; }
caption { text-align: left; font-weight: 600; padding-bottom: 0.3rem; }
th, td { text-align: left; padding: 3px 8px; border-bottom: 1px solid ${PALETTE.grid}; vertical-align: top; }
thead th { border-bottom: 2px solid ${PALETTE.ink}; font-weight: 600; }
tbody th { font-weight: 400; }
.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
thead th.num { white-space: normal; }
.note, .basis, .percentiles { color: ${PALETTE.muted}; }
figure.chart-figure { margin: 0.8rem 0 1.2rem; break-inside: avoid; }
.chart-title { margin: 0 0 0.3rem; }
figcaption { font-size: 0.85rem; color: ${PALETTE.muted}; margin-top: 0.3rem; }
svg.chart { display: block; width: 100%; max-width: 680px; height: auto; font-family: inherit; }
svg.chart text { fill: ${PALETTE.ink}; font-size: 11px; }
svg.chart .axis-title { font-size: 12px; font-weight: 600; }
svg.chart .marker-chosen { font-weight: 700; }
svg.chart .marker-suggestion { fill: ${PALETTE.suggestion}; }
svg.chart .group-note { fill: ${PALETTE.muted}; font-size: 10px; }
svg.chart .bar-value { font-variant-numeric: tabular-nums; }
.control { display: grid; grid-template-columns: minmax(12rem, 16rem) 1fr 7.5rem; gap: 0.3rem 0.8rem; align-items: center; margin: 0.5rem 0; }
.control input[type="number"] { font: inherit; width: 7.5rem; font-variant-numeric: tabular-nums; }
.control input[type="range"] { width: 100%; accent-color: ${PALETTE.primary}; }
.control input:focus-visible { outline: 2px solid ${PALETTE.accent}; outline-offset: 2px; }
.build-line code { display: block; margin-top: 0.3rem; padding: 6px 8px; background: #f6f7f9; border: 1px solid ${PALETTE.grid}; border-radius: 4px; user-select: all; overflow-x: auto; }
.build-line code span { white-space: nowrap; }
footer { max-width: 760px; margin: 0 auto; padding: 8px 28px 24px; font-size: 0.8rem; color: ${PALETTE.muted}; }
@media (max-width: 560px) { .cards { grid-template-columns: repeat(2, 1fr); } main { padding: 16px; } .control { grid-template-columns: 1fr 7.5rem; } .control label { grid-column: 1 / -1; } }
@page { size: A4; margin: 14mm; }
@media print {
  body { background: #ffffff; font-size: 10pt; }
  main { max-width: none; padding: 0; }
  .control { display: grid; grid-template-columns: minmax(12rem, 16rem) 1fr 7.5rem; gap: 0.3rem 0.8rem; align-items: center; margin: 0.5rem 0; }
.control input[type="number"] { font: inherit; width: 7.5rem; font-variant-numeric: tabular-nums; }
.control input[type="range"] { width: 100%; accent-color: ${PALETTE.primary}; }
.control input:focus-visible { outline: 2px solid ${PALETTE.accent}; outline-offset: 2px; }
.build-line code { display: block; margin-top: 0.3rem; padding: 6px 8px; background: #f6f7f9; border: 1px solid ${PALETTE.grid}; border-radius: 4px; user-select: all; }
footer { max-width: none; padding: 6pt 0 0; }
  * { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
  h2 { margin-top: 1.2rem; }
  table { break-inside: auto; }
  tr, .card, figure.chart-figure { break-inside: avoid; }
  svg.chart { max-width: 100%; }
  #controls, #controls-off { display: none; }
}
`;
