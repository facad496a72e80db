import fc from 'fast-check';
import { parseString } from 'fast-csv';
import { describe, expect, it } from 'vitest';
import { isLexlockError } from '../../src/LexlockError.js';
import { CsvFieldParser } from '../../src/corpus/CsvFieldParser.js';
import { CsvRecordScanner, type CsvRecord } from '../../src/corpus/csvRecords.js';
import { csvWhitespace } from '../../src/corpus/csvWhitespace.js';
import { LineSplitter } from '../../src/corpus/lines.js';

type Delimiter = ',' | '\t';

/** The records the scanner finds in `text`, or the code of the error it throws. */
function scan(text: string, delimiter: Delimiter = ','): { records: CsvRecord[] } | { code: string; message: string } {
  const scanner = new CsvRecordScanner('t.csv', delimiter);
  const splitter = new LineSplitter();
  const records: CsvRecord[] = [];
  try {
    for (const line of [...splitter.push(Buffer.from(text, 'utf8')), ...splitter.end()]) scanner.push(line, records);
    scanner.end();
  } catch (e) {
    if (!isLexlockError(e)) throw e;
    return { code: e.code, message: e.message };
  }
  return { records };
}

/** fast-csv's own reading of a whole text: its rows, or its error. */
function fastCsv(text: string, delimiter: Delimiter): Promise<{ rows: string[][] } | { error: string }> {
  return new Promise((resolve) => {
    const rows: string[][] = [];
    parseString<string[], string[]>(text, { delimiter, headers: false })
      .on('data', (r: string[]) => rows.push(r))
      .on('error', (e: Error) => resolve({ error: e.message }))
      .on('end', () => resolve({ rows }));
  });
}

describe('CsvRecordScanner', () => {
  it.each([
    // [input, records as [text, line, byteOffset]]
    ['a,b\nc,d', [['a,b', 1, 0], ['c,d', 2, 4]]],
    ['a,b\r\nc,d\r\n', [['a,b', 1, 0], ['c,d', 2, 5]]],
    ['a\n\n  \nb', [['a', 1, 0], ['b', 4, 6]]], // blank and white-space-only records are left out
    ['"x\ny",1\nz,2', [['"x\ny",1', 1, 0], ['z,2', 3, 8]]],
    ['"x\r\ny",1\r\nz,2', [['"x\r\ny",1', 1, 0], ['z,2', 3, 10]]],
    ['a""b,"c""\nd"\ne', [['a""b,"c""\nd"', 1, 0], ['e', 3, 13]]], // a quote inside an unquoted field opens nothing
    ['a\rb,"c\rd"\r\ne', [['a', 1, 0], ['b,"c\rd"', 1, 2], ['e', 2, 11]]], // a lone CR ends a record, except inside quotes
    ['a,  "b\nc"  ,d\n', [['a,  "b\nc"  ,d', 1, 0]]], // fast-csv lets white space stand around a quoted field
    ['é,"\u00a0"\n"ü"', [['é,"\u00a0"', 1, 0], ['"ü"', 2, 8]]],
  ])('%j', (input, expected) => {
    const result = scan(input as string);
    expect('records' in result).toBe(true);
    if (!('records' in result)) return;
    expect(result.records.map((r) => [r.bytes.toString('utf8'), r.line, r.byteOffset])).toEqual(expected);
  });

  it.each([
    ['text,stars\n"fine",1\n"open\nstill open,2\n', 'CSV_UNCLOSED_QUOTE', 't.csv line 3: quote opened here is never closed (byte 20); close it with " or escape inner quotes as ""'],
    ['a,"b""\n', 'CSV_UNCLOSED_QUOTE', 't.csv line 1: quote opened here is never closed (byte 2); close it with " or escape inner quotes as ""'],
    ['a,b\n"x" y,1\n', 'CSV_BAD_QUOTE', 't.csv line 2: text after a closing quote at byte 8; quote the whole field and write each quote inside it as ""'],
    ['a,"b\nc"d\n', 'CSV_BAD_QUOTE', 't.csv line 2: text after a closing quote at byte 7; quote the whole field and write each quote inside it as ""'],
  ])('%j -> %s', (input, code, message) => {
    expect(scan(input)).toEqual({ code, message });
  });

  // Reference for the white space fast-csv skips around quotes: JavaScript's own /\s/ (ECMAScript
  // WhiteSpace and LineTerminator), checked over every code point; CR and LF end records instead.
  it.each([',', '\t'] as const)('treats as white space exactly what /\\s/ matches (delimiter %j)', (delimiter) => {
    const d = delimiter.charCodeAt(0);
    const mismatches: string[] = [];
    for (let cp = 0; cp <= 0x10ffff; cp++) {
      if (cp >= 0xd800 && cp <= 0xdfff) continue;
      const ch = String.fromCodePoint(cp);
      const b = Buffer.from(ch, 'utf8');
      const expected = /\s/.test(ch) && ch !== '\n' && ch !== '\r' && ch !== delimiter ? b.length : 0;
      if (csvWhitespace(b, 0, b.length, d) !== expected) mismatches.push(cp.toString(16));
    }
    expect(mismatches).toEqual([]);
  });

  // Invariant: the scanner and fast-csv agree on where records end. For any text, either both refuse
  // it, or fast-csv's rows of the whole text (without the empty rows it makes of blank lines) are the
  // rows of the scanner's records, each split alone.
  const alphabet = fc.constantFrom('a', 'é', ' ', '"', '"', ',', '\t', '\n', '\r', '\r\n', '\u00a0', '\u2028', '\u3000', '\ufeff', '🎉');
  it.each([',', '\t'] as const)('agrees with fast-csv on record boundaries (delimiter %j)', async (delimiter) => {
    await fc.assert(
      fc.asyncProperty(fc.array(alphabet, { maxLength: 30 }).map((a) => a.join('')), async (text) => {
        // A final line feed keeps fast-csv from dropping a U+FEFF at the start of an unfinished last row.
        const whole = await fastCsv(`${text}\n`, delimiter);
        const scanned = scan(text, delimiter);
        if (!('records' in scanned)) {
          expect(whole).toHaveProperty('error');
          return;
        }
        expect(whole).toHaveProperty('rows');
        if (!('rows' in whole)) return;
        const alone: string[][] = [];
        for (const r of scanned.records) {
          const one = await fastCsv(`x\n${r.bytes.toString('utf8')}\n`, delimiter);
          expect(one).toHaveProperty('rows');
          if ('rows' in one) {
            expect(one.rows.length).toBe(2);
            alone.push(one.rows[1]!);
          }
        }
        expect(alone).toEqual(whole.rows.filter((row) => row.length > 0));
      }),
      { numRuns: 1500 },
    );
  });
});

describe('CsvFieldParser', () => {
  it('gives one row per record across batches, a record starting with U+FEFF included', async () => {
    const parser = new CsvFieldParser(',');
    try {
      expect(await parser.split(['a,b', '"c\nd",e'])).toEqual([['a', 'b'], ['c\nd', 'e']]);
      expect(await parser.split(['\ufeffx,y', 'z,"w""v"'])).toEqual([['\ufeffx', 'y'], ['z', 'w"v']]);
      expect(await parser.split([])).toEqual([]);
    } finally {
      parser.close();
    }
  });

  // RFC 4180 §2 rule 4 (from memory): "Spaces are considered part of a field and should not be ignored."
  it.each([
    [',', '  ,b', ['  ', 'b']],
    [',', '\t,b', ['\t', 'b']],
    ['\t', '  \tb', ['  ', 'b']],
    [',', ' a ,  , b ', [' a ', '  ', ' b ']],
  ] as const)('keeps a first field of white space only (delimiter %j, %j)', async (delimiter, record, fields) => {
    const parser = new CsvFieldParser(delimiter);
    try {
      expect(await parser.split([record])).toEqual([fields]);
    } finally {
      parser.close();
    }
  });

  it('names the record fast-csv refuses', async () => {
    const parser = new CsvFieldParser(',');
    let error: unknown;
    try {
      await parser.split(['a,b', 'c,d', '"e"f,g', 'h,i']);
    } catch (e) {
      error = e;
    } finally {
      parser.close();
    }
    expect(error).toMatchObject({ name: 'CsvFieldError', index: 2, message: "Parse Error: expected: ',' OR new line got: 'f'. at 'f,g\\n''" });
  });
});
