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

function collecting(): { rows: number[][]; sink: RowSink } {
  const rows: number[][] = [];
  return { rows, sink: { row: (ids, kept, label) => void rows.push([...ids, kept, label ?? -2]) } };
}

// Common practice: encoding from kept token numbers must give what encoding the corpus again gives.
describe('tallyAndRecord', () => {
  it.each([
    ['fixed length, pre padding', { length: 24, pad: 'pre', cut: 'pre' } as const],
    ['variable length', null],
  ])('tallies as tallyCorpus does and encodes the same rows as encodeCorpus (%s), then removes its spill', async (_name, shape) => {
    const recorded = await tallyAndRecord(readCorpus(demo, { label: 'topic' }), rules, tmp.path('spill'));
    const plain = await tallyCorpus(readCorpus(demo, { label: 'topic' }), rules);
    const lexicon = freeze(recorded.tally, { cap: 700, snippets: recorded.snippets, shape, now: new Date(0) });
    expect(serializeLexicon(lexicon)).toBe(serializeLexicon(freeze(plain.tally, { cap: 700, snippets: plain.snippets, shape, now: new Date(0) })));

    const fromSpill = collecting();
    const again = collecting();
    const statsFromSpill = await recorded.encode(lexicon, shape, fromSpill.sink);
    const stats = await encodeCorpus(readCorpus(demo, { label: 'topic' }), lexicon, shape, again.sink);
    expect(fromSpill.rows).toHaveLength(4000);
    expect(fromSpill.rows).toEqual(again.rows);
    expect(statsFromSpill).toEqual(stats);
    expect(stats.oovTokens).toBeGreaterThan(0);
    expect(await readdir(tmp.dir)).toEqual([]);
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
