// Every document carries a key that traces its row back to it (issue 14): the relative path in a
// folder, the line number in .txt, the data-row number in CSV/TSV/JSONL. The expected keys are worked
// out by hand from each file below (blank lines, a quoted field over two lines, a row of bad UTF-8
// left out under --bad-text skip: it still counts).
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { collect, fixture, fixtureFile } from './corpusFixtures.js';

const BAD = Buffer.from([0x66, 0xff, 0x0a]); // "f", an invalid byte, LF

describe('document keys', () => {
  it.each([
    ['notes.txt', Buffer.concat([Buffer.from('first\n\nthird\n'), BAD, Buffer.from('fifth\r\n\nseventh')]), ['1', '3', '5', '7']],
    ['rows.csv', Buffer.concat([Buffer.from('text,label\nlate ferry,delays\n\n"two\nlines",praise\n'), Buffer.from('x'), BAD, Buffer.from('last,delays\n')]), ['1', '2', '4']],
    ['rows.tsv', Buffer.from('text\tlabel\nlate\tdelays\n\nkind crew\tpraise\n'), ['1', '2']],
    ['lines.jsonl', Buffer.concat([Buffer.from('{"text":"a","label":"x"}\n  \n'), Buffer.from('{"text":"'), BAD, Buffer.from('{"text":"c","label":"y"}\n')]), ['1', '3']],
  ])('%s: keys %j', async (name, bytes, keys) => {
    const labelled = !name.endsWith('.txt');
    const path = await fixtureFile(name, bytes);
    const docs = await collect(readCorpus(path, { badText: 'skip', ...(labelled ? { label: 'label' } : {}) }));
    expect(docs.map((d) => d.key)).toEqual(keys);
  });

  it('a folder: the path below the folder, with /, in reading order', async () => {
    const dir = await fixture({ 'praise/b.txt': 'kind crew', 'delays/2024/a.txt': 'late', 'top.txt': 'no label' });
    const docs = await collect(readCorpus(dir));
    expect(docs.map((d) => [d.key, d.label])).toEqual([
      ['delays/2024/a.txt', 'delays'],
      ['praise/b.txt', 'praise'],
      ['top.txt', undefined],
    ]);
  });
});
