import { openAtomic } from './AtomicFile.js';

export { openAtomic, type AtomicFile } from './AtomicFile.js';

/**
 * Writes a whole file atomically: temporary file in the same folder, write, fsync, rename over
 * `path`, fsync the folder. On failure the temporary file is removed, the old file is left as it
 * was, and a `LexlockError` with code `IO` names the path and the system error.
 * @example await writeWhole('lex.json', text);
 */
export async function writeWhole(path: string, data: string | Uint8Array): Promise<void> {
  const bytes = typeof data === 'string' ? new TextEncoder().encode(data) : data;
  const file = await openAtomic(path);
  try {
    await file.write(bytes);
    await file.commit();
  } catch (e) {
    await file.abort();
    throw e;
  }
}
