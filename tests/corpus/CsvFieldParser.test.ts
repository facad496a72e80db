import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { CsvFieldParser } from '../../src/corpus/CsvFieldParser.js';
import { CsvRecordScanner, type CsvRecord } from '../../src/corpus/csvRecords.js';
import { LineSplitter } from '../../src/corpus/lines.js';
import { isJsSpace, splitCsvRecord } from '../../src/corpus/splitCsvRecord.js';

// CsvFieldParser splits every record itself (splitCsvRecord for quoted ones) and gives fast-csv only a
// batch holding a record it would read oddly or refuse. The reference is fast-csv (a general-purpose CSV
// library) splitting every record, the reading before.

type Delimiter = ',' | '\t';
type Outcome = { rows: string[][][] } | { error: { name: string; index: unknown; message: string } };

/** The rows of each batch, split in turn by one parser, or the error it throws. */
async function splitBatches(batches: readonly string[][], delimiter: Delimiter, everyRecordToFastCsv: boolean): Promise<Outcome> {
  const parser = new CsvFieldParser(delimiter, { everyRecordToFastCsv });
  const rows: string[][][] = [];
  try {
    for (const batch of batches) rows.push(await parser.split(batch));
  } catch (e) {
    if (!(e instanceof Error)) throw e;
    return { error: { name: e.name, index: (e as { index?: unknown }).index, message: e.message } };
  } finally {
    parser.close();
  }
  return { rows };
}

async function expectSameAsFastCsv(batches: readonly string[][], delimiter: Delimiter): Promise<Outcome> {
  const ours = await splitBatches(batches, delimiter, false);
  expect(ours).toEqual(await splitBatches(batches, delimiter, true));
  return ours;
}

/** The decoded records the scanner finds in `text`, or null when it refuses the text. */
function records(text: string, delimiter: Delimiter): string[] | null {
  const scanner = new CsvRecordScanner('t.csv', delimiter);
  const splitter = new LineSplitter();
  const found: CsvRecord[] = [];
  try {
    for (const line of [...splitter.push(Buffer.from(text, 'utf8')), ...splitter.end()]) scanner.push(line, found);
    scanner.end();
  } catch (e) {
    if (!isLexlockError(e)) throw e;
    return null;
  }
  return found.map((r) => r.bytes.toString('utf8'));
}

describe('CsvFieldParser splits unquoted records as fast-csv does', () => {
  // RFC 4180 §2 (examples from memory): rules 1-2 `aaa,bbb,ccc CRLF zzz,yyy,xxx`; rule 3 a header line
  // of the same form; rule 5 `"aaa","bbb","ccc"`; rule 6 `"aaa","b CRLF bb","ccc"`; rule 7
  // `"aaa","b""bb","ccc"`; rule 4 "spaces are considered part of a field and should not be ignored".
  it.each([
    ['aaa,bbb,ccc\r\nzzz,yyy,xxx\r\n', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]],
    ['aaa,bbb,ccc\r\nzzz,yyy,xxx', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]],
    ['field_name,field_name,field_name\r\naaa,bbb,ccc\r\n', [['field_name', 'field_name', 'field_name'], ['aaa', 'bbb', 'ccc']]],
    ['"aaa","bbb","ccc"\r\nzzz,yyy,xxx\r\n', [['aaa', 'bbb', 'ccc'], ['zzz', 'yyy', 'xxx']]],
    ['"aaa","b\r\nbb","ccc"\r\nzzz,yyy,xxx\r\n', [['aaa', 'b\r\nbb', 'ccc'], ['zzz', 'yyy', 'xxx']]],
    ['"aaa","b""bb","ccc"\r\n', [['aaa', 'b"bb', 'ccc']]],
    ['aaa , bbb ,  \r\n  ,x,\r\n', [['aaa ', ' bbb ', '  '], ['  ', 'x', '']]],
  ])('RFC 4180 §2: %j', async (text, fields) => {
    const found = records(text, ',');
    expect(found).not.toBeNull();
    expect(await expectSameAsFastCsv([found!], ',')).toEqual({ rows: [fields] });
  });

  it('keeps fast-csv\'s row count for a record of white space only, and its empty record', async () => {
    // The scanner leaves such records out; the splitter still answers as fast-csv does (no fields).
    expect(await expectSameAsFastCsv([['a,b', '  ', '', '\u3000\t', 'c']], ',')).toEqual({
      rows: [[['a', 'b'], [], [], [], ['c']]],
    });
  });

  it('names the record fast-csv refuses by its place in the whole batch, with fast-csv\'s message', async () => {
    const outcome = await expectSameAsFastCsv([['x,y'], ['a,b', 'c,d', '"e"f,g', 'h,"i"']], ',');
    expect(outcome).toEqual({
      error: { name: 'CsvFieldError', index: 2, message: "Parse Error: expected: ',' OR new line got: 'f'. at 'f,g\\n''" },
    });
  });

  // Records without a quote: trailing delimiters, empty fields, spaces and other \s around fields,
  // tabs (TSV's delimiter, or text in a CSV), U+FEFF, non-ASCII.
  const plain = fc.constantFrom('a', 'bb', 'é', '🎉', ' ', '  ', '\t', ',', ',', '\u00a0', '\u2028', '\u3000', '\ufeff', '\u000b');
  it.each([',', '\t'] as const)('splits fuzzed unquoted records as fast-csv does (delimiter %j)', async (delimiter) => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.array(fc.array(plain, { maxLength: 12 }).map((a) => a.join('')), { maxLength: 8 }), { maxLength: 3 }), async (batches) => {
        const outcome = await expectSameAsFastCsv(batches, delimiter);
        expect(outcome).toHaveProperty('rows');
      }),
      { numRuns: 400 },
    );
  });

  // Whole texts with quoted and unquoted lines mixed, CRLF and lone CR line ends, cut into records by
  // the scanner and split in one or two batches; fast-csv may refuse some (text after a closing quote).
  const mixed = fc.constantFrom('a', 'é', ' ', '"', '"', ',', ',', '\t', '\t', '\n', '\n', '\r\n', '\r', '\u00a0', '\ufeff', '🎉');
  it.each([',', '\t'] as const)('splits fuzzed files of quoted and unquoted records as fast-csv does (delimiter %j)', async (delimiter) => {
    await fc.assert(
      fc.asyncProperty(fc.array(mixed, { maxLength: 60 }).map((a) => a.join('')), fc.nat(), async (text, cut) => {
        const found = records(text, delimiter);
        if (found === null) return;
        const at = found.length === 0 ? 0 : cut % found.length;
        await expectSameAsFastCsv([found.slice(0, at), found.slice(at)], delimiter);
      }),
      { numRuns: 600 },
    );
  });
});

describe('CsvFieldParser splits quoted records as fast-csv does', () => {
  // RFC 4180 §2 (examples from memory) with the quoting of rules 5-7 in every position: first, middle
  // and last field, empty quoted fields, doubled quotes at both ends, line breaks and delimiters inside.
  it.each([
    ['"aaa","bbb","ccc"', ['aaa', 'bbb', 'ccc']],
    ['"aaa","b\r\nbb","ccc"', ['aaa', 'b\r\nbb', 'ccc']],
    ['"aaa","b""bb","ccc"', ['aaa', 'b"bb', 'ccc']],
    ['"","",""', ['', '', '']],
    ['"""",""""""', ['"', '""']],
    ['a,"b,c",d', ['a', 'b,c', 'd']],
    ['a,"b\nc\rd"', ['a', 'b\nc\rd']],
    ['"a",', ['a', '']],
    [',"a"', ['', 'a']],
    ['a,,"b",,', ['a', '', 'b', '', '']],
    // fast-csv's own readings, beside RFC 4180: white space around a quoted field is dropped, a quote
    // inside an unquoted field is text, and a first field of white space only keeps its spaces.
    ['  "a"  ,\u00a0"b"\u3000', ['a', 'b']],
    ['a"b,c""d', ['a"b', 'c""d']],
    ['  ,"b"', ['  ', 'b']],
    ['\ufeff"a",b', ['a', 'b']],
    ['', []],
    [' \u3000\t', []],
  ])('RFC 4180 §2 / fast-csv: %j', async (record, fields) => {
    expect(splitCsvRecord(record, 0x2c)).toEqual(fields);
    expect(await expectSameAsFastCsv([[record]], ',')).toEqual({ rows: [[fields]] });
  });

  it.each([
    ['"e"f,g', 'text after the closing quote'],
    ['"a" \r', 'a CR after the closing quote'],
    ['a\nb,"c"', 'an LF outside quotes'],
    ['"a""', 'a quote never closed'],
    ['x,"a', 'a quote never closed'],
  ])('leaves %j to fast-csv (%s)', (record) => {
    expect(splitCsvRecord(record, 0x2c)).toBeNull();
  });

  it("matches JavaScript's /\\s/ over every UTF-16 code unit (ECMA-262 WhiteSpace and LineTerminator)", () => {
    const mismatches: number[] = [];
    for (let c = 0; c <= 0xffff; c++) if (isJsSpace(c) !== /\s/.test(String.fromCharCode(c))) mismatches.push(c);
    expect(mismatches).toEqual([]);
  });

  // Records made field by field, every field quoted or not, with white space around quoted fields,
  // doubled quotes, delimiters and line breaks inside quotes, and now and then a record fast-csv
  // refuses (text after a closing quote) or reads oddly (a CR or LF outside quotes); batches of them.
  const inner = fc.constantFrom('a', 'é', '🎉', ' ', '""', ',', '\t', '\n', '\r\n', '\r', '\u00a0', '\ufeff', '\u2028', "'");
  const outer = fc.constantFrom('a', 'bb', 'é', ' ', '\t', '\u00a0', '\u3000', '\ufeff', '\u000b', '"');
  const space = fc.constantFrom('', '', ' ', '  ', '\t', '\u00a0', '\ufeff', '\u3000');
  const quotedField = fc
    .tuple(space, fc.array(inner, { maxLength: 8 }), space, fc.constantFrom('', '', '', '', '', '', 'x', '\r', '\n'))
    .map(([before, body, after, odd]) => `${before}"${body.join('')}"${after}${odd}`);
  // A quote in an unquoted field comes after an `x`: first in a field (or after a tab, TSV's delimiter)
  // it would open a quote never closed, which the scanner refuses before any splitting, and which
  // fast-csv reads on into the next records.
  const plainField = fc.array(outer, { maxLength: 6 }).map((a) => a.join('').replaceAll('"', 'x"'));
  const record = (delimiter: Delimiter) => fc.array(fc.oneof(quotedField, plainField), { minLength: 1, maxLength: 6 }).map((f) => f.join(delimiter));
  it.each([',', '\t'] as const)('splits fuzzed quoted, unquoted and mixed records as fast-csv does (delimiter %j)', async (delimiter) => {
    await fc.assert(
      fc.asyncProperty(fc.array(fc.array(record(delimiter), { maxLength: 6 }), { minLength: 1, maxLength: 3 }), async (batches) => {
        await expectSameAsFastCsv(batches, delimiter);
      }),
      { numRuns: 500 },
    );
  });

  it.each([',', '\t'] as const)('splits every record the scanner finds without fast-csv (delimiter %j)', (delimiter) => {
    const mixed = fc.constantFrom('a', 'é', ' ', '"', '"', ',', ',', '\t', '\t', '\n', '\n', '\r\n', '\r', '\u00a0', '\ufeff', '🎉');
    fc.assert(
      fc.property(fc.array(mixed, { maxLength: 60 }).map((a) => a.join('')), (text) => {
        const found = records(text, delimiter);
        if (found === null) return;
        const parser = new CsvFieldParser(delimiter);
        try {
          expect(parser.splitHere(found)).not.toBeNull();
        } finally {
          parser.close();
        }
      }),
      { numRuns: 600 },
    );
  });
});
