import type { CoverageReport, LabelAudit, LengthCandidate, WindowFigures } from '../../../src/audit/CoverageReport.js';
import type { ReportContext } from '../../../src/audit/report/ReportContext.js';
import { summarizeLengths } from '../../../src/tally/nearestRank.js';

// An invented scenario: support messages sent to "Harbourline", a made-up island ferry operator,
// routed to five desks. All numbers are generated below from simple formulas, not from real data.

/** The token the escaping checks look for in the page. */
export const SCRIPT_TOKEN = '<script>alert(1)</script>';

const TYPES = 48_000;
const CAP = 24_000;
const RESERVED = 2;
const LENGTH = 256;

/** Cumulative Zipf-like weights (exponent 1.05) of ranks 1…TYPES: `cumulative[r]` sums ranks 1…r. */
const cumulative = ((): Float64Array => {
  const out = new Float64Array(TYPES + 1);
  for (let r = 1; r <= TYPES; r++) out[r] = (out[r - 1] ?? 0) + r ** -1.05;
  return out;
})();

/** Share of occurrences covered by the top `cap` of `TYPES` types. */
function zipfShare(cap: number): number {
  return (cumulative[Math.min(cap, TYPES)] ?? 0) / (cumulative[TYPES] ?? 1);
}

/** A log-normal-ish length histogram with a long tail to 3,000 tokens. */
function lengthCounts(): Map<number, number> {
  const out = new Map<number, number>();
  for (let l = 3; l <= 3000; l++) {
    const z = (Math.log(l) - Math.log(95)) / 0.75;
    const documents = Math.round(520 * Math.exp(-0.5 * z * z) * (95 / l));
    if (documents > 0) out.set(l, documents);
  }
  // A few very long messages (pasted logs): the tail.
  for (const l of [1200, 1650, 2210, 2999]) out.set(l, (out.get(l) ?? 0) + 2);
  return out;
}

/** A realistic report of the invented ferry-support corpus against a 24,000-token lexicon, with drift. */
export function ferryReport(): CoverageReport {
  const lengths = lengthCounts();
  let documents = 0;
  let tokens = 0;
  let truncatedDocuments = 0;
  let droppedTokens = 0;
  let paddingTokens = 0;
  for (const [l, n] of lengths) {
    documents += n;
    tokens += l * n;
    if (l > LENGTH) {
      truncatedDocuments += n;
      droppedTokens += (l - LENGTH) * n;
    } else paddingTokens += (LENGTH - l) * n;
  }
  const caps = new Set<number>([CAP]);
  for (let i = 0; i < 300; i++) caps.add(Math.max(1, Math.round(Math.exp((Math.log(TYPES) * i) / 299))));
  const coverage = [...caps].sort((a, b) => a - b).map((cap) => ({ cap, share: zipfShare(cap) }));
  const capFor = (share: number): number => coverage.find((p) => p.share >= share)?.cap ?? TYPES;
  const oovRate = 1 - zipfShare(CAP);
  const oovTokens = Math.round(oovRate * tokens);
  const summary = summarizeLengths(lengths);

  const desks: Array<[string, number, number, number]> = [
    // label, share of documents, OOV rate, truncated share
    ['billing', 0.24, 0.061, 0.08],
    ['delays', 0.31, 0.048, 0.05],
    ['lost-property', 0.09, 0.124, 0.21],
    ['praise', 0.14, 0.032, 0.02],
    ['refunds', 0.22, 0.057, 0.11],
  ];
  const labels: Record<string, LabelAudit> = {};
  for (const [name, share, oov, cut] of desks) {
    const d = Math.round(documents * share);
    const t = Math.round(tokens * share);
    labels[name] = { documents: d, tokens: t, oovTokens: Math.round(t * oov), truncatedDocuments: Math.round(d * cut) };
  }
  // What the model sees at p50, p90, p95, p99 and the chosen length, from the histogram; the OOV tokens
  // the rows keep are invented: the corpus's rate cutting the end, 0.4 points more cutting the start.
  const candidates: Array<[LengthCandidate, number]> = [['p50', summary.p50], ['p90', summary.p90], ['p95', summary.p95], ['p99', summary.p99], ['chosen', LENGTH]];
  const byLength = new Map<number, LengthCandidate[]>();
  for (const [name, l] of candidates) byLength.set(l, [...(byLength.get(l) ?? []), name]);
  const windows: WindowFigures[] = [...byLength].sort((a, b) => a[0] - b[0]).map(([length, names]) => {
    let cut = 0;
    let dropped = 0;
    let kept = 0;
    let padding = 0;
    for (const [l, n] of lengths) {
      if (l > length) {
        cut += n;
        dropped += (l - length) * n;
      } else padding += (length - l) * n;
      kept += Math.min(l, length) * n;
    }
    const keptOov = { cutStart: Math.round(kept * (oovRate + 0.004)), cutEnd: Math.round(kept * oovRate) };
    return {
      length,
      candidates: names,
      truncatedDocuments: cut,
      droppedTokens: dropped,
      keptTokens: kept,
      paddingTokens: padding,
      paddingShare: padding / (documents * length),
      keptOov,
      keptOovRate: { cutStart: keptOov.cutStart / kept, cutEnd: keptOov.cutEnd / kept },
    };
  });
  const chosen = windows.find((w) => w.candidates.includes('chosen')) as WindowFigures;
  const known = { cutStart: chosen.keptTokens - (chosen.keptOov?.cutStart ?? 0), cutEnd: chosen.keptTokens - (chosen.keptOov?.cutEnd ?? 0) };

  const oovWords = ['hydrofoil', 'rebooking', 'e-ticket', 'skerry', 'harbourline', SCRIPT_TOKEN, 'a&b', '"quoted"', "o'clock", 'gangway', 'tidetable', 'ferrycard'];
  const topOov = oovWords.map((token, i) => ({ token, count: Math.round(2400 / (i + 1)) }));
  return {
    documents,
    tokens,
    types: TYPES,
    oovTokens,
    oovRate,
    shape: { length: LENGTH, pad: 'start', cut: 'end' },
    truncatedDocuments,
    droppedTokens,
    paddingTokens,
    length: summary,
    labels,
    topOov,
    suggest: {
      capFor90: capFor(0.9),
      capFor95: capFor(0.95),
      capFor99: capFor(0.99),
      // Invented: the fixture's curve has no counts, so the whole-count caps around each are made up.
      wholeCapsFor90: { below: capFor(0.9) - 40, above: capFor(0.9) + 310 },
      wholeCapsFor95: { below: capFor(0.95), above: capFor(0.95) },
      wholeCapsFor99: { below: capFor(0.99) - 1200, above: capFor(0.99) + 5400 },
      lengthFor90: summary.p90,
      lengthFor95: summary.p95,
      lengthFor99: summary.p99,
      cut: { length: LENGTH, knownKept: known, cut: 'end' },
    },
    coverage,
    windows,
    lengthHistogram: [...lengths].sort((a, b) => a[0] - b[0]).map(([length, n]) => ({ length, documents: n })),
    lexicon: { fingerprint: `sha256:${'3f9a0c1d'.repeat(8)}`, tokens: CAP + RESERVED, size: CAP + RESERVED + 2, reserved: RESERVED },
    capTie: { cap: CAP, count: 1, tokens: 9120, kept: 2210, left: 6910, below: CAP - 2210, above: CAP + 6910 },
    // Invented, shortened as identifyingTokens shortens them.
    identifyingTokens: {
      tokens: 41,
      email: { tokens: 34, examples: ['ta…@mail.example', 'o.…@port.example', 'de…@harbourline.example'] },
      url: { tokens: 5, examples: ['harbourline.example/help/re…'] },
      mention: { tokens: 0, examples: [] },
      phone: { tokens: 2, examples: ['555-01…', '020-794…'] },
      ip: { tokens: 0, examples: [] },
    },
    drift: {
      oovRate: { fit: 0.0312, now: oovRate },
      length: { fit: { min: 2, p50: 81, p90: 190, p95: 240, p99: 410, max: 2100 }, now: summary },
      labels: {
        billing: { fit: 0.27, now: 0.24 },
        delays: { fit: 0.22, now: 0.31 },
        'lost-property': { fit: 0.1, now: 0.09 },
        praise: { fit: 0.19, now: 0.14 },
        refunds: { fit: 0.22, now: 0.22 },
      },
      unseenTokens: [
        { token: 'hydrofoil', count: 2400 },
        { token: 'e-ticket', count: 800 },
        { token: SCRIPT_TOKEN, count: 400 },
      ],
      unseenBasis: 'fit',
    },
  };
}

/** The context the fixture report is shown with. */
export function ferryContext(): ReportContext {
  return {
    corpus: 'harbourline-support-2031-q2.jsonl',
    lexiconFile: 'lexicons/harbourline-support.lexicon.json',
    settings: { text: 'body', label: 'desk', cap: '24000', length: 'length 256; zeros at the start; long documents lose their end' },
    generatedAt: '2031-07-01T09:30:00Z',
    lexlockVersion: '0.1.0',
  };
}
