import { statSync } from 'node:fs';
import { BAD_TEXT_POLICIES } from '../artifact/badTextPolicy.js';
import { inputError } from '../LexlockError.js';
import type { CorpusDocument } from './CorpusDocument.js';
import type { CorpusStats } from './CorpusStats.js';
import { corpusKind, type CorpusKind } from './corpusKind.js';
import type { BadTextPolicy } from './decodeText.js';
import { documentIterator } from './documentIterator.js';
import type { ReadContext } from './ReadContext.js';
import { readCsv } from './readCsv.js';
import { readError } from './readError.js';
import { readFolder } from './readFolder.js';
import { readJsonl } from './readJsonl.js';
import { readTxt } from './readTxt.js';
import { RECORD_LIMIT_DEFAULT, RECORD_LIMIT_MOST } from './recordLimit.js';

export type { CorpusDocument } from './CorpusDocument.js';
export type { CorpusStats } from './CorpusStats.js';
export type { CorpusKind } from './corpusKind.js';
export type { BadTextPolicy } from './decodeText.js';

/** How to read a corpus. */
export interface CorpusOptions {
  /** Text field for csv/tsv/jsonl; default `text`. */
  text?: string;
  /** Label field for csv/tsv/jsonl; absent means no labels. */
  label?: string;
  /**
   * Key field for csv/tsv/jsonl: each document's key is that field's value (JSONL: a string, or a
   * whole number as its decimal digits), which must be unique and not empty (`DUPLICATE_KEY` names
   * both lines). Absent: keys are numbered as {@link CorpusDocument.key} says. Checking uniqueness
   * keeps every key read so far (about 50 to 90 bytes a key of 8 to 36 characters).
   */
  key?: string;
  /** Documents with invalid UTF-8: stop (`fail`, the default), decode with U+FFFD (`replace`), or leave out (`skip`). */
  badText?: BadTextPolicy;
  /** Called now and then (every 1 MiB read or 1000 documents, and at the end) with the counts so far. */
  onProgress?: (p: { bytes: number; documents: number }) => void;
  /** Bytes per read; default 1 MiB. Memory per reader stays near this, whatever the file's size. */
  chunkSize?: number;
  /**
   * Most bytes of one record (a line of .txt/.jsonl without its line end, a record of .csv/.tsv, a
   * file of a folder); default 64 MiB, at most 256 MiB. A longer one stops the read with
   * `RECORD_TOO_LARGE` naming the file and the line it starts on, before it is gathered into memory,
   * so a file without line breaks or with a quote left open cannot take all memory.
   */
  maxRecordBytes?: number;
}

/**
 * The documents of a corpus, read as they are iterated (`for await`), in corpus order. `stats` counts
 * as it goes; each new iteration reads the corpus again from the start and restarts the counts.
 */
export interface CorpusReader extends AsyncIterable<CorpusDocument> {
  readonly stats: CorpusStats;
  readonly kind: CorpusKind;
  /** The corpus path as given. */
  readonly path: string;
  /** The bad-text policy it reads under. */
  readonly badText: BadTextPolicy;
  /** The key field it reads keys from, or null when keys are numbered (see {@link CorpusDocument.key}). */
  readonly keyField: string | null;
}

const DEFAULT_CHUNK = 1 << 20;

/**
 * Opens a corpus (encoding contract, rule 7): `.csv`, `.tsv`, `.jsonl`/`.ndjson`, `.txt`, or a folder
 * with one document per file. Checks the path and options now (`CORPUS_NOT_FOUND`, `CORPUS_KIND`,
 * `BAD_OPTION`); reads nothing until iterated. A corpus with no documents throws `EMPTY_CORPUS` at the
 * end; every other problem of the input is a `LexlockError` too, whose `where` names the file (and
 * the line where there is one).
 * @example
 * for await (const { text, label } of readCorpus('reviews.csv', { label: 'stars' })) tally.add({ text, label });
 */
export function readCorpus(path: string, options: CorpusOptions = {}): CorpusReader {
  let isFolder: boolean;
  try {
    isFolder = statSync(path).isDirectory();
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'ENOENT' || code === 'ENOTDIR') {
      throw inputError('CORPUS_NOT_FOUND', { file: path }, 'no such file or folder; check the path');
    }
    throw readError(path, e);
  }
  const kind = corpusKind(path, isFolder);
  const badText = options.badText ?? 'fail';
  if (!(BAD_TEXT_POLICIES as readonly string[]).includes(badText)) {
    throw inputError('BAD_OPTION', { file: path }, `bad-text policy "${String(badText)}" is not one of fail, replace, skip`);
  }
  if (options.label !== undefined && (kind === 'txt' || kind === 'folder')) {
    const instead = kind === 'txt' ? 'a .txt corpus has no fields' : 'a folder corpus takes its labels from its subfolders';
    throw inputError('BAD_OPTION', { file: path }, `--label cannot be used here: ${instead}; leave out --label, or use a .csv, .tsv or .jsonl corpus`);
  }
  if (options.key !== undefined && (kind === 'txt' || kind === 'folder')) {
    const instead = kind === 'txt' ? 'a .txt corpus has no fields; its keys are line numbers' : 'a folder corpus keys its documents by their paths below the folder';
    throw inputError('BAD_OPTION', { file: path }, `--key cannot be used here: ${instead}; leave out --key, or use a .csv, .tsv or .jsonl corpus`);
  }
  const chunkSize = options.chunkSize ?? DEFAULT_CHUNK;
  if (!Number.isSafeInteger(chunkSize) || chunkSize < 1) {
    throw inputError('BAD_OPTION', { file: path }, `chunk size ${chunkSize} is not a whole number of bytes above 0`);
  }
  const maxRecordBytes = options.maxRecordBytes ?? RECORD_LIMIT_DEFAULT;
  if (!Number.isSafeInteger(maxRecordBytes) || maxRecordBytes < 1 || maxRecordBytes > RECORD_LIMIT_MOST) {
    throw inputError('BAD_OPTION', { file: path }, `record limit ${maxRecordBytes} is not a whole number of bytes from 1 to ${RECORD_LIMIT_MOST} (256 MiB)`);
  }
  const stats: CorpusStats = { documents: 0, replaced: 0, skipped: 0, bytes: 0 };
  const { onProgress } = options;
  return {
    stats,
    kind,
    path,
    badText,
    keyField: options.key ?? null,
    [Symbol.asyncIterator]() {
      stats.documents = 0;
      stats.replaced = 0;
      stats.skipped = 0;
      stats.bytes = 0;
      const context: ReadContext = {
        file: path,
        text: options.text ?? 'text',
        label: options.label,
        key: options.key,
        badText,
        chunkSize,
        maxRecordBytes,
        stats,
        empty: { reason: 'nothing was read', advice: 'check the path' },
      };
      return documentIterator(batchesOf(kind, context), context, onProgress);
    },
  };
}

function batchesOf(kind: CorpusKind, context: ReadContext) {
  switch (kind) {
    case 'csv':
      return readCsv(context, ',');
    case 'tsv':
      return readCsv(context, '\t');
    case 'jsonl':
      return readJsonl(context);
    case 'txt':
      return readTxt(context);
    case 'folder':
      return readFolder(context);
  }
}
