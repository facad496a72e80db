import { mkdir } from 'node:fs/promises';
import { dirname } from 'node:path';
import { serializeLexicon } from '../artifact/serializeLexicon.js';
import type { Lexicon } from '../lexicon/Lexicon.js';
import { writeWhole } from './writeWhole.js';
import { assertWritable } from './refuseOverwrite.js';

/** Options of {@link saveLexicon}. */
export interface SaveLexiconOptions {
  /** Replace an existing file (default false: refuse with OUTPUT_EXISTS). */
  force?: boolean;
}

/**
 * Writes a lexicon file atomically (temporary file in the same folder, fsync, rename): a crash or
 * Ctrl-C leaves the old file or the new one, never half of one. Missing parent folders are created.
 * @example await saveLexicon('models/reviews/lexicon.json', freeze(tally, { cap: 12000 }), { force: true });
 */
export async function saveLexicon(path: string, lexicon: Lexicon, options: SaveLexiconOptions = {}): Promise<void> {
  await assertWritable(path, options.force ?? false);
  await mkdir(dirname(path), { recursive: true });
  await writeWhole(path, serializeLexicon(lexicon));
}
