import { lstat } from 'node:fs/promises';
import { LexlockError } from '../LexlockError.js';
import { assertNotSymlink } from './refuseSymlink.js';

/**
 * Refuses, with code `OUTPUT_EXISTS`, to write over an existing file unless `force` is set, and
 * always refuses a folder; a symbolic link is refused first, `--force` or not, with `OUTPUT_SYMLINK`
 * (see assertNotSymlink). Other problems (missing parent folder, no permission) are left to the write.
 * @example await assertWritable('lex.json', flags.force);
 */
export async function assertWritable(path: string, force: boolean): Promise<void> {
  await assertNotSymlink(path);
  let isFolder: boolean;
  try {
    isFolder = (await lstat(path)).isDirectory();
  } catch {
    return;
  }
  if (isFolder) {
    throw new LexlockError('OUTPUT_EXISTS', `${path} is a folder; name a file to write instead`, { file: path });
  }
  if (!force) {
    throw new LexlockError('OUTPUT_EXISTS', `${path} already exists; pass --force to overwrite it`, { file: path });
  }
}
