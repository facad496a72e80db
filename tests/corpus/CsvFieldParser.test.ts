import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { CsvFieldParser } from '../../src/corpus/CsvFieldParser.js';
import { CsvRecordScanner, type CsvRecord } from '../../src/corpus/csvRecords.js';
import { LineSplitter } from '../../src/corpus/lines.js';

// CsvFieldParser splits records without a quote itself and gives fast-csv only the quoted ones. The
// reference is fast-csv (a general-purpose CSV library) splitting every record, the reading before.

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
