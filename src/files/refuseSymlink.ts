import { lstat, readlink } from 'node:fs/promises';
import { dirname, resolve } from 'node:path';
import { LexlockError } from '../LexlockError.js';

/**
 * Refuses, with code `OUTPUT_SYMLINK`, to write to a path that is a symbolic link, wherever it points.
 * An atomic write renames a new file over the path, which would replace the link itself and leave the
 * file it points to as it was; and where a link points can change between a check and the write. So
 * lexlock never writes through a link: the message names both paths and says what to do. Anything
 * else (a missing path, no permission) is left to the write.
 * @example await assertNotSymlink('out/ids.npy');
 */
export async function assertNotSymlink(path: string): Promise<void> {
  let target: string;
  try {
    if (!(await lstat(path)).isSymbolicLink()) return;
    target = resolve(dirname(path), await readlink(path));
  } catch {
    return;
  }
  throw new LexlockError(
    'OUTPUT_SYMLINK',
    `${path} is a symbolic link to ${target}; lexlock does not write through symbolic links: remove the link, or name ${target} itself as the output`,
    { file: path },
  );
}
