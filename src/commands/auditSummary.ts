import type { CoverageReport } from '../audit/CoverageReport.js';
import { describeCutAdvice } from '../audit/describeCutAdvice.js';
import { describeCapTie } from '../audit/describeCapTie.js';
import type { WholeCaps } from '../lexicon/capTie.js';
import type { Paint } from './colour.js';
import { identifyingRows } from './describeLexicon.js';
import { count, counted, percent, percentsApart } from './format.js';

/** Thresholds the audit gates on (shares, 0…1), and which are crossed. */
export interface Gates {
  maxOov: number | null;
  maxTruncated: number | null;
}

/** The share of documents the audit found truncated. */
export function truncatedShare(report: CoverageReport): number {
  return report.documents === 0 ? 0 : report.truncatedDocuments / report.documents;
}

/**
 * One line per crossed threshold, e.g. `OOV rate 6.12 % is above --max-oov 5.00 %`, with as many
 * decimals as tell the two apart (`2.0501 % is above --max-oov 2.0500 %`); empty when none is. A share
 * equal to its gate is not above it.
 */
export function crossedGates(report: CoverageReport, gates: Gates): string[] {
  const out: string[] = [];
  if (gates.maxOov !== null && report.oovRate > gates.maxOov) {
    const [rate, gate] = percentsApart(report.oovRate, gates.maxOov);
    out.push(`OOV rate ${rate} is above --max-oov ${gate}`);
  }
  const cut = truncatedShare(report);
  if (gates.maxTruncated !== null && cut > gates.maxTruncated) {
    const [share, gate] = percentsApart(cut, gates.maxTruncated);
    out.push(`${share} of documents are truncated, above --max-truncated ${gate}`);
  }
  return out;
}

/** A share and its gate as shown side by side: apart when they differ; the gate '' when there is none. */
function withGate(share: number, gate: number | null): [string, string] {
  return gate === null ? [percent(share), ''] : percentsApart(share, gate);
}

function table(rows: string[][], paint: Paint): string {
  const widths = rows[0]!.map((_, c) => Math.max(...rows.map((r) => (r[c] ?? '').length)));
  return rows
    .map((r, i) => {
      const line = r.map((cell, c) => (c === 0 ? cell.padEnd(widths[c]!) : cell.padStart(widths[c]!))).join('  ');
      return i === 0 ? paint.dim(line) : line;
    })
    .join('\n');
}

const lengths = (l: CoverageReport['length']) => `min ${count(l.min)}  p50 ${count(l.p50)}  p90 ${count(l.p90)}  p95 ${count(l.p95)}  p99 ${count(l.p99)}  max ${count(l.max)}`;

/** The audit as a compact, aligned terminal summary. */
export function auditSummary(report: CoverageReport, heading: string, gates: Gates, paint: Paint): string {
  const oovBad = gates.maxOov !== null && report.oovRate > gates.maxOov;
  const cutBad = gates.maxTruncated !== null && truncatedShare(report) > gates.maxTruncated;
  const mark = (bad: boolean, gate: string, flag: string) =>
    gate === '' ? '' : bad ? paint.red(`  above ${flag} ${gate}`) : paint.green(`  within ${flag} ${gate}`);
  const s = report.suggest;
  const [oov, oovGate] = withGate(report.oovRate, gates.maxOov);
  const rows: Array<[string, string]> = [
    ['documents', count(report.documents)],
    ['tokens', `${count(report.tokens)} (${count(report.types)} distinct)`],
    ['OOV', `${oovBad ? paint.red(oov) : oov} of tokens (${count(report.oovTokens)})${mark(oovBad, oovGate, '--max-oov')}`],
    ['tokens/document', lengths(report.length)],
  ];
  if (report.shape !== null) {
    const [share, cutGate] = withGate(truncatedShare(report), gates.maxTruncated);
    rows.push([
      `at length ${report.shape.length}`,
      `${counted(report.truncatedDocuments, 'document')} cut (${cutBad ? paint.red(share) : share}), ${counted(report.droppedTokens, 'token')} dropped, ${counted(report.paddingTokens, 'padding token')}${mark(cutBad, cutGate, '--max-truncated')}`,
    ]);
  }
  const cover = (cap: number, whole: WholeCaps) => (whole.below === whole.above ? count(cap) : `${count(cap)} (whole counts: ${count(whole.below)} or ${count(whole.above)})`);
  rows.push([
    'caps that cover',
    `90 % of tokens: ${cover(s.capFor90, s.wholeCapsFor90)}, 95 %: ${cover(s.capFor95, s.wholeCapsFor95)}, 99 %: ${cover(s.capFor99, s.wholeCapsFor99)} (lexicon has ${count(report.lexicon.tokens - report.lexicon.reserved)})`,
  ]);
  if (report.capTie !== null) rows.push(['lexicon cap', describeCapTie(report.capTie)]);
  rows.push(...identifyingRows(report.identifyingTokens));
  rows.push(['lengths that fit', `90 % of documents: ${count(s.lengthFor90)}, 95 %: ${count(s.lengthFor95)}, 99 %: ${count(s.lengthFor99)}`]);
  if (report.documents > 0) rows.push(['cut end', `${describeCutAdvice(s.cut)}${s.cut.cut === null ? '' : ` (--cut ${s.cut.cut})`}`]);
  if (report.topOov.length > 0) {
    rows.push(['top OOV', report.topOov.slice(0, 10).map((t) => `${t.token} (${count(t.count)})`).join(', ')]);
  }
  const width = Math.max(...rows.map(([k]) => k.length));
  let out = `${paint.bold(heading)}\n${rows.map(([k, v]) => `${k.padEnd(width)}  ${v}`).join('\n')}\n`;

  if (report.windows.length > 0) {
    const head = ['length as', 'tokens', 'documents cut', 'tokens dropped', 'padding of ids', 'OOV kept, cut start', 'OOV kept, cut end'];
    const body = report.windows.map((w) => [
      w.candidates.join(' '),
      count(w.length),
      `${count(w.truncatedDocuments)} (${percent(report.documents === 0 ? 0 : w.truncatedDocuments / report.documents)})`,
      count(w.droppedTokens),
      percent(w.paddingShare),
      w.keptOovRate === null ? '–' : percent(w.keptOovRate.cutStart),
      w.keptOovRate === null ? '–' : percent(w.keptOovRate.cutEnd),
    ]);
    out += `\n${paint.bold('rows of each length (what the model sees)')}\n${table([head, ...body], paint)}\n`;
  }
  const labels = Object.entries(report.labels);
  if (labels.length > 0) {
    const head = ['label', 'documents', 'tokens', 'OOV', ...(report.shape === null ? [] : ['truncated'])];
    const body = labels.map(([label, a]) => [
      label,
      count(a.documents),
      count(a.tokens),
      percent(a.tokens === 0 ? 0 : a.oovTokens / a.tokens),
      ...(report.shape === null ? [] : [percent(a.documents === 0 ? 0 : a.truncatedDocuments / a.documents)]),
    ]);
    out += `\n${table([head, ...body], paint)}\n`;
  }
  const d = report.drift;
  if (d !== undefined) {
    const shares = Object.entries(d.labels).map(([label, v]) => [label, percent(v.fit), percent(v.now)]);
    out += `\n${paint.bold('drift since the lexicon was built')}\n`;
    out += `OOV              ${percent(d.oovRate.fit)} then, ${percent(d.oovRate.now)} now\n`;
    out += `tokens/document  then ${lengths(d.length.fit)}\n                 now  ${lengths(d.length.now)}\n`;
    if (d.unseenTokens.length > 0) out += `new tokens       ${d.unseenTokens.slice(0, 10).map((t) => `${t.token} (${count(t.count)})`).join(', ')}\n`;
    if (shares.length > 0) out += `\n${table([['label share', 'then', 'now'], ...shares], paint)}\n`;
  }
  return out;
}
