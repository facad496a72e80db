import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { readCorpus } from '../../src/corpus/readCorpus.js';
import { collect, failure, fixtureFile, tempFolder, texts } from './corpusFixtures.js';
import { writeFile } from 'node:fs/promises';
import { join } from 'node:path';

const places = (docs: Awaited<ReturnType<typeof collect>>) => docs.map((d) => [d.where.line, d.where.row, d.where.byteOffset]);

describe('readCorpus on .csv: RFC 4180 section 2 (rules quoted from memory)', () => {
  // Rule 1: each record on its own line, ended by CRLF. Rule 2: the last record may lack the line break.
  it.each([
    ['rule 1: CRLF after every record', 'text,b,c\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n'],
    ['rule 2: no line break after the last record', 'text,b,c\r\naaa,bbb,ccc\r\nzzz,yyy,xxx'],
    ['LF line ends (common practice on Unix)', 'text,b,c\naaa,bbb,ccc\nzzz,yyy,xxx\n'],
  ])('%s', async (_, content) => {
    const path = await fixtureFile('rfc.csv', content);
    const docs = await collect(readCorpus(path, { label: 'c' }));
    expect(texts(docs)).toEqual([
      ['aaa', 'ccc'],
      ['zzz', 'xxx'],
    ]);
    expect(places(docs)).toEqual([
      [2, 1, content.indexOf('aaa')],
      [3, 2, content.indexOf('zzz')],
    ]);
  });

  // Rule 3: an optional header line with the same format; its example repeats one name three times,
  // which lexlock refuses, since a column must be named unambiguously.
  it('rule 3: the RFC header example (field_name three times) is a header lexlock refuses', async () => {
    const path = await fixtureFile('rfc.csv', 'field_name,field_name,field_name\r\naaa,bbb,ccc\r\nzzz,yyy,xxx\r\n');
    const { error } = await failure(readCorpus(path, { text: 'field_name' }));
    expect(error.code).toBe('CSV_BAD_HEADER');
    expect(error.message).toBe(`${path} line 1: column "field_name" appears twice (columns 1 and 2); give each column its own name`);
  });

  // Rule 4: spaces are part of a field and must not be ignored.
  it('rule 4: spaces belong to the field, a first field of spaces only included', async () => {
    const path = await fixtureFile('rfc.csv', 'text,b\n aaa , bbb \n  ,x\n');
    expect(texts(await collect(readCorpus(path, { label: 'b' })))).toEqual([
      [' aaa ', ' bbb '],
      ['  ', 'x'],
    ]);
  });

  // Rule 5: fields may or may not be enclosed in double quotes.
  it('rule 5: quoted and unquoted fields mix', async () => {
    const path = await fixtureFile('rfc.csv', 'text,b,c\r\n"aaa","bbb","ccc"\r\nzzz,yyy,xxx\r\n');
    expect(texts(await collect(readCorpus(path, { label: 'b' })))).toEqual([
      ['aaa', 'bbb'],
      ['zzz', 'yyy'],
    ]);
  });

  // Rule 6: fields holding line breaks (CRLF), double quotes or commas are enclosed in double quotes.
  it('rule 6: a quoted CRLF stays in the field and the next record is on line 4', async () => {
    const content = 'text,b,c\r\n"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx\r\n';
    const path = await fixtureFile('rfc.csv', content);
    const docs = await collect(readCorpus(path, { text: 'b' }));
    expect(docs.map((d) => d.text)).toEqual(['b\r\nbb', 'yyy']);
    expect(places(docs)).toEqual([
      [2, 1, 10],
      [4, 2, content.indexOf('zzz')],
    ]);
  });

  it('rule 6: an embedded comma and an embedded LF', async () => {
    const content = 'text,label\n"hello, world",a\n"two\nlines\nhere",b\nlast,c\n';
    const path = await fixtureFile('rfc.csv', content);
    const docs = await collect(readCorpus(path, { label: 'label' }));
    expect(texts(docs)).toEqual([
      ['hello, world', 'a'],
      ['two\nlines\nhere', 'b'],
      ['last', 'c'],
    ]);
    expect(places(docs)).toEqual([
      [2, 1, 11],
      [3, 2, 28],
      [6, 3, content.indexOf('last')],
    ]);
  });

  // Rule 7: a double quote inside a quoted field is escaped by another double quote.
  it('rule 7: "" inside quotes is one quote', async () => {
    const path = await fixtureFile('rfc.csv', 'text,b,c\r\n"aaa","b""bb","ccc"\r\n');
    expect(texts(await collect(readCorpus(path, { text: 'b', label: 'c' })))).toEqual([['b"bb', 'ccc']]);
  });
});

// Specification: the encoding contract, rule 7 (corpora), in the project's design notes.
describe('readCorpus on .csv and .tsv', () => {
  it.each([
    ['a BOM is dropped, offsets still count it', 'x.csv', '\uFEFFtext,label\nhi,1\n', {}, [['hi', undefined]], [[2, 1, 14]]],
    ['CRLF throughout', 'x.csv', 'text,label\r\nhi,1\r\nyo,2\r\n', { label: 'label' }, [['hi', '1'], ['yo', '2']], [[2, 1, 12], [3, 2, 18]]],
    ['blank lines are not rows', 'x.csv', '\ntext\n\n\nhi\n   \nyo\n\n', {}, [['hi', undefined], ['yo', undefined]], [[5, 1, 8], [7, 2, 15]]],
    ['a lone CR ends a record (old Mac line ends)', 'x.csv', 'text\rhi\ryo', {}, [['hi', undefined], ['yo', undefined]], [[1, 1, 5], [1, 2, 8]]],
    ['an empty quoted text is a document', 'x.csv', 'text,label\n"",a\n', { label: 'label' }, [['', 'a']], [[2, 1, 11]]],
    ['tab-separated, commas and quotes inside', 'x.tsv', 'label\ttext\na\t"say ""hi"", then\tgo"\nb\tplain, with comma\n', { label: 'label' }, [['say "hi", then\tgo', 'a'], ['plain, with comma', 'b']], [[2, 1, 11], [3, 2, 35]]],
    ['a .CSV extension in capitals', 'X.CSV', 'text\nhi\n', {}, [['hi', undefined]], [[2, 1, 5]]],
    ['other text column', 'x.csv', 'id,body\n1,hi\n', { text: 'body', label: 'id' }, [['hi', '1']], [[2, 1, 8]]],
  ])('%s', async (_, name, content, options, expected, where) => {
    const path = await fixtureFile(name, content);
    const docs = await collect(readCorpus(path, options));
    expect(texts(docs)).toEqual(expected);
    expect(places(docs)).toEqual(where);
    expect(docs.every((d) => d.where.file === path)).toBe(true);
  });

  it.each(['constructor', '__proto__', 'toString', 'hasOwnProperty'])('a column named %s is an ordinary column', async (name) => {
    const path = await fixtureFile('names.csv', `${name},other\nthe text,x\n`);
    expect(texts(await collect(readCorpus(path, { text: name, label: 'other' })))).toEqual([['the text', 'x']]);
    const labelled = await collect(readCorpus(path, { text: 'other', label: name }));
    expect(texts(labelled)).toEqual([['x', 'the text']]);
    const { error } = await failure(readCorpus(path, { text: 'valueOf' }));
    expect(error.message).toBe(`${path} line 1: no column "valueOf"; the columns are "${name}", "other"; pass --text to name the text column`);
  });

  it('reads a multi-byte character and a quoted line break split across chunks', async () => {
    const content = 'text,label\n"naïve\n€uro 🎉",ü\nnext,x\n';
    const path = await fixtureFile('chunks.csv', content);
    for (const chunkSize of [1, 2, 3, 5, 7]) {
      const docs = await collect(readCorpus(path, { label: 'label', chunkSize }));
      expect(texts(docs)).toEqual([
        ['naïve\n€uro 🎉', 'ü'],
        ['next', 'x'],
      ]);
      expect(places(docs)).toEqual([
        [2, 1, 11],
        [4, 2, Buffer.byteLength(content.slice(0, content.indexOf('next')))],
      ]);
    }
  });
});

describe('readCorpus on .csv: errors', () => {
  it.each([
    ['an unclosed quote', 'text,label\nfine,1\nok,2\n"never closed,3\nmore,4\n', {}, 'CSV_UNCLOSED_QUOTE', 'line 4: quote opened here is never closed (byte 23); close it with " or escape inner quotes as ""', 2],
    ['an unclosed quote in a later field', 'text,label\nfine,"1\n', {}, 'CSV_UNCLOSED_QUOTE', 'line 2: quote opened here is never closed (byte 16); close it with " or escape inner quotes as ""', 0],
    ['too many fields', 'text,label\na,1\nb,2\nc,3\nd,4\ne,5\nf,6,oops\n', {}, 'CSV_FIELD_COUNT', 'line 7 (row 6): 3 fields where the header has 2; quote fields that contain the delimiter', 5],
    ['too few fields', 'text,label\na\n', {}, 'CSV_FIELD_COUNT', 'line 2 (row 1): 1 field where the header has 2; give every row one field per column (empty fields are fine)', 0],
    ['the count after an embedded line break', 'text,label\n"a\nb",1\nc,2,3\n', {}, 'CSV_FIELD_COUNT', 'line 4 (row 2): 3 fields where the header has 2; quote fields that contain the delimiter', 1],
    ['an empty column name', 'text,,label\n', {}, 'CSV_BAD_HEADER', 'line 1: column 2 has no name; name every column in the header row', 0],
    ['a duplicate column name', 'text,label,text\n', {}, 'CSV_BAD_HEADER', 'line 1: column "text" appears twice (columns 1 and 3); give each column its own name', 0],
    ['no text column', 'body,stars\nhi,5\n', {}, 'MISSING_FIELD', 'line 1: no column "text"; the columns are "body", "stars"; pass --text to name the text column', 0],
    ['no label column', 'text,body\nhi,5\n', { label: 'stars' }, 'MISSING_FIELD', 'line 1: no column "stars"; the columns are "text", "body"; pass --label to name the label column', 0],
    ['text after a closing quote', 'text,label\n"a"b,1\n', {}, 'CSV_BAD_QUOTE', 'line 2: text after a closing quote at byte 14; quote the whole field and write each quote inside it as ""', 0],
    ['only a header row', 'text,label\n', {}, 'EMPTY_CORPUS', 'no documents (only a header row); add documents below the header', 0],
    ['an empty file', '', {}, 'EMPTY_CORPUS', 'no documents (the file is empty); start it with a header row naming the columns, then put one document on each row', 0],
    ['only blank lines', '\n\r\n  \n', {}, 'EMPTY_CORPUS', 'no documents (the file has only blank lines); start it with a header row naming the columns, then put one document on each row', 0],
  ])('%s', async (_, content, options, code, detail, before) => {
    const path = await fixtureFile('reviews.csv', content);
    for (const chunkSize of [1 << 20, 3]) {
      const result = await failure(readCorpus(path, { ...options, chunkSize }));
      expect(result.error.code).toBe(code);
      expect(result.error.message).toBe(code === 'EMPTY_CORPUS' ? `${path}: ${detail}` : `${path} ${detail}`);
      expect(result.before.length).toBe(before); // the documents before the problem come first
    }
  });

  it('names the place in the where member too', async () => {
    const path = await fixtureFile('reviews.csv', 'text\nok\n"open\n');
    const { error } = await failure(readCorpus(path));
    expect(error.where).toEqual({ file: path, line: 3, byteOffset: 8 });
  });
});

describe('readCorpus on .csv: invalid UTF-8', () => {
  // Row 2 (line 3) has a lone 0xFF at byte 19; row 3 is fine.
  const content = Buffer.concat([Buffer.from('text,label\nok,1\nbad'), Buffer.from([0xff]), Buffer.from(',2\nfine,3\n')]);

  it('fail (the default): BAD_UTF8 with line, row and byte, after the documents before it', async () => {
    const path = await fixtureFile('reviews.csv', content);
    const { error, before } = await failure(readCorpus(path));
    expect(error.code).toBe('BAD_UTF8');
    expect(error.message).toBe(`${path} line 3 (row 2): invalid UTF-8 at byte 19; fix the file's encoding or pass --bad-text replace or --bad-text skip`);
    expect(error.where).toEqual({ file: path, line: 3, row: 2, byteOffset: 19 });
    expect(texts(before)).toEqual([['ok', undefined]]);
  });

  it('replace: U+FFFD, counted', async () => {
    const path = await fixtureFile('reviews.csv', content);
    const reader = readCorpus(path, { badText: 'replace', label: 'label' });
    expect(texts(await collect(reader))).toEqual([
      ['ok', '1'],
      ['bad\uFFFD', '2'],
      ['fine', '3'],
    ]);
    expect(reader.stats).toEqual({ documents: 3, replaced: 1, skipped: 0, bytes: content.length });
  });

  it('skip: the row is left out, counted, and row numbers still count it', async () => {
    const path = await fixtureFile('reviews.csv', content);
    const reader = readCorpus(path, { badText: 'skip' });
    const docs = await collect(reader);
    expect(docs.map((d) => [d.text, d.where.row])).toEqual([
      ['ok', 1],
      ['fine', 3],
    ]);
    expect(reader.stats).toEqual({ documents: 2, replaced: 0, skipped: 1, bytes: content.length });
  });

  it('a bad byte on the second line of a quoted field names that line', async () => {
    const bytes = Buffer.concat([Buffer.from('text\n"a\nb'), Buffer.from([0xc3, 0x28]), Buffer.from('"\n')]);
    const path = await fixtureFile('reviews.csv', bytes);
    const { error } = await failure(readCorpus(path));
    expect(error.message).toBe(`${path} line 3 (row 1): invalid UTF-8 at byte 9; fix the file's encoding or pass --bad-text replace or --bad-text skip`);
  });

  it('a bad header is refused whatever the policy', async () => {
    const path = await fixtureFile('reviews.csv', Buffer.concat([Buffer.from('te'), Buffer.from([0xff]), Buffer.from('xt\nhi\n')]));
    for (const badText of ['fail', 'replace', 'skip'] as const) {
      const { error } = await failure(readCorpus(path, { badText }));
      expect(error.message).toBe(`${path} line 1: invalid UTF-8 at byte 2; fix the file's encoding (--bad-text applies to documents, not to the header row)`);
    }
  });

  it('all rows skipped: EMPTY_CORPUS says so', async () => {
    const path = await fixtureFile('reviews.csv', Buffer.concat([Buffer.from('text\n'), Buffer.from([0xff, 0x0a, 0xfe, 0x0a])]));
    const { error } = await failure(readCorpus(path, { badText: 'skip' }));
    expect(error.message).toBe(`${path}: no documents (all 2 were left out for invalid UTF-8); fix the file's encoding or pass --bad-text replace`);
  });
});

describe('readCorpus on .csv: round trip', () => {
  // Invariant (RFC 4180 §2 rules 5-7, from memory): any strings written as properly quoted CSV read back
  // identically, each row at the line its record starts on (counting the line breaks inside quotes)
  // and at its byte offset, whatever the chunk size.
  const field = fc.string({
    unit: fc.oneof(fc.constantFrom('"', ',', '\n', '\r\n', '\r', ' ', '\t', '\uFEFF', '\u00a0', 'a', 'é'), fc.string({ unit: 'grapheme', minLength: 1, maxLength: 1 })),
    maxLength: 12,
  });
  const quote = (s: string, always: boolean) => (always || /[",\r\n]/.test(s) ? `"${s.replaceAll('"', '""')}"` : s);
  it('reads back what it wrote', async () => {
    const dir = await tempFolder();
    let n = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.array(fc.tuple(field, field, fc.boolean()), { minLength: 1, maxLength: 8 }),
        fc.constantFrom('\n', '\r\n'),
        fc.boolean(),
        fc.integer({ min: 1, max: 64 }),
        async (rows, eol, finalEol, chunkSize) => {
          let content = `text,label${eol}`;
          const expected: Array<[string, string, number, number]> = [];
          let line = 2;
          rows.forEach(([text, label, always], i) => {
            expected.push([text, label, line, Buffer.byteLength(content)]);
            content += `${quote(text, always)},${quote(label, always)}`;
            if (i < rows.length - 1 || finalEol) content += eol;
            line += (text + label).split('\n').length; // the line breaks inside quotes, and the record's own
          });
          const path = join(dir, `round${n++}.csv`);
          await writeFile(path, content);
          const docs = await collect(readCorpus(path, { label: 'label', chunkSize }));
          expect(docs.map((d) => [d.text, d.label, d.where.line, d.where.byteOffset])).toEqual(expected);
          expect(docs.map((d) => d.where.row)).toEqual(rows.map((_, i) => i + 1));
        },
      ),
      { numRuns: 300 },
    );
  });
});
