import { describe, expect, it } from 'vitest';
import { serializeLexicon } from '../../src/artifact/serializeLexicon.js';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { freeze } from '../../src/lexicon/freeze.js';
import { encodeCorpus } from '../../src/pipeline/encodeCorpus.js';
import { tallyCorpus } from '../../src/pipeline/tallyCorpus.js';
import { resolveRules } from '../../src/rules/TextRules.js';
import { Tally } from '../../src/tally/Tally.js';

const demo = new URL('../../corpora-demo/ferry-messages.csv', import.meta.url).pathname;
const rules = resolveRules();

describe('worker threads', () => {
  it('tally to the same lexicon, byte for byte apart from the build time, on 1, 2 and 3 threads', async () => {
    const texts: string[] = [];
    for (const threads of [1, 2, 3]) {
      const { tally, snippets } = await tallyCorpus(readCorpus(demo, { label: 'topic' }), rules, { threads });
      const lexicon = freeze(tally, { cap: 1500, snippets, now: new Date(0) });
      texts.push(serializeLexicon(lexicon));
    }
    expect(texts[1]).toBe(texts[0]);
    expect(texts[2]).toBe(texts[0]);
  });

  it('tally to the same lexicon when threads send their counts several times (more distinct tokens than a thread keeps)', async () => {
    const { KEPT_TYPES } = await import('../../src/workers/batchHandler.js');
    // Letters only, so each word is one token: a, b, ..., z, ba, bb, ...
    const word = (i: number): string => (i < 26 ? '' : word(Math.floor(i / 26))) + String.fromCharCode(97 + (i % 26));
    // 3,000 documents of 100 words: every document shares 20 common words, the rest are its own.
    const docs = Array.from({ length: 3000 }, (_, d) => Array.from({ length: 100 }, (_, k) => word(k < 20 ? k : 20 + d * 80 + k)).join(' '));
    const lexicons: string[] = [];
    for (const threads of [1, 2]) {
      const { tally, snippets } = await tallyCorpus(docs, rules, { threads });
      expect(tally.types).toBe(20 + 3000 * 80);
      lexicons.push(serializeLexicon(freeze(tally, { cap: 5000, snippets, now: new Date(0) })));
    }
    expect(20 + 3000 * 80).toBeGreaterThan(2 * KEPT_TYPES);
    expect(lexicons[1]).toBe(lexicons[0]);
  });

  it('encode the same rows in the same order, with the same keys, on 1 and 2 threads', async () => {
    const { tally } = await tallyCorpus(readCorpus(demo, { label: 'topic' }), rules);
    const lexicon = freeze(tally, { cap: 800 });
    const shape = { length: 32, pad: 'start', cut: 'end' } as const;
    const runs: Array<{ rows: Array<Array<number | string>>; stats: unknown }> = [];
    for (const threads of [1, 2]) {
      const rows: Array<Array<number | string>> = [];
      const stats = await encodeCorpus(readCorpus(demo, { label: 'topic', key: 'id' }), lexicon, shape, { row: (ids, kept, label, key) => void rows.push([...ids, kept, label ?? -2, key]) }, { threads });
      runs.push({ rows, stats });
    }
    expect(runs[0]!.rows).toHaveLength(4000);
    expect([runs[0]!.rows[0]!.at(-1), runs[0]!.rows[3999]!.at(-1)]).toEqual(['m0001', 'm4000']);
    expect(runs[1]).toEqual(runs[0]);
  });

  it('key documents without keys by their place in the stream, from 1, on 1 and 2 threads', async () => {
    const lexicon = freeze(Tally.fromTexts(['late ferry'], rules));
    const texts = Array.from({ length: 5000 }, (_, i) => (i % 2 === 0 ? `late ${i}` : { text: `ferry ${i}`, label: 'x' }));
    for (const threads of [1, 2]) {
      const keys: string[] = [];
      await encodeCorpus(texts, lexicon, null, { row: (_ids, _kept, _label, key) => void keys.push(key) }, { threads });
      expect(keys).toEqual(Array.from({ length: 5000 }, (_, i) => String(i + 1)));
    }
  });
});

describe('audit on worker threads', () => {
  it('gives the same report on 1 and 2 threads', async () => {
    const { auditOnThreads } = await import('../../src/pipeline/auditOnThreads.js');
    const { tally } = await tallyCorpus(readCorpus(demo, { label: 'topic' }), rules);
    const lexicon = freeze(tally, { cap: 600, shape: { length: 40, pad: 'end', cut: 'end' } });
    const one = await auditOnThreads(readCorpus(demo, { label: 'topic' }), lexicon, { threads: 1 });
    const two = await auditOnThreads(readCorpus(demo, { label: 'topic' }), lexicon, { threads: 2 });
    expect(one.oovTokens).toBeGreaterThan(0);
    expect(JSON.stringify(two)).toBe(JSON.stringify(one));
  });
});
