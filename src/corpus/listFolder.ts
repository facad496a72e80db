import { readdir } from 'node:fs/promises';
import { readError } from './readError.js';

/**
 * The `/`-separated paths, relative to `root`, of every regular file below it whose path has no
 * segment starting with `.`, in JavaScript string order (UTF-16 code units). Symbolic links and other
 * non-regular entries are left out and not followed.
 * @example await listFolder('reviews') // ['neg/1.txt', 'neg/2.txt', 'pos/1.txt', 'readme.txt']
 */
export async function listFolder(root: string): Promise<string[]> {
  const found: string[] = [];
  const walk = async (relative: string): Promise<void> => {
    const folder = relative === '' ? root : joinPath(root, relative);
    let entries;
    try {
      entries = await readdir(folder, { withFileTypes: true });
    } catch (e) {
      throw readError(folder, e);
    }
    for (const entry of entries) {
      if (entry.name.startsWith('.')) continue;
      const path = relative === '' ? entry.name : `${relative}/${entry.name}`;
      if (entry.isDirectory()) await walk(path);
      else if (entry.isFile()) found.push(path);
    }
  };
  await walk('');
  return found.sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
}

/** `root` and a relative path joined with `/`, keeping `root` as the user wrote it. */
export function joinPath(root: string, relative: string): string {
  return root.endsWith('/') ? `${root}${relative}` : `${root}/${relative}`;
}
