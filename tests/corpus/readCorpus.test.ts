import { rm } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { collect, failure, fixture, fixtureFile, thrown } from './corpusFixtures.js';

// Specification: the encoding contract, rule 7 (corpora), in the project's design notes.
describe('readCorpus', () => {
  it.each([
    ['a.csv', 'text\nhi\n', 'csv'],
    ['a.tsv', 'text\nhi\n', 'tsv'],
    ['a.jsonl', '{"text":"hi"}\n', 'jsonl'],
    ['a.ndjson', '{"text":"hi"}\n', 'jsonl'],
    ['a.txt', 'hi\n', 'txt'],
    ['A.TXT', 'hi\n', 'txt'],
  ])('%s is read as %s', async (name, content, kind) => {
    const path = await fixtureFile(name, content);
    const reader = readCorpus(path);
    expect([reader.kind, reader.path]).toEqual([kind, path]);
    expect((await collect(reader)).map((d) => d.text)).toEqual(['hi']);
  });

  it('a folder is a folder corpus, whatever its name', async () => {
    const root = await fixture({ 'x.csv/a.txt': 'hi' });
    expect(readCorpus(join(root, 'x.csv')).kind).toBe('folder');
  });

  it.each([
    ['reviews.xlsx', 'cannot read ".xlsx" files'],
    ['reviews.json', 'cannot read ".json" files'],
    ['README', 'cannot read a file without an extension'],
    ['.csv', 'cannot read a file without an extension'],
  ])('CORPUS_KIND for %s', async (name, what) => {
    const path = await fixtureFile(name, 'x');
    expect(thrown(() => readCorpus(path))).toEqual({
      code: 'CORPUS_KIND',
      message: `${path}: ${what}; a corpus is a .csv, .tsv, .jsonl, .ndjson or .txt file, or a folder with one document per file`,
    });
  });

  it('CORPUS_NOT_FOUND for a missing path', async () => {
    const root = await fixture({});
    for (const path of [join(root, 'nope.csv'), join(root, 'no/such/folder')]) {
      expect(thrown(() => readCorpus(path))).toEqual({ code: 'CORPUS_NOT_FOUND', message: `${path}: no such file or folder; check the path` });
    }
  });

  it.each([
    [{ label: 'stars' }, '--label cannot be used here: a .txt corpus has no fields; leave out --label, or use a .csv, .tsv or .jsonl corpus'],
    [{ badText: 'ignore' as 'skip' }, 'bad-text policy "ignore" is not one of fail, replace, skip'],
    [{ chunkSize: 0 }, 'chunk size 0 is not a whole number of bytes above 0'],
  ])('BAD_OPTION for %j', async (options, detail) => {
    const path = await fixtureFile('notes.txt', 'hi\n');
    expect(thrown(() => readCorpus(path, options))).toEqual({ code: 'BAD_OPTION', message: `${path}: ${detail}` });
  });

  it('reports progress every 1000 documents and at the end', async () => {
    const content = Array.from({ length: 2500 }, (_, i) => `doc ${i}`).join('\n');
    const path = await fixtureFile('many.txt', content);
    const calls: Array<{ bytes: number; documents: number }> = [];
    const reader = readCorpus(path, { onProgress: (p) => calls.push({ ...p }) });
    await collect(reader);
    const bytes = Buffer.byteLength(content);
    expect(calls).toEqual([
      { bytes, documents: 1000 },
      { bytes, documents: 2000 },
      { bytes, documents: 2500 },
    ]);
    expect(reader.stats).toEqual({ documents: 2500, replaced: 0, skipped: 0, bytes });
  });

  it('reports progress every MiB read', async () => {
    const line = `${'x'.repeat(1023)}\n`;
    const path = await fixtureFile('big.txt', line.repeat(3 * 1024)); // 3 MiB, 3072 documents
    const calls: Array<{ bytes: number; documents: number }> = [];
    await collect(readCorpus(path, { chunkSize: 1 << 20, onProgress: (p) => calls.push({ ...p }) }));
    // Each MiB is read just before its first document is handed out (documents 1, 1025, 2049, at 1024
    // a MiB); between those, a report 1000 documents after the last one; and one at the end.
    const MiB = 1 << 20;
    expect(calls).toEqual([
      { bytes: MiB, documents: 1 },
      { bytes: MiB, documents: 1001 },
      { bytes: 2 * MiB, documents: 1025 },
      { bytes: 2 * MiB, documents: 2025 },
      { bytes: 3 * MiB, documents: 2049 },
      { bytes: 3 * MiB, documents: 3049 },
      { bytes: 3 * MiB, documents: 3072 },
    ]);
  });

  it('reads again from the start on each iteration, and stops early on break', async () => {
    const path = await fixtureFile('notes.txt', 'a\nb\nc\n');
    const reader = readCorpus(path);
    for await (const d of reader) if (d.text === 'b') break;
    expect(reader.stats.documents).toBe(2);
    expect((await collect(reader)).map((d) => d.text)).toEqual(['a', 'b', 'c']);
    expect(reader.stats.documents).toBe(3);
  });

  it('IO when the file goes away between opening and reading', async () => {
    const path = await fixtureFile('gone.txt', 'hi\n');
    const reader = readCorpus(path);
    await rm(path);
    const { error } = await failure(reader);
    expect(error.code).toBe('IO');
    expect(error.message).toBe(`${path}: could not read it (ENOENT: no such file or directory); check that it exists and that you may read it`);
  });
});
