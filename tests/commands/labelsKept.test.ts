import { mkdir, readdir, readFile, writeFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import { cli, freshFolderEachTest } from '../helpers/cli.js';

// Issue 14, point 2: labels are never dropped silently. A lexicon that has labels, used on a corpus
// read without any, used to write rows with no labels and exit 0. Now encode and audit stop (exit 1)
// naming --label FIELD, unless --no-labels says so; nothing is written.

const tmp = freshFolderEachTest();

/** A lexicon built from a folder (labels from its subfolders: no label field) and a CSV with a label column. */
async function folderLexiconAndCsv(): Promise<void> {
  await mkdir(tmp.path('mail/delays'), { recursive: true });
  await mkdir(tmp.path('mail/praise'), { recursive: true });
  await writeFile(tmp.path('mail/delays/a.txt'), 'the ferry was late again');
  await writeFile(tmp.path('mail/praise/b.txt'), 'lovely crossing friendly crew');
  const built = await cli('build', tmp.path('mail'), '-o', tmp.path('lex.json'), '--length', '4');
  expect([built.code, built.stderr]).toEqual([0, '']);
  await writeFile(tmp.path('held.csv'), 'text,topic\nlate again,delays\nfriendly crew,praise\n');
}

describe('a lexicon with labels and a corpus read without them', () => {
  it('encode stops with exit 1 naming --label FIELD, and writes nothing', async () => {
    await folderLexiconAndCsv();
    const r = await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'));
    expect([r.code, r.stdout]).toEqual([1, '']);
    expect(r.stderr).toBe(
      `lexlock encode: ${tmp.path('held.csv')}: ${tmp.path('lex.json')} has labels (delays, praise) but this corpus is read without them; ` +
        'name the label column with --label FIELD, or pass --no-labels to write rows without labels\n',
    );
    expect((await readdir(tmp.dir)).sort()).toEqual(['held.csv', 'lex.json', 'mail']);
  });

  it('encode --label topic keeps them; --no-labels writes rows without them on purpose', async () => {
    await folderLexiconAndCsv();
    const labelled = await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('a.jsonl'), '--label', 'topic');
    expect([labelled.code, labelled.stderr]).toEqual([0, '']);
    const rows = (await readFile(tmp.path('a.jsonl'), 'utf8')).trim().split('\n').map((l) => JSON.parse(l) as { label?: number });
    expect(rows.map((row) => row.label)).toEqual([0, 1]);
    const plain = await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('b.jsonl'), '--no-labels');
    expect([plain.code, plain.stderr]).toEqual([0, '']);
    const unlabelled = (await readFile(tmp.path('b.jsonl'), 'utf8')).trim().split('\n').map((l) => JSON.parse(l) as { label?: number });
    expect(unlabelled.map((row) => row.label)).toEqual([undefined, undefined]);
  });

  it.each([
    ['a .txt corpus', 'plain.txt', 'late again\nfriendly crew\n', 'a .txt corpus has no labels; encode a .csv, .tsv or .jsonl corpus with --label FIELD, or pass --no-labels to write rows without labels'],
    ['a folder without subfolders', 'flat', null, 'no document of this corpus has one (a folder corpus takes its labels from its subfolders); put the documents in folders named after their labels, or encode a .csv, .tsv or .jsonl corpus with --label FIELD, or pass --no-labels to write rows without labels'],
  ])('encode of %s stops the same way', async (_what, name, content, advice) => {
    await folderLexiconAndCsv();
    if (content === null) {
      await mkdir(tmp.path(name));
      await writeFile(tmp.path(`${name}/one.txt`), 'late again');
    } else {
      await writeFile(tmp.path(name), content);
    }
    const r = await cli('encode', tmp.path(name), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'));
    expect([r.code, r.stdout]).toEqual([1, '']);
    expect(r.stderr).toBe(`lexlock encode: ${tmp.path(name)}: ${tmp.path('lex.json')} has labels (delays, praise) but ${advice}\n`);
    expect(await readdir(tmp.dir)).not.toContain('out');
    const ok = await cli('encode', tmp.path(name), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--no-labels');
    expect([ok.code, ok.stderr]).toEqual([0, '']);
    expect(JSON.parse(await readFile(tmp.path('out/manifest.json'), 'utf8')).files.labels).toBeNull();
  });

  it('audit stops the same way, and --no-labels audits without labels', async () => {
    await folderLexiconAndCsv();
    const r = await cli('audit', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '--json');
    expect([r.code, r.stdout]).toEqual([1, '']);
    expect(r.stderr).toBe(
      `lexlock audit: ${tmp.path('held.csv')}: ${tmp.path('lex.json')} has labels (delays, praise) but this corpus is read without them; ` +
        'name the label column with --label FIELD, or pass --no-labels to audit without labels\n',
    );
    const ok = await cli('audit', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '--json', '--no-labels');
    expect([ok.code, ok.stderr]).toEqual([0, '']);
    expect(JSON.parse(ok.stdout).documents).toBe(2);
  });

  it('--no-labels with --label is a usage error (exit 2)', async () => {
    await folderLexiconAndCsv();
    const r = await cli('encode', tmp.path('held.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('out'), '--label', 'topic', '--no-labels');
    expect([r.code, r.stderr]).toEqual([2, 'lexlock encode: --no-labels and --label exclude each other: --label names the labels to keep, --no-labels leaves them out\n']);
  });

  it('labels the lexicon does not know keep today\'s rule: id -1, counted', async () => {
    await folderLexiconAndCsv();
    await writeFile(tmp.path('odd.csv'), 'text,topic\nlate again,refunds\n');
    const r = await cli('encode', tmp.path('odd.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path('odd.jsonl'), '--label', 'topic');
    expect([r.code, r.stderr]).toEqual([0, '']);
    expect(r.stdout).toContain('1 labelled documents, 1 with a label the lexicon lacks (id -1)');
    expect(JSON.parse(await readFile(tmp.path('odd.jsonl'), 'utf8')).label).toBe(-1);
  });
});

describe('-o names a .jsonl file or a folder', () => {
  it.each(['out.json', 'out.npy', 'OUT.NPY'])('encode -o %s is refused (exit 2) and nothing is made', async (name) => {
    await writeFile(tmp.path('m.csv'), 'text\nlate again\n');
    expect((await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4')).code).toBe(0);
    const r = await cli('encode', tmp.path('m.csv'), '--lexicon', tmp.path('lex.json'), '-o', tmp.path(name));
    expect([r.code, r.stdout]).toEqual([2, '']);
    expect(r.stderr).toBe(`lexlock encode: --output: "${tmp.path(name)}" ends in ${name.slice(name.lastIndexOf('.'))}, but encoded outputs are a .jsonl file or a folder (of .npy files, a manifest and keys); name a .jsonl file, or a folder without that ending\n`);
    expect((await readdir(tmp.dir)).sort()).toEqual(['lex.json', 'm.csv']);
  });

  it('build --encode out.npy is refused the same way, before anything is counted', async () => {
    await writeFile(tmp.path('m.csv'), 'text\nlate again\n');
    const r = await cli('build', tmp.path('m.csv'), '-o', tmp.path('lex.json'), '--length', '4', '--encode', tmp.path('out.npy'));
    expect([r.code, r.stdout]).toEqual([2, '']);
    expect(r.stderr).toBe(`lexlock build: --encode: "${tmp.path('out.npy')}" ends in .npy, but encoded outputs are a .jsonl file or a folder (of .npy files, a manifest and keys); name a .jsonl file, or a folder without that ending\n`);
    expect((await readdir(tmp.dir)).sort()).toEqual(['m.csv']);
  });
});
