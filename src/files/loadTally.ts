import { readFile } from 'node:fs/promises';
import { LexlockError } from '../LexlockError.js';
import type { TallyFile } from '../tally/tallyFile.js';
import { tallyFileParse } from '../tally/tallyFileParse.js';

/**
 * Reads and checks a tally file (format, version, schema, invariants; see tallyFileParse).
 * @example const { tally, snippets } = await loadTally('all.tally');
 */
export async function loadTally(path: string): Promise<TallyFile> {
  let text: string;
  try {
    text = await readFile(path, 'utf8');
  } catch (e) {
    const err = e as NodeJS.ErrnoException;
    const what = err.code === 'ENOENT' ? 'no such file' : err.code === 'EISDIR' ? 'is a folder, not a tally file' : err.message;
    throw new LexlockError('IO', `${path}: cannot read the tally (${what}); pass the path of a file written by lexlock tally or lexlock merge`, { file: path });
  }
  return tallyFileParse(text, { source: path });
}
