import { isUtf8 } from 'node:buffer';
import { readdir } from 'node:fs/promises';
import { inputError } from '../LexlockError.js';
import { readError } from './readError.js';

/**
 * The `/`-separated paths, relative to `root`, of every regular file below it whose path has no
 * segment starting with `.`, in JavaScript string order (UTF-16 code units). Symbolic links and other
 * non-regular entries are left out and not followed (so a link loop is harmless). A name that is not
 * valid UTF-8 (it could not be opened by its decoded name) is `BAD_UTF8` naming it.
 * @example await listFolder('reviews') // ['neg/1.txt', 'neg/2.txt', 'pos/1.txt', 'readme.txt']
 */
export async function listFolder(root: string): Promise<string[]> {
  const found: string[] = [];
  const walk = async (relative: string): Promise<void> => {
    const folder = relative === '' ? root : joinPath(root, relative);
    let entries;
    try {
      entries = await readdir(folder, { withFileTypes: true, encoding: 'buffer' });
    } catch (e) {
      throw readError(folder, e);
    }
    for (const entry of entries) {
      const raw = entry.name;
      const name = raw.toString('utf8');
      if (name.startsWith('.')) continue;
      const path = relative === '' ? name : `${relative}/${name}`;
      const isFolder = entry.isDirectory();
      if (!isFolder && !entry.isFile()) continue;
      if (!isUtf8(raw)) {
        throw inputError(
          'BAD_UTF8',
          { file: joinPath(root, path) },
          'this name is not valid UTF-8 (its bad bytes are shown as U+FFFD); rename it, or move it out of the folder',
        );
      }
      if (isFolder) await walk(path);
      else found.push(path);
    }
  };
  await walk('');
  return found.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

/** `root` and a relative path joined with `/`, keeping `root` as the user wrote it. */
export function joinPath(root: string, relative: string): string {
  return root.endsWith('/') ? `${root}${relative}` : `${root}/${relative}`;
}
