import type { Stats } from 'node:fs';
import { inputError, type LexlockError } from '../LexlockError.js';

/** What a non-regular file is, in words: `a named pipe (FIFO)`, `a character device`, `a folder`... */
function kindOf(stats: Stats): string {
  if (stats.isFIFO()) return 'a named pipe (FIFO)';
  if (stats.isCharacterDevice()) return 'a character device';
  if (stats.isBlockDevice()) return 'a block device';
  if (stats.isSocket()) return 'a socket';
  if (stats.isDirectory()) return 'a folder';
  return 'something other than a file';
}

/**
 * `NOT_A_FILE` for a file of a folder corpus that turned out, once open, not to be a regular file
 * (it was replaced after the folder was listed), e.g.
 * `mail/b.txt: this is a named pipe (FIFO), not a regular file; a folder corpus reads only regular files ...`.
 */
export function notRegularFile(file: string, stats: Stats): LexlockError {
  return inputError(
    'NOT_A_FILE',
    { file },
    `this is ${kindOf(stats)}, not a regular file; a folder corpus reads only regular files (each one document), ` +
      'so move it out of the folder or put a file in its place',
  );
}
