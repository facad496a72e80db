import { readdir, readFile, writeFile } from 'node:fs/promises';
import { describe, expect, it, vi } from 'vitest';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

// Nothing is committed unless every document read became one row in every file (common practice
// for a converter: check the counts before publishing the result). The pipeline is made to lose a
// row here, the way a bug or a damaged temporary file would, to see the checks stop the commit.

const lose = vi.hoisted(() => ({ mode: 'none' as 'none' | 'count' | 'row' }));

vi.mock('../../src/pipeline/encodeCorpus.js', async (original) => {
  const real = await original<typeof import('../../src/pipeline/encodeCorpus.js')>();
  return {
    ...real,
    encodeCorpus: async (...args: Parameters<typeof real.encodeCorpus>) => {
      const [documents, lexicon, shape, sink, options] = args;
      let first = true;
      const leaky = {
        row: async (ids: Int32Array, kept: number, label: number | null, key: string, facts: { tokens: number; oovTokens: number }) => {
          if (lose.mode === 'row' && first) {
            first = false;
            return;
          }
          await sink.row(ids, kept, label, key, facts);
        },
      };
      const stats = await real.encodeCorpus(documents, lexicon, shape, leaky, options);
      return lose.mode === 'count' ? { ...stats, documents: stats.documents - 1 } : stats;
    },
  };
});

vi.mock('../../src/pipeline/tallyAndRecord.js', async (original) => {
  const real = await original<typeof import('../../src/pipeline/tallyAndRecord.js')>();
  return {
    ...real,
    tallyAndRecord: async (...args: Parameters<typeof real.tallyAndRecord>) => {
      const recorded = await real.tallyAndRecord(...args);
      return {
        ...recorded,
        encode: async (...more: Parameters<typeof recorded.encode>) => {
          const stats = await recorded.encode(...more);
          return lose.mode === 'count' ? { ...stats, documents: stats.documents - 1 } : stats;
        },
      };
    },
  };
});

const tmp = freshFolderEachTest();

describe('encode commits nothing when rows and documents disagree', () => {
  it.each([
    ['the run counts one document less than it read', 'count', 'out', (out: string) => `${out}: not written: it got 2 rows for 3 documents`],
    ['a row never reaches the .npy files', 'row', 'out', (out: string) => `${out}: not written: it got 2 rows for 3 documents`],
    ['a row never reaches the .jsonl file', 'row', 'rows.jsonl', (out: string) => `${out}: not written: it got 2 rows for 3 documents`],
  ] as const)('%s: exit 1, the old output kept', async (_what, mode, name, message) => {
    await writeFile(tmp.path('m.csv'), 'text\nthe ferry was late\nlovely crossing\nlate late late\n');
    expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4')).code).toBe(0);
    lose.mode = 'none';
    expect((await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path(name))).code).toBe(0);
    const before = name === 'out' ? await readFile(tmp.path('out/ids.npy')) : await readFile(tmp.path(name));
    lose.mode = mode;
    try {
      const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path(name), '--force');
      expect([r.code, r.stderr]).toEqual([1, `lexlock encode: ${message(tmp.path(name))}; this is a lexlock bug, please report it with the command you ran\n`]);
    } finally {
      lose.mode = 'none';
    }
    expect(name === 'out' ? await readFile(tmp.path('out/ids.npy')) : await readFile(tmp.path(name))).toEqual(before);
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'm.csv', name]);
  });
});

describe('build --encode commits neither output when rows and documents disagree', () => {
  it('the rows from its temporary file fall one short: exit 1, old lexicon and folder kept', async () => {
    await writeFile(tmp.path('m.csv'), 'text\nthe ferry was late\nlovely crossing\nlate late late\n');
    lose.mode = 'none';
    expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4', '--encode', tmp.path('out'))).code).toBe(0);
    const before = [await readFile(tmp.path('lex.json')), await readFile(tmp.path('out/ids.npy'))];
    lose.mode = 'count';
    try {
      const r = await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '5', '--encode', tmp.path('out'), '--force');
      expect([r.code, r.stderr]).toEqual([
        1,
        `lexlock build: ${tmp.path('out')}: not written: 2 rows came back from the temporary file of token numbers for 3 documents read; is the disk failing? (otherwise this is a lexlock bug: please report it); ${tmp.path('lex.json')} was not written either\n`,
      ]);
    } finally {
      lose.mode = 'none';
    }
    expect([await readFile(tmp.path('lex.json')), await readFile(tmp.path('out/ids.npy'))]).toEqual(before);
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'm.csv', 'out']);
  });
});
