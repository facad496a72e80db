import { stat } from 'node:fs/promises';

/** The size of a corpus file in bytes, for a progress bar; null for folders and what cannot be read. */
export async function corpusBytes(path: string): Promise<number | null> {
  try {
    const s = await stat(path);
    return s.isFile() ? s.size : null;
  } catch {
    return null;
  }
}
