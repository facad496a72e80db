import type { CsvParserStream } from 'fast-csv';

type FastCsv = typeof import('fast-csv');
/**
 * fast-csv, loaded the first time a batch needs it: reading never does for records the scanner gives,
 * and loading it costs every `lexlock` run about 30-50 ms here.
 */
let fastCsv: FastCsv | null = null;

async function loadFastCsv(): Promise<FastCsv> {
  fastCsv ??= await import('fast-csv');
  return fastCsv;
}
import { splitCsvRecord } from './splitCsvRecord.js';

/** fast-csv refused record `index` of a batch given to {@link CsvFieldParser.split}; `message` is fast-csv's. */
export class CsvFieldError extends Error {
  override readonly name = 'CsvFieldError';
  readonly index: number;
  constructor(index: number, message: string) {
    super(message);
    this.index = index;
  }
}

/**
 * A first record put before every batch and dropped from the result: fast-csv removes a U+FEFF at the
 * start of every piece of text it is given, which would eat one from a record that starts a batch.
 */
const LEAD = 'x';

type Row = string[];

const NOT_SPACE = /\S/;

/**
 * Splits CSV/TSV records (decoded, one record each, without its line end, as {@link CsvRecordScanner}
 * in csvRecords.ts gives them) into fields, one batch at a time: exactly one row comes back per record, in order, so
 * each row keeps the line and byte offset its record was found at. Every record is split here: one
 * without a quote is its fields between delimiters (such a record holds no CR or LF: they end records
 * outside quotes), a quoted one goes through {@link splitCsvRecord}. Only a batch holding a record
 * fast-csv would refuse or read oddly (never one the scanner gives) sends its quoted records to
 * fast-csv, one stream for the whole file, made when first needed. The rows and the errors are those
 * fast-csv gives when it splits every record (tests/corpus/CsvFieldParser.test.ts compares the two):
 * fast-csv keeps spaces around unquoted fields (with the guard below for a first field of white space
 * only) and gives no fields for a record of white space only.
 */
export class CsvFieldParser {
  readonly #delimiter: ',' | '\t';
  readonly #delimiterCode: number;
  /** Every record goes to fast-csv (the plain reading, kept to settle errors exactly and for tests). */
  readonly #everyRecord: boolean;
  readonly #blankFirstField: RegExp;
  #fastCsv: CsvParserStream<Row, Row> | null = null;
  #rows: Row[] = [];
  #error: Error | null = null;
  #settle: () => void = () => {};

  constructor(delimiter: ',' | '\t', options: { everyRecordToFastCsv?: boolean } = {}) {
    this.#delimiter = delimiter;
    this.#delimiterCode = delimiter.charCodeAt(0);
    this.#everyRecord = options.everyRecordToFastCsv ?? false;
    this.#blankFirstField = delimiter === ',' ? /^[^\S\r\n]+(?=,)/ : /^[^\S\r\n\t]+(?=\t)/;
  }

  /** The fast-csv stream, made on first use. */
  get #stream(): CsvParserStream<Row, Row> {
    if (this.#fastCsv !== null) return this.#fastCsv;
    if (fastCsv === null) throw new Error('lexlock: fast-csv is used before it was loaded; please report this');
    const stream = fastCsv.parse<Row, Row>(fastCsvOptions(this.#delimiter));
    stream.on('data', (row: Row) => {
      this.#rows.push(row);
      this.#settle();
    });
    stream.on('error', (e: Error) => {
      this.#error ??= e;
      this.#settle();
    });
    this.#fastCsv = stream;
    return stream;
  }

  /**
   * The fields of each record. Throws {@link CsvFieldError} naming the record fast-csv refused (the
   * stream is unusable afterwards).
   */
  async split(records: readonly string[]): Promise<Row[]> {
    if (this.#everyRecord) return this.#splitWithFastCsv(records);
    return this.splitHere(records) ?? this.#splitOddBatch(records);
  }

  /**
   * The fields of each record, split here, or null when a record of the batch is one fast-csv reads
   * oddly or refuses ({@link splitCsvRecord}); {@link split} then hands the batch's quoted records to
   * fast-csv, so the rows, the message and the record named are fast-csv's.
   */
  splitHere(records: readonly string[]): Row[] | null {
    if (this.#everyRecord) return null;
    const rows: Row[] = new Array<Row>(records.length);
    const delimiter = this.#delimiter;
    const code = this.#delimiterCode;
    for (let i = 0; i < records.length; i++) {
      const record = records[i]!;
      if (record.indexOf('"') === -1) {
        rows[i] = unquotedFields(record, delimiter);
        continue;
      }
      const values = splitCsvRecord(record, code);
      if (values === null) return null;
      rows[i] = values;
    }
    return rows;
  }

  /** A batch with a record {@link splitCsvRecord} leaves to fast-csv: its quoted records go to fast-csv. */
  async #splitOddBatch(records: readonly string[]): Promise<Row[]> {
    const rows: Row[] = new Array<Row>(records.length);
    const quoted: string[] = [];
    const places: number[] = [];
    const delimiter = this.#delimiter;
    for (let i = 0; i < records.length; i++) {
      const record = records[i]!;
      if (record.indexOf('"') !== -1) {
        quoted.push(record);
        places.push(i);
        continue;
      }
      rows[i] = unquotedFields(record, delimiter);
    }
    let split: Row[];
    try {
      split = await this.#splitWithFastCsv(quoted);
    } catch (e) {
      throw await this.#failureOfEvery(records, e);
    }
    for (let j = 0; j < split.length; j++) rows[places[j]!] = split[j]!;
    return rows;
  }

  /**
   * The error fast-csv gives for the whole batch when every record goes to it: a fresh stream reads
   * the batch as this one would (each batch ends with a line feed, so nothing of the earlier ones is
   * held), which names the same record with the same message as before quoted records were singled
   * out. `cause` is thrown if, against expectation, the whole batch splits.
   */
  async #failureOfEvery(records: readonly string[], cause: unknown): Promise<unknown> {
    const every = new CsvFieldParser(this.#delimiter, { everyRecordToFastCsv: true });
    try {
      await every.split(records);
    } catch (e) {
      return e;
    } finally {
      every.close();
    }
    return cause;
  }

  /** Every record split by fast-csv. */
  async #splitWithFastCsv(records: readonly string[]): Promise<Row[]> {
    if (records.length === 0) return [];
    await loadFastCsv();
    let rows: Row[];
    try {
      rows = await this.#write(`${LEAD}\n${records.map((r) => this.#guard(r)).join('\n')}\n`);
    } catch (e) {
      throw await this.#blame(records, e);
    }
    if (rows.length !== records.length + 1) {
      throw new Error(`lexlock: fast-csv gave ${rows.length - 1} rows for ${records.length} records; please report this with the file`);
    }
    return rows.slice(1);
  }

  /** Writes `text` and waits for all its rows. */
  async #write(text: string): Promise<Row[]> {
    if (this.#error !== null) throw this.#error;
    this.#rows = [];
    await new Promise<void>((resolve, reject) => {
      let written = false;
      this.#settle = () => {
        if (this.#error !== null) reject(this.#error);
        // Once fast-csv has taken the whole write and nothing waits in its output, every row is here.
        else if (written && this.#stream.readableLength === 0) resolve();
      };
      this.#stream.write(text, (e) => {
        if (e) this.#error ??= e;
        written = true;
        this.#settle();
      });
    });
    const rows = this.#rows;
    this.#rows = [];
    return rows;
  }

  /**
   * fast-csv turns a first field of white space only (`  ,b`) into an empty string; RFC 4180 §2 rule 4
   * keeps spaces, so such a field is handed over quoted (it holds no quote, so the value is the same).
   */
  #guard(record: string): string {
    const c = record.charCodeAt(0);
    if (c > 0x20 && c < 0xa0) return record;
    const blank = this.#blankFirstField.exec(record);
    return blank === null ? record : `"${blank[0]}"${record.slice(blank[0].length)}`;
  }

  /** Ends the stream. */
  close(): void {
    this.#fastCsv?.destroy();
  }

  /** The record fast-csv refuses on its own, found by splitting the batch's records one by one. */
  async #blame(records: readonly string[], cause: unknown): Promise<Error> {
    const message = cause instanceof Error ? cause.message : String(cause);
    const { parseString } = await loadFastCsv();
    for (let i = 0; i < records.length; i++) {
      const refused = await new Promise<string | null>((resolve) => {
        parseString<Row, Row>(`${LEAD}\n${this.#guard(records[i]!)}\n`, fastCsvOptions(this.#delimiter))
          .on('error', (e: Error) => resolve(e.message))
          .on('data', () => {})
          .on('end', () => resolve(null));
      });
      if (refused !== null) return new CsvFieldError(i, refused);
    }
    // No record fails alone: name the first of the batch and say so.
    return new CsvFieldError(0, `${message}, in this row or one of the next ${records.length - 1}`);
  }
}

/** The fields of a record without a quote (it holds no CR or LF either: they end records outside quotes). */
function unquotedFields(record: string, delimiter: string): Row {
  const values = record.split(delimiter);
  // fast-csv gives no fields for a record of white space only (JavaScript's \s, as it skips it).
  return values.length === 1 && !NOT_SPACE.test(record) ? [] : values;
}

function fastCsvOptions(delimiter: string) {
  // RFC 4180 quoting ("" inside quotes), no trimming, no header handling, every row kept.
  return { delimiter, quote: '"', escape: '"', headers: false, ignoreEmpty: false, trim: false, ltrim: false, rtrim: false };
}
