import { readdirSync, readFileSync, statSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import type { CoverageReport, LabelAudit } from '../../../src/audit/CoverageReport.js';
import { identifyingTokens } from '../../../src/audit/identifyingTokens.js';
import { renderReport } from '../../../src/audit/report/renderReport.js';
import { coverageAt } from '../../../src/audit/report/sections/coverageAt.js';
import { ferryContext, ferryReport, SCRIPT_TOKEN } from './reportFixture.js';

/** A report with the given labels and nothing else worth drawing. */
function smallReport(labels: Record<string, LabelAudit>, changes: Partial<CoverageReport> = {}): CoverageReport {
  const base = ferryReport();
  const { drift: _drift, ...rest } = base;
  return { ...rest, labels, ...changes };
}

/** Labels whose names are also member names of every JavaScript object, as own entries. */
function trickyLabels(): Record<string, LabelAudit> {
  // JSON.parse makes "__proto__" an own member (an object literal would set the prototype instead).
  return JSON.parse(
    '{"__proto__":{"documents":10,"tokens":100,"oovTokens":7,"truncatedDocuments":1},' +
      '"constructor":{"documents":20,"tokens":200,"oovTokens":2,"truncatedDocuments":0},' +
      '"<b>desk</b>":{"documents":5,"tokens":50,"oovTokens":0,"truncatedDocuments":5}}',
  ) as Record<string, LabelAudit>;
}

const page = renderReport(ferryReport(), ferryContext());

describe('renderReport', () => {
  it('says which tokens of the vocabulary may identify people and how to fold them into placeholders', () => {
    expect(page).toContain(
      `<p class="identifying"><strong>The lexicon's vocabulary may identify people.</strong> 41 tokens may identify people: ` +
        '34 e-mail addresses (ta…@mail.example, o.…@port.example, …), 5 URLs (harbourline.example/help/re…, …), 2 phone-like numbers (555-01…, 020-794…); ' +
        'anyone who loads the lexicon can read its tokens: --collapse email,url,number folds these into placeholders.</p>',
    );
  });

  it('names the corpus, the lexicon file, its fingerprint and every setting', () => {
    const context = ferryContext();
    expect(page).toContain('<title>Vocabulary audit: harbourline-support-2031-q2.jsonl</title>');
    expect(page).toContain('lexicons/harbourline-support.lexicon.json');
    expect(page).toContain(`<code class="fingerprint">sha256:${'3f9a0c1d'.repeat(8)}</code>`);
    for (const [key, value] of Object.entries(context.settings)) expect(page).toMatch(new RegExp(`<th scope="row">${key}</th><td><code>${value}</code></td>`));
    expect(page).toContain('2031-07-01T09:30:00Z by lexlock 0.1.0');
  });

  it('says when the lexicon was frozen for the audit and when no settings were given', () => {
    const html = renderReport(ferryReport(), { ...ferryContext(), lexiconFile: null, settings: {} });
    expect(html).toContain('none: frozen from this corpus for this audit');
    expect(html).toContain('Settings: none given.');
  });

  it('escapes corpus-derived text everywhere and contains no script', () => {
    const context = { ...ferryContext(), corpus: '"><img src=x onerror=alert(2)>.csv', settings: { 'text"field': "<it's>" } };
    const html = renderReport(smallReport(trickyLabels()), context);
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<img/i);
    expect(html).not.toMatch(/<[^>]*\son\w+\s*=/i); // no event-handler attribute in any tag
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
    expect(html).toContain('&quot;&gt;&lt;img src=x onerror=alert(2)&gt;.csv');
    expect(html).toContain('text&quot;field');
    expect(html).toContain('&lt;it&#39;s&gt;');
    expect(html).not.toContain(SCRIPT_TOKEN);
    expect(html).not.toContain('<b>desk</b>');
    expect(html).toContain('&lt;b&gt;desk&lt;/b&gt;');
  });

  it('references nothing outside the page', () => {
    for (const html of [page, renderReport(smallReport(trickyLabels()), ferryContext())]) {
      expect(html).not.toMatch(/https?:/i);
      expect(html).not.toMatch(/\b(?:src|href|xlink:href|action|formaction|poster|srcset)\s*=/i);
      expect(html).not.toMatch(/@import/i);
      expect(html).not.toMatch(/url\(\s*(?!#)/i); // only same-document references such as url(#pattern)
      expect(html).not.toMatch(/<(?:link|iframe|object|embed|img|image|use|foreignObject)\b/i);
    }
    expect(page).toContain(`<meta http-equiv="Content-Security-Policy" content="default-src 'none'; style-src 'unsafe-inline';`);
  });

  it('draws five accessible charts, each with a title and a description, for a full report', () => {
    const svgs = page.match(/<svg [^>]*>/g) ?? [];
    expect(svgs).toHaveLength(5);
    for (const svg of svgs) {
      expect(svg).toContain('role="img"');
      expect(svg).toMatch(/aria-labelledby="(chart-[a-z-]+)-title \1-desc"/);
    }
    expect(page.match(/<svg [^>]*><title id="chart-[a-z-]+-title">[^<]+<\/title><desc id="chart-[a-z-]+-desc">[^<]+<\/desc>/g)).toHaveLength(5);
    expect(page).toContain('cap (tokens kept, log scale)');
    expect(page).toContain('token occurrences covered (%)');
    expect(page).toContain('tokens per document (bins of 50)');
    expect(page).toContain('Bar width: 50 tokens.');
    expect(page).toMatch(/chosen cap 24,000: 9\d\.\d\u00a0% covered/);
    expect(page).toMatch(/chosen length 256: 9\.\d\d\u00a0% truncated/);
  });

  it('shows what the model sees at each candidate length, and which end to cut', () => {
    const report = ferryReport();
    expect(page).toContain('<h2>What the model sees</h2>');
    // One row a length; the chosen 256 is the fixture's own figures (9.x % of documents truncated).
    expect(page.match(/<section id="windows">[\s\S]*?<\/section>/)?.[0].match(/<tr><th scope="row" class="num">/g)).toHaveLength(report.windows.length);
    const chosen = report.windows.find((w) => w.candidates.includes('chosen'));
    expect(chosen?.truncatedDocuments).toBe(report.truncatedDocuments);
    expect(page).toMatch(/<th scope="row" class="num">256<\/th><td>chosen<\/td><td class="num">[\d,]+ \(9\.\d\d\u00a0%\)<\/td>/);
    const known = report.suggest.cut.knownKept;
    expect(page).toContain(
      `<p class="cut-advice"><strong>Which end to cut:</strong> at length 256 rows keep ${known.cutEnd.toLocaleString('en-US')} known tokens when long documents lose their end, ${known.cutStart.toLocaleString('en-US')} when they lose their start: cut the end.</p>`,
    );
  });

  it('shows no NaN, Infinity or undefined, even for an empty corpus', () => {
    const empty: CoverageReport = {
      documents: 0,
      tokens: 0,
      types: 0,
      oovTokens: 0,
      oovRate: 0,
      shape: null,
      truncatedDocuments: 0,
      droppedTokens: 0,
      paddingTokens: 0,
      length: { min: 0, p50: 0, p90: 0, p95: 0, p99: 0, max: 0 },
      labels: {},
      topOov: [],
      suggest: {
        capFor90: 0,
        capFor95: 0,
        capFor99: 0,
        wholeCapsFor90: { below: 0, above: 0 },
        wholeCapsFor95: { below: 0, above: 0 },
        wholeCapsFor99: { below: 0, above: 0 },
        lengthFor90: 0,
        lengthFor95: 0,
        lengthFor99: 0,
        cut: { length: 1, knownKept: { cutStart: 0, cutEnd: 0 }, cut: null },
      },
      coverage: [],
      windows: [],
      lengthHistogram: [],
      lexicon: { fingerprint: 'sha256:00', tokens: 0, size: 2, reserved: 0 },
      capTie: null,
      identifyingTokens: identifyingTokens([]),
    };
    const html = renderReport(empty, ferryContext());
    for (const bad of ['NaN', 'Infinity', 'undefined', 'null']) expect(html).not.toContain(bad);
    expect(html).toContain('No coverage figures');
    expect(html).toContain('No documents, so no lengths to show.');
    expect(html).toContain('This corpus has no labels, so there are no per-label figures.');
    expect(html).toContain('No token of this corpus is out of the vocabulary.');
    expect(html).toContain('No document has a token, so there are no row lengths to weigh.');
    expect(html).not.toContain('Which end to cut');
    expect(html).toContain("<p class=\"note\">In the lexicon's vocabulary, no token looks like an e-mail address, URL, @mention, phone number or IP address.</p>");
    expect(html).not.toContain('<svg');
    for (const bad of ['NaN', 'Infinity', 'undefined']) expect(page).not.toContain(bad);
  });

  it('draws labels named like object members as ordinary labels', () => {
    const html = renderReport(smallReport(trickyLabels()), ferryContext());
    expect(html.match(/class="bar-group"/g)).toHaveLength(3);
    expect(html).toContain('<th scope="row"><code>__proto__</code></th><td class="num">10</td><td class="num">100</td><td class="num" data-live="label-oov" data-row="__proto__">7.00\u00a0%</td><td class="num" data-live="label-truncated" data-row="__proto__">10.0\u00a0%</td>');
    expect(html).toContain('<th scope="row"><code>constructor</code></th><td class="num">20</td>');
  });

  it('says when there are no labels, no shape and no drift', () => {
    const html = renderReport(smallReport({}, { shape: null, truncatedDocuments: 0, droppedTokens: 0, paddingTokens: 0 }), ferryContext());
    expect(html).toContain('This corpus has no labels, so there are no per-label figures.');
    expect(html).toContain('No sequence length is set, so nothing is truncated or padded.');
    expect(html).not.toContain('chosen length');
    expect(html).not.toContain('id="drift"');
    expect(html.match(/<svg /g)).toHaveLength(2);
  });

  it('shows drift then and now, and says what "unseen" was checked against', () => {
    expect(page).toContain('<h2>Drift since the lexicon was built</h2>');
    expect(page).toContain('<th scope="row">OOV rate</th><td class="num">3.12\u00a0%</td><td class="num">4.62\u00a0%</td><td class="num">+1.50 points</td>');
    expect(page).toContain('<th scope="row">p99</th><td class="num">410</td><td class="num">533</td><td class="num">+123 tokens</td>');
    expect(page).toContain('<th scope="row"><code>delays</code></th><td class="num">22.0\u00a0%</td><td class="num">31.0\u00a0%</td><td class="num">+9.00 points</td>');
    expect(page).toContain('never had the token at all');
    const report = ferryReport();
    if (report.drift === undefined) throw new Error('fixture has drift');
    const vocabulary = renderReport({ ...report, drift: { ...report.drift, unseenBasis: 'vocabulary', labels: {} } }, ferryContext());
    expect(vocabulary).toContain('may have occurred at build time and fallen under the cap');
    expect(vocabulary).toContain('Neither corpus has labels');
  });

  it('shows at most 30 labels in the chart and all of them in the table', () => {
    const labels: Record<string, LabelAudit> = {};
    for (let i = 0; i < 45; i++) labels[`desk-${String(i).padStart(2, '0')}`] = { documents: 100 + i, tokens: 1_000, oovTokens: i, truncatedDocuments: 0 };
    const html = renderReport(smallReport(labels), ferryContext());
    expect(html.match(/class="bar-group"/g)).toHaveLength(30);
    expect(html).toContain('Showing the 30 labels with the most documents of 45');
    expect(html).toContain('<code>desk-00</code>'); // in the table, though not in the chart
    expect(html).not.toMatch(/class="group-name">desk-14</);
    expect(html).toMatch(/class="group-name">desk-15</);
  });

  it('marks the chosen cap even beyond the curve, and notes when the lexicon covers less than the curve', () => {
    const report = ferryReport();
    const html = renderReport({ ...report, oovRate: 0.2 }, ferryContext());
    expect(html).toContain('the lexicon&#39;s own tokens cover 80.0\u00a0%');
    expect(page).not.toContain('the lexicon&#39;s own tokens cover');
    // A cap larger than the corpus has types: the curve ends at 48,000, the axis runs on to the cap.
    const wide = renderReport({ ...report, lexicon: { ...report.lexicon, tokens: 60_002 } }, ferryContext());
    expect(wide).toMatch(/class="marker marker-chosen" data-live="cap-marker">chosen cap 60,000: 100\u00a0% covered</);
    expect(wide).toContain('for N from 1 to 60,000');
  });
});

describe('coverageAt', () => {
  it.each([
    [0, 0],
    [1, 0.1],
    [4, 0.3],
    [10, 0.5],
    [1_000, 0.9],
  ])('reads the step curve at cap %d', (cap, share) => {
    expect(coverageAt([{ cap: 1, share: 0.1 }, { cap: 3, share: 0.3 }, { cap: 10, share: 0.5 }, { cap: 500, share: 0.9 }], cap)).toBe(share);
  });
});

describe('report modules', () => {
  it('import nothing from node: (the core runs in browsers)', () => {
    const root = join(import.meta.dirname, '../../../src/audit/report');
    const files: string[] = [];
    const walk = (dir: string): void => {
      for (const name of readdirSync(dir)) {
        const path = join(dir, name);
        if (statSync(path).isDirectory()) walk(path);
        else if (name.endsWith('.ts')) files.push(path);
      }
    };
    walk(root);
    expect(files.length).toBeGreaterThan(20);
    for (const file of files) expect(readFileSync(file, 'utf8')).not.toMatch(/from '(?:node:|fs|path|os)/);
  });
});
