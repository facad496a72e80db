import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { collect, failure, fixtureFile } from './corpusFixtures.js';

const docsOf = async (content: string | Buffer, options = {}) => {
  const path = await fixtureFile('notes.txt', content);
  return (await collect(readCorpus(path, options))).map((d) => [d.text, d.where.line, d.where.byteOffset]);
};

// Specification: the encoding contract, rule 7 (corpora), in the project's design notes.
describe('readCorpus on .txt', () => {
  it.each([
    ['one document a line', 'a b\nc\n', [['a b', 1, 0], ['c', 2, 4]]],
    ['no final line feed', 'a\nb', [['a', 1, 0], ['b', 2, 2]]],
    ['empty lines are skipped, white-space-only lines are documents', 'a\n\n \n\t\nb\n', [['a', 1, 0], [' ', 3, 3], ['\t', 4, 5], ['b', 5, 7]]],
    ['CRLF: the CR goes, a CR-only line is empty', 'a\r\n\r\nb\r\n', [['a', 1, 0], ['b', 3, 5]]],
    ['only one trailing CR goes', 'a\r\r\n', [['a\r', 1, 0]]],
    ['a BOM is dropped, offsets count it', '\uFEFFhello\nworld', [['hello', 1, 3], ['world', 2, 9]]],
    ['a U+FEFF later in the file stays', 'a\n\uFEFFb', [['a', 1, 0], ['\uFEFFb', 2, 2]]],
    ['unicode', 'naïve café 🎉\n日本語\n', [['naïve café 🎉', 1, 0], ['日本語', 2, 18]]],
  ])('%s', async (_, content, expected) => {
    expect(await docsOf(content)).toEqual(expected);
  });

  it('decodes characters split across chunks of any size', async () => {
    const content = '€🎉é\nx日本\n';
    for (const chunkSize of [1, 2, 3, 4, 5]) {
      expect(await docsOf(content, { chunkSize })).toEqual([['€🎉é', 1, 0], ['x日本', 2, 10]]);
    }
  });

  const bad = Buffer.concat([Buffer.from('fine\nalso fine\nbro'), Buffer.from([0xe2, 0x82]), Buffer.from('ken\nlast\n')]);
  it('fail: BAD_UTF8 names the line and the absolute byte, after the lines before it', async () => {
    const path = await fixtureFile('notes.txt', bad);
    for (const chunkSize of [1 << 20, 4]) {
      const { error, before } = await failure(readCorpus(path, { chunkSize }));
      expect(error.code).toBe('BAD_UTF8');
      expect(error.message).toBe(`${path} line 3: invalid UTF-8 at byte 18; fix the file's encoding or pass --bad-text replace or --bad-text skip`);
      expect(error.where).toEqual({ file: path, line: 3, byteOffset: 18 });
      expect(before.map((d) => d.text)).toEqual(['fine', 'also fine']);
    }
  });

  it.each([
    ['replace', ['fine', 'also fine', 'bro\uFFFDken', 'last'], { replaced: 1, skipped: 0 }],
    ['skip', ['fine', 'also fine', 'last'], { replaced: 0, skipped: 1 }],
  ] as const)('%s: counted', async (badText, expected, counts) => {
    const path = await fixtureFile('notes.txt', bad);
    const reader = readCorpus(path, { badText });
    expect((await collect(reader)).map((d) => d.text)).toEqual(expected);
    expect(reader.stats).toEqual({ documents: expected.length, bytes: bad.length, ...counts });
  });

  it.each([
    ['', 'no documents (the file is empty); put one document on each line'],
    ['\n\r\n\n', 'no documents (the file has no non-empty lines); put one document on each line'],
  ])('EMPTY_CORPUS for %j', async (content, detail) => {
    const path = await fixtureFile('notes.txt', content);
    const { error } = await failure(readCorpus(path));
    expect(error.code).toBe('EMPTY_CORPUS');
    expect(error.message).toBe(`${path}: ${detail}`);
  });

  it('EMPTY_CORPUS when its only document was skipped', async () => {
    const path = await fixtureFile('notes.txt', Buffer.from([0x61, 0xff, 0x0a]));
    const { error } = await failure(readCorpus(path, { badText: 'skip' }));
    expect(error.message).toBe(`${path}: no documents (its only document was left out for invalid UTF-8); fix the file's encoding or pass --bad-text replace`);
  });
});
