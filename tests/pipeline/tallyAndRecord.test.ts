import { readdir } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { encodeCorpus, type RowSink } from '../../src/pipeline/encodeCorpus.js';
import { tallyAndRecord } from '../../src/pipeline/tallyAndRecord.js';
import { tallyCorpus } from '../../src/pipeline/tallyCorpus.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { freshFolderEachTest } from '../helpers/cli.js';

const demo = new URL('../../corpora-demo/ferry-messages.csv', import.meta.url).pathname;
const rules = resolveRules();
const tmp = freshFolderEachTest();

function collecting(): { rows: Array<Array<number | string>>; sink: RowSink } {
  const rows: Array<Array<number | string>> = [];
  return { rows, sink: { row: (ids, kept, label, key) => void rows.push([...ids, kept, label ?? -2, key]) } };
}

// Common practice: encoding from kept token numbers must give what encoding the corpus again gives.
describe('tallyAndRecord', () => {
  it.each([
    ['fixed length, zeros at the start, 1 thread', { length: 24, pad: 'start', cut: 'start' } as const, 1],
    ['variable length, 1 thread', null, 1],
    ['fixed length, 2 threads', { length: 24, pad: 'end', cut: 'end' } as const, 2],
    ['variable length, 3 threads', null, 3],
  ])('tallies as tallyCorpus does and encodes the same rows as encodeCorpus (%s), then removes its spill', async (_name, shape, threads) => {
    const recorded = await tallyAndRecord(readCorpus(demo, { label: 'topic', key: 'id' }), rules, tmp.path('spill'), { threads });
    const plain = await tallyCorpus(readCorpus(demo, { label: 'topic' }), rules);
    const lexicon = freeze(recorded.tally, { cap: 700, snippets: recorded.snippets, shape, now: new Date(0) });
    expect(serializeLexicon(lexicon)).toBe(serializeLexicon(freeze(plain.tally, { cap: 700, snippets: plain.snippets, shape, now: new Date(0) })));

    const fromSpill = collecting();
    const again = collecting();
    const statsFromSpill = await recorded.encode(lexicon, shape, fromSpill.sink);
    const stats = await encodeCorpus(readCorpus(demo, { label: 'topic', key: 'id' }), lexicon, shape, again.sink);
    expect(fromSpill.rows).toHaveLength(4000);
    expect([fromSpill.rows[0]!.at(-1), fromSpill.rows[3999]!.at(-1)]).toEqual(['m0001', 'm4000']);
    expect(fromSpill.rows).toEqual(again.rows);
    expect(statsFromSpill).toEqual(stats);
    expect(stats.oovTokens).toBeGreaterThan(0);
    expect(await readdir(tmp.dir)).toEqual([]);
  });

  it('maps the numbers of worker threads that send their counts several times (more distinct tokens than a thread keeps)', async () => {
    const { KEPT_TYPES } = await import('../../src/workers/batchHandler.js');
    // Letters only, so each word is one token: a, b, ..., z, ba, bb, ...
    const word = (i: number): string => (i < 26 ? '' : word(Math.floor(i / 26))) + String.fromCharCode(97 + (i % 26));
    // 3,000 documents of 100 words: 20 common to all, 80 of their own; every third one labelled.
    const docs = Array.from({ length: 3000 }, (_, d) => ({ text: Array.from({ length: 100 }, (_, k) => word(k < 20 ? k : 20 + d * 80 + k)).join(' '), label: d % 3 === 0 ? `l${d % 4}` : undefined }));
    expect(20 + 3000 * 80).toBeGreaterThan(2 * KEPT_TYPES);
    const rows: Array<Array<Array<number | string>>> = [];
    for (const threads of [1, 2]) {
      const recorded = await tallyAndRecord(docs, rules, tmp.path(`spill-${threads}`), { threads });
      const lexicon = freeze(recorded.tally, { cap: 100_000, snippets: recorded.snippets, now: new Date(0) });
      const out = collecting();
      await recorded.encode(lexicon, null, out.sink);
      const again = collecting();
      await encodeCorpus(docs, lexicon, null, again.sink);
      expect(out.rows).toEqual(again.rows);
      rows.push(out.rows);
    }
    expect(rows[1]).toEqual(rows[0]);
  });

  it('removes its spill when discarded, and when the corpus fails midway', async () => {
    const recorded = await tallyAndRecord(['a b', 'b c'], rules, tmp.path('spill'));
    expect(await readdir(tmp.dir)).toEqual(['spill']);
    await recorded.discard();
    expect(await readdir(tmp.dir)).toEqual([]);
    async function* failing(): AsyncGenerator<string> {
      yield 'a b';
      throw new Error('the disk went away');
    }
    await expect(tallyAndRecord(failing(), rules, tmp.path('spill'))).rejects.toThrow('the disk went away');
    expect(await readdir(tmp.dir)).toEqual([]);
  });
});
