// The report page embeds figures for its controls within a fixed budget, so its size does not grow
// with the corpus's distinct tokens, documents, lengths or labels (issue 16: at most 2 MB). Checked on
// a generated corpus of 250,000 distinct tokens, 260 labels and 2,000 distinct lengths: the page must
// be within 2 MB even if every embedded figure had the 16 digits of the largest count below 2^53.
import { readFile, writeFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { auditReport } from '../../../src/audit/auditCorpus.js';
import { CAP_FIGURES, LENGTH_FIGURES, LIVE_LABELS, PAGE_BYTES, capGrid } from '../../../src/audit/explore/pageBudget.js';
import { pageDataOf } from '../../../src/audit/explore/pageDataOf.js';
import { rankingLexicon } from '../../../src/audit/explore/rankingLexicon.js';
import { stopsOf } from '../../../src/audit/explore/StopGrid.js';
import { renderReport } from '../../../src/audit/report/renderReport.js';
import { freeze } from '../../../src/lexicon/freeze.js';
import { auditCountsOnThreads } from '../../../src/pipeline/auditOnThreads.js';
import { resolveRules } from '../../../src/rules/TextRules.js';
import { Tally } from '../../../src/tally/Tally.js';
import { SHOWN_TOKEN_MOST, shownToken } from '../../../src/audit/report/shownToken.js';
import { cli, freshFolderEachTest } from '../../helpers/cli.js';
import { letters, seeded } from '../../helpers/generatedCorpora.js';

const TYPES = 250_000;
const LABELS = 260;

/** Documents of 1 to 2,000 invented words, every word a new one until TYPES, then repeats; a label each. */
function* corpus(): Generator<{ text: string; label: string }> {
  const random = seeded(16);
  let next = 0;
  let i = 0;
  while (next < TYPES) {
    const length = i % 50 === 0 ? 1 + (i % 2_000) : 1 + Math.floor(random() * 12);
    const words: string[] = [];
    for (let k = 0; k < length; k++) words.push(letters(next < TYPES ? next++ : Math.floor(random() * 100)));
    yield { text: words.join(' '), label: `desk-${letters(i % LABELS)}` };
    i++;
  }
}

describe('the report page size', () => {
  it(`stays within ${PAGE_BYTES.toLocaleString('en')} bytes for ${TYPES.toLocaleString('en')} distinct tokens and ${LABELS} labels`, async () => {
    const tally = new Tally(resolveRules());
    for (const d of corpus()) tally.add(d);
    expect(tally.types).toBeGreaterThanOrEqual(TYPES);
    const lexicon = freeze(tally, { cap: 30_000, shape: { length: 64, pad: 'end', cut: 'end' } });
    const ranking = rankingLexicon(tally, 1, lexicon);
    const grid = capGrid(ranking.encoding.tokens.length, 30_000, tally.labels.size);
    const counts = await auditCountsOnThreads(corpus(), lexicon, { page: { grid, ranking } });
    const report = auditReport(counts, lexicon);
    const data = pageDataOf(counts, report, { lexicon, shape: lexicon.shape, build: { head: ['corpus.csv'], tail: [] }, ranking: 'corpus' });
    expect(data.labels.length).toBeLessThanOrEqual(LIVE_LABELS);
    expect(data.labels.length + data.labelsLeftOut).toBe(LABELS);
    expect(data.cap.grid.step).toBeGreaterThan(1);
    expect(stopsOf(data.cap.grid)).toContain(30_000);
    const series = [data.overall, ...data.labels];
    const capFigures = series.reduce((sum, s) => sum + s.kept.length, 0);
    const lengthFigures = series.reduce((sum, s) => sum + s.documentsUpTo.length + s.tokensUpTo.length, 0);
    expect(capFigures).toBeLessThanOrEqual(CAP_FIGURES);
    expect(lengthFigures).toBeLessThanOrEqual(LENGTH_FIGURES);
    const html = renderReport(report, { corpus: 'corpus.csv', lexiconFile: null, settings: {}, generatedAt: '2031-06-01T00:00:00Z', lexlockVersion: 'test' }, data);
    const bytes = new TextEncoder().encode(html).length;
    expect(bytes).toBeLessThanOrEqual(PAGE_BYTES);
    // The worst case: each figure written with 16 digits and a comma instead of as it is.
    const written = series.reduce((sum, s) => sum + [...s.kept, ...s.documentsUpTo, ...s.tokensUpTo].reduce((n, v) => n + String(v).length + 1, 0), 0);
    expect(bytes - written + 17 * (capFigures + lengthFigures)).toBeLessThanOrEqual(PAGE_BYTES);
  }, 120_000);
});

// Long tokens (pasted data, base64 blobs) are the only text of a corpus the page lists at their own
// length: each is shown shortened (shownToken), in the top OOV list, the count bands and drift alike.
describe('the report page with very long tokens', () => {
  const tmp = freshFolderEachTest();
  const long = (i: number) => `${letters(i)}${'q'.repeat(100_000)}`;

  it.each([
    ['the top OOV list', (i: number) => (i % 2 === 0 ? 2 : 1), 'Most frequent of the corpus'],
    ['the count bands', () => 1, 'OOV tokens by count'],
  ])('stays within the bound listing 60 tokens of 100,000 characters in %s', async (_where, times, heading) => {
    const lines = Array.from({ length: 5 }, () => 'a b c');
    for (let i = 0; i < 60; i++) for (let k = 0; k < times(i); k++) lines.push(long(i));
    await writeFile(tmp.path('long.txt'), `${lines.join('\n')}\n`);
    const r = await cli('audit', tmp.path('long.txt'), '--cap', '3', '--report', tmp.path('page.html'), '-q');
    expect([r.code, r.stderr]).toEqual([0, '']);
    const html = await readFile(tmp.path('page.html'), 'utf8');
    expect(html.toLowerCase()).toContain(heading.toLowerCase());
    expect(new TextEncoder().encode(html).length).toBeLessThanOrEqual(PAGE_BYTES / 4);
    expect(html).toContain(shownToken(long(0)));
    expect(html).not.toContain('q'.repeat(SHOWN_TOKEN_MOST));
  });

  it('stays within the bound listing unseen tokens of 100,000 characters in drift', async () => {
    await writeFile(tmp.path('train.txt'), 'a b c\n');
    await writeFile(tmp.path('live.txt'), `${Array.from({ length: 60 }, (_, i) => long(i)).join('\n')}\n`);
    expect((await cli('build', tmp.path('train.txt'), '-o', tmp.path('lex.json'))).code).toBe(0);
    const r = await cli('audit', tmp.path('live.txt'), '--lexicon', tmp.path('lex.json'), '--report', tmp.path('page.html'), '-q');
    expect([r.code, r.stderr]).toEqual([0, '']);
    const html = await readFile(tmp.path('page.html'), 'utf8');
    expect(new TextEncoder().encode(html).length).toBeLessThanOrEqual(PAGE_BYTES / 4);
    expect(html).toContain(shownToken(long(0)));
    expect(html).not.toContain('q'.repeat(SHOWN_TOKEN_MOST));
  });
});
