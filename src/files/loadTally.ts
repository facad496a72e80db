import { readFile, stat } from 'node:fs/promises';
import { LexlockError } from '../LexlockError.js';
import { checkJsonFileSize, jsonFileTooLarge } from '../artifact/jsonFileLimit.js';
import type { TallyFile } from '../tally/tallyFile.js';
import { tallyFileParse } from '../tally/tallyFileParse.js';

/**
 * Reads and checks a tally file (format, version, schema, invariants; see tallyFileParse). A file
 * larger than one JSON text can be (`JSON_FILE_MOST_BYTES`) is refused from its size, before it is read.
 * @example const { tally, snippets } = await loadTally('all.tally');
 */
export async function loadTally(path: string): Promise<TallyFile> {
  let text: string;
  try {
    checkJsonFileSize('tally', (await stat(path)).size, { file: path });
    text = await readFile(path, 'utf8');
  } catch (e) {
    if (e instanceof LexlockError) throw e;
    const err = e as NodeJS.ErrnoException;
    // A file that reported no size (a pipe) but held more than a string can.
    if (err.code === 'ERR_STRING_TOO_LONG') throw jsonFileTooLarge('tally', null, { file: path });
    const what = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a tally file' : err.message;
    throw new LexlockError('IO', `${path}: cannot read the tally (${what}); pass the path of a file written by lexlock tally or lexlock merge`, { file: path });
  }
  return tallyFileParse(text, { source: path });
}
