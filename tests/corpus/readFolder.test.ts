import { symlink } from 'node:fs/promises';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { collect, failure, fixture, thrown } from './corpusFixtures.js';

// Specification: the encoding contract, rule 7 (corpora), in the project's design notes.
describe('readCorpus on a folder', () => {
  const files = {
    'pos/b.txt': 'good too',
    'pos/a.txt': '\uFEFFgood', // the BOM goes
    'pos-extra/z.txt': 'dash', // '-' (0x2D) sorts before '/' (0x2F)
    'neg/deeper/y.txt': 'deep bad', // label: the first folder under the root
    'neg/x.txt': 'bad\r\nline two\n', // the file as it is, line breaks included
    'Zeta/q.txt': 'capital', // 'Z' (0x5A) sorts before every lower-case letter
    'é/1.txt': 'accent', // U+00E9 sorts after ASCII
    'root.txt': 'no label',
    '.hidden.txt': 'hidden',
    '.git/config': 'hidden folder',
    'pos/.draft.txt': 'hidden file',
    'neg/.cache/x.txt': 'hidden folder below',
    'empty.txt': '',
  };

  it('reads every regular, non-hidden file in JavaScript string order of its relative path', async () => {
    const root = await fixture(files);
    await symlink(join(root, 'pos/a.txt'), join(root, 'pos/link.txt')); // symbolic links are left out
    await symlink(join(root, 'neg'), join(root, 'linked-folder'));
    const reader = readCorpus(root);
    const docs = await collect(reader);
    // Expected order worked out by hand from UTF-16 code units (the order of JavaScript's `<`).
    expect(docs.map((d) => [d.where.file, d.text, d.label])).toEqual([
      [`${root}/Zeta/q.txt`, 'capital', 'Zeta'],
      [`${root}/empty.txt`, '', undefined],
      [`${root}/neg/deeper/y.txt`, 'deep bad', 'neg'],
      [`${root}/neg/x.txt`, 'bad\r\nline two\n', 'neg'],
      [`${root}/pos-extra/z.txt`, 'dash', 'pos-extra'],
      [`${root}/pos/a.txt`, 'good', 'pos'],
      [`${root}/pos/b.txt`, 'good too', 'pos'],
      [`${root}/root.txt`, 'no label', undefined],
      [`${root}/é/1.txt`, 'accent', 'é'],
    ]);
    expect(docs.every((d) => Object.keys(d.where).join() === 'file')).toBe(true);
    expect(reader.kind).toBe('folder');
    const read = ['Zeta/q.txt', 'empty.txt', 'neg/deeper/y.txt', 'neg/x.txt', 'pos-extra/z.txt', 'pos/a.txt', 'pos/b.txt', 'root.txt', 'é/1.txt'] as const;
    const bytes = read.reduce((n, f) => n + Buffer.byteLength(files[f]), 0);
    expect(reader.stats).toEqual({ documents: 9, replaced: 0, skipped: 0, bytes });
  });

  it('keeps the folder path as given, a trailing slash included', async () => {
    const root = await fixture({ 'a/1.txt': 'x' });
    expect((await collect(readCorpus(`${root}/`))).map((d) => d.where.file)).toEqual([`${root}/a/1.txt`]);
  });

  const bad = { 'a/ok.txt': 'fine', 'b/bad.txt': Buffer.concat([Buffer.from('one\ntw'), Buffer.from([0xff]), Buffer.from('o')]), 'c/ok.txt': 'also fine' };
  it('fail: BAD_UTF8 names the file, the line and the byte', async () => {
    const root = await fixture(bad);
    const { error, before } = await failure(readCorpus(root));
    expect(error.message).toBe(`${root}/b/bad.txt line 2: invalid UTF-8 at byte 6; fix the file's encoding or pass --bad-text replace or --bad-text skip`);
    expect(error.where).toEqual({ file: `${root}/b/bad.txt`, line: 2, byteOffset: 6 });
    expect(before.map((d) => d.text)).toEqual(['fine']);
  });

  it.each([
    ['replace', ['fine', 'one\ntw\uFFFDo', 'also fine'], 1, 0],
    ['skip', ['fine', 'also fine'], 0, 1],
  ] as const)('%s: counted', async (badText, expected, replaced, skipped) => {
    const root = await fixture(bad);
    const reader = readCorpus(root, { badText });
    expect((await collect(reader)).map((d) => d.text)).toEqual(expected);
    expect(reader.stats.replaced).toBe(replaced);
    expect(reader.stats.skipped).toBe(skipped);
  });

  it('EMPTY_CORPUS when only hidden files are there', async () => {
    const root = await fixture({ '.a': 'x', '.b/c.txt': 'y' });
    const { error } = await failure(readCorpus(root));
    expect(error.code).toBe('EMPTY_CORPUS');
    expect(error.message).toBe(
      `${root}: no documents (no regular, non-hidden files below it); put one document in each file, in subfolders named after the labels if there are labels`,
    );
  });

  it('refuses --label: the labels are the subfolders', async () => {
    const root = await fixture({ 'a/1.txt': 'x' });
    expect(thrown(() => readCorpus(root, { label: 'stars' }))).toEqual({
      code: 'BAD_OPTION',
      message: `${root}: --label cannot be used here: a folder corpus takes its labels from its subfolders; leave out --label, or use a .csv, .tsv or .jsonl corpus`,
    });
  });
});
