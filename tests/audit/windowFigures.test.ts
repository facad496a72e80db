// What the model sees (issue 14, point 8): for each candidate length, documents cut, tokens dropped,
// the padding share of all ids and the OOV rate of what the rows keep for each cut end; and which cut
// end keeps more known tokens. Checked against counts worked out by hand for a small corpus, and
// against a plain re-computation from every document's ids (slices of them) on random corpora.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { AuditCounts } from '../../src/audit/AuditCounts.js';
import { auditCorpus, auditReport } from '../../src/audit/auditCorpus.js';
import { OovPositions } from '../../src/audit/OovPositions.js';
import { freeze } from '../../src/lexicon/freeze.js';
import type { Shape } from '../../src/lexicon/Shape.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const rules = resolveRules();
// Known tokens (cap 3): late, ferry, the. Everything else is OOV.
const lexicon = freeze(Tally.fromTexts(['the ferry was late again', 'the ferry was lovely', 'late late late'], rules), { cap: 3 });

// K known, O OOV:
const corpus = [
  'late ferry the rough sea', // K K K O O (5 tokens)
  'rough late', // O K (2)
  'the the the the the the the rough', // K K K K K K K O (8)
  'sea', // O (1)
  '', // no tokens (0)
];

describe('window figures, worked out by hand', () => {
  // Lengths 0, 1, 2, 5, 8 (nearest rank): p50 = 2 (3rd of 5), p90 = p95 = p99 = 8; chosen 4.
  // 16 tokens, 5 OOV.
  it('gives each candidate length\'s rows', async () => {
    const r = await auditCorpus(corpus, lexicon, { shape: { length: 4, pad: 'start', cut: 'start' } });
    expect([r.tokens, r.oovTokens, r.length.p50, r.length.p90]).toEqual([16, 5, 2, 8]);
    expect(r.windows).toEqual([
      {
        // Cut: the 5- and 8-token documents, losing 3 + 6. Kept 2 + 2 + 2 + 1 + 0 = 7; padding 0 + 1 + 2
        // in 5 rows of 2 ids. First 2 tokens: K K | O K | K K | O -> 2 OOV; last 2: O O | O K | K O | O -> 5.
        length: 2,
        candidates: ['p50'],
        truncatedDocuments: 2,
        droppedTokens: 9,
        keptTokens: 7,
        paddingTokens: 3,
        paddingShare: 3 / 10,
        keptOov: { cutStart: 5, cutEnd: 2 },
        keptOovRate: { cutStart: 5 / 7, cutEnd: 2 / 7 },
      },
      {
        // Cut: the same two, losing 1 + 4. Kept 4 + 2 + 4 + 1 + 0 = 11; padding 2 + 3 + 4 in 20 ids.
        // First 4: K K K O | O K | K K K K | O -> 3; last 4: K K O O | O K | K K K O | O -> 5.
        length: 4,
        candidates: ['chosen'],
        truncatedDocuments: 2,
        droppedTokens: 5,
        keptTokens: 11,
        paddingTokens: 9,
        paddingShare: 9 / 20,
        keptOov: { cutStart: 5, cutEnd: 3 },
        keptOovRate: { cutStart: 5 / 11, cutEnd: 3 / 11 },
      },
      {
        // Nothing cut; padding 3 + 6 + 0 + 7 + 8 = 24 of 40 ids; every OOV token kept either way.
        length: 8,
        candidates: ['p90', 'p95', 'p99'],
        truncatedDocuments: 0,
        droppedTokens: 0,
        keptTokens: 16,
        paddingTokens: 24,
        paddingShare: 24 / 40,
        keptOov: { cutStart: 5, cutEnd: 5 },
        keptOovRate: { cutStart: 5 / 16, cutEnd: 5 / 16 },
      },
    ]);
    // At length 4 the rows keep 11 - 5 = 6 known tokens cutting the start, 11 - 3 = 8 cutting the end.
    expect(r.suggest.cut).toEqual({ length: 4, knownKept: { cutStart: 6, cutEnd: 8 }, cut: 'end' });
    // The chosen length's figures are the report's own.
    const chosen = r.windows.find((w) => w.candidates.includes('chosen'));
    expect([chosen?.truncatedDocuments, chosen?.droppedTokens, chosen?.paddingTokens]).toEqual([r.truncatedDocuments, r.droppedTokens, r.paddingTokens]);
  });

  it('without a length, compares the cut ends at p95, where nothing is cut: no end is better', async () => {
    const r = await auditCorpus(corpus, lexicon, { shape: null });
    expect(r.windows.map((w) => [w.length, w.candidates])).toEqual([
      [2, ['p50']],
      [8, ['p90', 'p95', 'p99']],
    ]);
    expect(r.suggest.cut).toEqual({ length: 8, knownKept: { cutStart: 11, cutEnd: 11 }, cut: null });
  });

  it('prefers cutting the start when the OOV tokens sit at the start', async () => {
    const r = await auditCorpus(['rough sea late ferry', 'sea late'], lexicon, { shape: { length: 2, pad: 'end', cut: 'end' } });
    // First 2: O O | O K -> 3 OOV; last 2: K K | O K -> 1. Kept 4.
    expect(r.suggest.cut).toEqual({ length: 2, knownKept: { cutStart: 3, cutEnd: 1 }, cut: 'start' });
  });

  it('an empty corpus has no candidate lengths and no better end', async () => {
    const r = await auditCorpus([], lexicon, { shape: { length: 3, pad: 'end', cut: 'end' } });
    expect(r.windows).toEqual([
      { length: 3, candidates: ['chosen'], truncatedDocuments: 0, droppedTokens: 0, keptTokens: 0, paddingTokens: 0, paddingShare: 0, keptOov: { cutStart: 0, cutEnd: 0 }, keptOovRate: { cutStart: 0, cutEnd: 0 } },
    ]);
    expect(r.suggest.cut).toEqual({ length: 3, knownKept: { cutStart: 0, cutEnd: 0 }, cut: null });
  });
});

describe('window figures against a plain re-computation', () => {
  const WORDS = ['late', 'ferry', 'the', 'rough', 'sea', 'crew', 'x'];
  const documents = fc.array(fc.array(fc.constantFrom(...WORDS), { maxLength: 30 }).map((w) => w.join(' ')), { maxLength: 40 });
  const shape = fc.option(fc.record({ length: fc.integer({ min: 1, max: 35 }), pad: fc.constantFrom('start' as const, 'end' as const), cut: fc.constantFrom('start' as const, 'end' as const) }), { nil: null });

  /** Nearest rank, written out plainly: the smallest length with at least p % of documents at or below it. */
  function nearestRank(sorted: number[], p: number): number {
    if (sorted.length === 0) return 0;
    return sorted[Math.max(1, Math.ceil((p / 100) * sorted.length)) - 1] as number;
  }

  it('matches slices of every document\'s ids, on one thread or counted in two parts and merged', async () => {
    await fc.assert(
      fc.asyncProperty(documents, shape, fc.nat(), async (texts, s, split) => {
        const r = await auditCorpus(texts, lexicon, { shape: s });
        const ids = texts.map((t) => [...lexicon.encode(t, { shape: null })]);
        const sorted = ids.map((d) => d.length).sort((a, b) => a - b);
        const candidates = new Map<number, string[]>();
        const add = (name: string, length: number) => {
          if (length >= 1) candidates.set(length, [...(candidates.get(length) ?? []), name]);
        };
        for (const p of [50, 90, 95, 99]) add(`p${p}`, nearestRank(sorted, p));
        if (s !== null) add('chosen', s.length);
        const expected = [...candidates.entries()]
          .sort((a, b) => a[0] - b[0])
          .map(([length, names]) => {
            const oov = (row: number[]) => row.filter((id) => id === lexicon.oovId).length;
            const kept = ids.reduce((sum, d) => sum + Math.min(d.length, length), 0);
            const padding = ids.reduce((sum, d) => sum + Math.max(0, length - d.length), 0);
            const cutEnd = ids.reduce((sum, d) => sum + oov(d.slice(0, length)), 0);
            const cutStart = ids.reduce((sum, d) => sum + oov(d.slice(Math.max(0, d.length - length))), 0);
            return {
              length,
              candidates: names,
              truncatedDocuments: ids.filter((d) => d.length > length).length,
              droppedTokens: ids.reduce((sum, d) => sum + Math.max(0, d.length - length), 0),
              keptTokens: kept,
              paddingTokens: padding,
              paddingShare: ids.length === 0 ? 0 : padding / (ids.length * length),
              keptOov: { cutStart, cutEnd },
              keptOovRate: { cutStart: kept === 0 ? 0 : cutStart / kept, cutEnd: kept === 0 ? 0 : cutEnd / kept },
            };
          });
        expect(r.windows).toEqual(expected);

        const at = Math.max(1, s?.length ?? nearestRank(sorted, 95));
        const known = (keep: (d: number[]) => number[]) => ids.reduce((sum, d) => sum + keep(d).filter((id) => id !== lexicon.oovId).length, 0);
        const knownKept = { cutStart: known((d) => d.slice(Math.max(0, d.length - at))), cutEnd: known((d) => d.slice(0, at)) };
        expect(r.suggest.cut).toEqual({ length: at, knownKept, cut: knownKept.cutStart === knownKept.cutEnd ? null : knownKept.cutStart > knownKept.cutEnd ? 'start' : 'end' });

        // Counted in two parts (as worker threads do) and merged: the same report.
        const cutAt = texts.length === 0 ? 0 : split % (texts.length + 1);
        const length = s === null ? null : s.length;
        const first = new AuditCounts(lexicon, length);
        const second = new AuditCounts(lexicon, length);
        texts.slice(0, cutAt).forEach((t) => first.add(t, undefined));
        texts.slice(cutAt).forEach((t) => second.add(t, undefined));
        const merged = auditReport(first.merge(second.parts()), lexicon, { shape: s as Shape | null });
        expect(merged.windows).toEqual(r.windows);
        expect(merged.suggest.cut).toEqual(r.suggest.cut);
      }),
      { numRuns: 300 },
    );
  });

  it('OovPositions counts positions from both ends and grows to the longest document only', () => {
    const positions = new OovPositions();
    positions.add([1, 5, 1], 1);
    positions.add([7, 1], 1);
    expect([...positions.fromStart.slice(0, 4)]).toEqual([1, 1, 1, 0]);
    expect([...positions.fromEnd.slice(0, 4)]).toEqual([2, 0, 1, 0]);
    expect(positions.keptOov(1, 'end')).toBe(1);
    expect(positions.keptOov(1, 'start')).toBe(2);
    expect(positions.keptOov(10, 'start')).toBe(3);
    expect(positions.fromStart.length).toBe(64);
  });

  it('OovPositions.addPlaces counts as add of the ids does (property)', () => {
    fc.assert(
      fc.property(fc.array(fc.array(fc.constantFrom(1, 1, 2, 3), { maxLength: 90 }), { maxLength: 6 }), (documents) => {
        const byIds = new OovPositions();
        const byPlaces = new OovPositions();
        for (const ids of documents) {
          byIds.add(ids, 1);
          const places = Int32Array.from(ids.flatMap((id, i) => (id === 1 ? [i] : [])));
          byPlaces.addPlaces(places, places.length, ids.length);
        }
        expect([[...byPlaces.fromStart], [...byPlaces.fromEnd]]).toEqual([[...byIds.fromStart], [...byIds.fromEnd]]);
      }),
      { numRuns: 300 },
    );
  });
});
