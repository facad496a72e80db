import { open, readFile, stat } from 'node:fs/promises';
import { LexlockError } from '../LexlockError.js';
import { JSON_FILE_MOST_BYTES, jsonFileTooLarge } from '../artifact/jsonFileLimit.js';
import type { TallyFile } from '../tally/tallyFile.js';
import { tallyFileParse } from '../tally/tallyFileParse.js';
import { TallyPartReader } from '../tally/TallyPartReader.js';
import { tallyFileLineGroups } from './tallyFileLineGroups.js';

/** How every tally lexlock writes begins (tallyFileLines), after an optional byte order mark. */
const TALLY_START = '{\n  "format": "lexlock.tally",';

/** Whether the file at `path` begins as lexlock writes a tally, so it can be read line by line. */
async function startsAsTally(path: string): Promise<boolean> {
  const file = await open(path, 'r');
  try {
    const head = Buffer.alloc(3 + TALLY_START.length);
    const { bytesRead } = await file.read(head, 0, head.length, 0);
    const text = head.subarray(0, bytesRead).toString('utf8');
    return (text.startsWith('\ufeff') ? text.slice(1) : text).startsWith(TALLY_START);
  } finally {
    await file.close();
  }
}

/** A tally file read line by line and checked as it is read (TallyPartReader), its counts added to one tally. */
async function tallyByLines(path: string): Promise<TallyFile> {
  const part = await TallyPartReader.open({ name: path, lines: tallyFileLineGroups(path) });
  const { file } = part.header;
  while (await part.next()) file.tally.addToken(part.token, part.occurrences, part.documents);
  return file;
}

function readError(path: string, e: unknown): LexlockError {
  if (e instanceof LexlockError) return e;
  const err = e as NodeJS.ErrnoException;
  // A file that reported no size (a pipe) but held more than a string can.
  if (err.code === 'ERR_STRING_TOO_LONG') return jsonFileTooLarge('tally', null, { file: path });
  const what = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a tally file' : err.message;
  return new LexlockError('IO', `${path}: cannot read the tally (${what}); pass the path of a file written by lexlock tally or lexlock merge`, { file: path });
}

/**
 * {@link loadTally} with the size up to which a file is read as one JSON text: larger files are read
 * line by line when they begin as lexlock writes a tally, and refused (`FILE_TOO_LARGE`) otherwise.
 * Tests pass a small `wholeMostBytes` to take the line-by-line path with small files.
 */
export async function loadTallyWithin(path: string, wholeMostBytes: number): Promise<TallyFile> {
  let text: string;
  try {
    const size = (await stat(path)).size;
    if (size > wholeMostBytes) {
      if (await startsAsTally(path)) return await tallyByLines(path);
      throw jsonFileTooLarge('tally', size, { file: path });
    }
    text = await readFile(path, 'utf8');
  } catch (e) {
    throw readError(path, e);
  }
  return tallyFileParse(text, { source: path });
}

/**
 * Reads and checks a tally file (format, version, schema, invariants; see tallyFileParse). A file
 * larger than one JSON text can be (`JSON_FILE_MOST_BYTES`, 536,870,888 bytes: a merged tally of
 * about ten million distinct tokens) is read line by line, as `lexlock merge` reads its parts, when it
 * is laid out as lexlock writes tallies (one count a line); any other is refused from its size.
 * @example const { tally, snippets } = await loadTally('all.tally');
 */
export async function loadTally(path: string): Promise<TallyFile> {
  return loadTallyWithin(path, JSON_FILE_MOST_BYTES);
}
