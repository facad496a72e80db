// The report page recomputes OOV, truncation and padding at any cap and length stop from sums kept
// between stops (issue 16). Here those sums are checked against a plain recount: for each cap stop a
// lexicon frozen at that cap from the corpus's tally (what `lexlock audit --cap X` audits against),
// every document's tokens as strings (`tokenize`) looked up in it; for each length stop the documents
// cut, tokens dropped and padding counted one document at a time.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { figuresAt } from '../../../src/audit/explore/figuresAt.js';
import { capGrid } from '../../../src/audit/explore/pageBudget.js';
import { pageDataOf } from '../../../src/audit/explore/pageDataOf.js';
import { rankingLexicon } from '../../../src/audit/explore/rankingLexicon.js';
import type { PageData } from '../../../src/audit/explore/PageData.js';
import { stopGrid, stopsOf, StopIndex } from '../../../src/audit/explore/StopGrid.js';
import { auditReport } from '../../../src/audit/auditCorpus.js';
import { freeze } from '../../../src/lexicon/freeze.js';
import type { Lexicon } from '../../../src/lexicon/Lexicon.js';
import { auditCountsOnThreads } from '../../../src/pipeline/auditOnThreads.js';
import { resolveRules } from '../../../src/rules/TextRules.js';
import { tokenize } from '../../../src/rules/tokenize.js';
import { Tally } from '../../../src/tally/Tally.js';

const WORDS = ['the', 'ferry', 'late', 'again', 'quay', 'ticket', 'refund', 'été', 'pier@harbour.example', '10:30', ',', '!', 'x', 'y', 'z', 'w'];
const text = fc.array(fc.tuple(fc.constantFrom(...WORDS), fc.constantFrom(' ', ', ', '')), { maxLength: 14 }).map((p) => p.map(([w, g]) => w + g).join(''));
const doc = fc.record({ text, label: fc.option(fc.constantFrom('delays', 'praise', 'tickets'), { nil: undefined }) });
type Doc = { text: string; label: string | undefined };

/** What a plain recount gives one series (all documents, or one label's) at a cap and a length. */
function recount(docs: readonly Doc[], lexicon: Lexicon, length: number | null) {
  let tokens = 0;
  let oov = 0;
  let truncated = 0;
  let dropped = 0;
  let padding = 0;
  for (const d of docs) {
    const t = tokenize(d.text, lexicon.rules);
    tokens += t.length;
    oov += t.filter((token) => !lexicon.has(token)).length;
    if (length === null) continue;
    if (t.length > length) {
      truncated += 1;
      dropped += t.length - length;
    } else padding += length - t.length;
  }
  return { keptOccurrences: tokens - oov, oovTokens: oov, truncatedDocuments: truncated, droppedTokens: dropped, paddingTokens: padding };
}

async function pageFor(docs: readonly Doc[], cap: number, length: number | null, points: number, minCount = 1) {
  const rules = resolveRules();
  const tally = new Tally(rules);
  for (const d of docs) tally.add(d);
  const audited = freeze(tally, { cap, minCount, shape: length === null ? null : { length, pad: 'end', cut: 'end' } });
  const ranking = rankingLexicon(tally, minCount, audited);
  // The ranking is freeze's order: a lexicon frozen with no cap has the same tokens.
  expect(ranking.encoding.tokens).toEqual(freeze(tally, { cap: null, minCount }).encoding.tokens);
  const ranked = ranking.encoding.tokens.length;
  const grid = stopGrid(ranked, points, [Math.min(cap, ranked)]);
  const counts = await auditCountsOnThreads(docs, audited, { page: { grid, ranking } });
  const report = auditReport(counts, audited);
  // Looking tokens up in the ranking changes nothing in the audit's own report.
  expect(report).toEqual(auditReport(await auditCountsOnThreads(docs, audited), audited));
  const data = pageDataOf(counts, report, { lexicon: audited, shape: audited.shape, build: { head: ['corpus.csv'], tail: [] }, ranking: 'corpus' });
  return { tally, data, minCount };
}

/** Every (series, cap stop, length stop) of a page against a recount with a lexicon frozen at that cap. */
function checkAll(docs: readonly Doc[], tally: Tally, data: PageData, minCount: number): number {
  let checked = 0;
  const lengths = data.length.chosen === null ? [null] : stopsOf(data.length.grid);
  for (const cap of stopsOf(data.cap.grid)) {
    const lexicon = freeze(tally, { cap, minCount });
    for (const length of lengths) {
      expect(figuresAt(data, data.overall, cap, length), `cap ${cap}, length ${length}`).toEqual(recount(docs, lexicon, length));
      for (const series of data.labels) {
        const mine = docs.filter((d) => d.label === series.name);
        expect(figuresAt(data, series, cap, length), `${series.name} at cap ${cap}, length ${length}`).toEqual(recount(mine, lexicon, length));
        checked += 1;
      }
    }
  }
  return checked;
}

describe('StopGrid', () => {
  it.each([
    // [last, points, extra, exactTo, step]: every value while they fit; else half the stops one apart, then a round step
    [10, 100, [], 10, 1],
    [100_000, 1_000, [12_345], 500, 500],
    [5_000, 48_000 / 5, [1_200], 5_000, 1],
    [1_000_000, 300, [], 150, 10_000],
  ])('stopGrid(%d, %d, %j) is exact to %d, then steps of %d', (last, points, extra, exactTo, step) => {
    const grid = stopGrid(last, points, extra);
    expect([grid.exactTo, grid.step]).toEqual([exactTo, step]);
    const stops = stopsOf(grid);
    expect(stops.length).toBeLessThanOrEqual(Math.max(8, points));
    expect(stops[stops.length - 1]).toBe(last);
    for (const e of extra) expect(stops).toContain(e);
  });

  it('bucketOf gives the first stop at or above a value, for every value (plain search as reference)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 2_000 }), fc.integer({ min: 8, max: 300 }), fc.array(fc.integer({ min: 0, max: 5_000 }), { maxLength: 3 }), (last, points, extra) => {
        const index = new StopIndex(stopGrid(last, points, extra));
        const stops = index.stops;
        for (let v = 0; v <= last + 1; v++) {
          const plain = stops.findIndex((s) => s >= v);
          expect(index.bucketOf(v)).toBe(plain < 0 ? stops.length : plain);
        }
      }),
      { numRuns: 40 },
    );
  });
});

describe('page data', () => {
  it('matches a recount at every cap and length stop (fast-check: documents, caps, grids, min count)', async () => {
    await fc.assert(
      fc.asyncProperty(fc.array(doc, { minLength: 1, maxLength: 25 }), fc.integer({ min: 0, max: 20 }), fc.integer({ min: 1, max: 12 }), fc.integer({ min: 8, max: 40 }), fc.integer({ min: 1, max: 2 }), async (docs, cap, length, points, minCount) => {
        const { tally, data } = await pageFor(docs, cap, length, points, minCount);
        checkAll(docs, tally, data, minCount);
      }),
      { numRuns: 60 },
    );
  });

  it('steps past the exact part (a grid of 8 stops over 15 ranks) still match at each stop', async () => {
    const docs: Doc[] = WORDS.map((w, i) => ({ text: `${w} `.repeat(i + 1), label: i % 2 === 0 ? 'delays' : 'praise' }));
    const { tally, data } = await pageFor(docs, 7, 6, 8);
    expect(data.cap.grid.step).toBeGreaterThan(1);
    expect(stopsOf(data.cap.grid)).toContain(7);
    expect(checkAll(docs, tally, data, 1)).toBeGreaterThan(0);
  });

  it('the same on two threads as on one (page counts merge across workers)', async () => {
    const docs: Doc[] = Array.from({ length: 400 }, (_, i) => ({ text: `${WORDS[i % WORDS.length]} ${WORDS[(i * 7) % WORDS.length]} ${WORDS[(i * 3) % 5]} quay${i % 9}`, label: ['delays', 'praise', 'tickets'][i % 3] }));
    const rules = resolveRules();
    const tally = new Tally(rules);
    for (const d of docs) tally.add(d);
    const audited = freeze(tally, { cap: 5 });
    const ranking = rankingLexicon(tally, 1, audited);
    const grid = capGrid(ranking.encoding.tokens.length, 5, 3);
    const one = await auditCountsOnThreads(docs, audited, { page: { grid, ranking }, threads: 1 });
    const two = await auditCountsOnThreads(docs, audited, { page: { grid, ranking }, threads: 2 });
    const dataOf = (c: typeof one) => pageDataOf(c, auditReport(c, audited), { lexicon: audited, shape: { length: 3, pad: 'end', cut: 'end' }, build: { head: [], tail: [] }, ranking: 'corpus' });
    expect(dataOf(two)).toEqual(dataOf(one));
  });
});
