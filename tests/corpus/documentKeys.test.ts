// Every document carries a key that traces its row back to it (issue 14): the relative path in a
// folder, the line number in .txt, the data-row number in CSV/TSV/JSONL. The expected keys are worked
// out by hand from each file below (blank lines, a quoted field over two lines, a row of bad UTF-8
// left out under --bad-text skip: it still counts).
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { KeyCheck } from '../../src/corpus/KeyCheck.js';
import { collect, failure, fixture, fixtureFile } from './corpusFixtures.js';

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

describe('--key FIELD: the key is that field', () => {
  it.each([
    ['rows.csv', 'id,text\nA-17,late ferry\n"x,1","kind\ncrew"\n', ['A-17', 'x,1']],
    ['rows.tsv', 'text\tid\nlate\t0042\nkind\t42\n', ['0042', '42']],
    // JSONL: a string as it is, a whole number as its decimal digits (JSON.parse reads 7.0 as 7).
    ['lines.jsonl', '{"id":"m-1","text":"a"}\n{"id":7,"text":"b"}\n{"id":-3,"text":"c"}\n{"id":7.0e1,"text":"d"}\n{"id":9007199254740991,"text":"e"}\n', ['m-1', '7', '-3', '70', '9007199254740991']],
  ])('%s: keys %j', async (name, content, keys) => {
    const docs = await collect(readCorpus(await fixtureFile(name, content), { key: 'id' }));
    expect(docs.map((d) => d.key)).toEqual(keys);
  });

  it.each([
    ['a fraction', '1.5', 'a JSON number that is not a whole number up to 2^53 - 1 (9007199254740991) either side'],
    ['a whole number past 2^53 - 1', '9007199254740993', 'a JSON number that is not a whole number up to 2^53 - 1 (9007199254740991) either side'],
    ['true', 'true', 'a JSON boolean'],
    ['an object', '{"n":1}', 'a JSON object'],
    ['an array', '["a"]', 'a JSON array'],
  ])('a JSONL key that is %s is BAD_FIELD_TYPE naming the line', async (_what, value, kind) => {
    const path = await fixtureFile('lines.jsonl', `{"id":"ok","text":"a"}\n{"id":${value},"text":"b"}\n`);
    const { error, before } = await failure(readCorpus(path, { key: 'id' }));
    expect([error.code, error.message, before.length]).toEqual([
      'BAD_FIELD_TYPE',
      `${path} line 2: field "id" is ${kind}; a key is a JSON string or a whole number: store long or odd ids as strings, in quotes`,
      1,
    ]);
  });

  it('a null or missing JSONL key is MISSING_FIELD', async () => {
    const nul = await fixtureFile('lines.jsonl', '{"id":null,"text":"a"}\n');
    expect((await failure(readCorpus(nul, { key: 'id' }))).error.message).toBe(`${nul} line 1: field "id" is null; give every line a key, or leave out --key to number the rows`);
    const missing = await fixtureFile('lines.jsonl', '{"text":"a"}\n');
    expect((await failure(readCorpus(missing, { key: 'id' }))).error.message).toBe(`${missing} line 1: no field "id"; this line has "text"; pass --key to name the key field`);
  });

  it('a CSV without the key column is MISSING_FIELD naming the columns', async () => {
    const path = await fixtureFile('rows.csv', 'text,topic\nlate,delays\n');
    const { error } = await failure(readCorpus(path, { key: 'id' }));
    expect([error.code, error.message]).toEqual(['MISSING_FIELD', `${path} line 1: no column "id"; the columns are "text", "topic"; pass --key to name the key column`]);
  });

  it('an empty key is refused naming the place', async () => {
    const path = await fixtureFile('rows.csv', 'id,text\na,late\n,kind crew\n');
    const { error, before } = await failure(readCorpus(path, { key: 'id' }));
    expect([error.code, error.message, before.length]).toEqual([
      'BAD_FIELD_TYPE',
      `${path} line 3 (row 2): field "id" is empty; every document needs a key of its own: fill it in, or leave out --key to number the rows`,
      1,
    ]);
  });

  it.each([
    ['rows.csv', 'id,text\nA-17,late\n\n"B","two\nlines"\nA-17,again\n', 'line 6 (row 3)', 'line 2'],
    ['lines.jsonl', '{"id":"7","text":"a"}\n\n{"id":8,"text":"b"}\n{"id":7,"text":"c"}\n', 'line 4', 'line 1'],
  ])('%s: a key seen before is DUPLICATE_KEY naming both places', async (name, content, second, first) => {
    const path = await fixtureFile(name, content);
    const { error, before } = await failure(readCorpus(path, { key: 'id' }));
    const key = name.endsWith('.csv') ? 'A-17' : '7';
    expect([error.code, error.message, before.length]).toEqual([
      'DUPLICATE_KEY',
      `${path} ${second}: key "${key}" (field "id") is also the key of ${path} ${first}; keys must be unique, so that every row traces back to one document: fix one of the two, or leave out --key to number the rows`,
      2,
    ]);
    expect(error.where).toMatchObject({ file: path, field: 'id' });
  });

  it('each reading checks its keys afresh', async () => {
    const reader = readCorpus(await fixtureFile('rows.csv', 'id,text\na,x\nb,y\n'), { key: 'id' });
    expect((await collect(reader)).map((d) => d.key)).toEqual(['a', 'b']);
    expect((await collect(reader)).map((d) => d.key)).toEqual(['a', 'b']);
  });

  it.each([
    ['notes.txt', 'a .txt corpus has no fields; its keys are line numbers'],
    ['folder', 'a folder corpus keys its documents by their paths below the folder'],
  ])('%s: --key is refused (BAD_OPTION, a usage error)', async (name, why) => {
    const path = name === 'folder' ? await fixture({ 'a.txt': 'x' }) : await fixtureFile(name, 'x\n');
    let caught: unknown;
    try {
      readCorpus(path, { key: 'id' });
    } catch (e) {
      caught = e;
    }
    expect(caught).toMatchObject({ code: 'BAD_OPTION', message: `${path}: --key cannot be used here: ${why}; leave out --key, or use a .csv, .tsv or .jsonl corpus` });
  });
});

describe('KeyCheck', () => {
  it('finds a key seen before past the first Map (a Map holds at most 2^24 entries; here 2 a Map)', () => {
    const keys = new KeyCheck('id', 2);
    for (const [i, key] of ['a', 'b', 'c', 'd', 'e'].entries()) keys.check({ text: '', key, where: { file: 'f.csv', line: i + 2 } });
    let caught: unknown;
    try {
      keys.check({ text: '', key: 'a', where: { file: 'f.csv', line: 9, row: 8 } });
    } catch (e) {
      caught = e;
    }
    expect(caught).toMatchObject({ code: 'DUPLICATE_KEY', message: 'f.csv line 9 (row 8): key "a" (field "id") is also the key of f.csv line 2; keys must be unique, so that every row traces back to one document: fix one of the two, or leave out --key to number the rows' });
  });
});
