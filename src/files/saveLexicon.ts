import { serializeLexicon } from '../artifact/serializeLexicon.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { lockOutput } from './outputLock.js';
import { writeWhole } from './writeWhole.js';
import { assertWritable } from './refuseOverwrite.js';

/** Options of {@link saveLexicon}. */
export interface SaveLexiconOptions {
  /** Replace an existing file (default false: refuse with OUTPUT_EXISTS). */
  force?: boolean;
}

/**
 * Writes a lexicon file atomically (temporary file in the same folder, fsync, rename): a crash or
 * Ctrl-C leaves the old file or the new one, never half of one. Missing parent folders are created
 * (and removed again if the write fails). While it writes, it holds the file's lock (lockOutput): a
 * second writer of the same path fails at once with `OUTPUT_BUSY`.
 * @example await saveLexicon('models/reviews/lexicon.json', freeze(tally, { cap: 12000 }), { force: true });
 */
export async function saveLexicon(path: string, lexicon: Lexicon, options: SaveLexiconOptions = {}): Promise<void> {
  const lock = await lockOutput(path);
  let wrote = false;
  try {
    await assertWritable(path, options.force ?? false);
    await writeWhole(path, serializeLexicon(lexicon));
    wrote = true;
  } finally {
    await lock.release(wrote);
  }
}
