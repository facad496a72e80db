import { isUtf8 } from 'node:buffer';
import { inputError, type Where } from '../LexlockError.js';
import type { CorpusDocument } from './CorpusDocument.js';
import { CsvFieldError, CsvFieldParser } from './CsvFieldParser.js';
import { csvColumns, type CsvColumns } from './csvColumns.js';
import { CsvRecordScanner, type CsvRecord } from './csvRecords.js';
import type { ReadContext } from './ReadContext.js';
import { badUtf8Error, decodeText, type TextStart } from './decodeText.js';
import { fileChunks } from './fileChunks.js';
import { readLines } from './lines.js';

const START_ADVICE = 'start it with a header row naming the columns, then put one document on each row';

/**
 * A `.csv` (delimiter `,`) or `.tsv` (tab) corpus: a header row, then one document a row, text and
 * label (and the key, with a key column) taken from the named columns. {@link CsvRecordScanner} finds records, their places and bad
 * bytes on the bytes; {@link CsvFieldParser} splits the fields as fast-csv does. Row numbers count data records (the header is row
 * 0; blank lines are not rows; rows skipped for bad bytes still count). Yields one batch of documents
 * per group of lines read (about 64 KiB); when something is wrong, the documents before it come first.
 * A line, or a record over several lines, of more than `context.maxRecordBytes` is `RECORD_TOO_LARGE`
 * (lines are split on LF, so a file whose records end in lone CRs is one line and must fit the limit).
 */
export async function* readCsv(context: ReadContext, delimiter: ',' | '\t'): AsyncGenerator<CorpusDocument[], void, undefined> {
  const { file } = context;
  context.empty = { reason: 'the file is empty', advice: START_ADVICE };
  const scanner = new CsvRecordScanner(file, delimiter, context.maxRecordBytes);
  const fields = new CsvFieldParser(delimiter);
  let headerSeen = false;
  let columns: CsvColumns | null = null;
  let rows = 0;

  const placeOf = (start: TextStart): Where =>
    start.row === undefined
      ? { file, line: start.line, byteOffset: start.byteOffset }
      : { file, line: start.line, row: start.row, byteOffset: start.byteOffset };

  /** The documents of a batch of records. Errors are returned, not thrown, with the documents before them. */
  async function documentsOf(records: readonly CsvRecord[]): Promise<{ batch: CorpusDocument[]; failure: unknown }> {
    const texts: string[] = [];
    const starts: TextStart[] = [];
    let failure: unknown = null;
    for (const record of records) {
      if (!headerSeen) {
        const start: TextStart = { line: record.line, byteOffset: record.byteOffset };
        if (!isUtf8(record.bytes)) {
          failure = badUtf8Error(record.bytes, start, file, "fix the file's encoding (--bad-text applies to documents, not to the header row)");
          break;
        }
        headerSeen = true;
        texts.push(record.bytes.toString('utf8'));
        starts.push(start);
        continue;
      }
      rows += 1;
      const start: TextStart = { line: record.line, byteOffset: record.byteOffset, row: rows };
      let text: string | null;
      try {
        text = decodeText(record.bytes, start, context);
      } catch (e) {
        failure = e;
        break;
      }
      if (text !== null) {
        texts.push(text);
        starts.push(start);
      }
    }
    const batch: CorpusDocument[] = [];
    try {
      let split: string[][];
      try {
        split = await fields.split(texts);
      } catch (e) {
        if (!(e instanceof CsvFieldError)) throw e;
        const at = placeOf(starts[e.index]!);
        throw inputError('CSV_BAD_QUOTE', at, `fast-csv cannot split this row (${e.message}); check the quotes in it`);
      }
      // Each error below is for a record before `failure`'s, so it replaces it: errors come in file order.
      for (let i = 0; i < split.length; i++) {
        const values = split[i]!;
        const start = starts[i]!;
        if (start.row === undefined) {
          columns = csvColumns(values, context, placeOf(start));
          continue;
        }
        const where = placeOf(start);
        const c = columns!; // the header is always the first record split
        if (values.length !== c.count) throw fieldCountError(values.length, c.count, where);
        const text = values[c.text]!;
        const key = c.key === undefined ? String(start.row) : values[c.key]!;
        batch.push(c.label === undefined ? { text, key, where } : { text, label: values[c.label]!, key, where });
      }
    } catch (e) {
      failure = e;
    }
    return { batch, failure };
  }

  try {
    const limit = { maxBytes: context.maxRecordBytes, file };
    for await (const lines of readLines(fileChunks(file, context.chunkSize, context.stats), limit)) {
      const records: CsvRecord[] = [];
      let scanFailure: unknown = null;
      try {
        for (const line of lines) scanner.push(line, records);
      } catch (e) {
        scanFailure = e;
      }
      const { batch, failure } = await documentsOf(records);
      if (batch.length > 0) yield batch;
      if (failure !== null) throw failure;
      if (scanFailure !== null) throw scanFailure;
    }
    scanner.end();
  } finally {
    fields.close();
  }
  if (headerSeen) context.empty = { reason: 'only a header row', advice: 'add documents below the header' };
  else if (context.stats.bytes > 0) context.empty = { reason: 'the file has only blank lines', advice: START_ADVICE };
}

function fieldCountError(found: number, expected: number, where: Where) {
  const advice = found > expected ? 'quote fields that contain the delimiter' : 'give every row one field per column (empty fields are fine)';
  return inputError('CSV_FIELD_COUNT', where, `${found} field${found === 1 ? '' : 's'} where the header has ${expected}; ${advice}`);
}
